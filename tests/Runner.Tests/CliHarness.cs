using Xunit;

namespace Thermostrat.Runner.Tests;

/// <summary>Runs the command line in-process with captured output, in a scratch folder.</summary>
public sealed class CliHarness : IDisposable
{
    public string Dir { get; } = Directory.CreateTempSubdirectory("thermostrat-cli-").FullName;

    public (int Code, string Out, string Err) Run(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        int code = Cli.Run(args, o, e);
        return (code, o.ToString(), e.ToString());
    }

    public string Path_(string name) => Path.Combine(Dir, name);

    /// <summary>A path inside the repository (found from the test binary's folder).</summary>
    public static string Repo(string relative)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Thermostrat.slnx"))) dir = dir.Parent;
        return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("repository root (Thermostrat.slnx) not found above " + AppContext.BaseDirectory), relative);
    }

    public void Dispose()
    {
        try { Directory.Delete(Dir, recursive: true); } catch (IOException) { }
    }
}
