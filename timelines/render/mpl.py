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
import math
import threading
import warnings
from dataclasses import dataclass
from pathlib import Path

import numpy

from timelines.render.png import PNG_KEYWORD, write_png
from timelines.scene.fonts import faces, font_list
from timelines.scene.shaping import needs_shaping, shape_line
from timelines.scene.primitives import (
    PX_PER_INCH, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text, drawable_text,
    walk,
)

POINTS_PER_PX = 72.0 / PX_PER_INCH
# A fade in a PDF is one row of 256 samples: as fine as 8-bit alpha resolves, so no steps show.
GRADIENT_SAMPLES = 256
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
    page = _Page(axes, fonts, TransformedPatchPath(axes.patch), raster and _glyph_cache_works(),
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


def _paint_fades(fades: list[GradientRect], renderer, affine, page: _Page):
    """Raster backends get each ramp at device resolution, with partly covered edge pixels
    faded in as an antialiased SVG rect edge is; vector backends (PDF) get one row of samples
    scaled onto the rect. Either way a finished image goes to the renderer, not through
    AxesImage's general resampler (ten times the cost)."""
    from matplotlib.colors import to_rgb
    from matplotlib.transforms import Affine2D

    corners = [point for fade in fades
               for point in ((fade.x, fade.y + fade.height), (fade.x + fade.width, fade.y))]
    boxes = affine.transform(corners).reshape(-1, 4)   # left, bottom, right, top; y up
    gc = renderer.new_gc()
    gc.set_clip_rectangle(page.axes.bbox)
    if renderer.option_scale_image():
        for fade, (left, bottom, right, top) in zip(fades, boxes):
            image = _sample_row(to_rgb(fade.fill), fade.opacity_left, fade.opacity_right)
            renderer.draw_image(gc, left, bottom, image, Affine2D().scale(right - left,
                                                                          top - bottom))
            yield
    else:
        for placed in _device_fades(fades, boxes, renderer.width, renderer.height):
            if placed is not None:
                renderer.draw_image(gc, *placed)
            yield
    gc.restore()


def _device_fades(fades: list[GradientRect], boxes, canvas_width: float, canvas_height: float):
    """(column, row, RGBA image) for each fade, covering its box (device px, y up) on the
    visible canvas, or None if it misses the canvas. All fades are worked out in one pass of
    array arithmetic, element by element the same operations as one fade at a time."""
    left, bottom, right, top = boxes.T
    columns = _Ranges(numpy.maximum(numpy.floor(left), 0),
                      numpy.minimum(numpy.ceil(right), canvas_width))
    rows = _Ranges(numpy.maximum(numpy.floor(bottom), 0),
                   numpy.minimum(numpy.ceil(top), canvas_height))
    low, high = left[columns.owner], right[columns.owner]
    centres = (numpy.clip(columns.values + 0.5, low, high) - low) / (high - low)
    opacity_left = numpy.array([fade.opacity_left for fade in fades])[columns.owner]
    opacity_right = numpy.array([fade.opacity_right for fade in fades])[columns.owner]
    across = (_opacity_ramp(opacity_left, opacity_right, centres)
              * _coverage(columns.values, low, high))
    down = _coverage(rows.values, bottom[rows.owner], top[rows.owner])
    images = _fade_images(fades, columns, rows, across, down)
    return [None if image is None else (int(columns.first[i]), int(rows.first[i]), image)
            for i, image in enumerate(images)]


def _fade_images(fades: list[GradientRect], columns: _Ranges, rows: _Ranges, across, down):
    """Each fade's RGBA image, or None if it has no pixels: its colour, and as alpha the
    product of its column's value `across` and its row's `down` (image row 0 is the top)."""
    from matplotlib.colors import to_rgb

    sizes = rows.counts * columns.counts
    pixels = _Ranges(numpy.zeros(len(fades)), sizes)      # each fade's pixels 0, 1, ...
    owner = pixels.owner
    row, column = numpy.divmod(pixels.values.astype(numpy.intp), columns.counts[owner])
    alpha = (down[rows.starts[owner] + rows.counts[owner] - 1 - row]
             * across[columns.starts[owner] + column])
    images = numpy.empty((len(alpha), 4), dtype=numpy.uint8)
    images[:, :3] = numpy.round(numpy.array([to_rgb(fade.fill) for fade in fades]) * 255)[owner]
    images[:, 3] = numpy.round(alpha * 255)
    return [None if size == 0 else
            images[start:start + size].reshape(rows.counts[i], columns.counts[i], 4)
            for i, (start, size) in enumerate(zip(pixels.starts, sizes))]


class _Ranges:
    """The integers first, first + 1, ... below stop for many (first, stop) pairs, end to end
    in `values`, with each one's `owner` (its pair), and each pair's `counts` and `starts`
    (where its values begin)."""

    def __init__(self, first, stop):
        self.first = first
        self.counts = numpy.maximum(numpy.ceil(stop - first), 0).astype(numpy.intp)
        self.starts = numpy.cumsum(self.counts) - self.counts
        self.owner = numpy.repeat(numpy.arange(len(self.counts)), self.counts)
        self.values = first[self.owner] + (numpy.arange(len(self.owner)) - self.starts[self.owner])


@functools.lru_cache(maxsize=4096)
def _sample_row(rgb: tuple[float, float, float], left: float, right: float):
    """One row of samples for a vector backend. The same array object for the same fade, so
    the PDF writer (which keys images by identity) stores each distinct fade once."""
    centres = (numpy.arange(GRADIENT_SAMPLES) + 0.5) / GRADIENT_SAMPLES
    alpha = _opacity_ramp(left, right, centres)[None]
    image = numpy.empty((*alpha.shape, 4), dtype=numpy.uint8)
    image[..., :3] = numpy.round(numpy.asarray(rgb) * 255)
    image[..., 3] = numpy.round(alpha * 255)
    image.flags.writeable = False
    return image


def _opacity_ramp(left, right, position):
    """Opacity at `position` (0 at the left edge .. 1 at the right edge)."""
    return numpy.clip(left + (right - left) * position, 0.0, 1.0)


def _coverage(pixels, low, high):
    """The part of each device pixel [p, p+1) that lies inside [low, high]."""
    return numpy.clip(numpy.minimum(pixels + 1, high) - numpy.maximum(pixels, low), 0.0, 1.0)


def _glyph_cache_works() -> bool:
    """Whether this matplotlib has the per-glyph Agg text calls the cache relies on (3.11's);
    otherwise PNG text falls back to matplotlib's Text artist."""
    from matplotlib import ft2font

    return (all(hasattr(ft2font.FT2Font, name) for name in ("_set_transform", "_render_glyph"))
            and hasattr(ft2font, "Kerning") and hasattr(ft2font, "RenderMode"))


def _paint_texts(texts: list[Text], renderer, affine, page: _Page):
    """Each text from cached glyphs, composited by Agg's own text-image call as matplotlib's
    Text does. matplotlib lays out and renders every glyph of every string anew; a chart
    repeats the same few dozen glyphs thousands of times."""
    glyphs = _glyph_cache()
    anchors = affine.transform([(text.x, text.y) for text in texts])   # y up
    canvas_height = int(renderer.height)
    gc = renderer.new_gc()
    for text, (x, y) in zip(texts, anchors):
        if needs_shaping(text.text):
            _paint_shaped(text, x, y, renderer, gc, page)
            yield
            continue
        font, size = glyphs.font(page.font_family, text)
        font.set_size(size, renderer.dpi)
        offsets, width = glyphs.laid_out(font, size, renderer.dpi, text.text)
        x -= ANCHOR_SHIFT[text.anchor] * width
        placed = glyphs.placed(font, size, renderer.dpi, offsets, x, y)
        baseline = canvas_height - math.floor(y)   # its row, counted from the top as in Agg
        gc.set_foreground(text.fill)
        for image, column, below in _glyph_images(placed):
            renderer._renderer.draw_text_image(image, column, baseline + below, 0, gc)
        yield
    gc.restore()


def _paint_shaped(text: Text, x: float, y: float, renderer, gc, page: _Page) -> None:
    """Text that needs shaping (`scene.shaping`: direction, fallback, HarfBuzz), each run's
    glyphs from its own face where HarfBuzz put them; (x, y) is the anchor in device px."""
    from matplotlib.font_manager import FontPath, get_font

    line = shape_line(text.text, text.weight, page.families)
    em = text.size * renderer.dpi / PX_PER_INCH          # device px per em
    left = x - ANCHOR_SHIFT[text.anchor] * line.width * em
    baseline = int(renderer.height) - math.floor(y)
    gc.set_foreground(text.fill)
    for run in line.runs:
        font = get_font(FontPath(run.face.path, run.face.index))
        placed = _glyph_cache().placed_shaped(font, text.size * POINTS_PER_PX, renderer.dpi, [
            (glyph.id, left + glyph.x * em, y + glyph.y * em) for glyph in run.glyphs], y)
        for image, column, below in _glyph_images(placed):
            renderer._renderer.draw_text_image(image, column, baseline + below, 0, gc)


def _glyph_images(placed: list[tuple]) -> list[tuple]:
    """One line's glyphs (bitmap, column, rows above the baseline) as few images (image,
    column, rows below the baseline) as keep every pixel exact. Agg blends an image pixel by
    pixel and a zero changes nothing, so glyphs that share no column draw the same pixels as
    one image; a glyph reaching into the columns before it (kerning, an overhang) starts the
    next image, drawn after, as it was."""
    runs: list[list[tuple]] = []
    end = 0
    for buffer, column, top in placed:
        if not runs or column < end:
            runs.append([])
        runs[-1].append((buffer, column, top))
        end = column + buffer.shape[1]   # each glyph of a run starts after all before it end
    return [_joined_glyphs(run) for run in runs]


def _joined_glyphs(run: list[tuple]) -> tuple:
    if len(run) == 1:
        buffer, column, top = run[0]
        return buffer, column, buffer.shape[0] - top
    above = max(top for _, _, top in run)
    below = max(buffer.shape[0] - top for buffer, _, top in run)
    first, (last, last_column, _) = run[0][1], run[-1]
    image = numpy.zeros((above + below, last_column + last.shape[1] - first), dtype=numpy.uint8)
    for buffer, column, top in run:
        rows, columns = buffer.shape
        image[above - top:above - top + rows, column - first:column - first + columns] = buffer
    return image, first, below


@functools.cache
def _glyph_cache() -> _GlyphCache:
    return _GlyphCache()


class _GlyphCache:
    """Fonts, advances and rendered glyphs, kept from one text (and page) to the next.

    Glyphs are cached per font, size and quarter pixel of position."""

    def __init__(self):
        from matplotlib.backends.backend_agg import get_hinting_flag
        from matplotlib.font_manager import FontProperties, fontManager, get_font
        from matplotlib.ft2font import Kerning, RenderMode

        self._properties, self._get_font = FontProperties, get_font
        self._find_fonts, self._hinting = fontManager._find_fonts_by_props, get_hinting_flag
        self._kerning, self._render_mode = Kerning.DEFAULT, RenderMode.NORMAL
        self._fonts: dict[tuple, tuple] = {}
        self._metrics: dict[tuple, tuple[dict, dict]] = {}
        self._glyphs: dict[tuple, dict] = {}

    def font(self, families: list[str], text: Text):
        """(FT2Font, size in points) for the text, looked up once per style and thread (as
        matplotlib keeps one FT2Font per thread)."""
        key = (tuple(families), text.weight, text.style, text.size, threading.get_ident())
        if key not in self._fonts:
            properties = self._properties(family=families, weight=text.weight,
                                          style=text.style, size=text.size * POINTS_PER_PX)
            self._fonts[key] = (self._get_font(self._find_fonts(properties)),
                                properties.get_size_in_points())
        return self._fonts[key]

    def laid_out(self, font, size, dpi, content) -> tuple[list[tuple[int, float]], float]:
        """(glyph index, x offset) per character and the line's width, in device px: hinted
        advances plus pair kerning, each character's advance and each pair measured once."""
        advances, kerning = self._metrics.setdefault((font.fname, size, dpi), ({}, {}))
        offsets, pen, previous = [], 0.0, None
        for character in content:
            if character not in advances:
                index = font.get_char_index(ord(character))
                # the hinted advance, as matplotlib's Text and cairo set it: whole pixels
                glyph = font.load_glyph(index, self._hinting())
                advances[character] = (index, glyph.horiAdvance / 64)
            index, advance = advances[character]
            if previous is not None:
                if (previous, index) not in kerning:
                    kerning[previous, index] = font.get_kerning(previous, index,
                                                                self._kerning) / 64
                pen += kerning[previous, index]
            offsets.append((index, pen))
            pen += advance
            previous = index
        return offsets, pen

    def placed(self, font, size, dpi, offsets, x: float, y: float) -> list[tuple]:
        """(bitmap, column, rows above the baseline) of each inked glyph of a line laid out
        as `offsets`, whose pen starts at device position (x, y)."""
        phase_y = round(4 * (y % 1)) / 4
        rendered = self._glyphs.setdefault((font.fname, size, dpi, phase_y), {})
        placed = []
        for index, offset in offsets:
            gx = x + offset
            key = (index, round(4 * (gx % 1)) / 4)
            if key not in rendered:
                rendered[key] = self._render(font, size, dpi, key, phase_y)
            buffer, left, top = rendered[key]
            if buffer.size:                                  # a space has no ink
                placed.append((buffer, math.floor(gx) + left, top))
        return placed

    def placed_shaped(self, font, size, dpi, positions: list[tuple], y: float) -> list[tuple]:
        """(bitmap, column, rows above the baseline at `y`) of each inked glyph, from (glyph
        index, x, y) device positions (y up), as `placed` does for one face of a ttc too."""
        placed = []
        for index, gx, gy in positions:
            phase_y = round(4 * (gy % 1)) / 4
            rendered = self._glyphs.setdefault((font.fname, font.face_index, size, dpi,
                                                phase_y), {})
            key = (index, round(4 * (gx % 1)) / 4)
            if key not in rendered:
                rendered[key] = self._render(font, size, dpi, key, phase_y)
            buffer, left, top = rendered[key]
            if buffer.size:
                placed.append((buffer, math.floor(gx) + left,
                               top + math.floor(gy) - math.floor(y)))
        return placed

    def _render(self, font, size, dpi, key: tuple[int, float], phase_y: float) -> tuple:
        index, phase_x = key
        font.set_size(size, dpi)
        font._set_transform([[0x10000, 0], [0, 0x10000]],
                            [round(0x40 * phase_x), round(0x40 * phase_y)])
        bitmap = font._render_glyph(index, self._hinting(), self._render_mode)
        return bitmap.buffer.copy(), bitmap.left, bitmap.top


_PAINTERS = {Rect: _paint_rects, GradientRect: _paint_fades, Text: _paint_texts}


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
