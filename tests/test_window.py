"""--from/--to: the axis shows the window only; records outside are reported, records across an
edge are cut there and marked as continuing. Checked on the Scene's numbers and in the CLI."""
from __future__ import annotations

import datetime
import xml.etree.ElementTree as ET

import pytest

from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene, parse_window
from timelines.cli.commands import main
from timelines.errors import UsageError
from timelines.layout.window import TimeWindow, outside_note, split_by_window
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.scene import encodings as marks
from timelines.scene.bars import cut_sides
from timelines.scene.encodings import LaneBox, MarkStyle
from timelines.scene.primitives import GradientRect, Group, Polygon, Rect, Text, find, walk
from timelines.scene.scale import TimeScale
from timelines.scene.textsize import text_width

SVG = "{http://www.w3.org/2000/svg}"


def year(y: int, *qualifiers: Qualifier) -> Endpoint:
    return Endpoint(day(y, 1, 1), day(y, 12, 31), Precision.YEAR, frozenset(qualifiers))


def record(label, start, end, row=2) -> Record:
    return Record(label, Span(start, end), Provenance("test.csv", row))


def records_in(scene) -> list[Group]:
    return [p for p in walk(scene.children) if isinstance(p, Group) and p.css_class == "record"]


def the_record(scene, label: str) -> Group:
    [group] = [g for g in records_in(scene) if g.title.startswith(label)]
    return group


def parts(group: Group, kind, css: str):
    return [p for p in walk(group.children) if isinstance(p, kind) and css in p.css_class.split()]


WINDOW = parse_window("1650", "1700")
RECORDS = [record("inside", year(1660), year(1670), 2),
           record("across start", year(1620), year(1680), 3),
           record("across both", year(1600), year(1750), 4),
           record("before", year(1600), year(1640), 5),
           record("after", year(1710), year(1720), 6),
           record("open", Endpoint.open(Qualifier.OPEN_START), year(1660), 7)]


# --- the window itself ----------------------------------------------------------------


def test_from_counts_from_the_earliest_day_and_to_up_to_the_latest():
    # datetime.date.toordinal() counts R.D. days (Python docs), the oracle for fixed days
    assert WINDOW.start == datetime.date(1650, 1, 1).toordinal()
    assert WINDOW.end == datetime.date(1700, 12, 31).toordinal()
    decades = parse_window("1650s", "1690s")
    assert decades.end == datetime.date(1699, 12, 31).toordinal()


def test_either_side_may_be_left_to_the_records():
    assert parse_window(None, None) is None
    only_from = parse_window("1650", None)
    assert only_from.end is None and only_from.domain(1.0, 9e5) == (only_from.start, 9e5)


@pytest.mark.parametrize("start, end, words", [
    ("1700", "1650", "is empty"),
    ("1650", "1650-13", "--to: cannot read"),
    ("../1650", "1700", "has no day to start the axis at"),
])
def test_a_window_that_cannot_work_is_a_usage_error(start, end, words):
    with pytest.raises(UsageError, match=words):
        parse_window(start, end)


def test_records_wholly_outside_are_split_off_and_undated_ones_kept():
    undated = Record("no date", None, Provenance("test.csv", 8))
    kept, outside = split_by_window([*RECORDS, undated], WINDOW)
    assert [r.label for r in outside] == ["before", "after"]
    assert [r.label for r in kept] == ["inside", "across start", "across both", "open",
                                       "no date"]
    assert outside_note(1) == "1 record lies outside --from/--to"
    assert outside_note(3) == "3 records lie outside --from/--to"


def test_a_window_touching_a_record_keeps_it():
    edge = TimeWindow(day(1640, 12, 31), day(1700, 12, 31))
    assert edge.may_hold(RECORDS[3].span)           # ends on the window's first day


# --- the continuing mark ---------------------------------------------------------------


def test_continues_mark_is_a_zigzag_at_the_edge_leaning_outward():
    scale = TimeScale(0.0, 100.0, 50.0, 250.0)
    lane = LaneBox(10.0, 12.0)
    [end] = marks.continues_mark(100, "end", scale, lane, MarkStyle("#0072B2"))
    assert isinstance(end, Polygon) and not end.closed and end.fill is None
    xs = [x for x, _ in end.points]
    ys = [y for _, y in end.points]
    assert min(xs) == 250.0 and max(xs) == pytest.approx(250.0 + 12 * 0.3)
    assert ys == sorted(ys) and ys[0] < lane.y and ys[-1] > lane.y + lane.height
    assert len(end.points) == 7                     # three teeth
    [start] = marks.continues_mark(0, "start", scale, lane, MarkStyle("#0072B2"))
    assert max(x for x, _ in start.points) == 50.0 and min(x for x, _ in start.points) < 50.0


def test_cut_sides_leave_open_ends_to_their_arrow():
    domain = (float(WINDOW.start), float(WINDOW.end))
    assert cut_sides(RECORDS[0].span, domain) == (False, False)
    assert cut_sides(RECORDS[1].span, domain) == (True, False)
    assert cut_sides(RECORDS[2].span, domain) == (True, True)
    assert cut_sides(RECORDS[5].span, domain) == (False, False)   # open start: an arrow


# --- on the scene ------------------------------------------------------------------------


def test_the_axis_shows_the_window_only():
    scene = build_scene(RECORDS, window=WINDOW)
    [line] = find(scene, "axis-line")
    across = the_record(scene, "across both")
    [core] = parts(across, Rect, "core")
    assert (core.x, core.x + core.width) == pytest.approx((line.x1, line.x2))
    labels = [t.text for t in find(scene, "tick-label")]
    assert labels[0] == "1650" and labels[-1] == "1700"


def test_records_outside_are_not_drawn_but_named_under_the_chart():
    scene = build_scene(RECORDS, window=WINDOW)
    drawn = [g.title.splitlines()[0] for g in records_in(scene)]
    assert "before" not in drawn and "after" not in drawn and len(drawn) == 4
    notes = " ".join(t.text for t in find(scene, "note"))
    assert "2 records lie outside the time shown, not drawn: before (row 5), after (row 6)" \
        in notes
    assert "2 outside the time shown" in scene.desc


def test_a_record_across_an_edge_is_cut_there_and_marked():
    scene = build_scene(RECORDS, window=WINDOW)
    [line] = find(scene, "axis-line")
    across = the_record(scene, "across start")
    [zigzag] = parts(across, Polygon, "continues")
    assert max(x for x, _ in zigzag.points) == pytest.approx(line.x1)
    shapes = [p for p in walk(across.children) if isinstance(p, (Rect, GradientRect))]
    assert min(s.x for s in shapes) == pytest.approx(line.x1)      # nothing left of the axis
    assert parts(the_record(scene, "inside"), Polygon, "continues") == []
    assert parts(the_record(scene, "open"), Polygon, "open")      # open keeps its arrow
    assert len(parts(the_record(scene, "across both"), Polygon, "continues")) == 2
    legend = [t.text for t in find(scene, "legend-text")]
    assert "continues beyond the window shown" in legend


def test_signs_of_dates_beyond_the_window_are_left_out():
    rec = record("c. start", year(1630, Qualifier.APPROXIMATE),
                 Endpoint(None, day(1720, 12, 31), Precision.YEAR,
                          frozenset({Qualifier.BEFORE})))
    scene = build_scene([rec, RECORDS[0]], window=WINDOW)
    group = the_record(scene, "c. start")
    assert parts(group, Text, "qualifier") == []        # the ~ belongs to 1630, off the axis
    assert parts(group, Polygon, "bound") == []         # the ] belongs to 1720
    assert len(parts(group, Polygon, "continues")) == 2
    unwindowed = the_record(build_scene([rec, RECORDS[0]]), "c. start")
    assert parts(unwindowed, Text, "qualifier") and parts(unwindowed, Polygon, "bound")


def test_a_point_whose_moment_is_outside_keeps_only_its_line():
    # a moment in 1645..1655, most likely 1648: its diamond is off the axis
    point = Endpoint(day(1645, 1, 1), day(1655, 12, 31), Precision.DECADE,
                     likely=day(1648, 6, 1))
    scene = build_scene([record("moment", point, point), RECORDS[0]], window=WINDOW)
    group = the_record(scene, "moment")
    assert parts(group, Polygon, "point") == []
    assert parts(group, Polygon, "continues")


# --- the command line -----------------------------------------------------------------


def test_cli_reports_the_count_on_stderr_and_exits_0(tmp_path, capsys):
    table = tmp_path / "t.csv"
    table.write_text("name,start,end\nA,1660,1670\nB,1600,1640\nC,1620,1680\nD,1710,1720\n",
                     encoding="utf-8")
    out = tmp_path / "t.svg"
    code = main(["render", str(table), "-o", str(out), "--from", "1650", "--to", "1700"])
    err = capsys.readouterr().err
    assert code == 0                          # leaving rows out was asked for, not an error
    assert "note: 2 records lie outside --from/--to (named under the chart)" in err
    assert "4 rows read: 2 drawn; 2 outside --from/--to" in err
    root = ET.parse(out).getroot()
    assert len([g for g in root.iter(f"{SVG}g") if g.get("class") == "record"]) == 2
    notes = " ".join(t.text or "" for t in root.iter(f"{SVG}text") if t.get("class") == "note")
    assert "B (row 3), D (row 5)" in notes
    assert any("continues" in (e.get("class") or "") for e in root.iter())


def test_cli_window_usage_errors_exit_2(tmp_path, capsys):
    code = main(["render", "--demo", "-o", str(tmp_path / "x.svg"), "--from", "1700",
                 "--to", "1600"])
    assert code == 2 and "error: the window --from '1700' --to '1600' is empty" in \
        capsys.readouterr().err


def test_lanes_report_takes_the_window_too(capsys):
    assert main(["lanes", "--demo", "--from", "1655", "--to", "1700"]) == 0
    err = capsys.readouterr().err
    assert "note: 1 record lies outside --from/--to\n" in err
    assert "16 rows read: 15 drawn; 1 outside --from/--to" in err


def test_a_window_holding_no_record_is_a_usage_error(tmp_path, capsys):
    table = tmp_path / "t.csv"
    table.write_text("name,start,end\nA,1660,1670\nB,1600,1640\n", encoding="utf-8")
    code = main(["render", str(table), "-o", str(tmp_path / "t.svg"), "--from", "1800",
                 "--to", "1900"])
    err = capsys.readouterr().err
    assert code == 2
    assert "error: nothing to draw: all 2 dated records lie outside --from/--to" in err
    assert not (tmp_path / "t.svg").exists()


# --- a bar across the whole window -------------------------------------------------------

def _wcag_luminance(red: float, green: float, blue: float) -> float:
    """Relative luminance of an sRGB colour, components 0..1 (WCAG 2.1, definitions)."""
    def linear(c):
        return c / 12.92 if c <= 0.03928 else ((c + 0.055) / 1.055) ** 2.4
    return 0.2126 * linear(red) + 0.7152 * linear(green) + 0.0722 * linear(blue)


def _rgb(color: str) -> tuple[float, float, float]:
    return tuple(int(color[i:i + 2], 16) / 255 for i in (1, 3, 5))


def test_a_label_with_no_room_beside_is_drawn_over_its_bar_on_a_plate():
    # Its start may lie anywhere in 1650-1699 and it ends in 1760: across the whole window
    # 1650-1700 with no certain part in it worth a label, and no room left or right.
    start = Endpoint(day(1650, 1, 1), day(1699, 12, 31), Precision.DECADE,
                     frozenset({Qualifier.APPROXIMATE}))
    wide = Record("Guild of the Long Window", Span(start, year(1760)),
                  Provenance("test.csv", 2), group="Weavers and Fullers of the Old Town")
    scene = build_scene([wide, RECORDS[0]], window=WINDOW)
    [line] = find(scene, "axis-line")
    group = the_record(scene, "Guild of the Long Window")
    [label] = parts(group, Text, "over")
    [plate] = parts(group, Rect, "label-plate")
    width = text_width(label.text, label.size)
    assert line.x1 < label.x and label.x + width < line.x2          # on the bar, in the window
    assert plate.x <= label.x and plate.x + plate.width >= label.x + width
    # Dark text on the plate over the darkest bar there could be (black): the contrast of
    # WCAG 2.1 (SC 1.4.3 asks 4.5:1 for text), worked out here from its definitions.
    backdrop = tuple(plate.opacity * c for c in _rgb(plate.fill))       # over black
    ratio = ((_wcag_luminance(*backdrop) + 0.05)
             / (_wcag_luminance(*_rgb(label.fill)) + 0.05))
    assert ratio >= 4.5
    # Its start's sign stands left of the axis, clear of the group's name.
    [sign] = parts(group, Text, "qualifier")
    [caption] = [t for t in find(scene, "group-label") if t.text.startswith("Weavers")]
    sign_left = sign.x - text_width(sign.text, sign.size, "bold")
    assert sign.x <= line.x1 and sign_left >= caption.x + text_width(caption.text,
                                                                     caption.size, "bold")


def test_the_notes_name_the_first_undated_and_outside_records_and_count_the_rest():
    from timelines.scene.legend import OUTSIDE_LISTED, UNDATED_LISTED

    undated = [Record(f"n.d. {i}", None, Provenance("test.csv", 100 + i))
               for i in range(UNDATED_LISTED + 1234)]
    outside = [record(f"early {i}", year(1600), year(1610), 3000 + i)
               for i in range(OUTSIDE_LISTED + 1500)]
    scene = build_scene([*RECORDS[:1], *undated, *outside], window=WINDOW)
    notes = " ".join(t.text for t in find(scene, "note"))
    assert f"n.d. {UNDATED_LISTED - 1} (row {100 + UNDATED_LISTED - 1})" in notes
    assert f"n.d. {UNDATED_LISTED} (row" not in notes
    assert "and 1,234 more ('timelines check' lists them all)" in notes
    assert f"{OUTSIDE_LISTED + 1500:,} records lie outside the time shown" in notes
    assert "and 1,500 more." in notes
    # A page for the chart, not a wall of names: the notes are a few lines.
    assert len(find(scene, "note")) < 20
