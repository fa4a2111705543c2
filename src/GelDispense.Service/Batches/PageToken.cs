using System.Globalization;
using System.Text;
using GelDispense.Chemistry.Errors;

namespace GelDispense.Service.Batches;

/// <summary>The LIMS cursor: the event sequence of the last batch returned, opaque to clients (base64url of "seq:N").</summary>
public static class PageToken
{
    private const string Prefix = "seq:";

    public static string Encode(long sequence) =>
        Convert.ToBase64String(Encoding.ASCII.GetBytes(Prefix + sequence.ToString(CultureInfo.InvariantCulture)))
            .TrimEnd('=').Replace('+', '-').Replace('/', '_');

    public static long Decode(string token, string field = "pageToken")
    {
        if (string.IsNullOrEmpty(token))
        {
            return 0;
        }

        try
        {
            var base64 = token.Replace('-', '+').Replace('_', '/');
            base64 = base64.PadRight(base64.Length + ((4 - (base64.Length % 4)) % 4), '=');
            var text = Encoding.ASCII.GetString(Convert.FromBase64String(base64));
            if (text.StartsWith(Prefix, StringComparison.Ordinal)
                && long.TryParse(text.AsSpan(Prefix.Length), NumberStyles.None, CultureInfo.InvariantCulture, out var sequence))
            {
                return sequence;
            }
        }
        catch (FormatException)
        {
            // Falls through to the error below.
        }

        throw new InvalidInputException(field, token.Length <= 80 ? token : token[..80], "not a page token this service issued; pass nextPageToken unchanged");
    }
}
