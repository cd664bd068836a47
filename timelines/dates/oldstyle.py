"""When the year number changed: the year-start setting and Old Style/New Style dual years.

Until 1752 England and its colonies began the year on 25 March (Lady Day), so that the days
from 1 January to 24 March carried the number of the year before. Writers of the time, and
historians since, wrote such days with both numbers: `12 February 1701/02` is the day that
Old Style called 1701 and a year beginning on 1 January calls 1702 (Cheney, *A Handbook of Dates
for Students of British History*, ch. 1; from memory). Dual years belong to the Old Style, so
they are read in the Julian calendar unless the text names another.

`year_start` (setting "MM-DD") says how free-text years are numbered:
- "01-01" (default): as today;
- a start in January..June, such as "03-25": the written year Y ran from that day of Y to the
  day before it in Y+1 (England's Lady Day style, Florence's, Venice's 1 March);
- a start in July..December, such as "12-25": the written year Y began on that day of Y-1 (the
  Nativity style of medieval chanceries).
"""
from __future__ import annotations

from functools import lru_cache

from ..calendar import JULIAN, days_in_month, fixed_from_calendar
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .reasons import Unreadable
from .settings import DateSettings
from .windows import check_year, day_fixed, month_bounds, year_bounds

_MODERN = "01-01"   # the year-start setting when years begin on 1 January
LADY_DAY = (3, 25)     # the Old Style year start that dual years imply unless another is set
LAST_DUAL_YEAR = 1751  # 1750/51: the last dual year in England (Cheney, from memory)
_NO_SHIFT = (1, 1)
_CONVENTION = frozenset({Qualifier.CONVENTION_DEPENDENT})


def dual_year(first_text: str, second_text: str) -> int:
    """The later (New Style) year of `1701/02`, `1699/1700` or `1701/2`; raises Unreadable."""
    first = int(first_text)
    if not names_next_year(first_text, second_text):
        raise _not_dual(first, first_text, second_text)
    if first + 1 > LAST_DUAL_YEAR:
        raise Unreadable(f"{first_text}/{second_text} cannot be a dual year: from 1752 the year "
                         "began on 1 January (the Calendar Act of 1750)",
                         fragment=f"{first_text}/{second_text}",
                         hint=f"for two years write {first}–{first + 1}; an ISO 8601 interval "
                              f"is {first}/{first + 1}")
    return first + 1


def _not_dual(first: int, first_text: str, second_text: str) -> Unreadable:
    return Unreadable(f"{first_text}/{second_text} is not a dual year: a dual year names a "
                      "year and the next one", fragment=f"{first_text}/{second_text}",
                      hint=f"a dual year looks like {first}/{(first + 1) % 100:02d}; "
                           f"two years are written {first}–{_full(first, second_text)}")


def names_next_year(first_text: str, second_text: str) -> bool:
    """Whether `1650/51`, `1699/1700`, `1701/2` name a year and the one after it."""
    scale = 10 ** len(second_text)
    return (len(second_text) <= len(first_text)
            and (int(first_text) + 1) % scale == int(second_text) % scale)


def _full(first: int, second_text: str) -> str:
    """The second year of `1650/52` written in full: 1652."""
    scale = 10 ** len(second_text)
    return str(first - first % scale + int(second_text))


def dual_window(new_year: int, settings: DateSettings) -> tuple[int, int]:
    """1 January of the New Style year .. the day before the Old Style year began."""
    start = settings.year_start_month_day
    month, day = start if start != _NO_SHIFT and start[0] < 7 else LADY_DAY
    first = fixed_from_calendar(check_year(new_year), 1, 1, JULIAN)
    return first, fixed_from_calendar(new_year, month, day, JULIAN) - 1


def dual_year_endpoint(new_year: int, settings: DateSettings, calendar: str | None) -> Endpoint:
    earliest, latest = dual_window(new_year, settings)
    if calendar not in (None, JULIAN):
        raise Unreadable("a dual year belongs to the Old Style (Julian) calendar",
                         hint="leave out the calendar marker, or write the year once")
    endpoint = Endpoint(earliest, latest, Precision.YEAR, _CONVENTION)
    if trace.on:
        trace.note(f"dual year (Old Style/New Style): the days from 1 January of {new_year} "
                   f"until the Old Style year began, Julian calendar: {trace.bounds(endpoint)}")
    return endpoint


def within_dual(endpoint: Endpoint, new_year: int, settings: DateSettings,
                fragment: str) -> Endpoint:
    """A day or month written with a dual year: it must fall where the two numberings differ."""
    earliest, latest = dual_window(new_year, settings)
    low, high = max(endpoint.earliest, earliest), min(endpoint.latest, latest)
    if low > high:
        raise Unreadable("a dual year is written only for days from 1 January to the Old Style "
                         "new year (24 March)", fragment=fragment,
                         hint="after the new year both styles give the same year: write it once")
    return Endpoint(low, high, endpoint.precision, endpoint.qualifiers)


@lru_cache(maxsize=1 << 14)
def plain_year(year: int, calendar: str) -> Endpoint:
    """A year from 1 January to 31 December; years repeat in any column, so it is kept."""
    first, last = year_bounds(year, calendar)
    return Endpoint(first, last, Precision.YEAR)


def year_window(year: int, calendar: str, settings: DateSettings) -> Endpoint:
    """A written year in free text, numbered from the year-start setting."""
    if settings.year_start == _MODERN:
        return plain_year(year, calendar)
    start = settings.year_start_month_day
    begins = _start_fixed(year, start, calendar)
    following = _start_fixed(year + 1, start, calendar)
    endpoint = Endpoint(begins, following - 1, Precision.YEAR, _CONVENTION)
    _note_year_start(f"year {year}", endpoint, settings)
    return endpoint


def month_window(year: int, month: int, calendar: str, settings: DateSettings) -> Endpoint:
    """A month of a written year: the days of that month whose written year is `year`."""
    if settings.year_start == _MODERN:
        earliest, latest = month_bounds(year, month, calendar)
        return Endpoint(earliest, latest, Precision.MONTH)
    start = settings.year_start_month_day
    first_day = _day_fixed(year, month, 1, calendar, settings)
    last_day = _day_fixed(year, month, days_in_month(_modern_year(year, month, 28, start),
                                                      month, calendar), calendar, settings)
    low, high = min(first_day, last_day), max(first_day, last_day)
    if start[0] == month and start[1] > 1:
        # The month in which the year number changes is split between two modern years.
        low = _start_fixed(year, start, calendar)
        high = _start_fixed(year + 1, start, calendar) - 1
    endpoint = Endpoint(low, high, Precision.MONTH, _CONVENTION)
    _note_year_start(f"month {month} of {year}", endpoint, settings)
    return endpoint


def day_endpoint(year: int, month: int, day: int, calendar: str,
                 settings: DateSettings) -> Endpoint:
    """A day of a written year, numbered from the year-start setting."""
    if settings.year_start == _MODERN:
        return Endpoint.day(day_fixed(year, month, day, calendar))
    start = settings.year_start_month_day
    modern = _modern_year(year, month, day, start)
    fixed = fixed_from_calendar(check_year(modern), month, day, calendar)
    if modern == year:
        return Endpoint.day(fixed)
    endpoint = Endpoint(fixed, fixed, Precision.DAY, _CONVENTION)
    _note_year_start(f"day {day} of month {month} of {year}", endpoint, settings)
    return endpoint


def _modern_year(year: int, month: int, day: int, start: tuple[int, int]) -> int:
    """The January-to-December year of a day written in a year that began on `start`."""
    if start == _NO_SHIFT:
        return year
    if start[0] < 7:
        return year + 1 if (month, day) < start else year
    return year - 1 if (month, day) >= start else year


def _start_fixed(year: int, start: tuple[int, int], calendar: str) -> int:
    """The first day of written year `year`."""
    modern = year if start[0] < 7 else year - 1
    month, day = start
    if (month, day) == (2, 29) and days_in_month(modern, 2, calendar) == 28:
        month, day = 3, 1  # a year that begins on 29 February begins on 1 March otherwise
    return fixed_from_calendar(check_year(modern), month, day, calendar)


def _day_fixed(year: int, month: int, day: int, calendar: str, settings: DateSettings) -> int:
    modern = _modern_year(year, month, day, settings.year_start_month_day)
    return fixed_from_calendar(check_year(modern), month, day, calendar)


def _note_year_start(what: str, endpoint: Endpoint, settings: DateSettings) -> None:
    if trace.on:
        trace.note(f"{what} counted from a year beginning on {settings.year_start} "
                   f"(setting year-start): {trace.bounds(endpoint)}")
