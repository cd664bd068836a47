"""place() with LaneRules: groups and subgroups, their order, merged small groups, the three
packings, sort keys, pinned lanes and the lane limit.

Oracles: the packing properties are checked against brute force and point counting in
test_layout.py; here each rule is checked on hand-made cases and on random ones for the
properties the issue names (no overlap, compact = overlap depth, single = one lane each,
shuffled input = same lanes, nothing lost).
"""
from __future__ import annotations

import random

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from timelines.layout import (
    LaneRules, Placement, UnknownGroup, each_span, group_tree, max_overlap_depth, natural_key,
    place,
)
from timelines.model import Endpoint, Provenance, Record, Span


def record(label: str, start: int, end: int, group: str | None = None, row: int = 2,
           **fields: str) -> Record:
    return Record(label, Span(Endpoint.day(start), Endpoint.day(end)),
                  Provenance("test.csv", row), group=group, fields=tuple(fields.items()))


def extent(span: Span) -> tuple[float, float]:
    return float(span.start.earliest), float(span.end.latest + 1)


def arrange(records, rules=LaneRules(), gap=0.0, width=lambda label: 0.0, group=True) -> Placement:
    return place(records, domain=(0, 1000), measure_spans=each_span(extent), label_width=width,
                 group_key=(lambda r: r.group) if group else None, gap=gap, rules=rules)


def lanes_of(placement: Placement) -> dict[str, tuple[tuple[str, ...], int]]:
    return {p.record.label: (path, p.lane) for path, group in placement.leaves()
            for p in group.records}


def field(name):
    return lambda r: dict(r.fields).get(name)


# --- grouping, order, merging ------------------------------------------------------------


def test_group_orders():
    records = [record("a", 50, 60, "Beta", 2), record("b", 10, 20, "alpha", 3),
               record("c", 30, 40, "Gamma 10", 4), record("d", 35, 45, "Gamma 10", 5),
               record("e", 70, 80, "Gamma 2", 6)]

    def names(order):
        return [g.name for g in arrange(records, LaneRules(group_order=order)).groups]

    assert names("first") == ["alpha", "Gamma 10", "Beta", "Gamma 2"]
    assert names("name") == ["alpha", "Beta", "Gamma 2", "Gamma 10"]    # numbers by value
    assert names("size") == ["Gamma 10", "alpha", "Beta", "Gamma 2"]    # ties by first start
    assert names(("gamma 2", "Beta")) == ["Gamma 2", "Beta", "alpha", "Gamma 10"]


def test_an_unknown_group_in_an_explicit_order_is_an_error():
    with pytest.raises(UnknownGroup) as raised:
        arrange([record("a", 1, 2, "Masters")], LaneRules(group_order=("Master",)))
    assert raised.value.name == "Master" and "Masters" in raised.value.known


def test_small_groups_merge_into_a_remainder_group_placed_last():
    records = [record(f"w{i}", i * 10, i * 10 + 5, "Weavers", i + 2) for i in range(4)]
    records += [record("c", 0, 5, "Clerks", 10), record("b", 3, 9, "Bell-ringers", 11),
                record("d", 200, 300, "Dyers", 12), record("d2", 250, 350, "Dyers", 13)]
    placement = arrange(records, LaneRules(min_group_size=2, other_group="Others"))
    assert [g.name for g in placement.groups] == ["Weavers", "Dyers", "Others"]
    assert placement.groups[-1].merged == ("Clerks", "Bell-ringers")
    assert sorted(p.record.label for p in placement.groups[-1].records) == ["b", "c"]


def test_one_small_group_alone_keeps_its_name():
    records = [record("a", 0, 5, "Big", 2), record("b", 6, 9, "Big", 3),
               record("c", 0, 5, "Small", 4)]
    assert [g.name for g in arrange(records, LaneRules(min_group_size=2)).groups] == [
        "Big", "Small"]


def test_records_without_a_group_come_last_when_sorted_by_name():
    records = [record("x", 0, 5, None, 2), record("y", 10, 15, "B", 3),
               record("z", 20, 25, "A", 4)]
    assert [g.name for g in arrange(records, LaneRules(group_order="name")).groups] == [
        "A", "B", ""]


def test_subgroups_nest_inside_groups_each_with_their_own_lanes():
    records = [record("a", 0, 10, "North", 2, role="master"),
               record("b", 0, 10, "North", 3, role="journeyman"),
               record("c", 0, 10, "North", 4, role="master"),
               record("d", 5, 15, "South", 5, role="master")]
    placement = arrange(records, LaneRules(subgroup_key=field("role"), subgroup_order="name"))
    north, south = placement.groups
    assert [s.name for s in north.subgroups] == ["journeyman", "master"]
    assert north.records == () and north.lanes == 1 + 2 == sum(s.lanes for s in north.subgroups)
    assert [path for path, _ in placement.leaves()] == [
        ("North", "journeyman"), ("North", "master"), ("South", "master")]
    assert placement.lanes == 4


def test_small_subgroups_merge_inside_each_group():
    records = [record(f"m{i}", i * 20, i * 20 + 5, "North", i + 2, role="master")
               for i in range(3)]
    records += [record("j", 0, 5, "North", 10, role="journeyman"),
                record("w", 0, 5, "North", 11, role="warden")]
    rules = LaneRules(subgroup_key=field("role"), min_subgroup_size=2, min_group_size=99)
    [north] = group_tree(records, lambda r: r.group, rules)
    assert [(s.name, s.merged) for s in north.subgroups] == [
        ("master", ()), ("Other", ("journeyman", "warden"))]


# --- packings and sort keys --------------------------------------------------------------

PACKED = [record("long", 0, 90, row=2), record("short", 0, 10, row=3),
          record("mid", 20, 50, row=4), record("late", 60, 70, row=5)]


def test_compact_uses_the_fewest_lanes():
    assert {k: v[1] for k, v in lanes_of(arrange(PACKED)).items()} == {
        "long": 0, "short": 1, "mid": 1, "late": 1}


def test_ordered_keeps_the_sort_order_top_to_bottom():
    rules = LaneRules(pack="ordered", sort="duration")
    # shortest first: short (10) lane 0, mid (30) fits lane 0, late (10)... by duration:
    # short 11, late 11, mid 31, long 91 -> short 0, late 0, mid 0, long 1
    assert {k: v[1] for k, v in lanes_of(arrange(PACKED, rules)).items()} == {
        "short": 0, "late": 0, "mid": 0, "long": 1}
    descending = LaneRules(pack="ordered", sort="duration", descending=True)
    assert {k: v[1] for k, v in lanes_of(arrange(PACKED, descending)).items()} == {
        "long": 0, "mid": 1, "short": 1, "late": 1}


def test_single_gives_each_record_its_own_lane_in_sort_order():
    rules = LaneRules(pack="single", sort="label")
    assert {k: v[1] for k, v in lanes_of(arrange(PACKED, rules)).items()} == {
        "late": 0, "long": 1, "mid": 2, "short": 3}
    by_end = LaneRules(pack="single", sort="end", descending=True)
    assert [k for k, _ in sorted(lanes_of(arrange(PACKED, by_end)).items(),
                                 key=lambda item: item[1][1])] == ["long", "late", "mid",
                                                                   "short"]


def test_sort_by_a_column_compares_numbers_by_value_and_puts_empty_cells_last():
    records = [record("a", 0, 5, row=2, rank="10"), record("b", 0, 5, row=3, rank="9"),
               record("c", 0, 5, row=4, rank=""), record("d", 0, 5, row=5, rank="1.5")]
    rules = LaneRules(pack="single", sort=field("rank"))
    assert {k: v[1] for k, v in lanes_of(arrange(records, rules)).items()} == {
        "d": 0, "b": 1, "a": 2, "c": 3}
    assert natural_key("Phase 2") < natural_key("Phase 10") < natural_key("phase 11")


# --- pins and the lane limit -------------------------------------------------------------


def test_a_pinned_record_takes_its_lane_and_the_rest_pack_around_it():
    records = [record("free", 0, 10, row=2), record("pinned", 0, 10, row=3, lane="2"),
               record("later", 20, 30, row=4)]
    placement = arrange(records, LaneRules(lane_of=field("lane")))
    assert {k: v[1] for k, v in lanes_of(placement).items()} == {
        "free": 0, "pinned": 1, "later": 0}
    assert placement.notes == ()


@pytest.mark.parametrize("pin, reason", [
    ("x", "lane 'x' is not a lane number (1, 2, ...); placed with the others"),
    ("0", "lane '0' is not a lane number (1, 2, ...); placed with the others"),
    ("5", "lane 5 lies beyond the 3 lanes allowed; placed with the others"),
    ("1", "lane 1 is taken there by row 2 (first); placed with the others"),
])
def test_a_pin_that_cannot_be_kept_is_noted_and_the_record_still_drawn(pin, reason):
    records = [record("first", 0, 10, row=2, lane="1"), record("second", 5, 15, row=3,
                                                               lane=pin)]
    placement = arrange(records, LaneRules(lane_of=field("lane"), max_lanes=3))
    [note] = placement.notes
    assert (note.record.label, note.kind, note.reason) == ("second", "pin", reason)
    assert lanes_of(placement)["second"][1] == 1


def test_max_lanes_leaves_out_the_fewest_and_reports_each():
    # Five boxes over one moment, room for two: three are left out and noted.
    records = [record(f"r{i}", 0, 10 + i, "G", row=i + 2) for i in range(5)]
    records.append(record("after", 50, 60, "G", row=9))
    placement = arrange(records, LaneRules(max_lanes=2))
    group = placement.groups[0]
    assert group.lanes == 2 and len(group.records) == 3
    assert len(group.left_out) == 3 == len(placement.left_out)
    assert {n.kind for n in placement.notes} == {"left out"}
    assert all(n.reason == "no room within the 2 lanes allowed in 'G'" for n in placement.notes)
    assert "after" in lanes_of(placement)


def test_ordered_with_max_lanes_keeps_the_first_in_sort_order():
    records = [record(f"r{i}", 0, 10, row=i + 2, rank=str(5 - i)) for i in range(4)]
    rules = LaneRules(pack="ordered", sort=field("rank"), max_lanes=2)
    placement = arrange(records, rules)
    assert sorted(lanes_of(placement)) == ["r2", "r3"]          # ranks 3 and 2 lost to 1, 2


# --- properties on random cases ----------------------------------------------------------

random_rows = st.lists(st.tuples(st.integers(0, 300), st.integers(0, 60), st.integers(0, 40),
                                 st.sampled_from(["A", "B", "C", None]),
                                 st.sampled_from(["", "", "1", "2", "3", "x"])),
                       max_size=40)
random_rules = st.builds(
    LaneRules, pack=st.sampled_from(["compact", "ordered", "single"]),
    sort=st.sampled_from(["start", "end", "duration", "label"]), descending=st.booleans(),
    max_lanes=st.sampled_from([None, None, 1, 2, 4]), min_group_size=st.sampled_from([0, 3]),
    lane_of=st.sampled_from([None, field("lane")]),
    subgroup_key=st.sampled_from([None, field("kind")]))


def records_from(rows) -> list[Record]:
    # Each label carries its own width, as "r<i>w<width>": place() measures label texts.
    return [record(f"r{i}w{width}", start, start + length, group, row=i + 2, lane=pin,
                   kind="even" if start % 2 else "odd")
            for i, (start, length, width, group, pin) in enumerate(rows)]


def label_width(label: str) -> float:
    return float(label.split("w")[1])


@settings(max_examples=200)
@given(random_rows, random_rules, st.sampled_from([0.0, 2.0]))
def test_placement_properties(rows, rules, gap):
    records = records_from(rows)
    placement = arrange(records, rules, gap, label_width)
    placed = [(path, p) for path, group in placement.leaves() for p in group.records]
    # nothing lost: each record is placed once or left out (and noted) once
    assert sorted([p.record.label for _, p in placed] + [r.label for r in placement.left_out]
                  ) == sorted(r.label for r in records)
    for path, group in placement.leaves():
        boxes = [(p.box_start, p.box_end) for p in group.records]
        lanes = [p.lane for p in group.records]
        for i, a in enumerate(group.records):      # no two boxes in a lane share a point
            for b in group.records[i + 1:]:
                if a.lane == b.lane:
                    assert b.box_start > a.box_end + gap or a.box_start > b.box_end + gap
        if rules.max_lanes is not None:
            assert group.lanes <= rules.max_lanes
        if rules.pack == "compact" and rules.lane_of is None:
            assert group.lanes == max_overlap_depth(boxes, gap)
        if rules.pack == "single":
            assert len(set(lanes)) == len(lanes)
            if rules.lane_of is None:
                assert sorted(lanes) == list(range(len(lanes)))
    pinned_notes = {n.record.label for n in placement.notes if n.kind == "pin"}
    for _, p in placed:                           # a pin is kept unless a note says why not
        pin = dict(p.record.fields)["lane"]
        if rules.lane_of is not None and pin.isdigit() and p.record.label not in pinned_notes:
            assert p.lane == int(pin) - 1


@settings(max_examples=150)
@given(random_rows, random_rules, st.randoms(use_true_random=False))
def test_shuffled_input_gets_the_same_lanes(rows, rules, rng):
    records = records_from(rows)
    shuffled = records[:]
    rng.shuffle(shuffled)
    first = arrange(records, rules, 1.0, label_width)
    second = arrange(shuffled, rules, 1.0, label_width)
    assert lanes_of(first) == lanes_of(second)
    assert {r.label for r in first.left_out} == {r.label for r in second.left_out}


def test_a_large_group_places_quickly():
    rng = random.Random(3)
    records = [record(f"r{i}", s, s + rng.randint(0, 400), rng.choice("ABCD"), row=i + 2)
               for i, s in enumerate(rng.randint(0, 100_000) for _ in range(20_000))]
    placement = place(records, domain=(0, 101_000), measure_spans=each_span(extent),
                      label_width=lambda label: 30.0, group_key=lambda r: r.group)
    assert sum(len(g.records) for g in placement.groups) == 20_000
