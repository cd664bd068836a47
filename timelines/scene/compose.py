"""Placement + scale + theme -> Scene: heading, bands, lanes with group headers, axis, legend
and notes.

Vertical order of the page: title and subtitle, the band labels, the groups' lanes, the time
axis, the legend, the notes and the credit. Each record becomes one `Group(css_class="record")`
whose title is its tooltip (see `bars`); `draw_plot` is the part between heading and legend,
which small multiples (`facets`) draw once per panel.
"""
from __future__ import annotations

from collections import Counter
from dataclasses import dataclass, replace
from typing import Callable, Sequence

from ..calendar import gregorian_year_from_fixed, year_text
from ..layout import GroupPlacement, PlacedRecord, Placement
from ..model import Record, counted
from .activity import ActivitySeries, activity_strip
from .axis import axis_labels_row, calendar_note, draw_axis, draw_top_axis
from .bands import draw_bands, place_bands, strip_height
from .bars import draw_record, drawn_spans, stub_days
from .encodings import LaneBox
from .legend import fit_text, heading, legend_and_notes
from .overview import Overview, draw_overview
from .primitives import Group, Line, Primitive, Scene, Text
from .scale import TimeScale
from .theme import Theme

SUBGROUP_INDENT = 10.0      # px: subgroup names sit a little right of their group's header
# Lanes taller than a screen shows at once (a laptop's browser window is 700-900 px tall;
# common practice, no source) get the axis above them as well as below.
TOP_AXIS_FROM = 600.0
# And the axis labels again at the group break after each page's height (an A4 page is 1123 px
# at 96 px an inch: CSS Values and Units Level 3, 1in = 96px; ISO 216 A4 = 297 mm).
REPEAT_AXIS_EVERY = 1123.0


@dataclass(frozen=True, slots=True)
class ChartText:
    """The words around the plot: heading, the notes under the chart and what they report."""

    title: str = ""
    undated: tuple[Record, ...] = ()
    not_drawn: int = 0          # rows reported (unreadable or contradictory), not drawn
    source: str = ""
    subtitle: str = ""
    credit: str = ""            # a source or credit line, the last line of the page
    notes: tuple[str, ...] = ()  # the user's notes, each its own paragraph
    outside: tuple[Record, ...] = ()  # records wholly outside the --from/--to window
    color_title: str = ""       # the column the colours stand for, heading the colour key
    # Labels shown by key number: (panel name or "", those records in number order) each.
    keyed: tuple[tuple[str, tuple[PlacedRecord, ...]], ...] = ()


def compose(placement: Placement, scale: TimeScale, theme: Theme, text: ChartText,
            color_of: Callable[[Record], str], color_key: tuple[tuple[str, str], ...] = (),
            plot_top: float | None = None, bands: Sequence[Record] = (),
            activity: Sequence[ActivitySeries] = (), overview: Overview | None = None) -> Scene:
    """The timeline page; with `activity`, its counts per block in a strip under the lanes
    on the same time axis; with `overview`, the counts of the whole table above the lanes
    of the part they show."""
    used: set[str] = set()      # the marks that occur, so the legend shows only those
    header, header_bottom = heading(text, theme, theme.width)
    top = plot_top if plot_top is not None else header_bottom
    if overview is not None:
        strips, top = draw_overview(overview, theme, top, scale.x0)
        header += strips
    plot, plot_bottom = draw_plot(placement, scale, theme, top, color_of, used, bands)
    if activity:
        strip, plot_bottom = activity_strip(list(activity), scale, theme, plot_bottom + 8)
        plot += strip
    keyed = (("", placement.keyed),) if placement.keyed else ()
    axis_calendar = calendar_note(scale, theme)
    text = replace(text, keyed=keyed, notes=(*text.notes, axis_calendar) if axis_calendar
                   else text.notes)
    legend, bottom = legend_and_notes(used, color_key, text, theme, plot_bottom,
                                      width=theme.width)
    return Scene(theme.width, bottom + theme.margin, tuple(header + plot + legend),
                 title=text.title or "Timeline",
                 desc=describe(placement, scale, theme, text) + (
                     f" {overview.note}" if overview is not None else ""),
                 background=theme.background, font_family=theme.font_family)


def title_height(text: ChartText, theme: Theme) -> float:
    """Where the plot begins below the title and subtitle."""
    return heading(text, theme, theme.width)[1]


def draw_plot(placement: Placement, scale: TimeScale, theme: Theme, top: float,
              color_of: Callable[[Record], str], used: set[str], bands: Sequence[Record] = ()
              ) -> tuple[list[Primitive], float]:
    """Bands, grid, lanes and axis from `top` down; the y below the axis. Drawing order is
    back to front: bands, grid, lanes, axis."""
    placed_bands = place_bands(bands, scale, theme)
    lanes_top = top + strip_height(placed_bands, theme)
    tall = lanes_height(placement, theme) > TOP_AXIS_FROM
    above: list[Primitive] = []
    if tall:
        top_axis, lanes_top = draw_top_axis(scale, theme, lanes_top)
        above.append(top_axis)
    lanes, lanes_bottom = _draw_groups(placement, scale, theme, lanes_top, color_of, used,
                                       repeat_axis=tall)
    grid, axis, bottom = draw_axis(scale, theme, lanes_top, lanes_bottom)
    behind = [draw_bands(placed_bands, scale, theme, top, lanes_bottom + 4, used)
              ] if placed_bands else []
    return [*behind, grid, *above, *lanes, axis], bottom


def lanes_height(placement: Placement, theme: Theme) -> float:
    """The height of the lanes, near enough to decide whether a chart is tall: one lane height
    per lane of each group (at least one), and the gaps between groups."""
    rows = sum(max(group.lanes, 1) for _, group in placement.leaves())
    return rows * theme.lane_height + (len(placement.groups) - 1) * theme.group_gap


def _draw_groups(placement, scale, theme, top, color_of, used, repeat_axis: bool = False):
    """Each group's lanes top to bottom, a separator line between groups. A group with
    subgroups gets a header row of its own, then its subgroups with their names at the left
    and a lighter, dashed separator between them. With `repeat_axis`, the axis labels again
    at the first group break a page's height after the last axis."""
    items: list[Primitive] = []
    y = last_axis = top
    captions = _Captions(scale.x0 - theme.margin - 12, theme,
                         named=any(group.name for group in placement.groups))
    for index, group in enumerate(placement.groups):
        if index:
            items.append(Line(theme.margin, y - theme.group_gap / 2, theme.width - theme.margin,
                              y - theme.group_gap / 2, theme.separator_color, 1.0,
                              css_class="separator"))
        if index and repeat_axis and y - last_axis > REPEAT_AXIS_EVERY:
            items.append(axis_labels_row(scale, theme, y))
            y += theme.small_font_size + 10
            last_axis = y
        block, y = _group_block(group, f"group-{index + 1}", scale, theme, y, color_of, used,
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


def _group_block(group: GroupPlacement, element_id: str, scale, theme, y, color_of, used,
                 captions: _Captions) -> tuple[Group, float]:
    """The group's primitives and the y below its last lane."""
    if not group.subgroups:
        children, y = _lanes(group, scale, theme, y, color_of, used,
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
        lanes, y = _lanes(subgroup, scale, theme, y, color_of, used,
                          sub_captions.text(subgroup.name), "subgroup-label", SUBGROUP_INDENT)
        children.append(Group(tuple(lanes), id=f"{element_id}-{index + 1}",
                              css_class=f"subgroup subgroup-{slug(subgroup.name or 'none')}"))
    return Group(tuple(children), css_class=f"group group-{slug(group.name or 'all')}",
                 id=element_id), y


def _lanes(group: GroupPlacement, scale, theme, y, color_of, used, caption: str,
           caption_class: str, indent: float) -> tuple[list[Primitive], float]:
    children: list[Primitive] = []
    if caption:
        label = _caption(theme.margin + indent, y, caption, theme,
                         "bold" if caption_class == "group-label" else "normal", caption_class)
        children.append(_with_title(label, group))
    drawn = drawn_spans([placed.record.span for placed in group.records],
                        (scale.start, scale.end), stub_days(scale, theme)).each()
    for placed, geometry in zip(group.records, drawn):
        lane_top = y + placed.lane * theme.lane_height
        box = LaneBox(lane_top + (theme.lane_height - theme.bar_height) / 2, theme.bar_height)
        children.append(draw_record(placed, scale, theme, box, color_of(placed.record), used,
                                    geometry))
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


def describe(placement: Placement, scale: TimeScale, theme: Theme, text: ChartText) -> str:
    """The SVG <desc>: how many records, which span of time, which groups; then the subtitle,
    what was left out, the user's notes and the credit."""
    drawn = counted(p.record for _, group in placement.leaves() for p in group.records)
    names = [g.name for g in placement.groups if g.name]
    groups = f" in {len(names)} groups ({', '.join(names)})" if names else ""
    summary = f"Timeline of {drawn}{groups}, from {time_range(scale, theme)}"
    return describe_text(summary, text)


def time_range(scale: TimeScale, theme: Theme) -> str:
    first = year_text(gregorian_year_from_fixed(int(scale.start)), theme.era)
    last = year_text(gregorian_year_from_fixed(int(scale.end)), theme.era)
    return f"{first} to {last}"


def describe_text(summary: str, text: ChartText) -> str:
    """`summary` followed by what the notes under the chart say, one sentence each."""
    parts = [summary]
    if text.undated:
        parts[-1] += f"; {len(text.undated)} undated, listed below the chart"
    if text.outside:
        parts[-1] += f"; {len(text.outside)} outside the time shown, listed below the chart"
    sentences = [part.strip() for part in (*parts, text.subtitle, *text.notes, text.credit)
                 if part.strip()]
    return " ".join(s if s.endswith((".", "!", "?", "…")) else s + "." for s in sentences)


def slug(name: str) -> str:
    cleaned = "".join(c.lower() if c.isalnum() else "-" for c in name)
    return "-".join(part for part in cleaned.split("-") if part)[:40] or "group"


def color_key(records: list[Record], theme: Theme) -> tuple[tuple[str, str], ...]:
    """(value, colour) for each value of the colour column, in order of first appearance;
    with `theme.max_colors`, the smallest values beyond it share one colour as 'other'."""
    return colors_of(records, theme)[1]


def colors_of(records: list[Record], theme: Theme
              ) -> tuple[Callable[[Record], str], tuple[tuple[str, str], ...]]:
    """(a record's colour, the colour key) for `records`, in order of first appearance."""
    counts = Counter(r.color for r in records if r.color)
    values = list(counts)                          # a Counter keeps first-appearance order
    limit = theme.max_colors
    merged: list[str] = []
    if limit is not None and len(values) > limit:
        kept = set(sorted(values, key=lambda v: -counts[v])[:max(limit - 1, 0)])
        merged = [value for value in values if value not in kept]
        values = [value for value in values if value in kept]
    key = [(value, theme.color_for(i)) for i, value in enumerate(values)]
    by_value = dict(key)
    if merged:
        other = theme.color_for(len(values))
        key.append((f"other ({len(merged)} values)", other))
        by_value.update(dict.fromkeys(merged, other))
    return (lambda record: by_value.get(record.color, theme.bar_color)), tuple(key)
