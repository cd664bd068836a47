"""The arithmetic Islamic (Hijri) calendar on fixed day numbers (Reingold & Dershowitz,
*Calendrical Calculations*, ch. 6).

Years are counted from the Hijra (AH, anno Hegirae). Twelve lunar months alternate 30 and 29
days, and the last, Dhu al-Hijja, gains a 30th day in 11 years of every 30: years 2, 5, 7, 10,
13, 16, 18, 21, 24, 26 and 29 of each cycle. 1 Muharram 1 AH is Friday 16 July 622 (Julian),
R.D. 227015, the epoch R&D call civil (the astronomical epoch is a day earlier).

Caution: this is the arithmetic (tabular) calendar. The religious and civil calendar starts
each month when the new crescent is seen (in Saudi Arabia's Umm al-Qura calendar, when it is
computed to be visible), so a date written at the time may differ from this one by a day or
two. An Islamic day runs from sunset to sunset; it is given here as the civil day on which its
daylight falls.
"""
from __future__ import annotations

ISLAMIC_EPOCH = 227015   # R.D. of 1 Muharram 1 AH = Julian 622-07-16

MONTH_NAMES = ("Muharram", "Safar", "Rabi' al-Awwal", "Rabi' al-Thani", "Jumada al-Ula",
               "Jumada al-Akhira", "Rajab", "Sha'ban", "Ramadan", "Shawwal", "Dhu al-Qa'da",
               "Dhu al-Hijja")


def is_islamic_leap_year(year: int) -> bool:
    """Whether Dhu al-Hijja has 30 days: 11 years of each 30-year cycle (R&D
    islamic-leap-year?)."""
    return (14 + 11 * year) % 30 < 11


def last_day_of_islamic_month(year: int, month: int) -> int:
    # Odd months have 30 days, even months 29, but the last month of a leap year has 30.
    if month % 2 == 1 or (month == 12 and is_islamic_leap_year(year)):
        return 30
    return 29


def fixed_from_islamic(year: int, month: int, day: int) -> int:
    """R.D. of an arithmetic Islamic date (R&D fixed-from-islamic)."""
    return (
        ISLAMIC_EPOCH - 1
        + (year - 1) * 354             # ordinary days of all prior years
        + (3 + 11 * year) // 30        # leap days of prior years
        + 29 * (month - 1)             # prior months, if all had 29 days
        + month // 2                   # the 30th days of the prior odd months
        + day
    )


def islamic_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the arithmetic Islamic calendar (R&D
    islamic-from-fixed)."""
    # 10631 days make 30 years; the offset puts each new year where the leap days say.
    year = (30 * (fixed - ISLAMIC_EPOCH) + 10646) // 10631
    prior_days = fixed - fixed_from_islamic(year, 1, 1)
    month = (11 * prior_days + 330) // 325     # 325 days make 11 months of 29 1/2 days
    day = fixed - fixed_from_islamic(year, month, 1) + 1
    return year, month, day


def islamic_year_range(year: int) -> tuple[int, int]:
    """First and last fixed day of an Islamic year."""
    return fixed_from_islamic(year, 1, 1), fixed_from_islamic(year + 1, 1, 1) - 1
