"""The look of a chart: sizes, fonts, colours and the choice of uncertainty encoding.

All lengths are CSS px (1/96 inch), the unit of the Scene.
"""
from __future__ import annotations

from dataclasses import dataclass, field, replace

# Okabe & Ito (2008), "Color Universal Design": eight colours distinguishable under the common
# forms of colour-vision deficiency. Ordered so that the first five also differ in lightness
# (CIE L* at least 10 apart), and stay apart when printed in greyscale.
OKABE_ITO = (
    "#0072B2",  # blue
    "#E69F00",  # orange
    "#009E73",  # bluish green
    "#000000",  # black
    "#F0E442",  # yellow
    "#56B4E9",  # sky blue
    "#D55E00",  # vermillion
    "#CC79A7",  # reddish purple
)
# Paul Tol, "Colour Schemes", SRON technical note SRON/EPS/TN/09-002 (2021): qualitative
# schemes for colour-blind readers (values from memory; grey, his "bad data" colour, left out).
TOL_BRIGHT = ("#4477AA", "#EE6677", "#228833", "#CCBB44", "#66CCEE", "#AA3377")
TOL_VIBRANT = ("#0077BB", "#EE7733", "#009988", "#CC3311", "#33BBEE", "#EE3377")
TOL_MUTED = ("#332288", "#88CCEE", "#44AA99", "#117733", "#999933", "#DDCC77", "#CC6677",
             "#882255", "#AA4499")
PALETTES = {"okabe-ito": OKABE_ITO, "tol-bright": TOL_BRIGHT, "tol-vibrant": TOL_VIBRANT,
            "tol-muted": TOL_MUTED}


@dataclass(frozen=True, slots=True)
class Theme:
    width: float = 960.0
    font_family: str = "DejaVu Sans"
    font_size: float = 12.0          # record labels
    small_font_size: float = 10.0    # axis, legend, notes
    title_size: float = 18.0
    group_label_size: float = 12.0
    margin: float = 16.0
    lane_height: float = 22.0
    bar_height: float = 12.0
    group_gap: float = 10.0
    label_pad: float = 4.0
    # A side with no far bound (an empty cell, `after 1780`) is drawn this long: short, so
    # that its length cannot be read as a duration.
    stub_length: float = 24.0
    # At most this many colours for the colour column: the smallest values beyond share one
    # ('other'). None: every value its own colour, repeating past the palette's end.
    max_colors: int | None = None
    axis_height: float = 28.0
    legend_row_height: float = 18.0
    text_color: str = "#1a1a1a"
    muted_color: str = "#666666"
    neutral_color: str = "#8c8c8c"   # the legend's marks when colour stands for a column
    grid_color: str = "#e3e3e3"
    grid_minor_color: str = "#f0f0f0"
    separator_color: str = "#bbbbbb"
    background: str | None = "#ffffff"
    bar_color: str = OKABE_ITO[0]
    palette: tuple[str, ...] = field(default=OKABE_ITO)
    fringe: str = "fade"             # encoding of the possible-but-not-certain parts
    fringe_far_opacity: float = 0.12  # how faint a fade gets at the far end of a window
    era: str = "bce"                 # year labels: bce (44 BCE), bc (44 BC), astronomical (-43)
    # The calendar the axis counts years, months and days in: the one the dates were read in
    # ("historical": Julian before its reform day), so a tick falls on the day a reader of the
    # period calls 1 January.
    calendar: str = "gregorian"
    band_color: str = "#7f7f7f"      # background bands (--bands), alternating two strengths
    band_opacities: tuple[float, float] = (0.16, 0.09)

    def with_options(self, **changes) -> "Theme":
        changes = {k: v for k, v in changes.items() if v is not None}
        return replace(self, **changes)

    def with_font_size(self, size: float) -> "Theme":
        """Record labels at `size` px, and every other text and the rows that hold text
        (lanes, bars, axis, legend) scaled with them, so the chart keeps its proportions."""
        factor = size / self.font_size
        return replace(self, **{name: getattr(self, name) * factor for name in _TEXT_SIZED})

    def with_lane_height(self, height: float) -> "Theme":
        """Lanes `height` px tall: less room between bars, the bars (which hold labels)
        as tall as before while they fit."""
        return replace(self, lane_height=height, bar_height=min(self.bar_height, height))

    def color_for(self, index: int) -> str:
        return self.palette[index % len(self.palette)]


# The sizes that grow with the text: fonts, and the rows and pads made to hold a line of it.
_TEXT_SIZED = ("font_size", "small_font_size", "title_size", "group_label_size", "lane_height",
               "bar_height", "label_pad", "axis_height", "legend_row_height")

DEFAULT_THEME = Theme()


def relative_luminance(fill: str) -> float:
    """WCAG 2.x relative luminance of a `#rrggbb` colour (the Y of CIE XYZ, 0..1)."""
    red, green, blue = (int(fill[i:i + 2], 16) / 255 for i in (1, 3, 5))

    def linear(c: float) -> float:
        # the sRGB transfer function (IEC 61966-2-1)
        return c / 12.92 if c <= 0.04045 else ((c + 0.055) / 1.055) ** 2.4

    return 0.2126 * linear(red) + 0.7152 * linear(green) + 0.0722 * linear(blue)


def lightness(fill: str) -> float:
    """CIE 1976 L* (0 black .. 100 white): how light a colour looks, what greyscale keeps."""
    y = relative_luminance(fill)
    f = y ** (1 / 3) if y > (6 / 29) ** 3 else y / (3 * (6 / 29) ** 2) + 4 / 29
    return 116 * f - 16


def text_color_on(fill: str) -> str:
    """Black or white, whichever reads better on `fill` (WCAG contrast ratio)."""
    luminance = relative_luminance(fill)
    # Contrast with white is (1.05)/(L+0.05); with black (L+0.05)/0.05; pick the larger.
    return "#ffffff" if 1.05 / (luminance + 0.05) >= (luminance + 0.05) / 0.05 else "#000000"
