"""Rows into Records and Problems: every non-blank row is drawn, listed as undated, or
reported with its row, column, text and reason. Each distinct cell value is parsed once."""
from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Callable

from ..dates import DateError, endpoint_from_cell, span_from_cell
from ..dates.settings import DEFAULT_SETTINGS, DateSettings
from ..errors import UsageError
from ..model import Endpoint, Provenance, Qualifier, Record, Span
from .columns import ColumnMap, detect_columns, existing_column, column_parts
from .tables import Table, cell_text, read_table

_UNKNOWN_START = Endpoint.open(Qualifier.UNKNOWN_START)
_UNKNOWN_END = Endpoint.open(Qualifier.UNKNOWN_END)
_OPEN_START = Endpoint.open(Qualifier.OPEN_START)
_OPEN_END = Endpoint.open(Qualifier.OPEN_END)
# ISO 8601-2 writes an open end of an interval as "..". Alone in a start or end cell it means
# the same; only the column says which side is open, so it is read here, not by the parser.
OPEN_CELL = ".."
_OPEN = object()  # the cached reading of an OPEN_CELL, made into a side by the row reader



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
                  for part, name in column_parts(columns)}
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
    return index[existing_column(header, name, part)]


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
