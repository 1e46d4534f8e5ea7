namespace Anneal.Core.Travel;

/// <summary>Haversine distance on a sphere (Sinnott 1984, "Virtues of the Haversine", Sky and Telescope 68(2):159).</summary>
public static class GreatCircle
{
    /// <summary>Mean Earth radius in km (IUGG mean radius R1 = 6371.0088 km).</summary>
    public const double EarthRadiusKm = 6371.0088;

    public static double Kilometres(double lat1, double lon1, double lat2, double lon2)
    {
        const double toRad = Math.PI / 180.0;
        double dLat = (lat2 - lat1) * toRad;
        double dLon = (lon2 - lon1) * toRad;
        double s1 = Math.Sin(dLat / 2);
        double s2 = Math.Sin(dLon / 2);
        double a = (s1 * s1) + (Math.Cos(lat1 * toRad) * Math.Cos(lat2 * toRad) * s2 * s2);
        return 2 * EarthRadiusKm * Math.Asin(Math.Min(1.0, Math.Sqrt(a)));
    }
}
