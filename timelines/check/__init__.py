"""Check: what a run read, what it will draw, and what deserves a second look.

- `report`: `check(loaded)` gives a `Report`: rows read, drawn and reported, every problem
  of loading, and a few warning rules (duplicate ids, implausibly long spans);
- `living`: withholding the details of records that may be of living persons.
"""
from .living import WITHHELD_LABEL, possibly_living, withhold_possibly_living
from .report import CheckLimits, Counts, Finding, Report, check

__all__ = ["CheckLimits", "Counts", "Finding", "Report", "WITHHELD_LABEL", "check",
           "possibly_living", "withhold_possibly_living"]
