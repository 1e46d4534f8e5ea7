namespace Anneal.Reports.Html;

/// <summary>The report's stylesheet: calm on screen, and in print one vehicle sheet per page.</summary>
internal static class ReportStyles
{
    public const string Css = """
        :root { --ink: #1d2733; --muted: #5b6672; --line: #d5dbe1; --ok: #21733a; --bad: #b3261e; --warn: #8a5a00; --band: #f3f5f7; }
        * { box-sizing: border-box; }
        body { font: 15px/1.45 "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; color: var(--ink); margin: 0 auto; max-width: 1100px; padding: 24px 28px 48px; }
        h1 { font-size: 26px; margin: 0 0 4px; }
        h2 { font-size: 19px; margin: 32px 0 10px; padding-bottom: 4px; border-bottom: 2px solid var(--line); }
        h3 { font-size: 16px; margin: 0 0 6px; }
        .meta { color: var(--muted); margin: 0 0 18px; }
        .cards { display: flex; flex-wrap: wrap; gap: 12px; margin: 8px 0 6px; }
        .card { flex: 1 1 180px; border: 1px solid var(--line); border-radius: 8px; padding: 10px 14px; background: var(--band); }
        .card .label { color: var(--muted); font-size: 13px; }
        .card .value { font-size: 22px; font-weight: bold; }
        .ok { color: var(--ok); } .bad { color: var(--bad); } .warn { color: var(--warn); }
        .advice { border-left: 5px solid var(--ok); background: #eef6f0; padding: 10px 14px; margin: 14px 0; }
        .advice.bad { border-left-color: var(--bad); background: #fbeeed; color: var(--ink); }
        table { border-collapse: collapse; width: 100%; margin: 6px 0 10px; }
        th, td { text-align: left; padding: 4px 8px; border-bottom: 1px solid var(--line); vertical-align: top; }
        th { background: var(--band); font-weight: 600; font-size: 13px; }
        td.n, th.n { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        #solver-table td:first-child { white-space: nowrap; }
        #solver-table td.status { overflow-wrap: anywhere; font-size: 13px; }
        #solver-table th, #solver-table td { padding: 4px 6px; }
        tr.chosen td { font-weight: bold; }
        tr.late td { background: #fbeeed; }
        tr.break td { background: #efe9f8; color: var(--muted); }
        tr.break td:first-child { border-left: 4px solid #c6b6e6; }
        tr.depot td { background: var(--band); color: var(--muted); }
        figure { margin: 10px 0 18px; }
        figure img { width: 100%; height: auto; border: 1px solid var(--line); }
        figcaption { color: var(--muted); font-size: 13px; }
        ul.plain { padding-left: 20px; }
        .sheet { border: 1px solid var(--line); border-radius: 8px; padding: 12px 14px; margin: 14px 0; }
        .swatch { display: inline-block; width: 14px; height: 14px; border-radius: 3px; margin-right: 8px; vertical-align: -1px; }
        .sheet .sum { color: var(--muted); margin: 0 0 6px; }
        .none { color: var(--muted); font-style: italic; }
        @page { size: A4; margin: 14mm; }
        @media print {
          body { max-width: none; padding: 0; font-size: 11pt; }
          .sheet { break-before: page; border: none; padding: 0; }
          figure { break-inside: avoid; }
          h2 { break-after: avoid; }
          tr { break-inside: avoid; }
          .advice, .card, .swatch { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
        }
        """;
}
