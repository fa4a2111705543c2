using k8s.Models;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>hpa.yaml: scales the Deployment, never below the two replicas a site needs for failover.</summary>
public sealed class HpaTests
{
    private static readonly V2HorizontalPodAutoscaler Hpa = Manifests.Single<V2HorizontalPodAutoscaler>();

    [Fact]
    public void Hpa_IsAutoscalingV2_AndTargetsTheDeploymentByName()
    {
        Assert.Equal("autoscaling/v2", Hpa.ApiVersion);
        Assert.Equal("Deployment", Hpa.Spec.ScaleTargetRef.Kind);
        Assert.Equal(Manifests.Deployment.ApiVersion, Hpa.Spec.ScaleTargetRef.ApiVersion);
        Assert.Equal(Manifests.Deployment.Metadata.Name, Hpa.Spec.ScaleTargetRef.Name);
    }

    [Fact]
    public void Hpa_KeepsAtLeastTheDeploymentsTwoReplicas_AndCanGrowBeyondThem()
    {
        Assert.Equal(Manifests.Deployment.Spec.Replicas, Hpa.Spec.MinReplicas);
        Assert.True(Hpa.Spec.MaxReplicas > Hpa.Spec.MinReplicas);
    }

    [Fact]
    public void Hpa_ScalesOnCpuUtilisation_WhichTheContainerRequests()
    {
        var metric = Assert.Single(Hpa.Spec.Metrics);
        Assert.Equal("cpu", metric.Resource.Name);
        Assert.Equal("Utilization", metric.Resource.Target.Type);
        Assert.True(Manifests.Container.Resources.Requests.ContainsKey("cpu"));
    }
}
