"""Withholding the details of people who may still be living.

Family histories and case files name living people, and many laws and codes of practice limit
what may be published about them. This module offers one common safeguard; whether it is
enough is for the user's own rules and law to decide. A record counts as *possibly living*
when nothing shows that its span has ended (its end is open, unknown, or lies after `as_of`)
and it could have started within the last `years` years before `as_of` (a common genealogy
rule of thumb is 100 years; common practice, no source). Such a record keeps its place in the
chart; its label, written dates and other fields are replaced, and its dates are kept only to
the year so that a birthday cannot be read from the tooltip.
"""
from __future__ import annotations

from dataclasses import dataclass, replace

from ..calendar import gregorian_year_from_fixed, year_range
from ..model import Endpoint, Precision, Record, Span

WITHHELD_LABEL = "(withheld: possibly living)"


@dataclass(frozen=True, slots=True)
class Withheld:
    records: tuple[Record, ...]
    count: int


def possibly_living(record: Record, as_of_year: int, years: int = 100) -> bool:
    if record.span is None:
        return False
    start, end = record.span.start, record.span.end
    ended = end.latest is not None and gregorian_year_from_fixed(end.latest) <= as_of_year
    if ended and not end.is_open:
        return False
    latest_start = start.latest if start.latest is not None else start.earliest
    if latest_start is None:
        return True     # nothing known of the start: cannot rule it out
    return gregorian_year_from_fixed(latest_start) > as_of_year - years


def withhold_possibly_living(records, as_of_year: int, years: int = 100) -> Withheld:
    """The records with possibly living people's details withheld, and how many were."""
    result, count = [], 0
    for record in records:
        if possibly_living(record, as_of_year, years):
            result.append(_withheld(record))
            count += 1
        else:
            result.append(record)
    return Withheld(tuple(result), count)


def _withheld(record: Record) -> Record:
    span = Span(_to_year(record.span.start), _to_year(record.span.end))
    return replace(record, label=WITHHELD_LABEL, span=span, start_text="", end_text="",
                   id=None, fields=())


def _to_year(endpoint: Endpoint) -> Endpoint:
    """The same endpoint widened to whole years, so no day or month is disclosed."""
    if endpoint.earliest is None and endpoint.latest is None:
        return endpoint
    earliest = (None if endpoint.earliest is None
                else year_range(gregorian_year_from_fixed(endpoint.earliest), "gregorian")[0])
    latest = (None if endpoint.latest is None
              else year_range(gregorian_year_from_fixed(endpoint.latest), "gregorian")[1])
    return Endpoint(earliest, latest, Precision.YEAR, endpoint.qualifiers)
