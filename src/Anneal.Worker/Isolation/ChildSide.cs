using System.Globalization;
using System.Runtime.InteropServices;
using Anneal.Core.Model;
using Anneal.Core.Solving;
using Anneal.Formats.Input;
using Anneal.Jobs;

namespace Anneal.Worker.Isolation;

/// <summary>
/// The solver process's side of <see cref="ChildRun"/> (`anneal run-job`): reads the job, runs the one job runner with
/// the worker's request, writes the run's files into the folder it was given and reports on standard output in
/// <see cref="ChildProtocol"/> lines. A stop request (SIGTERM from the worker) ends the search; the best plan is still
/// written.
/// </summary>
public static partial class ChildSide
{
    public const string Command = "run-job";

    /// <summary>
    /// For tests of the worker: the solver process aborts (libc abort(), as a failed check in native code does) when the
    /// solver this variable names begins. Nothing else reads it.
    /// </summary>
    public const string AbortSwitch = "ANNEAL_TEST_ABORT_IN";

    /// <summary>The arguments after the executable that make it the solver process of one job.</summary>
    /// <param name="claimedAt">
    /// When the job's budget began: with <see cref="JobRequest.WholeRun"/>, its whole run, this process's start-up
    /// included, keeps within it; otherwise the budget is the solvers' own.
    /// </param>
    public static IReadOnlyList<string> Arguments(string input, string output, JobRequest request, DateTimeOffset claimedAt)
    {
        var args = new List<string> { Command, input, "--out", output, "--default-time", Number(request.DefaultTimeSeconds),
            "--threads", request.Threads.ToString(CultureInfo.InvariantCulture), "--claimed-at", claimedAt.ToString("O", CultureInfo.InvariantCulture) };
        Add(args, "--solvers", request.Solvers);
        Add(args, "--time", request.TimeSeconds is { } time ? Number(time) : null);
        Add(args, "--iterations", request.Iterations?.ToString(CultureInfo.InvariantCulture));
        Add(args, "--target", request.Target is { } target ? Number(target) : null);
        Add(args, "--objective", request.Objective?.ToText());
        Add(args, "--seed", request.Seed?.ToString(CultureInfo.InvariantCulture));
        if (!request.WholeRun)
        {
            args.Add(SearchBudget);
        }

        return args;
    }

    /// <summary>The budget is the solvers' own (not the whole run's, files included), as the database worker asks.</summary>
    public const string SearchBudget = "--search-budget";

    private static void Add(List<string> args, string option, string? value)
    {
        if (value is not null)
        {
            args.Add(option);
            args.Add(value);
        }
    }

    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    /// <param name="written">Called after the run's files are written, before the result is reported (the database worker's package).</param>
    /// <returns>0 when the files are written (130 when the search was cut short).</returns>
    /// <exception cref="InputException">when the job cannot be read.</exception>
    public static int Run(JobRunner runner, RunWriter writer, string input, string output, JobRequest request, TextWriter stdout, TimeProvider clock, CancellationToken stop,
        Action<JobRun>? written = null)
    {
        var loaded = InputLoader.Load(input);
        var plan = runner.Prepare(loaded, request);
        var reporting = new List<ISolver>();
        foreach (var solver in plan.Solvers)
        {
            reporting.Add(new Reporting(solver, stdout));
        }

        var run = runner.Run(plan with { Solvers = reporting }, (solver, point) => Write(stdout, ChildProtocol.PointLine(solver, point)), stop);
        try
        {
            writer.Write(output, run, clock.GetUtcNow());
            written?.Invoke(run);
        }
        catch (Exception e) when (Formats.Output.DiskFull.Is(e))
        {
            Write(stdout, ChildProtocol.NoSpaceLine(e.Message));
            return 4;
        }

        var best = run.Outcome.Best;
        Write(stdout, ChildProtocol.DoneLine(new ChildResult(run.Interrupted, best.Result.Solver, best.Evaluation.Objective, best.Evaluation.Feasible, best.Evaluation.VehiclesUsed)));
        return run.Interrupted ? 130 : 0;
    }

    /// <summary>
    /// Stops the search when the worker is gone: its end of our standard input closes when it dies, even by SIGKILL,
    /// so no orphaned search goes on writing into a partial folder that recovery is about to remove.
    /// </summary>
    public static void StopWhenParentEnds(Stream stdin, CancellationTokenSource stop)
    {
        var watch = new Thread(() =>
        {
            try
            {
                var buffer = new byte[64];
                while (stdin.Read(buffer) > 0)
                {
                    // The worker writes nothing; anything read is ignored.
                }
            }
            catch (IOException)
            {
                // A broken pipe is the same news.
            }

            try
            {
                stop.Cancel();
            }
            catch (ObjectDisposedException)
            {
                // The run already finished.
            }
        })
        { IsBackground = true, Name = "parent watch" };
        watch.Start();
    }

    /// <summary>
    /// SIGTERM (what the worker sends) stops the search; SIGINT is ignored, since Ctrl+C in a terminal reaches the
    /// worker and this process alike and the worker passes it on as SIGTERM; a second SIGINT would otherwise count as
    /// the "end at once" signal and lose the plan.
    /// </summary>
    public static IDisposable StopOnSigterm(CancellationTokenSource stop)
    {
        var registrations = new List<PosixSignalRegistration>();
        try
        {
            registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGINT, c => c.Cancel = true));
            registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGTERM, c =>
            {
                c.Cancel = true;
                try
                {
                    stop.Cancel();
                }
                catch (ObjectDisposedException)
                {
                    // The run already finished.
                }
            }));
        }
        catch (PlatformNotSupportedException)
        {
            // Without POSIX signals the worker's stop arrives as a kill; the closed standard input still says so.
        }

        return new Registrations(registrations);
    }

    private sealed class Registrations(List<PosixSignalRegistration> all) : IDisposable
    {
        public void Dispose() => all.ForEach(r => r.Dispose());
    }

    private static void Write(TextWriter stdout, string line)
    {
        lock (stdout)
        {
            stdout.WriteLine(line);
            stdout.Flush();
        }
    }

    /// <summary>Says when a solver begins and ends, so that a crash can be placed in its phase.</summary>
    private sealed class Reporting(ISolver inner, TextWriter stdout) : ISolver
    {
        public string Name => inner.Name;

        public string? Declines(Instance instance) => inner.Declines(instance);

        public SolverResult Solve(Instance instance, SolveOptions options, IProgress<TracePoint>? progress, CancellationToken cancel)
        {
            Write(stdout, ChildProtocol.BeginLine(Name));
            if (Environment.GetEnvironmentVariable(AbortSwitch) == Name)
            {
                Abort();
            }
            var result = inner.Solve(instance, options, progress, cancel);
            Write(stdout, ChildProtocol.EndLine(Name));
            return result;
        }
    }

    [LibraryImport("libc", EntryPoint = "abort")]
    private static partial void Abort();
}
