using System.Reflection;
using MassTransit;

namespace Monitor.Service.Tests.Support;

/// <summary>A <see cref="PublishContext"/> that only keeps the MessageId a publish pipe sets; other members return defaults.</summary>
public class StandInPublishContext : DispatchProxy
{
    public Guid? MessageId { get; private set; }

    protected override object? Invoke(MethodInfo? targetMethod, object?[]? args)
    {
        switch (targetMethod?.Name)
        {
            case "set_MessageId":
                MessageId = (Guid?)args![0];
                return null;
            case "get_MessageId":
                return MessageId;
            default:
                var type = targetMethod?.ReturnType;
                return type is null || type == typeof(void) || !type.IsValueType ? null : Activator.CreateInstance(type);
        }
    }
}
