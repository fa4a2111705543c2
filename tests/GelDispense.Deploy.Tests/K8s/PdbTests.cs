using k8s.Models;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>pdb.yaml: guards the Deployment's pods and still lets a node drain.</summary>
public sealed class PdbTests
{
    private static readonly V1PodDisruptionBudget Pdb = Manifests.Single<V1PodDisruptionBudget>();

    [Fact]
    public void PdbSelector_MatchesThePodLabels()
    {
        var podLabels = Manifests.Deployment.Spec.Template.Metadata.Labels;
        Assert.NotEmpty(Pdb.Spec.Selector.MatchLabels);
        Assert.All(Pdb.Spec.Selector.MatchLabels, label => Assert.Equal(label.Value, podLabels[label.Key]));
    }

    [Fact]
    public void Pdb_KeepsOnePodServing_AndAllowsOneEvictionAtTheMinimumScale()
    {
        var minAvailable = int.Parse(Pdb.Spec.MinAvailable.Value, System.Globalization.CultureInfo.InvariantCulture);
        Assert.True(minAvailable >= 1);
        // At or above the HPA's floor, one pod may always be evicted, so a node drain is never blocked.
        Assert.True(minAvailable < Manifests.Single<V2HorizontalPodAutoscaler>().Spec.MinReplicas);
    }
}
