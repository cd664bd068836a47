"""Scene -> SVG with svgwrite: small, deterministic, accessible, safe to embed.

One `_draw_<kind>` per primitive, chosen from a dispatch table. Coordinates are written with one
decimal, sizes of strokes and fonts with two, opacities with three, so the same scene always gives
the same bytes. To keep large charts small, presentation every text of a class shares becomes one
<style> rule scoped to the chart, and the fade most shapes of a top-level <g> share is set once on
that <g>; every element keeps its class. Every user string is escaped by ElementTree (through
svgwrite) and cleaned of characters XML 1.0 forbids; colours are checked, so a scene can never
smuggle in script, event handlers or an external reference. This module never imports
matplotlib: the SVG path must start fast.
"""
from __future__ import annotations

import hashlib
import math
import re
import unicodedata
from dataclasses import dataclass, field
from pathlib import Path
from xml.etree import ElementTree

import svgwrite
from svgwrite.base import Desc, Title

from timelines.scene.fonts import font_list
from timelines.scene.primitives import (
    TEXT_MODES, GradientRect, Group, Line, Polygon, Rect, Scene, Text, clean_text, drawable_text,
)

# The chart's <title> and <desc> ids: these prefixes and a digest of the two texts, so that
# two different charts inlined in one HTML page do not share an id (the same chart always
# gets the same ids).
TITLE_ID = "timelines-title-"
DESC_ID = "timelines-desc-"
ROOT_ID_PREFIX = "timelines-chart-"     # the root's id, when it has a style sheet to scope
GRADIENT_ID_PREFIX = "f"                # scene ids are group-N and panel-N: no clash
# Root attributes svgwrite always writes and nothing here needs: no element uses a name in the
# xlink or xml-events namespace (no href, no handlers), and baseProfile is metadata without any
# processing restriction, absent meaning "none" (SVG 1.1 Second Edition, the 'svg' element;
# SVG 2 drops it; MDN's baseProfile page).
_UNUSED_ROOT_ATTRIBUTES = ("xmlns:xlink", "xmlns:ev", "baseProfile")
_BASE36 = "0123456789abcdefghijklmnopqrstuvwxyz"
# Metric-compatible fallbacks after the scene's font, so text measured for DejaVu Sans fits.
FONT_FALLBACKS = ("Bitstream Vera Sans", "sans-serif")
_RTL_CLASSES = frozenset({"R", "AL", "AN"})   # UAX #9 bidirectional classes of RTL text
XML_DECLARATION = '<?xml version="1.0" encoding="utf-8"?>\n'

# Hex colours and CSS colour keywords only: nothing that could be url(...) or a script.
_COLOUR = re.compile(r"#[0-9a-fA-F]{3}(?:[0-9a-fA-F]{3})?|[a-zA-Z]{1,40}")
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


def render_svg(scene: Scene, *, text: str = "text") -> str:
    """The scene as a complete SVG document (with XML declaration).

    `text="paths"` draws every text as glyph outlines instead of `<text>` (for print shops
    without the font); labels stay readable in each record's `<title>`."""
    digest = _chart_digest(scene)
    context = _Context(_new_drawing(scene, digest),
                       outlines=_choice(text, TEXT_MODES) == "paths", id_suffix=digest,
                       font_family=scene.font_family)
    for item in scene.children:
        _draw_into(context.drawing, item, context)
    if not context.gradients:
        context.drawing.elements.remove(context.drawing.defs)
    rules = _text_style_rules(context.texts)
    if rules:
        context.drawing["id"], sheet = _style_sheet(rules)
        heading = sum(isinstance(e, Title) for e in context.drawing.elements[:3])
        context.drawing.elements.insert(heading, _StyleSheet(sheet))
    return XML_DECLARATION + _serialise(context.drawing) + "\n"


def _serialise(drawing: svgwrite.Drawing) -> str:
    """The drawing's XML as svgwrite builds it, less the root attributes nothing uses."""
    root = drawing.get_xml()
    for name in _UNUSED_ROOT_ATTRIBUTES:
        root.attrib.pop(name, None)
    # ElementTree writes empty elements as "<x />"; "/>" is the same XML. Text and attribute
    # values have ">" escaped, so the replacement can only meet the ends of tags.
    return ElementTree.tostring(root, encoding="unicode").replace(" />", "/>")


def write_svg(scene: Scene, path: str | Path, *, text: str = "text") -> None:
    """Write the scene to `path` as UTF-8 SVG with LF line ends on every platform."""
    Path(path).write_bytes(render_svg(scene, text=text).encode("utf-8"))


@dataclass(slots=True)
class _Context:
    """The drawing being built and the gradients already defined in it (key -> id)."""

    drawing: svgwrite.Drawing
    gradients: dict[tuple[str, int, int], str] = field(default_factory=dict)
    outlines: bool = False          # draw text as glyph outlines
    texts: list = field(default_factory=list)       # the <text> elements, for _text_style_rules
    id_suffix: str = ""             # ends every scene id (_chart_digest)
    font_family: str | None = None  # the scene's families, for text drawn as outlines


def _new_drawing(scene: Scene, digest: str) -> svgwrite.Drawing:
    width, height = _number(scene.width), _number(scene.height)
    drawing = svgwrite.Drawing(
        size=(width, height), viewBox=f"0 0 {width} {height}", profile="full", debug=False,
    )
    drawing["role"] = "img"
    drawing["font-family"] = font_family_list(scene.font_family)
    _describe_chart(drawing, scene, digest)
    if scene.background is not None:
        drawing.add(drawing.rect(
            size=(width, height), fill=_colour(scene.background), class_="background",
        ))
    return drawing


def _describe_chart(drawing: svgwrite.Drawing, scene: Scene, digest: str) -> None:
    """Chart-level <title>/<desc> first in the root, named by aria-labelledby (SVG-AAM); their
    ids end with the chart's digest."""
    labels = [TITLE_ID + digest]
    title = Title(clean_text(scene.title))
    title.xml.set("id", labels[0])
    drawing.elements.insert(0, title)
    if scene.desc:
        desc = Desc(clean_text(scene.desc))
        labels.append(DESC_ID + digest)
        desc.xml.set("id", labels[1])
        drawing.elements.insert(1, desc)
    drawing["aria-labelledby"] = " ".join(labels)
    if scene.metadata:
        lines = (f"{clean_text(key)}: {clean_text(value)}" for key, value in scene.metadata)
        drawing.elements.insert(len(labels), _MetadataText("\n".join(lines)))


def _chart_digest(scene: Scene) -> str:
    """Ten hex digits from the chart's title and description, ending the ids of its elements:
    an HTML page holding two charts inline has one id space for both."""
    text = f"{clean_text(scene.title)}\0{clean_text(scene.desc or '')}"
    return hashlib.sha256(text.encode()).hexdigest()[:10]


class _MetadataText(Title):
    """<metadata> as plain `key: value` lines: readable, and no foreign namespace needed."""

    elementname = "metadata"


class _StyleSheet(Title):
    """<style> with CSS rules only this module writes (classes and checked values)."""

    elementname = "style"


def _style_sheet(rules: list[tuple[str, str]]) -> tuple[str, str]:
    """(root id, CSS) with every rule scoped to this chart: a <style> in an SVG inlined in an
    HTML page applies to the whole page, so an unscoped `text.label` rule would restyle the
    other charts there. The id comes from the rules, so charts whose rules differ never share
    one, and the same chart always gets the same id."""
    text = "".join(f"{selector}{{{declarations}}}" for selector, declarations in rules)
    root_id = f"{ROOT_ID_PREFIX}{hashlib.sha256(text.encode()).hexdigest()[:12]}"
    return root_id, "".join(f"#{root_id} {selector}{{{declarations}}}"
                            for selector, declarations in rules)


def _text_style_rules(texts: list) -> list[tuple[str, str]]:
    """(selector `text.a.b`, declarations `prop:value;...`) for the presentation every text of
    class "a b" shares, with those attributes taken off the texts. A rule for classes T also
    matches texts whose classes include T; those must then have their own, more specific rule
    for that property (CSS 2.1 section 6.4.3: more classes win), else the rule is dropped."""
    rules = _shared_text_styles(texts)
    classes = {_class_set(text) for text in texts}
    while dropped := {(cls, prop) for cls, prop in rules if any(
            cls < other and (other, prop) not in rules for other in classes)}:
        rules = {key: value for key, value in rules.items() if key not in dropped}
    for text in texts:
        for prop in _TEXT_STYLES:
            if (_class_set(text), prop) in rules:
                del text.attribs[prop]
    declarations: dict[frozenset, list[str]] = {}
    for (classes, prop), value in sorted(rules.items(), key=lambda rule: rule[0][1]):
        declarations.setdefault(classes, []).append(f"{prop}:{value}")
    return [(f"text.{'.'.join(sorted(classes))}", ";".join(declarations[classes]))
            for classes in sorted(declarations, key=lambda c: (len(c), sorted(c)))]


def _shared_text_styles(texts: list) -> dict[tuple[frozenset, str], str]:
    """(classes, property) -> value, where every text of those classes sets that value."""
    values: dict[tuple[frozenset, str], set] = {}
    for text in texts:
        classes = _class_set(text)
        if classes and all(_CSS_IDENT.fullmatch(name) for name in classes):
            for prop in _TEXT_STYLES:
                values.setdefault((classes, prop), set()).add(text.attribs.get(prop))
    return {key: found.pop() for key, found in values.items()
            if len(found) == 1 and None not in found}


def _class_set(element) -> frozenset:
    return frozenset(element.attribs.get("class", "").split())


def _draw_into(parent, item, context: _Context) -> None:
    element = _DRAW[type(item)](item, context)
    if element is not None:
        parent.add(element)


def _draw_rect(rect: Rect, context: _Context):
    if rect.width <= 0 or rect.height <= 0:
        return None  # SVG draws nothing for a zero size and rejects a negative one
    (x, width), (y, height) = _extent(rect.x, rect.width), _extent(rect.y, rect.height)
    element = context.drawing.rect(
        insert=(x, y), size=(width, height),
        fill=_paint(rect.fill),
    )
    _set_stroke(element, rect.stroke, rect.stroke_width)
    _set_common(element, rect.opacity, rect.css_class)
    return element


def _draw_gradient_rect(rect: GradientRect, context: _Context):
    if rect.width <= 0 or rect.height <= 0:
        return None  # a bounding-box gradient on a zero-width box is an error in SVG
    (x, width), (y, height) = _extent(rect.x, rect.width), _extent(rect.y, rect.height)
    element = context.drawing.rect(
        insert=(x, y), size=(width, height),
        fill=f"url(#{_gradient_id(rect, context)})",
    )
    _set_common(element, 1.0, rect.css_class)
    return element


def _gradient_id(rect: GradientRect, context: _Context) -> str:
    """One <linearGradient> per (colour, left, right opacity): identical fades share a def.
    A fade through many stops is named by a digest of them."""
    colour = _colour(rect.fill)
    if rect.stops:
        return _stops_gradient_id(colour, rect.stops, context)
    key = (colour.lower(), _per_mille(rect.opacity_left), _per_mille(rect.opacity_right))
    if key not in context.gradients:
        gradient_id = _gradient_name(*key)
        gradient = context.drawing.linearGradient(start=(0, 0), end=(1, 0), id=gradient_id)
        gradient.add_stop_color(0, colour, _number(key[1] / 1000, 3))
        gradient.add_stop_color(1, colour, _number(key[2] / 1000, 3))
        context.drawing.defs.add(gradient)
        context.gradients[key] = gradient_id
    return context.gradients[key]


def _stops_gradient_id(colour: str, stops: tuple[float, ...], context: _Context) -> str:
    per_mille = tuple(_per_mille(value) for value in stops)
    key = (colour.lower(), per_mille)
    if key not in context.gradients:
        digest = hashlib.sha256(repr(key).encode()).hexdigest()[:12]
        gradient_id = f"{GRADIENT_ID_PREFIX}s{digest}"
        gradient = context.drawing.linearGradient(start=(0, 0), end=(1, 0), id=gradient_id)
        last = len(per_mille) - 1
        for index, value in enumerate(per_mille):
            gradient.add_stop_color(_number(index / last, 4), colour, _number(value / 1000, 3))
        context.drawing.defs.add(gradient)
        context.gradients[key] = gradient_id
    return context.gradients[key]


def _gradient_name(colour: str, left: int, right: int) -> str:
    """A short id that still spells out its fade: the colour's hex digits (a CSS name after a
    '-', which no hex digit is), then each per-mille opacity as two base-36 digits (1000 < 36²).
    Fringes repeat the id on every bar, so its length counts; and as it is one id per content,
    two charts inlined in one HTML page that both define it define the same fade."""
    name = colour[1:] if colour.startswith("#") else f"-{colour}"
    return GRADIENT_ID_PREFIX + name + "".join(
        _BASE36[digit] for value in (left, right) for digit in divmod(value, 36))


def _draw_line(line: Line, context: _Context):
    element = context.drawing.line(
        start=(_coordinate(line.x1), _coordinate(line.y1)),
        end=(_coordinate(line.x2), _coordinate(line.y2)),
    )
    _set_stroke(element, line.stroke, line.stroke_width)
    if line.dash:
        element["stroke-dasharray"] = " ".join(_number(d) for d in line.dash)
    _set_common(element, line.opacity, line.css_class)
    return element


def _draw_polygon(polygon: Polygon, context: _Context):
    if not polygon.points:
        return None
    points = [(_coordinate(x), _coordinate(y)) for x, y in polygon.points]
    if polygon.closed:
        element = context.drawing.polygon(points, fill=_paint(polygon.fill))
    else:
        element = context.drawing.polyline(points, fill="none")  # an open polyline is stroke only
    _set_stroke(element, polygon.stroke, polygon.stroke_width)
    _set_common(element, polygon.opacity, polygon.css_class)
    return element


def _draw_text(text: Text, context: _Context):
    content = drawable_text(text.text)
    if not content:
        return None
    if context.outlines:
        return _draw_text_outline(text, content, context)
    element = context.drawing.text(
        _isolated(content), insert=(_coordinate(text.x), _coordinate(text.y)), font_size=_number(text.size),
    )
    # Defaults are left out (SVG's own initial values) to keep large charts small.
    if text.anchor != "start":
        element["text-anchor"] = _choice(text.anchor, ("start", "middle", "end"))
    if text.weight != "normal":
        element["font-weight"] = _choice(text.weight, ("normal", "bold"))
    if text.style != "normal":
        element["font-style"] = _choice(text.style, ("normal", "italic", "oblique"))
    if text.fill.lower() not in ("#000000", "#000", "black"):
        element["fill"] = _colour(text.fill)
    _set_common(element, 1.0, text.css_class)
    context.texts.append(element)
    return element


def _draw_text_outline(text: Text, content: str, context: _Context):
    from .outlines import outliner  # fontTools only when outlines are asked for

    weight = _choice(text.weight, ("normal", "bold"))
    anchor = _choice(text.anchor, ("start", "middle", "end"))
    data = outliner(weight).path_data(content, text.x, text.y, text.size, anchor,
                                      context.font_family)
    if not data:
        return None     # only spaces
    element = context.drawing.path(d=data)
    if text.fill.lower() not in ("#000000", "#000", "black"):
        element["fill"] = _colour(text.fill)
    _set_common(element, 1.0, text.css_class)
    return element


def _draw_group(group: Group, context: _Context):
    element = context.drawing.g()
    _set_common(element, 1.0, group.css_class)
    if group.id:
        element["id"] = f"{clean_text(group.id)}-{context.id_suffix}"
    if group.title:
        element.elements.append(Title(clean_text(group.title)))  # the record's tooltip
    for child in group.children:
        _draw_into(element, child, context)
    return element


_DRAW = {
    Rect: _draw_rect,
    GradientRect: _draw_gradient_rect,
    Line: _draw_line,
    Polygon: _draw_polygon,
    Text: _draw_text,
    Group: _draw_group,
}


def _set_stroke(element, stroke: str | None, width: float) -> None:
    if stroke is not None and width > 0:
        element["stroke"] = _colour(stroke)
        element["stroke-width"] = _number(width)


def _set_common(element, opacity: float, css_class: str) -> None:
    if opacity < 1:
        element["opacity"] = _number(max(opacity, 0.0), 3)
    if css_class:
        element["class"] = clean_text(css_class)


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
