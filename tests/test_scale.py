"""The time scale and its ticks.

Oracles: datetime.date for day and month positions (years 1..9999), convertdate for Julian
positions, and the calendar functions already checked in test_calendar.py. The tick-label rule at
the era boundary (round BCE numbers, then "1 CE", then round CE numbers) is common practice, no
source; thousands separators from five-digit years on likewise.
"""
from __future__ import annotations

import datetime
import math

import pytest
from convertdate import julian as cd_julian
from hypothesis import assume, given
from hypothesis import strategies as st

from timelines.calendar import (
    GREGORIAN, HISTORICAL, JULIAN, astronomical_year, before_present_label, fixed_from_calendar,
    fixed_from_gregorian, fixed_from_julian, gregorian_from_fixed, jdn_from_fixed,
)
from timelines.scene.scale import (
    MONTH_ABBREVIATIONS, TickUnit, TimeScale, choose_unit, nice_domain, tick_years, ticks,
)

MONTH_NUMBERS = {abbreviation: i + 1 for i, abbreviation in enumerate(MONTH_ABBREVIATIONS)}


def axis(first: tuple[int, int, int], last: tuple[int, int, int]) -> TimeScale:
    return TimeScale(fixed_from_gregorian(*first), fixed_from_gregorian(*last), 0.0, 800.0)


def labels(scale: TimeScale, **options) -> list[str]:
    return [tick.label for tick in ticks(scale, **options) if tick.major]


def year_from_label(text: str) -> int:
    """Astronomical year of a label written as '44 BCE', '44 BC', 'AD 1', '1 CE', '-43'."""
    text = text.replace(",", "")
    if text.startswith("AD "):
        return astronomical_year(int(text[3:]), "AD")
    number, _, era = text.partition(" ")
    return astronomical_year(int(number), era) if era else int(number)


def date_from_label(text: str) -> tuple[int, int, int]:
    """(year, month, day) of a tick label: '12 Apr 1650', 'Apr 1650' or a year label."""
    words = text.split(" ", 2)
    if words[0] in MONTH_NUMBERS:
        return year_from_label(text.split(" ", 1)[1]), MONTH_NUMBERS[words[0]], 1
    if len(words) > 2 and words[1] in MONTH_NUMBERS:
        return year_from_label(words[2]), MONTH_NUMBERS[words[1]], int(words[0])
    return year_from_label(text), 1, 1


# --- TimeScale ------------------------------------------------------------------------------


def test_scale_maps_ends_and_back():
    scale = TimeScale(100.0, 300.0, 50.0, 450.0)
    assert scale.px_per_day == 2.0
    assert scale.x(100) == 50 and scale.x(300) == 450 and scale.x(200) == 250
    assert scale.day_at(250) == 200
    assert scale.x(400) == 650    # outside the domain the map simply extends


@given(st.floats(-4e12, 4e12), st.floats(1, 1e12), st.floats(0, 1))
def test_day_at_inverts_x(start, length, fraction):
    scale = TimeScale(start, start + length, 10.0, 1010.0)
    day = start + fraction * length
    assert scale.day_at(scale.x(day)) == pytest.approx(day, rel=1e-9, abs=1e-6 * length)


@pytest.mark.parametrize("start, end, x0, x1", [
    (10, 10, 0, 100), (10, 5, 0, 100), (0, 10, 100, 100), (0, math.inf, 0, 100),
    (math.nan, 10, 0, 100),
])
def test_invalid_scales_are_rejected(start, end, x0, x1):
    with pytest.raises(ValueError):
        TimeScale(start, end, x0, x1)


# --- the era boundary ---------------------------------------------------------------------------

ERA_BOUNDARY_CASES = [
    # (step, first year, last year, era, astronomical years with a tick)
    (100, -250, 250, "bce", [-199, -99, 1, 100, 200]),      # 200 BCE, 100 BCE, 1 CE, 100, 200
    (100, -250, 250, "astronomical", [-200, -100, 0, 100, 200]),
    (1, -2, 2, "bce", [-2, -1, 0, 1, 2]),                   # every year; 0 is 1 BCE
    (2, -6, 6, "bce", [-5, -3, -1, 1, 4, 6]),               # 2 dropped: within half a step of 1
    (5, -12, 12, "bce", [-9, -4, 1, 5, 10]),                # 10 BCE, 5 BCE, 1 CE, 5, 10
    (10, 1600, 1650, "bce", [1600, 1610, 1620, 1630, 1640, 1650]),
    (1000, -5000, -999, "bce", [-4999, -3999, -2999, -1999, -999]),    # 5000 .. 1000 BCE
    (1000, -5000, -1000, "bce", [-4999, -3999, -2999, -1999]),   # -1000 is 1001 BCE
    (100, 1, 300, "bce", [1, 100, 200, 300]),
    (100, 2, 300, "bce", [100, 200, 300]),
]


def test_era_boundary_cases_do_not_repeat():
    assert len({repr(case) for case in ERA_BOUNDARY_CASES}) == len(ERA_BOUNDARY_CASES)


@pytest.mark.parametrize("step, first, last, era, expected", ERA_BOUNDARY_CASES)
def test_tick_years_at_the_era_boundary(step, first, last, era, expected):
    assert tick_years(step, first, last, era) == expected


def test_bce_axis_reads_in_round_numbers():
    scale = axis((-250, 1, 1), (250, 1, 1))
    assert labels(scale) == ["200 BCE", "100 BCE", "1 CE", "100", "200"]
    assert labels(scale, era="bc") == ["200 BC", "100 BC", "AD 1", "100", "200"]
    assert labels(scale, era="astronomical") == ["-200", "-100", "0", "100", "200"]


def test_year_ticks_sit_on_1_january_of_their_year():
    scale = axis((-250, 1, 1), (250, 1, 1))
    assert [t.day for t in ticks(scale)] == [
        fixed_from_gregorian(y, 1, 1) for y in (-199, -99, 1, 100, 200)]


def test_no_tick_is_labelled_year_zero():
    scale = axis((-2, 1, 1), (3, 1, 1))     # astronomical -2 is 3 BCE
    assert labels(scale) == ["3 BCE", "2 BCE", "1 BCE", "1 CE", "2", "3"]
    for max_ticks in range(1, 30):
        for text in labels(axis((-12, 1, 1), (12, 1, 1)), max_ticks=max_ticks):
            assert text.split(" ")[0] != "0"


# --- units, labels, calendars --------------------------------------------------------------------


@pytest.mark.parametrize("first, last, expected", [
    ((1600, 1, 1), (1700, 1, 1), ["1600", "1620", "1640", "1660", "1680", "1700"]),
    ((1650, 1, 1), (1651, 1, 1), ["Jan 1650", "Mar 1650", "May 1650", "Jul 1650", "Sep 1650",
                                  "Nov 1650", "Jan 1651"]),
    ((1650, 4, 1), (1650, 4, 6), ["1 Apr 1650", "2 Apr 1650", "3 Apr 1650", "4 Apr 1650",
                                  "5 Apr 1650", "6 Apr 1650"]),
    ((1650, 4, 1), (1650, 5, 1), ["1 Apr 1650", "6 Apr 1650", "11 Apr 1650", "16 Apr 1650",
                                  "21 Apr 1650", "26 Apr 1650", "1 May 1650"]),
    ((-15000, 1, 1), (-9000, 1, 1), ["15,000 BCE", "14,000 BCE", "13,000 BCE", "12,000 BCE",
                                     "11,000 BCE", "10,000 BCE"]),
    ((-2999, 1, 1), (-1999, 1, 1), ["3000 BCE", "2800 BCE", "2600 BCE", "2400 BCE",
                                    "2200 BCE", "2000 BCE"]),
    ((-66_000_000, 1, 1), (-60_000_000, 1, 1), [
        "66,000,000 BCE", "65,000,000 BCE", "64,000,000 BCE", "63,000,000 BCE",
        "62,000,000 BCE", "61,000,000 BCE"]),
    ((10000, 1, 1), (13000, 1, 1), ["10,000", "10,500", "11,000", "11,500", "12,000",
                                    "12,500", "13,000"]),
])
def test_tick_labels(first, last, expected):
    assert labels(axis(first, last)) == expected


def test_quarter_century_steps():
    assert labels(axis((1900, 1, 1), (2000, 1, 2)), max_ticks=5) == [
        "1900", "1925", "1950", "1975", "2000"]


def test_small_common_era_years_carry_the_era_in_dates():
    # "Apr 5" would read as a day of April.
    assert labels(axis((5, 4, 1), (5, 4, 3))) == ["1 Apr 5 CE", "2 Apr 5 CE", "3 Apr 5 CE"]
    assert labels(axis((5, 4, 1), (5, 4, 3)), era="bc") == [
        "1 Apr AD 5", "2 Apr AD 5", "3 Apr AD 5"]
    assert labels(axis((-43, 3, 14), (-43, 3, 16))) == [
        "14 Mar 44 BCE", "15 Mar 44 BCE", "16 Mar 44 BCE"]


def test_day_and_month_positions_agree_with_datetime():
    scale = axis((1650, 1, 1), (1651, 1, 1))
    for tick in ticks(scale):
        assert tick.day == datetime.date(*date_from_label(tick.label)).toordinal()


def test_historical_years_before_the_reform_begin_on_julian_1_january():
    scale = axis((1400, 1, 1), (1800, 1, 1))
    by_label = {t.label: t.day for t in ticks(scale, calendar=HISTORICAL)}
    # convertdate: Julian 1500-01-01 as a JD, back to R.D.
    assert by_label["1500"] == cd_julian.to_jd(1500, 1, 1) + 0.5 - jdn_from_fixed(0)
    assert by_label["1500"] == fixed_from_julian(1500, 1, 1)
    assert by_label["1700"] == fixed_from_gregorian(1700, 1, 1)
    gregorian = {t.label: t.day for t in ticks(scale, calendar=GREGORIAN)}
    assert gregorian["1500"] == fixed_from_gregorian(1500, 1, 1)
    julian = {t.label: t.day for t in ticks(scale, calendar=JULIAN)}
    assert julian["1700"] == fixed_from_julian(1700, 1, 1)


def test_historical_day_ticks_skip_the_ten_days_of_the_reform():
    scale = TimeScale(fixed_from_julian(1582, 10, 3), fixed_from_gregorian(1582, 10, 16), 0, 800)
    assert labels(scale, calendar=HISTORICAL) == [
        "3 Oct 1582", "4 Oct 1582", "15 Oct 1582", "16 Oct 1582"]


def test_minor_ticks_lie_between_majors_and_carry_no_label():
    scale = axis((1900, 1, 1), (2000, 1, 1))
    every = ticks(scale, minor=True)
    majors = [t for t in every if t.major]
    minors = [t for t in every if not t.major]
    assert majors == ticks(scale)
    assert [t.day for t in minors] == [
        fixed_from_gregorian(y, 1, 1) for y in range(1905, 2000, 5) if y % 20]
    assert all(t.label == "" for t in minors)
    assert [t.day for t in every] == sorted({t.day for t in every})


def test_minor_ticks_across_the_era_boundary_align_with_the_majors():
    scale = axis((-50, 1, 1), (31, 1, 1))
    every = ticks(scale, minor=True)
    assert [t.label for t in every if t.major] == ["40 BCE", "20 BCE", "1 CE", "20"]
    # Minor ticks have no label: read their years from their days.
    years = [gregorian_from_fixed(int(t.day))[0] for t in every]
    assert years == [-49, -44, -39, -34, -29, -24, -19, -14, -9, -4, 1, 5, 10, 15, 20, 25, 30]


def test_options_are_checked():
    scale = axis((1600, 1, 1), (1700, 1, 1))
    with pytest.raises(ValueError):
        ticks(scale, era="BCE")
    with pytest.raises(ValueError):
        ticks(scale, calendar="Gregorian")
    with pytest.raises(ValueError):
        ticks(scale, max_ticks=0)
    with pytest.raises(ValueError):
        nice_domain(10, 5)


# --- properties of ticks over any axis ----------------------------------------------------------

# Axis start from 10 million years BCE to 10,000 CE; length from a few hours to 100 Ma.
axis_start = st.floats(-3.6e9, 3.6e6)
axis_length = st.floats(-1, 10.6).map(lambda e: 10 ** e)
eras = st.sampled_from(["bce", "bc", "astronomical"])
calendars = st.sampled_from([GREGORIAN, JULIAN, HISTORICAL])


@given(axis_start, axis_length, st.integers(1, 20), eras, calendars)
def test_ticks_are_few_ordered_inside_and_labelled_with_their_own_date(
        start, length, max_ticks, era, calendar):
    scale = TimeScale(start, start + length, 0, 1000)
    found = ticks(scale, max_ticks=max_ticks, era=era, calendar=calendar)
    assert len(found) <= max_ticks
    assert all(start <= t.day <= start + length for t in found)
    assert [t.day for t in found] == sorted({t.day for t in found})
    for tick in found:
        # The label names the day the tick stands on, read in the axis's calendar.
        assert fixed_from_calendar(*date_from_label(tick.label), calendar) == tick.day
        if era != "astronomical":
            assert not tick.label.startswith("0")


@given(axis_start, axis_length, st.integers(2, 12), st.sampled_from(["bce", "bc"]))
def test_year_tick_labels_are_round_numbers(start, length, max_ticks, era):
    scale = TimeScale(start, start + length, 0, 1000)
    unit = choose_unit(scale.start, scale.end, max_ticks=max_ticks, era=era)
    assume(unit.kind == "year")
    for tick in ticks(scale, max_ticks=max_ticks, era=era):
        year = year_from_label(tick.label)
        number = year if year > 0 else 1 - year
        assert number % unit.step == 0 or year == 1


@given(axis_start, axis_length, st.integers(1, 12))
def test_the_chosen_unit_is_the_smallest_that_fits(start, length, max_ticks):
    # With one tick more allowed, the unit is never coarser.
    coarse = choose_unit(start, start + length, max_ticks=max_ticks)
    fine = choose_unit(start, start + length, max_ticks=max_ticks + 1)
    order = {"day": 0, "month": 1, "year": 2}
    assert (order[fine.kind], fine.approximate_days) <= (order[coarse.kind],
                                                        coarse.approximate_days)


def test_unit_ladder_reaches_deep_time():
    huge = TimeScale(-1.6e12, 0, 0, 1000)     # about 4.4 billion years
    unit = choose_unit(huge.start, huge.end)
    assert unit == TickUnit("year", 500_000_000)
    assert labels(huge)[:2] == ["4,000,000,000 BCE", "3,500,000,000 BCE"]


# --- nice_domain -----------------------------------------------------------------------------


def test_nice_domain_rounds_out_to_ticks():
    lo, hi = fixed_from_gregorian(1651, 3, 1), fixed_from_gregorian(1689, 5, 1)
    assert nice_domain(lo, hi) == (fixed_from_gregorian(1650, 1, 1),
                                   fixed_from_gregorian(1700, 1, 1))


def test_nice_domain_across_the_era_boundary():
    lo, hi = fixed_from_gregorian(-180, 6, 1), fixed_from_gregorian(150, 6, 1)
    low, high = nice_domain(lo, hi)
    assert (low, high) == (fixed_from_gregorian(-199, 1, 1), fixed_from_gregorian(200, 1, 1))
    assert labels(TimeScale(low, high, 0, 800)) == ["200 BCE", "100 BCE", "1 CE", "100", "200"]


def test_nice_domain_of_a_single_day():
    day = fixed_from_gregorian(1650, 4, 12)
    assert nice_domain(day, day) == (day - 1, day + 1)


@given(axis_start, axis_length, st.integers(2, 12), eras, calendars)
def test_nice_domain_holds_the_data_and_ends_on_major_ticks(start, length, max_ticks, era,
                                                            calendar):
    options = {"max_ticks": max_ticks, "era": era, "calendar": calendar}
    low, high = nice_domain(start, start + length, **options)
    assert low < start and start + length < high
    days = [t.day for t in ticks(TimeScale(low, high, 0, 1000), **options)]
    assert days[0] == low and days[-1] == high


# --- years before present ---------------------------------------------------------------------

def test_before_present_ticks_count_back_from_1950():
    # "Present" is AD 1950 in radiocarbon reporting (Stuiver & Polach 1977, from memory).
    scale = TimeScale(fixed_from_calendar(-12000, 1, 1, GREGORIAN),
                      fixed_from_calendar(1000, 1, 1, GREGORIAN), 0, 1000)
    found = ticks(scale, era="bp", calendar=GREGORIAN)
    assert [t.label for t in found] == ["12,000 BP", "10,000 BP", "8000 BP", "6000 BP",
                                        "4000 BP", "2000 BP"]
    # 2000 BP is 50 BCE: astronomical year 1950 - 2000 = -50
    assert found[-1].day == fixed_from_calendar(-50, 1, 1, GREGORIAN)


@pytest.mark.parametrize("years, text", [
    (0, "0 BP"), (5500, "5500 BP"), (12500, "12,500 BP"), (120_000, "120 ka"),
    (1_750_000, "1.75 Ma"), (65_500_000, "65.5 Ma"),
])
def test_before_present_labels_switch_to_ka_and_ma(years, text):
    # ka and Ma as archaeologists and geologists write them: common practice, no source.
    assert before_present_label(years) == text
