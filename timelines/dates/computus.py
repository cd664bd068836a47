"""The computus: the day of Easter in the Julian and the Gregorian calendars, as fixed days.

Easter Day is the first Sunday after the paschal full moon, the first ecclesiastical full moon
on or after 21 March. The moon is not observed but read from a 19-year table (the Metonic
cycle): the year's place in the cycle is its golden number, and the moon's age on a set day
its epact. Both rules are Reingold & Dershowitz, *Calendrical Calculations* (3rd ed.,
ch. 8 "Ecclesiastical calendars", from memory): `julian_easter` is their "orthodox Easter",
the Alexandrian computus Rome followed from the sixth century; `gregorian_easter` their
"Easter", the tables of the 1582 reform (Clavius), which add a solar and a lunar correction.
Years are astronomical (year 0 = 1 BC), as everywhere in the model.

`movable_feast(year, offset, calendar)` is the day `offset` days from a year's Easter in the
readers' calendar. In a historical reckoning the Julian computus holds until the reform: a
feast is reckoned by the Julian rule if its Julian day falls before the reform's first
Gregorian day, else by the Gregorian rule. So in the reform year of the papal reckoning,
1582, Easter was still Julian (15 April, Julian), the reform coming in October; in Britain
(reform 14 September 1752) every movable feast of 1752 is Julian and of 1753 Gregorian.
Churches did not always follow their state's civil calendar (the Orthodox churches kept the
Julian Easter after 1918 and 1923; Protestant Germany and Sweden reckoned Easter
astronomically for some years after 1700, from memory): name the calendar in the text
(`Easter 1920 Julian`) where the church's rule is wanted.

`feast_in_year` is the feast a written year names, with the year-start setting: the feast in
the civil year as numbered. With years from 25 March (Lady Day) an Easter on 22-24 March
belongs to the written year before, so that a written year may hold no Easter or two (and
more often no Palm Sunday or two): both are refused, naming the days, since either reading
would be a guess. A feast that fell in another year than the same number counted from
1 January is `convention_dependent`, as oldstyle.py marks fixed days. Movable feasts before
AD 326 are refused: no common computus was kept before the Council of Nicaea (325), nor
everywhere for centuries after (Northumbria followed Rome from the Synod of Whitby, 664;
from memory).
"""
from __future__ import annotations

from ..calendar import (GREGORIAN, JULIAN, fixed_from_gregorian, fixed_from_julian,
                        iso_from_fixed, iso_from_fixed_julian, reform_of)
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .oldstyle import LAST_DUAL_YEAR, year_window
from .reasons import Unreadable
from .settings import DateSettings

_APRIL = 4
FIRST_COMPUTUS_YEAR = 326   # the year after the Council of Nicaea
_CONVENTION = frozenset({Qualifier.CONVENTION_DEPENDENT})


def golden_number(year: int) -> int:
    """The year's place in the 19-year lunar cycle, 1..19 (1 BC had golden number 1)."""
    return year % 19 + 1


def julian_easter(year: int) -> int:
    """Fixed day of Easter Day by the Julian computus (R&D, "orthodox Easter")."""
    # The epact shifted so that the paschal full moon is 19 April minus it: each year of the
    # cycle the moon's age grows by 11 days (365 days less 12 lunar months of 29.5 days).
    shifted_epact = (14 + 11 * (golden_number(year) - 1)) % 30
    # The paschal full moon: 21 March .. 18 April in the Julian calendar.
    paschal_moon = fixed_from_julian(year, _APRIL, 19) - shifted_epact
    return sunday_after(paschal_moon)


def gregorian_easter(year: int) -> int:
    """Fixed day of Easter Day by the Gregorian computus (R&D, "Easter")."""
    century = year // 100 + 1
    shifted_epact = (
        14 + 11 * (golden_number(year) - 1)  # the Julian epact, as above
        - 3 * century // 4                   # solar equation: the leap days the Gregorian
                                             # calendar leaves out (three centuries in four)
        + (5 + 8 * century) // 25            # lunar equation: the 19-year cycle runs ahead of
                                             # the moon by about 8 days in 2,500 years
    ) % 30
    # Clavius's two exceptions, each moving the paschal moon one day earlier: a shifted
    # epact of 0 (epact 24) would put it on 19 April, past the Julian limit of 18 April; a
    # shifted epact of 1 (epact 25) in a year of golden number 12 or more would give it the
    # 18 April that the moved epact 24 already holds in the same 19-year cycle.
    adjusted_epact = (shifted_epact + 1 if shifted_epact == 0
                      or (shifted_epact == 1 and golden_number(year) > 11) else shifted_epact)
    paschal_moon = fixed_from_gregorian(year, _APRIL, 19) - adjusted_epact
    return sunday_after(paschal_moon)


def sunday_after(fixed: int) -> int:
    """The first Sunday strictly after a fixed day (R.D. 0 was a Sunday, so Sundays are the
    multiples of 7): Easter is never on the full moon itself."""
    return fixed + 7 - fixed % 7


def easter(year: int, calendar: str) -> int:
    """Fixed day of Easter Day in `year` as the readers' `calendar` reckons it: the Julian
    computus in the Julian calendar, the Gregorian in the (proleptic) Gregorian calendar, and
    in a historical reckoning the one in force (`movable_feast`)."""
    return movable_feast(year, 0, calendar)[0]


def movable_feast(year: int, offset: int, calendar: str) -> tuple[int, str]:
    """(fixed day, JULIAN or GREGORIAN: the computus used) of the feast `offset` days from
    Easter Day of `year`. In a historical reckoning the Julian rule holds for a feast whose
    Julian day falls before the reform; raises Unreadable for a feast whose Julian day falls
    after the reform and whose Gregorian day before it: neither rule was in force on its day."""
    reform = reform_of(calendar)
    if reform is None:
        computus = julian_easter if calendar == JULIAN else gregorian_easter
        return computus(year) + offset, calendar
    julian_day = julian_easter(year) + offset
    if julian_day < reform.first_day:
        return julian_day, JULIAN
    gregorian_day = gregorian_easter(year) + offset
    if gregorian_day >= reform.first_day:
        return gregorian_day, GREGORIAN
    raise Unreadable(
        f"the reform of {iso_from_fixed(reform.first_day)} falls between this feast's Julian "
        f"day ({iso_from_fixed_julian(julian_day)} Julian, after the reform) and its Gregorian "
        f"day ({iso_from_fixed(gregorian_day)}, before it): neither computus held on its day",
        hint="write the calendar the church kept after the year (Julian, Gregorian)")


def feast_in_year(name: str, offset: int, year: int, calendar: str,
                  settings: DateSettings | None = None) -> Endpoint:
    """The day of the feast `offset` days from Easter Day in the written `year`, numbered
    from the year-start setting (None: years from 1 January); raises Unreadable for a year
    before AD 326 and for a written year that holds no such feast or two (module docstring)."""
    if year < FIRST_COMPUTUS_YEAR:
        raise Unreadable(f"{name} before AD {FIRST_COMPUTUS_YEAR} has no agreed day: the "
                         "churches reckoned Easter differently before the Council of Nicaea",
                         hint="write the day, or the year alone")
    if settings is None or settings.year_start == "01-01":
        fixed, computus = movable_feast(year, offset, calendar)
        _note(name, offset, year, fixed, computus, calendar)
        return Endpoint.day(fixed)
    written = year_window(year, calendar, settings)
    # A year that begins in January..June ends in the next modern year; one that begins in
    # July..December began in the modern year before (oldstyle.py).
    later = settings.year_start_month_day[0] < 7
    modern_years = (year, year + 1) if later else (year - 1, year)
    days = [(modern, *movable_feast(modern, offset, calendar)) for modern in modern_years]
    inside = [day for day in days if written.earliest <= day[1] <= written.latest]
    if len(inside) != 1:
        raise _not_one(name, year, days, len(inside), settings)
    modern, fixed, computus = inside[0]
    _note(name, offset, year, fixed, computus, calendar)
    if modern == year:
        return Endpoint.day(fixed)
    return Endpoint(fixed, fixed, Precision.DAY, _CONVENTION)


def _not_one(name: str, year: int, days, found: int, settings: DateSettings) -> Unreadable:
    shown = " and ".join(f"{_day_words(fixed, computus)} (the feast of {modern} counted from "
                         "1 January)" for modern, fixed, computus in days)
    what = f"no {name}" if found == 0 else f"two days of {name}"
    # The day before the year began (missing) or after it ended (the second) has a dual year.
    modern = year if found == 0 else year + 1
    dual = (f", or the dual year ({name} {modern - 1}/{modern % 100:02d})"
            if modern <= LAST_DUAL_YEAR else "")
    return Unreadable(f"the year {year}, counted from {settings.year_start} (setting "
                      f"year-start), holds {what}: {shown}",
                      hint=f"write the day{dual}; if the source counts years from 1 January, "
                           "set year-start 01-01")


def _note(name: str, offset: int, year: int, fixed: int, computus: str, calendar: str) -> None:
    """`Ash Wednesday 1700: Gregorian computus (after the reform day 1582-10-15), Easter Day
    -46 days: 1700-02-24`."""
    if trace.on:
        days = f", Easter Day {offset:+d} days" if offset else ""
        reform = reform_of(calendar)
        why = (f"the {calendar} calendar" if reform is None else
               f"{'before' if computus == JULIAN else 'after'} the reform day "
               f"{iso_from_fixed(reform.first_day)}")
        trace.note(f"{name} {year}: {computus.capitalize()} computus ({why}){days}: "
                   f"{_day_words(fixed, computus)}")


def _day_words(fixed: int, computus: str) -> str:
    """A day in the calendar its computus reckons in, with its ISO 8601 (Gregorian) date."""
    if computus == JULIAN:
        return f"{iso_from_fixed_julian(fixed)} Julian = {iso_from_fixed(fixed)}"
    return iso_from_fixed(fixed)
