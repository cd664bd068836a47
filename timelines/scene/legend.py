"""The chart's words: the heading (title, subtitle), the legend (only the marks that occur,
in plain words) and the notes under it (what was not drawn and why, the user's notes, and last
the source or credit line)."""
from __future__ import annotations

from . import encodings as marks
from .encodings import EndWindow, LaneBox, MarkStyle
from .primitives import Group, Primitive, Text
from .scale import TimeScale
from .textsize import text_width
from .theme import DEFAULT_THEME, Theme

SWATCH = 34.0   # page width of a legend sample beside text of the default small size
SWATCH_HEIGHT = 10.0
# Legend entries in reading order: key used while drawing -> plain words.
ENTRIES = (
    ("core", "certain: the span surely covers this"),
    ("fringe:fade", "possible: the date lies somewhere in the fading part"),
    ("fringe:whisker", "possible: the date lies somewhere on the thin line"),
    ("fringe:hatch", "possible: the date lies somewhere in the hatched part"),
    ("fringe:dots", "possible: the date lies somewhere in the dotted part"),
    ("open", "open: runs on beyond the chart"),
    ("continues", "continues beyond the window shown"),
    ("unknown", "not recorded: an empty cell, drawn short; it could lie anywhere beyond"),
    ("unknown bounded", "not recorded: anywhere in the dashed part, within the longest "
                        "duration set"),
    ("unbounded", "no limit on this side: drawn short, it could lie further on"),
    ("unbounded bounded", "no limit recorded: anywhere in the dashed part, within the longest "
                          "duration set"),
    ("before", "before: no later than the bracket"),
    ("after", "after: no earlier than the bracket"),
    ("approximate", "approximate (c., ~)"),
    ("uncertain", "uncertain (?)"),
    ("approximate uncertain", "approximate and uncertain"),
    ("likely", "most likely date"),
    ("point", "a dated moment"),
    ("point window", "a moment somewhere on the line"),
    ("event window", "an event: one moment somewhere in the shaded window, not a duration"),
    ("band fringe", "shaded period; its edge fades where its start or end is uncertain"),
    ("calibrated", "radiocarbon date, calibrated: the darker, the likelier; the line beneath "
                   "marks the 68.3% ranges, the shading spans the 95.4% ranges"),
    ("calibrated median", "the median of a calibrated date"),
)
OUTSIDE_LISTED = 10     # records outside the window named in the note; the rest counted
# Undated records named in the note; the rest counted: a catalogue's thousands of n.d. rows
# listed in full made a chart tens of thousands of px tall ('timelines check' names them all).
UNDATED_LISTED = 50


def legend_and_notes(used: set[str], color_key, text, theme: Theme, top: float,
                     width: float) -> tuple[list[Primitive], float]:
    entries = [(key, words) for key, words in ENTRIES if key in used]
    items: list[Primitive] = []
    y = top + 6
    if entries or color_key:
        legend, y = _legend(entries, color_key, text, theme, y, width)
        items.append(legend)
    curves = sorted(key.split(":", 1)[1] for key in used if key.startswith("curve:"))
    notes, y = _notes(text, theme, y, width, [f"Radiocarbon ages calibrated with {citation}."
                                              for citation in curves])
    items += notes
    return items, y


def _legend(entries, color_key, text, theme: Theme, top: float, width: float):
    """The marks that occur, then the colour key under a heading naming its column, each
    sample with its words, wrapped to `width`."""
    # Where colour stands for a column, the marks are shown neutral: their colour means nothing.
    mark_color = theme.neutral_color if color_key else theme.bar_color
    samples = [(_sample(key, theme, color=mark_color), words) for key, words in entries]
    samples += [(_color_sample(color, theme), value) for value, color in color_key]
    heading_at = len(entries) if color_key and text.color_title else None
    children: list[Primitive] = []
    x, y = theme.margin, top
    row = theme.legend_row_height
    scale = swatch_scale(theme)
    swatch, gap, space = SWATCH * scale, 6 * scale, 18 * scale
    for index, (draw, words) in enumerate(samples):
        if index == heading_at:
            x, y = (theme.margin, y + row) if x > theme.margin else (x, y)
            title = f"{text.color_title}:"
            children.append(Text(x, y + row / 2 + theme.small_font_size * 0.36, title,
                                 theme.small_font_size, weight="bold", fill=theme.text_color,
                                 css_class="legend-text legend-heading"))
            x += text_width(title, theme.small_font_size, "bold") + gap
        words = fit_text(words, theme.small_font_size, width - 2 * theme.margin - swatch - gap)
        needed = swatch + gap + text_width(words, theme.small_font_size) + space
        if x + needed - space > width - theme.margin and x > theme.margin:
            x, y = theme.margin, y + row
        box = LaneBox(y + (row - SWATCH_HEIGHT * scale) / 2, SWATCH_HEIGHT * scale)
        children += draw(x, box)
        children.append(Text(x + swatch + gap, box.middle + theme.small_font_size * 0.36, words,
                             theme.small_font_size, fill=theme.text_color,
                             css_class="legend-text"))
        x += needed
    return Group(tuple(children), css_class="legend"), y + row


def swatch_scale(theme: Theme) -> float:
    """How much the legend's samples grow or shrink: with its text, never above full size."""
    return min(theme.small_font_size / DEFAULT_THEME.small_font_size, 1.0)


def _sample(key: str, theme: Theme, color: str):
    """A small picture of one mark, drawn by the same encoder the chart uses."""
    style = MarkStyle(color, theme.fringe_far_opacity, theme.text_color, theme.small_font_size)
    fringe = marks.fringe_encoder(theme.fringe)   # bound and likely samples use the chart's

    def draw(x: float, box: LaneBox) -> list[Primitive]:
        scale = TimeScale(0.0, 10.0, x, x + SWATCH * swatch_scale(theme))
        if key == "core":
            return marks.core(0, 10, scale, box, style)
        if key.startswith("fringe:"):
            return marks.FRINGES[key.split(":", 1)[1]](EndWindow(0, 10, "end"), scale, box, style)
        if key == "open":
            return (marks.core(0, 7, scale, box, style)
                    + marks.open_arrow(7, "end", scale, box, style))
        if key == "continues":
            return (marks.core(0, 8, scale, box, style)
                    + marks.continues_mark(8, "end", scale, box, style))
        if key == "band fringe":
            return _band_sample(x, box, theme)
        if key.startswith(("unknown", "unbounded")):
            return marks.unknown_stretch(EndWindow(0, 10, "end"), scale, box, style, theme.fringe)
        if key == "before":
            return (fringe(EndWindow(0, 7, "start"), scale, box, style)
                    + marks.bound_bracket(7, "before", scale, box, style))
        if key == "after":
            return (marks.bound_bracket(3, "after", scale, box, style)
                    + fringe(EndWindow(3, 10, "end"), scale, box, style))
        if key == "likely":
            return (fringe(EndWindow(0, 10, "start"), scale, box, style)
                    + marks.likely_tick(6, scale, box, style))
        if key in ("point", "calibrated median"):
            return marks.point_marker(5, scale, box, style)
        if key == "event window":
            return (marks.event_window(EndWindow(0, 10, "event", 5), scale, box, style)
                    + marks.point_marker(5, scale, box, style))
        if key == "calibrated":
            days = [0, 1.5, 3, 4, 5, 6.5, 8, 10]          # two ranges, the first the likelier
            relative = [0.05, 1.0, 0.55, 0.02, 0.0, 0.45, 0.3, 0.05]
            return (marks.density_fade(EndWindow(0, 10, "end"), scale, box, style, days,
                                       relative)
                    + marks.calibrated_ranges([(0.8, 2.4), (6, 7)], scale, box, style))
        if key == "point window":
            return (marks.moment_window(EndWindow(1, 9, "end"), scale, box, style)
                    + marks.point_marker(5, scale, box, style))
        return marks.qualifier_glyph(3, "end", key, scale, box, style)
    return draw


def _band_sample(x: float, box: LaneBox, theme: Theme) -> list[Primitive]:
    scale = TimeScale(0.0, 10.0, x, x + SWATCH * swatch_scale(theme))
    tall = LaneBox(box.y - 3, box.height + 6)
    start, end = EndWindow(0, 4, "start"), EndWindow(10, 10, "end")
    return marks.band(start, end, scale, tall, theme.band_color, theme.band_opacities[0])


def _color_sample(color: str, theme: Theme):
    style = MarkStyle(color)

    def draw(x: float, box: LaneBox) -> list[Primitive]:
        return marks.core(0, 10, TimeScale(0.0, 10.0, x, x + SWATCH * 0.6 * swatch_scale(theme)),
                          box, style)
    return draw


def _notes(text, theme: Theme, top: float, width: float,
           sources: list[str] = ()) -> tuple[list[Primitive], float]:
    room = width - 2 * theme.margin
    paragraphs = [*_report_notes(text), *sources, *text.notes]
    lines = [(line, "note") for paragraph in paragraphs
             for line in wrap(paragraph, theme.small_font_size, room)]
    if text.credit:
        lines += [(line, "credit") for line in wrap(text.credit, theme.small_font_size, room)]
    items: list[Primitive] = []
    y = top
    for line, css_class in lines:
        y += theme.small_font_size * 1.4
        items.append(Text(theme.margin, y, line, theme.small_font_size,
                          style="italic" if css_class == "credit" else "normal",
                          fill=theme.muted_color, css_class=css_class))
    return items, y + (4 if lines else 0)


def _report_notes(text) -> list[str]:
    """What the chart leaves out and why: every row is drawn or named here."""
    notes = []
    if text.undated:
        shown = text.undated[:UNDATED_LISTED]
        more = len(text.undated) - len(shown)
        rest = f" and {more:,} more ('timelines check' lists them all)" if more else ""
        notes.append(f"Undated, not drawn: {_names(shown)}{rest}.")
    if text.not_drawn:
        rows = "row" if text.not_drawn == 1 else "rows"
        notes.append(f"{text.not_drawn:,} {rows} with unreadable or contradictory dates not "
                     "drawn; 'timelines check' lists them.")
    for panel, placed in text.keyed:
        listed = "; ".join(f"{p.key} {p.record.label}" for p in placed)
        notes.append(f"{panel}: labels by number: {listed}." if panel
                     else f"Labels by number: {listed}.")
    if text.outside:
        shown = text.outside[:OUTSIDE_LISTED]
        more = len(text.outside) - len(shown)
        rest = f" and {more:,} more" if more else ""
        count = "1 record lies" if len(text.outside) == 1 else f"{len(text.outside):,} records lie"
        notes.append(f"{count} outside the time shown, not drawn: {_names(shown)}{rest}.")
    return notes


def _names(records) -> str:
    return ", ".join(f"{r.label} (row {r.provenance.row})" for r in records)


def heading(text, theme: Theme, width: float) -> tuple[list[Primitive], float]:
    """The title and, under it, the subtitle, each wrapped to the page; the y where the plot
    may begin."""
    items: list[Primitive] = []
    y = theme.margin
    for number, line in enumerate(wrap(text.title, theme.title_size, width - 2 * theme.margin,
                                       "bold")):
        y += theme.title_size * (1.0 if number == 0 else 1.2)
        items.append(Text(theme.margin, y, line, theme.title_size, weight="bold",
                          fill=theme.text_color, css_class="title"))
    size = theme.font_size * 1.1
    for line in wrap(text.subtitle, size, width - 2 * theme.margin):
        y += size * 1.35
        items.append(Text(theme.margin, y, line, size, fill=theme.muted_color,
                          css_class="subtitle"))
    return items, y + (14 if items else 0)


def wrap(text: str, size: float, width: float, weight: str = "normal") -> list[str]:
    """Greedy word wrap by measured width; a word wider than a line alone is cut short with
    an ellipsis, so no line is wider than `width`."""
    lines, current = [], ""
    for word in text.split():
        candidate = f"{current} {word}" if current else word
        if current and text_width(candidate, size, weight) > width:
            lines.append(current)
            current = word
        else:
            current = candidate
    lines += [current] if current else []
    return [fit_text(line, size, width, weight) for line in lines]


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
