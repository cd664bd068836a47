"""The colour key (issue 10): a heading naming its column, the smallest values merged on
request, a warning when colours would repeat, and marks shown neutral when colour is a column."""
from __future__ import annotations

from timelines import Chart
from timelines.scene.primitives import GradientRect, Rect, Text, walk
from timelines.scene.theme import OKABE_ITO

KINDS = ["brig"] * 6 + ["sloop"] * 5 + ["hoy"] * 4 + ["ketch"] * 3 + ["yawl"] * 2 + ["smack",
         "cutter", "lugger", "barque"]
ROWS = [{"name": f"Vessel {i}", "kind": kind, "start": str(1700 + i), "end": str(1720 + i)}
        for i, kind in enumerate(KINDS)]


def _legend(chart: Chart):
    [legend] = [g for g in chart.scene().children if g.css_class == "legend"]
    return list(walk(legend.children))


def test_the_colour_key_is_headed_by_its_column():
    chart = Chart(ROWS, label="name", color="kind")
    texts = [t for t in _legend(chart) if isinstance(t, Text)]
    [heading] = [t for t in texts if "legend-heading" in t.css_class]
    assert heading.text == "kind:" and heading.weight == "bold"
    values = [t.text for t in texts if t.x > heading.x and t.y == heading.y]
    assert values[:3] == ["brig", "sloop", "hoy"]             # first appearance


def test_marks_in_the_legend_are_neutral_when_colour_is_a_column():
    coloured = Chart(ROWS, label="name", color="kind")
    items = _legend(coloured)
    [heading] = [t for t in items if isinstance(t, Text) and "legend-heading" in t.css_class]
    marks = [p for p in items if isinstance(p, (Rect, GradientRect))
             and p.css_class in ("core", "fringe") and p.y < heading.y - 10]   # rows above it
    assert marks and {m.fill for m in marks} == {coloured.options.theme.neutral_color}
    plain = Chart(ROWS, label="name")
    marks = [p for p in _legend(plain) if isinstance(p, Rect) and p.css_class == "core"]
    assert {m.fill for m in marks} == {OKABE_ITO[0]}


def test_more_values_than_colours_is_said():
    chart = Chart(ROWS, label="name", color="kind")
    [warning] = [w for w in chart.warnings if "colour column" in w]
    assert "'kind' has 9 values and the palette 8 colours" in warning
    assert "--max-colors 8" in warning


def test_max_colors_merges_the_smallest_values():
    chart = Chart(ROWS, label="name", color="kind").style(max_colors=4)
    texts = [t.text for t in _legend(chart) if isinstance(t, Text)]
    assert texts[-4:] == ["brig", "sloop", "hoy", "other (6 values)"]
    fills = {p.fill for p in walk(chart.scene().children) if isinstance(p, Rect)
             and p.css_class == "core"}
    assert len(fills - {chart.options.theme.neutral_color}) == 4
    assert not [w for w in chart.warnings if "colour column" in w]
