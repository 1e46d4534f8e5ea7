using Anneal.Core.Model;

namespace Anneal.Formats.Input.Csv;

/// <summary>The <c>windows</c> cell: <c>open-close</c> pieces separated by ';', sorted and non-overlapping.</summary>
internal static class WindowText
{
    private const string Fix = "write windows as open-close separated by ';', in time order, e.g. 08:00-10:30;14:00-16:00";

    public static TimeWindow[] Read(Cells cells, string column)
    {
        var text = cells.Text(column);
        if (text.Length == 0)
        {
            return [TimeWindow.Always];
        }

        var windows = new List<TimeWindow>();
        bool ok = true;
        foreach (var piece in text.Split(';'))
        {
            var p = piece.Trim();
            if (p.Length == 0)
            {
                continue;
            }

            var parts = p.Split('-');
            if (parts.Length != 2 || !TimeText.TryParseTime(cells.Decimal(parts[0]), out double open) || !TimeText.TryParseTime(cells.Decimal(parts[1]), out double close))
            {
                cells.Report(column, p, "not a valid window", Fix + "; times are HH:MM (HH 0-47, MM 00-59) or minutes from 0 to 2880");
                ok = false;
                continue;
            }

            if (open > close)
            {
                cells.Report(column, p, "the window opens after it closes", "give open <= close; a window past midnight may use hours 24-47, e.g. 22:00-26:00");
                ok = false;
                continue;
            }

            if (windows.Count > 0 && open < windows[^1].Close)
            {
                cells.Report(column, p, open < windows[^1].Open ? "the windows are not in time order" : "the window overlaps the one before it", Fix + "; merge windows that overlap");
                ok = false;
                continue;
            }

            windows.Add(new TimeWindow(open, close));
        }

        return ok && windows.Count > 0 ? windows.ToArray() : [TimeWindow.Always];
    }
}
