"""The user's table of named periods and reigns (issue 16): a CSV, TSV, XLSX or ODS file
read as any other table (tables.py), its periods read by `dates.periods`.

Columns, named in any letter case, in any order, others ignored:
- `label` (required): the name the period is written by: `Bronze Age`, `Aldric II`;
- `start`, `end` (required): dates in the date language: `c. 3300 BC`, `1102-03-14`;
- `aliases`: other names, separated by `;` or `|`: `Aldric the Younger; the Younger King`;
- `kind`: `reign` (regnal years are counted from its start, the accession) or `period`
  (the default when the column or the cell is empty).
"""
from __future__ import annotations

from pathlib import Path

from ..dates.periods import COLUMNS, PeriodTable, periods_from_rows
from ..dates.settings import DEFAULT_SETTINGS, DateSettings
from ..errors import SourceError, did_you_mean
from .tables import cell_text, read_table

REQUIRED = ("label", "start", "end")


def read_periods_file(path: str | Path, settings: DateSettings = DEFAULT_SETTINGS, *,
                      sheet: str | int | None = None,
                      encoding: str | None = None) -> PeriodTable:
    """The periods of a table file; raises SourceError for a file that cannot be read or
    lacks a required column, and DateError for a bad row (dates.periods.periods_from_rows)."""
    table = read_table(path, sheet, encoding=encoding)
    roles = {name.strip().casefold(): place for place, name in enumerate(table.header)}
    missing = [role for role in REQUIRED if role not in roles]
    if missing:
        listed = ", ".join(repr(name) for name in table.header)
        raise SourceError(f"{table.source}: a periods table needs a label, a start and an end "
                          f"column; there is no {' and no '.join(missing)} column among {listed}",
                          hint=did_you_mean(missing[0], table.header) or "name the columns "
                          "label, start, end (and optionally aliases, kind) in the first row")
    used = [(table.header[place], place) for role, place in roles.items() if role in COLUMNS]
    rows = ({name: cell_text(row[place]) for name, place in used} for row in table.rows)
    return periods_from_rows(rows, settings, table.source, first_row=table.first_row)
