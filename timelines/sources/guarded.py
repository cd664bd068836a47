"""Reading a date column so that no cell can stop the table.

- An unexpected exception while reading a cell (anything but the DateError that says why a
  date cannot be read) is a fault of timelines, not of the table: it becomes that cell's
  problem, "internal error, please report", and every other cell is still read. The column is
  read whole, each distinct value once, as fast as ever; only when that fails is it read again
  value by value to find the values at fault.
- A spreadsheet cell with no value to read (an UnreadableCell: a formula never calculated, an
  error value, 1900-02-29) is that cell's DateError in a date column; in the other columns a
  formula with no saved value is left empty, and one note per column says so.
"""
from __future__ import annotations

from collections.abc import Callable

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


def unknown_value_notes(table: Table, cells: list[list[object]], rows: list[int],
                        date_places: set[int]) -> list[Problem]:
    """A note for each column other than the date columns whose cells include formulas with
    no saved value: their cells read as empty, and the note names the rows."""
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
