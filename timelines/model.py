"""The data model: frozen endpoints, spans and records, all in integer fixed day numbers.

An `Endpoint` is a window `[earliest, latest]` of fixed days in which a start or an end fell;
`None` on a side means no bound there. A `Span` is a start and an end endpoint; from it follow
the *possible extent* (where the span may reach) and the *certain core* (where it surely was).
A `Record` is one row of the user's table: a label, a span (or none: undated), its original
text, its grouping fields, where it came from, and what kind of thing it dates: a **span**
(a life, a reign: the whole interval was occupied) or an **event** (a wreck, a find, a letter:
one moment somewhere in its window, a point whose window runs from the not-before to the
not-after; `event_endpoint`).
"""
from __future__ import annotations

import dataclasses
import gc
from collections import deque
from collections.abc import Iterable, Iterator
from contextlib import contextmanager
from dataclasses import MISSING, dataclass, field
from enum import StrEnum
from functools import lru_cache
from itertools import repeat
from typing import TypeVar

from .calendar import fixed_from_gregorian, iso_from_fixed


class Precision(StrEnum):
    DAY = "day"
    MONTH = "month"
    SEASON = "season"
    YEAR = "year"
    DECADE = "decade"
    CENTURY = "century"
    MILLENNIUM = "millennium"
    DEEP_TIME = "deep time"


class Qualifier(StrEnum):
    """Qualifiers in ISO 8601-2 terms, plus the bound words historians use."""

    APPROXIMATE = "approximate"      # ~, c., ca., circa
    UNCERTAIN = "uncertain"          # ?
    UNSPECIFIED = "unspecified"      # X digits
    BEFORE = "before"                # before 1700, ../1700 in a set
    AFTER = "after"
    ONE_OF = "one_of"                # [1667,1668]
    ALL_OF = "all_of"                # {1667,1668}
    OPEN_START = "open_start"        # ../1760: no bound, the span runs on into the past
    OPEN_END = "open_end"            # 1760/..: the span runs on
    UNKNOWN_START = "unknown_start"  # /1760 or an empty cell: the start is not known
    UNKNOWN_END = "unknown_end"
    CONVENTION_DEPENDENT = "convention_dependent"  # a documented setting decided the bounds
    DURATION_BOUND = "duration_bound"  # the user's longest plausible duration set this bound


_OPEN_SIDES = frozenset({Qualifier.OPEN_START, Qualifier.OPEN_END})
# ISO 8601-2 signs (§ 8, qualification of a date): both qualifiers make "%", not "~?".
_SIGNS = {frozenset({Qualifier.APPROXIMATE, Qualifier.UNCERTAIN}): "%",
          frozenset({Qualifier.APPROXIMATE}): "~", frozenset({Qualifier.UNCERTAIN}): "?"}
_WORDED = frozenset({Qualifier.BEFORE, Qualifier.AFTER, Qualifier.OPEN_START,
                     Qualifier.OPEN_END, Qualifier.UNKNOWN_START, Qualifier.UNKNOWN_END})
_UNKNOWN_SIDES = frozenset({Qualifier.UNKNOWN_START, Qualifier.UNKNOWN_END})


@dataclass(frozen=True, slots=True)
class Radiocarbon:
    """A radiocarbon determination as measured, `age` ± `error` 14C years BP, with the
    calibration curve it is read with ("intcal20", "shcal20") and its laboratory code if
    written; and what calibration made of it (dates/c14.py): the probability of each calendar
    year from the astronomical year `first_year` on (`density`, summing to 1), the
    highest-density `ranges` per level ((level, ((first year, last year, probability), ...)),
    oldest first), the `median_year` and the curve's `citation`. Two are equal when the
    measurement and the curve are."""

    age: float
    error: float
    curve: str = "intcal20"
    lab: str | None = None
    first_year: int = field(default=0, compare=False)
    density: tuple[float, ...] = field(default=(), compare=False, repr=False)
    ranges: tuple[tuple[float, tuple[tuple[int, int, float], ...]], ...] = field(
        default=(), compare=False, repr=False)
    median_year: int = field(default=0, compare=False)
    citation: str = field(default="", compare=False, repr=False)

    def __str__(self) -> str:
        lab = f"{self.lab}: " if self.lab else ""
        return f"{lab}{self.age:g} ± {self.error:g} 14C BP"

    def yearly(self) -> tuple[list[int], tuple[float, ...]]:
        """(the middle day of each year of `density`, proleptic Gregorian; its probability)."""
        years = range(self.first_year, self.first_year + len(self.density))
        return [fixed_from_gregorian(year, 7, 2) for year in years], self.density


@dataclass(frozen=True, slots=True)
class Endpoint:
    """When a start or an end fell: somewhere in the window `earliest..latest` of fixed day
    numbers (None: no bound on that side), both days included; `likely` the most likely day
    if known; `precision` the unit the date was written in; `qualifiers` what else was said
    (approximate, uncertain, before, open, ...). Prints as ISO dates with ISO 8601-2 signs:
    `1645-01-01..1655-12-31 ~`."""

    earliest: int | None
    latest: int | None
    precision: Precision | None = Precision.DAY
    qualifiers: frozenset[Qualifier] = frozenset()
    likely: int | None = None
    radiocarbon: Radiocarbon | None = None   # a calibrated 14C age: the window its 95.4% ranges

    def __post_init__(self) -> None:
        if self.earliest is not None and self.latest is not None and self.earliest > self.latest:
            raise ValueError(f"earliest {self.earliest} is after latest {self.latest}")
        if self.likely is not None:
            if (self.earliest is not None and self.likely < self.earliest) or (
                    self.latest is not None and self.likely > self.latest):
                raise ValueError(f"likely {self.likely} lies outside the window")

    @classmethod
    def day(cls, fixed: int) -> "Endpoint":
        return cls(fixed, fixed, Precision.DAY)

    @classmethod
    def open(cls, side: Qualifier) -> "Endpoint":
        """An endpoint with no bound at all: open (the span runs on) or unknown."""
        return cls(None, None, None, frozenset({side}))

    @property
    def is_exact(self) -> bool:
        return self.earliest is not None and self.earliest == self.latest

    @property
    def is_open(self) -> bool:
        return not self.qualifiers.isdisjoint(_OPEN_SIDES)

    @property
    def is_unknown(self) -> bool:
        return not self.qualifiers.isdisjoint(_UNKNOWN_SIDES)

    def has(self, qualifier: Qualifier) -> bool:
        return qualifier in self.qualifiers

    def __str__(self) -> str:
        """The window as ISO 8601 dates (`1645-01-01..1655-12-31`; `..` alone where it has no
        bound), then the ISO 8601-2 sign of its qualifiers (~ approximate, ? uncertain, %
        both) and the words of the rest (before, after, open, unknown)."""
        if self.earliest is not None and self.earliest == self.latest:
            window = iso_from_fixed(self.earliest)
        else:
            window = f"{_iso_or_open(self.earliest)}..{_iso_or_open(self.latest)}"
        marks = [_SIGNS[kind] for kind in _SIGNS if kind <= self.qualifiers]
        marks = marks[:1] + [str(q).replace("_", " ") for q in sorted(self.qualifiers)
                             if q in _WORDED]
        return " ".join([window, *marks])

    def __repr__(self) -> str:
        precision = f", {self.precision}" if self.precision else ""
        likely = f", likely {iso_from_fixed(self.likely)}" if self.likely is not None else ""
        return f"Endpoint({self}{precision}{likely})"


@dataclass(frozen=True, slots=True)
class Span:
    """A start and an end endpoint. A point is a span whose two endpoints are equal."""

    start: Endpoint
    end: Endpoint

    def __post_init__(self) -> None:
        if (self.end.latest is not None and self.start.earliest is not None
                and self.end.latest < self.start.earliest):
            raise ValueError("the end window lies wholly before the start window")

    @classmethod
    def point(cls, endpoint: Endpoint) -> "Span":
        return cls(endpoint, endpoint)

    def __str__(self) -> str:
        """A point as its one endpoint; a span as its two ends, `start / end`."""
        return str(self.start) if self.is_point else f"{self.start} / {self.end}"

    def __repr__(self) -> str:
        return f"Span({self})"

    @property
    def is_point(self) -> bool:
        return self.start is self.end or self.start == self.end

    @property
    def possible_extent(self) -> tuple[int | None, int | None]:
        """Earliest possible start .. latest possible end; None where unbounded."""
        return self.start.earliest, self.end.latest

    @property
    def certain_core(self) -> tuple[int | None, int | None] | None:
        """Latest possible start .. earliest possible end, the part certainly covered.

        An open start (the span runs on into the past) puts the core's start at -infinity
        (None); an unknown start leaves no certain part before the end. None when empty."""
        if self.start.is_open:
            low = None
        elif self.start.latest is None:
            return None
        else:
            low = self.start.latest
        if self.end.is_open:
            high = None
        elif self.end.earliest is None:
            return None
        else:
            high = self.end.earliest
        if low is not None and high is not None and low > high:
            return None
        return low, high


@dataclass(frozen=True, slots=True)
class Provenance:
    """Where a record came from: file, row as a spreadsheet numbers it (header = 1), columns."""

    source: str
    row: int
    columns: tuple[str, ...] = ()

    def __str__(self) -> str:
        return f"{self.source}:{self.row}"


@dataclass(frozen=True, slots=True)
class Record:
    """One row of the user's table: its label, its span (None: no usable date), where it
    came from, its date cells as written, its id, group, colour value and other cells, and
    its kind: "span", or "event" (one moment in a window, its span a point)."""

    label: str
    span: Span | None             # None: no usable date (undated)
    provenance: Provenance
    start_text: str = ""          # the original cell text, as the user wrote it
    end_text: str = ""
    id: str | None = None
    group: str | None = None
    color: str | None = None
    fields: tuple[tuple[str, str], ...] = field(default=())
    # SPAN or EVENT: what the row dates. Counts of activity weigh the two differently (an
    # event by the share of its window in a block, aoristically; a span by overlap), so
    # every output says which a table holds.
    kind: str = "span"

    @property
    def is_event(self) -> bool:
        return self.kind == EVENT

    @property
    def date_text(self) -> str:
        if self.end_text and self.end_text != self.start_text:
            start = self.start_text or "?"
            return f"{start} – {self.end_text}"
        return self.start_text


SPAN, EVENT = "span", "event"
RECORD_KINDS = (SPAN, EVENT)
# Of two bound cells, what an event keeps: its own qualifiers, not the sides' words (an
# event has no open end; a `before` belongs to the not-after, an `after` to the not-before).
_SIDE_WORDS = _OPEN_SIDES | _UNKNOWN_SIDES | {Qualifier.BEFORE, Qualifier.AFTER}
_PRECISIONS = tuple(Precision)


def event_endpoint(not_before: Endpoint | None, not_after: Endpoint | None) -> Endpoint:
    """The window of one moment bounded by two dates (terminus post quem and ante quem, in
    the archaeologists' words): from the not-before's earliest day to the not-after's latest.
    A missing or open side is unknown. A likely day is kept only where it is the moment's
    own (one endpoint for both bounds): a likely not-before is not a likely moment."""
    if not_before is not None and not_before is not_after and not not_before.is_open:
        return not_before
    earliest = None if not_before is None or not_before.is_open else not_before.earliest
    latest = None if not_after is None or not_after.is_open else not_after.latest
    precision, qualifiers = _event_terms(
        *((None, None) if not_before is None else (not_before.precision, not_before.qualifiers)),
        *((None, None) if not_after is None else (not_after.precision, not_after.qualifiers)),
        earliest is None, latest is None)
    return Endpoint(earliest, latest, precision, qualifiers)


@lru_cache(maxsize=1024)
def _event_terms(before_precision: Precision | None, before: frozenset | None,
                 after_precision: Precision | None, after: frozenset | None,
                 no_earliest: bool, no_latest: bool) -> tuple[Precision | None, frozenset]:
    """An event's precision (the coarser of its bounds') and qualifiers (the bounds' own,
    `after` from the not-before, `before` from the not-after, and the sides not known).
    Few distinct combinations occur, so each is worked out once (speed alone)."""
    qualifiers = set()
    for own, kept in ((before, Qualifier.AFTER), (after, Qualifier.BEFORE)):
        if own is not None:
            qualifiers |= (own - _SIDE_WORDS) | (own & {kept})
    qualifiers |= {Qualifier.UNKNOWN_START} if no_earliest else set()
    qualifiers |= {Qualifier.UNKNOWN_END} if no_latest else set()
    known = [p for p in (before_precision, after_precision) if p is not None]
    return max(known, key=_PRECISIONS.index, default=None), frozenset(qualifiers)


def holds(records: Iterable[Record]) -> str:
    """What dated records are: "events", "spans" (also for none), or "events and spans"."""
    kinds = {record.kind for record in records if record.span is not None}
    if kinds == {EVENT}:
        return "events"
    return "events and spans" if EVENT in kinds else "spans"


def counted(records: Iterable[Record]) -> str:
    """How many dated records, named by what they are: "3 events", "1 span", "5 records
    (2 events, 3 spans)", "1,000,000 spans"."""
    kinds = [record.kind for record in records if record.span is not None]
    events = kinds.count(EVENT)
    if events and events < len(kinds):
        return (f"{len(kinds):,} records ({_counted(events, EVENT)}, "
                f"{_counted(len(kinds) - events, SPAN)})")
    return _counted(len(kinds), EVENT if events else SPAN)


def _counted(number: int, kind: str) -> str:
    return f"{number} {kind}" if number == 1 else f"{number:,} {kind}s"


def _iso_or_open(day: int | None) -> str:
    return "" if day is None else iso_from_fixed(day)


# Many objects at once: frozen slot dataclass objects made from columns of their field values.
#
# A table of 200,000 rows becomes 200,000 Records, Provenances and placed records. Calling a
# frozen dataclass's `__init__` for each costs a Python call and an `object.__setattr__` per
# field; here each field is set for all objects in one C-level loop over the column, through
# the slot's own descriptor (which a frozen dataclass does not guard). For speed alone.
#
# Only for classes whose `__init__` does nothing but store its arguments, or for values the
# caller has already checked: `__post_init__` does not run. What comes out equals, hashes and
# prints like the same objects made the ordinary way (tests/test_bulk.py checks it).

T = TypeVar("T")

_CONSUME = deque(maxlen=0).extend   # runs a map for its effects, keeping nothing


def many(cls: type[T], count: int, **columns: Iterable[object]) -> list[T]:
    """`count` objects of the slot dataclass `cls`; field `name` of the i-th object is the
    i-th value of `columns[name]`, or the field's default when no column is given.

    Each column must hold at least `count` values (`itertools.repeat(value)` for one value
    shared by all). A field without a default must be given."""
    slots = dataclasses.fields(cls)
    unknown = set(columns) - {slot.name for slot in slots}
    if unknown:
        raise TypeError(f"{cls.__name__} has no field {', '.join(sorted(unknown))}")
    setters = []
    for slot in slots:
        if slot.name in columns:
            values = columns[slot.name]
        elif slot.default is not MISSING:
            values = repeat(slot.default)
        elif slot.default_factory is not MISSING:
            values = (slot.default_factory() for _ in range(count))
        else:
            raise TypeError(f"{cls.__name__} needs a column for its field {slot.name!r}")
        if hasattr(values, "__len__") and len(values) < count:
            raise ValueError(f"column {slot.name!r} holds {len(values)} values, not {count}")
        setters.append((getattr(cls, slot.name).__set__, values))
    with collection_paused():
        objects = list(map(object.__new__, repeat(cls, count)))
        for setter, values in setters:
            _CONSUME(map(setter, objects, values))
    return objects


@contextmanager
def collection_paused() -> Iterator[None]:
    """The cyclic garbage collector paused meanwhile, as it was afterwards.

    Reading a table makes a million objects that hold no cycles while a million cells are
    alive: the collector, set off by the allocations, would walk them all again and again
    for nothing (a third of the time of a large load). Reference counting frees as usual."""
    paused = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if paused:
            gc.enable()
