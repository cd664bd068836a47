"""Text painted from cached glyphs onto matplotlib's Agg renderer (PNG).

matplotlib lays out and renders every glyph of every string anew; a chart repeats the same few
dozen glyphs thousands of times. Here fonts, advances and rendered glyphs are kept from one
text to the next, and a line's glyphs are composited by Agg's own text-image call as
matplotlib's Text does. Text that needs shaping (another direction, joining, fallback fonts)
is laid out by `scene.shaping` and drawn the same way.
"""
from __future__ import annotations

from typing import TYPE_CHECKING

import functools
import math
import threading

import numpy

from timelines.scene.primitives import PX_PER_INCH, Text

if TYPE_CHECKING:                      # the page a painter draws on
    from timelines.render.mpl import _Page
from timelines.scene.shaping import needs_shaping, shape_line

POINTS_PER_PX = 72.0 / PX_PER_INCH
ANCHOR_SHIFT = {"start": 0.0, "middle": 0.5, "end": 1.0}   # of the width, to the left


def glyph_cache_works() -> bool:
    """Whether this matplotlib has the per-glyph Agg text calls the cache relies on (3.11's);
    otherwise PNG text falls back to matplotlib's Text artist."""
    from matplotlib import ft2font

    return (all(hasattr(ft2font.FT2Font, name) for name in ("_set_transform", "_render_glyph"))
            and hasattr(ft2font, "Kerning") and hasattr(ft2font, "RenderMode"))


def paint_texts(texts: list[Text], renderer, affine, page: _Page):
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
