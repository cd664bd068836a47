"""The date language: what people write in a date cell, read into explicit endpoint windows.

- `parse_date(text)`: one date -> `Endpoint`;
- `parse_span(text)`: a range (`1650–1660`, `1985/1987`, `../1760`) or one date -> `Span`;
- `parse_endpoint(text)`: for a start or end column: one date, or a range as one window;
- `endpoint_from_cell(value)`, `span_from_cell(value)`: any spreadsheet cell (None when empty);
- `describe(text)`: the JSON object of `timelines parse --json`.

Forms live one function each in `iso` (ISO 8601-1/-2, proleptic Gregorian) and `text`
(historians' English, in the calendar setting); `single` adds `c.`, `before`, `after`; `ranges`
joins two dates. Every failure is a `DateError` with a reason and, where one helps, a hint.
Conventions that practitioners settle differently are in `DateSettings`.
"""
from ..errors import DateError
from .cells import endpoint_from_cell, span_from_cell
from .column import parse_column, parse_span_column
from .explain import explain
from .normal import iso_form
from .options import SETTING_HELP, options_from_settings, settings_from_options
from .ranges import parse_endpoint, parse_span
from .report import describe
from .settings import DEFAULT_SETTINGS, DateSettings
from .single import parse_date

__all__ = [
    "DEFAULT_SETTINGS", "DateError", "DateSettings", "SETTING_HELP", "describe",
    "endpoint_from_cell", "explain", "iso_form", "options_from_settings", "parse_column",
    "parse_date", "parse_endpoint", "parse_span", "parse_span_column", "settings_from_options",
    "span_from_cell",
]
