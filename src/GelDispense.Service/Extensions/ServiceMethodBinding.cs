using System.Reflection;
using GelDispense.Chemistry.Errors;
using GelDispense.Service.Api;
using GelDispense.Service.Errors;
using Google.Protobuf;
using Grpc.AspNetCore.Server.Model;
using Grpc.Core;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace GelDispense.Service.Extensions;

/// <summary>
/// Binds every gRPC service as Grpc.AspNetCore's own binder does, with two changes to the marshallers:
/// <list type="bullet">
/// <item>A request that is not valid protobuf is refused as INVALID_ARGUMENT with a reason. Grpc.AspNetCore parses the
/// request before any interceptor runs and reports a parse failure as UNKNOWN "Exception was thrown by handler.",
/// which tells a client that sent a truncated or garbled message nothing about its own mistake.</item>
/// <item>An answer whose bytes are kept (<see cref="SerializedAnswers"/>, a remembered plan) is written from them.</item>
/// </list>
/// </summary>
public static class ServiceMethodBinding
{
    /// <summary>Grpc.AspNetCore's default provider, internal to it; replaced by ours.</summary>
    private const string DefaultProviderName = "BinderServiceMethodProvider`1";

    public static IServiceCollection AddServiceMethodBinding(this IServiceCollection services)
    {
        var defaults = services.Where(d => d.ServiceType == typeof(IServiceMethodProvider<>) && d.ImplementationType?.Name == DefaultProviderName).ToList();
        if (defaults.Count != 1)
        {
            // Both providers would map every method twice; stop at start-up rather than answer with ambiguous routes.
            throw new InvalidOperationException(
                $"Grpc.AspNetCore's default service method provider ({DefaultProviderName}) was not found once among the registered services; " +
                "call AddServiceMethodBinding after AddGrpc, and check the provider against the Grpc.AspNetCore version in use.");
        }

        services.Remove(defaults[0]);
        services.TryAddEnumerable(ServiceDescriptor.Singleton(typeof(IServiceMethodProvider<>), typeof(Provider<>)));
        return services;
    }

    /// <summary>INVALID_ARGUMENT naming the message type and what is wrong with the bytes.</summary>
    private static RpcException NotAMessage<TRequest>(InvalidProtocolBufferException e) =>
        new ApiProblem(StatusCode.InvalidArgument, "The request is not a valid protobuf message.",
            [new InputError("request", typeof(TRequest).Name, $"the bytes do not parse as {typeof(TRequest).Name}: {e.Message}")]).ToRpcException();

    /// <summary><paramref name="marshaller"/>, writing an answer whose bytes are kept from those bytes.</summary>
    internal static Marshaller<TResponse> FromKeptBytes<TResponse>(Marshaller<TResponse> marshaller, SerializedAnswers serialized) =>
        new((response, context) =>
        {
            if (serialized.TryGet(response!, out var bytes))
            {
                context.Complete(bytes);
            }
            else
            {
                marshaller.ContextualSerializer(response, context);
            }
        }, marshaller.ContextualDeserializer);

    private static Marshaller<TRequest> Checked<TRequest>(Marshaller<TRequest> marshaller) =>
        new(marshaller.ContextualSerializer, context =>
        {
            try
            {
                return marshaller.ContextualDeserializer(context);
            }
            catch (InvalidProtocolBufferException e)
            {
                throw NotAMessage<TRequest>(e);
            }
        });

    private sealed class Provider<TService>(SerializedAnswers serialized) : IServiceMethodProvider<TService>
        where TService : class
    {
        public void OnServiceMethodDiscovery(ServiceMethodProviderContext<TService> context)
        {
            // The generated base class names its static BindService(ServiceBinderBase, TBase) method.
            for (var type = typeof(TService); type is not null; type = type.BaseType)
            {
                if (type.GetCustomAttribute<BindServiceMethodAttribute>(inherit: false) is { } bind)
                {
                    var method = bind.BindType.GetMethod(bind.BindMethodName, BindingFlags.Public | BindingFlags.Static, [typeof(ServiceBinderBase), type])
                        ?? throw new InvalidOperationException($"{bind.BindType.Name}.{bind.BindMethodName}(ServiceBinderBase, {type.Name}) not found.");
                    method.Invoke(null, [new Binder<TService>(context, type, serialized), null]);
                    return;
                }
            }
        }
    }

    /// <summary>Adds each method with its marshallers changed, the handler found by name as the default binder finds it.</summary>
    private sealed class Binder<TService>(ServiceMethodProviderContext<TService> context, Type serviceBase, SerializedAnswers serialized) : ServiceBinderBase
        where TService : class
    {
        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, UnaryServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<UnaryServerMethod<TService, TRequest, TResponse>>(method.Name, typeof(TRequest), typeof(ServerCallContext));
            context.AddUnaryMethod(Bound(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, ServerStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<ServerStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(TRequest), typeof(IServerStreamWriter<TResponse>), typeof(ServerCallContext));
            context.AddServerStreamingMethod(Bound(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, ClientStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<ClientStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(IAsyncStreamReader<TRequest>), typeof(ServerCallContext));
            context.AddClientStreamingMethod(Bound(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, DuplexStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<DuplexStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(IAsyncStreamReader<TRequest>), typeof(IServerStreamWriter<TResponse>), typeof(ServerCallContext));
            context.AddDuplexStreamingMethod(Bound(method), metadata, invoker);
        }

        private Method<TRequest, TResponse> Bound<TRequest, TResponse>(Method<TRequest, TResponse> method) =>
            new(method.Type, method.ServiceName, method.Name, Checked(method.RequestMarshaller), FromKeptBytes(method.ResponseMarshaller, serialized));

        /// <summary>
        /// The service's override of the generated virtual method (or the generated one, which answers UNIMPLEMENTED),
        /// with the attributes of the class and then the method, so [Authorize] and the like apply as before.
        /// </summary>
        private (TDelegate Invoker, List<object> Metadata) Handler<TDelegate>(string name, params Type[] parameters)
            where TDelegate : Delegate
        {
            var handler = typeof(TService).GetMethods(BindingFlags.Public | BindingFlags.Instance)
                .Single(m => m.Name == name && m.GetParameters().Select(p => p.ParameterType).SequenceEqual(parameters) &&
                    m.GetBaseDefinition().DeclaringType == serviceBase);
            List<object> metadata = [.. typeof(TService).GetCustomAttributes(inherit: true), .. handler.GetCustomAttributes(inherit: true)];
            metadata.Add(new HttpMethodMetadata(["POST"], acceptCorsPreflight: true));
            return ((TDelegate)Delegate.CreateDelegate(typeof(TDelegate), handler), metadata);
        }
    }
}
