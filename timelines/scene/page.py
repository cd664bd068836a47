"""Publication settings: the page size (`--size`), the text size (`--font-size`) and the font.

Sizes: `180x120mm`, `7x5in`, `12x8cm`, `1200x800px` (a bare width such as `180mm` leaves the
height to the content). Page units are CSS px, 1/96 inch (CSS Values and Units Level 3, §5.2);
a PNG of a size in px is written at 96 dpi unless `--dpi` says otherwise, so `1200x800px` gives
a 1200 by 800 pixel image.

What a height means. The width is the page's width, always. A height is the space the figure
must fill, as a journal's figure slot or a panel's frame: a shorter chart is padded at the
bottom to exactly that height; a taller one has less room between its bars (the bars keep
their height, as they hold labels), down to `MIN_BAR_GAP` between bars and lanes of at least
`MIN_LANE_FACTOR` times the label size, so a label beside a bar still fits its lane. If even
that is too tall, nothing is hidden: the page grows to what the chart needs and a warning
says by how much, with ways to make it fit.

Fonts. `--font` names the family written into the SVG and used for PNG/PDF; label room is
measured with DejaVu Sans metrics, so another family may run wider or narrower (`font_note`).
"""
from __future__ import annotations

import re
from dataclasses import dataclass, replace
from typing import Callable

from ..errors import UsageError
from ..layout.distances import PX_PER_UNIT
from .primitives import Scene
from .theme import Theme

SIZE_UNITS = ("mm", "cm", "in", "px")
# A lane at least this many label sizes tall still holds its label: the line height most
# typesetting uses for body text is 1.2 (common practice, no source).
MIN_LANE_FACTOR = 1.25
MIN_BAR_GAP = 3.0               # px kept between the bars of neighbouring lanes
MEASURED_FONT = "DejaVu Sans"   # the metrics `textsize` measures with
_SIZE = re.compile(r"\s*(\d+(?:\.\d*)?)\s*(?:[x×]\s*(\d+(?:\.\d*)?))?\s*([a-z]+)\s*",
                   re.IGNORECASE)
_FONT_SIZE = re.compile(r"\s*(\d+(?:\.\d*)?)\s*(pt|px)?\s*", re.IGNORECASE)


@dataclass(frozen=True, slots=True)
class PageSize:
    """A page width and optional height in px, and the unit the user wrote them in."""

    width: float
    height: float | None
    unit: str


def parse_size(text: str) -> PageSize:
    """`180x120mm`, `7x5in`, `1200x800px`, or a width alone (`180mm`)."""
    found = _SIZE.fullmatch(text)
    unit = found.group(3).lower() if found else ""
    if not found or unit not in SIZE_UNITS:
        raise UsageError(f"cannot read the size {text!r}",
                         hint="give WIDTHxHEIGHT and a unit, e.g. 180x120mm, 7x5in or "
                              "1200x800px (or a width alone: 180mm)")
    width = float(found.group(1)) * PX_PER_UNIT[unit]
    height = float(found.group(2)) * PX_PER_UNIT[unit] if found.group(2) else None
    if width < 200 or (height is not None and height < 100):
        raise UsageError(f"the size {text!r} is too small for a chart",
                         hint="at least 200px (53 mm) wide and 100px (27 mm) tall")
    return PageSize(width, height, unit)


def parse_font_size(text: str) -> float:
    """A font size in px from `9` or `9pt` (points, as word processors and journals give
    them) or `12px`."""
    found = _FONT_SIZE.fullmatch(str(text))
    if not found or float(found.group(1)) <= 0:
        raise UsageError(f"cannot read the font size {text!r}",
                         hint="give points (9 or 9pt) or px (12px)")
    unit = (found.group(2) or "pt").lower()
    return float(found.group(1)) * PX_PER_UNIT[unit]


def length_text(px: float, unit: str) -> str:
    """A page length as the user measures it: '152 mm', '6.1 in', '980px'."""
    if unit == "px":
        return f"{px:.0f}px"
    return f"{px / PX_PER_UNIT[unit]:.{0 if unit == 'mm' else 1}f} {unit}"


def png_dpi(dpi: float | None, size: PageSize | None) -> float:
    """The PNG resolution: as given, else 96 for a size in px (one image pixel per px), else
    150."""
    if dpi is not None:
        return dpi
    return 96.0 if size is not None and size.unit == "px" else 150.0


def font_note(family: str) -> str | None:
    """What a user of another font should know, or None for the measured one."""
    if family.strip().casefold() == MEASURED_FONT.casefold():
        return None
    return (f"label room is measured with {MEASURED_FONT} metrics; in {family!r} labels may "
            "run a little wider or narrower than the room kept for them")


# Taller than this, a chart shows badly or not at all in many viewers: 16,384 px is a common
# largest image or texture side (from memory, not one standard); it is 4.3 m printed at 96 px
# an inch.
TALLEST_VIEWABLE = 16_384


def tall_note(scene: Scene) -> str | None:
    """Advice when the page is taller than most viewers show."""
    if scene.height <= TALLEST_VIEWABLE:
        return None
    return (f"the chart is {scene.height:,.0f} px tall ({scene.height / 96 * 0.0254:.1f} m at "
            "96 px an inch), more than many viewers show; fewer lanes fit with --max-lanes or "
            "--labels inside, --facet sets groups side by side, --from/--to shows a part")


@dataclass(frozen=True, slots=True)
class FittedPage:
    scene: Scene
    theme: Theme                 # the theme the scene was composed with
    warning: str | None = None


def fit_height(compose_at: Callable[[Theme], Scene], theme: Theme, size: PageSize | None
               ) -> FittedPage:
    """The scene `compose_at` makes, fitted to the height of `size` (module notes)."""
    full = compose_at(theme)
    if size is None or size.height is None:
        return FittedPage(full, theme)
    if full.height <= size.height:
        return FittedPage(replace(full, height=size.height), theme)
    least = theme.with_lane_height(min(theme.lane_height, max(
        theme.font_size * MIN_LANE_FACTOR, theme.bar_height + MIN_BAR_GAP)))
    thinnest = compose_at(least)
    if thinnest.height > size.height:
        return FittedPage(thinnest, least, _too_tall(thinnest.height, size))
    # The height grows linearly with the lane height (piecewise, convexly, with facets):
    # where the line through the two charts meets the page, the chart fits.
    share = (full.height - size.height) / (full.height - thinnest.height)
    fitted = theme.with_lane_height(theme.lane_height
                                    - share * (theme.lane_height - least.lane_height))
    scene = compose_at(fitted)
    return FittedPage(replace(scene, height=max(scene.height, size.height)), fitted)


def _too_tall(needed: float, size: PageSize) -> str:
    return (f"the chart needs {length_text(needed, size.unit)} of height, more than the "
            f"{length_text(size.height, size.unit)} of --size, even with thinner lanes; the "
            "page is that tall (fewer lanes fit with --max-lanes, --labels inside, "
            "--facet or a taller --size)")
