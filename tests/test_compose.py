"""The compiled Scene, checked on numbers: where each part of a span is drawn."""
from __future__ import annotations

import pytest

from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.scene.encodings import SEAM_OVERLAP
from timelines.scene.measure import chart_scale
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Text, find, walk
from timelines.scene.theme import DEFAULT_THEME


def year(y: int, *qualifiers: Qualifier) -> Endpoint:
    return Endpoint(day(y, 1, 1), day(y, 12, 31), Precision.YEAR, frozenset(qualifiers))


def record(label, start, end, row=2, group=None) -> Record:
    return Record(label, Span(start, end), Provenance("test.csv", row), group=group)


def records_in(scene) -> list[Group]:
    return [p for p in walk(scene.children) if isinstance(p, Group) and p.css_class == "record"]


def parts(group: Group, kind, css: str):
    return [p for p in walk(group.children) if isinstance(p, kind) and css in p.css_class.split()]


def test_core_spans_latest_start_to_earliest_end_and_fringes_the_windows():
    rec = record("Aldous", year(1650), year(1700))
    scene = build_scene([rec, record("Other", year(1600), year(1610), row=3)])
    scale = chart_scale([rec, record("Other", year(1600), year(1610))], DEFAULT_THEME)
    [group] = [g for g in records_in(scene) if g.title.startswith("Aldous")]
    [core] = parts(group, Rect, "core")
    assert core.x == scale.x(day(1650, 12, 31))
    assert core.x + core.width == scale.x(day(1700, 1, 1))
    start_fringe, end_fringe = parts(group, GradientRect, "fringe")
    assert (start_fringe.x, start_fringe.x + start_fringe.width) == pytest.approx(
        (scale.x(day(1650, 1, 1)), scale.x(day(1650, 12, 31)) + SEAM_OVERLAP))
    assert start_fringe.opacity_left < start_fringe.opacity_right == 1.0
    assert end_fringe.x + end_fringe.width == scale.x(day(1700, 12, 31))
    assert end_fringe.opacity_left == 1.0 > end_fringe.opacity_right


def test_open_end_runs_to_the_axis_edge_with_an_arrow():
    rec = record("Shop", year(1679), Endpoint.open(Qualifier.OPEN_END))
    scene = build_scene([rec, record("Other", year(1600), year(1720), row=3)])
    scale = chart_scale([rec, record("Other", year(1600), year(1720))], DEFAULT_THEME)
    [group] = [g for g in records_in(scene) if g.title.startswith("Shop")]
    [core] = parts(group, Rect, "core")
    assert core.x + core.width == scale.x1
    [arrow] = parts(group, Polygon, "open")
    assert max(x for x, _ in arrow.points) > scale.x1


def test_unknown_end_is_a_short_stub_whatever_the_other_rows():
    # Issue 10: an empty death cell was drawn to the chart's edge, so its length depended on
    # the other rows. It is now a stub of fixed page length, from the latest possible start.
    lengths = []
    for other_end in (1720, 2100):
        rec = record("Fenna", year(1672), Endpoint.open(Qualifier.UNKNOWN_END))
        others = record("Other", year(1600), year(other_end), row=3)
        scene = build_scene([rec, others])
        scale = chart_scale([rec, others], DEFAULT_THEME)
        [group] = [g for g in records_in(scene) if g.title.startswith("Fenna")]
        assert parts(group, Rect, "core") == [] and parts(group, Polygon, "open") == []
        [stretch] = parts(group, GradientRect, "unknown")
        assert stretch.x == scale.x(day(1672, 12, 31))   # from the latest possible start
        assert stretch.x + stretch.width < scale.x1
        assert stretch.opacity_right < stretch.opacity_left < 1.0
        assert len(parts(group, Line, "unknown")) == 2    # dashed outline
        assert "possible: 1672-01-01 to not recorded" in group.title
        lengths.append(stretch.width)
    assert lengths == pytest.approx([DEFAULT_THEME.stub_length] * 2)


def test_before_and_qualifier_marks_appear_with_legend_entries():
    start = year(1630, Qualifier.UNCERTAIN)
    end = Endpoint(None, day(1689, 12, 31), Precision.YEAR, frozenset({Qualifier.BEFORE}))
    scene = build_scene([record("Bertilde", start, end)])
    [group] = records_in(scene)
    assert parts(group, Polygon, "bound")
    [glyph] = parts(group, Text, "qualifier")
    assert glyph.text == "?"
    legend = " ".join(t.text for t in find(scene, "legend-text"))
    assert "uncertain" in legend and "before" in legend
    assert "open" not in legend and "approximate" not in legend   # only marks that occur


def test_point_is_a_diamond_and_undated_records_are_noted():
    point = Endpoint.day(day(1651, 6, 12))
    undated = Record("Portrait", None, Provenance("test.csv", 5))
    scene = build_scene([record("Chapel organ", point, point), undated])
    [group] = records_in(scene)
    assert parts(group, Polygon, "point")
    notes = " ".join(t.text for t in find(scene, "note"))
    assert "Portrait (row 5)" in notes


def test_groups_get_headers_in_order_of_first_start():
    recs = [record("b", year(1700), year(1710), group="Later"),
            record("a", year(1600), year(1610), row=3, group="Earlier")]
    scene = build_scene(recs)
    headers = [t.text for t in find(scene, "group-label")]
    assert headers == ["Earlier", "Later"]


def test_records_in_one_group_never_overlap_in_a_lane():
    recs = [record(f"r{i}", year(1600 + 5 * i), year(1640 + 5 * i), row=i + 2) for i in range(8)]
    scene = build_scene(recs)
    bars = []
    for group in records_in(scene):
        shapes = [p for p in walk(group.children) if isinstance(p, (Rect, GradientRect))]
        bars.append((min(s.y for s in shapes), min(s.x for s in shapes),
                     max(s.x + s.width for s in shapes)))
    for i, (y, x0, x1) in enumerate(bars):
        for y2, a, b in bars[i + 1:]:
            assert y != y2 or b <= x0 or a >= x1


def test_tooltip_holds_label_written_date_and_bounds():
    rec = Record("Corwin", Span(year(1641), year(1702)), Provenance("guild.csv", 4),
                 start_text="1641", end_text="1702")
    [group] = records_in(build_scene([rec]))
    assert group.title.splitlines() == [
        "Corwin", "written: 1641 – 1702", "possible: 1641-01-01 to 1702-12-31",
        "certain: 1641-12-31 to 1702-01-01", "source: guild.csv:4"]


def test_bc_axis_labels_have_no_year_zero():
    recs = [record("Dynasty", year(-299), year(149))]   # 300 BC .. AD 150 in astronomical years
    labels = [t.text for t in find(build_scene(recs), "tick-label")]
    assert any(label.endswith("BCE") for label in labels)
    assert "0" not in labels and "0 BCE" not in labels


def test_an_end_window_reaching_back_past_the_start_is_drawn_from_the_start():
    # 562 BC (astronomical -561) to "6th century BC": the end cannot lie before the start
    start = Endpoint(day(-561, 1, 1), day(-561, 12, 31), Precision.YEAR)
    end = Endpoint(day(-598, 1, 1), day(-499, 12, 31), Precision.CENTURY)
    rec = record("Sapir II", start, end)
    [group] = records_in(build_scene([rec]))
    scale = chart_scale([rec], DEFAULT_THEME)
    shapes = [p for p in walk(group.children) if isinstance(p, (Rect, GradientRect))]
    assert min(s.x for s in shapes) == pytest.approx(scale.x(day(-561, 1, 1)), abs=SEAM_OVERLAP)
