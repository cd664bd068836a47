"""A record's text in any column of its table, by the column's header name.

Lane settings, facets and sorting name columns as the user's header does; a record keeps the
cells of its roles (label, id, group, colour, start, end) as attributes and every other cell
in `Record.fields`. `column_reader` hides which is which.
"""
from __future__ import annotations

from typing import Callable

from ..errors import UsageError, did_you_mean
from ..model import Record
from .columns import ColumnMap, column_parts, existing_column


def column_reader(columns: ColumnMap, header: tuple[str, ...] | None, name: str, part: str,
                  keywords: tuple[str, ...] = ()) -> Callable[[Record], str | None]:
    """A function giving a record's text in column `name` (checked against `header`; None:
    records made by the caller, whose other columns are in `Record.fields`). `part` names
    what the column is for in messages; `keywords` are words the option also takes, offered
    in the hint beside the header's names."""
    if header is not None:
        try:
            name = existing_column(header, name, part)
        except UsageError as error:
            hint = did_you_mean(name, (*keywords, *header)) if keywords else error.hint
            raise UsageError(str(error), hint=hint) from None
    role = next((role for role, column in column_parts(columns) if column == name), None)
    if role in ("label", "id", "group", "color"):
        return lambda record: getattr(record, role)
    if role in ("start", "when"):
        return lambda record: record.start_text
    if role == "end":
        return lambda record: record.end_text

    def field_text(record: Record) -> str | None:
        for column, text in record.fields:
            if column == name:
                return text
        return None

    return field_text
