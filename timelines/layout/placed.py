"""Where each record of a group went: one `PlacedRecord` each, or, for a table read as
columns (`columnar.RecordColumns`), `PlacedColumns`: the lanes and boxes as numpy arrays
beside the records, PlacedRecord objects made only when something iterates over them (the
scene, to draw them). The lanes report reads the arrays."""
from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass

import numpy as np

from ..columnar import RecordColumns
from ..model import Record, many


@dataclass(frozen=True, slots=True)
class PlacedRecord:
    record: Record
    lane: int
    box_start: float
    box_end: float
    bar_start: float
    bar_end: float
    label_side: str   # "inside", "right", "left", "over" (on the bar's body, on a plate),
    #                   "key right"/"key left" (a number spelled out under the chart) or
    #                   "none" (left out; kept in the tooltip)
    key: int = 0      # with a key side: its number, 1, 2, ... in drawing order
    shown: str = ""   # the label as drawn when shortened to fit ("" when whole)


class PlacedColumns(Sequence):
    """A group's placed records as columns: `records` (a RecordColumns) and, one value per
    record, `lanes`, `box_start`, `box_end`, `bar_start`, `bar_end` (numpy arrays),
    `sides`, `keys` and `shown` (lists). A Sequence of PlacedRecord, made once when asked."""

    __slots__ = ("records", "lanes", "box_start", "box_end", "bar_start", "bar_end", "sides",
                 "keys", "shown", "_made")

    def __init__(self, records: RecordColumns, lanes: np.ndarray, box_start: np.ndarray,
                 box_end: np.ndarray, bar_start: np.ndarray, bar_end: np.ndarray,
                 sides: list[str], keys: list[int], shown: list[str] | None) -> None:
        self.records, self.lanes = records, np.asarray(lanes, dtype=np.int64)
        self.box_start, self.box_end = box_start, box_end
        self.bar_start, self.bar_end = bar_start, bar_end
        self.sides, self.keys, self.shown = sides, keys, shown
        self._made: list[PlacedRecord] | None = None

    def __len__(self) -> int:
        return len(self.records)

    def __getitem__(self, index):
        return self._objects()[index]

    def __iter__(self) -> Iterator[PlacedRecord]:
        return iter(self._objects())

    def __eq__(self, other: object) -> bool:
        if isinstance(other, (PlacedColumns, tuple)):
            return tuple(self) == tuple(other)
        return NotImplemented

    __hash__ = None  # type: ignore[assignment]

    def __repr__(self) -> str:
        return f"<{len(self)} placed records as columns>"

    def _objects(self) -> list[PlacedRecord]:
        if self._made is None:
            count = len(self)
            self._made = many(
                PlacedRecord, count, record=self.records.records(), lane=self.lanes.tolist(),
                box_start=self.box_start.tolist(), box_end=self.box_end.tolist(),
                bar_start=self.bar_start.tolist(), bar_end=self.bar_end.tolist(),
                label_side=self.sides, key=self.keys,
                shown=self.shown if self.shown is not None else [""] * count)
        return self._made
