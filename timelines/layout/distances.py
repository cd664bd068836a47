"""Distances the user writes: a time on the axis (`5y`, `30d`) or a length on the page (`4px`,
`1mm`), as the lane gap takes them; and the page units the page size takes.
"""
from __future__ import annotations

import re
from dataclasses import dataclass

from ..errors import UsageError

# CSS Values and Units Level 3, §5.2 (absolute lengths): 1in = 96px = 2.54cm, 1pt = 1/72in.
PX_PER_UNIT = {"px": 1.0, "mm": 96 / 25.4, "cm": 96 / 2.54, "in": 96.0, "pt": 96 / 72}
# Days per unit. The Gregorian calendar has 146097 days in 400 years: a mean year of
# 365.2425 days and a mean month of a twelfth of that.
DAYS_PER_UNIT = {"d": 1.0, "day": 1.0, "days": 1.0, "w": 7.0, "week": 7.0, "weeks": 7.0,
                 "mo": 365.2425 / 12, "month": 365.2425 / 12, "months": 365.2425 / 12,
                 "y": 365.2425, "yr": 365.2425, "year": 365.2425, "years": 365.2425}
_DISTANCE = re.compile(r"\s*(\d+(?:\.\d*)?|\.\d+)\s*([a-z]+)\s*", re.IGNORECASE)


@dataclass(frozen=True, slots=True)
class Distance:
    """A length on the time axis (`unit` "days") or on the page (`unit` "px")."""

    amount: float
    unit: str
    text: str              # as the user wrote it

    def days(self, days_per_px: float) -> float:
        return self.amount if self.unit == "days" else self.amount * days_per_px


def parse_distance(text: str) -> Distance:
    """`5y`, `30d`, `2 weeks`, `6mo` (time) or `4px`, `1mm`, `0.5cm`, `3pt`, `0.1in` (page)."""
    found = _DISTANCE.fullmatch(str(text))
    unit = found.group(2).lower() if found else ""
    if found and unit in DAYS_PER_UNIT:
        return Distance(float(found.group(1)) * DAYS_PER_UNIT[unit], "days", str(text).strip())
    if found and unit in PX_PER_UNIT:
        return Distance(float(found.group(1)) * PX_PER_UNIT[unit], "px", str(text).strip())
    raise UsageError(f"cannot read the distance {text!r}",
                     hint="give a number and a unit: a time such as 5y, 6mo, 2w, 30d or a "
                          "page distance such as 4px, 1mm, 3pt")
