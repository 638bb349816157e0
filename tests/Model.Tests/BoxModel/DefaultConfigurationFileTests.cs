using System.Globalization;
using System.Text.Json;
using Thermostrat.Model.Models.Tropical;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>configs/default.json states exactly the code defaults, key for key (so documentation and file cannot drift apart).</summary>
public class DefaultConfigurationFileTests
{
    private static string FindConfig()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            string path = Path.Combine(dir.FullName, "configs", "default.json");
            if (File.Exists(path)) return path;
        }
        throw new FileNotFoundException("configs/default.json not found above " + AppContext.BaseDirectory);
    }

    private static void Flatten(JsonElement e, string path, Dictionary<string, string> into)
    {
        switch (e.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (var p in e.EnumerateObject()) Flatten(p.Value, path.Length == 0 ? p.Name : path + ":" + p.Name, into);
                break;
            case JsonValueKind.Array:
                int i = 0;
                foreach (var item in e.EnumerateArray()) Flatten(item, path + ":" + i++, into);
                break;
            case JsonValueKind.String:
                into[path] = e.GetString()!;
                break;
            default:
                into[path] = e.GetRawText();
                break;
        }
    }

    [Fact]
    public void ModelSectionEqualsTheCodeDefaults()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(FindConfig()));
        var file = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        Flatten(doc.RootElement, "", file);
        var options = Build().Describe().Options.Where(o => !o.Key.StartsWith("Model:MeanSalinity", StringComparison.Ordinal)).ToList();
        foreach (var o in options)
        {
            Assert.True(file.TryGetValue(o.Key, out string? text), $"{o.Key} is missing from configs/default.json");
            if (double.TryParse(o.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out double expected) && double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double actual))
                Assert.Equal(expected, actual);
            else
                Assert.Equal(o.Value, text, ignoreCase: true);
        }
        var known = options.Select(o => o.Key).ToHashSet(StringComparer.OrdinalIgnoreCase);
        foreach (var key in file.Keys.Where(k => k.StartsWith("Model:", StringComparison.Ordinal)))
            Assert.True(known.Contains(key), $"configs/default.json has {key}, which is not an option of the model");
    }

    [Fact]
    public void RunSectionEqualsTheCodeDefaults()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(FindConfig()));
        var run = doc.RootElement.GetProperty("Run");
        var d = new RunOptions();
        Assert.Equal(d.DurationYears, run.GetProperty("DurationYears").GetDouble());
        Assert.Equal(d.StartAgeKa, run.GetProperty("StartAgeKa").GetDouble());
        Assert.Equal(d.OutputIntervalYears, run.GetProperty("OutputIntervalYears").GetDouble());
        Assert.Equal(d.RelativeTolerance, run.GetProperty("RelativeTolerance").GetDouble());
        Assert.Equal(d.AbsoluteTolerance, run.GetProperty("AbsoluteTolerance").GetDouble());
        Assert.Equal(d.Method.ToString(), run.GetProperty("Method").GetString());
    }
}
