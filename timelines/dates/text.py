"""Dates as historians write them in English, read in the calendar setting (`settings.calendar`;
by default Julian before 1582-10-15, Gregorian from then on). Any letter case.

Forms (one function each, tried in the order of `TEXT_FORMS`), each with an optional era
(`44 BC`, `44 BCE`, `44 B.C.`, `AD 1066`, `1066 AD`, `1066 CE`):
- a year `1650`, `44`: digits alone are astronomical years as in ISO 8601 (`0` is 1 BC); with
  an era there is no year zero (`0 BC` is refused). More than four digits need an era. A year
  padded with zeros to four digits (`0000`, `0044`) is written the ISO way and read as ISO.
- a decade `1650s`, `1650's`: 1650..1659. BC decades count down: `1650s BC` is 1659..1650 BC.
  Three or four digits: `'60s` is refused as ambiguous.
- hundreds `1600s`: read as the century 1600..1699 (the usual meaning of "the 1600s"), not as
  the decade 1600..1609. `1600s BC` is 1699..1600 BC.
- a century `17th century`, `17th-century`, `17th c.`, `17th cent.`, `1st`, `2nd`, `3rd`, `21st`
  (a wrong ordinal such as `17st` is refused). Bounds follow `settings.century` and are marked
  `convention_dependent`:
    common (default): AD nth = (n-1)00 .. (n-1)99, the years whose hundreds are n-1
                      (17th = 1600..1699; the 1st century, having no year 0, is AD 1..99);
                      BC nth mirrors it: (n-1)99 BC .. (n-1)00 BC (5th century BC = 499..400
                      BC, astronomical -498..-399; 1st century BC = 99..1 BC).
    strict:           AD nth = (n-1)01 .. n00 (17th = 1601..1700); BC nth = n00 BC .. (n-1)01 BC
                      (5th century BC = 500..401 BC, astronomical -499..-400).
- a month `April 1650`, `Apr. 1650`, and a day `12 April 1650`, `12th of April 1650`,
  `April 12, 1650`; month names in full or as three letters (and `Sept`).
"""
from __future__ import annotations

import re
from typing import Callable

from ..calendar import astronomical_year
from ..model import Endpoint, Precision, Qualifier
from .settings import DateSettings
from .windows import MAX_YEAR_DIGITS, day, month, years

_FLAGS = re.VERBOSE | re.IGNORECASE | re.ASCII

ERA_SUFFIX = re.compile(r"""
    (?P<core>.+?)
    (?: (?<=[0-9]) | \s+ )         # 44BC or 44 BC; never inside a word
    (?P<era>
        B\.?\s?C\.?\s?E\.?         # BCE, B.C.E.
      | B\.?\s?C\.?                # BC, B.C.
      | A\.?\s?D\.?                # AD, A.D.
      | C\.?\s?E\.?                # CE, C.E.
    )
""", _FLAGS)

ERA_PREFIX = re.compile(r"""
    (?P<era> A\.?\s?D\.? | C\.?\s?E\.? )   # AD 1066, A.D. 1066, CE 1066
    \s*
    (?P<core>[0-9].*)                      # the era stands before a number only
""", _FLAGS)

YEAR_NUMBER = re.compile(rf"[0-9]{{1,{MAX_YEAR_DIGITS}}}")

DECADE = re.compile(r"""
    (?P<digits>[1-9][0-9]{1,2}0)   # 1650, 650, 1600: three or four digits ending in 0
    '?s                            # 1650s or 1650's
""", _FLAGS)

SHORT_DECADE = re.compile(r"""
    '?[0-9]0'?s                    # '60s, 60s: which century is not said
""", _FLAGS)

CENTURY = re.compile(r"""
    (?P<number>[0-9]{1,3})
    (?P<suffix>st|nd|rd|th)        # ordinal: 1st, 2nd, 3rd, 17th, 21st
    [\s-]*                         # 17th century, 17th-century
    (?: century | cent\.? | c\.? ) # century, cent., c.
""", _FLAGS)

_YEAR = rf"(?P<year>[0-9]{{1,{MAX_YEAR_DIGITS}}})"
_DAY = r"(?P<day>[0-9]{1,2}) (?:st|nd|rd|th)?"

MONTH_YEAR = re.compile(rf"""
    (?P<month>[a-z]+) \.? \s {_YEAR}            # April 1650, Apr. 1650
""", _FLAGS)

DAY_MONTH_YEAR = re.compile(rf"""
    {_DAY} \s (?:of\s)? (?P<month>[a-z]+) \.? ,? \s {_YEAR}   # 12 April 1650, 12th of Apr. 1650
""", _FLAGS)

MONTH_DAY_YEAR = re.compile(rf"""
    (?P<month>[a-z]+) \.? \s {_DAY} ,? \s {_YEAR}             # April 12, 1650
""", _FLAGS)

_MONTH_NAMES = ("january", "february", "march", "april", "may", "june", "july", "august",
                "september", "october", "november", "december")
MONTHS = {name: number for number, name in enumerate(_MONTH_NAMES, start=1)}
MONTHS |= {name[:3]: number for name, number in list(MONTHS.items())}
MONTHS["sept"] = 9


def read_text(text: str, settings: DateSettings) -> Endpoint | None:
    """A free-text date, or None when `text` is written in none of the forms here."""
    core, era = split_era(text)
    for form in TEXT_FORMS:
        endpoint = form(core, era, settings)
        if endpoint is not None:
            return endpoint
    return None


def split_era(text: str) -> tuple[str, str | None]:
    """(the text without its era, "BC" or "AD" or None)."""
    match = ERA_PREFIX.fullmatch(text) or ERA_SUFFIX.fullmatch(text)
    if match is None:
        return text, None
    era = "BC" if match["era"][0] in "Bb" else "AD"
    return match["core"], era


def plain_year(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    if not YEAR_NUMBER.fullmatch(core) or _is_iso_year(core, era):
        return None
    if era is None and len(core) > 4:
        raise ValueError("a year of more than four digits needs a sign (+12000) "
                         "or an era (12000 BC)")
    year = _year(core, era)
    return years(year, year, settings.calendar, Precision.YEAR)


def decade(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    match = DECADE.fullmatch(core)
    if match is None:
        return None
    number = int(match["digits"])
    if number % 100 == 0:
        first, last = _counted_years(number, number + 99, era)
        return years(first, last, settings.calendar, Precision.CENTURY)
    first, last = _counted_years(number, number + 9, era)
    return years(first, last, settings.calendar, Precision.DECADE)


def short_decade(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    if SHORT_DECADE.fullmatch(core):
        raise ValueError("a two-digit decade does not say its century; write it in full, "
                         "such as 1960s")
    return None


def century(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    match = CENTURY.fullmatch(core)
    if match is None:
        return None
    number = _ordinal(match["number"], match["suffix"])
    low, high = _century_numbers(number, settings.century)
    first, last = _counted_years(low, high, era)
    return years(first, last, settings.calendar, Precision.CENTURY,
                 {Qualifier.CONVENTION_DEPENDENT})


def month_year(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    match = MONTH_YEAR.fullmatch(core)
    if match is None or match["month"].lower() not in MONTHS:
        return None
    return month(_year(match["year"], era), MONTHS[match["month"].lower()], settings.calendar)


def day_month_year(core: str, era: str | None, settings: DateSettings) -> Endpoint | None:
    match = DAY_MONTH_YEAR.fullmatch(core) or MONTH_DAY_YEAR.fullmatch(core)
    if match is None or match["month"].lower() not in MONTHS:
        return None
    month_number = MONTHS[match["month"].lower()]
    return day(_year(match["year"], era), month_number, int(match["day"]), settings.calendar)


TextForm = Callable[[str, "str | None", DateSettings], "Endpoint | None"]
TEXT_FORMS: tuple[TextForm, ...] = (
    plain_year, decade, short_decade, century, month_year, day_month_year,
)


def _is_iso_year(core: str, era: str | None) -> bool:
    # Only ISO 8601 pads a year with zeros to four digits (0000, 0044): leave it to iso.py.
    return era is None and len(core) == 4 and core[0] == "0"


def _year(number_text: str, era: str | None) -> int:
    """Astronomical year of a year number written with an optional era."""
    number = int(number_text)
    return number if era is None else astronomical_year(number, era)


def _counted_years(low: int, high: int, era: str | None) -> tuple[int, int]:
    """First and last astronomical year of the year numbers low..high as written in `era`;
    BC numbers count backwards, so 1650..1659 BC runs from 1659 BC to 1650 BC."""
    if era == "BC":
        return astronomical_year(high, era), astronomical_year(low, era)
    return low, high


def _century_numbers(number: int, convention: str) -> tuple[int, int]:
    """The year numbers of the nth century, counted away from the epoch (AD or BC alike)."""
    if convention == "strict":
        return (number - 1) * 100 + 1, number * 100
    return max(1, (number - 1) * 100), (number - 1) * 100 + 99


def _ordinal(number_text: str, suffix: str) -> int:
    number = int(number_text)
    if number == 0:
        raise ValueError("there is no 0th century")
    expected = _ordinal_suffix(number)
    if suffix.lower() != expected:
        raise ValueError(f"write {number}{expected}, not {number}{suffix}")
    return number


def _ordinal_suffix(number: int) -> str:
    if number % 100 in (11, 12, 13):
        return "th"
    return {1: "st", 2: "nd", 3: "rd"}.get(number % 10, "th")
