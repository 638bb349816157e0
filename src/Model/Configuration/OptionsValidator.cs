using System.Collections;
using System.Globalization;
using System.Reflection;

namespace Thermostrat.Model.Configuration;

/// <summary>
/// Validates a bound options tree: every floating-point value finite, every value inside the
/// bounds of its <see cref="ParameterAttribute"/>, and every <see cref="ISelfValidating"/>
/// object's own relations. Collects all problems rather than stopping at the first.
/// </summary>
public static class OptionsValidator
{
    /// <summary>Throws <see cref="ConfigurationException"/> listing every problem, if any.</summary>
    /// <param name="options">The options object.</param>
    /// <param name="path">Configuration path of the object (e.g. "Model").</param>
    public static void ThrowIfInvalid(object options, string path)
    {
        var problems = Validate(options, path);
        if (problems.Count > 0) throw new ConfigurationException(problems);
    }

    /// <summary>Returns every problem found in <paramref name="options"/>.</summary>
    public static List<string> Validate(object options, string path)
    {
        var problems = new List<string>();
        Walk(options, path, problems, depth: 0);
        return problems;
    }

    private static void Walk(object? node, string path, List<string> problems, int depth)
    {
        if (node is null || depth > 16) return;
        var type = node.GetType();
        if (IsLeaf(type)) return;
        if (node is IDictionary dict)
        {
            foreach (DictionaryEntry e in dict) CheckValue(e.Value, Join(path, e.Key?.ToString() ?? ""), null, problems, depth);
            return;
        }
        if (node is IEnumerable list and not string)
        {
            int i = 0;
            foreach (var item in list) CheckValue(item, Join(path, (i++).ToString(CultureInfo.InvariantCulture)), null, problems, depth);
            return;
        }
        foreach (var prop in type.GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (prop.GetIndexParameters().Length > 0 || !prop.CanRead) continue;
            CheckValue(prop.GetValue(node), Join(path, prop.Name), prop.GetCustomAttribute<ParameterAttribute>(), problems, depth);
        }
        if (node is ISelfValidating self) problems.AddRange(self.Validate(path));
    }

    private static void CheckValue(object? value, string key, ParameterAttribute? attr, List<string> problems, int depth)
    {
        switch (value)
        {
            case double d:
                CheckNumber(d, key, attr, problems);
                break;
            case float f:
                CheckNumber(f, key, attr, problems);
                break;
            case int i:
                CheckNumber(i, key, attr, problems);
                break;
            case long l:
                CheckNumber(l, key, attr, problems);
                break;
            default:
                if (value is not null && !IsLeaf(value.GetType())) Walk(value, key, problems, depth + 1);
                break;
        }
    }

    private static void CheckNumber(double v, string key, ParameterAttribute? attr, List<string> problems)
    {
        string shown = v.ToString("R", CultureInfo.InvariantCulture);
        if (!double.IsFinite(v))
        {
            problems.Add($"{key} = {shown} is not a finite number; allowed: {DescribeRange(attr)}");
            return;
        }
        if (attr is null) return;
        bool low = !double.IsNaN(attr.Min) && (attr.MinExclusive ? v <= attr.Min : v < attr.Min);
        bool high = !double.IsNaN(attr.Max) && v > attr.Max;
        if (low || high) problems.Add($"{key} = {shown} is out of range; allowed: {DescribeRange(attr)}");
    }

    /// <summary>Human-readable allowed range of a parameter, with its unit.</summary>
    public static string DescribeRange(ParameterAttribute? attr)
    {
        if (attr is null) return "any finite number";
        string unit = string.IsNullOrEmpty(attr.Unit) || attr.Unit == "1" ? "" : " " + attr.Unit;
        string lo = double.IsNaN(attr.Min) ? "" : (attr.MinExclusive ? "> " : ">= ") + attr.Min.ToString(CultureInfo.InvariantCulture);
        string hi = double.IsNaN(attr.Max) ? "" : "<= " + attr.Max.ToString(CultureInfo.InvariantCulture);
        return (lo, hi) switch
        {
            ("", "") => "any finite number" + (unit.Length > 0 ? " (" + unit.Trim() + ")" : ""),
            (_, "") => lo + unit,
            ("", _) => hi + unit,
            _ => $"{lo} and {hi}{unit}",
        };
    }

    private static string Join(string path, string key) => path.Length == 0 ? key : path + ":" + key;

    private static bool IsLeaf(Type t) =>
        t.IsPrimitive || t.IsEnum || t == typeof(string) || t == typeof(decimal) || t == typeof(DateTime) || t == typeof(TimeSpan);
}
