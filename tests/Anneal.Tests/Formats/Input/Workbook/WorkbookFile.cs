using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace Anneal.Tests.Formats.Input.Workbook;

/// <summary>A time-typed cell: the number of days (a fraction for a time of day), shown with a time format.</summary>
internal sealed record TimeCell(double Days, bool Hours = false)
{
    public static TimeCell At(int hours, int minutes) => new(((hours * 60) + minutes) / 1440.0, hours >= 24);
}

/// <summary>
/// Writes .xlsx workbooks with the Open XML SDK (DocumentFormat.OpenXml), a general-purpose writer independent of the
/// reader under test. Cells: string (inline text), double or int (number), bool, <see cref="TimeCell"/> (a number
/// styled h:mm, or [h]:mm past 24 hours); a null row is left out of the sheet, so the rows after it keep their numbers.
/// </summary>
internal static class WorkbookFile
{
    private const uint TimeStyle = 1;      // built-in number format 20, h:mm
    private const uint HoursStyle = 2;     // custom format 164, [h]:mm

    public static void Write(string path, params (string Name, object?[]?[] Rows)[] sheets)
    {
        using var document = SpreadsheetDocument.Create(path, SpreadsheetDocumentType.Workbook);
        var book = document.AddWorkbookPart();
        book.Workbook = new DocumentFormat.OpenXml.Spreadsheet.Workbook();
        var styles = book.AddNewPart<WorkbookStylesPart>();
        styles.Stylesheet = new Stylesheet(
            new NumberingFormats(new NumberingFormat { NumberFormatId = 164, FormatCode = "[h]:mm" }) { Count = 1 },
            new Fonts(new Font()) { Count = 1 },
            new Fills(new Fill(new PatternFill { PatternType = PatternValues.None }), new Fill(new PatternFill { PatternType = PatternValues.Gray125 })) { Count = 2 },
            new Borders(new Border()) { Count = 1 },
            new CellStyleFormats(new CellFormat()) { Count = 1 },
            new CellFormats(
                new CellFormat(),
                new CellFormat { NumberFormatId = 20, ApplyNumberFormat = true },
                new CellFormat { NumberFormatId = 164, ApplyNumberFormat = true }) { Count = 3 });

        var list = book.Workbook.AppendChild(new Sheets());
        uint id = 1;
        foreach (var (name, rows) in sheets)
        {
            var part = book.AddNewPart<WorksheetPart>();
            var data = new SheetData();
            part.Worksheet = new Worksheet(data);
            for (int r = 0; r < rows.Length; r++)
            {
                if (rows[r] is not { } cells)
                {
                    continue;
                }

                var row = new Row { RowIndex = (uint)(r + 1) };
                for (int c = 0; c < cells.Length; c++)
                {
                    if (cells[c] is { } value)
                    {
                        row.Append(Cell(Column(c) + (r + 1), value));
                    }
                }

                data.Append(row);
            }

            list.Append(new Sheet { Id = book.GetIdOfPart(part), SheetId = id++, Name = name });
        }

        book.Workbook.Save();
    }

    private static Cell Cell(string reference, object value) => value switch
    {
        string s => new Cell { CellReference = reference, DataType = CellValues.InlineString, InlineString = new InlineString(new Text(s)) },
        bool b => new Cell { CellReference = reference, DataType = CellValues.Boolean, CellValue = new CellValue(b ? "1" : "0") }, // as the standard and spreadsheets write it
        TimeCell t => new Cell { CellReference = reference, CellValue = new CellValue(t.Days), StyleIndex = t.Hours ? HoursStyle : TimeStyle },
        int i => new Cell { CellReference = reference, CellValue = new CellValue(i) },
        double d => new Cell { CellReference = reference, CellValue = new CellValue(d) },
        _ => throw new ArgumentException("unsupported cell value " + value.GetType().Name),
    };

    private static string Column(int index)
    {
        var letters = string.Empty;
        for (int n = index + 1; n > 0; n = (n - 1) / 26)
        {
            letters = (char)('A' + ((n - 1) % 26)) + letters;
        }

        return letters;
    }
}
