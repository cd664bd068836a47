"""The activity chart (issue 11): bars of the expected count, the envelope as a band, the
certain and possible counts as step lines, checked on the scene's numbers."""
from __future__ import annotations

import math
import xml.etree.ElementTree as ET

import pytest

from timelines import Chart
from timelines.analysis.activity import activity
from timelines.chart.activity import activity_chart
from timelines.cli import main
from timelines.scene.primitives import Line, Rect, Text, walk

ROWS = [{"label": f"Keeper {i}", "start": f"c. {1600 + 7 * i}", "end": f"{(1640 + 7 * i) // 10 * 10}s"}
        for i in range(12)] + [{"label": "Unknown end", "start": "1650", "end": ""}]


def _panel(scene):
    [panel] = [g for g in scene.children if getattr(g, "css_class", "") == "activity"]
    return list(walk(panel.children))


def _scene(runs: int = 0):
    table = activity(Chart(ROWS).records, per="decade", runs=runs, seed=3)
    return table, activity_chart(table, "Keepers per decade (invented)")


def test_bars_stand_as_high_as_the_expected_counts():
    table, scene = _scene()
    bars = [p for p in _panel(scene) if isinstance(p, Rect) and p.css_class == "expected"]
    expected = [value for value in table["expected"] if value > 0]
    assert len(bars) == len(expected)
    heights = [bar.height for bar in bars]
    tallest = max(heights)
    for height, value in zip(heights, expected, strict=True):   # proportional to the count
        assert height / tallest == pytest.approx(value / max(expected), rel=1e-6)


def test_certain_and_possible_lines_and_the_envelope():
    table, scene = _scene(runs=200)
    kinds = {p.css_class for p in _panel(scene) if isinstance(p, (Rect, Line))}
    assert {"certain", "possible", "envelope", "expected"} <= kinds
    certain = [p for p in _panel(scene) if isinstance(p, Line) and p.css_class == "certain"
               and p.y1 == p.y2]
    assert len(certain) == len(table)              # one level per block
    legend = [t.text for t in walk(scene.children) if isinstance(t, Text)
              and t.css_class == "legend-text"]
    assert legend[0].startswith("Monte Carlo envelope")
    notes = " ".join(t.text for t in walk(scene.children) if isinstance(t, Text)
                     and t.css_class == "note")
    assert "1 record (spans) with no bound on a side" in notes


def test_the_command_writes_the_chart(tmp_path, capsys):
    table = tmp_path / "keepers.csv"
    table.write_text("label,start,end\n" + "\n".join(f"{r['label']},{r['start']},{r['end']}"
                                                      for r in ROWS) + "\n", encoding="utf-8")
    out = tmp_path / "activity.svg"
    assert main(["activity", str(table), "--runs", "100", "-o", str(out)]) == 0
    root = ET.parse(out).getroot()
    assert root.tag == "{http://www.w3.org/2000/svg}svg"
    assert "wrote" in capsys.readouterr().err


def test_relate_and_activity_read_a_config_file_and_notes_are_no_loss(tmp_path, capsys):
    table = tmp_path / "keepers.csv"
    table.write_text("label,start,end\nA,1650,1700s\nB,1660,1680\n", encoding="utf-8")
    config = tmp_path / "counts.toml"
    config.write_text('per = "century"\n', encoding="utf-8")
    assert main(["activity", str(table), "--config", str(config)]) == 0
    captured = capsys.readouterr()
    assert "1600–1699" in captured.out and "could not be read" not in captured.err
    assert main(["relate", str(table), "A", "B", "--config", str(config)]) == 0
    assert "could not be read" not in capsys.readouterr().err   # a 1700s note is no loss


# --- the strip under a timeline (render --activity, Chart.activity) ---------------------------

def _strip_panels(scene):
    """The activity panels of a timeline scene, found among its top-level children."""
    return [g for g in scene.children if getattr(g, "css_class", "") == "activity"]


def test_the_strip_shares_the_timelines_time_axis():
    chart = Chart(ROWS).activity("decade")
    scale = chart.layout().scale
    (panel,) = _strip_panels(chart.scene())
    table = activity([p.record for _, g in chart.layout().placement.leaves() for p in g.records],
                     per="decade", start=int(scale.start), end=int(scale.end))
    drawn = table[(table["expected"] > 0) & (table["block_end"] > scale.start)
                  & (table["block_start"] < scale.end)]
    bars = [p for p in walk(panel.children) if isinstance(p, Rect) and p.css_class == "expected"]
    assert len(bars) == len(drawn) > 0
    for bar, (_, row) in zip(bars, drawn.iterrows(), strict=True):
        # Each bar begins where its block begins on the lanes' own scale (cut at its edge).
        assert bar.x == pytest.approx(scale.x(max(row["block_start"], scale.start)))
        assert scale.x0 - 1e-6 <= bar.x and bar.x + bar.width <= scale.x1 + 1e-6
    # Under the lanes and their axis: below every mark of the record groups and the axis.
    above = [g for g in chart.scene().children if getattr(g, "css_class", "") in ("group",
                                                                               "axis")]
    lanes_bottom = max(getattr(p, "y", 0) + getattr(p, "height", 0)
                       for g in above for p in walk(g.children))
    strip_top = min(getattr(p, "y", math.inf) for p in walk(panel.children))
    assert strip_top > lanes_bottom
    notes = " ".join(t.text for t in walk(chart.scene().children) if isinstance(t, Text))
    assert "1 record (spans) with no bound on a side" in notes    # 'Unknown end' said


def test_render_activity_from_the_command_line(tmp_path, capsys):
    out = tmp_path / "strip.svg"
    assert main(["render", "--demo", "--activity", "-o", str(out)]) == 0
    root = ET.parse(out).getroot()
    classes = {element.get("class") for element in root.iter()}
    assert {"activity", "expected", "certain", "possible"} <= classes
    again = tmp_path / "again.svg"
    assert main(["render", "--demo", "--activity", "-o", str(again)]) == 0
    assert out.read_bytes() == again.read_bytes()                 # deterministic
    plain = tmp_path / "plain.svg"
    assert main(["render", "--demo", "-o", str(plain)]) == 0
    assert "activity" not in {e.get("class") for e in ET.parse(plain).getroot().iter()}
    capsys.readouterr()
    with pytest.raises(SystemExit):
        main(["render", "--demo", "--activity", "fortnight", "-o", str(tmp_path / "x.svg")])
    assert "cannot make blocks of 'fortnight'" in capsys.readouterr().err


def test_the_strip_needs_one_panel_and_one_page(tmp_path):
    from timelines.errors import UsageError
    rows = [dict(row, place="North" if i % 2 else "South") for i, row in enumerate(ROWS)]
    with pytest.raises(UsageError, match="--activity adds its strip under a chart of one"):
        Chart(rows).activity().facet("place").scene()
    assert main(["render", "--demo", "--activity", "--pages",
                 "-o", str(tmp_path / "p.pdf")]) != 0
    assert not (tmp_path / "p.pdf").exists()
