using System.IO.Compression;
using Anneal.Cli;
using Anneal.Cli.Commands;
using Anneal.Queue.Database;
using Anneal.Tests.Fixtures;
using Anneal.Tests.Worker;

namespace Anneal.Tests.Queue;

/// <summary>
/// `anneal queue init | submit | status | fetch` against a real PostgreSQL server (issue 25): the schema is versioned
/// and init is idempotent, inputs are stored as files and checked with `anneal check`'s own words, passwords never show.
/// </summary>
public sealed class QueueCommandTests(PostgresCluster cluster) : QueueTest(cluster)
{
    [SkippableFact]
    public void Init_creates_the_schema_once_and_every_command_refuses_a_database_without_it_or_at_another_version()
    {
        var before = Anneal("queue", "status", "--db", Db);
        Assert.Equal(ExitCodes.QueueUnavailable, before.Code);
        Assert.Contains("anneal queue init", before.Err, StringComparison.Ordinal);

        var first = Anneal("queue", "init", "--db", Db);
        Assert.True(first.Code == 0, first.Err);
        Assert.Contains($"Created the queue schema, version {QueueSchema.Version}", first.Out, StringComparison.Ordinal);
        var again = Anneal("queue", "init", "--db", Db);
        Assert.True(again.Code == 0, again.Err);
        Assert.Contains("nothing to do", again.Out, StringComparison.Ordinal);
        Assert.Equal(1L, Scalar<long>("SELECT count(*) FROM anneal_schema"));
        Assert.Equal(QueueSchema.Version, Scalar<int>("SELECT version FROM anneal_schema"));

        Execute("UPDATE anneal_schema SET version = 99");
        var newer = Anneal("queue", "status", "--db", Db);
        Assert.Equal(ExitCodes.QueueUnavailable, newer.Code);
        Assert.Contains("version 99, newer than", newer.Err, StringComparison.Ordinal);
        Assert.Equal(ExitCodes.QueueUnavailable, Anneal("queue", "init", "--db", Db).Code);
    }

    [SkippableFact]
    public async Task A_database_at_the_first_version_is_refused_until_init_migrates_it_keeping_its_jobs()
    {
        await using (var db = QueueConnection.Open(Db))
        {
            await QueueSchema.InitAsync(db, CancellationToken.None, upTo: 1);
        }

        Execute("INSERT INTO jobs (name, kind) VALUES ('north', 'folder')");
        var old = Anneal("queue", "status", "--db", Db);
        Assert.Equal(ExitCodes.QueueUnavailable, old.Code);
        Assert.Contains("version 1, older than", old.Err, StringComparison.Ordinal);

        var migrated = Anneal("queue", "init", "--db", Db);
        Assert.True(migrated.Code == 0, migrated.Err);
        Assert.Contains($"Migrated the queue schema from version 1 to {QueueSchema.Version}", migrated.Out, StringComparison.Ordinal);
        Assert.Equal(1, Status().GetProperty("queued").GetInt32());
        Assert.Equal(1L, Scalar<long>("SELECT count(*) FROM jobs WHERE name = 'north' AND label IS NULL"));
    }

    [SkippableFact]
    public void Submit_stores_each_input_and_prints_one_id_per_line()
    {
        Init();
        string folder = WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 1);
        string zipped = Path.Combine(Dir, "quay.zip");
        ZipFile.CreateFromDirectory(WorkerJobs.WriteValid(Path.Combine(Dir, "src", "quay"), 2), zipped, CompressionLevel.Fastest, includeBaseDirectory: true);
        string bench = BenchmarkData.File("solomon/c101.txt");

        var (code, output, err) = Anneal("queue", "submit", "--db", Db, "--time", "2", "--solvers", "sa", "--priority", "3", folder, zipped, bench);

        Assert.True(code == 0, err);
        var ids = output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(long.Parse).ToArray();
        Assert.Equal(3, ids.Length);
        Assert.Equal(3, Status().GetProperty("queued").GetInt32());
        Assert.Equal(0, Status().GetProperty("running").GetInt32());
        Assert.Equal("folder,zip,file", Scalar<string>("SELECT string_agg(kind, ',' ORDER BY id) FROM jobs"));
        Assert.Equal("north,quay,c101", Scalar<string>("SELECT string_agg(name, ',' ORDER BY id) FROM jobs"));
        Assert.Equal(3L, Scalar<long>("SELECT count(*) FROM jobs WHERE solvers = 'sa' AND time_seconds = 2 AND priority = 3 AND state = 'queued'"));

        // The files themselves are kept, byte for byte, so the job no longer needs the submitter's disk.
        Assert.Equal("depots.csv,stops.csv,vehicles.csv", Scalar<string>($"SELECT string_agg(path, ',' ORDER BY path) FROM job_inputs WHERE job_id = {ids[0]}"));
        Assert.Equal(File.ReadAllBytes(Path.Combine(folder, "stops.csv")), Scalar<byte[]>($"SELECT content FROM job_inputs WHERE job_id = {ids[0]} AND path = 'stops.csv'"));
        Assert.Equal(File.ReadAllBytes(zipped), Scalar<byte[]>($"SELECT content FROM job_inputs WHERE job_id = {ids[1]}"));
        Assert.Equal(File.ReadAllBytes(bench), Scalar<byte[]>($"SELECT content FROM job_inputs WHERE job_id = {ids[2]}"));
    }

    [SkippableFact]
    public void A_broken_job_is_refused_with_the_problems_check_prints_and_nothing_is_stored()
    {
        Init();
        string good = WorkerJobs.WriteValid(Path.Combine(Dir, "good"), 1);
        string bad = WorkerJobs.WriteBadDemand(Path.Combine(Dir, "bad"));
        var check = new StringWriter();
        Assert.Equal(ExitCodes.InvalidInput, CheckCommand.Execute(bad, new CliContext(check, new StringWriter())));

        var (code, _, err) = Anneal("queue", "submit", "--db", Db, good, bad);

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains(check.ToString().Trim(), err, StringComparison.Ordinal);
        Assert.Contains("stops.csv, row 3, column 'demand_kg'", err, StringComparison.Ordinal);
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM jobs"));

        var unknown = Anneal("queue", "submit", "--db", Db, "--solvers", "nonesuch", good);
        Assert.Equal(ExitCodes.InvalidInput, unknown.Code);
        Assert.Contains("nonesuch", unknown.Err, StringComparison.Ordinal);
        Assert.Equal(0L, Scalar<long>("SELECT count(*) FROM jobs"));
    }

    [SkippableFact]
    public void The_password_is_never_printed_whether_the_database_answers_or_not()
    {
        const string password = "Tr0mbone-Sekret-41";
        Init();
        string withPassword = Db + ";Password=" + password;
        string unreachable = $"Host=127.0.0.1;Port=1;Username=anneal;Password={password};Database=x;Timeout=2";
        string unreadable = $"Host=127.0.0.1;Password={password};Flavour=sweet";
        string job = WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 1);

        var outputs = new[]
        {
            Anneal("queue", "status", "--db", withPassword),
            Anneal("queue", "submit", "--db", withPassword, job),
            Anneal("queue", "status", "--db", unreachable),
            Anneal("queue", "status", "--db", unreadable),
            Anneal("queue", "init", "--db", unreachable),
        };

        Assert.Equal(0, outputs[0].Code);
        Assert.Equal(ExitCodes.QueueUnavailable, outputs[2].Code);
        Assert.Contains("127.0.0.1:1", outputs[2].Err, StringComparison.Ordinal);
        Assert.Equal(ExitCodes.QueueUnavailable, outputs[3].Code);
        foreach (var (_, output, err) in outputs)
        {
            Assert.DoesNotContain(password, output + err, StringComparison.Ordinal);
        }
    }

    [SkippableFact]
    public void Fetch_names_jobs_without_a_result_and_refuses_unknown_ids()
    {
        Init();
        string job = WorkerJobs.WriteValid(Path.Combine(Dir, "north"), 1);
        string id = Anneal("queue", "submit", "--db", Db, job).Out.Trim();

        var (code, _, err) = Anneal("queue", "fetch", "--db", Db, id, "4711", "--out", Path.Combine(Dir, "out"));

        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("there is no job 4711", err, StringComparison.Ordinal);
        Assert.Contains($"job {id} (north) is queued: no result yet", err, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(Path.Combine(Dir, "out")));
        Assert.Equal(ExitCodes.InvalidInput, Anneal("queue", "fetch", "--db", Db, "--all", id, "--out", "x").Code);
    }
}
