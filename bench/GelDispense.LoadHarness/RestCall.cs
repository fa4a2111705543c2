using System.Net.Http.Headers;
using System.Text;

namespace GelDispense.LoadHarness;

/// <summary>
/// A REST client with its own HTTP/1.1 connection that posts to one route, with the body <paramref name="json"/> gives
/// for each call. It reads every byte of each answer into one reused buffer and does not decode it (see
/// <see cref="GrpcCall"/>); an answer other than 2xx fails the call with its body.
/// </summary>
public sealed class RestCall(Uri baseAddress, string? apiKey, string path, Func<string> json) : ILoadClient
{
    private readonly HttpClient _http = Connect(baseAddress, apiKey);
    private readonly byte[] _answer = new byte[16 * 1024];

    public Task PrepareAsync(CancellationToken cancellationToken) => Task.CompletedTask;

    public async Task CallAsync(CancellationToken cancellationToken)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = new StringContent(json(), Encoding.UTF8, "application/json") };
        using var response = await _http.SendAsync(request, HttpCompletionOption.ResponseHeadersRead, cancellationToken);
        if (!response.IsSuccessStatusCode)
        {
            throw Refused(path, response, await response.Content.ReadAsStringAsync(cancellationToken));
        }

        await using var answer = await response.Content.ReadAsStreamAsync(cancellationToken);
        while (await answer.ReadAsync(_answer, cancellationToken) > 0)
        {
        }
    }

    public void Dispose() => _http.Dispose();

    /// <summary>An HTTP/1.1 client with one connection, sending the API key when there is one.</summary>
    public static HttpClient Connect(Uri baseAddress, string? apiKey)
    {
        var http = new HttpClient(new SocketsHttpHandler { MaxConnectionsPerServer = 1 }) { BaseAddress = baseAddress };
        if (apiKey is not null)
        {
            http.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", apiKey);
        }

        return http;
    }

    /// <summary>Posts and reads the whole answer, so the figures include writing the response; fails on any non-2xx status.</summary>
    public static async Task<string> PostAsync(HttpClient http, string path, string json, CancellationToken cancellationToken)
    {
        using var content = new StringContent(json, Encoding.UTF8, "application/json");
        using var response = await http.PostAsync(path, content, cancellationToken);
        var body = await response.Content.ReadAsStringAsync(cancellationToken);
        return response.IsSuccessStatusCode ? body : throw Refused(path, response, body);
    }

    private static HttpRequestException Refused(string path, HttpResponseMessage response, string body) =>
        new($"POST {path} answered {(int)response.StatusCode}: {(body.Length > 300 ? body[..300] : body)}");
}
