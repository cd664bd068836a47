"""What the XLSX and ODS readers share: cells that hold no readable value, the guards on size,
the choice of a sheet, and the assembly of streamed rows into columns with merged cells filled.

The readers stream a sheet row by row and keep only the rows that hold a value, so a sheet
whose stated size or styled range reaches the last cell costs nothing; what remains is
bounded here, with an error that names the size long before memory runs out."""
from __future__ import annotations

from dataclasses import dataclass, field
from zipfile import ZipFile, ZipInfo

from ..errors import SourceError, UsageError
from .columns import did_you_mean

# One XML part of a workbook may expand to this many bytes: about four million rows of five
# columns as Excel writes them (shared text, ~45 bytes a cell). Python's objects for the cells
# take a few times the XML's size, so this is where memory, not the table, would give out.
MAX_PART_BYTES = 1_000_000_000
# Tables of real values pack about 5 to 15 to 1 (measured on generated registers, shared and
# inline text); a part packed more than MAX_RATIO to 1 is mostly repetition, as in a zip bomb,
# and is refused from this size on.
MAX_RATIO = 100
MAX_PACKED_PART_BYTES = 100_000_000
# Rows x columns of the table from A1 to the last cell holding a value: 50 columns of a
# million rows. Beyond it the columns alone would take gigabytes.
MAX_CELLS = 50_000_000
# Excel's sheet: 1,048,576 rows by 16,384 columns (XFD); LibreOffice's since 7.4 is the same.
# From memory (Microsoft, "Excel specifications and limits").
MAX_COLUMNS = 16_384
TOO_LARGE_HINT = ("a table this large is unusual in a spreadsheet: delete the cells beyond the "
                  "table (Ctrl+End shows the last cell in use) or save it as CSV")


@dataclass(frozen=True, slots=True)
class UnreadableCell:
    """A spreadsheet cell with no value a date can be read from: a formula never calculated,
    an error such as #DIV/0!, a day that did not exist. In a date column it is that cell's
    error; elsewhere the cell reads as `shown` ("" when its value is unknown)."""

    text: str                  # what the cell holds, as a message quotes it
    reason: str
    shown: str = ""
    hint: str | None = None

    def __str__(self) -> str:
        return self.shown


def formula_without_value(formula: str) -> UnreadableCell:
    # A workbook written by a program and never opened in a spreadsheet program has formulas
    # whose result was never computed: the file holds no value for them.
    return UnreadableCell(formula, "a formula with no saved value",
                          hint="open and save the file in a spreadsheet program")


def error_value(shown: str) -> UnreadableCell:
    return UnreadableCell(shown, f"the spreadsheet shows the error {shown}, not a value", shown,
                          hint="correct the cell in the spreadsheet")


@dataclass(slots=True)
class SheetCells:
    """A sheet's rows as they stream in, only those holding a value kept, then its columns.

    `add_row(number, values, repeat)`: `values` from column A on ("" for an empty cell),
    standing for `repeat` equal rows from row `number` on. `merged` holds merged blocks as
    (first row, first column, last row, last column), counted from 1."""

    file_name: str
    sheet: str
    width: int = 0
    marked: set[int] = field(default_factory=set)     # columns holding an UnreadableCell
    merged: list[tuple[int, int, int, int]] = field(default_factory=list)
    filled: dict[int, list[int]] = field(default_factory=dict)   # column -> rows filled
    _rows: list[tuple[int, list[object], int]] = field(default_factory=list)

    def add_row(self, number: int, values: list[object], repeat: int = 1) -> None:
        while values and values[-1] == "":
            values.pop()
        if values:
            self._rows.append((number, values, repeat))
            self.width = max(self.width, len(values))

    @property
    def is_empty(self) -> bool:
        return not self._rows

    @property
    def last_row(self) -> int:
        number, _, repeat = max(self._rows, key=lambda row: row[0] + row[2])
        return number + repeat - 1

    def columns(self) -> list[list[object]]:
        """Each column's cells from row 1 to the last row holding a value, merged blocks
        filled down their first column (see fill_merged)."""
        rows = self.last_row
        if rows * self.width > MAX_CELLS:
            raise self._too_many_cells(rows)
        columns = [[""] * rows for _ in range(self.width)]
        for number, values, repeat in self._rows:
            for index in range(number - 1, number - 1 + repeat):
                for place, value in enumerate(values):
                    if value != "":
                        columns[place][index] = value
        self.filled = fill_merged(columns, self.merged)
        return columns

    def _too_many_cells(self, rows: int) -> SourceError:
        corner = f"{column_letters(self.width)}{rows}"
        return SourceError(
            f"{self.file_name}: the sheet {self.sheet!r} has values as far as cell {corner}: "
            f"{rows:,} rows by {self.width:,} columns, {rows * self.width:,} cells, more than "
            f"timelines reads ({MAX_CELLS:,})", hint=TOO_LARGE_HINT)


def fill_merged(columns: list[list[object]],
                merged: list[tuple[int, int, int, int]]) -> dict[int, list[int]]:
    """Fill each merged block's value down its first column; the rows filled, by column.

    A block merged down a column means "the same as above" (a group, a place, a year shared by
    several rows), so every row it covers takes its value, but only rows holding something
    else: a merged block that runs past the table adds no rows. Cells a block covers to the
    right stay empty, as the spreadsheet shows them; a block starting in row 1 (the names) is
    left alone."""
    if not merged:
        return {}
    rows = len(columns[0]) if columns else 0
    holding = [any(column[index] != "" for column in columns) for index in range(rows)]
    filled: dict[int, list[int]] = {}
    for first_row, first_column, last_row, _ in sorted(merged):
        if first_row < 2 or first_column > len(columns) or first_row > rows:
            continue
        column = columns[first_column - 1]
        value = column[first_row - 1]
        if value == "":
            continue
        for index in range(first_row, min(last_row, rows)):
            if column[index] == "" and holding[index]:
                column[index] = value
                filled.setdefault(first_column - 1, []).append(index + 1)
    return filled


def column_letters(number: int) -> str:
    """A column's letters as a spreadsheet names it: 1 -> A, 27 -> AA, 16384 -> XFD."""
    letters = ""
    while number > 0:
        number, remainder = divmod(number - 1, 26)
        letters = chr(ord("A") + remainder) + letters
    return letters


def checked_part(archive: ZipFile, name: str, file_name: str, what: str) -> ZipInfo:
    """The archive entry `name`, refused when it would expand beyond what a table needs.

    The sizes are those the archive declares; Python's zipfile stops at the declared size
    and fails on a longer stream (its CRC check), so they bound what is read."""
    info = archive.getinfo(name)
    packed = max(info.compress_size, 1)
    ratio = info.file_size / packed
    if info.file_size > MAX_PART_BYTES or (
            info.file_size > MAX_PACKED_PART_BYTES and ratio > MAX_RATIO):
        raise SourceError(
            f"{file_name}: {what} would expand from {size_text(packed)} in the file to "
            f"{size_text(info.file_size)} ({ratio:,.0f} to 1), more than timelines reads "
            f"({size_text(MAX_PART_BYTES)}; {size_text(MAX_PACKED_PART_BYTES)} when packed "
            f"more than {MAX_RATIO} to 1)", hint=TOO_LARGE_HINT)
    return info


def size_text(size: int) -> str:
    """A size in bytes as people say it, in decimal units: 4.7 kB, 2.1 GB."""
    for unit, scale in (("GB", 10 ** 9), ("MB", 10 ** 6), ("kB", 10 ** 3)):
        if size >= scale:
            return f"{size / scale:.1f} {unit}"
    return f"{size} bytes"


def sheet_name(file_name: str, names: list[str], wanted: str | int | None) -> str:
    """The sheet `wanted` names: by name, by name in any case, or by its place from 1."""
    if not names:
        raise SourceError(f"{file_name}: the spreadsheet has no sheets")
    if wanted is None:
        return names[0]
    wanted = str(wanted)
    if wanted in names:
        return wanted
    folded = [name for name in names if name.casefold() == wanted.casefold()]
    if len(folded) == 1:
        return folded[0]
    if wanted.isdigit() and 1 <= int(wanted) <= len(names):
        return names[int(wanted) - 1]
    listed = ", ".join(repr(name) for name in names)
    # the sheet is the user's option, not a fault of the file: a usage error
    raise UsageError(f"{file_name}: no sheet {wanted!r}; the sheets are {listed}",
                     hint=did_you_mean(wanted, names) or "a sheet number counts from 1")


SHEET_STATES = {True: "holds data", False: "empty", None: "too large to look into"}


def empty_sheet_error(file_name: str, chosen: str,
                      sheets: list[tuple[str, bool | None]]) -> SourceError:
    """The error for an empty sheet, naming every sheet and whether it holds data
    (None: not looked into, being over the size guard)."""
    listed = ", ".join(f"{name!r} ({SHEET_STATES[holds]})" for name, holds in sheets)
    with_data = [name for name, holds in sheets if holds]
    if with_data:
        hint = f"choose a sheet that holds data, e.g. --sheet {with_data[0]!r}"
    else:
        hint = "no sheet holds data: is this the file you meant?"
    return SourceError(f"{file_name}: the sheet {chosen!r} is empty; the sheets are {listed}",
                       hint=hint)
