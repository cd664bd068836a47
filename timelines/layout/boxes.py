"""What each record occupies in its lane, as arrays: its drawn bar, the room on it for its
label, and the box the label makes with it (`labels.label_boxes`), in days.

`BoxMeasure` asks the caller's `measure_spans` once for every distinct span object of a
placement (records read from one table share them) and the label width once per distinct
text; `boxes(records)` then gives a group's boxes. `each_span` makes a `measure_spans` from
functions of one span.
"""
from __future__ import annotations

import itertools
import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from operator import attrgetter

import numpy as np

from ..columnar import RecordColumns
from ..model import Record, Span
from ..spanarrays import distinct_spans
from .labels import LABEL_SIDES, label_boxes


@dataclass(frozen=True, slots=True)
class Boxes:
    """The boxes of a group's records, as arrays: where each box and bar lie (days) and the
    side of each label (an index into LABEL_SIDES)."""

    box_start: np.ndarray
    box_end: np.ndarray
    bar_start: np.ndarray
    bar_end: np.ndarray
    side: np.ndarray
    shown: list[str] | None = None     # a label shortened to fit ("" where it is whole)

    def box(self, index: int) -> tuple[float, float]:
        return float(self.box_start[index]), float(self.box_end[index])


SpanMeasure = Callable[[list[Span]], np.ndarray]


class BoxMeasure:
    """The caller's measures: every distinct span of a placement at once, each label text
    once, then each group's boxes from them."""

    __slots__ = ("domain", "label_width", "label_pad", "clearance", "mode", "widths",
                 "measured", "rows", "key_width", "keys", "label_widths", "coded")

    def __init__(self, domain: tuple[float, float], measure_spans: SpanMeasure,
                 label_width: Callable[[str], float], label_pad: float, clearance: float,
                 mode: str, parts: list[Sequence[Record]], key_width: float | None = None,
                 label_widths: Callable[[list[str]], np.ndarray] | None = None) -> None:
        """`parts`: the records of each group; `label_widths` measures many labels at once."""
        self.domain, self.label_pad, self.clearance, self.mode = domain, label_pad, clearance, mode
        self.key_width = key_width
        self.keys = itertools.count(1)      # the key numbers of labels shown by number
        self.label_width, self.label_widths = label_width, label_widths
        self.widths: dict[str, float] = {}
        first = parts[0] if parts else None
        self.coded = isinstance(first, RecordColumns) and all(map(first.same_table, parts))
        if self.coded:
            # A table as columns: its distinct spans referenced by the groups, each once.
            used = np.zeros(len(first.spans), dtype=bool)
            for part in parts:
                used[part.used_codes()] = True
            codes = np.flatnonzero(used)
            spans = first.spans_at(codes)
            self.rows = np.full(len(first.spans), -1, dtype=np.intp)
            self.rows[codes] = np.arange(len(codes))
        else:
            # Each distinct span object measured once; rows: the place of each one's measures.
            spans, self.rows = distinct_spans(span for part in parts for span in map(_SPAN, part))
        measured = np.asarray(measure_spans(spans), dtype=float)
        self.measured = measured.reshape(-1, 6 if measured.ndim == 2 and measured.shape[1] == 6
                                         else 4)

    def boxes(self, records: Sequence[Record]) -> Boxes:
        if self.coded:
            labels = records.column("labels")
            span_rows = self.rows[records.codes()]
        else:
            labels = list(map(_LABEL, records))
            span_rows = np.fromiter(map(self.rows.__getitem__, map(id, map(_SPAN, records))),
                                    dtype=np.intp, count=len(records))
        measured = self.measured[span_rows]
        bars, rooms = measured[:, :2], measured[:, 2:4]
        bodies = measured[:, 4:6] if measured.shape[1] == 6 else None
        found = label_boxes(labels, bars, self._widths(labels), self.domain,
                            self.label_pad, rooms, self.clearance, self.mode, self.key_width,
                            bodies)
        shown = self._shorten(labels, bars, found) if self.mode == "beside" else None
        return Boxes(found.start, found.end, bars[:, 0], bars[:, 1], found.side, shown)

    def _shorten(self, labels: list[str], bars: np.ndarray, found) -> list[str] | None:
        """Labels with no room whole beside their bars, shortened with an ellipsis where at
        least SHORTEST_SHOWN characters fit (right, else left): their boxes and sides are
        changed in place; the shortened texts are returned ("" for the rest)."""
        short = np.flatnonzero(np.isin(found.side, _NOT_BESIDE))
        if not len(short):
            return None
        shown = [""] * len(labels)
        low, high = self.domain
        for index in short.tolist():
            label, (start, end) = labels[index], bars[index]
            for side, room in ((_RIGHT, high - end - self.label_pad),
                               (_LEFT, start - self.label_pad - low)):
                text = self._fitting(label, room)
                if text:
                    width = self._width(text)
                    if side == _RIGHT:
                        found.end[index] = end + self.label_pad + width + self.clearance
                    else:
                        found.start[index] = start - self.label_pad - width - self.clearance
                    found.side[index], shown[index] = side, text
                    break
        return shown

    def _fitting(self, label: str, room: float) -> str | None:
        """The longest start of `label` with an ellipsis that is at most `room` wide, if it
        keeps SHORTEST_SHOWN characters (a shorter stub says less than a key number)."""
        if len(label.strip()) <= SHORTEST_SHOWN:
            return None
        low, high = SHORTEST_SHOWN, len(label) - 1
        if self._width(label[:low].rstrip() + "…") > room:
            return None
        while low < high:
            middle = (low + high + 1) // 2
            if self._width(label[:middle].rstrip() + "…") <= room:
                low = middle
            else:
                high = middle - 1
        return label[:low].rstrip() + "…"

    def _widths(self, labels: list[str]) -> np.ndarray:
        """Each label's width, each distinct text measured once."""
        distinct = dict.fromkeys(labels)
        texts = list(distinct)
        if self.label_widths is not None:
            widths = self.label_widths(texts)
        else:
            widths = np.array([self._width(text) for text in texts], dtype=float)
        if len(texts) == len(labels):
            return widths                           # every label its own: the usual case
        return widths[_codes(labels, distinct)]

    def _width(self, label: str) -> float:
        if label not in self.widths:
            self.widths[label] = self.label_width(label)
        return self.widths[label]


def each_span(drawn_extent: Callable[[Span], tuple[float, float]],
              inside_room: Callable[[Span], tuple[float, float] | None] | None = None
              ) -> SpanMeasure:
    """A `measure_spans` for `place` from functions of one span: its bar (start, end) in
    days, and the part of it a label may sit on (None: no room), the whole bar by default."""
    room = inside_room or drawn_extent

    def measure_spans(spans: list[Span]) -> np.ndarray:
        return np.array([(*drawn_extent(span), *(room(span) or _NO_ROOM)) for span in spans],
                        dtype=float).reshape(-1, 4)

    return measure_spans


def _codes(values: list, distinct: dict) -> np.ndarray:
    """The place of each value in `distinct` (in its order)."""
    place = dict(zip(distinct, range(len(distinct))))
    return np.fromiter(map(place.__getitem__, values), dtype=np.intp, count=len(values))


_NO_ROOM = (math.nan, math.nan)
# A label shortened below this many characters says less than a key number: it gets one.
# Common practice, no source.
SHORTEST_SHOWN = 10
_RIGHT, _LEFT = LABEL_SIDES.index("right"), LABEL_SIDES.index("left")
_NOT_BESIDE = [LABEL_SIDES.index(side) for side in ("none", "key right", "key left")]
_SPAN, _LABEL = attrgetter("span"), attrgetter("label")
