"""A PNG drawn in bands of rows (issue 15): the file one canvas of the page gives, whatever
the band height; pages taller than Agg draws; memory that follows the band, not the page.

Each band is the whole page's geometry moved up by whole device rows, so Agg computes every
pixel's coverage as on one canvas: the tests ask for identical files (pixels, chunks and
compressed bytes alike), not for a tolerance.
"""
from __future__ import annotations

import io
import struct
import subprocess
import sys
import zlib
from importlib import resources
from pathlib import Path

import numpy
import pytest
from PIL import Image

from timelines import Chart
from timelines.render import mpl
from timelines.render.png import write_png, write_png_rows
from timelines.scene.primitives import (
    GradientRect, Group, Line, Polygon, Rect, Scene, Text,
)

ROOT = Path(__file__).resolve().parent.parent
DEMO = resources.files("timelines") / "demo" / "fenwold-organ-builders.csv"
ONE_CANVAS = 1 << 30      # a band taller than any page here: the whole page on one canvas
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"  # PNG specification (ISO/IEC 15948), section 5.2


def png_bytes(scene: Scene, dpi: float, band_height: int, monkeypatch) -> bytes:
    monkeypatch.setattr(mpl, "PNG_BAND_HEIGHT", band_height)
    out = io.BytesIO()
    mpl.render_png(scene, out, dpi=dpi)
    return out.getvalue()


def pixels(data: bytes) -> numpy.ndarray:
    return numpy.asarray(Image.open(io.BytesIO(data)))


def chunks(data: bytes) -> list[tuple[bytes, bytes]]:
    """(type, data) of each chunk, each CRC checked (PNG 5.3; 5.5: the CRC-32 of zlib)."""
    assert data.startswith(PNG_SIGNATURE)
    found, at = [], len(PNG_SIGNATURE)
    while at < len(data):
        (length,) = struct.unpack(">I", data[at:at + 4])
        kind, body = data[at + 4:at + 8], data[at + 8:at + 8 + length]
        assert struct.unpack(">I", data[at + 8 + length:at + 12 + length])[0] == \
            zlib.crc32(kind + body)
        found.append((kind, body))
        at += 12 + length
    return found


def crossing_scene(background: str | None = "#ffffff") -> Scene:
    """Everything a band edge can cut through: fades and bars with fractional edges, text, a
    tall dashed line (Agg would restart the dashes where it clips), slanted lines and
    polygons, stroked and open shapes, a group taller than a band."""
    bars = tuple(
        Group((GradientRect(20.3, y, 30.2, 9.7, "#0072B2", 0.0, 1.0),
               Rect(50.5, y, 90.25, 9.7, fill="#0072B2", stroke="#000000", stroke_width=0.8),
               GradientRect(140.75, y, 25.1, 9.7, "#0072B2", 1.0, 0.2, stops=(1.0, 0.3, 0.6)),
               Text(170.2, y + 8.4, f"Wendeline Pask {y:.1f} \u2013 c. 1650", size=11.5)),
              css_class="record", title=str(y))
        for y in numpy.arange(4.37, 300, 13.61))
    return Scene(
        360, 310,
        (
            Line(10.5, 0, 10.5, 310, stroke="#888888", stroke_width=0.5),
            Line(14.25, -20, 14.25, 330, stroke="#333333", stroke_width=1.5, dash=(3.0, 2.0)),
            Line(330, 10.3, 350, 290.7, stroke="#D55E00", stroke_width=1.25, dash=(4.0, 1.5)),
            Group(bars, css_class="group"),
            Polygon(((300.2, 40.1), (310.4, 30.3), (320.6, 40.1), (310.4, 49.9)),
                    fill="#D55E00", stroke="#ffffff", stroke_width=0.75),
            Polygon(((290, 95.5), (295, 60.2), (300, 95.5)), fill=None, stroke="#000000",
                    stroke_width=1.5, closed=False),
            Line(200.1, 100.3, 280.7, 180.9, stroke="#009E73", stroke_width=3.0),
            Rect(230.4, 200.2, 40.3, 60.7, fill=None, stroke="#CC79A7", stroke_width=2.0),
            Text(250, 250.6, "\u00c7\u00e0 \u01fa \u1ec6 gjpqy", size=30, anchor="middle",
                 weight="bold"),
        ),
        title="Bands", desc="A scene cut by many band edges.", background=background,
        metadata=(("Author", "timelines tests"),),
    )


def masons(count: int) -> list:
    """Records of invented spans in three groups: bars, fades and labels, nothing slanted
    (a slanted shape widens the margin a band is drawn with, hiding what a narrow one
    would show)."""
    from timelines.calendar import fixed_from_gregorian
    from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span

    def year(y, qualifiers=frozenset()):
        return Endpoint(fixed_from_gregorian(y, 1, 1), fixed_from_gregorian(y, 12, 31),
                        Precision.YEAR, qualifiers)

    return [Record(f"Mason {i}", Span(year(1500 + i * 7 % 300,
                                           frozenset({Qualifier.APPROXIMATE}) if i % 4 else
                                           frozenset()),
                                      year(1500 + i * 7 % 300 + 5 + i % 40)),
                   Provenance("test", i + 2), group=f"Lodge {i % 3}") for i in range(count)]


def bars(count: int) -> Scene:
    from timelines.chart import build_scene

    return build_scene(masons(count))


def demo(**settings) -> Scene:
    chart = Chart(DEMO)
    if settings.get("activity"):
        chart = chart.activity(settings["activity"])
    if settings.get("facet"):
        chart = chart.facet(settings["facet"])
    return chart.scene()


SCENES = {
    "bars": lambda: bars(150),
    "crossing": crossing_scene,
    "crossing-transparent": lambda: crossing_scene(background=None),
    "demo-activity": lambda: demo(activity="decade"),
    "demo-facets": lambda: demo(facet="category"),
}


# --- bands join without seams ---------------------------------------------------------------

# 97 rows: bands end inside bars, fades, glyphs and dashes; 101 dpi: a page px is 1.052...
# device px, so band edges fall between page units and only whole device rows keep the grid.
@pytest.mark.parametrize("name", SCENES)
@pytest.mark.parametrize("dpi", [96, 101, 150])
def test_a_banded_png_is_the_file_one_canvas_gives(name, dpi, monkeypatch):
    scene = SCENES[name]()
    whole = png_bytes(scene, dpi, ONE_CANVAS, monkeypatch)
    banded = png_bytes(scene, dpi, 97, monkeypatch)
    assert len(pixels(whole)) > 3 * 97                  # several bands, several edges
    assert numpy.array_equal(pixels(banded), pixels(whole))
    assert banded == whole     # the same filtered rows, so the same zlib stream too


@pytest.mark.parametrize("band_height", [1, 2, 13, 256])
def test_any_band_height_gives_the_same_pixels(band_height, monkeypatch):
    scene = crossing_scene()
    whole = pixels(png_bytes(scene, 150, ONE_CANVAS, monkeypatch))
    assert numpy.array_equal(pixels(png_bytes(scene, 150, band_height, monkeypatch)), whole)


def test_a_tall_chart_in_bands_of_the_default_height(monkeypatch):
    # A chart of many bars, at 300 dpi: three bands of the default 4,096 rows.
    default = mpl.PNG_BAND_HEIGHT
    scene = bars(600)
    whole = png_bytes(scene, 300, ONE_CANVAS, monkeypatch)
    banded = png_bytes(scene, 300, default, monkeypatch)
    assert len(pixels(whole)) > 2 * default
    assert banded == whole


def test_metadata_is_what_one_canvas_writes(monkeypatch):
    # Text chunks and the physical size, in the order the writer has always used: IHDR, the
    # text, pHYs, then the image data (PNG 5.6, 11.3.4.3, 11.3.5.3).
    scene = crossing_scene()
    banded = chunks(png_bytes(scene, 150, 97, monkeypatch))
    whole = chunks(png_bytes(scene, 150, ONE_CANVAS, monkeypatch))
    assert [c for c in banded if c[0] != b"IDAT"] == [c for c in whole if c[0] != b"IDAT"]
    kinds = [kind for kind, _ in banded]
    assert kinds[:5] == [b"IHDR", b"tEXt", b"tEXt", b"tEXt", b"pHYs"]
    assert set(kinds[5:-1]) == {b"IDAT"} and kinds[-1] == b"IEND"
    texts = [body for kind, body in banded if kind == b"tEXt"]
    assert texts == [b"Title\0Bands", b"Description\0A scene cut by many band edges.",
                     b"Author\0timelines tests"]
    # 150 dpi is 5905.5 px per metre, rounded up; unit 1 is the metre
    assert struct.unpack(">IIB", dict(banded)[b"pHYs"]) == (5906, 5906, 1)
    width, height, depth, colour = struct.unpack(">IIBB", dict(banded)[b"IHDR"][:10])
    assert (width, height, depth, colour) == (562, 484, 8, 2)   # 360 x 310 px at 150 dpi


# --- pages of any height --------------------------------------------------------------------

def test_a_page_taller_than_agg_draws():
    # Agg draws no canvas over 2^23 px a side (matplotlib 3.10; 2^16 before); a band is all
    # it draws at once.
    height = (1 << 23) + 1000
    scene = Scene(4, height, (
        Rect(0, 0, 4, 10, fill="#ff0000"),
        Rect(1, height // 2, 2, 3, fill="#00ff00"),
        GradientRect(0, height - 300, 4, 100, "#0000ff", 1.0, 1.0),
        Rect(0, height - 10, 4, 10, fill="#000000"),
    ))
    out = io.BytesIO()
    mpl.render_png(scene, out, dpi=96)
    image = Image.open(io.BytesIO(out.getvalue()))
    assert image.size == (4, height)
    drawn = numpy.asarray(image)
    assert drawn[0, 0].tolist() == [255, 0, 0]
    assert drawn[height // 2 + 1, :, 1].tolist() == [255, 255, 255, 255]
    assert drawn[height // 2 + 1, :, 0].tolist() == [255, 0, 0, 255]
    assert drawn[height - 250, 0].tolist() == [0, 0, 255]
    assert drawn[height - 1, 3].tolist() == [0, 0, 0]
    assert drawn[height - 20, 0].tolist() == [255, 255, 255]


def test_memory_follows_the_band_not_the_page(tmp_path):
    # 1,000 x 100,000 px: one canvas of it would be 400 MB; a band of 4,096 rows is 16 MB.
    script = (
        "import resource, sys\n"
        f"sys.path.insert(0, {str(ROOT)!r})\n"
        "import matplotlib.backends.backend_agg\n"
        "from timelines.render.mpl import render_png\n"
        "from timelines.scene.primitives import Line, Rect, Scene, Text\n"
        "items = [Rect(10, y, 200, 12, fill='#0072B2') for y in range(0, 100000, 997)]\n"
        "items += [Text(220, y + 10, f'row {y}') for y in range(0, 100000, 997)]\n"
        "items.append(Line(5, 0, 5, 100000, stroke='#888888'))\n"
        "scene = Scene(1000, 100000, tuple(items))\n"
        "before = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss\n"
        "render_png(scene, sys.argv[1], dpi=96)\n"
        "print(resource.getrusage(resource.RUSAGE_SELF).ru_maxrss - before)\n"
    )
    done = subprocess.run([sys.executable, "-c", script, str(tmp_path / "tall.png")],
                          check=True, capture_output=True, text=True)
    grown_kib = int(done.stdout.split()[-1])           # ru_maxrss is in KiB on Linux
    assert grown_kib < 150_000
    header = dict(chunks((tmp_path / "tall.png").read_bytes()))[b"IHDR"]
    assert struct.unpack(">II", header[:8]) == (1000, 100000)


# --- the writer -----------------------------------------------------------------------------

@pytest.mark.parametrize("channels", [3, 4])
def test_rows_in_uneven_bands_make_the_file_one_array_makes(channels, tmp_path):
    # The Up filter (PNG 9.2) takes the row above from the band before.
    rng = numpy.random.default_rng(15)
    image = rng.integers(0, 256, size=(700, 33, channels), dtype=numpy.uint8)
    image[300:400] = image[299]                       # rows repeating across band edges
    metadata = {"Title": "Rows", "Author": "Ana\u00efs \u0141"}
    write_png(tmp_path / "one.png", image, 150, metadata)
    edges = [0, 1, 2, 97, 256, 257, 600, 700]
    bands = (image[start:stop] for start, stop in zip(edges, edges[1:]))
    write_png_rows(tmp_path / "bands.png", 33, 700, bands, 150, metadata)
    assert (tmp_path / "bands.png").read_bytes() == (tmp_path / "one.png").read_bytes()
    assert numpy.array_equal(numpy.asarray(Image.open(tmp_path / "bands.png")), image)


def test_idat_chunks_fill_before_the_next_begins(tmp_path, monkeypatch):
    from timelines.render import png

    monkeypatch.setattr(png, "PNG_IDAT_BYTES", 1000)
    noise = numpy.random.default_rng(1).integers(0, 256, size=(90, 50, 3), dtype=numpy.uint8)
    write_png_rows(tmp_path / "a.png", 50, 90, (noise[i:i + 7] for i in range(0, 90, 7)),
                   96, {})
    sizes = [len(body) for kind, body in chunks((tmp_path / "a.png").read_bytes())
             if kind == b"IDAT"]
    assert len(sizes) > 3 and set(sizes[:-1]) == {1000} and 0 < sizes[-1] <= 1000
    assert numpy.array_equal(numpy.asarray(Image.open(tmp_path / "a.png")), noise)


@pytest.mark.parametrize("bands, message", [
    ([numpy.zeros((5, 4, 3), numpy.uint8)], "5 rows for a PNG of 6"),
    ([numpy.zeros((4, 4, 3), numpy.uint8)] * 2, "more than the 6 rows"),
    ([numpy.zeros((6, 5, 3), numpy.uint8)], "a band of (6, 5, 3) pixels"),
    ([numpy.zeros((3, 4, 3), numpy.uint8), numpy.zeros((3, 4, 4), numpy.uint8)],
     "a band of (3, 4, 4) pixels"),
    ([], "bands of rows x width x 3 or 4"),
])
def test_rows_that_do_not_make_the_image_are_refused(bands, message):
    with pytest.raises(ValueError, match=message.replace("(", r"\(").replace(")", r"\)")):
        write_png_rows(io.BytesIO(), 4, 6, iter(bands), 96, {})
