"""Suggestions that `explain` adds to an error: the likely slip behind it.

The same words could be the error's own hint; for these four they are given by `explain`
alone, so that the messages of the reports stay as they are:
- `1985-13-01`: day and month swapped? 1985-01-13;
- `2001-02-29`: 2001-02-28 or 2001-03-01?;
- `1990/1980`: did you mean 1980/1990?;
- `c. 18th`: a century is written 18th century.
"""
from __future__ import annotations

import re

from ..errors import DateError
from .grammar import FLAGS

_ISO_DAY = re.compile(r"\s* (?P<year>[+-]?[0-9]{4,}) - (?P<month>[0-9]{2}) - (?P<day>[0-9]{2}) \s*",
                      FLAGS)
_INTERVAL = re.compile(r"\s* (?P<start>[^/]+?) \s* / \s* (?P<end>[^/]+?) \s*", FLAGS)
_LONE_ORDINAL = re.compile(r"\s* (?:c\.?|ca\.?)? \s* (?P<ordinal>[0-9]{1,2}(?:st|nd|rd|th)) \s*",
                           FLAGS)


def suggestion(text: str, error: DateError) -> str | None:
    """A suggestion for `error` about `text`, or None."""
    day = _ISO_DAY.fullmatch(text)
    if day and error.reason.startswith("month "):
        if 1 <= int(day["day"]) <= 12:
            return f"day and month swapped? {day['year']}-{day['day']}-{day['month']}"
    if day and error.reason.endswith("is not a leap year"):
        return f"{day['year']}-02-28 or {day['year']}-03-01?"
    interval = _INTERVAL.fullmatch(text)
    if interval and error.reason == "the end comes before the start":
        return f"did you mean {interval['end']}/{interval['start']}?"
    ordinal = _LONE_ORDINAL.fullmatch(text)
    if ordinal:
        return f"a century is written {ordinal['ordinal']} century"
    return None
