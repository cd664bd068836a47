"""What the readers of other calendars share: each calendar's arithmetic as one record, and
the window of a year, a month or a day in it, checked and noted for `explain`.
"""
from __future__ import annotations

import re
from collections.abc import Callable
from dataclasses import dataclass

from ...model import Endpoint, Precision
from .. import trace
from ..ordinals import ordinal_number
from ..reasons import Unreadable
from . import coptic, hebrew, islamic, republican
from .names import roman_numeral


@dataclass(frozen=True, slots=True)
class Reckoning:
    name: str                                    # the calendar's name: "islamic"
    words: str                                   # for notes: "Islamic calendar (arithmetic)"
    fixed_from: Callable[[int, int, int], int]   # (year, month, day) -> fixed day
    last_day: Callable[[int, int], int]          # (year, month) -> days in the month
    year_range: Callable[[int], tuple[int, int]]
    month_name: Callable[[int, int], str]        # (year, month) -> "Adar I"
    year_text: Callable[[int], str]              # 1200 -> "1200 AH"

    @property
    def title(self) -> str:
        return self.words.split(" calendar")[0]


def _ethiopic_year_range(year: int) -> tuple[int, int]:
    return coptic.fixed_from_ethiopic(year, 1, 1), coptic.fixed_from_ethiopic(year + 1, 1, 1) - 1


def _coptic_year_range(year: int) -> tuple[int, int]:
    return coptic.fixed_from_coptic(year, 1, 1), coptic.fixed_from_coptic(year + 1, 1, 1) - 1


ISLAMIC = Reckoning(
    "islamic", "Islamic calendar (arithmetic)", islamic.fixed_from_islamic,
    islamic.last_day_of_islamic_month, islamic.islamic_year_range,
    lambda year, month: islamic.MONTH_NAMES[month - 1], lambda year: f"{year} AH")
HEBREW = Reckoning(
    "hebrew", "Hebrew calendar", hebrew.fixed_from_hebrew, hebrew.last_day_of_hebrew_month,
    hebrew.hebrew_year_range, hebrew.month_name, lambda year: f"{year} AM")
COPTIC = Reckoning(
    "coptic", "Coptic calendar", coptic.fixed_from_coptic, coptic.last_day_of_coptic_month,
    _coptic_year_range, lambda year, month: coptic.COPTIC_MONTH_NAMES[month - 1],
    lambda year: f"{year} AM (Coptic)")
ETHIOPIC = Reckoning(
    "ethiopic", "Ethiopian calendar", coptic.fixed_from_ethiopic,
    coptic.last_day_of_coptic_month, _ethiopic_year_range,
    lambda year, month: coptic.ETHIOPIC_MONTH_NAMES[month - 1], lambda year: f"{year} E.C.")
FRENCH_REPUBLICAN = Reckoning(
    "french-republican", "French Republican calendar", republican.fixed_from_french,
    republican.last_day_of_french_month, republican.french_year_range,
    lambda year, month: republican.MONTH_NAMES[month - 1],
    lambda year: f"an {roman_numeral(year)}" if year < 4000 else f"an {year}")


def unit(reckoning: Reckoning, match: re.Match[str], year: int, month: int | None,
         day: int | None) -> tuple[Endpoint, str]:
    """The window of a year (month None), a month (day None) or a day of `reckoning`, and
    the calendar's name; Unreadable for a year 0 or a day the month lacks."""
    if year < 1:
        raise Unreadable(f"the {reckoning.title} calendar has no year {year}: it begins with "
                         f"{reckoning.year_text(1)}", fragment=match["year"])
    if month is None:
        endpoint = Endpoint(*reckoning.year_range(year), Precision.YEAR)
        what = f"year {year}"
    else:
        name, length = reckoning.month_name(year, month), reckoning.last_day(year, month)
        first = reckoning.fixed_from(year, month, 1)
        if day is None:
            endpoint = Endpoint(first, first + length - 1, Precision.MONTH)
            what = f"month {month} ({name}) of year {year}"
        elif 1 <= day <= length:
            endpoint = Endpoint.day(first + day - 1)
            what = f"day {day} of month {month} ({name}) of year {year}"
        else:
            raise Unreadable(f"day {day} does not exist in {name} {reckoning.year_text(year)} "
                             f"(it has {length} days)", fragment=_day_text(match))
    if trace.on:
        trace.note(f"{match[0]}: {reckoning.words}, {what}: {trace.bounds(endpoint)}")
    return endpoint, reckoning.name


def _day_text(match: re.Match[str]) -> str:
    """The day as written: `30`, the `6` of `6e jour complémentaire`, or the whole date."""
    written = match.groupdict()
    return written.get("day") or written.get("number") or written.get("festival") or match[0]


def written_day(match: re.Match[str]) -> int | None:
    """The day number of `12` or `12th`; None when the text writes no day."""
    if match["day"] is None:
        return None
    if match["suffix"]:
        return ordinal_number(match["day"], match["suffix"], "day")
    return int(match["day"])


def no_marker(marker: str | None, reckoning: Reckoning) -> None:
    """Refuse Julian, Gregorian, O.S. or N.S. beside a date that names its own calendar."""
    if marker is not None:
        raise Unreadable(f"a date of the {reckoning.title} calendar cannot also be "
                         f"{marker.capitalize()}", fragment=marker,
                         hint=f"leave out {marker.capitalize()}")

