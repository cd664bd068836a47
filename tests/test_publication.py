"""Publication settings: page size, font and font size, subtitle, credit and notes, the grid
with its minor ticks, and a legend that stays off the data."""
from __future__ import annotations

import struct
import xml.etree.ElementTree as ET

import pytest

from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene
from timelines.cli.commands import main
from timelines.errors import UsageError
from timelines.model import Endpoint, Precision, Provenance, Record, Span
from timelines.render import write
from timelines.scene.axis import axis_ticks
from timelines.scene.compose import ChartText
from timelines.scene.page import (
    MIN_BAR_GAP, PageSize, fit_height, font_note, length_text, parse_font_size, parse_size,
    png_dpi,
)
from timelines.scene.primitives import Rect, Scene, Text, find, walk
from timelines.scene.scale import TimeScale
from timelines.scene.textsize import text_width
from timelines.scene.theme import DEFAULT_THEME, lightness

SVG = "{http://www.w3.org/2000/svg}"
# CSS Values and Units Level 3, §5.2: 1in = 2.54cm = 25.4mm = 96px = 72pt.
PX_PER_MM = 96 / 25.4


def year(y: int) -> Endpoint:
    return Endpoint(day(y, 1, 1), day(y, 12, 31), Precision.YEAR)


def records(count: int = 3) -> list[Record]:
    return [Record(f"Record {i}", Span(year(1600 + 3 * i), year(1640 + 3 * i)),
                   Provenance("test.csv", i + 2)) for i in range(count)]


# --- sizes -----------------------------------------------------------------------------


@pytest.mark.parametrize("text, width, height, unit", [
    ("180x120mm", 180 * PX_PER_MM, 120 * PX_PER_MM, "mm"),
    ("7x5in", 672.0, 480.0, "in"),
    ("12x8cm", 120 * PX_PER_MM, 80 * PX_PER_MM, "cm"),
    ("1200x800px", 1200.0, 800.0, "px"),
    ("180 × 120 mm", 180 * PX_PER_MM, 120 * PX_PER_MM, "mm"),
    ("180mm", 180 * PX_PER_MM, None, "mm"),
])
def test_sizes_are_read_in_css_units(text, width, height, unit):
    size = parse_size(text)
    assert size.width == pytest.approx(width) and size.unit == unit
    assert size.height == (None if height is None else pytest.approx(height))


@pytest.mark.parametrize("text", ["180x120", "axbmm", "180x120yd", "20x20mm", ""])
def test_unreadable_or_tiny_sizes_are_usage_errors(text):
    with pytest.raises(UsageError):
        parse_size(text)


def test_font_sizes_are_points_unless_px_is_said():
    assert parse_font_size("9") == pytest.approx(12.0)      # 9pt = 12px (CSS §5.2)
    assert parse_font_size("9pt") == pytest.approx(12.0)
    assert parse_font_size("11px") == 11.0
    with pytest.raises(UsageError):
        parse_font_size("0")


def test_png_resolution_and_lengths_as_the_user_measures_them():
    assert png_dpi(None, None) == 150.0
    assert png_dpi(None, parse_size("1200x800px")) == 96.0   # one image pixel per px
    assert png_dpi(300.0, parse_size("1200x800px")) == 300.0
    assert png_dpi(None, parse_size("180x120mm")) == 150.0
    assert length_text(120 * PX_PER_MM, "mm") == "120 mm"
    assert length_text(480.0, "in") == "5.0 in" and length_text(800.4, "px") == "800px"


def test_another_font_is_noted_because_labels_are_measured_in_dejavu_sans():
    assert font_note("DejaVu Sans") is None and font_note("dejavu sans") is None
    assert "DejaVu Sans metrics" in font_note("Source Serif")


def test_font_size_scales_every_text_and_the_rows_that_hold_it():
    theme = DEFAULT_THEME.with_font_size(18.0)
    assert theme.font_size == 18.0
    assert theme.small_font_size == pytest.approx(15.0)     # 10 * 18/12
    assert theme.title_size == pytest.approx(27.0)
    assert theme.lane_height == pytest.approx(33.0) and theme.bar_height == pytest.approx(18.0)
    assert theme.margin == DEFAULT_THEME.margin              # the page margin stays


# --- fitting the height ------------------------------------------------------------------


def linear_chart(theme) -> Scene:
    """A stand-in chart 100 px of text plus ten lanes."""
    return Scene(theme.width, 100 + 10 * theme.lane_height, ())


def test_a_short_chart_is_padded_to_the_height():
    page = fit_height(linear_chart, DEFAULT_THEME, PageSize(960, 500, "px"))
    assert page.scene.height == 500 and page.theme == DEFAULT_THEME and page.warning is None


def test_a_tall_chart_gets_thinner_lanes_to_fit_exactly():
    page = fit_height(linear_chart, DEFAULT_THEME, PageSize(960, 280, "px"))   # needs 320
    assert page.scene.height == pytest.approx(280)
    assert page.theme.lane_height == pytest.approx(18.0)
    assert page.theme.bar_height == DEFAULT_THEME.bar_height   # bars keep their height
    assert page.warning is None


def test_a_chart_that_cannot_fit_grows_the_page_and_says_so():
    page = fit_height(linear_chart, DEFAULT_THEME, PageSize(960, 150, "px"))
    least = DEFAULT_THEME.bar_height + MIN_BAR_GAP
    assert page.theme.lane_height == pytest.approx(least)
    assert page.scene.height == pytest.approx(100 + 10 * least)
    assert "the chart needs 250px of height, more than the 150px of --size" in page.warning


def test_no_height_leaves_the_chart_as_tall_as_it_is():
    page = fit_height(linear_chart, DEFAULT_THEME, parse_size("180mm"))
    assert page.scene.height == 100 + 10 * DEFAULT_THEME.lane_height


# --- words ---------------------------------------------------------------------------


def test_subtitle_notes_and_credit_are_in_the_scene_and_the_desc():
    text = ChartText("Guild members", subtitle="Admissions and departures",
                     notes=("Dates are Old Style.", "Two registers disagree."),
                     credit="Source: the invented Fenwold guild book.")
    scene = build_scene(records(), text=text)
    [subtitle] = find(scene, "subtitle")
    [title] = find(scene, "title")
    assert subtitle.text == "Admissions and departures" and subtitle.y > title.y
    notes = [t.text for t in find(scene, "note")]
    assert notes == ["Dates are Old Style.", "Two registers disagree."]
    [credit] = find(scene, "credit")
    assert credit.y > max(t.y for t in find(scene, "note"))         # the last line
    assert credit.y < scene.height
    assert scene.desc.endswith("Admissions and departures. Dates are Old Style. "
                               "Two registers disagree. Source: the invented Fenwold guild book.")


def test_long_notes_wrap_within_the_page():
    text = ChartText(notes=("word " * 200,))
    scene = build_scene(records(), text=text)
    lines = find(scene, "note")
    assert len(lines) > 3
    assert all(text_width(t.text, t.size) <= scene.width - 2 * DEFAULT_THEME.margin
               for t in lines)


# --- grid, ticks and legend --------------------------------------------------------------


def test_minor_ticks_and_grid_lines_are_lighter_than_major_ones():
    scene = build_scene(records())
    major, minor = find(scene, "major"), find(scene, "minor")
    major_grid = [p for p in major if "grid" in p.css_class.split()]
    minor_grid = [p for p in minor if "grid" in p.css_class.split()]
    assert major_grid and len(minor_grid) > len(major_grid)
    assert lightness(minor_grid[0].stroke) > lightness(major_grid[0].stroke)
    assert minor_grid[0].stroke_width < major_grid[0].stroke_width
    major_tick = next(p for p in major if "tick" in p.css_class.split())
    minor_tick = next(p for p in minor if "tick" in p.css_class.split())
    assert minor_tick.y2 - minor_tick.y1 < major_tick.y2 - major_tick.y1


def test_a_narrow_axis_takes_fewer_labels_that_stand_apart():
    scale = TimeScale(float(day(1575, 1, 1)), float(day(1750, 1, 1)), 16.0, 216.0)
    labelled = [t for t in axis_ticks(scale, DEFAULT_THEME) if t.major and t.label]
    assert 2 <= len(labelled) < 8
    xs = [scale.x(t.day) for t in labelled]
    widths = [text_width(t.label, DEFAULT_THEME.small_font_size) for t in labelled]
    assert all(b - a >= (wa + wb) / 2 for a, b, wa, wb in zip(xs, xs[1:], widths, widths[1:]))


def test_the_legend_stays_below_the_axis():
    scene = build_scene(records())
    axis_bottom = max(t.y for t in find(scene, "tick-label"))
    legend_top = min(t.y - t.size for t in find(scene, "legend-text"))
    drawn = [p for group in find(scene, "record") for p in walk(group.children)
             if isinstance(p, Rect)]
    assert max(p.y + p.height for p in drawn) < axis_bottom < legend_top


# --- the command line -----------------------------------------------------------------


def png_size(path) -> tuple[int, int]:
    # PNG spec (ISO/IEC 15948) §11.2.2: IHDR, the first chunk, holds width and height
    data = path.read_bytes()
    return struct.unpack(">II", data[16:24])


def test_a_size_in_px_gives_a_png_of_exactly_those_pixels(tmp_path, capsys):
    out = tmp_path / "chart.png"
    assert main(["render", "--demo", "-o", str(out), "--size", "1200x800px"]) == 0
    assert png_size(out) == (1200, 800)


def test_a_size_in_mm_sets_the_svg_page(tmp_path, capsys):
    out = tmp_path / "chart.svg"
    assert main(["render", "--demo", "-o", str(out), "--size", "180x160mm"]) == 0
    root = ET.parse(out).getroot()
    width, height = float(root.get("width")), float(root.get("height"))
    assert width == pytest.approx(180 * PX_PER_MM, abs=0.01)
    assert height == pytest.approx(160 * PX_PER_MM, abs=0.01)
    assert root.get("viewBox") == f"0 0 {root.get('width')} {root.get('height')}"


def test_a_chart_too_tall_for_its_size_warns_on_stderr(tmp_path, capsys):
    out = tmp_path / "chart.svg"
    assert main(["render", "--demo", "-o", str(out), "--size", "180x60mm"]) == 0
    assert "warning: the chart needs " in capsys.readouterr().err


def test_size_and_width_together_are_a_usage_error(tmp_path, capsys):
    with pytest.raises(SystemExit) as exited:
        main(["render", "--demo", "-o", str(tmp_path / "x.svg"), "--size", "7x5in",
              "--width", "800"])
    assert exited.value.code == 2


def test_font_and_font_size_reach_the_svg(tmp_path, capsys):
    out = tmp_path / "chart.svg"
    assert main(["render", "--demo", "-o", str(out), "--font", "DejaVu Serif",
                 "--font-size", "8"]) == 0
    assert "label room is measured with DejaVu Sans metrics" in capsys.readouterr().err
    root = ET.parse(out).getroot()
    assert root.get("font-family").startswith("DejaVu Serif, DejaVu Sans")
    sizes = {float(t.get("font-size")) for t in root.iter(f"{SVG}text")
             if t.get("class") == "label"}
    assert len(sizes) == 1 and sizes.pop() == pytest.approx(8 * 96 / 72, abs=0.01)


def test_words_options_reach_the_svg_escaped(tmp_path, capsys):
    out = tmp_path / "chart.svg"
    hostile = "<script>alert(1)</script> & 'quotes'"
    assert main(["render", "--demo", "-o", str(out), "--subtitle", hostile,
                 "--credit", "Source: invented", "--note", "First.", "--note", "Second."]) == 0
    root = ET.parse(out).getroot()
    texts = {t.get("class"): [] for t in root.iter(f"{SVG}text")}
    for t in root.iter(f"{SVG}text"):
        texts[t.get("class")].append(t.text)
    assert texts["subtitle"] == [hostile]
    assert texts["credit"] == ["Source: invented"]
    assert "First." in texts["note"] and "Second." in texts["note"]
    assert not [e for e in root.iter() if e.tag.endswith("script")]
    desc = root.find(f"{SVG}desc").text
    assert hostile in desc and desc.endswith("First. Second. Source: invented.")


def test_notes_from_a_config_file(tmp_path, capsys):
    config = tmp_path / "chart.toml"
    config.write_text('note = "From the file."\nsubtitle = "Sub"\n', encoding="utf-8")
    out = tmp_path / "chart.svg"
    assert main(["render", "--demo", "-o", str(out), "--config", str(config)]) == 0
    notes = [t.text for t in ET.parse(out).getroot().iter(f"{SVG}text")
             if t.get("class") == "note"]
    assert notes == ["From the file."]


def test_lines_of_text_are_drawn_with_the_theme_colours():
    scene = build_scene(records(), text=ChartText(credit="c", notes=("n",)))
    [credit] = find(scene, "credit")
    assert isinstance(credit, Text) and credit.fill == DEFAULT_THEME.muted_color
    assert credit.style == "italic"


def test_write_takes_a_path_as_text_too(tmp_path):
    scene = build_scene(records())
    write(scene, str(tmp_path / "chart.svg"))
    write(scene, tmp_path / "chart-path.svg")
    assert (tmp_path / "chart.svg").read_bytes() == (tmp_path / "chart-path.svg").read_bytes()
    with pytest.raises(UsageError, match="must end in .svg, .png, .pdf or .html"):
        write(scene, str(tmp_path / "chart.txt"))
