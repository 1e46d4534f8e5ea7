namespace Anneal.Formats.Input.Csv;

/// <summary>How a job file places its locations.</summary>
internal enum CoordinateSystem
{
    /// <summary>Not determined (columns missing or mixed); a problem has been reported.</summary>
    None,

    /// <summary>Planar x, y in km.</summary>
    Planar,

    /// <summary>Latitude and longitude in degrees.</summary>
    LatLon,
}
