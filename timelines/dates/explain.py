"""`explain(text)`: plain lines saying how each bound of `text` was reached, for
`timelines parse --explain`: the forms recognised, the rules applied, the settings used.

The readers leave notes as they go (trace.py); the last lines give the result in ISO 8601
(proleptic Gregorian) dates, or the error with its position and suggestion.
"""
from __future__ import annotations

from ..errors import DateError
from ..model import Endpoint, Span
from . import trace
from .ranges import parse_span
from .settings import DEFAULT_SETTINGS, DateSettings
from .suggest import suggestion


def explain(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> list[str]:
    """How `text` reads, in a few plain lines (never raises for a bad date)."""
    head = [f"input: {text!r}", _DATES_SHOWN]
    with trace.collecting() as notes:
        try:
            span = parse_span(text, settings)
        except DateError as error:
            return [*head, *_unique(notes), *_error_lines(text, error)]
    return [*head, *_unique(notes), *_result_lines(span)]


_DATES_SHOWN = ("dates below: ISO 8601, proleptic Gregorian, astronomical years "
                "(-0043 is 44 BC)")


def _unique(notes: list[str]) -> list[str]:
    # A form tried on a range's side and again on the whole text notes the same thing twice.
    return list(dict.fromkeys(notes))


def _error_lines(text: str, error: DateError) -> list[str]:
    lines = [f"error: {error.reason}"]
    if error.position is not None:
        lines.append(f"at: {text}")
        lines.append("    " + " " * error.position + "^")
    if error.hint:
        lines.append(f"hint: {error.hint}")
    extra = suggestion(text, error)
    if extra:
        lines.append(f"suggestion: {extra}")
    return lines


def _result_lines(span: Span) -> list[str]:
    if span.is_point:
        return [*_open_side_lines(span), f"result: {describe_endpoint(span.start)}"]
    lines = [*_open_side_lines(span), f"start: {describe_endpoint(span.start)}",
             f"end: {describe_endpoint(span.end)}"]
    low, high = span.possible_extent
    lines.append(f"possible extent: {trace.day_text(low)} .. {trace.day_text(high)}")
    core = span.certain_core
    lines.append("certain core: none (the two windows overlap)" if core is None
                 else f"certain core: {trace.day_text(core[0])} .. {trace.day_text(core[1])}")
    return lines


def _open_side_lines(span: Span) -> list[str]:
    """What a chart does with a side that has no far bound (`after 1780` as an end): drawn
    short, unless the longest-duration setting bounds it by the record's other end."""
    sides = [name for name, endpoint, day in (("earlier", span.start, span.start.earliest),
                                              ("later", span.end, span.end.latest))
             if day is None and not endpoint.is_open]
    return [f"no {side} limit: a chart draws this side short; --longest DURATION (e.g. 110y "
            "for lives) bounds it by the record's other end" for side in sides]


def describe_endpoint(endpoint: Endpoint) -> str:
    """`1645-01-01 .. 1655-12-31, year precision; approximate, convention_dependent`."""
    if endpoint.earliest is None and endpoint.latest is None:
        return ", ".join(sorted(q.value for q in endpoint.qualifiers)) or "no bound"
    parts = [trace.bounds(endpoint)]
    if endpoint.precision is not None:
        parts.append(f"{endpoint.precision.value} precision")
    if endpoint.likely is not None:
        parts.append(f"likely {trace.day_text(endpoint.likely)}")
    text = ", ".join(parts)
    if endpoint.qualifiers:
        text += "; " + ", ".join(sorted(q.value for q in endpoint.qualifiers))
    return text
