"""Rows into Records and Problems: every non-blank row is drawn, listed as undated, or
reported with its row, column, text and reason. Each distinct cell value is parsed once, and
no cell, whatever it holds, stops the rest of the table (guarded.py).

With `events`, each row dates one moment (a wreck, a find, a letter), not a span: the start
and end columns are its not-before and not-after, and a `when` cell's whole reading (`1st
century BC`, `1650–1660`) is the window of one moment (`model.event_endpoint`)."""
from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from ..columnar import RecordColumns
from ..dates import DateError, parse_column, parse_span_column
from ..dates.column import Coded, parse_column_coded, parse_span_column_coded
from ..dates.built import checked_span
from ..dates.settings import DEFAULT_SETTINGS, DateSettings
from ..errors import UsageError
from ..model import (
    EVENT, SPAN, Endpoint, Qualifier, Record, Span, collection_paused, event_endpoint,
)
from .conventions import hundreds_notes
from .days import DateOutcome, DayOutcomes, day_outcomes, of_days
from .columns import ColumnMap, detect_columns, existing_column, column_parts
from .guarded import each_value_guarded, internal_error, parsed_column, unknown_value_notes
from .problems import Problem
from .serials import DATE_NUMBERS, date_column_values
from .sheets import UnreadableCell
from .tables import Table, cell_text, read_table

_UNKNOWN_START = Endpoint.open(Qualifier.UNKNOWN_START)
_UNKNOWN_END = Endpoint.open(Qualifier.UNKNOWN_END)
_OPEN_START = Endpoint.open(Qualifier.OPEN_START)
_OPEN_END = Endpoint.open(Qualifier.OPEN_END)
# ISO 8601-2 writes an open end of an interval as "..". Alone in a start or end cell (OPEN_CELL)
# it means the same; only the column says which side is open, so this module tells the parser.

@dataclass(frozen=True, slots=True)
class LoadResult:
    records: Sequence[Record]            # a RecordColumns as read; a tuple where given
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
    return LoadResult(records, (*notes, *problems), len(offsets))


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


def _start_end_outcomes(cells: list[list[object]], layout: _Layout, settings: DateSettings,
                        sheet: bool) -> Coded:
    """Each row's outcome, as codes: each distinct pair of start and end readings is made
    into a span (or failures) once."""
    count = len(cells[0])
    starts = _side(cells, layout.start, _OPEN_START, settings, sheet, count)
    ends = _side(cells, layout.end, _OPEN_END, settings, sheet, count)
    if not layout.events and of_days(starts) and of_days(ends):
        return day_outcomes(starts, ends, layout.end)
    width = len(ends.results)
    pairs, codes = np.unique(starts.codes.astype(np.int64) * width + ends.codes,
                             return_inverse=True)
    outcomes = [_guarded_outcome(starts.results[pair // width], ends.results[pair % width],
                                 layout) for pair in pairs.tolist()]
    return Coded(codes.reshape(-1), outcomes)


def _side(cells: list[list[object]], place: int | None, open_side: Endpoint,
          settings: DateSettings, sheet: bool, count: int) -> Coded:
    if place is None:
        return Coded(np.zeros(count, dtype=np.intp), [None])
    return _guarded_coded(parse_column_coded, parse_column, cells[place], settings, sheet,
                          open_cell=open_side)


def _guarded_coded(coded: Callable[..., Coded], each: Callable[..., list],
                   values: list[object], settings: DateSettings, sheet: bool,
                   **options: object) -> Coded:
    """`coded(values, settings, **options)`; where a fault of ours stops it, each value read
    on its own, and in a spreadsheet with cells that have no value to read, the column as
    `guarded.parsed_column` reads it; both coded by the results' identity (rare paths)."""
    if not (sheet and UnreadableCell in set(map(type, values))):
        try:
            return coded(values, settings, **options)
        except Exception:  # noqa: BLE001 - a fault of ours in some cell: found cell by cell
            return _by_identity(each_value_guarded(each, values, settings, **options))
    return _by_identity(parsed_column(each, values, settings, from_spreadsheet=sheet,
                                      **options))


def _by_identity(results: list) -> Coded:
    """Results that are shared objects, coded by which object each is."""
    place: dict[int, int] = {}
    distinct = []
    for result in results:
        if id(result) not in place:
            place[id(result)] = len(distinct)
            distinct.append(result)
    codes = np.fromiter(map(place.__getitem__, map(id, results)), dtype=np.intp,
                        count=len(results))
    return Coded(codes, distinct)


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
    if start.earliest is None and start.latest is None and end.earliest is None and (
            end.latest is None):
        return None   # `..` and nothing known: no day to draw from (undated, said so)
    if end.latest is not None and start.earliest is not None and end.latest < start.earliest:
        return [(layout.end, None)]   # a contradiction: the end wholly before the start
    if layout.events:
        return Span.point(event_endpoint(start, end))
    return checked_span(start, end)   # in order: checked just above


def _as_events(outcomes: Coded) -> Coded:
    """Each span read from a when cell as one moment in its whole window."""
    return Coded(outcomes.codes, [
        Span.point(event_endpoint(outcome.start, outcome.end)) if type(outcome) is Span
        else outcome for outcome in outcomes.results])


def _when_outcomes(cells: list[object], place: int, settings: DateSettings,
                   sheet: bool) -> Coded:
    spans = _guarded_coded(parse_span_column_coded, parse_span_column, cells, settings, sheet)
    return Coded(spans.codes, [[(place, span)] if isinstance(span, DateError) else span
                               for span in spans.results])


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

    def or_none(self, place: int | None) -> list[str | None] | None:
        """The texts of column `place`, None for an empty cell; None for a part not in use."""
        found = self.of(place)
        return None if found is None else [text or None for text in found]


def _records(source: str, layout: _Layout, texts: _Texts, numbers: list[int],
             outcomes: Coded) -> RecordColumns:
    """The Records of the rows whose dates were read (dated or undated), as columns."""
    if isinstance(outcomes.results, DayOutcomes):
        failed, spans = outcomes.results.failed(), outcomes.results.spans
    else:
        failed = np.fromiter((type(outcome) is list for outcome in outcomes.results),
                             dtype=bool, count=len(outcomes.results))
        spans = [None if type(outcome) is list else outcome for outcome in outcomes.results]
    ids = texts.or_none(layout.id)
    labels = texts.of(layout.label)
    labels = list(labels) if labels is not None else [""] * texts.count
    for index in [index for index, label in enumerate(labels) if not label]:
        labels[index] = (ids[index] if ids is not None else None) or f"row {numbers[index]}"
    if layout.when is None:
        start_texts, end_texts = texts.of(layout.start), texts.of(layout.end)
    else:
        start_texts, end_texts = texts.of(layout.when), None
    table = RecordColumns(
        source=source, columns=layout.columns.used(), spans=spans, span_of=outcomes.codes,
        rows=np.array(numbers, dtype=np.int64), labels=labels, start_texts=start_texts,
        end_texts=end_texts, ids=ids, groups=texts.or_none(layout.group),
        colors=texts.or_none(layout.color),
        fields=tuple((name, texts.of(place)) for place, name in layout.other),
        kind=EVENT if layout.events else SPAN)
    kept = failed[outcomes.codes]
    return table.take(np.flatnonzero(~kept)) if kept.any() else table


def _problems(source: str, layout: _Layout, texts: _Texts, numbers: list[int],
             outcomes: Coded) -> list[Problem]:
    """The problems of the rows, in row order: unreadable cells, contradictions, no date."""
    if isinstance(outcomes.results, DayOutcomes):
        reported = outcomes.results.reported()
    else:
        reported = np.fromiter((type(outcome) is not Span for outcome in outcomes.results),
                               dtype=bool, count=len(outcomes.results))
    problems: list[Problem] = []
    for index in np.flatnonzero(reported[outcomes.codes]).tolist():
        outcome = outcomes.results[outcomes.codes[index]]
        if outcome is None:
            problems.append(_undated(source, numbers[index], layout, texts, index))
        else:
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
