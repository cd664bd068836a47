"""Reading a date column so that no cell can stop the table.

- An unexpected exception while reading a cell (anything but the DateError that says why a
  date cannot be read) is a fault of timelines, not of the table: it becomes that cell's
  problem, "internal error, please report", and every other cell is still read. The column is
  read whole, each distinct value once, as fast as ever; only when that fails is it read again
  value by value to find the values at fault.
- A spreadsheet cell with no value to read (an UnreadableCell: a formula never calculated, an
  error value, 1900-02-29) is that cell's DateError in a date column; in the other columns a
  formula with no saved value is left empty, and one note per column says so.
- A note on some cells of a column (here and in conventions.py) asks its question once per
  distinct value (flagged_offsets): a million-row column holds perhaps a hundred thousand.
"""
from __future__ import annotations

from collections.abc import Callable
from datetime import date, datetime, time

from ..dates import DateError
from ..dates.settings import DateSettings
from .problems import Problem, row_ranges
from .sheets import UnreadableCell
from .tables import Table, cell_text

INTERNAL_ERROR = "internal error, please report"
ColumnParser = Callable[..., list]   # dates.parse_column or dates.parse_span_column


def parsed_column(parse: ColumnParser, values: list[object], settings: DateSettings, *,
                  from_spreadsheet: bool = False, **options: object) -> list:
    """`parse(values, settings, **options)`, with each cell whose reading raises an
    unexpected exception given an internal-error DateError instead, and (in a spreadsheet's
    column) each UnreadableCell its own DateError."""
    try:
        results = parse(values, settings, **options)
    except Exception:  # noqa: BLE001 - a fault of ours in some cell: found below, cell by cell
        results = _each_value_guarded(parse, values, settings, options)
    if from_spreadsheet and UnreadableCell in set(map(type, values)):
        results = _unreadable_cells_refused(values, results)
    return results


def each_value_guarded(parse: ColumnParser, values: list[object], settings: DateSettings,
                       **options: object) -> list:
    """`parsed_column` after the whole column failed: each distinct value on its own."""
    return _each_value_guarded(parse, values, settings, options)


def _each_value_guarded(parse: ColumnParser, values: list[object], settings: DateSettings,
                        options: dict) -> list:
    found: dict[object, object] = {}
    for value in values:
        key = _key(value)
        if key not in found:
            found[key] = _one_value(parse, value, settings, options)
    return [found[_key(value)] for value in values]


def _key(value: object) -> object:
    # 1650, 1650.0 and True are equal dict keys; cells of different types are kept apart
    return value if type(value) is str else (type(value), value)


def _one_value(parse: ColumnParser, value: object, settings: DateSettings,
               options: dict) -> object:
    try:
        return parse([value], settings, **options)[0]
    except Exception as error:  # noqa: BLE001 - reported as this cell's problem
        return internal_error(cell_text(value), error)


def internal_error(text: str, error: BaseException) -> DateError:
    """The DateError that reports an unexpected exception as a cell's problem."""
    reported = DateError(text, INTERNAL_ERROR, hint=f"{type(error).__name__}: {error}")
    reported.__cause__ = error
    return reported


def _unreadable_cells_refused(values: list[object], results: list) -> list:
    refusals: dict[UnreadableCell, DateError] = {}
    results = list(results)
    for index, value in enumerate(values):
        if type(value) is UnreadableCell:
            if value not in refusals:
                refusals[value] = DateError(value.text, value.reason, hint=value.hint)
            results[index] = refusals[value]
    return results


def flagged_offsets(values: list[object], flagged: Callable[[object], object]) -> list[int]:
    """The offsets, in order, of the cells for which `flagged(value)` is true, asked once per
    distinct value: a note's test on each of a million cells took longer than reading them,
    and real columns repeat a lot. Cells are their own keys, as a text file's are, unless the
    column holds two types whose cells may be equal: 0, 0.0 and False are equal dict keys
    that a test may answer differently, so then each is keyed by its type, as `_key` does."""
    typed = _may_be_equal(set(map(type, values)))
    keys = list(zip(map(type, values), values)) if typed else values
    try:
        distinct = set(keys)
    except TypeError:  # an unhashable cell (a list in a DataFrame): each cell asked in turn
        return [offset for offset, value in enumerate(values) if flagged(value)]
    hits = {key for key in distinct if flagged(key[1] if typed else key)}
    # Then a set lookup per cell, no call: about a third of the time of the test on each.
    return [offset for offset, key in enumerate(keys) if key in hits] if hits else []


# Cells of these types equal no cell of another of them; numbers of different types can be
# equal (1650 == 1650.0, 1 == True), and a type not named here may equal anything.
_OWN_KIND_ONLY = frozenset({str, type(None), date, datetime, time, UnreadableCell})
_NUMBERS = frozenset({int, float, bool})


def _may_be_equal(kinds: set[type]) -> bool:
    """Whether a cell of one of these types may equal a cell of another of them."""
    if len(kinds) < 2:
        return False
    return not kinds <= _OWN_KIND_ONLY | _NUMBERS or len(kinds & _NUMBERS) > 1


def unknown_value_notes(table: Table, cells: list[list[object]], rows: list[int],
                        date_places: set[int]) -> list[Problem]:
    """A note for each column other than the date columns whose cells include formulas with
    no saved value: their cells read as empty, and the note names the rows."""
    notes = []
    for place in sorted(table.marked - date_places):
        unknown = [rows[offset] for offset in flagged_offsets(cells[place], _unknown_value)]
        if unknown:
            count = "a formula has" if len(unknown) == 1 else f"{len(unknown)} formulas have"
            reason = f"{count} no saved value ({row_ranges(unknown)}); read as empty"
            notes.append(Problem(table.source, unknown[0], table.header[place], None, "",
                                 reason, "note",
                                 hint="open and save the file in a spreadsheet program"))
    return notes


def _unknown_value(value: object) -> bool:
    """A formula with no saved value (an error value shows its text instead)."""
    return type(value) is UnreadableCell and not value.shown
