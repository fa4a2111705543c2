using GelDispense.Contracts.V1;
using Google.Protobuf;

namespace GelDispense.Service.Batches;

/// <summary>
/// How an addition's (or a correction's) response is kept for replays: base64 of its protobuf bytes. Formatting the response as JSON
/// took about a millisecond per addition (the largest single cost of recording one); the protobuf form is a small
/// fraction of that and of the size, and any engine stores it as text.
/// </summary>
public static class StoredResponse
{
    public static string Write(IMessage response) => Convert.ToBase64String(response.ToByteArray());

    /// <summary>A correction's response; corrections came after the switch to the protobuf form, so there is no JSON form.</summary>
    public static CorrectAdditionResponse ReadCorrection(string stored) => CorrectAdditionResponse.Parser.ParseFrom(Convert.FromBase64String(stored));

    /// <summary>Reads either form: rows written before the change hold the response as protobuf JSON.</summary>
    public static RecordAdditionResponse Read(string stored) =>
        stored.StartsWith('{')
            ? JsonParser.Default.Parse<RecordAdditionResponse>(stored)
            : RecordAdditionResponse.Parser.ParseFrom(Convert.FromBase64String(stored));
}
