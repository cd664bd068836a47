"""Reading a table file into raw cells: CSV/TSV as text exactly as written, XLSX/ODS with
their cell types. Rows are numbered as a spreadsheet program numbers them (header = row 1).
The only module of the project that imports pandas, and only when it reads with it.

A text table is read by pandas' C reader, or, when it is small, by the standard csv module:
importing pandas takes about a quarter of a second, longer than the csv module takes for a
table of tens of thousands of cells, while on a large table pandas is several times faster.
Both give the same cells (tests/test_sources.py checks it on random tables); whatever the csv
module cannot read (a field over its size limit, a blank first line) goes to pandas.

A spreadsheet is streamed by our own readers (xlsx.py, ods.py), which keep what pandas lost:
a date cell's serial, formulas with no saved value, error values, merged cells, the workbook's
date system, and a bound on size (sheets.py)."""
from __future__ import annotations

import csv
import io
import re
from collections.abc import Iterable
from dataclasses import dataclass, replace
from datetime import date, datetime
from pathlib import Path

from ..errors import SourceError, UsageError
from .decoding import checked_encoding, decoded_text
from .problems import Problem, row_ranges
from .serials import DateSystem
from .sheets import SheetCells

TEXT_FORMATS = {".csv": ",", ".tsv": "\t", ".tab": "\t", ".txt": None}  # None: from the header
SPREADSHEET_ENGINES = {".xlsx": "xlsx", ".xlsm": "xlsx", ".ods": "ods"}
READABLE = ", ".join([*TEXT_FORMATS, *SPREADSHEET_ENGINES])
_DELIMITERS = ("\t", ";", ",", "|")  # tried in this order when a header line must decide
# Up to this many characters a text table is read by the csv module (about 40,000 rows of a
# register like the gallery's: where it and importing pandas take about as long).
SMALL_TEXT = 2_000_000
TEXT_READERS = ("csv", "pandas")



@dataclass(frozen=True, slots=True)
class Table:
    """Raw cells of one sheet, by column: `columns[j][i]` is the cell of column j in row
    i + `first_row`: spreadsheet row i + 2 for a file (the header is row 1), row i for a
    DataFrame, counted as `iloc` counts. Kept by column as the reader gives them and the
    records are read."""

    source: str                          # the file name, for messages
    header: tuple[str, ...]
    columns: tuple[list[object], ...]    # one per header name, all of one length
    # A spreadsheet's: how it counts days (for numbers read as date serials); what reading it
    # did to whole columns (merged cells filled); which columns hold an UnreadableCell.
    date_system: DateSystem | None = None
    notes: tuple[Problem, ...] = ()
    marked: frozenset[int] = frozenset()
    first_row: int = 2

    def __post_init__(self) -> None:
        if len(self.columns) != len(self.header):
            raise ValueError(f"{len(self.columns)} columns for {len(self.header)} names")
        if len({len(column) for column in self.columns}) > 1:
            raise ValueError("the columns must be of one length")

    @classmethod
    def from_rows(cls, source: str, header: tuple[str, ...],
                  rows: Iterable[tuple[object, ...]]) -> "Table":
        """A table from rows, each as long as the header."""
        rows = list(rows)
        if any(len(row) != len(header) for row in rows):
            raise ValueError(f"every row must have {len(header)} cells")
        columns = tuple(map(list, zip(*rows))) if rows else tuple([] for _ in header)
        return cls(source, header, columns)

    @property
    def row_count(self) -> int:
        return len(self.columns[0]) if self.columns else 0

    @property
    def rows(self) -> tuple[tuple[object, ...], ...]:
        """`rows[i]`: spreadsheet row i + 2, as long as the header."""
        return tuple(zip(*self.columns))


def read_table(path: str | Path, sheet: str | int | None = None, *,
               encoding: str | None = None, header_row: int = 1) -> Table:
    """Read a table file; its format follows the extension (see READABLE).

    `sheet` picks a spreadsheet's sheet by name, or by its place counted from 1 when it is a
    number that is not also a sheet's name. A text file is read in `encoding` when one is
    named; else UTF-8, or UTF-16 by its byte-order mark, or, for bytes that are not UTF-8,
    Windows-1252 with a note (decoding.py). `header_row` is the row that names the columns
    (a sheet may have a title and notes above it); rows keep their spreadsheet numbers."""
    if encoding is not None:
        checked_encoding(encoding)
    if header_row < 1:
        raise UsageError(f"the header row is counted from 1, not {header_row}")
    path = Path(path)
    suffix = path.suffix.lower()
    if suffix not in TEXT_FORMATS and suffix not in SPREADSHEET_ENGINES:
        raise SourceError(f"{path.name}: cannot read files of type {suffix or '(none)'!r}",
                          hint=f"save it as one of {READABLE}")
    if not path.is_file():
        raise SourceError(f"{path}: no such file" if not path.exists() else f"{path}: not a file",
                          hint="check the path and the spelling of the file name")
    if suffix in SPREADSHEET_ENGINES:
        return _spreadsheet_table(path, SPREADSHEET_ENGINES[suffix], sheet, header_row)
    if sheet is not None:
        raise UsageError(f"{path.name} is a text file and has no sheets",
                         hint="a sheet can be chosen only in an .xlsx, .xlsm or .ods file")
    decoded = decoded_text(path.read_bytes(), path.name, encoding)
    cells = _text_cells(path, decoded.text, TEXT_FORMATS[suffix], header_row - 1)
    table = _from_header_row(path.name, cells, header_row, skipped=0)
    return replace(table, notes=decoded.notes + table.notes) if decoded.notes else table


def _from_header_row(source: str, columns: list[list[object]], header_row: int,
                     skipped: int | None = None) -> Table:
    """The table whose names are in `header_row`; the `skipped` rows above it (all of them
    unless the reader dropped them already) are set aside, and when the names look like a
    title above the real header, a note says which row to give."""
    skipped = header_row - 1 if skipped is None else skipped
    if columns and skipped >= len(columns[0]):
        raise SourceError(f"{source}: there is no row {header_row} to take the column names "
                          f"from; the sheet has {len(columns[0])} rows")
    table = _table_from_cells(source, [column[skipped:] for column in columns])
    table = replace(table, first_row=header_row + 1)
    title = _title_rows_note(source, columns, skipped)
    return replace(table, notes=table.notes + title) if title else table


_LOOKED_AT = 20      # rows searched for a header below a lone title
TITLE_ROW = "names one column only"


def _title_rows_note(source: str, columns: list[list[object]], skipped: int
                     ) -> tuple[Problem, ...]:
    """A note when the header row holds one cell (a title, most likely) and a row below it
    fills several: that row is probably the header."""
    if len(columns) < 2:
        return ()
    filled = [sum(1 for column in columns if cell_text(column[row]))
              for row in range(skipped, min(len(columns[0]), skipped + _LOOKED_AT))]
    if not filled or filled[0] > 1:
        return ()
    below = next((offset for offset, count in enumerate(filled) if count >= 2), None)
    if below is None:
        return ()
    row = skipped + below + 1
    hint = f"if the column names are in row {row}, give --header-row {row}"
    return (Problem(source, skipped + 1, None, None, "", f"row {skipped + 1} {TITLE_ROW}",
                    "note", hint=hint),)


def _text_cells(path: Path, text: str, delimiter: str | None, skipped: int = 0
                ) -> list[list[object]]:
    """The cells of a text table by column, from its line `skipped` + 1 (the header) on."""
    if skipped:
        lines = text.split("\n", skipped)
        if len(lines) <= skipped:
            raise SourceError(f"{path.name}: there is no line {skipped + 1} to take the column "
                              f"names from; the file has {len(lines)} lines")
        text = lines[-1]
    if not text.strip():
        raise SourceError(f"{path.name}: the file is empty",
                          hint="the first row should name the columns, e.g. label,start,end")
    first_line = text.split("\n", 1)[0]
    delimiter = _delimiter_from_header(first_line, delimiter)
    try:
        return text_columns(text, delimiter)
    except _RaggedRow as error:
        raise SourceError(f"{path.name}: {error}", hint=_ragged_hint(error, skipped)) from error


def _ragged_hint(error: "_RaggedRow", skipped: int) -> str:
    """Every line as wide as the header; where line 1 is a single cell and a line below is
    wider (a title above the header, most likely), which --header-row to give."""
    found = re.match(r"line (\d+) has \d+ cells, the header has 1$", str(error))
    if found and not skipped and int(found.group(1)) <= _LOOKED_AT:
        line = int(found.group(1))
        return f"if the column names are in line {line}, give --header-row {line}"
    return "every line should have as many cells as the header"


class _RaggedRow(ValueError):
    """A line with more cells than the first."""


def text_columns(text: str, delimiter: str, reader: str | None = None) -> list[list[object]]:
    """The cells of a text table by column, the first row's included, each the str it was.
    `reader`: "csv" or "pandas"; by default the csv module for a small text (SMALL_TEXT).
    Raises _RaggedRow for a line with more cells than the first; shorter lines are padded
    with empty cells, and a blank line is a row of them."""
    if reader is None:
        reader = "csv" if len(text) <= SMALL_TEXT else "pandas"
    if reader not in TEXT_READERS:
        raise ValueError(f"reader must be one of {', '.join(TEXT_READERS)}, not {reader!r}")
    if reader == "csv":
        columns = _csv_columns(text, delimiter)
        if columns is not None:
            return columns
    return _pandas_columns(text, delimiter)


def _csv_columns(text: str, delimiter: str) -> list[list[object]] | None:
    """The csv module's reading, as pandas reads (header=None, no missing values, blank lines
    kept); None for what it cannot read the same way."""
    text = text.removeprefix("\ufeff")   # a byte-order mark left in: pandas drops it too
    try:
        rows = list(csv.reader(io.StringIO(text, newline=""), delimiter=delimiter))
    except csv.Error:
        return None          # a field over the module's size limit, and the like
    if not rows or not rows[0]:
        return None          # a blank first line: pandas decides the width otherwise
    width = len(rows[0])
    for number, row in enumerate(rows, start=1):
        if len(row) > width:
            raise _RaggedRow(f"line {number} has {len(row)} cells, the header has {width}")
    padded = [row if len(row) == width else row + [""] * (width - len(row)) for row in rows]
    return [list(column) for column in zip(*padded)]


def _pandas_columns(text: str, delimiter: str) -> list[list[object]]:
    import pandas as pd

    try:
        # dtype=object keeps every cell the str it was, with no type guessing at all.
        frame = pd.read_csv(io.StringIO(text), sep=delimiter, header=None, dtype=object,
                            keep_default_na=False, na_filter=False, skip_blank_lines=False,
                            engine="c")
    except pd.errors.ParserError as error:
        raise _RaggedRow(_plain_parser_message(error)) from error
    return _frame_columns(frame)


def _frame_columns(frame) -> list[list[object]]:
    """Each column's cells, the first row's included, as plain Python lists."""
    return [frame[column].tolist() for column in frame.columns]


def _delimiter_from_header(first_line: str, default: str | None) -> str:
    """The delimiter of a text table: the extension's, unless its header line holds none of it.

    A `.csv` saved where the decimal mark is a comma is separated by semicolons; a `.txt`
    says nothing. Then the header decides: the candidate it holds most (tab, `;`, `,`, `|`
    win ties in that order). A header with none of them is a single column."""
    if default is not None and default in first_line:
        return default
    counts = [(first_line.count(candidate), candidate) for candidate in _DELIMITERS]
    best_count = max(count for count, _ in counts)
    if best_count == 0:
        return default or ","
    return next(candidate for count, candidate in counts if count == best_count)


def _plain_parser_message(error: Exception) -> str:
    # pandas says "Error tokenizing data. C error: Expected 3 fields in line 5, saw 4".
    found = re.search(r"Expected (\d+) fields in line (\d+), saw (\d+)", str(error))
    if found:
        expected, line, saw = found.groups()
        return f"line {line} has {saw} cells, the header has {expected}"
    return str(error).strip()


def _spreadsheet_table(path: Path, reader: str, sheet: str | int | None,
                       header_row: int = 1) -> Table:
    if reader == "xlsx":
        from .xlsx import read_xlsx as read_sheet
    else:
        from .ods import read_ods as read_sheet
    cells, date_system = read_sheet(path, sheet)
    table = _from_header_row(path.name, cells.columns(), header_row)
    notes = table.notes + _merged_note(table, cells)
    return replace(table, date_system=date_system, notes=notes,
                   marked=frozenset(cells.marked))


def _merged_note(table: Table, cells: SheetCells) -> tuple[Problem, ...]:
    """One note for the sheet when merged cells were filled, naming the columns and rows."""
    if not cells.filled:
        return ()
    parts = [f"{table.header[place]!r} {row_ranges(rows)}"
             for place, rows in sorted(cells.filled.items())]
    first = min(min(rows) for rows in cells.filled.values())
    reason = ("merged cells: each merged block's value is read in every row it covers ("
              + "; ".join(parts) + ")")
    return (Problem(table.source, first, None, None, "", reason, "note"),)


def _table_from_cells(source: str, columns: list[list[object]]) -> Table:
    """A table from each column's cells, row 1 (the names) first."""
    if not columns or not columns[0]:
        raise SourceError(f"{source}: the sheet is empty",
                          hint="the first row should name the columns, e.g. label,start,end")
    first_row = tuple(column[0] for column in columns)
    if not any(map(cell_text, first_row)):
        raise SourceError(f"{source}: row 1 is empty; it should name the columns",
                          hint="put the column names (e.g. label, start, end) in the first row")
    return Table(source, _header_names(first_row), tuple(column[1:] for column in columns))


def _header_names(cells: tuple[object, ...]) -> tuple[str, ...]:
    """Column names from row 1: blanks become `column N`; a repeated name gets ` (2)`, ` (3)`."""
    names: list[str] = []
    for number, cell in enumerate(cells, start=1):
        name = cell_text(cell) or f"column {number}"
        repeat = 2
        base = name
        while name in names:
            name = f"{base} ({repeat})"
            repeat += 1
        names.append(name)
    return tuple(names)


def cell_text(value: object) -> str:
    """A cell as the text a user would read in it: dates in ISO form, whole numbers bare,
    an UnreadableCell as the spreadsheet shows it ("" for a formula with no saved value)."""
    if type(value) is str:
        return value.strip()
    if isinstance(value, datetime):
        if value.time() == datetime.min.time():
            return value.date().isoformat()
        return value.isoformat(sep=" ")
    if isinstance(value, date):
        return value.isoformat()
    if isinstance(value, float) and value.is_integer():
        return str(int(value))
    return "" if value is None else str(value).strip()
