"""Geometry of each mark, on numbers (STYLE.md: assert coordinates, not pixels)."""
from __future__ import annotations

import pytest

from timelines.errors import UsageError
from timelines.scene import encodings as marks
from timelines.scene.encodings import EndWindow, LaneBox, MarkStyle
from timelines.scene.primitives import GradientRect, Line, Polygon, Rect, Text
from timelines.scene.scale import TimeScale

SCALE = TimeScale(0.0, 100.0, 50.0, 250.0)   # 2 px per day, x = 50 + 2 * day
LANE = LaneBox(10.0, 12.0)
STYLE = MarkStyle("#0072B2", far_opacity=0.1)


def test_core_is_a_solid_rect_from_low_to_high():
    [rect] = marks.core(10, 30, SCALE, LANE, STYLE)
    assert isinstance(rect, Rect)
    assert (rect.x, rect.y, rect.width, rect.height) == (70.0, 10.0, 40.0, 12.0)
    assert rect.fill == "#0072B2" and rect.opacity == 1.0


def test_fade_on_a_start_window_is_faint_at_its_earliest_bound():
    [fade] = marks.fade(EndWindow(10, 20, "start"), SCALE, LANE, STYLE)
    assert isinstance(fade, GradientRect)
    # x(10) .. x(20), reaching SEAM_OVERLAP under the core so no light seam shows
    assert (fade.x, fade.width) == (70.0, 20.0 + marks.SEAM_OVERLAP)
    assert (fade.opacity_left, fade.opacity_right) == (0.1, 1.0)


def test_fade_on_an_end_window_is_faint_at_its_latest_bound():
    [fade] = marks.fade(EndWindow(40, 60, "end"), SCALE, LANE, STYLE)
    assert (fade.x, fade.width) == (130.0 - marks.SEAM_OVERLAP, 40.0 + marks.SEAM_OVERLAP)
    assert (fade.opacity_left, fade.opacity_right) == (1.0, 0.1)


def test_an_exact_endpoint_has_no_fringe():
    for name, encoder in marks.FRINGES.items():
        assert encoder(EndWindow(20, 20, "start"), SCALE, LANE, STYLE) == [], name


def test_whisker_runs_across_the_window_with_a_cap_at_the_far_bound():
    line, cap = marks.whisker(EndWindow(40, 60, "end"), SCALE, LANE, STYLE)
    assert isinstance(line, Line) and (line.x1, line.x2) == (130.0, 170.0)
    assert line.y1 == line.y2 == LANE.middle
    assert cap.x1 == cap.x2 == 170.0 and cap.y1 < LANE.middle < cap.y2


def test_open_arrow_points_outward_from_the_axis_edge():
    [start] = marks.open_arrow(0, "start", SCALE, LANE, STYLE)
    [end] = marks.open_arrow(100, "end", SCALE, LANE, STYLE)
    assert isinstance(start, Polygon)
    assert min(x for x, _ in start.points) < 50.0 == max(x for x, _ in start.points)
    assert max(x for x, _ in end.points) > 250.0 == min(x for x, _ in end.points)


def test_bound_brackets_open_toward_where_the_date_may_lie():
    [before] = marks.bound_bracket(50, "before", SCALE, LANE, STYLE)
    [after] = marks.bound_bracket(50, "after", SCALE, LANE, STYLE)
    assert not before.closed and max(x for x, _ in before.points) == 150.0
    assert min(x for x, _ in before.points) < 150.0     # arms reach back: ']'
    assert min(x for x, _ in after.points) == 150.0
    assert max(x for x, _ in after.points) > 150.0      # arms reach forward: '['


def test_qualifier_glyphs_are_the_iso_8601_2_signs_outside_the_bar_end():
    # ISO 8601-2:2019 §8: '~' approximate, '?' uncertain ('%' both; we print '~?').
    [start] = marks.qualifier_glyph(10, "start", "approximate", SCALE, LANE, STYLE)
    [end] = marks.qualifier_glyph(60, "end", "uncertain", SCALE, LANE, STYLE)
    assert isinstance(start, Text) and start.text == "~" and start.anchor == "end"
    assert start.x < 70.0
    assert end.text == "?" and end.anchor == "start" and end.x > 170.0


def test_point_marker_is_a_diamond_centred_on_its_day():
    [diamond] = marks.point_marker(25, SCALE, LANE, STYLE)
    xs = [x for x, _ in diamond.points]
    ys = [y for _, y in diamond.points]
    assert (min(xs) + max(xs)) / 2 == 100.0
    assert (min(ys) + max(ys)) / 2 == LANE.middle


def test_likely_tick_crosses_the_bar():
    [tick] = marks.likely_tick(30, SCALE, LANE, STYLE)
    assert tick.x1 == tick.x2 == 110.0 and tick.y1 < LANE.y and tick.y2 > LANE.y + LANE.height


def test_unknown_fringe_name_suggests_the_closest():
    with pytest.raises(UsageError) as caught:
        marks.fringe_encoder("fad")
    assert caught.value.hint == "did you mean 'fade'?"


def test_unknown_stretch_is_a_paler_fade_inside_a_dashed_outline():
    fade, top, bottom = marks.unknown_stretch(EndWindow(40, 100, "end"), SCALE, LANE, STYLE)
    assert isinstance(fade, GradientRect) and (fade.x, fade.x + fade.width) == (130.0, 250.0)
    assert fade.opacity_left < 1.0 and fade.opacity_right < fade.opacity_left
    assert top.dash and bottom.dash and (top.y1, bottom.y1) == (LANE.y, LANE.y + LANE.height)


def test_hatch_lines_stay_inside_the_window_at_45_degrees():
    fill, *lines = marks.hatch(EndWindow(10, 30, "start"), SCALE, LANE, STYLE)
    assert isinstance(fill, Rect) and (fill.x, fill.width) == (70.0, 40.0) and fill.opacity < 1
    assert len(lines) >= 40 / marks.HATCH_SPACING
    for line in lines:
        assert 70.0 <= min(line.x1, line.x2) and max(line.x1, line.x2) <= 110.0
        assert LANE.y <= min(line.y1, line.y2) and max(line.y1, line.y2) <= LANE.y + LANE.height
        assert abs(abs(line.x2 - line.x1) - abs(line.y2 - line.y1)) < 1e-9   # 45 degrees


def test_dots_thin_out_toward_the_far_bound():
    for side, far_is_left in (("start", True), ("end", False)):
        squares = marks.dots(EndWindow(10, 60, side), SCALE, LANE, STYLE)
        assert squares and all(70.0 <= s.x and s.x + s.width <= 170.0 + 1e-9 for s in squares)
        left = sum(1 for s in squares if s.x < 120.0)
        right = len(squares) - left
        assert (left < right) if far_is_left else (right < left)


# --- where each span is drawn: the arrays agree with the model's own span ---------------------
_SIDES = ["1650", "c. 1650", "1650s", "../1801", "1801", "1801/..", "before 1700", "after 1640",
          "", "early 17th century", "1690?", "1701-03-04", "..", "1650-1660"]


def _span(start: str, end: str):
    from timelines.dates import DateError, parse_column
    from timelines.model import Endpoint, Qualifier, Span

    first = parse_column([start], open_cell=Endpoint.open(Qualifier.OPEN_START))[0]
    last = parse_column([end], open_cell=Endpoint.open(Qualifier.OPEN_END))[0]
    if isinstance(first, DateError) or isinstance(last, DateError):
        return None
    first = first or Endpoint.open(Qualifier.UNKNOWN_START)
    last = last or Endpoint.open(Qualifier.UNKNOWN_END)
    try:
        return Span(first, last)
    except ValueError:
        return None        # the end wholly before the start: a contradiction, not drawn


def test_drawn_cores_are_the_models_certain_cores():
    """`drawn_spans` works on arrays; `Span.certain_core` is the model's rule, one span at a
    time. Every pair of the sides above: a core is drawn exactly where the model has one,
    from its latest start to its earliest end (an open side from the axis edge)."""
    from timelines.scene.bars import drawn_spans

    spans = [span for start in _SIDES for end in _SIDES
             if (span := _span(start, end)) is not None]
    domain = (500_000.0, 700_000.0)                  # holds every bound above
    drawn = drawn_spans(spans, domain, stub=100.0).each()
    assert len(spans) > 100
    for span, geometry in zip(spans, drawn):
        core = span.certain_core
        assert geometry.has_core == (core is not None), span
        if core is not None:
            low, high = (domain[0] if core[0] is None else core[0],
                         domain[1] if core[1] is None else core[1])
            assert (geometry.start_high, geometry.end_low) == (low, high), span
