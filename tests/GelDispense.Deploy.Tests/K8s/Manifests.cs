using System.Globalization;
using k8s;
using k8s.Models;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>
/// The Kubernetes manifests under deploy/k8s, loaded into the client library's typed models in strict mode:
/// an unknown or misspelt field is an error, so a manifest that loads here has the shape the API server expects.
/// </summary>
internal static class Manifests
{
    public const string Folder = "deploy/k8s";
    public const string Kustomization = "kustomization.yaml";
    public const string SecretExampleFile = "secret.example.yaml";

    /// <summary>The files kustomization.yaml applies, in its order.</summary>
    public static IReadOnlyList<string> Resources { get; } =
        YamlNodes.Load($"{Folder}/{Kustomization}").Seq("resources").Scalars();

    /// <summary>Every YAML file in the folder but kustomization.yaml.</summary>
    public static IReadOnlyList<string> ManifestFiles { get; } =
        [.. Directory.EnumerateFiles(RepoPaths.Of(Folder), "*.yaml").Select(Path.GetFileName).OfType<string>()
            .Where(name => name != Kustomization).Order(StringComparer.Ordinal)];

    /// <summary>Every object that `kubectl apply -k` would send.</summary>
    public static IReadOnlyList<object> Applied { get; } = [.. Resources.SelectMany(LoadFile)];

    public static T Single<T>() => Applied.OfType<T>().Single();

    public static V1Deployment Deployment => Single<V1Deployment>();

    public static V1PodSpec Pod => Deployment.Spec.Template.Spec;

    public static V1Container Container => Pod.Containers.Single();

    public static V1Secret SecretExample { get; } =
        KubernetesYaml.Deserialize<V1Secret>(RepoPaths.Read($"{Folder}/{SecretExampleFile}"), strict: true);

    public static List<object> LoadFile(string fileName) =>
        KubernetesYaml.LoadAllFromString(RepoPaths.Read($"{Folder}/{fileName}"), strict: true);

    /// <summary>The container port a probe or Service port refers to, by number or by the container port's name.</summary>
    public static int ContainerPort(IntOrString port) =>
        int.TryParse(port.Value, NumberStyles.None, CultureInfo.InvariantCulture, out var number)
            ? number
            : Container.Ports.Single(p => p.Name == port.Value).ContainerPort;

    /// <summary>The container's port with that name (rest, grpc).</summary>
    public static int NamedPort(string name) => Container.Ports.Single(p => p.Name == name).ContainerPort;
}
