namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// What the model needs to know about a process before building it: its name (its key in
/// "Model:Processes"), its place in the evaluation order, its options type, how to build it, and the
/// text the <c>describe</c> command prints (role, equation, references).
/// </summary>
public sealed class ProcessDescriptor
{
    private readonly Func<ProcessOptions> _createOptions;
    private readonly Func<ProcessOptions, ProcessBuildContext, IProcess> _factory;

    private ProcessDescriptor(string name, string role, string equation, IReadOnlyList<string> references, double order,
        Type optionsType, Func<ProcessOptions> createOptions, Func<ProcessOptions, ProcessBuildContext, IProcess> factory)
    {
        if (string.IsNullOrWhiteSpace(name) || name.Any(ch => !char.IsLetterOrDigit(ch)))
            throw new ArgumentException($"Process name '{name}' must be a non-empty word of letters and digits (it becomes a configuration key).", nameof(name));
        if (!double.IsFinite(order)) throw new ArgumentOutOfRangeException(nameof(order), order, "The evaluation order must be a finite number.");
        Name = name;
        Role = role;
        Equation = equation;
        References = references;
        Order = order;
        OptionsType = optionsType;
        _createOptions = createOptions;
        _factory = factory;
    }

    /// <summary>
    /// A descriptor for a process whose options are <typeparamref name="TOptions"/>.
    /// </summary>
    /// <param name="name">Configuration key (letters and digits), e.g. "Ventilation".</param>
    /// <param name="role">One line: what the process does.</param>
    /// <param name="equation">Its equations in plain Unicode (may span lines).</param>
    /// <param name="references">Published sources of the equations.</param>
    /// <param name="order">Evaluation order: processes run in increasing order, so a process reads the diagnostics of processes with smaller order.</param>
    /// <param name="factory">Builds the process from its options; it must register everything it uses through the build context.</param>
    public static ProcessDescriptor Create<TOptions>(string name, string role, string equation, IReadOnlyList<string> references, double order,
        Func<TOptions, ProcessBuildContext, IProcess> factory) where TOptions : ProcessOptions, new()
    {
        ArgumentNullException.ThrowIfNull(factory);
        return new ProcessDescriptor(name, role, equation, references, order, typeof(TOptions), () => new TOptions(),
            (o, c) => factory(o as TOptions ?? throw new ArgumentException(
                $"Model:Processes:{name} holds options of type {o.GetType().Name}; the process needs {typeof(TOptions).Name}.", nameof(o)), c));
    }

    /// <summary>Configuration key of the process.</summary>
    public string Name { get; }

    /// <summary>One-line role.</summary>
    public string Role { get; }

    /// <summary>Equations in plain Unicode.</summary>
    public string Equation { get; }

    /// <summary>Published sources.</summary>
    public IReadOnlyList<string> References { get; }

    /// <summary>Evaluation order (smaller first).</summary>
    public double Order { get; }

    /// <summary>The options class bound from "Model:Processes:&lt;Name&gt;".</summary>
    public Type OptionsType { get; }

    /// <summary>A new options object with the defaults.</summary>
    public ProcessOptions CreateDefaultOptions() => _createOptions();

    internal IProcess Build(ProcessOptions options, ProcessBuildContext context) => _factory(options, context);
}

/// <summary>
/// The processes a model can be built from. <see cref="CreateBuiltIn"/> lists the built-in ones; add a
/// process with <see cref="With"/> (a new catalog; catalogs are immutable and may be shared).
/// </summary>
public sealed class ProcessCatalog
{
    private readonly ProcessDescriptor[] _entries;

    /// <summary>A catalog of the given processes (names must be distinct, case-insensitive).</summary>
    public ProcessCatalog(IEnumerable<ProcessDescriptor> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        _entries = [.. entries];
        var dup = _entries.GroupBy(e => e.Name, StringComparer.OrdinalIgnoreCase).FirstOrDefault(g => g.Count() > 1);
        if (dup is not null) throw new ArgumentException($"Process name '{dup.Key}' appears more than once in the catalog.", nameof(entries));
    }

    /// <summary>The built-in processes of the tropical model.</summary>
    public static ProcessCatalog CreateBuiltIn() => new(BuiltInProcesses.All);

    /// <summary>The processes, in catalog order.</summary>
    public IReadOnlyList<ProcessDescriptor> Entries => _entries;

    /// <summary>Names of the processes, in catalog order.</summary>
    public IReadOnlyList<string> Names => _entries.Select(e => e.Name).ToArray();

    /// <summary>This catalog plus <paramref name="descriptor"/> (whose name must be new).</summary>
    public ProcessCatalog With(ProcessDescriptor descriptor)
    {
        ArgumentNullException.ThrowIfNull(descriptor);
        return new ProcessCatalog(_entries.Append(descriptor));
    }

    /// <summary>The process called <paramref name="name"/> (case-insensitive), or null.</summary>
    public ProcessDescriptor? Find(string name) =>
        _entries.FirstOrDefault(e => string.Equals(e.Name, name, StringComparison.OrdinalIgnoreCase));

    /// <summary>Default options of every process, keyed by name.</summary>
    public ProcessOptionsSet CreateDefaultOptions()
    {
        var set = new ProcessOptionsSet();
        foreach (var e in _entries) set[e.Name] = e.CreateDefaultOptions();
        return set;
    }
}
