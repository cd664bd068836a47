"""Endpoint windows built from calendar units, and the conventions that move their bounds.

The helpers here know nothing of text. They raise `Unreadable` (a ValueError) with a plain
reason ("month 13 does not exist"); the parser entry points turn it into a `DateError` naming
the text, in one place (`reasons.reading`).
"""
from __future__ import annotations

from dataclasses import replace
from functools import lru_cache
from typing import Iterable

from ..calendar import (
    GREGORIAN, GREGORIAN_REFORM, HISTORICAL, JULIAN, fixed_from_calendar, fixed_from_gregorian,
    fixed_from_julian, gregorian_from_fixed, gregorian_year_from_fixed, is_gregorian_leap_year,
    is_julian_leap_year, julian_from_fixed, month_range, reform_day, reform_of, year_range,
)
from ..errors import DateError
from ..model import Endpoint, Precision, Qualifier, Span
from . import trace
from .options import option_name
from .reasons import Unreadable
from .settings import DateSettings

# Years of more digits than this are refused before `int()` sees them: deep time reaches
# 10^10 years, and 10^12 years of days still fit an int64 fixed day number.
MAX_YEAR_DIGITS = 12
PRESENT_YEAR = 1950  # "before present" (BP, ka, Ma) counts back from 1950 (radiocarbon usage)

# Days in each month of a common year; February gains the leap day.
_MONTH_DAYS = (31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31)
_PAPAL_REFORM_MONTH = (1582, 10)   # the month of calendar.GREGORIAN_REFORM
_PRECISION_ORDER = {precision: rank for rank, precision in enumerate(Precision)}
_APPROXIMATE_MARKS = frozenset({Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT})


def normalise(text: str) -> str:
    """One space between words, none at the ends; typographic apostrophes and hyphens made plain."""
    if not text.isascii():
        text = text.translate(_PLAIN_PUNCTUATION)
    return " ".join(text.split())


# U+2212, the minus sign of typeset tables (-300), is a hyphen-minus to the readers.
_PLAIN_PUNCTUATION = str.maketrans({"\u2019": "'", "\u2018": "'", "\u2010": "-", "\u2011": "-",
                                    "\u2212": "-", "\u00a0": " ", "\u202f": " "})


def check_year(year: int) -> int:
    if abs(year) >= 10 ** MAX_YEAR_DIGITS:
        raise Unreadable(f"year {_year_shown(year)} is out of range (at most {MAX_YEAR_DIGITS} "
                         "digits)")
    return year


def _year_shown(year: int) -> str:
    """A year for a message: written out while that is readable, else by its size (a float
    cell of 1e300 holds a year of 301 digits)."""
    return str(year) if abs(year) < 10 ** 24 else f"of {digits_about(year)} digits"


def digits_about(number: int) -> str:
    """How many digits a number has, roughly, without writing it out (str() refuses ints of
    over 4,300 digits)."""
    return f"about {int(number.bit_length() * 0.30103) + 1:,}"   # log10(2) digits a bit


@lru_cache(maxsize=1 << 16)
def year_bounds(year: int, calendar: str) -> tuple[int, int]:
    """First and last fixed day of a year; columns repeat years, so this is remembered."""
    check_year(year)
    reform = reform_of(calendar)
    if reform is not None:
        if reform.last_julian[0] <= year <= reform.first_gregorian[0]:
            return year_range(year, calendar)   # Julian January, Gregorian December
        calendar = GREGORIAN if year > reform.first_gregorian[0] else JULIAN
    if calendar == GREGORIAN:
        first = fixed_from_gregorian(year, 1, 1)
        return first, first + 364 + is_gregorian_leap_year(year)
    if calendar == JULIAN:
        first = fixed_from_julian(year, 1, 1)
        return first, first + 364 + is_julian_leap_year(year)
    return year_range(year, calendar)           # an unknown calendar: its error


@lru_cache(maxsize=1 << 16)
def month_bounds(year: int, month_number: int, calendar: str) -> tuple[int, int]:
    """First and last fixed day of a month; remembered like year_bounds."""
    check_year(year)
    if 1 <= month_number <= 12:
        calendar = _reckoning(year, month_number, calendar)
    if not 1 <= month_number <= 12 or calendar not in (GREGORIAN, JULIAN):
        return month_range(year, month_number, calendar)   # its errors, or the reform month
    if calendar == GREGORIAN:
        first, leap = fixed_from_gregorian(year, month_number, 1), is_gregorian_leap_year(year)
    else:
        first, leap = fixed_from_julian(year, month_number, 1), is_julian_leap_year(year)
    return first, first + _MONTH_DAYS[month_number - 1] - 1 + (month_number == 2 and leap)


def day_fixed(year: int, month_number: int, day_number: int, calendar: str) -> int:
    """The fixed day of a date that must exist in `calendar`; raises ValueError."""
    if 1 <= month_number <= 12 and 1 <= day_number <= 28:
        # Every month has a 28th: only the reform months of a historical reckoning lack days,
        # and _reckoning leaves them to fixed_from_calendar.
        reckoning = _reckoning(check_year(year), month_number, calendar)
        if reckoning == GREGORIAN:
            return fixed_from_gregorian(year, month_number, day_number)
        if reckoning == JULIAN:
            return fixed_from_julian(year, month_number, day_number)
    return fixed_from_calendar(check_year(year), month_number, day_number, calendar)


def _reckoning(year: int, month_number: int, calendar: str) -> str:
    """The calendar a month is written in: a historical reckoning's side of the reform, or
    the historical calendar itself for the months the reform falls in."""
    if calendar == GREGORIAN or calendar == JULIAN:
        return calendar
    if calendar == HISTORICAL:
        first = last = _PAPAL_REFORM_MONTH   # the default, without a look-up
    else:
        reform = reform_of(calendar)
        first, last = reform.last_julian[:2], reform.first_gregorian[:2]
    if (year, month_number) < first:
        return JULIAN
    return GREGORIAN if (year, month_number) > last else calendar


def years(first: int, last: int, calendar: str, precision: Precision,
          qualifiers: Iterable[Qualifier] = ()) -> Endpoint:
    """1 January of `first` .. 31 December of `last`, astronomical years written in `calendar`."""
    return Endpoint(year_bounds(first, calendar)[0], year_bounds(last, calendar)[1], precision,
                    frozenset(qualifiers))


def month(year: int, month_number: int, calendar: str,
          qualifiers: Iterable[Qualifier] = ()) -> Endpoint:
    earliest, latest = month_bounds(year, month_number, calendar)
    return Endpoint(earliest, latest, Precision.MONTH, frozenset(qualifiers))


def day(year: int, month_number: int, day_number: int, calendar: str) -> Endpoint:
    return Endpoint.day(day_fixed(year, month_number, day_number, calendar))


def qualified(endpoint: Endpoint, *qualifiers: Qualifier) -> Endpoint:
    return replace(endpoint, qualifiers=endpoint.qualifiers | frozenset(qualifiers))


def approximate(endpoint: Endpoint, settings: DateSettings, calendar: str,
                precision: Precision | None = None) -> Endpoint:
    """`c. X` / `X~`: X widened on both sides by the settings' circa amount for a precision
    (X's own unless given: `2004-06~-11` widens by the month's amount).

    A single day, or the likely day X already had, stays the likely day of the wider window."""
    if endpoint.has(Qualifier.APPROXIMATE):
        raise Unreadable("approximate twice (both c. and ~); write one of them")
    if endpoint.earliest is None or endpoint.latest is None:
        raise Unreadable("only a bounded date can be approximate",
                         hint="write c. before the date inside before/after: before c. 1650")
    field, amount = circa_amount(precision or endpoint.precision, settings)
    earliest, latest = _widened(endpoint, field, amount, calendar)
    likely = endpoint.earliest if endpoint.is_exact else endpoint.likely
    widened = Endpoint(earliest, latest, endpoint.precision,
                       endpoint.qualifiers | _APPROXIMATE_MARKS, likely)
    if trace.on:
        unit = {"days": "days", "percent": "% of the age"}.get(_CIRCA_UNITS[field], "years")
        trace.note(f"approximate: widened by {amount} {unit} on each side (setting "
                   f"{option_name(field)} = {amount}): {trace.bounds(widened)}")
    return widened


_CIRCA_UNITS = {
    "circa_days_for_day": "days", "circa_days_for_month": "days",
    "circa_years_for_year": "years", "circa_years_for_decade": "years",
    "circa_years_for_century": "years", "circa_years_for_millennium": "years",
    "circa_percent_for_deep_time": "percent",
}
_CIRCA_FIELD = {
    Precision.DAY: "circa_days_for_day", Precision.MONTH: "circa_days_for_month",
    Precision.SEASON: "circa_days_for_month", Precision.YEAR: "circa_years_for_year",
    Precision.DECADE: "circa_years_for_decade", Precision.CENTURY: "circa_years_for_century",
    Precision.MILLENNIUM: "circa_years_for_millennium",
    Precision.DEEP_TIME: "circa_percent_for_deep_time",
}


def circa_amount(precision: Precision | None, settings: DateSettings) -> tuple[str, int]:
    """(the settings field, its value) that says how far circa widens at `precision`."""
    field = _CIRCA_FIELD[precision or Precision.YEAR]
    return field, getattr(settings, field)


def _widened(endpoint: Endpoint, field: str, amount: int, calendar: str) -> tuple[int, int]:
    unit = _CIRCA_UNITS[field]
    if unit == "days":
        return endpoint.earliest - amount, endpoint.latest + amount
    first, last = year_of(endpoint.earliest, calendar), year_of(endpoint.latest, calendar)
    if unit == "percent":
        # Deep time: a share of the age, counted back from the present of BP (1950); a year
        # after it (Y171010000S3~) is as far off the other way, and widens as much.
        first -= abs(PRESENT_YEAR - first) * amount // 100
        last += abs(PRESENT_YEAR - last) * amount // 100
    else:
        first, last = first - amount, last + amount
    return year_bounds(first, calendar)[0], year_bounds(last, calendar)[1]


def year_of(fixed: int, calendar: str) -> int:
    """The year, as `calendar` numbers it, that holds a fixed day."""
    if _written_gregorian(fixed, calendar):
        return gregorian_year_from_fixed(fixed)
    return julian_from_fixed(fixed)[0]


def date_of(fixed: int, calendar: str) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day as `calendar` writes it."""
    if _written_gregorian(fixed, calendar):
        return gregorian_from_fixed(fixed)
    return julian_from_fixed(fixed)


def _written_gregorian(fixed: int, calendar: str) -> bool:
    if calendar == GREGORIAN or calendar == JULIAN:
        return calendar == GREGORIAN
    first_day = GREGORIAN_REFORM if calendar == HISTORICAL else reform_day(calendar)
    return fixed >= first_day


def before(endpoint: Endpoint, settings: DateSettings, inclusive: bool | None = None) -> Endpoint:
    """`before X`: no earliest bound; ends the day before X begins (exclusive) or with X.

    `inclusive` None follows the before-after setting; True or False is what the words said
    (`by 1700`, `not after 1700`)."""
    latest = endpoint.latest if _inclusive(inclusive, settings) else endpoint.earliest - 1
    marks = _bound_marks(Qualifier.BEFORE, inclusive)
    bounded = Endpoint(None, latest, endpoint.precision, endpoint.qualifiers | marks)
    _note_bound("before", bounded, inclusive, settings)
    return bounded


def after(endpoint: Endpoint, settings: DateSettings, inclusive: bool | None = None) -> Endpoint:
    """`after X`: no latest bound; begins the day after X ends (exclusive) or with X."""
    earliest = endpoint.earliest if _inclusive(inclusive, settings) else endpoint.latest + 1
    marks = _bound_marks(Qualifier.AFTER, inclusive)
    bounded = Endpoint(earliest, None, endpoint.precision, endpoint.qualifiers | marks)
    _note_bound("after", bounded, inclusive, settings)
    return bounded


def _inclusive(inclusive: bool | None, settings: DateSettings) -> bool:
    return settings.before_after == "inclusive" if inclusive is None else inclusive


def _bound_marks(side: Qualifier, inclusive: bool | None) -> frozenset[Qualifier]:
    if inclusive is None:
        return frozenset({side, Qualifier.CONVENTION_DEPENDENT})
    return frozenset({side})


def _note_bound(side: str, bounded: Endpoint, inclusive: bool | None,
                settings: DateSettings) -> None:
    if not trace.on:
        return
    if inclusive is None:
        rule = f"setting before-after = {settings.before_after}"
    else:
        rule = "the words say " + ("the date itself is allowed" if inclusive else "strictly")
    trace.note(f"{side}: one side left open ({rule}): {trace.bounds(bounded)}")


def coarser(first: Precision | None, second: Precision | None) -> Precision | None:
    """The coarser of two precisions; an open side (None) gives way to the other."""
    if first is None:
        return second
    if second is None:
        return first
    return first if _PRECISION_ORDER[first] >= _PRECISION_ORDER[second] else second


def ordered_span(start: Endpoint, end: Endpoint, text: str, hint: str | None = None,
                 position: int | None = None) -> Span:
    if start.earliest is not None and end.latest is not None and end.latest < start.earliest:
        raise DateError(text, "the end comes before the start", hint=hint, position=position)
    return Span(start, end)


def spanning(first: Endpoint, last: Endpoint, qualifier: Qualifier) -> Endpoint:
    """One window from `first`'s earliest to `last`'s latest day, e.g. `between X and Y`."""
    qualifiers = first.qualifiers | last.qualifiers | {qualifier}
    return Endpoint(first.earliest, last.latest, coarser(first.precision, last.precision),
                    frozenset(qualifiers))


def collapsed(span: Span) -> Endpoint:
    """A range read as one window: it happened once, somewhere between the start's earliest
    and the end's latest day (a born column holding `1985/1987`)."""
    return spanning(span.start, span.end, Qualifier.ONE_OF)

