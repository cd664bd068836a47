"""Tables in, Records out: read a CSV/TSV/XLSX/ODS file, find its columns, parse every date cell.

Three steps, each usable alone:

- `read_table(path, sheet=None)` gives the raw cells. CSV-like files are read as text, exactly
  as written (`0043` stays `0043`, `1650` never becomes `1650.0`); spreadsheet cells keep their
  types (a real date arrives as a `datetime`, a year as an `int`). Empty cells are `""`.
- `detect_columns(header, given)` fills the roles the user did not name (start, end, when,
  label, group, color, id) from common header names.
- `load_records(table, columns, settings, date_numbers="years")` turns rows into `Record`s
  and `Problem`s. Every non-blank row ends as a Record (drawn, or undated and listed) or as a
  Problem (not drawn): no row is lost. Every cell error of every row is collected, not just
  the first, and an unexpected fault in one cell is that cell's problem. `date_numbers`
  says how a spreadsheet's numbers in date columns are read: years, or date serials.

Spreadsheets are streamed by our own readers (`xlsx`, `ods`): a date cell's serial is seen
before it becomes a date (1900-02-29, Excel's day that did not exist, is refused), the
workbook's date system (1900 or 1904) is honoured, merged blocks are filled down with a note,
formulas with no saved value and error values are reported as such, and the size of what a
file expands to is bounded with an error that names it (`sheets`).

Rows are numbered as a spreadsheet program numbers them: the header is row 1, so the first
data row is row 2. This is the only module of the project that imports pandas.
"""
from .columns import COLUMN_NAMES, ColumnMap, detect_columns
from ..dates.column import OPEN_CELL
from .problems import PROBLEM_KINDS, Problem
from .records import LoadResult, load_records, read_records
from .serials import DATE_NUMBERS
from .sheets import UnreadableCell
from .tables import READABLE, Table, cell_text, read_table

__all__ = ["COLUMN_NAMES", "ColumnMap", "DATE_NUMBERS", "LoadResult", "OPEN_CELL",
           "PROBLEM_KINDS", "Problem", "READABLE", "Table", "UnreadableCell", "cell_text",
           "detect_columns", "load_records", "read_records", "read_table"]
