"""The axis counts in the calendar the dates were read in (issue 10, item 9): under the
historical reckoning a day or month before the reform is ticked and labelled as Julian, and a
note under the chart says so; year scales need no note (a year label is the same in both)."""
from __future__ import annotations

from convertdate import julian

from timelines import Chart
from timelines.calendar import JD_OFFSET
from timelines.scene.primitives import Group, Text, walk


def _fixed_from_julian_by_convertdate(year: int, month: int, day: int) -> int:
    # convertdate's Julian day of the date's noon: JD = ... .5 at midnight; R.D. = JDN - 1721425
    return int(julian.to_jd(year, month, day) + 0.5) - JD_OFFSET


def _axis_labels(chart: Chart) -> list[Text]:
    [axis] = [g for g in chart.scene().children if isinstance(g, Group)
              and g.css_class == "axis"]
    return [t for t in walk(axis.children) if isinstance(t, Text)]


def _notes(chart: Chart) -> str:
    return " ".join(t.text for t in walk(chart.scene().children)
                    if isinstance(t, Text) and t.css_class == "note")


ROWS = [{"name": "Siege of Ardmore (invented)", "start": "1500-03-10", "end": "1500-08-20"},
        {"name": "Truce (invented)", "start": "1500-05-02", "end": "1500-06-30"}]


def test_months_before_the_reform_are_ticked_where_julian_months_begin():
    chart = Chart(ROWS, label="name")
    labels = _axis_labels(chart)
    april = next(t for t in labels if t.text == "Apr 1500")
    scale = chart.layout().scale
    assert round(scale.day_at(april.x)) == _fixed_from_julian_by_convertdate(1500, 4, 1)
    assert "Days and months on the axis are in the Julian calendar." in _notes(chart)


def test_the_gregorian_setting_ticks_gregorian_months_without_a_note():
    chart = Chart(ROWS, label="name").dates(calendar="gregorian")
    april = next(t for t in _axis_labels(chart) if t.text == "Apr 1500")
    import datetime
    assert round(chart.layout().scale.day_at(april.x)) == datetime.date(1500, 4, 1).toordinal()
    assert "Julian" not in _notes(chart)


def test_a_window_across_britains_reform_says_where_the_calendar_turns():
    rows = [{"name": "Almanac (invented)", "start": "1752-08-01", "end": "1752-11-30"}]
    chart = Chart(rows, label="name").dates(reform="britain")
    assert ("Days and months on the axis are Julian before 1752-09-14, Gregorian from it on."
            in _notes(chart))


def test_a_year_scale_needs_no_note():
    rows = [{"name": "Long reign (invented)", "start": "1300", "end": "1400"}]
    assert "Julian" not in _notes(Chart(rows, label="name"))
