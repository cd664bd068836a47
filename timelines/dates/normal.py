"""`iso_form(endpoint)`: an ISO 8601(-2) text that reads back to the endpoint's bounds.

- a window of exactly one Gregorian day, month or year: that unit (`1650-04-12`, `1650-04`,
  `1650`); a bare year is written only where the default reading of free text agrees with ISO
  8601 (from 1583 on, or signed, padded or expanded: `-0043`, `0044`, `+12000`, and before
  -999 with a leading zero, `-01500`, since a bare `-1500` is read by the signed-years
  setting); before 1583 a year is written as its months, `[1500-01..1500-12]`;
- any other window: an ISO 8601-2 set run `[1645..1655]`, `[1650-03-28..1650-04-27]`, each
  side in the coarsest unit that fits it; an open side is left empty: `[..1699]`, `[1701..]`;
- no bound at all: `..`.
Only the bounds are written: qualifiers (approximate, before, ...) are the endpoint's own.
"""
from __future__ import annotations

from ..calendar import gregorian_from_fixed, gregorian_year_range, month_range
from ..model import Endpoint
from .windows import MAX_YEAR_DIGITS

_FIRST_AGREEING_YEAR = 1583   # from here the historical default reads years as ISO does
_PADDED_YEARS_FROM = -10 ** (MAX_YEAR_DIGITS - 1)   # -01500 fits; -0 and twelve digits do not


def iso_form(endpoint: Endpoint) -> str:
    earliest, latest = endpoint.earliest, endpoint.latest
    if earliest is None and latest is None:
        return ".."
    if earliest is not None and latest is not None:
        single = _single_unit(earliest, latest)
        if single is not None:
            return single
    low = "" if earliest is None else _side(earliest, start=True)
    high = "" if latest is None else _side(latest, start=False)
    return f"[{low}..{high}]"


def _single_unit(earliest: int, latest: int) -> str | None:
    year, month, day = gregorian_from_fixed(earliest)
    if earliest == latest:
        return _day(earliest)
    if day == 1 and month_range(year, month, "gregorian")[1] == latest:
        return f"{_year(year)}-{month:02d}"
    whole_year = (month, day) == (1, 1) and gregorian_year_range(year)[1] == latest
    if whole_year and _bare_year_reads(year):
        return _bare_year(year)
    return None


def _side(fixed: int, start: bool) -> str:
    """A side in the coarsest unit that starts (or ends) exactly on `fixed`."""
    year, month, day = gregorian_from_fixed(fixed)
    whole_year = (month, day) == (1, 1) if start else (month, day) == (12, 31)
    if whole_year and _bare_year_reads(year):
        return _bare_year(year)
    whole_month = day == 1 if start else month_range(year, month, "gregorian")[1] == fixed
    if whole_month:
        return f"{_year(year)}-{month:02d}"
    return _day(fixed)


def _bare_year_reads(year: int) -> bool:
    # Before -999 a bare year needs a padding zero, and a year of the most digits a date
    # holds (MAX_YEAR_DIGITS) has no room for one: it is written as its months.
    return _PADDED_YEARS_FROM < year < 1000 or year >= _FIRST_AGREEING_YEAR


def _year(year: int) -> str:
    if 0 <= year <= 9999:
        return f"{year:04d}"
    return f"{'-' if year < 0 else '+'}{abs(year):04d}"


def _bare_year(year: int) -> str:
    """A year alone; before -999 padded with a zero (`-01500`), which only ISO 8601 writes:
    a bare `-1500` is a signed year number, read by the signed-years setting."""
    return f"-0{-year}" if year < -999 else _year(year)


def _day(fixed: int) -> str:
    year, month, day = gregorian_from_fixed(fixed)
    return f"{_year(year)}-{month:02d}-{day:02d}"
