"""Conventions that practitioners settle differently. Each is a setting with a documented
default (docs/dates.md); a result that depended on one carries `convention_dependent`."""
from __future__ import annotations

from dataclasses import dataclass

from ..calendar import CALENDARS, HISTORICAL


@dataclass(frozen=True, slots=True)
class DateSettings:
    # Calendar of free-text dates: "historical" (Julian before 1582-10-15, Gregorian from
    # then on), "gregorian" or "julian". ISO 8601 forms are always proleptic Gregorian.
    calendar: str = HISTORICAL
    # How far "c." / "~" widens a value on each side, in years, by the value's precision.
    # Day and month precision widen by days. Common practice, no source.
    circa_days_for_day: int = 15
    circa_days_for_month: int = 31
    circa_years_for_year: int = 5
    circa_years_for_decade: int = 5
    circa_years_for_century: int = 25
    # "17th century": "common" = 1600-1699 (usage of most catalogues), "strict" = 1601-1700.
    century: str = "common"
    # "before 1700": "exclusive" ends on 1699-12-31; "inclusive" ends on 1700-12-31.
    before_after: str = "exclusive"
    # Numeric day/month order for 03/04/1650: None = refuse when ambiguous, True, False.
    day_first: bool | None = None

    def __post_init__(self) -> None:
        if self.calendar not in CALENDARS:
            raise ValueError(f"calendar must be one of {', '.join(CALENDARS)}, not {self.calendar!r}")
        if self.century not in ("common", "strict"):
            raise ValueError(f"century must be 'common' or 'strict', not {self.century!r}")
        if self.before_after not in ("exclusive", "inclusive"):
            raise ValueError(f"before_after must be 'exclusive' or 'inclusive', not {self.before_after!r}")


DEFAULT_SETTINGS = DateSettings()
