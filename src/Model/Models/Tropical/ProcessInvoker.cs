using System.Numerics;
using System.Reflection;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>A process's <see cref="IProcess.Apply{T}"/> closed over one number type.</summary>
public delegate void ProcessAction<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>;

/// <summary>
/// Binds a process's generic <see cref="IProcess.Apply{T}"/> to a delegate for a fixed number type once,
/// so that the hot path calls it directly instead of through a generic virtual (interface) dispatch,
/// which costs a runtime lookup per call.
/// </summary>
internal static class ProcessInvoker
{
    /// <summary>A delegate to <paramref name="process"/>'s public Apply&lt;T&gt;, or null when it implements Apply only explicitly (then the interface call is used).</summary>
    public static ProcessAction<T>? TryBind<T>(IProcess process) where T : struct, IFloatingPointIeee754<T>
    {
        var method = process.GetType().GetMethods(BindingFlags.Public | BindingFlags.Instance)
            .FirstOrDefault(m => m.Name == nameof(IProcess.Apply) && m.IsGenericMethodDefinition && m.GetParameters().Length == 1);
        if (method is null) return null;
        return (ProcessAction<T>)Delegate.CreateDelegate(typeof(ProcessAction<T>), process, method.MakeGenericMethod(typeof(T)));
    }
}
