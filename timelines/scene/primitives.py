"""Renderer-neutral scene: frozen drawing primitives in page units (CSS px, 1/96 inch).

The scene is plain data. `compose` builds it; each renderer draws it with one small function
per primitive kind, so SVG, PNG and PDF show the same geometry by construction. y grows
downward, as on a page. Colours are `#rrggbb` strings; opacity is a separate number.
"""
from __future__ import annotations

import re
from dataclasses import dataclass, field, replace
from typing import Union

PX_PER_INCH = 96.0
# XML 1.0 (section 2.2) forbids C0 controls other than tab/LF/CR, surrogates, U+FFFE/U+FFFF;
# DEL and the C1 controls are allowed but never meant as text, so they go too. No renderer
# draws them; SVG collapses XML whitespace, so every renderer does (one clean-up for all).
_NOT_TEXT = re.compile("[\x00-\x08\x0b\x0c\x0e-\x1f\x7f-\x9f\ud800-\udfff\ufffe\uffff]")
_WHITESPACE = re.compile("[\t\n\r ]+")
# U+FEFF inside text is a zero-width no-break space (a byte-order mark pasted along): it draws
# nothing, and matplotlib's PDF writer fails on it. U+2060 WORD JOINER is its modern form
# (Unicode 15, section 23.8, from memory): the join is kept, the character is not.
_INVISIBLE = re.compile("\ufeff")
# Unicode bidirectional formatting characters (UAX #9, section 2): embeddings and overrides
# end at PDF, isolates at PDI.
_EMBEDDINGS = frozenset("\u202a\u202b\u202d\u202e")   # LRE, RLE, LRO, RLO
_ISOLATES = frozenset("\u2066\u2067\u2068")            # LRI, RLI, FSI
_POP_EMBEDDING, _POP_ISOLATE = "\u202c", "\u2069"        # PDF, PDI
_BIDI = re.compile("[\u202a-\u202e\u2066-\u2069]")
# How a vector renderer writes text: as text (selectable, restylable) or as glyph outlines.
TEXT_MODES = ("text", "paths")
PX_PER_MM = PX_PER_INCH / 25.4


@dataclass(frozen=True, slots=True)
class Rect:
    x: float
    y: float
    width: float
    height: float
    fill: str | None = "#000000"
    stroke: str | None = None
    stroke_width: float = 0.0
    opacity: float = 1.0
    css_class: str = ""


@dataclass(frozen=True, slots=True)
class GradientRect:
    """A rectangle filled with one colour whose opacity runs linearly from left to right; with
    `stops` (at least two), through those opacities at evenly spaced points from the left
    edge to the right instead (a calibrated date's probability; opacity_left and _right are
    then the first and the last)."""

    x: float
    y: float
    width: float
    height: float
    fill: str
    opacity_left: float
    opacity_right: float
    css_class: str = ""
    stops: tuple[float, ...] = ()


@dataclass(frozen=True, slots=True)
class Line:
    x1: float
    y1: float
    x2: float
    y2: float
    stroke: str = "#000000"
    stroke_width: float = 1.0
    dash: tuple[float, ...] | None = None
    opacity: float = 1.0
    css_class: str = ""


@dataclass(frozen=True, slots=True)
class Polygon:
    """A closed polygon (filled) or, with `closed=False`, an open polyline (stroked only)."""

    points: tuple[tuple[float, float], ...]
    fill: str | None = "#000000"
    stroke: str | None = None
    stroke_width: float = 0.0
    closed: bool = True
    opacity: float = 1.0
    css_class: str = ""


@dataclass(frozen=True, slots=True)
class Text:
    """One line of text. `y` is the baseline; `anchor` is start, middle or end."""

    x: float
    y: float
    text: str
    size: float = 12.0
    anchor: str = "start"
    weight: str = "normal"
    style: str = "normal"
    fill: str = "#000000"
    css_class: str = ""


@dataclass(frozen=True, slots=True)
class Group:
    """A group of primitives; `title` becomes the SVG tooltip (`<title>`) of the group."""

    children: tuple["Primitive", ...]
    css_class: str = ""
    title: str | None = None
    id: str | None = None


Primitive = Union[Rect, GradientRect, Line, Polygon, Text, Group]
PRIMITIVE_KINDS = (Rect, GradientRect, Line, Polygon, Text, Group)


@dataclass(frozen=True, slots=True)
class Scene:
    width: float
    height: float
    children: tuple[Primitive, ...]
    title: str = ""
    desc: str = ""
    background: str | None = "#ffffff"
    font_family: str = "DejaVu Sans"
    metadata: tuple[tuple[str, str], ...] = field(default=())


def walk(items: tuple[Primitive, ...]):
    """Every primitive in drawing order, groups included (depth first)."""
    for item in items:
        yield item
        if isinstance(item, Group):
            yield from walk(item.children)


def find(scene: Scene, css_class: str) -> list[Primitive]:
    """Primitives whose class list holds `css_class`; a test helper as much as an API."""
    return [p for p in walk(scene.children) if css_class in p.css_class.split()]


def clean_text(text: str) -> str:
    """`text` without the characters XML 1.0 cannot carry (so an SVG stays well-formed) or
    that draw nothing and break a writer, its bidirectional controls balanced."""
    text = _INVISIBLE.sub("\u2060", _NOT_TEXT.sub("", str(text)))
    return balanced_bidi(text) if _BIDI.search(text) else text


def balanced_bidi(text: str) -> str:
    """`text` with every bidirectional embedding, override and isolate closed within it: a
    closer with nothing to close is dropped, and what is still open at the end is closed
    there, so a label drawn right to left cannot reverse the text after it."""
    out: list[str] = []
    open_: list[str] = []
    for character in text:
        if character in _EMBEDDINGS or character in _ISOLATES:
            open_.append(character)
        elif character == _POP_EMBEDDING:
            if not open_ or open_[-1] not in _EMBEDDINGS:
                continue                     # nothing of its kind to close here
            open_.pop()
        elif character == _POP_ISOLATE:
            if not any(opener in _ISOLATES for opener in open_):
                continue
            while open_[-1] not in _ISOLATES:        # an isolate's end closes what it holds
                out.append(_POP_EMBEDDING)
                open_.pop()
            open_.pop()
        out.append(character)
    out += [_POP_ISOLATE if opener in _ISOLATES else _POP_EMBEDDING for opener in reversed(open_)]
    return "".join(out)


def drawable_text(text: str) -> str:
    """Text as it is drawn: cleaned, XML whitespace collapsed, ends trimmed. Every renderer
    draws this same string, so SVG, PNG and PDF show identical text."""
    return _WHITESPACE.sub(" ", clean_text(text)).strip()


def shifted(item: Primitive, dx: float, dy: float) -> Primitive:
    """`item` moved by (dx, dy) page px, groups with all they hold."""
    if isinstance(item, Group):
        return replace(item, children=tuple(shifted(child, dx, dy) for child in item.children))
    if isinstance(item, Line):
        return replace(item, x1=item.x1 + dx, y1=item.y1 + dy, x2=item.x2 + dx,
                       y2=item.y2 + dy)
    if isinstance(item, Polygon):
        return replace(item, points=tuple((x + dx, y + dy) for x, y in item.points))
    if isinstance(item, (Rect, GradientRect, Text)):
        return replace(item, x=item.x + dx, y=item.y + dy)
    raise TypeError(f"cannot move a {type(item).__name__}")


def vertical_extent(items) -> tuple[float, float]:
    """The top and bottom (page y) of what `items` draw; a text from its size above the
    baseline to 0.3 of it below."""
    ys: list[float] = []
    for item in walk(tuple(items)):
        if isinstance(item, (Rect, GradientRect)):
            ys += [item.y, item.y + item.height]
        elif isinstance(item, Line):
            ys += [item.y1, item.y2]
        elif isinstance(item, Polygon):
            ys += [y for _, y in item.points]
        elif isinstance(item, Text):
            ys += [item.y - item.size, item.y + item.size * 0.3]
    return (min(ys), max(ys)) if ys else (0.0, 0.0)
