"""A whole column at once: each distinct cell read once, a plain ISO column read in bulk.

`parse_column(values)` gives, for each cell, what `endpoint_from_cell` gives (an Endpoint, or
None for an empty cell) or the DateError it raises; `parse_span_column` does the same with
`span_from_cell`. Real columns repeat a lot (a thousand rows, forty distinct decades), so the
results are shared objects, one per distinct value; the `_coded` forms give them as they are
made, each distinct result once and a numpy array of each cell's index into them.

A column whose cells are all `YYYY-MM-DD` strings (or empty) is read by numpy's ISO 8601 day
parser, which is proleptic Gregorian and refuses days that do not exist, as the language does;
its results are the distinct days as one array (`DayEndpoints`), no object per day. A column
with anything else, or with one impossible day, takes the general path, which gives each bad
cell its own error.
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Callable, Iterable, Sequence

import numpy as np

from ..calendar import fixed_from_gregorian
from ..errors import DateError
from ..model import Endpoint, Qualifier, Span
from .built import days as day_endpoints
from .cells import endpoint_from_cell, span_from_cell
from .covering import covering, without_circa
from .ranges import RUNNING_ON_WORDS, running_on
from .settings import DEFAULT_SETTINGS, DateSettings

Result = Endpoint | Span | DateError | None

# numpy counts datetime64[D] days from 1970-01-01; R.D. counts from 0001-01-01 = 1.
_UNIX_EPOCH = fixed_from_gregorian(1970, 1, 1)
_ISO_DAY_LENGTH = 10
OPEN_CELL = ".."   # ISO 8601-2's sign for the open end of an interval


def parse_column(values: Iterable[object], settings: DateSettings = DEFAULT_SETTINGS, *,
                 open_cell: Endpoint | None = None) -> list[Endpoint | DateError | None]:
    """The endpoint (or None, or the DateError) of each cell of a start or end column.

    `open_cell`: what a cell holding only ISO 8601-2's open-end sign `..` gives. Only the
    column says which side is open, so the caller decides; without it `..` is not a date.
    With an open end, a cell holding only `present`, `now`, `today` or `ongoing` runs on
    (ranges.running_on); with an open start such a cell is refused."""
    return parse_column_coded(values, settings, open_cell=open_cell).expanded()


def parse_column_coded(values: Iterable[object], settings: DateSettings = DEFAULT_SETTINGS, *,
                       open_cell: Endpoint | None = None) -> "Coded":
    """What `parse_column` gives, as codes: each distinct value's result once, and for each
    cell the index of its own (a plain ISO column's days come from one array)."""
    values = values if isinstance(values, list) else list(values)
    days = _iso_days(values)
    if days is not None:
        return days
    if open_cell is None:
        return _each_distinct_once(values, endpoint_from_cell, settings)

    def endpoint_or_open(value: object, settings: DateSettings) -> Endpoint | None:
        if type(value) is str:
            if value.strip() == OPEN_CELL:
                return open_cell
            if value.strip().lower() in RUNNING_ON_WORDS:
                return _running_on_cell(value, open_cell, settings)
        return endpoint_from_cell(value, settings)

    return _each_distinct_once(values, endpoint_or_open, settings)


@dataclass(frozen=True, slots=True)
class Coded:
    """A column read once per distinct value: `results` holds each distinct value's result
    (shared objects), `codes` each cell's index into it."""

    codes: np.ndarray
    results: list

    def expanded(self) -> list:
        """The result of each cell, in cell order."""
        return list(map(list(self.results).__getitem__, self.codes.tolist()))


def _running_on_cell(value: str, open_cell: Endpoint, settings: DateSettings) -> Endpoint:
    """`present` alone in an end cell: the span runs on (ranges.running_on); in a start cell it
    is refused, since what is still going on cannot begin at the present."""
    if open_cell.has(Qualifier.OPEN_END):
        return running_on(value.strip(), settings)
    raise DateError(value, f"{value.strip()!r} can end a span (it runs on to the present), "
                           "not start one", hint="leave the start empty when it is not known, "
                           "or write .. when the span runs on into the past")


def parse_span_column(values: Iterable[object],
                      settings: DateSettings = DEFAULT_SETTINGS) -> list[Span | DateError | None]:
    """The span (or None, or the DateError) of each cell of a single date column (a `when`
    column): a range as written, a single value as covering dates (covering.py) unless the
    single-value setting is `moment`."""
    return parse_span_column_coded(values, settings).expanded()


def parse_span_column_coded(values: Iterable[object],
                            settings: DateSettings = DEFAULT_SETTINGS) -> Coded:
    """What `parse_span_column` gives, as codes (`Coded`)."""
    values = values if isinstance(values, list) else list(values)
    if settings.single_value == "moment":
        return _each_distinct_once(values, span_from_cell, settings)
    return _each_distinct_once(values, covering_span_from_cell, settings)


def covering_span_from_cell(value: object,
                            settings: DateSettings = DEFAULT_SETTINGS) -> Span | None:
    """span_from_cell with a single value read as covering its whole unit."""
    span = span_from_cell(value, settings)
    if span is None:
        return None
    return covering(span, lambda: span_from_cell(value, without_circa(settings)), settings)


def _each_distinct_once(values: list[object], parse: Callable[[object, DateSettings], Result],
                        settings: DateSettings) -> Coded:
    distinct = dict.fromkeys(values)
    if not all(type(value) is str for value in distinct):
        # 1650, 1650.0 and True are equal dict keys: cells of other types are told apart
        values = list(map(_key, values))
        distinct = dict.fromkeys(values)
    place = dict(zip(distinct, range(len(distinct))))
    codes = np.fromiter(map(place.__getitem__, values), dtype=np.intp, count=len(values))
    results: list[Result] = []
    for key in place:
        value = key if type(key) is str else key[1]
        try:
            results.append(parse(value, settings))
        except DateError as error:
            results.append(error)
    return Coded(codes, results)


def _key(value: object) -> object:
    # 1650, 1650.0 and True are equal dict keys; keep cells of different types apart.
    return value if type(value) is str else (type(value), value)


def _iso_days(values: Sequence[object]) -> Coded | None:
    """Every cell as its day when all are `YYYY-MM-DD` strings or empty (None, as on the
    general path), with at least one day; None otherwise."""
    if not values:
        return None
    try:
        lengths = np.fromiter(map(len, values), dtype=np.intp, count=len(values))
        blank = lengths == 0
        if not ((lengths == _ISO_DAY_LENGTH) | blank).all() or blank.all() or (
                not min(filter(None, values))[0].isdigit()):
            return None  # a cell of another length, or a sign (+/- sort before digits)
    except TypeError:
        return None      # a cell that is not a string
    try:
        parsed = np.array(values, dtype="datetime64[D]")
    except (ValueError, TypeError, OverflowError):
        return None
    if (np.isnat(parsed) != blank).any():
        return None      # 'NaT' and the like: not a date
    days = parsed[~blank].astype(np.int64) + _UNIX_EPOCH if blank.any() else (
        parsed.astype(np.int64) + _UNIX_EPOCH)
    return _shared_days(days, blank if blank.any() else None)


def _shared_days(days: np.ndarray, blank: np.ndarray | None) -> Coded:
    """The distinct days as one array, each cell coded by its day's rank; the blank cells
    (where `blank`, when given) by the code after the last day's."""
    low = int(days.min())
    offsets = days - low
    present = np.zeros(int(offsets.max()) + 1, dtype=bool)
    present[offsets] = True
    distinct = np.flatnonzero(present)
    rank = np.cumsum(present, dtype=np.intp) - 1     # of each day among the distinct ones
    if blank is None:
        return Coded(rank[offsets], DayEndpoints(distinct + low, blank=False))
    codes = np.full(len(blank), len(distinct), dtype=np.intp)
    codes[~blank] = rank[offsets]
    return Coded(codes, DayEndpoints(distinct + low, blank=True))


class DayEndpoints(Sequence):
    """The results of a column of plain days: `Endpoint.day` of each of `days` (fixed days,
    an int array), then None where the column has blank cells (`blank`). The Endpoints are
    made only when something asks for one (the reader works on `days` alone)."""

    __slots__ = ("days", "blank", "_made")

    def __init__(self, days: np.ndarray, *, blank: bool) -> None:
        self.days, self.blank = days, blank
        self._made: list[Endpoint | None] | None = None

    def __len__(self) -> int:
        return len(self.days) + self.blank

    def __getitem__(self, index):
        return self._endpoints()[index]

    def __iter__(self):
        return iter(self._endpoints())

    def _endpoints(self) -> list[Endpoint | None]:
        if self._made is None:
            self._made = [*day_endpoints(self.days.tolist()), *([None] if self.blank else [])]
        return self._made

    def as_floats(self) -> np.ndarray:
        """Each result's day as a float, NaN for the blank cells' None."""
        return np.append(self.days.astype(float), [np.nan] if self.blank else [])
