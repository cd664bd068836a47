"""The day the historical calendar switches from Julian to Gregorian is a setting.

Oracles: Python's `datetime.date.toordinal()` (proleptic Gregorian R.D.); convertdate's
`julian` module for Julian dates (JD at midnight = JDN - 0.5, JDN = R.D. + 1721425);
published switch days: Julian 4 October 1582 followed by Gregorian 15 October 1582 (the bull
Inter gravissimas; Reingold & Dershowitz, *Calendrical Calculations*), Julian 2 September 1752
followed by Gregorian 14 September 1752 in Britain and its colonies (Calendar (New Style) Act
1750; Reingold & Dershowitz), and the others of `NAMED_REFORMS` from the list of adoption dates
of the Gregorian calendar by country (Wikipedia), each given there as its last Julian day.
"""
from __future__ import annotations

import datetime

import pytest
from convertdate import julian as cd_julian

from timelines.calendar import (
    GREGORIAN_REFORM, HISTORICAL, JD_OFFSET, fixed_from_calendar, historical_calendar,
    month_range, reform_of, year_range,
)
from timelines.dates import (
    DateError, DateSettings, explain, parse_date, parse_span, settings_from_options,
)
from timelines.dates.settings import NAMED_REFORMS

BRITAIN = "historical:1752-09-14"
BRITISH = DateSettings(reform="1752-09-14")


def gregorian(year: int, month: int, day: int) -> int:
    return datetime.date(year, month, day).toordinal()


def julian(year: int, month: int, day: int) -> int:
    """R.D. of a Julian date by convertdate (its JD is at midnight: JDN - 0.5)."""
    return int(cd_julian.to_jd(year, month, day) + 0.5) - JD_OFFSET


def test_britain_went_from_julian_2_to_gregorian_14_september_1752():
    assert fixed_from_calendar(1752, 9, 2, BRITAIN) == julian(1752, 9, 2)
    assert fixed_from_calendar(1752, 9, 14, BRITAIN) == gregorian(1752, 9, 14)
    assert fixed_from_calendar(1752, 9, 14, BRITAIN) == fixed_from_calendar(1752, 9, 2,
                                                                            BRITAIN) + 1
    # September 1752 had 19 days in Britain: 1-2, 14-30.
    first, last = month_range(1752, 9, BRITAIN)
    assert (first, last) == (julian(1752, 9, 1), gregorian(1752, 9, 30))
    assert last - first + 1 == 19
    # The year 1752 had 355 days (366 in the Julian leap year, less 11).
    first, last = year_range(1752, BRITAIN)
    assert (first, last - first + 1) == (julian(1752, 1, 1), 355)


@pytest.mark.parametrize("day", [3, 8, 13])
def test_the_eleven_skipped_days_do_not_exist_in_britain(day):
    with pytest.raises(ValueError, match=r"1752-09-03\.\.13 do not exist .*Julian 2 September "
                                         r"was followed by Gregorian 14 September"):
        fixed_from_calendar(1752, 9, day, BRITAIN)


def test_between_1582_and_1752_britain_is_julian():
    # 1700-02-29 is a Julian leap day, not a Gregorian one.
    assert fixed_from_calendar(1700, 2, 29, BRITAIN) == julian(1700, 2, 29)
    assert fixed_from_calendar(1650, 4, 12, BRITAIN) == julian(1650, 4, 12)
    assert fixed_from_calendar(1582, 10, 10, BRITAIN) == julian(1582, 10, 10)
    with pytest.raises(ValueError, match="not a leap year"):
        fixed_from_calendar(1700, 2, 29, HISTORICAL)


# (name, last Julian day, first Gregorian day), as the list of adoption dates gives them.
PUBLISHED_SWITCHES = [
    ("papal", (1582, 10, 4), (1582, 10, 15)),
    ("france", (1582, 12, 9), (1582, 12, 20)),
    ("protestant-germany", (1700, 2, 18), (1700, 3, 1)),
    ("denmark-norway", (1700, 2, 18), (1700, 3, 1)),
    ("britain", (1752, 9, 2), (1752, 9, 14)),
    ("sweden", (1753, 2, 17), (1753, 3, 1)),
    ("russia", (1918, 1, 31), (1918, 2, 14)),
    ("greece", (1923, 2, 15), (1923, 3, 1)),
]


def test_every_named_reform_is_tested_once():
    assert sorted(name for name, _, _ in PUBLISHED_SWITCHES) == sorted(NAMED_REFORMS)


@pytest.mark.parametrize("name, last_julian, first_gregorian", PUBLISHED_SWITCHES)
def test_named_reforms_follow_the_published_last_julian_day(name, last_julian, first_gregorian):
    settings = settings_from_options({"reform": name})
    calendar = settings.reckoning
    assert fixed_from_calendar(*first_gregorian, calendar) == gregorian(*first_gregorian)
    assert fixed_from_calendar(*last_julian, calendar) == julian(*last_julian)
    assert julian(*last_julian) + 1 == gregorian(*first_gregorian)
    assert reform_of(calendar).last_julian == last_julian


def test_the_default_reform_is_the_papal_one():
    assert DateSettings().reckoning == HISTORICAL == historical_calendar(GREGORIAN_REFORM)
    assert settings_from_options({"reform": "papal"}) == DateSettings()


def test_a_february_reform_keeps_only_the_days_that_existed():
    # Sweden: Julian 17 February 1753 was followed by Gregorian 1 March.
    sweden = settings_from_options({"reform": "sweden"})
    assert parse_date("February 1753", sweden).latest == julian(1753, 2, 17)
    with pytest.raises(DateError, match="1753-02-18..28 do not exist"):
        parse_date("20 February 1753", sweden)
    # Denmark-Norway: 29 February 1700 (a Julian leap day) fell in the skipped days.
    denmark = settings_from_options({"reform": "denmark-norway"})
    with pytest.raises(DateError, match="do not exist"):
        parse_date("29 February 1700", denmark)


def test_dual_years_and_plain_dates_agree_under_the_british_reform():
    # Dual years are Old Style (Julian): 12 February 1701/02 is Julian 12 February 1702.
    dual = parse_date("12 February 1701/02", BRITISH)
    plain = parse_date("12 February 1702", BRITISH)
    assert dual == plain and plain.earliest == julian(1702, 2, 12)
    # With the default (papal) reform, 1702 is Gregorian: 11 days earlier.
    assert parse_date("12 February 1702").earliest == gregorian(1702, 2, 12)
    assert julian(1702, 2, 12) - gregorian(1702, 2, 12) == 11


def test_years_and_months_around_the_british_reform():
    assert parse_date("1700", BRITISH).earliest == julian(1700, 1, 1)
    assert parse_date("1752", BRITISH).latest == gregorian(1752, 12, 31)
    assert parse_date("September 1752", BRITISH).earliest == julian(1752, 9, 1)
    span = parse_span("1740–1760", BRITISH)
    assert span.start.earliest == julian(1740, 1, 1)
    assert span.end.latest == gregorian(1760, 12, 31)


def test_iso_forms_stay_proleptic_gregorian():
    assert parse_date("1702-02-12", BRITISH).earliest == gregorian(1702, 2, 12)


def test_explain_names_the_reform_day():
    lines = explain("12 April 1700", BRITISH)
    assert any("Julian before 1752-09-14" in line for line in lines)


@pytest.mark.parametrize("value, message", [
    ("1500-01-01", "comes before the first Gregorian day"),
    ("1752-02-30", "does not exist"),
    ("england", "one of papal, france"),
    ("14/09/1752", "YYYY-MM-DD"),
])
def test_a_bad_reform_is_refused_plainly(value, message):
    with pytest.raises(ValueError, match=message):
        settings_from_options({"reform": value})


def test_the_reform_is_named_in_the_settings_by_its_day():
    assert settings_from_options({"reform": "Britain"}).reform == "1752-09-14"
    assert settings_from_options({"reform": "1752-09-14"}) == BRITISH
