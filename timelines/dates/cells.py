"""Spreadsheet cells as dates: whatever a table reader hands over, without importing pandas.

- empty: None, NaN, pandas NaT/NA, a blank or whitespace-only string, and the words that say
  there is no date (`n.d.`, `s.d.`, `undated`, `unknown`, `?`) -> None (no date);
- a string -> the date language (stripped first);
- a date or date-time (`datetime.date`, `datetime.datetime`, `pandas.Timestamp`: anything with
  year, month and day) -> that day; these types are proleptic Gregorian, as is ISO 8601;
- a whole number (int, or a float such as 1650.0 as spreadsheets store numbers) -> that year,
  in the calendar setting like the text `1650`; a negative number or 0 as the signed-years and
  year-zero settings read the text `-300` or `0` (signed.py); any other number is refused.
"""
from __future__ import annotations

import math
import numbers

from ..calendar import GREGORIAN
from ..errors import DateError
from ..model import Endpoint, Precision, Span
from .ranges import parse_endpoint, parse_span
from .reasons import DATE_HINT, reading
from .settings import DEFAULT_SETTINGS, DateSettings
from .signed import negative_year, zero_year
from .windows import day, digits_about, years

# What cataloguers write for "no date" (n.d., Latin s.d. sine dato): the cell says no date.
NO_DATE_WORDS = frozenset({"n.d.", "n.d", "nd", "s.d.", "s.d", "undated", "unknown", "?", "??"})
_NO_DATE_WORDS: set[str] = set()


def no_date_words() -> set[str]:
    """NO_DATE_WORDS with each language table's words for no date (sans date, o. J., sine
    anno), read when a cell first needs them."""
    if not _NO_DATE_WORDS:
        from .languages import CODES, table
        _NO_DATE_WORDS.update(NO_DATE_WORDS, (spelling.lower() for code in CODES
                                              for spelling, concept in table(code).spellings
                                              if concept == "unknown"))
    return _NO_DATE_WORDS


# pandas' missing-value markers, known by name so that this module need not import pandas.
_MISSING_TYPES = frozenset({"NaTType", "NAType"})


def endpoint_from_cell(value: object, settings: DateSettings = DEFAULT_SETTINGS) -> Endpoint | None:
    """The endpoint a start or end cell holds; None for an empty cell."""
    if is_empty_cell(value):
        return None
    if isinstance(value, str):
        return parse_endpoint(value, settings)
    return _endpoint_from_value(value, settings)


def span_from_cell(value: object, settings: DateSettings = DEFAULT_SETTINGS) -> Span | None:
    """The span a single date cell holds (a range, or a point); None for an empty cell."""
    if is_empty_cell(value):
        return None
    if isinstance(value, str):
        return parse_span(value, settings)
    return Span.point(_endpoint_from_value(value, settings))


def is_empty_cell(value: object) -> bool:
    if value is None or type(value).__name__ in _MISSING_TYPES:
        return True
    if isinstance(value, str):
        return not value.strip() or value.strip().lower() in NO_DATE_WORDS or (
            " ".join(value.lower().split()) in no_date_words())
    return isinstance(value, float) and math.isnan(value)


def _endpoint_from_value(value: object, settings: DateSettings) -> Endpoint:
    if isinstance(value, bool):
        raise DateError(str(value), "a true/false cell is not a date", hint=DATE_HINT)
    if isinstance(value, numbers.Integral):
        return _year_cell(int(value), _integer_text(int(value)), settings)
    if isinstance(value, numbers.Real):
        return _number_cell(float(value), settings)
    if all(hasattr(value, name) for name in ("year", "month", "day")):
        return _day_cell(value)
    raise DateError(str(value), f"a cell of type {type(value).__name__} is not a date",
                    hint=DATE_HINT)


def _integer_text(number: int) -> str:
    try:
        return str(number)
    except ValueError:   # over sys.get_int_max_str_digits() digits (4,300 unless set)
        return f"a whole number of {digits_about(number)} digits"


def _year_cell(year: int, text: str, settings: DateSettings) -> Endpoint:
    with reading(text):
        if year < 0:
            return negative_year(-year, text, None, settings)[0]
        if year == 0:
            return zero_year(text, None, settings)[0]
        return years(year, year, settings.reckoning, Precision.YEAR)


def _number_cell(number: float, settings: DateSettings) -> Endpoint:
    text = repr(number)
    if math.isnan(number) or math.isinf(number) or not number.is_integer():
        raise DateError(text, "a number that is not a whole year",
                        hint="a year cell holds a whole number such as 1650")
    return _year_cell(int(number), text, settings)


def _day_cell(value: object) -> Endpoint:
    text = str(value)
    with reading(text):
        try:
            year, month, day_number = int(value.year), int(value.month), int(value.day)
        except (TypeError, OverflowError) as error:
            raise ValueError("its year, month and day are not whole numbers") from error
        return day(year, month, day_number, GREGORIAN)
