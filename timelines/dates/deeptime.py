"""Ages before present and values with an error term: `12,500 BP`, `65.5 Ma`, `1650 ± 10`.

Ages count back from a present: 1950 for `BP`, `cal BP`, `ka`, `Ma`, `Ga` and `years ago`
(the radiocarbon convention, Stuiver & Polach 1977, from memory), 2000 for `b2k` (ice-core
chronologies). Units: years (`BP`, `years ago`), thousands (`ka`, `kya`), millions (`Ma`,
`mya`), billions (`Ga`, `gya`). BP ages are read as calendar years as written: an uncalibrated
radiocarbon age must be calibrated first. Years are proleptic Gregorian and astronomical.

- Without an error term the precision follows the digits given: a value stands for every age
  that rounds to it at its last written digit, so `65.5 Ma` is 65.45..65.55 million years ago
  and `12,500 BP` is that one year (1950 - 12500 = year -10550). Precision `deep time`.
- With an error term (`±`, `+/-`) the window is the value minus and plus the error:
  `12,500 ± 150 BP` is 12,650..12,350 BP; marked `approximate`.
- A calendar year with an error term, `1650 ± 10` (or `3000 ± 50 BC`), is 1640..1660 in the
  calendar setting, at year precision, `approximate`.
In every case the likely day is the middle day of the nominal value's year (`1650 ± 10`:
1650-07-02), since the writer named that value as the best estimate.
"""
from __future__ import annotations

import re

from ..calendar import GREGORIAN
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .reasons import Unreadable
from .settings import DateSettings
from .text import written_year
from .windows import MAX_YEAR_DIGITS, year_bounds

# Atomic: a number is read once, never taken apart again when what follows does not fit.
_NUMBER = r"(?> [0-9]{1,3}(?:,[0-9]{3})+(?:\.[0-9]+)? | [0-9]{1,13}(?:\.[0-9]{1,12})? )"
_PLUS_MINUS = r"(?:\u00b1|\+/-|\+-)"

AGE = re.compile(rf"""
    (?P<value>{_NUMBER})
    (?: \s* {_PLUS_MINUS} \s* (?P<error>{_NUMBER}) )?      # 12,500 ± 150 BP
    \s*
    (?P<unit>
        cal\.?\s*BP | BP | b2k                             # years before 1950 (2000 for b2k)
      | (?:years?|yrs?)\s+(?:cal\.?\s*)?(?:BP|ago|b2k)     # 10,000 years ago, 500 yr BP
      | ka | kya | Ma | mya | Ga | gya                     # thousands, millions, billions
      | (?:thousand|million|billion)\s+years\s+ago         # 66 million years ago
    )
""", FLAGS)

YEAR_WITH_ERROR = re.compile(rf"""
    (?P<year>[0-9]{{1,{MAX_YEAR_DIGITS}}}) \s* {_PLUS_MINUS} \s*
    (?P<error>[0-9]{{1,{MAX_YEAR_DIGITS}}}) (?:\s*(?:years?|yrs?|y))?   # 1650 ± 10 (years)
""", FLAGS)

_SCALES = {"ka": 1000, "kya": 1000, "thousand": 1000, "ma": 10 ** 6, "mya": 10 ** 6,
           "million": 10 ** 6, "ga": 10 ** 9, "gya": 10 ** 9, "billion": 10 ** 9}


def read_age(match: re.Match[str], era: str | None, marker: str | None,
             settings: DateSettings) -> Endpoint:
    unit = " ".join(match["unit"].lower().replace(".", " ").split())
    if unit == "bp" and match["error"] and settings.bp == "radiocarbon":
        from .c14 import PLAIN_BP, read_radiocarbon     # the table's BP ages are 14C ages
        return read_radiocarbon(PLAIN_BP.fullmatch(match[0]), era, marker, settings)
    present = 2000 if unit.endswith("b2k") else 1950
    scale = _SCALES.get(unit.split()[0], 1)   # BP, years ago: years
    # Exact integer arithmetic in units of 1 / (2 * 10^decimals) of a year.
    places = max(_decimals(match["value"]), _decimals(match["error"] or ""))
    denominator = 2 * 10 ** places
    value = _scaled(match["value"], places) * scale * 2
    if match["error"]:
        error = _scaled(match["error"], places) * scale * 2
        nearest, farthest = _whole_ages(value - error, value + error, denominator, True)
    else:
        # Every age that rounds to the value at its last written digit: [value - ½, value + ½).
        half = scale * 10 ** (places - _decimals(match["value"]))
        nearest, farthest = _whole_ages(value - half, value + half, denominator, False)
    nominal = min(max((value + denominator // 2) // denominator, nearest), farthest)
    endpoint = _ages(present - farthest, present - nearest, present - nominal,
                     bool(match["error"]))
    if trace.on:
        trace.note(f"age {match[0]!r}: {nearest:,}..{farthest:,} years before {present}, "
                   f"{'the error term' if match['error'] else 'to its last digit'}: "
                   f"{trace.bounds(endpoint)}")
        if unit == "bp":
            trace.note("BP is read as calendar years before 1950; a radiocarbon age is written "
                       "14C BP or uncal BP and calibrated (or give --bp radiocarbon)")
    return endpoint


def _whole_ages(low: int, high: int, denominator: int, high_included: bool) -> tuple[int, int]:
    """The nearest and farthest whole age (years before the present) of the ages `low` up to
    `high`, given in units of 1/denominator of a year."""
    nearest = -(-low // denominator)
    farthest = high // denominator if high_included else -(-high // denominator) - 1
    if nearest <= farthest:
        return nearest, farthest
    # No whole age inside: a window finer than a year (0.999999999 Ma is 999,999.9985 up to
    # 999,999.9995 years). Then the years that hold it, each whole age N holding the ages that
    # round to it, N - ½ up to N + ½, as 12,500 BP holds 12,499.5 up to 12,500.5.
    half = denominator // 2
    nearest = (low + half) // denominator
    farthest = ((high + half) // denominator if high_included
                else -(-(high + half) // denominator) - 1)
    return nearest, farthest


def _scaled(text: str, places: int) -> int:
    """`12,500.5` with `places` decimals as a whole number of 10^-places: 125005 (places 1)."""
    whole, _, fraction = text.replace(",", "").partition(".")
    return int(whole + fraction.ljust(places, "0"))


def _decimals(text: str) -> int:
    return len(text.partition(".")[2])


def _ages(first_year: int, last_year: int, nominal_year: int, has_error: bool) -> Endpoint:
    for year in (first_year, last_year):
        if abs(year) >= 10 ** MAX_YEAR_DIGITS:
            raise Unreadable(f"an age of {abs(year):,} years is out of range")
    qualifiers = frozenset({Qualifier.APPROXIMATE}) if has_error else frozenset()
    likely = sum(year_bounds(nominal_year, GREGORIAN)) // 2
    return Endpoint(year_bounds(first_year, GREGORIAN)[0], year_bounds(last_year, GREGORIAN)[1],
                    Precision.DEEP_TIME, qualifiers, likely)


def read_year_with_error(match: re.Match[str], era: str | None, marker: str | None,
                         settings: DateSettings) -> Endpoint:
    year = written_year(match["year"], era)
    error = int(match["error"])
    calendar = marker or settings.reckoning
    nominal = year_bounds(year, calendar)
    endpoint = Endpoint(year_bounds(year - error, calendar)[0],
                        year_bounds(year + error, calendar)[1], Precision.YEAR,
                        frozenset({Qualifier.APPROXIMATE}), sum(nominal) // 2)
    if trace.on:
        trace.note(f"{match[0]!r}: the year {year} minus and plus {error} years, likely the "
                   f"middle of {year}: {trace.bounds(endpoint)}")
    return endpoint


AGE_FORMS = (
    Form("age before present", AGE, read_age, takes_era=False, gregorian=True),
    Form("year with an error term", YEAR_WITH_ERROR, read_year_with_error),
)
