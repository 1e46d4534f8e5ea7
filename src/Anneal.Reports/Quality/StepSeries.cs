namespace Anneal.Reports.Quality;

/// <summary>
/// A step curve for the experiment pictures: y holds from each x until the next. <paramref name="Colour"/> picks the
/// solver's colour, <paramref name="Pattern"/> the line pattern (0 solid, 1 dashed, 2 dotted, …).
/// </summary>
public sealed record StepSeries(string Label, int Colour, int Pattern, IReadOnlyList<double> X, IReadOnlyList<double> Y);
