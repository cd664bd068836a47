"""Small multiples (`--facet COL`): one small timeline per value of a column, in a grid.

Every panel has the same width, the same time scale and the same room for group names, so a
given year stands at the same x in every panel of a column, and panels compare at a glance.
The number of columns follows the page width (panels at least `MIN_PANEL_WIDTH` wide, at most
`MAX_COLUMNS` of them), then is evened out so the last row is not left nearly empty (four
panels make two rows of two, not three and one). Panels of a row share its top; each is
titled with its value. One legend and one set of notes serve the whole page.

A panel is composed as a little page of its own, at the origin and `panel_width` wide, then
moved to its place in the grid (`shifted`): the scene has no transforms, only page positions.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Callable, Sequence

from ..layout import Placement
from ..model import Record
from .axis import calendar_note
from .compose import ChartText, describe_text, draw_plot, slug, time_range
from .legend import fit_text, heading, legend_and_notes
from .primitives import Group, Primitive, Scene, Text, shifted
from .scale import TimeScale
from .theme import Theme

MIN_PANEL_WIDTH = 420.0     # px: room for a group column, labels beside bars and an axis
MAX_COLUMNS = 3
PANEL_GAP = 12.0            # px between rows of panels


@dataclass(frozen=True, slots=True)
class Panel:
    """One value of the facet column and the lanes of its records."""

    name: str
    placement: Placement


def grid_columns(count: int, page_width: float) -> int:
    """How many panels side by side (module notes)."""
    fit = max(1, min(MAX_COLUMNS, int(page_width // MIN_PANEL_WIDTH), count))
    rows = math.ceil(count / fit) if count else 1
    return math.ceil(count / rows) if count else 1


def panel_width(page_width: float, count: int) -> float:
    return page_width / grid_columns(count, page_width)


def compose_facets(panels: Sequence[Panel], scale: TimeScale, theme: Theme, text: ChartText,
                   color_of: Callable[[Record], str],
                   color_key: tuple[tuple[str, str], ...] = (), *, facet: str = "",
                   bands: Sequence[Record] = ()) -> Scene:
    """The page: heading, the grid of panels, one legend and the notes. `theme` is the
    page's; `scale` is in a panel's own coordinates (panel_width wide)."""
    used: set[str] = set()
    header, y = heading(text, theme, theme.width)
    columns = grid_columns(len(panels), theme.width)
    panel_theme = replace(theme, width=theme.width / columns)
    grid: list[Primitive] = []
    for row_start in range(0, len(panels), columns):
        row = panels[row_start:row_start + columns]
        drawn = [_panel(panel, row_start + i, scale, panel_theme, color_of, used, bands)
                 for i, panel in enumerate(row)]
        grid += [shifted(group, i * panel_theme.width, y) for i, (group, _) in enumerate(drawn)]
        y += max(height for _, height in drawn) + PANEL_GAP
    keyed = tuple((panel.name or "(none)", panel.placement.keyed) for panel in panels
                  if panel.placement.keyed)
    axis_calendar = calendar_note(scale, panel_theme)
    text = replace(text, keyed=keyed, notes=(*text.notes, axis_calendar) if axis_calendar
                   else text.notes)
    legend, bottom = legend_and_notes(used, color_key, text, theme, y - PANEL_GAP,
                                      width=theme.width)
    return Scene(theme.width, bottom + theme.margin, tuple(header + grid + legend),
                 title=text.title or "Timelines", desc=describe_facets(panels, scale, theme,
                                                                       text, facet),
                 background=theme.background, font_family=theme.font_family)


def _panel(panel: Panel, index: int, scale: TimeScale, theme: Theme, color_of, used,
           bands) -> tuple[Group, float]:
    """One panel at the origin: its title, then its lanes and axis; and its height."""
    size = theme.group_label_size * 1.1
    caption = fit_text(panel.name or "(none)", size, theme.width - 2 * theme.margin, "bold")
    title = Text(theme.margin, size, caption, size, weight="bold", fill=theme.text_color,
                 css_class="panel-title")
    plot, bottom = draw_plot(panel.placement, scale, theme, size + 10, color_of, used, bands)
    return Group((title, *plot), css_class=f"panel panel-{slug(panel.name or 'none')}",
                 id=f"panel-{index + 1}"), bottom


def describe_facets(panels: Sequence[Panel], scale: TimeScale, theme: Theme, text: ChartText,
                    facet: str) -> str:
    drawn = sum(len(group.records) for panel in panels
                for _, group in panel.placement.leaves())
    names = ", ".join(panel.name or "(none)" for panel in panels)
    by = f" by {facet}" if facet else ""
    summary = (f"Small multiples{by}: {len(panels)} timelines ({names}) of {drawn} records "
               f"in all, each from {time_range(scale, theme)}")
    return describe_text(summary, text)
