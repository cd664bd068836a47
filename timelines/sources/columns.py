"""Which column plays which part: the user's names checked, the rest found by header name."""
from __future__ import annotations

from dataclasses import dataclass, fields
from typing import Iterable

from ..errors import UsageError, did_you_mean


@dataclass(frozen=True, slots=True)
class ColumnMap:
    """Which column plays which part; None: not used (or, for `detect_columns`, not given)."""

    start: str | None = None
    end: str | None = None
    when: str | None = None              # one column holding each date or range
    label: str | None = None
    group: str | None = None
    color: str | None = None
    id: str | None = None

    def used(self) -> tuple[str, ...]:
        """The columns in use, in field order."""
        return tuple(name for name in (getattr(self, f.name) for f in fields(self)) if name)


# Header names recognised for each part, compared without case, spaces or punctuation,
# in order of preference. Common practice, no source.
COLUMN_NAMES: dict[str, tuple[str, ...]] = {
    "start": ("start", "start date", "begin", "begin date", "beginning", "from", "date from",
              "start year", "born", "birth", "date of birth"),
    "end": ("end", "end date", "until", "to", "date to", "end year", "died", "death",
            "date of death"),
    "when": ("when", "date", "dates", "period", "year"),
    "label": ("label", "name", "title", "event"),
    "group": ("group", "category", "type"),
    "color": ("color", "colour"),
    "id": ("id", "identifier", "ref", "reference", "no", "number"),
}


def detect_columns(header: Iterable[str], given: ColumnMap = ColumnMap()) -> ColumnMap:
    """Complete `given` from the header: named columns are checked, omitted ones looked up.

    Start and end take precedence: `when` is looked up only if neither a start nor an end
    column was named or found. Raises UsageError for a named column that does not exist (with
    a "did you mean"), for `when` named together with start or end, and when no date column
    can be found."""
    header = tuple(header)
    if given.when and (given.start or given.end):
        raise UsageError("a 'when' column cannot be combined with start or end columns",
                         hint="use --when for one column holding each date or range, "
                              "or --start/--end for two columns")
    chosen = {part: existing_column(header, name, part)
              for part, name in column_parts(given) if name is not None}
    date_parts = ("when",) if given.when else ("start", "end", "when")
    for part in ("label", "group", "color", "id", *date_parts):
        if part == "when" and (chosen.get("start") or chosen.get("end")):
            break  # start and end found: a "Date" column stays an ordinary field
        chosen.setdefault(part, _known_column(header, part, set(chosen.values())))
    if not (chosen.get("start") or chosen.get("end") or chosen.get("when")):
        listed = ", ".join(repr(name) for name in header)
        raise UsageError(f"no date column found among {listed}",
                         hint="name them with --start and --end (a start and an end column) "
                              "or --when (one column holding each date or range)")
    return ColumnMap(**chosen)


def column_parts(columns: ColumnMap) -> list[tuple[str, str | None]]:
    return [(f.name, getattr(columns, f.name)) for f in fields(columns)]


def existing_column(header: tuple[str, ...], name: str, part: str) -> str:
    """The header's spelling of a column the user named: exact, else without case or spaces."""
    if name in header:
        return name
    matches = [column for column in header if _folded(column) == _folded(name)]
    if len(matches) == 1:
        return matches[0]
    listed = ", ".join(repr(column) for column in header)
    raise UsageError(f"no column {name!r} (given for {part}); the columns are {listed}",
                     hint=did_you_mean(name, header))


def _known_column(header: tuple[str, ...], part: str, taken: set[str | None]) -> str | None:
    by_folded_name: dict[str, str] = {}
    for column in header:
        if column not in taken:
            by_folded_name.setdefault(_folded(column), column)
    for candidate in COLUMN_NAMES[part]:
        column = by_folded_name.get(_folded(candidate))
        if column is not None:
            return column
    return None


def _folded(name: str) -> str:
    # "Start date", "start_date" and "StartDate" name the same column.
    return "".join(character for character in name.casefold() if character.isalnum())
