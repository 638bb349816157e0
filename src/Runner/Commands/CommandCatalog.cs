using System.CommandLine;

namespace Thermostrat.Runner.Commands;

/// <summary>A runner command: builds its System.CommandLine definition.</summary>
public interface IRunnerCommand
{
    /// <summary>The command with its options and action.</summary>
    Command Build(TextWriter stdout, TextWriter stderr);
}

/// <summary>The list of commands of the runner. Adding a command: write a class, add it here.</summary>
public static class CommandCatalog
{
    /// <summary>Every command, in the order help lists them.</summary>
    public static IEnumerable<IRunnerCommand> All() =>
    [
        new RunCommand(),
        new InsolationCommand(),
        new DensityMatchCommand(),
        new BranchCommand(),
        new BoundaryCommand(),
        new CollapseCommand(),
        new DescribeCommand(),
    ];
}
