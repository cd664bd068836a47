"""The Coptic and Ethiopian calendars on fixed day numbers (Reingold & Dershowitz,
*Calendrical Calculations*, ch. 4).

Both have twelve months of 30 days and a thirteenth of five days, six in a leap year; every
fourth year is a leap year, the year before a Julian leap year, so that each year begins on 29
or 30 August (Julian). They differ only in their epochs:
- Coptic years are counted from the era of the martyrs (Anno Martyrum, A.M.): 1 Thout 1 is
  Julian 284-08-29, R.D. 103605, the accession of Diocletian;
- Ethiopian years (E.C., the Ethiopian calendar; Amete Mihret, the year of mercy) are counted
  from Julian 8-08-29, R.D. 2796: an Ethiopian year is the Coptic year plus 276.
"""
from __future__ import annotations

COPTIC_EPOCH = 103605     # R.D. of 1 Thout 1 A.M. = Julian 284-08-29
ETHIOPIC_EPOCH = 2796    # R.D. of 1 Meskerem 1 E.C. = Julian 8-08-29

COPTIC_MONTH_NAMES = ("Thout", "Paopi", "Hathor", "Koiak", "Tobi", "Meshir", "Paremhat",
                      "Parmouti", "Pashons", "Paoni", "Epip", "Mesori", "Pi Kogi Enavot")
ETHIOPIC_MONTH_NAMES = ("Meskerem", "Tikimt", "Hidar", "Tahsas", "Tir", "Yekatit", "Megabit",
                         "Miazia", "Genbot", "Sene", "Hamle", "Nehasse", "Pagume")


def is_coptic_leap_year(year: int) -> bool:
    # Years 3, 7, 11 ... end with six extra days (R&D coptic-leap-year?); Ethiopian years alike.
    return year % 4 == 3


def last_day_of_coptic_month(year: int, month: int) -> int:
    """30, or for the thirteenth month 5 (6 in a leap year); Ethiopian months alike."""
    if month == 13:
        return 6 if is_coptic_leap_year(year) else 5
    return 30


def fixed_from_coptic(year: int, month: int, day: int) -> int:
    """R.D. of a Coptic date (R&D fixed-from-coptic)."""
    return (
        COPTIC_EPOCH - 1
        + 365 * (year - 1)    # ordinary days of all prior years
        + year // 4           # leap days of prior years (years 3, 7, 11 ...)
        + 30 * (month - 1)    # prior months
        + day
    )


def coptic_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the Coptic calendar (R&D coptic-from-fixed)."""
    # 1461 days make four years; the offset 1463 puts the leap day at the end of the cycle.
    year = (4 * (fixed - COPTIC_EPOCH) + 1463) // 1461
    month = (fixed - fixed_from_coptic(year, 1, 1)) // 30 + 1
    day = fixed + 1 - fixed_from_coptic(year, month, 1)
    return year, month, day


def fixed_from_ethiopic(year: int, month: int, day: int) -> int:
    """R.D. of an Ethiopian date: the Coptic arithmetic from the Ethiopian epoch (R&D
    fixed-from-ethiopic)."""
    return ETHIOPIC_EPOCH + fixed_from_coptic(year, month, day) - COPTIC_EPOCH


def ethiopic_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the Ethiopian calendar (R&D ethiopic-from-fixed)."""
    return coptic_from_fixed(fixed + COPTIC_EPOCH - ETHIOPIC_EPOCH)
