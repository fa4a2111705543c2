using System.Collections.Concurrent;
using System.Diagnostics.CodeAnalysis;
using Google.Protobuf;

namespace GelDispense.Service.Api;

/// <summary>
/// The protobuf bytes of answers the service hands out unchanged again and again (a remembered plan), kept beside the
/// message so that a gRPC answer is written from them instead of being serialised anew on every call. Entries are
/// found by the very instance, and whoever keeps bytes forgets them when it lets the message go. A message must not be
/// changed once its bytes are kept.
/// </summary>
/// <remarks>
/// Not a ConditionalWeakTable: the memo knows when it lets a plan go, so the bytes go then, without a dependent handle
/// per plan for the garbage collector to trace.
/// </remarks>
public sealed class SerializedAnswers
{
    private readonly ConcurrentDictionary<object, byte[]> _bytes = new(ReferenceEqualityComparer.Instance);

    /// <summary>Serialises <paramref name="answer"/> once and keeps the bytes with it; returns them.</summary>
    public byte[] Keep(IMessage answer) => _bytes[answer] = answer.ToByteArray();

    /// <summary>Drops the bytes kept for <paramref name="answer"/>, if any.</summary>
    public void Forget(object answer) => _bytes.TryRemove(answer, out _);

    /// <summary>The bytes kept for this very instance, if any.</summary>
    public bool TryGet(object answer, [NotNullWhen(true)] out byte[]? bytes) => _bytes.TryGetValue(answer, out bytes);
}
