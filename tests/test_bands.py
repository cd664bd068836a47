"""Background bands (--bands): named periods behind the lanes, with their own fuzzy ends.
Geometry checked on the Scene's numbers; the table read through the CLI."""
from __future__ import annotations

import xml.etree.ElementTree as ET

import pytest

from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene
from timelines.cli.commands import main
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.scene import encodings as marks
from timelines.scene.bands import band_bounds, on_axis, place_bands
from timelines.scene.encodings import EndWindow, LaneBox
from timelines.scene.measure import chart_scale
from timelines.scene.primitives import GradientRect, Group, Rect, Text, find, walk
from timelines.scene.scale import TimeScale
from timelines.scene.theme import DEFAULT_THEME

SVG = "{http://www.w3.org/2000/svg}"
SCALE = TimeScale(0.0, 100.0, 50.0, 250.0)     # 2 px per day, x = 50 + 2 * day


def years(first: int, last: int, precision=Precision.YEAR) -> Endpoint:
    return Endpoint(day(first, 1, 1), day(last, 12, 31), precision)


def record(label, start, end, row=2) -> Record:
    return Record(label, Span(start, end), Provenance("test.csv", row))


RECORDS = [record("Ansel", years(1630, 1630), years(1690, 1690)),
           record("Berit", years(1650, 1650), years(1700, 1700), 3)]
# "1640s" to "c. 1665": a decade's window, then an end window of 1660..1670
TROUBLES = record("Troubles", years(1640, 1649, Precision.DECADE), years(1660, 1670), 2)
CHARTER = record("The chartered years", years(1672, 1672), years(1688, 1688), 3)


def bands_of(scene) -> list[Group]:
    return [p for p in walk(scene.children) if isinstance(p, Group) and p.css_class == "band"]


def test_band_is_a_pale_rect_fading_in_and_out_across_its_windows():
    box = LaneBox(10.0, 100.0)
    fade_in, core, fade_out = marks.band(EndWindow(10, 20, "start"), EndWindow(40, 60, "end"),
                                         SCALE, box, "#7f7f7f", 0.2)
    assert isinstance(fade_in, GradientRect) and isinstance(fade_out, GradientRect)
    assert (fade_in.x, fade_in.width, fade_in.opacity_left, fade_in.opacity_right) == (
        70.0, 20.0, 0.0, 0.2)
    assert isinstance(core, Rect) and (core.x, core.width, core.opacity) == (90.0, 40.0, 0.2)
    assert (fade_out.x, fade_out.width, fade_out.opacity_left, fade_out.opacity_right) == (
        130.0, 40.0, 0.2, 0.0)
    assert (core.y, core.height) == (10.0, 100.0)
    exact = marks.band(EndWindow(10, 10, "start"), EndWindow(60, 60, "end"), SCALE, box,
                       "#7f7f7f", 0.2)
    assert [type(p) for p in exact] == [Rect]       # certain ends: no fading edge


def test_band_bounds_clip_to_the_axis_and_run_open_sides_to_the_edge():
    domain = (float(day(1600, 1, 1)), float(day(1700, 1, 1)))
    start, end = band_bounds(TROUBLES.span, domain)
    assert (start.low, start.high) == (day(1640, 1, 1), day(1649, 12, 31))
    assert (end.low, end.high) == (day(1660, 1, 1), day(1670, 12, 31))
    running = Span(years(1690, 1690), Endpoint.open(Qualifier.OPEN_END))
    _, end = band_bounds(running, domain)
    assert end.low == end.high == domain[1]
    early = Span(years(1500, 1500), years(1650, 1650))
    start, _ = band_bounds(early, domain)
    assert start.low == start.high == domain[0]


def test_overlapping_windows_meet_halfway():
    # start 1640..1660 and end 1650..1670: no certain part; the fades meet in the middle
    span = Span(years(1640, 1660), years(1650, 1670))
    start, end = band_bounds(span, (float(day(1600, 1, 1)), float(day(1700, 1, 1))))
    assert start.high == end.low == pytest.approx((day(1660, 12, 31) + day(1650, 1, 1)) / 2)


def test_bands_wholly_off_the_axis_are_set_apart():
    domain = (float(day(1600, 1, 1)), float(day(1700, 1, 1)))
    late = record("Later times", years(1750, 1750), years(1800, 1800))
    shown, off = on_axis([TROUBLES, late], domain)
    assert shown == [TROUBLES] and off == [late]


def test_labels_that_would_touch_go_to_a_second_row():
    scale = TimeScale(float(day(1600, 1, 1)), float(day(1700, 1, 1)), 100.0, 500.0)
    near = record("Another long period name", years(1650, 1650), years(1668, 1668))
    placed = place_bands([TROUBLES, near, CHARTER], scale, DEFAULT_THEME)
    rows = {band.record.label: band.row for band in placed}
    assert rows["Troubles"] == 0 and rows["Another long period name"] == 1
    assert rows["The chartered years"] == 0


def test_bands_are_drawn_behind_the_lanes_from_the_strip_to_the_axis():
    plain = build_scene(RECORDS)
    scene = build_scene(RECORDS, bands=[TROUBLES, CHARTER])
    order = list(walk(scene.children))
    first_band = order.index(bands_of(scene)[0])
    first_record = next(i for i, p in enumerate(order)
                        if isinstance(p, Group) and p.css_class == "record")
    assert first_band < first_record                       # drawn first: behind
    [axis] = find(scene, "axis-line")
    troubles = bands_of(scene)[0]
    [core] = [p for p in troubles.children if "band-core" in p.css_class]
    assert core.y + core.height == pytest.approx(axis.y1)  # down to the axis line
    [label] = [p for p in troubles.children if isinstance(p, Text)]
    assert label.text == "Troubles" and "band-label" in label.css_class
    lanes_top = min(p.y for p in find(scene, "core") if isinstance(p, Rect))
    assert core.y < label.y < lanes_top                    # the label above the lanes
    plain_top = min(p.y for p in find(plain, "core") if isinstance(p, Rect))
    assert lanes_top > plain_top                           # lanes moved down for the strip


def test_band_geometry_follows_the_chart_scale():
    scene = build_scene(RECORDS, bands=[TROUBLES])
    scale = chart_scale(RECORDS, DEFAULT_THEME)            # bands do not move the axis
    fade_in, core, fade_out = bands_of(scene)[0].children[:3]
    assert fade_in.x == pytest.approx(scale.x(day(1640, 1, 1)))
    assert core.x == pytest.approx(scale.x(day(1649, 12, 31)))
    assert core.x + core.width == pytest.approx(scale.x(day(1660, 1, 1)))
    assert fade_out.x + fade_out.width == pytest.approx(scale.x(day(1670, 12, 31)))
    assert (fade_in.opacity_left, fade_out.opacity_right) == (0.0, 0.0)


def test_neighbouring_bands_alternate_strength_and_the_legend_explains_fading_edges():
    scene = build_scene(RECORDS, bands=[TROUBLES, CHARTER])
    opacities = [next(p.opacity for p in band.children if isinstance(p, Rect))
                 for band in bands_of(scene)]
    assert opacities == list(DEFAULT_THEME.band_opacities)
    legend = " ".join(t.text for t in find(scene, "legend-text"))
    assert "its edge fades where its start or end is uncertain" in legend
    exact_only = build_scene(RECORDS, bands=[record("Exact", Endpoint.day(day(1650, 1, 1)),
                                                    Endpoint.day(day(1660, 1, 1)))])
    assert "fades" not in " ".join(t.text for t in find(exact_only, "legend-text"))


def test_cli_reads_a_band_table_with_fuzzy_dates(tmp_path, capsys):
    table = tmp_path / "people.csv"
    table.write_text("name,start,end\nAnsel,1630,1690\nBerit,1650,1700\n", encoding="utf-8")
    bands = tmp_path / "periods.csv"
    bands.write_text("label,start,end\nTroubles,1640s,c. 1660\nCharter,1672,before 1689\n"
                     "Much later,1800,1850\nBroken,1650-13,1660\n", encoding="utf-8")
    out = tmp_path / "chart.svg"
    code = main(["render", str(table), "-o", str(out), "--bands", str(bands)])
    err = capsys.readouterr().err
    assert code == 1                                    # a band row could not be read
    assert "periods.csv:5:start: " in err and "1650-13" in err
    assert "note: bands not drawn, outside the time shown or undated: 'Much later'" in err
    root = ET.parse(out).getroot()
    labels = [t.text for t in root.iter(f"{SVG}text") if t.get("class") == "band-label"]
    assert labels == ["Troubles", "Charter"]
    fringes = [e for e in root.iter(f"{SVG}rect") if e.get("class") == "band-fringe"]
    assert len(fringes) >= 3                            # 1640s, c. 1660 and before 1689
