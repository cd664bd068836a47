"""Months, days and seasons in free text, in the calendar setting or the one the text names.

- a month `April 1650`, `Apr. 1650`, `Apr-1650`, `April, 1650`, `1650 April`;
- a day `12 April 1650`, `12th of April, 1650`, `12-Apr-1650`, `April 12, 1650`,
  `April 12th 1650`, `1650 April 12`, with an optional day of the week that must agree
  (`Friday 12 April 1985`);
- month names in full, as three letters, `Sept`, `Febr`, and the old `7ber`..`10ber`, `Xber`
  (September..December) of parish registers;
- numeric `25/12/1650`, `12/25/1650`, `25.12.1650`, `25-12-1650`, `1650/12/25`, and `12/1650`.
  When both of the first two numbers could be the month (`03/04/1650`) the `day_first`
  setting decides (the result is then `convention_dependent`); unset, it is an error naming
  both readings. Dots are read day first, as the countries that write them do (common
  practice, no source). Two-digit years are refused: they do not say their century;
- seasons `spring 1650`, `winter 1650/51` (the winter from December 1650) and quarters
  `Q2 1650`, `1650 Q2`. Season months follow the hemisphere setting (northern: spring
  March-May, summer June-August, autumn September-November, winter December-February of
  the next year) and are `convention_dependent`.
A year may be a dual year (`12 February 1701/02`): see oldstyle.py.
"""
from __future__ import annotations

import re
from functools import lru_cache

from ..calendar import JULIAN, weekday_from_fixed
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .oldstyle import day_endpoint, dual_year, month_window, names_next_year, within_dual
from .ordinals import ordinal_number
from .reasons import Unreadable, closest_word
from .seasons import consecutive_months, season_endpoint
from .settings import DateSettings
from .text import written_year

_MONTH_NAMES = ("january", "february", "march", "april", "may", "june", "july", "august",
                "september", "october", "november", "december")
MONTHS = {name: number for number, name in enumerate(_MONTH_NAMES, start=1)}
MONTHS |= {name[:3]: number for name, number in list(MONTHS.items())}
MONTHS |= {"sept": 9, "febr": 2, "7ber": 9, "8ber": 10, "9ber": 11, "10ber": 12, "xber": 12}
# The names as one alternative per month, shared prefixes written once (jan(?:uary)?): each
# name is tried once, which keeps a text that holds no month name quick to refuse.
MONTH_NAMES_PATTERN = (r"(?:jan(?:uary)?|feb(?:r(?:uary)?|ruary)?|mar(?:ch)?|apr(?:il)?|may"
                       r"|june?|july?|aug(?:ust)?|sep(?:t(?:ember)?|tember)?|oct(?:ober)?"
                       r"|nov(?:ember)?|dec(?:ember)?|[789]ber|10ber|xber)")
_MONTH = rf"(?P<month>{MONTH_NAMES_PATTERN})\.?"

_WEEKDAY_NAMES = ("monday", "tuesday", "wednesday", "thursday", "friday", "saturday", "sunday")
WEEKDAYS = {name: number for number, name in enumerate(_WEEKDAY_NAMES, start=1)}
WEEKDAYS |= {name[:3]: number for name, number in list(WEEKDAYS.items())}
_WEEKDAY = ("(?:(?P<weekday>" + "|".join(sorted(WEEKDAYS, key=len, reverse=True))
            + r")\.?,?\s+)?")

_YEAR = r"(?P<year>[0-9]{1,12}+)(?:/(?P<next>[0-9]{1,4}+))?"  # 1650, or dual 1701/02
_DAY = r"(?P<day>[0-9]{1,2}+)(?P<suffix>st|nd|rd|th)?"

MONTH_YEAR = re.compile(rf"""
    {_MONTH} (?:[\s,/-]+|(?<=\.)) (?:of\s+)? {_YEAR}      # April 1650, Apr-1650, April of 1650
""", FLAGS)

YEAR_MONTH = re.compile(rf"""
    (?P<year>[0-9]{{3,4}}) ,?\s+ {_MONTH}                  # 1650 April
""", FLAGS)

DAY_MONTH_YEAR = re.compile(rf"""
    {_WEEKDAY} {_DAY} (?:\s+of)? [\s/.-]* {_MONTH} ,? [\s/.-]* {_YEAR}
    # 12 April 1650, 12th of April, 1650, 12-Apr-1650, 12/Apr/1650
""", FLAGS)

MONTH_DAY_YEAR = re.compile(rf"""
    {_WEEKDAY} {_MONTH} [\s-]* {_DAY} ,? \s+ {_YEAR}      # April 12, 1650; April 12th 1650
""", FLAGS)

YEAR_MONTH_DAY = re.compile(rf"""
    (?P<year>[0-9]{{3,4}}) ,?\s+ {_MONTH} ,?\s+ {_DAY}     # 1650 April 12
""", FLAGS)

NUMERIC_DATE = re.compile(r"""
    (?P<first>[0-9]{1,2}) (?P<separator>[/.-]) (?P<second>[0-9]{1,2})
    (?P<separator_2>[/.-]) (?P<year>[0-9]{2,4})            # 25/12/1650, 03.04.1650
  | (?P<long_year>[0-9]{3,4}) / (?P<month_2>[0-9]{1,2}) / (?P<day_2>[0-9]{1,2})   # 1650/12/25
""", FLAGS)

NUMERIC_MONTH = re.compile(r"""
    (?P<month>[0-9]{1,2}) [/.] (?P<year>[0-9]{4})          # 12/1650, 04.1650
""", FLAGS)

SEASON_YEAR = re.compile(rf"""
    (?P<season>spring|summer|autumn|fall|winter) (?:\s+of)? ,?\s+ {_YEAR}   # spring 1650
""", FLAGS)

QUARTER_YEAR = re.compile(r"""
    Q(?P<quarter>[1-4]) [\s-]* (?P<year>[0-9]{1,4})        # Q2 1650
  | (?P<year_first>[0-9]{1,4}) [\s-]* Q(?P<quarter_2>[1-4])   # 1650 Q2, 1650-Q2
""", FLAGS)

NAMED_MONTH_HINT = "a month is written April 1650 or Apr. 1650"


def read_month_year(match: re.Match[str], era: str | None, marker: str | None,
                    settings: DateSettings) -> Endpoint:
    month = MONTHS[match["month"].lower()]
    if "next" not in match.re.groupindex:
        return month_window(written_year(match["year"], era), month,
                            marker or settings.reckoning, settings)
    return _in_year(match, era, marker, settings,
                    lambda year, calendar: month_window(year, month, calendar, settings))


def read_day(match: re.Match[str], era: str | None, marker: str | None,
             settings: DateSettings) -> Endpoint:
    month = MONTHS[match["month"].lower()]
    day_number = _day_number(match)
    result = _in_year(match, era, marker, settings, lambda year, calendar: day_endpoint(
        year, month, day_number, calendar, settings))
    if match["weekday"]:
        _check_weekday((result[0] if type(result) is tuple else result).earliest,
                       match["weekday"])
    return result


def _in_year(match: re.Match[str], era: str | None, marker: str | None, settings: DateSettings,
             unit) -> Endpoint | tuple[Endpoint, str]:
    """The unit in a plain year, or in the New Style year of a dual year (Julian)."""
    if match["next"] is None:
        return unit(written_year(match["year"], era), marker or settings.reckoning)
    new_year = dual_year(match["year"], match["next"])
    if marker not in (None, JULIAN):
        raise Unreadable("a dual year belongs to the Old Style (Julian) calendar",
                         fragment=match["next"])
    endpoint = within_dual(unit(new_year, JULIAN), new_year, settings, match[0])
    if trace.on:
        trace.note(f"dual year {match['year']}/{match['next']}: Old Style {match['year']}, New "
                   f"Style {new_year}, read in the Julian calendar: {trace.bounds(endpoint)}")
    return endpoint, JULIAN


def _day_number(match: re.Match[str]) -> int:
    if match["suffix"]:
        return ordinal_number(match["day"], match["suffix"], "day")
    return int(match["day"])


def _check_weekday(fixed: int, written: str) -> None:
    actual = weekday_from_fixed(fixed)
    if WEEKDAYS[written.lower()] != actual:
        raise Unreadable(f"that day was a {_WEEKDAY_NAMES[actual - 1].capitalize()}, "
                         f"not a {_WEEKDAY_NAMES[WEEKDAYS[written.lower()] - 1].capitalize()}",
                         fragment=written, hint="check the day, month and year")


def read_year_month_day(match: re.Match[str], era: str | None, marker: str | None,
                        settings: DateSettings) -> Endpoint:
    year = written_year(match["year"], era)
    month = MONTHS[match["month"].lower()]
    return day_endpoint(year, month, _day_number(match), marker or settings.reckoning, settings)


def read_numeric_date(match: re.Match[str], era: str | None, marker: str | None,
                      settings: DateSettings) -> Endpoint:
    calendar = marker or settings.reckoning
    if match["long_year"]:
        year = written_year(match["long_year"], era)
        return day_endpoint(year, _month(match["month_2"]), int(match["day_2"]), calendar,
                            settings)
    if match["separator"] != match["separator_2"]:
        raise Unreadable("the day, month and year are separated by different marks",
                         fragment=match[0], hint="write 25/12/1650 or 25.12.1650")
    if len(match["year"]) == 2:
        raise Unreadable("a two-digit year does not say its century", fragment=match["year"],
                         hint=f"write the year in full, such as 16{match['year']}")
    day, month, dependent = _day_and_month(match, settings)
    endpoint = day_endpoint(written_year(match["year"], era), month, day, calendar, settings)
    if dependent:
        return Endpoint(endpoint.earliest, endpoint.latest, Precision.DAY,
                        endpoint.qualifiers | {Qualifier.CONVENTION_DEPENDENT})
    return endpoint


def _day_and_month(match: re.Match[str], settings: DateSettings) -> tuple[int, int, bool]:
    """(day, month, whether a convention decided) of `first/second/year`."""
    first, second = int(match["first"]), int(match["second"])
    if first == second or max(first, second) > 12:
        # At most one of the two can be a month: no convention needed.
        day, month = (first, second) if second <= 12 else (second, first)
        return day, _month(str(month)), False
    if match["separator"] == ".":
        _note_order("dots are written day first (common practice)", first, second)
        return first, second, True
    if settings.day_first is None:
        raise Unreadable(
            f"{match[0]} could be {first} {_MONTH_NAMES[second - 1].capitalize()} or "
            f"{_MONTH_NAMES[first - 1].capitalize()} {second}", fragment=match[0],
            hint="set day-first (yes: day/month/year, no: month/day/year) or write the "
                 "month as a word")
    day, month = (first, second) if settings.day_first else (second, first)
    _note_order(f"setting day-first = {'yes' if settings.day_first else 'no'}", day, month)
    return day, month, True


def _note_order(rule: str, day: int, month: int) -> None:
    if trace.on:
        trace.note(f"numeric date read as day {day}, month {month} ({rule})")


def _month(text: str) -> int:
    number = int(text)
    if not 1 <= number <= 12:
        raise Unreadable(f"month {number} does not exist", fragment=text)
    return number


def read_numeric_month(match: re.Match[str], era: str | None, marker: str | None,
                       settings: DateSettings) -> Endpoint:
    year = written_year(match["year"], era)
    return month_window(year, _month(match["month"]), marker or settings.reckoning, settings)


def read_season(match: re.Match[str], era: str | None, marker: str | None,
                settings: DateSettings) -> Endpoint:
    season = match["season"].lower()
    year = written_year(match["year"], era)
    if match["next"] is not None:
        if season != "winter" or not names_next_year(match["year"], match["next"]):
            raise Unreadable("only a winter is written with two years (winter 1650/51)",
                             fragment=match[0])
    return season_endpoint(year, season, marker or settings.reckoning, settings)


def read_quarter(match: re.Match[str], era: str | None, marker: str | None,
                 settings: DateSettings) -> Endpoint:
    quarter = int(match["quarter"] or match["quarter_2"])
    year = written_year(match["year"] or match["year_first"], era)
    return consecutive_months(year, 3 * quarter - 2, 3, marker or settings.reckoning)


def misspelt_month(text: str) -> tuple[str, str] | None:
    """(the word, a hint) for `Aprl 1650` or `12 Aprl 1650`: the nearest month name, if near."""
    for word in re.findall(r"[a-z]{3,}", text, re.IGNORECASE | re.ASCII):
        if word.lower() in MONTHS:
            continue
        close = _nearest_month(word.lower())
        if close:
            return word, f"did you mean {close.capitalize()}?"
    return None


@lru_cache(maxsize=1 << 12)
def _nearest_month(word: str) -> str | None:
    # A column's notes repeat their words; the string comparison is the cost of an error.
    return closest_word(word, _MONTH_NAMES)


MONTH_FORMS = (
    Form("month", MONTH_YEAR, read_month_year, starts="digit letter"),
    Form("month", YEAR_MONTH, read_month_year),
    Form("day", DAY_MONTH_YEAR, read_day, starts="digit letter"),
    Form("day", MONTH_DAY_YEAR, read_day, starts="digit letter"),
    Form("day", YEAR_MONTH_DAY, read_year_month_day),
    Form("numeric date", NUMERIC_DATE, read_numeric_date),
    Form("numeric month", NUMERIC_MONTH, read_numeric_month),
    Form("season", SEASON_YEAR, read_season, starts="letter"),
    Form("quarter", QUARTER_YEAR, read_quarter, starts="digit letter"),
)
