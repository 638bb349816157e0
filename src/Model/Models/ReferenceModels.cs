using Thermostrat.Model.Analysis;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Models;

/// <summary>The published reference models, selectable by name.</summary>
public static class ReferenceModels
{
    private static readonly (string Name, Func<IParametricSystem> Create)[] Catalog =
    [
        ("stommel", () => new StommelBoxModel()),
        ("stommel-smooth", () => new StommelBoxModel(flowLaw: StommelFlowLaw.Smoothed)),
        ("stommel-dimensional", () => new StommelDimensionalModel()),
        ("stommel-dimensional-smooth", () => new StommelDimensionalModel(flowLaw: StommelFlowLaw.Smoothed)),
        ("recharge-oscillator", () => new RechargeOscillator(nonlinear: true)),
        ("recharge-oscillator-linear", () => new RechargeOscillator(nonlinear: false)),
    ];

    /// <summary>Names accepted by <see cref="Create"/>.</summary>
    public static IReadOnlyList<string> Names { get; } = Catalog.Select(c => c.Name).ToArray();

    /// <summary>Creates the reference model called <paramref name="name"/> (case-insensitive) with its default parameters.</summary>
    /// <exception cref="ArgumentException">Unknown name; the message gives the closest valid name and lists all.</exception>
    public static IParametricSystem Create(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        foreach (var (n, create) in Catalog)
            if (string.Equals(n, name, StringComparison.OrdinalIgnoreCase)) return create();
        throw new ArgumentException($"Unknown reference model '{name}': did you mean '{EditDistance.Closest(name, Names)}'? Valid names: {string.Join(", ", Names)}.", nameof(name));
    }
}
