namespace Thermostrat.Model.Configuration;

/// <summary>
/// Bad configuration or usage: an unknown key, a value out of range, a malformed file. The runner
/// prints <see cref="Exception.Message"/> (which names the key, the value and what is allowed)
/// and exits with code 2.
/// </summary>
public sealed class ConfigurationException : Exception
{
    public ConfigurationException(string message) : base(message) { }

    public ConfigurationException(IReadOnlyList<string> problems)
        : base(problems.Count == 1 ? problems[0] : "configuration has " + problems.Count + " problems:\n  - " + string.Join("\n  - ", problems))
    {
        Problems = problems;
    }

    public ConfigurationException(string message, Exception inner) : base(message, inner) { }

    /// <summary>Every problem found (at least one).</summary>
    public IReadOnlyList<string> Problems { get; } = [];
}
