"""Ranges: two dates joined by a dash or a word, or an ISO 8601 interval (intervals.py).

Separators, tried in this order:
- an en dash, em dash, figure dash or horizontal bar, spaced or not: `1650–1660`, `1650 — 1660`;
- the words `to`, `until`, `till`: `1650 to 1660`, optionally after `from`
  (`from 1650 to 1660`, GEDCOM's FROM ... TO);
- a slash: first as one date that holds one (`1701/02` a dual year, `25/12/1650`), then as
  an ISO 8601 interval (`1985/1987`);
- a hyphen, only when no single-date form claims the whole text. A date claims its own hyphens
  first, so `1985-04` and `-0043-03-15` are dates, and `1985-13-01` is a date with no month 13;
  a year-month is claimed only for months 00-12 and the ISO 8601-2 codes 21-41, so `1650-1660`,
  `1650-60`, `1650s-1670s`, `c. 1650-1660` are ranges. A hyphen straight after another hyphen
  is a sign (`-0500 - -0400`). Two hyphens that could each separate are refused as ambiguous.

A side may be `?` (or `unknown`): the side is not known; an end may be `present`, `now`,
`today`, `ongoing` or `date`: the span runs on (open), at least until the present setting's
day (today unless set), which is the end window's earliest day. The two sides lend each other what
they share (completion.py: `1650–60`, `March–May 1650`, `500–400 BC`, `17th–18th century`).
"""
from __future__ import annotations

import re

from ..errors import DateError
from ..calendar import iso_from_fixed
from ..model import Endpoint, Precision, Qualifier, Span
from . import trace
from .completion import completed
from .intervals import iso_interval
from .quick import quick_span
from .reasons import DATE_HINT, RANGE_HINT, date_error, locate
from .settings import DEFAULT_SETTINGS, DateSettings, present_day
from .frame import read_framed
from .single import not_a_date, prepared, read_single
from .translate import translated
from .windows import collapsed, ordered_span

DASH = re.compile(r"\s*[\u2012-\u2015]\s*")      # figure dash, en dash, em dash, horizontal bar
WORD = re.compile(r"\s+(?:to|until|till)\s+", re.IGNORECASE)
FROM = re.compile(r"from\s+", re.IGNORECASE)
_RANGE_SIGN = re.compile(r"[\u2012-\u2015]|\s(?:to|until|till)\s", re.IGNORECASE)
# Anything that makes a text more than one plain date: a dash, a slash, a set's bracket,
# a joining word, or a pair's opening word.
_COMPOUND = re.compile(r"[\u2012-\u2015/\[{]|\s(?:to|until|till|or)\s|^(?:bet|btw|from\s)",
                       re.IGNORECASE)

_UNKNOWN_WORDS = ("?", "??", "unknown")
# An end that has not come: the span runs on past the present setting's day (`1985–present`).
RUNNING_ON_WORDS = ("present", "now", "today", "ongoing")
_RUNNING_ON_IN_A_RANGE = (*RUNNING_ON_WORDS, "date")   # 1985–date: "to date"


def parse_span(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Span:
    """A range or interval, or a single date as a point span; raises DateError."""
    if type(text) is str:
        span = quick_span(text, settings)
        if span is not None:
            return span
    return general_span(text, settings)


def general_span(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Span:
    """parse_span without the quick lane (quick.py), which must agree with it."""
    cleaned = prepared(text)
    try:
        return _read_span(translated(cleaned, settings), text, settings)
    except DateError:
        raise
    except ValueError as error:
        raise date_error(text, error) from error


def parse_endpoint(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Endpoint:
    """A single date, or a range collapsed into one window (see `windows.collapsed`)."""
    span = parse_span(text, settings)
    return span.start if span.is_point else collapsed(span)


def _read_span(cleaned: str, text: str, settings: DateSettings) -> Span:
    if _COMPOUND.search(cleaned) is None:
        # Most cells: one date with no dash, slash, bracket or joining word. Straight to it.
        endpoint = read_framed(cleaned, settings)
        if endpoint is not None:
            return Span.point(endpoint)
        return _hyphen_range(cleaned, text, settings)
    if cleaned[:1] in ("[", "{") or cleaned[:3].lower() in ("bet", "btw"):
        return _point(cleaned, text, settings)
    if _RANGE_SIGN.search(cleaned):
        written = FROM.sub("", cleaned, count=1) if cleaned[:5].lower() == "from " else cleaned
        parts = split_at_mark(written, text, DASH) or split_at_mark(written, text, WORD)
        if parts is not None:
            return _text_range(parts, text, settings)
    if "/" in cleaned:
        endpoint = read_single(cleaned, settings)
        if endpoint is not None:
            return Span.point(endpoint)
        return iso_interval(cleaned, text, settings)
    endpoint = read_single(cleaned, settings)
    if endpoint is not None:
        return Span.point(endpoint)
    return _hyphen_range(cleaned, text, settings)


def _hyphen_range(cleaned: str, text: str, settings: DateSettings) -> Span:
    parts = split_at_hyphen(cleaned, text)
    if parts is not None:
        return _text_range(parts, text, settings)
    raise not_a_date(text, cleaned)


def _point(cleaned: str, text: str, settings: DateSettings) -> Span:
    endpoint = read_single(cleaned, settings)
    if endpoint is None:
        raise not_a_date(text, cleaned)
    return Span.point(endpoint)


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
    written_start, written_end = parts
    start_text, end_text = completed(written_start, written_end)
    if trace.on:
        trace.note(f"a range: start {start_text!r}, end {end_text!r}")
    start = _range_side(start_text, "start", text, settings)
    end = _range_side(end_text, "end", text, settings)
    hint = None
    if end_text != written_end and written_end.isdigit():
        hint = (f"{written_end} after {written_start} reads as {end_text}; "
                "months are written 1650-04")
    elif end.latest is not None and start.earliest is not None and end.latest < start.earliest:
        hint = _reversed_hint(start_text, end_text)
    return ordered_span(start, end, text, hint, locate(text, written_end) if written_end else None)


def running_on(word: str, settings: DateSettings) -> Endpoint:
    """`present`, `now`, `today`, `ongoing` as an end: the span runs on (open end), known to
    last at least until the present setting's day, which is the window's earliest day."""
    day = present_day(settings)
    endpoint = Endpoint(day, None, Precision.DAY, frozenset({Qualifier.OPEN_END}))
    if trace.on:
        trace.note(f"{word!r}: the span runs on, at least until {iso_from_fixed(day)} "
                   f"(setting present = {settings.present}): {trace.bounds(endpoint)}")
    return endpoint


def _reversed_hint(start_text: str, end_text: str) -> str:
    if re.search(r"\b(?:BP|ka|kya|Ma|mya|Ga|ago)\b", end_text, re.IGNORECASE):
        return "ages count back from the present: write the older first (66–56 Ma)"
    return f"did you mean {end_text} – {start_text}?"


def _range_side(part: str, side: str, text: str, settings: DateSettings) -> Endpoint:
    """One side of a free-text range; its errors name the side."""
    if not part:
        raise DateError(text, f"the range has no {side}", hint=RANGE_HINT)
    word = part.lower()
    if word in _UNKNOWN_WORDS:
        return Endpoint.open(Qualifier.UNKNOWN_START if side == "start" else Qualifier.UNKNOWN_END)
    if side == "end" and word in _RUNNING_ON_IN_A_RANGE:
        return running_on(part, settings)
    try:
        endpoint = read_single(part, settings)
    except DateError as error:
        raise DateError(text, f"the {side} {part!r}: {error.reason}", hint=error.hint,
                        position=locate(text, part)) from error
    except ValueError as error:
        reason = getattr(error, "reason", str(error))
        raise DateError(text, f"the {side} {part!r}: {reason}", hint=getattr(error, "hint", None),
                        position=locate(text, getattr(error, "fragment", None) or part)) from error
    if endpoint is None:
        raise DateError(text, f"the {side} {part!r} is not a date form timelines reads",
                        hint=DATE_HINT, position=locate(text, part))
    return endpoint
