"""Notes on date cells that a reader may mean otherwise than the settings read them.

`1600s`, an s on a century year, is the century 1600-1699 to most writers and the decade
1600-1609 to some (a table written by a program that names decades by their first year). The
hundreds setting decides; one note per date column names the rows that depend on it, so that
a reader can check them.

`3450 ± 40 BP`, an age with an error term in years BP, is read as calendar years before 1950
unless the bp setting says radiocarbon; written so, it is often an uncalibrated radiocarbon
age, which lies centuries from its calendar reading. One note for the table names the columns
and rows (dates/c14.py reads `14C BP`, `uncal BP` and laboratory codes as radiocarbon).

`-300`, a year written as a signed number, is 300 BC to most historians and archaeologists
and 301 BC to ISO 8601 (dates/signed.py). The signed-years setting decides; one note per date
column names the rows that depend on it.

Each note asks its question once per distinct value of a column (guarded.flagged_offsets): a
million-row table has a hundred thousand distinct dates or fewer, and most have no note.
"""
from __future__ import annotations

import re
from collections.abc import Callable

from ..dates.settings import DateSettings
from ..dates.text import writes_hundreds
from .columns import ColumnMap
from .guarded import flagged_offsets
from .problems import Problem, row_ranges
from .serials import LARGEST_YEAR_NUMBER
from .tables import Table

_READINGS = {"century": ("centuries", "1600–1699", "decade", "1600–1609"),
             "decade": ("decades", "1600–1609", "century", "1600–1699")}


def hundreds_notes(source: str, header: tuple[str, ...], cells: list[list[object]],
                   rows: list[int], date_places: set[int],
                   settings: DateSettings) -> list[Problem]:
    """A note for each date column with cells such as `1600s`, naming their rows."""
    notes = []
    for place in sorted(date_places):
        offsets = flagged_offsets(cells[place], _writes_hundreds)
        if offsets:
            found = [rows[offset] for offset in offsets]
            example = min(map(cells[place].__getitem__, offsets))
            notes.append(_note(source, header[place], found, example, settings))
    return notes


def _writes_hundreds(value: object) -> bool:
    return type(value) is str and writes_hundreds(value)


def _note(source: str, column: str, found: list[int], example: str,
          settings: DateSettings) -> Problem:
    plural, reading, other, other_reading = _READINGS[settings.hundreds]
    cells = "a cell writes" if len(found) == 1 else f"{len(found)} cells write"
    reason = (f"{cells} an s on a century year, read as {plural} (1600s = {reading}; "
              f"{row_ranges(found)})")
    hint = (f"--hundreds {other} reads 1600s as {other_reading}; writing {reading} says which")
    return Problem(source, found[0], column, None, example.strip(), reason, "note", hint)


# A year written as a bare signed number inside a cell's text: -300, c. -300, -300 – -200; not
# the end of a range (1650-1660), a day (12-Apr-1650) or a zero-padded ISO year (-0300).
SIGNED_NUMBER = re.compile(r"(?<![0-9A-Za-z])[-\u2212][1-9][0-9]*(?![0-9])")
ZERO_YEAR = re.compile(r"[-+\u2212]?0{1,3}")     # 0, -0, 000; not ISO's 0000
_SIGN_READINGS = {"bc": ("BC/AD years with no year zero", "300 BC", "astronomical",
                         "301 BC, as ISO 8601 does", "300 BC"),
                  "astronomical": ("astronomical years, as ISO 8601 counts them", "301 BC",
                                   "bc", "300 BC", "301 BC")}


def signed_year_notes(table: Table, columns: ColumnMap,
                      settings: DateSettings) -> tuple[Problem, ...]:
    """One note for the table when its date columns write years as signed numbers (-300, or
    a negative number cell), naming the columns and rows: the signed-years setting decided
    what they mean."""
    zero_read = settings.signed_years == "astronomical" or settings.year_zero == "1bc"
    written = _writes_signed_or_zero if zero_read else _writes_signed_year
    found = _date_rows(table, columns, written)
    return (_signed_note(table.source, found, settings),) if found else ()


def _date_rows(table: Table, columns: ColumnMap,
               flagged: Callable[[object], object]) -> dict[str, list[int]]:
    """The rows of each date column (start, end, when, each once) whose cells are flagged,
    for the columns that have any."""
    found: dict[str, list[int]] = {}
    for name in dict.fromkeys((columns.start, columns.end, columns.when)):
        if name is not None and name in table.header:
            cells = table.columns[table.header.index(name)]
            offsets = flagged_offsets(cells, flagged)
            if offsets:
                found[name] = [offset + table.first_row for offset in offsets]
    return found


# `3450 ± 40 BP` as written: a whole age within the curves' reach, an error term, plain BP.
PLAIN_BP_AGE = re.compile(r"(?<![0-9.,])[0-9]{2,5}\s*(?:\u00b1|\+/-|\+-)\s*[0-9]{1,4}\s*BP\b"
                          r"(?!\s*\(?\s*uncal)", re.IGNORECASE)


def bp_age_notes(table: Table, columns: ColumnMap, settings: DateSettings) -> tuple[Problem, ...]:
    """One note when date cells write `N ± E BP` read as calendar years (the bp setting
    "calendar"), naming the columns and rows: they may be uncalibrated radiocarbon ages."""
    if settings.bp != "calendar":
        return ()
    found = _date_rows(table, columns, _writes_plain_bp_age)
    if not found:
        return ()
    count = sum(map(len, found.values()))
    cells = "a cell writes" if count == 1 else f"{count} cells write"
    where = "; ".join(f"{name!r} {row_ranges(rows)}" for name, rows in found.items())
    reason = (f"{cells} an age such as 3450 ± 40 BP, read as calendar years before 1950 "
              f"({where}); if these are radiocarbon ages they lie centuries from that")
    hint = ("--bp radiocarbon calibrates them (IntCal20; --curve shcal20 for the southern "
            "hemisphere); writing 14C BP or cal BP says which")
    first = min(min(rows) for rows in found.values())
    return (Problem(table.source, first, None, None, "", reason, "note", hint),)


def _writes_plain_bp_age(value: object) -> bool:
    return (type(value) is str and "BP" in value.upper()
            and PLAIN_BP_AGE.search(value) is not None and "CAL" not in value.upper())


def _writes_signed_or_zero(value: object) -> bool:
    """Under settings that read a year 0 (as 1 BC), a 0 depends on them as -300 does."""
    return _writes_signed_year(value) or _writes_zero(value)


def _writes_signed_year(value: object) -> bool:
    if type(value) is str:
        return ("-" in value or "\u2212" in value) and SIGNED_NUMBER.search(value) is not None
    return type(value) in (int, float) and -LARGEST_YEAR_NUMBER <= value < 0


def _writes_zero(value: object) -> bool:
    """A year 0 that the settings read (as 1 BC): a number cell 0, or 0 written bare."""
    if type(value) is str:
        return ZERO_YEAR.fullmatch(value.strip()) is not None
    return type(value) in (int, float) and value == 0


def _signed_note(source: str, found: dict[str, list[int]], settings: DateSettings) -> Problem:
    reading, meaning, other, other_meaning, written = _SIGN_READINGS[settings.signed_years]
    count = sum(map(len, found.values()))
    cells = "a cell writes" if count == 1 else f"{count} cells write"
    where = "; ".join(f"{name!r} {row_ranges(rows)}" for name, rows in found.items())
    zero = ", 0 = 1 BC" if settings.signed_years == "astronomical" or (
        settings.year_zero == "1bc") else ""
    reason = (f"{cells} a year as a signed number, read as {reading} (-300 = {meaning}"
              f"{zero}; {where})")
    hint = (f"--signed-years {other} reads -300 as {other_meaning}; writing {written} "
            "says which")
    first = min(min(rows) for rows in found.values())
    return Problem(source, first, None, None, "", reason, "note", hint)
