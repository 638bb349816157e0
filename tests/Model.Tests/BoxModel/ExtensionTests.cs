using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>A toy process added as one class plus one catalog/configuration entry (no change to the model).</summary>
public class ExtensionTests
{
    /// <summary>Toy hypothesis: a constant extra heat flux into the cold tongue (e.g. an unresolved cloud effect).</summary>
    private sealed class ToyColdTongueHeating : IProcess
    {
        public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<ToyOptions>(
            "ToyHeating", "test: constant extra surface heat flux into the cold tongue", "Q_E += F_toy", ["(test process)"], order: 75,
            (o, c) => new ToyColdTongueHeating(o, c));

        private readonly int _flux, _slot;

        private ToyColdTongueHeating(ToyOptions o, ProcessBuildContext c)
        {
            _flux = c.Parameter(nameof(o.Flux_Wm2));
            _slot = c.ProvideDiagnostic("toy_heating_wm2", "W m-2", "toy extra heating of the cold tongue", 0.0);
        }

        public string Name => "ToyHeating";

        public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
        {
            c.Diagnostics[_slot] = c.P(_flux);
            c.AddSurfaceHeatFlux(Box.ColdTongue, c.P(_flux));
        }
    }

    private sealed class ToyOptions : ProcessOptions
    {
        [Parameter("W m-2", "extra heat flux into the cold tongue", Source = "test value", Min = -100, Max = 100)]
        public double Flux_Wm2 { get; set; } = 20.0;
    }

    private static readonly ProcessCatalog Catalog = ProcessCatalog.CreateBuiltIn().With(ToyColdTongueHeating.Descriptor);

    [Fact]
    public void AToyProcessTakesEffectThroughTheCatalog()
    {
        var m = Build(catalog: Catalog);
        Assert.Contains("ToyHeating", m.ActiveProcesses);
        Assert.Contains(m.ParameterEntries, p => p.Key == "Model:Processes:ToyHeating:Flux_Wm2");
        Assert.Contains(m.Columns, c => c.Name == "toy_heating_wm2");
        var withToy = Equilibrium(m);
        var without = Equilibrium(Build());
        // Extra heat in the cold tongue warms it and, with the Bjerknes and cloud feedbacks, shrinks the zonal contrast.
        Assert.True(withToy[(int)Box.ColdTongue] > without[(int)Box.ColdTongue] + 0.2);
        Assert.True(ZonalDifference(withToy) < ZonalDifference(without));
        Assert.Contains(m.Describe().Processes, p => p.Name == "ToyHeating" && p.Enabled);
    }

    [Fact]
    public void DisablingTheToyProcessRestoresTheDefault()
    {
        var m = Build(o => o.Processes["ToyHeating"].Enabled = false, catalog: Catalog);
        var y = Equilibrium(m);
        var d = Equilibrium(Build());
        for (int i = 0; i < d.Length; i++) Assert.Equal(d[i], y[i], 1e-9);
    }

    [Fact]
    public void AnOptionsEntryForAProcessTheCatalogLacksIsAnError()
    {
        // The configuration names a process the (built-in) catalog does not know.
        var ex = Assert.Throws<ConfigurationException>(() => Build(o => o.Processes["ToyHeating"] = new ProcessOptions()));
        Assert.Contains("Model:Processes:ToyHeating", ex.Message);
        Assert.Contains("allowed:", ex.Message);
        Assert.Contains("Ventilation", ex.Message);
    }
}
