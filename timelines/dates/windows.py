"""Endpoint windows built from calendar units, and the conventions that move their bounds.

The helpers here know nothing of text. They raise `ValueError` with a plain reason ("month 13
does not exist"); the parser entry points turn it into a `DateError` naming the text, in one
place (`reading`).
"""
from __future__ import annotations

from contextlib import contextmanager
from dataclasses import replace
from typing import Iterable, Iterator

from ..calendar import (
    GREGORIAN, GREGORIAN_REFORM, HISTORICAL, fixed_from_calendar, gregorian_year_from_fixed,
    julian_from_fixed, month_range, year_range,
)
from ..errors import DateError
from ..model import Endpoint, Precision, Qualifier, Span
from .settings import DateSettings

# Years of more digits than this are refused before `int()` sees them: deep time reaches
# 10^10 years, and 10^12 years of days still fit an int64 fixed day number.
MAX_YEAR_DIGITS = 12

DATE_HINT = "expected a date such as 1650, c. 1650, 1650s, 17th century, 1650-04-12, 44 BC"

_PRECISION_ORDER = tuple(Precision)


@contextmanager
def reading(text: str) -> Iterator[None]:
    """Turn a plain ValueError raised while reading `text` into a DateError about `text`."""
    try:
        yield
    except DateError:
        raise
    except ValueError as error:
        raise DateError(text, str(error)) from error


def normalise(text: str) -> str:
    """One space between words, none at the ends; typographic apostrophes and hyphens made plain."""
    return " ".join(text.translate(_PLAIN_PUNCTUATION).split())


_PLAIN_PUNCTUATION = str.maketrans({"\u2019": "'", "\u2018": "'", "\u2010": "-", "\u2011": "-"})


def check_year(year: int) -> int:
    if abs(year) >= 10 ** MAX_YEAR_DIGITS:
        raise ValueError(f"year {year} is out of range (at most {MAX_YEAR_DIGITS} digits)")
    return year


def years(first: int, last: int, calendar: str, precision: Precision,
          qualifiers: Iterable[Qualifier] = ()) -> Endpoint:
    """1 January of `first` .. 31 December of `last`, astronomical years written in `calendar`."""
    earliest = year_range(check_year(first), calendar)[0]
    latest = year_range(check_year(last), calendar)[1]
    return Endpoint(earliest, latest, precision, frozenset(qualifiers))


def month(year: int, month_number: int, calendar: str,
          qualifiers: Iterable[Qualifier] = ()) -> Endpoint:
    earliest, latest = month_range(check_year(year), month_number, calendar)
    return Endpoint(earliest, latest, Precision.MONTH, frozenset(qualifiers))


def day(year: int, month_number: int, day_number: int, calendar: str) -> Endpoint:
    return Endpoint.day(fixed_from_calendar(check_year(year), month_number, day_number, calendar))


def qualified(endpoint: Endpoint, *qualifiers: Qualifier) -> Endpoint:
    return replace(endpoint, qualifiers=endpoint.qualifiers | frozenset(qualifiers))


def approximate(endpoint: Endpoint, settings: DateSettings, calendar: str) -> Endpoint:
    """`c. X` / `X~`: X widened on both sides by the settings' circa amount for X's precision.

    A single day stays the likely day of the wider window."""
    if endpoint.has(Qualifier.APPROXIMATE):
        raise ValueError("approximate twice (both c. and ~); write one of them")
    unit, amount = _circa_amount(endpoint.precision, settings)
    if amount == 0:
        return qualified(endpoint, Qualifier.APPROXIMATE)
    if unit == "days":
        earliest, latest = endpoint.earliest - amount, endpoint.latest + amount
    else:
        first_year = check_year(year_of(endpoint.earliest, calendar) - amount)
        last_year = check_year(year_of(endpoint.latest, calendar) + amount)
        earliest, latest = year_range(first_year, calendar)[0], year_range(last_year, calendar)[1]
    likely = endpoint.earliest if endpoint.is_exact else endpoint.likely
    marks = frozenset({Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT})
    return Endpoint(earliest, latest, endpoint.precision, endpoint.qualifiers | marks, likely)


def _circa_amount(precision: Precision | None, settings: DateSettings) -> tuple[str, int]:
    # Millennia and coarser have no circa setting yet: they are marked, not widened.
    amounts = {
        Precision.DAY: ("days", settings.circa_days_for_day),
        Precision.MONTH: ("days", settings.circa_days_for_month),
        Precision.YEAR: ("years", settings.circa_years_for_year),
        Precision.DECADE: ("years", settings.circa_years_for_decade),
        Precision.CENTURY: ("years", settings.circa_years_for_century),
    }
    return amounts.get(precision, ("years", 0))


def year_of(fixed: int, calendar: str) -> int:
    """The year, as `calendar` numbers it, that holds a fixed day."""
    if calendar == GREGORIAN or (calendar == HISTORICAL and fixed >= GREGORIAN_REFORM):
        return gregorian_year_from_fixed(fixed)
    return julian_from_fixed(fixed)[0]


def before(endpoint: Endpoint, settings: DateSettings) -> Endpoint:
    """`before X`: no earliest bound; ends the day before X begins (exclusive) or with X."""
    exclusive = settings.before_after == "exclusive"
    latest = endpoint.earliest - 1 if exclusive else endpoint.latest
    marks = frozenset({Qualifier.BEFORE, Qualifier.CONVENTION_DEPENDENT})
    return Endpoint(None, latest, endpoint.precision, endpoint.qualifiers | marks)


def after(endpoint: Endpoint, settings: DateSettings) -> Endpoint:
    """`after X`: no latest bound; begins the day after X ends (exclusive) or with X."""
    exclusive = settings.before_after == "exclusive"
    earliest = endpoint.latest + 1 if exclusive else endpoint.earliest
    marks = frozenset({Qualifier.AFTER, Qualifier.CONVENTION_DEPENDENT})
    return Endpoint(earliest, None, endpoint.precision, endpoint.qualifiers | marks)


def coarser(first: Precision | None, second: Precision | None) -> Precision | None:
    """The coarser of two precisions; an open side (None) gives way to the other."""
    known = [p for p in (first, second) if p is not None]
    return max(known, key=_PRECISION_ORDER.index) if known else None


def ordered_span(start: Endpoint, end: Endpoint, text: str, hint: str | None = None) -> Span:
    if start.earliest is not None and end.latest is not None and end.latest < start.earliest:
        raise DateError(text, "the end comes before the start", hint=hint)
    return Span(start, end)


def collapsed(span: Span) -> Endpoint:
    """A range read as one window: it happened once, somewhere between the start's earliest
    and the end's latest day (a born column holding `1985/1987`)."""
    qualifiers = span.start.qualifiers | span.end.qualifiers | {Qualifier.ONE_OF}
    precision = coarser(span.start.precision, span.end.precision)
    return Endpoint(span.start.earliest, span.end.latest, precision, frozenset(qualifiers))
