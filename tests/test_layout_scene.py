"""The layout as drawn: group and subgroup headers, separators, the row of records left out,
and labels that never collide with another record's label or marks.

Label boxes are measured with timelines.textsize (DejaVu Sans advance widths and its hhea
ascent/descent), the same measure the layout packs with and both renderers draw with.
"""
from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene
from timelines.layout.settings import LaneSettings
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Text, find, walk
from timelines.scene.textsize import text_ascent, text_descent, text_width


def year(y: int, *qualifiers: Qualifier) -> Endpoint:
    return Endpoint(day(y, 1, 1), day(y, 12, 31), Precision.YEAR, frozenset(qualifiers))


def record(label, start, end, row=2, group=None, **fields) -> Record:
    return Record(label, Span(start, end), Provenance("test.csv", row), group=group,
                  fields=tuple(fields.items()))


def records_in(scene) -> list[Group]:
    return [p for p in walk(scene.children) if isinstance(p, Group) and p.css_class == "record"]


def texts(scene, css: str) -> list[str]:
    return [t.text for t in find(scene, css) if isinstance(t, Text)]


# --- headers and separators --------------------------------------------------------------


def test_subgroups_get_a_header_row_their_names_and_dashed_separators():
    recs = [record("a", year(1600), year(1640), 2, "North", role="master"),
            record("b", year(1610), year(1650), 3, "North", role="journeyman"),
            record("c", year(1620), year(1660), 4, "South", role="master"),
            record("d", year(1630), year(1670), 5, "South", role="warden")]
    scene = build_scene(recs, lanes=LaneSettings(subgroup="role", subgroup_order="name"))
    assert texts(scene, "group-label") == ["North", "South"]
    assert texts(scene, "subgroup-label") == ["journeyman", "master", "master", "warden"]
    assert len(find(scene, "separator")) == 1                # between North and South
    dashed = [line for line in find(scene, "subgroup-separator") if isinstance(line, Line)]
    assert len(dashed) == 2 and all(line.dash for line in dashed)
    north = next(p for p in walk(scene.children)
                 if isinstance(p, Group) and p.id == "group-1")
    assert [g.id for g in north.children if isinstance(g, Group)] == ["group-1-1",
                                                                       "group-1-2"]
    # the group header sits on its own row, above its first subgroup's first lane
    [header] = [t for t in find(scene, "group-label") if t.text == "North"]
    [first_sub] = [t for t in find(scene, "subgroup-label") if t.text == "journeyman"]
    assert first_sub.y - header.y == pytest.approx(22.0)     # one lane height


def test_a_merged_group_names_its_members_in_a_tooltip():
    recs = [record(f"w{i}", year(1600 + 10 * i), year(1605 + 10 * i), i + 2, "Weavers")
            for i in range(3)]
    recs += [record("c", year(1600), year(1610), 9, "Clerks"),
             record("b", year(1620), year(1630), 10, "Bell-ringers")]
    scene = build_scene(recs, lanes=LaneSettings(min_group_size=2))
    assert texts(scene, "group-label") == ["Weavers", "Other"]
    [header] = find(scene, "group-header")
    assert header.title == "Other: Clerks, Bell-ringers (small groups merged)"


def test_records_without_a_group_are_captioned_when_others_have_one():
    recs = [record("a", year(1600), year(1610), 2, "Named"),
            record("b", year(1620), year(1630), 3, None)]
    assert texts(build_scene(recs), "group-label") == ["Named", "(none)"]
    assert texts(build_scene([record("x", year(1600), year(1610))]), "group-label") == []


def test_a_long_group_name_is_cut_with_an_ellipsis_inside_its_column():
    name = "The Worshipful Company of Tenter-keepers, Fullers and Shearmen of the Vale"
    scene = build_scene([record("a", year(1600), year(1610), 2, name),
                         record("b", year(1600), year(1610), 3, "Dyers")])
    [caption] = [t for t in find(scene, "group-label") if t.text != "Dyers"]
    assert caption.text.endswith("…") and name.startswith(caption.text[:-1])
    plot_left = min(r.x for g in records_in(scene) for r in walk(g.children)
                    if isinstance(r, (Rect, GradientRect)))
    assert caption.x + text_width(caption.text, caption.size, "bold") < plot_left


def test_records_left_out_get_a_row_saying_so_with_every_name_in_its_tooltip():
    recs = [record(f"r{i}", year(1600), year(1650 + i), i + 2, "G") for i in range(5)]
    scene = build_scene(recs, lanes=LaneSettings(max_lanes=2, labels="none"))
    assert len(records_in(scene)) == 2
    [row] = [g for g in find(scene, "left-out") if isinstance(g, Group)]
    [line] = [t for t in walk(row.children) if isinstance(t, Text)]
    assert line.text.startswith("3 more not drawn, no room left in these lanes: ")
    assert row.title.count("(row ") == 3


def test_a_lane_gap_in_years_keeps_bars_apart_by_that_much():
    recs = [record("a", year(1600), year(1620)), record("b", year(1630), year(1650), 3)]
    together = build_scene(recs, lanes=LaneSettings(lane_gap="5y", labels="none"))
    apart = build_scene(recs, lanes=LaneSettings(lane_gap="15y", labels="none"))

    def lanes(scene) -> int:
        return len({min(p.y for p in walk(g.children) if isinstance(p, Rect))
                    for g in records_in(scene)})

    assert lanes(together) == 1 and lanes(apart) == 2


# --- labels never collide ----------------------------------------------------------------

Box = tuple[float, float, float, float]   # x0, y0, x1, y1


def label_box(text: Text) -> Box:
    width = text_width(text.text, text.size, text.weight)
    x0 = {"start": text.x, "middle": text.x - width / 2, "end": text.x - width}[text.anchor]
    return x0, text.y - text_ascent(text.size), x0 + width, text.y + text_descent(text.size)


def mark_box(mark) -> Box | None:
    if isinstance(mark, (Rect, GradientRect)):
        return mark.x, mark.y, mark.x + mark.width, mark.y + mark.height
    if isinstance(mark, Line):
        return min(mark.x1, mark.x2), min(mark.y1, mark.y2), max(mark.x1, mark.x2), max(
            mark.y1, mark.y2)
    if isinstance(mark, Polygon):
        xs, ys = [x for x, _ in mark.points], [y for _, y in mark.points]
        return min(xs), min(ys), max(xs), max(ys)
    if isinstance(mark, Text):
        return label_box(mark)
    return None


def overlap(a: Box, b: Box) -> bool:
    eps = 0.01
    return a[0] < b[2] - eps and b[0] < a[2] - eps and a[1] < b[3] - eps and b[1] < a[3] - eps


def parts_of(group: Group):
    labels = [p for p in walk(group.children) if isinstance(p, Text)
              and "label" in p.css_class.split()]
    marks = [box for p in walk(group.children) if p not in labels
             for box in [mark_box(p)] if box is not None]
    return labels, marks


def window_holds(record: Record, start: str, end: str) -> bool:
    """Whether the record's possible extent reaches into the years start..end."""
    low, high = record.span.possible_extent
    return ((low is None or low <= day(int(end), 12, 31))
            and (high is None or high >= day(int(start), 1, 1)))


def signs(group: Group) -> list[Box]:
    """The boxes of a record's marks other than its label and the bar's body (the core, the
    fringes, the plate under a label): its signs, brackets, arrows and lines."""
    return [box for p in walk(group.children)
            if not isinstance(p, (Rect, GradientRect)) and not (
                isinstance(p, Text) and "label" in p.css_class.split())
            for box in [mark_box(p)] if box is not None]


endpoints = st.sampled_from(["plain", "approximate", "uncertain", "both", "before", "after",
                             "decade", "half century"])
labels = st.text(alphabet="WMmiIl1 .éAVlong-word", min_size=0, max_size=40)


def endpoint(y: int, kind: str) -> Endpoint:
    qualifiers = {"plain": (), "approximate": (Qualifier.APPROXIMATE,),
                  "uncertain": (Qualifier.UNCERTAIN,),
                  "both": (Qualifier.APPROXIMATE, Qualifier.UNCERTAIN)}
    if kind == "before":
        return Endpoint(None, day(y, 12, 31), Precision.YEAR, frozenset({Qualifier.BEFORE}))
    if kind == "after":
        return Endpoint(day(y, 1, 1), None, Precision.YEAR, frozenset({Qualifier.AFTER}))
    if kind in ("decade", "half century"):         # a wide window: a long fade, maybe no core
        first = y - y % (10 if kind == "decade" else 50)
        return Endpoint(day(first, 1, 1), day(first + (9 if kind == "decade" else 49), 12, 31),
                        Precision.DECADE)
    return year(y, *qualifiers[kind])


@st.composite
def random_records(draw):
    count = draw(st.integers(1, 25))
    result = []
    for row in range(count):
        start = draw(st.integers(1600, 1690))
        end = start + draw(st.integers(0, 40))
        kinds = draw(st.tuples(endpoints, endpoints))
        first = endpoint(start, kinds[0] if kinds[0] != "after" else "plain")
        last = endpoint(end, kinds[1] if kinds[1] != "after" else "plain")
        span = Span.point(first) if draw(st.booleans()) and kinds[0] == "plain" else Span(
            first, last)
        result.append(Record(draw(labels), span, Provenance("t.csv", row + 2),
                             group=draw(st.sampled_from(["A", "B", None]))))
    return result


@settings(max_examples=150, deadline=None)
@given(random_records(), st.sampled_from(["compact", "ordered", "single"]),
       st.sampled_from(["3px", "0px", "2y"]), st.sampled_from([700.0, 960.0]),
       st.sampled_from([None, ("1640", "1650"), ("1620", "1700")]))
def test_labels_never_collide_with_other_labels_or_marks(records, pack, gap, width, window):
    # A --from/--to window cuts bars at its edges, and a bar across all of it has no room
    # beside it: its label stands over it ("over"), which must keep clear of its signs.
    from timelines.chart import parse_window
    from timelines.scene.theme import DEFAULT_THEME
    if window is not None and not any(window_holds(r, *window) for r in records):
        window = None                                # no record in it: a usage error
    scene = build_scene(records, DEFAULT_THEME.with_options(width=width),
                        lanes=LaneSettings(pack=pack, lane_gap=gap, sort="label"),
                        window=parse_window(*window) if window else None)
    groups = records_in(scene)
    drawn = [parts_of(g) for g in groups]
    for i, (own_labels, own_marks) in enumerate(drawn):
        for label in own_labels:
            box = label_box(label)
            assert box[0] >= 0 and box[2] <= scene.width       # on the page
            if "over" in label.css_class.split():    # on its bar's body, clear of its signs
                assert not any(overlap(box, mark) for mark in signs(groups[i])), label.text
            elif "inside" not in label.css_class.split():      # beside: clear of its own bar
                assert not any(overlap(box, mark) for mark in own_marks), label.text
            for j, (other_labels, other_marks) in enumerate(drawn):
                if i != j:
                    assert not any(overlap(box, mark) for mark in other_marks), label.text
                    assert not any(overlap(box, label_box(t)) for t in other_labels), label.text


@settings(max_examples=60, deadline=None)
@given(random_records())
def test_every_label_is_drawn_or_kept_in_its_tooltip(records):
    scene = build_scene(records)
    for group in records_in(scene):
        label = group.title.splitlines()[0]
        drawn = [t.text for t in walk(group.children) if isinstance(t, Text)
                 and "label" in t.css_class.split()]
        assert drawn in ([], [label]) or (drawn == [] and label == "(no label)")
        assert group.title.startswith(label)
