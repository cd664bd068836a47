"""Placement + scale + theme -> Scene: bars, labels, group headers, axis, legend and notes.

Vertical order of the page: title, the groups' lanes, the time axis, the legend, the notes.
Each record becomes one `Group(css_class="record")` whose title is its tooltip.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from typing import Callable

from . import encodings as marks
from .calendar import gregorian_year_from_fixed, iso_from_fixed
from .encodings import EndWindow, LaneBox, MarkStyle
from .layout import GroupPlacement, Placement, PlacedRecord
from .legend import legend_and_notes
from .model import Qualifier, Record, Span
from .scale import TimeScale, ticks, year_text
from .scene import Group, Line, Primitive, Scene, Text
from .textsize import text_width
from .theme import Theme, text_color_on

SUBGROUP_INDENT = 10.0      # px: subgroup names sit a little right of their group's header


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


def drawn_span(span: Span, domain: tuple[float, float]) -> DrawnSpan:
    """Where each part of a span is drawn. Unbounded sides run to the axis edge; an unknown
    start reaches to the end's earliest bound (and an unknown end back to the start's latest),
    so the whole stretch reads as possible, none of it certain."""
    low_edge, high_edge = domain
    start, end = span.start, span.end
    a = _first(start.earliest, low_edge)
    d = _first(end.latest, high_edge)
    b = _first(start.latest, end.earliest, d)
    c = _first(end.earliest, start.latest, a)
    if start.is_open:
        a = b = low_edge
    if end.is_open:
        c = d = high_edge
    # A span cannot end before it starts: an end window reaching back past the earliest start
    # (562 BC to '6th century BC') is drawn from that start, and a start window no later
    # than the latest end.
    c, b = max(c, a), min(b, d)
    clip = lambda day: min(max(day, low_edge), high_edge)  # noqa: E731 - one-line clamp
    has_core = span.certain_core is not None and clip(b) <= clip(c)
    return DrawnSpan(clip(a), clip(b), clip(c), clip(d), start.is_open, end.is_open, has_core)


def _first(*values):
    return next(v for v in values if v is not None)


@dataclass(frozen=True, slots=True)
class ChartText:
    title: str = ""
    undated: tuple[Record, ...] = ()
    not_drawn: int = 0          # rows reported (unreadable or contradictory), not drawn
    source: str = ""


@dataclass
class _Collector:
    """The marks that occur, so the legend shows only those."""

    used: set[str] = field(default_factory=set)


def compose(placement: Placement, scale: TimeScale, theme: Theme, text: ChartText,
            color_of: Callable[[Record], str], color_key: tuple[tuple[str, str], ...] = (),
            plot_top: float | None = None) -> Scene:
    seen = _Collector()
    top = plot_top if plot_top is not None else title_height(text.title, theme)
    lanes, plot_bottom = _draw_groups(placement, scale, theme, top, color_of, seen)
    axis, axis_bottom = _draw_axis(scale, theme, top, plot_bottom)
    legend, bottom = legend_and_notes(seen.used, color_key, text, theme, axis_bottom,
                                      width=theme.width)
    children: list[Primitive] = []
    if text.title:
        children.append(Text(theme.margin, theme.margin + theme.title_size, text.title,
                             theme.title_size, weight="bold", fill=theme.text_color,
                             css_class="title"))
    children += [axis[0], *lanes, *axis[1:], *legend]
    return Scene(theme.width, bottom + theme.margin, tuple(children), title=text.title or
                 "Timeline", desc=describe(placement, scale, theme, text),
                 background=theme.background, font_family=theme.font_family)


def title_height(title: str, theme: Theme) -> float:
    return theme.margin + (theme.title_size + 14 if title else 0)


def _draw_groups(placement, scale, theme, top, color_of, seen):
    """Each group's lanes top to bottom, a separator line between groups. A group with
    subgroups gets a header row of its own, then its subgroups with their names at the left
    and a lighter, dashed separator between them."""
    items: list[Primitive] = []
    y = top
    captions = _Captions(scale.x0 - theme.margin - 12, theme,
                         named=any(group.name for group in placement.groups))
    for index, group in enumerate(placement.groups):
        if index:
            items.append(Line(theme.margin, y - theme.group_gap / 2, theme.width - theme.margin,
                              y - theme.group_gap / 2, theme.separator_color, 1.0,
                              css_class="separator"))
        block, y = _group_block(group, f"group-{index + 1}", scale, theme, y, color_of, seen,
                                captions)
        items.append(block)
        y += theme.group_gap
    return items, y - theme.group_gap


@dataclass(frozen=True, slots=True)
class _Captions:
    """How group names are written at the left: within `width`, "(none)" for records with
    no group when other groups have names."""

    width: float
    theme: Theme
    named: bool

    def text(self, name: str, width: float | None = None, weight: str = "normal") -> str:
        shown = name or ("(none)" if self.named else "")
        return fit_text(shown, self.theme.group_label_size, width or self.width, weight)


def _group_block(group: GroupPlacement, element_id: str, scale, theme, y, color_of, seen,
                 captions: _Captions) -> tuple[Group, float]:
    """The group's primitives and the y below its last lane."""
    if not group.subgroups:
        children, y = _lanes(group, scale, theme, y, color_of, seen,
                             captions.text(group.name, weight="bold"), "group-label", 0.0)
        return Group(tuple(children), css_class=f"group group-{slug(group.name or 'all')}",
                     id=element_id), y
    header = _caption(theme.margin, y, captions.text(group.name, theme.width - 2 * theme.margin,
                                                     "bold"), theme, "bold", "group-label")
    children: list[Primitive] = [_with_title(header, group)]
    y += theme.lane_height
    sub_captions = _Captions(captions.width - SUBGROUP_INDENT, theme,
                             named=any(sub.name for sub in group.subgroups))
    gap = theme.group_gap / 2
    for index, subgroup in enumerate(group.subgroups):
        if index:
            children.append(Line(theme.margin + SUBGROUP_INDENT, y + gap / 2,
                                 theme.width - theme.margin, y + gap / 2, theme.separator_color,
                                 0.75, dash=(3.0, 3.0), css_class="subgroup-separator"))
            y += gap
        lanes, y = _lanes(subgroup, scale, theme, y, color_of, seen,
                          sub_captions.text(subgroup.name), "subgroup-label", SUBGROUP_INDENT)
        children.append(Group(tuple(lanes), id=f"{element_id}-{index + 1}",
                              css_class=f"subgroup subgroup-{slug(subgroup.name or 'none')}"))
    return Group(tuple(children), css_class=f"group group-{slug(group.name or 'all')}",
                 id=element_id), y


def _lanes(group: GroupPlacement, scale, theme, y, color_of, seen, caption: str,
           caption_class: str, indent: float) -> tuple[list[Primitive], float]:
    children: list[Primitive] = []
    if caption:
        label = _caption(theme.margin + indent, y, caption, theme,
                         "bold" if caption_class == "group-label" else "normal", caption_class)
        children.append(_with_title(label, group))
    for placed in group.records:
        lane_top = y + placed.lane * theme.lane_height
        box = LaneBox(lane_top + (theme.lane_height - theme.bar_height) / 2, theme.bar_height)
        children.append(draw_record(placed, scale, theme, box, color_of(placed.record), seen.used))
    y += max(group.lanes, 1) * theme.lane_height
    if group.left_out:
        children.append(_left_out_row(group.left_out, scale, theme, y))
        y += theme.lane_height
    return children, y


def _caption(x: float, y: float, text: str, theme: Theme, weight: str, css_class: str) -> Text:
    return Text(x, y + theme.lane_height / 2 + theme.group_label_size * 0.36, text,
                theme.group_label_size, weight=weight, fill=theme.text_color, css_class=css_class)


def _with_title(caption: Text, group: GroupPlacement) -> Primitive:
    """A caption, inside a group whose tooltip names the small groups merged into it."""
    if not group.merged:
        return caption
    return Group((caption,), css_class="group-header",
                 title=f"{group.name}: {', '.join(group.merged)} (small groups merged)")


def _left_out_row(records: tuple[Record, ...], scale, theme, y: float) -> Group:
    """A row under the lanes saying which records found no room in them; all in the tooltip."""
    names = [f"{r.label} (row {r.provenance.row})" for r in records]
    text = f"{len(records)} more not drawn, no room left in these lanes: {', '.join(names)}"
    line = Text(scale.x0, y + theme.lane_height / 2 + theme.small_font_size * 0.36,
                fit_text(text, theme.small_font_size, scale.x1 - scale.x0), theme.small_font_size,
                style="italic", fill=theme.muted_color, css_class="left-out")
    return Group((line,), css_class="left-out", title="Not drawn, no room left:\n"
                 + "\n".join(names))


def fit_text(text: str, size: float, width: float, weight: str = "normal") -> str:
    """`text`, cut short with an ellipsis where it would be wider than `width` px."""
    if text_width(text, size, weight) <= width:
        return text
    low, high = 0, len(text)          # the longest prefix that fits with "…" after it
    while low < high:
        middle = (low + high + 1) // 2
        if text_width(text[:middle].rstrip() + "…", size, weight) <= width:
            low = middle
        else:
            high = middle - 1
    return text[:low].rstrip() + "…" if low else ""


def draw_record(placed: PlacedRecord, scale: TimeScale, theme: Theme, box: LaneBox, color: str,
                used: set[str]) -> Group:
    record = placed.record
    style = MarkStyle(color, theme.fringe_far_opacity, theme.text_color, theme.small_font_size)
    geometry = drawn_span(record.span, (scale.start, scale.end))
    if record.span.is_point and not geometry.open_start and not geometry.open_end:
        parts = _point_marks(record.span, geometry, scale, box, style, used)
    else:
        parts = _bar_marks(record.span, geometry, scale, box, style, theme, used)
    parts += _qualifier_marks(record.span, geometry, scale, box, style, used)
    parts += _label(placed, geometry, scale, theme, box, color)
    return Group(tuple(parts), css_class="record", title=tooltip(record))


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
        elif endpoint.is_unknown:
            parts += marks.unknown_stretch(window, scale, box, style)
            used.add("unknown")
        else:
            drawn = fringe(window, scale, box, style)
            parts += drawn
            if drawn:
                used.add(f"fringe:{theme.fringe}")
    return parts


def _point_marks(span, geometry: DrawnSpan, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    endpoint = span.start
    if geometry.start_high > geometry.start_low:
        parts += marks.whisker(EndWindow(geometry.start_low, geometry.start_high, "end"),
                               scale, box, style)
        used.add("point window")
    centre = endpoint.likely if endpoint.likely is not None else (
        (geometry.start_low + geometry.start_high) / 2)
    parts += marks.point_marker(centre, scale, box, style)
    used.add("point")
    return parts


def _qualifier_marks(span, geometry: DrawnSpan, scale, box, style, used) -> list[Primitive]:
    parts: list[Primitive] = []
    ends = (("start", span.start, geometry.start_low, geometry.start_high),
            ("end", span.end, geometry.end_low, geometry.end_high))
    if span.is_point:
        ends = (("end", span.start, geometry.start_low, geometry.start_high),)
    for side, endpoint, low, high in ends:
        if endpoint.likely is not None and not span.is_point:
            parts += marks.likely_tick(endpoint.likely, scale, box, style)
            used.add("likely")
        if endpoint.has(Qualifier.BEFORE):
            parts += marks.bound_bracket(high, "before", scale, box, style)
            used.add("before")
        if endpoint.has(Qualifier.AFTER):
            parts += marks.bound_bracket(low, "after", scale, box, style)
            used.add("after")
        kind = qualifier_kind(endpoint.qualifiers)
        if kind:
            parts += marks.qualifier_glyph(low if side == "start" else high, side, kind,
                                           scale, box, style)
            used.add(kind)
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
    label = placed.record.label
    if placed.label_side == "inside":
        # layout puts a label inside only when it fits on the solid core
        x = scale.x(geometry.start_high) + theme.label_pad
        return [Text(x, baseline, label, theme.font_size, fill=text_color_on(color),
                     css_class="label inside")]
    if placed.label_side == "right":
        return [Text(scale.x(placed.bar_end) + theme.label_pad, baseline, label, theme.font_size,
                     fill=theme.text_color, css_class="label")]
    return [Text(scale.x(placed.bar_start) - theme.label_pad, baseline, label, theme.font_size,
                 anchor="end", fill=theme.text_color, css_class="label")]


def _draw_axis(scale: TimeScale, theme: Theme, top: float, bottom: float):
    """Grid behind the lanes (returned first, drawn first), then the axis line and labels."""
    grid: list[Primitive] = []
    axis: list[Primitive] = [Line(scale.x0, bottom + 4, scale.x1, bottom + 4, theme.muted_color,
                                  1.0, css_class="axis-line")]
    for tick in ticks(scale, era=theme.era):
        x = scale.x(tick.day)
        grid.append(Line(x, top - 4, x, bottom + 4, theme.grid_color, 1.0 if tick.major else 0.5,
                         css_class="grid"))
        axis.append(Line(x, bottom + 4, x, bottom + (9 if tick.major else 7), theme.muted_color,
                         1.0, css_class="tick"))
        if tick.major and tick.label:
            # keep an edge label on the page: shift it inward rather than cut it off
            half = text_width(tick.label, theme.small_font_size) / 2 + 2
            centre = min(max(x, half), theme.width - half)
            axis.append(Text(centre, bottom + 12 + theme.small_font_size, tick.label,
                             theme.small_font_size, anchor="middle", fill=theme.text_color,
                             css_class="tick-label"))
    return [Group(tuple(grid), css_class="grid"), Group(tuple(axis), css_class="axis")], (
        bottom + theme.axis_height)


def tooltip(record: Record) -> str:
    lines = [record.label or "(no label)"]
    if record.date_text:
        lines.append(f"written: {record.date_text}")
    if record.span is not None:
        lines.append(f"possible: {_bound(record.span.possible_extent[0])} to "
                     f"{_bound(record.span.possible_extent[1])}")
        core = record.span.certain_core
        lines.append("certain: " + (f"{_bound(core[0])} to {_bound(core[1])}" if core else "none"))
    lines.append(f"source: {record.provenance}")
    return "\n".join(lines)


def _bound(day: int | None) -> str:
    return "open" if day is None else iso_from_fixed(day)


def describe(placement: Placement, scale: TimeScale, theme: Theme, text: ChartText) -> str:
    drawn = sum(len(group.records) for _, group in placement.leaves())
    first = year_text(gregorian_year_from_fixed(int(scale.start)), theme.era)
    last = year_text(gregorian_year_from_fixed(int(scale.end)), theme.era)
    names = [g.name for g in placement.groups if g.name]
    groups = f" in {len(names)} groups ({', '.join(names)})" if names else ""
    undated = f"; {len(text.undated)} undated, listed below the chart" if text.undated else ""
    return f"Timeline of {drawn} records{groups}, from {first} to {last}{undated}."


def slug(name: str) -> str:
    cleaned = "".join(c.lower() if c.isalnum() else "-" for c in name)
    return "-".join(part for part in cleaned.split("-") if part)[:40] or "group"

