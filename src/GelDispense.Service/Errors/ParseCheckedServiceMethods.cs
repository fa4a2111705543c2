using System.Reflection;
using GelDispense.Chemistry.Errors;
using Google.Protobuf;
using Grpc.AspNetCore.Server.Model;
using Grpc.Core;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection.Extensions;

namespace GelDispense.Service.Errors;

/// <summary>
/// Binds every gRPC service as Grpc.AspNetCore's own binder does, but with request marshallers that turn a message
/// which is not valid protobuf into INVALID_ARGUMENT with a reason. Grpc.AspNetCore parses the request before any
/// interceptor runs and reports a parse failure as UNKNOWN "Exception was thrown by handler.", which tells a client
/// that sent a truncated or garbled message nothing about its own mistake.
/// </summary>
public static class ParseCheckedServiceMethods
{
    /// <summary>Grpc.AspNetCore's default provider, internal to it; replaced by ours.</summary>
    private const string DefaultProviderName = "BinderServiceMethodProvider`1";

    public static IServiceCollection AddParseCheckedServiceMethods(this IServiceCollection services)
    {
        var defaults = services.Where(d => d.ServiceType == typeof(IServiceMethodProvider<>) && d.ImplementationType?.Name == DefaultProviderName).ToList();
        if (defaults.Count != 1)
        {
            // Both providers would map every method twice; stop at start-up rather than answer with ambiguous routes.
            throw new InvalidOperationException(
                $"Grpc.AspNetCore's default service method provider ({DefaultProviderName}) was not found once among the registered services; " +
                "call AddParseCheckedServiceMethods after AddGrpc, and check the provider against the Grpc.AspNetCore version in use.");
        }

        services.Remove(defaults[0]);
        services.TryAddEnumerable(ServiceDescriptor.Singleton(typeof(IServiceMethodProvider<>), typeof(Provider<>)));
        return services;
    }

    /// <summary>INVALID_ARGUMENT naming the message type and what is wrong with the bytes.</summary>
    private static RpcException NotAMessage<TRequest>(InvalidProtocolBufferException e) =>
        new ApiProblem(StatusCode.InvalidArgument, "The request is not a valid protobuf message.",
            [new InputError("request", typeof(TRequest).Name, $"the bytes do not parse as {typeof(TRequest).Name}: {e.Message}")]).ToRpcException();

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

    private sealed class Provider<TService> : IServiceMethodProvider<TService>
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
                    method.Invoke(null, [new Binder<TService>(context, type), null]);
                    return;
                }
            }
        }
    }

    /// <summary>Adds each method with its request marshaller checked, the handler found by name as the default binder finds it.</summary>
    private sealed class Binder<TService>(ServiceMethodProviderContext<TService> context, Type serviceBase) : ServiceBinderBase
        where TService : class
    {
        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, UnaryServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<UnaryServerMethod<TService, TRequest, TResponse>>(method.Name, typeof(TRequest), typeof(ServerCallContext));
            context.AddUnaryMethod(CheckedMethod(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, ServerStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<ServerStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(TRequest), typeof(IServerStreamWriter<TResponse>), typeof(ServerCallContext));
            context.AddServerStreamingMethod(CheckedMethod(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, ClientStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<ClientStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(IAsyncStreamReader<TRequest>), typeof(ServerCallContext));
            context.AddClientStreamingMethod(CheckedMethod(method), metadata, invoker);
        }

        public override void AddMethod<TRequest, TResponse>(Method<TRequest, TResponse> method, DuplexStreamingServerMethod<TRequest, TResponse>? handler)
        {
            var (invoker, metadata) = Handler<DuplexStreamingServerMethod<TService, TRequest, TResponse>>(
                method.Name, typeof(IAsyncStreamReader<TRequest>), typeof(IServerStreamWriter<TResponse>), typeof(ServerCallContext));
            context.AddDuplexStreamingMethod(CheckedMethod(method), metadata, invoker);
        }

        private static Method<TRequest, TResponse> CheckedMethod<TRequest, TResponse>(Method<TRequest, TResponse> method) =>
            new(method.Type, method.ServiceName, method.Name, Checked(method.RequestMarshaller), method.ResponseMarshaller);

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
