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

    public void Dispose()
    {
        try { Directory.Delete(Dir, recursive: true); } catch (IOException) { }
    }
}
