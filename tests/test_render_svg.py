"""The SVG renderer, read back with ElementTree: structure, accessibility, determinism, safety."""
from __future__ import annotations

import datetime
import os
import re
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from timelines.scene.fonts import DEFAULT_FONTS
from timelines.render.svg import (
    DESC_ID, TITLE_ID, drawable_text, font_family_list, render_svg, write_svg,
)
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Scene, Text

SVG = "{http://www.w3.org/2000/svg}"
HERE = Path(__file__).resolve().parent


def parse(scene: Scene) -> ET.Element:
    return ET.fromstring(render_svg(scene))


def scene_of(*children, **options) -> Scene:
    return Scene(400, 200, tuple(children), **options)


def drawn(root: ET.Element, tag: str) -> list[ET.Element]:
    return list(root.iter(SVG + tag))


def sample_scene() -> Scene:
    bar = Group(
        (
            GradientRect(10, 20, 30, 12, "#0072B2", 0.0, 1.0, css_class="fringe start"),
            Rect(40, 20, 100, 12, fill="#0072B2", css_class="core"),
            GradientRect(140, 20, 25, 12, "#0072B2", 1.0, 0.0, css_class="fringe end"),
            Text(170, 30, "Orla Fenwick", size=12, css_class="label"),
        ),
        css_class="record", title="Orla Fenwick: c. 1650 - 1702", id="record-1",
    )
    return scene_of(
        bar,
        Line(10, 180, 390, 180, stroke="#333333", stroke_width=1, dash=(4, 2), css_class="axis"),
        Polygon(((200, 100), (210, 90), (220, 100)), fill="#D55E00", css_class="marker"),
        Polygon(((230, 100), (240, 90), (250, 100)), closed=False, stroke="#000000",
                stroke_width=1.5, css_class="bracket"),
        Text(200, 195, "1700", size=10, anchor="middle", weight="bold", fill="#444444"),
        title="Guild of Lantern Makers", desc="Members of an invented guild, 1600-1750.",
    )


# --- the document -------------------------------------------------------------------------

def test_root_has_viewbox_and_size_in_page_units():
    # SVG 1.1 section 7.7: viewBox="min-x min-y width height" maps user units onto the viewport.
    root = parse(Scene(640.5, 300, ()))
    assert root.tag == SVG + "svg"
    assert root.get("viewBox") == "0 0 640.5 300"
    assert (root.get("width"), root.get("height")) == ("640.5", "300")


def test_document_starts_with_an_xml_declaration_and_ends_with_a_newline():
    text = render_svg(sample_scene())
    assert text.startswith('<?xml version="1.0" encoding="utf-8"?>\n<svg')
    assert text.endswith("</svg>\n")


def test_title_and_desc_name_the_chart_through_aria():
    # SVG-AAM 1.0 / WAI-ARIA 1.2: role="img" with aria-labelledby naming the <title> and <desc>
    # ids is the common pattern for a standalone accessible SVG (common practice, no source).
    root = parse(sample_scene())
    assert root.get("role") == "img"
    title, desc = root[0], root[1]
    assert root.get("aria-labelledby") == f"{title.get('id')} {desc.get('id')}"
    assert (title.tag, title.text) == (SVG + "title", "Guild of Lantern Makers")
    assert (desc.tag, desc.text) == (SVG + "desc", "Members of an invented guild, 1600-1750.")
    assert title.get("id").startswith(TITLE_ID) and desc.get("id").startswith(DESC_ID)


def test_without_a_desc_only_the_title_is_referenced():
    root = parse(scene_of(title="Only a title"))
    assert root.get("aria-labelledby") == root[0].get("id")
    assert root[0].get("id").startswith(TITLE_ID)
    assert not drawn(root, "desc")


def test_two_charts_inlined_in_one_page_do_not_share_ids():
    # An HTML page holding two inline SVGs has one id space (HTML Living Standard, the id
    # attribute: unique in the element's tree).
    first = parse(scene_of(Group((), id="group-1"), title="North yard"))
    second = parse(scene_of(Group((), id="group-1"), title="South yard"))
    ids = lambda root: {e.get("id") for e in root.iter() if e.get("id")}  # noqa: E731
    assert not (ids(first) & ids(second)) - {None}
    assert parse(scene_of(title="North yard"))[0].get("id") == first[0].get("id")


def test_every_aria_reference_resolves_to_an_element():
    root = parse(sample_scene())
    ids = {element.get("id") for element in root.iter() if element.get("id")}
    assert set(root.get("aria-labelledby").split()) <= ids


def test_font_family_is_set_once_on_the_root_starting_with_the_scene_font():
    root = parse(scene_of(Text(0, 10, "a"), font_family="DejaVu Sans"))
    assert root.get("font-family") == ", ".join((*DEFAULT_FONTS, "Bitstream Vera Sans",
                                                 "sans-serif"))
    assert [e for e in root.iter() if e is not root and e.get("font-family")] == []
    assert font_family_list("Fira Sans").startswith("Fira Sans, DejaVu Sans, ")


def test_font_family_cannot_break_out_of_its_attribute_value():
    assert font_family_list('Evil"; fill:url(http://x)').startswith(
        "Evil fillurlhttpx, DejaVu Sans, Noto Sans, ")


def test_background_is_a_full_page_rect_or_absent():
    root = parse(scene_of(background="#fafafa"))
    background = [r for r in drawn(root, "rect") if r.get("class") == "background"]
    assert [(r.get("width"), r.get("height"), r.get("fill")) for r in background] == [
        ("400", "200", "#fafafa")]
    assert not drawn(parse(scene_of(background=None)), "rect")


def test_root_declares_only_what_the_document_uses():
    # No element uses an xlink or xml-events name (no href, no handlers: see the hostile-text
    # tests), and baseProfile is optional metadata, absent meaning "none" (SVG 1.1 Second
    # Edition, the 'svg' element; MDN's baseProfile page), so none of them is written.
    output = render_svg(sample_scene())
    root_tag = output[output.index("<svg"):output.index(">", output.index("<svg")) + 1]
    assert 'xmlns="http://www.w3.org/2000/svg"' in root_tag and 'version="1.1"' in root_tag
    assert not re.search(r"xmlns:|baseProfile", output)


def test_metadata_is_written_as_text():
    root = parse(scene_of(metadata=(("generator", "timelines 0.1.0"), ("source", "guild.csv"))))
    assert drawn(root, "metadata")[0].text == "generator: timelines 0.1.0\nsource: guild.csv"


# --- primitives ---------------------------------------------------------------------------

def test_rect_attributes_and_class():
    root = parse(scene_of(
        Rect(1.5, 2, 30.25, 4, fill="#112233", stroke="#445566", stroke_width=0.5, opacity=0.4,
             css_class="core certain"), background=None))
    (rect,) = drawn(root, "rect")
    assert rect.attrib == {
        # the right edge 31.75 rounds to 31.8 (one decimal): width 30.3, not 30.25 rounded alone
        "x": "1.5", "y": "2", "width": "30.3", "height": "4", "fill": "#112233",
        "stroke": "#445566", "stroke-width": "0.5", "opacity": "0.4", "class": "core certain",
    }


def test_rect_without_fill_is_fill_none_and_empty_rects_are_skipped():
    root = parse(scene_of(Rect(0, 0, 10, 10, fill=None, stroke="#000000", stroke_width=1),
                          Rect(5, 5, 0, 10), Rect(5, 5, 10, -1), background=None))
    assert [r.get("fill") for r in drawn(root, "rect")] == ["none"]


def test_gradient_is_a_bounding_box_linear_gradient_left_to_right():
    # SVG 1.1 section 13.2.2: gradientUnits defaults to objectBoundingBox, so x1=0 x2=1 runs
    # from the rect's left edge to its right edge whatever its size.
    root = parse(scene_of(GradientRect(10, 10, 50, 8, "#0072B2", 0.25, 1.0)))
    (gradient,) = drawn(root, "linearGradient")
    assert gradient.get("gradientUnits") in (None, "objectBoundingBox")
    assert [gradient.get(k) for k in ("x1", "y1", "x2", "y2")] == ["0", "0", "1", "0"]
    stops = [(s.get("offset"), s.get("stop-color"), s.get("stop-opacity")) for s in gradient]
    assert stops == [("0", "#0072B2", "0.25"), ("1", "#0072B2", "1")]
    (rect,) = [r for r in drawn(root, "rect") if r.get("class") != "background"]
    assert rect.get("fill") == f"url(#{gradient.get('id')})"


def test_gradients_live_in_defs_and_identical_fades_share_one():
    fade = GradientRect(0, 0, 10, 10, "#0072B2", 1.0, 0.0)
    root = parse(scene_of(
        fade, GradientRect(50, 50, 30, 5, "#0072B2", 1.0, 0.0),
        GradientRect(0, 20, 10, 10, "#0072B2", 0.0, 1.0),
        GradientRect(0, 40, 10, 10, "#E69F00", 1.0, 0.0),
    ))
    (defs,) = drawn(root, "defs")
    ids = [g.get("id") for g in defs]
    assert len(ids) == 3 == len(set(ids))
    fills = [r.get("fill") for r in drawn(root, "rect") if r.get("class") != "background"]
    assert fills[0] == fills[1] != fills[2] != fills[3]
    assert {f[len("url(#"):-1] for f in fills} == set(ids)


def test_gradient_ids_do_not_depend_on_drawing_order():
    first = GradientRect(0, 0, 10, 10, "#0072B2", 1.0, 0.0)
    second = GradientRect(0, 20, 10, 10, "#E69F00", 0.0, 0.5)
    forward = {g.get("id") for g in drawn(parse(scene_of(first, second)), "linearGradient")}
    backward = {g.get("id") for g in drawn(parse(scene_of(second, first)), "linearGradient")}
    assert forward == backward


def decoded_gradient_id(gradient_id: str) -> tuple[str, float, float]:
    """(colour, left opacity, right opacity) read back from a gradient id."""
    assert gradient_id.startswith("f")
    colour = gradient_id[1:-4].lstrip("-") if "-" in gradient_id else "#" + gradient_id[1:-4]
    left, right = (int(digits, 36) / 1000 for digits in (gradient_id[-4:-2], gradient_id[-2:]))
    return colour, left, right


def test_a_gradient_id_is_short_and_spells_out_its_fade():
    # The id is a function of the fade alone, so it can be decoded back into its stops: two
    # charts inlined in one HTML page that both define an id define the same fade.
    opacities = [0.0, 0.001, 0.035, 0.036, 0.12, 0.5, 0.999, 1.0]
    kinds = [(c, a, b) for c in ("#0072B2", "#abc", "teal") for a in opacities for b in opacities]
    fades = [GradientRect(0, 10 * i, 10, 5, *kind) for i, kind in enumerate(kinds)]
    root = parse(scene_of(*fades))
    gradients = drawn(root, "linearGradient")
    assert len(gradients) == len(fades)
    for gradient in gradients:
        colour, left, right = decoded_gradient_id(gradient.get("id"))
        stops = [(s.get("stop-color").lower(), float(s.get("stop-opacity"))) for s in gradient]
        assert stops == [(colour, left), (colour, right)]
    assert len(gradients[0].get("id")) <= 11     # a hex colour's id: f + 6 + 4 characters


def test_zero_width_gradient_rect_is_skipped_with_no_defs_left_over():
    root = parse(scene_of(GradientRect(10, 10, 0, 8, "#0072B2", 0.0, 1.0), background=None))
    assert not drawn(root, "rect") and not drawn(root, "defs")


def test_group_carries_class_id_and_a_title_tooltip_first():
    root = parse(sample_scene())
    (group,) = drawn(root, "g")
    # the scene's id, ended by the chart's digest (ids stay unique with two charts inline)
    assert group.get("class") == "record"
    assert re.fullmatch(r"record-1-[0-9a-f]{10}", group.get("id"))
    assert group[0].tag == SVG + "title"
    assert group[0].text == "Orla Fenwick: c. 1650 - 1702"
    assert [child.tag[len(SVG):] for child in group[1:]] == ["rect", "rect", "rect", "text"]


def test_group_without_title_has_no_title_child():
    root = parse(scene_of(Group((Rect(0, 0, 5, 5),), css_class="lane")))
    (group,) = drawn(root, "g")
    assert not drawn(group, "title")


def test_text_attributes():
    root = parse(sample_scene())
    label, tick = drawn(root, "text")
    assert label.attrib == {"x": "170", "y": "30", "font-size": "12", "class": "label"}
    assert label.text == "Orla Fenwick"
    assert tick.attrib == {
        "x": "200", "y": "195", "font-size": "10", "text-anchor": "middle",
        "font-weight": "bold", "fill": "#444444",
    }


def test_text_whitespace_is_collapsed_as_svg_would_display_it():
    root = parse(scene_of(Text(0, 10, "  two\tlines\nand  more  ", style="italic")))
    (text,) = drawn(root, "text")
    assert text.text == "two lines and more"
    assert text.get("font-style") == "italic"


def test_empty_text_is_not_drawn():
    assert not drawn(parse(scene_of(Text(0, 10, " \n\x00 "))), "text")


def test_line_with_dash_pattern():
    root = parse(sample_scene())
    (line,) = drawn(root, "line")
    assert line.attrib == {
        "x1": "10", "y1": "180", "x2": "390", "y2": "180", "stroke": "#333333",
        "stroke-width": "1", "stroke-dasharray": "4 2", "class": "axis",
    }


def test_closed_polygon_and_open_polyline():
    root = parse(sample_scene())
    (polygon,) = drawn(root, "polygon")
    assert (polygon.get("points"), polygon.get("fill")) == ("200,100 210,90 220,100", "#D55E00")
    (polyline,) = drawn(root, "polyline")
    assert polyline.get("fill") == "none"
    assert (polyline.get("stroke"), polyline.get("stroke-width")) == ("#000000", "1.5")


def test_numbers_are_compact():
    root = parse(scene_of(Rect(1 / 3, 2.0, 10.005, -0.001 + 1, opacity=0.12345),
                          Line(-0.001, 1e-9, 2.499, 7, stroke_width=1), background=None))
    (rect,), (line,) = drawn(root, "rect"), drawn(root, "line")
    assert (rect.get("x"), rect.get("y"), rect.get("height"), rect.get("opacity")) == (
        "0.3", "2", "1", "0.123")
    assert (line.get("x1"), line.get("y1"), line.get("x2")) == ("0", "0", "2.5")


def test_rect_edges_are_rounded_so_abutting_shapes_still_meet():
    # Three parts of one bar, touching at x = 10.26 and x = 30.34; each edge rounds to one
    # decimal on its own, so a part's right edge is exactly the next part's left edge.
    root = parse(scene_of(GradientRect(0.04, 0, 10.22, 5, "#0072B2", 0, 1),
                          Rect(10.26, 0, 20.08, 5, fill="#0072B2"),
                          GradientRect(30.34, 0, 4.43, 5, "#0072B2", 1, 0), background=None))
    edges = [(float(r.get("x")), float(r.get("x")) + float(r.get("width")))
             for r in drawn(root, "rect")]
    assert [round(e, 6) for edge in edges for e in edge] == [0, 10.3, 10.3, 30.3, 30.3, 34.8]
    for (low, high), exact in zip(edges, [(0.04, 10.26), (10.26, 30.34), (30.34, 34.77)],
                                  strict=True):
        assert abs(low - exact[0]) <= 0.05 + 1e-9 and abs(high - exact[1]) <= 0.05 + 1e-9


def test_a_sliver_narrower_than_the_rounding_is_kept():
    root = parse(scene_of(Rect(10.01, 0, 0.03, 5, fill="#000000"), background=None))
    (rect,) = drawn(root, "rect")
    assert (rect.get("x"), rect.get("width")) == ("10.01", "0.03")


def test_empty_elements_end_in_a_bare_slash():
    output = render_svg(sample_scene())
    assert " />" not in output and "/>" in output


def test_non_finite_coordinates_are_refused():
    with pytest.raises(ValueError, match="coordinate"):
        render_svg(scene_of(Rect(float("nan"), 0, 10, 10)))


@pytest.mark.parametrize("colour", [
    "url(http://example.invalid/x.svg#a)", "red;stroke:url(#x)", "#12345", "javascript:alert(1)",
])
def test_colours_that_are_not_colours_are_refused(colour):
    with pytest.raises(ValueError, match="not a colour"):
        render_svg(scene_of(Rect(0, 0, 10, 10, fill=colour)))


# --- compaction: style rules and inherited fades ------------------------------------------

def style_rules(root: ET.Element) -> dict[str, str]:
    """selector -> declarations of the chart's <style> (none: empty), each selector scoped to
    the root's id (checked here, then left off)."""
    sheets = drawn(root, "style")
    assert len(sheets) <= 1
    text = sheets[0].text if sheets else ""
    rules = re.findall(r"([^{}]+)\{([^{}]*)\}", text)
    assert all(selector.startswith(f"#{root.get('id')} ") for selector, _ in rules)
    return {selector.split(" ", 1)[1]: declarations for selector, declarations in rules}


def labelled_scene(extra=()) -> Scene:
    def record(y, text_class, fill):
        return Group((Rect(10, y, 50, 12, fill="#0072B2", css_class="core"),
                      Text(14, y + 10, f"Name {y}", size=12, fill=fill, css_class=text_class,
                           weight="bold")),
                     css_class="record", title=f"Name {y}\nwritten: c. 1650")
    return scene_of(record(10, "label", "#1a1a1a"), record(30, "label inside", "#ffffff"),
                    record(50, "label", "#1a1a1a"), *extra, background=None)


def test_presentation_a_class_shares_is_one_style_rule_and_off_the_texts():
    root = parse(labelled_scene())
    # CSS 2.1 section 6.4.3: text.inside.label (two classes) outranks text.label (one).
    assert style_rules(root) == {"text.label": "fill:#1a1a1a;font-weight:bold",
                                 "text.inside.label": "fill:#ffffff;font-weight:bold"}
    for text in drawn(root, "text"):
        assert text.get("fill") is None and text.get("font-weight") is None
        assert text.get("font-size") == "12"             # the size stays on every text
    assert [t.get("class") for t in drawn(root, "text")] == ["label", "label inside", "label"]


def test_style_rules_are_scoped_to_the_chart_by_an_id_made_from_them():
    # An SVG inlined in HTML shares one style sheet with the page (HTML Living Standard, the
    # style element): unscoped rules would restyle other charts on the same page.
    first, again = parse(labelled_scene()), parse(labelled_scene())
    dark = Text(0, 90, "x", fill="#222222", css_class="caption")
    other = parse(labelled_scene((dark,)))
    assert first.get("id") == again.get("id") != other.get("id")
    assert re.fullmatch(r"timelines-chart-[0-9a-f]{12}", first.get("id"))
    assert parse(scene_of(Text(0, 10, "plain"))).get("id") is None   # no rules, no id


def test_no_rule_for_a_class_when_a_wider_class_would_pick_it_up_wrongly():
    # "label note" texts differ in colour, so they get no rule of their own; a rule for
    # "label" would then colour them too, so "label" keeps its attributes as well.
    notes = (Text(0, 80, "a", fill="#123456", css_class="label note"),
             Text(0, 90, "b", fill="#654321", css_class="label note"))
    root = parse(labelled_scene(notes))
    assert style_rules(root) == {"text.inside.label": "fill:#ffffff;font-weight:bold"}
    assert [t.get("fill") for t in drawn(root, "text")] == [
        "#1a1a1a", None, "#1a1a1a", "#123456", "#654321"]


def test_a_class_where_one_text_keeps_the_initial_value_gets_no_rule():
    root = parse(scene_of(Text(0, 10, "a", fill="#1a1a1a", css_class="tick"),
                          Text(0, 20, "b", css_class="tick")))
    assert style_rules(root) == {}
    assert [t.get("fill") for t in drawn(root, "text")] == ["#1a1a1a", None]


@pytest.mark.parametrize("css_class", [
    "label x}text{fill:url(http://example.invalid/a)", "</style><script>alert(1)</script>",
    "label\u00e9", "1st",
])
def test_class_names_unsafe_in_a_selector_get_no_rule(css_class):
    output = render_svg(scene_of(Text(0, 10, "a", fill="#1a1a1a", css_class=css_class),
                                 Text(0, 20, "b", fill="#1a1a1a", css_class=css_class)))
    assert "<style" not in output and "<script" not in output
    assert [t.get("fill") for t in drawn(ET.fromstring(output), "text")] == ["#1a1a1a"] * 2


def test_text_as_paths_writes_no_style_rules():
    output = render_svg(labelled_scene(), text="paths")
    assert "<style" not in output
    assert {p.get("fill") for p in drawn(ET.fromstring(output), "path")} == {"#1a1a1a", "#ffffff"}


def bar(y, fill="#0072B2"):
    return (GradientRect(0, y, 5, 12, fill, 0.1, 1, css_class="fringe"),
            Rect(5, y, 40, 12, fill=fill, css_class="core"),
            GradientRect(45, y, 5, 12, fill, 1, 0.1, css_class="fringe"))


def test_no_fill_is_inherited_from_a_group_so_a_stripped_style_sheet_degrades_to_black():
    # Sanitisers in content systems often strip <style>; a text left without its rule must
    # then fall back to SVG's initial black, never inherit a fade from an enclosing <g>.
    block = Group((Group(bar(10), css_class="record", title="a"),
                   Group(bar(30), css_class="record", title="b")), css_class="group group-a")
    root = parse(scene_of(block, background=None))
    assert all(g.get("fill") is None for g in drawn(root, "g"))
    assert all(r.get("fill") for r in drawn(root, "rect"))


# --- determinism --------------------------------------------------------------------------

def test_same_scene_gives_the_same_bytes_twice(tmp_path):
    assert render_svg(sample_scene()) == render_svg(sample_scene())
    write_svg(sample_scene(), tmp_path / "a.svg")
    assert (tmp_path / "a.svg").read_bytes() == render_svg(sample_scene()).encode("utf-8")


def test_same_bytes_across_processes_with_different_hash_seeds():
    script = (
        "import hashlib, sys\n"
        f"sys.path[:0] = [{str(HERE)!r}, {str(HERE.parent)!r}]\n"
        "from test_render_svg import sample_scene\n"
        "from timelines.render.svg import render_svg\n"
        "print(hashlib.sha256(render_svg(sample_scene()).encode()).hexdigest())\n"
    )
    digests = set()
    for seed in ("1", "2"):
        done = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True,
                              env={**os.environ, "PYTHONHASHSEED": seed}, check=True)
        digests.add(done.stdout.strip())
    assert len(digests) == 1 and "" not in digests


def test_no_timestamps():
    text = render_svg(sample_scene())
    today = datetime.date.today()
    assert today.isoformat() not in text and str(today.year) not in text
    assert not re.search(r"\d{4}-\d\d-\d\dT|\d\d:\d\d:\d\d", text)


# --- hostile text -------------------------------------------------------------------------

HOSTILE = [
    "<script>alert(1)</script>",
    "javascript:alert(document.cookie)",
    "&amp; &lt; &#x3C; & < >",
    "\"double\" 'single' `back`",
    '" onload="alert(1)',
    "\u05e9\u05dc\u05d5\u05dd \u0645\u0631\u062d\u0628\u0627 \u202eevil\u202c",  # RTL, override
    "\U0001f600 \U0001f1f3\U0001f1f4 \u200d",  # emoji, flag, zero-width joiner
    "nul\x00 bell\x07 escape\x1b form\x0c del\x7f c1\x85 lone\ud800 end\ufffe",
    "]]> <![CDATA[ x ]]>",
    "<foreignObject><body onload='x'/></foreignObject>",
    "x" * 5000,
]


def hostile_scene(text: str) -> Scene:
    return Scene(
        300, 100,
        (Group((Text(10, 20, text), Rect(0, 0, 5, 5, css_class=text)), css_class=text,
               title=text, id=text),
         GradientRect(10, 30, 50, 5, "#0072B2", 0, 1)),
        title=text, desc=text, metadata=((text, text),),
    )


@pytest.mark.parametrize("text", HOSTILE, ids=range(len(HOSTILE)))
def test_hostile_text_stays_text(text):
    # XML 1.0 (Fifth Edition) section 2.2, production [2] Char: what a document may contain.
    output = render_svg(hostile_scene(text))
    output.encode("utf-8")  # no lone surrogates survive
    root = ET.fromstring(output)
    assert "<script" not in output and "<foreignObject" not in output
    for element in root.iter():
        assert element.tag in {SVG + t for t in (
            "svg", "title", "desc", "metadata", "defs", "linearGradient", "stop", "g",
            "text", "rect")}, element.tag
        for name, value in element.attrib.items():
            local = name.rsplit("}", 1)[-1]
            assert not local.lower().startswith("on"), name
            assert local != "href", name
            if "url(" in value:
                assert value.startswith("url(#"), value
    (label,) = drawn(root, "text")
    # right-to-left text is wrapped in FSI ... PDI (render/svg.py, _isolated)
    assert label.text.removeprefix("\u2068").removesuffix("\u2069") == drawable_text(text)


def test_escaped_markup_reads_back_as_the_original_characters():
    root = ET.fromstring(render_svg(hostile_scene("<script>alert(1)</script> &amp; \"q\"")))
    assert drawn(root, "text")[0].text == "<script>alert(1)</script> &amp; \"q\""
    assert drawn(root, "g")[0][0].text == "<script>alert(1)</script> &amp; \"q\""


def test_control_characters_are_removed_and_the_rest_kept():
    root = ET.fromstring(render_svg(hostile_scene("a\x00b\x07c\td\ne\U0001f600")))
    assert drawn(root, "text")[0].text == "abc d e\U0001f600"
    assert drawn(root, "g")[0][0].text == "abc\td\ne\U0001f600"  # tooltips keep line breaks


def test_a_long_label_is_kept_whole(tmp_path):
    write_svg(hostile_scene("x" * 5000), tmp_path / "long.svg")
    root = ET.parse(tmp_path / "long.svg").getroot()
    assert drawn(root, "text")[0].text == "x" * 5000


SAFE_SHEET = re.compile(r"(#timelines-chart-[0-9a-f]{12} text(\.[-_a-zA-Z][-_a-zA-Z0-9]*)+"
                        r"\{[-a-z]+:[#0-9a-zA-Z]+(;[-a-z]+:[#0-9a-zA-Z]+)*\})+")


@pytest.mark.parametrize("text", HOSTILE, ids=range(len(HOSTILE)))
def test_the_style_sheet_holds_only_class_names_and_checked_values(text):
    hostile = (Text(0, 80, text, fill="#1a1a1a", css_class=text),
               Text(0, 90, text, fill="#1a1a1a", css_class=f"label {text}"))
    root = parse(labelled_scene(hostile))
    (sheet,) = drawn(root, "style")
    assert SAFE_SHEET.fullmatch(sheet.text), sheet.text
