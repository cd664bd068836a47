"""Boxes into lanes: the compact sweep, first fit in a given order, and what fits in k lanes.

A box `(start, end)` with a gap `g` occupies the closed interval `[start, end + g]`. Two boxes
may share a lane only when those intervals are disjoint: the later one starts strictly after
`end + g` of the earlier. With `g = 0` boxes that touch therefore take different lanes (two
abutting bars in one lane would read as one bar). Lanes are numbered from 0, top first.

Everything here works on plain numbers; `placement` turns records into boxes.
"""
from __future__ import annotations

import bisect
import heapq
import math
from collections.abc import Sequence
from dataclasses import dataclass
from itertools import chain

import numpy as np

Box = tuple[float, float]
LEFT_OUT = -1   # the lane of a box that found no room within the lanes allowed


@dataclass(frozen=True, slots=True)
class Density:
    """The most boxes that share one moment, and the first stretch `[start, end]` where they do."""

    depth: int
    start: float
    end: float


def pack_lanes(boxes: Sequence[Box], gap: float = 0.0) -> list[int]:
    """Lane of each box, using the fewest lanes possible. O(n log n).

    Boxes are taken by start, ties in input order; each goes to the lowest-numbered lane free
    at its start. Greedy colouring of intervals in start order uses exactly as many lanes as
    the most intervals sharing one point (`max_overlap_depth`), which is the minimum."""
    starts, ends = _checked_boxes(boxes, gap)
    return _sweep(starts, ends)


def _sweep(starts: np.ndarray, ends: np.ndarray) -> list[int]:
    count = len(starts)
    # One sorted stream of events: the first half are starts, the second ends. The stable sort
    # puts a start before an end at the same moment (closed intervals that touch overlap) and
    # keeps equal starts in input order.
    events = np.argsort(np.concatenate((starts, ends)), kind="stable").tolist()
    lanes = [0] * count
    free: list[int] = []          # lanes whose last box has ended, lowest first
    opened = 0
    push, pop = heapq.heappush, heapq.heappop
    for event in events:
        if event < count:
            if free:
                lanes[event] = pop(free)
            else:
                lanes[event] = opened
                opened += 1
        else:
            push(free, lanes[event - count])
    return lanes


def max_overlap_depth(boxes: Sequence[Box], gap: float = 0.0) -> int:
    """The largest number of boxes `[start, end + gap]` that share one point."""
    return densest_moment(boxes, gap).depth


def densest_moment(boxes: Sequence[Box], gap: float = 0.0) -> Density:
    """Where the most boxes overlap: their number and the first stretch holding that many.

    A sweep over the sorted starts and ends, starts first at equal moments; the depth after
    each event is a running sum. Depth 0 (no boxes) has the stretch (0, 0)."""
    starts, ends = _checked_boxes(boxes, gap)
    if not len(starts):
        return Density(0, 0.0, 0.0)
    times = np.concatenate((starts, ends))
    steps = np.concatenate((np.ones(len(starts), np.int64), -np.ones(len(ends), np.int64)))
    order = np.argsort(times, kind="stable")
    depth = np.cumsum(steps[order])
    peak = int(np.argmax(depth))   # the first event reaching the maximum: a start
    # The stretch ends where the next box ends: the first end event after the peak.
    return Density(int(depth[peak]), float(times[order[peak]]), float(times[order[peak + 1]]))


def first_fit(boxes: Sequence[Box], gap: float = 0.0, *,
              taken: Sequence[tuple[Box, int]] = (), max_lanes: int | None = None) -> list[int]:
    """Lane of each box taken in the given order: the lowest lane where it fits.

    `taken` holds boxes already fixed in a lane (pinned ones); a box fits a lane when it
    overlaps none of the lane's boxes. With `max_lanes`, a box that fits none of the first
    `max_lanes` lanes gets LEFT_OUT. In start order this gives the same lanes as
    `pack_lanes`; in any other order it keeps that order top to bottom, at the cost of lanes."""
    starts, ends = _checked_boxes(boxes, gap)
    spaces: list[_LaneSpace] = []
    for position, ((start, end), lane) in enumerate(taken):
        _check_box(position, start, end)
        while len(spaces) <= lane:
            spaces.append(_LaneSpace())
        spaces[lane].add(float(start), float(end) + gap)
    limit = math.inf if max_lanes is None else max_lanes
    lanes = []
    for start, end in zip(starts.tolist(), ends.tolist()):
        lane = next((number for number, space in enumerate(spaces) if space.fits(start, end)),
                    len(spaces))
        if lane >= limit:
            lanes.append(LEFT_OUT)
            continue
        if lane == len(spaces):
            spaces.append(_LaneSpace())
        spaces[lane].add(start, end)
        lanes.append(lane)
    return lanes


class _LaneSpace:
    """The boxes of one lane as two sorted lists; disjoint boxes sort alike by start and end."""

    __slots__ = ("starts", "ends")

    def __init__(self) -> None:
        self.starts: list[float] = []
        self.ends: list[float] = []

    def fits(self, start: float, end: float) -> bool:
        if not self.ends or start > self.ends[-1]:
            return True                      # after everything: the common case
        # The boxes starting no later than `end`; the last of them ends latest.
        before = bisect.bisect_right(self.starts, end)
        return before == 0 or self.ends[before - 1] < start

    def add(self, start: float, end: float) -> None:
        place = bisect.bisect_right(self.starts, end)
        self.starts.insert(place, start)
        self.ends.insert(place, end)


def most_that_fit(boxes: Sequence[Box], gap: float, lanes: int) -> list[bool]:
    """Which boxes to keep so that as many as possible fit in `lanes` lanes.

    Boxes by end, ties in input order; each goes to the lane that became free latest before
    its start, or is left out when none is free. Checked against brute force in the tests."""
    starts, ends = _checked_boxes(boxes, gap)
    if lanes < 1:
        raise ValueError(f"lanes must be at least 1, not {lanes}")
    free_from = [-math.inf] * lanes       # sorted: the end (+ gap) of each lane's last box
    keep = [False] * len(starts)
    start_list, end_list = starts.tolist(), ends.tolist()
    for index in np.argsort(ends, kind="stable").tolist():
        latest = bisect.bisect_left(free_from, start_list[index]) - 1
        if latest >= 0:
            del free_from[latest]
            bisect.insort(free_from, end_list[index])
            keep[index] = True
    return keep


def _checked_boxes(boxes: Sequence[Box], gap: float) -> tuple[np.ndarray, np.ndarray]:
    """Starts and `end + gap` as float arrays, after checking every box and the gap.
    `boxes` is a sequence of (start, end) pairs or an n x 2 array."""
    check_distance("gap", gap)
    if isinstance(boxes, np.ndarray):                     # an n x 2 array of boxes
        starts, ends = boxes[:, 0].astype(float), boxes[:, 1].astype(float)
    else:
        flat = np.fromiter(chain.from_iterable(boxes), dtype=float, count=2 * len(boxes))
        starts, ends = flat[0::2], flat[1::2]
    bad = ~(np.isfinite(starts) & np.isfinite(ends) & (starts <= ends))
    if bad.any():
        position = int(np.flatnonzero(bad)[0])
        _check_box(position, float(starts[position]), float(ends[position]))
    return starts, ends + gap


def _check_box(position: int, start: float, end: float) -> None:
    if not (math.isfinite(start) and math.isfinite(end)) or end < start:
        raise ValueError(f"box {position} ({start}, {end}) must be finite with start <= end")


def check_distance(name: str, value: float) -> None:
    if not (math.isfinite(value) and value >= 0):
        raise ValueError(f"{name} must be a finite number >= 0, not {value}")
