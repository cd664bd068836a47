"""The commonest cells, read by one regex and one short function each: a quick lane in
front of the general reader, for speed alone.

Shapes: a year `1650`, `1650?`, `1650~`; an ISO day `1985-04-12`; `12 April 1650`,
`12-Apr-1650`, `April 12, 1650`, `April 1650`; a decade `1650s`, `early 1650s`; a century
`17th century`, `late 17th c.`; `c. 1650`, `circa 1650`, `about 1650`, `before 1700`,
`bef. 1700`, `after 1650`, `aft. 1650`, `by 1700`; `44 BC`, `c. 44 BC`; two four-digit years
`1650–1660`, `1650-1660`, `1650 to 1660`, and the ISO interval `1985/1987`; `1650%`;
`between 1650 and 1660`; `March–May 1650`; `c. 1650s`; `1650 ± 10`; ages `12,500 ± 150 BP`,
`65.5 Ma`; a day of a dual year `12 February 1701/02`. Values are made by built.py, without
checks that the reader has already made.

Every shape gives what the general reader gives: most through the same window functions,
a few (a year widened by circa, bounded by before or after, with an error term; an age) by
the same arithmetic written out for their simple bounds. tests/test_dates_quick.py checks
that both give the same span for each shape, in any letter case: the shapes' regex ignores
case, as the general reader's forms do, so the readers take apart the text in lower case
(a reader that split `Mid-1650S` at a literal `mid-` once failed on it). Anything
else, anything doubtful (a day that may not exist, a year-start setting, a range written
backwards) and every reading that `explain` follows goes to the general reader (None here).
"""
from __future__ import annotations

import re
from datetime import date
from functools import lru_cache
from typing import Callable

from ..calendar import (
    GREGORIAN, HISTORICAL, JULIAN, JULIAN_EPOCH, fixed_from_gregorian, fixed_from_julian,
)
from ..model import Endpoint, Precision, Qualifier, Span
from . import trace
from .built import checked_span, checked_window, day_point, point
from .centuries import counted_unit
from .months import MONTHS
from .oldstyle import LAST_DUAL_YEAR, names_next_year, plain_year
from .ordinals import ordinal_suffix
from .parts import part_from_words, part_of
from .settings import DateSettings
from .text import hundreds
from .windows import approximate, day_fixed, month_bounds, year_bounds, years

# Any word a month's name could be (the readers look it up, and leave the text to the general
# reader when it is none): cheaper for the regex engine than an alternation of the names.
_MONTH = "[a-z]{3,9}|[0-9]{1,2}ber"
_YEAR = "[1-9][0-9]{0,3}"

_DIGIT, _LETTER = "digit", "letter"
# (name, regex, what it can begin with), the commonest first: the first regex to match all of
# a text is its shape. A month shape also matches words that are no month (`about 1650`): the
# shapes of such words come before it, and its reader passes on any other word.
# Month names can begin with a digit too (7ber: September).
_SHAPES = (
    ("iso", r"[0-9]{4}-[0-9]{2}-[0-9]{2}", _DIGIT),
    ("day_month_year", rf"[0-9]{{1,2}} [\x20-] (?:{_MONTH}) [\x20-] {_YEAR}", _DIGIT),
    ("years", r"[1-9][0-9]{3} (?:\u2013|-|\x20to\x20) [1-9][0-9]{3}", _DIGIT),
    ("numeric", r"[0-9]{1,2} [/-] [0-9]{1,2} [/-] [1-9][0-9]{3}", _DIGIT),
    ("age", r"""[1-9][0-9]{0,2} , [0-9]{3} \x20 \u00b1 \x20 [1-9][0-9]{0,3} \x20 BP
              | [1-9][0-9]{0,2} \. [0-9] \x20 Ma""", _DIGIT),
    ("interval", r"[1-9][0-9]{3} / [1-9][0-9]{3}", _DIGIT),
    ("bc", rf"{_YEAR} \x20 BCE?", _DIGIT),
    ("dual_day", rf"[0-9]{{1,2}} \x20 (?:{_MONTH}) \x20 [1-9][0-9]{{3}} / [0-9]{{2}}", _DIGIT),
    ("year", _YEAR, _DIGIT),
    ("marked", rf"{_YEAR} [?~%]", _DIGIT),
    ("year_error", rf"{_YEAR} \x20 \u00b1 \x20 [0-9]{{1,4}}", _DIGIT),
    ("decade", r"[1-9][0-9]{1,2}0s", _DIGIT),
    ("worded", rf"(?:c\.|ca\.|c|ca|circa|about|before|bef\.|after|aft\.|by) \x20 {_YEAR}",
     _LETTER),
    ("worded_bc", rf"(?:c\.|ca\.|circa|about) \x20 {_YEAR} \x20 BCE?", _LETTER),
    ("between", r"between \x20 [1-9][0-9]{3} \x20 and \x20 [1-9][0-9]{3}", _LETTER),
    ("month_day_year", rf"(?:{_MONTH}) \x20 [0-9]{{1,2}} ,? \x20 {_YEAR}", _LETTER + _DIGIT),
    ("month_year", rf"(?:{_MONTH}) \x20 {_YEAR}", _LETTER + _DIGIT),
    ("months", rf"(?:{_MONTH}) \u2013 (?:{_MONTH}) \x20 {_YEAR}", _LETTER + _DIGIT),
    ("century", r"(?:early\x20|mid-|late\x20)? [1-9][0-9]? (?:st|nd|rd|th) \x20 (?:century|c\.)",
     _LETTER + _DIGIT),
    ("part_decade", r"(?:early\x20|mid-|late\x20) [1-9][0-9]{1,2}0s", _LETTER),
    ("circa_decade", r"(?:c\.|ca\.|circa|about) \x20 [1-9][0-9]{1,2}0s", _LETTER),
)


def _joined(begins: str) -> re.Pattern[str]:
    return re.compile("|".join(f"(?P<{name}> {pattern} )" for name, pattern, starts in _SHAPES
                               if begins in starts), re.VERBOSE | re.IGNORECASE | re.ASCII)


QUICK = _joined("")   # every shape
# A text meets only the shapes that can begin as it does: less for the regex engine to try.
_QUICK_DIGIT, _QUICK_LETTER = _joined(_DIGIT), _joined(_LETTER)
_DIGIT_SHAPE, _LETTER_SHAPE = _QUICK_DIGIT.fullmatch, _QUICK_LETTER.fullmatch
_DIGITS = frozenset("0123456789")

_CIRCA = frozenset({"c.", "ca.", "c", "ca", "circa", "about"})
# word -> (a before word, its qualifiers, inclusive): windows.before and windows.after, whose
# marks say when the before-after setting decided (None) and when the words did (True).
_BEFORE_SET = frozenset({Qualifier.BEFORE, Qualifier.CONVENTION_DEPENDENT})
_AFTER_SET = frozenset({Qualifier.AFTER, Qualifier.CONVENTION_DEPENDENT})
_BOUNDS = {"before": (True, _BEFORE_SET, None), "bef.": (True, _BEFORE_SET, None),
           "after": (False, _AFTER_SET, None), "aft.": (False, _AFTER_SET, None),
           "by": (True, frozenset({Qualifier.BEFORE}), True)}
# What windows.approximate marks a widened window with.
_APPROXIMATE = frozenset({Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT})
_UNCERTAIN = frozenset({Qualifier.UNCERTAIN})
_BOTH = _APPROXIMATE | _UNCERTAIN
_ONE_OF = frozenset({Qualifier.ONE_OF})
_ERROR_TERM = frozenset({Qualifier.APPROXIMATE})
_MARKS = {"~": _APPROXIMATE, "?": _UNCERTAIN, "%": _BOTH}
_NO_QUALIFIERS: frozenset[Qualifier] = frozenset()
_PRESENT = 1950          # deeptime.py: BP and Ma count back from 1950
_HALF_TENTH_MA = 50_000  # 65.5 Ma is every age that rounds to it: 65.45 up to 65.55 Ma
# The days of a dual year's months before the Old Style new year, 25 March (oldstyle.py).
_DUAL_DAYS = {1: 31, 2: 28, 3: 24}
# Days of a common year before the first of each month (index 1..12).
_DAYS_BEFORE = (0, 0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334)


def quick_span(text: str, settings: DateSettings) -> Span | None:
    """The span of a cell in one of the quick shapes; None for anything else."""
    if trace.on or settings.year_start != "01-01" or len(text) > 24 or settings.bp != "calendar":
        return None
    found = (_DIGIT_SHAPE if text[:1] in _DIGITS else _LETTER_SHAPE)(text)
    if found is None:
        return None
    # The shapes match any case; their readers split at literal lower-case words (mid-, bp).
    return _READERS[found.lastgroup](text.lower(), settings)


_PLAIN_CALENDARS = frozenset({GREGORIAN, JULIAN, HISTORICAL})


@lru_cache(maxsize=1 << 14)
def _year_point(year: int, calendar: str) -> Span:
    return Span.point(plain_year(year, calendar))


def _year(text: str, settings: DateSettings) -> Span:
    return _year_point(int(text), settings.reckoning)


def _iso(text: str, settings: DateSettings) -> Span | None:
    # Proleptic Gregorian, as ISO 8601 is; R.D. counts days as date.toordinal does.
    try:
        return day_point(date.fromisoformat(text).toordinal())
    except ValueError:
        return None   # month 13, 30 February, year 0000: the general reader says which


def _day_month_year(text: str, settings: DateSettings) -> Span | None:
    day, month, year = text.replace("-", " ").split(" ")
    return _day(int(year), MONTHS.get(month, 0), int(day), settings)


def _month_day_year(text: str, settings: DateSettings) -> Span | None:
    month, day, year = text.replace(",", "").split(" ")
    return _day(int(year), MONTHS.get(month, 0), int(day), settings)


def _day(year: int, month: int, day: int, settings: DateSettings) -> Span | None:
    if not 1 <= day <= 28 or not 1 <= month <= 12 or year == 1582 and month == 10:
        return None   # the general reader says why a day does not exist
    calendar = settings.reckoning
    if calendar not in _PLAIN_CALENDARS:
        return None   # another reform day: its skipped days are the general reader's
    return day_point(_day_number(year, month, day, calendar))


def _day_number(year: int, month: int, day: int, calendar: str) -> int:
    """windows.day_fixed for a day that exists (1..28, not in October 1582), years 1..9999."""
    if calendar == JULIAN or calendar == HISTORICAL and (
            year < 1582 or year == 1582 and month < 10):
        # calendar.fixed_from_julian with its month term read from a table
        prior = year - 1
        return (JULIAN_EPOCH - 1
                + 365 * prior + prior // 4              # the days of the prior years
                + _DAYS_BEFORE[month]                   # of the prior months, in a common year
                + (month > 2 and year % 4 == 0)         # 29 February, once past it
                + day)
    if calendar == GREGORIAN or calendar == HISTORICAL:
        return date(year, month, day).toordinal()
    return day_fixed(year, month, day, calendar)


def _month_year(text: str, settings: DateSettings) -> Span | None:
    month, year = text.split(" ")
    number = MONTHS.get(month)
    if number is None:
        return None
    earliest, latest = month_bounds(int(year), number, settings.reckoning)
    return point(checked_window(earliest, latest, Precision.MONTH))


def _decade(text: str, settings: DateSettings) -> Span:
    number = int(text[:-1])
    if number % 100 == 0:
        return Span.point(hundreds(number, None, settings.reckoning, settings))
    return Span.point(years(number, number + 9, settings.reckoning, Precision.DECADE))


def _worded(text: str, settings: DateSettings) -> Span:
    word, year = text.split(" ")
    if word in _CIRCA:
        return point(_circa_year(int(year), settings))
    return point(_bounded_year(int(year), word, settings))


def _bounded_year(year: int, word: str, settings: DateSettings) -> Endpoint:
    """windows.before or windows.after of plain_year(year): one side left open."""
    first, last = year_bounds(year, settings.reckoning)
    is_before, marks, inclusive = _BOUNDS[word]
    if inclusive is None:
        inclusive = settings.before_after == "inclusive"
    if is_before:
        return checked_window(None, last if inclusive else first - 1, Precision.YEAR, marks)
    return checked_window(first if inclusive else last + 1, None, Precision.YEAR, marks)


def _circa_year(year: int, settings: DateSettings, qualifiers=_APPROXIMATE) -> Endpoint:
    """windows.approximate(plain_year(year)): the years around it, no likely day."""
    amount, calendar = settings.circa_years_for_year, settings.reckoning
    return checked_window(year_bounds(year - amount, calendar)[0],
                          year_bounds(year + amount, calendar)[1], Precision.YEAR, qualifiers)


def _bc(text: str, settings: DateSettings) -> Span:
    year = 1 - int(text.split(" ")[0])
    return point(plain_year(year, settings.reckoning))


def _years(text: str, settings: DateSettings) -> Span | None:
    first, last = int(text[:4]), int(text[-4:])
    if last < first:
        return None   # the general reader says the end comes before the start
    return checked_span(plain_year(first, settings.reckoning), plain_year(last, settings.reckoning))


def _interval(text: str, settings: DateSettings) -> Span | None:
    first, last = int(text[:4]), int(text[5:])
    if last <= first + 1:
        return None   # a dual year (1701/02), or written backwards: the general reader
    # ISO 8601: proleptic Gregorian
    return checked_span(plain_year(first, GREGORIAN), plain_year(last, GREGORIAN))


def _century(text: str, settings: DateSettings) -> Span | None:
    *words, ordinal, _unit = text.replace("mid-", "mid ").split()
    number = int(ordinal[:-2])
    if ordinal[-2:] != ordinal_suffix(number):
        return None   # the general reader says which suffix is right
    endpoint = counted_unit(number, 100, None, None, settings)
    return Span.point(_part(endpoint, words, settings))


def _part_decade(text: str, settings: DateSettings) -> Span:
    words, decade = text.replace("mid-", "mid ").split()
    return Span.point(_part(_decade(decade, settings).start, [words], settings))


def _part(endpoint: Endpoint, words: list[str], settings: DateSettings) -> Endpoint:
    if not words:
        return endpoint
    return part_of(endpoint, part_from_words(words[0]), settings.reckoning, settings)


def _worded_bc(text: str, settings: DateSettings) -> Span:
    _word, year, _era = text.split(" ")
    return point(_circa_year(1 - int(year), settings))


def _marked(text: str, settings: DateSettings) -> Span:
    marks = _MARKS[text[-1]]
    if marks is _UNCERTAIN:
        first, last = year_bounds(int(text[:-1]), settings.reckoning)
        return point(checked_window(first, last, Precision.YEAR, marks))
    return point(_circa_year(int(text[:-1]), settings, marks))


def _numeric(text: str, settings: DateSettings) -> Span | None:
    if text.count("/") not in (0, 2):
        return None   # mixed separators: the general reader says so
    first, second, year = (int(part) for part in text.replace("-", "/").split("/"))
    if first != second and max(first, second) <= 12:
        return None   # 03/04/1650: the day-first setting decides, in the general reader
    day, month = (first, second) if second <= 12 else (second, first)
    return None if month > 12 else _day(year, month, day, settings)


def _between(text: str, settings: DateSettings) -> Span | None:
    first, last = int(text[8:12]), int(text[-4:])
    if last < first:
        return None   # the general reader says to write the earlier first
    calendar = settings.reckoning
    return point(checked_window(year_bounds(first, calendar)[0], year_bounds(last, calendar)[1],
                                Precision.YEAR, _ONE_OF))


def _months(text: str, settings: DateSettings) -> Span | None:
    months, year = text.split(" ")
    first, last = (MONTHS.get(name, 0) for name in months.split("\u2013"))
    if last < first or not first:
        return None   # written backwards: the general reader says so
    start = month_bounds(int(year), first, settings.reckoning)
    end = month_bounds(int(year), last, settings.reckoning)
    return checked_span(checked_window(*start, Precision.MONTH),
                        checked_window(*end, Precision.MONTH))


def _circa_decade(text: str, settings: DateSettings) -> Span:
    decade = _decade(text.split(" ")[1], settings).start
    return point(approximate(decade, settings, settings.reckoning))


def _year_error(text: str, settings: DateSettings) -> Span:
    year_text, _sign, error_text = text.split(" ")
    year, error, calendar = int(year_text), int(error_text), settings.reckoning
    nominal = year_bounds(year, calendar)
    return point(checked_window(year_bounds(year - error, calendar)[0],
                                year_bounds(year + error, calendar)[1], Precision.YEAR,
                                _ERROR_TERM, sum(nominal) // 2))


def _age(text: str, settings: DateSettings) -> Span:
    """deeptime.read_age for `12,500 ± 150 BP` (whole years) and `65.5 Ma` (tenths)."""
    if text[-1] == "p":   # 12,500 ± 150 bp (the text is in lower case here); else 65.5 ma
        value, _sign, error, _unit = text.split(" ")
        age, error_years = int(value.replace(",", "")), int(error)
        nearest, farthest, qualifiers = age - error_years, age + error_years, _ERROR_TERM
    else:
        age = int(text[:-3].replace(".", "")) * 100_000
        nearest, farthest = age - _HALF_TENTH_MA, age + _HALF_TENTH_MA - 1
        qualifiers = _NO_QUALIFIERS
    nominal = _PRESENT - age
    likely = (_new_year(nominal) + _new_year(nominal + 1) - 1) // 2
    return point(checked_window(_new_year(_PRESENT - farthest),
                                _new_year(_PRESENT - nearest + 1) - 1, Precision.DEEP_TIME,
                                qualifiers, likely))


def _new_year(year: int) -> int:
    return fixed_from_gregorian(year, 1, 1)


def _dual_day(text: str, settings: DateSettings) -> Span | None:
    """`12 February 1701/02`: a day of Old Style 1701, New Style 1702, in the Julian calendar."""
    day_text, month_name, years_text = text.split(" ")
    first, second = years_text.split("/")
    month, day = MONTHS.get(month_name, 0), int(day_text)
    if (not names_next_year(first, second) or int(first) + 1 > LAST_DUAL_YEAR
            or not 1 <= day <= _DUAL_DAYS.get(month, 0)):
        return None   # not a dual year, or a day the two numberings share: the general reader
    return day_point(fixed_from_julian(int(first) + 1, month, day))


_READERS: dict[str, Callable[[str, DateSettings], Span | None]] = {
    "year": _year, "iso": _iso, "day_month_year": _day_month_year,
    "month_day_year": _month_day_year, "month_year": _month_year, "decade": _decade,
    "worded": _worded, "bc": _bc, "years": _years, "interval": _interval,
    "century": _century, "part_decade": _part_decade, "worded_bc": _worded_bc,
    "marked": _marked, "numeric": _numeric, "between": _between, "months": _months,
    "circa_decade": _circa_decade, "year_error": _year_error, "age": _age,
    "dual_day": _dual_day,
}
