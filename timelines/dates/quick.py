"""The commonest cells, read by one regex and one short function each: a quick lane in
front of the general reader, for speed alone.

Shapes: a year `1650`, `1650?`, `1650~`; an ISO day `1985-04-12`; `12 April 1650`,
`12-Apr-1650`, `April 12, 1650`, `April 1650`; a decade `1650s`, `early 1650s`; a century
`17th century`, `late 17th c.`; `c. 1650`, `circa 1650`, `about 1650`, `before 1700`,
`bef. 1700`, `after 1650`, `aft. 1650`, `by 1700`; `44 BC`, `c. 44 BC`; two four-digit years
`1650–1660`, `1650-1660`, `1650 to 1660`, and the ISO interval `1985/1987`.

Every shape is read by the same window functions as the general reader, and
tests/test_dates_quick.py checks that both give the same span for each shape. Anything
else, anything doubtful (a day that may not exist, a year-start setting, a range written
backwards) and every reading that `explain` follows goes to the general reader (None here).
"""
from __future__ import annotations

import re
from functools import lru_cache
from typing import Callable

from ..calendar import GREGORIAN, days_in_month
from ..model import Endpoint, Precision, Qualifier, Span
from . import trace
from .centuries import counted_unit
from .months import MONTHS
from .oldstyle import plain_year
from .ordinals import ordinal_suffix
from .parts import part_from_words, part_of
from .settings import DateSettings
from .windows import after, approximate, before, day_fixed, month_bounds, qualified, years

_MONTH = "|".join(sorted(MONTHS, key=len, reverse=True))
_YEAR = "[1-9][0-9]{0,3}"

QUICK = re.compile(rf"""
    (?P<year> {_YEAR} )
  | (?P<iso> [0-9]{{4}}-[0-9]{{2}}-[0-9]{{2}} )
  | (?P<day_month_year> [0-9]{{1,2}} [\x20-] (?:{_MONTH}) [\x20-] {_YEAR} )
  | (?P<month_day_year> (?:{_MONTH}) \x20 [0-9]{{1,2}} ,? \x20 {_YEAR} )
  | (?P<month_year> (?:{_MONTH}) \x20 {_YEAR} )
  | (?P<decade> [1-9][0-9]{{1,2}}0s )
  | (?P<worded> (?:c\.|ca\.|c|ca|circa|about|before|bef\.|after|aft\.|by) \x20 {_YEAR} )
  | (?P<bc> {_YEAR} \x20 BCE? )
  | (?P<years> [1-9][0-9]{{3}} (?:\u2013|-|\x20to\x20) [1-9][0-9]{{3}} )
  | (?P<interval> [1-9][0-9]{{3}} / [1-9][0-9]{{3}} )
  | (?P<century> (?:early\x20|mid-|late\x20)? [1-9][0-9]? (?:st|nd|rd|th) \x20 (?:century|c\.) )
  | (?P<part_decade> (?:early\x20|mid-|late\x20) [1-9][0-9]{{1,2}}0s )
  | (?P<worded_bc> (?:c\.|ca\.|circa|about) \x20 {_YEAR} \x20 BCE? )
  | (?P<marked> {_YEAR} [?~] )
  | (?P<numeric> [0-9]{{1,2}} [/-] [0-9]{{1,2}} [/-] [1-9][0-9]{{3}} )
""", re.VERBOSE | re.IGNORECASE)

_SPLIT = re.compile(r"[\x20,\-\u2013]+")
_CIRCA = frozenset({"c.", "ca.", "c", "ca", "circa", "about"})
# word -> (bound, inclusive): None follows the before-after setting, True the words' own sense
_BOUNDS = {"before": (before, None), "bef.": (before, None), "after": (after, None),
           "aft.": (after, None), "by": (before, True)}


def quick_span(text: str, settings: DateSettings) -> Span | None:
    """The span of a cell in one of the quick shapes; None for anything else."""
    if trace.on or settings.year_start != "01-01" or len(text) > 24:
        return None
    found = QUICK.fullmatch(text)
    if found is None:
        return None
    return _READERS[found.lastgroup](text, settings)


@lru_cache(maxsize=1 << 14)
def _year_point(year: int, calendar: str) -> Span:
    return Span.point(plain_year(year, calendar))


def _year(text: str, settings: DateSettings) -> Span:
    return _year_point(int(text), settings.calendar)


def _iso(text: str, settings: DateSettings) -> Span | None:
    year, month, day = int(text[:4]), int(text[5:7]), int(text[8:])
    if not 1 <= month <= 12 or not 1 <= day <= days_in_month(year, month, GREGORIAN):
        return None
    fixed = month_bounds(year, month, GREGORIAN)[0] + day - 1
    endpoint = Endpoint(fixed, fixed, Precision.DAY)
    return Span(endpoint, endpoint)


def _day_month_year(text: str, settings: DateSettings) -> Span | None:
    day, month, year = _SPLIT.split(text)
    return _day(int(year), MONTHS[month.lower()], int(day), settings)


def _month_day_year(text: str, settings: DateSettings) -> Span | None:
    month, day, year = _SPLIT.split(text)
    return _day(int(year), MONTHS[month.lower()], int(day), settings)


def _day(year: int, month: int, day: int, settings: DateSettings) -> Span | None:
    if not 1 <= day <= 28 or not 1 <= month <= 12 or (year, month) == (1582, 10):
        return None   # the general reader says why a day does not exist
    fixed = day_fixed(year, month, day, settings.calendar)
    endpoint = Endpoint(fixed, fixed, Precision.DAY)
    return Span(endpoint, endpoint)


def _month_year(text: str, settings: DateSettings) -> Span:
    month, year = text.split(" ")
    earliest, latest = month_bounds(int(year), MONTHS[month.lower()], settings.calendar)
    return Span.point(Endpoint(earliest, latest, Precision.MONTH))


def _decade(text: str, settings: DateSettings) -> Span:
    number = int(text[:-1])
    if number % 100 == 0:
        return Span.point(years(number, number + 99, settings.calendar, Precision.CENTURY))
    return Span.point(years(number, number + 9, settings.calendar, Precision.DECADE))


def _worded(text: str, settings: DateSettings) -> Span:
    word, year = text.split(" ")
    word = word.lower()
    endpoint = plain_year(int(year), settings.calendar)
    if word in _CIRCA:
        return Span.point(approximate(endpoint, settings, settings.calendar))
    bound, inclusive = _BOUNDS[word]
    return Span.point(bound(endpoint, settings, inclusive))


def _bc(text: str, settings: DateSettings) -> Span:
    year = 1 - int(text.split(" ")[0])
    return Span.point(plain_year(year, settings.calendar))


def _years(text: str, settings: DateSettings) -> Span | None:
    first, last = int(text[:4]), int(text[-4:])
    if last < first:
        return None   # the general reader says the end comes before the start
    return Span(plain_year(first, settings.calendar), plain_year(last, settings.calendar))


def _interval(text: str, settings: DateSettings) -> Span | None:
    first, last = int(text[:4]), int(text[5:])
    if last <= first + 1:
        return None   # a dual year (1701/02), or written backwards: the general reader
    return Span(plain_year(first, GREGORIAN), plain_year(last, GREGORIAN))  # ISO: Gregorian


def _century(text: str, settings: DateSettings) -> Span | None:
    *words, ordinal, _unit = text.replace("mid-", "mid ").split()
    number = int(ordinal[:-2])
    if ordinal[-2:].lower() != ordinal_suffix(number):
        return None   # the general reader says which suffix is right
    endpoint = counted_unit(number, 100, None, None, settings)
    return Span.point(_part(endpoint, words, settings))


def _part_decade(text: str, settings: DateSettings) -> Span:
    words, decade = text.replace("mid-", "mid ").split()
    return Span.point(_part(_decade(decade, settings).start, [words], settings))


def _part(endpoint: Endpoint, words: list[str], settings: DateSettings) -> Endpoint:
    if not words:
        return endpoint
    return part_of(endpoint, part_from_words(words[0]), settings.calendar, settings)


def _worded_bc(text: str, settings: DateSettings) -> Span:
    _word, year, _era = text.split(" ")
    endpoint = plain_year(1 - int(year), settings.calendar)
    return Span.point(approximate(endpoint, settings, settings.calendar))


def _marked(text: str, settings: DateSettings) -> Span:
    endpoint = plain_year(int(text[:-1]), settings.calendar)
    if text[-1] == "~":
        return Span.point(approximate(endpoint, settings, settings.calendar))
    return Span.point(qualified(endpoint, Qualifier.UNCERTAIN))


def _numeric(text: str, settings: DateSettings) -> Span | None:
    if text.count("/") not in (0, 2):
        return None   # mixed separators: the general reader says so
    first, second, year = (int(part) for part in text.replace("-", "/").split("/"))
    if first != second and max(first, second) <= 12:
        return None   # 03/04/1650: the day-first setting decides, in the general reader
    day, month = (first, second) if second <= 12 else (second, first)
    return None if month > 12 else _day(year, month, day, settings)


_READERS: dict[str, Callable[[str, DateSettings], Span | None]] = {
    "year": _year, "iso": _iso, "day_month_year": _day_month_year,
    "month_day_year": _month_day_year, "month_year": _month_year, "decade": _decade,
    "worded": _worded, "bc": _bc, "years": _years, "interval": _interval,
    "century": _century, "part_decade": _part_decade, "worded_bc": _worded_bc,
    "marked": _marked, "numeric": _numeric,
}
