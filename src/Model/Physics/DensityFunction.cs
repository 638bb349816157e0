using System.Numerics;
using System.Reflection;
using System.Runtime.CompilerServices;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Physics;

/// <summary>
/// An equation of state's density with its generic method bound once for <see cref="double"/> and
/// <see cref="Dual"/>, so the hot path avoids a generic virtual dispatch per call; other number types use
/// the interface.
/// </summary>
public sealed class DensityFunction
{
    private delegate T Density<T>(T salinity, T temperature, T pressure);

    private readonly IEquationOfState _eos;
    private readonly Density<double>? _double;
    private readonly Density<Dual>? _dual;

    /// <summary>Binds the density of <paramref name="eos"/>.</summary>
    public DensityFunction(IEquationOfState eos)
    {
        _eos = eos ?? throw new ArgumentNullException(nameof(eos));
        var method = eos.GetType().GetMethods(BindingFlags.Public | BindingFlags.Instance)
            .FirstOrDefault(m => m.Name == nameof(IEquationOfState.Density) && m.IsGenericMethodDefinition && m.GetParameters().Length == 3);
        if (method is null) return;
        _double = (Density<double>)Delegate.CreateDelegate(typeof(Density<double>), eos, method.MakeGenericMethod(typeof(double)));
        _dual = (Density<Dual>)Delegate.CreateDelegate(typeof(Density<Dual>), eos, method.MakeGenericMethod(typeof(Dual)));
    }

    /// <summary>In-situ density ρ(S, T, p) in kg/m³ (salinity g/kg, temperature °C, sea pressure dbar).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public T Of<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>
    {
        if (typeof(T) == typeof(double) && _double is not null)
        {
            double r = _double(Unsafe.As<T, double>(ref salinity), Unsafe.As<T, double>(ref temperature), Unsafe.As<T, double>(ref pressure));
            return Unsafe.As<double, T>(ref r);
        }
        if (typeof(T) == typeof(Dual) && _dual is not null)
        {
            Dual r = _dual(Unsafe.As<T, Dual>(ref salinity), Unsafe.As<T, Dual>(ref temperature), Unsafe.As<T, Dual>(ref pressure));
            return Unsafe.As<Dual, T>(ref r);
        }
        return _eos.Density(salinity, temperature, pressure);
    }
}
