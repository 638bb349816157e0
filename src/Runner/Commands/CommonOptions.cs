using System.CommandLine;
using Thermostrat.Runner.Configuration;

namespace Thermostrat.Runner.Commands;

/// <summary>Options shared by every command that reads configuration or writes output.</summary>
public sealed class CommonOptions
{
    /// <summary>Configuration files layered over the built-in defaults.</summary>
    public Option<string[]> Config { get; } = new("--config", "-c")
    {
        Description = "Configuration file (JSON) layered over the built-in defaults; repeat to layer several, later files win.",
        AllowMultipleArgumentsPerToken = false,
    };

    /// <summary>Key=value overrides.</summary>
    public Option<string[]> Set { get; } = new("--set", "-s")
    {
        Description = "Override one configuration value, e.g. --set Insolation:SolarConstant=1365 (repeatable). Environment variables THERMOSTRAT_Section__Key override these.",
    };

    /// <summary>Output folder.</summary>
    public Option<string> Out { get; }

    /// <summary>Replace an existing output folder once the new output is complete.</summary>
    public Option<bool> Replace { get; } = new("--replace")
    {
        Description = "Replace an existing, non-empty output folder (only after the new output is complete).",
    };

    /// <summary>Less console output.</summary>
    public Option<bool> Quiet { get; } = new("--quiet", "-q") { Description = "Print only errors and the final summary line." };

    public CommonOptions(string defaultOut)
    {
        Out = new Option<string>("--out", "-o")
        {
            Description = $"Output folder (default: {defaultOut}).",
            DefaultValueFactory = _ => defaultOut,
        };
    }

    /// <summary>Adds the options to a command.</summary>
    public void AddTo(Command command, bool withOutput = true)
    {
        command.Options.Add(Config);
        command.Options.Add(Set);
        if (withOutput)
        {
            command.Options.Add(Out);
            command.Options.Add(Replace);
        }
        command.Options.Add(Quiet);
    }

    /// <summary>The configuration request described by the parsed options.</summary>
    public ConfigRequest Request(ParseResult pr, string? scenario = null) => new()
    {
        ConfigFiles = pr.GetValue(Config) ?? [],
        Sets = pr.GetValue(Set) ?? [],
        ScenarioFile = scenario,
    };
}
