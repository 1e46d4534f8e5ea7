using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.Sockets;
using Npgsql;

namespace Anneal.Tests.Queue;

/// <summary>
/// A private PostgreSQL cluster for the queue tests: initdb in a temporary folder, the server on a free port of
/// 127.0.0.1 (its unix socket in the same folder), run as 'nobody' when the tests run as root (the server refuses root),
/// removed at the end. The binaries are the Debian package `postgresql` (.ci/run installs it); without them every queue
/// test skips with <see cref="SkipReason"/>. Each test takes a database of its own from <see cref="NewDatabase"/>.
/// </summary>
public sealed class PostgresCluster : IDisposable
{
    private const string User = "anneal";
    private readonly string? _bin;
    private readonly string _folder = string.Empty;
    private readonly bool _asNobody;
    private int _databases;

    public PostgresCluster()
    {
        _bin = FindBinaries();
        if (_bin is null)
        {
            SkipReason = "no PostgreSQL server binaries (initdb, pg_ctl) under /usr/lib/postgresql: .ci/run installs the Debian package postgresql; queue tests skipped";
            return;
        }

        _asNobody = Environment.UserName == "root";
        _folder = Directory.CreateTempSubdirectory("anneal-pg-").FullName;
        if (_asNobody)
        {
            Run("chown", ["nobody", _folder], asNobody: false);
        }

        Port = FreePort();
        Run(Path.Combine(_bin, "initdb"), ["-D", DataFolder, "-U", User, "--auth=trust", "-E", "UTF8", "--no-sync"], _asNobody);
        Start();
    }

    /// <summary>Why the queue tests cannot run here; null when the cluster is up.</summary>
    public string? SkipReason { get; }

    public int Port { get; }

    private string DataFolder => Path.Combine(_folder, "data");

    /// <summary>A fresh, empty database and its connection string (TCP on 127.0.0.1, as a remote worker would connect).</summary>
    public string NewDatabase()
    {
        string name = "t" + Interlocked.Increment(ref _databases).ToString(CultureInfo.InvariantCulture);
        using (var conn = new NpgsqlConnection(ConnectionString("postgres") + ";Pooling=false"))
        {
            conn.Open();
            using var create = new NpgsqlCommand($"CREATE DATABASE {name}", conn);
            create.ExecuteNonQuery();
        }

        return ConnectionString(name);
    }

    public string ConnectionString(string database) =>
        $"Host=127.0.0.1;Port={Port.ToString(CultureInfo.InvariantCulture)};Username={User};Database={database};Timeout=5";

    /// <summary>Starts the server (again); waits until it accepts connections.</summary>
    public void Start() =>
        Run(Path.Combine(_bin!, "pg_ctl"),
            ["-D", DataFolder, "-l", Path.Combine(_folder, "server.log"), "-w", "-t", "60",
             "-o", $"-p {Port.ToString(CultureInfo.InvariantCulture)} -k {_folder} -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=200", "start"], _asNobody);

    /// <summary>Stops the server at once, dropping every connection, as a crash or a network cut would.</summary>
    public void Stop() => Run(Path.Combine(_bin!, "pg_ctl"), ["-D", DataFolder, "-m", "immediate", "-w", "stop"], _asNobody);

    public void Dispose()
    {
        if (_bin is null)
        {
            return;
        }

        try
        {
            Stop();
        }
        catch (InvalidOperationException)
        {
            // Already stopped.
        }

        Directory.Delete(_folder, recursive: true);
    }

    private static string? FindBinaries()
    {
        const string root = "/usr/lib/postgresql";
        if (!Directory.Exists(root))
        {
            return null;
        }

        return Directory.GetDirectories(root)
            .Select(d => Path.Combine(d, "bin"))
            .Where(d => File.Exists(Path.Combine(d, "initdb")) && File.Exists(Path.Combine(d, "pg_ctl")))
            .OrderByDescending(d => int.TryParse(Path.GetFileName(Path.GetDirectoryName(d)), out int v) ? v : 0)
            .FirstOrDefault();
    }

    /// <summary>A TCP port on 127.0.0.1 that nothing listens on right now.</summary>
    internal static int FreePort()
    {
        var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        int port = ((IPEndPoint)listener.LocalEndpoint).Port;
        listener.Stop();
        return port;
    }

    private static void Run(string program, string[] args, bool asNobody)
    {
        var info = new ProcessStartInfo(asNobody ? "runuser" : program)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        if (asNobody)
        {
            foreach (var a in new[] { "-u", "nobody", "--", program })
            {
                info.ArgumentList.Add(a);
            }
        }

        foreach (var a in args)
        {
            info.ArgumentList.Add(a);
        }

        using var process = Process.Start(info)!;
        var stderr = process.StandardError.ReadToEndAsync();
        string stdout = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"{Path.GetFileName(program)} {string.Join(' ', args)} failed ({process.ExitCode}): {stdout}{stderr.Result}");
        }
    }
}

[CollectionDefinition(Name)]
public sealed class PostgresCollection : ICollectionFixture<PostgresCluster>
{
    public const string Name = "PostgreSQL";
}
