using System.IO.Compression;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Service.Batches;

/// <summary>
/// How an addition's (or a correction's) response is kept for replays: its protobuf bytes, deflated; an addition's as
/// bytes (<see cref="Deflate"/>, the additions.response_bytes column), a correction's as base64 text after
/// <see cref="DeflatedPrefix"/>. The response repeats the handling cautions of every remaining step,
/// so it deflates to well under half its protobuf size; left to the database, PostgreSQL compressed the 10–12 KB text
/// itself with pglz on every addition, about a tenth of its CPU (docs/performance.md). Rows written by earlier
/// versions hold the deflated base64 text, plain base64 protobuf or protobuf JSON, and still read.
/// </summary>
public static class StoredResponse
{
    /// <summary>Marks the deflated form; neither base64 nor JSON text can start with it.</summary>
    public const string DeflatedPrefix = "deflate:";

    /// <summary>The protobuf bytes of <paramref name="response"/>, deflated.</summary>
    public static byte[] Deflate(IMessage response)
    {
        using var deflated = new MemoryStream();
        using (var deflate = new DeflateStream(deflated, CompressionLevel.Fastest, leaveOpen: true))
        {
            response.WriteTo(deflate);
        }

        return deflated.ToArray();
    }

    /// <summary>The deflated bytes as text, for a column that holds text.</summary>
    public static string Write(IMessage response) => DeflatedPrefix + Convert.ToBase64String(Deflate(response));

    public static CorrectAdditionResponse ReadCorrection(string stored) => CorrectAdditionResponse.Parser.ParseFrom(Bytes(stored));

    /// <summary>An addition's response from its row: the deflated bytes where the row has them, else the text.</summary>
    public static RecordAdditionResponse Read(string text, byte[]? deflated) =>
        deflated is null ? Read(text) : RecordAdditionResponse.Parser.ParseFrom(Inflate(deflated));

    /// <summary>Reads any text form: rows written before protobuf hold the response as protobuf JSON.</summary>
    public static RecordAdditionResponse Read(string stored) =>
        stored.StartsWith('{') ? JsonParser.Default.Parse<RecordAdditionResponse>(stored) : RecordAdditionResponse.Parser.ParseFrom(Bytes(stored));

    private static byte[] Bytes(string stored) =>
        stored.StartsWith(DeflatedPrefix, StringComparison.Ordinal)
            ? Inflate(Convert.FromBase64String(stored[DeflatedPrefix.Length..]))
            : Convert.FromBase64String(stored);

    private static byte[] Inflate(byte[] deflated)
    {
        using var deflate = new DeflateStream(new MemoryStream(deflated), CompressionMode.Decompress);
        using var inflated = new MemoryStream();
        deflate.CopyTo(inflated);
        return inflated.ToArray();
    }
}
