"""matplotlib for the caller's own figures: year ticks without a year zero, and a chart's lanes
drawn into an Axes the caller already has.

matplotlib's date axis refuses years before 1, and a plain number axis labelled as years
ticks at astronomical multiples: -200, -150, ..., 0, 50 read as "201 BCE, 151 BCE, ..., 1 BCE,
50 CE". `EraYearLocator` ticks where a historian expects (200 BCE, 150 BCE, 100 BCE, 50 BCE,
1 CE, 50) and `EraYearFormatter` labels them, both by the very rules of the static chart's axis
(`scene.scale.ticks`). The axis values are decimal astronomical years (0 = 1 BCE, -43 = 44 BCE;
1 January of each year a whole number; `calendar.decimal_year_from_fixed`). `year_axis(ax)`
sets both in one line.

`draw_on_axes` draws a chart's lanes (bars, fringes, signs, labels; not its title, legend or
axis) into an Axes, through the same batch artists as the PNG, in those decimal years.
matplotlib is imported when this module is: only a caller who asks for it loads it.
"""
from __future__ import annotations

import dataclasses

from matplotlib.ticker import Formatter, Locator
from matplotlib.transforms import Affine2D

from ..scene.primitives import Group, Primitive, Scene, Text, vertical_extent
from ..scene.scale import TimeScale, decimal_year_from_fixed, year_text, year_ticks
from .mpl import DRAW_ORDER, _artists, _Page

MAX_TICKS = 8                      # labelled ticks on an axis, as the static chart's axis
EDGE_PAD = 4.0                     # px kept above the first lane and below the last
CAPTIONS = ("group-label", "subgroup-label")   # group names, shown as y tick labels instead
_PLOT_CLASSES = ("group", "separator", "bands")


class EraYearLocator(Locator):
    """Ticks on an axis of decimal astronomical years, at round years of the era: round BCE
    years, 1 CE, round CE years (or round years before present with era "bp"); months and
    days on a short stretch. `era`: "bce", "bc", "astronomical" or "bp"."""

    def __init__(self, era: str = "bce", max_ticks: int = MAX_TICKS):
        self.era, self.max_ticks = era, max_ticks

    def __call__(self):
        low, high = self.axis.get_view_interval()
        return self.tick_values(low, high)

    def tick_values(self, vmin: float, vmax: float) -> list[float]:
        return [position for position, _ in year_ticks(vmin, vmax, era=self.era,
                                                       max_ticks=self.max_ticks)]


class EraYearFormatter(Formatter):
    """Labels for an axis of decimal astronomical years: "200 BCE", "1 CE", "50", "Mar 1650",
    "12,500 BP", as the static chart writes them. A position off the era's ticks gets its
    year's label."""

    def __init__(self, era: str = "bce", max_ticks: int = MAX_TICKS):
        self.era, self.max_ticks = era, max_ticks
        self._labels: dict[float, str] = {}

    def set_locs(self, locs):
        super().set_locs(locs)
        if self.axis is not None:
            low, high = self.axis.get_view_interval()
        elif len(locs):
            low, high = min(locs), max(locs)
        else:
            return
        self._labels = dict(year_ticks(low, high, era=self.era, max_ticks=self.max_ticks))

    def __call__(self, x: float, pos=None) -> str:
        found = self._labels.get(x)
        if found is None:
            near = [label for position, label in self._labels.items()
                    if abs(position - x) < 1e-6 * max(1.0, abs(x))]
            found = near[0] if near else year_text(round(x), self.era)
        return found


def year_axis(ax, era: str = "bce", which: str = "x", max_ticks: int = MAX_TICKS):
    """Tick `ax`'s x (or y) axis of decimal astronomical years by era rules. Returns `ax`."""
    axis = ax.xaxis if which == "x" else ax.yaxis
    axis.set_major_locator(EraYearLocator(era, max_ticks))
    axis.set_major_formatter(EraYearFormatter(era, max_ticks))
    return ax


def draw_on_axes(scene: Scene, scale: TimeScale, ax, era: str = "bce"):
    """The lanes of `scene` (laid out on `scale`) drawn into `ax`: x in decimal years, y in
    the scene's page units growing downward, group names as y tick labels. Returns `ax`."""
    plot, captions = _plot_items(scene)
    if not plot:
        return ax
    first, last = decimal_year_from_fixed(scale.start), decimal_year_from_fixed(scale.end)
    years_per_px = (last - first) / (scale.x1 - scale.x0)
    # Linear between the scale's two ends, exact at both: within a day of the exact year
    # anywhere between (a year is 365 or 366 days).
    page_to_years = Affine2D().scale(years_per_px, 1.0).translate(
        first - scale.x0 * years_per_px, 0.0)
    page = _Page(ax, list(dict.fromkeys([scene.font_family, "DejaVu Sans"])), ax.patch)
    for artist in _artists(tuple(plot), page):
        artist.set_transform(page_to_years + ax.transData)
        artist.set_zorder(DRAW_ORDER + 1)
        artist.set_clip_path(ax.patch)
        ax.add_artist(artist)
    top, bottom = vertical_extent(plot)
    top, bottom = top - EDGE_PAD, bottom + EDGE_PAD
    ax.set_xlim(first, last)
    ax.set_ylim(bottom, top)               # y grows downward, as on the page
    ax.set_yticks([centre for centre, _ in captions], [name for _, name in captions])
    ax.tick_params(axis="y", length=0)
    return year_axis(ax, era)


def _plot_items(scene: Scene) -> tuple[list[Primitive], list[tuple[float, str]]]:
    """The lanes' primitives without the group names, and (y of the lane's centre, name) of
    each group name."""
    captions: list[tuple[float, str]] = []
    plot = []
    for item in scene.children:
        if item.css_class.split(" ")[0] in _PLOT_CLASSES:
            kept = _without_captions(item, captions)
            if kept is not None:
                plot.append(kept)
    return plot, captions


def _without_captions(item: Primitive, captions: list) -> Primitive | None:
    if isinstance(item, Text) and item.css_class in CAPTIONS:
        captions.append((item.y - item.size * 0.36, item.text))
        return None
    if isinstance(item, Group):
        children = [kept for child in item.children
                    if (kept := _without_captions(child, captions)) is not None]
        return dataclasses.replace(item, children=tuple(children)) if children else None
    return item
