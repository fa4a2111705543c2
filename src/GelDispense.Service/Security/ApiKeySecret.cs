using System.Security.Cryptography;
using System.Text;

namespace GelDispense.Service.Security;

/// <summary>
/// The form of a key: "gdk_" then 32 random bytes (256 bits) in base64url. The first <see cref="PrefixLength"/>
/// characters after "gdk_" are stored in clear to find the row; the whole key is stored only as its SHA-256 hash.
/// A random 256-bit secret needs no slow password hash: there is nothing to guess from a dictionary.
/// </summary>
public static class ApiKeySecret
{
    public const string Marker = "gdk_";
    public const int PrefixLength = 12;
    private const int SecretBytes = 32;

    /// <summary>Length of a well-formed key: the marker plus 43 base64url characters.</summary>
    public static readonly int KeyLength = Marker.Length + Base64UrlLength(SecretBytes);

    public static string NewKey(RandomNumberGenerator random)
    {
        var bytes = new byte[SecretBytes];
        random.GetBytes(bytes);
        return Marker + Convert.ToBase64String(bytes).TrimEnd('=').Replace('+', '-').Replace('/', '_');
    }

    /// <summary>The lookup prefix of a well-formed key, or null for anything else (never throws on odd input).</summary>
    public static string? Prefix(string candidate) =>
        candidate.Length == KeyLength && candidate.StartsWith(Marker, StringComparison.Ordinal) && candidate.AsSpan(Marker.Length).ContainsOnlyBase64Url()
            ? candidate.Substring(Marker.Length, PrefixLength)
            : null;

    public static string Hash(string key) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(key)));

    /// <summary>Compares in constant time, so response timing says nothing about how much of a hash matched.</summary>
    public static bool Matches(string key, string storedHash) =>
        CryptographicOperations.FixedTimeEquals(Encoding.ASCII.GetBytes(Hash(key)), Encoding.ASCII.GetBytes(storedHash));

    private static int Base64UrlLength(int bytes) => ((bytes * 4) + 2) / 3;

    private static bool ContainsOnlyBase64Url(this ReadOnlySpan<char> text)
    {
        foreach (var c in text)
        {
            if (!(char.IsAsciiLetterOrDigit(c) || c is '-' or '_'))
            {
                return false;
            }
        }

        return true;
    }
}
