using System.Globalization;
using System.Reflection;
using Anneal.Formats.Input;
using Microsoft.Extensions.Configuration;

namespace Anneal.Worker;

/// <summary>
/// Binds the Worker section by hand, so that a value of the wrong kind ("two" for ConcurrentJobs, "Finish" for
/// OnShutdown) or an unknown key becomes a plain problem naming the allowed values, reported by
/// <see cref="WorkerOptionsValidator"/> with every other wrong setting, instead of the binder's exception with .NET type names.
/// </summary>
public sealed class WorkerSettingsText(IConfiguration configuration)
{
    private static readonly PropertyInfo[] Properties = typeof(WorkerOptions).GetProperties(BindingFlags.Public | BindingFlags.Instance);

    private readonly List<string> _problems = [];

    /// <summary>The problems found by the last <see cref="Apply"/>.</summary>
    public IReadOnlyList<string> Problems => _problems;

    public void Apply(WorkerOptions options)
    {
        _problems.Clear();
        var section = configuration.GetSection(WorkerOptions.Section);
        foreach (var child in section.GetChildren())
        {
            var property = Array.Find(Properties, p => string.Equals(p.Name, child.Key, StringComparison.OrdinalIgnoreCase));
            if (property is null)
            {
                var near = Closest.Find(child.Key, Properties.Select(p => p.Name));
                _problems.Add($"Worker:{child.Key} is not a worker setting" + (near is not null ? $"; did you mean {near}?" : $"; the settings are {string.Join(", ", Properties.Select(p => p.Name))}"));
                continue;
            }

            if (child.Value is not { } text)
            {
                continue; // a nested section where a value belongs stays at its default
            }

            if (Parse(property.PropertyType, text.Trim(), out object? value, out string expects))
            {
                property.SetValue(options, value);
            }
            else
            {
                _problems.Add($"Worker:{property.Name}{Flag(property.Name)} must be {expects}, not '{text}'");
            }
        }
    }

    /// <summary>" (--jobs)" for a setting the command line also takes.</summary>
    private static string Flag(string key) => key switch
    {
        nameof(WorkerOptions.Inbox) => " (--inbox)",
        nameof(WorkerOptions.Outbox) => " (--outbox)",
        nameof(WorkerOptions.TimeSeconds) => " (--time)",
        nameof(WorkerOptions.ConcurrentJobs) => " (--jobs)",
        nameof(WorkerOptions.ThreadsPerJob) => " (--threads)",
        nameof(WorkerOptions.Solvers) => " (--solvers)",
        _ => string.Empty,
    };

    private static bool Parse(Type type, string text, out object? value, out string expects)
    {
        value = null;
        if (type == typeof(string))
        {
            expects = "text";
            value = text.Length == 0 ? null : text;
            return true;
        }

        if (type == typeof(int))
        {
            expects = "a whole number, e.g. 2";
            bool ok = int.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int i);
            value = i;
            return ok;
        }

        if (type == typeof(long))
        {
            expects = "a whole number, e.g. 268435456";
            bool ok = long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out long l);
            value = l;
            return ok;
        }

        if (type == typeof(double))
        {
            expects = "a number of seconds with a dot for decimals, e.g. 2.5";
            bool ok = double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double d) && double.IsFinite(d);
            value = d;
            return ok;
        }

        if (type == typeof(bool))
        {
            expects = "true or false";
            bool ok = bool.TryParse(text, out bool b);
            value = b;
            return ok;
        }

        if (type.IsEnum)
        {
            var names = Enum.GetNames(type);
            expects = names.Length == 2 ? $"{names[0]} or {names[1]}" : "one of " + string.Join(", ", names);
            var name = Array.Find(names, n => string.Equals(n, text, StringComparison.OrdinalIgnoreCase));
            value = name is null ? null : Enum.Parse(type, name);
            if (name is null && Closest.Find(text, names) is { } near)
            {
                expects += $" (did you mean {near}?)";
            }

            return name is not null;
        }

        throw new InvalidOperationException("a worker setting of an unhandled kind: " + type.Name);
    }
}
