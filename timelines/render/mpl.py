"""Scene -> PNG/PDF with matplotlib's object API (a Figure and a canvas, never pyplot).

One Axes spans the whole figure with x in 0..width and y in height..0, so scene page units
(CSS px) map 1:1 onto the figure and y grows downward as in the SVG. Each primitive kind has one
small `_draw_<kind>`; every artist gets the same zorder, so matplotlib's stable sort keeps the
scene's drawing order. Edges are not snapped to device pixels: the PNG shows the geometry the
SVG shows. matplotlib is imported lazily, only when a PNG or PDF is asked for.

Drawing runs under fixed local settings (matplotlib's defaults plus `_SETTINGS`), so a user's
matplotlibrc cannot change the picture and the same scene always gives the same bytes.
"""
from __future__ import annotations

import functools
import math
import re
from dataclasses import dataclass
from pathlib import Path

import numpy

from timelines.scene import (
    PX_PER_INCH, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text,
    drawable_text,
)

POINTS_PER_PX = 72.0 / PX_PER_INCH
# A fade in a PDF is one row of 256 samples: as fine as 8-bit alpha resolves, so no steps show.
GRADIENT_SAMPLES = 256
PNG_COMPRESSION = 3
DRAW_ORDER = 1  # one zorder for every artist: insertion order is drawing order
HORIZONTAL_ALIGNMENT = {"start": "left", "middle": "center", "end": "right"}
ANCHOR_SHIFT = {"start": 0.0, "middle": 0.5, "end": 1.0}   # of the width, to the left

_SETTINGS = {
    "pdf.fonttype": 42,               # embed TrueType (Type 42), not Type 3 outlines
    "pdf.compression": 6,
    "lines.scale_dashes": False,      # dash lengths are page units, not multiples of the width
    "text.usetex": False,
    "savefig.bbox": "standard",       # never crop: the page is the scene's size
    "savefig.transparent": False,
}
# PNG 11.3.4.3: a keyword is 1-79 Latin-1 characters without leading or trailing spaces; we
# accept the printable ASCII part of that.
_PNG_KEYWORD = re.compile(r"[!-~](?:[ -~]{0,77}[!-~])?")
_PDF_INFO_KEYS = {"author": "Author", "subject": "Subject", "keywords": "Keywords"}


def render_png(scene: Scene, path: str | Path, dpi: float = 150) -> None:
    """Write the scene as PNG; the image is width*dpi/96 by height*dpi/96 pixels."""
    with _local_settings():
        figure = _figure(scene, raster=True)
        figure.savefig(
            path, format="png", dpi=dpi, facecolor=figure.get_facecolor(),
            metadata=_png_metadata(scene),
            # zlib level 3: on chart images as small as the default 6 and a third faster
            pil_kwargs={"compress_level": PNG_COMPRESSION},
        )


def render_pdf(scene: Scene, path: str | Path) -> None:
    """Write the scene as a one-page PDF of width/96 by height/96 inches, fonts embedded."""
    with _local_settings():
        figure = _figure(scene)
        figure.savefig(
            path, format="pdf", facecolor=figure.get_facecolor(), metadata=_pdf_metadata(scene),
        )


def _local_settings():
    import matplotlib.style

    return matplotlib.style.context(["default", _SETTINGS])


def _figure(scene: Scene, raster: bool = False):
    """A Figure of the scene's size holding every primitive, on an Agg canvas. With `raster`,
    text is drawn by the glyph-caching artist (PNG); vector output keeps matplotlib's Text."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure
    from matplotlib.transforms import TransformedPatchPath

    figure = Figure(
        figsize=(scene.width / PX_PER_INCH, scene.height / PX_PER_INCH), dpi=PX_PER_INCH,
        facecolor=_paint(scene.background),
    )
    FigureCanvasAgg(figure)
    axes = figure.add_axes((0, 0, 1, 1))
    axes.set_axis_off()
    axes.set_xlim(0, scene.width)
    axes.set_ylim(scene.height, 0)  # y grows downward, as on the page
    fonts = list(dict.fromkeys([scene.font_family, "DejaVu Sans"]))
    page = _Page(axes, fonts, TransformedPatchPath(axes.patch), raster and _glyph_cache_works())
    for item in scene.children:
        _draw(item, page)
    return figure


@dataclass(frozen=True, slots=True)
class _Page:
    """Where primitives are drawn, and the font list text uses (DejaVu Sans last as fallback)."""

    axes: object
    font_family: list[str]
    clip: object
    cached_glyphs: bool = False     # draw text with _glyph_text_type() (raster output)


def _draw(item, page: _Page) -> None:
    artist = _DRAW[type(item)](item, page)
    if artist is not None:
        artist.set_zorder(DRAW_ORDER)
        # The page edge clips anyway; one shared clip path spares add_artist making one each.
        artist.set_clip_path(page.clip)
        artist.set_clip_on(False)
        page.axes.add_artist(artist)


def _draw_rect(rect: Rect, page: _Page):
    from matplotlib.patches import Polygon as PolygonPatch

    if rect.width <= 0 or rect.height <= 0:
        return None  # as in the SVG, which draws nothing for such a rect
    # A polygon, not a Rectangle: its corners need no patch transform recomputed at each draw.
    corners = [(rect.x, rect.y), (rect.x + rect.width, rect.y),
               (rect.x + rect.width, rect.y + rect.height), (rect.x, rect.y + rect.height)]
    return PolygonPatch(
        corners, closed=True, alpha=_opacity(rect.opacity), facecolor=_paint(rect.fill),
        joinstyle="miter", snap=False, **_stroke_style(rect.stroke, rect.stroke_width),
    )


def _draw_gradient_rect(rect: GradientRect, page: _Page):
    if rect.width <= 0 or rect.height <= 0:
        return None
    return _fade_artist_type()(rect)


@functools.cache
def _fade_artist_type():
    """The artist for a GradientRect, made on first use so matplotlib loads only when needed.

    It hands the renderer a finished image instead of going through AxesImage's general
    resampler (ten times the cost, and fades are on nearly every bar). Raster backends get the
    ramp at device resolution with partly covered edge pixels faded in, as an antialiased SVG
    rect edge is; vector backends (PDF) get one row of samples scaled onto the rect.
    """
    from matplotlib.artist import Artist
    from matplotlib.colors import to_rgb
    from matplotlib.transforms import Affine2D

    class FadeArtist(Artist):
        def __init__(self, rect: GradientRect):
            super().__init__()
            self.rect = rect

        def draw(self, renderer):
            if not self.get_visible():
                return
            rgb = to_rgb(self.rect.fill)
            (left, bottom), (right, top) = self.get_transform().transform(
                [(self.rect.x, self.rect.y + self.rect.height),
                 (self.rect.x + self.rect.width, self.rect.y)])
            gc = renderer.new_gc()
            gc.set_clip_rectangle(self.axes.bbox)
            if renderer.option_scale_image():
                image = _sample_row(rgb, self.rect.opacity_left, self.rect.opacity_right)
                scale = Affine2D().scale(right - left, top - bottom)
                renderer.draw_image(gc, left, bottom, image, scale)
            else:
                placed = _device_fade(self.rect, rgb, (left, bottom, right, top), renderer)
                if placed is not None:
                    renderer.draw_image(gc, *placed)
            gc.restore()
            self.stale = False

    return FadeArtist


def _device_fade(rect: GradientRect, rgb, box, renderer):
    """(column, row, RGBA image) covering `box` (device px, y up) on the visible canvas."""
    left, bottom, right, top = box
    columns = numpy.arange(max(math.floor(left), 0), min(math.ceil(right), renderer.width))
    rows = numpy.arange(max(math.floor(bottom), 0), min(math.ceil(top), renderer.height))
    if columns.size == 0 or rows.size == 0:
        return None
    centres = (numpy.clip(columns + 0.5, left, right) - left) / (right - left)
    across = _opacity_ramp(rect.opacity_left, rect.opacity_right, centres)
    across *= _coverage(columns, left, right)
    down = _coverage(rows, bottom, top)[::-1]  # image row 0 is the top row
    return int(columns[0]), int(rows[0]), _ramp_image(rgb, numpy.outer(down, across))


@functools.lru_cache(maxsize=4096)
def _sample_row(rgb: tuple[float, float, float], left: float, right: float):
    """One row of samples for a vector backend. The same array object for the same fade, so
    the PDF writer (which keys images by identity) stores each distinct fade once."""
    centres = (numpy.arange(GRADIENT_SAMPLES) + 0.5) / GRADIENT_SAMPLES
    image = _ramp_image(rgb, _opacity_ramp(left, right, centres)[None])
    image.flags.writeable = False
    return image


def _opacity_ramp(left: float, right: float, position):
    """Opacity at `position` (0 at the left edge .. 1 at the right edge)."""
    return numpy.clip(left + (right - left) * position, 0.0, 1.0)


def _coverage(pixels, low: float, high: float):
    """The part of each device pixel [p, p+1) that lies inside [low, high]."""
    return numpy.clip(numpy.minimum(pixels + 1, high) - numpy.maximum(pixels, low), 0.0, 1.0)


def _ramp_image(rgb, alpha):
    image = numpy.empty((*alpha.shape, 4), dtype=numpy.uint8)
    image[..., :3] = numpy.round(numpy.asarray(rgb) * 255)
    image[..., 3] = numpy.round(alpha * 255)
    return image


def _draw_line(line: Line, page: _Page):
    from matplotlib.lines import Line2D

    if line.stroke_width <= 0:
        return None
    dashes = (0, tuple(d * POINTS_PER_PX for d in line.dash)) if line.dash else "solid"
    return Line2D(
        (line.x1, line.x2), (line.y1, line.y2), color=line.stroke,
        linewidth=line.stroke_width * POINTS_PER_PX, linestyle=dashes,
        alpha=_opacity(line.opacity), solid_capstyle="butt", dash_capstyle="butt", snap=False,
    )


def _draw_polygon(polygon: Polygon, page: _Page):
    from matplotlib.patches import Polygon as PolygonPatch

    if len(polygon.points) < 2:
        return None
    fill = polygon.fill if polygon.closed else None  # an open polyline is stroke only
    return PolygonPatch(
        polygon.points, closed=polygon.closed, fill=fill is not None,
        facecolor=_paint(fill), alpha=_opacity(polygon.opacity), joinstyle="miter",
        capstyle="butt", snap=False, **_stroke_style(polygon.stroke, polygon.stroke_width),
    )


def _draw_text(text: Text, page: _Page):
    from matplotlib.text import Text as TextArtist

    content = drawable_text(text.text)   # the string the SVG draws, too
    if not content:
        return None
    if text.anchor not in HORIZONTAL_ALIGNMENT:
        raise ValueError(f"{text.anchor!r} is not one of start, middle, end")
    if page.cached_glyphs:
        return _glyph_text_type()(text, content, page.font_family)
    return TextArtist(
        text.x, text.y, content, fontsize=text.size * POINTS_PER_PX,
        horizontalalignment=HORIZONTAL_ALIGNMENT[text.anchor], verticalalignment="baseline",
        fontfamily=page.font_family, fontweight=text.weight, fontstyle=text.style,
        color=text.fill, parse_math=False, usetex=False, wrap=False,
    )


def _glyph_cache_works() -> bool:
    """Whether this matplotlib has the per-glyph Agg text calls the cache relies on (3.11's);
    otherwise PNG text falls back to matplotlib's Text artist."""
    from matplotlib import ft2font

    return (all(hasattr(ft2font.FT2Font, name) for name in ("_set_transform", "_render_glyph"))
            and hasattr(ft2font, "Kerning") and hasattr(ft2font, "RenderMode"))


@functools.cache
def _glyph_text_type():
    """An artist drawing one line of text on Agg from a cache of rendered glyphs.

    matplotlib's Text lays out and renders every glyph of every string anew; a chart repeats
    the same few dozen glyphs thousands of times. Glyphs are cached per font, size and quarter
    pixel of position, then composited by Agg's own text-image call, as matplotlib does."""
    from matplotlib.artist import Artist
    from matplotlib.backends.backend_agg import get_hinting_flag
    from matplotlib.font_manager import FontProperties, fontManager, get_font
    from matplotlib.ft2font import Kerning, RenderMode

    glyphs: dict[tuple, tuple] = {}

    def rendered(font, size, dpi, index, x, y):
        phase_x, phase_y = round(4 * (x % 1)) / 4, round(4 * (y % 1)) / 4
        key = (font.fname, size, dpi, index, phase_x, phase_y)
        if key not in glyphs:
            font.set_size(size, dpi)
            font._set_transform([[0x10000, 0], [0, 0x10000]],
                                [round(0x40 * phase_x), round(0x40 * phase_y)])
            bitmap = font._render_glyph(index, get_hinting_flag(), RenderMode.NORMAL)
            glyphs[key] = (bitmap.buffer.copy(), bitmap.left, bitmap.top)
        return glyphs[key]

    class GlyphText(Artist):
        def __init__(self, text: Text, content: str, families: list[str]):
            super().__init__()
            self.text, self.content = text, content
            self.properties = FontProperties(family=families, weight=text.weight,
                                             style=text.style, size=text.size * POINTS_PER_PX)
            self.color = text.fill

        def draw(self, renderer):
            if not self.get_visible():
                return
            x, y = self.get_transform().transform((self.text.x, self.text.y))  # y up
            size = self.properties.get_size_in_points()
            font = get_font(fontManager._find_fonts_by_props(self.properties))
            font.set_size(size, renderer.dpi)
            offsets, width = laid_out(font, size, renderer.dpi, self.content)
            x -= ANCHOR_SHIFT[self.text.anchor] * width
            gc = renderer.new_gc()
            gc.set_foreground(self.color)
            for index, offset in offsets:
                gx, gy = x + offset, y
                buffer, left, top = rendered(font, size, renderer.dpi, index, gx, gy)
                column, row = math.floor(gx) + left, math.floor(gy) + top
                renderer._renderer.draw_text_image(
                    buffer, column, int(renderer.height) - row + buffer.shape[0], 0, gc)
            gc.restore()
            self.stale = False

    advances: dict[tuple, tuple[int, float]] = {}

    def laid_out(font, size, dpi, content) -> tuple[list[tuple[int, float]], float]:
        """(glyph index, x offset) per character and the line's width, in device px: hinted
        advances plus pair kerning, each character's advance measured once."""
        offsets, pen, previous = [], 0.0, None
        for character in content:
            key = (font.fname, size, dpi, character)
            if key not in advances:
                index = font.get_char_index(ord(character))
                # the hinted advance, as matplotlib's Text and cairo set it: whole pixels
                glyph = font.load_glyph(index, get_hinting_flag())
                advances[key] = (index, glyph.horiAdvance / 64)
            index, advance = advances[key]
            if previous is not None:
                pen += font.get_kerning(previous, index, Kerning.DEFAULT) / 64
            offsets.append((index, pen))
            pen += advance
            previous = index
        return offsets, pen

    return GlyphText


def _draw_group(group: Group, page: _Page):
    # Classes, ids and tooltips have no meaning on paper; the children carry the picture.
    for child in group.children:
        _draw(child, page)
    return None


_DRAW = {
    Rect: _draw_rect,
    GradientRect: _draw_gradient_rect,
    Line: _draw_line,
    Polygon: _draw_polygon,
    Text: _draw_text,
    Group: _draw_group,
}


def _stroke_style(stroke: str | None, width: float) -> dict:
    if stroke is None or width <= 0:
        return {"edgecolor": "none", "linewidth": 0.0}
    return {"edgecolor": stroke, "linewidth": width * POINTS_PER_PX}


def _paint(colour: str | None) -> str:
    return "none" if colour is None else colour


def _opacity(opacity: float) -> float | None:
    return None if opacity >= 1 else max(opacity, 0.0)


def _png_metadata(scene: Scene) -> dict[str, str | None]:
    """PNG text chunks: title, description and the scene's metadata; no software stamp."""
    metadata: dict[str, str | None] = {"Software": None}
    items = [("Title", scene.title), ("Description", scene.desc), *scene.metadata]
    for key, value in items:
        if value and _PNG_KEYWORD.fullmatch(key):
            metadata[key] = clean_text(value)
    return metadata


def _pdf_metadata(scene: Scene) -> dict[str, str | None]:
    """The PDF info dictionary without dates or producer, so the bytes are reproducible."""
    metadata: dict[str, str | None] = {"CreationDate": None, "Producer": None, "Creator": None}
    for key, value in scene.metadata:
        if key.lower() in _PDF_INFO_KEYS and value:
            metadata[_PDF_INFO_KEYS[key.lower()]] = clean_text(value)
    if scene.title:
        metadata["Title"] = clean_text(scene.title)
    if scene.desc:
        metadata["Subject"] = clean_text(scene.desc)
    return metadata
