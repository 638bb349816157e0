namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// The six boxes of the tropical ocean–cloud model. The first four are surface boxes (they exchange heat
/// and freshwater with the atmosphere); <see cref="Thermocline"/> and <see cref="Deep"/> lie beneath them.
/// </summary>
public enum Box
{
    /// <summary>Western equatorial warm pool (surface).</summary>
    WarmPool = 0,
    /// <summary>Eastern equatorial cold tongue (surface), where thermocline water upwells.</summary>
    ColdTongue = 1,
    /// <summary>Northern ventilation (subduction) box (surface), the outcrop that feeds the equatorial thermocline.</summary>
    North = 2,
    /// <summary>Southern ventilation (subduction) box (surface).</summary>
    South = 3,
    /// <summary>Equatorial thermocline (undercurrent) box that supplies the upwelling.</summary>
    Thermocline = 4,
    /// <summary>Slow deep reservoir beneath the thermocline.</summary>
    Deep = 5,
}

/// <summary>Names and groupings of <see cref="Box"/>.</summary>
public static class Boxes
{
    /// <summary>Number of boxes.</summary>
    public const int Count = 6;

    /// <summary>Number of surface boxes (indices 0 … 3).</summary>
    public const int SurfaceCount = 4;

    /// <summary>All boxes in index order.</summary>
    public static IReadOnlyList<Box> All { get; } = [Box.WarmPool, Box.ColdTongue, Box.North, Box.South, Box.Thermocline, Box.Deep];

    /// <summary>The surface boxes in index order.</summary>
    public static IReadOnlyList<Box> Surface { get; } = [Box.WarmPool, Box.ColdTongue, Box.North, Box.South];

    /// <summary>True for the two equatorial surface boxes (warm pool and cold tongue).</summary>
    public static bool IsTropicalSurface(Box b) => b is Box.WarmPool or Box.ColdTongue;

    /// <summary>True for the two ventilation boxes (north and south), the model's extratropical surface boxes.</summary>
    public static bool IsExtratropicalSurface(Box b) => b is Box.North or Box.South;

    /// <summary>True for boxes in contact with the atmosphere.</summary>
    public static bool IsSurface(Box b) => (int)b < SurfaceCount;

    /// <summary>Configuration name of a box ("WarmPool", ...), as in "Model:Boxes:WarmPool".</summary>
    public static string ConfigName(Box b) => b.ToString();

    /// <summary>snake_case name used in output columns ("warm_pool", "cold_tongue", ...).</summary>
    public static string ColumnName(Box b) => b switch
    {
        Box.WarmPool => "warm_pool",
        Box.ColdTongue => "cold_tongue",
        Box.North => "north",
        Box.South => "south",
        Box.Thermocline => "thermocline",
        Box.Deep => "deep",
        _ => throw new ArgumentOutOfRangeException(nameof(b), b, "not a box of the tropical model"),
    };

    /// <summary>Human-readable name ("warm pool", ...).</summary>
    public static string Label(Box b) => ColumnName(b).Replace('_', ' ');

    /// <summary>Parses a configuration name (case-insensitive); throws naming the allowed names.</summary>
    public static Box Parse(string name, string key)
    {
        foreach (var b in All)
            if (string.Equals(ConfigName(b), name?.Trim(), StringComparison.OrdinalIgnoreCase)) return b;
        throw new Configuration.ConfigurationException(
            $"{key} = '{name}' is not a box; allowed: {string.Join(", ", All.Select(ConfigName))}");
    }
}
