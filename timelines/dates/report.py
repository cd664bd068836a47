"""`describe`: the JSON object `timelines parse --json` prints for one input (DESIGN §5)."""
from __future__ import annotations

from ..calendar import iso_from_fixed, year_text
from ..errors import DateError
from ..model import Endpoint, Span
from .cells import no_date_words
from .ranges import parse_span
from .settings import DEFAULT_SETTINGS, DateSettings
from .windows import coarser


def describe(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> dict:
    """What `text` reads as, in plain JSON types.

    Keys: input (exactly as given), ok, earliest, latest, likely, precision, qualifiers (sorted),
    error (the DateError reason, else null). Dates are ISO 8601 calendar dates (proleptic
    Gregorian, astronomical years); an open or unknown bound is null. For a range, "start" and
    "end" hold the same keys for each endpoint (less input/ok/error), and the top level is the
    possible extent: start's earliest .. end's latest, no likely day, the coarser of the two
    precisions, the union of their qualifiers.
    """
    if " ".join(text.lower().split()) in no_date_words():
        # Not a failure to read: the text says there is no date, as an empty cell does.
        return _failure(text, f"no date: {text.strip()!r} says the date is not known; in a "
                              "table, the row counts as undated and is listed under the chart")
    try:
        span = parse_span(text, settings)
    except DateError as error:
        return _failure(text, error.reason)
    if span.is_point:
        return {"input": text, "ok": True, **_window(span.start), "error": None}
    summary = {"input": text, "ok": True, **_extent(span), "error": None}
    return summary | {"start": _window(span.start), "end": _window(span.end)}


def _window(endpoint: Endpoint) -> dict:
    window = {
        "earliest": _iso(endpoint.earliest),
        "latest": _iso(endpoint.latest),
        "likely": _iso(endpoint.likely),
        "precision": None if endpoint.precision is None else endpoint.precision.value,
        "qualifiers": sorted(q.value for q in endpoint.qualifiers),
    }
    if endpoint.radiocarbon is not None:
        window["radiocarbon"] = _calibrated(endpoint.radiocarbon)
    return window


def _calibrated(measured) -> dict:
    """A calibrated radiocarbon age: the measurement, the curve, the ranges per level (years
    BC/AD and astronomical, with their probability) and the median year."""
    return {
        "age": measured.age, "error": measured.error, "curve": measured.curve,
        "lab": measured.lab, "citation": measured.citation,
        "ranges": {f"{level:.1%}": [{"from": year_text(first, "bc", mark_common_era=True),
                                     "to": year_text(last, "bc", mark_common_era=True),
                                     "from_year": first, "to_year": last,
                                     "probability": probability}
                                    for first, last, probability in ranges]
                   for level, ranges in measured.ranges},
        "median": year_text(measured.median_year, "bc", mark_common_era=True),
    }


def _extent(span: Span) -> dict:
    precision = coarser(span.start.precision, span.end.precision)
    return {
        "earliest": _iso(span.start.earliest),
        "latest": _iso(span.end.latest),
        "likely": None,
        "precision": None if precision is None else precision.value,
        "qualifiers": sorted(q.value for q in span.start.qualifiers | span.end.qualifiers),
    }


def _failure(text: str, reason: str) -> dict:
    return {"input": text, "ok": False, "earliest": None, "latest": None, "likely": None,
            "precision": None, "qualifiers": [], "error": reason}


def _iso(fixed: int | None) -> str | None:
    return None if fixed is None else iso_from_fixed(fixed)
