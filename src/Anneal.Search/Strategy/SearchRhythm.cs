namespace Anneal.Search.Strategy;

/// <summary>
/// How a local search is driven between its steps: how often the driver checks phases, restarts and samples the
/// trace, whether before or after the step, and how often the hard-rule prices adapt and at which point of a check.
/// A search that scans a whole neighbourhood per step (tabu) checks after every step; one that samples a move per
/// step (annealing) checks every so many steps.
/// </summary>
/// <param name="CheckEvery">Steps between checks; a power of two.</param>
/// <param name="CheckAfterStep">Check after the step (and its offer to the best) rather than before it.</param>
/// <param name="PricesEvery">Steps between price updates; a power of two, a multiple of <paramref name="CheckEvery"/>.</param>
/// <param name="PricesFirst">Update the prices at the start of a check rather than after its phase changes.</param>
/// <param name="WorkPerIteration">Route evaluations the ejection pool counts as one step, about what a step costs.</param>
public readonly record struct SearchRhythm(int CheckEvery, bool CheckAfterStep, int PricesEvery, bool PricesFirst, long WorkPerIteration);
