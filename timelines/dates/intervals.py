"""ISO 8601 intervals `A/B`: ISO dates (-1 or -2) on each side, `..` for an open side (the span
runs on), nothing for an unknown one. `1984~/2004-06`, `../1760`, `1760/..`, `/1760`.

Durations (`P1Y`) are not read. A free-text date on a side is refused: the slash of an
interval is ISO 8601's; free text joins two dates with a dash or `to`.
"""
from __future__ import annotations

from ..errors import DateError
from ..model import Endpoint, Qualifier, Span
from . import trace
from .core import iso_date
from .reasons import locate
from .settings import DateSettings
from .windows import ordered_span

INTERVAL_HINT = "an ISO 8601 interval joins two dates: 1985/1987, 1985-04/1985-06, ../1760"

# (qualifier for `..`, qualifier for nothing) on each side of an interval
_START_SIDE = (Qualifier.OPEN_START, Qualifier.UNKNOWN_START)
_END_SIDE = (Qualifier.OPEN_END, Qualifier.UNKNOWN_END)


def iso_interval(text: str, original: str, settings: DateSettings) -> Span:
    """`A/B`; `text` holds one '/' or more (more are refused)."""
    parts = text.split("/")
    if len(parts) != 2:
        raise DateError(original, "an interval has exactly one '/'", hint=INTERVAL_HINT,
                        position=locate(original, "/"))
    start = _interval_side(parts[0], original, settings, _START_SIDE)
    end = _interval_side(parts[1], original, settings, _END_SIDE)
    if start.earliest is None and end.latest is None:
        raise DateError(original, "an interval needs a date on at least one side",
                        hint=INTERVAL_HINT)
    if trace.on:
        trace.note(f"ISO 8601 interval: start {trace.bounds(start)}, end {trace.bounds(end)}")
    return ordered_span(start, end, original, position=locate(original, parts[1].strip()))


def _interval_side(part: str, original: str, settings: DateSettings,
                   side: tuple[Qualifier, Qualifier]) -> Endpoint:
    date_text = part.strip()
    if date_text == "..":
        return Endpoint.open(side[0])
    if not date_text:
        return Endpoint.open(side[1])
    if date_text[0] in "Pp":
        raise DateError(original, "durations (P...) in intervals are not supported yet",
                        hint=INTERVAL_HINT, position=locate(original, date_text))
    endpoint = iso_date(date_text, settings)
    if endpoint is None:
        raise DateError(original, f"{date_text!r} is not an ISO 8601 date", hint=INTERVAL_HINT,
                        position=locate(original, date_text))
    return endpoint
