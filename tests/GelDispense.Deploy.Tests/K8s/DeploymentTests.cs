using k8s.Models;
using GelDispense.Deploy.Tests.Docker;

namespace GelDispense.Deploy.Tests.K8s;

/// <summary>deployment.yaml: ports, probes, security, resources and configuration agree with the image and the service.</summary>
public sealed class DeploymentTests
{
    private static readonly V1Container Container = Manifests.Container;

    [Fact]
    public void Deployment_StartsTwoReplicas_AndSelectsItsOwnPodLabels()
    {
        Assert.Equal(2, Manifests.Deployment.Spec.Replicas);
        Assert.All(Manifests.Deployment.Spec.Selector.MatchLabels,
            label => Assert.Equal(label.Value, Manifests.Deployment.Spec.Template.Metadata.Labels[label.Key]));
    }

    [Fact]
    public void ContainerPorts_AreTheDockerfileExposedPorts_RestOnHttp1AndGrpcOnHttp2()
    {
        Assert.Equal(DockerRuntimePorts.Http1, Manifests.NamedPort("rest"));
        Assert.Equal(DockerRuntimePorts.Http2, Manifests.NamedPort("grpc"));
        Assert.Equal(DockerfileModel.Repository.Runtime.ExposedPorts(), Container.Ports.Select(p => p.ContainerPort).ToHashSet());
    }

    [Fact]
    public void ReadinessAndLivenessProbes_AskGrpcHealthOnTheContainersGrpcPort()
    {
        Assert.All([Container.ReadinessProbe, Container.LivenessProbe], probe =>
        {
            Assert.NotNull(probe?.Grpc);
            Assert.Equal(Manifests.NamedPort("grpc"), probe.Grpc.Port);
        });
    }

    [Fact]
    public void Readiness_asks_the_overall_status_with_storage_and_liveness_the_service_name_that_leaves_storage_out()
    {
        // No service name: the overall status of grpc.health.v1.Health, which includes the storage check.
        Assert.Null(Container.ReadinessProbe.Grpc.Service);
        Assert.False(string.IsNullOrEmpty(ServiceSettings.GrpcLivenessService), "HealthExtensions.LivenessService not found in the service source");
        Assert.Equal(ServiceSettings.GrpcLivenessService, Container.LivenessProbe.Grpc.Service);
    }

    [Fact]
    public void EveryProbe_TargetsAContainerPortThatTheServiceExposes()
    {
        var service = Manifests.Single<V1Service>();
        var exposed = service.Spec.Ports.Select(p => Manifests.ContainerPort(p.TargetPort)).ToHashSet();
        var probes = new[] { Container.StartupProbe, Container.ReadinessProbe, Container.LivenessProbe }.OfType<V1Probe>().ToList();
        Assert.Equal(3, probes.Count);
        Assert.All(probes, probe =>
        {
            var port = probe.Grpc?.Port ?? Manifests.ContainerPort(probe.HttpGet?.Port ?? probe.TcpSocket.Port);
            Assert.Contains(port, exposed);
        });
    }

    [Fact]
    public void HttpProbes_AskTheHealthRouteTheServiceMaps_OnTheRestPort()
    {
        var httpProbes = new[] { Container.StartupProbe, Container.ReadinessProbe, Container.LivenessProbe }
            .Select(p => p?.HttpGet).OfType<V1HTTPGetAction>().ToList();
        Assert.NotEmpty(httpProbes);
        Assert.All(httpProbes, get =>
        {
            Assert.True(ServiceSettings.MapsHealthRoute(get.Path), $"the service maps no {get.Path}");
            Assert.Equal(DockerRuntimePorts.Http1, Manifests.ContainerPort(get.Port));
        });
    }

    [Fact]
    public void Pod_RunsAsTheDockerfilesNonRootUser_WithoutPrivilegeEscalation()
    {
        var pod = Manifests.Pod.SecurityContext;
        Assert.True(pod.RunAsNonRoot);
        var dockerUser = DockerfileModel.Repository.Runtime.Last("USER")!.Operands.Single();
        Assert.Equal(dockerUser, pod.RunAsUser?.ToString(System.Globalization.CultureInfo.InvariantCulture));
        Assert.False(Container.SecurityContext.AllowPrivilegeEscalation);
        Assert.True(Container.SecurityContext.ReadOnlyRootFilesystem);
        Assert.Contains("ALL", Container.SecurityContext.Capabilities.Drop);
    }

    [Fact]
    public void Container_RequestsAndLimitsCpuAndMemory()
    {
        // The HPA's CPU utilisation is measured against the request, so the request must exist (Kubernetes docs).
        Assert.All(["cpu", "memory"], resource =>
        {
            Assert.True(Container.Resources.Requests.ContainsKey(resource), $"no {resource} request");
            Assert.True(Container.Resources.Limits.ContainsKey(resource), $"no {resource} limit");
        });
    }

    [Fact]
    public void Configuration_ComesFromTheConfigMap_AndTheConnectionStringFromASecretReference()
    {
        var configMap = Manifests.Single<V1ConfigMap>();
        Assert.Equal(configMap.Metadata.Name, Assert.Single(Container.EnvFrom).ConfigMapRef.Name);
        Assert.Equal("Postgres", configMap.Data[ServiceSettings.EnvName("Storage:Provider")]);
        var connection = Assert.Single(Container.Env, e => e.Name == ServiceSettings.EnvName($"ConnectionStrings:{ServiceSettings.ConnectionStringName}"));
        Assert.Null(connection.Value);
        Assert.NotNull(connection.ValueFrom.SecretKeyRef);
    }
}
