"""One line of text in any script as positioned glyphs: direction, font fallback, shaping.

The steps, each by a library or a published rule, none by hand:
1. embedding levels from the Unicode bidirectional algorithm (UAX #9) as python-bidi computes
   them (its Rust core, the `unicode-bidi` crate), the paragraph direction from the first
   strong character (UAX #9 P2-P3), as a browser sets an isolated `dir=auto` text;
2. each character's face: the first of the chart's families that has it (`fonts.face_for`),
   else the Noto Sans face of its script where installed (`coverage.script_face`); marks and
   joiners stay with their base, neutrals with the run they sit in;
3. runs of one level and one face shaped by HarfBuzz (uharfbuzz), with the whole line as
   context so Arabic letters join across a run boundary; HarfBuzz mirrors brackets in RTL runs;
4. runs put in visual order by UAX #9 rule L2 (reverse every sequence at or above each level,
   from the highest level down to the lowest odd one).

Positions are in em (multiply by the size in px), x from the line's left end, y up. Renderers
and `textsize` share these results, so the room measured is the room drawn. Text the DejaVu
Sans tables of `textsize` cover needs none of this (`needs_shaping`): the fast path stays.
"""
from __future__ import annotations

import re
import unicodedata
from dataclasses import dataclass
from functools import cache, lru_cache

from .coverage import script_face
from .fonts import Face, face_for, faces, font_list

# Characters that belong to the cluster before them: marks, joiners, variation selectors.
_ATTACHED_CATEGORIES = frozenset({"Mn", "Me", "Mc", "Cf"})
_LEVELS = re.compile(r"levels: \[(.*?)\]", re.S)
_LEVEL = re.compile(r"Level\(\s*(\d+)")
_PARAGRAPH_LEVEL = re.compile(r"ParagraphInfo \{.*?level: Level\(\s*(\d+)", re.S)


@dataclass(frozen=True, slots=True)
class Glyph:
    """One glyph: its id in the face, where its origin sits (em, y up), its name."""

    id: int
    x: float
    y: float
    name: str


@dataclass(frozen=True, slots=True)
class GlyphRun:
    """Glyphs of one face, in visual (left to right) order; `rtl` for a right-to-left run."""

    face: Face
    glyphs: tuple[Glyph, ...]
    rtl: bool
    text: str


@dataclass(frozen=True, slots=True)
class ShapedLine:
    runs: tuple[GlyphRun, ...]
    width: float                 # advance of the whole line, em
    missing: str = ""            # characters no installed face has (drawn as its box)


def needs_shaping(text: str) -> bool:
    """Whether `text` holds characters the DejaVu Sans tables do not cover (everything else
    is left-to-right, one glyph per character, and drawn and measured as it always was)."""
    from .textsize import covered_by_tables

    return not covered_by_tables(text)


@lru_cache(maxsize=8192)
def shape_line(text: str, weight: str = "normal", families: str | None = None) -> ShapedLine:
    """`text` shaped with the chart's families (a comma-separated list; None: the default)."""
    if not text:
        return ShapedLine((), 0.0)
    available = faces(font_list(families), "bold" if weight == "bold" else "normal")
    levels, paragraph = embedding_levels(text)
    chosen, missing = _faces_per_character(text, available, weight == "bold")
    bounds = _runs(levels, chosen)
    runs = [_shaped_run(text, start, end, chosen[start], levels[start] % 2 == 1)
            for start, end in bounds]
    return _placed([runs[i] for i in visual_order([levels[s] for s, _ in bounds])], missing)


def embedding_levels(text: str) -> tuple[list[int], int]:
    """Each character's resolved embedding level and the paragraph level (UAX #9), from
    python-bidi, whose debug output lists the levels per UTF-8 byte."""
    from bidi import get_display

    report = get_display(text, debug=True)
    per_byte = [int(level) for level in _LEVEL.findall(_LEVELS.search(report).group(1))]
    levels, offset = [], 0
    for character in text:
        levels.append(per_byte[offset])
        offset += len(character.encode("utf-8"))
    return levels, int(_PARAGRAPH_LEVEL.search(report).group(1))


def visual_order(levels: list[int]) -> list[int]:
    """Indices of runs (each of one level) left to right, by UAX #9 rule L2."""
    order = list(range(len(levels)))
    odd_levels = [level for level in levels if level % 2]
    for level in range(max(levels, default=0), min(odd_levels, default=1) - 1, -1):
        i = 0
        while i < len(order):
            end = i
            while end < len(order) and levels[order[end]] >= level:
                end += 1
            order[i:end] = reversed(order[i:end])
            i = end + 1
    return order


def _faces_per_character(text: str, available: tuple[Face, ...], bold: bool
                         ) -> tuple[list[Face], str]:
    """The face of each character, and the characters no face has (drawn with the first
    face's missing-glyph box, and reported by `fonts_report`)."""
    chosen: list[Face] = []
    missing = []
    for character in text:
        previous = chosen[-1] if chosen else None
        if previous is not None and _stays_with(character, previous):
            chosen.append(previous)
            continue
        face = face_for(character, available) or script_face(character, bold)
        if face is None:
            missing.append(character)
            face = previous or available[0]
        chosen.append(face)
    return chosen, "".join(dict.fromkeys(missing))


def _stays_with(character: str, previous: Face) -> bool:
    """Marks and joiners stay with their base; spaces, digits and punctuation stay in the run
    they sit in when its face has them (fewer runs, as browsers split them)."""
    category = unicodedata.category(character)
    if category in _ATTACHED_CATEGORIES:
        return True
    from .fonts import codepoints

    return not category.startswith("L") and ord(character) in codepoints(previous)


def _runs(levels: list[int], chosen: list[Face]) -> list[tuple[int, int]]:
    """(start, end) of each stretch of one level and one face, in logical order."""
    bounds, start = [], 0
    for i in range(1, len(levels) + 1):
        if i == len(levels) or levels[i] != levels[start] or chosen[i] is not chosen[start]:
            bounds.append((start, i))
            start = i
    return bounds


def _shaped_run(text: str, start: int, end: int, face: Face, rtl: bool) -> tuple:
    """(face, [(glyph id, x offset, y offset, x advance, name)], rtl, text) in em, visual order
    as HarfBuzz returns it, the rest of the line given as context."""
    import uharfbuzz

    font, units = _harfbuzz_font(face)
    buffer = uharfbuzz.Buffer()
    buffer.add_str(text, item_offset=start, item_length=end - start)
    buffer.guess_segment_properties()
    buffer.direction = "rtl" if rtl else "ltr"
    uharfbuzz.shape(font, buffer)
    glyphs = [(info.codepoint, pos.x_offset / units, pos.y_offset / units, pos.x_advance / units,
               font.glyph_to_string(info.codepoint))
              for info, pos in zip(buffer.glyph_infos, buffer.glyph_positions)]
    return face, glyphs, rtl, text[start:end]


@cache
def _harfbuzz_font(face: Face):
    import uharfbuzz

    hb_face = uharfbuzz.Face(uharfbuzz.Blob.from_file_path(face.path), face.index)
    return uharfbuzz.Font(hb_face), hb_face.upem


def _placed(runs: list[tuple], missing: str) -> ShapedLine:
    """The runs laid end to end from x = 0, each glyph at its pen position plus offset."""
    pen, placed = 0.0, []
    for face, glyphs, rtl, text in runs:
        run = []
        for glyph_id, x_offset, y_offset, advance, name in glyphs:
            run.append(Glyph(glyph_id, pen + x_offset, y_offset, name))
            pen += advance
        placed.append(GlyphRun(face, tuple(run), rtl, text))
    return ShapedLine(tuple(placed), pen, missing)
