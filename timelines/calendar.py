"""Calendrical arithmetic on integer fixed day numbers (R.D.).

R.D. 1 is Gregorian 0001-01-01, the same count as `datetime.date.toordinal()` (Reingold &
Dershowitz, *Calendrical Calculations*). Years are astronomical inside (year 0 = 1 BC,
year -43 = 44 BC); BC/BCE labels exist only at the edges (`year_label`, `year_text`,
`astronomical_year`).
Every function works for any integer year; Python's floor division keeps the formulas valid
before year 1.
"""
from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import lru_cache

GREGORIAN_EPOCH = 1  # R.D. of Gregorian 0001-01-01
JULIAN_EPOCH = -1    # R.D. of Julian 0001-01-01 (= Gregorian 0000-12-30)
JD_OFFSET = 1721425  # Julian Day Number = R.D. + 1721425 (JDN 0 = Julian -4712-01-01 at noon)

GREGORIAN, JULIAN, HISTORICAL = "gregorian", "julian", "historical"
CALENDARS = (HISTORICAL, GREGORIAN, JULIAN)

_MONTH_DAYS = (31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31)


def is_gregorian_leap_year(year: int) -> bool:
    return year % 4 == 0 and year % 100 != 0 or year % 400 == 0


def is_julian_leap_year(year: int) -> bool:
    # year % 4 with floor semantics: 0, -4, -8 (1, 5, 9 BC) are leap years.
    return year % 4 == 0


def days_in_month(year: int, month: int, calendar: str = GREGORIAN) -> int:
    if not 1 <= month <= 12:
        raise ValueError(f"month {month} does not exist")
    if month == 2:
        reckoning = _reckoning_for(year, month, _checked(calendar))
        leap = is_julian_leap_year(year) if reckoning == JULIAN else is_gregorian_leap_year(year)
        return 29 if leap else 28
    return _MONTH_DAYS[month - 1]


def fixed_from_gregorian(year: int, month: int, day: int) -> int:
    """R.D. of a proleptic Gregorian date (Reingold & Dershowitz, eq. 2.17)."""
    prior = year - 1
    return (
        GREGORIAN_EPOCH - 1
        + 365 * prior                        # ordinary days of all prior years
        + prior // 4 - prior // 100 + prior // 400   # leap days of prior years
        + (367 * month - 362) // 12          # days in prior months, if February had 30
        + _february_correction(month, is_gregorian_leap_year(year))
        + day
    )


def _february_correction(month: int, leap: bool) -> int:
    # The (367m - 362)/12 term assumes a 30-day February; take back 1 or 2 days after it.
    if month <= 2:
        return 0
    return -1 if leap else -2


def gregorian_year_from_fixed(fixed: int) -> int:
    """Gregorian year holding a fixed day (Reingold & Dershowitz, eq. 2.18)."""
    d0 = fixed - GREGORIAN_EPOCH
    n400, d1 = divmod(d0, 146097)   # complete 400-year cycles
    n100, d2 = divmod(d1, 36524)    # complete centuries in the cycle
    n4, d3 = divmod(d2, 1461)       # complete 4-year cycles in the century
    n1 = d3 // 365                  # complete years in the 4-year cycle
    year = 400 * n400 + 100 * n100 + 4 * n4 + n1
    # The last day of a leap cycle (n100 or n1 == 4) belongs to the year just counted.
    return year if n100 == 4 or n1 == 4 else year + 1


def decimal_year_from_fixed(fixed: float) -> float:
    """A moment as a decimal astronomical year: the Gregorian year holding it plus the share
    of that year gone by, so each 1 January is a whole number (year 0 = 1 BCE). Fractional
    fixed days are moments within a day."""
    day = math.floor(fixed)
    year = gregorian_year_from_fixed(day)
    first = fixed_from_gregorian(year, 1, 1)
    length = fixed_from_gregorian(year + 1, 1, 1) - first
    return year + (fixed - first) / length


def fixed_from_decimal_year(year: float) -> float:
    """The inverse of `decimal_year_from_fixed`: a fractional fixed day."""
    whole = math.floor(year)
    first = fixed_from_gregorian(whole, 1, 1)
    length = fixed_from_gregorian(whole + 1, 1, 1) - first
    return first + (year - whole) * length


def gregorian_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the proleptic Gregorian calendar (eq. 2.23)."""
    year = gregorian_year_from_fixed(fixed)
    prior_days = fixed - fixed_from_gregorian(year, 1, 1)
    if fixed >= fixed_from_gregorian(year, 3, 1):
        prior_days += 1 if is_gregorian_leap_year(year) else 2  # pretend February has 30 days
    month = (12 * prior_days + 373) // 367
    day = fixed - fixed_from_gregorian(year, month, 1) + 1
    return year, month, day


def fixed_from_julian(year: int, month: int, day: int) -> int:
    """R.D. of a proleptic Julian date, astronomical year numbering (eq. 3.3, with year 0)."""
    prior = year - 1
    return (
        JULIAN_EPOCH - 1
        + 365 * prior + prior // 4           # every fourth year is a leap year
        + (367 * month - 362) // 12
        + _february_correction(month, is_julian_leap_year(year))
        + day
    )


def julian_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the proleptic Julian calendar (eq. 3.4)."""
    approx = (4 * (fixed - JULIAN_EPOCH) + 1464) // 1461
    year = approx
    if fixed < fixed_from_julian(year, 1, 1):
        year -= 1
    prior_days = fixed - fixed_from_julian(year, 1, 1)
    if fixed >= fixed_from_julian(year, 3, 1):
        prior_days += 1 if is_julian_leap_year(year) else 2
    month = (12 * prior_days + 373) // 367
    day = fixed - fixed_from_julian(year, month, 1) + 1
    return year, month, day


# The first Gregorian day in the historical (default) reckoning: Gregorian 1582-10-15,
# which followed Julian 1582-10-04 in the Papal States.
GREGORIAN_REFORM = 577736
# A historical reckoning that switches on another day is named "historical:YYYY-MM-DD", the
# first Gregorian day (`historical_calendar`): Britain's is "historical:1752-09-14".
_REFORM_MARK = ":"


@dataclass(frozen=True, slots=True)
class Reform:
    """Where a historical reckoning switches from the Julian to the Gregorian calendar."""

    first_day: int                          # fixed day of the first Gregorian date
    last_julian: tuple[int, int, int]       # the last date written in the Julian calendar
    first_gregorian: tuple[int, int, int]   # the first date written in the Gregorian calendar

    def reckoning_of(self, year: int, month: int, day: int) -> str:
        """JULIAN or GREGORIAN for a date written in this reckoning; ValueError for a date in
        the days the switch skipped."""
        if (year, month, day) <= self.last_julian:
            return JULIAN
        if (year, month, day) >= self.first_gregorian:
            return GREGORIAN
        raise ValueError(f"{self.skipped_days()} do not exist in the historical reckoning "
                         f"(Julian {_day_month(self.last_julian)} was followed by Gregorian "
                         f"{_day_month(self.first_gregorian)})")

    def skipped_days(self) -> str:
        """The dates the switch skipped: '1582-10-05..14', '1753-02-18..28'."""
        first = iso_from_fixed_julian(self.first_day)
        last = iso_from_fixed(self.first_day - 1)
        return f"{first}..{last[8:]}" if first[:7] == last[:7] else f"{first}..{last}"


_MONTH_NAMES = ("January", "February", "March", "April", "May", "June", "July", "August",
                "September", "October", "November", "December")


def _day_month(date: tuple[int, int, int]) -> str:
    return f"{date[2]} {_MONTH_NAMES[date[1] - 1]}"


def iso_from_fixed_julian(fixed: int) -> str:
    """The Julian date of a fixed day written as ISO 8601 writes dates (YYYY-MM-DD)."""
    year, month, day = julian_from_fixed(fixed)
    return f"{year:04d}-{month:02d}-{day:02d}"


def historical_calendar(first_gregorian_day: int) -> str:
    """The name of the historical reckoning that is Julian before `first_gregorian_day` (a
    fixed day) and Gregorian from it on: "historical" for the 1582 reform, otherwise
    "historical:YYYY-MM-DD" (Britain's is "historical:1752-09-14")."""
    if first_gregorian_day == GREGORIAN_REFORM:
        return HISTORICAL
    return f"{HISTORICAL}{_REFORM_MARK}{iso_from_fixed(first_gregorian_day)}"


@lru_cache(maxsize=64)
def reform_of(calendar: str) -> Reform | None:
    """The reform of a historical calendar name; None for the Gregorian and Julian calendars.
    Raises ValueError for a name that is no calendar."""
    if calendar in (GREGORIAN, JULIAN):
        return None
    if calendar == HISTORICAL:
        return _reform(GREGORIAN_REFORM)
    name, mark, day = calendar.partition(_REFORM_MARK) if isinstance(calendar, str) else ("",) * 3
    if name != HISTORICAL or not mark:
        raise ValueError(f"unknown calendar {calendar!r}; choose one of {', '.join(CALENDARS)}")
    return _reform(first_gregorian_day(day))


def first_gregorian_day(text: str) -> int:
    """The fixed day of a reform's first Gregorian date written YYYY-MM-DD; ValueError for a
    date that is no day or falls before the 1582 reform (no calendar switched earlier)."""
    parts = text.split("-")
    if len(parts) != 3 or not all(part.isdigit() for part in parts) or len(parts[0]) != 4:
        raise ValueError(f"a reform day is written YYYY-MM-DD, such as 1752-09-14, not {text!r}")
    year, month, day = map(int, parts)
    check_calendar_date(year, month, day, GREGORIAN)
    fixed = fixed_from_gregorian(year, month, day)
    if fixed < GREGORIAN_REFORM:
        raise ValueError(f"the reform day {text} comes before the first Gregorian day, "
                         "1582-10-15")
    return fixed


def _reform(first_day: int) -> Reform:
    return Reform(first_day, julian_from_fixed(first_day - 1), gregorian_from_fixed(first_day))


def reform_day(calendar: str) -> int | None:
    """The first Gregorian fixed day of a historical calendar; None for gregorian and julian."""
    reform = reform_of(calendar)
    return None if reform is None else reform.first_day


def fixed_from_calendar(year: int, month: int, day: int, calendar: str = HISTORICAL) -> int:
    """R.D. of a date written in `calendar`, checking that the date exists there.

    `calendar` is "gregorian", "julian", "historical" (Julian before 1582-10-15, Gregorian
    from then on) or a historical reckoning with another reform day (`historical_calendar`).
    Raises ValueError with a plain reason (month 13, 29 February in a common year, or a day in
    the days the reform skipped)."""
    if _reckoning_of_date(year, month, day, calendar) == GREGORIAN:
        return fixed_from_gregorian(year, month, day)
    return fixed_from_julian(year, month, day)


def _checked(calendar: str) -> str:
    reform_of(calendar)   # raises for a name that is no calendar
    return calendar


def check_calendar_date(year: int, month: int, day: int, calendar: str = HISTORICAL) -> None:
    _reckoning_of_date(year, month, day, calendar)


def _reckoning_of_date(year: int, month: int, day: int, calendar: str) -> str:
    """GREGORIAN or JULIAN: the calendar a date written in `calendar` is reckoned in, once
    checked that it exists there."""
    reform = reform_of(calendar)
    if not 1 <= month <= 12:
        raise ValueError(f"month {month} does not exist")
    reckoning = calendar if reform is None else reform.reckoning_of(year, month, day)
    length = days_in_month(year, month, reckoning)
    if not 1 <= day <= length:
        if month == 2 and day == 29:
            raise ValueError(f"{year_label(year)} is not a leap year in the {reckoning} calendar")
        raise ValueError(f"day {day} does not exist in month {month} (it has {length} days)")
    return reckoning


def month_range(year: int, month: int, calendar: str = HISTORICAL) -> tuple[int, int]:
    """First and last fixed day of a month written in `calendar`."""
    if not 1 <= month <= 12:
        raise ValueError(f"month {month} does not exist")
    return _unit_range((year, month, 1), (year, month, days_in_month(year, month, JULIAN)),
                       (year, month, days_in_month(year, month, GREGORIAN)), calendar)


def year_range(year: int, calendar: str = HISTORICAL) -> tuple[int, int]:
    """First and last fixed day of a year (1 January .. 31 December) written in `calendar`."""
    return _unit_range((year, 1, 1), (year, 12, 31), (year, 12, 31), calendar)


def _unit_range(first: tuple[int, int, int], julian_last: tuple[int, int, int],
                gregorian_last: tuple[int, int, int], calendar: str) -> tuple[int, int]:
    """First and last fixed day of a unit from its first date and its last (as each calendar
    writes it). In a historical reckoning the unit begins in Julian unless its Julian start
    falls on or after the reform, and ends in Gregorian unless its Gregorian end falls before
    it: so a unit that holds the reform keeps only the days that existed."""
    reform = reform_of(calendar)
    if reform is None:
        last = gregorian_last if calendar == GREGORIAN else julian_last
        return fixed_from_calendar(*first, calendar), fixed_from_calendar(*last, calendar)
    julian_first = fixed_from_julian(*first)
    earliest = (julian_first if julian_first < reform.first_day
                else max(fixed_from_gregorian(*first), reform.first_day))
    gregorian_end = fixed_from_gregorian(*gregorian_last)
    latest = (gregorian_end if gregorian_end >= reform.first_day
              else min(fixed_from_julian(*julian_last), reform.first_day - 1))
    if earliest > latest:
        raise ValueError(f"the unit lies wholly in the days the reform skipped "
                         f"({reform.skipped_days()})")
    return earliest, latest


def gregorian_year_range(year: int) -> tuple[int, int]:
    return fixed_from_gregorian(year, 1, 1), fixed_from_gregorian(year, 12, 31)


def _reckoning_for(year: int, month: int, calendar: str) -> str:
    reform = reform_of(calendar)
    if reform is None:
        return calendar
    return GREGORIAN if (year, month) >= reform.first_gregorian[:2] else JULIAN


def jdn_from_fixed(fixed: int) -> int:
    return fixed + JD_OFFSET


def fixed_from_jdn(jdn: int) -> int:
    return jdn - JD_OFFSET


def astronomical_year(year: int, era: str) -> int:
    """Astronomical year from a year written with an era (`BC`/`BCE` or `AD`/`CE`).

    BC counting has no year zero: 1 BC is year 0, 44 BC is year -43."""
    if year <= 0:
        raise ValueError("BC/AD counting has no year zero" if year == 0
                         else f"a year with an era is written without a sign, not {year}")
    written = era.upper().replace(".", "").replace(" ", "")
    if written in ("BC", "BCE"):
        return 1 - year
    if written in ("AD", "CE"):
        return year
    raise ValueError(f"unknown era {era!r}; expected BC, BCE, AD or CE")


YEAR_STYLES = ("bce", "bc", "astronomical")
ERAS = ("bce", "bc", "astronomical", "bp")
# Radiocarbon convention: "present" is AD 1950 (Stuiver & Polach 1977, "Discussion: reporting
# of 14C data", Radiocarbon 19(3), from memory).
PRESENT_YEAR = 1950


def year_label(year: int, style: str = "bce") -> str:
    """Label of an astronomical year: `bce` (44 BCE), `bc` (44 BC) or `astronomical` (-43)."""
    if style not in YEAR_STYLES:
        raise ValueError(f"unknown year style {style!r}; choose one of {', '.join(YEAR_STYLES)}")
    if style == "astronomical" or year > 0:
        return str(year)
    suffix = "BC" if style == "bc" else "BCE"
    return f"{1 - year} {suffix}"


def iso_from_fixed(fixed: int) -> str:
    """ISO 8601 calendar date, proleptic Gregorian, astronomical years; expanded form
    (`-0043-03-15`, `+12000-01-01`) outside 0000..9999."""
    year, month, day = gregorian_from_fixed(fixed)
    if 0 <= year <= 9999:
        return f"{year:04d}-{month:02d}-{day:02d}"
    sign = "-" if year < 0 else "+"
    return f"{sign}{abs(year):04d}-{month:02d}-{day:02d}"


def weekday_from_fixed(fixed: int) -> int:
    """ISO 8601 day of the week: 1 = Monday .. 7 = Sunday (R.D. 1, 0001-01-01, was a Monday)."""
    return (fixed - 1) % 7 + 1


def _iso_week_one_monday(year: int) -> int:
    # ISO 8601 week 1 is the week (Monday to Sunday) that holds 4 January.
    january_4 = fixed_from_gregorian(year, 1, 4)
    return january_4 - weekday_from_fixed(january_4) + 1


def iso_weeks_in_year(year: int) -> int:
    """52 or 53: the weeks from this year's week 1 to the next year's."""
    return (_iso_week_one_monday(year + 1) - _iso_week_one_monday(year)) // 7


def fixed_from_iso_week(year: int, week: int, weekday: int = 1) -> int:
    """R.D. of an ISO 8601 week date (`1985-W15-5`); raises ValueError for a week or day
    that does not exist."""
    if not 1 <= weekday <= 7:
        raise ValueError(f"day {weekday} of the week does not exist (Monday 1 .. Sunday 7)")
    weeks = iso_weeks_in_year(year)
    if not 1 <= week <= weeks:
        raise ValueError(f"week {week} does not exist in {year} (it has {weeks} weeks)")
    return _iso_week_one_monday(year) + 7 * (week - 1) + weekday - 1


def fixed_from_ordinal_date(year: int, day_of_year: int) -> int:
    """R.D. of an ISO 8601 ordinal date (`1985-102`), proleptic Gregorian."""
    length = 366 if is_gregorian_leap_year(year) else 365
    if not 1 <= day_of_year <= length:
        raise ValueError(f"day {day_of_year} does not exist in {year} (it has {length} days)")
    return fixed_from_gregorian(year, 1, 1) + day_of_year - 1


def before_present_label(years: int) -> str:
    """'5500 BP', '12,500 BP', '120 ka', '65 Ma': thousands (ka) from 100,000 years and
    millions (Ma) from 1,000,000, as archaeologists and geologists write them (common practice,
    no source)."""
    if abs(years) >= 1_000_000:
        return f"{years / 1_000_000:g} Ma"
    if abs(years) >= 100_000:
        return f"{years / 1000:g} ka"
    return f"{years:,} BP" if abs(years) >= 10_000 else f"{years} BP"


def year_text(year: int, era: str = "bce", *, mark_common_era: bool = False) -> str:
    """A year as an axis or a summary writes it, in any of ERAS: `year_label` with thousands
    separators from 10,000 on (four-digit years are written without: common practice, no
    source), or years before present. `mark_common_era` writes "5 CE" / "AD 5" where a bare
    year would be misread (beside a day and month, or at the era boundary)."""
    if era == "bp":
        return before_present_label(PRESENT_YEAR - year)
    text = re.sub(r"\d{5,}", lambda m: f"{int(m.group()):,}", year_label(year, era))
    if mark_common_era and year > 0 and era != "astronomical":
        return f"{text} CE" if era == "bce" else f"AD {text}"
    return text
