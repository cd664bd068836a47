"""The rows of a table of plain ISO days (`YYYY-MM-DD` starts and ends, empty cells allowed)
as arrays: what `records` makes of them without an object per day or pair of days.

Each side's column comes from the reader as its distinct days in one array
(`dates.column.DayEndpoints`, NaN for an empty cell) and a code per cell. Each distinct pair
of a start and an end code is one outcome: a span of `spanarrays.DaySpans`, no date at all
(both cells empty), or, where the end day lies before the start day, the end cell's
contradiction. `tests/test_day_spans.py` holds this to the cell by cell reading.
"""
from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from ..dates import DateError
from ..dates.column import Coded, DayEndpoints
from ..model import Span
from ..spanarrays import DaySpans

# A row's outcome, as records.py has it: a span, None (undated), or [(column, error)].
DateOutcome = Span | None | list[tuple[int, DateError | None]]


def of_days(side: Coded) -> bool:
    """Whether a side's results are plain days (or it has no column)."""
    return isinstance(side.results, DayEndpoints) or side.results == [None]


def day_outcomes(starts: Coded, ends: Coded, end_place: int | None) -> Coded:
    """The outcome of each row of two sides of plain days (`of_days`), as codes into the
    distinct pairs' outcomes (`DayOutcomes`); `end_place` is the end column's index, which
    a contradiction names."""
    start_days, end_days = _days_of(starts), _days_of(ends)
    width = len(end_days)
    pairs, codes = np.unique(starts.codes.astype(np.int64) * width + ends.codes,
                             return_inverse=True)
    first, last = start_days[pairs // width], end_days[pairs % width]
    contradicted = last < first                                  # NaN compares False
    spans = DaySpans(np.where(contradicted, np.nan, first), np.where(contradicted, np.nan, last))
    return Coded(codes.reshape(-1), DayOutcomes(spans, contradicted, end_place))


def _days_of(side: Coded) -> np.ndarray:
    if isinstance(side.results, DayEndpoints):
        return side.results.as_floats()
    return np.array([np.nan])                                   # no column: not known


class DayOutcomes(Sequence):
    """The outcomes of distinct pairs of days: a span of `spans`, None (no day on either
    side), or the end cell's contradiction where `contradicted`; each outcome made when
    asked for."""

    def __init__(self, spans: DaySpans, contradicted: np.ndarray, end: int | None) -> None:
        self.spans, self.contradicted, self.end = spans, contradicted, end

    def __len__(self) -> int:
        return len(self.spans)

    def __getitem__(self, index: int) -> DateOutcome:
        return [(self.end, None)] if self.contradicted[index] else self.spans[index]

    def failed(self) -> np.ndarray:
        """Which outcomes are contradictions."""
        return self.contradicted

    def reported(self) -> np.ndarray:
        """Which outcomes are no span: contradictions and rows with no date."""
        return self.contradicted | ~self.spans.facts().dated
