"""ISO 8601-2 sets: `[1667,1668,1670..1672]` one of, `{1667,1668,1670..1672}` all of.

An element is a date (any single date the language reads, so that the bracketed dates of
catalogues, `[1650?]`, `[ca. 1650]`, read too), a run `1670..1672` (from the first's earliest
to the last's latest day), or an open run `..1760-12-03` (on or before) or `1760-12..` (on or
after). The endpoint is the window from the earliest to the latest day any element allows,
marked `one_of` or `all_of`, `before` for an open start and `after` for an open end, with the
elements' own qualifiers. A set of one plain date is that date.
"""
from __future__ import annotations

from typing import Callable

from ..model import Endpoint, Qualifier
from . import trace
from .reasons import Unreadable
from .settings import DateSettings
from .windows import coarser

_CLOSING = {"[": "]", "{": "}"}
# ISO 8601-2 sets do not nest; a catalogue's brackets around one (`[[1667,1668]]`) make two
# levels. Three is room enough, and refusing deeper texts at once keeps the reading shallow.
MAX_BRACKET_DEPTH = 3
_KIND = {"[": Qualifier.ONE_OF, "{": Qualifier.ALL_OF}

ReadOne = Callable[[str, DateSettings], "Endpoint | None"]


def read_set(text: str, settings: DateSettings, read_one: ReadOne) -> Endpoint:
    """A set; `read_one` reads one element date (None when it is no date)."""
    opening = text[0]
    depth = bracket_depth(text)
    if depth > MAX_BRACKET_DEPTH:
        raise Unreadable(f"brackets nested {depth} deep; a date nests them at most "
                         f"{MAX_BRACKET_DEPTH} deep", fragment=text[:depth])
    if text[-1] != _CLOSING[opening]:
        raise Unreadable(f"a set opened with {opening} closes with {_CLOSING[opening]}",
                         fragment=text[-1])
    inner = text[1:-1].strip()
    if not inner:
        raise Unreadable("an empty set holds no date", fragment=text)
    if ".." not in inner:
        whole = read_one(inner, settings)
        if whole is not None:
            return whole
    elements = [_element(part.strip(), settings, read_one) for part in inner.split(",")]
    endpoint = _joined(elements, _KIND[opening])
    if trace.on:
        kind = "one of" if opening == "[" else "all of"
        trace.note(f"set ({kind}) of {len(elements)} elements: from the earliest to the latest "
                   f"day any allows: {trace.bounds(endpoint)}")
    return endpoint


def bracket_depth(text: str) -> int:
    """How deep the brackets `[ ]` and `{ }` of a text nest (an unclosed one counts too)."""
    depth = deepest = 0
    for char in text:
        if char in "[{":
            depth += 1
            deepest = max(deepest, depth)
        elif char in "]}":
            depth -= 1
    return deepest


def _element(part: str, settings: DateSettings, read_one: ReadOne) -> Endpoint:
    if not part:
        raise Unreadable("a set has an empty element", hint="separate dates with one comma")
    if ".." not in part:
        return _date(part, settings, read_one)
    first_text, _, last_text = part.partition("..")
    first = _date(first_text.strip(), settings, read_one) if first_text.strip() else None
    last = _date(last_text.strip(), settings, read_one) if last_text.strip() else None
    if first is None and last is None:
        raise Unreadable("'..' in a set needs a date on at least one side", fragment=part)
    if first is not None and last is not None:
        # A side may itself be open (`by 1670..1672`): only two known bounds can be in the
        # wrong order.
        if None not in (first.earliest, last.latest) and last.latest < first.earliest:
            raise Unreadable(f"the run {part!r} ends before it begins", fragment=part)
        return Endpoint(first.earliest, last.latest, coarser(first.precision, last.precision),
                        first.qualifiers | last.qualifiers)
    if first is None:
        return Endpoint(None, last.latest, last.precision, last.qualifiers | {Qualifier.BEFORE})
    return Endpoint(first.earliest, None, first.precision, first.qualifiers | {Qualifier.AFTER})


def _date(part: str, settings: DateSettings, read_one: ReadOne) -> Endpoint:
    endpoint = read_one(part, settings)
    if endpoint is None:
        raise Unreadable(f"{part!r} in the set is not a date", fragment=part)
    return endpoint


def _joined(elements: list[Endpoint], kind: Qualifier) -> Endpoint:
    earliest = None if any(e.earliest is None for e in elements) else min(
        e.earliest for e in elements)
    latest = None if any(e.latest is None for e in elements) else max(e.latest for e in elements)
    precision = None
    qualifiers = {kind}
    for element in elements:
        precision = coarser(precision, element.precision)
        qualifiers |= element.qualifiers
    return Endpoint(earliest, latest, precision, frozenset(qualifiers))
