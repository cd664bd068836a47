"""The French Republican calendar on fixed day numbers.

Twelve months of 30 days, Vendémiaire to Fructidor, then five complementary days (the
sansculottides), six in a leap year: month 13 here. Years are counted from 1 Vendémiaire
an I, 22 September 1792 (R.D. 654415), the day of the autumnal equinox at Paris.

Which years have the sixth complementary day (the jour de la Révolution):
- Years I-XIV, the years the calendar was used (to 10 Nivôse XIV, 31 December 1805): each
  year began on the day of the autumnal equinox at the Paris Observatory, which made III, VII
  and XI the leap ("sextile") years. These dates are the documents' own: 18 Brumaire an VIII
  is 9 November 1799.
- From year XV on, the arithmetic rule Gilbert Romme proposed in year III (1795), never
  enacted, as Reingold & Dershowitz give it for their "arithmetic French" calendar
  (*Calendrical Calculations*, 3rd ed., ch. 17): every fourth year is a leap year, except the
  years divisible by 100 and not by 400 (C, CC, CCC, D ...) and the years divisible by 4000.
R&D apply the rule from year I on, with leap years IV, VIII and XII: the calendar as used and
their arithmetic differ by a day in years III-XII (the arithmetic begins IV, VIII and XII a day
earlier) and agree from year XIII on, since both count three leap days before it. The equinox
itself, had it been kept after XIV, would make other years leap now and then. (The history
here is from memory; the dates of years I-XIV agree with convertdate's.)
"""
from __future__ import annotations

REPUBLICAN_EPOCH = 654415   # R.D. of 1 Vendémiaire an I = Gregorian 1792-09-22
_LAST_YEAR_IN_USE = 14      # an XIV: the calendar was abolished on 1 January 1806
_SEXTILE_YEARS_IN_USE = (3, 7, 11)

MONTH_NAMES = ("Vendémiaire", "Brumaire", "Frimaire", "Nivôse", "Pluviôse", "Ventôse",
               "Germinal", "Floréal", "Prairial", "Messidor", "Thermidor", "Fructidor",
               "jours complémentaires")
# The complementary days by name, from the first (jour de la Vertu) to the sixth.
COMPLEMENTARY_DAY_NAMES = ("Vertu", "Génie", "Travail", "Opinion", "Récompenses",
                           "Révolution")


def is_french_leap_year(year: int) -> bool:
    """Whether the year has a sixth complementary day."""
    if 1 <= year <= _LAST_YEAR_IN_USE:
        return year in _SEXTILE_YEARS_IN_USE
    return year % 4 == 0 and year % 400 not in (100, 200, 300) and year % 4000 != 0


def _leap_days_before(year: int) -> int:
    """Leap days in the years from an I to the one before `year` (negative before an I)."""
    if 1 <= year <= _LAST_YEAR_IN_USE + 1:
        return year // 4       # after III, VII and XI: one, two, three
    prior = year - 1           # Romme's rule, counted as R&D count it from an I
    return prior // 4 - prior // 100 + prior // 400 - prior // 4000


def french_new_year(year: int) -> int:
    """R.D. of 1 Vendémiaire of `year`."""
    return REPUBLICAN_EPOCH + 365 * (year - 1) + _leap_days_before(year)


def last_day_of_french_month(year: int, month: int) -> int:
    if month == 13:
        return 6 if is_french_leap_year(year) else 5
    return 30


def fixed_from_french(year: int, month: int, day: int) -> int:
    """R.D. of a French Republican date; the complementary days are month 13."""
    return french_new_year(year) + 30 * (month - 1) + day - 1


def french_from_fixed(fixed: int) -> tuple[int, int, int]:
    """(year, month, day) of a fixed day in the French Republican calendar."""
    # 1460969 days make 4000 years of Romme's rule: the estimate is off by a year at most.
    year = (4000 * (fixed - REPUBLICAN_EPOCH + 2)) // 1460969 + 1
    while fixed < french_new_year(year):
        year -= 1
    while fixed >= french_new_year(year + 1):
        year += 1
    prior_days = fixed - french_new_year(year)
    return year, prior_days // 30 + 1, prior_days % 30 + 1


def french_year_range(year: int) -> tuple[int, int]:
    """First and last fixed day of a French Republican year."""
    return french_new_year(year), french_new_year(year + 1) - 1
