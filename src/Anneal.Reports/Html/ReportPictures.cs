namespace Anneal.Reports.Html;

/// <summary>The PNG pictures embedded in the report; null where there is nothing to draw (no search, no plan).</summary>
public sealed record ReportPictures(byte[]? Convergence, byte[]? Routes, byte[]? Schedule);
