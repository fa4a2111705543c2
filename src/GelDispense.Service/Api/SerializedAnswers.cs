using System.Diagnostics.CodeAnalysis;
using System.Runtime.CompilerServices;
using Google.Protobuf;

namespace GelDispense.Service.Api;

/// <summary>
/// The protobuf bytes of answers the service hands out unchanged again and again (a remembered plan), kept beside the
/// message so that a gRPC answer is written from them instead of being serialised anew on every call. Each entry is
/// held weakly by its message: it lives as long as whoever remembers the message, and a message must not be changed
/// once its bytes are kept.
/// </summary>
public sealed class SerializedAnswers
{
    private readonly ConditionalWeakTable<object, byte[]> _bytes = [];

    /// <summary>Serialises <paramref name="answer"/> once and keeps the bytes with it; returns them.</summary>
    public byte[] Keep(IMessage answer)
    {
        var bytes = answer.ToByteArray();
        _bytes.AddOrUpdate(answer, bytes);
        return bytes;
    }

    /// <summary>The bytes kept for this very instance, if any.</summary>
    public bool TryGet(object answer, [NotNullWhen(true)] out byte[]? bytes) => _bytes.TryGetValue(answer, out bytes);
}
