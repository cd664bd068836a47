"""Years and decades as historians write them in English, read in the calendar setting
(`settings.calendar`; by default Julian before 1582-10-15, Gregorian from then on), or in the
calendar the text names. Any letter case. Each form may carry an era (`44 BC`, `44 BCE`,
`44 B.C.`, `AD 1066`, `1066 AD`, `1066 CE`), which `frame.py` takes off first.

- a year `1650`, `44`: digits alone are years AD; `0` alone is the year zero, which BC/AD
  counting lacks, read as the signed-years and year-zero settings say (signed.py); with an
  era there is no year zero (`0 BC` is refused). More than four digits need an era
  (`12,000 BC` may group thousands). Digits alone are also ISO 8601 when only ISO could mean
  them (iso.py): a year padded with zeros to four digits (`0044`), seven digits (ordinal
  `1985102`), eight (basic `19850412`). Years are numbered from the year-start setting
  (oldstyle.py).
- a dual year `1701/02`, `1699/1700` (Old Style/New Style, see oldstyle.py).
- a decade `1650s`, `1650's`: 1650..1659. BC decades count down: `1650s BC` is 1659..1650 BC.
  Three or four digits: `'60s` is refused as ambiguous.
- hundreds `1600s`, an s on a century year: some writers mean the century 1600..1699, others
  the decade 1600..1609. The hundreds setting decides (century by default, the usual meaning
  of "the 1600s" in prose), and the endpoint is `convention_dependent`. `1600s BC` is
  1699..1600 BC (or 1609..1600 BC).
Centuries and millennia are in centuries.py, months and days in months.py.
"""
from __future__ import annotations

import re

from ..calendar import JULIAN, astronomical_year
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .oldstyle import LAST_DUAL_YEAR, dual_year, dual_year_endpoint, year_window
from .reasons import Unreadable
from .settings import DateSettings
from .signed import is_zero_digits, zero_year
from .windows import MAX_YEAR_DIGITS, years

DIGITS = re.compile(rf"""
    (?P<digits>[0-9]{{1,{MAX_YEAR_DIGITS}}})     # 1650, 44, 0044, 19850412
  | (?P<grouped>[0-9]{{1,3}}(?:,[0-9]{{3}})+)  # 12,000 (with an era)
""", FLAGS)

DUAL_YEAR = re.compile(r"""
    (?P<year>[0-9]{3,4}) / (?P<next>[0-9]{1,4})   # 1701/02, 1699/1700, 1701/2
""", FLAGS)

DECADE = re.compile(r"""
    (?P<digits>[1-9][0-9]{1,2}0)   # 1650, 650, 1600: three or four digits ending in 0
    '?s                            # 1650s or 1650's
""", FLAGS)

SHORT_DECADE = re.compile(r"""
    '?[0-9]0'?s                    # '60s, 60s: which century is not said
""", FLAGS)


def read_digits(match: re.Match[str], era: str | None, marker: str | None,
                settings: DateSettings) -> Endpoint:
    if match["grouped"]:
        return _grouped_year(match["grouped"], era, marker, settings)
    digits = match["digits"]
    if era is None and len(digits) > 4:
        raise Unreadable("a year of more than four digits needs a sign (+12000) "
                         "or an era (12000 BC)", fragment=digits)
    if era is None and is_zero_digits(digits):
        return zero_year(digits, marker, settings)[0]
    return year_window(written_year(digits, era), marker or settings.reckoning, settings)


def _grouped_year(grouped: str, era: str | None, marker: str | None,
                  settings: DateSettings) -> Endpoint:
    if era is None:
        raise Unreadable("a year grouped in thousands needs an era (12,000 BC) or a sign "
                         "(-11999, +12000)", fragment=grouped)
    return year_window(written_year(grouped.replace(",", ""), era),
                       marker or settings.reckoning, settings)


def read_dual_year(match: re.Match[str], era: str | None, marker: str | None,
                   settings: DateSettings) -> tuple[Endpoint, str] | None:
    after_last_dual = int(match["year"]) + 1 > LAST_DUAL_YEAR
    if len(match["next"]) == 4 and (int(match["next"]) != int(match["year"]) + 1
                                    or after_last_dual):
        return None  # two full years that cannot be a dual year: an interval (1985/1987)
    if era == "BC":
        raise Unreadable("a dual year belongs to the Old Style of the Christian era, not BC",
                         fragment=match[0])
    return dual_year_endpoint(dual_year(match["year"], match["next"]), settings, marker), JULIAN


def read_decade(match: re.Match[str], era: str | None, marker: str | None,
                settings: DateSettings) -> Endpoint:
    number = int(match["digits"])
    calendar = marker or settings.reckoning
    if number % 100 == 0:
        return hundreds(number, era, calendar, settings)
    first, last = counted_years(number, number + 9, era)
    return years(first, last, calendar, Precision.DECADE)


def hundreds(number: int, era: str | None, calendar: str, settings: DateSettings) -> Endpoint:
    """`1600s`: the century 1600..1699 or the decade 1600..1609, as the hundreds setting says."""
    century = settings.hundreds == "century"
    first, last = counted_years(number, number + (99 if century else 9), era)
    endpoint = years(first, last, calendar, Precision.CENTURY if century else Precision.DECADE,
                     _CONVENTION)
    if trace.on:
        trace.note(f"'{number}s', an s on a century year: read as the "
                   f"{settings.hundreds} (setting hundreds = {settings.hundreds}): "
                   f"{trace.bounds(endpoint)}")
    return endpoint


_CONVENTION = (Qualifier.CONVENTION_DEPENDENT,)
# Where a text writes an s on a century year (1600s, 1700's): sources name such cells.
HUNDREDS_WRITTEN = re.compile(r"(?<![0-9])[1-9][0-9]?00'?s(?![a-z])", re.IGNORECASE)


def writes_hundreds(text: str) -> bool:
    """Whether a text holds an s on a century year, `1600s`, read by the hundreds setting."""
    return "s" in text.lower() and HUNDREDS_WRITTEN.search(text) is not None


def read_short_decade(match: re.Match[str], era: str | None, marker: str | None,
                      settings: DateSettings) -> Endpoint:
    raise Unreadable("a two-digit decade does not say its century; write it in full, "
                     "such as 1960s", fragment=match[0])


def written_year(number_text: str, era: str | None) -> int:
    """Astronomical year of a year number written with an optional era."""
    number = int(number_text)
    if era is None:
        return number
    try:
        return astronomical_year(number, era)
    except ValueError as error:
        raise Unreadable(str(error), fragment=number_text,
                         hint="1 BC is the year before AD 1" if number == 0 else None) from None


def counted_years(low: int, high: int, era: str | None) -> tuple[int, int]:
    """First and last astronomical year of the year numbers low..high as written in `era`;
    BC numbers count backwards, so 1650..1659 BC runs from 1659 BC to 1650 BC."""
    if era == "BC":
        return astronomical_year(high, era), astronomical_year(low, era)
    return low, high


YEAR_FORMS = (
    Form("year", DIGITS, read_digits),
    Form("dual year", DUAL_YEAR, read_dual_year),
    Form("decade", DECADE, read_decade),
    Form("two-digit decade", SHORT_DECADE, read_short_decade, starts="digit other"),
)
