"""pandas DataFrames and plain rows as tables, and dates as DataFrame columns.

- `table_from_data(data)`: a DataFrame, an iterable of rows (mappings of column name to cell)
  or an iterable of Records, as the reading steps take it;
- `read(data, ...)`: the caller's table as a DataFrame with, per date column, each cell's
  bounds (ISO text and fixed day numbers), precision, qualifiers and the reason a cell could not
  be read: the dates the chart would draw, for the caller's own analysis;
- `parse_series(series, ...)`: the same for one Series; `import timelines` registers it as the
  Series accessor `series.dates.parse()` (when pandas is loaded; `register_accessor()` else).

A DataFrame's cells keep their types, as a spreadsheet's do: a Timestamp is a date, a number
a year (or a day serial: see docs/dates.md), NaN, None, NaT and pd.NA are empty cells. Its rows
are numbered in messages as `iloc` counts them (row N is `frame.iloc[N]`; rows given as dicts
likewise from 0); `read` keeps the frame's own index.
"""
from __future__ import annotations

import sys
from collections.abc import Iterable, Mapping
from dataclasses import replace
from datetime import datetime

from ..calendar import iso_from_fixed
from ..dates import DEFAULT_SETTINGS, DateError, DateSettings, parse_column, parse_span_column
from ..errors import UsageError
from ..model import Endpoint, Qualifier, Record, Span
from .columns import ColumnMap, column_parts, detect_columns
from .records import LoadResult
from .tables import Table, _table_from_cells

FRAME_SOURCE = "DataFrame"
ROWS_SOURCE = "rows"
# The columns `read` adds for each date column, after its name and an underscore.
ENDPOINT_FIELDS = ("earliest", "latest", "earliest_day", "latest_day", "precision",
                   "qualifiers", "error")
SPAN_FIELDS = ("earliest", "latest", "earliest_day", "latest_day", "start_latest",
               "end_earliest", "precision", "qualifiers", "error")


def is_frame(data: object) -> bool:
    """Whether `data` is a pandas DataFrame (pandas is not imported to find out)."""
    pandas = sys.modules.get("pandas")
    return pandas is not None and isinstance(data, pandas.DataFrame)


def table_from_data(data: object) -> Table | LoadResult:
    """A Table of a DataFrame or of rows; the records themselves, unread, when `data` holds
    Records (a LoadResult with no problems)."""
    if isinstance(data, Table):
        return data
    if is_frame(data):
        return table_from_frame(data)
    if isinstance(data, (str, bytes, Mapping)) or not isinstance(data, Iterable):
        raise UsageError(f"cannot chart a {type(data).__name__}",
                         hint="give a file path, a pandas DataFrame, rows (dicts of column "
                              "name to cell) or Records")
    items = list(data)
    if items and all(isinstance(item, Record) for item in items):
        return LoadResult(tuple(items), (), len(items))
    return table_from_rows(items)


def table_from_frame(frame, source: str = FRAME_SOURCE) -> Table:
    """The cells of a DataFrame by column (by position: repeated names are kept apart)."""
    names = [str(name) for name in frame.columns]
    columns = [[name, *map(frame_cell, frame.iloc[:, place].tolist())]
               for place, name in enumerate(names)]
    if not columns:
        raise UsageError(f"the {source} has no columns")
    register_accessor()
    return replace(_table_from_cells(source, columns), first_row=0)


def table_from_rows(rows: list, source: str = ROWS_SOURCE) -> Table:
    """The cells of rows given as mappings of column name to cell; the columns in order of
    first appearance, a cell missing from a row empty."""
    if not rows:
        raise UsageError("no rows to chart")
    for number, row in enumerate(rows, start=2):
        if not isinstance(row, Mapping):
            raise UsageError(f"row {number - 2} is a {type(row).__name__}, not a mapping of "
                             "column name to cell", hint="give each row as a dict")
    names = list(dict.fromkeys(str(name) for row in rows for name in row))
    columns = [[name, *(frame_cell(row.get(name, "")) for row in rows)] for name in names]
    return replace(_table_from_cells(source, columns), first_row=0)


def frame_cell(value: object) -> object:
    """A DataFrame cell as a spreadsheet cell: Timestamps as datetimes (their own wall-clock
    time, a time zone dropped), numpy numbers as Python numbers, missing values as ''."""
    if value is None:
        return ""
    kind = type(value).__name__
    if kind in ("NaTType", "NAType"):
        return ""
    if isinstance(value, float) and value != value:
        return ""
    if kind == "Timestamp":
        value = value.to_pydatetime()
    if isinstance(value, datetime) and value.tzinfo is not None:
        return value.replace(tzinfo=None)
    if hasattr(value, "item") and type(value).__module__ == "numpy":
        return frame_cell(value.item())
    return value


# --- dates as DataFrame columns -------------------------------------------------------------

def read(data, *, start: str | None = None, end: str | None = None, when: str | None = None,
         settings: DateSettings = DEFAULT_SETTINGS, sheet: str | None = None,
         encoding: str | None = None):
    """The table as a DataFrame with the bounds of its dates beside each date column.

    `data` is a path, a DataFrame or rows; the date columns are `start`/`end` or `when` as
    given, or found by their names as the chart finds them. For a start or end column C, the
    columns `C_earliest`, `C_latest` (ISO 8601 dates, proleptic Gregorian, astronomical years),
    `C_earliest_day`, `C_latest_day` (fixed day numbers, R.D.), `C_precision`,
    `C_qualifiers` (comma-separated) and `C_error` (why the cell could not be read) follow C;
    for a `when` column also `C_start_latest` and `C_end_earliest`, the ends of the certain
    part (empty when there is none). An empty cell has empty bounds and no error. A text
    file is read in `encoding` when one is named, else as `read_table` decides (UTF-8, UTF-16
    by its mark, Windows-1252 for bytes that are not UTF-8)."""
    import pandas as pd

    from .tables import read_table

    register_accessor()
    table = read_table(data, sheet, encoding=encoding) if isinstance(data, (str, bytes)) or hasattr(
        data, "__fspath__") else table_from_data(data)
    if isinstance(table, LoadResult):
        raise UsageError("read() takes a table, not Records")
    frame = data.copy() if is_frame(data) else pd.DataFrame(
        dict(zip(table.header, table.columns)), columns=list(table.header))
    columns = detect_columns(table.header, ColumnMap(start=start, end=end, when=when))
    added = {}
    for part, name in column_parts(columns):
        if part not in ("start", "end", "when") or name is None:
            continue
        cells = table.columns[table.header.index(name)]
        added[name] = _span_columns(cells, settings) if part == "when" else _endpoint_columns(
            cells, settings, part)
    return _with_columns(frame, table.header, added, pd)


def parse_series(series, *, span: bool = False, settings: DateSettings = DEFAULT_SETTINGS):
    """One Series of date cells read into a DataFrame of bounds with the Series' index:
    columns `ENDPOINT_FIELDS` (each cell one window), or `SPAN_FIELDS` with `span` (each cell
    a start and an end: `1650-1660`, `19th century`)."""
    import pandas as pd

    cells = [frame_cell(value) for value in series.tolist()]
    columns = _span_columns(cells, settings) if span else _endpoint_columns(cells, settings)
    frame = pd.DataFrame(columns, index=series.index)
    return _typed(frame)


def _endpoint_columns(cells: list, settings: DateSettings, part: str = "start") -> dict:
    # ".." alone in a cell is an open end; only the column says which side.
    side = Qualifier.OPEN_START if part == "start" else Qualifier.OPEN_END
    results = parse_column(cells, settings, open_cell=Endpoint.open(side))
    rows = [_endpoint_row(result) for result in results]
    return {field: [row[i] for row in rows] for i, field in enumerate(ENDPOINT_FIELDS)}


def _endpoint_row(result: Endpoint | DateError | None) -> tuple:
    if isinstance(result, DateError):
        return (None,) * 6 + (result.reason,)
    if result is None:
        return (None,) * 6 + ("",)
    return (_iso(result.earliest), _iso(result.latest), result.earliest, result.latest,
            str(result.precision) if result.precision else None,
            ",".join(sorted(map(str, result.qualifiers))), "")


def _span_columns(cells: list, settings: DateSettings) -> dict:
    rows = [_span_row(result) for result in parse_span_column(cells, settings)]
    return {field: [row[i] for row in rows] for i, field in enumerate(SPAN_FIELDS)}


def _span_row(result: Span | DateError | None) -> tuple:
    if isinstance(result, DateError):
        return (None,) * 8 + (result.reason,)
    if result is None:
        return (None,) * 8 + ("",)
    low, high = result.possible_extent
    core = result.certain_core or (None, None)
    precisions = dict.fromkeys(str(e.precision) for e in (result.start, result.end)
                               if e.precision)
    qualifiers = sorted({str(q) for e in (result.start, result.end) for q in e.qualifiers})
    return (_iso(low), _iso(high), low, high, _iso(core[0]), _iso(core[1]),
            "/".join(precisions) or None, ",".join(qualifiers), "")


def _iso(day: int | None) -> str | None:
    return None if day is None else iso_from_fixed(day)


def _with_columns(frame, header: tuple[str, ...], added: dict[str, dict], pd):
    """`frame` with each date column's new columns right after it."""
    pieces = []
    for position, name in enumerate(header):
        pieces.append(frame.iloc[:, [position]])
        if name in added:
            new = pd.DataFrame({f"{name}_{field}": values
                                for field, values in added[name].items()}, index=frame.index)
            pieces.append(_typed(new))
    return pd.concat(pieces, axis=1)


def _typed(frame):
    """Day numbers as nullable integers (a date column may be partly empty)."""
    for column in frame.columns:
        if column.endswith("_day"):
            frame[column] = frame[column].astype("Int64")
    return frame


def register_accessor() -> None:
    """Register `series.dates` (pandas must be importable); done by `import timelines` when
    pandas is already loaded, and by `read`."""
    import pandas as pd

    if "dates" in getattr(pd.Series, "_accessors", set()):
        return

    @pd.api.extensions.register_series_accessor("dates")
    class DatesAccessor:
        """`series.dates.parse()`: each cell read into its bounds (see `parse_series`)."""

        def __init__(self, series):
            self._series = series

        def parse(self, *, span: bool = False, settings: DateSettings = DEFAULT_SETTINGS):
            return parse_series(self._series, span=span, settings=settings)
