"""Two routes to one picture, and two measurements of one text, must agree.

As matplotlib's `check_figures_equal` does, no stored baselines: our SVG rasterised by cairosvg is
compared with our PNG drawn by matplotlib at the same pixel size. Text antialiasing and hinting
differ between the two rasterisers, so shapes are compared pixel by pixel and text by where its
ink lands. The second half checks `timelines.textsize` (a stdlib table) against matplotlib's own
measurement of DejaVu Sans.
"""
from __future__ import annotations

import ast
import importlib.util
import io
import re
import shutil
import subprocess
from pathlib import Path

import cairosvg
import numpy
import pytest
from matplotlib.backends.backend_agg import RendererAgg
from matplotlib.font_manager import FontProperties, findfont
from matplotlib.ft2font import FT2Font
from PIL import Image

from timelines.render.mpl import render_pdf, render_png
from timelines.render.svg import render_svg
from timelines.scene import textsize
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Scene, Text
from timelines.scene.textsize import cap_height, text_ascent, text_descent, text_height, text_width

ROOT = Path(__file__).resolve().parent.parent

# Per-channel mean absolute difference (0-255) allowed between the two rasters of a shapes-only
# scene, and for any 8x8 block of it (edges antialias a little differently; measured about 0.3
# and 11 on this machine; a reversed fade gives about 13 and 200, see the control below).
MEAN_TOLERANCE = 1.0
BLOCK_TOLERANCE = 24.0
BLOCK = 8


def rasters(scene: Scene, dpi: float, tmp_path: Path) -> tuple[numpy.ndarray, numpy.ndarray]:
    """(matplotlib PNG, cairosvg PNG of our SVG) as float RGB arrays of the same size."""
    render_png(scene, tmp_path / "mpl.png", dpi=dpi)
    ours = numpy.asarray(Image.open(tmp_path / "mpl.png").convert("RGB")).astype(float)
    height, width = ours.shape[:2]
    png = cairosvg.svg2png(bytestring=render_svg(scene).encode("utf-8"),
                           output_width=width, output_height=height)
    theirs = numpy.asarray(Image.open(io.BytesIO(png)).convert("RGB")).astype(float)
    assert theirs.shape == ours.shape
    return ours, theirs


def differences(ours: numpy.ndarray, theirs: numpy.ndarray) -> tuple[numpy.ndarray, float]:
    """Per-channel mean absolute difference, and the largest 8x8 block mean."""
    difference = numpy.abs(ours - theirs)
    rows, columns = (n // BLOCK * BLOCK for n in difference.shape[:2])
    blocks = difference[:rows, :columns].reshape(
        rows // BLOCK, BLOCK, columns // BLOCK, BLOCK, 3).mean(axis=(1, 3))
    return difference.mean(axis=(0, 1)), float(blocks.max())


def shapes_scene(reversed_fades: bool = False) -> Scene:
    rise, fall = ((1.0, 0.0), (0.0, 1.0)) if reversed_fades else ((0.0, 1.0), (1.0, 0.0))
    return Scene(320, 160, (
        GradientRect(10, 10, 80, 30, "#0072B2", *rise),
        Rect(90, 10, 120, 30, fill="#0072B2"),
        GradientRect(210, 10, 90, 30, "#0072B2", *fall),
        GradientRect(10.5, 50.25, 140.3, 17.7, "#E69F00", 0.2, 0.9),
        Rect(160.4, 50.6, 60.2, 18.3, fill="#009E73", opacity=0.6, stroke="#000000",
             stroke_width=1.5),
        Rect(230, 50, 70, 20, fill=None, stroke="#CC79A7", stroke_width=2),
        Line(10, 90, 300, 90, stroke="#333333", stroke_width=1),
        Line(10, 100.5, 300, 100.5, stroke="#D55E00", stroke_width=2, dash=(6, 3)),
        Line(20, 110, 120, 150, stroke="#56B4E9", stroke_width=3, opacity=0.7),
        Polygon(((150, 150), (170, 115), (190, 150)), fill="#F0E442", stroke="#000000",
                stroke_width=1),
        Polygon(((200, 150), (220, 120), (240, 150), (260, 120)), closed=False,
                stroke="#000000", stroke_width=1.5),
        Group((Rect(270, 120, 30, 30, fill="#000000"),
               GradientRect(270, 120, 30, 30, "#ffffff", *rise))),
    ))


@pytest.mark.parametrize("dpi", [96, 150, 192])
def test_svg_and_png_draw_the_same_shapes(dpi, tmp_path):
    mean, worst_block = differences(*rasters(shapes_scene(), dpi, tmp_path))
    assert mean.max() < MEAN_TOLERANCE, mean
    assert worst_block < BLOCK_TOLERANCE, worst_block


@pytest.mark.skipif(shutil.which("pdftoppm") is None, reason="poppler's pdftoppm is not here")
def test_pdf_draws_the_same_shapes_as_the_png(tmp_path):
    # A third route: our PDF rasterised by poppler. Poppler neither antialiases image edges
    # nor widens hairlines as Agg does, so the allowance is wider (measured about 2.9 and 29).
    render_pdf(shapes_scene(), tmp_path / "a.pdf")
    subprocess.run(["pdftoppm", "-r", "96", "-png", "-singlefile", str(tmp_path / "a.pdf"),
                    str(tmp_path / "poppler")], check=True)
    render_png(shapes_scene(), tmp_path / "mpl.png", dpi=96)
    ours, poppler = (numpy.asarray(Image.open(tmp_path / name).convert("RGB")).astype(float)
                     for name in ("mpl.png", "poppler.png"))
    mean, worst_block = differences(ours, poppler)
    assert mean.max() < 4 * MEAN_TOLERANCE and worst_block < 2 * BLOCK_TOLERANCE


def test_the_comparison_notices_a_reversed_fade(tmp_path):
    ours, _ = rasters(shapes_scene(), 96, tmp_path)
    _, reversed_svg = rasters(shapes_scene(reversed_fades=True), 96, tmp_path)
    mean, worst_block = differences(ours, reversed_svg)
    assert mean.max() > 4 * MEAN_TOLERANCE and worst_block > 4 * BLOCK_TOLERANCE


def demo_scene(**options) -> Scene:
    from timelines.chart import ChartOptions, arrange, arranged_scene
    demo = ROOT / "timelines" / "demo" / "fenwold-organ-builders.csv"
    chosen = ChartOptions(**options)
    return arranged_scene(arrange(demo, chosen), chosen)


def svg_raster(svg: str, scene: Scene) -> numpy.ndarray:
    png = cairosvg.svg2png(bytestring=svg.encode("utf-8"), output_width=round(scene.width * 1.5),
                           output_height=round(scene.height * 1.5))
    return numpy.asarray(Image.open(io.BytesIO(png)).convert("RGB")).astype(float)


@pytest.mark.parametrize("options", [{}, {"facet": "category"}], ids=["plain", "facets"])
def test_style_rules_draw_what_attributes_drew(options, monkeypatch):
    # The same SVG with every text's presentation written on the element itself (the style
    # sheet switched off) must rasterise to the same pixels: cairosvg applies the <style>
    # rules exactly as the attributes.
    from timelines.render import svg as svg_module

    scene = demo_scene(**options)
    compact = render_svg(scene)
    assert "<style>" in compact
    monkeypatch.setattr(svg_module, "_text_style_rules", lambda texts: [])
    verbose = render_svg(scene)
    assert "<style>" not in verbose and len(verbose) > len(compact)
    assert numpy.array_equal(svg_raster(compact, scene), svg_raster(verbose, scene))


def dejavu_is_installed() -> bool:
    """cairosvg draws text with the system's fonts; the text check needs DejaVu Sans there."""
    if shutil.which("fc-match") is None:
        return False
    found = subprocess.run(["fc-match", "DejaVu Sans"], capture_output=True, text=True).stdout
    return found.startswith("DejaVuSans")


def ink_box(pixels: numpy.ndarray) -> numpy.ndarray:
    dark = numpy.argwhere(pixels.mean(axis=2) < 160)
    return numpy.array([*dark.min(axis=0), *dark.max(axis=0)])  # top, left, bottom, right


@pytest.mark.skipif(not dejavu_is_installed(), reason="DejaVu Sans is not a system font here")
@pytest.mark.parametrize("anchor, x", [("start", 20), ("middle", 200), ("end", 380)])
@pytest.mark.parametrize("weight", ["normal", "bold"])
def test_text_lands_in_the_same_place(anchor, x, weight, tmp_path):
    for label in ("Marrow & Fenwick, 1650\u20131702", "\u0141\u00f3d\u017a \u00d8rsted"):
        scene = Scene(400, 40, (Text(x, 28, label, size=18, anchor=anchor, weight=weight),))
        ours, theirs = rasters(scene, 96, tmp_path)
        assert numpy.abs(ink_box(ours) - ink_box(theirs)).max() <= 2, label


# --- text measurement ----------------------------------------------------------------------

LABELS = [
    "Hello, world",
    "Anna Kowalczyk (1650\u20131712)",
    "c. 1650 \u2013 before 1700",
    "\u0141\u00f3d\u017a; Dvo\u0159\u00e1k\u2019s \u201c\u00d8rsted\u201d \u2026",
    "\u03a9\u03bc\u03ad\u03b3\u03b1 \u041c\u043e\u0441\u043a\u0432\u0430",
    "Guild of Lantern Makers, Varnholt",
    "1984~ 198X 1985/1987 ../1760 44 BC",
]


def matplotlib_advance(text: str, size_px: float, weight: str) -> float:
    """Advance width as matplotlib's Agg renderer lays the text out, kerning included.

    The renderer reports the ink box; bracketing the text between two '|' and subtracting the
    ink of '||' leaves the advance of the text itself (plus its kerning against the bars).
    """
    renderer = RendererAgg(10, 10, 72)  # at 72 dpi one point is one pixel
    font = FontProperties(family="DejaVu Sans", weight=weight, size=size_px)

    def ink(s):
        return renderer.get_text_width_height_descent(s, font, ismath=False)[0]

    return ink(f"|{text}|") - ink("||")


@pytest.mark.parametrize("weight", ["normal", "bold"])
@pytest.mark.parametrize("text", LABELS)
def test_text_width_matches_matplotlib_within_two_percent(text, weight):
    measured = matplotlib_advance(text, 100, weight)
    assert text_width(text, 100, weight) == pytest.approx(measured, rel=0.02)


def test_text_width_ignores_kerning_so_tight_pairs_come_out_wider():
    # 'AV', 'Wa', 'To' are kerned together in DejaVu Sans; a table of advances cannot see it.
    assert text_width("WAVE To", 100) > matplotlib_advance("WAVE To", 100, "normal")


def test_text_width_scales_with_size_and_adds_up():
    assert text_width("", 12) == 0
    assert text_width("Marrow", 24) == pytest.approx(2 * text_width("Marrow", 12))
    assert text_width("ab", 10) == pytest.approx(text_width("a", 10) + text_width("b", 10))
    assert text_width("abc", 10, "bold") > text_width("abc", 10)
    assert text_width("abc", 10, "700") == text_width("abc", 10, "bold")


def test_characters_outside_the_table():
    em = 10.0
    assert text_width("\u0301", em) == 0                             # combining acute accent
    assert text_width("\u200d\u202e", em) == 0                       # format characters
    assert text_width("\u01ce", em) == text_width("a", em)           # a with caron -> a
    assert text_width("\u1ebf", em) == text_width("e", em)           # Vietnamese e -> e
    # Without a font file to shape with, the estimate: CJK one em, others DejaVu's box.
    assert textsize.estimated_width("\u4e2d", em) == pytest.approx(em)
    fallback = textsize.MISSING_GLYPH_UNITS / textsize.UNITS_PER_EM * em
    assert textsize.estimated_width("\u0915", em) == pytest.approx(fallback)  # Devanagari ka
    assert fallback == pytest.approx(0.6 * em, abs=0.001)


def test_vertical_metrics_match_the_font_matplotlib_uses():
    font = FT2Font(findfont(FontProperties(family="DejaVu Sans")))
    size = 100.0
    assert text_ascent(size) == pytest.approx(font.ascender / font.units_per_EM * size)
    assert text_descent(size) == pytest.approx(-font.descender / font.units_per_EM * size)
    assert text_height(size) == pytest.approx(text_ascent(size) + text_descent(size))
    renderer = RendererAgg(10, 10, 72)
    _, ink_height, ink_descent = renderer.get_text_width_height_descent(
        "H", FontProperties(family="DejaVu Sans", size=size), ismath=False)
    assert ink_descent == pytest.approx(0, abs=1)
    assert cap_height(size) == pytest.approx(ink_height, abs=1.5)


def test_the_table_in_the_module_is_what_the_generator_makes():
    spec = importlib.util.spec_from_file_location("make_textsize", ROOT / "tools" /
                                                  "make_textsize.py")
    generator = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(generator)
    module_text = (ROOT / "timelines" / "scene" / "textsize.py").read_text(encoding="utf-8")
    block = re.escape(generator.START) + ".*?" + re.escape(generator.END)
    expected = generator.generated_block()
    # The header line names the matplotlib version; the numbers are what must not drift.
    strip_version = re.compile(r"# DejaVu Sans as bundled with matplotlib .*\n")
    assert strip_version.sub("", re.search(block, module_text, re.S).group(0)) == \
        strip_version.sub("", expected)


def test_textsize_needs_only_the_standard_library():
    """The table path loads nothing; text beyond the tables loads the shaping lazily."""
    tree = ast.parse((ROOT / "timelines" / "scene" / "textsize.py").read_text(encoding="utf-8"))
    imported = {alias.name for node in tree.body if isinstance(node, ast.Import)
                for alias in node.names}
    imported |= {node.module for node in tree.body if isinstance(node, ast.ImportFrom)}
    assert imported <= {"__future__", "unicodedata", "functools"}
