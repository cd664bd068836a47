"""The activity chart: how many records were active per block of time, on the time axis.

One panel per kind of record (events and spans are never summed together): the expected count
per block as bars (the aoristic sum for events, the summed probability of overlap for spans),
the Monte Carlo envelope as a pale band behind them, and the certain and possible counts as
step lines, so the reader sees at once what is sure, what is likely and what is only possible.
The legend says what each mark is; a count axis at the left, the time axis under each panel.
"""
from __future__ import annotations

from dataclasses import dataclass

from .axis import draw_axis
from .legend import heading, wrap
from .primitives import Group, Line, Primitive, Rect, Scene, Text
from .scale import TimeScale, nice_domain
from .textsize import text_width
from .theme import DEFAULT_THEME, Theme

PANEL_HEIGHT = 180.0        # px of counts per panel
COUNT_TICKS = 5             # at most this many labelled counts on the left
ENVELOPE_OPACITY = 0.22
BAR_OPACITY = 0.75


@dataclass(frozen=True, slots=True)
class ActivitySeries:
    """The counts of one kind of record (and group), block by block, in fixed days."""

    name: str                               # "events", "spans", or with a group "spans: Weaver"
    method: str                             # how each record was weighed, in words
    starts: tuple[float, ...]
    ends: tuple[float, ...]
    certain: tuple[float, ...]
    possible: tuple[float, ...]
    expected: tuple[float, ...]
    low: tuple[float, ...] = ()             # the envelope, when runs were made
    high: tuple[float, ...] = ()


def activity_scene(series: list[ActivitySeries], title: str = "",
                   theme: Theme = DEFAULT_THEME, notes: tuple[str, ...] = ()) -> Scene:
    """The activity chart of `series`, one panel each, on one time axis; `notes` under it."""
    text = _Heading(title)
    header, y = heading(text, theme, theme.width)
    low, high = nice_domain(min(min(s.starts) for s in series),
                            max(max(s.ends) for s in series), era=theme.era)
    left = theme.margin + _count_label_width(series, theme) + 8
    scale = TimeScale(low, high, left, theme.width - theme.margin)
    panels: list[Primitive] = []
    for one in series:
        panel, y = _panel(one, scale, theme, y + 8)
        panels.append(panel)
    legend, y = _legend(series, theme, y + 6)
    lines: list[Primitive] = []
    for note in notes:
        for line in wrap(note, theme.small_font_size, theme.width - 2 * theme.margin):
            y += theme.small_font_size * 1.4
            lines.append(Text(theme.margin, y, line, theme.small_font_size,
                              fill=theme.muted_color, css_class="note"))
    return Scene(theme.width, y + theme.margin, (*header, *panels, legend, *lines),
                 title=title or "Activity", desc=_describe(series),
                 background=theme.background, font_family=theme.font_family)


def activity_strip(series: list[ActivitySeries], scale: TimeScale, theme: Theme, top: float,
                   height: float = PANEL_HEIGHT) -> tuple[list[Primitive], float]:
    """The same panels under a timeline, on its time `scale` (its counts at the left, in the
    captions' margin), `height` px of counts each, with their legend; the y below. A block
    the chart's edge cuts is drawn only as far as the edge (its counts are the whole block's)."""
    panels: list[Primitive] = []
    y = top
    for one in series:
        panel, y = _panel(_within(one, scale.start, scale.end), scale, theme, y + 8, height)
        panels.append(panel)
    legend, y = _legend(series, theme, y + 6)
    return [*panels, legend], y


def _within(series: ActivitySeries, start: float, end: float) -> ActivitySeries:
    """`series` with its blocks cut to `start..end`, those wholly outside left out."""
    keep = [i for i, (s, e) in enumerate(zip(series.starts, series.ends)) if e > start and s < end]

    def kept(values):
        return tuple(values[i] for i in keep) if values else ()
    return ActivitySeries(series.name, series.method,
                          tuple(max(series.starts[i], start) for i in keep),
                          tuple(min(series.ends[i], end) for i in keep),
                          kept(series.certain), kept(series.possible), kept(series.expected),
                          kept(series.low), kept(series.high))


@dataclass(frozen=True, slots=True)
class _Heading:
    title: str
    subtitle: str = ""


def _panel(series: ActivitySeries, scale: TimeScale, theme: Theme, top: float,
           height: float = PANEL_HEIGHT) -> tuple[Group, float]:
    """One kind's counts: its name, the band, the bars, the lines, the count and time axes."""
    caption = f"{series.name}: {series.method}" if series.method else series.name
    lines = wrap(caption, theme.group_label_size, theme.width - 2 * theme.margin, weight="bold")
    names = [Text(theme.margin, top + theme.group_label_size * (1 + 1.25 * number), line,
                  theme.group_label_size, weight="bold", fill=theme.text_color,
                  css_class="panel-title") for number, line in enumerate(lines)]
    plot_top = top + theme.group_label_size * (1 + 1.25 * (len(lines) - 1)) + 10
    bottom = plot_top + height
    most = max(max(series.possible, default=0), max(series.high, default=0), 1)
    y_of = (lambda count: bottom - count / most * height)
    grid, axis, below = draw_axis(scale, theme, plot_top, bottom)
    items = [*names, grid, *_counts_axis(most, scale, theme, y_of),
             *_envelope(series, scale, theme, y_of), *_bars(series, scale, theme, y_of),
             *_steps(series.possible, series, scale, y_of, theme.muted_color, (3.0, 2.0),
                     "possible"),
             *_steps(series.certain, series, scale, y_of, theme.text_color, (), "certain"),
             axis]
    return Group(tuple(items), css_class="activity"), below


def _bars(series, scale: TimeScale, theme: Theme, y_of) -> list[Primitive]:
    return [Rect(scale.x(start), y_of(value), max(scale.x(end) - scale.x(start) - 1, 0.5),
                 y_of(0) - y_of(value), theme.bar_color, opacity=BAR_OPACITY,
                 css_class="expected")
            for start, end, value in zip(series.starts, series.ends, series.expected)
            if value > 0]


def _envelope(series, scale: TimeScale, theme: Theme, y_of) -> list[Primitive]:
    return [Rect(scale.x(start), y_of(high), scale.x(end) - scale.x(start),
                 y_of(low) - y_of(high), theme.bar_color, opacity=ENVELOPE_OPACITY,
                 css_class="envelope")
            for start, end, low, high in zip(series.starts, series.ends, series.low,
                                              series.high) if high > low]


def _steps(values, series, scale: TimeScale, y_of, color: str, dash, css: str
           ) -> list[Primitive]:
    """A step line: level across each block, upright where the count changes."""
    lines: list[Primitive] = []
    previous = None
    for start, end, value in zip(series.starts, series.ends, values):
        x0, x1, y = scale.x(start), scale.x(end), y_of(value)
        if previous is not None and previous != y:
            lines.append(Line(x0, previous, x0, y, color, 1.5, dash, css_class=css))
        lines.append(Line(x0, y, x1, y, color, 1.5, dash, css_class=css))
        previous = y
    return lines


def _counts_axis(most: float, scale: TimeScale, theme: Theme, y_of) -> list[Primitive]:
    step = _round_step(most)
    items: list[Primitive] = []
    count = 0.0
    while count <= most + 1e-9:
        y = y_of(count)
        items.append(Line(scale.x0 - 4, y, scale.x0, y, theme.muted_color, 1.0,
                          css_class="tick count"))
        items.append(Text(scale.x0 - 6, y + theme.small_font_size * 0.36, _count_text(count),
                          theme.small_font_size, anchor="end", fill=theme.text_color,
                          css_class="tick-label count"))
        count += step
    return items


def _round_step(most: float) -> float:
    """The smallest of 1, 2, 5, 10, 20, 50, ... giving at most COUNT_TICKS + 1 labels."""
    step = 1.0
    while most / step > COUNT_TICKS:
        for factor in (2.0, 2.5, 2.0):
            step *= factor
            if most / step <= COUNT_TICKS:
                break
    return step


def _count_text(count: float) -> str:
    return f"{count:,.0f}" if count == int(count) else f"{count:g}"


def _count_label_width(series: list[ActivitySeries], theme: Theme) -> float:
    most = max(max(max(s.possible, default=0), max(s.high, default=0), 1) for s in series)
    return text_width(_count_text(float(int(most))), theme.small_font_size)


_LEGEND = (
    ("envelope", "Monte Carlo envelope: where the count falls in 95 of 100 simulated runs"),
    ("expected", "expected count: each record weighed by its chance of lying in the block"),
    ("certain", "certain: records surely active in the block"),
    ("possible", "possible: records that may have been active"),
)


def _legend(series: list[ActivitySeries], theme: Theme, top: float) -> tuple[Group, float]:
    shown = [(key, words) for key, words in _LEGEND
             if key != "envelope" or any(s.high for s in series)]
    items: list[Primitive] = []
    y = top
    for key, words in shown:
        middle = y + theme.legend_row_height / 2
        items += _sample(key, theme, middle)
        lines = wrap(words, theme.small_font_size, theme.width - theme.margin * 2 - 40)
        for number, line in enumerate(lines):
            items.append(Text(theme.margin + 40, middle + theme.small_font_size * (
                0.36 + 1.3 * number), line, theme.small_font_size, fill=theme.text_color,
                css_class="legend-text"))
        y += theme.legend_row_height + theme.small_font_size * 1.3 * (len(lines) - 1)
    return Group(tuple(items), css_class="legend"), y


def _sample(key: str, theme: Theme, middle: float) -> list[Primitive]:
    x = theme.margin
    if key in ("envelope", "expected"):
        opacity = ENVELOPE_OPACITY if key == "envelope" else BAR_OPACITY
        return [Rect(x, middle - 5, 30, 10, theme.bar_color, opacity=opacity, css_class=key)]
    color, dash = ((theme.text_color, ()) if key == "certain"
                   else (theme.muted_color, (3.0, 2.0)))
    return [Line(x, middle, x + 30, middle, color, 1.5, dash, css_class=key)]


def _describe(series: list[ActivitySeries]) -> str:
    parts = [f"{s.name}, {len(s.starts)} blocks ({s.method})" for s in series]
    return "Activity per block of time: " + "; ".join(parts) + "."
