"""Endpoints and spans made without running their checks again: for speed alone.

`Endpoint` and `Span` check their bounds in `__post_init__` (earliest <= latest, the end not
wholly before the start). The quick lane (quick.py) and the bulk ISO column (column.py) have
made sure of that already, or build values that cannot break it (one day; a point span): they
set the slots directly, at about a third of the cost. What comes out equals, hashes and prints
like the same value made the ordinary way (tests/test_dates_built.py checks it).
"""
from __future__ import annotations

from ..model import Endpoint, Precision, Span, many

_NEW = object.__new__
_NO_QUALIFIERS: frozenset = frozenset()
# The slots' own descriptors: a frozen dataclass refuses attribute assignment, not these.
_EARLIEST = Endpoint.earliest.__set__
_LATEST = Endpoint.latest.__set__
_PRECISION = Endpoint.precision.__set__
_QUALIFIERS = Endpoint.qualifiers.__set__
_LIKELY = Endpoint.likely.__set__
_RADIOCARBON = Endpoint.radiocarbon.__set__
_START = Span.start.__set__
_END = Span.end.__set__
_DAY = Precision.DAY


def checked_window(earliest: int | None, latest: int | None, precision: Precision,
                   qualifiers: frozenset = _NO_QUALIFIERS, likely: int | None = None) -> Endpoint:
    """Endpoint(...) for bounds (and a likely day) the caller knows are in order."""
    endpoint = _NEW(Endpoint)
    _EARLIEST(endpoint, earliest)
    _LATEST(endpoint, latest)
    _PRECISION(endpoint, precision)
    _QUALIFIERS(endpoint, qualifiers)
    _LIKELY(endpoint, likely)
    _RADIOCARBON(endpoint, None)
    return endpoint


def day_point(fixed: int) -> Span:
    """Span.point(Endpoint.day(fixed))."""
    endpoint = _NEW(Endpoint)
    _EARLIEST(endpoint, fixed)
    _LATEST(endpoint, fixed)
    _PRECISION(endpoint, _DAY)
    _QUALIFIERS(endpoint, _NO_QUALIFIERS)
    _LIKELY(endpoint, None)
    _RADIOCARBON(endpoint, None)
    span = _NEW(Span)
    _START(span, endpoint)
    _END(span, endpoint)
    return span


def point(endpoint: Endpoint) -> Span:
    """Span.point(endpoint): a point span cannot end before it starts."""
    span = _NEW(Span)
    _START(span, endpoint)
    _END(span, endpoint)
    return span


def checked_span(start: Endpoint, end: Endpoint) -> Span:
    """Span(start, end) for sides the caller knows are in order."""
    span = _NEW(Span)
    _START(span, start)
    _END(span, end)
    return span


def days(fixed: list[int]) -> list[Endpoint]:
    """[Endpoint.day(day) for day in fixed], each slot set for all at once (a whole column)."""
    return many(Endpoint, len(fixed), earliest=fixed, latest=fixed)
