using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models;

namespace Thermostrat.Runner.Models;

/// <summary>Chooses the model an analysis command works on.</summary>
public static class ModelHosts
{
    /// <summary>Name of the default model (the tropical ocean–cloud box model).</summary>
    public const string Tropical = "tropical";

    /// <summary>Every model name accepted by --model.</summary>
    public static IReadOnlyList<string> Names => [Tropical, .. ReferenceModels.Names];

    /// <summary>The host for <paramref name="name"/>; the tropical model is built from <paramref name="settings"/>.</summary>
    public static IModelHost Create(string name, Configuration.Settings settings)
    {
        if (string.Equals(name, Tropical, StringComparison.OrdinalIgnoreCase))
            return TropicalModelHost.Create(settings);
        if (!ReferenceModels.Names.Contains(name, StringComparer.OrdinalIgnoreCase))
        {
            var near = Configuration.KeySuggester.Closest(name, Names);
            throw new ConfigurationException($"--model '{name}' is not known{(near is null ? "" : $"; did you mean '{near}'?")} Allowed: {string.Join(", ", Names)}");
        }
        return ReferenceModelHost.Create(name);
    }
}
