"""The PNG/PDF renderer: file formats, page size, pixels where they belong, byte-stable output."""
from __future__ import annotations

import io
import os
import re
import struct
import subprocess
import sys
import zlib
from pathlib import Path

import matplotlib
import matplotlib.style
import numpy
import pytest
from PIL import Image

from timelines.render.mpl import render_pdf, render_png
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Scene, Text

HERE = Path(__file__).resolve().parent
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"  # PNG specification (ISO/IEC 15948), section 5.2


def sample_scene() -> Scene:
    return Scene(
        480, 192,
        (
            Group((
                GradientRect(20, 20, 60, 20, "#0072B2", 0.0, 1.0),
                Rect(80, 20, 200, 20, fill="#0072B2"),
                GradientRect(280, 20, 60, 20, "#0072B2", 1.0, 0.0),
                Text(350, 35, "Orla Fenwick \u2013 c. 1650", size=12),
            ), css_class="record", title="Orla Fenwick"),
            Line(20, 170, 460, 170, stroke="#333333", stroke_width=1, dash=(4, 2)),
            Polygon(((200, 100), (210, 90), (220, 100)), fill="#D55E00"),
            Polygon(((230, 100), (240, 90), (250, 100)), closed=False, stroke="#000000",
                    stroke_width=1.5),
            Text(240, 188, "1700", size=10, anchor="middle", weight="bold"),
        ),
        title="Guild of Lantern Makers", desc="An invented guild.",
        metadata=(("Author", "timelines tests"),),
    )


def png_pixels(scene: Scene, tmp_path: Path, dpi: float = 96) -> numpy.ndarray:
    render_png(scene, tmp_path / "out.png", dpi=dpi)
    return numpy.asarray(Image.open(tmp_path / "out.png").convert("RGBA")).astype(int)


def png_size(data: bytes) -> tuple[int, int]:
    # PNG section 11.2.2: IHDR is the first chunk; width and height are 4-byte big-endian.
    assert data[12:16] == b"IHDR"
    return struct.unpack(">II", data[16:24])


# --- PNG ----------------------------------------------------------------------------------

@pytest.mark.parametrize("width, height, dpi, expected", [
    (480, 192, 96, (480, 192)),
    (480, 192, 150, (750, 300)),   # 480 px = 5 in; 5 in * 150 dpi = 750
    (96, 48, 300, (300, 150)),
])
def test_png_signature_and_pixel_size(tmp_path, width, height, dpi, expected):
    render_png(Scene(width, height, ()), tmp_path / "a.png", dpi=dpi)
    data = (tmp_path / "a.png").read_bytes()
    assert data.startswith(PNG_SIGNATURE)
    assert png_size(data) == expected


def test_png_is_byte_identical_for_identical_scenes(tmp_path):
    render_png(sample_scene(), tmp_path / "a.png")
    render_png(sample_scene(), tmp_path / "b.png")
    assert (tmp_path / "a.png").read_bytes() == (tmp_path / "b.png").read_bytes()


def test_png_carries_title_but_no_software_or_time_stamp(tmp_path):
    render_png(sample_scene(), tmp_path / "a.png")
    data = (tmp_path / "a.png").read_bytes()
    assert b"tIME" not in data and b"Software" not in data and b"matplotlib" not in data
    assert Image.open(tmp_path / "a.png").text["Title"] == "Guild of Lantern Makers"


def test_y_grows_downward_and_page_units_map_one_to_one(tmp_path):
    scene = Scene(100, 50, (Rect(10, 5, 20, 10, fill="#ff0000"),), background="#ffffff")
    pixels = png_pixels(scene, tmp_path, dpi=96)
    red = numpy.argwhere((pixels[..., 0] > 200) & (pixels[..., 1] < 50))
    assert red.min(axis=0).tolist() == [5, 10] and red.max(axis=0).tolist() == [14, 29]


def test_scale_follows_dpi(tmp_path):
    scene = Scene(100, 50, (Rect(10, 5, 20, 10, fill="#ff0000"),), background="#ffffff")
    pixels = png_pixels(scene, tmp_path, dpi=192)
    red = numpy.argwhere((pixels[..., 0] > 200) & (pixels[..., 1] < 50))
    assert red.min(axis=0).tolist() == [10, 20] and red.max(axis=0).tolist() == [29, 59]


def test_no_background_means_transparent(tmp_path):
    pixels = png_pixels(Scene(20, 20, (), background=None), tmp_path)
    assert pixels[..., 3].max() == 0


def test_gradient_runs_linearly_left_to_right(tmp_path):
    # Straight-alpha source-over on white: channel = 255 - opacity * (255 - colour).
    scene = Scene(256, 10, (GradientRect(0, 0, 256, 10, "#000000", 0.0, 1.0),),
                  background="#ffffff")
    row = png_pixels(scene, tmp_path)[5, :, 0]
    expected = 255 - (numpy.arange(256) + 0.5) / 256 * 255
    assert numpy.abs(row - expected).max() <= 1.5
    assert (numpy.diff(row) <= 0).all()


def test_gradient_with_partial_opacity_and_drawing_order(tmp_path):
    scene = Scene(40, 10, (Rect(0, 0, 40, 10, fill="#0000ff"),
                           GradientRect(0, 0, 40, 10, "#ffffff", 0.5, 0.5)), background=None)
    pixel = png_pixels(scene, tmp_path)[5, 20]
    assert abs(pixel[0] - 127.5) <= 1.5 and pixel[2] == 255 and pixel[3] == 255


def test_opacity_on_shapes(tmp_path):
    scene = Scene(40, 10, (Rect(0, 0, 40, 10, fill="#000000", opacity=0.25),),
                  background="#ffffff")
    assert abs(png_pixels(scene, tmp_path)[5, 20, 0] - 255 * 0.75) <= 1.5


def test_text_anchor_places_the_ink(tmp_path):
    def ink_columns(anchor):
        scene = Scene(200, 40, (Text(100, 30, "Marrow", size=20, anchor=anchor),))
        dark = numpy.argwhere(png_pixels(scene, tmp_path)[..., 0] < 128)
        return dark[:, 1].min(), dark[:, 1].max(), dark[:, 0].max()

    start, middle, end = ink_columns("start"), ink_columns("middle"), ink_columns("end")
    assert 99 <= start[0] <= 103 and 97 <= end[1] <= 101
    assert abs((middle[0] + middle[1]) / 2 - 100) <= 2
    assert start[2] <= 30  # "Marrow" has no descender: the ink sits on the baseline


def test_text_is_never_mathtext_or_tex(tmp_path):
    # "$\frac{$" is invalid mathtext: matplotlib would raise if it tried to parse it.
    render_png(Scene(100, 20, (Text(5, 15, r"$\frac{$ 5% \\n _x_ ^y"),)), tmp_path / "a.png")


@pytest.mark.filterwarnings("ignore:Glyph .* missing from font")
def test_hostile_text_renders(tmp_path):
    texts = ["<script>alert(1)</script>", "a\x00b\x07c\ud800", "\u05e9\u05dc\u05d5\u05dd",
             "\U0001f600", "x" * 5000, "  \n  "]
    scene = Scene(200, 40, tuple(Text(5, 20, t) for t in texts), title="\x00t\ud800",
                  metadata=(("bad\x00key", "v"), ("Comment", "\U0001f600\ud800")))
    render_png(scene, tmp_path / "a.png", dpi=96)
    render_pdf(scene, tmp_path / "a.pdf")
    assert png_size((tmp_path / "a.png").read_bytes()) == (200, 40)


def test_users_matplotlib_settings_do_not_leak_in(tmp_path):
    render_png(sample_scene(), tmp_path / "plain.png")
    render_pdf(sample_scene(), tmp_path / "plain.pdf")
    hostile_rc = {"savefig.bbox": "tight", "figure.facecolor": "red", "savefig.facecolor": "red",
                  "lines.solid_capstyle": "round", "lines.scale_dashes": True,
                  "pdf.fonttype": 3, "font.family": "serif", "text.antialiased": False}
    with matplotlib.rc_context(hostile_rc):
        render_png(sample_scene(), tmp_path / "styled.png")
        render_pdf(sample_scene(), tmp_path / "styled.pdf")
    assert (tmp_path / "plain.png").read_bytes() == (tmp_path / "styled.png").read_bytes()
    assert (tmp_path / "plain.pdf").read_bytes() == (tmp_path / "styled.pdf").read_bytes()


def test_global_settings_are_left_as_they_were(tmp_path):
    before = dict(matplotlib.rcParams)
    render_pdf(sample_scene(), tmp_path / "a.pdf")
    render_png(sample_scene(), tmp_path / "a.png")
    assert dict(matplotlib.rcParams) == before


# --- PDF ----------------------------------------------------------------------------------

def test_pdf_header_and_page_size(tmp_path):
    render_pdf(sample_scene(), tmp_path / "a.pdf")
    data = (tmp_path / "a.pdf").read_bytes()
    assert data.startswith(b"%PDF-")  # ISO 32000-1, section 7.5.2: the file header
    # 480 x 192 px at 96 px/in is 5 x 2 in, which is 360 x 144 pt (1 pt = 1/72 in).
    assert re.search(rb"/MediaBox \[ ?0 0 360 144 ?\]", data)


def test_pdf_embeds_truetype_not_type3_fonts(tmp_path):
    # ISO 32000-1, 9.6.5 and 9.9: Type 3 fonts are glyph procedures; embedded TrueType programs
    # are referenced through /FontFile2.
    render_pdf(sample_scene(), tmp_path / "a.pdf")
    data = (tmp_path / "a.pdf").read_bytes()
    assert b"/Type3" not in data
    assert b"/FontFile2" in data
    assert b"DejaVuSans" in data and b"DejaVuSans-Bold" in data


def test_pdf_is_byte_identical_and_undated(tmp_path):
    render_pdf(sample_scene(), tmp_path / "a.pdf")
    render_pdf(sample_scene(), tmp_path / "b.pdf")
    data = (tmp_path / "a.pdf").read_bytes()
    assert data == (tmp_path / "b.pdf").read_bytes()
    for key in (b"/CreationDate", b"/ModDate", b"/Producer", b"/Creator"):
        assert key not in data
    assert b"/Title (Guild of Lantern Makers)" in data and b"/Author (timelines tests)" in data


def test_pdf_stores_each_distinct_fade_once(tmp_path):
    fade = GradientRect(10, 10, 50, 10, "#0072B2", 0.0, 1.0)
    other = GradientRect(10, 30, 50, 10, "#0072B2", 1.0, 0.0)
    moved = GradientRect(70, 50, 20, 5, "#0072B2", 0.0, 1.0)
    render_pdf(Scene(100, 60, (fade, other, moved)), tmp_path / "a.pdf")
    # Each image XObject with alpha comes with its soft mask, itself an image (ISO 32000-1,
    # 11.6.5.3): two distinct fades make four.
    assert (tmp_path / "a.pdf").read_bytes().count(b"/Subtype /Image") == 4


def test_pdf_writes_to_a_file_object():
    buffer = io.BytesIO()
    render_pdf(sample_scene(), buffer)
    assert buffer.getvalue().startswith(b"%PDF-")


# --- process-level properties ---------------------------------------------------------------

def test_bytes_are_the_same_across_processes_with_different_hash_seeds(tmp_path):
    script = (
        "import sys\n"
        f"sys.path[:0] = [{str(HERE)!r}, {str(HERE.parent)!r}]\n"
        "from test_render_mpl import sample_scene\n"
        "from timelines.render.mpl import render_pdf, render_png\n"
        "render_png(sample_scene(), sys.argv[1] + '.png')\n"
        "render_pdf(sample_scene(), sys.argv[1] + '.pdf')\n"
    )
    for seed in ("1", "2"):
        subprocess.run([sys.executable, "-c", script, str(tmp_path / seed)], check=True,
                       env={**os.environ, "PYTHONHASHSEED": seed})
    for suffix in (".png", ".pdf"):
        assert (tmp_path / f"1{suffix}").read_bytes() == (tmp_path / f"2{suffix}").read_bytes()


def test_importing_the_module_does_not_load_matplotlib():
    script = (
        "import sys\n"
        f"sys.path.insert(0, {str(HERE.parent)!r})\n"
        "import timelines.render.mpl\n"
        "assert 'matplotlib' not in sys.modules\n"
    )
    subprocess.run([sys.executable, "-c", script], check=True)


def test_png_text_stays_inside_the_room_layout_reserves(tmp_path):
    # Layout reserves textsize.text_width times the hinting allowance; the PNG stays inside.
    from PIL import Image

    from timelines.scene.measure import RENDERED_WIDTH_ALLOWANCE
    from timelines.scene.textsize import text_width

    label = "Chamber organ for the Brightwater rooms, 1650-1720 and more words"
    path = tmp_path / "wide.png"
    render_png(Scene(1000, 40, (Text(10, 28, label, 12),)), path, dpi=96)
    grey = numpy.asarray(Image.open(path).convert("L"))
    ink = numpy.where((grey < 160).any(axis=0))[0]
    assert ink.max() <= 10 + text_width(label, 12) * RENDERED_WIDTH_ALLOWANCE
    assert ink.max() >= 10 + text_width(label, 12) * 0.97


# --- the PNG file and the batched drawing ---------------------------------------------------

def png_chunks(data: bytes) -> list[tuple[bytes, bytes]]:
    """(type, data) of each chunk, checking each CRC. PNG specification (ISO/IEC 15948) 5.3:
    length, type, data, CRC; 5.5 and Annex D: the CRC is the ISO 3309 CRC-32, as zlib.crc32."""
    assert data.startswith(PNG_SIGNATURE)
    chunks, at = [], len(PNG_SIGNATURE)
    while at < len(data):
        (length,) = struct.unpack(">I", data[at:at + 4])
        kind, body = data[at + 4:at + 8], data[at + 8:at + 8 + length]
        assert struct.unpack(">I", data[at + 8 + length:at + 12 + length])[0] == \
            zlib.crc32(kind + body)
        chunks.append((kind, body))
        at += 12 + length
    return chunks


@pytest.mark.parametrize("background, colour_type, channels", [
    ("#ffffff", 2, 3),    # PNG 11.2.2: colour type 2 is truecolour (RGB)
    (None, 6, 4),         # colour type 6 is truecolour with alpha
])
def test_png_file_structure(tmp_path, background, colour_type, channels):
    scene = Scene(30, 20, (Rect(2, 2, 10, 10, fill="#ff0000"),), background=background)
    render_png(scene, tmp_path / "a.png", dpi=96)
    chunks = png_chunks((tmp_path / "a.png").read_bytes())
    kinds = [kind for kind, _ in chunks]
    assert kinds[0] == b"IHDR" and kinds[-1] == b"IEND"   # 5.6: first and last chunks
    width, height, depth, colour, *_ = struct.unpack(">IIBBBBB", chunks[0][1])
    assert (width, height, depth, colour) == (30, 20, 8, colour_type)
    # 10 and 11.2.4: the IDAT chunks together hold one zlib stream of the filtered rows, each
    # row a filter-type byte (0-4) and width * channels bytes.
    rows = zlib.decompress(b"".join(body for kind, body in chunks if kind == b"IDAT"))
    assert len(rows) == height * (1 + width * channels)
    assert all(rows[row * (1 + width * channels)] <= 4 for row in range(height))


def test_png_pixels_are_what_matplotlib_and_pillow_write(tmp_path):
    # Two writers of one drawing: ours, and matplotlib's savefig with Pillow's encoder.
    from timelines.render import mpl

    render_png(sample_scene(), tmp_path / "ours.png", dpi=150)
    with mpl._local_settings():
        figure = mpl._figure(sample_scene(), raster=True)
        figure.savefig(tmp_path / "pillow.png", format="png", dpi=150,
                       facecolor=figure.get_facecolor())
    ours, pillow = (numpy.asarray(Image.open(tmp_path / name).convert("RGBA"))
                    for name in ("ours.png", "pillow.png"))
    assert numpy.array_equal(ours, pillow)


def test_png_resolution_and_text_that_latin_1_cannot_carry(tmp_path):
    scene = Scene(20, 20, (), title="\u0141\u00f3d\u017a guild",
                  metadata=(("Author", "Ana\u00efs"),))
    render_png(scene, tmp_path / "a.png", dpi=150)
    image = Image.open(tmp_path / "a.png")
    assert image.text == {"Title": "\u0141\u00f3d\u017a guild", "Author": "Ana\u00efs"}
    chunks = dict(png_chunks((tmp_path / "a.png").read_bytes()))
    assert chunks[b"iTXt"].startswith(b"Title\0")     # PNG 11.3.4.5: UTF-8 text
    assert chunks[b"tEXt"] == b"Author\0Ana\xefs"      # 11.3.4.3: Latin-1 text
    # 11.3.5.3: pixels per metre; 150 / 0.0254 = 5905.5, rounded as Pillow rounds it
    assert struct.unpack(">IIB", chunks[b"pHYs"]) == (5906, 5906, 1)


def polygon_patch_pixels(rects: list[Rect], tmp_path: Path) -> numpy.ndarray:
    """The rects drawn by matplotlib's own Polygon patches, with the style our renderer asks
    for, through savefig: the route the batch artist replaces."""
    from matplotlib.figure import Figure
    from matplotlib.patches import Polygon as PolygonPatch

    figure = Figure(figsize=(2, 1), dpi=96, facecolor="#ffffff")
    axes = figure.add_axes((0, 0, 1, 1))
    axes.set_axis_off()
    axes.set_xlim(0, 192)
    axes.set_ylim(96, 0)
    for rect in rects:
        corners = [(rect.x, rect.y), (rect.x + rect.width, rect.y),
                   (rect.x + rect.width, rect.y + rect.height), (rect.x, rect.y + rect.height)]
        stroke = ({"edgecolor": rect.stroke, "linewidth": rect.stroke_width * 0.75}
                  if rect.stroke else {"edgecolor": "none", "linewidth": 0.0})
        axes.add_patch(PolygonPatch(
            corners, closed=True, facecolor=rect.fill or "none", joinstyle="miter", snap=False,
            alpha=None if rect.opacity >= 1 else rect.opacity, clip_on=False, **stroke))
    with matplotlib.style.context("default"):
        figure.savefig(tmp_path / "patches.png", dpi=150, facecolor="#ffffff")
    return numpy.asarray(Image.open(tmp_path / "patches.png").convert("RGB"))


def test_batched_rects_draw_what_matplotlibs_polygon_patches_draw(tmp_path):
    rects = [Rect(10.3, 5.6, 40.2, 12.1, fill="#0072B2"),
             Rect(30.7, 10.1, 50.5, 30.4, fill="#D55E00", opacity=0.55),
             Rect(60.25, 40.75, 70.5, 20.5, fill="#009E73", stroke="#000000", stroke_width=1.5),
             Rect(100.1, 20.2, 60.3, 50.6, fill=None, stroke="#CC79A7", stroke_width=2,
                  opacity=0.7),
             Rect(150.5, 60.5, 30.0, 30.0, fill="#F0E442", stroke="#56B4E9", stroke_width=0.5,
                  opacity=0.3)]
    render_png(Scene(192, 96, tuple(rects)), tmp_path / "ours.png", dpi=150)
    ours = numpy.asarray(Image.open(tmp_path / "ours.png").convert("RGB"))
    assert numpy.array_equal(ours, polygon_patch_pixels(rects, tmp_path))


def test_all_fades_at_once_equal_one_fade_at_a_time():
    # The batched arithmetic against the same formula written for one fade alone: the coverage
    # of each device pixel times the opacity ramp at the pixel's clipped centre.
    from timelines.render.fades import _device_fades

    rng = numpy.random.default_rng(7)
    fades = [GradientRect(0, 0, 1, 1, "#0072B2", *rng.uniform(-0.2, 1.2, 2)) for _ in range(60)]
    left = rng.uniform(-20, 110, 60)
    bottom = rng.uniform(-10, 45, 60)
    boxes = numpy.column_stack([left, bottom, left + rng.uniform(0.1, 30, 60),
                                bottom + rng.uniform(0.1, 12, 60)])
    boxes[5] = (-30, 10, -5, 20)   # wholly off the canvas
    placed_all = _device_fades(fades, boxes, 100, 50)
    assert len(placed_all) == len(fades) == 60
    for fade, box, placed in zip(fades, boxes, placed_all, strict=True):
        expected = one_fade(fade, box, 100, 50)
        if expected is None:
            assert placed is None
        else:
            assert placed[:2] == expected[:2] and numpy.array_equal(placed[2], expected[2])


def one_fade(fade: GradientRect, box, canvas_width: int, canvas_height: int):
    left, bottom, right, top = box
    columns = numpy.arange(max(numpy.floor(left), 0), min(numpy.ceil(right), canvas_width))
    rows = numpy.arange(max(numpy.floor(bottom), 0), min(numpy.ceil(top), canvas_height))
    if columns.size == 0 or rows.size == 0:
        return None

    def coverage(pixels, low, high):
        return numpy.clip(numpy.minimum(pixels + 1, high) - numpy.maximum(pixels, low), 0, 1)

    centres = (numpy.clip(columns + 0.5, left, right) - left) / (right - left)
    ramp = numpy.clip(fade.opacity_left + (fade.opacity_right - fade.opacity_left) * centres,
                      0, 1)
    # Image row 0 is the fade's lowest device row, as Agg draws an image (the orientation is
    # checked against Agg's own rects in test_a_fade_of_one_opacity_covers_the_pixels_...).
    alpha = numpy.outer(coverage(rows, bottom, top), ramp * coverage(columns, left, right))
    image = numpy.empty((*alpha.shape, 4), dtype=numpy.uint8)
    image[..., :3] = (0, 114, 178)   # #0072B2
    image[..., 3] = numpy.round(alpha * 255)
    return int(columns[0]), int(rows[0]), image


def test_glyphs_drawn_as_one_image_equal_glyphs_drawn_one_by_one(tmp_path, monkeypatch):
    # 'AV', 'To', 'Wa' are kerned pairs in DejaVu Sans: their glyphs reach into each other's
    # columns, so the merged drawing must split there to stay exact.
    from timelines.render import glyphs as painter

    scene = Scene(400, 60, (Text(10.3, 25.6, "WAVE To Warrow, Fenwick 1650", size=15),
                            Text(390, 50.2, "Tyburn & Ava", size=12, anchor="end",
                                 weight="bold", fill="#D55E00")))
    merged = painter._glyph_images
    counts = []

    def counted(placed):
        images = merged(placed)
        counts.append((len(placed), len(images)))
        return images

    monkeypatch.setattr(painter, "_glyph_images", counted)
    render_png(scene, tmp_path / "merged.png", dpi=150)
    assert all(1 < images < glyphs for glyphs, images in counts)   # merged, and split
    monkeypatch.setattr(painter, "_glyph_images", lambda placed: [
        image for glyph in placed for image in merged([glyph])])
    render_png(scene, tmp_path / "single.png", dpi=150)
    assert (tmp_path / "merged.png").read_bytes() == (tmp_path / "single.png").read_bytes()


def test_drawing_order_holds_across_batches(tmp_path):
    # rect, then a line (a matplotlib artist between two batches), then a rect over the line
    scene = Scene(60, 20, (Rect(0, 0, 60, 20, fill="#0000ff"),
                           Line(0, 10, 60, 10, stroke="#ff0000", stroke_width=4),
                           Rect(30, 0, 30, 20, fill="#00ff00")), background="#ffffff")
    pixels = png_pixels(scene, tmp_path)
    assert pixels[10, 15, :3].tolist() == [255, 0, 0]    # the line over the first rect
    assert pixels[10, 45, :3].tolist() == [0, 255, 0]    # the second rect over the line
    assert pixels[2, 15, :3].tolist() == [0, 0, 255]


def test_png_text_without_the_glyph_cache_lands_in_the_same_place(tmp_path, monkeypatch):
    # Where this matplotlib lacks the per-glyph calls, matplotlib's Text draws the PNG text.
    from timelines.render import mpl

    scene = Scene(300, 40, (Text(150, 28, "Marrow & Fenwick", size=18, anchor="middle"),),
                  background="#ffffff")

    def ink(name):
        render_png(scene, tmp_path / name, dpi=96)
        grey = numpy.asarray(Image.open(tmp_path / name).convert("L"))
        dark = numpy.argwhere(grey < 128)
        return numpy.array([*dark.min(axis=0), *dark.max(axis=0)])

    cached = ink("cached.png")
    monkeypatch.setattr(mpl, "glyph_cache_works", lambda: False)
    assert numpy.abs(ink("text.png") - cached).max() <= 1


def test_a_fade_of_one_opacity_covers_the_pixels_a_rect_covers():
    """At a fractional top and bottom, a fade's partly covered rows are the rect's: the fade
    image's rows run the way Agg draws them (the top row once came out with the bottom's
    coverage and the bottom with the top's)."""
    import io

    import numpy
    from PIL import Image

    from timelines.render.mpl import render_png
    from timelines.scene.primitives import GradientRect, Rect, Scene

    def column(item) -> numpy.ndarray:
        out = io.BytesIO()
        render_png(Scene(100, 40, (item,), background="#ffffff"), out, dpi=150)
        return numpy.array(Image.open(io.BytesIO(out.getvalue())).convert("L"))[:, 60]

    for top, height in ((10.3, 12.4), (7.8, 5.55), (20.05, 3.3)):
        rect = column(Rect(10, top, 80, height, "#000000")).astype(int)
        fade = column(GradientRect(10, top, 80, height, "#000000", 1.0, 1.0)).astype(int)
        assert numpy.abs(rect - fade).max() <= 2, (top, height)
