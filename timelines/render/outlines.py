"""Text as outlines, for print shops that will not have the font: each Text becomes one SVG
path drawn from the glyphs of DejaVu Sans, the font the charts are measured and drawn with.

The font files are the ones matplotlib ships (found without importing matplotlib); glyphs are
read with fontTools, recorded once and replayed at each place they are used.
"""
from __future__ import annotations

import importlib.util
from functools import lru_cache
from pathlib import Path

from fontTools.pens.recordingPen import RecordingPen
from fontTools.pens.svgPathPen import SVGPathPen
from fontTools.pens.transformPen import TransformPen
from fontTools.ttLib import TTFont

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
        self.font = TTFont(str(font_path(weight)), lazy=True)
        self.glyphs = self.font.getGlyphSet()
        self.cmap = self.font.getBestCmap()
        self.advances = self.font["hmtx"].metrics
        self.units_per_em = self.font["head"].unitsPerEm
        self._recorded: dict[str, RecordingPen] = {}

    def advance(self, text: str, size: float) -> float:
        """Width of `text` at `size` px, from the font's advance widths (no kerning)."""
        return sum(self.advances[self._glyph_name(c)][0] for c in text) * size / self.units_per_em

    def path_data(self, text: str, x: float, y: float, size: float, anchor: str) -> str:
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


@lru_cache(maxsize=2)
def outliner(weight: str) -> Outliner:
    return Outliner("bold" if weight == "bold" else "normal")


def _number(value: float) -> str:
    text = f"{value:.2f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text
