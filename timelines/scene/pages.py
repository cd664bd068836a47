"""A tall chart split into pages at group breaks, the time axis under the lanes of each page.

A register of a few thousand records is metres long: printed on one PDF page it is either
unreadable or off the paper. Split, each page holds as many whole groups as fit its height,
with the axis (and the grid) redrawn under its lanes; the heading opens the first page and the
legend and notes close the last. A group taller than a page gets a page of its own, as tall
as it needs: a group's lanes are never cut apart from its name.
"""
from __future__ import annotations

from dataclasses import replace

from .axis import draw_axis
from .primitives import Primitive, Scene, shifted, vertical_extent
from .scale import TimeScale
from .theme import Theme

# The parts of a composed chart, by the class of its top-level items.
_HEADER = ("title", "subtitle")
_REDRAWN = ("grid", "axis")            # the axis, the top axis, repeated labels: made per page
_LANES = ("group", "separator")


def split_pages(scene: Scene, scale: TimeScale, theme: Theme, page_height: float
                ) -> list[Scene]:
    """`scene` (a chart as `compose` makes it, one panel) as pages no taller than
    `page_height` where its groups allow."""
    header, lanes, footer = _parts(scene)
    if not lanes:
        return [scene]
    header_bottom = max((vertical_extent([item])[1] for item in header), default=0.0)
    pages, start = [], 0
    while start < len(lanes):
        top = (header_bottom + 14 if not pages else 0.0) + theme.margin
        room = page_height - top - theme.axis_height - theme.margin
        end = _fill(lanes, start, room)
        pages.append(_page(scene, scale, theme, header if not pages else [], lanes[start:end],
                           top))
        start = end
    return pages[:-1] + [_with_footer(pages[-1], footer, scene, theme)]


def _parts(scene: Scene) -> tuple[list[Primitive], list[list[Primitive]], list[Primitive]]:
    """(the heading, the lanes as blocks of one group each with the separator above it, the
    legend and notes)."""
    header, blocks, footer = [], [], []
    for item in scene.children:
        kind = item.css_class.split(" ")[0]
        if kind in _HEADER:
            header.append(item)
        elif kind in _REDRAWN:
            continue
        elif kind in _LANES:
            if kind == "separator" or not blocks or blocks[-1][-1].css_class != "separator":
                blocks.append([])
            blocks[-1].append(item)
        else:
            footer.append(item)
    return header, blocks, footer


def _fill(blocks: list[list[Primitive]], start: int, room: float) -> int:
    """The end of the run of blocks from `start` that fits `room` (at least one)."""
    top = vertical_extent(blocks[start])[0]
    end = start + 1
    while end < len(blocks) and vertical_extent(blocks[end])[1] - top <= room:
        end += 1
    return end


def _page(scene: Scene, scale: TimeScale, theme: Theme, header: list[Primitive],
          blocks: list[list[Primitive]], top: float) -> Scene:
    """One page: the heading (on the first), the blocks moved up to `top`, the grid and the
    axis under them."""
    items = [item for block in blocks for item in block if item.css_class != "separator"
             or block is not blocks[0]]
    low, high = vertical_extent(items)
    moved = [shifted(item, 0.0, top - low) for item in items]
    grid, axis, bottom = draw_axis(scale, theme, top, top + high - low)
    return replace(scene, height=bottom + theme.margin,
                   children=(*header, grid, *moved, axis))


def _with_footer(page: Scene, footer: list[Primitive], scene: Scene, theme: Theme) -> Scene:
    """The last page with the legend and notes under its axis, as far below it as they stood
    below the chart's own axis."""
    if not footer:
        return page
    axis_bottom = page.height - theme.margin
    first = vertical_extent(footer)[0]
    moved = [shifted(item, 0.0, axis_bottom + 6 - first) for item in footer]
    return replace(page, height=vertical_extent(moved)[1] + theme.margin,
                   children=(*page.children, *moved))
