"""Radiocarbon ages in a table (issue 14): read only where written as such, calibrated, drawn
with their probability, explained. The calibration itself is checked against published values
in test_radiocarbon.py; here, that the chart and the reader carry it honestly."""
from __future__ import annotations

import xml.etree.ElementTree as ET

import numpy as np
import pytest

from timelines import Chart
from timelines.calendar import fixed_from_gregorian
from timelines.dates import DateSettings, parse_endpoint
from timelines.dates.radiocarbon import calibrate
from timelines.scene import encodings as marks
from timelines.scene.encodings import EndWindow, LaneBox, MarkStyle
from timelines.scene.primitives import GradientRect, Line, Text, walk
from timelines.scene.scale import TimeScale

EXPLICIT = ["3450 ± 40 14C BP", "3450 ± 40 BP (uncal)", "3450±40 uncal BP",
            "3450 +/- 40 14C yr BP", "Lab-1234: 3450 ± 40", "OxA-1234: 3450 ± 40 BP",
            "3450 ± 40 ¹⁴C BP", "3450 ± 40 BP uncal", "3,450 ± 40 14C BP"]


def _year_of(day: int) -> int:
    from timelines.calendar import gregorian_year_from_fixed
    return gregorian_year_from_fixed(day)


@pytest.mark.parametrize("text", EXPLICIT)
def test_explicit_radiocarbon_forms_are_calibrated(text):
    endpoint = parse_endpoint(text)
    assert endpoint.radiocarbon is not None and endpoint.radiocarbon.age == 3450
    # The values (IntCal20, 95.4%): 1882-1668 BC and 1656-1635 BC; the window is
    # their outer extent. Astronomical years: 1882 BC = -1881. Tolerance ±1 year on the
    # oldest end (implementations differ in grid and interpolation); the young end is checked
    # against this project's calibration, itself held to published values in
    # test_radiocarbon.py.
    assert abs(_year_of(endpoint.earliest) - (-1881)) <= 1
    oldest, youngest = calibrate(3450, 40).outer(0.954)
    assert (_year_of(endpoint.earliest), _year_of(endpoint.latest)) == (1950 - oldest,
                                                                          1950 - youngest)
    assert endpoint.earliest == fixed_from_gregorian(_year_of(endpoint.earliest), 1, 1)
    assert endpoint.latest == fixed_from_gregorian(_year_of(endpoint.latest), 12, 31)
    assert endpoint.likely is not None and endpoint.earliest < endpoint.likely < endpoint.latest
    assert abs(sum(endpoint.radiocarbon.density) - 1) < 1e-9


def test_a_lab_code_and_a_curve_named_in_the_cell_are_kept():
    found = parse_endpoint("OxA-1234: 3450 ± 40 (SHCal20)").radiocarbon
    assert (found.lab, found.curve) == ("OxA-1234", "shcal20")
    assert "Hogg" in found.citation
    assert parse_endpoint("3450 ± 40 14C BP").radiocarbon.curve == "intcal20"
    assert parse_endpoint("3450 ± 40 14C BP", DateSettings(curve="shcal20")
                          ).radiocarbon.curve == "shcal20"


def test_plain_bp_stays_calendar_years_unless_the_setting_says_radiocarbon():
    plain = parse_endpoint("3450 ± 40 BP")
    assert plain.radiocarbon is None
    assert (_year_of(plain.earliest), _year_of(plain.latest)) == (1950 - 3490, 1950 - 3410)
    assert parse_endpoint("3000 cal BP").radiocarbon is None
    assert parse_endpoint("1650 ± 10").radiocarbon is None
    read = parse_endpoint("3450 ± 40 BP", DateSettings(bp="radiocarbon"))
    assert read == parse_endpoint("3450 ± 40 14C BP")
    # A comma-grouped age goes the quick reader's way unless the setting says radiocarbon.
    assert parse_endpoint("3,450 ± 40 BP", DateSettings(bp="radiocarbon")).radiocarbon


def test_an_age_beyond_the_curve_is_refused_with_its_range():
    from timelines.errors import DateError
    with pytest.raises(DateError) as refused:
        parse_endpoint("60000 ± 40 14C BP")
    assert "IntCal20 covers radiocarbon ages" in str(refused.value)


def test_explain_gives_the_ranges_and_says_what_plain_bp_means(capsys):
    from timelines.cli.commands import main
    assert main(["parse", "--explain", "3450 ± 40 14C BP"]) == 0
    out = capsys.readouterr().out
    assert "calibrated with IntCal20 (Reimer P. et al. 2020)" in out
    assert "95.4% ranges: 1882 BC–" in out and "68.3% ranges:" in out and "median" in out
    assert main(["parse", "--explain", "3450 ± 40 BP"]) == 0
    assert "BP is read as calendar years before 1950" in capsys.readouterr().out


# -- drawing --------------------------------------------------------------------------------

SCALE = TimeScale(0.0, 100.0, 50.0, 250.0)   # 2 px per day
LANE = LaneBox(10.0, 12.0)
STYLE = MarkStyle("#0072B2", far_opacity=0.1)


def test_the_density_fade_follows_the_probability_and_leaves_gaps():
    days = [0, 20, 30, 40, 60, 70, 80, 100]
    relative = [0.0, 1.0, 0.0, 0.0, 0.0, 0.5, 0.0, 0.0]    # two separate ranges
    parts = marks.density_fade(EndWindow(0, 100, "end"), SCALE, LANE, STYLE, days, relative)
    assert len(parts) == 2 and all(isinstance(p, GradientRect) for p in parts)
    first, second = parts
    # Each stretch ends where the probability vanishes: nothing drawn between 30 and 60.
    assert first.x + first.width <= SCALE.x(32) and second.x >= SCALE.x(58)
    assert max(first.stops) == pytest.approx(1.0) and max(second.stops) == pytest.approx(0.5)
    peak = first.x + first.width * np.argmax(first.stops) / (len(first.stops) - 1)
    assert peak == pytest.approx(SCALE.x(20), abs=2 * marks.DENSITY_STEP)


SITE = """id,context,date
a1,hearth 1,3450 ± 40 14C BP
a2,phase,3450 ± 40 14C BP–3210 ± 35 14C BP
a3,midden,c. 800 BC
"""


@pytest.fixture
def site(tmp_path):
    path = tmp_path / "site.csv"
    path.write_text(SITE, encoding="utf-8")
    return path


def test_a_chart_draws_calibrated_dates_by_their_density(site, tmp_path):
    chart = Chart(str(site), when="date", label="context")
    items = list(walk(chart.scene().children))
    shaded = [p for p in items if isinstance(p, GradientRect) and "calibrated" in p.css_class]
    # 3450 ± 40 has two separate 95.4% ranges; the span's start and end are both calibrated.
    assert len(shaded) >= 4 and all(len(p.stops) >= 2 for p in shaded)
    assert max(len(p.stops) for p in shaded) > 30
    underlines = [p for p in items if isinstance(p, Line) and p.css_class == "calibrated-range"]
    assert len(underlines) >= 6          # four 68.3% ranges of 3450 ± 40, twice, and more
    texts = " ".join(p.text for p in items if isinstance(p, Text))
    assert "radiocarbon date, calibrated" in texts
    assert "Radiocarbon ages calibrated with Reimer P. et al. 2020" in texts
    # The SVG carries each density as one gradient of many stops.
    out = tmp_path / "site.svg"
    chart.save(out)
    root = ET.parse(out).getroot()
    gradients = [g for g in root.iter("{http://www.w3.org/2000/svg}linearGradient")
                 if len(g) > 10]
    assert gradients
    offsets = [float(stop.get("offset")) for stop in gradients[0]]
    assert offsets[0] == 0 and offsets[-1] == 1 and offsets == sorted(offsets)


def test_the_tooltip_gives_the_ranges_with_their_probabilities(site):
    from timelines.scene.bars import tooltip
    hearth = Chart(str(site), when="date", label="context").records[0]
    text = tooltip(hearth)
    assert "3450 ± 40 14C BP, calibrated (Reimer P. et al. 2020)" in text
    assert "95.4%: 1882 BC–" in text and "68.3%:" in text and "median" in text


def test_plain_bp_columns_get_one_note(tmp_path):
    path = tmp_path / "plain.csv"
    path.write_text("id,name,date\na,hearth,3450 ± 40 BP\nb,pit,3420 ± 35 BP\n"
                    "c,cal,3000 cal BP\n", encoding="utf-8")
    notes = [p for p in Chart(str(path), when="date").problems if "3450 ± 40 BP" in p.reason]
    assert len(notes) == 1 and "rows 2–3" in notes[0].reason
    assert "--bp radiocarbon" in notes[0].hint
    radiocarbon = Chart(str(path), when="date").dates(bp="radiocarbon")
    assert not [p for p in radiocarbon.problems if "3450 ± 40 BP" in p.reason]
    assert radiocarbon.records[0].span.start.radiocarbon is not None


# -- activity: the summed probability ---------------------------------------------------------

def test_activity_sums_each_calibrated_dates_probability(site):
    from timelines.analysis.activity import activity
    from timelines.calendar import GREGORIAN
    hearth = Chart(str(site), when="date", label="context").records[0]
    measured = hearth.span.start.radiocarbon
    first = fixed_from_gregorian(measured.first_year - 10, 1, 1)
    last = fixed_from_gregorian(measured.first_year + len(measured.density) + 10, 12, 31)
    runs = 4000
    table = activity([hearth], per="decade", start=first, end=last, runs=runs, seed=3,
                     calendar=GREGORIAN)
    # Every year of the density falls in some block: the weights sum to 1, not to the share
    # of a flat window; and each block holds the probability of its ten years.
    assert table["expected"].sum() == pytest.approx(1.0, abs=1e-9)
    years = np.arange(measured.first_year, measured.first_year + len(measured.density))
    decade = years // 10 * 10
    by_decade = {d: float(np.asarray(measured.density)[decade == d].sum()) for d in set(decade)}
    for row in table.itertuples():
        start_year = _year_of(row.block_start)
        assert row.expected == pytest.approx(by_decade.get(start_year, 0.0), abs=1e-12)
    # The simulated count's mean per block is the probability (4 standard errors).
    from timelines.analysis.calibrated import simulate_calibrated
    edges = np.append(table["block_start"].to_numpy(float), table["block_end"].iloc[-1])
    counts = simulate_calibrated([hearth], np.array([2]), edges, runs, 3)
    spread = np.sqrt(table["expected"] * (1 - table["expected"]) / runs) + 1e-9
    assert np.all(np.abs(counts.mean(axis=0) - table["expected"]) <= 4 * spread)


def test_parse_prints_the_ranges_and_json_holds_them(capsys):
    import json

    from timelines.cli.commands import main
    assert main(["parse", "3450 ± 40 14C BP"]) == 0
    line = capsys.readouterr().out.strip()
    assert "calibrated (intcal20), 95.4%: 1882 BC–" in line and "median" in line
    assert main(["parse", "--json", "OxA-7: 3450 ± 40"]) == 0
    found = json.loads(capsys.readouterr().out)["radiocarbon"]
    assert (found["age"], found["error"], found["lab"]) == (3450, 40, "OxA-7")
    ranges = found["ranges"]["95.4%"]
    assert ranges[0]["from"] == "1882 BC" and ranges[0]["from_year"] == -1881
    assert sum(r["probability"] for r in ranges) >= 0.954 - 1e-6
    assert main(["parse", "--json", "1650"]) == 0
    assert "radiocarbon" not in json.loads(capsys.readouterr().out)
