"""SVG with text as outlines (`text="paths"`): no <text> left, glyphs where matplotlib puts them."""
from __future__ import annotations

import re
import xml.etree.ElementTree as ET

import pytest

from timelines.render.outlines import outliner
from timelines.render.svg import render_svg
from timelines.scene.primitives import Group, Rect, Scene, Text
from timelines.scene.textsize import text_width

SVG = "{http://www.w3.org/2000/svg}"


def scene() -> Scene:
    record = Group((Rect(10, 10, 100, 12, "#0072B2", css_class="core"),
                    Text(14, 20, "Aldous Perrin", 12, fill="#ffffff", css_class="label")),
                   css_class="record", title="Aldous Perrin\nwritten: c. 1608 – 1671")
    return Scene(300, 80, (record, Text(150, 60, "1650", 10, anchor="middle")), title="t")


def test_paths_mode_leaves_no_text_elements_but_keeps_tooltips():
    root = ET.fromstring(render_svg(scene(), text="paths").encode())
    assert not list(root.iter(f"{SVG}text"))
    paths = list(root.iter(f"{SVG}path"))
    assert [p.get("class") for p in paths] == ["label", None]
    assert paths[0].get("fill") == "#ffffff"
    [record] = [g for g in root.iter(f"{SVG}g") if g.get("class") == "record"]
    assert record.find(f"{SVG}title").text.startswith("Aldous Perrin")


def test_paths_output_is_byte_identical():
    assert render_svg(scene(), text="paths") == render_svg(scene(), text="paths")


def test_unknown_text_mode_is_refused():
    with pytest.raises(ValueError):
        render_svg(scene(), text="outline")


def test_advances_agree_with_the_measuring_table():
    # textsize's table was generated from the same font file: they must agree exactly
    for text in ("Aldous Perrin", "1650", "~?"):
        assert outliner("normal").advance(text, 12) == pytest.approx(text_width(text, 12))


def path_points(data: str) -> tuple[list[float], list[float]]:
    """x and y coordinates of an SVG path of absolute M, L, H, V, Q, C and Z commands."""
    xs, ys = [], []
    for command, args in re.findall(r"([MLHVQCZ])([^MLHVQCZ]*)", data):
        values = [float(n) for n in re.findall(r"-?\d+(?:\.\d+)?", args)]
        if command == "H":
            xs += values
        elif command == "V":
            ys += values
        else:
            xs += values[0::2]
            ys += values[1::2]
    return xs, ys


def test_glyph_outlines_land_where_matplotlib_draws_them():
    # matplotlib's TextPath (the same DejaVu Sans) as an outside oracle for the glyph extents
    from matplotlib.font_manager import FontProperties
    from matplotlib.textpath import TextPath

    data = outliner("normal").path_data("Hi", 0, 0, 100, "start")
    xs, ys = path_points(data)
    reference = TextPath((0, 0), "Hi", size=100, prop=FontProperties(family="DejaVu Sans"))
    box = reference.get_extents()
    # our y grows downward: flip to compare
    assert min(xs) == pytest.approx(box.x0, abs=0.5) and max(xs) == pytest.approx(box.x1, abs=0.5)
    assert -max(ys) == pytest.approx(box.y0, abs=0.5) and -min(ys) == pytest.approx(box.y1, abs=0.5)
