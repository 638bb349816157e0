using System.Numerics;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// One physical process of the tropical model: it reads the state, the forcing, its parameters and the
/// diagnostics of processes that ran before it, writes its own diagnostics, and adds heat and salt
/// fluxes (and the rates of any state variables it owns) through the <see cref="ProcessContext{T}"/>.
/// </summary>
/// <remarks>
/// <para>Written once, generic over the number type, so the same code gives values and exact Jacobians
/// (forward-mode dual numbers). <see cref="Apply{T}"/> is the model's hot path: it must not allocate.</para>
/// <para>A process is built by its <see cref="ProcessDescriptor"/> from its options; there it asks the
/// <see cref="ProcessBuildContext"/> for the indices of its parameters, the diagnostics it provides and
/// reads, and any state variables it owns.</para>
/// </remarks>
public interface IProcess
{
    /// <summary>The process's name (its key in "Model:Processes").</summary>
    string Name { get; }

    /// <summary>Adds this process's contribution at one instant.</summary>
    void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>;
}
