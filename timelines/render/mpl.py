"""Scene -> PNG/PDF with matplotlib's object API (a Figure and a canvas, never pyplot).

One Axes spans the whole figure with x in 0..width and y in height..0, so scene page units
(CSS px) map 1:1 onto the figure and y grows downward as in the SVG. Each primitive kind has one
small `_draw_<kind>`. Rects, fades and (on a raster) texts are the bulk of a chart, thousands of
them: consecutive ones are drawn by one batch artist straight onto the renderer, since
matplotlib's work per artist (creation, transforms, stale flags) costs more than the drawing.
Lines and polygons are matplotlib artists between the batches. Every artist gets the same
zorder, so matplotlib's stable sort keeps the scene's drawing order. Edges are not snapped to
device pixels: the PNG shows the geometry the SVG shows. matplotlib is imported lazily, only
when a PNG or PDF is asked for.

Drawing runs under fixed local settings (matplotlib's defaults plus `_SETTINGS`), so a user's
matplotlibrc cannot change the picture and the same scene always gives the same bytes. The PNG
file is written from Agg's pixels by `png.write_png`.
"""
from __future__ import annotations

import contextlib
import dataclasses
import functools
import warnings
from dataclasses import dataclass
from pathlib import Path

import numpy

from timelines.render.fades import paint_fades
from timelines.render.glyphs import POINTS_PER_PX, glyph_cache_works, paint_texts
from timelines.render.png import PNG_KEYWORD, write_png
from timelines.scene.fonts import faces, font_list
from timelines.scene.shaping import needs_shaping, shape_line
from timelines.scene.primitives import (
    PX_PER_INCH, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text, drawable_text,
    walk,
)

DRAW_ORDER = 1  # one zorder for every artist: insertion order is drawing order
HORIZONTAL_ALIGNMENT = {"start": "left", "middle": "center", "end": "right"}

_SETTINGS = {
    "pdf.fonttype": 42,               # embed TrueType (Type 42), not Type 3 outlines
    "pdf.compression": 6,
    "lines.scale_dashes": False,      # dash lengths are page units, not multiples of the width
    "text.usetex": False,
    "savefig.bbox": "standard",       # never crop: the page is the scene's size
    "savefig.transparent": False,
}
_PDF_INFO_KEYS = {"author": "Author", "subject": "Subject", "keywords": "Keywords"}


def render_png(scene: Scene, path: str | Path, dpi: float = 150) -> None:
    """Write the scene as PNG; the image is width*dpi/96 by height*dpi/96 pixels."""
    with _local_settings(), _quiet_fonts():
        figure = _figure(scene, raster=True)
        figure.dpi = dpi              # as savefig(dpi=...) sets it for the drawing
        figure.canvas.draw()
        pixels = numpy.asarray(figure.canvas.buffer_rgba())
    if figure.get_facecolor()[3] == 1:
        pixels = pixels[..., :3]      # an opaque page has no use for an alpha channel
    write_png(path, pixels, dpi, _png_metadata(scene))


def render_pdf(scene: Scene, path: str | Path) -> None:
    """Write the scene as a one-page PDF of width/96 by height/96 inches, fonts embedded."""
    with _local_settings(), _quiet_fonts():
        figure = _figure(scene)
        figure.savefig(
            path, format="pdf", facecolor=figure.get_facecolor(), metadata=_pdf_metadata(scene),
        )


def render_pdf_pages(scenes: list[Scene], path) -> None:
    """Write the scenes as the pages of one PDF, each its own size (the first page's title and
    description stand for the document)."""
    from matplotlib.backends.backend_pdf import PdfPages

    with _local_settings(), _quiet_fonts(), PdfPages(
            path, metadata=_pdf_metadata(scenes[0])) as pages:
        for scene in scenes:
            figure = _figure(scene)
            pages.savefig(figure, facecolor=figure.get_facecolor())


@contextlib.contextmanager
def _quiet_fonts():
    """matplotlib's per-glyph "Glyph N missing from font(s)" warnings and "findfont" log lines
    silenced: missing characters are reported once per script by `scene.fonts` instead."""
    import logging

    logger = logging.getLogger("matplotlib.font_manager")
    level = logger.level
    with warnings.catch_warnings():
        warnings.filterwarnings("ignore", message="Glyph .* missing from", category=UserWarning)
        logger.setLevel(logging.ERROR)
        try:
            yield
        finally:
            logger.setLevel(level)


def _local_settings():
    import matplotlib.style

    return matplotlib.style.context(["default", _SETTINGS])


def _figure(scene: Scene, raster: bool = False):
    """A Figure of the scene's size holding every primitive, on an Agg canvas. With `raster`,
    text is drawn from the glyph cache (PNG); vector output keeps matplotlib's Text."""
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
    fonts = list(dict.fromkeys([font_list(scene.font_family)[0], "DejaVu Sans"]))
    page = _Page(axes, fonts, TransformedPatchPath(axes.patch), raster and glyph_cache_works(),
                 scene.font_family)
    for artist in _artists(scene.children, page):
        artist.set_zorder(DRAW_ORDER)
        # The page edge clips anyway; one shared clip path spares add_artist making one each.
        artist.set_clip_path(page.clip)
        artist.set_clip_on(False)
        axes.add_artist(artist)
    return figure


@dataclass(frozen=True, slots=True)
class _Page:
    """Where primitives are drawn, and the font list text uses (DejaVu Sans last as fallback)."""

    axes: object
    font_family: list[str]
    clip: object
    cached_glyphs: bool = False     # draw text from the glyph cache (raster output)
    families: str | None = None     # the scene's family list, for text that needs shaping


def _artists(items, page: _Page):
    """The artists that draw `items` in order: a batch artist for each run of primitives the
    batch draws, matplotlib's own artists for the rest."""
    run: list = []
    for item in walk(items):
        drawn = _DRAW[type(item)](item, page)
        if type(drawn) in _PAINTERS:
            run.append(drawn)
        elif drawn is not None:
            if run:
                yield _batch_type()(run, page)
                run = []
            yield drawn
    if run:
        yield _batch_type()(run, page)


# Each _draw_<kind> returns what draws the primitive: a matplotlib artist, a primitive for the
# batch artist (see _PAINTERS), or None for nothing.

def _draw_rect(rect: Rect, page: _Page):
    if rect.width <= 0 or rect.height <= 0:
        return None  # as in the SVG, which draws nothing for such a rect
    return rect


def _draw_gradient_rect(rect: GradientRect, page: _Page):
    if rect.width <= 0 or rect.height <= 0:
        return None
    return rect


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
        return dataclasses.replace(text, text=content)
    families = page.font_family
    if needs_shaping(content):
        runs = shape_line(content, text.weight, page.families).runs
        families = list(dict.fromkeys([*_registered_families(page.families, text.weight),
                                       *_registered(run.face for run in runs)]))
    return TextArtist(
        text.x, text.y, content, fontsize=text.size * POINTS_PER_PX,
        horizontalalignment=HORIZONTAL_ALIGNMENT[text.anchor], verticalalignment="baseline",
        fontfamily=families, fontweight=text.weight, fontstyle=text.style,
        color=text.fill, parse_math=False, usetex=False, wrap=False,
    )


@functools.lru_cache(maxsize=16)
def _registered_families(families: str | None, weight: str) -> list[str]:
    """The installed families of the chart's list, each face made known to matplotlib's font
    manager (whose cached list may predate a font installed since), so matplotlib's own
    layout (libraqm: bidi and shaping) falls back through the fonts our measurement used."""
    return _registered(faces(font_list(families), "bold" if weight == "bold" else "normal"))


def _registered(installed) -> list[str]:
    """The families of `installed` faces, each made known to matplotlib's font manager."""
    from matplotlib.font_manager import fontManager

    installed = list(installed)
    known = {entry.fname for entry in fontManager.ttflist}
    for face in installed:
        if face.path not in known and not face.path.lower().endswith((".ttc", ".otc")):
            fontManager.addfont(face.path)
    return list(dict.fromkeys(face.family for face in installed))


def _draw_group(group: Group, page: _Page):
    # Classes, ids and tooltips have no meaning on paper; walk() hands over the children.
    return None


_DRAW = {
    Rect: _draw_rect,
    GradientRect: _draw_gradient_rect,
    Line: _draw_line,
    Polygon: _draw_polygon,
    Text: _draw_text,
    Group: _draw_group,
}


@functools.cache
def _batch_type():
    """The artist drawing a run of rects, fades and texts, made on first use so matplotlib
    loads only when needed."""
    from matplotlib.artist import Artist

    class Batch(Artist):
        def __init__(self, items: list, page: _Page):
            super().__init__()
            self.items, self.page = items, page

        def draw(self, renderer):
            if not self.get_visible():
                return
            affine = self.get_transform().get_affine()
            kinds = dict.fromkeys(type(item) for item in self.items)
            # One painter (a generator) per kind prepares its whole share at once, then draws
            # its next primitive each time it is advanced: kinds interleave in scene order.
            painters = {kind: _PAINTERS[kind]([i for i in self.items if type(i) is kind],
                                              renderer, affine, self.page) for kind in kinds}
            for item in self.items:
                next(painters[type(item)])
            for painter in painters.values():
                next(painter, None)   # lets it release its graphics context
            self.stale = False

    return Batch


def _paint_rects(rects: list[Rect], renderer, affine, page: _Page):
    """Each rect as a closed polygon with the graphics state matplotlib's Polygon patch sets
    (miter joins, butt caps, antialiased, not snapped)."""
    from matplotlib.path import Path as MplPath

    gc = renderer.new_gc()
    gc.set_capstyle("butt")
    gc.set_joinstyle("miter")
    gc.set_antialiased(True)
    gc.set_snap(False)
    for rect in rects:
        face, edge, width, alpha = _rect_paint(rect.fill, rect.stroke, rect.stroke_width,
                                               rect.opacity)
        gc.set_linewidth(width)
        gc.set_alpha(alpha)               # before the colour, which it overrides
        gc.set_foreground(edge, isRGBA=True)
        gc.set_dashes(0, None)
        right, bottom = rect.x + rect.width, rect.y + rect.height
        corners = [(rect.x, rect.y), (right, rect.y), (right, bottom), (rect.x, bottom),
                   (rect.x, rect.y)]
        renderer.draw_path(gc, MplPath(corners, closed=True), affine, face)
        yield
    gc.restore()


@functools.lru_cache(maxsize=256)
def _rect_paint(fill: str | None, stroke: str | None, stroke_width: float, opacity: float):
    """(face RGBA or None, edge RGBA, edge width in points, alpha) as a Patch derives them."""
    from matplotlib.colors import to_rgba

    alpha = _opacity(opacity)
    face = to_rgba(_paint(fill), alpha)
    style = _stroke_style(stroke, stroke_width)
    edge = to_rgba(style["edgecolor"], alpha)
    width = style["linewidth"] if edge[3] else 0.0
    return (face if face[3] else None), edge, float(width), alpha


_PAINTERS = {Rect: _paint_rects, GradientRect: paint_fades, Text: paint_texts}


def _stroke_style(stroke: str | None, width: float) -> dict:
    if stroke is None or width <= 0:
        return {"edgecolor": "none", "linewidth": 0.0}
    return {"edgecolor": stroke, "linewidth": width * POINTS_PER_PX}


def _paint(colour: str | None) -> str:
    return "none" if colour is None else colour


def _opacity(opacity: float) -> float | None:
    return None if opacity >= 1 else max(opacity, 0.0)


def _png_metadata(scene: Scene) -> dict[str, str]:
    """PNG text chunks: title, description and the scene's metadata; no software stamp."""
    metadata: dict[str, str] = {}
    items = [("Title", scene.title), ("Description", scene.desc), *scene.metadata]
    for key, value in items:
        if value and PNG_KEYWORD.fullmatch(key):
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
