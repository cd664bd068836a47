"""Conventions that practitioners settle differently. Each is a setting with a documented
default (docs/dates.md); a result that depended on one carries `convention_dependent`.

`options.py` gives each setting the name the command line and the config file use.
"""
from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

from ..calendar import CALENDARS, HISTORICAL

CENTURY_READINGS = ("common", "strict")
BOUND_READINGS = ("exclusive", "inclusive")
PART_READINGS = ("thirds", "overlapping")
HEMISPHERES = ("northern", "southern")
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

    def __post_init__(self) -> None:
        _check_choice("calendar", self.calendar, CALENDARS)
        _check_choice("century", self.century, CENTURY_READINGS)
        _check_choice("before_after", self.before_after, BOUND_READINGS)
        _check_choice("early_mid_late", self.early_mid_late, PART_READINGS)
        _check_choice("hemisphere", self.hemisphere, HEMISPHERES)
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

    @property
    def year_start_month_day(self) -> tuple[int, int]:
        return year_start_parts(self.year_start)


_CIRCA_FIELDS = ("circa_days_for_day", "circa_days_for_month", "circa_years_for_year",
                 "circa_years_for_decade", "circa_years_for_century",
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


def _check_choice(name: str, value: object, choices: tuple[str, ...]) -> None:
    if value not in choices:
        raise ValueError(f"{name} must be one of {', '.join(choices)}, not {value!r}")


DEFAULT_SETTINGS = DateSettings()
