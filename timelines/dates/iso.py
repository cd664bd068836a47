"""ISO 8601-1 calendar dates and ISO 8601-2 (EDTF) extensions, always proleptic Gregorian.

Forms read here (one function each, dispatched by `_unqualified`):
- `1985-04-12`, `1985-04`, `1985`; signed and expanded years `-0043`, `+12000`, `+001985-04-12`,
  the EDTF letter-prefixed year `Y170000002`. Years are astronomical (`0000` = 1 BC).
- a date with a time of day (`1985-04-12T23:20:30Z`, `1985-04-12 00:00:00`): read at day
  precision, the day as written (the time zone does not move it).
- unspecified digits `X`: `198X` decade, `19XX` century, `1XXX` millennium, `1985-XX` the year,
  `1985-04-XX` the month; qualifier `unspecified`.
- a qualifier on the whole date: `?` uncertain, `~` approximate, `%` both. Approximate dates are
  widened by the circa settings, like `c.` in free text (so they are `convention_dependent`).
- intervals `A/B`, `../B` and `A/..` (open), `/B` and `A/` (unknown).

A year-month `YYYY-MM` is claimed only for MM in 00-12 (00 is then refused as no month) and
21-41 (the ISO 8601-2 season and quarter codes, refused as not supported yet); `1650-60` is left
to the range reader as 1650 to 1660.

A plain four-digit year is also an ISO date, but `parse_date` reads a bare year as free text first
(in the calendar setting, so that `1650`, `c. 1650` and `1650s` agree; with the default
historical setting both readings agree from 1583 on). Two exceptions are ISO and Gregorian: a
year padded with zeros (`0000`, `0044`), and any year inside an interval (`1500/1510`).
"""
from __future__ import annotations

import re

from ..calendar import GREGORIAN, days_in_month
from ..errors import DateError
from ..model import Endpoint, Precision, Qualifier, Span
from .settings import DateSettings
from .windows import approximate, day, month, ordered_span, qualified, years

_FLAGS = re.VERBOSE | re.IGNORECASE | re.ASCII

ISO_DATE = re.compile(r"""
    (?P<year>
        [+-][0-9]{5,12}            # expanded year, sign required: +12000, -12000, +001985
      | [+-]?[0-9]{4}              # four-digit year, optionally signed: 1985, -0043
      | [+-]?[0-9]{3}X             # unspecified last digit: 198X, a decade
      | [+-]?[0-9]{2}XX            # unspecified last two digits: 19XX, a century
      | [+-]?[0-9]XXX              # unspecified last three digits: 1XXX, a millennium
      | XXXX                       # no year digit at all: refused below
      | Y[+-]?[0-9]{5,12}          # EDTF letter-prefixed year: Y170000002, Y-170000002
    )
    (?:
        -(?P<month>[0-9]{2}|XX)    # year-month-day: any two digits, checked below
        -(?P<day>[0-9]{2}|XX)
        (?P<time>[T\x20][0-9:.,+Z-]+)?   # time of day, checked by TIME_OF_DAY
      | -(?P<month_only>           # year-month alone: only what can be a month code, so
            0[0-9] | 1[0-2]        # that 1650-60 stays a range; 00 is refused below
          | 2[1-9] | 3[0-9] | 4[01] # ISO 8601-2 seasons, quarters, semesters: refused below
          | XX                     # unspecified month: 1985-XX
        )
    )?
    (?P<qualifier>[?~%])?          # ISO 8601-2 qualifier on the whole date
""", _FLAGS)

TIME_OF_DAY = re.compile(r"""
    [T\x20]
    (?P<hour>[0-9]{2})
    (?: :?(?P<minute>[0-9]{2})     # extended 23:20 or basic 2320
        (?: :?(?P<second>[0-9]{2}) (?:[.,][0-9]+)? )?   # seconds, with a decimal fraction
    )?
    (?: Z | [+-][0-9]{2}(?::?[0-9]{2})? )?   # UTC or an offset: does not move the day
""", _FLAGS)

INTERVAL_HINT = "an ISO 8601 interval joins two dates: 1985/1987, 1985-04/1985-06, ../1760"


def iso_date(text: str, settings: DateSettings) -> Endpoint | None:
    """An ISO 8601 date, or None when `text` is not written as one."""
    match = ISO_DATE.fullmatch(text)
    if match is None:
        return None
    endpoint = _unqualified(match, text)
    return _with_qualifier(endpoint, match["qualifier"], settings)


def _unqualified(match: re.Match[str], text: str) -> Endpoint:
    year_text = match["year"].upper()
    month_text = (match["month"] or match["month_only"] or "").upper()
    day_text = (match["day"] or "").upper()
    if "X" in year_text:
        return _unspecified_year(year_text, month_text + day_text, text)
    year = int(year_text.lstrip("Y"))
    if match["time"]:
        _check_time(match["time"], text)
    if day_text and day_text != "XX":
        return _calendar_date(year_text, year, _month_number(month_text, day_text), int(day_text))
    if month_text and month_text != "XX":
        endpoint = month(year, _month_number(month_text, day_text), GREGORIAN)
        return qualified(endpoint, Qualifier.UNSPECIFIED) if day_text else endpoint
    endpoint = years(year, year, GREGORIAN, Precision.YEAR)
    return qualified(endpoint, Qualifier.UNSPECIFIED) if month_text else endpoint


def _unspecified_year(year_text: str, later_parts: str, text: str) -> Endpoint:
    """`198X`: every year the digits allow; `-019X` is -0199..-0190."""
    if year_text == "XXXX":
        raise DateError(text, "a year with no known digit says nothing",
                        hint="leave the cell empty for an unknown date")
    if later_parts.strip("X"):
        raise DateError(text, "a known month or day after unspecified year digits "
                        "is not supported yet")
    low, high = int(year_text.replace("X", "0")), int(year_text.replace("X", "9"))
    first, last = (high, low) if year_text.startswith("-") else (low, high)
    precision = _UNSPECIFIED_YEAR_PRECISION[year_text.count("X")]
    return years(first, last, GREGORIAN, precision, {Qualifier.UNSPECIFIED})


_UNSPECIFIED_YEAR_PRECISION = {1: Precision.DECADE, 2: Precision.CENTURY, 3: Precision.MILLENNIUM}


def _month_number(month_text: str, day_text: str) -> int:
    if month_text == "XX":
        raise ValueError("an unspecified month with a known day is not supported yet")
    number = int(month_text)
    if 21 <= number <= 41 and not day_text:
        raise ValueError(f"ISO 8601-2 season and quarter codes such as {month_text} "
                         "are not supported yet")
    if not 1 <= number <= 12:
        raise ValueError(f"month {number} does not exist")
    return number


def _calendar_date(year_text: str, year: int, month_number: int, day_number: int) -> Endpoint:
    """A complete date; the reasons name the year as it was written."""
    length = days_in_month(year, month_number, GREGORIAN)
    if not 1 <= day_number <= length:
        if month_number == 2 and day_number == 29:
            raise ValueError(f"{year_text} is not a leap year")
        raise ValueError(f"day {day_number} does not exist in {year_text}-{month_number:02d} "
                         f"(it has {length} days)")
    return day(year, month_number, day_number, GREGORIAN)


def _check_time(time_text: str, text: str) -> None:
    match = TIME_OF_DAY.fullmatch(time_text)
    limits = (("hour", 24), ("minute", 59), ("second", 60))  # 24:00 ends a day; 60 is a leap second
    if match is None or any(int(match[name] or 0) > limit for name, limit in limits):
        raise DateError(text, f"{time_text.strip()!r} is not a time of day",
                        hint="a date with a time looks like 1985-04-12T23:20:30")


def _with_qualifier(endpoint: Endpoint, mark: str | None, settings: DateSettings) -> Endpoint:
    if mark == "?":
        return qualified(endpoint, Qualifier.UNCERTAIN)
    if mark == "~":
        return approximate(endpoint, settings, GREGORIAN)
    if mark == "%":
        return qualified(approximate(endpoint, settings, GREGORIAN), Qualifier.UNCERTAIN)
    return endpoint


def iso_interval(text: str, settings: DateSettings) -> Span | None:
    """`A/B` with ISO dates, `..` (open) or nothing (unknown) on either side; None without '/'."""
    if "/" not in text:
        return None
    parts = text.split("/")
    if len(parts) != 2:
        raise DateError(text, "an interval has exactly one '/'", hint=INTERVAL_HINT)
    start = _interval_side(parts[0], text, settings, _START_SIDE)
    end = _interval_side(parts[1], text, settings, _END_SIDE)
    if start.earliest is None and end.latest is None:
        raise DateError(text, "an interval needs a date on at least one side", hint=INTERVAL_HINT)
    return ordered_span(start, end, text)


# (qualifier for `..`, qualifier for nothing) on each side of an interval
_START_SIDE = (Qualifier.OPEN_START, Qualifier.UNKNOWN_START)
_END_SIDE = (Qualifier.OPEN_END, Qualifier.UNKNOWN_END)


def _interval_side(part: str, text: str, settings: DateSettings,
                   side: tuple[Qualifier, Qualifier]) -> Endpoint:
    date_text = part.strip()
    if date_text == "..":
        return Endpoint.open(side[0])
    if not date_text:
        return Endpoint.open(side[1])
    if date_text[0] in "Pp":
        raise DateError(text, "durations (P...) in intervals are not supported yet",
                        hint=INTERVAL_HINT)
    endpoint = iso_date(date_text, settings)
    if endpoint is None:
        raise DateError(text, f"{date_text!r} is not an ISO 8601 date", hint=INTERVAL_HINT)
    return endpoint
