using System.Reflection;

namespace Thermostrat.Model;

/// <summary>Identity of this build of the library, written into every output file.</summary>
public static class ThermostratInfo
{
    /// <summary>The tool version (assembly informational version).</summary>
    public static string Version { get; } =
        typeof(ThermostratInfo).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion?.Split('+')[0]
        ?? "0.0.0";
}
