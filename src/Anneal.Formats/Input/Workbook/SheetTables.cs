using System.Text;
using Anneal.Formats.Input.Csv;
using ExcelDataReader;

namespace Anneal.Formats.Input.Workbook;

/// <summary>Every sheet of an .xlsx file read into tables of cell texts, each row knowing its number in the sheet.</summary>
internal static class SheetTables
{
    static SheetTables()
    {
        // The reader decodes some legacy strings through code pages that .NET only has once registered.
        Encoding.RegisterProvider(CodePagesEncodingProvider.Instance);
    }

    /// <summary>The sheets by name (as written), in workbook order; null (with a problem) when the file cannot be read.</summary>
    public static List<CsvTable>? Read(string path, string file, ProblemList problems)
    {
        try
        {
            using var stream = File.OpenRead(path);
            using var reader = ExcelReaderFactory.CreateOpenXmlReader(stream);
            var sheets = new List<CsvTable>();
            do
            {
                sheets.Add(Sheet(reader, file, problems));
            }
            while (reader.NextResult());

            return sheets;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            problems.Add(file, null, null, null, "the workbook cannot be read: " + e.Message, "check that the file is not open elsewhere and may be read");
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // The reader's own exceptions (not a zip, not a workbook, a damaged part) say nothing a coordinator can act on.
            problems.Add(file, null, null, null, "the file is not a readable .xlsx workbook",
                "save it again from the spreadsheet as an Excel workbook (.xlsx), or export each sheet as CSV into a job folder");
        }

        return null;
    }

    private static CsvTable Sheet(IExcelDataReader reader, string file, ProblemList problems)
    {
        string sheet = reader.Name;
        var rows = new List<CsvRow>();
        int number = 0;
        while (reader.Read())
        {
            number++;
            var cells = new string[reader.FieldCount];
            bool blank = true;
            for (int i = 0; i < cells.Length; i++)
            {
                cells[i] = CellText.Of(reader.GetValue(i));
                blank &= string.IsNullOrWhiteSpace(cells[i]);
            }

            if (!blank)
            {
                rows.Add(new CsvRow(number, cells));
            }
        }

        var header = rows.Count == 0 ? [] : Header(rows[0].Cells);
        var table = new CsvTable
        {
            File = file,
            Sheet = sheet,
            Names = JobNames.Workbook,
            Header = header,
            Rows = rows.Count == 0 ? [] : rows.GetRange(1, rows.Count - 1),
        };
        if (rows.Count > 0 && rows[0].Line != 1)
        {
            problems.Add(table, rows[0].Line, null, null, "blank rows before the header", "put the column names in row 1");
        }

        foreach (var row in table.Rows)
        {
            for (int i = header.Length; i < row.Cells.Length; i++)
            {
                if (!string.IsNullOrWhiteSpace(row.Cells[i]))
                {
                    problems.Add(new InputProblem(file, row.Line, null, row.Cells[i], "a value beyond the last named column", "name its column in row 1, or clear the cell")
                    {
                        Sheet = sheet,
                    });
                    break;
                }
            }
        }

        return table;
    }

    /// <summary>The header's names, trimmed, without the empty columns after the last name.</summary>
    private static string[] Header(string[] cells)
    {
        int width = cells.Length;
        while (width > 0 && string.IsNullOrWhiteSpace(cells[width - 1]))
        {
            width--;
        }

        var header = new string[width];
        for (int i = 0; i < width; i++)
        {
            header[i] = cells[i].Trim();
        }

        return header;
    }
}
