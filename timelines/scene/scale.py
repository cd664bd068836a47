"""Fixed day -> page x, and axis ticks from single days to millions of years.

Positions are continuous: the fixed day number `d` as a position is the start (midnight) of that
day, and the whole day covers `[d, d + 1)`. A tick therefore sits where its unit begins: a year
tick at its 1 January, a month tick at its first day.

Units run from days (1, 2, 5, 10, 15 days: ticks on days 1, 1+s, 1+2s, ... of each month) over
months (1, 2, 3, 6) to years (1, 2, 5, 10, 20, 25, 50, 100, ... up to 10^11). `ticks` takes the
smallest unit that gives at most `max_ticks` major ticks on the axis.

Year labels and the missing year zero. BC/BCE counting has no year zero, so an axis stepping
through astronomical multiples (-200, -100, 0, 100) would read "201 BCE, 101 BCE, 1 BCE, 100".
A historian expects round numbers on both sides of the era boundary, so under the `bce` and `bc`
styles the ticks are at:
  * BCE years that are multiples of the step: astronomical 1 - k*step ("200 BCE", "100 BCE");
  * the era boundary itself, year 1, labelled "1 CE" (or "AD 1");
  * CE years that are multiples of the step: k*step ("100", "200"), leaving out a multiple that
    falls within half a step after year 1 (with step 2, year 2) so labels do not crowd.
The intervals next to the boundary are therefore a year shorter or longer than the rest: the
price of a count without zero. The `astronomical` style has a year zero and uses plain multiples.

Calendars: `gregorian` puts years and months on the proleptic Gregorian calendar, `julian` on the
Julian, `historical` on Julian dates before 1582-10-15 and Gregorian ones after, so a year before
the reform begins on Julian 1 January, where a historian of that period expects it.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ..calendar import (
    CALENDARS, ERAS, GREGORIAN, JULIAN, PRESENT_YEAR,
    decimal_year_from_fixed, fixed_from_calendar, fixed_from_decimal_year, gregorian_from_fixed,
    julian_from_fixed, reform_day, year_text,
)

MONTH_ABBREVIATIONS = ("Jan", "Feb", "Mar", "Apr", "May", "Jun",
                       "Jul", "Aug", "Sep", "Oct", "Nov", "Dec")
# Mean Gregorian year and month, only for estimating how many ticks a unit gives.
_APPROXIMATE_DAYS = {"day": 1.0, "month": 365.2425 / 12, "year": 365.2425}


@dataclass(frozen=True, slots=True)
class TimeScale:
    """A linear map from fixed days `[start, end]` to page x `[x0, x1]` (px)."""

    start: float
    end: float
    x0: float
    x1: float

    def __post_init__(self) -> None:
        if not all(math.isfinite(v) for v in (self.start, self.end, self.x0, self.x1)):
            raise ValueError("a time scale needs finite start, end, x0 and x1")
        if not self.end > self.start:
            raise ValueError(f"the scale's end {self.end} must be after its start {self.start}")
        if not self.x1 > self.x0:
            raise ValueError(f"the scale's x1 {self.x1} must be right of its x0 {self.x0}")

    @property
    def px_per_day(self) -> float:
        return (self.x1 - self.x0) / (self.end - self.start)

    def x(self, day: float) -> float:
        return self.x0 + (day - self.start) * self.px_per_day

    def day_at(self, x: float) -> float:
        return self.start + (x - self.x0) / self.px_per_day


@dataclass(frozen=True, slots=True)
class Tick:
    day: float
    label: str       # minor ticks carry no label
    major: bool = True


@dataclass(frozen=True, slots=True)
class TickUnit:
    kind: str        # "day", "month" or "year"
    step: int

    @property
    def approximate_days(self) -> float:
        return self.step * _APPROXIMATE_DAYS[self.kind]


def _year_steps() -> list[int]:
    steps = []
    for exponent in range(12):
        steps += [m * 10 ** exponent for m in (1, 2, 5)]
        steps += [25 * 10 ** exponent]            # 25, 250, 2500: quarters of round numbers
    return sorted(steps)


UNITS: tuple[TickUnit, ...] = (
    *(TickUnit("day", s) for s in (1, 2, 5, 10, 15)),
    *(TickUnit("month", s) for s in (1, 2, 3, 6)),
    *(TickUnit("year", s) for s in _year_steps()),
)

# Minor unit under each major unit: a subdivision that lands on the major ticks too.
_MINOR_UNITS = {
    TickUnit("day", 2): TickUnit("day", 1), TickUnit("day", 5): TickUnit("day", 1),
    TickUnit("day", 10): TickUnit("day", 5), TickUnit("day", 15): TickUnit("day", 5),
    TickUnit("month", 1): TickUnit("day", 5), TickUnit("month", 2): TickUnit("month", 1),
    TickUnit("month", 3): TickUnit("month", 1), TickUnit("month", 6): TickUnit("month", 1),
    TickUnit("year", 1): TickUnit("month", 3),
}
# Year steps by mantissa; 100, 250, 5000 ... use the entry of 10, 25, 50 scaled up.
_MINOR_YEAR_STEPS = {2: 1, 5: 1, 10: 2, 20: 5, 25: 5, 50: 10}


def ticks(scale: TimeScale, *, max_ticks: int = 8, era: str = "bce",
          calendar: str = GREGORIAN, minor: bool = False) -> list[Tick]:
    """Major ticks (at most `max_ticks`) in the smallest unit that allows that many, labelled
    with `era` ("bce", "bc", "astronomical"); with `minor`, unlabelled minor ticks between."""
    _check_options(era, calendar, max_ticks)
    unit = choose_unit(scale.start, scale.end, max_ticks=max_ticks, era=era, calendar=calendar)
    majors = _unit_ticks(unit, scale.start, scale.end, era, calendar)
    if not minor:
        return majors
    minor_unit = _minor_unit(unit)
    if minor_unit is None:
        return majors
    taken = {tick.day for tick in majors}
    minors = [Tick(t.day, "", major=False)
              for t in _unit_ticks(minor_unit, scale.start, scale.end, era, calendar)
              if t.day not in taken]
    return sorted(majors + minors, key=lambda tick: tick.day)


def year_ticks(low: float, high: float, *, era: str = "bce", max_ticks: int = 8
               ) -> list[tuple[float, str]]:
    """(position, label) of the major ticks of `ticks` on an axis of decimal astronomical
    years `low..high` (`calendar.decimal_year_from_fixed`): the chart's own axis rules for
    another's axis."""
    low, high = sorted((low, high))
    start, end = fixed_from_decimal_year(low), fixed_from_decimal_year(high)
    if not end > start:
        return []
    found = ticks(TimeScale(start, end, 0.0, 1.0), max_ticks=max_ticks, era=era)
    return [(decimal_year_from_fixed(tick.day), tick.label) for tick in found]


def choose_unit(start: float, end: float, *, max_ticks: int = 8, era: str = "bce",
                calendar: str = GREGORIAN) -> TickUnit:
    """The smallest unit giving at most `max_ticks` ticks on `[start, end]`."""
    span = end - start
    for unit in UNITS:
        # Cheap estimate first: counting real ticks of a far too small unit would be slow.
        # The margin covers units with uneven spacing (days 1, 11, 21; the era boundary).
        if span / unit.approximate_days > 2 * (max_ticks + 1):
            continue
        if len(_unit_ticks(unit, start, end, era, calendar)) <= max_ticks:
            return unit
    return UNITS[-1]


def nice_domain(lo: float, hi: float, *, pad: float = 0.03, max_ticks: int = 8,
                era: str = "bce", calendar: str = GREGORIAN) -> tuple[float, float]:
    """A domain holding `[lo, hi]` padded by `pad` of its span on each side (at least half a
    day), widened to the major ticks just outside, so both ends of the axis carry a tick."""
    _check_options(era, calendar, max_ticks)
    if not (math.isfinite(lo) and math.isfinite(hi)) or hi < lo:
        raise ValueError(f"nice_domain needs finite lo <= hi, not {lo}, {hi}")
    margin = max((hi - lo) * pad, 0.5)
    low, high = lo - margin, hi + margin
    unit = choose_unit(low, high, max_ticks=max_ticks, era=era, calendar=calendar)
    # A wider domain may need a coarser unit, whose ticks lie elsewhere: snap until stable.
    # The range only grows, so the unit only coarsens, and the ladder of units is finite.
    for _ in UNITS:
        low = _tick_at_or_before(unit, low, era, calendar)
        high = _tick_at_or_after(unit, high, era, calendar)
        wider = choose_unit(low, high, max_ticks=max_ticks, era=era, calendar=calendar)
        if wider == unit:
            break
        unit = wider
    return low, high


def _tick_at_or_before(unit: TickUnit, day: float, era: str, calendar: str) -> float:
    reach = 3 * unit.approximate_days
    while True:
        found = _unit_ticks(unit, day - reach, day, era, calendar)
        if found:
            return found[-1].day
        reach *= 2


def _tick_at_or_after(unit: TickUnit, day: float, era: str, calendar: str) -> float:
    reach = 3 * unit.approximate_days
    while True:
        found = _unit_ticks(unit, day, day + reach, era, calendar)
        if found:
            return found[0].day
        reach *= 2


def _check_options(era: str, calendar: str, max_ticks: int) -> None:
    if max_ticks < 1:
        raise ValueError(f"max_ticks must be at least 1, not {max_ticks}")
    if era not in ERAS:
        raise ValueError(f"era must be one of {', '.join(ERAS)}, not {era!r}")
    if calendar not in CALENDARS:
        reform_day(calendar)           # a historical reckoning with its own reform day, or not


def _minor_unit(unit: TickUnit) -> TickUnit | None:
    if unit.kind != "year" or unit.step == 1:
        return _MINOR_UNITS.get(unit)
    mantissa, factor = unit.step, 1
    while mantissa >= 100:
        mantissa, factor = mantissa // 10, factor * 10
    return TickUnit("year", _MINOR_YEAR_STEPS[mantissa] * factor)


def _unit_ticks(unit: TickUnit, start: float, end: float, era: str, calendar: str) -> list[Tick]:
    """The ticks of one unit whose day lies in `[start, end]`, in order."""
    if end < start:
        return []
    first, last = math.floor(start), math.floor(end)
    if unit.kind == "year":
        candidates = _year_ticks(unit.step, first, last, era, calendar)
    elif unit.kind == "month":
        candidates = _month_ticks(unit.step, first, last, era, calendar)
    else:
        candidates = _day_ticks(unit.step, first, last, era, calendar)
    return [tick for tick in candidates if start <= tick.day <= end]


def _year_ticks(step: int, first: int, last: int, era: str, calendar: str) -> list[Tick]:
    years = tick_years(step, _date_from_fixed(first, calendar)[0],
                       _date_from_fixed(last, calendar)[0], era)
    return [Tick(float(fixed_from_calendar(year, 1, 1, calendar)),
                 year_text(year, era, mark_common_era=year == 1)) for year in years]


def tick_years(step: int, first: int, last: int, era: str = "bce") -> list[int]:
    """Astronomical years in `[first, last]` that carry a tick for a step of `step` years,
    following the module's rule for the era boundary (no year zero in `bce`/`bc` styles)."""
    if era == "astronomical":
        return list(range(_ceil_div(first, step) * step, last + 1, step))
    if era == "bp":   # round numbers of years before 1950
        k_low, k_high = _ceil_div(PRESENT_YEAR - last, step), (PRESENT_YEAR - first) // step
        return [PRESENT_YEAR - k * step for k in range(k_high, k_low - 1, -1)]
    # BCE side: astronomical 1 - k*step for k >= 1, within [first, last].
    k_low, k_high = max(1, _ceil_div(1 - last, step)), (1 - first) // step
    years = [1 - k * step for k in range(k_high, k_low - 1, -1)]
    if first <= 1 <= last:
        years.append(1)
    # CE side: k*step for k >= 1, dropping a multiple within half a step after year 1.
    k_low, k_high = max(1, _ceil_div(first, step)), last // step
    years += [k * step for k in range(k_low, k_high + 1) if k * step - 1 > step / 2]
    return years


def _ceil_div(a: int, b: int) -> int:
    return -(-a // b)


def _month_ticks(step: int, first: int, last: int, era: str, calendar: str) -> list[Tick]:
    year, month, _ = _date_from_fixed(first, calendar)
    last_year, last_month, _ = _date_from_fixed(last, calendar)
    found = []
    while (year, month) <= (last_year, last_month):
        if (month - 1) % step == 0:
            day = fixed_from_calendar(year, month, 1, calendar)
            label = f"{MONTH_ABBREVIATIONS[month - 1]} {_date_year_text(year, era)}"
            found.append(Tick(float(day), label))
        year, month = (year + 1, 1) if month == 12 else (year, month + 1)
    return found


def _day_ticks(step: int, first: int, last: int, era: str, calendar: str) -> list[Tick]:
    found = []
    for fixed in range(first, last + 1):
        year, month, day = _date_from_fixed(fixed, calendar)
        if (day - 1) % step == 0:
            label = f"{day} {MONTH_ABBREVIATIONS[month - 1]} {_date_year_text(year, era)}"
            found.append(Tick(float(fixed), label))
    return found


def _date_from_fixed(fixed: int, calendar: str) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day as `calendar` writes it (a historical reckoning is
    Julian before its reform day)."""
    if calendar == JULIAN:
        return julian_from_fixed(fixed)
    if calendar != GREGORIAN and fixed < reform_day(calendar):
        return julian_from_fixed(fixed)
    return gregorian_from_fixed(fixed)


def _date_year_text(year: int, era: str) -> str:
    # In "Apr 5" or "12 Apr 5" a bare small year reads as a day: mark CE years below 1000.
    # Days and months are never counted before present; they keep the BCE/CE labels.
    era = "bce" if era == "bp" else era
    return year_text(year, era, mark_common_era=0 < year < 1000)
