"""Records into placed groups: group, measure each record's box, order, pin, pack.

All quantities are in days on the time axis; the caller converts label widths and gaps from
page px to days before calling, and back afterwards.

Packing inside a group (`LaneRules.pack`):
- "compact": the fewest lanes (boxes by start, each to the lowest free lane); the sort key
  only breaks ties between equal starts. With `max_lanes`, as many records as possible are
  kept and the fewest left out.
- "ordered": records in sort order, each to the first lane where it fits, so the order reads
  top to bottom; it may take more lanes than compact. With `max_lanes` the records first in
  the order are kept.
- "single": one record per lane in sort order.

Sort keys: "start", "end", "duration" (of the drawn bar), "label", or a function giving a
cell's text (numbers by value, then text, then empty cells); ties go by source row, then
input position, so the same records in any input order get the same lanes.

A pinned record (`lane_of` gives its lane number, counting from 1 within its group) is put
there first. A pin that is not a number, lies beyond `max_lanes`, or collides with an earlier
pinned record is not kept: the record is packed with the others and a note says why. Pins
take first-fit packing around them, so compact lanes are then no longer guaranteed minimal.

Nothing is dropped silently: a record that finds no lane within `max_lanes` is left out of the
picture and listed in `Placement.notes` (kind "left out") and in its group's `left_out`.
"""
from __future__ import annotations

import math
from collections.abc import Callable, Iterable, Iterator, Sequence
from dataclasses import dataclass, field
from itertools import repeat
from operator import attrgetter

import numpy as np

from ..columnar import RecordColumns
from ..model import Record, collection_paused, many
from .boxes import Boxes, BoxMeasure, SpanMeasure
from .grouping import (
    GROUP_ORDERS, NO_KEY, GroupKey, GroupOrder, check_listed_names, collect_groups,
    merge_small_groups, natural_key, order_groups,
)
from .placed import PlacedColumns, PlacedRecord
from .labels import LABEL_MODES, LABEL_SIDES
from .packing import (
    LEFT_OUT, check_distance, first_fit, max_overlap_depth, most_that_fit, pack_lanes,
)

PACKINGS = ("compact", "ordered", "single")
SORT_KEYS = ("start", "end", "duration", "label")

CellKey = Callable[[Record], str | None]


@dataclass(frozen=True, slots=True)
class LaneRules:
    """How records are grouped below the top level, ordered and packed (module notes)."""

    subgroup_key: GroupKey | None = None
    group_order: GroupOrder = "first"
    subgroup_order: GroupOrder = "first"
    min_group_size: int = 0            # groups with fewer records merge into `other_group`
    min_subgroup_size: int = 0         # the same inside each group
    other_group: str = "Other"
    pack: str = "compact"
    sort: str | CellKey = "start"
    descending: bool = False
    lane_of: CellKey | None = None     # a pinned lane number (1, 2, ...) as text, or None
    max_lanes: int | None = None

    def __post_init__(self) -> None:
        if self.pack not in PACKINGS:
            raise ValueError(f"pack must be one of {', '.join(PACKINGS)}, not {self.pack!r}")
        if not callable(self.sort) and self.sort not in SORT_KEYS:
            raise ValueError(f"sort must be one of {', '.join(SORT_KEYS)} or a function, "
                             f"not {self.sort!r}")
        for order in (self.group_order, self.subgroup_order):
            if not isinstance(order, tuple) and order not in GROUP_ORDERS:
                raise ValueError(f"group order must be one of {', '.join(GROUP_ORDERS)} or a "
                                 f"tuple of names, not {order!r}")
        for name in ("min_group_size", "min_subgroup_size"):
            if getattr(self, name) < 0:
                raise ValueError(f"{name} must be >= 0, not {getattr(self, name)}")
        if not self.other_group:
            raise ValueError("other_group needs a name")
        if self.max_lanes is not None and self.max_lanes < 1:
            raise ValueError(f"max_lanes must be at least 1, not {self.max_lanes}")


@dataclass(frozen=True, slots=True)
class GroupPlacement:
    """A group's lanes. A group with subgroups holds no records itself: its subgroups do,
    each in lanes of its own, and `lanes` is their sum."""

    name: str
    lanes: int
    records: Sequence[PlacedRecord]         # a tuple, or PlacedColumns (placed.py)
    subgroups: tuple["GroupPlacement", ...] = ()
    merged: tuple[str, ...] = ()           # names of the small groups merged into this one
    left_out: tuple[Record, ...] = ()      # no room within the lanes allowed

    def leaves(self, path: tuple[str, ...] = ()) -> Iterator[tuple[tuple[str, ...],
                                                                  "GroupPlacement"]]:
        """(group path, group) of each group that holds lanes itself, top to bottom."""
        path = (*path, self.name)
        if not self.subgroups:
            yield path, self
        for subgroup in self.subgroups:
            yield from subgroup.leaves(path)


@dataclass(frozen=True, slots=True)
class LayoutNote:
    """Something to report about one record's place."""

    record: Record
    path: tuple[str, ...]       # its group, and subgroup
    kind: str                   # "left out" (not drawn) or "pin" (drawn, not where pinned)
    reason: str
    box: tuple[float, float]


@dataclass(frozen=True, slots=True)
class Placement:
    groups: tuple[GroupPlacement, ...]
    undated: tuple[Record, ...]
    domain: tuple[float, float]
    notes: tuple[LayoutNote, ...] = field(default=())
    gap: float = 0.0            # the least distance kept between boxes in a lane, in days

    @property
    def lanes(self) -> int:
        return sum(group.lanes for group in self.groups)

    @property
    def left_out(self) -> tuple[Record, ...]:
        return tuple(note.record for note in self.notes if note.kind == "left out")

    def leaves(self) -> Iterator[tuple[tuple[str, ...], GroupPlacement]]:
        for group in self.groups:
            yield from group.leaves()

    @property
    def keyed(self) -> tuple[PlacedRecord, ...]:
        """The records whose labels are shown by key number, in number order."""
        keyed = [placed for _, group in self.leaves() for placed in group.records if placed.key]
        return tuple(sorted(keyed, key=attrgetter("key")))


@dataclass(frozen=True, slots=True)
class GroupNode:
    """A group before packing: its records (a tuple, or RecordColumns), or its subgroups."""

    name: str
    records: Sequence[Record]
    subgroups: tuple["GroupNode", ...] = ()
    merged: tuple[str, ...] = ()


def group_tree(records: Iterable[Record], group_key: GroupKey | None = None,
               rules: LaneRules = LaneRules()) -> tuple[GroupNode, ...]:
    """Groups (and subgroups) in order, small ones merged. Raises UnknownGroup for a name in
    an explicit order that no group has."""
    records = records if isinstance(records, RecordColumns) else list(records)
    top = _ordered_level(records, group_key or NO_KEY, rules.group_order,
                         rules.min_group_size, rules.other_group)
    if rules.subgroup_key is None:
        return tuple(GroupNode(name, _kept(members), (), merged)
                     for name, members, merged in top)
    levels = [(name, _ordered_level(members, rules.subgroup_key, rules.subgroup_order,
                                    rules.min_subgroup_size, rules.other_group, check=False),
               merged) for name, members, merged in top]
    if isinstance(rules.subgroup_order, tuple):
        known = [rules.subgroup_key(record) or "" for record in records]
        check_listed_names(rules.subgroup_order, [*known, rules.other_group])
    return tuple(GroupNode(name, (), tuple(GroupNode(sub, _kept(members), (), sub_merged)
                                          for sub, members, sub_merged in subs), merged)
                 for name, subs, merged in levels)


def _kept(members: Sequence[Record]) -> Sequence[Record]:
    """A group's records as held by its node: columns stay columns."""
    return members if isinstance(members, RecordColumns) else tuple(members)


def _ordered_level(records: Sequence[Record], key: GroupKey, order: GroupOrder, min_size: int,
                   other: str, check: bool = True
                   ) -> list[tuple[str, Sequence[Record], tuple[str, ...]]]:
    groups = collect_groups(records, key)
    if check and isinstance(order, tuple):
        check_listed_names(order, [*(name for name, _ in groups), other])
    groups, merged = merge_small_groups(groups, min_size, other)
    last = {other} if merged else set()
    return [(name, members, merged if name == other else ())
            for name, members in order_groups(groups, order, last=last)]


_PROVENANCE = attrgetter("provenance")


def place(records: Iterable[Record], *, domain: tuple[float, float],
          measure_spans: SpanMeasure, label_width: Callable[[str], float],
          group_key: GroupKey | None = None, gap: float = 0.0, label_pad: float = 0.0,
          label_clearance: float = 0.0, labels: str = "beside",
          rules: LaneRules = LaneRules(), tree: tuple[GroupNode, ...] | None = None,
          key_width: float | None = None,
          label_widths: Callable[[list[str]], np.ndarray] | None = None) -> Placement:
    """Group dated records, place each label, pack each group's boxes into lanes.

    `measure_spans` gives, for a list of spans (each distinct span object once),
    an n x 4 array: each one's drawn bar (start, end) in days (the caller decides how open or
    unknown ends are drawn) and the part of it a label may sit on (start, end; NaN where there
    is none; for example only the solid core, where text stays legible), and optionally two
    more columns, n x 6: the bar's body a label may be drawn over when nothing beside has
    room (start, end; NaN where there is none); `each_span` makes one from functions of one
    span. `label_width` gives a label's width in days, asked once
    per distinct text. `label_pad` is the space in days between a label and the bar's edge
    (on both sides for a label inside); `label_clearance` the room kept free on the far side
    of a label beside its bar; `labels` the label mode ("beside",
    "inside" or "none", see `labels`); `gap` the least distance in days between boxes in one
    lane; `tree` the dated records' groups as `group_tree(records, group_key, rules)` made
    them, when the caller has them already; `key_width` the width in days of a key number
    put beside a bar whose label finds no room (None: such labels are left out);
    `label_widths` what `label_width` gives, for many texts at once (speed alone).

    A table read as columns (`columnar.RecordColumns`) is laid out as columns: its groups
    hold parts of it, and each group's places are PlacedColumns."""
    low, high = domain
    if not high > low:
        raise ValueError(f"domain end {high} must be after its start {low}")
    check_distance("gap", gap)
    check_distance("label_pad", label_pad)
    check_distance("label_clearance", label_clearance)
    if labels not in LABEL_MODES:
        raise ValueError(f"labels must be one of {', '.join(LABEL_MODES)}, not {labels!r}")
    if isinstance(records, RecordColumns):
        undated = tuple(records.undated_part())
        if tree is None:
            tree = group_tree(records.dated_part(), group_key, rules)
    else:
        records = list(records)
        undated = tuple(record for record in records if record.span is None)
        if tree is None:
            tree = group_tree((record for record in records if record.span is not None),
                              group_key, rules)
    notes: list[LayoutNote] = []
    with collection_paused():
        measure = BoxMeasure((low, high), measure_spans, label_width, label_pad, label_clearance,
                             labels, list(_tree_parts(tree)), key_width, label_widths)
        groups = tuple(_place_node(node, (), measure, gap, rules, notes) for node in tree)
    return Placement(groups, undated, (low, high), tuple(notes), gap)


def _tree_parts(tree: tuple[GroupNode, ...]) -> Iterator[Sequence[Record]]:
    """The records of each group that holds them."""
    for node in tree:
        if node.records:
            yield node.records
        yield from _tree_parts(node.subgroups)


def _place_node(node: GroupNode, path: tuple[str, ...], measure: BoxMeasure, gap: float,
                rules: LaneRules, notes: list[LayoutNote]) -> GroupPlacement:
    path = (*path, node.name)
    if node.subgroups:
        subgroups = tuple(_place_node(sub, path, measure, gap, rules, notes)
                          for sub in node.subgroups)
        return GroupPlacement(node.name, sum(sub.lanes for sub in subgroups), (), subgroups,
                              node.merged)
    records = node.records
    boxes = measure.boxes(records)
    order = _sorted_indices(records, boxes, rules)
    pins = _pins(records, boxes, order, gap, rules, path, notes)
    lanes = _lanes(boxes, order, pins, gap, rules)
    kept = [index for index, lane in enumerate(lanes) if lane != LEFT_OUT]
    placed = _placed(records, boxes, lanes, kept, measure)
    where = f" in {_path_text(path)}" if any(path) else ""
    left_out = []
    for index, lane in enumerate(lanes):
        if lane == LEFT_OUT:
            left_out.append(records[index])
            notes.append(LayoutNote(records[index], path, "left out",
                                    f"no room within the {rules.max_lanes} lanes allowed{where}",
                                    boxes.box(index)))
    placed = placed if isinstance(placed, PlacedColumns) else tuple(placed)
    return GroupPlacement(node.name, max(lanes, default=-1) + 1, placed, (), node.merged,
                          tuple(left_out))


def _placed(records: Sequence[Record], boxes: Boxes, lanes: list[int],
            kept: list[int], measure: BoxMeasure) -> Sequence[PlacedRecord]:
    """The PlacedRecords of the kept records, made column by column (a group may be large),
    or kept as columns; a label shown by key number gets the next number of the placement,
    in drawing order."""
    if isinstance(records, RecordColumns):
        return _placed_columns(records, boxes, lanes, kept, measure)

    def column(values) -> list:
        values = values.tolist() if isinstance(values, np.ndarray) else values
        return values if len(kept) == len(records) else [values[index] for index in kept]

    sides = column([LABEL_SIDES[side] for side in boxes.side.tolist()])
    keys = [next(measure.keys) if side.startswith("key") else 0 for side in sides]
    shown = column(boxes.shown) if boxes.shown is not None else repeat("")
    return many(PlacedRecord, len(kept), record=column(records), lane=column(lanes),
                box_start=column(boxes.box_start), box_end=column(boxes.box_end),
                bar_start=column(boxes.bar_start), bar_end=column(boxes.bar_end),
                label_side=sides, key=keys, shown=shown)


def _placed_columns(records: RecordColumns, boxes: Boxes, lanes: list[int],
                    kept: list[int], measure: BoxMeasure) -> PlacedColumns:
    every = len(kept) == len(records)
    picked = slice(None) if every else np.array(kept, dtype=np.intp)

    def column(values: list) -> list:
        return values if every else [values[index] for index in kept]

    sides = [LABEL_SIDES[side] for side in boxes.side[picked].tolist()]
    keys = [next(measure.keys) if side.startswith("key") else 0 for side in sides]
    return PlacedColumns(records if every else records.take(picked),
                         np.asarray(lanes, dtype=np.int64)[picked], boxes.box_start[picked],
                         boxes.box_end[picked], boxes.bar_start[picked], boxes.bar_end[picked],
                         sides, keys, column(boxes.shown) if boxes.shown is not None else None)


def _path_text(path: tuple[str, ...]) -> str:
    return " / ".join(repr(name) if name else "(none)" for name in path)


def _sorted_indices(records: Sequence[Record], boxes: Boxes, rules: LaneRules) -> list[int]:
    """Indices of `records` in sort order; ties by source row, then input position."""
    by_row = _row_order(records)
    sort = rules.sort
    if callable(sort) or sort == "label":
        if isinstance(records, RecordColumns) and sort == "label":
            keys = list(map(natural_key, records.column("labels")))
        else:
            cell = sort if callable(sort) else (lambda record: record.label)
            keys = [natural_key(cell(record)) for record in records]
        # reverse=True keeps sort stability: equal keys stay in row order.
        return sorted(by_row.tolist(), key=keys.__getitem__, reverse=rules.descending)
    if sort == "duration":
        values = boxes.bar_end - boxes.bar_start      # of the drawn bar
    else:
        values = boxes.bar_end if sort == "end" else boxes.bar_start
    values = values[by_row]
    # A stable sort of the negated keys puts equal keys in row order, as a descending sort
    # should (the same as Python's sorted(..., reverse=True)).
    order = np.argsort(-values if rules.descending else values, kind="stable")
    return by_row[order].tolist()


def _row_order(records: Sequence[Record]) -> np.ndarray:
    """Indices of `records` by source and row, ties in input order."""
    if isinstance(records, RecordColumns):
        return np.argsort(records.row_numbers(), kind="stable")
    provenances = list(map(_PROVENANCE, records))
    rows = np.fromiter(map(attrgetter("row"), provenances), dtype=np.int64, count=len(records))
    if len(set(map(attrgetter("source"), provenances))) <= 1:
        return np.argsort(rows, kind="stable")
    places = [(record.provenance.source, record.provenance.row) for record in records]
    return np.array(sorted(range(len(records)), key=places.__getitem__), dtype=np.int64)


def _lanes(boxes: Boxes, order: list[int], pins: dict[int, int], gap: float,
           rules: LaneRules) -> list[int]:
    count = len(boxes.box_start)
    if rules.pack == "single":
        return _single_lanes(count, order, pins, rules.max_lanes)
    free = np.array([index for index in order if index not in pins] if pins else order,
                    dtype=np.int64)
    if rules.pack == "compact":
        # stable: ties stay in sort order
        free = free[np.argsort(boxes.box_start[free], kind="stable")]
        if not pins:
            return _compact_lanes(boxes, free, gap, rules.max_lanes)
    free_list = free.tolist()
    taken = [(boxes.box(index), lane) for index, lane in pins.items()]
    found = first_fit([boxes.box(index) for index in free_list], gap, taken=taken,
                      max_lanes=rules.max_lanes)
    lanes = [LEFT_OUT] * count
    for index, lane in [*zip(free_list, found), *pins.items()]:
        lanes[index] = lane
    return lanes


def _compact_lanes(boxes: Boxes, ordered: np.ndarray, gap: float,
                   max_lanes: int | None) -> list[int]:
    spans = np.column_stack((boxes.box_start[ordered], boxes.box_end[ordered]))
    if max_lanes is not None and max_overlap_depth(spans, gap) > max_lanes:
        keep = np.array(most_that_fit(spans, gap, max_lanes), dtype=bool)
        ordered, spans = ordered[keep], spans[keep]
    lanes = [LEFT_OUT] * len(boxes.box_start)
    for index, lane in zip(ordered.tolist(), pack_lanes(spans, gap)):
        lanes[index] = lane
    return lanes


def _single_lanes(count: int, order: list[int], pins: dict[int, int],
                  max_lanes: int | None) -> list[int]:
    lanes = [LEFT_OUT] * count
    taken = set(pins.values())
    for index, lane in pins.items():
        lanes[index] = lane
    limit = math.inf if max_lanes is None else max_lanes
    lane = 0
    for index in order:
        if index in pins:
            continue
        while lane in taken:
            lane += 1
        if lane < limit:
            lanes[index] = lane
            lane += 1
    return lanes


def _pins(records, boxes, order: list[int], gap: float, rules: LaneRules,
          path: tuple[str, ...], notes: list[LayoutNote]) -> dict[int, int]:
    """Pinned lane (from 0) of each record that keeps its pin; notes for those that do not."""
    if rules.lane_of is None:
        return {}
    if isinstance(records, RecordColumns):
        records = records.records()       # each record's cell is read: made once, here
    pins: dict[int, int] = {}
    holders: dict[int, list[int]] = {}
    for index in order:
        text = (rules.lane_of(records[index]) or "").strip()
        if not text:
            continue
        lane = _lane_number(text)
        box = boxes.box(index)
        if lane is None:
            reason = f"lane {text!r} is not a lane number (1, 2, ...)"
        elif rules.max_lanes is not None and lane > rules.max_lanes:
            reason = f"lane {lane} lies beyond the {rules.max_lanes} lanes allowed"
        else:
            holder = next((other for other in holders.get(lane, [])
                           if rules.pack == "single" or _overlap(box, boxes.box(other), gap)), None)
            if holder is None:
                pins[index] = lane - 1
                holders.setdefault(lane, []).append(index)
                continue
            taken_by = records[holder]
            reason = (f"lane {lane} is taken there by row {taken_by.provenance.row} "
                      f"({taken_by.label})")
        notes.append(LayoutNote(records[index], path, "pin",
                                f"{reason}; placed with the others", box))
    return pins


def _lane_number(text: str) -> int | None:
    try:
        number = float(text)
    except ValueError:
        return None
    return int(number) if number.is_integer() and number >= 1 else None


def _overlap(box: tuple[float, float], other, gap: float) -> bool:
    return not (box[0] > other[1] + gap or other[0] > box[1] + gap)
