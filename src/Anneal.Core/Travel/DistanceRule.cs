namespace Anneal.Core.Travel;

/// <summary>How distances between locations are obtained.</summary>
public enum DistanceRule
{
    /// <summary>Euclidean in double precision (Solomon convention).</summary>
    Euclidean,

    /// <summary>Euclidean rounded to the nearest integer per arc (TSPLIB EUC_2D, Reinelt 1991).</summary>
    EuclideanRounded,

    /// <summary>Great-circle (haversine) km between latitude/longitude, times a detour factor.</summary>
    GreatCircle,

    /// <summary>Given pairwise distances and durations (e.g. exported from a road-network router).</summary>
    Matrix,
}
