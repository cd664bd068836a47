"""Reading a date column so that no cell can stop the table.

An unexpected exception while reading a cell (anything but the DateError that says why a date
cannot be read) is a fault of timelines, not of the table: it becomes that cell's problem,
"internal error, please report", and every other cell is still read. The column is read whole,
each distinct value once, as fast as ever; only when that fails is it read again value by
value to find the values at fault.
"""
from __future__ import annotations

from collections.abc import Callable

from ..dates import DateError
from ..dates.settings import DateSettings
from .tables import cell_text

INTERNAL_ERROR = "internal error, please report"
ColumnParser = Callable[..., list]   # dates.parse_column or dates.parse_span_column


def parsed_column(parse: ColumnParser, values: list[object], settings: DateSettings,
                  **options: object) -> list:
    """`parse(values, settings, **options)`, with each cell whose reading raises an
    unexpected exception given an internal-error DateError instead."""
    try:
        return parse(values, settings, **options)
    except Exception:  # noqa: BLE001 - a fault of ours in some cell: found below, cell by cell
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

