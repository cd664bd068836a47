"""ISO 8601-2 (EDTF) extensions, levels 1 and 2: qualifiers on components, unspecified digits,
sub-year groupings, long years and significant digits. Examples from ISO 8601-2:2019 and the
EDTF specification (Library of Congress, 2019), from memory.

- Qualifiers `?` (uncertain), `~` (approximate), `%` (both). On the right of a component they
  qualify it and every component to its left (`2004-06~-11`: year and month); on the left,
  that component alone (`2004-~06-11`: the month). The endpoint carries the union; an
  approximate date is widened by the circa setting of the coarsest component a `~` or `%` is
  written against (`2004-06~-11`: the month's 31 days; `2004~-06-11`: the year's 5 years;
  `2004-06-11~`: the day's 15 days, as for the whole date).
- Unspecified digits `X` anywhere, bounded to days that exist: `156X-12-25` is 1560-12-25 ..
  1569-12-25, `1985-04-3X` is 1985-04-30 (April has no 31st), `XXXX-02-29` is refused as
  saying nothing of the year. Precision: the coarsest unit with an X.
- Sub-year groupings in the month's place (of a year with unspecified digits too: `20XX-41`
  is the second half of some year 2000..2099): 21-24 spring, summer, autumn, winter (independent
  of location: read in the hemisphere setting, northern by default), 25-28 the same in the
  northern and 29-32 in the southern hemisphere; 33-36 quarters, 37-39 quadrimesters (four
  months), 40-41 semesters (six months). Months of seasons: see seasons.py.
- Long years `Y170000002`, `Y-170000002`, with an exponent `Y-17E7` (-170000000), and
  significant digits `1950S2` (a year 1900..1999, estimated 1950), `Y171010000S3`
  (171000000..171999999): the estimate is the likely day (the middle of its year).
"""
from __future__ import annotations

import re
from itertools import product
from typing import Iterator

from ..calendar import GREGORIAN, days_in_month, fixed_from_calendar, month_range, reform_of
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .reasons import Unreadable
from .seasons import consecutive_months, season_endpoint
from .settings import DateSettings
from .windows import MAX_YEAR_DIGITS, approximate, qualified, year_bounds

LONG_YEAR = re.compile(r"""
    Y (?P<sign>[+-])? (?P<digits>[0-9]{1,12})       # Y170000002, Y-170000002
    (?: E(?P<exponent>[0-9]{1,2}) )?                # Y-17E7: -17 x 10^7
    (?: S(?P<significant>[0-9]{1,2}) )?             # Y171010000S3: three significant digits
""", FLAGS)

SIGNIFICANT_YEAR = re.compile(r"""
    (?P<sign>-)? (?P<digits>[0-9]{4}) S(?P<significant>[0-9]{1,2})   # 1950S2
""", FLAGS)

_COMPONENTS = ("year", "month", "day")
_COMPONENT_PRECISION = {"year": Precision.YEAR, "month": Precision.MONTH, "day": Precision.DAY}


def with_component_marks(base: Endpoint, match: re.Match[str], settings: DateSettings,
                         calendar: str) -> Endpoint:
    """`base` qualified as the `?~%` marks around the components of an ISO date say."""
    marks = _component_marks(match)
    if not marks:
        return base
    approximate_at = [name for name, mark in marks if mark in "~%"]
    endpoint = base
    if approximate_at:
        coarsest = approximate_at[0]
        precision = _COMPONENT_PRECISION[coarsest]
        if coarsest == "month" and base.precision == Precision.SEASON:
            precision = Precision.SEASON
        endpoint = approximate(base, settings, calendar, precision)
    if any(mark in "?%" for _, mark in marks):
        endpoint = qualified(endpoint, Qualifier.UNCERTAIN)
    return endpoint


def _component_marks(match: re.Match[str]) -> list[tuple[str, str]]:
    """(component, mark) for every written mark, coarsest component first."""
    right = {"year": match["year_right"], "month": match["month_right"] or match["only_right"],
             "day": match["day_right"]}
    left = {"year": match["year_left"], "month": match["month_left"] or match["only_left"],
            "day": match["day_left"]}
    return [(name, mark) for name in _COMPONENTS for mark in (left[name], right[name]) if mark]


def unspecified(year_text: str, month_text: str, day_text: str, calendar: str) -> Endpoint:
    """The window of every existing date the digits allow, `X` standing for any digit."""
    _check_known_digit(year_text)
    earliest = _first_existing(year_text, month_text, day_text, calendar, forward=True)
    latest = _first_existing(year_text, month_text, day_text, calendar, forward=False)
    precision = _unspecified_precision(year_text, month_text)
    endpoint = Endpoint(earliest, latest, precision, frozenset({Qualifier.UNSPECIFIED}))
    if trace.on:
        trace.note(f"unspecified digits X: every existing date that "
                   f"{'-'.join(p for p in (year_text, month_text, day_text) if p)} allows: "
                   f"{trace.bounds(endpoint)}")
    return endpoint


def _check_known_digit(year_text: str) -> None:
    if year_text.lstrip("+-") == "XXXX":
        raise Unreadable("a year with no known digit says nothing", fragment=year_text,
                         hint="leave the cell empty for an unknown date")


def _unspecified_precision(year_text: str, month_text: str) -> Precision:
    digits = year_text.lstrip("+-")
    if "X" in digits:
        place = len(digits) - 1 - digits.index("X")   # 0 ones, 1 tens, 2 hundreds or more
        return (Precision.DECADE, Precision.CENTURY, Precision.MILLENNIUM)[min(place, 2)]
    return Precision.YEAR if "X" in month_text else Precision.MONTH


def _first_existing(year_text: str, month_text: str, day_text: str, calendar: str,
                    forward: bool) -> int:
    """The first (forward) or last day matching the patterns, searching in time order."""
    months = _matching(month_text, 1, 12, forward) if month_text else None
    days = _matching(day_text, 1, 31, forward) if day_text else None
    if months == [] or days == []:
        raise Unreadable(f"no {'month' if months == [] else 'day'} matches "
                         f"{month_text if months == [] else day_text}",
                         fragment=month_text if months == [] else day_text)
    for year in _matching_years(year_text, forward):
        found = _first_in_year(year, months, days, calendar, forward)
        if found is not None:
            return found
    raise Unreadable("no existing date matches these digits",
                     fragment="-".join(p for p in (year_text, month_text, day_text) if p))


def _first_in_year(year: int, months: list[int] | None, days: list[int] | None, calendar: str,
                   forward: bool) -> int | None:
    if months is None:
        return year_bounds(year, calendar)[0 if forward else 1]
    for month in months:
        length = days_in_month(year, month, calendar)
        if days is None:
            return month_range(year, month, calendar)[0 if forward else 1]
        for day in days:
            if day <= length and not _skipped_in_reform(year, month, day, calendar):
                return fixed_from_calendar(year, month, day, calendar)
    return None


def _skipped_in_reform(year: int, month: int, day: int, calendar: str) -> bool:
    reform = reform_of(calendar)
    return reform is not None and reform.last_julian < (year, month, day) < reform.first_gregorian


def _matching(pattern: str, low: int, high: int, forward: bool) -> list[int]:
    """The numbers low..high whose two digits fit `pattern`, in time order."""
    found = [n for n in range(low, high + 1)
             if all(p in ("X", d) for p, d in zip(pattern, f"{n:02d}"))]
    return found if forward else found[::-1]


def _matching_years(year_text: str, forward: bool) -> Iterator[int]:
    """Years fitting `-019X`, `1X50`, in time order (a negative year counts down its digits)."""
    negative = year_text.startswith("-")
    digits = year_text.lstrip("+-")
    ascending_magnitude = forward != negative
    order = "0123456789" if ascending_magnitude else "9876543210"
    choices = [order if char == "X" else char for char in digits]
    for chosen in product(*choices):
        magnitude = int("".join(chosen))
        yield -magnitude if negative else magnitude


def sub_year(year: int, code: int, calendar: str, settings: DateSettings) -> Endpoint:
    """An ISO 8601-2 sub-year grouping, code 21..41, of `year`."""
    if code <= 32:
        hemisphere = None if code <= 24 else ("northern" if code <= 28 else "southern")
        return season_endpoint(year, _SEASONS[(code - 21) % 4], calendar, settings, hemisphere)
    first, count = _GROUPINGS[code]
    return consecutive_months(year, first, count, calendar)


def unspecified_sub_year(year_text: str, code: int, calendar: str,
                         settings: DateSettings) -> Endpoint:
    """`20XX-41`: the grouping `code` of any year the digits allow, from its first days in
    the first such year to its last days in the last (the second half of 2000 .. of 2099)."""
    _check_known_digit(year_text)
    first = sub_year(next(_matching_years(year_text, forward=True)), code, calendar, settings)
    last = sub_year(next(_matching_years(year_text, forward=False)), code, calendar, settings)
    endpoint = Endpoint(first.earliest, last.latest, _unspecified_precision(year_text, ""),
                        first.qualifiers | {Qualifier.UNSPECIFIED})
    if trace.on:
        trace.note(f"unspecified digits X: sub-year grouping {code} of every year that "
                   f"{year_text} allows: {trace.bounds(endpoint)}")
    return endpoint


_SEASONS = ("spring", "summer", "autumn", "winter")
# code -> (first month, number of months): quarters, quadrimesters, semesters
_GROUPINGS = {33: (1, 3), 34: (4, 3), 35: (7, 3), 36: (10, 3), 37: (1, 4), 38: (5, 4),
              39: (9, 4), 40: (1, 6), 41: (7, 6)}


def read_long_year(match: re.Match[str], era: str | None, marker: str | None,
                   settings: DateSettings) -> Endpoint:
    exponent = int(match["exponent"] or 0)
    if len(match["digits"].lstrip("0")) + exponent > MAX_YEAR_DIGITS:
        # Said as written: Y9E99 written out would be a hundred digits long.
        raise Unreadable(f"year {match[0]} is out of range (at most {MAX_YEAR_DIGITS} digits)",
                         fragment=match[0])
    value = int(match["digits"]) * 10 ** exponent
    return _year_estimate(-value if match["sign"] == "-" else value, match, marker)


def read_significant_year(match: re.Match[str], era: str | None, marker: str | None,
                          settings: DateSettings) -> Endpoint:
    value = int(match["digits"])
    return _year_estimate(-value if match["sign"] else value, match, marker)


def _year_estimate(year: int, match: re.Match[str], marker: str | None) -> Endpoint:
    calendar = marker or GREGORIAN
    magnitude = abs(year)
    if magnitude >= 10 ** MAX_YEAR_DIGITS:
        raise Unreadable(f"year {year} is out of range (at most {MAX_YEAR_DIGITS} digits)")
    if not match["significant"]:
        first, last = year_bounds(year, calendar)
        return Endpoint(first, last, Precision.YEAR)
    significant, written = int(match["significant"]), len(str(magnitude))
    if not 1 <= significant <= written:
        raise Unreadable(f"{year} has {written} digits, not {significant} significant ones",
                         fragment="S" + match["significant"])
    unit = 10 ** (written - significant)
    low, high = magnitude // unit * unit, magnitude // unit * unit + unit - 1
    first, last = (-high, -low) if year < 0 else (low, high)
    endpoint = Endpoint(year_bounds(first, calendar)[0], year_bounds(last, calendar)[1],
                        _precision_of_unit(unit), frozenset(),
                        sum(year_bounds(year, calendar)) // 2)
    if trace.on:
        trace.note(f"{significant} significant digits: the years {first}..{last}, estimated "
                   f"{year} (the likely day is the middle of {year}): {trace.bounds(endpoint)}")
    return endpoint


def _precision_of_unit(unit: int) -> Precision:
    return {1: Precision.YEAR, 10: Precision.DECADE, 100: Precision.CENTURY,
            1000: Precision.MILLENNIUM}.get(unit, Precision.DEEP_TIME)


EDTF_FORMS = (
    Form("ISO 8601-2 long year", LONG_YEAR, read_long_year, takes_era=False, gregorian=True,
         starts="letter"),
    Form("ISO 8601-2 year with significant digits", SIGNIFICANT_YEAR, read_significant_year,
         takes_era=False, gregorian=True, starts="digit other"),
)
