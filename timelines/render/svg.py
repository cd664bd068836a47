"""Scene -> SVG, written as a stream: small, deterministic, accessible, safe to embed.

One `_draw_<kind>` per primitive, chosen from a dispatch table, writes its element straight to
an XMLWriter (render/xmlwriter.py): no element objects and no tree, so a chart of 100,000
records costs the memory of its scene, not of its document. The <defs> gradients and the
<style> rules come before the first shape, so a quick survey of the scene finds them first.

Coordinates are written with one decimal, sizes of strokes and fonts with two, opacities with
three, so the same scene always gives the same bytes. Presentation every text of a class
shares becomes one <style> rule scoped to the chart; every element keeps its class. Every user
string is escaped and cleaned of characters XML 1.0 forbids; colours are checked, so a scene
can never smuggle in script, event handlers or an external reference. This module never
imports matplotlib: the SVG path must start fast.

svgwrite is no longer used at run time: one Python object per element, serialised through
ElementTree at the end, took most of a 100,000-record run and over a gigabyte. The bytes are
still the ones it wrote: attributes sorted by name, empty values left out, ElementTree's
escaping, `/>` for empty elements, none of the root attributes it adds that nothing here uses
(xmlns:xlink, xmlns:ev, baseProfile).
"""
from __future__ import annotations

import functools
import hashlib
import io
import math
import re
import unicodedata
from dataclasses import dataclass, field
from pathlib import Path
from typing import IO

from timelines.scene.fonts import font_list
from timelines.scene.primitives import (
    TEXT_MODES, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text, drawable_text,
    walk,
)

from .xmlwriter import XMLWriter

# The chart's <title> and <desc> ids: these prefixes and a digest of the two texts, so that
# two different charts inlined in one HTML page do not share an id (the same chart always
# gets the same ids).
TITLE_ID = "timelines-title-"
DESC_ID = "timelines-desc-"
ROOT_ID_PREFIX = "timelines-chart-"     # the root's id, when it has a style sheet to scope
GRADIENT_ID_PREFIX = "f"                # scene ids are group-N and panel-N: no clash
SVG_NAMESPACE = "http://www.w3.org/2000/svg"
_BASE36 = "0123456789abcdefghijklmnopqrstuvwxyz"
# Metric-compatible fallbacks after the scene's font, so text measured for DejaVu Sans fits.
FONT_FALLBACKS = ("Bitstream Vera Sans", "sans-serif")
_RTL_CLASSES = frozenset({"R", "AL", "AN"})   # UAX #9 bidirectional classes of RTL text
XML_DECLARATION = '<?xml version="1.0" encoding="utf-8"?>\n'

# Hex colours and CSS colour keywords only: nothing that could be url(...) or a script.
_COLOUR = re.compile(r"#[0-9a-fA-F]{3}(?:[0-9a-fA-F]{3})?|[a-zA-Z]{1,40}")
_BLACK = ("#000000", "#000", "black")     # a text's initial fill: not written
_FONT_NAME_UNSAFE = re.compile(r"[^\w \-]")
# Class names that may go into a CSS selector as they are (no escaping needed).
_CSS_IDENT = re.compile(r"-?[_a-zA-Z][_a-zA-Z0-9-]*")
# Coordinates: one decimal puts every edge within 0.05 px of the scene's, a twentieth of a pixel
# at 1:1 and 0.013 mm on paper at 96 px/in, finer than a 600 dpi printer dot (0.042 mm); the
# raster comparison in tests/test_render_agree.py checks that the picture does not change.
COORDINATE_DECIMALS = 1
# Text presentation moved into <style> rules when a class agrees on it. The font size stays on
# each text: scripts and editors read a label's size from its attribute.
_TEXT_STYLES = ("fill", "font-weight", "font-style", "text-anchor")


def render_svg(scene: Scene, *, text: str = "text", file: IO | None = None) -> str | None:
    """The scene as a complete SVG document (with XML declaration).

    `text="paths"` draws every text as glyph outlines instead of `<text>` (for print shops
    without the font); labels stay readable in each record's `<title>`. With `file` (a text or
    binary file object) the document is written there piece by piece, UTF-8 in a binary file,
    and None returned; a scene that cannot be drawn (a bad colour, a coordinate that is not
    finite) raises part-way, leaving a partial document there."""
    if file is None:
        chunks: list[str] = []
        _write_document(scene, chunks.append, text)
        return "".join(chunks)
    if isinstance(file, io.TextIOBase):
        _write_document(scene, file.write, text)
    else:
        _write_document(scene, lambda chunk: file.write(chunk.encode("utf-8")), text)
    return None


def write_svg(scene: Scene, file: str | Path | IO, *, text: str = "text") -> None:
    """Write the scene to a file object as `render_svg(..., file=file)` does, or to a path as
    UTF-8 with LF line ends on every platform, whole or not at all (render.replacing)."""
    if hasattr(file, "write"):
        render_svg(scene, text=text, file=file)
        return
    from . import replacing

    with replacing(Path(file)) as binary:
        render_svg(scene, text=text, file=binary)


def _write_document(scene: Scene, write, text: str) -> None:
    """The document through `write`; every check that concerns the whole chart is made
    before the first piece is written."""
    digest = _chart_digest(scene)
    width, height = _number(scene.width), _number(scene.height)
    background = None if scene.background is None else _colour(scene.background)
    outlines = _choice(text, TEXT_MODES) == "paths"
    gradients, texts = _survey(scene, outlines)
    rules = _text_style_rules(texts)
    sheet = _style_sheet(rules) if rules else None
    writer = XMLWriter(write)
    context = _Context(writer, {key: name for key, (name, _) in gradients.items()}, rules,
                       outlines, id_suffix=digest, font_family=scene.font_family)
    writer.raw(XML_DECLARATION)
    writer.start("svg", _root_attributes(scene, width, height, digest, sheet))
    _describe_chart(writer, scene, digest)
    if sheet is not None:
        writer.element("style", (), sheet[1])
    if gradients:
        _write_gradients(writer, gradients)
    if background is not None:
        writer.element("rect", (("class", "background"), ("fill", background),
                                ("height", height), ("width", width), ("x", "0"), ("y", "0")))
    for item in scene.children:
        _DRAW[type(item)](item, context)
    writer.end()
    writer.raw("\n")
    writer.close()


@dataclass(slots=True)
class _Context:
    """The writer, and what the survey found that each element needs: gradient ids by key and
    the (classes, property) pairs a style rule sets."""

    writer: XMLWriter
    gradients: dict[tuple, str] = field(default_factory=dict)
    rules: dict[tuple[frozenset, str], str] = field(default_factory=dict)
    outlines: bool = False          # draw text as glyph outlines
    id_suffix: str = ""             # ends every scene id (_chart_digest)
    font_family: str | None = None  # the scene's families, for text drawn as outlines
    fills: dict[tuple, str] = field(default_factory=dict)   # a fade as drawn -> its url(#id)


def _root_attributes(scene: Scene, width: str, height: str, digest: str,
                     sheet: tuple[str, str] | None) -> tuple:
    labels = TITLE_ID + digest + (f" {DESC_ID}{digest}" if scene.desc else "")
    return (("aria-labelledby", labels), ("font-family", font_family_list(scene.font_family)),
            ("height", height), ("id", sheet and sheet[0]), ("role", "img"),
            ("version", "1.1"), ("viewBox", f"0 0 {width} {height}"), ("width", width),
            ("xmlns", SVG_NAMESPACE))


def _describe_chart(writer: XMLWriter, scene: Scene, digest: str) -> None:
    """Chart-level <title>/<desc> first in the root, named by aria-labelledby (SVG-AAM); their
    ids end with the chart's digest. Then the metadata, as plain `key: value` lines: readable,
    and no foreign namespace needed."""
    writer.element("title", (("id", TITLE_ID + digest),), clean_text(scene.title))
    if scene.desc:
        writer.element("desc", (("id", DESC_ID + digest),), clean_text(scene.desc))
    if scene.metadata:
        lines = (f"{clean_text(key)}: {clean_text(value)}" for key, value in scene.metadata)
        writer.element("metadata", (), "\n".join(lines))


def _chart_digest(scene: Scene) -> str:
    """Ten hex digits from the chart's title and description, ending the ids of its elements:
    an HTML page holding two charts inline has one id space for both."""
    text = f"{clean_text(scene.title)}\0{clean_text(scene.desc or '')}"
    return hashlib.sha256(text.encode()).hexdigest()[:10]


# --- the survey: what must be written before the first shape --------------------------------

def _survey(scene: Scene, outlines: bool) -> tuple[dict[tuple, tuple[str, str]], tuple]:
    """(gradient key -> (id, colour) in order of first use, (styles, class sets) of the drawn
    texts: see _survey_text). A primitive that cannot be drawn is passed over here: drawing it
    raises, at the same primitive."""
    gradients: dict[tuple, tuple[str, str]] = {}
    texts: tuple[dict, set] = ({}, set())
    for item in walk(scene.children):
        try:
            if isinstance(item, GradientRect) and item.width > 0 and item.height > 0:
                key, colour = _gradient_key(item)
                if key not in gradients:
                    gradients[key] = (_gradient_name(key), colour)
            elif isinstance(item, Text) and not outlines and drawable_text(item.text):
                _survey_text(item, *texts)
        except (ValueError, TypeError, AttributeError):
            continue
    return gradients, texts


def _survey_text(text: Text, styles: dict[tuple[frozenset, str], set],
                 class_sets: set[frozenset]) -> None:
    """Adds the text's class set to `class_sets` and, when those classes can go into a
    selector, the value it gives each property (None: left out) to `styles`."""
    classes = _class_set(text.css_class)
    class_sets.add(classes)
    if classes and all(_CSS_IDENT.fullmatch(name) for name in classes):
        for prop, value in zip(_TEXT_STYLES, _text_styles(text)):
            styles.setdefault((classes, prop), set()).add(value)


def _text_style_rules(texts: tuple[dict, set]) -> dict[tuple[frozenset, str], str]:
    """(classes, property) -> value, where every text of those classes sets that value; each
    is one style rule, and left off those texts. A rule for classes T also matches texts
    whose classes include T; those must then have their own, more specific rule for that
    property (CSS 2.1 section 6.4.3: more classes win), else the rule is dropped."""
    styles, class_sets = texts
    rules = {key: next(iter(found)) for key, found in styles.items()
             if len(found) == 1 and None not in found}
    while dropped := {(cls, prop) for cls, prop in rules if any(
            cls < other and (other, prop) not in rules for other in class_sets)}:
        rules = {key: value for key, value in rules.items() if key not in dropped}
    return rules


def _style_sheet(rules: dict[tuple[frozenset, str], str]) -> tuple[str, str]:
    """(root id, CSS): one rule `text.a.b{prop:value;...}` per class set, scoped to this chart:
    a <style> in an SVG inlined in an HTML page applies to the whole page, so an unscoped
    `text.label` rule would restyle the other charts there. The id comes from the rules, so
    charts whose rules differ never share one, and the same chart always gets the same id."""
    declarations: dict[frozenset, list[str]] = {}
    for (classes, prop), value in sorted(rules.items(), key=lambda rule: rule[0][1]):
        declarations.setdefault(classes, []).append(f"{prop}:{value}")
    selected = [(f"text.{'.'.join(sorted(classes))}", ";".join(declarations[classes]))
                for classes in sorted(declarations, key=lambda c: (len(c), sorted(c)))]
    text = "".join(f"{selector}{{{body}}}" for selector, body in selected)
    root_id = f"{ROOT_ID_PREFIX}{hashlib.sha256(text.encode()).hexdigest()[:12]}"
    return root_id, "".join(f"#{root_id} {selector}{{{body}}}" for selector, body in selected)


# --- gradients ------------------------------------------------------------------------------

def _gradient_key(rect: GradientRect) -> tuple[tuple, str]:
    """(key, colour): identical fades (one colour, any case, and the same per-mille stops)
    share one <linearGradient>; the colour as the first rect of a fade spells it."""
    colour = _colour(rect.fill)
    if rect.stops:
        return (colour.lower(), tuple(_per_mille(value) for value in rect.stops)), colour
    return (colour.lower(), _per_mille(rect.opacity_left), _per_mille(rect.opacity_right)), colour


def _gradient_name(key: tuple) -> str:
    """A short id that still spells out its fade: the colour's hex digits (a CSS name after a
    '-', which no hex digit is), then each per-mille opacity as two base-36 digits (1000 < 36²).
    Fringes repeat the id on every bar, so its length counts; and as it is one id per content,
    two charts inlined in one HTML page that both define it define the same fade. A fade
    through many stops is named by a digest of them."""
    if len(key) == 2:
        return f"{GRADIENT_ID_PREFIX}s{hashlib.sha256(repr(key).encode()).hexdigest()[:12]}"
    colour, left, right = key
    name = colour[1:] if colour.startswith("#") else f"-{colour}"
    return GRADIENT_ID_PREFIX + name + "".join(
        _BASE36[digit] for value in (left, right) for digit in divmod(value, 36))


def _stops(key: tuple) -> list[tuple[str, int]]:
    """(offset, per-mille opacity) of each stop of a fade: its two ends, or its many stops
    spaced evenly from the left edge to the right."""
    if len(key) == 3:
        return [("0", key[1]), ("1", key[2])]
    last = len(key[1]) - 1
    return [(_number(index / last, 4), value) for index, value in enumerate(key[1])]


def _write_gradients(writer: XMLWriter, gradients: dict[tuple, tuple[str, str]]) -> None:
    """<defs> with one left-to-right <linearGradient> per fade, in order of first use."""
    writer.start("defs")
    for key, (gradient_id, colour) in gradients.items():
        writer.start("linearGradient", (("id", gradient_id), ("x1", "0"), ("x2", "1"),
                                        ("y1", "0"), ("y2", "0")))
        for offset, per_mille in _stops(key):
            writer.element("stop", (("offset", offset), ("stop-color", colour),
                                    ("stop-opacity", _number(per_mille / 1000, 3))))
        writer.end()
    writer.end()


# --- the primitives -------------------------------------------------------------------------

def _draw_rect(rect: Rect, context: _Context) -> None:
    if rect.width <= 0 or rect.height <= 0:
        return  # SVG draws nothing for a zero size and rejects a negative one
    (x, width), (y, height) = _extent(rect.x, rect.width), _extent(rect.y, rect.height)
    fill = _paint(rect.fill)
    stroke, stroke_width = _stroke(rect.stroke, rect.stroke_width)
    context.writer.element("rect", (
        ("class", _class(rect.css_class)), ("fill", fill), ("height", height),
        ("opacity", _opacity(rect.opacity)), ("stroke", stroke), ("stroke-width", stroke_width),
        ("width", width), ("x", x), ("y", y)))


def _draw_gradient_rect(rect: GradientRect, context: _Context) -> None:
    if rect.width <= 0 or rect.height <= 0:
        return  # a bounding-box gradient on a zero-width box is an error in SVG
    (x, width), (y, height) = _extent(rect.x, rect.width), _extent(rect.y, rect.height)
    fade = (rect.fill, rect.opacity_left, rect.opacity_right, tuple(rect.stops))
    fill = context.fills.get(fade)
    if fill is None:    # not drawn before: find its gradient (the colour checked once)
        fill = context.fills[fade] = f"url(#{context.gradients[_gradient_key(rect)[0]]})"
    context.writer.element("rect", (
        ("class", _class(rect.css_class)), ("fill", fill), ("height", height),
        ("width", width), ("x", x), ("y", y)))


def _draw_line(line: Line, context: _Context) -> None:
    x1, y1 = _coordinate(line.x1), _coordinate(line.y1)
    x2, y2 = _coordinate(line.x2), _coordinate(line.y2)
    stroke, stroke_width = _stroke(line.stroke, line.stroke_width)
    dash = " ".join(_number(d) for d in line.dash) if line.dash else None
    context.writer.element("line", (
        ("class", _class(line.css_class)), ("opacity", _opacity(line.opacity)),
        ("stroke", stroke), ("stroke-dasharray", dash), ("stroke-width", stroke_width),
        ("x1", x1), ("x2", x2), ("y1", y1), ("y2", y2)))


def _draw_polygon(polygon: Polygon, context: _Context) -> None:
    if not polygon.points:
        return
    points = " ".join(f"{_coordinate(x)},{_coordinate(y)}" for x, y in polygon.points)
    # an open polyline is stroke only
    fill = _paint(polygon.fill) if polygon.closed else "none"
    stroke, stroke_width = _stroke(polygon.stroke, polygon.stroke_width)
    context.writer.element("polygon" if polygon.closed else "polyline", (
        ("class", _class(polygon.css_class)), ("fill", fill),
        ("opacity", _opacity(polygon.opacity)), ("points", points), ("stroke", stroke),
        ("stroke-width", stroke_width)))


def _draw_text(text: Text, context: _Context) -> None:
    content = drawable_text(text.text)
    if not content:
        return
    if context.outlines:
        _draw_text_outline(text, content, context)
        return
    x, y, size = _coordinate(text.x), _coordinate(text.y), _number(text.size)
    css_class = _class(text.css_class)
    fill, weight, style, anchor = _text_styles(text)
    if context.rules:       # presentation a style rule gives this text's classes is left off
        classes = _class_set(text.css_class)
        fill, weight, style, anchor = (
            None if (classes, prop) in context.rules else value
            for prop, value in zip(_TEXT_STYLES, (fill, weight, style, anchor)))
    context.writer.element("text", (
        ("class", css_class), ("fill", fill), ("font-size", size), ("font-style", style),
        ("font-weight", weight), ("text-anchor", anchor), ("x", x), ("y", y)),
        _isolated(content))


def _text_styles(text: Text) -> tuple[str | None, ...]:
    """The presentation attributes of a text in _TEXT_STYLES order, None where it keeps SVG's
    initial value (left out to keep large charts small)."""
    anchor = _choice(text.anchor, ("start", "middle", "end")) if text.anchor != "start" else None
    weight = _choice(text.weight, ("normal", "bold")) if text.weight != "normal" else None
    style = (_choice(text.style, ("normal", "italic", "oblique"))
             if text.style != "normal" else None)
    fill = None if text.fill.lower() in _BLACK else _colour(text.fill)
    return fill, weight, style, anchor


def _draw_text_outline(text: Text, content: str, context: _Context) -> None:
    from .outlines import outliner  # fontTools only when outlines are asked for

    weight = _choice(text.weight, ("normal", "bold"))
    anchor = _choice(text.anchor, ("start", "middle", "end"))
    data = outliner(weight).path_data(content, text.x, text.y, text.size, anchor,
                                      context.font_family)
    if not data:
        return     # only spaces
    fill = None if text.fill.lower() in _BLACK else _colour(text.fill)
    context.writer.element("path", (
        ("class", _class(text.css_class)), ("d", data), ("fill", fill)))


def _draw_group(group: Group, context: _Context) -> None:
    writer = context.writer
    group_id = f"{clean_text(group.id)}-{context.id_suffix}" if group.id else None
    writer.start("g", (("class", _class(group.css_class)), ("id", group_id)))
    if group.title:
        writer.element("title", (), clean_text(group.title))  # the record's tooltip
    for child in group.children:
        _DRAW[type(child)](child, context)
    writer.end()


_DRAW = {
    Rect: _draw_rect,
    GradientRect: _draw_gradient_rect,
    Line: _draw_line,
    Polygon: _draw_polygon,
    Text: _draw_text,
    Group: _draw_group,
}


# --- values ---------------------------------------------------------------------------------

def _stroke(stroke: str | None, width: float) -> tuple[str | None, str | None]:
    if stroke is not None and width > 0:
        return _colour(stroke), _number(width)
    return None, None


def _opacity(opacity: float) -> str | None:
    return _number(max(opacity, 0.0), 3) if opacity < 1 else None


# A chart repeats a few class lists on every record: each is cleaned once.
@functools.lru_cache(maxsize=1024)
def _class(css_class: str) -> str:
    """The class attribute's value: the scene's class list, cleaned."""
    return clean_text(css_class) if css_class else ""


@functools.lru_cache(maxsize=1024)
def _class_set(css_class: str) -> frozenset:
    return frozenset(_class(css_class).split())


def font_family_list(font_family: str) -> str:
    """The scene's families, then the default fallback list our own renderers use (so a
    browser falls back to the fonts the text was measured with), ending in a generic one."""
    names = [_FONT_NAME_UNSAFE.sub("", name).strip() for name in font_list(font_family)]
    names += FONT_FALLBACKS
    return ", ".join(dict.fromkeys(name for name in names if name))


def _isolated(content: str) -> str:
    """Text holding right-to-left characters inside FIRST STRONG ISOLATE ... POP DIRECTIONAL
    ISOLATE (UAX #9, 2.4): a browser then sets its direction from its first strong character
    as our shaping does (P2-P3), while the SVG's own direction, and so its anchors, stay
    left to right."""
    if any(unicodedata.bidirectional(c) in _RTL_CLASSES for c in content):
        return f"\u2068{content}\u2069"
    return content


def _paint(colour: str | None) -> str:
    return "none" if colour is None else _colour(colour)


def _colour(colour: str) -> str:
    if not isinstance(colour, str) or not _COLOUR.fullmatch(colour):
        raise ValueError(f"not a colour: {colour!r} (expected #rrggbb, #rgb or a CSS name)")
    return colour


def _choice(value: str, allowed: tuple[str, ...]) -> str:
    if value not in allowed:
        raise ValueError(f"{value!r} is not one of {', '.join(allowed)}")
    return value


def _per_mille(opacity: float) -> int:
    return round(min(max(opacity, 0.0), 1.0) * 1000)


def _extent(start: float, size: float) -> tuple[str, str]:
    """(start, size) with both edges rounded to COORDINATE_DECIMALS, so abutting shapes still
    meet; a size that would round away keeps two decimals and is not lost."""
    low, high = round(start, COORDINATE_DECIMALS), round(start + size, COORDINATE_DECIMALS)
    if high - low <= 0:
        return _number(start, 2), _number(size, 2)
    return _coordinate(low), _coordinate(high - low)


def _coordinate(value: float) -> str:
    return _number(value, COORDINATE_DECIMALS)


def _number(value: float, decimals: int = 2) -> str:
    """`value` with at most `decimals` decimals, trailing zeros and '-0' removed."""
    if not math.isfinite(value):
        raise ValueError(f"cannot draw a coordinate of {value!r}")
    text = f"{value:.{decimals}f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text
