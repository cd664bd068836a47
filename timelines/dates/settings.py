"""Conventions that practitioners settle differently. Each is a setting with a documented
default (docs/dates.md); a result that depended on one carries `convention_dependent`.

`options.py` gives each setting the name the command line and the config file use.
"""
from __future__ import annotations

import datetime
from dataclasses import dataclass
from functools import lru_cache
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from .periods import PeriodTable

from ..calendar import CALENDARS, HISTORICAL, first_gregorian_day, historical_calendar

CENTURY_READINGS = ("common", "strict")
BOUND_READINGS = ("exclusive", "inclusive")
PART_READINGS = ("thirds", "overlapping")
HEMISPHERES = ("northern", "southern")
SINGLE_VALUE_READINGS = ("unit", "moment")
HUNDREDS_READINGS = ("century", "decade")
SIGNED_YEAR_READINGS = ("bc", "astronomical")
BP_READINGS = ("calendar", "radiocarbon")
CURVE_NAMES = ("intcal20", "shcal20")
YEAR_ZERO_READINGS = ("refuse", "1bc")
TODAY = "today"
# The first Gregorian day of published reforms, by name: the date that followed the last Julian
# one. From the list of adoption dates of the Gregorian calendar by country (Wikipedia,
# checked against a second table, sci.aha.ru); 1582 and 1752 also in Reingold & Dershowitz,
# *Calendrical Calculations*. Sweden's own calendar of 1700-1712 is not modelled; Prussia is
# left out (1610 and 1612 are both published).
NAMED_REFORMS = {
    "papal": "1582-10-15",               # after Julian 4 October 1582: Italy, Spain, Portugal
    "france": "1582-12-20",              # after 9 December 1582
    "protestant-germany": "1700-03-01",  # after 18 February 1700
    "denmark-norway": "1700-03-01",      # after 18 February 1700
    "britain": "1752-09-14",             # after 2 September 1752 (Calendar (New Style) Act 1750)
    "sweden": "1753-03-01",              # after 17 February 1753
    "russia": "1918-02-14",              # after 31 January 1918
    "greece": "1923-03-01",              # after 15 February 1923
}
DEFAULT_REFORM = NAMED_REFORMS["papal"]
MAX_CIRCA = 1_000_000  # years or days: far beyond any sensible widening, small enough for int64


@dataclass(frozen=True, slots=True)
class DateSettings:
    # Calendar of free-text dates: "historical" (Julian before 1582-10-15, Gregorian from
    # then on), "gregorian" or "julian". ISO 8601 forms are always proleptic Gregorian;
    # a marker in the text (Julian, O.S., Gregorian, N.S.) overrides both.
    calendar: str = HISTORICAL
    # How far "c." / "~" widens a value on each side, by the value's precision: days for a
    # day, a month or a season, years for a year, decade, century or millennium, and a
    # percentage of the age for deep time. Common practice, no source.
    circa_days_for_day: int = 15
    circa_days_for_month: int = 31
    circa_years_for_year: int = 5
    circa_years_for_decade: int = 5
    circa_years_for_century: int = 25
    circa_years_for_millennium: int = 250
    circa_percent_for_deep_time: int = 10
    # "17th century": "common" = 1600-1699 (usage of most catalogues), "strict" = 1601-1700.
    # Millennia follow the same reading (2nd millennium: 1000-1999 or 1001-2000).
    century: str = "common"
    # "before 1700": "exclusive" ends on 1699-12-31; "inclusive" ends on 1700-12-31.
    # Only the bare words before/after (bef., aft., pre-, post-) follow this; "by", "not after",
    # "since", "not before" and the termini say inclusive in so many words.
    before_after: str = "exclusive"
    # Numeric day/month order for 03/04/1650: None = refuse when ambiguous, True, False.
    day_first: bool | None = None
    # early/mid/late: "thirds" splits a unit into three parts that do not overlap (a century
    # 33/34/33 years, a decade 3/4/3); "overlapping" gives each part 40% of the unit.
    early_mid_late: str = "thirds"
    # The day the year number changes in free-text dates, as "MM-DD": "01-01" (modern), or
    # e.g. "03-25" (Lady Day: England until 1752). A start from July on (e.g. "12-25") began
    # the year in the previous modern year. Dual years (1701/02) do not depend on it.
    year_start: str = "01-01"
    # Months of the seasons: ISO 8601-2 codes 21-24 and words like "spring 1650".
    hemisphere: str = "northern"
    # The first Gregorian day of the historical calendar, YYYY-MM-DD: Julian before it.
    # 1582-10-15 (the papal reform) by default; 1752-09-14 in Britain and its colonies.
    reform: str = DEFAULT_REFORM
    # A single value in a span column (`1650`, `19th century` in a when column): "unit"
    # covers the whole unit (1650-01-01 .. 1650-12-31, all of it certain); "moment" reads it
    # as one moment somewhere in the unit. An explicit day is a moment either way.
    single_value: str = "unit"
    # `1600s`, an s on a century year: "century" (1600-1699) or "decade" (1600-1609).
    hundreds: str = "century"
    # The day `present`, `now`, `today`, `ongoing` in an end cell stand for: "today" (the
    # local date when the table is read) or YYYY-MM-DD.
    present: str = TODAY
    # A year written as a bare signed number (-300) or a number cell: "bc" counts BC/AD with
    # no year zero (-300 = 300 BC, as historians' and archaeologists' tables mean it);
    # "astronomical" counts a year 0 (-300 = 301 BC). Zero-padded ISO 8601 years (-0300) are
    # astronomical whatever this says (signed.py).
    signed_years: str = "bc"
    # A bare 0 as a year under "bc": "refuse" (the year does not exist) or "1bc".
    year_zero: str = "refuse"
    # `3450 ± 40 BP`: "calendar" years before 1950 as written, or "radiocarbon" ages to be
    # calibrated. `14C BP`, `uncal BP` and a laboratory code say radiocarbon either way (c14.py).
    bp: str = "calendar"
    # The calibration curve of radiocarbon ages that name none: IntCal20 (northern
    # hemisphere) or SHCal20 (southern); radiocarbon.py gives the citations.
    curve: str = "intcal20"
    # The languages of the words in free-text dates (languages/, translate.py): "default" is
    # English with the forms of French, German, Italian, Spanish, Dutch and Latin that no two
    # of them read differently; codes joined by commas ("fr,en") take every word of those
    # languages, the first named winning where two differ. English is always read.
    language: str = "default"
    # Event words before a date (genealogists' bapt., bur.): how many days a birth may come
    # before a baptism, and a death before a burial. The window of `bapt. 4 May 1760` is then
    # the birth's, reaching that many days earlier; 0 reads the date as written. Common
    # practice, no source: baptism within days to weeks of birth, burial within days of death.
    baptism_days: int = 30
    burial_days: int = 7
    # The user's own named periods and reigns (periods.py; `--periods FILE`): each label is
    # then a date form (`Bronze Age`, `early Bronze Age`, `reign of Aldric II`, `3 Aldric II`).
    periods: "PeriodTable | None" = None

    def __post_init__(self) -> None:
        _check_choice("calendar", self.calendar, CALENDARS)
        _check_choice("century", self.century, CENTURY_READINGS)
        _check_choice("before_after", self.before_after, BOUND_READINGS)
        _check_choice("early_mid_late", self.early_mid_late, PART_READINGS)
        _check_choice("hemisphere", self.hemisphere, HEMISPHERES)
        _check_choice("single_value", self.single_value, SINGLE_VALUE_READINGS)
        _check_choice("hundreds", self.hundreds, HUNDREDS_READINGS)
        _check_choice("signed_years", self.signed_years, SIGNED_YEAR_READINGS)
        _check_choice("year_zero", self.year_zero, YEAR_ZERO_READINGS)
        _check_choice("bp", self.bp, BP_READINGS)
        _check_choice("curve", self.curve, CURVE_NAMES)
        if self.present != TODAY:
            present_setting_day(self.present)
        if self.day_first not in (None, True, False):
            raise ValueError(f"day_first must be None, True or False, not {self.day_first!r}")
        for name in _CIRCA_FIELDS:
            value = getattr(self, name)
            if type(value) is not int or not 0 <= value <= MAX_CIRCA:
                raise ValueError(f"{name} must be a whole number from 0 to {MAX_CIRCA}, "
                                 f"not {value!r}")
        if self.circa_percent_for_deep_time > 100:
            raise ValueError("circa_percent_for_deep_time is a percentage: 0 to 100")
        year_start_parts(self.year_start)
        _check_language(self.language)
        _reckoning(self.calendar, self.reform)   # raises for a reform day that is no day

    @property
    def reckoning(self) -> str:
        """The calendar name the readers use: the calendar setting with its reform day."""
        if self.reform == DEFAULT_REFORM:
            return self.calendar
        return _reckoning(self.calendar, self.reform)

    @property
    def year_start_month_day(self) -> tuple[int, int]:
        return year_start_parts(self.year_start)


_CIRCA_FIELDS = ("baptism_days", "burial_days", "circa_days_for_day", "circa_days_for_month",
                 "circa_years_for_year", "circa_years_for_decade", "circa_years_for_century",
                 "circa_years_for_millennium", "circa_percent_for_deep_time")

# Days in each month when the year is a leap year: a year may begin on 29 February.
_LONGEST_MONTHS = (31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31)


@lru_cache(maxsize=64)
def year_start_parts(text: str) -> tuple[int, int]:
    """(month, day) of a year start written "MM-DD"; raises ValueError."""
    month_text, _, day_text = text.partition("-") if isinstance(text, str) else ("", "", "")
    if not (len(month_text) == 2 and len(day_text) == 2
            and month_text.isdigit() and day_text.isdigit()):
        raise ValueError(f"year_start is written MM-DD, such as 03-25, not {text!r}")
    month, day = int(month_text), int(day_text)
    if not 1 <= month <= 12 or not 1 <= day <= _LONGEST_MONTHS[month - 1]:
        raise ValueError(f"year_start {text!r} is not a day of the year")
    return month, day


@lru_cache(maxsize=64)
def _reckoning(calendar: str, reform: str) -> str:
    """The calendar name of the readers: a historical calendar carries its reform day."""
    if not isinstance(reform, str):
        raise ValueError(f"reform is a day written YYYY-MM-DD, not {reform!r}")
    first_day = first_gregorian_day(reform)
    return historical_calendar(first_day) if calendar == HISTORICAL else calendar


@lru_cache(maxsize=64)
def present_setting_day(text: str) -> int:
    """The fixed day of a present setting written YYYY-MM-DD (proleptic Gregorian)."""
    try:
        if isinstance(text, str) and len(text) == 10:
            return datetime.date.fromisoformat(text).toordinal()
    except ValueError:
        pass
    raise ValueError(f"present is 'today' or a day written YYYY-MM-DD, not {text!r}")


def present_day(settings: "DateSettings") -> int:
    """The fixed day `present` stands for: the present setting, or today (the local date)."""
    if settings.present == TODAY:
        return datetime.date.today().toordinal()
    return present_setting_day(settings.present)


@lru_cache(maxsize=64)
def _check_language(value: str) -> None:
    from .translate import language_codes   # the tables are read only when a text needs them
    if not isinstance(value, str):
        raise ValueError(f"language is default or codes joined by commas, not {value!r}")
    language_codes(value)


def _check_choice(name: str, value: object, choices: tuple[str, ...]) -> None:
    if value not in choices:
        raise ValueError(f"{name} must be one of {', '.join(choices)}, not {value!r}")


DEFAULT_SETTINGS = DateSettings()
