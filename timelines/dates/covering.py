"""Covering dates: a single value in a span column is a span over its whole unit.

An archivist's covering dates (ISAD(G) 3.1.3, "Date(s)", from memory) give the extent of the
material: a file dated `1650` runs through 1650, one dated `19th century` through the century.
So in a `when` column a single value that names a unit (a year, month, season, decade,
century, millennium, or a part of one: `early 17th century`) is read as the span from the
unit's first day to its last, all of it certain: start `[1650-01-01]`, end `[1650-12-31]`.

- `c. 1650`: the covering span of 1650 with each of its two ends approximate: each end's
  window is that end's day widened as circa widens the value (the circa setting of the
  value's precision: years, or days for a month or season), so the start lies in
  1645-01-01 .. 1655-01-01 and the end in 1645-12-31 .. 1655-12-31. The possible extent is the point reading's window (1645-1655);
  the certain core is empty, as nothing of "about 1650" is certain; each end keeps the unit's
  boundary as its likely day. A century widened by 25 years keeps a core (`c. 17th century`:
  1625-1675).
- `1650?`, `1701/02`, `fl. 1650`, `1650s`: the bounds are the value's own; covered the same way.
- Values that do not name a unit stay what they were, a moment somewhere in a window: an
  explicit day, `before 1700` and `after 1650` (bounds, not units), `between 1650 and 1660`
  and `1650 or 1651` and sets (one date of several), unspecified digits `198X` (one year not
  written), ages and error terms (`65.5 Ma`, `1650 ± 10`: measurements with a likely day).
- A range or an ISO 8601 interval is already a span: it is not changed.

The single-value setting `moment` turns all this off (each value a moment in its window).
"""
from __future__ import annotations

from collections.abc import Callable
from dataclasses import replace

from ..calendar import days_in_month
from ..model import Endpoint, Precision, Qualifier, Span
from .settings import DateSettings
from .windows import circa_amount, date_of, day_fixed

# Qualifiers that say a value is not the extent of a unit: a bound, one of several dates,
# unspecified digits, or a side with no bound.
_NOT_A_UNIT = frozenset({
    Qualifier.BEFORE, Qualifier.AFTER, Qualifier.ONE_OF, Qualifier.ALL_OF,
    Qualifier.UNSPECIFIED, Qualifier.OPEN_START, Qualifier.OPEN_END, Qualifier.UNKNOWN_START,
    Qualifier.UNKNOWN_END,
})
_MEAN_YEAR_DAYS = 146097 / 400   # days in 400 Gregorian years
_CIRCA_IN_DAYS = frozenset({"circa_days_for_day", "circa_days_for_month"})
_NO_CIRCA = {"circa_days_for_day": 0, "circa_days_for_month": 0, "circa_years_for_year": 0,
             "circa_years_for_decade": 0, "circa_years_for_century": 0,
             "circa_years_for_millennium": 0, "circa_percent_for_deep_time": 0}


def without_circa(settings: DateSettings) -> DateSettings:
    """The settings with every circa amount 0: `c. 1650` read as the unit it names."""
    return replace(settings, **_NO_CIRCA)


def covering(span: Span, nominal: Callable[[], Span | None], settings: DateSettings) -> Span:
    """`span` (a cell read as a point or a range) as covering dates.

    `nominal()` reads the same cell with no circa widening; it is called only for an
    approximate value, to find the unit the value names."""
    if not span.is_point or not names_a_unit(span.start):
        return span
    value = span.start
    if not value.has(Qualifier.APPROXIMATE):
        return _whole_unit(value)
    unit = nominal()
    if unit is None or not unit.is_point or not names_a_unit(unit.start):
        return span    # `c. 12 April 1650`: a day, a moment however widened
    return _approximate_unit(value, unit.start, settings)


def names_a_unit(endpoint: Endpoint) -> bool:
    """Whether a value is a unit of time that covering dates can run through."""
    return (endpoint.earliest is not None and endpoint.latest is not None
            and endpoint.earliest != endpoint.latest and endpoint.likely is None
            and endpoint.precision not in (None, Precision.DAY, Precision.DEEP_TIME)
            and endpoint.qualifiers.isdisjoint(_NOT_A_UNIT))


def _whole_unit(value: Endpoint) -> Span:
    start = Endpoint(value.earliest, value.earliest, value.precision, value.qualifiers)
    end = Endpoint(value.latest, value.latest, value.precision, value.qualifiers)
    return Span(start, end)


def _approximate_unit(value: Endpoint, unit: Endpoint, settings: DateSettings) -> Span:
    """Each boundary of the unit moved by the circa amount of the value's precision: the
    start lies between the value's earliest day and the unit's first day moved later, the
    end between the unit's last day moved earlier and the value's latest day."""
    field, amount = circa_amount(value.precision, settings)
    if field in _CIRCA_IN_DAYS:
        start_latest, end_earliest = unit.earliest + amount, unit.latest - amount
    else:
        start_latest = _moved(unit.earliest, amount, settings.reckoning)
        end_earliest = _moved(unit.latest, -amount, settings.reckoning)
    start = Endpoint(value.earliest, min(max(start_latest, unit.earliest), value.latest),
                     value.precision, value.qualifiers, unit.earliest)
    end = Endpoint(max(min(end_earliest, unit.latest), value.earliest), value.latest,
                   value.precision, value.qualifiers, unit.latest)
    return Span(start, end)


def _moved(day: int, years: int, calendar: str) -> int:
    """The same day of the month `years` later (earlier when negative), as `calendar` writes
    dates; 29 February becomes the 28th in a common year."""
    year, month, day_number = date_of(day, calendar)
    try:
        length = days_in_month(year + years, month, calendar)
        return day_fixed(year + years, month, min(day_number, length), calendar)
    except ValueError:   # a day a reform skipped: near enough in mean Gregorian years
        return day + round(years * _MEAN_YEAR_DAYS)
