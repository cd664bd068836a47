"""Calendars: Old Style/New Style dual years, calendar markers in the text, the year-start
setting. Julian days are checked against convertdate.julian, Gregorian ones against the
stdlib; handbook facts are from Cheney, *A Handbook of Dates* (from memory): England began
the year on 25 March until 1752, and dual years are written for 1 January .. 24 March.
"""
from __future__ import annotations

import datetime
import math

import convertdate.julian
import pytest
from hypothesis import given, strategies as st

from timelines.calendar import JD_OFFSET, iso_from_fixed
from timelines.dates import DateError, DateSettings, parse_date, parse_span
from timelines.dates.windows import month_bounds, year_bounds
from timelines.model import Qualifier

C = Qualifier.CONVENTION_DEPENDENT
LADY_DAY = DateSettings(year_start="03-25")
NATIVITY = DateSettings(year_start="12-25")


def _julian(year, month, day):
    # convertdate gives the JD at midnight (x.5); JDN = floor(JD + 0.5) = R.D. + 1721425.
    return math.floor(convertdate.julian.to_jd(year, month, day) + 0.5) - JD_OFFSET


def _gregorian(year, month, day):
    return datetime.date(year, month, day).toordinal()


# (text, settings, Julian first day, Julian last day)
DUAL_YEARS = [
    ("12 February 1701/02", DateSettings(), (1702, 2, 12), (1702, 2, 12)),   # issue 3 example: Old Style 1701 = 1702
    ("12 February 1701/2", DateSettings(), (1702, 2, 12), (1702, 2, 12)),
    ("12 Feb 1701/1702", DateSettings(), (1702, 2, 12), (1702, 2, 12)),
    ("11 February 1731/32", DateSettings(), (1732, 2, 11), (1732, 2, 11)),   # a handbook example (from memory): N.S. 22 February 1732
    ("24 March 1699/1700", DateSettings(), (1700, 3, 24), (1700, 3, 24)),    # the last day of Old Style 1699
    ("1 January 1699/00", DateSettings(), (1700, 1, 1), (1700, 1, 1)),       # the century rolls over
    ("February 1701/02", DateSettings(), (1702, 2, 1), (1702, 2, 28)),
    ("March 1701/02", DateSettings(), (1702, 3, 1), (1702, 3, 24)),          # only the days before Lady Day
    ("1701/02", DateSettings(), (1702, 1, 1), (1702, 3, 24)),                # issue 3: the dual part of the year
    ("1699/1700", DateSettings(), (1700, 1, 1), (1700, 3, 24)),              # issue 3 example
    ("1701/02", DateSettings(year_start="03-01"), (1702, 1, 1), (1702, 2, 28)),  # Venice: year began 1 March
    ("12 February 1701/02", DateSettings(calendar="gregorian"), (1702, 2, 12), (1702, 2, 12)),  # dual years are Old Style
    ("12 February 1701/02 O.S.", DateSettings(), (1702, 2, 12), (1702, 2, 12)),
    ("c. 12 February 1701/02", DateSettings(), (1702, 1, 28), (1702, 2, 27)),   # circa ±15 days
]


def test_dual_year_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in DUAL_YEARS]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, first, last", DUAL_YEARS)
def test_dual_years_agree_with_convertdate(text, settings, first, last):
    endpoint = parse_date(text, settings)
    assert (endpoint.earliest, endpoint.latest) == (_julian(*first), _julian(*last))


def test_a_dual_year_day_in_new_style():
    # Cheney (from memory): from 1 March 1700 the calendars were eleven days apart.
    assert iso_from_fixed(parse_date("11 February 1731/32").earliest) == "1732-02-22"
    assert iso_from_fixed(parse_date("12 February 1701/02").earliest) == "1702-02-23"


def test_a_bare_dual_year_depends_on_the_new_year_convention():
    assert parse_date("1701/02").has(C)
    assert not parse_date("12 February 1701/02").has(C)


# (text, exact reason)
DUAL_ERRORS = [
    ("12 June 1701/02", "a dual year is written only for days from 1 January to the Old Style "
                        "new year (24 March)"),
    ("1650/52", "1650/52 is not a dual year: a dual year names a year and the next one"),
    ("12 February 1701/03", "1701/03 is not a dual year: a dual year names a year and the next one"),
    ("12 February 1701/02 N.S.", "a dual year belongs to the Old Style (Julian) calendar"),
    ("1701/02 BC", "a dual year belongs to the Old Style of the Christian era, not BC"),
    ("1751/52", "1751/52 cannot be a dual year: from 1752 the year began on 1 January "
                "(the Calendar Act of 1750)"),                   # Cheney (from memory)
    ("Jan 1788/9", "1788/9 cannot be a dual year: from 1752 the year began on 1 January "
                   "(the Calendar Act of 1750)"),
]


def test_dual_error_table_has_no_repeated_case():
    assert len({row[0] for row in DUAL_ERRORS}) == len(DUAL_ERRORS)


@pytest.mark.parametrize("text, reason", DUAL_ERRORS)
def test_dual_year_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason


def test_consecutive_years_apart_are_an_interval():
    span = parse_span("1985/1987")
    assert span.start.latest < span.end.earliest
    # After the last dual year two full consecutive years are an ISO 8601 interval.
    span = parse_span("1850/1851")
    assert span.start.earliest == datetime.date(1850, 1, 1).toordinal()
    assert span.end.latest == datetime.date(1851, 12, 31).toordinal()


def test_the_last_dual_year():
    endpoint = parse_date("1750/51")                      # 1 January .. 24 March 1751 (Julian)
    assert (endpoint.earliest, endpoint.latest) == (_julian(1751, 1, 1), _julian(1751, 3, 24))


# (text, settings, expected fixed day as (calendar, y, m, d)): markers override the setting
MARKERS = [
    ("1700-02-29 (Julian)", DateSettings(), ("julian", 1700, 2, 29)),   # issue 3: valid Julian, invalid Gregorian
    ("Julian 1700-02-29", DateSettings(), ("julian", 1700, 2, 29)),
    ("29 February 1700 O.S.", DateSettings(), ("julian", 1700, 2, 29)),
    ("29 February 1700 Old Style", DateSettings(), ("julian", 1700, 2, 29)),
    ("@#DJULIAN@ 29 FEB 1700", DateSettings(), ("julian", 1700, 2, 29)),  # GEDCOM calendar escape
    ("12 April 1650 (Julian)", DateSettings(calendar="gregorian"), ("julian", 1650, 4, 12)),
    ("12 April 1500 N.S.", DateSettings(), ("gregorian", 1500, 4, 12)),
    ("12 April 1500 Gregorian", DateSettings(calendar="julian"), ("gregorian", 1500, 4, 12)),
    ("@#DGREGORIAN@ 12 APR 1500", DateSettings(), ("gregorian", 1500, 4, 12)),
    ("12 April 1650", DateSettings(calendar="julian"), ("julian", 1650, 4, 12)),
    ("12 April 1500", DateSettings(calendar="gregorian"), ("gregorian", 1500, 4, 12)),
    ("1500-04-12", DateSettings(calendar="julian"), ("gregorian", 1500, 4, 12)),  # ISO: Gregorian
]


def test_marker_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in MARKERS]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, expected", MARKERS)
def test_calendar_markers_override_the_setting(text, settings, expected):
    calendar, *ymd = expected
    fixed = _julian(*ymd) if calendar == "julian" else _gregorian(*ymd)
    assert parse_date(text, settings).earliest == fixed


@pytest.mark.parametrize("text, reason", [
    ("1700-02-29", "1700 is not a leap year"),
    ("29 February 1700 N.S.", "1700 is not a leap year in the gregorian calendar"),
    ("1700-02-29 Julian N.S.", "the date names two calendars"),
    ("1582-10-10 (Julian)", None),
])
def test_a_date_must_exist_in_the_calendar_it_is_written_in(text, reason):
    if reason is None:
        parse_date(text)  # 10 October 1582 exists in the Julian calendar
        return
    with pytest.raises(DateError) as caught:
        parse_date(text)
    assert caught.value.reason == reason


# (text, settings, first (calendar, y, m, d), last (calendar, y, m, d)): the year-start setting
YEAR_STARTS = [
    ("1701", LADY_DAY, ("julian", 1701, 3, 25), ("julian", 1702, 3, 24)),   # Lady Day year 1701
    ("12 February 1701", LADY_DAY, ("julian", 1702, 2, 12), ("julian", 1702, 2, 12)),  # Old Style number
    ("12 June 1701", LADY_DAY, ("julian", 1701, 6, 12), ("julian", 1701, 6, 12)),      # after Lady Day: as written
    ("February 1701", LADY_DAY, ("julian", 1702, 2, 1), ("julian", 1702, 2, 28)),
    ("March 1701", LADY_DAY, ("julian", 1701, 3, 25), ("julian", 1702, 3, 24)),        # split by the new year
    ("1200", NATIVITY, ("julian", 1199, 12, 25), ("julian", 1200, 12, 24)),   # Nativity style: began 25 Dec before
    ("26 December 1200", NATIVITY, ("julian", 1199, 12, 26), ("julian", 1199, 12, 26)),
    ("1701", DateSettings(), ("julian", 1701, 1, 1), ("julian", 1701, 12, 31)),
]


def test_year_start_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in YEAR_STARTS]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, first, last", YEAR_STARTS)
def test_year_start_setting(text, settings, first, last):
    julian = DateSettings(calendar="julian", year_start=settings.year_start)
    endpoint = parse_date(text, julian)
    assert (endpoint.earliest, endpoint.latest) == (_julian(*first[1:]), _julian(*last[1:]))


def test_year_start_marks_only_what_it_moved():
    assert parse_date("1701", LADY_DAY).has(C)
    assert parse_date("12 February 1701", LADY_DAY).has(C)
    assert not parse_date("12 June 1701", LADY_DAY).has(C)
    assert not parse_date("1701").has(C)


@given(st.integers(min_value=1, max_value=3000), st.sampled_from(["03-25", "03-01", "12-25"]))
def test_written_years_tile_time(year, start):
    # Consecutive written years meet without a gap or an overlap, whatever the year start.
    settings = DateSettings(calendar="julian", year_start=start)
    this, following = parse_date(str(year), settings), parse_date(str(year + 1), settings)
    assert following.earliest == this.latest + 1


@given(st.dates(min_value=datetime.date(1, 1, 1), max_value=datetime.date(9999, 12, 31)))
def test_julian_days_agree_with_convertdate(day):
    year, month, number = convertdate.julian.from_gregorian(day.year, day.month, day.day)
    if year < 1:
        return
    text = f"{number} {datetime.date(2001, month, 1):%B} {year}"
    endpoint = parse_date(text, DateSettings(calendar="julian"))
    assert endpoint.earliest == day.toordinal()


# Oracles: convertdate.julian for Julian days, datetime.date for proleptic Gregorian ones. The
# remembered bounds are worked out without a second calendar conversion (windows.py).
@given(st.integers(1, 9998), st.integers(1, 12))
def test_year_and_month_bounds_agree_with_the_oracles(year, month):
    next_year, next_month = (year + 1, 1) if month == 12 else (year, month + 1)
    assert year_bounds(year, "julian") == (_julian(year, 1, 1), _julian(year + 1, 1, 1) - 1)
    assert month_bounds(year, month, "julian") == (_julian(year, month, 1),
                                                   _julian(next_year, next_month, 1) - 1)
    assert year_bounds(year, "gregorian") == (_gregorian(year, 1, 1), _gregorian(year, 12, 31))
    assert month_bounds(year, month, "gregorian") == (_gregorian(year, month, 1),
                                                      _gregorian(next_year, next_month, 1) - 1)
