"""A record's text in any column of its table, by the column's header name.

Lane settings, facets and sorting name columns as the user's header does; a record keeps the
cells of its roles (label, id, group, colour, start, end) as attributes and every other cell
in `Record.fields`. `column_reader` hides which is which.
"""
from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from ..columnar import RecordColumns
from ..errors import UsageError, did_you_mean
from ..model import Record
from .columns import ColumnMap, column_parts, existing_column


def column_reader(columns: ColumnMap, header: tuple[str, ...] | None, name: str, part: str,
                  keywords: tuple[str, ...] = ()) -> "ColumnReader":
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
    return ColumnReader(name, role)


# Where each role's text is kept: the Record attribute, and the RecordColumns column.
_ROLES = {"label": ("label", "labels"), "id": ("id", "ids"), "group": ("group", "groups"),
          "color": ("color", "colors"), "start": ("start_text", "start_texts"),
          "when": ("start_text", "start_texts"), "end": ("end_text", "end_texts")}


@dataclass(frozen=True, slots=True)
class ColumnReader:
    """A record's text in column `name` (call it with the record); `role` is the part the
    column plays (label, id, group, colour, start, when, end), None for another column."""

    name: str
    role: str | None

    def __call__(self, record: Record) -> str | None:
        if self.role in _ROLES:
            return getattr(record, _ROLES[self.role][0])
        for column, text in record.fields:
            if column == self.name:
                return text
        return None

    def texts(self, records: Sequence[Record]) -> list[str | None]:
        """The text of each of `records`: read from a table's columns where they are kept so
        (no Record made)."""
        if isinstance(records, RecordColumns):
            if self.role in _ROLES:
                return records.column(_ROLES[self.role][1])
            return records.field(self.name)
        return list(map(self, records))
