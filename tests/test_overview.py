"""The overview of a large table (issue 15): counts per group above the lanes of a part.

Geometry is read from the scene. The counts drawn are those of `analysis.activity` (tested
against published worked examples in tests/test_activity.py), so here the wiring is checked:
the strips' bars stand for those numbers, every row is drawn, counted or reported, and the
part chosen is the part drawn.
"""
from __future__ import annotations

import pytest

from timelines import Chart
from timelines.chart.overview import FIRST_SHOWN, OVERVIEW_FROM, wanted
from timelines.errors import UsageError
from timelines.scene.primitives import Group, Rect, Text, find, walk


def _table(tmp_path, count: int, groups: int = 3):
    path = tmp_path / "t.csv"
    rows = [f"R{i},{1600 + i % 200},{1610 + i % 200},g{i % groups},{'x' if i % 5 == 0 else 'y'}"
            for i in range(count)]
    path.write_text("label,start,end,group,kind\n" + "\n".join(rows) + "\n", encoding="utf-8")
    return path


def test_the_overview_comes_from_its_threshold_on_or_when_asked():
    assert not wanted(OVERVIEW_FROM - 1, "auto") and wanted(OVERVIEW_FROM, "auto")
    assert wanted(10, "yes") and not wanted(10 ** 6, "no")
    with pytest.raises(UsageError):
        wanted(10, "sometimes")


def test_a_small_table_forced_into_the_overview(tmp_path):
    chart = Chart(_table(tmp_path, 300), group="group").overview("yes")
    arranged = chart.layout()
    drawn = [p.record for _, g in arranged.placement.leaves() for p in g.records]
    assert len(drawn) == FIRST_SHOWN
    assert arranged.summarised == 300 - FIRST_SHOWN
    # The first by start: no record left out starts before the last one drawn.
    latest = max(r.span.start.earliest for r in drawn)
    left = [r for r in arranged.loaded.records if r not in drawn]
    assert all(r.span.start.earliest >= latest for r in left)
    assert f"{300 - FIRST_SHOWN} counted in the overview only" in arranged.summary()
    scene = chart.scene()
    strips = find(scene, "overview")
    assert len(strips) == 1
    captions = [t.text for t in walk(strips[0].children)
                if isinstance(t, Text) and "panel-title" in t.css_class]
    assert captions == ["g0", "g1", "g2"]              # in the order the groups appear


def test_the_strips_bars_are_the_activity_counts(tmp_path):
    from timelines.analysis.activity import activity

    chart = Chart(_table(tmp_path, 120, groups=1), group="group").overview("yes")
    scene = chart.scene()
    [strip] = find(scene, "overview")
    panels = [p for p in walk(strip.children) if isinstance(p, Group) and p.css_class == "activity"]
    bars = [p for panel in panels for p in walk(panel.children)
            if isinstance(p, Rect) and "expected" in p.css_class]
    per = "year" if "per year" in chart.layout().overview.note else "decade"
    table = activity(chart.layout().loaded.records, per=per, group="group")
    expected = [v for v in table["expected"].tolist() if v > 0]
    heights = [bar.height for bar in sorted(bars, key=lambda b: b.x)]
    # Heights are proportional to the counts: one scale for the panel.
    ratios = {round(h / e, 6) for h, e in zip(heights, expected)}
    assert len(heights) == len(expected) and len(ratios) == 1


def test_where_and_first_choose_the_lanes(tmp_path):
    chart = Chart(_table(tmp_path, 400), group="group").overview("yes", where="kind=x",
                                                                  first=7)
    arranged = chart.layout()
    drawn = [p.record for _, g in arranged.placement.leaves() for p in g.records]
    assert len(drawn) == 7 and all(dict(r.fields).get("kind", "x") == "x" for r in drawn)
    assert "those with kind = x; the first 7 by start" in arranged.overview.note
    with pytest.raises(UsageError, match="COLUMN=VALUE"):
        Chart(_table(tmp_path, 10)).overview("yes", where="kind").layout()


def test_a_where_that_no_record_answers_says_so_and_names_the_values(tmp_path):
    # Not "nothing to draw: no row has a usable date": every row has one.
    with pytest.raises(UsageError, match="no dated record has kind = 'X'") as raised:
        Chart(_table(tmp_path, 40)).overview("yes", where="kind=X").layout()
    assert raised.value.hint == "did you mean 'x'?"
    with pytest.raises(UsageError, match="no dated record in --from/--to") as raised:
        Chart(_table(tmp_path, 40)).overview("yes", where="kind=z").window("1600",
                                                                          "1620").layout()
    assert raised.value.hint == "kind holds 'x', 'y'"


def test_the_window_is_marked_on_the_strips(tmp_path):
    chart = Chart(_table(tmp_path, 400), group="group").overview("yes").window("1650", "1660")
    scene = chart.scene()
    [mark] = [p for p in walk(scene.children) if isinstance(p, Rect)
              and "overview-window" in p.css_class]
    assert mark.width > 0
    drawn = [p.record for _, g in chart.layout().placement.leaves() for p in g.records]
    assert drawn and all(r.span.possible_extent[1] >= 602_000 for r in drawn)


def test_the_command_line_counts_every_row(tmp_path, capsys):
    from timelines.cli import main

    out = tmp_path / "o.svg"
    assert main(["render", str(_table(tmp_path, 250)), "--group", "group", "--overview", "yes",
                 "--first", "20", "-o", str(out)]) == 0
    err = capsys.readouterr().err
    assert "250 rows read: 20 drawn; 230 counted in the overview only (--overview)" in err
    assert 'class="overview"' in out.read_text(encoding="utf-8")


def test_the_lanes_report_lists_every_record_however_many(tmp_path, capsys):
    """The overview is a way of drawing: `timelines lanes` reports the lane of every record,
    above the overview's threshold too."""
    from timelines.cli import main

    path = _table(tmp_path, OVERVIEW_FROM + 10)
    assert main(["lanes", str(path), "--group", "group", "--format", "csv"]) == 0
    rows = capsys.readouterr().out.strip().splitlines()
    assert len(rows) == OVERVIEW_FROM + 10 + 1              # a header and every record


def test_the_part_takes_records_bounded_on_both_sides_first(tmp_path):
    # Thirty rows begin in 1550 with an empty end (they may reach any decade, and would be
    # drawn as stubs far left of it); thirty lie in 1700-1720. Asked for 1700 to 1710, the
    # lanes show the thirty bounded rows first, then the earliest of the others.
    path = tmp_path / "t.csv"
    rows = [f"U{i},{1550 + i % 3}," for i in range(30)] + [
        f"B{i},{1700 + i % 10},{1710 + i % 10}" for i in range(30)]
    path.write_text("label,start,end\n" + "\n".join(rows) + "\n", encoding="utf-8")
    arranged = Chart(path).overview("yes").window("1700", "1710").layout()
    drawn = {p.record.label for _, g in arranged.placement.leaves() for p in g.records}
    assert len(drawn) == FIRST_SHOWN
    assert {f"B{i}" for i in range(30)} <= drawn
    assert "those with both ends bounded first" in arranged.overview.note


def test_of_a_window_the_part_takes_records_beginning_in_it_first(tmp_path):
    # Sixty rows run from the 1650s into 1700-1705; thirty begin in 1700-1709. Asked for
    # 1700 to 1710 with thirty lanes, the lanes show the thirty that begin in the decade
    # (whole bars), not the earliest starters cut at the window's edge; the strips shade the
    # window the lanes show, not the chosen rows' whole extent.
    from timelines.calendar import fixed_from_gregorian

    path = tmp_path / "t.csv"
    rows = [f"E{i},{1650 + i % 10},{1700 + i % 6}" for i in range(60)] + [
        f"B{i},{1700 + i % 10},{1712 + i % 10}" for i in range(30)]
    path.write_text("label,start,end\n" + "\n".join(rows) + "\n", encoding="utf-8")
    arranged = Chart(path).overview("yes", first=30).window("1700", "1710").layout()
    drawn = {p.record.label for _, g in arranged.placement.leaves() for p in g.records}
    assert drawn == {f"B{i}" for i in range(30)}
    assert "of them, those surely beginning in the window" in arranged.overview.note
    assert arranged.overview.window == (fixed_from_gregorian(1700, 1, 1),
                                       fixed_from_gregorian(1710, 12, 31) + 1)


def _captions(chart) -> list[str]:
    [strip] = find(chart.scene(), "overview")
    return [t.text for t in walk(strip.children)
            if isinstance(t, Text) and "panel-title" in t.css_class]


def test_strips_name_the_kind_only_where_both_kinds_are_counted(tmp_path):
    path = _table(tmp_path, 60)
    events = Chart(path, group="group").events().overview("yes")
    assert _captions(events) == ["g0", "g1", "g2"]      # not "events: g0": one kind
    from dataclasses import replace

    spans = list(Chart(path, group="group").layout().loaded.records)
    mixed = [replace(record, kind="event") if index % 2 else record
             for index, record in enumerate(spans)]
    captions = _captions(Chart(mixed, group="group").overview("yes"))
    assert set(captions) == {f"{kind}: g{n}" for kind in ("events", "spans") for n in range(3)}
