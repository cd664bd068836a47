"""Background bands (`--bands FILE`): named periods drawn behind the lanes.

A band is a `Record` read from a second table (label, start, end; fuzzy dates as anywhere
else). It is a pale rectangle from the top of the plot to the axis, fading in across its start
window and out across its end window (`encodings.band`); a bound that is open or not recorded
runs to the axis edge. Neighbouring bands alternate two strengths of one neutral grey, so they
stay apart where they touch, and colour stays free for the records.

Labels sit in a strip above the lanes, centred on the band as drawn (fading edges included),
cut short to fit it; labels that would touch go to a second row.
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Sequence

from ..model import Record, Span
from . import encodings as marks
from .encodings import EndWindow, LaneBox
from .legend import fit_text
from .primitives import Group, Primitive, Text
from .scale import TimeScale
from .textsize import text_width
from .theme import Theme

LABEL_GAP = 6.0     # px kept between two band labels in one row


@dataclass(frozen=True, slots=True)
class PlacedBand:
    """A band on the axis: its four drawn bounds in fixed days and its label's row and text."""

    record: Record
    start: EndWindow
    end: EndWindow
    row: int
    label: str


def band_bounds(span: Span, domain: tuple[float, float]) -> tuple[EndWindow, EndWindow]:
    """The start and end windows of a band, clipped to the axis; a missing bound runs to the
    edge, and windows that overlap meet halfway (a period with no certain part)."""
    low_edge, high_edge = domain
    clip = lambda day: min(max(day, low_edge), high_edge)  # noqa: E731 - one-line clamp
    a = low_edge if span.start.earliest is None else clip(span.start.earliest)
    d = high_edge if span.end.latest is None else clip(span.end.latest)
    b = a if span.start.latest is None else clip(span.start.latest)
    c = d if span.end.earliest is None else clip(span.end.earliest)
    b, c = min(b, d), max(c, a)
    if b > c:
        b = c = (b + c) / 2
    return EndWindow(a, b, "start"), EndWindow(c, d, "end")


def on_axis(bands: Sequence[Record], domain: tuple[float, float]
            ) -> tuple[list[Record], list[Record]]:
    """(bands with some part on the axis, bands wholly off it); undated rows are off it."""
    shown, off = [], []
    for band in bands:
        low, high = band.span.possible_extent if band.span else (domain[1], domain[0])
        inside = (high is None or high >= domain[0]) and (low is None or low <= domain[1])
        (shown if band.span is not None and inside else off).append(band)
    return shown, off


def place_bands(bands: Sequence[Record], scale: TimeScale, theme: Theme) -> list[PlacedBand]:
    """Each band on the axis with its label fitted and put in the first row where it does not
    run into another label."""
    placed: list[PlacedBand] = []
    row_ends: list[float] = []          # the right end of the last label in each row
    for band in sorted(on_axis(bands, (scale.start, scale.end))[0], key=_start_day):
        start, end = band_bounds(band.span, (scale.start, scale.end))
        left, right = _label_room(start, end, scale)
        label = fit_text(band.label, theme.small_font_size, max(right - left - 4, 0.0))
        width = text_width(label, theme.small_font_size)
        label_left = (left + right - width) / 2
        row = next((i for i, end_x in enumerate(row_ends) if end_x + LABEL_GAP <= label_left),
                   len(row_ends))
        row_ends[row:row + 1] = [label_left + width]
        placed.append(PlacedBand(band, start, end, row, label))
    return placed


def _start_day(band: Record) -> float:
    earliest = band.span.start.earliest
    return float("-inf") if earliest is None else earliest


def _label_room(start: EndWindow, end: EndWindow, scale: TimeScale) -> tuple[float, float]:
    """The x range a label is centred in: the whole band, its fading edges included (a
    period's certain part is often too short for its name)."""
    return scale.x(start.low), scale.x(end.high)


def strip_height(placed: Sequence[PlacedBand], theme: Theme) -> float:
    """Height of the label strip above the lanes: one text row per label row used."""
    rows = max((band.row for band in placed), default=-1) + 1
    return rows * label_row_height(theme) + (4 if rows else 0)


def label_row_height(theme: Theme) -> float:
    return theme.small_font_size * 1.5


def draw_bands(placed: Sequence[PlacedBand], scale: TimeScale, theme: Theme, top: float,
               bottom: float, used: set[str]) -> Group:
    """The bands from `top` (the top of the label strip) down to `bottom` (the axis)."""
    items: list[Primitive] = []
    box = LaneBox(top, bottom - top)
    for index, band in enumerate(placed):
        opacity = theme.band_opacities[index % len(theme.band_opacities)]
        shapes = marks.band(band.start, band.end, scale, box, theme.band_color, opacity)
        if band.start.high > band.start.low or band.end.high > band.end.low:
            used.add("band fringe")
        if band.label:
            shapes.append(_band_label(band, scale, theme, top))
        items.append(Group(tuple(shapes), css_class="band", title=_tooltip(band.record)))
    return Group(tuple(items), css_class="bands")


def _band_label(band: PlacedBand, scale: TimeScale, theme: Theme, top: float) -> Text:
    left, right = _label_room(band.start, band.end, scale)
    baseline = top + band.row * label_row_height(theme) + theme.small_font_size * 1.1
    return Text((left + right) / 2, baseline, band.label, theme.small_font_size,
                anchor="middle", style="italic", fill=theme.text_color, css_class="band-label")


def _tooltip(band: Record) -> str:
    written = f"\nwritten: {band.date_text}" if band.date_text else ""
    return f"{band.label or '(no label)'}{written}\nsource: {band.provenance}"
