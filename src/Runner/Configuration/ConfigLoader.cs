using System.Collections;
using System.Globalization;
using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.Extensions.Configuration;
using Thermostrat.Model.Configuration;

namespace Thermostrat.Runner.Configuration;

/// <summary>What a command asks the configuration system for.</summary>
public sealed class ConfigRequest
{
    /// <summary>Configuration files, layered in order (later wins).</summary>
    public IReadOnlyList<string> ConfigFiles { get; init; } = [];

    /// <summary>A scenario file, layered above the config files (its own "Config" file beneath it).</summary>
    public string? ScenarioFile { get; init; }

    /// <summary>"Section:Key=value" overrides from the command line.</summary>
    public IReadOnlyList<string> Sets { get; init; } = [];

    /// <summary>Environment variables (THERMOSTRAT_Section__Key); null reads the process environment.</summary>
    public IDictionary? Environment { get; init; }
}

/// <summary>
/// Builds the layered configuration, rejects unknown keys (naming the closest valid one) and
/// malformed values (naming key, value and what is allowed), binds it to the settings type
/// and validates bounds. Every failure is a <see cref="ConfigurationException"/>.
/// </summary>
public static class ConfigLoader
{
    /// <summary>Prefix of environment variables read as the top configuration layer.</summary>
    public const string EnvironmentPrefix = "THERMOSTRAT_";

    /// <summary>Loads, checks, binds and validates.</summary>
    public static T Load<T>(ConfigRequest request) where T : class, new()
    {
        var root = Build(request);
        CheckKeys(root, new T(), "");
        T settings;
        try
        {
            settings = root.Get<T>(o => o.ErrorOnUnknownConfiguration = true) ?? new T();
        }
        catch (InvalidOperationException e)
        {
            throw new ConfigurationException("configuration could not be read: " + e.Message, e);
        }
        OptionsValidator.ThrowIfInvalid(settings, "");
        return settings;
    }

    /// <summary>The layered configuration (no checks).</summary>
    public static IConfigurationRoot Build(ConfigRequest request)
    {
        var b = new ConfigurationBuilder();
        foreach (var f in request.ConfigFiles) AddJson(b, f, "configuration file");
        if (request.ScenarioFile is { } scenario)
        {
            AddScenario(b, scenario);
        }
        var sets = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (var s in request.Sets)
        {
            int eq = s.IndexOf('=');
            if (eq <= 0) throw new ConfigurationException($"--set '{s}' is not of the form Section:Key=value");
            sets[s[..eq].Trim()] = s[(eq + 1)..].Trim();
        }
        b.AddInMemoryCollection(sets);
        var env = request.Environment ?? System.Environment.GetEnvironmentVariables();
        var fromEnv = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (DictionaryEntry e in env)
        {
            var name = e.Key?.ToString() ?? "";
            if (name.StartsWith(EnvironmentPrefix, StringComparison.OrdinalIgnoreCase) && name.Length > EnvironmentPrefix.Length)
                fromEnv[name[EnvironmentPrefix.Length..].Replace("__", ":")] = e.Value?.ToString();
        }
        b.AddInMemoryCollection(fromEnv);
        return b.Build();
    }

    private static void AddScenario(ConfigurationBuilder b, string scenario)
    {
        var full = Path.GetFullPath(scenario);
        if (!File.Exists(full)) throw new ConfigurationException($"scenario file not found: {scenario}");
        // A scenario may name the configuration it builds on; that file goes beneath the scenario.
        var probe = new ConfigurationBuilder();
        AddJson(probe, full, "scenario file");
        var baseConfig = probe.Build()["Config"];
        if (!string.IsNullOrWhiteSpace(baseConfig))
        {
            var basePath = Path.IsPathRooted(baseConfig) ? baseConfig : Path.Combine(Path.GetDirectoryName(full)!, baseConfig);
            if (!File.Exists(basePath))
                throw new ConfigurationException($"scenario {scenario}: Config = '{baseConfig}' names a file that does not exist ({basePath})");
            AddJson(b, basePath, "configuration file");
        }
        AddJson(b, full, "scenario file");
    }

    private static void AddJson(IConfigurationBuilder b, string path, string what)
    {
        var full = Path.GetFullPath(path);
        if (!File.Exists(full)) throw new ConfigurationException($"{what} not found: {path}");
        try
        {
            // Parse once here so a malformed file fails with its name and position, not later.
            using var doc = JsonDocument.Parse(File.ReadAllText(full), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
            if (doc.RootElement.ValueKind != JsonValueKind.Object)
                throw new ConfigurationException($"{what} {path}: the top level must be a JSON object");
        }
        catch (JsonException e)
        {
            throw new ConfigurationException($"{what} {path} is not valid JSON: {e.Message}");
        }
        b.AddJsonFile(full, optional: false, reloadOnChange: false);
    }

    /// <summary>
    /// Checks every key present in <paramref name="config"/> against the properties of
    /// the default instance: unknown keys and values that do not parse as the property's type
    /// are errors. Collects all problems.
    /// </summary>
    /// <remarks>
    /// The default instance <paramref name="defaults"/> tells the run-time types of values that the
    /// declared types do not (a dictionary pre-filled with options of several derived types); a
    /// pre-filled dictionary is a closed set of names.
    /// </remarks>
    public static void CheckKeys(IConfiguration config, object defaults, string path)
    {
        var problems = new List<string>();
        CheckSection(config, defaults.GetType(), defaults, path, problems);
        if (problems.Count > 0) throw new ConfigurationException(problems);
    }

    private static void CheckSection(IConfiguration section, Type type, object? instance, string path, List<string> problems)
    {
        var props = type.GetProperties(BindingFlags.Public | BindingFlags.Instance).Where(p => p.CanWrite || IsCollection(p.PropertyType)).ToList();
        foreach (var child in section.GetChildren())
        {
            string key = path.Length == 0 ? child.Key : path + ":" + child.Key;
            var prop = props.FirstOrDefault(p => string.Equals(p.Name, child.Key, StringComparison.OrdinalIgnoreCase));
            if (prop is null)
            {
                var near = KeySuggester.Closest(child.Key, props.Select(p => p.Name));
                string valid = string.Join(", ", props.Select(p => p.Name));
                problems.Add(near is not null
                    ? $"unknown configuration key '{key}'; did you mean '{Join(path, near)}'? (valid keys here: {valid})"
                    : $"unknown configuration key '{key}'; valid keys here: {valid}");
                continue;
            }
            object? value = instance is null || prop.GetIndexParameters().Length > 0 ? null : prop.GetValue(instance);
            CheckValue(child, value?.GetType() ?? prop.PropertyType, value, key, prop.GetCustomAttribute<ParameterAttribute>(), problems);
        }
    }

    private static void CheckValue(IConfigurationSection child, Type t, object? instance, string key, ParameterAttribute? attr, List<string> problems)
    {
        var under = Nullable.GetUnderlyingType(t);
        bool nullable = under is not null;
        t = under ?? t;
        if (IsScalar(t))
        {
            if (child.GetChildren().Any())
            {
                problems.Add($"{key} must be a single value ({Describe(t, attr)}), not a section");
                return;
            }
            var v = child.Value;
            if (v is null) return;
            if (nullable && v.Length == 0) return;
            if (!TryParse(v, t, out _))
                problems.Add($"{key} = '{v}' is not valid; allowed: {Describe(t, attr)}");
            return;
        }
        if (child.Value is { Length: > 0 } && !child.GetChildren().Any())
        {
            problems.Add($"{key} must be a section with keys, not the single value '{child.Value}'");
            return;
        }
        if (IsDictionary(t, out var valueType))
        {
            var existing = instance as IDictionary;
            var names = existing?.Keys.Cast<object>().Select(k => k.ToString()!).ToList() ?? [];
            foreach (var entry in child.GetChildren())
            {
                var name = names.FirstOrDefault(n => string.Equals(n, entry.Key, StringComparison.OrdinalIgnoreCase));
                if (names.Count > 0 && name is null && !IsScalar(valueType!))
                {
                    var near = KeySuggester.Closest(entry.Key, names);
                    problems.Add($"unknown entry '{key}:{entry.Key}'{(near is null ? "" : $"; did you mean '{key}:{near}'?")} (valid entries: {string.Join(", ", names)})");
                    continue;
                }
                object? value = name is null ? null : existing![name];
                CheckValue(entry, value?.GetType() ?? valueType!, value, key + ":" + entry.Key, null, problems);
            }
            return;
        }
        if (IsList(t, out var elemType))
        {
            foreach (var entry in child.GetChildren())
            {
                if (!int.TryParse(entry.Key, NumberStyles.None, CultureInfo.InvariantCulture, out _))
                    problems.Add($"{key}:{entry.Key}: {key} is a list; its entries are numbered 0, 1, 2, ...");
                else CheckValue(entry, elemType!, null, key + ":" + entry.Key, null, problems);
            }
            return;
        }
        CheckSection(child, t, instance, key, problems);
    }

    private static string Join(string path, string name) => path.Length == 0 ? name : path + ":" + name;

    private static bool IsScalar(Type t) => t.IsPrimitive || t.IsEnum || t == typeof(string) || t == typeof(decimal);

    private static bool IsCollection(Type t) => IsDictionary(t, out _) || IsList(t, out _);

    private static bool IsDictionary(Type t, out Type? valueType)
    {
        valueType = null;
        var i = t.IsGenericType && t.GetGenericTypeDefinition() == typeof(Dictionary<,>) ? t
            : t.GetInterfaces().FirstOrDefault(x => x.IsGenericType && x.GetGenericTypeDefinition() == typeof(IDictionary<,>));
        if (i is null) return false;
        valueType = i.GetGenericArguments()[1];
        return true;
    }

    private static bool IsList(Type t, out Type? elemType)
    {
        elemType = null;
        if (t == typeof(string)) return false;
        if (t.IsArray) { elemType = t.GetElementType(); return true; }
        var i = t.IsGenericType && t.GetGenericTypeDefinition() == typeof(List<>) ? t
            : t.GetInterfaces().FirstOrDefault(x => x.IsGenericType && x.GetGenericTypeDefinition() == typeof(IList<>));
        if (i is null) return false;
        elemType = i.GetGenericArguments()[0];
        return true;
    }

    private static bool TryParse(string v, Type t, out object? value)
    {
        value = null;
        var inv = CultureInfo.InvariantCulture;
        if (t == typeof(string)) { value = v; return true; }
        if (t == typeof(double)) { var ok = double.TryParse(v, NumberStyles.Float, inv, out var d); value = d; return ok; }
        if (t == typeof(float)) { var ok = float.TryParse(v, NumberStyles.Float, inv, out var d); value = d; return ok; }
        if (t == typeof(int)) { var ok = int.TryParse(v, NumberStyles.Integer, inv, out var d); value = d; return ok; }
        if (t == typeof(long)) { var ok = long.TryParse(v, NumberStyles.Integer, inv, out var d); value = d; return ok; }
        if (t == typeof(bool)) { var ok = bool.TryParse(v, out var d); value = d; return ok; }
        if (t.IsEnum)
        {
            var name = Enum.GetNames(t).FirstOrDefault(n => string.Equals(n, v, StringComparison.OrdinalIgnoreCase));
            if (name is null) return false;
            value = Enum.Parse(t, name);
            return true;
        }
        return false;
    }

    private static string Describe(Type t, ParameterAttribute? attr)
    {
        if (t == typeof(bool)) return "true or false";
        if (t.IsEnum) return "one of " + string.Join(", ", Enum.GetNames(t));
        if (t == typeof(int) || t == typeof(long)) return "an integer" + (attr is null ? "" : ", " + OptionsValidator.DescribeRange(attr));
        if (t == typeof(double) || t == typeof(float)) return "a number" + (attr is null ? "" : ", " + OptionsValidator.DescribeRange(attr));
        return "text";
    }

    /// <summary>JSON options used for the resolved configuration (enums as names, NaN allowed, nulls omitted).</summary>
    public static JsonSerializerOptions ResolvedJson { get; } = new()
    {
        WriteIndented = true,
        Converters = { new JsonStringEnumConverter() },
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };
}
