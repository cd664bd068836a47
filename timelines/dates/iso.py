"""ISO 8601-1 dates, proleptic Gregorian unless the text names another calendar.

Forms (one regex each; `edtf.py` reads the ISO 8601-2 parts they allow):
- calendar dates, extended `1985-04-12`, `1985-04`, and basic `19850412` (eight digits alone are
  read by text.py and handed here); signed and expanded years `-0043`, `+12000`,
  `+001985-04-12`. Years are astronomical (`0000` = 1 BC). `YYYYMM` does not exist in ISO 8601
  (it would read as YYMMDD) and is not read.
- ordinal dates `1985-102` and `1985102`; week dates `1985-W15-5`, `1985W155`, and weeks
  `1985-W15`, `1985W15` (Monday to Sunday, at day precision: there is no week precision).
- a date with a time of day (`1985-04-12T23:20:30Z`, `19850412T232030`, `1985-04-12 00:00:00`):
  read at day precision, the day as written (the time zone does not move it); a time or
  offset that cannot exist is refused (clock.py).
- inside the calendar form, ISO 8601-2: unspecified digits `X` anywhere (`156X-12-25`,
  `1985-04-3X`), sub-year groupings 21-41 in the month's place (`2001-21`, spring), and
  qualifiers on single components (`2004-06~-11`, `?2004-06-~11`, `2004?-06-11`).

A year-month `YYYY-MM` is claimed only for MM in 00-12 (00 is then refused as no month),
21-41 and X patterns, so that `1650-60` stays a range.
"""
from __future__ import annotations

import re

from ..calendar import (
    GREGORIAN, days_in_month, fixed_from_iso_week, fixed_from_ordinal_date,
)
from ..model import Endpoint, Precision
from . import edtf
from .clock import check_time
from .grammar import FLAGS, Form
from .reasons import Unreadable
from .settings import DateSettings
from .signed import note_iso_year
from .windows import check_year, day, month, years

_MARK = r"[?~%]"   # ISO 8601-2 qualifiers: uncertain, approximate, both
_YEAR = r"[+-][0-9]{5,12} | [+-]?[0-9X]{4}"   # expanded years need a sign; X: unspecified

ISO_CALENDAR = re.compile(rf"""
    (?P<year_left>{_MARK})? (?P<year>{_YEAR}) (?P<year_right>{_MARK})?
    (?:
        - (?P<month_left>{_MARK})? (?P<month>[0-9X]{{2}}) (?P<month_right>{_MARK})?
        - (?P<day_left>{_MARK})? (?P<day>[0-9X]{{2}}) (?P<day_right>{_MARK})?
        (?P<time>[T\x20][0-9:.,+Z-]+)?          # time of day, checked by clock.py
      | - (?P<only_left>{_MARK})?
        (?P<month_only>                         # year-month alone: only what can be a month
            0[0-9X] | 1[0-2X] | X[0-9X]         # code, so that 1650-60 stays a range
          | 2[1-9] | 3[0-9] | 4[01]             # ISO 8601-2 seasons, quarters, semesters
        )
        (?P<only_right>{_MARK})?
    )?
""", FLAGS)

ISO_PADDED_YEAR = re.compile(r"""
    (?P<year>0[0-9]{3})            # 0000, 0044: only ISO 8601 pads a year to four digits
""", FLAGS)

ISO_BASIC = re.compile(r"""
    (?P<digits>[0-9]{8}) (?P<time>T[0-9:.,+Z-]+)?   # 19850412, 19850412T101530Z
""", FLAGS)

ISO_ORDINAL_BASIC = re.compile(r"""
    (?P<year>[0-9]{4}) (?P<day>[0-9]{3})            # 1985102
""", FLAGS)

ISO_ORDINAL = re.compile(r"""
    (?P<year>[+-][0-9]{5,12} | [+-]?[0-9]{4}) - (?P<day>[0-9]{3})   # 1985-102
""", FLAGS)

ISO_WEEK = re.compile(r"""
    (?P<year>[+-]?[0-9]{4}) - W(?P<week>[0-9]{2}) (?: -(?P<weekday>[0-9]) )?   # 1985-W15-5
""", FLAGS)

ISO_WEEK_BASIC = re.compile(r"""
    (?P<year>[0-9]{4}) W(?P<week>[0-9]{2}) (?P<weekday>[0-9])?                  # 1985W155
""", FLAGS)

def read_iso_calendar(match: re.Match[str], era: str | None, marker: str | None,
                      settings: DateSettings) -> Endpoint:
    calendar = marker or GREGORIAN
    year_text = match["year"].upper()
    month_text = (match["month"] or match["month_only"] or "").upper()
    day_text = (match["day"] or "").upper()
    if match["time"]:
        check_time(match["time"])
    if match["month_only"] and "X" not in month_text and int(month_text) > 20:
        base = _sub_year(year_text, int(month_text), calendar, settings)
    elif "X" in year_text + month_text + day_text:
        base = edtf.unspecified(year_text, month_text, day_text, calendar)
    else:
        base = _calendar_date(year_text, month_text, day_text, calendar)
    return edtf.with_component_marks(base, match, settings, calendar)


def _sub_year(year_text: str, code: int, calendar: str, settings: DateSettings) -> Endpoint:
    if "X" in year_text:
        return edtf.unspecified_sub_year(year_text, code, calendar, settings)
    return edtf.sub_year(int(year_text), code, calendar, settings)


def _calendar_date(year_text: str, month_text: str, day_text: str, calendar: str) -> Endpoint:
    """A complete date, a year-month or a year; the reasons name the year as it was written."""
    year = int(year_text)
    note_iso_year(year_text, year)
    if not month_text:
        return years(year, year, calendar, Precision.YEAR)
    month_number = month_of(month_text)
    if not day_text:
        return month(year, month_number, calendar)
    day_number = int(day_text)
    length = days_in_month(check_year(year), month_number, calendar)
    if not 1 <= day_number <= length:
        if month_number == 2 and day_number == 29:
            raise Unreadable(f"{year_text} is not a leap year" + _in(calendar),
                             fragment=f"{month_text}-{day_text}")
        raise Unreadable(f"day {day_number} does not exist in {year_text}-{month_number:02d} "
                         f"(it has {length} days)", fragment=f"{month_text}-{day_text}")
    return day(year, month_number, day_number, calendar)


def _in(calendar: str) -> str:
    return "" if calendar == GREGORIAN else f" in the {calendar} calendar"


def month_of(month_text: str) -> int:
    number = int(month_text)
    if not 1 <= number <= 12:
        raise Unreadable(f"month {number} does not exist", fragment=month_text)
    return number


def basic_date(digits: str, marker: str | None) -> Endpoint:
    """`19850412`: the basic format of a complete calendar date."""
    return _calendar_date(digits[:4], digits[4:6], digits[6:], marker or GREGORIAN)


def read_basic(match: re.Match[str], era: str | None, marker: str | None,
               settings: DateSettings) -> Endpoint:
    if match["time"]:
        check_time(match["time"])
    return basic_date(match["digits"], marker)


def read_padded_year(match: re.Match[str], era: str | None, marker: str | None,
                     settings: DateSettings) -> Endpoint:
    year = int(match["year"])
    note_iso_year(match["year"], year)
    return years(year, year, marker or GREGORIAN, Precision.YEAR)


def ordinal_date(year_text: str, day_text: str, marker: str | None) -> Endpoint:
    """`1985-102`: the 102nd day of 1985."""
    if (marker or GREGORIAN) != GREGORIAN:
        raise Unreadable("ordinal dates are ISO 8601 forms: proleptic Gregorian only")
    year = check_year(int(year_text))
    try:
        return Endpoint.day(fixed_from_ordinal_date(year, int(day_text)))
    except ValueError as error:
        raise Unreadable(str(error), fragment=day_text) from None


def read_ordinal(match: re.Match[str], era: str | None, marker: str | None,
                 settings: DateSettings) -> Endpoint:
    return ordinal_date(match["year"], match["day"], marker)


def read_week(match: re.Match[str], era: str | None, marker: str | None,
              settings: DateSettings) -> Endpoint:
    if (marker or GREGORIAN) != GREGORIAN:
        raise Unreadable("week dates are ISO 8601 forms: proleptic Gregorian only")
    year, week = check_year(int(match["year"])), int(match["week"])
    try:
        if match["weekday"]:
            return Endpoint.day(fixed_from_iso_week(year, week, int(match["weekday"])))
        monday = fixed_from_iso_week(year, week, 1)
    except ValueError as error:
        raise Unreadable(str(error), fragment=match["weekday"] or match["week"]) from None
    return Endpoint(monday, monday + 6, Precision.DAY)


# Digits alone that only ISO 8601 writes: before the free-text year in the table (core.py).
ISO_DIGIT_FORMS = (
    Form("ISO 8601 year", ISO_PADDED_YEAR, read_padded_year, takes_era=False, gregorian=True),
    Form("ISO 8601 basic date", ISO_BASIC, read_basic, takes_era=False, gregorian=True),
    Form("ISO 8601 ordinal date", ISO_ORDINAL_BASIC, read_ordinal, takes_era=False,
         gregorian=True),
)

ISO_FORMS = (
    Form("ISO 8601 date", ISO_CALENDAR, read_iso_calendar, takes_era=False, gregorian=True,
         starts="digit letter other"),
    Form("ISO 8601 ordinal date", ISO_ORDINAL, read_ordinal, takes_era=False, gregorian=True,
         starts="digit other"),
    Form("ISO 8601 week date", ISO_WEEK, read_week, takes_era=False, gregorian=True,
         starts="digit other"),
    Form("ISO 8601 week date", ISO_WEEK_BASIC, read_week, takes_era=False, gregorian=True),
)
