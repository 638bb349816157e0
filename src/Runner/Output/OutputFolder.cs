using System.Text.Json;
using Thermostrat.Model;
using Thermostrat.Model.Configuration;
using Thermostrat.Runner.Configuration;

namespace Thermostrat.Runner.Output;

/// <summary>
/// A command's output folder, built in a staging folder beside the target and moved into place
/// only when everything in it is complete. A failed or interrupted command leaves nothing at the
/// target, and an existing folder is never touched unless the user asked to replace it — and
/// even then only once the new output is complete.
/// </summary>
public sealed class OutputFolder : IDisposable
{
    private readonly string _final;
    private readonly bool _replace;
    private bool _committed;

    private OutputFolder(string final, bool replace)
    {
        _final = final;
        _replace = replace;
        Staging = Path.Combine(Path.GetDirectoryName(final)!, "." + Path.GetFileName(final) + ".partial-" + Environment.ProcessId);
        if (Directory.Exists(Staging)) Directory.Delete(Staging, recursive: true);
        Directory.CreateDirectory(Staging);
    }

    /// <summary>Where files are written until <see cref="Commit"/>.</summary>
    public string Staging { get; }

    /// <summary>The folder the output will have once complete.</summary>
    public string FinalPath => _final;

    /// <summary>
    /// Checks the target before any work is done: an existing non-empty folder is an error unless
    /// <paramref name="replace"/> is set.
    /// </summary>
    public static OutputFolder Begin(string path, bool replace)
    {
        if (string.IsNullOrWhiteSpace(path)) throw new ConfigurationException("--out: the output folder name is empty");
        var full = Path.GetFullPath(path.TrimEnd('/', '\\'));
        if (File.Exists(full)) throw new ConfigurationException($"--out {path}: a file of that name exists; an output folder is expected");
        if (Directory.Exists(full) && Directory.EnumerateFileSystemEntries(full).Any() && !replace)
            throw new ConfigurationException($"--out {path}: the folder exists and is not empty; choose another folder or pass --replace to replace it once the new output is complete");
        return new OutputFolder(full, replace);
    }

    /// <summary>Full path of a file inside the staging folder.</summary>
    public string File_(string name) => Path.Combine(Staging, name);

    /// <summary>Writes <c>run.json</c>: command, arguments, tool version, git commit and the resolved configuration.</summary>
    public void WriteRunRecord(string command, IReadOnlyList<string> args, object resolvedSettings, IReadOnlyDictionary<string, object?>? extra = null)
    {
        var record = new Dictionary<string, object?>
        {
            ["tool"] = "thermostrat",
            ["version"] = ThermostratInfo.Version,
            ["commit"] = ThermostratInfo.Commit,
            ["command"] = command,
            ["arguments"] = args,
            ["created_utc"] = DateTime.UtcNow.ToString("yyyy-MM-ddTHH:mm:ssZ"),
            ["configuration"] = resolvedSettings,
        };
        if (extra is not null) foreach (var (k, v) in extra) record[k] = v;
        File.WriteAllText(File_("run.json"), JsonSerializer.Serialize(record, ConfigLoader.ResolvedJson));
    }

    /// <summary>Moves the complete output into place (replacing an existing folder only now, if allowed).</summary>
    public void Commit()
    {
        if (Directory.Exists(_final))
        {
            if (!_replace && Directory.EnumerateFileSystemEntries(_final).Any())
                throw new ConfigurationException($"output folder {_final} appeared while the command ran; the new output is kept in {Staging}");
            var old = Path.Combine(Path.GetDirectoryName(_final)!, "." + Path.GetFileName(_final) + ".old-" + Environment.ProcessId);
            Directory.Move(_final, old);
            Directory.Move(Staging, _final);
            Directory.Delete(old, recursive: true);
        }
        else
        {
            Directory.Move(Staging, _final);
        }
        _committed = true;
    }

    /// <summary>Removes the staging folder if the output was not committed.</summary>
    public void Dispose()
    {
        if (!_committed && Directory.Exists(Staging))
        {
            try { Directory.Delete(Staging, recursive: true); } catch (IOException) { }
        }
    }
}

/// <summary>Serialises the resolved configuration to the JSON written into run.json and Parquet metadata.</summary>
public static class ResolvedConfig
{
    /// <summary>The resolved configuration as indented JSON.</summary>
    public static string ToJson(object settings) => JsonSerializer.Serialize(settings, settings.GetType(), ConfigLoader.ResolvedJson);

    /// <summary>Standard Parquet metadata: resolved configuration, command and commit.</summary>
    public static Dictionary<string, string> Metadata(object settings, string command, IReadOnlyDictionary<string, string>? extra = null)
    {
        var m = new Dictionary<string, string>
        {
            [Thermostrat.Model.IO.ParquetTableWriter.ConfigKey] = ToJson(settings),
            ["thermostrat.command"] = command,
            ["thermostrat.commit"] = ThermostratInfo.Commit,
        };
        if (extra is not null) foreach (var (k, v) in extra) m[k] = v;
        return m;
    }
}
