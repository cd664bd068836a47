"""The Python front door: Chart, read, the Series accessor, readable reprs, drawing into one's
own Axes and the BCE-aware year ticks."""
from __future__ import annotations

import datetime
import io
import xml.etree.ElementTree as ElementTree
from pathlib import Path

import pandas as pd
import pytest

import timelines
from timelines.calendar import (
    JD_OFFSET, decimal_year_from_fixed, fixed_from_decimal_year, fixed_from_gregorian,
)
from timelines.cli import main
from timelines.errors import TimelineError, UsageError

SVG = "{http://www.w3.org/2000/svg}"
# Invented people of an invented house, as the demos use.
ROWS = [
    {"name": "Aldric Hollin", "house": "Hollin", "born": "c. 1650", "died": "1702"},
    {"name": "Berenice Hollin", "house": "Hollin", "born": "1675", "died": "before 1740"},
    {"name": "Cato Marrow", "house": "Marrow", "born": "1690s", "died": "1755?"},
    {"name": "Dagny Marrow", "house": "Marrow", "born": "1712", "died": "1771"},
    {"name": "Eluned Vashti", "house": "Vashti", "born": "early 17th century", "died": "1688"},
]


@pytest.fixture
def table(tmp_path) -> Path:
    path = tmp_path / "houses.csv"
    pd.DataFrame(ROWS).to_csv(path, index=False)
    return path


def _chart(data) -> timelines.Chart:
    return timelines.Chart(data, start="born", end="died", label="name", group="house")


# --- Chart ----------------------------------------------------------------------------------

def test_a_chart_of_a_path_saves_the_bytes_the_command_line_writes(table, tmp_path, capsys):
    _chart(table).titles("Three houses").lanes(pack="ordered").save(tmp_path / "api.svg")
    code = main(["render", str(table), "--start", "born", "--end", "died", "--label", "name",
                 "--group", "house", "--title", "Three houses", "--pack", "ordered",
                 "-o", str(tmp_path / "cli.svg")])
    assert code == 0
    assert (tmp_path / "api.svg").read_bytes() == (tmp_path / "cli.svg").read_bytes()


def test_a_dataframe_and_rows_chart_like_the_file(table):
    from_file = _chart(table)
    from_frame = _chart(pd.read_csv(table, dtype=str))
    from_rows = _chart(ROWS)
    assert len(from_frame.records) == len(from_rows.records) == len(from_file.records) == 5
    spans = [[r.span for r in chart.records] for chart in (from_file, from_frame, from_rows)]
    assert spans[0] == spans[1] == spans[2]
    assert from_frame.summary == "5 rows read: 5 drawn"


def test_setting_methods_return_new_charts_and_leave_the_old_one_alone(table):
    base = _chart(table)
    titled = base.titles("A title", subtitle="below it")
    styled = titled.style(fringe="whisker", era="bc", font_size=8)
    assert base.options.title == "" and titled.options.title == "A title"
    assert titled.options.theme.fringe == "fade" and styled.options.theme.fringe == "whisker"
    assert styled.options.theme.font_size == pytest.approx(8 * 96 / 72)  # 8 pt in CSS px
    assert base is not titled is not styled


def test_unknown_settings_are_named_with_a_hint(table):
    with pytest.raises(UsageError, match="unknown lane setting 'pakc'") as error:
        _chart(table).lanes(pakc="ordered")
    assert error.value.hint == "did you mean 'pack'?"
    with pytest.raises(UsageError, match="fringe 'fadd' is not one of"):
        _chart(table).style(fringe="fadd")
    with pytest.raises(UsageError, match="unknown date setting 'centuy'"):
        _chart(table).dates(centuy="strict")
    with pytest.raises(UsageError, match="either when or start/end"):
        timelines.Chart(table, when="born", start="born")


def test_date_conventions_change_the_bounds(table):
    # "17th century": 1601-1700 strictly, 1600-1699 in common usage (docs/dates.md)
    common = _chart(ROWS).records[4].span.start
    strict = _chart(ROWS).dates(century="strict").records[4].span.start
    assert common.earliest == fixed_from_gregorian(1600, 1, 1)
    assert strict.earliest == fixed_from_gregorian(1601, 1, 1)


def test_a_window_shows_part_of_the_time(table):
    chart = _chart(table).window("1700", "1720")
    assert chart.layout().scale.start == fixed_from_gregorian(1700, 1, 1)
    assert chart.layout().scale.end == fixed_from_gregorian(1720, 12, 31)
    with pytest.raises(UsageError, match="--from: cannot read 'sometime'"):
        _chart(table).window("sometime")


def test_save_to_file_objects(table, tmp_path):
    chart = _chart(table)
    binary = io.BytesIO()
    chart.save(binary, format="png")
    assert binary.getvalue().startswith(b"\x89PNG\r\n\x1a\n")
    text = io.StringIO()
    chart.save(text, format="svg")
    assert text.getvalue() == chart.to_svg()
    with open(tmp_path / "named.pdf", "wb") as file:        # the format from the file's name
        chart.save(file)
    assert (tmp_path / "named.pdf").read_bytes().startswith(b"%PDF")
    with pytest.raises(UsageError, match="say which format"):
        chart.save(io.BytesIO())


def test_save_checks_the_target_before_drawing(table, tmp_path):
    with pytest.raises(UsageError, match="must end in .svg, .png, .pdf or .html"):
        _chart(table).save(tmp_path / "chart.jpg")
    with pytest.raises(UsageError, match="does not exist"):
        _chart(table).save(tmp_path / "no" / "such" / "chart.svg")


def test_strict_writes_nothing_when_a_row_is_not_drawn(tmp_path):
    rows = [*ROWS, {"name": "Fenn", "house": "Vashti", "born": "1985-13-01", "died": ""}]
    chart = _chart(rows).strict()
    with pytest.raises(TimelineError, match="nothing written: 6 rows read: 5 drawn"):
        chart.save(tmp_path / "strict.svg")
    assert not (tmp_path / "strict.svg").exists()
    problem, = chart.problems
    # rows given as dicts are counted from 0, as a DataFrame's iloc counts them
    assert (problem.row, problem.column, problem.text) == (5, "born", "1985-13-01")


def test_a_dataframes_rows_are_named_as_iloc_counts_them():
    frame = pd.DataFrame(ROWS)
    frame.loc[3, "died"] = "2001-02-29"
    chart = _chart(frame)
    problem, = chart.problems
    assert (problem.source, problem.row, problem.column) == ("DataFrame", 3, "died")
    assert frame.iloc[problem.row]["died"] == problem.text
    assert [r.provenance.row for r in chart.records] == [0, 1, 2, 4]


def test_the_notebook_gets_svg(table):
    bundle = _chart(table)._repr_mimebundle_()
    root = ElementTree.fromstring(bundle["image/svg+xml"].encode("utf-8"))
    assert root.tag == f"{SVG}svg"
    assert bundle["text/plain"].startswith("Chart('") and "group='house'" in bundle["text/plain"]
    assert _chart(table)._repr_svg_() == bundle["image/svg+xml"]


def test_a_chart_reads_its_table_once(table, monkeypatch):
    from timelines.chart import spec

    calls = []
    real = spec.read_source
    monkeypatch.setattr(spec, "read_source", lambda *a: calls.append(1) or real(*a))
    chart = _chart(table)
    chart.to_svg(), chart.report, chart.summary, chart.save  # noqa: B018
    assert calls == [1]


# --- read and the Series accessor -------------------------------------------------------------

def test_read_adds_the_bounds_beside_each_date_column():
    frame = pd.DataFrame(ROWS, index=list("abcde"))
    frame.loc["c", "born"] = "1690s"
    frame.loc["e", "died"] = "1985-13-01"
    read = timelines.read(frame, start="born", end="died")
    names = list(read.columns)
    assert names[:3] == ["name", "house", "born"]
    assert names[3:10] == [f"born_{field}" for field in (
        "earliest", "latest", "earliest_day", "latest_day", "precision", "qualifiers", "error")]
    assert list(read.index) == list("abcde")
    assert read.loc["c", "born_earliest"] == "1690-01-01"
    assert read.loc["c", "born_latest"] == "1699-12-31"
    assert read.loc["c", "born_precision"] == "decade"
    assert read.loc["a", "born_qualifiers"] == "approximate,convention_dependent"
    assert read.loc["e", "died_error"] == "month 13 does not exist"
    assert pd.isna(read.loc["e", "died_latest_day"])
    assert str(read["born_earliest_day"].dtype) == "Int64"
    # Fixed days are Python's own proleptic Gregorian ordinals (datetime.date.toordinal).
    assert read.loc["d", "born_earliest_day"] == datetime.date(1712, 1, 1).toordinal()
    assert read.loc["d", "born_latest_day"] == datetime.date(1712, 12, 31).toordinal()


def test_a_when_column_reads_as_spans():
    frame = pd.DataFrame({"period": ["1800/1899", "1650-1660", "c. 1700", ""]})
    read = timelines.read(frame, when="period")
    assert list(read["period_earliest"][:3]) == ["1800-01-01", "1650-01-01", "1695-01-01"]
    assert list(read["period_start_latest"][:2]) == ["1800-12-31", "1650-12-31"]
    assert list(read["period_end_earliest"][:2]) == ["1899-01-01", "1660-01-01"]
    # c. 1700 covers about the year 1700: each end is approximate, and the windows of its two
    # ends overlap, so no part of it is certain
    assert read[["period_start_latest", "period_end_earliest"]].iloc[2:].isna().all().all()
    assert read["period_earliest"].isna().tolist() == [False, False, False, True]


def test_the_series_accessor_parses_one_column():
    timelines.register_accessor()
    series = pd.Series(["c. 1650", "", "44 BC", "nonsense"], index=[10, 20, 30, 40])
    parsed = series.dates.parse()
    assert list(parsed.index) == [10, 20, 30, 40]
    assert parsed.loc[10, "earliest"] == "1645-01-01"
    assert parsed.loc[20, "error"] == "" and pd.isna(parsed.loc[20, "earliest"])
    # 44 BC is astronomical year -43, as ISO 8601 numbers years (Julian 1 January -43 is
    # proleptic Gregorian -0044-12-30: Meeus, Astronomical Algorithms, ch. 7, from memory).
    assert parsed.loc[30, "earliest"] == "-0044-12-30"
    assert parsed.loc[40, "error"] != ""
    assert list(series.dates.parse(span=True).columns)[:2] == ["earliest", "latest"]


def test_dataframe_cells_keep_their_types():
    frame = pd.DataFrame({
        "label": ["a", "b", "c"],
        "start": pd.to_datetime(["1900-02-03", None, "2001-05-06"]),
        "end": [1950, None, 2010]})
    records = timelines.Chart(frame).records
    assert records[0].span.start.earliest == datetime.date(1900, 2, 3).toordinal()
    assert records[0].span.end.latest == datetime.date(1950, 12, 31).toordinal()
    assert records[1].span is None                       # NaT and NaN are empty cells


# --- reprs ----------------------------------------------------------------------------------

@pytest.mark.parametrize("text, shown", [
    # ISO 8601-2 qualification signs: ~ approximate, ? uncertain, % both.
    ("c. 1650", "1645-01-01..1655-12-31 ~"),
    ("1650?", "1650-01-01..1650-12-31 ?"),
    ("1650%", "1645-01-01..1655-12-31 %"),
    ("1650s", "1650-01-01..1659-12-31"),
    ("2000-01-01", "2000-01-01"),
    ("before 1700", "..1699-12-31 before"),
    ("after 1780", "1781-01-01.. after"),
])
def test_an_endpoint_prints_as_its_dates(text, shown):
    endpoint = timelines.parse_date(text)
    assert str(endpoint) == shown
    assert repr(endpoint).startswith(f"Endpoint({shown}, ")


def test_a_span_prints_as_its_two_ends():
    assert str(timelines.parse_span("1650-1660")) == (
        "1650-01-01..1650-12-31 / 1660-01-01..1660-12-31")
    assert str(timelines.parse_span("../1760")) == ".. open start / 1760-01-01..1760-12-31"
    assert repr(timelines.parse_span("2000-01-01")) == "Span(2000-01-01)"


# --- matplotlib -----------------------------------------------------------------------------

def _axes():
    from matplotlib.figure import Figure

    figure = Figure(figsize=(8, 4))
    return figure, figure.add_subplot()


@pytest.mark.parametrize("low, high, labels", [
    # Round BCE years, the era boundary as 1 CE, round CE years (scene/scale.py's rule);
    # astronomical year -199 is 200 BCE (no year zero in BC/AD counting).
    (-250, 60, ["250 BCE", "200 BCE", "150 BCE", "100 BCE", "50 BCE", "1 CE", "50"]),
    (1600, 1800, ["1600", "1650", "1700", "1750", "1800"]),       # 25s would be 9 ticks
])
def test_year_axis_ticks_round_era_years(low, high, labels):
    figure, ax = _axes()
    ax.plot([low, high], [0, 1])
    ax.set_xlim(low, high)
    timelines.year_axis(ax)
    figure.canvas.draw()
    assert [t.get_text() for t in ax.get_xticklabels()] == labels
    positions = list(ax.get_xticks())
    assert positions[0] == (-249 if low < 0 else 1600)


def test_year_axis_labels_before_present():
    figure, ax = _axes()
    ax.set_xlim(1950 - 12_000, 1950 - 8_000)
    timelines.year_axis(ax, era="bp")
    figure.canvas.draw()
    labels = [t.get_text() for t in ax.get_xticklabels()]
    assert labels[0] == "12,000 BP" and labels[-1] == "8000 BP"


def test_decimal_years_are_exact_at_each_first_of_january():
    # Gregorian 2000-01-01 is JDN 2451545 (Meeus, Astronomical Algorithms, ch. 7).
    assert decimal_year_from_fixed(2451545 - JD_OFFSET) == 2000.0
    for year in (-4712, -199, 0, 1, 1582, 1900, 2000, 2024):
        first = fixed_from_gregorian(year, 1, 1)
        assert decimal_year_from_fixed(first) == year
        assert fixed_from_decimal_year(year + 0.5) == pytest.approx(
            first + (fixed_from_gregorian(year + 1, 1, 1) - first) / 2)


def test_draw_puts_the_lanes_into_an_existing_axes(table):
    figure, ax = _axes()
    ax.set_title("mine")
    size = tuple(figure.get_size_inches())
    chart = _chart(table)
    assert chart.draw(ax) is ax
    scale = chart.layout().scale
    low, high = ax.get_xlim()
    assert low == pytest.approx(decimal_year_from_fixed(scale.start))
    assert high == pytest.approx(decimal_year_from_fixed(scale.end))
    assert [t.get_text() for t in ax.get_yticklabels()] == ["Vashti", "Hollin", "Marrow"]
    labels = {artist.items[i].text for artist in ax.artists if hasattr(artist, "items")
              for i in range(len(artist.items)) if hasattr(artist.items[i], "text")}
    texts = {t.get_text() for t in ax.texts} | labels
    assert {"Aldric Hollin", "Cato Marrow"} <= texts
    assert ax.get_title() == "mine" and tuple(figure.get_size_inches()) == size
    figure.canvas.draw()                                  # draws without error
