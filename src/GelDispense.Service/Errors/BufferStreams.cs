using Microsoft.IO;

namespace GelDispense.Service.Errors;

/// <summary>
/// Pooled memory streams for the REST edge, which buffers every request body and every answer: fresh MemoryStreams
/// grew by doubling and were garbage after each call (about 16 KB for a remembered plan's answer alone).
/// </summary>
public static class BufferStreams
{
    private static readonly RecyclableMemoryStreamManager Manager = new();

    /// <summary>A pooled stream with room for <paramref name="expectedBytes"/> (0 when unknown); dispose it to return it.</summary>
    public static MemoryStream Get(string tag, long expectedBytes = 0) =>
        expectedBytes > 0 ? Manager.GetStream(tag, expectedBytes) : Manager.GetStream(tag);
}
