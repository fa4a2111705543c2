using System.IO.Compression;
using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Service.Batches;

/// <summary>
/// How an addition's (or a correction's) response is kept for replays: its protobuf bytes, deflated, in base64 after a
/// <see cref="DeflatedPrefix"/>. The response repeats the handling cautions of every remaining step, so it deflates
/// to well under half its base64 size; left to the database, PostgreSQL compressed the 10–12 KB text itself with pglz on
/// every addition, about a tenth of its CPU (docs/performance.md). Rows written by earlier versions hold plain base64
/// protobuf or protobuf JSON, and still read.
/// </summary>
public static class StoredResponse
{
    /// <summary>Marks the deflated form; neither base64 nor JSON text can start with it.</summary>
    public const string DeflatedPrefix = "deflate:";

    public static string Write(IMessage response)
    {
        using var deflated = new MemoryStream();
        using (var deflate = new DeflateStream(deflated, CompressionLevel.Fastest, leaveOpen: true))
        {
            response.WriteTo(deflate);
        }

        return DeflatedPrefix + Convert.ToBase64String(deflated.GetBuffer(), 0, (int)deflated.Length);
    }

    public static CorrectAdditionResponse ReadCorrection(string stored) => CorrectAdditionResponse.Parser.ParseFrom(Bytes(stored));

    /// <summary>Reads any form: rows written before protobuf hold the response as protobuf JSON.</summary>
    public static RecordAdditionResponse Read(string stored) =>
        stored.StartsWith('{') ? JsonParser.Default.Parse<RecordAdditionResponse>(stored) : RecordAdditionResponse.Parser.ParseFrom(Bytes(stored));

    private static byte[] Bytes(string stored)
    {
        if (!stored.StartsWith(DeflatedPrefix, StringComparison.Ordinal))
        {
            return Convert.FromBase64String(stored);
        }

        using var deflate = new DeflateStream(new MemoryStream(Convert.FromBase64String(stored[DeflatedPrefix.Length..])), CompressionMode.Decompress);
        using var inflated = new MemoryStream();
        deflate.CopyTo(inflated);
        return inflated.ToArray();
    }
}
