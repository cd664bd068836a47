"""Parts of a unit: `early`, `mid`, `late`, `first half`, `second quarter`, `last quarter`.

A unit is cut into its sub-units (a millennium, century or decade into years, a year or a
season into months, a month into days) and a part takes a run of them:
- halves and quarters are exact: the first half of the 17th century is 1600-1649, its second
  quarter 1625-1649; a unit that does not divide into whole quarters (a decade) is refused;
- early/mid/late follow the `early_mid_late` setting and are marked `convention_dependent`:
  "thirds" (default) gives early and late a third each, rounded down, and mid the rest
  (a century 33/34/33 years: 1600-1632, 1633-1666, 1667-1699; a decade 3/4/3; a year 4/4/4
  months); "overlapping" gives each part 40% of the unit, mid centred (1600-1639, 1630-1669,
  1660-1699), for writers who let the words overlap.
Parts count forward in time, so the early 5th century BC is its first years: 499-467 BC.
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

from ..calendar import month_range
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .reasons import Unreadable
from .settings import DateSettings
from .windows import date_of, year_bounds, year_of


@dataclass(frozen=True, slots=True)
class Part:
    words: str          # as written, for reasons and notes
    kind: str           # "early", "mid", "late", or "fraction"
    index: int = 0      # for a fraction: which one (0-based) ...
    count: int = 1      # ... of how many equal parts


def part_from_words(words: str) -> Part:
    """The Part that `early`, `mid-`, `first half of`, `last quarter of the` ... name."""
    key = " ".join(words.lower().replace("-", " ").split())
    for filler in (" of the", " of"):
        key = key.removesuffix(filler)
    if key in _THIRDS:
        return Part(words, _THIRDS[key])
    ordinal, _, fraction = key.rpartition(" ")
    count = {"half": 2, "quarter": 4}[fraction]
    index = _FRACTION_ORDINALS[ordinal]
    return Part(words, "fraction", count - 1 if index < 0 else index, count)


_THIRDS = {"early": "early", "beginning": "early", "start": "early", "mid": "mid",
           "middle": "mid", "late": "late", "end": "late"}
_FRACTION_ORDINALS = {"first": 0, "1st": 0, "second": 1, "2nd": 1, "latter": 1, "third": 2,
                      "3rd": 2, "fourth": 3, "4th": 3, "last": -1, "final": -1}


def part_of(endpoint: Endpoint, part: Part, calendar: str, settings: DateSettings) -> Endpoint:
    """The window of `part` of the unit `endpoint` covers."""
    count, start_of = _sub_units(endpoint, part, calendar)
    first, last = _chosen(part, count, settings)
    if part.kind == "fraction" and part.count == 4 and count % 4:
        raise Unreadable(f"a {_unit_name(endpoint)} does not divide into quarters",
                         fragment=part.words, hint="write early, mid or late, or a half")
    qualifiers = endpoint.qualifiers
    if part.kind != "fraction":
        qualifiers = qualifiers | {Qualifier.CONVENTION_DEPENDENT}
    window = Endpoint(start_of(first), start_of(last + 1) - 1, endpoint.precision, qualifiers)
    if trace.on:
        rule = (f"setting early-mid-late = {settings.early_mid_late}" if part.kind != "fraction"
                else f"part {part.index + 1} of {part.count}, equal parts")
        trace.note(f"{part.words!r}: sub-units {first + 1}..{last + 1} of {count} ({rule}): "
                   f"{trace.bounds(window)}")
    return window


def _chosen(part: Part, count: int, settings: DateSettings) -> tuple[int, int]:
    """First and last sub-unit (0-based) of the part."""
    if part.kind == "fraction":
        return part.index * count // part.count, (part.index + 1) * count // part.count - 1
    if settings.early_mid_late == "thirds":
        size = count // 3
        runs = {"early": (0, size), "mid": (size, count - size), "late": (count - size, count)}
    else:
        size = (2 * count + 2) // 5           # 40% of the unit, rounded to the nearest
        middle = (count - size) // 2
        runs = {"early": (0, size), "mid": (middle, middle + size),
                "late": (count - size, count)}
    low, high = runs[part.kind]
    return low, max(low, high - 1)


def _sub_units(endpoint: Endpoint, part: Part,
               calendar: str) -> tuple[int, Callable[[int], int]]:
    """(how many sub-units, the first fixed day of sub-unit k; k == count gives the end + 1)."""
    if endpoint.earliest is None or endpoint.latest is None:
        raise Unreadable(f"{part.words!r} needs a bounded date", fragment=part.words)
    precision = endpoint.precision
    if precision in (Precision.DECADE, Precision.CENTURY, Precision.MILLENNIUM):
        return _years(endpoint, calendar)
    if precision in (Precision.YEAR, Precision.SEASON):
        return _months(endpoint, calendar)
    if precision == Precision.MONTH:
        return endpoint.latest - endpoint.earliest + 1, lambda k: endpoint.earliest + k
    raise Unreadable(f"{part.words!r} applies to a month, year, decade, century or millennium, "
                     f"not to a {_unit_name(endpoint)}", fragment=part.words)


def _years(endpoint: Endpoint, calendar: str) -> tuple[int, Callable[[int], int]]:
    first_year = year_of(endpoint.earliest, calendar)
    count = year_of(endpoint.latest, calendar) - first_year + 1

    def start_of(k: int) -> int:
        return endpoint.latest + 1 if k >= count else year_bounds(first_year + k, calendar)[0]

    return count, start_of


def _months(endpoint: Endpoint, calendar: str) -> tuple[int, Callable[[int], int]]:
    # Month starts inside the window, found by stepping a day past each month's end.
    starts = [endpoint.earliest]
    while True:
        next_start = _next_month_start(starts[-1], calendar)
        if next_start > endpoint.latest:
            break
        starts.append(next_start)
    count = len(starts)
    return count, lambda k: endpoint.latest + 1 if k >= count else starts[k]


def _next_month_start(fixed: int, calendar: str) -> int:
    year, month, _ = date_of(fixed, calendar)
    return month_range(year, month, calendar)[1] + 1


def _unit_name(endpoint: Endpoint) -> str:
    return "deep-time date" if endpoint.precision == Precision.DEEP_TIME else str(
        endpoint.precision or "date")
