namespace Thermostrat.Runner;

internal static class Program
{
    private static int Main(string[] args) => Cli.Run(args, Console.Out, Console.Error);
}
