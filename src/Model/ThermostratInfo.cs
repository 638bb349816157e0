using System.Reflection;

namespace Thermostrat.Model;

/// <summary>Identity of this build of the library, written into every output file.</summary>
public static class ThermostratInfo
{
    private static readonly string Informational =
        typeof(ThermostratInfo).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "0.0.0";

    /// <summary>The tool version (semantic version without build metadata).</summary>
    public static string Version { get; } = Informational.Split('+')[0];

    /// <summary>The git commit the library was built from, when the build knew it; otherwise "unknown".</summary>
    public static string Commit { get; } = Informational.Contains('+') ? Informational.Split('+')[1] : "unknown";
}
