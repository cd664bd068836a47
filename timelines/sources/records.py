"""Rows into Records and Problems: every non-blank row is drawn, listed as undated, or
reported with its row, column, text and reason. Each distinct cell value is parsed once, and
no cell, whatever it holds, stops the rest of the table (guarded.py).

With `events`, each row dates one moment (a wreck, a find, a letter), not a span: the start
and end columns are its not-before and not-after, and a `when` cell's whole reading (`1st
century BC`, `1650–1660`) is the window of one moment (`model.event_endpoint`)."""
from __future__ import annotations

from collections.abc import Callable, Iterable
from dataclasses import dataclass
from itertools import repeat
from pathlib import Path

import numpy as np

from ..dates import DateError, parse_column, parse_span_column
from ..dates.built import checked_span
from ..dates.settings import DEFAULT_SETTINGS, DateSettings
from ..errors import UsageError
from ..model import (
    EVENT, SPAN, Endpoint, Provenance, Qualifier, Record, Span, collection_paused,
    event_endpoint, many,
)
from .conventions import hundreds_notes
from .columns import ColumnMap, detect_columns, existing_column, column_parts
from .guarded import internal_error, parsed_column, unknown_value_notes
from .problems import Problem
from .serials import DATE_NUMBERS, date_column_values
from .tables import Table, cell_text, read_table

_UNKNOWN_START = Endpoint.open(Qualifier.UNKNOWN_START)
_UNKNOWN_END = Endpoint.open(Qualifier.UNKNOWN_END)
_OPEN_START = Endpoint.open(Qualifier.OPEN_START)
_OPEN_END = Endpoint.open(Qualifier.OPEN_END)
# ISO 8601-2 writes an open end of an interval as "..". Alone in a start or end cell (OPEN_CELL)
# it means the same; only the column says which side is open, so this module tells the parser.

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
    events: bool = False                 # each row one moment: start = not-before, end = not-after

    @property
    def date_places(self) -> set[int]:
        return {place for place in (self.start, self.end, self.when) if place is not None}

    @classmethod
    def of(cls, header: tuple[str, ...], columns: ColumnMap, events: bool = False
           ) -> "_Layout":
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
        return cls(columns, header, **places, other=other, events=events)


def _existing_index(header: tuple[str, ...], index: dict[str, int], name: str | None,
                    part: str) -> int | None:
    if name is None:
        return None
    return index[existing_column(header, name, part)]


def load_records(table: Table, columns: ColumnMap,
                 settings: DateSettings = DEFAULT_SETTINGS, *,
                 date_numbers: str = "years", events: bool = False) -> LoadResult:
    """Every non-blank row of `table` as a Record or a Problem, using `columns` as given.

    The table is read column by column: each distinct cell value of a date column is parsed
    once (real columns repeat a lot), and the Records are made from whole columns at once.
    `date_numbers`: how a spreadsheet's numbers in date columns are read, "years" or
    "serials" (see serials.py); the problems begin with the notes of reading the sheet.
    `events`: each row is one moment in a window, not a span (the module's docstring)."""
    if date_numbers not in DATE_NUMBERS:
        raise UsageError(f"date numbers are read as {' or '.join(DATE_NUMBERS)}, "
                         f"not {date_numbers!r}")
    layout = _Layout.of(table.header, columns, events)
    with collection_paused():
        return _load(table, layout, settings, date_numbers)


def _load(table: Table, layout: _Layout, settings: DateSettings,
          date_numbers: str) -> LoadResult:
    offsets = _filled_rows(table.columns)
    cells = list(table.columns)
    if len(offsets) < table.row_count:
        cells = [[column[offset] for offset in offsets] for column in cells]
    numbers = [offset + table.first_row for offset in offsets]
    for place in layout.date_places:
        cells[place] = date_column_values(cells[place], table.date_system, date_numbers)
    sheet = table.date_system is not None        # only a spreadsheet has UnreadableCells
    if layout.when is None:
        outcomes = _start_end_outcomes(cells, layout, settings, sheet)
    else:
        outcomes = _when_outcomes(cells[layout.when], layout.when, settings, sheet)
        outcomes = _as_events(outcomes) if layout.events else outcomes
    texts = _Texts(cells, layout)
    records = _records(table.source, layout, texts, numbers, outcomes)
    problems = _problems(table.source, layout, texts, numbers, outcomes)
    notes = [*table.notes, *unknown_value_notes(table, cells, numbers, layout.date_places),
             *hundreds_notes(table.source, layout.header, cells, numbers, layout.date_places,
                             settings)]
    return LoadResult(tuple(records), (*notes, *problems), len(offsets))


def _filled_rows(columns: tuple[list[object], ...]) -> list[int]:
    """Offsets of the rows holding anything: spreadsheets trail many wholly blank rows."""
    filled = np.zeros(len(columns[0]) if columns else 0, dtype=bool)
    for column in columns:
        filled |= np.array(column, dtype=object) != ""
    return np.flatnonzero(filled).tolist()


def read_records(path: str | Path, columns: ColumnMap = ColumnMap(),
                 settings: DateSettings = DEFAULT_SETTINGS, *, sheet: str | int | None = None,
                 encoding: str = "utf-8", date_numbers: str = "years",
                 events: bool = False) -> LoadResult:
    """read_table, detect_columns and load_records in one call."""
    table = read_table(path, sheet, encoding=encoding)
    return load_records(table, detect_columns(table.header, columns), settings,
                        date_numbers=date_numbers, events=events)


DateOutcome = Span | None | list[tuple[int, DateError | None]]  # span, undated, or failures


def _start_end_outcomes(cells: list[list[object]], layout: _Layout, settings: DateSettings,
                        sheet: bool) -> list[DateOutcome]:
    starts = _side(cells, layout.start, _OPEN_START, settings, sheet)
    ends = _side(cells, layout.end, _OPEN_END, settings, sheet)
    # Parsed cells are shared objects, one per distinct value, kept alive by the two lists:
    # identity names them, so each distinct pair is made into a span once.
    pairs = list(zip(map(id, starts), map(id, ends)))
    found = {pair: _guarded_outcome(starts[row], ends[row], layout)
             for pair, row in dict(zip(pairs, range(len(pairs)))).items()}
    return list(map(found.__getitem__, pairs))


def _side(cells: list[list[object]], place: int | None, open_side: Endpoint,
          settings: DateSettings, sheet: bool) -> list[Endpoint | DateError | None]:
    if place is None:
        return [None] * len(cells[0])
    return parsed_column(parse_column, cells[place], settings, from_spreadsheet=sheet,
                         open_cell=open_side)


def _guarded_outcome(start: Endpoint | DateError | None, end: Endpoint | DateError | None,
                     layout: _Layout) -> DateOutcome:
    """The span of a row from its two endpoints; a fault of ours is the end cell's problem
    (the start's, with no end column)."""
    try:
        return _outcome(start, end, layout)
    except Exception as error:  # noqa: BLE001 - reported as the row's problem
        place = layout.end if layout.end is not None else layout.start
        return [(place, internal_error("", error))]   # the Problem quotes the cell's text


def _outcome(start: Endpoint | DateError | None, end: Endpoint | DateError | None,
             layout: _Layout) -> DateOutcome:
    if isinstance(start, DateError) or isinstance(end, DateError):
        return [(place, error) for place, error in ((layout.start, start), (layout.end, end))
                if isinstance(error, DateError)]
    if start is None and end is None:
        return None
    start = start or _UNKNOWN_START
    end = end or _UNKNOWN_END
    if end.latest is not None and start.earliest is not None and end.latest < start.earliest:
        return [(layout.end, None)]   # a contradiction: the end wholly before the start
    if layout.events:
        return Span.point(event_endpoint(start, end))
    return checked_span(start, end)   # in order: checked just above


def _as_events(outcomes: list[DateOutcome]) -> list[DateOutcome]:
    """Each span read from a when cell as one moment in its whole window; equal cells share
    a span, so each distinct one is made once."""
    made: dict[int, DateOutcome] = {}

    def moment(outcome: DateOutcome) -> DateOutcome:
        if type(outcome) is not Span:
            return outcome
        found = made.get(id(outcome))
        if found is None:
            found = made[id(outcome)] = Span.point(event_endpoint(outcome.start, outcome.end))
        return found

    return list(map(moment, outcomes))


def _when_outcomes(cells: list[object], place: int, settings: DateSettings,
                   sheet: bool) -> list[DateOutcome]:
    failures: dict[int, DateOutcome] = {}

    def outcome(span: Span | DateError | None) -> DateOutcome:
        if isinstance(span, DateError):
            return failures.setdefault(id(span), [(place, span)])
        return span

    return list(map(outcome, parsed_column(parse_span_column, cells, settings,
                                           from_spreadsheet=sheet)))


def _texts(cells: list[object]) -> list[str]:
    if set(map(type, cells)) <= {str}:
        return list(map(str.strip, cells))   # a text file's cells: the common case
    return [value.strip() if type(value) is str else cell_text(value) for value in cells]


class _Texts:
    """The text of each used column's cells as a user reads them, made once per column."""

    def __init__(self, cells: list[list[object]], layout: _Layout) -> None:
        self._cells = cells
        self._made: dict[int, list[str]] = {}
        self.count = len(cells[0]) if cells else 0
        self.layout = layout

    def of(self, place: int | None) -> list[str] | None:
        """The texts of column `place`; None for a part not in use."""
        if place is None:
            return None
        if place not in self._made:
            self._made[place] = _texts(self._cells[place])
        return self._made[place]

    def at(self, place: int | None, index: int) -> str:
        """The text of one cell; "" for a part not in use."""
        found = self.of(place)
        return "" if found is None else found[index]

    def or_empty(self, place: int | None) -> Iterable[str]:
        found = self.of(place)
        return repeat("", self.count) if found is None else found

    def or_none(self, place: int | None) -> Iterable[str | None]:
        found = self.of(place)
        return repeat(None, self.count) if found is None else [text or None for text in found]


def _records(source: str, layout: _Layout, texts: _Texts, numbers: list[int],
             outcomes: list[DateOutcome]) -> list[Record]:
    """The Records of the rows whose dates were read (dated or undated), from whole columns."""
    kept = [index for index, outcome in enumerate(outcomes) if type(outcome) is not list]
    pick = _picker(kept, len(outcomes))
    ids = pick(texts.or_none(layout.id))
    rows = pick(numbers)
    labels = [label or identifier or f"row {row}" for label, identifier, row
              in zip(pick(texts.or_empty(layout.label)), ids, rows)]
    if layout.when is None:
        start_texts, end_texts = texts.or_empty(layout.start), texts.or_empty(layout.end)
    else:
        start_texts, end_texts = texts.or_empty(layout.when), texts.or_empty(None)
    count = len(kept)
    provenances = many(Provenance, count, source=repeat(source), row=rows,
                       columns=repeat(layout.columns.used()))
    return many(Record, count, label=labels, span=pick(outcomes), provenance=provenances,
                start_text=pick(start_texts), end_text=pick(end_texts), id=ids,
                group=pick(texts.or_none(layout.group)), color=pick(texts.or_none(layout.color)),
                fields=pick(_fields(texts, layout.other)),
                kind=repeat(EVENT if layout.events else SPAN))


def _picker(kept: list[int], count: int) -> Callable[[Iterable], list]:
    """Selects the kept rows' values from a column (all of it when every row is kept)."""

    def pick(column: Iterable) -> list:
        values = column if isinstance(column, list) else list(column)
        return values if len(kept) == count else [values[index] for index in kept]

    return pick


def _fields(texts: _Texts, other: tuple[tuple[int, str], ...]) -> Iterable[tuple]:
    """Each row's (name, text) pairs of the columns kept as fields; equal rows share them."""
    if not other:
        return repeat((), texts.count)
    names = [name for _, name in other]
    values = list(zip(*(texts.of(place) for place, _ in other)))
    shared = {row: tuple(zip(names, row)) for row in set(values)}
    return list(map(shared.__getitem__, values))


def _problems(source: str, layout: _Layout, texts: _Texts, numbers: list[int],
              outcomes: list[DateOutcome]) -> list[Problem]:
    """The problems of the rows, in row order: unreadable cells, contradictions, no date."""
    problems: list[Problem] = []
    for index, outcome in enumerate(outcomes):
        if outcome is None:
            problems.append(_undated(source, numbers[index], layout, texts, index))
        elif type(outcome) is list:
            problems.extend(_failure(source, numbers[index], layout, texts, index, place, error)
                            for place, error in outcome)
    return problems


def _failure(source: str, number: int, layout: _Layout, texts: _Texts, index: int,
             place: int, error: DateError | None) -> Problem:
    """The Problem of a cell that cannot be read (error) or of an end before its start (None)."""
    identifier = _identifier(texts, index)
    text = texts.at(place, index)
    if error is not None:
        text = text or error.text   # a cell that shows nothing: a formula with no saved value
        return Problem(source, number, layout.header[place], identifier, text, error.reason,
                       "error", error.hint)
    start = texts.at(layout.start, index)
    if layout.events:
        reason = f"the not-after ({text!r}) lies before the not-before ({start!r})"
    else:
        reason = f"the end ({text!r}) lies wholly before the start ({start!r})"
    return Problem(source, number, layout.header[place], identifier, text, reason,
                   "contradiction")


def _identifier(texts: "_Texts", index: int) -> str | None:
    return texts.at(texts.layout.id, index) or None


def _undated(source: str, number: int, layout: _Layout, texts: "_Texts",
             index: int) -> Problem:
    places = [place for place in (layout.start, layout.end, layout.when) if place is not None]
    names = [repr(layout.header[place]) for place in places]
    written = [texts.at(place, index).strip() for place in places]
    if any(written):
        # n.d., sans date, o. J.: the cell says there is no date, in so many words.
        said = ", ".join(repr(text) for text in written if text)
        cells = f"the {names[0]} cell says" if len(names) == 1 else \
            f"the {' and '.join(names)} cells say"
        reason = f"{cells} there is no date ({said})"
    elif len(names) == 1:
        reason = f"the {names[0]} cell is empty"
    else:
        reason = f"the {' and '.join(names)} cells are empty"
    identifier = _identifier(texts, index)
    return Problem(source, number, None, identifier, "", reason, "undated")
