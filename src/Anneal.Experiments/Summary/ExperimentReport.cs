using System.Globalization;
using Anneal.Experiments.Analysis;
using Anneal.Formats.Output;
using Anneal.Reports.Plots;

namespace Anneal.Experiments.Summary;

/// <summary>
/// Everything an experiment leaves beside results.csv: statistics.csv, comparisons.csv, the three pictures (PNG and
/// SVG), summary.md and summary.html. Computed from the rows of the plan only, so a folder reused with a smaller plan
/// does not mix experiments.
/// </summary>
public static class ExperimentReport
{
    public const string StatisticsFile = "statistics.csv";
    public const string ComparisonsFile = "comparisons.csv";

    public static ExperimentStatistics Write(string outDir, BenchOutcome outcome, MachineInfo machine, string? referenceFile)
    {
        // A solver that only proves bounds has no plan to rank: its rows feed the bound table, not the statistics.
        var all = outcome.PlanRows();
        var rows = all.Where(r => !r.BoundOnly).ToList();
        var stats = ExperimentAnalysis.Compute(rows);
        var traced = ExperimentTraces.Load(outDir, rows, out int unreadable);
        var pictures = ExperimentPictures.Draw(outDir, rows, traced, TimeToTarget.DefaultPercents);
        AtomicFile.WriteText(Path.Combine(outDir, StatisticsFile), w => SummaryTables.WriteConfigCsv(w, stats));
        AtomicFile.WriteText(Path.Combine(outDir, ComparisonsFile), w => SummaryTables.WritePairCsv(w, stats));
        var doc = Document(outcome, rows, stats, machine, referenceFile, pictures, unreadable, SummaryTables.Bounds(all));
        AtomicFile.WriteText(Path.Combine(outDir, MarkdownSummary.FileName), w => w.Write(MarkdownSummary.Render(doc)));
        AtomicFile.WriteText(Path.Combine(outDir, HtmlSummary.FileName), w => w.Write(HtmlSummary.Render(doc)));
        return stats;
    }

    private static SummaryDocument Document(BenchOutcome outcome, IReadOnlyList<BenchRow> rows, ExperimentStatistics stats, MachineInfo machine,
        string? referenceFile, ExperimentPictures pictures, int unreadable, SummaryTable? bounds)
    {
        var solvers = outcome.Plan.Select(p => p.Solver).Distinct(StringComparer.OrdinalIgnoreCase);
        var budgets = outcome.Plan.Select(p => p.BudgetSeconds).Distinct().Order().Select(SummaryTables.Seconds);
        var seeds = outcome.Plan.Select(p => p.Seed).Distinct().Count();
        var objectives = outcome.Plan.Select(p => p.Objective).Distinct(StringComparer.Ordinal);
        var lead = new List<string>
        {
            string.Create(CultureInfo.InvariantCulture,
                $"{stats.Instances} instance(s) × solvers {string.Join(", ", solvers)} × {seeds} seed(s) × budgets {string.Join(", ", budgets)}; objective: {string.Join(", ", objectives)}."),
            string.Create(CultureInfo.InvariantCulture, $"Runs: {rows.Count} of {outcome.Plan.Count} planned in results.csv")
                + (outcome.Missing > 0 ? $"; {outcome.Missing} not done yet (interrupted: run the same command again to continue)." : "."),
            "Machine: " + machine.Line() + ".",
            References(stats, referenceFile),
        };
        if (unreadable > 0)
        {
            lead.Add($"{unreadable} run(s) have no readable trace and are missing from the time-based pictures.");
        }

        var sections = new List<SummarySection>
        {
            new("Gap by solver and budget",
            [
                "Gap = objective (cost) or distance (benchmark objectives) above the reference, in percent, over the runs whose plan keeps every hard rule; "
                + "runs that break one count in runs but not in feasible or in the gaps. IQR: interquartile range (Hyndman & Fan definition 7). "
                + "The 95% confidence interval of the mean uses Student's t with n − 1 degrees of freedom. Best on: instances where the solver's mean gap over seeds was lowest at that budget (ties count for each).",
            ], SummaryTables.Configs(stats)),
        };
        if (stats.Pairs.Count > 0)
        {
            sections.Add(new("Paired comparisons (Wilcoxon signed-rank test)",
            [
                "Each pair of solvers at each budget, paired by instance (mean gap over seeds; instances where either solver had no feasible run are left out). "
                + $"Zero differences are dropped and ties get average ranks; p is two-sided, exact up to {Statistics.WilcoxonSignedRank.ExactLimit} pairs, else the normal approximation with continuity correction. "
                + "A negative median A − B means A had the lower (better) gap.",
            ], SummaryTables.Pairs(stats)));
        }

        if (bounds is not null)
        {
            sections.Add(new("Lower bounds",
            [
                "The strongest lower bound any run proved on the objective of plans that keep the hard rules, per instance. "
                + "Bound ÷ reference: how close the bound comes to the best-known value (a valid bound never exceeds an optimum proven under the same distance rule). "
                + "Plan within: the best feasible plan of the experiment is proved at most this far above the optimum.",
            ], bounds));
        }

        var pics = new List<SummaryPicture>();
        if (pictures.Profile is { } profile)
        {
            pics.Add(new(ProfilePlot.FileStem, "Performance profile (Dolan & Moré 2002): fraction of runs whose objective is within a factor τ of the best found on the instance by any run; breaking a hard rule never counts as within.", profile));
        }

        if (pictures.Quality is { } quality)
        {
            pics.Add(new(QualityPlot.FileStem, "Quality against runtime: median gap to the reference over instances and seeds, band = interquartile range; a moment is drawn once half of the runs have a feasible plan.", quality));
        }

        if (pictures.TimeToTarget is { } ttt)
        {
            pics.Add(new(TimeToTargetPlot.FileStem, "Time to target: fraction of runs whose best feasible plan is within 1%, 2% or 5% of the reference by each moment, each solver at its longest budget.", ttt));
        }

        sections.Add(new("Pictures", [], null, pics));
        sections.Add(new("Files",
        [
            "results.csv: one row per finished run (instance, solver, seed, budget_s, objective, objective_value, vehicles, distance, feasible, seconds_to_best, seconds, reference, reference_vehicles, gap_pct, trace_file, lower_bound, bound_only); "
            + "gap_pct there is to the reference file only. traces/: each run's convergence trace. statistics.csv and comparisons.csv: the tables above as plain numbers. machine.json: where and when each invocation ran.",
        ]));
        return new SummaryDocument("Solver comparison", lead, sections);
    }

    private static string References(ExperimentStatistics stats, string? referenceFile)
    {
        int without = stats.WithoutReference.Count;
        int with = stats.Gaps.Where(g => g.FromReference).Select(g => (g.Row.Instance, g.Row.Objective)).Distinct().Count();
        string source = referenceFile is null ? "no reference file was given" : $"reference values from {Path.GetFileName(referenceFile)} for {with} instance(s)";
        if (without == 0)
        {
            return $"Gaps: {source}.";
        }

        string list = without <= 12 ? ": " + string.Join(", ", stats.WithoutReference) : string.Empty;
        return $"Gaps: {source}; for {without} instance(s) without a reference the gap is to the best found across this experiment{list}.";
    }
}
