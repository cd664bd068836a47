"""The overview of a table too large to read lane by lane: per group, how many records were
possibly and certainly active per block (and the expected count: the aoristic sum of events,
the summed probability of spans), on an axis of the whole time, above the lanes of a chosen
part. The part the lanes show is marked on the strips; a note says what was summarised.

The strips are the activity chart's panels (activity.py), lower; the counts come from
`analysis.activity` through the chart stage, so they are the numbers `timelines activity`
prints.
"""
from __future__ import annotations

from dataclasses import dataclass

from .activity import ActivitySeries, activity_strip
from .legend import wrap
from .primitives import Group, Primitive, Rect, Text
from .scale import TimeScale, nice_domain
from .theme import Theme

STRIP_HEIGHT = 54.0         # px of counts per group: a dozen groups fit one screen
WINDOW_OPACITY = 0.10       # the shade over the stretch the lanes show


@dataclass(frozen=True, slots=True)
class Overview:
    series: tuple[ActivitySeries, ...]      # one per group (and kind of record)
    start: float                            # the whole time, fixed days
    end: float
    window: tuple[float, float] | None      # the time of the lanes below, marked; None: all
    note: str                               # what was summarised, and how to see the rest


def draw_overview(overview: Overview, theme: Theme, top: float, left: float
                  ) -> tuple[list[Primitive], float]:
    """The strips from `top`, counts left of `left`; the y below them."""
    low, high = nice_domain(overview.start, overview.end, era=theme.era,
                            calendar=theme.calendar)
    scale = TimeScale(low, high, left, theme.width - theme.margin)
    items: list[Primitive] = []
    y = top
    for line in wrap(overview.note, theme.small_font_size, theme.width - 2 * theme.margin):
        y += theme.small_font_size * 1.4
        items.append(Text(theme.margin, y, line, theme.small_font_size,
                          fill=theme.muted_color, css_class="overview-note"))
    strips, bottom = activity_strip(list(overview.series), scale, theme, y + 4, STRIP_HEIGHT)
    if overview.window is not None:
        first = max(scale.x(overview.window[0]), scale.x0)
        last = min(scale.x(overview.window[1]), scale.x1)
        if last > first:
            items.append(Rect(first, y + 4, last - first, bottom - y - 4, theme.text_color,
                              opacity=WINDOW_OPACITY, css_class="overview-window"))
    return [Group(tuple(items + strips), css_class="overview")], bottom + 12
