"""Lane packing, grouping and label placement.

Oracles: brute force (every partition of up to 7 boxes into lanes) and a point-by-point count
of overlaps, both written here independently of the sweep in timelines/layout.py. The theorem
that greedy colouring of intervals in start order is optimal (the clique bound) is textbook
interval partitioning: Kleinberg & Tardos, *Algorithm Design*, §4.1 (from memory).
"""
from __future__ import annotations

import itertools

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from timelines.layout import (
    LEFT_OUT, NO_GROUP, GroupPlacement, PlacedRecord, Placement, densest_moment, each_span,
    first_fit, group_records, max_overlap_depth, most_that_fit, pack_lanes, place,
)
from timelines.model import Endpoint, Provenance, Qualifier, Record, Span

# --- helpers ---------------------------------------------------------------------------------


def record(label: str, start: int | None, end: int | None = None, group: str | None = None,
           *, open_start: bool = False) -> Record:
    """A record spanning days start..end (a point when end is omitted); start None = undated."""
    provenance = Provenance("test.csv", 2)
    if start is None and not open_start:
        return Record(label, None, provenance, group=group)
    first = Endpoint.open(Qualifier.OPEN_START) if open_start else Endpoint.day(start)
    last = Endpoint.day(end if end is not None else start)
    return Record(label, Span(first, last), provenance, group=group)


def extent(span: Span) -> tuple[float, float]:
    # Bar of a day-precision span: from the start of its first day to the end of its last.
    start = span.start.earliest
    return (float(start) if start is not None else 0.0), float(span.end.latest + 1)


def lanes_are_disjoint(boxes, lanes, gap) -> bool:
    by_lane: dict[int, list[tuple[float, float]]] = {}
    for box, lane in zip(boxes, lanes, strict=True):
        by_lane.setdefault(lane, []).append(box)
    for members in by_lane.values():
        members.sort()
        for before, after in zip(members, members[1:]):
            if not after[0] > before[1] + gap:
                return False
    return True


def depth_by_points(boxes, gap) -> int:
    # The depth of closed intervals peaks at some interval's start: count there directly.
    return max((sum(1 for s, e in boxes if s <= point <= e + gap) for point, _ in boxes),
               default=0)


def set_partitions(items: list[int]):
    if not items:
        yield []
        return
    first, rest = items[0], items[1:]
    for partition in set_partitions(rest):
        for i in range(len(partition)):
            yield partition[:i] + [[first] + partition[i]] + partition[i + 1:]
        yield [[first]] + partition


def minimum_lanes_by_brute_force(boxes, gap) -> int:
    def fits(block):
        return all(boxes[j][0] > boxes[i][1] + gap or boxes[i][0] > boxes[j][1] + gap
                   for i, j in itertools.combinations(block, 2))
    return min((len(p) for p in set_partitions(list(range(len(boxes))))
                if all(fits(block) for block in p)), default=0)


# Integer grids make ties and touching boxes common; floats exercise the rest.
coordinate = st.one_of(st.integers(-20, 20).map(float),
                       st.floats(-1e6, 1e6, allow_nan=False, allow_infinity=False))
box = st.tuples(coordinate, st.floats(0, 30, allow_nan=False)).map(lambda p: (p[0], p[0] + p[1]))
small_grid_box = st.tuples(st.integers(0, 12), st.integers(0, 5)).map(
    lambda p: (float(p[0]), float(p[0] + p[1])))
gaps = st.sampled_from([0.0, 0.5, 1.0, 2.0])


# --- pack_lanes and max_overlap_depth ----------------------------------------------------------


@given(st.lists(box, max_size=60), gaps)
def test_no_two_boxes_in_a_lane_overlap(boxes, gap):
    assert lanes_are_disjoint(boxes, pack_lanes(boxes, gap), gap)


@given(st.lists(box, max_size=60), gaps)
def test_lane_count_is_the_overlap_depth(boxes, gap):
    lanes = pack_lanes(boxes, gap)
    assert max(lanes, default=-1) + 1 == max_overlap_depth(boxes, gap)


@given(st.lists(box, max_size=60), gaps)
def test_overlap_depth_agrees_with_counting_at_each_point(boxes, gap):
    assert max_overlap_depth(boxes, gap) == depth_by_points(boxes, gap)


@settings(max_examples=300)
@given(st.lists(small_grid_box, max_size=7), gaps)
def test_lane_count_is_minimal_by_brute_force(boxes, gap):
    lanes = pack_lanes(boxes, gap)
    assert max(lanes, default=-1) + 1 == minimum_lanes_by_brute_force(boxes, gap)


@given(st.lists(box, max_size=40), gaps)
def test_packing_is_deterministic(boxes, gap):
    assert pack_lanes(boxes, gap) == pack_lanes(list(boxes), gap)


@given(st.lists(box, max_size=40), gaps)
def test_lanes_are_numbered_from_zero_without_holes(boxes, gap):
    lanes = pack_lanes(boxes, gap)
    assert sorted(set(lanes)) == list(range(len(set(lanes))))


def test_touching_boxes_take_separate_lanes():
    # The documented rule: [0, 5] and [5, 9] share the point 5, so they cannot share a lane.
    assert pack_lanes([(0, 5), (5, 9)]) == [0, 1]
    assert pack_lanes([(0, 5), (5.001, 9)]) == [0, 0]
    assert max_overlap_depth([(0, 5), (5, 9)]) == 2


def test_gap_keeps_boxes_apart():
    assert pack_lanes([(0, 5), (6, 9)], gap=1.0) == [0, 1]
    assert pack_lanes([(0, 5), (6.5, 9)], gap=1.0) == [0, 0]


def test_lowest_free_lane_is_reused_and_ties_follow_input_order():
    boxes = [(0, 10), (0, 2), (0, 4), (3, 5), (11, 12)]
    # Equal starts: input order decides lanes 0, 1, 2. (3, 5) finds lane 1 free first
    # (lane 1 ended at 2). (11, 12) finds all free and takes lane 0.
    assert pack_lanes(boxes) == [0, 1, 2, 1, 0]


def test_empty_and_point_boxes():
    assert pack_lanes([]) == []
    assert max_overlap_depth([]) == 0
    assert pack_lanes([(3, 3), (3, 3), (4, 4)]) == [0, 1, 0]


@pytest.mark.parametrize("boxes, gap", [
    ([(5, 4)], 0.0),
    ([(0, float("nan"))], 0.0),
    ([(0, float("inf"))], 0.0),
    ([(0, 1)], -1.0),
])
def test_invalid_boxes_are_rejected(boxes, gap):
    with pytest.raises(ValueError):
        pack_lanes(boxes, gap)
    with pytest.raises(ValueError):
        max_overlap_depth(boxes, gap)


@given(st.lists(box, max_size=60), gaps)
def test_first_fit_in_start_order_is_the_compact_packing(boxes, gap):
    # Taken by start, the lowest lane whose last box ended before is the lowest free lane.
    order = sorted(range(len(boxes)), key=lambda i: boxes[i][0])
    lanes = first_fit([boxes[i] for i in order], gap)
    assert lanes == [pack_lanes(boxes, gap)[i] for i in order]


@given(st.lists(box, max_size=40), gaps)
def test_first_fit_in_any_order_never_overlaps(boxes, gap):
    assert lanes_are_disjoint(boxes, first_fit(boxes, gap), gap)


def fits_in_lane(candidate, others, gap) -> bool:
    return all(candidate[0] > o[1] + gap or o[0] > candidate[1] + gap for o in others)


@given(st.lists(small_grid_box, max_size=12), gaps, st.integers(1, 3))
def test_first_fit_respects_taken_boxes_and_the_lane_limit(boxes, gap, limit):
    pinned, rest = boxes[: len(boxes) // 3], boxes[len(boxes) // 3:]
    fixed = [(b, lane) for b, lane in zip(pinned, pack_lanes(pinned, gap)) if lane < limit]
    lanes = first_fit(rest, gap, taken=fixed, max_lanes=limit)
    placed = fixed + [(b, lane) for b, lane in zip(rest, lanes) if lane != LEFT_OUT]
    assert all(0 <= lane < limit for _, lane in placed)
    assert lanes_are_disjoint([b for b, _ in placed], [lane for _, lane in placed], gap)
    for b, lane in zip(rest, lanes):         # left out only when no lane had room
        if lane == LEFT_OUT:
            assert not any(fits_in_lane(b, [o for o, at in placed if at == candidate], gap)
                           for candidate in range(limit))


def most_by_brute_force(boxes, gap, lanes) -> int:
    # A set fits in k lanes exactly when at most k of its boxes share a point (the clique
    # bound of interval graphs, checked by the brute-force partition test above).
    for size in range(len(boxes), 0, -1):
        for subset in itertools.combinations(boxes, size):
            if depth_by_points(list(subset), gap) <= lanes:
                return size
    return 0


@settings(max_examples=300)
@given(st.lists(small_grid_box, max_size=8), gaps, st.integers(1, 3))
def test_most_that_fit_keeps_as_many_as_brute_force(boxes, gap, lanes):
    keep = most_that_fit(boxes, gap, lanes)
    kept = [b for b, k in zip(boxes, keep) if k]
    assert depth_by_points(kept, gap) <= lanes if kept else True
    assert len(kept) == most_by_brute_force(boxes, gap, lanes)


@given(st.lists(box, min_size=1, max_size=60), gaps)
def test_densest_moment_holds_that_many_boxes_throughout(boxes, gap):
    moment = densest_moment(boxes, gap)
    assert moment.depth == depth_by_points(boxes, gap)
    assert moment.start <= moment.end
    for point in (moment.start, (moment.start + moment.end) / 2, moment.end):
        assert sum(1 for s, e in boxes if s <= point <= e + gap) == moment.depth


def test_densest_moment_of_a_small_case():
    # [0, 10], [2, 6], [4, 8]: all three share 4..6.
    moment = densest_moment([(0, 10), (2, 6), (4, 8)])
    assert (moment.depth, moment.start, moment.end) == (3, 4.0, 6.0)
    assert densest_moment([]).depth == 0


def test_two_hundred_thousand_boxes_pack_in_seconds():
    # The sweep is O(n log n); a quadratic slip would take minutes here.
    import random
    import time
    rng = random.Random(7)
    boxes = [(s, s + rng.expovariate(1 / 400)) for s in
             (rng.uniform(0, 3.65e5) for _ in range(200_000))]
    began = time.perf_counter()
    lanes = pack_lanes(boxes)
    assert time.perf_counter() - began < 5.0
    assert max(lanes) + 1 == max_overlap_depth(boxes)


# --- group_records ---------------------------------------------------------------------------


def test_groups_come_in_order_of_first_start_and_keep_input_order_inside():
    records = [
        record("b1", 500, group="B"),
        record("a1", 300, group="A"),
        record("b2", 100, group="B"),    # B's earliest start is 100: B comes first
        record("a2", 200, group="A"),
        record("c1", 400, group="C"),
    ]
    groups = group_records(records, key=lambda r: r.group)
    assert [name for name, _ in groups] == ["B", "A", "C"]
    assert [[r.label for r in members] for _, members in groups] == [
        ["b1", "b2"], ["a1", "a2"], ["c1"]]


def test_open_starts_sort_first_and_undated_last():
    records = [
        record("dated", 100, group="dated"),
        record("undated", None, group="undated"),
        record("open", None, 50, group="open", open_start=True),
    ]
    groups = group_records(records, key=lambda r: r.group)
    assert [name for name, _ in groups] == ["open", "dated", "undated"]


def test_equal_first_starts_keep_order_of_appearance():
    records = [record("x", 10, group="Z"), record("y", 10, group="A")]
    assert [name for name, _ in group_records(records, key=lambda r: r.group)] == ["Z", "A"]


def test_records_without_a_group_share_one_group_named_empty():
    records = [record("x", 10, group=None), record("y", 20, group=""), record("z", 5, group="G")]
    groups = group_records(records, key=lambda r: r.group)
    assert groups[0][0] == "G"
    assert groups[1][0] == NO_GROUP == ""
    assert [r.label for r in groups[1][1]] == ["x", "y"]


# --- place and label sides -------------------------------------------------------------------

DOMAIN = (0.0, 100.0)


def place_one(start: float, end: float, width: float, pad: float = 0.0) -> PlacedRecord:
    r = record("r", 0, 1)
    placement = place([r], domain=DOMAIN, measure_spans=each_span(lambda _: (start, end)),
                      label_width=lambda _: width, label_pad=pad)
    return placement.groups[0].records[0]


LABEL_CASES = [
    # (bar, label width, pad, expected side, expected box)
    ((10, 30), 20, 0, "inside", (10, 30)),     # exactly fits
    ((10, 30), 16, 2, "inside", (10, 30)),     # 16 + 2*2 = 20 fits
    ((10, 30), 17, 2, "right", (10, 49)),      # too wide inside; right: 30 + 2 + 17 = 49
    ((10, 30), 70, 0, "right", (10, 100)),     # right edge exactly at the domain end
    ((60, 70), 40, 5, "left", (15, 70)),       # 70 + 5 + 40 > 100; left: 60 - 45 = 15
    ((40, 75), 40, 0, "left", (0, 75)),        # left edge exactly at the domain start
    ((20, 80), 70, 0, "none", (20, 80)),       # room nowhere: left out of the picture
    ((50, 50), 0, 0, "inside", (50, 50)),      # an empty label fits in a point
    ((50, 50), 5, 0, "right", (50, 55)),       # a point's label goes right
]


def test_label_cases_do_not_repeat():
    assert len({repr(case) for case in LABEL_CASES}) == len(LABEL_CASES)


@pytest.mark.parametrize("bar, width, pad, side, box", LABEL_CASES)
def test_label_side(bar, width, pad, side, box):
    placed = place_one(*bar, width, pad)
    assert placed.label_side == side
    assert (placed.box_start, placed.box_end) == box
    assert (placed.bar_start, placed.bar_end) == bar


def test_a_label_with_no_room_beside_goes_over_the_bar_before_a_key_number():
    import numpy as np

    from timelines.layout.labels import LABEL_SIDES, label_boxes

    bars = np.array([[0, 100], [0, 100], [20, 80], [10, 90]], dtype=float)
    bodies = np.array([[0, 100], [40, 60], [20, 80], [10, 90]], dtype=float)
    rooms = np.full((4, 2), np.nan)                     # no core to sit on
    widths = np.array([50, 50, 70, 60], dtype=float)
    found = label_boxes(["a", "b", "c", "d"], bars, widths, (0, 100), 2, rooms,
                        key_width=5, bodies=bodies)
    assert [LABEL_SIDES[side] for side in found.side] == ["over", "none", "key right", "over"]
    # a: 50 + 2 x 2 fits the body; b: the body is 20 wide, and neither a key nor the label
    # finds room beside; c: 70 + 4 is wider than its body, a key fits right (80 + 2 + 5);
    # d: over, though a key would fit. A label over its bar keeps the bar as its box.
    assert found.start.tolist()[::3] == [0, 10] and found.end.tolist()[::3] == [100, 90]
    without = label_boxes(["a"], bars[:1], widths[:1], (0, 100), 2, rooms[:1])
    assert LABEL_SIDES[without.side[0]] == "none"       # no bodies given: as before


def test_label_boxes_take_part_in_packing():
    # Two bars that do not overlap, but the first one's label (placed right) reaches the second.
    first, second = record("first", 0, 9), record("second", 12, 19)
    placement = place([first, second], domain=(0, 100), measure_spans=each_span(extent),
                      label_width=lambda label: 15 if label == "first" else 1)
    placed = {p.record.label: p for p in placement.groups[0].records}
    assert placed["first"].label_side == "right" and placed["first"].box_end == 25
    assert placed["second"].label_side == "inside"
    assert placement.groups[0].lanes == 2 and placed["second"].lane == 1


def test_place_separates_undated_and_packs_each_group():
    records = [
        record("a", 0, 9, "A"), record("b", 5, 14, "B"), record("lost", None, group="A"),
        record("a2", 5, 14, "A"), record("a3", 20, 29, "A"),
    ]
    placement = place(records, domain=(0, 100), measure_spans=each_span(extent), label_width=lambda label: 1,
                      group_key=lambda r: r.group)
    assert isinstance(placement, Placement)
    assert [r.label for r in placement.undated] == ["lost"]
    assert [g.name for g in placement.groups] == ["A", "B"]
    group_a = placement.groups[0]
    assert isinstance(group_a, GroupPlacement)
    assert [p.record.label for p in group_a.records] == ["a", "a2", "a3"]
    assert [p.lane for p in group_a.records] == [0, 1, 0]
    assert group_a.lanes == 2 and placement.groups[1].lanes == 1
    assert placement.lanes == 3
    assert placement.domain == (0, 100)


def test_place_without_group_key_makes_one_unnamed_group():
    records = [record("a", 0, 9, "A"), record("b", 5, 14, "B")]
    placement = place(records, domain=(0, 100), measure_spans=each_span(extent), label_width=lambda label: 1)
    assert [g.name for g in placement.groups] == [NO_GROUP]
    assert placement.groups[0].lanes == 2


def test_place_with_only_undated_records():
    placement = place([record("x", None)], domain=(0, 1), measure_spans=each_span(extent),
                      label_width=lambda label: 1)
    assert placement.groups == () and len(placement.undated) == 1


@given(st.lists(st.tuples(st.integers(0, 90), st.integers(0, 10), st.integers(0, 30),
                          st.sampled_from(["A", "B", None])), max_size=30),
       st.sampled_from([0.0, 1.0]), st.sampled_from([0.0, 0.5]))
def test_place_properties(rows, gap, pad):
    records = [record(f"r{i}", s, s + length, g) for i, (s, length, _, g) in enumerate(rows)]
    widths = {f"r{i}": float(w) for i, (_, _, w, _) in enumerate(rows)}

    def run() -> Placement:
        return place(records, domain=(0, 100), measure_spans=each_span(extent),
                     label_width=lambda label: widths[label], group_key=lambda r: r.group,
                     gap=gap, label_pad=pad)

    placement = run()
    assert placement == run()    # deterministic
    assert sum(len(g.records) for g in placement.groups) == len(records)
    for group in placement.groups:
        boxes = [(p.box_start, p.box_end) for p in group.records]
        assert lanes_are_disjoint(boxes, [p.lane for p in group.records], gap)
        assert group.lanes == max_overlap_depth(boxes, gap)
        for p in group.records:
            assert p.box_start <= p.bar_start <= p.bar_end <= p.box_end
            label_room = p.box_end - p.box_start - (p.bar_end - p.bar_start)
            if p.label_side in ("right", "left"):
                assert label_room == pytest.approx(widths[p.record.label] + pad)
                # The label itself stays inside the domain (a bar may run past it).
                assert (p.box_end <= 100 if p.label_side == "right" else p.box_start >= 0)
            else:
                assert label_room == 0


@pytest.mark.parametrize("kwargs", [
    {"domain": (10, 10)},
    {"label_pad": -1.0},
    {"measure_spans": each_span(lambda span: (5.0, 1.0))},
    {"label_width": lambda label: -1.0},
    {"gap": -0.5},
])
def test_place_rejects_invalid_arguments(kwargs):
    arguments = {"domain": (0, 100), "measure_spans": each_span(extent),
                 "label_width": lambda label: 1.0}
    arguments.update(kwargs)
    with pytest.raises(ValueError):
        place([record("a", 0, 9)], **arguments)
