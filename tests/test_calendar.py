"""Calendar arithmetic checked against published values and independent libraries.

Oracles: Meeus, *Astronomical Algorithms* (2nd ed., 1998), ch. 7; Reingold & Dershowitz,
*Calendrical Calculations*; convertdate (astronomical year numbering in both its `julian` and
`gregorian` modules: `julian.leap(0)` is True, checked below); Python's `datetime.date`.
"""
from __future__ import annotations

import datetime

import pytest
from convertdate import gregorian as cd_gregorian
from convertdate import julian as cd_julian
from hypothesis import given
from hypothesis import strategies as st

from timelines.calendar import (
    GREGORIAN, GREGORIAN_REFORM, HISTORICAL, JD_OFFSET, JULIAN, astronomical_year, days_in_month,
    fixed_from_calendar, fixed_from_gregorian, fixed_from_jdn, fixed_from_julian,
    gregorian_from_fixed, gregorian_year_range, is_gregorian_leap_year, is_julian_leap_year,
    iso_from_fixed, jdn_from_fixed, julian_from_fixed, month_range, year_label, year_range,
)

FIXED_FROM = {GREGORIAN: fixed_from_gregorian, JULIAN: fixed_from_julian}
FROM_FIXED = {GREGORIAN: gregorian_from_fixed, JULIAN: julian_from_fixed}
CONVERTDATE = {GREGORIAN: cd_gregorian, JULIAN: cd_julian}

# ±10,000 years around the common era, in fixed days.
FAR_PAST = fixed_from_gregorian(-10000, 1, 1)
FAR_FUTURE = fixed_from_gregorian(10000, 12, 31)


def julian_day(calendar: str, year: int, month: int, day: float) -> float:
    """JD of a moment: a civil date's JD at 0h is its JDN - 0.5 (Meeus ch. 7)."""
    whole = int(day)
    fixed = FIXED_FROM[calendar](year, month, whole)
    return jdn_from_fixed(fixed) - 0.5 + (day - whole)


# Meeus, Astronomical Algorithms, 2nd ed., ch. 7: the worked examples 7.a and 7.b and the table
# of Julian Days that follows them. Values from memory; each is also checked against convertdate
# below, which agrees. Meeus uses the Julian calendar before 1582 October 15 and astronomical
# years (-1000 is 1001 BC).
MEEUS_JULIAN_DAYS = [
    (GREGORIAN, 1957, 10, 4.81, 2436116.31),   # Example 7.a (Sputnik 1)
    (JULIAN, 333, 1, 27.5, 1842713.0),         # Example 7.b
    (GREGORIAN, 2000, 1, 1.5, 2451545.0),
    (GREGORIAN, 1999, 1, 1.0, 2451179.5),
    (GREGORIAN, 1987, 1, 27.0, 2446822.5),
    (GREGORIAN, 1987, 6, 19.5, 2446966.0),
    (GREGORIAN, 1988, 1, 27.0, 2447187.5),
    (GREGORIAN, 1988, 6, 19.5, 2447332.0),
    (GREGORIAN, 1900, 1, 1.0, 2415020.5),
    (GREGORIAN, 1600, 1, 1.0, 2305447.5),
    (GREGORIAN, 1600, 12, 31.0, 2305812.5),
    (JULIAN, 837, 4, 10.3, 2026871.8),
    (JULIAN, -123, 12, 31.0, 1676496.5),
    (JULIAN, -122, 1, 1.0, 1676497.5),
    (JULIAN, -1000, 7, 12.5, 1356001.0),
    (JULIAN, -1000, 2, 29.0, 1355866.5),
    (JULIAN, -1001, 8, 17.9, 1355671.4),
    (JULIAN, -4712, 1, 1.5, 0.0),
]


def test_meeus_table_has_no_repeated_case():
    assert len(set(MEEUS_JULIAN_DAYS)) == len(MEEUS_JULIAN_DAYS)


@pytest.mark.parametrize("calendar, year, month, day, jd", MEEUS_JULIAN_DAYS)
def test_julian_day_matches_meeus(calendar, year, month, day, jd):
    assert julian_day(calendar, year, month, day) == pytest.approx(jd, abs=1e-6)


@pytest.mark.parametrize("calendar, year, month, day, jd", MEEUS_JULIAN_DAYS)
def test_meeus_values_agree_with_convertdate(calendar, year, month, day, jd):
    # The recalled table is itself checked against an independent implementation.
    whole = int(day)
    oracle = CONVERTDATE[calendar].to_jd(year, month, whole) + (day - whole)
    assert oracle == pytest.approx(jd, abs=1e-6)


def test_meeus_example_7a_civil_date_jdn():
    # Meeus Example 7.a: 1957 October 4.81 = JD 2436116.31, so the civil date has JDN 2436116.
    assert jdn_from_fixed(fixed_from_gregorian(1957, 10, 4)) == 2436116


def test_meeus_example_7b_civil_date_jdn():
    # Meeus Example 7.b: 333 January 27.5 (Julian) = JD 1842713.0: noon, so JDN 1842713.
    assert jdn_from_fixed(fixed_from_julian(333, 1, 27)) == 1842713


def test_jdn_offset_and_inverse():
    # Reingold & Dershowitz: JD = R.D. + 1721424.5, so JDN (the noon count) = R.D. + 1721425.
    assert JD_OFFSET == 1721425
    assert jdn_from_fixed(1) == 1721426
    assert fixed_from_jdn(jdn_from_fixed(710347)) == 710347
    # Meeus ch. 7: JD 0 is Julian -4712 January 1 at noon.
    assert julian_from_fixed(fixed_from_jdn(0)) == (-4712, 1, 1)
    # Gregorian 2000-01-01 = JDN 2451545 (Meeus ch. 7, the J2000.0 epoch).
    assert gregorian_from_fixed(fixed_from_jdn(2451545)) == (2000, 1, 1)


def test_reingold_dershowitz_running_example():
    # Reingold & Dershowitz, Calendrical Calculations: R.D. 710347 = 1945 November 12
    # (from memory; datetime agrees).
    assert gregorian_from_fixed(710347) == (1945, 11, 12)
    assert fixed_from_gregorian(1945, 11, 12) == 710347
    assert datetime.date(1945, 11, 12).toordinal() == 710347


def test_rd_one_is_gregorian_year_one():
    # Reingold & Dershowitz: R.D. 1 = Gregorian 0001-01-01 = datetime.date.min.toordinal().
    assert fixed_from_gregorian(1, 1, 1) == 1 == datetime.date.min.toordinal()
    # Julian 0001-01-01 is Gregorian 0000-12-30, R.D. -1 (Reingold & Dershowitz, julian-epoch).
    assert fixed_from_julian(1, 1, 1) == -1
    assert gregorian_from_fixed(-1) == (0, 12, 30)


def test_gregorian_reform_follows_julian_4_october_1582():
    # The bull Inter gravissimas: Thursday 4 October 1582 (Julian) was followed by Friday
    # 15 October 1582 (Gregorian). Weekday via datetime (Monday = 0).
    reform = fixed_from_gregorian(1582, 10, 15)
    assert reform == fixed_from_julian(1582, 10, 4) + 1 == GREGORIAN_REFORM
    assert datetime.date.fromordinal(reform).weekday() == 4
    assert fixed_from_calendar(1582, 10, 15, HISTORICAL) == fixed_from_calendar(1582, 10, 4) + 1
    # convertdate agrees on the same pair of dates.
    assert cd_gregorian.to_jd(1582, 10, 15) == cd_julian.to_jd(1582, 10, 4) + 1


def test_historical_reckoning_switches_at_the_reform():
    assert fixed_from_calendar(1582, 10, 4) == fixed_from_julian(1582, 10, 4)
    assert fixed_from_calendar(1582, 10, 15) == fixed_from_gregorian(1582, 10, 15)
    assert fixed_from_calendar(1066, 10, 14) == fixed_from_julian(1066, 10, 14)
    assert fixed_from_calendar(1700, 3, 1) == fixed_from_gregorian(1700, 3, 1)
    # The historical October 1582 ran 1..4, 15..31: 21 days.
    first, last = month_range(1582, 10, HISTORICAL)
    assert last - first + 1 == 21
    # The historical year 1582 began on Julian 1 January and had 355 days.
    first, last = year_range(1582, HISTORICAL)
    assert (first, last - first + 1) == (fixed_from_julian(1582, 1, 1), 355)


# datetime.date.toordinal() is R.D. for years 1..9999 (Python documentation: "proleptic
# Gregorian ordinal, where January 1 of year 1 has ordinal 1").
@given(st.dates())
def test_gregorian_agrees_with_datetime(date):
    fixed = fixed_from_gregorian(date.year, date.month, date.day)
    assert fixed == date.toordinal()
    assert gregorian_from_fixed(fixed) == (date.year, date.month, date.day)


def test_gregorian_agrees_with_datetime_strided_over_years_1_to_9999():
    # Stride 7 * 13 + 2 (coprime to week, month and year lengths) visits every day-of-month.
    for ordinal in range(1, datetime.date.max.toordinal() + 1, 93):
        date = datetime.date.fromordinal(ordinal)
        assert gregorian_from_fixed(ordinal) == (date.year, date.month, date.day)
        assert fixed_from_gregorian(date.year, date.month, date.day) == ordinal


@pytest.mark.parametrize("calendar", [GREGORIAN, JULIAN])
@given(fixed=st.integers(FAR_PAST, FAR_FUTURE))
def test_round_trip_fixed_to_date_to_fixed(calendar, fixed):
    year, month, day = FROM_FIXED[calendar](fixed)
    assert 1 <= month <= 12 and 1 <= day <= days_in_month(year, month, calendar)
    assert FIXED_FROM[calendar](year, month, day) == fixed


@pytest.mark.parametrize("calendar", [GREGORIAN, JULIAN])
@given(fixed=st.integers(FAR_PAST, FAR_FUTURE))
def test_agrees_with_convertdate(calendar, fixed):
    # convertdate works in JD; R.D. fixed at 0h is JD fixed + 1721424.5.
    oracle = CONVERTDATE[calendar]
    assert FROM_FIXED[calendar](fixed) == oracle.from_jd(jdn_from_fixed(fixed) - 0.5)
    assert jdn_from_fixed(fixed) - 0.5 == oracle.to_jd(*FROM_FIXED[calendar](fixed))


@pytest.mark.parametrize("calendar", [GREGORIAN, JULIAN])
def test_every_month_of_twenty_thousand_years_is_contiguous(calendar):
    # Dense over months: each month starts the day after the previous one ended, and both its
    # first and last day survive the round trip.
    to_fixed, from_fixed = FIXED_FROM[calendar], FROM_FIXED[calendar]
    expected_next = to_fixed(-10000, 1, 1)
    for year in range(-10000, 10001):
        for month in range(1, 13):
            length = days_in_month(year, month, calendar)
            first = to_fixed(year, month, 1)
            assert first == expected_next
            assert from_fixed(first) == (year, month, 1)
            assert from_fixed(first + length - 1) == (year, month, length)
            expected_next = first + length


@pytest.mark.parametrize("calendar", [GREGORIAN, JULIAN])
@pytest.mark.parametrize("first_year", [-10000, -4713, -101, 1581, 9999])
def test_every_day_round_trips_near_hard_years(calendar, first_year):
    # Dense over days across the edges of the range, the JD epoch, the era boundary and the reform.
    to_fixed, from_fixed = FIXED_FROM[calendar], FROM_FIXED[calendar]
    for fixed in range(to_fixed(first_year, 1, 1), to_fixed(first_year + 3, 1, 1)):
        assert to_fixed(*from_fixed(fixed)) == fixed


def test_convertdate_uses_astronomical_years():
    # So comparing with it checks our year 0 = 1 BC convention, not a different one.
    assert cd_julian.leap(0) and cd_julian.leap(-4) and not cd_julian.leap(-1)
    assert cd_julian.to_jd(1, 1, 1) - cd_julian.to_jd(0, 1, 1) == 366


def test_leap_year_rules():
    # Gregorian rule (Inter gravissimas): centuries are leap only when divisible by 400.
    assert not is_gregorian_leap_year(1900) and is_julian_leap_year(1900)
    assert is_gregorian_leap_year(2000) and is_julian_leap_year(2000)
    # Year 0 (1 BC) and -4 (5 BC) are leap in both proleptic calendars (astronomical numbering;
    # Meeus ch. 7 lists -1000 Feb 29 as a date).
    assert is_gregorian_leap_year(0) and is_julian_leap_year(0)
    assert is_gregorian_leap_year(-4) and is_julian_leap_year(-4)
    assert not is_gregorian_leap_year(-1) and not is_julian_leap_year(-1)
    assert not is_gregorian_leap_year(-100) and is_julian_leap_year(-100)
    assert is_gregorian_leap_year(-400)
    assert not is_gregorian_leap_year(2001) and not is_julian_leap_year(2001)


@given(year=st.integers(1, 9999))
def test_gregorian_leap_rule_agrees_with_datetime(year):
    days = datetime.date(year, 12, 31).toordinal() - datetime.date(year, 1, 1).toordinal() + 1
    assert is_gregorian_leap_year(year) == (days == 366)


def test_days_in_month():
    assert [days_in_month(2001, m) for m in range(1, 13)] == [
        31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]
    assert days_in_month(2000, 2) == 29
    assert days_in_month(1900, 2, GREGORIAN) == 28
    assert days_in_month(1900, 2, JULIAN) == 29
    assert days_in_month(0, 2, GREGORIAN) == days_in_month(0, 2, JULIAN) == 29
    with pytest.raises(ValueError):
        days_in_month(2001, 13)
    with pytest.raises(ValueError):
        days_in_month(2001, 0)


def test_days_in_month_historical_follows_the_julian_rule_before_the_reform():
    assert days_in_month(1500, 2, HISTORICAL) == 29


@pytest.mark.parametrize("year, month, day, calendar", [
    (2001, 2, 29, GREGORIAN),
    (2001, 2, 29, HISTORICAL),
    (1900, 2, 29, GREGORIAN),
    (1900, 2, 29, HISTORICAL),   # 1900 is after the reform: Gregorian rule
    (2001, 13, 1, GREGORIAN),
    (2001, 0, 1, GREGORIAN),
    (2001, 4, 31, GREGORIAN),
    (2001, 1, 0, JULIAN),
    (1582, 10, 5, HISTORICAL),
    (1582, 10, 10, HISTORICAL),
    (1582, 10, 14, HISTORICAL),
])
def test_fixed_from_calendar_rejects_dates_that_do_not_exist(year, month, day, calendar):
    with pytest.raises(ValueError):
        fixed_from_calendar(year, month, day, calendar)


def test_fixed_from_calendar_accepts_dates_that_exist():
    assert fixed_from_calendar(1900, 2, 29, JULIAN) == fixed_from_julian(1900, 2, 29)
    assert fixed_from_calendar(1500, 2, 29, HISTORICAL) == fixed_from_julian(1500, 2, 29)
    # The skipped ten days exist in the proleptic calendars.
    assert fixed_from_calendar(1582, 10, 10, GREGORIAN) == fixed_from_gregorian(1582, 10, 10)
    assert fixed_from_calendar(1582, 10, 10, JULIAN) == fixed_from_julian(1582, 10, 10)
    assert fixed_from_calendar(2000, 2, 29, GREGORIAN) == datetime.date(2000, 2, 29).toordinal()


def test_fixed_from_calendar_gap_error_says_why():
    with pytest.raises(ValueError, match="1582-10-05..14 do not exist"):
        fixed_from_calendar(1582, 10, 5, HISTORICAL)


def test_fixed_from_calendar_rejects_unknown_calendar_names():
    with pytest.raises(ValueError):
        # Accepted today and read as Gregorian, though the caller asked for Julian.
        fixed_from_calendar(1900, 3, 1, "Julian")


def test_year_and_month_ranges():
    assert year_range(2000, GREGORIAN) == gregorian_year_range(2000) == (
        datetime.date(2000, 1, 1).toordinal(), datetime.date(2000, 12, 31).toordinal())
    assert month_range(1900, 2, GREGORIAN) == (
        datetime.date(1900, 2, 1).toordinal(), datetime.date(1900, 2, 28).toordinal())
    first, last = month_range(1900, 2, JULIAN)
    assert last - first + 1 == 29


def test_astronomical_year():
    # Astronomical numbering (Meeus ch. 7; common practice): 1 BC = 0, 44 BC = -43.
    assert astronomical_year(44, "BC") == -43
    assert astronomical_year(44, "BCE") == -43
    assert astronomical_year(1, "B.C.") == 0
    assert astronomical_year(1650, "AD") == 1650
    assert astronomical_year(1650, "CE") == 1650
    with pytest.raises(ValueError, match="no year zero"):
        astronomical_year(0, "BC")
    with pytest.raises(ValueError):
        astronomical_year(-5, "AD")


def test_astronomical_year_rejects_unknown_eras():
    with pytest.raises(ValueError):
        astronomical_year(44, "BX")


def test_year_label():
    # No year zero in BC/BCE counting (common practice, no source).
    assert year_label(-43) == "44 BCE"
    assert year_label(-43, "bc") == "44 BC"
    assert year_label(0) == "1 BCE"
    assert year_label(0, "bc") == "1 BC"
    assert year_label(1) == "1"
    assert year_label(1650) == "1650"
    assert year_label(-43, "astronomical") == "-43"
    assert year_label(0, "astronomical") == "0"


@pytest.mark.parametrize("calendar, ymd, expected", [
    # ISO 8601-1:2019 §4.4.1.3: expanded years carry a sign and at least four digits;
    # years are astronomical (0000 = 1 BC). Computed via the proleptic Gregorian calendar.
    (GREGORIAN, (-43, 3, 15), "-0043-03-15"),
    (GREGORIAN, (12000, 1, 1), "+12000-01-01"),
    (GREGORIAN, (0, 1, 1), "0000-01-01"),
    (GREGORIAN, (9999, 12, 31), "9999-12-31"),
    (GREGORIAN, (10000, 1, 1), "+10000-01-01"),
    (GREGORIAN, (-1, 12, 31), "-0001-12-31"),
    (GREGORIAN, (-10000, 2, 29), "-10000-02-29"),
    # The Ides of March 44 BC (Julian) fell on Gregorian -0043-03-13 (convertdate agrees:
    # checked in test_iso_of_the_ides_of_march_agrees_with_convertdate).
    (JULIAN, (-43, 3, 15), "-0043-03-13"),
])
def test_iso_from_fixed(calendar, ymd, expected):
    assert iso_from_fixed(FIXED_FROM[calendar](*ymd)) == expected


def test_iso_of_the_ides_of_march_agrees_with_convertdate():
    jd = cd_julian.to_jd(-43, 3, 15)
    assert cd_gregorian.from_jd(jd) == (-43, 3, 13)


@given(st.dates())
def test_iso_from_fixed_agrees_with_datetime_isoformat(date):
    assert iso_from_fixed(date.toordinal()) == date.isoformat()
