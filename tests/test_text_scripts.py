"""Text in any script: shaped runs (order, joining), fallback, the missing-glyph report, and
every route (PNG, PDF, SVG outlines) against a browser's rendering of the text SVG.

Names here are invented. Where a test needs a font or a program, it skips and says which.
"""
from __future__ import annotations

import io
import shutil
import subprocess
from pathlib import Path

import numpy
import pytest

from timelines.scene.coverage import missing_glyph_notes, script_of
from timelines.scene.fonts import DEFAULT_FONTS, face_of, font_list
from timelines.scene.primitives import Scene, Text
from timelines.scene.shaping import embedding_levels, shape_line, visual_order
from timelines.scene.textsize import text_width

HEBREW = "שלמה בן דוד"                 # an invented name: Shlomo son of David
ARABIC = "فاطمة بنت علي"              # Fatima daughter of Ali
DEVANAGARI = "राम प्रसाद"             # Ram Prasad
CHINESE = "李明远"
GREEK = "Αλέξανδρος Νικολάου"
MIXED = "Ada Fenwick (אדה)"
SCRIPTS = [HEBREW, ARABIC, GREEK, MIXED, DEVANAGARI, CHINESE]
CHROMIUM_PATHS = ("/usr/lib/chromium/chromium", "/usr/bin/chromium")


def _needs_face(family: str):
    if face_of(family, False) is None:
        pytest.skip(f"{family} is not installed (Debian: fonts-noto-core / fonts-noto-cjk)")


def _names(text: str) -> list[str]:
    return [glyph.name for run in shape_line(text).runs for glyph in run.glyphs]


# --- shaped runs -------------------------------------------------------------------------

def test_hebrew_is_in_visual_order():
    # Hebrew is right to left: the first letter (shin, U+05E9) is drawn rightmost; DejaVu's
    # glyph names are uniXXXX (its post table).
    (run,) = shape_line("שלום").runs
    assert run.rtl and run.face.family == "DejaVu Sans"
    assert [g.name for g in run.glyphs] == ["uni05DD", "uni05D5", "uni05DC", "uni05E9"]
    assert [g.x for g in run.glyphs] == sorted(g.x for g in run.glyphs)


def test_arabic_letters_join_in_visual_order():
    # Presentation forms for "علي" (ain lam yeh), right to left: yeh final U+FEF2, lam medial
    # U+FEE0, ain initial U+FECB (Unicode's Arabic Presentation Forms-B chart, from memory).
    (run,) = shape_line("علي").runs
    assert [g.name for g in run.glyphs] == ["uniFEF2", "uniFEE0", "uniFECB"]


def test_arabic_matches_harfbuzz_shaping_the_whole_string():
    # HarfBuzz's own output for the string in the font our fallback chose is the reference.
    import uharfbuzz

    (run,) = shape_line(ARABIC).runs
    face = uharfbuzz.Face(uharfbuzz.Blob.from_file_path(run.face.path), run.face.index)
    font = uharfbuzz.Font(face)
    buffer = uharfbuzz.Buffer()
    buffer.add_str(ARABIC)
    buffer.guess_segment_properties()
    uharfbuzz.shape(font, buffer)
    assert [g.id for g in run.glyphs] == [info.codepoint for info in buffer.glyph_infos]
    assert buffer.direction == "rtl"


def test_mixed_direction_orders_runs_by_uax9():
    # UAX #9: an LTR paragraph (first strong L) with an RTL run inside; the brackets around it
    # resolve to L here (N0), so runs are "Ada Fenwick (", "אדה" reversed, ")".
    levels, paragraph = embedding_levels(MIXED)
    assert paragraph == 0
    assert [run.text for run in shape_line(MIXED).runs] == ["Ada Fenwick (", "אדה", ")"]
    # An RTL paragraph with a Latin word: the Latin run (level 2) sits at the left end.
    runs = shape_line("שלום abc").runs
    assert [run.text for run in runs] == ["abc", "שלום "]


def test_rule_l2_reverses_from_the_highest_level():
    # UAX #9 L2 worked example shape: levels 0 1 1 2 2 1 0 -> runs 0, then 5, 3-4 reversed...
    assert visual_order([0, 1, 2, 1, 0]) == [0, 3, 2, 1, 4]
    assert visual_order([1, 1, 1]) == [2, 1, 0]
    assert visual_order([0, 0]) == [0, 1]


def test_devanagari_falls_back_to_its_noto_face_and_forms_conjuncts():
    _needs_face("Noto Sans Devanagari")
    (first, *_) = shape_line(DEVANAGARI).runs
    assert first.face.family == "Noto Sans Devanagari"
    # "प्र" (pa virama ra) is shaped to fewer glyphs than its three characters.
    assert len(shape_line("प्र").runs[0].glyphs) < 3


def test_chinese_falls_back_to_noto_cjk():
    _needs_face("Noto Sans CJK SC")
    assert shape_line(CHINESE).runs[0].face.family.startswith("Noto Sans CJK")


# --- measurement --------------------------------------------------------------------------

def test_latin_keeps_the_table_path_and_other_scripts_are_measured_as_shaped():
    assert text_width("Ada", 10) == pytest.approx((1401 + 1300 + 1255) / 2048 * 10)
    assert text_width(ARABIC, 10) == pytest.approx(shape_line(ARABIC).width * 10)
    assert text_width(HEBREW, 12, "bold") == pytest.approx(
        shape_line(HEBREW, "bold").width * 12)


# --- font list and report -----------------------------------------------------------------

def test_font_list_takes_the_users_families_then_the_defaults():
    assert font_list(None) == DEFAULT_FONTS
    assert font_list("Fira Sans, 'Noto Serif'")[:3] == ("Fira Sans", "Noto Serif", "DejaVu Sans")
    assert font_list(["A", "a", "DejaVu Sans"])[:2] == ("A", "DejaVu Sans")


def test_a_character_no_font_has_is_reported_once_per_script():
    # U+A9A7 JAVANESE LETTER BA: no default family has Javanese.
    javanese = "\ua9a7\ua9b8 one"
    texts = tuple(Text(0, 10 * i, label) for i, label in enumerate([javanese, javanese, "Ada"]))
    notes = missing_glyph_notes(Scene(100, 100, texts))
    assert len(notes) == 1
    assert notes[0].startswith("1 label holds characters no installed font has")
    assert "fonts-noto-extra" in notes[0]
    assert script_of("\u0915") == ("Devanagari", "install fonts-noto-core")


def test_the_pdf_route_prints_no_library_warnings(tmp_path, recwarn):
    from timelines.render.mpl import render_pdf

    render_pdf(_scene(["\ua9a7\ua9b8", HEBREW]), tmp_path / "a.pdf")
    assert not [w for w in recwarn if "missing from" in str(w.message)]


# --- every route against a browser ---------------------------------------------------------

LINE = 56          # px per line of the test page
SIZE = 28


def _scene(labels: list[str]) -> Scene:
    texts = tuple(Text(20, LINE * i + 38, label, size=SIZE) for i, label in enumerate(labels))
    return Scene(520, LINE * len(labels), texts)


def _ink(pixels: numpy.ndarray) -> numpy.ndarray:
    grey = pixels[..., :3].mean(axis=2)
    return (255 - grey) / 255


def _chromium() -> str:
    for path in CHROMIUM_PATHS:
        if Path(path).exists():
            return path
    pytest.skip("Chromium is not installed (Debian: apt-get install chromium)")


@pytest.fixture(scope="module")
def browser():
    sync_api = pytest.importorskip("playwright.sync_api", reason="needs Playwright (pip)")
    executable = _chromium()
    with sync_api.sync_playwright() as playwright:
        launched = playwright.chromium.launch(executable_path=executable, args=[
            "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
            "--disable-component-update", "--no-first-run"])
        yield launched
        launched.close()


def _chromium_pixels(browser, scene: Scene, tmp_path: Path) -> numpy.ndarray:
    from PIL import Image
    from timelines.render.svg import write_svg

    path = tmp_path / "text.svg"
    write_svg(scene, path)
    page = browser.new_page(viewport={"width": int(scene.width), "height": int(scene.height)},
                            device_scale_factor=1)
    page.goto(path.as_uri())
    shot = page.screenshot()
    page.close()
    Image.open(io.BytesIO(shot)).save(tmp_path / "chromium.png")
    return numpy.asarray(Image.open(io.BytesIO(shot)).convert("RGB"))


def _png_pixels(scene: Scene, tmp_path: Path) -> numpy.ndarray:
    from PIL import Image
    from timelines.render.mpl import render_png

    render_png(scene, tmp_path / "route.png", dpi=96)
    return numpy.asarray(Image.open(tmp_path / "route.png").convert("RGB"))


def _pdf_pixels(scene: Scene, tmp_path: Path) -> numpy.ndarray:
    from PIL import Image
    from timelines.render.mpl import render_pdf

    if shutil.which("pdftoppm") is None:
        pytest.skip("pdftoppm is not installed (Debian: poppler-utils)")
    render_pdf(scene, tmp_path / "route.pdf")
    subprocess.run(["pdftoppm", "-r", "96", "-png", "-singlefile", str(tmp_path / "route.pdf"),
                    str(tmp_path / "route-pdf")], check=True, capture_output=True)
    return numpy.asarray(Image.open(tmp_path / "route-pdf.png").convert("RGB"))


def _outline_pixels(scene: Scene, tmp_path: Path) -> numpy.ndarray:
    from PIL import Image
    from timelines.render.svg import render_svg

    cairosvg = pytest.importorskip("cairosvg", reason="needs cairosvg (the test extra)")
    png = cairosvg.svg2png(bytestring=render_svg(scene, text="paths").encode())
    Image.open(io.BytesIO(png)).save(tmp_path / "outlines.png")
    return numpy.asarray(Image.open(io.BytesIO(png)).convert("RGB"))


ROUTES = {"png": _png_pixels, "pdf": _pdf_pixels, "outlines": _outline_pixels}


def _line_profile(ink: numpy.ndarray, line: int) -> numpy.ndarray:
    """Ink per column of one line, smoothed over 3 px: rasterisers differ in how a thin
    stroke's coverage splits between neighbouring columns, not in where the ink is."""
    profile = ink[line * LINE:(line + 1) * LINE].sum(axis=0)
    return numpy.convolve(profile, numpy.ones(3) / 3, mode="same")


def _extent(profile: numpy.ndarray) -> tuple[int, int]:
    columns = numpy.flatnonzero(profile > 0.3)
    return int(columns[0]), int(columns[-1])


@pytest.mark.parametrize("route", sorted(ROUTES))
def test_each_route_agrees_with_chromium(route, browser, tmp_path):
    """Each line's ink starts and ends within 3 px of the browser's, and its column profile
    (ink per column, a reversed or unjoined string changes it) correlates at 0.8 or more."""
    _needs_face("Noto Sans Devanagari")
    _needs_face("Noto Sans CJK SC")
    scene = _scene(SCRIPTS)
    reference = _ink(_chromium_pixels(browser, scene, tmp_path))
    drawn = _ink(ROUTES[route](scene, tmp_path))
    assert drawn.shape == reference.shape
    for line, label in enumerate(SCRIPTS):
        ours, theirs = _line_profile(drawn, line), _line_profile(reference, line)
        (left, right), (ref_left, ref_right) = _extent(ours), _extent(theirs)
        assert abs(left - ref_left) <= 3 and abs(right - ref_right) <= 3, (label, left, right,
                                                                          ref_left, ref_right)
        correlation = numpy.corrcoef(ours, theirs)[0, 1]
        assert correlation >= 0.8, (label, correlation)


def test_a_reversed_hebrew_line_would_fail_the_comparison(browser, tmp_path):
    """The comparison can tell: the letters in logical order drawn left to right (the old
    PNG's fault) correlate far worse with the browser than the shaped line does."""
    scene = _scene([HEBREW])
    reference = _line_profile(_ink(_chromium_pixels(browser, scene, tmp_path)), 0)
    reversed_scene = _scene(["\u202d" + HEBREW + "\u202c"])   # logical order forced LTR
    wrong = _line_profile(_ink(_png_pixels(reversed_scene, tmp_path)), 0)
    right = _line_profile(_ink(_png_pixels(scene, tmp_path)), 0)
    assert numpy.corrcoef(right, reference)[0, 1] > numpy.corrcoef(wrong, reference)[0, 1] + 0.2
