"""Text as outlines, for print shops that will not have the font: each Text becomes one SVG
path drawn from the glyphs of the fonts the chart is measured and drawn with.

Text the DejaVu Sans tables cover is drawn from the DejaVu files matplotlib ships (found
without importing matplotlib), a glyph per character; any other text is shaped first
(`scene.shaping`: direction, font fallback, HarfBuzz) and drawn glyph by glyph from the faces
that shaped it. Glyphs are read with fontTools, recorded once and replayed where used.
"""
from __future__ import annotations

import importlib.util
from functools import lru_cache
from pathlib import Path

from fontTools.pens.recordingPen import RecordingPen
from fontTools.pens.svgPathPen import SVGPathPen
from fontTools.pens.transformPen import TransformPen
from fontTools.ttLib import TTFont

from timelines.scene.shaping import ShapedLine, needs_shaping, shape_line

FONT_FILES = {"normal": "DejaVuSans.ttf", "bold": "DejaVuSans-Bold.ttf"}


class OutlineError(RuntimeError):
    """The outline font cannot be found."""


def font_path(weight: str) -> Path:
    spec = importlib.util.find_spec("matplotlib")
    if spec is None or not spec.submodule_search_locations:
        raise OutlineError("text as paths needs DejaVu Sans, which comes with matplotlib")
    return (Path(spec.submodule_search_locations[0]) / "mpl-data" / "fonts" / "ttf"
            / FONT_FILES["bold" if weight == "bold" else "normal"])


class Outliner:
    """Turns one line of text at a place and size into SVG path data."""

    def __init__(self, weight: str = "normal"):
        self.weight = weight
        self.font = TTFont(str(font_path(weight)), lazy=True)
        self.glyphs = self.font.getGlyphSet()
        self.cmap = self.font.getBestCmap()
        self.advances = self.font["hmtx"].metrics
        self.units_per_em = self.font["head"].unitsPerEm
        self._recorded: dict[str, RecordingPen] = {}

    def advance(self, text: str, size: float) -> float:
        """Width of `text` at `size` px, from the font's advance widths (no kerning)."""
        return sum(self.advances[self._glyph_name(c)][0] for c in text) * size / self.units_per_em

    def path_data(self, text: str, x: float, y: float, size: float, anchor: str,
                  families: str | None = None) -> str:
        if needs_shaping(text):
            return shaped_path_data(shape_line(text, self.weight, families), x, y, size, anchor)
        scale = size / self.units_per_em
        width = self.advance(text, size)
        pen_x = x - {"start": 0.0, "middle": width / 2, "end": width}[anchor]
        svg_pen = SVGPathPen(self.glyphs, ntos=_number)
        for character in text:
            name = self._glyph_name(character)
            # font units have y up; the page has y down, baseline at y
            placed = TransformPen(svg_pen, (scale, 0, 0, -scale, pen_x, y))
            self._recording(name).replay(placed)
            pen_x += self.advances[name][0] * scale
        return svg_pen.getCommands()

    def _glyph_name(self, character: str) -> str:
        return self.cmap.get(ord(character), ".notdef")

    def _recording(self, name: str) -> RecordingPen:
        if name not in self._recorded:
            pen = RecordingPen()
            self.glyphs[name].draw(pen)
            self._recorded[name] = pen
        return self._recorded[name]


def shaped_path_data(line: ShapedLine, x: float, y: float, size: float, anchor: str) -> str:
    """Path data of a shaped line: each run's glyphs from its own face, where HarfBuzz put
    them (em, y up) scaled to `size` px, the line's left end set by `anchor`."""
    left = x - {"start": 0.0, "middle": line.width / 2, "end": line.width}[anchor] * size
    commands = []
    for run in line.runs:
        glyph_set = _glyph_set(run.face.path, run.face.index)
        scale = size / glyph_set.units_per_em
        svg_pen = SVGPathPen(glyph_set.glyphs, ntos=_number)
        for glyph in run.glyphs:
            placed = TransformPen(svg_pen, (scale, 0, 0, -scale, left + glyph.x * size,
                                            y - glyph.y * size))
            glyph_set.recording(glyph.id).replay(placed)
        commands.append(svg_pen.getCommands())
    return "".join(commands)


class _GlyphSet:
    """One face's glyphs by glyph id, each recorded once."""

    def __init__(self, path: str, index: int):
        self.font = TTFont(path, fontNumber=index, lazy=True)
        self.glyphs = self.font.getGlyphSet()
        self.order = self.font.getGlyphOrder()
        self.units_per_em = self.font["head"].unitsPerEm
        self._recorded: dict[int, RecordingPen] = {}

    def recording(self, glyph_id: int) -> RecordingPen:
        if glyph_id not in self._recorded:
            pen = RecordingPen()
            self.glyphs[self.order[glyph_id]].draw(pen)
            self._recorded[glyph_id] = pen
        return self._recorded[glyph_id]


@lru_cache(maxsize=32)
def _glyph_set(path: str, index: int) -> _GlyphSet:
    return _GlyphSet(path, index)


@lru_cache(maxsize=2)
def outliner(weight: str) -> Outliner:
    return Outliner("bold" if weight == "bold" else "normal")


def _number(value: float) -> str:
    text = f"{value:.2f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text
