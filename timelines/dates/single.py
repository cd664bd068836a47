"""One date: a base form (free text or ISO 8601), optionally behind `c.` and `before`/`after`.

Dispatch is flat: `before`/`after` over `circa` over a base form. A base form is tried as free
text first (calendar setting), then as ISO 8601 (proleptic Gregorian); the two sets of forms
never claim the same text except a bare unpadded year, which is free text on purpose (iso.py).

Each form returns None when the text is not written its way and raises when it is but the date
cannot exist; so a text matched by no form gets one general reason and hint.
"""
from __future__ import annotations

import re

from ..calendar import GREGORIAN
from ..errors import DateError
from ..model import Endpoint
from .iso import iso_date
from .settings import DEFAULT_SETTINGS, DateSettings
from .text import read_text
from .windows import DATE_HINT, after, approximate, before, normalise, reading

_FLAGS = re.VERBOSE | re.IGNORECASE | re.ASCII

CIRCA = re.compile(r"""
    (?: circa                      # circa 1650
      | ca\. | ca(?=[\s0-9])       # ca. 1650, ca 1650
      | c\.  | c(?=[\s0-9])        # c. 1650, c 1650, c1650 (not CE 1066)
      | about(?=\s)                # about 1650
      | approx\. | approx(?=\s)    # approx. 1650, approx 1650
      | approximately(?=\s)        # approximately 1650
    )
    \s*
    (?P<rest>.+)
""", _FLAGS)

BOUND = re.compile(r"""
    (?: (?P<before> before | bef\. | bef(?=\s) )   # before 1700, bef. 1700
      | (?P<after>  after  | aft\. | aft(?=\s) )   # after 1700, aft. 1700
    )
    \s*
    (?P<rest>.+)
""", _FLAGS)

# Signs that a text holds two dates: a dash, "to", or an interval's slash.
_RANGE_MARK = re.compile(r"[\u2012-\u2015/]|\sto\s", re.IGNORECASE)


# Longer texts are notes, not dates; refusing them early keeps every regex here linear.
MAX_DATE_LENGTH = 200


def parse_date(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Endpoint:
    """One date (no range) as an endpoint window; raises DateError."""
    cleaned = prepared(text)
    with reading(text):
        endpoint = read_single(cleaned, settings)
    if endpoint is None:
        raise not_a_date(text, cleaned)
    return endpoint


def prepared(text: object) -> str:
    """The text normalised for the readers; refuses what is not text or far too long."""
    if not isinstance(text, str):
        raise DateError(str(text), f"expected text, not {type(text).__name__}")
    cleaned = normalise(text)
    if len(cleaned) > MAX_DATE_LENGTH:
        raise DateError(text, f"too long for a date ({len(cleaned)} characters)")
    return cleaned


def read_single(text: str, settings: DateSettings) -> Endpoint | None:
    """A normalised single date, or None when no form claims it."""
    for form in (bounded, circa):
        endpoint = form(text, settings)
        if endpoint is not None:
            return endpoint
    return read_base(text, settings)


def bounded(text: str, settings: DateSettings) -> Endpoint | None:
    """`before X`, `after X`, where X may be approximate."""
    match = BOUND.fullmatch(text)
    if match is None:
        return None
    inner = circa(match["rest"], settings) or read_base(match["rest"], settings)
    if inner is None:
        return None
    return before(inner, settings) if match["before"] else after(inner, settings)


def circa(text: str, settings: DateSettings) -> Endpoint | None:
    """`c. X`: X widened by the circa settings, in the calendar X was read in."""
    match = CIRCA.fullmatch(text)
    if match is None:
        return None
    inner = read_text(match["rest"], settings)
    if inner is not None:
        return approximate(inner, settings, settings.calendar)
    inner = iso_date(match["rest"], settings)
    return None if inner is None else approximate(inner, settings, GREGORIAN)


def read_base(text: str, settings: DateSettings) -> Endpoint | None:
    return read_text(text, settings) or iso_date(text, settings)


def not_a_date(text: str, cleaned: str) -> DateError:
    """The error for a text that no form claims."""
    if not cleaned:
        return DateError(text, "there is no date here",
                         hint="an empty cell is read as no date, not through the parser")
    if _RANGE_MARK.search(cleaned):
        return DateError(text, "a range where one date is expected", hint=DATE_HINT)
    return DateError(text, "not a date form I know", hint=DATE_HINT)
