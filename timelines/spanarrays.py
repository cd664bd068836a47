"""Spans as arrays: what packing, drawing and checking ask of many spans at once.

`span_facts(spans)` gives, for each of some spans, the numbers and flags those stages read
(`SpanFacts`: the four bounds, open sides, points, qualifiers, precisions, calibrated
radiocarbon dates and likely days), as numpy
arrays. For spans held as objects it looks at each once; for `DaySpans` it reads them off
the arrays the spans are held in.

`DaySpans` are the spans of a table of plain ISO days (`1702-03-14` in a start and an end
column): each side one day or not known. A million such rows hold hundreds of thousands of
distinct pairs of days; they are kept as two arrays of days, and a `Span` object is made only
for a span something asks for (one that is drawn, or named in a warning).
"""
from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from operator import attrgetter

import numpy as np

from .model import Endpoint, Precision, Qualifier, Span

# The bounds of each span, as columns of `SpanFacts.bounds`.
EARLIEST_START, LATEST_START, EARLIEST_END, LATEST_END = range(4)
PRECISIONS = tuple(Precision)      # a precision's code is its index here; -1 for none
_NO_QUALIFIERS: frozenset = frozenset()
_UNKNOWN_START = Endpoint.open(Qualifier.UNKNOWN_START)
_UNKNOWN_END = Endpoint.open(Qualifier.UNKNOWN_END)


@dataclass(frozen=True, slots=True, eq=False)
class SpanFacts:
    """Facts of each of n spans (None, an undated row, has no bounds, nothing open and no
    qualifiers). `bounds`: n x 4 fixed days (the columns named at the top of the module),
    NaN where a side has no such bound. `start_qualifiers` and `end_qualifiers`: the index of
    each side's qualifiers in `qualifier_sets`; `start_precision` and `end_precision`: the
    index of each side's precision in `PRECISIONS`, -1 for none."""

    bounds: np.ndarray
    dated: np.ndarray
    open_start: np.ndarray
    open_end: np.ndarray
    point: np.ndarray                  # Span.is_point
    qualifier_sets: tuple[frozenset, ...]
    start_qualifiers: np.ndarray
    end_qualifiers: np.ndarray
    start_precision: np.ndarray
    end_precision: np.ndarray
    start_radiocarbon: np.ndarray      # the start's window is a calibrated 14C age's
    end_radiocarbon: np.ndarray
    likely: np.ndarray                 # a side has a most likely day

    def __len__(self) -> int:
        return len(self.dated)

    def take(self, indices: np.ndarray) -> "SpanFacts":
        """The facts of the spans at `indices`, in that order."""
        return SpanFacts(**{name: (getattr(self, name) if name == "qualifier_sets"
                                   else getattr(self, name)[indices])
                            for name in self.__slots__})

    def precision_in(self, precisions: frozenset[Precision]) -> np.ndarray:
        """Which spans have a side written in one of `precisions`."""
        codes = [PRECISIONS.index(precision) for precision in precisions]
        return np.isin(self.start_precision, codes) | np.isin(self.end_precision, codes)


def span_facts(spans: Sequence[Span | None]) -> SpanFacts:
    """The facts of each span (None for an undated row)."""
    if isinstance(spans, DaySpans):
        return spans.facts()
    count = len(spans)
    dated = np.fromiter((span is not None for span in spans), dtype=bool, count=count)
    filled = [span if span is not None else _NO_SPAN for span in spans]
    bounds = bounds_of(filled)
    starts, ends = list(map(_START, filled)), list(map(_END, filled))
    sets: dict[frozenset, int] = {}
    precisions = {None: -1, **{precision: code for code, precision in enumerate(PRECISIONS)}}

    def flags(endpoints: list[Endpoint], get) -> np.ndarray:
        return np.fromiter(map(get, endpoints), dtype=bool, count=count)

    def codes(values, dtype=np.intp) -> np.ndarray:
        return np.fromiter(values, dtype=dtype, count=count)

    return SpanFacts(
        bounds=bounds, dated=dated, open_start=flags(starts, _IS_OPEN),
        open_end=flags(ends, _IS_OPEN), point=_points(filled, bounds) & dated,
        start_qualifiers=codes(sets.setdefault(side.qualifiers, len(sets)) for side in starts),
        end_qualifiers=codes(sets.setdefault(side.qualifiers, len(sets)) for side in ends),
        qualifier_sets=tuple(sets),
        start_precision=codes(map(precisions.__getitem__, map(_PRECISION, starts)), np.int8),
        end_precision=codes(map(precisions.__getitem__, map(_PRECISION, ends)), np.int8),
        start_radiocarbon=codes((side.radiocarbon is not None for side in starts), bool),
        end_radiocarbon=codes((side.radiocarbon is not None for side in ends), bool),
        likely=codes((first.likely is not None or last.likely is not None
                      for first, last in zip(starts, ends)), bool))


def distinct_spans(spans: Iterable[Span]) -> tuple[list[Span], dict[int, int]]:
    """The distinct span objects of `spans` in order of first use, and the place of each
    among them by its id. Records read from one table share Span objects for equal cells,
    so what depends on the span alone is worked out once per distinct one (the callers keep
    the spans alive, so the ids stay theirs)."""
    spans = list(spans)
    by_id = dict(zip(map(id, spans), spans))
    return list(by_id.values()), dict(zip(by_id, range(len(by_id))))


def bounds_of(spans: Sequence[Span]) -> np.ndarray:
    """Each span's earliest and latest start and end as an n x 4 float array (the columns
    named at the top of the module); NaN where a side has no bound."""
    return np.array(list(map(_BOUNDS, spans)), dtype=float).reshape(-1, 4)


def _points(spans: list[Span], bounds: np.ndarray) -> np.ndarray:
    """Span.is_point of each span, asked only of those whose start and end have the same
    `bounds` (the others cannot be points)."""
    same = bounds[:, :2] == bounds[:, 2:]
    same |= np.isnan(bounds[:, :2]) & np.isnan(bounds[:, 2:])
    point = same.all(axis=1)
    for index in np.flatnonzero(point).tolist():
        point[index] = spans[index].is_point
    return point


class DaySpans(Sequence):
    """Spans each of whose sides is one day or not known, as two float arrays of fixed days
    (NaN: not known). Span i is `Span(Endpoint.day(s), Endpoint.day(e))` (one endpoint for
    both sides when s == e), an unknown side `Endpoint.open(UNKNOWN_START or UNKNOWN_END)`,
    and None when neither side is known; each made when first asked for."""

    __slots__ = ("starts", "ends", "_made")

    def __init__(self, starts: np.ndarray, ends: np.ndarray) -> None:
        self.starts = np.asarray(starts, dtype=float)
        self.ends = np.asarray(ends, dtype=float)
        if self.starts.shape != self.ends.shape or self.starts.ndim != 1:
            raise ValueError("starts and ends must be one-dimensional and of one length")
        if (self.ends < self.starts).any():
            raise ValueError("a span ends before it starts")
        self._made: dict[int, Span | None] = {}

    def __len__(self) -> int:
        return len(self.starts)

    def __getitem__(self, index):
        if isinstance(index, slice):
            return [self[i] for i in range(len(self))[index]]
        index = range(len(self))[index]             # IndexError as a list gives it
        made = self._made.get(index, self)
        if made is self:
            made = self._made[index] = self._make(self.starts[index], self.ends[index])
        return made

    @staticmethod
    def _make(start: float, end: float) -> Span | None:
        start_known, end_known = start == start, end == end       # NaN is not itself
        if start_known and end_known and start == end:
            return Span.point(Endpoint.day(int(start)))
        if not (start_known or end_known):
            return None
        return Span(Endpoint.day(int(start)) if start_known else _UNKNOWN_START,
                    Endpoint.day(int(end)) if end_known else _UNKNOWN_END)

    def __repr__(self) -> str:
        return f"<{len(self)} spans of days>"

    def take(self, indices: np.ndarray) -> "DaySpans":
        """The spans at `indices`, in that order."""
        return DaySpans(self.starts[indices], self.ends[indices])

    def facts(self) -> SpanFacts:
        starts, ends = self.starts, self.ends
        start_known, end_known = ~np.isnan(starts), ~np.isnan(ends)
        dated = start_known | end_known
        none = np.zeros(len(self), dtype=bool)
        day = PRECISIONS.index(Precision.DAY)
        return SpanFacts(
            bounds=np.column_stack((starts, starts, ends, ends)), dated=dated,
            open_start=none, open_end=none.copy(), point=starts == ends,
            qualifier_sets=(_NO_QUALIFIERS, _UNKNOWN_START.qualifiers, _UNKNOWN_END.qualifiers),
            start_qualifiers=np.where(dated & ~start_known, 1, 0),
            end_qualifiers=np.where(dated & ~end_known, 2, 0),
            start_precision=np.where(start_known, day, -1).astype(np.int8),
            end_precision=np.where(end_known, day, -1).astype(np.int8),
            start_radiocarbon=none.copy(), end_radiocarbon=none.copy(), likely=none.copy())


# None converts to NaN in a float array: the four bounds of a span in one call.
_BOUNDS = attrgetter("start.earliest", "start.latest", "end.earliest", "end.latest")
_START, _END = attrgetter("start"), attrgetter("end")
_IS_OPEN = attrgetter("is_open")
_PRECISION = attrgetter("precision")
_NO_SPAN = Span.point(Endpoint(None, None, None))   # stands in for an undated row's facts
