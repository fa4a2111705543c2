using k8s.Models;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>service.yaml: selects the Deployment's pods and exposes the rest and grpc ports, gRPC marked as cleartext HTTP/2.</summary>
public sealed class ServiceTests
{
    private static readonly V1Service Service = Manifests.Single<V1Service>();

    [Fact]
    public void Service_SelectsThePodLabelsOfTheDeployment()
    {
        Assert.Equal(Manifests.Deployment.Spec.Selector.MatchLabels, Service.Spec.Selector);
    }

    [Fact]
    public void ServicePorts_TargetTheContainersRestAndGrpcPorts_OnTheSameNumbers()
    {
        Assert.All(["rest", "grpc"], name =>
        {
            var port = Assert.Single(Service.Spec.Ports, p => p.Name == name);
            Assert.Equal(Manifests.NamedPort(name), Manifests.ContainerPort(port.TargetPort));
            Assert.Equal(Manifests.NamedPort(name), port.Port);
        });
    }

    [Fact]
    public void GrpcPort_DeclaresCleartextHttp2AsItsAppProtocol()
    {
        // kubernetes.io/h2c: HTTP/2 over cleartext with prior knowledge (Kubernetes Service appProtocol standard values).
        Assert.Equal("kubernetes.io/h2c", Service.Spec.Ports.Single(p => p.Name == "grpc").AppProtocol);
    }
}
