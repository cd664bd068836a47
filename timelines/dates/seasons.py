"""Three-month windows: seasons (which months, by hemisphere) and quarters.

Northern hemisphere (default), as meteorologists count them: spring March-May, summer
June-August, autumn September-November, winter December to February of the next year, so
that `winter 1650` is the winter that begins in December 1650 (common practice, no source).
The southern hemisphere is six months on. Seasons are `convention_dependent`; quarters are not.
"""
from __future__ import annotations

from ..calendar import month_range
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .settings import DateSettings


# Months of each season in the northern hemisphere; the southern is six months on.
SEASON_MONTHS = {"spring": 3, "summer": 6, "autumn": 9, "fall": 9, "winter": 12}


def consecutive_months(year: int, first_month: int, count: int, calendar: str,
                       qualifiers: frozenset[Qualifier] = frozenset()) -> Endpoint:
    """`count` months from `first_month` of `year`, running into the next year if need be."""
    last_month = first_month + count - 1
    earliest = month_range(year, first_month, calendar)[0]
    latest = month_range(year + (last_month > 12), (last_month - 1) % 12 + 1, calendar)[1]
    return Endpoint(earliest, latest, Precision.SEASON, qualifiers)


def season_endpoint(year: int, season: str, calendar: str, settings: DateSettings,
                    hemisphere: str | None = None) -> Endpoint:
    """A season's three months, in `hemisphere` or else the hemisphere setting."""
    hemisphere = hemisphere or settings.hemisphere
    first_month = SEASON_MONTHS[season]
    if hemisphere == "southern":
        first_month = (first_month + 5) % 12 + 1
    endpoint = consecutive_months(year, first_month, 3, calendar,
                                  frozenset({Qualifier.CONVENTION_DEPENDENT}))
    if trace.on:
        rule = ("setting hemisphere" if hemisphere == settings.hemisphere
                else "the code names it")
        trace.note(f"{season} {year}, {hemisphere} hemisphere ({rule}): three months from "
                   f"month {first_month}: {trace.bounds(endpoint)}")
    return endpoint
