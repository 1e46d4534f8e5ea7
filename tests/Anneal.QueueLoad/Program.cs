using System.Diagnostics;
using System.Globalization;
using System.Text;
using Anneal.Queue.Database;
using Anneal.Queue.Inputs;
using Anneal.Queue.Worker;
using Npgsql;

// Claim throughput of the queue itself: N trivial jobs, W claimers each with a connection pool of its own (as W worker
// processes would have), each claiming with the worker's SQL and storing a small result through the fenced write, with
// no search and no pictures. Usage: dotnet run -c Release --project tests/Anneal.QueueLoad -- CONN [workers] [jobs]
// The database should be empty or a scratch one: the jobs table is emptied first.
if (args.Length == 0)
{
    Console.Error.WriteLine("usage: Anneal.QueueLoad CONN [workers=4] [jobs=2000]");
    return 2;
}

string connection = args[0];
int workers = args.Length > 1 ? int.Parse(args[1], CultureInfo.InvariantCulture) : 4;
int jobs = args.Length > 2 ? int.Parse(args[2], CultureInfo.InvariantCulture) : 2000;

await using (var setup = QueueConnection.Open(connection))
{
    await QueueSchema.InitAsync(setup, CancellationToken.None);
    await using var clear = setup.CreateCommand("TRUNCATE jobs, experiments CASCADE");
    await clear.ExecuteNonQueryAsync();
    await using var insert = setup.CreateCommand(
        "INSERT INTO jobs (name, kind) SELECT 'load-' || g, 'file' FROM generate_series(1, @n) g; INSERT INTO job_inputs (job_id, path, content) SELECT id, 'job.txt', '\\x00'::bytea FROM jobs");
    insert.Parameters.AddWithValue("n", jobs);
    await insert.ExecuteNonQueryAsync();
}

var file = new StoredFile("summary.json", Encoding.UTF8.GetBytes("{\"plan\":{}}"));
var result = new ResultPackage("load", "none", "distance", 1, 1, 1, 1, true, 0, false, 0, "{}", [file],
    [new PlanRow("v1", 1, "a", 0, 0, 1, 0, 0), new PlanRow("v1", 2, "b", 1, 1, 2, 0, 0)], null);
var clock = Stopwatch.StartNew();
var counts = await Task.WhenAll(Enumerable.Range(0, workers).Select(w => Task.Run(async () =>
{
    await using var db = QueueConnection.Open(connection);
    string me = $"load-{w}";
    var claims = new Claims(db, me);
    var store = new ResultStore(db, me);
    int done = 0;
    while (await claims.ClaimAsync(60, CancellationToken.None) is { } job)
    {
        if (!await store.CompleteAsync(job, result, ClaimEnd.Done, CancellationToken.None))
        {
            throw new InvalidOperationException("a fresh claim was refused");
        }

        done++;
    }

    return done;
})));
double seconds = clock.Elapsed.TotalSeconds;

await using (var check = QueueConnection.Open(connection))
{
    await using var cmd = check.CreateCommand("SELECT count(*) FROM jobs WHERE state = 'done'");
    long stored = (long)(await cmd.ExecuteScalarAsync())!;
    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"{workers} claimers, {jobs} jobs: {counts.Sum()} claimed and stored ({stored} done in the table) in {seconds:0.00} s = {counts.Sum() / seconds:0} jobs/s; per claimer {string.Join(", ", counts)}"));
}

return 0;
