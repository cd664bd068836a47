"""Notes on how a text was read, collected only while `explain` asks for them.

Readers write `if trace.on: trace.note(...)`, so that reading without an explanation costs one
attribute test per note. Notes name endpoints by their ISO 8601 (proleptic Gregorian) bounds.
"""
from __future__ import annotations

from contextlib import contextmanager
from typing import Iterator

from ..calendar import iso_from_fixed
from ..model import Endpoint

on = False
_notes: list[str] = []


@contextmanager
def collecting() -> Iterator[list[str]]:
    """Collect the notes written inside the block into the list it yields."""
    global on, _notes
    saved = on, _notes
    on, _notes = True, []
    try:
        yield _notes
    finally:
        on, _notes = saved


def note(message: str) -> None:
    if on:
        _notes.append(message)


def place() -> int:
    """Where the next note will stand: a reader that notes its result after its parts have
    noted theirs puts its note here (`note_at`), so that the notes read from the outside in."""
    return len(_notes)


def note_at(index: int, message: str) -> None:
    if on:
        _notes.insert(index, message)


def bounds(endpoint: Endpoint) -> str:
    """`1650-01-01 .. 1659-12-31`, `open` for a side without a bound."""
    return f"{day_text(endpoint.earliest)} .. {day_text(endpoint.latest)}"


def day_text(fixed: int | None) -> str:
    return "open" if fixed is None else iso_from_fixed(fixed)
