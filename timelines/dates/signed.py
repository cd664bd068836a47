"""Years written as bare signed numbers (`-300`, `+150`) and the year 0: which count they use.

Two counts write a year before AD 1 with a minus sign (from memory: Meeus, *Astronomical
Algorithms*, ch. 7; ISO 8601-1, 4.3.2):
- BC/AD counting has no year zero: 1 BC is followed by AD 1, so -300 written for 300 BC is
  the astronomical year -299. Historians' and archaeologists' tables mostly mean this;
- astronomical counting (ISO 8601, astronomers) has one: year 0 is 1 BC and year -300 is
  301 BC.
The setting `signed_years` decides for a bare number, in text or in a number cell: "bc"
(the default: what such tables mean), a year of the calendar setting like `300 BC`; or
"astronomical", the number read as ISO 8601 (and EDTF) read a signed year: astronomical and
proleptic Gregorian, `-300` as `-0300`. A year zero-padded to four digits or more (`-0300`,
`0000`, `-01500`) is an ISO 8601 form whatever the setting (iso.py): only ISO 8601 pads a
year. Four digits with a sign and no zero (`-1500`) are ISO's too, but a table that writes
`-300` writes `-1500` the same way, so the setting reads them: one column, one count.
Whatever the setting decided is `convention_dependent`.

A year 0 (`0`, `-0`, a number cell holding 0) does not exist in BC/AD counting: it is refused
unless `year_zero` is "1bc", which reads it as 1 BC; under astronomical counting it is 1 BC.
Positive numbers (`150`, `+150`) are years AD in both counts and depend on neither setting.
"""
from __future__ import annotations

import re

from ..calendar import GREGORIAN
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .oldstyle import year_window
from .reasons import Unreadable
from .settings import DateSettings
from .windows import MAX_YEAR_DIGITS, qualified, years

SIGNED_YEAR = re.compile(rf"""
    (?P<sign>-) (?P<digits>[1-9][0-9]{{0,{MAX_YEAR_DIGITS - 1}}} | 0)   # -300, -12000, -0
  | (?P<plus>\+) (?P<short>[1-9][0-9]{{0,2}} | 0)   # +150, +0: with four digits or more
                                                   # (+1650, +12000) a sign is ISO 8601's
""", FLAGS)

SETTING = "signed-years"
ZERO_SETTING = "year-zero"
ZERO_HINT = (f"1 BC is followed by AD 1: write 1 BC or AD 1; --{ZERO_SETTING} 1bc reads 0 as "
             f"1 BC, and --{SETTING} astronomical counts a year 0 (1 BC) before AD 1")


def read_signed_year(match: re.Match[str], era: str | None, marker: str | None,
                     settings: DateSettings) -> tuple[Endpoint, str]:
    number = int(match["digits"] or match["short"])
    if number == 0:
        return zero_year(match[0], marker, settings)
    if match["plus"]:
        calendar = marker or settings.reckoning
        return year_window(number, calendar, settings), calendar
    return negative_year(number, match[0], marker, settings)


def negative_year(number: int, written: str, marker: str | None,
                  settings: DateSettings) -> tuple[Endpoint, str]:
    """`-300` (`number` 300) and the calendar it was read in: 300 BC in the calendar setting
    when signed_years is "bc", else the ISO 8601 year -0300, which is 301 BC."""
    bc = settings.signed_years == "bc"
    endpoint, calendar = _year(1 - number if bc else -number, marker, settings)
    if trace.on:
        reading = (f"{number} BC, counting BC/AD with no year zero" if bc else
                   f"the astronomical year -{number} of ISO 8601, which is {number + 1} BC")
        other = f"{number + 1} BC" if bc else f"{number} BC"
        trace.note(f"{written!r}: a signed year number read as {reading} (setting {SETTING} "
                   f"= {settings.signed_years}; the other reading is {other}): "
                   f"{trace.bounds(endpoint)}")
    return endpoint, calendar


def zero_year(written: str, marker: str | None, settings: DateSettings) -> tuple[Endpoint, str]:
    """The year 0 written bare: refused in BC/AD counting unless year_zero says 1 BC."""
    astronomical = settings.signed_years == "astronomical"
    if not astronomical and settings.year_zero == "refuse":
        raise Unreadable("the year 0 does not exist in BC/AD counting", fragment=written,
                         hint=ZERO_HINT)
    endpoint, calendar = _year(0, marker, settings)
    if trace.on:
        why = (f"setting {SETTING} = astronomical: ISO 8601's year 0000" if astronomical else
               f"setting {ZERO_SETTING} = 1bc; BC/AD counting has no year 0")
        trace.note(f"{written!r}: the year 0, read as 1 BC ({why}): {trace.bounds(endpoint)}")
    return endpoint, calendar


def _year(year: int, marker: str | None, settings: DateSettings) -> tuple[Endpoint, str]:
    """An astronomical year as the setting reads it, marked as decided by it: a free-text
    year of the calendar setting (bc), or an ISO 8601 year, proleptic Gregorian."""
    if settings.signed_years == "bc":
        calendar = marker or settings.reckoning
        endpoint = year_window(year, calendar, settings)
    else:
        calendar = marker or GREGORIAN
        endpoint = years(year, year, calendar, Precision.YEAR)
    return qualified(endpoint, Qualifier.CONVENTION_DEPENDENT), calendar


def note_iso_year(year_text: str, year: int) -> None:
    """Explain a zero-padded ISO 8601 year at or before 0: astronomical, whatever the setting."""
    if trace.on and year <= 0:
        trace.note(f"{year_text!r}: an ISO 8601 year, counted astronomically as the standard "
                   f"says (year 0 is 1 BC): {1 - year} BC; the {SETTING} setting is for bare "
                   "numbers such as -300")


def is_zero_digits(digits: str) -> bool:
    """`0`, `00`, `000`: a year 0 written without ISO 8601's four digits."""
    return len(digits) < 4 and not digits.strip("0")


SIGNED_YEAR_FORMS = (
    Form("signed year number", SIGNED_YEAR, read_signed_year, takes_era=False, starts="other"),
)
