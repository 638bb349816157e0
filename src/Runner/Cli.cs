using System.CommandLine;
using Thermostrat.Model.Configuration;
using Thermostrat.Runner.Commands;

namespace Thermostrat.Runner;

/// <summary>Entry point of the command line, separated from Main so tests can call it.</summary>
public static class Cli
{
    /// <summary>Exit code: success.</summary>
    public const int Ok = 0;
    /// <summary>Exit code: a run failed (non-finite state, no convergence), with its diagnosis.</summary>
    public const int RunFailed = 1;
    /// <summary>Exit code: bad usage or configuration.</summary>
    public const int UsageError = 2;

    /// <summary>Parses and runs a command line; returns the process exit code.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        var root = new RootCommand(
            "thermostrat — reduced-physics tropical ocean–cloud box models: forced runs, equilibria and thresholds, orbital insolation.\n" +
            "Research software for scientific exploration, not for operational forecasts or decisions.");
        foreach (var command in CommandCatalog.All()) root.Subcommands.Add(command.Build(stdout, stderr));
        var version = new Command("version", "Print the tool version and the git commit it was built from.");
        version.SetAction(_ => { stdout.WriteLine($"thermostrat {Model.ThermostratInfo.Version} (commit {Model.ThermostratInfo.Commit})"); return Ok; });
        root.Subcommands.Add(version);

        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            foreach (var e in parsed.Errors) stderr.WriteLine("error: " + e.Message);
            stderr.WriteLine("Run 'thermostrat --help' (or 'thermostrat <command> --help') for usage.");
            return UsageError;
        }
        return parsed.Invoke(new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false });
    }

    /// <summary>Runs a command body, turning our exceptions into messages and exit codes.</summary>
    public static int Guard(TextWriter stderr, Func<int> body)
    {
        try
        {
            return body();
        }
        catch (ConfigurationException e)
        {
            stderr.WriteLine("error: " + e.Message);
            return UsageError;
        }
        catch (Exception e) when (e is ArgumentException or FileNotFoundException or DirectoryNotFoundException or InvalidDataException or FormatException)
        {
            stderr.WriteLine("error: " + e.Message);
            return UsageError;
        }
        catch (RunFailedException e)
        {
            stderr.WriteLine("run failed: " + e.Message);
            return RunFailed;
        }
    }
}

/// <summary>A run that could not complete (integration failure, no convergence); the message is the diagnosis.</summary>
public sealed class RunFailedException(string message, Exception? inner = null) : Exception(message, inner);
