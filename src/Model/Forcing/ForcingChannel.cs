using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// Indices of the forcing values a process reads from <see cref="ProcessContext{T}.Forcing"/>. All are
/// evaluated once per right-hand-side call from precomputed tables.
/// </summary>
public static class ForcingChannel
{
    /// <summary>Top-of-atmosphere insolation over surface box b (W/m²): annual mean or daily mean, per <see cref="ForcingOptions.SeasonalCycle"/>; index = (int)b for the four surface boxes.</summary>
    public static int Insolation(Box b) => Boxes.IsSurface(b) ? (int)b : throw new ArgumentOutOfRangeException(nameof(b), b, "only surface boxes receive insolation");

    /// <summary>Atmospheric CO2 concentration (ppm).</summary>
    public const int Co2 = 4;

    /// <summary>Sea level relative to present (m; negative with more land ice).</summary>
    public const int SeaLevel = 5;

    /// <summary>Scheduled freshwater input into surface box b (m³/s), from "Model:Forcing:Freshwater"; index = 6 + (int)b.</summary>
    public static int Freshwater(Box b) => Boxes.IsSurface(b) ? 6 + (int)b : throw new ArgumentOutOfRangeException(nameof(b), b, "freshwater schedules apply to surface boxes");

    /// <summary>Number of channels.</summary>
    public const int Count = 10;
}
