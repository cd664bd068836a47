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
matplotlibrc cannot change the picture and the same scene always gives the same bytes.

A PNG is drawn in bands of `PNG_BAND_HEIGHT` device rows (`_Raster`), each handed to
`png.write_png_rows` before the next is drawn: memory follows the band, not the page, and no
page is too tall for Agg. A band is the whole page's geometry, moved up by a whole number of
rows after the page's own transform, on a canvas reaching a little past the band, so its
pixels are the ones a single canvas of the page would hold (tests/test_png_bands.py).
"""
from __future__ import annotations

import contextlib
import dataclasses
import functools
import math
import warnings
from dataclasses import dataclass
from pathlib import Path

import numpy

from timelines.render.fades import paint_fades
from timelines.render.glyphs import POINTS_PER_PX, glyph_cache_works, paint_texts
from timelines.render.png import PNG_KEYWORD, write_png_rows
from timelines.scene.fonts import faces, font_list
from timelines.scene.shaping import needs_shaping, shape_line
from timelines.scene.primitives import (
    PX_PER_INCH, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text, drawable_text,
    vertical_extent, walk,
)

DRAW_ORDER = 1  # one zorder for every artist: insertion order is drawing order
HORIZONTAL_ALIGNMENT = {"start": "left", "middle": "center", "end": "right"}
# Device rows of a PNG drawn at a time: a band of a page 1,500 px wide holds 25 MB.
PNG_BAND_HEIGHT = 4096

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
    """Write the scene as PNG; the image is width*dpi/96 by height*dpi/96 pixels, drawn and
    written a band of `PNG_BAND_HEIGHT` rows at a time."""
    with _local_settings(), _quiet_fonts():
        raster = _Raster(scene, dpi, PNG_BAND_HEIGHT)
        write_png_rows(path, raster.width, raster.height, raster.bands(), dpi,
                       _png_metadata(scene))


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
    figure, page = _blank_figure(scene, raster)
    for artist in _artists(scene.children, page):
        artist.set_zorder(DRAW_ORDER)
        # The page edge clips anyway; one shared clip path spares add_artist making one each.
        artist.set_clip_path(page.clip)
        artist.set_clip_on(False)
        page.axes.add_artist(artist)
    return figure


def _blank_figure(scene: Scene, raster: bool = False):
    """(figure, page): a Figure of the scene's size on an Agg canvas, with nothing drawn yet,
    and the `_Page` of its one Axes, which spans it."""
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
    return figure, page


@dataclass(frozen=True, slots=True)
class _Page:
    """Where primitives are drawn, and the font list text uses (DejaVu Sans last as fallback)."""

    axes: object
    font_family: list[str]
    clip: object
    cached_glyphs: bool = False     # draw text from the glyph cache (raster output)
    families: str | None = None     # the scene's family list, for text that needs shaping
    band: _Band | None = None       # drawing one band of a PNG


@dataclass(frozen=True, slots=True)
class _Band:
    """A band of a PNG's rows, drawn on a canvas of its own (`_Raster`)."""

    lowered: int                    # display rows the page is moved down by onto the canvas
    page_height: int                # device rows of the whole page
    # (left, top, right, bottom) in page units, a little inside the canvas, which Agg clips
    # strokes to: `_draw_line` cuts a dashed line there, its dashes kept in step (Agg's cut
    # would start the pattern afresh).
    inside: tuple[float, float, float, float]


class _Raster:
    """The scene on Agg's pixel grid at `dpi`, drawn a band of rows at a time.

    Every band is drawn with the transform of the whole page's figure (what one canvas of the
    page would use), then moved up by a whole number of rows (`_lowered`): its numbers are the
    page's less an integer, which subtracts exactly, so Agg gives every pixel the coverage the
    single canvas gives it. The canvas reaches `margin` rows past the band on either side:
    more than any stroke's half-width, so where Agg clips a stroke at the canvas edge the band
    does not show it, and as far as the tallest slanted shape, so none is cut (`_overhangs`).
    Only what reaches the band is drawn (`_reaching`).
    """

    def __init__(self, scene: Scene, dpi: float, band_height: int):
        self.figure, self.page = _blank_figure(scene, raster=True)
        self.band_height = band_height
        self.figure.dpi = dpi             # as savefig(dpi=...) sets it for the drawing
        # Agg's canvas: whole pixels, as FigureCanvasAgg sizes it
        self.width, self.height = self.figure.canvas.get_width_height(physical=True)
        self.per_unit = dpi / PX_PER_INCH
        # Agg counts rows down from the canvas's whole-pixel height, the figure's transform up
        # from its exact one: page y of device row r is (r + rows_above) / per_unit.
        self.rows_above = self.figure.bbox.height - self.height
        self.opaque = self.figure.get_facecolor()[3] == 1
        text_overhang, stroke_reach, slanted = _overhangs(scene.children, self.per_unit)
        # Slanted shapes taller than a band (or 512 rows) are not held whole, to keep the
        # canvas a few bands at most: where a band edge cuts one it may differ by a level.
        self.margin = math.ceil(stroke_reach * self.per_unit) + 2 + min(
            math.ceil(slanted * self.per_unit), max(band_height, 512))
        self.overhang = text_overhang + stroke_reach + 2 / self.per_unit
        self.items, self.tops, self.bottoms = _pieces(
            scene.children, band_height / self.per_unit)

    def bands(self):
        """The page's pixels, `band_height` rows at a time (RGB for an opaque page, else RGBA),
        each band a view of the canvas the next band is drawn into."""
        from matplotlib.backends.backend_agg import RendererAgg

        renderer = None
        for first in range(0, self.height, self.band_height):
            last = min(first + self.band_height, self.height)
            top, bottom = max(first - self.margin, 0), min(last + self.margin, self.height)
            if renderer is None or renderer.height != bottom - top:
                renderer = RendererAgg(self.width, bottom - top, self.figure.dpi)
            self._draw(renderer, first, last, top, bottom)
            pixels = numpy.asarray(renderer.buffer_rgba())[first - top:last - top]
            yield pixels[..., :3] if self.opaque else pixels   # opaque: no use for alpha

    def _draw(self, renderer, first: int, last: int, top: int, bottom: int) -> None:
        """Draw into `renderer`, a canvas of device rows top..bottom, what reaches the rows
        first..last, as Figure.draw would: the background first, then in scene order."""
        renderer.clear()
        self.figure.patch.draw(renderer)
        band = _Band(self.height - bottom, self.height, (
            -0.5 / self.per_unit, self._page_y(top - 0.5),
            (self.width + 0.5) / self.per_unit, self._page_y(bottom + 0.5)))
        transform = self.page.axes.transData + _lowered(band.lowered)
        page = dataclasses.replace(self.page, band=band)
        for artist in _artists(self._reaching(first, last), page):
            artist.set_figure(self.figure)
            artist.set_transform(transform)
            artist.draw(renderer)

    def _reaching(self, first: int, last: int) -> list:
        """The pieces whose ink may reach device rows first..last, in scene order."""
        low = self._page_y(first) - self.overhang
        high = self._page_y(last) + self.overhang
        chosen = numpy.flatnonzero((self.bottoms >= low) & (self.tops <= high))
        return [self.items[index] for index in chosen]

    def _page_y(self, row: float) -> float:
        return (row + self.rows_above) / self.per_unit


def _pieces(items, tallest: float):
    """(pieces, tops, bottoms): `items` in drawing order as pieces to cull, a group whole
    unless taller than `tallest` (page units; then its children in its place, in turn), with
    each piece's vertical extent as arrays."""
    pieces, extents = [], []

    def add(items):
        for item in items:
            extent = vertical_extent((item,))
            if isinstance(item, Group) and extent[1] - extent[0] > tallest:
                add(item.children)
            else:
                pieces.append(item)
                extents.append(extent)

    add(items)
    tops, bottoms = numpy.array(extents, dtype=float).reshape(-1, 2).T
    return pieces, tops, bottoms


def _overhangs(items, per_unit: float) -> tuple[float, float, float]:
    """(text, stroke, slanted), in page units: how far ink may reach past `vertical_extent`,
    and the height of the tallest shape with slanted edges.

    Text may reach an em further either way (stacked marks, deep descenders); a stroke half
    its width, or at a miter join up to half its width times Agg's miter limit (matplotlib
    sets the limit to the width in device px). A slanted edge that Agg cuts at the canvas edge
    is drawn from the cut, and its coverage can differ by one level in 255 all along it; a
    canvas reaching the tallest such shape past the band holds it whole."""
    size = stroke = slanted = 0.0
    for item in walk(tuple(items)):
        if isinstance(item, Text):
            size = max(size, item.size)
            continue
        if isinstance(item, (Line, Polygon, Rect)):
            stroke = max(stroke, item.stroke_width)
        if isinstance(item, Line) and item.x1 != item.x2:
            slanted = max(slanted, abs(item.y2 - item.y1))
        elif isinstance(item, Polygon) and item.points:
            ys = [y for _, y in item.points]
            slanted = max(slanted, max(ys) - min(ys))
    return size, stroke / 2 * max(1.5, stroke * per_unit), slanted


def _lowered(rows: int):
    """A transform after the page's own that moves display y down by `rows` (whole pixels)."""
    return _lowered_type()(rows)


@functools.cache
def _lowered_type():
    """Not affine, so matplotlib applies it to the numbers the page's transform gives rather
    than folding it into the page's matrix, whose rounding would differ from one canvas's."""
    from matplotlib.transforms import Transform

    class Lowered(Transform):
        input_dims = output_dims = 2

        def __init__(self, rows: int):
            super().__init__()
            self.rows = rows

        def transform_non_affine(self, values):
            moved = numpy.array(values, dtype=float)
            moved[:, 1] -= self.rows
            return moved

    return Lowered


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
    if line.dash and page.band is not None:
        line, along = _cut(line, page.band.inside)
        if line is None:
            return None
        dashes = (along * POINTS_PER_PX, dashes[1])     # the pattern goes on where it was
    return Line2D(
        (line.x1, line.x2), (line.y1, line.y2), color=line.stroke,
        linewidth=line.stroke_width * POINTS_PER_PX, linestyle=dashes,
        alpha=_opacity(line.opacity), solid_capstyle="butt", dash_capstyle="butt", snap=False,
    )


def _cut(line: Line, box: tuple[float, float, float, float]) -> tuple[Line | None, float]:
    """(the part of `line` inside `box` (left, top, right, bottom), how far along the line
    it starts), or (None, 0) if no part is inside: Liang and Barsky's clipping."""
    left, top, right, bottom = box
    dx, dy = line.x2 - line.x1, line.y2 - line.y1
    start, end = 0.0, 1.0
    for step, room in ((-dx, line.x1 - left), (dx, right - line.x1),
                       (-dy, line.y1 - top), (dy, bottom - line.y1)):
        if step == 0:
            if room < 0:
                return None, 0.0          # parallel to this edge and outside it
        elif step < 0:
            start = max(start, room / step)
        else:
            end = min(end, room / step)
    if start > end:
        return None, 0.0
    if start == 0 and end == 1:
        return line, 0.0
    return dataclasses.replace(
        line, x1=line.x1 + start * dx, y1=line.y1 + start * dy, x2=line.x1 + end * dx,
        y2=line.y1 + end * dy), start * math.hypot(dx, dy)


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
            transform = self.get_transform()
            # A band of a PNG moves the page after its affine part (`_lowered`): keep it all.
            affine = transform.get_affine() if transform.is_affine else transform
            kinds = dict.fromkeys(type(item) for item in self.items)
            # One painter (a generator) per kind prepares its whole share at once, then draws
            # its next primitive each time it is advanced: kinds interleave in scene order.
            painters = {kind: _PAINTERS[kind]([i for i in self.items if type(i) is kind],
                                              *self._surface(kind, renderer, affine),
                                              self.page) for kind in kinds}
            for item in self.items:
                next(painters[type(item)])
            for painter in painters.values():
                next(painter, None)   # lets it release its graphics context
            self.stale = False

        def _surface(self, kind, renderer, affine):
            """(renderer, transform) a painter of `kind` draws with. On a band, fades are
            worked out in the whole page's rows, as on one canvas, and only then moved onto
            the band. Cut at the canvas edge, a fade's image would differ: `fades` builds it
            top row first and Agg's draw_image takes the first row as the bottom, so its
            edge rows trade places, and a cut image trades other rows."""
            if kind is GradientRect and self.page.band is not None:
                return _WholePage(renderer, self.page.band), self.page.axes.transData
            return renderer, affine

    return Batch


class _WholePage:
    """A band's renderer as the fade painter sees it: as tall as the page, each image moved
    down by the band's whole rows when drawn."""

    def __init__(self, renderer, band: _Band):
        self.renderer, self.band = renderer, band
        self.width, self.height = renderer.width, band.page_height

    def option_scale_image(self) -> bool:
        return self.renderer.option_scale_image()

    def new_gc(self):
        return self.renderer.new_gc()

    def draw_image(self, gc, x, y, image) -> None:
        self.renderer.draw_image(gc, x, y - self.band.lowered, image)


def _paint_rects(rects: list[Rect], renderer, affine, page: _Page):
    """Each rect as a closed polygon with the graphics state matplotlib's Polygon patch sets
    (miter joins, butt caps, antialiased, not snapped)."""
    from matplotlib.path import Path as MplPath
    from matplotlib.transforms import IdentityTransform

    outlines = _rect_outlines(rects)
    if not affine.is_affine:      # a band of a PNG: the corners placed here, all at once
        outlines = affine.transform(outlines.reshape(-1, 2)).reshape(outlines.shape)
        affine = IdentityTransform()
    gc = renderer.new_gc()
    gc.set_capstyle("butt")
    gc.set_joinstyle("miter")
    gc.set_antialiased(True)
    gc.set_snap(False)
    for rect, corners in zip(rects, outlines):
        face, edge, width, alpha = _rect_paint(rect.fill, rect.stroke, rect.stroke_width,
                                               rect.opacity)
        gc.set_linewidth(width)
        gc.set_alpha(alpha)               # before the colour, which it overrides
        gc.set_foreground(edge, isRGBA=True)
        gc.set_dashes(0, None)
        renderer.draw_path(gc, MplPath(corners, closed=True), affine, face)
        yield
    gc.restore()


def _rect_outlines(rects: list[Rect]) -> numpy.ndarray:
    """Each rect's corners clockwise from the top left, the first again at the end."""
    x = numpy.array([rect.x for rect in rects], dtype=float)
    y = numpy.array([rect.y for rect in rects], dtype=float)
    right = x + numpy.array([rect.width for rect in rects], dtype=float)
    bottom = y + numpy.array([rect.height for rect in rects], dtype=float)
    return numpy.stack([numpy.stack([x, right, right, x, x], axis=1),
                        numpy.stack([y, y, bottom, bottom, y], axis=1)], axis=2)


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
