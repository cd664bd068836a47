"""Covering dates: a single value in a when column is a span over its whole unit.

Oracle: Python's `datetime.date.toordinal()` (R.D., proleptic Gregorian) for days after 1582;
convertdate's `julian` module for earlier ones. The reading itself is archival practice:
ISAD(G) 3.1.3 "Date(s)" gives the covering dates of a unit of description as a single date
or a range (from memory); the circa amounts are common practice, no source (docs/dates.md).
"""
from __future__ import annotations

import datetime

import pytest
from convertdate import julian as cd_julian

from timelines.calendar import JD_OFFSET
from timelines.dates import DateSettings, parse_span, parse_span_column, span_from_cell
from timelines.model import Qualifier, Span
from timelines.sources import ColumnMap, Table, load_records

MOMENTS = DateSettings(single_value="moment")


def day(year: int, month: int, day_number: int) -> int:
    return datetime.date(year, month, day_number).toordinal()


def julian(year: int, month: int, day_number: int) -> int:
    return int(cd_julian.to_jd(year, month, day_number) + 0.5) - JD_OFFSET


def covered(text: object, settings: DateSettings = DateSettings()) -> Span:
    return parse_span_column([text], settings)[0]


# (cell, first day, last day): the whole unit is the certain core.
WHOLE_UNITS = [
    ("1650", day(1650, 1, 1), day(1650, 12, 31)),
    ("1700s", day(1700, 1, 1), day(1799, 12, 31)),         # hundreds: the century by default
    ("1650s", day(1650, 1, 1), day(1659, 12, 31)),
    ("19th century", day(1800, 1, 1), day(1899, 12, 31)),
    ("early 17th century", day(1600, 1, 1), day(1632, 12, 31)),
    ("April 1650", day(1650, 4, 1), day(1650, 4, 30)),
    ("winter 1650", day(1650, 12, 1), day(1651, 2, 28)),
    ("1650?", day(1650, 1, 1), day(1650, 12, 31)),
    ("fl. 1650", day(1650, 1, 1), day(1650, 12, 31)),
    ("1985", day(1985, 1, 1), day(1985, 12, 31)),          # ISO 8601 year
    ("1985-04", day(1985, 4, 1), day(1985, 4, 30)),
    ("1570", julian(1570, 1, 1), julian(1570, 12, 31)),    # Julian before 1582-10-15
    (1650, day(1650, 1, 1), day(1650, 12, 31)),            # a spreadsheet's number cell
]


def test_no_case_repeats():
    assert len({repr(text) for text, _, _ in WHOLE_UNITS}) == len(WHOLE_UNITS)


@pytest.mark.parametrize("text, first, last", WHOLE_UNITS)
def test_a_single_value_covers_its_whole_unit(text, first, last):
    span = covered(text)
    assert (span.start.earliest, span.start.latest) == (first, first)
    assert (span.end.earliest, span.end.latest) == (last, last)
    assert span.certain_core == span.possible_extent == (first, last)


@pytest.mark.parametrize("text", ["1650", "19th century", "c. 1650", "1650s"])
def test_the_moment_setting_reads_single_values_as_before(text):
    assert covered(text, MOMENTS) == parse_span(text) == span_from_cell(text)
    assert covered(text, MOMENTS).is_point


def test_parse_span_of_one_value_is_still_a_point():
    # parse_span and span_from_cell are unchanged: covering belongs to a span column.
    assert parse_span("19th century").is_point and span_from_cell("1650").is_point


@pytest.mark.parametrize("text", [
    "1650-04-12", "12 April 1650", "before 1700", "after 1650", "by 1700",
    "between 1650 and 1660", "1650 or 1651", "[1667,1668]", "{1667,1668}", "198X",
    "1650 ± 10", "65.5 Ma", "12,500 BP", "c. 12 April 1650",
])
def test_values_that_name_no_unit_stay_moments(text):
    assert covered(text) == parse_span(text)


@pytest.mark.parametrize("text", ["1650–1660", "1985/1987", "../1760", "1650s–1670s"])
def test_ranges_and_intervals_are_unchanged(text):
    assert covered(text) == parse_span(text)


def test_circa_blurs_each_end_of_the_unit():
    span = covered("c. 1650")
    # Each end is the unit's boundary widened by circa-year (5 years) on each side.
    assert (span.start.earliest, span.start.latest) == (day(1645, 1, 1), day(1655, 1, 1))
    assert (span.end.earliest, span.end.latest) == (day(1645, 12, 31), day(1655, 12, 31))
    assert (span.start.likely, span.end.likely) == (day(1650, 1, 1), day(1650, 12, 31))
    assert span.possible_extent == (day(1645, 1, 1), day(1655, 12, 31))
    assert span.certain_core is None       # nothing of "about 1650" is certain
    assert span.start.has(Qualifier.APPROXIMATE) and span.end.has(Qualifier.APPROXIMATE)


def test_circa_keeps_a_core_in_a_long_unit():
    span = covered("c. 19th century")    # circa-century: 25 years
    assert span.certain_core == (day(1825, 1, 1), day(1874, 12, 31))
    assert span.possible_extent == (day(1775, 1, 1), day(1924, 12, 31))


def test_circa_of_a_month_moves_each_end_by_days():
    span = covered("c. April 1650")      # circa-month: 31 days
    assert (span.start.earliest, span.start.latest) == (day(1650, 4, 1) - 31,
                                                        day(1650, 4, 1) + 31)
    assert (span.end.earliest, span.end.latest) == (day(1650, 4, 30) - 31,
                                                    day(1650, 4, 30) + 31)


def test_circa_follows_the_circa_settings():
    span = covered("c. 1650", DateSettings(circa_years_for_year=2))
    assert (span.start.earliest, span.start.latest) == (day(1648, 1, 1), day(1652, 1, 1))


def test_a_when_column_draws_covering_dates():
    table = Table.from_rows("fonds.csv", ("file", "dates"),
                            [("Letter book", "1700s"), ("Petition", "1650-04-12"),
                             ("Accounts", "c. 1650"), ("Minutes", "1650–1660")])
    records = load_records(table, ColumnMap(when="dates", label="file")).records
    spans = {record.label: record.span for record in records}
    assert spans["Letter book"].certain_core == (day(1700, 1, 1), day(1799, 12, 31))
    assert spans["Petition"].is_point
    assert spans["Minutes"] == parse_span("1650–1660")
    moments = load_records(table, ColumnMap(when="dates", label="file"), MOMENTS).records
    assert all(record.span == parse_span(record.start_text) for record in moments)
