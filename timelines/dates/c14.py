"""Radiocarbon ages as written in a chronology, read only where the text says so, and
calibrated: `3450 ± 40 14C BP`, `3450 ± 40 BP (uncal)`, `3450±40 uncal BP`, a laboratory
code before the age `Lab-1234: 3450 ± 40` (a code says a measurement), each optionally naming
its curve `(SHCal20)`.

A plain `3450 ± 40 BP` stays calendar years before 1950 (deeptime.py), as geologists and
many archaeologists write calibrated or other ages; the setting `bp = "radiocarbon"` (CLI
`--bp radiocarbon`) reads every `N ± E BP` of the table as a radiocarbon age instead. The
curve is the setting `curve` (`--curve intcal20 | shcal20`) unless the cell names one.

The endpoint's window is the outer extent of the 95.4% highest-density ranges (Stuiver &
Reimer 1993; Bronk Ramsey 2008; radiocarbon.py), its likely day the middle of the median
year, and it carries the measurement (`Endpoint.radiocarbon`), from which the chart draws the
probability and the tooltip and `--explain` give the ranges. Years are proleptic Gregorian
and astronomical (cal BP 1950 is 1 BC, year 0).
"""
from __future__ import annotations

import re

from ..calendar import fixed_from_gregorian
from ..model import Endpoint, Precision, Radiocarbon
from . import trace
from .grammar import FLAGS, Form
from .radiocarbon import CURVES, cal_bp_label, calibrate, year_label
from .reasons import Unreadable
from .settings import DateSettings

LEVELS = (0.683, 0.954)      # the usual 1 and 2 sigma levels of calibrated ranges
_NUMBER = r"(?: [0-9]{1,3}(?:,[0-9]{3})+ | [0-9]{1,6} )"
_PLUS_MINUS = r"(?:\u00b1|\+/-|\+-)"
_LAB = r"(?P<lab>[A-Z]{1,6}(?:-[A-Z]{1,4})?[-\x20]?[0-9]{1,7}[A-Z]?) \s* : \s*"
# What says "radiocarbon years": 14C BP (also ¹⁴C, C14, C-14, with yr/years), uncal BP,
# BP uncal, BP (uncal), BP (uncalibrated).
_RADIOCARBON_UNIT = r"""(?: (?:14C|C-?14|\u00b9\u2074C) \s* (?:yrs?\s*|years\s*)? BP
                         | uncal(?:ibrated)?\.? \s* BP
                         | BP \s* \(? \s* uncal(?:ibrated)?\.? \s* \)? )"""


def _measured(prefix: str) -> tuple[str, str]:
    """`3450 ± 40` and an optional curve after it, the groups named with `prefix` (the joined
    form table allows no name twice, so each alternative has its own)."""
    return (rf"(?P<{prefix}age>{_NUMBER}) \s* {_PLUS_MINUS} \s* (?P<{prefix}error>{_NUMBER})",
            rf"(?: \s* \(? \s* (?P<{prefix}curve>IntCal\s?20|SHCal\s?20) \s* \)? )?")


RADIOCARBON = re.compile(rf"""
      {_LAB} {_measured("")[0]} (?: \s* (?: {_RADIOCARBON_UNIT} | BP ) )? {_measured("")[1]}
                                                            # Lab-1234: 3450 ± 40 (any unit)
    | {_measured("bare_")[0]} \s* {_RADIOCARBON_UNIT} {_measured("bare_")[1]}
                                                            # 3450 ± 40 14C BP, uncal BP
""", FLAGS)
# With `bp = "radiocarbon"`: a plain `3450 ± 40 BP` (deeptime.AGE hands it over).
PLAIN_BP = re.compile(rf"{_measured('bare_')[0]} \s* BP {_measured('bare_')[1]}", FLAGS)


def read_radiocarbon(match: re.Match[str], era: str | None, marker: str | None,
                     settings: DateSettings) -> Endpoint:
    """The calibrated window of a radiocarbon age written as one."""
    prefix = "" if match.groupdict().get("lab") else "bare_"
    curve = _curve(match[prefix + "curve"], settings)
    return calibrated(_number(match[prefix + "age"]), _number(match[prefix + "error"]), curve,
                      match.groupdict().get("lab"), match[0])


def calibrated(age: int, error: int, curve: str, lab: str | None, written: str) -> Endpoint:
    """`age ± error` 14C BP calibrated against `curve` as an endpoint (its 95.4% window)."""
    try:
        found = calibrate(age, error, curve)
    except ValueError as error_found:
        raise Unreadable(str(error_found).replace("cannot calibrate", "a radiocarbon age")
                         ) from None
    oldest_bp, youngest_bp = found.outer(LEVELS[1])
    first_year, last_year = 1950 - oldest_bp, 1950 - youngest_bp
    median_year = 1950 - found.median_bp
    years, density = found.density_by_year()
    ranges = tuple((level, tuple((r.start_year, r.end_year, round(r.probability, 6))
                                 for r in found.ranges(level))) for level in LEVELS)
    measured = Radiocarbon(float(age), float(error), curve, lab, int(years[0]),
                           tuple(density.tolist()), ranges, median_year,
                           CURVES[curve].citation)
    endpoint = Endpoint(fixed_from_gregorian(first_year, 1, 1),
                        fixed_from_gregorian(last_year, 12, 31), Precision.YEAR, frozenset(),
                        fixed_from_gregorian(median_year, 7, 2), measured)
    if trace.on:
        for line in reading(endpoint.radiocarbon, written):
            trace.note(line)
    return endpoint


def reading(measured: Radiocarbon, written: str = "") -> list[str]:
    """In words: the age read as radiocarbon, the curve, its ranges at both levels and the
    median (for `--explain` and tooltips)."""
    found = calibrate(measured.age, measured.error, measured.curve)
    source = CURVES[measured.curve]
    lines = [f"{written or measured}: a radiocarbon age, {measured}, calibrated with "
             f"{source.title} ({source.citation.split(',')[0]})"]
    for level in reversed(LEVELS):
        ranges = "; ".join(_range_text(r) for r in found.ranges(level))
        lines.append(f"{level:.1%} ranges: {ranges}")
    median = found.median_bp
    lines.append(f"median {year_label(1950 - median)} ({cal_bp_label(median)}); the window "
                 "drawn and counted is the outer extent of the 95.4% ranges")
    return lines


def _range_text(found) -> str:
    return (f"{year_label(found.start_year)}–{year_label(found.end_year)} "
            f"({found.start_bp}–{cal_bp_label(found.end_bp)}, {found.probability:.1%})")


def _curve(written: str | None, settings: DateSettings) -> str:
    return settings.curve if written is None else written.replace(" ", "").lower()


def _number(text: str) -> int:
    return int(text.replace(",", ""))


RADIOCARBON_FORMS = (
    Form("radiocarbon age", RADIOCARBON, read_radiocarbon, takes_era=False, gregorian=True,
         starts="digit letter"),
)
