namespace Anneal.Bounds.Pricing;

/// <summary>
/// What one pricing run found. <see cref="MinReducedCost"/> is the least reduced cost over every ng-route of the kind
/// when <see cref="Complete"/> (an exact run that finished), and only the least among the routes it looked at otherwise.
/// </summary>
/// <param name="Routes">Routes of negative reduced cost (stop indices in order), most negative first.</param>
/// <param name="Labels">Labels created, for the notes and for tuning.</param>
public sealed record PricingResult(double MinReducedCost, bool Complete, IReadOnlyList<int[]> Routes, long Labels);
