using System.Text.Json;
using Anneal.Cli;
using Anneal.Tests.Fixtures;
using Npgsql;

namespace Anneal.Tests.Queue;

/// <summary>A queue test: the shared cluster, a database of its own, a temporary folder, and `anneal` run in-process.</summary>
[Collection(PostgresCollection.Name)]
public abstract class QueueTest : TempFolderTest
{
    protected QueueTest(PostgresCluster cluster)
    {
        Cluster = cluster;
        Skip.If(cluster.SkipReason is not null, cluster.SkipReason);
        Db = cluster.NewDatabase();
    }

    protected PostgresCluster Cluster { get; }

    /// <summary>The test's own database.</summary>
    protected string Db { get; }

    /// <summary>Runs `anneal` in-process; returns its exit code and what it printed.</summary>
    protected static (int Code, string Out, string Err) Anneal(params string[] args)
    {
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = CliApp.Run(args, stdout, stderr);
        return (code, stdout.ToString(), stderr.ToString());
    }

    protected void Init()
    {
        var (code, _, err) = Anneal("queue", "init", "--db", Db);
        Assert.True(code == 0, err);
    }

    protected JsonElement Status()
    {
        var (code, output, err) = Anneal("queue", "status", "--db", Db, "--json");
        Assert.True(code == 0, err);
        using var doc = JsonDocument.Parse(output);
        return doc.RootElement.Clone();
    }

    protected T Scalar<T>(string sql)
    {
        using var conn = new NpgsqlConnection(Unpooled);
        conn.Open();
        using var cmd = new NpgsqlCommand(sql, conn);
        return (T)cmd.ExecuteScalar()!;
    }

    /// <summary>The test's own queries open a fresh connection each time, so that a server restart leaves no broken one in a pool.</summary>
    private string Unpooled => new NpgsqlConnectionStringBuilder(Db) { Pooling = false }.ConnectionString;

    protected void Execute(string sql)
    {
        using var conn = new NpgsqlConnection(Unpooled);
        conn.Open();
        using var cmd = new NpgsqlCommand(sql, conn);
        cmd.ExecuteNonQuery();
    }
}
