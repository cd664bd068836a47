"""The notes on date cells ask their question once per distinct cell value, not once per cell,
and say exactly what asking each cell said.

A million-row table has a hundred thousand distinct dates or fewer; asking each of its cells
took longer than reading it. The reference below is the per-cell computation the notes were
made by before, kept as the definition of their output: on small tables with repeated values
and mixed types (1650, 1650.0, "1650" and True, which are equal dict keys; 0, 0.0 and False)
both must give the same notes, text, rows and order.
"""
from __future__ import annotations

import itertools
from dataclasses import replace
from datetime import datetime

import pytest
from hypothesis import given, settings as hypothesis_settings, strategies as st

from timelines.dates import DateSettings
from timelines.dates.text import writes_hundreds
from timelines.sources import ColumnMap, Problem, Table, UnreadableCell
from timelines.sources.conventions import (
    PLAIN_BP_AGE, SIGNED_NUMBER, ZERO_YEAR, _note, _signed_note, bp_age_notes, hundreds_notes,
    signed_year_notes)
from timelines.sources.guarded import flagged_offsets, unknown_value_notes
from timelines.sources.problems import row_ranges
from timelines.sources.serials import LARGEST_YEAR_NUMBER
from timelines.sources.sheets import error_value, formula_without_value

NAN = float("nan")
FORMULA = formula_without_value("=A2+1")
# Cells a date column may hold: each note's cases, their near misses, and values that are
# equal dict keys but not the same cell (1650 == 1650.0, 1 == 1.0 == True, 0 == 0.0 == False).
CELLS = [
    "", " ", "1650", 1650, 1650.0, True, False, 1, 1.0, 0, 0.0, "0", "-0", "000", "0000", " 0 ",
    -300, -300.0, -1, -1.0, "-300", "c. -300", "-300 – -200", "\u2212300", "1650-1660",
    "12-Apr-1650", "-0300", -LARGEST_YEAR_NUMBER, -LARGEST_YEAR_NUMBER - 1, 12.5, -0.5,
    "1600s", "1700's", "THE 1900S", "c. 1600s", "1600", "1650s",
    "3450 ± 40 BP", "3450±40 bp", "3450 +/- 40 BP", "3450 ± 40 cal BP", "3450 ± 40 BP (uncal)",
    "3450 ± 40 14C BP", "OxA-1234: 3450 ± 40 BP",
    datetime(1650, 4, 12), NAN, FORMULA, error_value("#DIV/0!"),
]
# A spreadsheet's date column as its reader gives it: text, whole years, days, unreadable cells
# (no two of these types have equal cells, so the values are their own keys).
SHEET_CELLS = [cell for cell in CELLS if type(cell) not in (float, bool)] + [None]


class Text(str):
    """A str of another type (a DataFrame may hold one): equal to the str, never read as it."""


ALL_SETTINGS = [DateSettings(signed_years=signed, year_zero=zero, hundreds=hundreds, bp=bp)
                for signed, zero, hundreds, bp in itertools.product(
                    ("bc", "astronomical"), ("refuse", "1bc"), ("century", "decade"),
                    ("calendar", "radiocarbon"))]


# --- the per-cell computation the notes were made by ------------------------------------------

def _signed(value: object) -> bool:
    if type(value) is str:
        return ("-" in value or "\u2212" in value) and SIGNED_NUMBER.search(value) is not None
    return type(value) in (int, float) and -LARGEST_YEAR_NUMBER <= value < 0


def _zero(value: object) -> bool:
    if type(value) is str:
        return ZERO_YEAR.fullmatch(value.strip()) is not None
    return type(value) in (int, float) and value == 0


def _date_columns(table: Table, columns: ColumnMap):
    for name in dict.fromkeys((columns.start, columns.end, columns.when)):
        if name is not None and name in table.header:
            yield name, table.columns[table.header.index(name)]


def per_cell_signed_year_notes(table: Table, columns: ColumnMap,
                               settings: DateSettings) -> tuple[Problem, ...]:
    zero_read = settings.signed_years == "astronomical" or settings.year_zero == "1bc"
    found = {}
    for name, cells in _date_columns(table, columns):
        rows = [index + table.first_row for index, value in enumerate(cells)
                if _signed(value) or zero_read and _zero(value)]
        if rows:
            found[name] = rows
    return (_signed_note(table.source, found, settings),) if found else ()


def per_cell_bp_age_notes(table: Table, columns: ColumnMap,
                          settings: DateSettings) -> tuple[Problem, ...]:
    if settings.bp != "calendar":
        return ()
    found = {}
    for name, cells in _date_columns(table, columns):
        rows = [index + table.first_row for index, value in enumerate(cells)
                if type(value) is str and "BP" in value.upper()
                and PLAIN_BP_AGE.search(value) and "CAL" not in value.upper()]
        if rows:
            found[name] = rows
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


def per_cell_hundreds_notes(source, header, cells, rows, date_places, settings) -> list[Problem]:
    notes = []
    for place in sorted(date_places):
        found = [rows[index] for index, value in enumerate(cells[place])
                 if type(value) is str and writes_hundreds(value)]
        if found:
            example = min(value for value in cells[place]
                          if type(value) is str and writes_hundreds(value))
            notes.append(_note(source, header[place], found, example, settings))
    return notes


def per_cell_unknown_value_notes(table, cells, rows, date_places) -> list[Problem]:
    notes = []
    for place in sorted(table.marked - date_places):
        unknown = [rows[index] for index, value in enumerate(cells[place])
                   if type(value) is UnreadableCell and not value.shown]
        if unknown:
            count = "a formula has" if len(unknown) == 1 else f"{len(unknown)} formulas have"
            reason = f"{count} no saved value ({row_ranges(unknown)}); read as empty"
            notes.append(Problem(table.source, unknown[0], table.header[place], None, "",
                                 reason, "note",
                                 hint="open and save the file in a spreadsheet program"))
    return notes


# --- the notes against it ---------------------------------------------------------------------

HEADER = ("label", "start", "end", "when")
COLUMN_MAPS = [ColumnMap(start="start", end="end"), ColumnMap(when="when"),
               ColumnMap(start="start", end="start"), ColumnMap(start="end", when="when"),
               ColumnMap(start="start", end="absent")]


def _table(columns: list[list[object]], first_row: int = 2) -> Table:
    cells = [[f"row {index}" for index in range(len(columns[0]))], *columns]
    return replace(Table("register.csv", HEADER, tuple(cells), marked=frozenset({0, 1, 2, 3})),
                   first_row=first_row)


def _assert_same_notes(table: Table, settings: DateSettings) -> None:
    for columns in COLUMN_MAPS:
        assert signed_year_notes(table, columns, settings) == per_cell_signed_year_notes(
            table, columns, settings)
        assert bp_age_notes(table, columns, settings) == per_cell_bp_age_notes(
            table, columns, settings)
    cells = list(table.columns)
    rows = [index + table.first_row for index in range(table.row_count)]
    for places in ({1, 2}, {3}, {2}, set()):
        assert hundreds_notes(table.source, table.header, cells, rows, places, settings) == (
            per_cell_hundreds_notes(table.source, table.header, cells, rows, places, settings))
        assert unknown_value_notes(table, cells, rows, places) == per_cell_unknown_value_notes(
            table, cells, rows, places)


def _columns(pool: list[object]) -> st.SearchStrategy[list[list[object]]]:
    """Three columns of one length, of cells drawn (and so repeated) from `pool`."""
    return st.integers(1, 30).flatmap(lambda length: st.lists(
        st.lists(st.sampled_from(pool), min_size=length, max_size=length),
        min_size=3, max_size=3))


@hypothesis_settings(max_examples=300, deadline=None)
@given(st.sampled_from([CELLS, SHEET_CELLS]).flatmap(_columns),
       st.sampled_from(ALL_SETTINGS), st.sampled_from([2, 0]))
def test_random_tables_of_repeated_mixed_cells_give_the_per_cell_notes(columns, settings,
                                                                       first_row):
    _assert_same_notes(_table(columns, first_row), settings)


@pytest.mark.parametrize("settings", ALL_SETTINGS)
def test_equal_keys_of_other_types_are_asked_apart(settings):
    # 1650, 1650.0 and True (== 1), 0, 0.0 and False, -300 and -300.0 are equal dict keys:
    # a cell of each kind, in both orders, in one column, repeated.
    column = [1650, 1650.0, "1650", True, 1, 1.0, 0, False, 0.0, "0", -300, -300.0, "-300",
              "", "1600s", "3450 ± 40 BP", FORMULA]
    for cells in (column * 3, list(reversed(column)) * 3):
        _assert_same_notes(_table([cells, cells[::-1], cells[1:] + cells[:1]]), settings)


@pytest.mark.parametrize("settings", ALL_SETTINGS)
def test_a_str_of_another_type_is_not_read_as_the_equal_str(settings):
    column = ["-300", Text("-300"), "1600s", Text("1600s"), "0", Text("0"), "3450 ± 40 BP",
              Text("3450 ± 40 BP"), 1650, ""] * 2
    for cells in (column, column[::-1]):
        _assert_same_notes(_table([cells, cells[1:] + cells[:1], [""] * len(cells)]), settings)


def test_a_zero_read_as_1_bc_is_flagged_as_a_number_and_never_as_false():
    cells = [False, 0, "", False, 0.0, True, False, -2, "-2"]
    table = _table([cells, [""] * len(cells), [""] * len(cells)])
    settings = DateSettings(signed_years="astronomical")
    (note,) = signed_year_notes(table, ColumnMap(start="start"), settings)
    assert note == per_cell_signed_year_notes(table, ColumnMap(start="start"), settings)[0]
    assert note.row == 3
    assert "4 cells write" in note.reason and "'start' rows 3, 6, 9–10" in note.reason
    assert signed_year_notes(table, ColumnMap(start="start"), DateSettings()) == (
        per_cell_signed_year_notes(table, ColumnMap(start="start"), DateSettings()))


def test_notes_of_a_table_with_few_distinct_values_name_every_row():
    starts = ["-300", "1650", "1600s", "", "3450 ± 40 BP", -300] * 200
    ends = ["1700s", "", "-200"] * 400
    table = _table([starts, ends, [""] * len(starts)])
    (signed,) = signed_year_notes(table, ColumnMap(start="start", end="end"), DateSettings())
    assert signed.reason.startswith("800 cells write a year as a signed number")
    (bp,) = bp_age_notes(table, ColumnMap(start="start", end="end"), DateSettings())
    assert bp.reason.startswith("200 cells write an age such as 3450 ± 40 BP")
    rows = list(range(2, 2 + table.row_count))
    century, later = hundreds_notes(table.source, table.header, list(table.columns), rows,
                                    {1, 2}, DateSettings())
    assert (century.column, century.row, century.text) == ("start", 4, "1600s")
    assert (later.column, later.row, later.text) == ("end", 2, "1700s")
    _assert_same_notes(table, DateSettings())


def test_formulas_with_no_saved_value_are_named_by_row():
    column = [FORMULA, "", error_value("#REF!"), FORMULA, "x", formula_without_value("=B2")]
    table = _table([column * 2, [""] * 12, [""] * 12])
    rows = list(range(2, 14))
    (note,) = unknown_value_notes(table, list(table.columns), rows, {2, 3})
    assert note == Problem("register.csv", 2, "start", None, "",
                           "6 formulas have no saved value (rows 2, 5, 7–8, 11, 13); read "
                           "as empty", "note",
                           hint="open and save the file in a spreadsheet program")


def test_an_unhashable_cell_is_asked_in_its_turn():
    cells = [[-300], "-300", [-300], "1600s", ["1600s"], ""]
    table = _table([cells, [""] * 6, [""] * 6])
    _assert_same_notes(table, DateSettings())
    assert flagged_offsets(cells, lambda value: type(value) is list) == [0, 2, 4]


def test_each_distinct_value_is_asked_once():
    asked: list[object] = []

    def flagged(value: object) -> bool:
        asked.append(value)
        return value in ("-300", 0) and type(value) is not bool

    column = ["-300", "1650", 0, False, 0.0, "", NAN] * 1000
    assert flagged_offsets(column, flagged) == [
        offset for offset, value in enumerate(column) if flagged(value)]
    per_distinct = asked[:len(asked) - len(column)]
    assert sorted(map(repr, per_distinct)) == sorted(map(repr, column[:7]))
    assert flagged_offsets(["1650"] * 10, flagged) == []
    assert flagged_offsets([], flagged) == []
