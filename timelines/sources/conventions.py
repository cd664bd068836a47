"""Notes on date cells that a reader may mean otherwise than the settings read them.

`1600s`, an s on a century year, is the century 1600-1699 to most writers and the decade
1600-1609 to some (a table written by a program that names decades by their first year). The
hundreds setting decides; one note per date column names the rows that depend on it, so that
a reader can check them.
"""
from __future__ import annotations

from ..dates.settings import DateSettings
from ..dates.text import writes_hundreds
from .problems import Problem, row_ranges

_READINGS = {"century": ("centuries", "1600–1699", "decade", "1600–1609"),
             "decade": ("decades", "1600–1609", "century", "1600–1699")}


def hundreds_notes(source: str, header: tuple[str, ...], cells: list[list[object]],
                   rows: list[int], date_places: set[int],
                   settings: DateSettings) -> list[Problem]:
    """A note for each date column with cells such as `1600s`, naming their rows."""
    notes = []
    for place in sorted(date_places):
        written = {value for value in set(cells[place])
                   if type(value) is str and writes_hundreds(value)}
        if written:
            found = [rows[index] for index, value in enumerate(cells[place]) if value in written]
            notes.append(_note(source, header[place], found, min(written), settings))
    return notes


def _note(source: str, column: str, found: list[int], example: str,
          settings: DateSettings) -> Problem:
    plural, reading, other, other_reading = _READINGS[settings.hundreds]
    cells = "a cell writes" if len(found) == 1 else f"{len(found)} cells write"
    reason = (f"{cells} an s on a century year, read as {plural} (1600s = {reading}; "
              f"{row_ranges(found)})")
    hint = (f"--hundreds {other} reads 1600s as {other_reading}; writing {reading} says which")
    return Problem(source, found[0], column, None, example.strip(), reason, "note", hint)
