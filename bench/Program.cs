using System.Reflection;
using Thermostrat.Bench;

// Benchmarks: every public static class in this assembly whose name ends in "Bench" and that has
// `public static void Run(BenchContext context)` is a suite. Run all with no arguments, or name
// suites: `dotnet run -c Release --project bench -- Orbital Ode`.
var suites = typeof(BenchContext).Assembly.GetTypes()
    .Where(t => t.IsClass && t.IsAbstract && t.IsSealed && t.Name.EndsWith("Bench", StringComparison.Ordinal))
    .Select(t => (Name: t.Name[..^"Bench".Length], Run: t.GetMethod("Run", BindingFlags.Public | BindingFlags.Static, [typeof(BenchContext)])))
    .Where(s => s.Run is not null)
    .OrderBy(s => s.Name, StringComparer.Ordinal)
    .ToList();

var wanted = args.Where(a => !a.StartsWith('-')).ToHashSet(StringComparer.OrdinalIgnoreCase);
var unknown = wanted.Where(w => suites.All(s => !s.Name.Equals(w, StringComparison.OrdinalIgnoreCase))).ToList();
if (unknown.Count > 0)
{
    Console.Error.WriteLine($"unknown benchmark suite(s): {string.Join(", ", unknown)}; available: {string.Join(", ", suites.Select(s => s.Name))}");
    return 2;
}
var context = new BenchContext(Console.Out, args.Contains("--quick"));
context.Out.WriteLine($"Thermostrat benchmarks — {Environment.ProcessorCount} logical cores, .NET {Environment.Version}, {(context.Quick ? "quick" : "full")} mode");
foreach (var s in suites.Where(s => wanted.Count == 0 || wanted.Contains(s.Name)))
{
    context.Out.WriteLine();
    context.Out.WriteLine($"## {s.Name}");
    s.Run!.Invoke(null, [context]);
}
return 0;
