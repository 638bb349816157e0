namespace Thermostrat.Model.Models;

/// <summary>How the Stommel models turn the density difference into the exchange rate between the boxes.</summary>
public enum StommelFlowLaw
{
    /// <summary>Stommel's |q|: mixing proportional to the magnitude of the flow, with a corner at q = 0.</summary>
    Absolute,
    /// <summary>√(q² + ε²): a smooth approximation of |q| (within ε of it), whose turning points are smooth folds.</summary>
    Smoothed,
}
