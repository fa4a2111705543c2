using GelDispense.Agent.Configuration;

namespace GelDispense.Agent.Service;

/// <summary>
/// The station's link to the service as its config describes it: <c>serviceAddress</c> first, then each of
/// <c>standbyAddresses</c> in order, all with the same TLS settings and key. With no standby the invoker simply stays
/// on the one address. Owns the channels.
/// </summary>
public sealed class ServiceConnection : IDisposable
{
    private readonly FailoverCallInvoker _invoker;

    private ServiceConnection(FailoverCallInvoker invoker, ServiceLink link)
    {
        _invoker = invoker;
        Link = link;
    }

    public ServiceLink Link { get; }

    /// <summary>The address calls go to now.</summary>
    public Uri Current => _invoker.Current;

    public static ServiceConnection Open(StationConfig config, ServiceLinkSettings settings, TimeProvider time)
    {
        var addresses = Addresses(config);
        var invoker = new FailoverCallInvoker(addresses, settings, ServiceTls.Options(config.Service));
        var link = new ServiceLink(invoker, string.Join(" then ", addresses.Select(a => a.ToString().TrimEnd('/'))), settings, time, config.ApiKey);
        return new ServiceConnection(invoker, link);
    }

    public void Dispose() => _invoker.Dispose();

    private static IReadOnlyList<Uri> Addresses(StationConfig config) =>
        [new Uri(config.ServiceAddress), .. config.StandbyAddresses.Select(a => new Uri(a))];
}
