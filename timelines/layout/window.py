"""The time window of `--from DATE --to DATE`: the part of time the axis shows.

`--from` counts from the earliest day its date may mean and `--to` up to the latest, so
`--from 1650 --to 1700` shows 1650-01-01 to 1700-12-31 whole. Either may be left out: that side
of the axis then follows the records, as without a window.

A record is *outside* when no part of it can lie in the window (its latest possible end is
before the window, or its earliest possible start after it); outside records are not drawn but
reported, never dropped in silence. A record reaching past an edge is drawn up to the edge and
marked there as continuing (see `scene.compose`). The dates of `--from` and `--to` are read
by `chart.parse_window`.
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Iterable, Sequence

import numpy as np

from ..columnar import RecordColumns
from ..errors import UsageError
from ..model import Record, Span
from ..spanarrays import EARLIEST_START, LATEST_END


@dataclass(frozen=True, slots=True)
class TimeWindow:
    """Fixed days `start..end` shown on the axis; None on a side left to the records."""

    start: int | None = None
    end: int | None = None
    start_text: str = ""        # as the user wrote them, for messages
    end_text: str = ""

    def __post_init__(self) -> None:
        if self.start is not None and self.end is not None and self.end <= self.start:
            raise UsageError(f"the window --from {self.start_text!r} --to {self.end_text!r} "
                             "is empty", hint="--to must be later than --from")

    def may_hold(self, span: Span) -> bool:
        """Whether some part of `span` may lie inside the window (unbounded sides reach on)."""
        low, high = span.possible_extent
        if self.start is not None and high is not None and high < self.start:
            return False
        return not (self.end is not None and low is not None and low > self.end)

    def may_hold_bounds(self, bounds: np.ndarray) -> np.ndarray:
        """`may_hold` of each span given by its bounds (`spanarrays.bounds_of`); a span with
        no bounds (an undated row) is held."""
        holds = np.ones(len(bounds), dtype=bool)
        if self.start is not None:
            holds &= ~(bounds[:, LATEST_END] < self.start)          # NaN compares False
        if self.end is not None:
            holds &= ~(bounds[:, EARLIEST_START] > self.end)
        return holds

    def domain(self, low: float, high: float) -> tuple[float, float]:
        """The axis domain: the window's sides, the records' `low`/`high` where it has none."""
        return (float(self.start) if self.start is not None else low,
                float(self.end) if self.end is not None else high)


def split_by_window(records: Iterable[Record], window: TimeWindow | None
                    ) -> tuple[Sequence[Record], list[Record]]:
    """(records kept, dated records wholly outside the window); undated records are kept,
    to be listed under the chart as always. A table's columns are kept as columns."""
    if isinstance(records, RecordColumns):
        return _split_columns(records, window)
    kept, outside = [], []
    for record in records:
        if window is None or record.span is None or window.may_hold(record.span):
            kept.append(record)
        else:
            outside.append(record)
    return kept, outside


def _split_columns(records: RecordColumns, window: TimeWindow | None
                   ) -> tuple[RecordColumns, list[Record]]:
    """split_by_window of a table's columns: each distinct span looked at once."""
    if window is None:
        return records, []
    inside = window.may_hold_bounds(records.span_bounds())[records.codes()]
    return (records.take(np.flatnonzero(inside)),
            records.take(np.flatnonzero(~inside)).records())


def outside_note(count: int) -> str:
    """The one line that says how many records the window leaves out."""
    records = "1 record lies" if count == 1 else f"{count} records lie"
    return f"{records} outside --from/--to"
