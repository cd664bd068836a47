"""Tables in, Records out: read a CSV/TSV/XLSX/ODS file, find its columns, parse every date cell.

Three steps, each usable alone:

- `read_table(path, sheet=None)` gives the raw cells. CSV-like files are read as text, exactly
  as written (`0043` stays `0043`, `1650` never becomes `1650.0`); spreadsheet cells keep their
  types (a real date arrives as a `datetime`, a year as an `int`). Empty cells are `""`.
- `detect_columns(header, given)` fills the roles the user did not name (start, end, when,
  label, group, color, id) from common header names.
- `load_records(table, columns, settings)` turns rows into `Record`s and `Problem`s. Every
  non-blank row ends as a Record (drawn, or undated and listed) or as a Problem (not drawn):
  no row is lost. Every cell error of every row is collected, not just the first.

Rows are numbered as a spreadsheet program numbers them: the header is row 1, so the first
data row is row 2. This is the only module of the project that imports pandas.
"""
from __future__ import annotations

import difflib
import io
import re
from dataclasses import dataclass, fields
from datetime import date, datetime
from pathlib import Path
from typing import Callable, Iterable

import pandas as pd

from .dates import DateError, endpoint_from_cell, span_from_cell
from .dates.settings import DEFAULT_SETTINGS, DateSettings
from .errors import SourceError, UsageError
from .model import Endpoint, Provenance, Qualifier, Record, Span

TEXT_FORMATS = {".csv": ",", ".tsv": "\t", ".tab": "\t", ".txt": None}  # None: from the header
SPREADSHEET_ENGINES = {".xlsx": "openpyxl", ".xlsm": "openpyxl", ".ods": "odf"}
READABLE = ", ".join([*TEXT_FORMATS, *SPREADSHEET_ENGINES])
_DELIMITERS = ("\t", ";", ",", "|")  # tried in this order when a header line must decide

_UNKNOWN_START = Endpoint.open(Qualifier.UNKNOWN_START)
_UNKNOWN_END = Endpoint.open(Qualifier.UNKNOWN_END)
_OPEN_START = Endpoint.open(Qualifier.OPEN_START)
_OPEN_END = Endpoint.open(Qualifier.OPEN_END)
# ISO 8601-2 writes an open end of an interval as "..". Alone in a start or end cell it means
# the same; only the column says which side is open, so it is read here, not by the parser.
OPEN_CELL = ".."
_OPEN = object()  # the cached reading of an OPEN_CELL, made into a side by the row reader


# ---------------------------------------------------------------------------------------------
# Reading a file into a Table

@dataclass(frozen=True, slots=True)
class Table:
    """Raw cells of one sheet: `rows[i]` is spreadsheet row i + 2, as long as the header."""

    source: str                          # the file name, for messages
    header: tuple[str, ...]
    rows: tuple[tuple[object, ...], ...]


def read_table(path: str | Path, sheet: str | int | None = None, *,
               encoding: str = "utf-8") -> Table:
    """Read a table file; its format follows the extension (see READABLE).

    `sheet` picks a spreadsheet's sheet by name, or by its place counted from 1 when it is a
    number that is not also a sheet's name. Text files are UTF-8 (a byte-order mark is
    dropped; a UTF-16 mark is honoured) unless `encoding` says otherwise."""
    path = Path(path)
    suffix = path.suffix.lower()
    if suffix not in TEXT_FORMATS and suffix not in SPREADSHEET_ENGINES:
        raise SourceError(f"{path.name}: cannot read files of type {suffix or '(none)'!r}",
                          hint=f"save it as one of {READABLE}")
    if not path.is_file():
        raise SourceError(f"{path}: no such file" if not path.exists() else f"{path}: not a file",
                          hint="check the path and the spelling of the file name")
    if suffix in SPREADSHEET_ENGINES:
        cells = _spreadsheet_cells(path, SPREADSHEET_ENGINES[suffix], sheet)
    elif sheet is not None:
        raise UsageError(f"{path.name} is a text file and has no sheets",
                         hint="a sheet can be chosen only in an .xlsx, .xlsm or .ods file")
    else:
        cells = _text_cells(path, TEXT_FORMATS[suffix], encoding)
    return _table_from_cells(path.name, cells)


def _text_cells(path: Path, delimiter: str | None, encoding: str) -> list[tuple[object, ...]]:
    text = _decoded_text(path, encoding)
    if not text.strip():
        raise SourceError(f"{path.name}: the file is empty",
                          hint="the first row should name the columns, e.g. label,start,end")
    first_line = text.split("\n", 1)[0]
    delimiter = _delimiter_from_header(first_line, delimiter)
    try:
        # dtype=object keeps every cell the str it was, with no type guessing at all.
        frame = pd.read_csv(io.StringIO(text), sep=delimiter, header=None, dtype=object,
                            keep_default_na=False, na_filter=False, skip_blank_lines=False,
                            engine="c")
    except pd.errors.ParserError as error:
        raise SourceError(f"{path.name}: {_plain_parser_message(error)}",
                          hint="every line should have as many cells as the header") from error
    return _frame_rows(frame)


def _frame_rows(frame: pd.DataFrame) -> list[tuple[object, ...]]:
    # Column lists zipped into rows: several times faster than DataFrame.to_numpy().tolist().
    return list(zip(*(frame[column].tolist() for column in frame.columns)))


def _decoded_text(path: Path, encoding: str) -> str:
    raw = path.read_bytes()
    if raw.startswith((b"\xff\xfe", b"\xfe\xff")):
        encoding = "utf-16"  # a spreadsheet's "Unicode text" export announces itself this way
    elif encoding.lower().replace("-", "").replace("_", "") == "utf8":
        encoding = "utf-8-sig"  # drops the byte-order mark Excel puts before "CSV UTF-8"
    try:
        return raw.decode(encoding)
    except UnicodeDecodeError as error:
        line = raw[:error.start].count(b"\n") + 1
        raise SourceError(
            f"{path.name}: line {line} is not {encoding.removesuffix('-sig')} text "
            f"(byte 0x{raw[error.start]:02x})",
            hint="save the file as UTF-8 (in a spreadsheet program: 'CSV UTF-8')") from error


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


def _spreadsheet_cells(path: Path, engine: str,
                       sheet: str | int | None) -> list[tuple[object, ...]]:
    try:
        book = pd.ExcelFile(path, engine=engine)
    except Exception as error:  # a damaged or mislabelled file: many libraries, many errors
        raise SourceError(f"{path.name}: cannot open it as a spreadsheet ({error})",
                          hint="open it in a spreadsheet program and save it again") from error
    with book:
        name = _sheet_name(path.name, book.sheet_names, sheet)
        frame = pd.read_excel(book, sheet_name=name, header=None, dtype=object, na_filter=False)
    return [tuple(map(_spreadsheet_value, row)) for row in _frame_rows(frame)]


def _sheet_name(file_name: str, names: list[str], wanted: str | int | None) -> str:
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
    raise SourceError(f"{file_name}: no sheet {wanted!r}; the sheets are {listed}",
                      hint=_did_you_mean(wanted, names) or "a sheet number counts from 1")


def _spreadsheet_value(value: object) -> object:
    """A spreadsheet cell as plain Python: pandas Timestamps become datetimes, NaN becomes ''."""
    if isinstance(value, pd.Timestamp):
        return value.to_pydatetime()
    if isinstance(value, float) and value != value:
        return ""
    if value is None:
        return ""
    return value


def _table_from_cells(source: str, cells: list[tuple[object, ...]]) -> Table:
    if not cells:
        raise SourceError(f"{source}: the sheet is empty",
                          hint="the first row should name the columns, e.g. label,start,end")
    if not any(map(cell_text, cells[0])):
        raise SourceError(f"{source}: row 1 is empty; it should name the columns",
                          hint="put the column names (e.g. label, start, end) in the first row")
    return Table(source, _header_names(cells[0]), tuple(cells[1:]))


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
    """A cell as the text a user would read in it: dates in ISO form, whole numbers bare."""
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


# ---------------------------------------------------------------------------------------------
# Finding the columns

@dataclass(frozen=True, slots=True)
class ColumnMap:
    """Which column plays which part; None: not used (or, for `detect_columns`, not given)."""

    start: str | None = None
    end: str | None = None
    when: str | None = None              # one column holding each date or range
    label: str | None = None
    group: str | None = None
    color: str | None = None
    id: str | None = None

    def used(self) -> tuple[str, ...]:
        """The columns in use, in field order."""
        return tuple(name for name in (getattr(self, f.name) for f in fields(self)) if name)


# Header names recognised for each part, compared without case, spaces or punctuation,
# in order of preference. Common practice, no source.
COLUMN_NAMES: dict[str, tuple[str, ...]] = {
    "start": ("start", "start date", "begin", "begin date", "beginning", "from", "date from",
              "start year", "born", "birth", "date of birth"),
    "end": ("end", "end date", "until", "to", "date to", "end year", "died", "death",
            "date of death"),
    "when": ("when", "date", "dates", "period", "year"),
    "label": ("label", "name", "title", "event"),
    "group": ("group", "category", "type"),
    "color": ("color", "colour"),
    "id": ("id", "identifier", "ref", "reference", "no", "number"),
}


def detect_columns(header: Iterable[str], given: ColumnMap = ColumnMap()) -> ColumnMap:
    """Complete `given` from the header: named columns are checked, omitted ones looked up.

    Start and end take precedence: `when` is looked up only if neither a start nor an end
    column was named or found. Raises UsageError for a named column that does not exist (with
    a "did you mean"), for `when` named together with start or end, and when no date column
    can be found."""
    header = tuple(header)
    if given.when and (given.start or given.end):
        raise UsageError("a 'when' column cannot be combined with start or end columns",
                         hint="use --when for one column holding each date or range, "
                              "or --start/--end for two columns")
    chosen = {part: _existing_column(header, name, part)
              for part, name in _parts(given) if name is not None}
    date_parts = ("when",) if given.when else ("start", "end", "when")
    for part in ("label", "group", "color", "id", *date_parts):
        if part == "when" and (chosen.get("start") or chosen.get("end")):
            break  # start and end found: a "Date" column stays an ordinary field
        chosen.setdefault(part, _known_column(header, part, set(chosen.values())))
    if not (chosen.get("start") or chosen.get("end") or chosen.get("when")):
        listed = ", ".join(repr(name) for name in header)
        raise UsageError(f"no date column found among {listed}",
                         hint="name them with --start and --end (a start and an end column) "
                              "or --when (one column holding each date or range)")
    return ColumnMap(**chosen)


def _parts(columns: ColumnMap) -> list[tuple[str, str | None]]:
    return [(f.name, getattr(columns, f.name)) for f in fields(columns)]


def _existing_column(header: tuple[str, ...], name: str, part: str) -> str:
    """The header's spelling of a column the user named: exact, else without case or spaces."""
    if name in header:
        return name
    matches = [column for column in header if _folded(column) == _folded(name)]
    if len(matches) == 1:
        return matches[0]
    listed = ", ".join(repr(column) for column in header)
    raise UsageError(f"no column {name!r} (given for {part}); the columns are {listed}",
                     hint=_did_you_mean(name, header))


def _known_column(header: tuple[str, ...], part: str, taken: set[str | None]) -> str | None:
    by_folded_name: dict[str, str] = {}
    for column in header:
        if column not in taken:
            by_folded_name.setdefault(_folded(column), column)
    for candidate in COLUMN_NAMES[part]:
        column = by_folded_name.get(_folded(candidate))
        if column is not None:
            return column
    return None


def _folded(name: str) -> str:
    # "Start date", "start_date" and "StartDate" name the same column.
    return "".join(character for character in name.casefold() if character.isalnum())


def _did_you_mean(name: str, choices: Iterable[str]) -> str | None:
    choices = list(choices)
    by_folded = {choice.casefold(): choice for choice in choices}
    close = difflib.get_close_matches(name.casefold(), list(by_folded), n=3, cutoff=0.6)
    if not close:
        return None
    return "did you mean " + " or ".join(repr(by_folded[match]) for match in close) + "?"


# ---------------------------------------------------------------------------------------------
# Rows into Records

PROBLEM_KINDS = ("error", "undated", "contradiction")


@dataclass(frozen=True, slots=True)
class Problem:
    """Something to report about one row (or one cell of it).

    kind "error": a cell could not be read; "contradiction": the end lies wholly before the
    start. Both keep the row off the chart. kind "undated": the row has no date at all; it is
    a Record with no span, listed in a note under the chart."""

    source: str
    row: int
    column: str | None
    id: str | None
    text: str
    reason: str
    kind: str = "error"
    hint: str | None = None

    def __post_init__(self) -> None:
        if self.kind not in PROBLEM_KINDS:
            raise ValueError(f"kind must be one of {', '.join(PROBLEM_KINDS)}, not {self.kind!r}")

    def location(self) -> str:
        return ":".join(str(part) for part in (self.source, self.row, self.column)
                        if part is not None)

    def __str__(self) -> str:
        who = f" [{self.id}]" if self.id else ""
        if self.kind == "error":
            message = f"cannot read {self.text!r}: {self.reason}"
        elif self.kind == "undated":
            message = f"no date: {self.reason}"
        else:
            message = self.reason
        if self.hint:
            message += f" ({self.hint})"
        return f"{self.location()}:{who} {message}"


@dataclass(frozen=True, slots=True)
class LoadResult:
    records: tuple[Record, ...]
    problems: tuple[Problem, ...]
    rows_read: int                       # non-blank data rows; wholly blank rows are skipped


@dataclass(frozen=True, slots=True)
class _Layout:
    """Where each part sits in a row: column indexes, None when the part is not used."""

    columns: ColumnMap
    header: tuple[str, ...]
    start: int | None
    end: int | None
    when: int | None
    label: int | None
    group: int | None
    color: int | None
    id: int | None
    other: tuple[tuple[int, str], ...]   # (index, name) of the columns kept as fields

    @classmethod
    def of(cls, header: tuple[str, ...], columns: ColumnMap) -> "_Layout":
        index = {name: place for place, name in reversed(list(enumerate(header)))}
        places = {part: _existing_index(header, index, name, part)
                  for part, name in _parts(columns)}
        if places["start"] is None and places["end"] is None and places["when"] is None:
            raise UsageError("no date column given",
                             hint="name one with start/end (--start/--end) or when (--when)")
        two_columns = places["start"] is not None or places["end"] is not None
        if places["when"] is not None and two_columns:
            raise UsageError("a 'when' column cannot be combined with start or end columns")
        used = set(places.values())
        other = tuple((place, name) for place, name in enumerate(header) if place not in used)
        return cls(columns, header, **places, other=other)


def _existing_index(header: tuple[str, ...], index: dict[str, int], name: str | None,
                    part: str) -> int | None:
    if name is None:
        return None
    return index[_existing_column(header, name, part)]


def load_records(table: Table, columns: ColumnMap,
                 settings: DateSettings = DEFAULT_SETTINGS) -> LoadResult:
    """Every non-blank row of `table` as a Record or a Problem, using `columns` as given.

    Each distinct cell value is parsed once: real columns repeat a lot."""
    layout = _Layout.of(table.header, columns)
    read_row = _row_reader(table.source, layout, settings)
    records: list[Record] = []
    problems: list[Problem] = []
    rows_read = 0
    width = len(table.header)
    for offset, row in enumerate(table.rows):
        if row.count("") == width:
            continue  # a wholly blank row holds no record; spreadsheets trail many
        rows_read += 1
        record, row_problems = read_row(row, offset + 2)
        if record is not None:
            records.append(record)
        problems.extend(row_problems)
    return LoadResult(tuple(records), tuple(problems), rows_read)


def read_records(path: str | Path, columns: ColumnMap = ColumnMap(),
                 settings: DateSettings = DEFAULT_SETTINGS, *, sheet: str | int | None = None,
                 encoding: str = "utf-8") -> LoadResult:
    """read_table, detect_columns and load_records in one call."""
    table = read_table(path, sheet, encoding=encoding)
    return load_records(table, detect_columns(table.header, columns), settings)


RowReader = Callable[[tuple[object, ...], int], tuple[Record | None, list[Problem]]]
DateOutcome = Span | None | list[tuple[int, DateError | None]]  # span, undated, or failures
_CONTRADICTION = "contradiction"


def _row_reader(source: str, layout: _Layout, settings: DateSettings) -> RowReader:
    """A function reading one row, holding the per-load caches of parsed cells and spans."""
    if layout.when is None:
        read_dates = _start_end_reader(layout, settings)
    else:
        read_dates = _when_reader(layout, settings)
    make_record = _record_maker(source, layout)

    def read_row(row: tuple[object, ...], number: int) -> tuple[Record | None, list[Problem]]:
        outcome = read_dates(row)
        if type(outcome) is list:
            return None, [_failure(source, number, layout, row, place, error)
                          for place, error in outcome]
        record = make_record(row, number, outcome)
        if outcome is None:
            return record, [_undated(source, number, layout, record.id)]
        return record, []

    return read_row


def _cached(parse: Callable[[object, DateSettings], object],
            settings: DateSettings) -> Callable[[object], object]:
    """`parse` with a memory: the result, or the DateError, for each distinct cell value."""
    results: dict[object, object] = {}

    def read(value: object) -> object:
        # 1650, 1650.0 and True are equal dict keys; keep cells of different types apart.
        key = value if type(value) is str else (type(value), value)
        try:
            return results[key]
        except KeyError:
            pass
        try:
            result = parse(value, settings)
        except DateError as error:
            result = error
        results[key] = result
        return result

    return read


def _endpoint_or_open(value: object, settings: DateSettings) -> object:
    if type(value) is str and value.strip() == OPEN_CELL:
        return _OPEN
    return endpoint_from_cell(value, settings)


def _start_end_reader(layout: _Layout, settings: DateSettings) -> Callable[[tuple], DateOutcome]:
    read_endpoint = _cached(_endpoint_or_open, settings)
    start_place, end_place = layout.start, layout.end
    spans: dict[tuple[int, int], Span | str] = {}

    def read_dates(row: tuple[object, ...]) -> DateOutcome:
        start = read_endpoint(row[start_place]) if start_place is not None else None
        end = read_endpoint(row[end_place]) if end_place is not None else None
        if start is _OPEN:
            start = _OPEN_START
        if end is _OPEN:
            end = _OPEN_END
        if isinstance(start, DateError) or isinstance(end, DateError):
            return [(place, error) for place, error in ((start_place, start), (end_place, end))
                    if isinstance(error, DateError)]
        if start is None and end is None:
            return None
        key = (id(start), id(end))  # cached results are shared objects: identity names them
        span = spans.get(key)
        if span is None:
            span = spans[key] = _span_or_contradiction(start, end)  # type: ignore[arg-type]
        if span is _CONTRADICTION:
            return [(end_place, None)]  # type: ignore[list-item]
        return span  # type: ignore[return-value]

    return read_dates


def _when_reader(layout: _Layout, settings: DateSettings) -> Callable[[tuple], DateOutcome]:
    read_span = _cached(span_from_cell, settings)
    place = layout.when

    def read_dates(row: tuple[object, ...]) -> DateOutcome:
        span = read_span(row[place])
        if isinstance(span, DateError):
            return [(place, span)]  # type: ignore[list-item]
        return span  # type: ignore[return-value]

    return read_dates


def _span_or_contradiction(start: Endpoint | None, end: Endpoint | None) -> Span | str:
    start = start or _UNKNOWN_START
    end = end or _UNKNOWN_END
    if end.latest is not None and start.earliest is not None and end.latest < start.earliest:
        return _CONTRADICTION
    return Span(start, end)


def _record_maker(source: str, layout: _Layout) -> Callable[[tuple, int, Span | None], Record]:
    """A function making the Record of a row whose dates were read."""
    columns = layout.columns.used()
    # Index -1 is the "" appended to each row's texts: the text of a part not in use.
    at = {part: -1 if place is None else place for part, place in (
        ("label", layout.label), ("id", layout.id), ("group", layout.group),
        ("color", layout.color), ("start", layout.start), ("end", layout.end))}
    if layout.when is not None:
        at["start"], at["end"] = layout.when, -1
    label_at, id_at, group_at, color_at, start_at, end_at = at.values()
    other = layout.other

    def make_record(row: tuple[object, ...], number: int, span: Span | None) -> Record:
        # One pass over the row, str cells stripped in place: this runs a million times.
        texts = [value.strip() if type(value) is str else cell_text(value) for value in row]
        texts.append("")
        identifier = texts[id_at] or None
        return Record(
            label=texts[label_at] or identifier or f"row {number}", span=span,
            provenance=Provenance(source, number, columns),
            start_text=texts[start_at], end_text=texts[end_at], id=identifier,
            group=texts[group_at] or None, color=texts[color_at] or None,
            fields=tuple([(name, texts[place]) for place, name in other]),
        )

    return make_record


def _text_of(place: int | None) -> Callable[[tuple], str]:
    if place is None:
        return lambda row: ""
    return lambda row: cell_text(row[place])


def _failure(source: str, number: int, layout: _Layout, row: tuple[object, ...],
             place: int, error: DateError | None) -> Problem:
    """The Problem of a cell that cannot be read (error) or of an end before its start (None)."""
    identifier = _text_of(layout.id)(row) or None
    text = cell_text(row[place])
    if error is not None:
        return Problem(source, number, layout.header[place], identifier, text, error.reason,
                       "error", error.hint)
    start = _text_of(layout.start)(row)
    reason = f"the end ({text!r}) lies wholly before the start ({start!r})"
    return Problem(source, number, layout.header[place], identifier, text, reason,
                   "contradiction")


def _undated(source: str, number: int, layout: _Layout, identifier: str | None) -> Problem:
    names = [repr(layout.header[place]) for place in (layout.start, layout.end, layout.when)
             if place is not None]
    if len(names) == 1:
        reason = f"the {names[0]} cell is empty"
    else:
        reason = f"the {' and '.join(names)} cells are empty"
    return Problem(source, number, None, identifier, "", reason, "undated")
