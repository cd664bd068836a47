"""Marks for the parts of a span: each encoder turns an endpoint window into primitives.

Every fringe encoder has one signature, `(window, scale, lane, style) -> list[Primitive]`, and is
registered by name in `FRINGES`; a new encoding is one function, one registry line and one
geometry test. A moment's whole window is drawn by one of `MOMENT_WINDOWS`, by the kind of
record (a dated moment, or an event dated by a window). The other marks (core, open arrow,
bound bracket, likely tick, qualifier glyph, point) are plain functions with the same
arguments where they apply.
"""
from __future__ import annotations

import difflib
from dataclasses import dataclass, replace
from typing import Callable

import numpy as np

from ..errors import UsageError
from .primitives import GradientRect, Line, Polygon, Primitive, Rect, Text
from .scale import TimeScale


@dataclass(frozen=True, slots=True)
class EndWindow:
    """An endpoint's window on the drawn axis, in fixed days, `low <= high`; `side` says
    which end of the span it is (`start` or `end`), so a fade knows which way to fade. A
    moment's window may name the day its marker stands on (`peak`; None: the middle)."""

    low: float
    high: float
    side: str
    peak: float | None = None


@dataclass(frozen=True, slots=True)
class LaneBox:
    """The bar's band in a lane: top y and height, in page px."""

    y: float
    height: float

    @property
    def middle(self) -> float:
        return self.y + self.height / 2


@dataclass(frozen=True, slots=True)
class MarkStyle:
    color: str
    far_opacity: float = 0.12
    text_color: str = "#1a1a1a"
    glyph_size: float = 10.0


SEAM_OVERLAP = 0.5   # px a fade reaches under the solid core it meets

Encoder = Callable[[EndWindow, TimeScale, LaneBox, MarkStyle], list[Primitive]]


def fade(window: EndWindow, scale: TimeScale, lane: LaneBox, style: MarkStyle) -> list[Primitive]:
    """The bar fading out across the window: full colour where it meets the core, faint at the
    far bound, so the eye reads 'possibly' rather than a hard edge."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    near, far = 1.0, style.far_opacity
    left, right = (far, near) if window.side == "start" else (near, far)
    # Run half a pixel under the core: two antialiased edges that merely touch leave a light seam.
    if window.side == "start":
        x_high += SEAM_OVERLAP
    else:
        x_low -= SEAM_OVERLAP
    return [GradientRect(x_low, lane.y, x_high - x_low, lane.height, style.color, left, right,
                         css_class="fringe")]


def whisker(window: EndWindow, scale: TimeScale, lane: LaneBox,
            style: MarkStyle) -> list[Primitive]:
    """A thin line across the window with a short cap at the far bound."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    far_x = x_low if window.side == "start" else x_high
    cap = lane.height * 0.35
    return [
        Line(x_low, lane.middle, x_high, lane.middle, style.color, 1.5, css_class="fringe"),
        Line(far_x, lane.middle - cap, far_x, lane.middle + cap, style.color, 1.5,
             css_class="fringe"),
    ]


def moment_window(window: EndWindow, scale: TimeScale, lane: LaneBox,
                  style: MarkStyle) -> list[Primitive]:
    """The window a moment lies in: a thin line with a cap at both bounds (either may be the
    moment's)."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    cap = lane.height * 0.35
    return [Line(x_low, lane.middle, x_high, lane.middle, style.color, 1.5, css_class="fringe"),
            *(Line(x, lane.middle - cap, x, lane.middle + cap, style.color, 1.5,
                   css_class="fringe") for x in (x_low, x_high))]


EVENT_PEAK_OPACITY = 0.55   # where an event's window meets its marker: never a solid bar
EVENT_BAND = 0.7            # of the bar's height: thinner than a span's fringe, read apart


def event_window(window: EndWindow, scale: TimeScale, lane: LaneBox,
                 style: MarkStyle) -> list[Primitive]:
    """The window an event lies in (one moment between a not-before and a not-after): a band
    fading from the marker towards both bounds, a hairline at each bound. Not a bar: nothing
    of it is certain, and it says nothing of how long the event took."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    peak = (window.low + window.high) / 2 if window.peak is None else window.peak
    x_peak = min(max(scale.x(peak), x_low), x_high)
    y, height = lane.middle - lane.height * EVENT_BAND / 2, lane.height * EVENT_BAND
    near, far = EVENT_PEAK_OPACITY, style.far_opacity
    parts: list[Primitive] = [
        GradientRect(left, y, right - left, height, style.color, *opacities,
                     css_class="event-window")
        for left, right, opacities in ((x_low, x_peak, (far, near)),
                                       (x_peak, x_high, (near, far))) if right > left]
    cap = lane.height * 0.35
    return parts + [Line(x, lane.middle - cap, x, lane.middle + cap, style.color, 1.0,
                         css_class="event-window") for x in (x_low, x_high)]


# A moment's whole window, by the kind of record: a dated moment, an event.
MOMENT_WINDOWS: dict[str, Encoder] = {"span": moment_window, "event": event_window}


DENSITY_STEP = 2.0    # px between the samples of a calibrated date's probability
DENSITY_FLOOR = 0.01  # of the peak: a stretch below this is left undrawn
MAX_STOPS = 400       # samples of one calibrated date at most


def density_fade(window: EndWindow, scale: TimeScale, lane: LaneBox, style: MarkStyle,
                 days, relative) -> list[Primitive]:
    """A calibrated radiocarbon date across its window: the opacity follows its probability
    (`relative`: the density at fixed `days`, 1 at its peak), so separate ranges show as
    separate patches and the likeliest years darkest. Sampled every DENSITY_STEP px (at most
    MAX_STOPS samples), one fade through many stops per stretch where the probability is not
    all but nil."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    steps = min(max(2, int((x_high - x_low) / DENSITY_STEP)), MAX_STOPS)
    at = np.linspace(window.low, window.high, steps + 1)
    opacity = np.interp(at, days, relative, left=0.0, right=0.0)
    shown = np.flatnonzero(opacity >= DENSITY_FLOOR)
    if not len(shown):
        return []
    # Stretches of samples above the floor, each with one sample of margin either side.
    breaks = np.flatnonzero(np.diff(shown) > 1)
    parts: list[Primitive] = []
    for first, last in zip(np.r_[shown[0], shown[breaks + 1]], np.r_[shown[breaks], shown[-1]]):
        first, last = max(first - 1, 0), min(last + 1, steps)
        if last == first:
            continue
        x0, x1 = scale.x(float(at[first])), scale.x(float(at[last]))
        stops = tuple(round(float(value), 3) for value in opacity[first:last + 1])
        parts.append(GradientRect(x0, lane.y, x1 - x0, lane.height, style.color, stops[0],
                                  stops[-1], css_class="fringe calibrated", stops=stops))
    return parts


def calibrated_ranges(ranges, scale: TimeScale, lane: LaneBox,
                      style: MarkStyle) -> list[Primitive]:
    """The 68.3% ranges of a calibrated date: a thin line under the bar along each
    (`ranges`: (first day, last day) pairs)."""
    y = lane.y + lane.height + 1.5
    return [Line(scale.x(low), y, max(scale.x(high), scale.x(low) + 1.0), y, style.color, 1.2,
                 css_class="calibrated-range") for low, high in ranges]


HATCH_SPACING = 4.0   # px between hatch lines, measured along the bar


def hatch(window: EndWindow, scale: TimeScale, lane: LaneBox, style: MarkStyle) -> list[Primitive]:
    """A pale fill crossed by diagonal lines: 'possibly' as a texture, readable in greyscale
    and on a photocopy, where a fade can vanish."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    parts: list[Primitive] = [Rect(x_low, lane.y, x_high - x_low, lane.height, style.color,
                                   opacity=0.25, css_class="fringe")]
    bottom, rise = lane.y + lane.height, lane.height
    # Each line runs up at 45 degrees from (start, bottom) to (start + rise, top); keep the
    # part of it whose x lies inside the window.
    start = x_low - rise
    while start < x_high:
        t0, t1 = max(0.0, x_low - start), min(rise, x_high - start)
        if t1 > t0:
            parts.append(Line(start + t0, bottom - t0, start + t1, bottom - t1, style.color, 1.0,
                              css_class="fringe"))
        start += HATCH_SPACING
    return parts


def dots(window: EndWindow, scale: TimeScale, lane: LaneBox, style: MarkStyle) -> list[Primitive]:
    """Stippling that thins out toward the far bound: dense where the window meets the core,
    sparse at the far end, so density reads as likelihood without relying on tone."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    width = x_high - x_low
    if width <= 0:
        return []
    size, rows = 1.6, max(int(lane.height // 3), 1)
    row_step = lane.height / rows
    parts: list[Primitive] = []
    travelled = 0.0     # distance from the near end (the core side)
    column = 0
    while travelled < width:
        x = x_high - travelled - size if window.side == "start" else x_low + travelled
        x = min(max(x, x_low), x_high - size)
        for row in range(rows):
            y = lane.y + row * row_step + (row_step - size) / 2
            if (row + column) % 2 == 0 or travelled < width / 3:
                parts.append(Rect(x, y, size, size, style.color, css_class="fringe"))
        travelled += 2.5 + 6.0 * (travelled / width)   # the gap grows toward the far bound
        column += 1
    return parts


FRINGES: dict[str, Encoder] = {"fade": fade, "whisker": whisker, "hatch": hatch, "dots": dots}


def fringe_encoder(name: str) -> Encoder:
    if name in FRINGES:
        return FRINGES[name]
    close = difflib.get_close_matches(name, FRINGES, n=1)
    hint = f"did you mean {close[0]!r}?" if close else None
    raise UsageError(f"unknown fringe style {name!r}; choose one of {', '.join(FRINGES)}", hint)


def unknown_stretch(window: EndWindow, scale: TimeScale, lane: LaneBox,
                    style: MarkStyle, fringe: str = "fade") -> list[Primitive]:
    """Where an empty cell leaves a side unknown: a paler fade inside a dashed outline, so it
    reads apart from a dated window's fade; with the hatch or dots fringe (chosen to survive
    greyscale printing) that pattern inside the outline instead of the fade."""
    x_low, x_high = scale.x(window.low), scale.x(window.high)
    if x_high - x_low <= 0:
        return []
    dash = (3.0, 2.0)
    if fringe in ("hatch", "dots"):
        inside = [replace(item, css_class="unknown") for item in
                  FRINGES[fringe](window, scale, lane, style)]
    else:
        near, far = 0.55, style.far_opacity * 0.5
        left, right = (far, near) if window.side == "start" else (near, far)
        inside = [GradientRect(x_low, lane.y, x_high - x_low, lane.height, style.color, left,
                               right, css_class="unknown")]
    return [
        *inside,
        Line(x_low, lane.y, x_high, lane.y, style.color, 1.0, dash, css_class="unknown"),
        Line(x_low, lane.y + lane.height, x_high, lane.y + lane.height, style.color, 1.0, dash,
             css_class="unknown"),
    ]


def core(low: float, high: float, scale: TimeScale, lane: LaneBox,
         style: MarkStyle) -> list[Primitive]:
    """The certain part: a solid bar."""
    x_low, x_high = scale.x(low), scale.x(high)
    return [Rect(x_low, lane.y, max(x_high - x_low, 1.0), lane.height, style.color,
                 css_class="core")]


OPEN_ARROW_REACH = 0.7   # of the bar's height: how far an open end's arrowhead reaches out


def open_arrow(day: float, side: str, scale: TimeScale, lane: LaneBox,
               style: MarkStyle) -> list[Primitive]:
    """An arrowhead at the axis edge: the span runs on past the chart (ISO 8601-2 '..')."""
    x = scale.x(day)
    reach = lane.height * OPEN_ARROW_REACH
    tip = x - reach if side == "start" else x + reach
    points = ((x, lane.y - 2), (tip, lane.middle), (x, lane.y + lane.height + 2))
    return [Polygon(points, style.color, css_class="open")]


def bound_bracket(day: float, side: str, scale: TimeScale, lane: LaneBox,
                  style: MarkStyle) -> list[Primitive]:
    """A bracket at a 'before' or 'after' limit, opening toward the side the date may lie."""
    x = scale.x(day)
    arm = 3.5 if side == "before" else -3.5
    top, bottom = lane.y - 2, lane.y + lane.height + 2
    points = ((x - arm, top), (x, top), (x, bottom), (x - arm, bottom))
    return [Polygon(points, None, style.text_color, 1.5, closed=False, css_class="bound")]


def likely_tick(day: float, scale: TimeScale, lane: LaneBox, style: MarkStyle) -> list[Primitive]:
    """A short tick through the bar at the most likely date of a window."""
    x = scale.x(day)
    return [Line(x, lane.y - 3, x, lane.y + lane.height + 3, style.text_color, 1.5,
                 css_class="likely")]


GLYPHS = {"approximate": "~", "uncertain": "?", "approximate uncertain": "~?"}


def qualifier_glyph(day: float, side: str, kind: str, scale: TimeScale, lane: LaneBox,
                    style: MarkStyle) -> list[Primitive]:
    """The ISO 8601-2 sign (~ approximate, ? uncertain, ~? both) just outside a bar end."""
    x = scale.x(day)
    anchor, gap = ("end", -2.0) if side == "start" else ("start", 2.0)
    baseline = lane.middle + style.glyph_size * 0.36
    return [Text(x + gap, baseline, GLYPHS[kind], style.glyph_size, anchor, "bold",
                 fill=style.text_color, css_class=f"qualifier {kind.replace(' ', '-')}")]


def point_marker(day: float, scale: TimeScale, lane: LaneBox, style: MarkStyle) -> list[Primitive]:
    """A diamond at a dated moment."""
    x, y, r = scale.x(day), lane.middle, lane.height * 0.55
    points = ((x, y - r), (x + r, y), (x, y + r), (x - r, y))
    return [Polygon(points, style.color, "#ffffff", 0.75, css_class="point")]


def continues_mark(day: float, side: str, scale: TimeScale, lane: LaneBox,
                   style: MarkStyle) -> list[Primitive]:
    """A zigzag cut across the bar where the `--from/--to` window clips it: the span goes on
    past the window (unlike an open arrow, which says no bound exists at all)."""
    x = scale.x(day)
    teeth, reach = 3, lane.height * 0.3
    top, height = lane.y - 2, lane.height + 4
    # A zigzag of `teeth` points, leaning outward on the clipped side.
    out = -reach if side == "start" else reach
    points = [(x, top)]
    for tooth in range(teeth):
        points.append((x + out, top + height * (tooth + 0.5) / teeth))
        points.append((x, top + height * (tooth + 1) / teeth))
    return [Polygon(tuple(points), None, style.text_color, 1.25, closed=False,
                    css_class="continues")]


def band(start: EndWindow, end: EndWindow, scale: TimeScale, box: LaneBox, color: str,
         opacity: float) -> list[Primitive]:
    """A named period behind the lanes (`--bands`): a pale rectangle from the start window's
    high bound to the end window's low bound, fading in across the start window and out across
    the end window, so a period's uncertain edges look like a bar's."""
    parts: list[Primitive] = []
    x = [scale.x(day) for day in (start.low, start.high, end.low, end.high)]
    if x[1] > x[0]:
        parts.append(GradientRect(x[0], box.y, x[1] - x[0], box.height, color, 0.0, opacity,
                                  css_class="band-fringe"))
    if x[2] > x[1]:
        parts.append(Rect(x[1], box.y, x[2] - x[1], box.height, color, opacity=opacity,
                          css_class="band-core"))
    if x[3] > x[2]:
        parts.append(GradientRect(x[2], box.y, x[3] - x[2], box.height, color, opacity, 0.0,
                                  css_class="band-fringe"))
    return parts
