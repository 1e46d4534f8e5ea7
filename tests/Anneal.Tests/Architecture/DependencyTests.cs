using System.Reflection;
using System.Reflection.Metadata;
using System.Reflection.PortableExecutable;

namespace Anneal.Tests.Architecture;

/// <summary>
/// The dependency picture runs one way: Core at the bottom, knowing routes and costs and doing no I/O; search
/// strategies, bounds and file formats on it; OR-Tools, jobs and reports above; the hosts (worker, queue, CLI) at
/// the top. Read from the compiled assemblies (what the code really uses, not what a project file lists), so a new
/// reference or an I/O call in the wrong place fails here. Forbidden-dependency tests of this kind are common practice.
/// </summary>
public sealed class DependencyTests
{
    // A project may use only projects of a lower layer. A new project must be given its layer here.
    private static readonly Dictionary<string, int> Layers = new()
    {
        ["Anneal.Core"] = 0,
        ["Anneal.Search"] = 1,
        ["Anneal.Bounds"] = 1,
        ["Anneal.Formats"] = 1,
        ["Anneal.OrTools"] = 2,
        ["Anneal.Jobs"] = 2,
        ["Anneal.Reports"] = 2,
        ["Anneal.Experiments"] = 3,
        ["Anneal.Worker"] = 3,
        ["Anneal.Queue"] = 4,
        ["Anneal.Queue.Web"] = 5,
        ["anneal"] = 6, // the CLI host
    };

    // Namespaces and types through which code reaches files, the console, the network or other processes.
    private static readonly string[] InputOutput =
        ["System.IO", "System.Net", "System.Console", "System.Diagnostics.Process", "Microsoft.Win32"];

    private static IEnumerable<string> AnnealAssemblies() =>
        Directory.EnumerateFiles(AppContext.BaseDirectory, "*.dll")
            .Select(Path.GetFileNameWithoutExtension)
            .OfType<string>()
            .Where(name => name == "anneal" || (name.StartsWith("Anneal.", StringComparison.Ordinal) && name != "Anneal.Tests" && name != "Anneal.Benchmarks"));

    private static AssemblyName[] ReferencesOf(string name) =>
        Assembly.LoadFrom(Path.Combine(AppContext.BaseDirectory, name + ".dll")).GetReferencedAssemblies();

    [Fact]
    public void Every_project_has_a_layer()
    {
        var assemblies = AnnealAssemblies().ToList();
        Assert.Contains("Anneal.Core", assemblies);
        Assert.Contains("anneal", assemblies);
        Assert.All(assemblies, name => Assert.True(Layers.ContainsKey(name), $"{name} has no layer in {nameof(DependencyTests)}.Layers"));
    }

    [Fact]
    public void A_project_uses_only_lower_layers()
    {
        var broken = new List<string>();
        foreach (var name in AnnealAssemblies().Where(Layers.ContainsKey))
        {
            foreach (var reference in ReferencesOf(name))
            {
                if (reference.Name is { } used && Layers.TryGetValue(used, out int layer) && layer >= Layers[name])
                {
                    broken.Add($"{name} (layer {Layers[name]}) uses {used} (layer {layer})");
                }
            }
        }

        Assert.True(broken.Count == 0, string.Join("; ", broken));
    }

    [Fact]
    public void Core_depends_on_the_framework_only()
    {
        var outside = ReferencesOf("Anneal.Core")
            .Select(r => r.Name ?? "")
            .Where(n => !(n == "System" || n.StartsWith("System.", StringComparison.Ordinal) || n == "netstandard" || n == "mscorlib"))
            .ToList();
        Assert.True(outside.Count == 0, "Anneal.Core references " + string.Join(", ", outside));
    }

    [Fact]
    public void Core_does_no_input_or_output()
    {
        var used = TypesReferencedBy(Path.Combine(AppContext.BaseDirectory, "Anneal.Core.dll"));
        Assert.Contains("System.Collections.Generic.List`1", used); // the scan sees what Core uses
        var io = used.Where(t => InputOutput.Any(p => t == p || t.StartsWith(p + ".", StringComparison.Ordinal))).ToList();
        Assert.True(io.Count == 0, "Anneal.Core uses " + string.Join(", ", io));
    }

    [Fact]
    public void The_io_scan_sees_io_where_there_is_some()
    {
        // Formats reads and writes files, so the same scan must find System.IO there; else the check above proves nothing.
        var used = TypesReferencedBy(Path.Combine(AppContext.BaseDirectory, "Anneal.Formats.dll"));
        Assert.Contains(used, t => t.StartsWith("System.IO.", StringComparison.Ordinal));
    }

    private static HashSet<string> TypesReferencedBy(string path)
    {
        using var stream = File.OpenRead(path);
        using var pe = new PEReader(stream);
        var reader = pe.GetMetadataReader();
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var handle in reader.TypeReferences)
        {
            var type = reader.GetTypeReference(handle);
            string ns = reader.GetString(type.Namespace);
            names.Add(ns.Length == 0 ? reader.GetString(type.Name) : ns + "." + reader.GetString(type.Name));
        }

        return names;
    }
}
