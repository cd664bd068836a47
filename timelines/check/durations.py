"""A longest plausible duration, bounding what a record leaves open.

An empty death cell says nothing about when someone died, and "after 1780" nothing about how
long after. Left alone, such an end has no limit, and a chart can only draw it short and say
so. A practitioner often knows more than the cell: a life lasts at most about 110 years (a
common genealogists' rule of thumb; common practice, no source), an apprenticeship at most ten,
a ship's service forty. Given such a duration, an unknown or one-sided end is bounded by the
other end plus (or minus) it: a birth in 1650 gives a death no later than 1760.

The duration is the user's, never a default: per table (`longest`), or per record from a
column. Each bound it sets carries the qualifier `duration_bound`, so tooltips and the legend
can say where the limit came from. A record whose own dates already exceed the duration
(born 1650, died after 1780, longest 110 years) keeps its open side and gets a warning: the
duration or the record is wrong, and only the user can say which.
"""
from __future__ import annotations

from collections.abc import Callable, Iterable
from dataclasses import dataclass, replace

from ..model import Endpoint, Qualifier, Record, Span
from .report import Finding

_BOUND = frozenset({Qualifier.DURATION_BOUND})


@dataclass(frozen=True, slots=True)
class Bounded:
    records: tuple[Record, ...]
    count: int                                  # records given a bound they lacked
    findings: tuple[Finding, ...] = ()          # records longer than the duration allows


def bound_by_longest(records: Iterable[Record],
                     longest_of: Callable[[Record], float | None], text: str) -> Bounded:
    """Each record with an unknown or one-sided side bounded by `longest_of(record)` days
    (None: no duration for it); `text` names the setting in messages ("--longest 110y")."""
    kept, findings, count = [], [], 0
    for record in records:
        days = longest_of(record) if record.span is not None else None
        bounded = _bounded(record.span, days) if days is not None else record.span
        if bounded is None:
            findings.append(_too_long(record, text))
            bounded = record.span
        elif bounded is not record.span:
            record = replace(record, span=bounded)
            count += 1
        kept.append(record)
    return Bounded(tuple(kept), count, tuple(findings))


def _bounded(span: Span, days: float) -> Span | None:
    """`span` with its far-side gaps bounded by `days` from the other end; the same span when
    nothing is open, None when its own dates already take longer than `days`."""
    start, end = span.start, span.end
    if end.latest is None and not end.is_open and start.latest is not None:
        end = _with_latest(end, int(start.latest + days))
    if start.earliest is None and not start.is_open and end.earliest is not None:
        start = _with_earliest(start, int(end.earliest - days))
    if start is span.start and end is span.end:
        return span
    if end is None or start is None:
        return None
    return Span(start, end)


def _with_latest(endpoint: Endpoint, latest: int) -> Endpoint | None:
    if endpoint.earliest is not None and latest < endpoint.earliest:
        return None
    return replace(endpoint, latest=latest, qualifiers=endpoint.qualifiers | _BOUND)


def _with_earliest(endpoint: Endpoint, earliest: int) -> Endpoint | None:
    if endpoint.latest is not None and earliest > endpoint.latest:
        return None
    return replace(endpoint, earliest=earliest, qualifiers=endpoint.qualifiers | _BOUND)


def _too_long(record: Record, text: str) -> Finding:
    return Finding(record.provenance.source, record.provenance.row, None, record.id,
                   f"{record.date_text!r} already takes longer than {text}; its open side "
                   "is left unbounded", "longer than the longest duration")
