namespace Anneal.Formats.Output;

/// <summary>One convergence sample of one solver, as written to trace.csv (the host maps the solvers' trace points).</summary>
public sealed record TraceRow(string Solver, double Seconds, long Iteration, double BestObjective, double CurrentObjective, bool BestFeasible, string State);
