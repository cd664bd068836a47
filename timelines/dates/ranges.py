"""Ranges: an ISO 8601 interval (`1985/1987`, see iso.py) or two dates joined by a dash or `to`.

Separators, tried in this order:
- an en dash, em dash, figure dash or horizontal bar, spaced or not: `1650–1660`, `1650 — 1660`;
- the word `to`: `1650 to 1660`;
- a hyphen, only when no single-date form claims the whole text. A date claims its own hyphens
  first, so `1985-04` and `-0043-03-15` are dates, and `1985-13-01` is a date with no month 13;
  a year-month is claimed only for months 00-12 and the ISO 8601-2 codes 21-41, so `1650-1660`,
  `1650-60`, `1650s-1670s`, `c. 1650-1660` are ranges. A hyphen straight after another hyphen
  is a sign (`-0500 - -0400`). Two hyphens that could each separate are refused as ambiguous.

The end may lean on the start:
- two digits after a plain three- or four-digit year abbreviate it: `1650–60` is 1650 to 1660
  (inclusive numbers as the Chicago Manual of Style writes them, from memory);
- an end in BC lends its era to a start written without one or a sign: `500–400 BC`.
"""
from __future__ import annotations

import re

from ..errors import DateError
from ..model import Endpoint, Span
from .iso import iso_interval
from .settings import DEFAULT_SETTINGS, DateSettings
from .single import not_a_date, prepared, read_single
from .text import split_era
from .windows import DATE_HINT, collapsed, ordered_span, reading

RANGE_HINT = "a range looks like 1650–1660, 1650 to 1660, 500 BC – AD 100 or 1985/1987"

DASH = re.compile(r"\s*[\u2012-\u2015]\s*")      # figure dash, en dash, em dash, horizontal bar
TO = re.compile(r"\s+to\s+", re.IGNORECASE)
_PLAIN_YEAR = re.compile(r"[0-9]{3,4}")
_TWO_DIGITS = re.compile(r"[0-9]{2}")


def parse_span(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Span:
    """A range or interval, or a single date as a point span; raises DateError."""
    cleaned = prepared(text)
    with reading(text):
        return _read_span(cleaned, text, settings)


def parse_endpoint(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Endpoint:
    """A single date, or a range collapsed into one window (see `windows.collapsed`)."""
    span = parse_span(text, settings)
    return span.start if span.is_point else collapsed(span)


def _read_span(cleaned: str, text: str, settings: DateSettings) -> Span:
    interval = iso_interval(cleaned, settings)
    if interval is not None:
        return interval
    parts = split_at_mark(cleaned, text, DASH) or split_at_mark(cleaned, text, TO)
    if parts is not None:
        return _text_range(parts, text, settings)
    endpoint = read_single(cleaned, settings)
    if endpoint is not None:
        return Span.point(endpoint)
    parts = split_at_hyphen(cleaned, text)
    if parts is not None:
        return _text_range(parts, text, settings)
    raise not_a_date(text, cleaned)


def split_at_mark(cleaned: str, text: str, mark: re.Pattern[str]) -> tuple[str, str] | None:
    """(start, end) around the one separator `mark`, None without one."""
    found = list(mark.finditer(cleaned))
    if not found:
        return None
    if len(found) > 1:
        raise DateError(text, "a range has one start and one end", hint=RANGE_HINT)
    return cleaned[:found[0].start()], cleaned[found[0].end():]


def split_at_hyphen(cleaned: str, text: str) -> tuple[str, str] | None:
    places = [i for i, char in enumerate(cleaned) if char == "-" and _separates(cleaned, i)]
    if not places:
        return None
    if len(places) > 1:
        raise DateError(text, "more than one hyphen could end the start here",
                        hint="join the two dates with an en dash (–), 'to' or '/'")
    return cleaned[:places[0]].strip(), cleaned[places[0] + 1:].strip()


def _separates(cleaned: str, index: int) -> bool:
    # A hyphen at the start, or straight after another hyphen, is a minus sign.
    left = cleaned[:index].rstrip()
    return bool(left) and not left.endswith("-") and bool(cleaned[index + 1:].strip())


def _text_range(parts: tuple[str, str], text: str, settings: DateSettings) -> Span:
    start_text, written_end = parts
    end_text = _unabbreviated(start_text, written_end)
    start_text = _with_shared_era(start_text, end_text)
    start = _range_side(start_text, "start", text, settings)
    end = _range_side(end_text, "end", text, settings)
    hint = None
    if end_text != written_end:
        hint = f"{written_end} after {start_text} reads as {end_text}; months are written 1650-04"
    return ordered_span(start, end, text, hint)


def _unabbreviated(start_text: str, end_text: str) -> str:
    if _PLAIN_YEAR.fullmatch(start_text) and _TWO_DIGITS.fullmatch(end_text):
        return start_text[:-2] + end_text
    return end_text


def _with_shared_era(start_text: str, end_text: str) -> str:
    if (start_text and start_text[0] not in "+-" and split_era(start_text)[1] is None
            and split_era(end_text)[1] == "BC"):
        return f"{start_text} BC"
    return start_text


def _range_side(part: str, side: str, text: str, settings: DateSettings) -> Endpoint:
    """One side of a free-text range; its errors name the side."""
    if not part:
        raise DateError(text, f"the range has no {side}", hint=RANGE_HINT)
    try:
        endpoint = read_single(part, settings)
    except DateError as error:
        raise DateError(text, f"the {side} {part!r}: {error.reason}", hint=error.hint) from error
    except ValueError as error:
        raise DateError(text, f"the {side} {part!r}: {error}") from error
    if endpoint is None:
        raise DateError(text, f"the {side} {part!r} is not a date form I know", hint=DATE_HINT)
    return endpoint
