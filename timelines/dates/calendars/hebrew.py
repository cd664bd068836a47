"""The Hebrew calendar on fixed day numbers (Reingold & Dershowitz, *Calendrical
Calculations*, ch. 8: the fixed arithmetic calendar, not one of observation).

Months are numbered from Nisan (1), as R&D and the Torah number them, while the year begins
on 1 Tishri (7): Nisan 5760 falls in spring 2000, in the year that began in autumn 1999. A
leap year (7 in every 19) adds a thirteenth month, Adar II (13), after Adar I (12); in a
common year month 12 is plain Adar. Years are counted from the creation (Anno Mundi, A.M.):
1 Tishri 1 is Julian 7 October 3761 BC, R.D. -1373427.

The new year is the day of the mean conjunction (molad) of Tishri, postponed by the rules of
the fixed calendar (dehiyyot): never on a Sunday, Wednesday or Friday, and so that no year is
356 or 382 days long. Year lengths follow: 353-355 days, 383-385 in a leap year, the
difference made by Marheshvan (30 days in a long year) and Kislev (29 in a short one).
A Hebrew day runs from sunset to sunset; it is given as the civil day of its daylight.
"""
from __future__ import annotations

from functools import lru_cache

HEBREW_EPOCH = -1373427   # R.D. of 1 Tishri 1 A.M. = Julian 3761 BC October 7

NISAN, IYYAR, SIVAN, TAMMUZ, AV, ELUL = 1, 2, 3, 4, 5, 6
TISHRI, MARHESHVAN, KISLEV, TEVET, SHEVAT, ADAR, ADAR_II = 7, 8, 9, 10, 11, 12, 13

MONTH_NAMES = ("Nisan", "Iyyar", "Sivan", "Tammuz", "Av", "Elul", "Tishri", "Marheshvan",
               "Kislev", "Tevet", "Shevat", "Adar", "Adar II")


def month_name(year: int, month: int) -> str:
    """The month's name in that year: month 12 is Adar I in a leap year, Adar in a common one."""
    if month == ADAR and is_hebrew_leap_year(year):
        return "Adar I"
    return MONTH_NAMES[month - 1]


def is_hebrew_leap_year(year: int) -> bool:
    # Years 3, 6, 8, 11, 14, 17 and 19 of the 19-year (Metonic) cycle (R&D hebrew-leap-year?).
    return (7 * year + 1) % 19 < 7


def last_month_of_hebrew_year(year: int) -> int:
    return ADAR_II if is_hebrew_leap_year(year) else ADAR


def _elapsed_days(year: int) -> int:
    """Days from the epoch's eve to the eve of 1 Tishri of `year` before the postponements
    for the length of a year (R&D hebrew-calendar-elapsed-days)."""
    months_elapsed = (235 * year - 234) // 19    # 235 months in 19 years
    # A month is 29 days 12 hours 793 parts (1080 parts an hour): 13753 parts past 29 days.
    # 12084 parts (11h 204p): the molad of the epoch's Tishri (BaHaRaD, Sunday 11:11 pm)
    # counted from noon of the Sunday, so that a molad after noon puts the new year on the
    # next day (molad zaken).
    parts_elapsed = 12084 + 13753 * months_elapsed
    days = 29 * months_elapsed + parts_elapsed // 25920     # 25920 parts in a day
    # Not on a Sunday, Wednesday or Friday (lo ADU rosh): those days move on by one.
    return days + 1 if (3 * (days + 1)) % 7 < 3 else days


def _year_length_correction(year: int) -> int:
    """The days a new year is put off so that no year has 356 days or a leap year's
    predecessor 382 (R&D hebrew-year-length-correction)."""
    previous, this, following = (_elapsed_days(year - 1), _elapsed_days(year),
                                 _elapsed_days(year + 1))
    if following - this == 356:   # this year would be too long: start it two days later
        return 2
    if this - previous == 382:    # the year before would be too short: start this one later
        return 1
    return 0


@lru_cache(maxsize=1 << 12)
def hebrew_new_year(year: int) -> int:
    """R.D. of 1 Tishri of `year` (R&D hebrew-new-year)."""
    return HEBREW_EPOCH + _elapsed_days(year) + _year_length_correction(year)


def days_in_hebrew_year(year: int) -> int:
    return hebrew_new_year(year + 1) - hebrew_new_year(year)


def last_day_of_hebrew_month(year: int, month: int) -> int:
    """29 or 30 (R&D last-day-of-hebrew-month)."""
    length = days_in_hebrew_year(year)
    if month in (IYYAR, TAMMUZ, ELUL, TEVET, ADAR_II):
        return 29
    if month == ADAR and not is_hebrew_leap_year(year):
        return 29
    if month == MARHESHVAN and length % 10 != 5:    # long years: 355 or 385 days
        return 29
    if month == KISLEV and length % 10 == 3:        # short years: 353 or 383 days
        return 29
    return 30


def fixed_from_hebrew(year: int, month: int, day: int) -> int:
    """R.D. of a Hebrew date (R&D fixed-from-hebrew): the new year, then the months from
    Tishri to the one before `month`, which wrap past the end of the month count to Nisan."""
    if month < TISHRI:
        prior = [*range(TISHRI, last_month_of_hebrew_year(year) + 1), *range(NISAN, month)]
    else:
        prior = range(TISHRI, month)
    return (hebrew_new_year(year) + day - 1
            + sum(last_day_of_hebrew_month(year, earlier) for earlier in prior))


def hebrew_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the Hebrew calendar (R&D hebrew-from-fixed)."""
    # The mean year is 35975351/98496 days (235 months of 29d 12h 793p in 19 years): this
    # estimate is the year or the one before (R&D).
    year = (98496 * (fixed - HEBREW_EPOCH)) // 35975351
    while hebrew_new_year(year + 1) <= fixed:
        year += 1
    month = TISHRI if fixed < fixed_from_hebrew(year, NISAN, 1) else NISAN
    while fixed > fixed_from_hebrew(year, month, last_day_of_hebrew_month(year, month)):
        month += 1
    return year, month, fixed - fixed_from_hebrew(year, month, 1) + 1


def hebrew_year_range(year: int) -> tuple[int, int]:
    """First and last fixed day of a Hebrew year: 1 Tishri to 29 Elul."""
    return hebrew_new_year(year), hebrew_new_year(year + 1) - 1
