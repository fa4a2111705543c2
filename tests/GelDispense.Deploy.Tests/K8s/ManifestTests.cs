using k8s;
using k8s.Models;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>Every manifest is a well-formed Kubernetes object, kustomization.yaml applies all of them, and no secret is committed.</summary>
public sealed class ManifestTests
{
    [Fact]
    public void EveryManifestDocument_HasApiVersionKindAndMetadataName()
    {
        Assert.NotEmpty(Manifests.ManifestFiles);
        Assert.All(Manifests.ManifestFiles, file => Assert.All(YamlNodes.LoadDocuments($"{Manifests.Folder}/{file}"), document =>
        {
            Assert.False(string.IsNullOrWhiteSpace(document.Text("apiVersion")), $"{file}: no apiVersion");
            Assert.False(string.IsNullOrWhiteSpace(document.Text("kind")), $"{file}: no kind");
            Assert.False(string.IsNullOrWhiteSpace(document.Map("metadata").Text("name")), $"{file}: no metadata.name");
        }));
    }

    [Fact]
    public void EveryManifest_LoadsStrictlyIntoTheKubernetesTypeOfItsKind()
    {
        Assert.All(Manifests.ManifestFiles, file =>
        {
            var kinds = YamlNodes.LoadDocuments($"{Manifests.Folder}/{file}").Select(d => d.Text("kind"));
            var loaded = Manifests.LoadFile(file).Cast<IKubernetesObject>().Select(o => o.Kind);
            Assert.Equal(kinds, loaded);
        });
    }

    [Fact]
    public void Kustomization_AppliesEveryManifest_ExceptTheSecretExample()
    {
        var expected = Manifests.ManifestFiles.Where(file => file != Manifests.SecretExampleFile);
        Assert.Equal(expected.Order(StringComparer.Ordinal), Manifests.Resources.Order(StringComparer.Ordinal));
        Assert.DoesNotContain(Manifests.Applied, o => o is V1Secret);
    }

    [Fact]
    public void SecretExample_IsTheSecretTheDeploymentReferences_AndHoldsOnlyAPlaceholderPassword()
    {
        var reference = Manifests.Container.Env.Select(e => e.ValueFrom?.SecretKeyRef).OfType<V1SecretKeySelector>().Single();
        Assert.Equal(reference.Name, Manifests.SecretExample.Metadata.Name);
        Assert.True(Manifests.SecretExample.StringData.TryGetValue(reference.Key, out var connection), $"the example has no key {reference.Key}");
        Assert.Contains("Password=CHANGE-ME", connection, StringComparison.Ordinal);
    }
}
