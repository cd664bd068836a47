"""The time axis under the lanes and the light grid behind them; on a tall chart the axis
again above the lanes, and its labels at group breaks a page apart, so a reader never scrolls
far to find a year.

Major ticks carry labels and a grid line in `theme.grid_color`; the minor ticks between them
(`scale.ticks(minor=True)`) are shorter, and their grid lines thinner and paler, so the eye
finds the labelled years first. Every element has a class (`grid major`, `grid minor`,
`tick major`, `tick minor`, `tick-label`, `axis-line`) for restyling.
"""
from __future__ import annotations

from .primitives import Group, Line, Primitive, Text
from ..calendar import GREGORIAN, JULIAN, iso_from_fixed, reform_day
from .scale import Tick, TimeScale, choose_unit, ticks
from .textsize import text_width
from .theme import Theme

MAX_TICKS = 8           # labelled ticks on a wide axis (the scale's default)
LABEL_GAP = 8.0         # px at least between two tick labels


def draw_axis(scale: TimeScale, theme: Theme, top: float, bottom: float
              ) -> tuple[Group, Group, float]:
    """(the grid, drawn behind the lanes; the axis line, ticks and labels; the y below it)."""
    grid: list[Primitive] = []
    axis: list[Primitive] = [Line(scale.x0, bottom + 4, scale.x1, bottom + 4, theme.muted_color,
                                  1.0, css_class="axis-line")]
    for tick in axis_ticks(scale, theme):
        grid.append(_grid_line(tick, scale, theme, top, bottom))
        axis.append(_tick_line(tick, scale, theme, bottom))
        if tick.major and tick.label:
            axis.append(_tick_label(tick, scale, theme, bottom))
    return (Group(tuple(grid), css_class="grid"), Group(tuple(axis), css_class="axis"),
            bottom + theme.axis_height)


def draw_top_axis(scale: TimeScale, theme: Theme, top: float) -> tuple[Group, float]:
    """The axis again above the lanes, labels upward: (the axis, the y below it)."""
    line_y = top + theme.axis_height - 4
    axis: list[Primitive] = [Line(scale.x0, line_y, scale.x1, line_y, theme.muted_color, 1.0,
                                  css_class="axis-line")]
    for tick in axis_ticks(scale, theme):
        length = 5.0 if tick.major else 2.5
        axis.append(Line(scale.x(tick.day), line_y - length, scale.x(tick.day), line_y,
                         theme.muted_color, 1.0 if tick.major else 0.75,
                         css_class=f"tick {'major' if tick.major else 'minor'}"))
        if tick.major and tick.label:
            axis.append(_tick_label(tick, scale, theme, line_y - 12 - theme.small_font_size
                                    - 2 - theme.small_font_size * 0.3))
    return Group(tuple(axis), css_class="axis axis-top"), top + theme.axis_height


def calendar_note(scale: TimeScale, theme: Theme) -> str | None:
    """Which calendar the axis's days and months are in, when it matters: at day or month
    scale, where Julian dates are shown (a year label is the same in both calendars)."""
    unit = choose_unit(scale.start, scale.end, era=theme.era, calendar=theme.calendar)
    if unit.kind == "year" or theme.calendar == GREGORIAN:
        return None
    if theme.calendar == JULIAN:
        return "Days and months on the axis are in the Julian calendar."
    switch = reform_day(theme.calendar)
    if scale.start >= switch:
        return None
    if scale.end < switch:
        return "Days and months on the axis are in the Julian calendar."
    return (f"Days and months on the axis are Julian before {iso_from_fixed(switch)}, "
            "Gregorian from it on.")


def axis_labels_row(scale: TimeScale, theme: Theme, top: float) -> Group:
    """The axis's labels alone, in a row at `top` between two groups of a very tall chart."""
    labels = [_tick_label(tick, scale, theme, top - 12 + 2)
              for tick in axis_ticks(scale, theme) if tick.major and tick.label]
    return Group(tuple(labels), css_class="axis axis-repeat")


def axis_ticks(scale: TimeScale, theme: Theme) -> list[Tick]:
    """Ticks in the finest unit whose labels stand apart (at most MAX_TICKS of them, fewer
    on a narrow axis such as a small multiple's), with the minor ticks between."""
    for most in range(MAX_TICKS, 1, -1):
        found = ticks(scale, era=theme.era, minor=True, max_ticks=most, calendar=theme.calendar)
        if _labels_stand_apart([t for t in found if t.major and t.label], scale, theme):
            return found
    return found


def _labels_stand_apart(majors: list[Tick], scale: TimeScale, theme: Theme) -> bool:
    widths = [text_width(t.label, theme.small_font_size) for t in majors]
    return all(scale.x(b.day) - scale.x(a.day) >= (wa + wb) / 2 + LABEL_GAP
               for a, b, wa, wb in zip(majors, majors[1:], widths, widths[1:]))


def _grid_line(tick: Tick, scale: TimeScale, theme: Theme, top: float, bottom: float) -> Line:
    x = scale.x(tick.day)
    if tick.major:
        return Line(x, top - 4, x, bottom + 4, theme.grid_color, 1.0, css_class="grid major")
    return Line(x, top - 4, x, bottom + 4, theme.grid_minor_color, 0.5, css_class="grid minor")


def _tick_line(tick: Tick, scale: TimeScale, theme: Theme, bottom: float) -> Line:
    x = scale.x(tick.day)
    if tick.major:
        return Line(x, bottom + 4, x, bottom + 9, theme.muted_color, 1.0, css_class="tick major")
    return Line(x, bottom + 4, x, bottom + 6.5, theme.muted_color, 0.75, css_class="tick minor")


def _tick_label(tick: Tick, scale: TimeScale, theme: Theme, bottom: float) -> Text:
    # keep an edge label on the page: shift it inward rather than cut it off
    half = text_width(tick.label, theme.small_font_size) / 2 + 2
    centre = min(max(scale.x(tick.day), half), theme.width - half)
    return Text(centre, bottom + 12 + theme.small_font_size, tick.label, theme.small_font_size,
                anchor="middle", fill=theme.text_color, css_class="tick-label")
