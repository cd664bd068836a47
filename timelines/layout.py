"""Grouping, label placement and lane packing, in fixed days. Pure and deterministic.

All quantities are in days on the time axis; the caller converts label widths and gaps from
page px to days (`width_px / scale.px_per_day`) before calling, and back afterwards.

Boxes and lanes. A box `(start, end)` is what a record occupies in its lane: its drawn bar plus
the room of a label placed outside it. With a gap `g` a box is the closed interval
`[start, end + g]`; two boxes may share a lane only when those intervals are disjoint, that is
when the later one starts strictly after `end + g` of the earlier. With `g = 0` boxes that touch
(one ends on the day the next begins) therefore take different lanes: two abutting bars in one
lane would read as one bar. Under this rule packing is interval-graph colouring, and the greedy
sweep below uses exactly as many lanes as the largest number of boxes sharing one point
(`max_overlap_depth`), which is the minimum.

Group order. Groups come in the order of their earliest possible start; a record whose start
is unbounded (open or unknown start) counts as earlier than any date, undated records as later
than any; ties keep the order of first appearance. Records inside a group keep input order.
Records without a group (the key returns None or "") form one group named "" (`NO_GROUP`);
how to caption it is the renderer's choice.
"""
from __future__ import annotations

import heapq
import math
from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass, replace

from .model import Record

NO_GROUP = ""
LABEL_SIDES = ("inside", "right", "left", "none")

GroupKey = Callable[[Record], str | None]


@dataclass(frozen=True, slots=True)
class PlacedRecord:
    record: Record
    lane: int
    box_start: float
    box_end: float
    bar_start: float
    bar_end: float
    label_side: str   # "inside", "right", "left" or "none" (left out; keep it in the tooltip)


@dataclass(frozen=True, slots=True)
class GroupPlacement:
    name: str
    lanes: int
    records: tuple[PlacedRecord, ...]


@dataclass(frozen=True, slots=True)
class Placement:
    groups: tuple[GroupPlacement, ...]
    undated: tuple[Record, ...]
    domain: tuple[float, float]

    @property
    def lanes(self) -> int:
        return sum(group.lanes for group in self.groups)


def pack_lanes(boxes: Sequence[tuple[float, float]], gap: float = 0.0) -> list[int]:
    """Lane number (0, 1, ...) of each box, using the fewest lanes possible. O(n log n).

    Boxes are taken by start, ties by input position; each goes to the lowest-numbered lane
    free at its start. A lane is free once its last box's `end + gap` lies before the start."""
    ends = _checked_ends(boxes, gap)
    starts = [box[0] for box in boxes]
    lanes = [0] * len(boxes)
    busy: list[tuple[float, int]] = []   # (end + gap, lane) of the last box in each busy lane
    free: list[int] = []                 # lanes whose last box ended before the current start
    push, pop = heapq.heappush, heapq.heappop
    # sorted() is stable, so boxes with equal starts stay in input order.
    for index in sorted(range(len(boxes)), key=starts.__getitem__):
        start = starts[index]
        while busy and busy[0][0] < start:
            push(free, pop(busy)[1])
        lane = pop(free) if free else len(busy)
        push(busy, (ends[index], lane))
        lanes[index] = lane
    return lanes


def max_overlap_depth(boxes: Sequence[tuple[float, float]], gap: float = 0.0) -> int:
    """The largest number of boxes `[start, end + gap]` that share one point (a sweep).

    The depth peaks at some box's start: count the boxes begun by then, less those whose
    `end + gap` lies strictly before it (closed intervals that touch do overlap)."""
    ends = sorted(_checked_ends(boxes, gap))
    closed = deepest = 0
    for opened, start in enumerate(sorted(box[0] for box in boxes), start=1):
        while ends[closed] < start:
            closed += 1
        deepest = max(deepest, opened - closed)
    return deepest


def _check_distance(name: str, value: float) -> None:
    if not (math.isfinite(value) and value >= 0):
        raise ValueError(f"{name} must be a finite number >= 0, not {value}")


def _checked_ends(boxes: Sequence[tuple[float, float]], gap: float) -> list[float]:
    _check_distance("gap", gap)
    ends = []
    for position, (start, end) in enumerate(boxes):
        if not (math.isfinite(start) and math.isfinite(end)) or end < start:
            raise ValueError(f"box {position} ({start}, {end}) must be finite with start <= end")
        ends.append(end + gap)
    return ends


def group_records(records: Iterable[Record], key: GroupKey) -> list[tuple[str, list[Record]]]:
    """Records grouped by `key`, groups by earliest possible start (see the module notes)."""
    members: dict[str, list[Record]] = {}
    first_start: dict[str, tuple[int, float]] = {}
    for record in records:
        name = key(record) or NO_GROUP
        members.setdefault(name, []).append(record)
        start = _start_order(record)
        first_start[name] = min(first_start.get(name, start), start)
    # dicts keep insertion order and sorted() is stable: ties stay in order of first appearance.
    names = sorted(members, key=lambda name: first_start[name])
    return [(name, members[name]) for name in names]


def _start_order(record: Record) -> tuple[int, float]:
    # (0, -) an open start (the span runs on into the past), (1, day) a start bounded by a
    # date, (2, -) no date at all. An unknown or 'before' start counts from its first known
    # bound, so one missing birth year does not pull its whole group to the top.
    if record.span is None:
        return 2, 0.0
    start, end = record.span.start, record.span.end
    if start.is_open:
        return 0, 0.0
    known = next((day for day in (start.earliest, start.latest, end.earliest, end.latest)
                  if day is not None), None)
    return (0, 0.0) if known is None else (1, float(known))


def place(records: Iterable[Record], *, domain: tuple[float, float],
          drawn_extent: Callable[[Record], tuple[float, float]],
          label_width: Callable[[Record], float], group_key: GroupKey | None = None,
          gap: float = 0.0, label_pad: float = 0.0,
          inside_room: Callable[[Record], tuple[float, float] | None] | None = None) -> Placement:
    """Group dated records, place each label, pack each group's boxes into lanes.

    `drawn_extent` gives a record's bar in days (the caller decides how open or unknown ends
    are drawn); `label_width` its label's width in days; `label_pad` the space in days between
    a label and the bar's edge (on both sides for a label inside); `inside_room` the part of
    the bar a label may sit on (for example only the solid core, where text stays legible;
    None from it: no room inside), the whole bar when not given."""
    low, high = domain
    if not high > low:
        raise ValueError(f"domain end {high} must be after its start {low}")
    _check_distance("gap", gap)
    _check_distance("label_pad", label_pad)
    records = list(records)
    undated = tuple(record for record in records if record.span is None)
    dated = [record for record in records if record.span is not None]
    groups = group_records(dated, group_key or (lambda record: None))
    room = inside_room or drawn_extent
    placed = tuple(_place_group(name, members, domain, drawn_extent, label_width, gap, label_pad,
                                room) for name, members in groups)
    return Placement(placed, undated, (low, high))


def _place_group(name: str, members: list[Record], domain: tuple[float, float],
                 drawn_extent: Callable[[Record], tuple[float, float]],
                 label_width: Callable[[Record], float], gap: float,
                 label_pad: float, room) -> GroupPlacement:
    unpacked = [_label_box(record, drawn_extent(record), label_width(record), domain, label_pad,
                           room(record)) for record in members]
    lanes = pack_lanes([(p.box_start, p.box_end) for p in unpacked], gap)
    packed = tuple(replace(p, lane=lane) for p, lane in zip(unpacked, lanes))
    return GroupPlacement(name, max(lanes, default=-1) + 1, packed)


def _label_box(record: Record, bar: tuple[float, float], width: float,
               domain: tuple[float, float], pad: float,
               room: tuple[float, float] | None) -> PlacedRecord:
    """Where the label goes and the box it makes with the bar, lane not yet known (-1).

    Inside when the label and its padding fit in the room inside the bar; else right of the
    bar, else left of it, as long as it stays within the domain; else nowhere."""
    bar_start, bar_end = bar
    if not (math.isfinite(bar_start) and math.isfinite(bar_end)) or bar_end < bar_start:
        raise ValueError(f"drawn extent {bar} of {record.label!r} must be finite, start <= end")
    if not (math.isfinite(width) and width >= 0):
        raise ValueError(f"label width {width} of {record.label!r} must be finite and >= 0")
    box_start, box_end, side = bar_start, bar_end, "none"
    if room is not None and width + 2 * pad <= room[1] - room[0]:
        side = "inside"
    elif bar_end + pad + width <= domain[1]:
        box_end, side = bar_end + pad + width, "right"
    elif bar_start - pad - width >= domain[0]:
        box_start, side = bar_start - pad - width, "left"
    return PlacedRecord(record, -1, box_start, box_end, bar_start, bar_end, side)
