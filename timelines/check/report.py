"""Validation: counts of what was read and drawn, the problems of loading, a few warning rules.

`check(loaded)` takes what `sources.load_records` returned (anything with `records`,
`problems` and `rows_read`), or a plain sequence of Records, and gives a `Report`:

- `errors`: the problems that keep a row off the chart (cells that cannot be read, ends that
  lie wholly before their starts), one per cell, in row order;
- `undated_rows`: the rows with no date at all (no bar; listed in a note under the chart);
- `warnings`: the findings of the rules below (the rows are drawn);
- `counts`: rows read, drawn and reported; `summary()` says it in one line.

Every item's `str()` is one line `file:row[:column]: [id] message`, so a command line can print
each to stderr and end with the summary.

The rules, few on purpose:

- duplicate id: an id that occurs on more than one row is reported on every later row;
- long span: a possible extent longer than `CheckLimits.max_extent_years` (default 1000) is
  worth a second look, the usual sign of a mistyped year (`165` for `1650`). Spans with an
  endpoint of millennium or deep-time precision are exempt: they are long by nature. An
  event's window is held to the same limit, in words that say it is one moment.

A table of events (`Record.kind`, one moment in a window) is named so: the summary counts
"events drawn", and a window whose not-after lies before its not-before is a contradiction
said in those words (by the reader, `sources.records`).
"""
from __future__ import annotations

from collections import Counter
from dataclasses import asdict, dataclass, is_dataclass
from typing import Iterable, Protocol, Sequence

import numpy as np

from ..columnar import RecordColumns
from ..model import EVENT, Precision, Record, Span, holds
from ..spanarrays import EARLIEST_START, LATEST_END

DAYS_PER_YEAR = 365.2425  # the mean Gregorian year (97 leap days in 400 years)
_LONG_BY_NATURE = frozenset({Precision.MILLENNIUM, Precision.DEEP_TIME})
_KEEPS_ROW_OFF = frozenset({"error", "contradiction"})


class Reportable(Protocol):
    """A line of a report: a load Problem (sources.Problem) or a Finding."""

    source: str
    row: int
    column: str | None
    id: str | None
    kind: str


class Loaded(Protocol):
    """What sources.load_records returns; check.py does not import sources."""

    records: Sequence[Record]
    problems: Sequence[Reportable]
    rows_read: int


@dataclass(frozen=True, slots=True)
class CheckLimits:
    # A possible extent over this many years gets a warning; None switches the rule off.
    # 1000 leaves room for archaeological phases while catching a dropped digit in a
    # modern year. Common practice, no source.
    max_extent_years: int | None = 1000


@dataclass(frozen=True, slots=True)
class Finding:
    """A warning from a rule: the row is drawn, but something about it deserves a look."""

    source: str
    row: int
    column: str | None
    id: str | None
    message: str
    kind: str                              # the rule: "duplicate id", "long span"

    def location(self) -> str:
        return ":".join(str(part) for part in (self.source, self.row, self.column)
                        if part is not None)

    def __str__(self) -> str:
        who = f" [{self.id}]" if self.id else ""
        return f"{self.location()}:{who} warning: {self.message}"


@dataclass(frozen=True, slots=True)
class Counts:
    rows_read: int                         # non-blank data rows
    drawn: int                             # records with a span
    undated: int                           # records without one, listed under the chart
    unreadable: int                        # rows with at least one cell that cannot be read
    contradictory: int                     # rows whose end lies wholly before the start
    warnings: int                          # findings of the rules (undated rows not counted)

    @property
    def reported(self) -> int:
        """Rows not drawn as bars; with `drawn` they add up to `rows_read`."""
        return self.undated + self.unreadable + self.contradictory


@dataclass(frozen=True, slots=True)
class Report:
    errors: tuple[Reportable, ...]         # load problems that keep rows off the chart
    warnings: tuple[Finding, ...]          # findings of the rules
    counts: Counts
    undated_rows: tuple[Reportable, ...] = ()  # load problems of kind "undated"
    notes: tuple[Reportable, ...] = ()     # what reading did to the table (merged cells filled)
    holds: str = "spans"                   # what the dated records are: spans, events, or both

    @property
    def ok(self) -> bool:
        """True when no row was kept off the chart by an error."""
        return not self.errors

    @property
    def not_drawn(self) -> int:
        """Rows without a bar: unreadable, contradictory or undated."""
        return self.counts.reported

    @property
    def undated(self) -> int:
        return self.counts.undated

    def lines(self) -> tuple[str, ...]:
        """Every error, undated row, warning and note, one line each, in row order."""
        items = sorted(self.errors + self.undated_rows + self.warnings + self.notes,
                       key=lambda item: (item.source, item.row))
        return tuple(map(str, items))

    def as_dict(self) -> dict:
        """The report as plain data for JSON: counts, summary and each item with its line."""
        counts = asdict(self.counts) | {"reported": self.counts.reported}
        return {
            "summary": self.summary(), "holds": self.holds, "counts": counts,
            "errors": [_item_dict(item) for item in self.errors],
            "undated": [_item_dict(item) for item in self.undated_rows],
            "warnings": [_item_dict(item) for item in self.warnings],
            "notes": [_item_dict(item) for item in self.notes],
        }

    def summary(self) -> str:
        """E.g. '12 rows read: 10 drawn, 2 reported (1 unreadable, 1 undated); 1 warning'."""
        counts = self.counts
        drawn = _drawn(counts.drawn, self.holds)
        text = f"{_plural(counts.rows_read, 'row')} read: {drawn} drawn"
        if counts.reported:
            parts = [f"{number} {name}" for number, name in (
                (counts.unreadable, "unreadable"), (counts.contradictory, "contradictory"),
                (counts.undated, "undated")) if number]
            text += f", {counts.reported} reported ({', '.join(parts)})"
        if counts.warnings:
            text += f"; {_plural(counts.warnings, 'warning')}"
        return text


def check(loaded: Loaded | Iterable[Record], limits: CheckLimits = CheckLimits(),
          findings: Sequence[Finding] = ()) -> Report:
    """Count, gather the load problems and apply the rules; `findings` of earlier steps (such
    as bounding open ends) join the rules' own."""
    records, problems, rows_read = _unpack(loaded)
    errors = tuple(problem for problem in problems if problem.kind in _KEEPS_ROW_OFF)
    undated = tuple(problem for problem in problems if problem.kind == "undated")
    notes = tuple(problem for problem in problems if problem.kind == "note")
    findings = [*findings, *_duplicate_ids(records, errors), *_long_spans(records, limits)]
    findings = tuple(sorted(findings, key=lambda finding: (finding.source, finding.row)))
    counts = _counts(records, errors, rows_read, len(findings))
    return Report(errors, findings, counts, undated, notes, _holds(records))


Records = tuple[Record, ...] | RecordColumns   # a table's records as read stay columns


def _unpack(loaded: Loaded | Iterable[Record]
            ) -> tuple[Records, tuple[Reportable, ...], int | None]:
    if hasattr(loaded, "records") and hasattr(loaded, "problems"):
        records = loaded.records  # type: ignore[union-attr]
        return (records if isinstance(records, RecordColumns) else tuple(records),
                tuple(loaded.problems),  # type: ignore[union-attr]
                getattr(loaded, "rows_read", None))
    if isinstance(loaded, RecordColumns):
        return loaded, (), None
    return tuple(loaded), (), None  # type: ignore[arg-type]


def _holds(records: Records) -> str:
    if isinstance(records, RecordColumns):
        if records.kind == EVENT and records.dated().any():
            return "events"
        return "spans"
    return holds(records)


def _counts(records: Records, errors: tuple[Reportable, ...],
            rows_read: int | None, warnings: int) -> Counts:
    if isinstance(records, RecordColumns):
        undated = len(records) - int(np.count_nonzero(records.dated()))
    else:
        undated = sum(1 for record in records if record.span is None)
    unreadable = len({(item.source, item.row) for item in errors if item.kind == "error"})
    contradictory = len({(item.source, item.row) for item in errors
                         if item.kind == "contradiction"})
    drawn = len(records) - undated
    if rows_read is None:
        rows_read = len(records) + unreadable + contradictory
    return Counts(rows_read, drawn, undated, unreadable, contradictory, warnings)


def _drawn(drawn: int, held: str) -> str:
    """The number drawn, named as events where the table holds events."""
    if held == "events":
        return _plural(drawn, "event")
    return f"{drawn} (events and spans)" if held == "events and spans" else str(drawn)


def _duplicate_ids(records: Records, errors: tuple[Reportable, ...]) -> list[Finding]:
    """A Finding on each later row that repeats an id, naming the row that had it first."""
    if isinstance(records, RecordColumns):
        record_ids = records.column("ids")
        ids = Counter(record_ids)
        ids.pop(None, None)
    else:
        ids = Counter(record.id for record in records if record.id)
    ids.update(error.id for error in errors if error.id)
    repeated = {identifier for identifier, count in ids.items() if count > 1}
    if not repeated:
        return []   # the usual case, found without sorting every row
    if isinstance(records, RecordColumns):
        rows = {(records.source, row): identifier for row, identifier
                in zip(records.row_numbers().tolist(), record_ids) if identifier in repeated}
    else:
        rows = {(record.provenance.source, record.provenance.row): record.id
                for record in records if record.id in repeated}
    for error in errors:
        if error.id in repeated:
            rows.setdefault((error.source, error.row), error.id)
    first_row: dict[str, int] = {}
    findings = []
    # Records and problems arrive in row order already; sorting only merges the two.
    for (source, row), identifier in sorted(rows.items()):
        seen = first_row.setdefault(identifier, row)
        if seen != row:
            findings.append(Finding(source, row, None, identifier,
                                    f"the id {identifier!r} is also on row {seen}",
                                    "duplicate id"))
    return findings


def _long_spans(records: Records, limits: CheckLimits) -> list[Finding]:
    if limits.max_extent_years is None:
        return []
    if isinstance(records, RecordColumns):
        return _long_spans_of_columns(records, limits.max_extent_years)
    # Records read from one table share Span objects: each distinct one is measured once.
    spans = {id(record.span): record.span for record in records}
    long_days: dict[int, int] = {}
    for key, span in spans.items():
        days = _extent_days(span)
        # Whole years, as the message says them: 1001-01-01..2000-12-31 is 1000.
        if days is not None and round(days / DAYS_PER_YEAR) > limits.max_extent_years:
            long_days[key] = days
    return [_long_span(record, long_days[id(record.span)], limits.max_extent_years)
            for record in records if id(record.span) in long_days]


def _long_spans_of_columns(records: RecordColumns, limit: int) -> list[Finding]:
    """The same rule on a table's columns: each distinct span measured once, and a Record
    made only for the rows it finds."""
    facts = records.span_facts()
    days = facts.bounds[:, LATEST_END] - facts.bounds[:, EARLIEST_START] + 1
    # Whole years, as the message says them (as `_long_spans`); NaN (unbounded) is not long.
    long = (np.round(days / DAYS_PER_YEAR) > limit) & ~facts.precision_in(_LONG_BY_NATURE)
    long_days = dict(zip(np.flatnonzero(long).tolist(), days[long].astype(int).tolist()))
    if not long_days:
        return []
    codes = records.codes()
    found = np.flatnonzero(np.isin(codes, list(long_days)))
    return [_long_span(record, long_days[code], limit) for record, code
            in zip(records.records(records.positions[found]), codes[found].tolist())]


def _extent_days(span: Span | None) -> int | None:
    """Days of the possible extent; None when unbounded, undated or long by nature."""
    if span is None or span.start.precision in _LONG_BY_NATURE or (
            span.end.precision in _LONG_BY_NATURE):
        return None
    earliest, latest = span.possible_extent
    if earliest is None or latest is None:
        return None
    return latest - earliest + 1


def _long_span(record: Record, days: int, limit: int) -> Finding:
    years = round(days / DAYS_PER_YEAR)
    if record.is_event:
        said = (f"{record.date_text!r} dates one moment in a window of about {years} years, "
                f"more than {limit}")
    else:
        said = f"{record.date_text!r} may last about {years} years, more than {limit}"
    return Finding(record.provenance.source, record.provenance.row, None, record.id,
                   f"{said}; is a year mistyped?", "long span")


def _item_dict(item: Reportable) -> dict:
    fields = asdict(item) if is_dataclass(item) else {
        name: getattr(item, name) for name in ("source", "row", "column", "id", "kind")}
    return fields | {"line": str(item)}


def _plural(number: int, noun: str) -> str:
    return f"{number} {noun}" if number == 1 else f"{number} {noun}s"
