"""One record on its lane: the bar (or the point), its signs and its label, as a Group.

`drawn_spans` says where each part of each span is drawn on the axis; `draw_record` draws a
record with the encoders of `encodings` and notes in `used` which marks occurred (for the
legend). A span that a --from/--to window cuts short gets a zigzag at the edge (`cut_sides`),
and the signs whose dates lie beyond the window are left out.
"""
from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from ..calendar import fixed_from_gregorian, iso_from_fixed, year_text
from ..layout import PlacedRecord
from ..model import Qualifier, Record, Span, event_endpoint
from ..spanarrays import SpanFacts, span_facts
from . import encodings as marks
from .encodings import EndWindow, LaneBox, MarkStyle
from .primitives import Group, Primitive, Rect, Text
from .scale import TimeScale
from .textsize import text_width
from .theme import Theme, text_color_on

# A label over a bar (no room beside it) stands on a plate of the background colour at this
# opacity: over the darkest bar (black) the text colour keeps a contrast of about 9.5:1, above
# WCAG 2.1's 4.5:1 for text (success criterion 1.4.3), and the bar still shows through.
LABEL_PLATE_OPACITY = 0.75
LABEL_PLATE_MARGIN = 2.0    # px of plate left and right of the text


@dataclass(frozen=True, slots=True)
class DrawnSpan:
    """A span's four drawn bounds in fixed days, clipped to the axis: the start window
    `start_low..start_high`, the end window `end_low..end_high`; the core lies between
    `start_high` and `end_low` when they are in order."""

    start_low: float
    start_high: float
    end_low: float
    end_high: float
    open_start: bool
    open_end: bool
    has_core: bool      # the model's certain core is not empty


@dataclass(frozen=True, slots=True)
class DrawnSpans:
    """The drawn bounds of many spans, as arrays (fields as in DrawnSpan)."""

    start_low: np.ndarray
    start_high: np.ndarray
    end_low: np.ndarray
    end_high: np.ndarray
    open_start: np.ndarray
    open_end: np.ndarray
    has_core: np.ndarray

    def each(self) -> list[DrawnSpan]:
        return list(map(DrawnSpan, *(getattr(self, name).tolist() for name in _DRAWN_FIELDS)))


_DRAWN_FIELDS = ("start_low", "start_high", "end_low", "end_high", "open_start", "open_end",
                 "has_core")


def drawn_spans(spans: Sequence[Span] | SpanFacts, domain: tuple[float, float],
                stub: float = 0.0) -> DrawnSpans:
    """Where each part of each span is drawn. An open side (ISO 8601-2 `..`: it runs on)
    reaches the axis edge. A side with no far bound (an empty cell, or `after 1780` as an end)
    is drawn `stub` days long from the nearest date known: short, so its length says nothing
    and no other row's dates stretch it. An unknown start reaches to the end's earliest bound
    (and an unknown end from the start's latest), so the whole stretch reads as possible.
    `spans` may be given as their `spanarrays.SpanFacts`."""
    low_edge, high_edge = domain
    facts = spans if isinstance(spans, SpanFacts) else span_facts(spans)
    start_earliest, start_latest, end_earliest, end_latest = facts.bounds.T
    # The nearest date known from each far side inwards: a stub is measured from it. In
    # order that is the start's latest (the end's earliest); where the dates known are out of
    # order (`1704` to `after 1701`) the stub starts from the earliest (latest) of them all,
    # so that it never ends before the span starts.
    start_anchor = np.fmin(np.fmin(start_latest, end_earliest), end_latest)
    end_anchor = np.fmax(np.fmax(end_earliest, start_latest), start_earliest)
    # Each drawn bound is the first one known of those it falls back on.
    a = _first_known(start_earliest, start_anchor - stub)
    d = _first_known(end_latest, end_anchor + stub)
    b = _first_known(start_latest, _first_known(end_earliest, d))
    c = _first_known(end_earliest, _first_known(start_latest, a))
    open_start, open_end = facts.open_start, facts.open_end
    a, b = np.where(open_start, low_edge, a), np.where(open_start, low_edge, b)
    c, d = np.where(open_end, high_edge, c), np.where(open_end, high_edge, d)
    # A span cannot end before it starts: an end window reaching back past the earliest start
    # (562 BC to '6th century BC') is drawn from that start, and a start window no later
    # than the latest end.
    c, b = np.maximum(c, a), np.minimum(b, d)
    a, b, c, d = (np.clip(day, low_edge, high_edge) for day in (a, b, c, d))
    # Span.certain_core is not None, on the arrays: each side open or bounded inwards, and
    # (neither side open) the start's latest no later than the end's earliest. An open side
    # puts the core's end at infinity whatever bound it has (`../1801` ran on from the past).
    certain = ((open_start | ~np.isnan(start_latest)) & (open_end | ~np.isnan(end_earliest))
               & ~(~open_start & ~open_end & (start_latest > end_earliest)))
    return DrawnSpans(a, b, c, d, open_start, open_end, (b <= c) & certain)


def stub_days(scale: TimeScale, theme: Theme) -> float:
    """The stub's length in days on `scale`."""
    return theme.stub_length / scale.px_per_day


def unbounded(endpoint, side: str) -> bool:
    """Whether an endpoint has no far bound and is drawn as a stub: its earliest (a start) or
    latest (an end) unknown, and the side not open."""
    far = endpoint.earliest if side == "start" else endpoint.latest
    return far is None and not endpoint.is_open




def _first_known(days: np.ndarray, otherwise) -> np.ndarray:
    return np.where(np.isnan(days), otherwise, days)


def draw_record(placed: PlacedRecord, scale: TimeScale, theme: Theme, box: LaneBox, color: str,
                used: set[str], geometry: DrawnSpan) -> Group:
    """The record's marks; `geometry` is where its span is drawn (one of drawn_spans)."""
    record = placed.record
    style = MarkStyle(color, theme.fringe_far_opacity, theme.text_color, theme.small_font_size)
    if record.is_event:
        parts = _event_marks(record.span, geometry, scale, box, style, used)
    elif record.span.is_point and not geometry.open_start and not geometry.open_end:
        parts = _point_marks(record.span, geometry, scale, box, style, used)
    else:
        parts = _bar_marks(record.span, geometry, scale, box, style, theme, used)
    parts += _qualifier_marks(record.span, geometry, scale, box, style, used)
    parts += _continues_marks(record.span, scale, box, style, used)
    parts += _label(placed, geometry, scale, theme, box, color)
    return Group(tuple(parts), css_class="record", title=tooltip(record))


def cut_sides(span: Span, domain: tuple[float, float]) -> tuple[bool, bool]:
    """Whether the axis cuts the span short at its start / its end: some bound of it lies
    beyond that edge (only a --from/--to window does this; an open side has its arrow)."""
    bounds = [day for end in (span.start, span.end) for day in (end.earliest, end.latest)
              if day is not None]
    if not bounds:
        return False, False
    return (not span.start.is_open and min(bounds) < domain[0],
            not span.end.is_open and max(bounds) > domain[1])


def _continues_marks(span, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    for side, cut, edge in zip(("start", "end"), cut_sides(span, (scale.start, scale.end)),
                               (scale.start, scale.end)):
        if cut:
            parts += marks.continues_mark(edge, side, scale, box, style)
            used.add("continues")
    return parts


def _bar_marks(span, geometry: DrawnSpan, scale, box, style, theme, used) -> list[Primitive]:
    fringe = marks.fringe_encoder(theme.fringe)
    parts: list[Primitive] = []
    if geometry.has_core:
        parts += marks.core(geometry.start_high, geometry.end_low, scale, box, style)
        used.add("core")
    windows = ((EndWindow(geometry.start_low, geometry.start_high, "start"), span.start,
                scale.start, geometry.open_start),
               (EndWindow(geometry.end_low, geometry.end_high, "end"), span.end,
                scale.end, geometry.open_end))
    for window, endpoint, edge, is_open in windows:
        if is_open:
            parts += marks.open_arrow(edge, window.side, scale, box, style)
            used.add("open")
        elif endpoint.is_unknown or unbounded(endpoint, window.side):
            parts += marks.unknown_stretch(window, scale, box, style, theme.fringe)
            used.add(_stretch_kind(endpoint, window.side))
        elif endpoint.radiocarbon is not None:
            parts += calibrated_marks(window, endpoint.radiocarbon, scale, box, style, used)
        else:
            drawn = fringe(window, scale, box, style)
            parts += drawn
            if drawn:
                used.add(f"fringe:{theme.fringe}")
    return parts


def calibrated_marks(window: EndWindow, measured, scale, box, style, used) -> list[Primitive]:
    """A calibrated radiocarbon date in its window: shaded by its probability, its 68.3%
    ranges underlined; the legend names the curve."""
    days, relative = calibrated_profile(measured)
    parts = marks.density_fade(window, scale, box, style, days, relative)
    inner = [(max(low, window.low), min(high, window.high))
             for low, high in _range_days(measured, 0.683) if high >= window.low
             and low <= window.high]
    parts += marks.calibrated_ranges(inner, scale, box, style)
    used.update({"calibrated", f"curve:{measured.citation}"})
    return parts


def calibrated_profile(measured) -> tuple[np.ndarray, np.ndarray]:
    """The calibrated probability at the middle day of each year, as a share of its peak."""
    days, density = measured.yearly()
    density = np.asarray(density)
    return np.asarray(days, dtype=float), density / density.max()


def _range_days(measured, level: float) -> list[tuple[int, int]]:
    """The ranges at `level` as (first day, last day) of their years."""
    for found_level, ranges in measured.ranges:
        if abs(found_level - level) < 1e-9:
            return [(fixed_from_gregorian(first, 1, 1), fixed_from_gregorian(last, 12, 31))
                    for first, last, _ in ranges]
    return []


def _stretch_kind(endpoint, side: str) -> str:
    """The legend's key for a dashed stretch: not recorded or without a limit, drawn short or
    bounded by the user's longest duration."""
    kind = "unknown" if endpoint.is_unknown else "unbounded"
    return f"{kind} bounded" if Qualifier.DURATION_BOUND in endpoint.qualifiers else kind


def _point_marks(span, geometry: DrawnSpan, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    endpoint = span.start
    if endpoint.radiocarbon is not None:
        parts += calibrated_marks(EndWindow(geometry.start_low, geometry.start_high, "end"),
                                  endpoint.radiocarbon, scale, box, style, used)
    elif geometry.start_high > geometry.start_low:
        parts += marks.moment_window(EndWindow(geometry.start_low, geometry.start_high, "end"),
                                     scale, box, style)
        used.add("point window")
    centre = _point_centre(endpoint, geometry)
    if scale.start <= centre <= scale.end:      # a window may leave only the line showing
        parts += marks.point_marker(centre, scale, box, style)
        used.add("point" if endpoint.radiocarbon is None else "calibrated median")
    return parts


def _event_marks(span, geometry: DrawnSpan, scale, box, style, used) -> list[Primitive]:
    """An event: its marker at the likely day or the middle, its window a band fading towards
    both bounds; a side not recorded is a dashed stretch, drawn short, beyond the marker."""
    endpoint = event_endpoint(span.start, span.end)    # the same endpoint for a point
    low, high = geometry.start_low, geometry.end_high
    centre = _window_centre(endpoint, low, high)
    middle = min(max(centre, low), high)         # where the parts meet, on the axis shown
    parts: list[Primitive] = []
    for side, unknown, window in (("start", endpoint.earliest is None, (low, middle)),
                                  ("end", endpoint.latest is None, (middle, high))):
        if unknown and window[1] > window[0]:
            parts += marks.unknown_stretch(EndWindow(*window, side), scale, box, style)
            used.add("unknown")
    known = EndWindow(middle if endpoint.earliest is None else low,
                      middle if endpoint.latest is None else high, "event", centre)
    if endpoint.radiocarbon is not None:
        drawn = calibrated_marks(known, endpoint.radiocarbon, scale, box, style, used)
    else:
        drawn = marks.MOMENT_WINDOWS["event"](known, scale, box, style)
    if drawn:
        parts += drawn
        used.add("event window")
    if scale.start <= centre <= scale.end:      # a window may leave only the band showing
        parts += marks.point_marker(centre, scale, box, style)
        used.add("point" if not drawn else "event window")
    return parts


def _window_centre(endpoint, low: float, high: float) -> float:
    """The likely day, else the middle of the window as written (a side with no bound: as
    drawn)."""
    if endpoint.likely is not None:
        return endpoint.likely
    return ((endpoint.earliest if endpoint.earliest is not None else low)
            + (endpoint.latest if endpoint.latest is not None else high)) / 2


def _point_centre(endpoint, geometry: DrawnSpan) -> float:
    """The likely day, else the middle of the window as written (not as clipped)."""
    if endpoint.likely is not None:
        return endpoint.likely
    low = endpoint.earliest if endpoint.earliest is not None else geometry.start_low
    high = endpoint.latest if endpoint.latest is not None else geometry.start_high
    return (low + high) / 2


def _qualifier_marks(span, geometry: DrawnSpan, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    ends = (("start", span.start, geometry.start_low, geometry.start_high),
            ("end", span.end, geometry.end_low, geometry.end_high))
    if span.is_point:
        ends = (("end", span.start, geometry.start_low, geometry.start_high),)
    for side, endpoint, low, high in ends:
        # A mark whose date a --from/--to window cuts off is left out: the cut is marked.
        low = low if _on_axis(endpoint.earliest, scale) else None
        high = high if _on_axis(endpoint.latest, scale) else None
        if (endpoint.likely is not None and endpoint.radiocarbon is None
                and not span.is_point and _on_axis(endpoint.likely, scale)):
            parts += marks.likely_tick(endpoint.likely, scale, box, style)
            used.add("likely")
        parts += _bound_marks(endpoint, low, high, scale, box, style, used)
        kind = qualifier_kind(endpoint.qualifiers)
        at = low if side == "start" else high
        if kind and at is not None:
            parts += marks.qualifier_glyph(at, side, kind, scale, box, style)
            used.add(kind)
    return parts


def _on_axis(day: int | None, scale: TimeScale) -> bool:
    """Whether a bound is on the axis (an absent bound is drawn at the edge, so it is)."""
    return day is None or scale.start <= day <= scale.end


def _bound_marks(endpoint, low, high, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    if endpoint.has(Qualifier.BEFORE) and high is not None:
        parts += marks.bound_bracket(high, "before", scale, box, style)
        used.add("before")
    if endpoint.has(Qualifier.AFTER) and low is not None:
        parts += marks.bound_bracket(low, "after", scale, box, style)
        used.add("after")
    return parts


def qualifier_kind(qualifiers) -> str | None:
    approximate = Qualifier.APPROXIMATE in qualifiers
    uncertain = Qualifier.UNCERTAIN in qualifiers
    if approximate and uncertain:
        return "approximate uncertain"
    return "approximate" if approximate else "uncertain" if uncertain else None


def _label(placed: PlacedRecord, geometry: DrawnSpan, scale, theme, box, color) -> list[Primitive]:
    if placed.label_side == "none" or not placed.record.label:
        return []
    baseline = box.middle + theme.font_size * 0.36
    label = placed.shown or placed.record.label         # shortened with an ellipsis to fit
    if placed.label_side == "inside":
        # layout puts a label inside only when it fits on the solid core
        x = scale.x(geometry.start_high) + theme.label_pad
        return [Text(x, baseline, label, theme.font_size, fill=text_color_on(color),
                     css_class="label inside")]
    if placed.label_side == "right":
        return [Text(scale.x(placed.bar_end) + theme.label_pad, baseline, label, theme.font_size,
                     fill=theme.text_color, css_class="label")]
    if placed.label_side == "over":
        # no room beside (a bar across the whole window): over the bar, dark on a pale plate
        x = scale.x(geometry.start_low) + theme.label_pad
        width = text_width(label, theme.font_size, families=theme.font_family)
        return [Rect(x - LABEL_PLATE_MARGIN, box.y, width + 2 * LABEL_PLATE_MARGIN, box.height,
                     theme.background or "#ffffff", opacity=LABEL_PLATE_OPACITY,
                     css_class="label-plate"),
                Text(x, baseline, label, theme.font_size, fill=theme.text_color,
                     css_class="label over")]
    if placed.label_side.startswith("key"):
        # no room for the label: its number, spelled out in the key under the chart
        right = placed.label_side == "key right"
        x = (scale.x(placed.bar_end) + theme.label_pad if right
             else scale.x(placed.bar_start) - theme.label_pad)
        return [Text(x, box.middle + theme.small_font_size * 0.36, str(placed.key),
                     theme.small_font_size, weight="bold", anchor="start" if right else "end",
                     fill=theme.text_color, css_class="label key")]
    return [Text(scale.x(placed.bar_start) - theme.label_pad, baseline, label, theme.font_size,
                 anchor="end", fill=theme.text_color, css_class="label")]


def tooltip(record: Record) -> str:
    lines = [record.label or "(no label)"]
    if record.date_text:
        lines.append(f"written: {_written(record)}")
    span = record.span
    if span is not None and record.is_event:
        lines.append(_event_window_text(event_endpoint(span.start, span.end)))
    elif span is not None:
        lines.append(f"possible: {_far_bound(span.start, 'start')} to "
                     f"{_far_bound(span.end, 'end')}")
        core = span.certain_core
        lines.append("certain: " + (f"{_bound(core[0])} to {_bound(core[1])}" if core else "none"))
        if any(Qualifier.DURATION_BOUND in e.qualifiers for e in (span.start, span.end)):
            lines.append("limited by the longest duration set for it")
    if span is not None:
        ends = (span.start,) if span.is_point else (span.start, span.end)
        names = ("",) if span.is_point else ("start: ", "end: ")
        lines += [name + calibrated_text(end.radiocarbon) for name, end in zip(names, ends)
                  if end.radiocarbon is not None]
    lines.append(f"source: {record.provenance}")
    return "\n".join(lines)


def calibrated_text(measured) -> str:
    """A calibrated date in words: the measurement, the curve, the ranges at each level with
    their probabilities, the median."""
    parts = [f"{measured}, calibrated ({measured.citation.split(',')[0]})"]
    for level, ranges in reversed(measured.ranges):
        found = ", ".join(f"{_year(first)}–{_year(last)} ({p:.1%})" for first, last, p in ranges)
        parts.append(f"{level:.1%}: {found}")
    parts.append(f"median {_year(measured.median_year)}")
    return "; ".join(parts)


def _year(year: int) -> str:
    return year_text(year, "bc", mark_common_era=True)


def _written(record: Record) -> str:
    """The cells as written; an event's two cells named as its bounds."""
    if not (record.is_event and record.end_text):
        return record.date_text
    sides = (("not before", record.start_text), ("not after", record.end_text))
    return "; ".join(f"{name} {text}" for name, text in sides if text)


def _event_window_text(endpoint) -> str:
    """'one moment between … and …', or what is known where a side is not recorded."""
    earliest, latest = endpoint.earliest, endpoint.latest
    if earliest is not None and latest is not None:
        text = f"one moment between {iso_from_fixed(earliest)} and {iso_from_fixed(latest)}"
    elif latest is not None:
        text = f"one moment no later than {iso_from_fixed(latest)}; no earliest date recorded"
    else:
        text = f"one moment no earlier than {iso_from_fixed(earliest)}; no latest date recorded"
    if endpoint.likely is not None:
        text += f"; most likely {iso_from_fixed(endpoint.likely)}"
    return text


def _far_bound(endpoint, side: str) -> str:
    """A span's outer bound on one side, or why it has none: open (it runs on), not recorded
    (an empty cell), or no limit (`after 1780` as an end)."""
    day = endpoint.earliest if side == "start" else endpoint.latest
    if day is not None:
        return iso_from_fixed(day)
    if endpoint.is_open:
        return "open"
    return "not recorded" if endpoint.is_unknown else "no limit"


def _bound(day: int | None) -> str:
    return "open" if day is None else iso_from_fixed(day)
