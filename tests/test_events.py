"""Events dated by a window (issue 17, item 3): a row that dates one moment somewhere between a
not-before and a not-after is read as a point whose window runs from one to the other, drawn
as a marker in a graded window (never a bar), and named as an event in every output."""
from __future__ import annotations

import json
import xml.etree.ElementTree as ET

import pytest

from timelines import Chart
from timelines.calendar import fixed_from_gregorian as day
from timelines.cli.commands import main
from timelines.model import Qualifier
from timelines.scene import encodings as marks
from timelines.scene.bars import tooltip
from timelines.scene.encodings import EVENT_PEAK_OPACITY, EndWindow, LaneBox, MarkStyle
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, walk
from timelines.scene.scale import TimeScale

# An invented harbour register: each find or happening dated only by its bounds, with windows
# from one year to several centuries (the last row contradicts itself).
ROWS = [
    {"event": "Wreck at Gull Point", "tpq": "1703", "taq": "1703"},
    {"event": "Letter to the harbourmaster", "tpq": "1712-03-04", "taq": "1712-03-04"},
    {"event": "Coin hoard under the quay", "tpq": "c. 1650", "taq": "1690"},
    {"event": "Votive pit", "tpq": "1200", "taq": "1500"},
    {"event": "Amphora deposit", "tpq": "300 BC", "taq": "AD 100"},
    {"event": "Boundary stone set", "tpq": "", "taq": "1620"},
    {"event": "Burnt layer", "tpq": "1720", "taq": "1690"},
]
SVG = "{http://www.w3.org/2000/svg}"


def _chart(rows=ROWS) -> Chart:
    return Chart(rows, label="event").events(not_before="tpq", not_after="taq")


def _record(chart: Chart, name: str):
    return next(r for r in chart.records if r.label.startswith(name))


def _drawn(chart: Chart, name: str) -> list:
    [group] = [g for g in walk(chart.scene().children) if isinstance(g, Group)
               and g.css_class == "record" and g.title.startswith(name)]
    return list(walk(group.children))


def _of_class(parts: list, css_class: str) -> list:
    return [p for p in parts if css_class in p.css_class.split()]


def test_each_row_is_one_moment_from_the_not_before_to_the_not_after():
    chart = _chart()
    wreck = _record(chart, "Wreck")
    assert wreck.kind == "event" and wreck.is_event and wreck.span.is_point
    assert (wreck.span.start.earliest, wreck.span.start.latest) == (day(1703, 1, 1),
                                                                    day(1703, 12, 31))
    pit = _record(chart, "Votive pit").span.start        # Julian years, as the reader reads them
    assert pit.earliest == _record(Chart([{"when": "1200"}]), "row").span.start.earliest
    # c. 1650 as a not-before widens the earliest day by circa-year (5 years), and says so
    hoard = _record(chart, "Coin hoard").span.start
    assert hoard.earliest == day(1645, 1, 1) and hoard.latest == day(1690, 12, 31)
    assert Qualifier.APPROXIMATE in hoard.qualifiers and hoard.likely is None
    # an empty not-before is an unknown side, not a bound
    stone = _record(chart, "Boundary stone").span.start
    assert stone.earliest is None and stone.latest == day(1620, 12, 31)
    assert Qualifier.UNKNOWN_START in stone.qualifiers


def test_a_when_cell_is_one_moment_in_its_whole_window():
    rows = [{"event": "Inscribed lintel", "when": "1st century BC"},
            {"event": "Sherd", "when": "1650 ± 10"}, {"event": "Seal", "when": "1650-1660"}]
    as_spans = Chart(rows, label="event")
    events = Chart(rows, label="event").events()
    for name in ("Inscribed", "Seal"):
        span, moment = _record(as_spans, name).span, _record(events, name).span
        assert moment.is_point and not span.is_point
        assert (moment.start.earliest, moment.start.latest) == span.possible_extent
    sherd = _record(events, "Sherd").span.start          # a likely day of the moment is kept
    assert sherd.likely == day(1650, 7, 2)


def test_an_event_has_no_core_its_marker_in_the_middle_its_window_exact():
    chart = _chart()
    scale = chart.layout().scale
    for name in ("Wreck", "Coin hoard", "Votive pit", "Amphora"):
        window = _record(chart, name).span.start
        parts = _drawn(chart, name)
        assert not _of_class(parts, "core"), name
        [diamond] = [p for p in parts if isinstance(p, Polygon) and p.css_class == "point"]
        middle = scale.x((window.earliest + window.latest) / 2)
        assert min(x for x, _ in diamond.points) + max(x for x, _ in diamond.points) == (
            pytest.approx(2 * middle)), name
        band = [p for p in _of_class(parts, "event-window") if isinstance(p, GradientRect)]
        assert min(p.x for p in band) == pytest.approx(scale.x(window.earliest)), name
        assert max(p.x + p.width for p in band) == pytest.approx(scale.x(window.latest)), name
        # graded: faint at both bounds, never full colour, thinner than a bar
        assert band[0].opacity_left < band[0].opacity_right == EVENT_PEAK_OPACITY < 1.0
        assert band[-1].opacity_left == EVENT_PEAK_OPACITY > band[-1].opacity_right
        assert all(p.height < chart.options.theme.bar_height for p in band)


def test_the_marker_stands_on_the_likely_day():
    chart = Chart([{"event": "Sherd", "when": "1650 ± 10"}], label="event").events()
    scale = chart.layout().scale
    [diamond] = [p for p in _drawn(chart, "Sherd") if isinstance(p, Polygon)]
    assert diamond.points[0][0] == pytest.approx(scale.x(day(1650, 7, 2)))


def test_a_one_day_event_is_the_marker_alone():
    parts = _drawn(_chart(), "Letter")
    assert not _of_class(parts, "event-window") and not _of_class(parts, "core")
    assert [p.css_class for p in parts if isinstance(p, Polygon)] == ["point"]


def test_a_side_not_recorded_is_a_dashed_stretch_beyond_the_marker():
    chart = _chart()
    scale = chart.layout().scale
    parts = _drawn(chart, "Boundary stone")
    [diamond] = [p for p in parts if isinstance(p, Polygon)]
    marker_x = diamond.points[0][0]
    dashed = [p for p in _of_class(parts, "unknown") if isinstance(p, Line)]
    assert dashed and all(max(p.x1, p.x2) <= marker_x + 1e-9 for p in dashed)
    band = [p for p in _of_class(parts, "event-window") if isinstance(p, GradientRect)]
    assert min(p.x for p in band) >= marker_x - 1e-9
    assert max(p.x + p.width for p in band) == pytest.approx(scale.x(day(1620, 12, 31)))


def test_the_encoder_grades_the_window_towards_both_bounds():
    scale, lane = TimeScale(0.0, 10.0, 0.0, 100.0), LaneBox(0.0, 10.0)
    style = MarkStyle("#0072b2", far_opacity=0.1)
    parts = marks.MOMENT_WINDOWS["event"](EndWindow(2, 8, "event"), scale, lane, style)
    rises, falls = [p for p in parts if isinstance(p, GradientRect)]
    assert (rises.x, rises.x + rises.width, falls.x, falls.x + falls.width) == (20, 50, 50, 80)
    assert (rises.opacity_left, rises.opacity_right) == (0.1, EVENT_PEAK_OPACITY)
    assert [p.x1 for p in parts if isinstance(p, Line)] == [20, 80]      # a hairline at each
    peaked = marks.event_window(EndWindow(2, 8, "event", 3), scale, lane, style)
    assert peaked[0].x + peaked[0].width == 30
    assert marks.event_window(EndWindow(4, 4, "event"), scale, lane, style) == []


def test_the_tooltip_says_one_moment_between_its_bounds():
    chart = _chart()
    assert tooltip(_record(chart, "Wreck")).splitlines() == [
        "Wreck at Gull Point", "written: not before 1703; not after 1703",
        "one moment between 1703-01-01 and 1703-12-31", "source: rows:0"]
    stone = tooltip(_record(chart, "Boundary stone"))
    assert "one moment no later than 1620-12-31; no earliest date recorded" in stone
    sherd = Chart([{"event": "Sherd", "when": "1650 ± 10"}], label="event").events()
    assert "; most likely 1650-07-02" in tooltip(sherd.records[0])


def test_the_legend_and_the_description_name_events():
    scene = _chart().scene()
    legend = [t.text for t in walk(scene.children) if getattr(t, "css_class", "") == "legend-text"]
    assert "an event: one moment somewhere in the shaded window, not a duration" in legend
    assert not any(words.startswith("certain") for words in legend)
    assert scene.desc.startswith("Timeline of 6 events, from ")
    spans = Chart(ROWS, label="event", start="tpq", end="taq").scene()
    assert spans.desc.startswith("Timeline of 6 spans, from ")


def test_check_names_the_contradiction_and_counts_events():
    chart = _chart()
    [problem] = [p for p in chart.problems if p.kind == "contradiction"]
    assert (problem.row, problem.column) == (6, "taq")      # rows counted from 0
    assert problem.reason == "the not-after ('1690') lies before the not-before ('1720')"
    assert chart.report.summary() == "7 rows read: 6 events drawn, 1 reported (1 contradictory)"
    assert chart.report.as_dict()["holds"] == "events"
    spans = Chart(ROWS, label="event", start="tpq", end="taq")
    assert spans.report.summary().startswith("7 rows read: 6 drawn")
    assert spans.report.as_dict()["holds"] == "spans"


def test_a_long_window_is_said_as_one_moment():
    chart = _chart([{"event": "Tool mark", "tpq": "200", "taq": "1500"}])
    [warning] = chart.report.warnings
    assert warning.message == ("'200 – 1500' dates one moment in a window of about 1301 "
                               "years, more than 1000; is a year mistyped?")


def test_events_are_packed_by_their_drawn_window():
    rows = [{"event": f"Find {n}", "tpq": "1600", "taq": "1650"} for n in range(3)]
    placement = _chart(rows).layout().placement
    assert sorted(p.lane for p in placement.groups[0].records) == [0, 1, 2]


def _table(tmp_path):
    path = tmp_path / "register.csv"
    lines = ["event,tpq,taq"] + [f"{r['event']},{r['tpq']},{r['taq']}" for r in ROWS]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def test_the_command_line_reads_events(tmp_path, capsys):
    table, out = _table(tmp_path), tmp_path / "register.svg"
    code = main(["render", str(table), "--not-before", "tpq", "--not-after", "taq",
                 "--label", "event", "-o", str(out)])
    err = capsys.readouterr().err
    assert code == 1                                          # the burnt layer is reported
    assert "register.csv:8:taq: the not-after ('1690') lies before the not-before ('1720')" in err
    assert "7 rows read: 6 events drawn, 1 reported (1 contradictory)" in err
    root = ET.parse(out).getroot()
    assert root.find(f"{SVG}desc").text.startswith("Timeline of 6 events")
    assert b"<script" not in out.read_bytes()
    code = main(["check", str(table), "--events", "--start", "tpq", "--end", "taq", "--json"])
    assert json.loads(capsys.readouterr().out)["holds"] == "events"


def test_the_command_line_refuses_two_columns_for_one_bound(tmp_path, capsys):
    table = _table(tmp_path)
    code = main(["check", str(table), "--start", "tpq", "--not-before", "taq"])
    assert code == 2
    assert "give either --start or --not-before, not both" in capsys.readouterr().err


def test_events_in_a_config_file(tmp_path, capsys):
    config = tmp_path / "register.toml"
    config.write_text('not-before = "tpq"\nnot-after = "taq"\nlabel = "event"\n',
                      encoding="utf-8")
    main(["check", str(_table(tmp_path)), "--config", str(config)])
    assert "6 events drawn" in capsys.readouterr().out


def test_the_png_draws_events(tmp_path):
    path = tmp_path / "register.png"
    _chart().save(path)
    assert path.read_bytes().startswith(b"\x89PNG")


def test_counts_name_what_records_are_with_thousands_grouped():
    from timelines.model import EVENT, SPAN, Endpoint, Provenance, Record, Span, counted

    point = Span.point(Endpoint.day(day(1650, 1, 1)))
    spans = [Record("s", point, Provenance("t.csv", 2), kind=SPAN)] * 1234
    events = [Record("e", point, Provenance("t.csv", 2), kind=EVENT)] * 2
    assert counted(spans[:1]) == "1 span" and counted(events) == "2 events"
    assert counted(spans) == "1,234 spans"
    assert counted(spans + events) == "1,236 records (2 events, 1,234 spans)"
