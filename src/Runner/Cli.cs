namespace Thermostrat.Runner;

/// <summary>Entry point of the command line, separated from Main so tests can call it.</summary>
public static class Cli
{
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr)
    {
        stdout.WriteLine("thermostrat " + Thermostrat.Model.ThermostratInfo.Version);
        return 0;
    }
}
