"""What reading a table has to say about a row, a cell or a sheet: one `Problem` per item, each
a line `file:row[:column]: [id] message` that names where and why."""
from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass

# error, contradiction: the row is kept off the chart; undated: listed under the chart;
# note: what the reader did to a sheet or a column (merged cells filled, formulas with no
# saved value read as empty); the rows are drawn.
PROBLEM_KINDS = ("error", "undated", "contradiction", "note")
SHOWN_CHARACTERS = 60   # of a cell's text in a one-line message; the Problem keeps it all
SHOWN_RANGES = 8        # row ranges a note names before it counts the rest


@dataclass(frozen=True, slots=True)
class Problem:
    """Something to report about one row (or one cell of it, or a sheet from a row on).

    kind "error": a cell could not be read; "contradiction": the end lies wholly before the
    start. Both keep the row off the chart. kind "undated": the row has no date at all; it is
    a Record with no span, listed in a note under the chart. kind "note": what the reader did
    to a sheet or a column, from `row` on; the rows are drawn."""

    source: str
    row: int
    column: str | None
    id: str | None
    text: str
    reason: str
    kind: str = "error"
    hint: str | None = None

    def __post_init__(self) -> None:
        if self.kind not in PROBLEM_KINDS:
            raise ValueError(f"kind must be one of {', '.join(PROBLEM_KINDS)}, not {self.kind!r}")

    def location(self) -> str:
        return ":".join(str(part) for part in (self.source, self.row, self.column)
                        if part is not None)

    def __str__(self) -> str:
        who = f" [{self.id}]" if self.id else ""
        if self.kind == "error":
            message = f"cannot read {shown_text(self.text)}: {self.reason}"
        elif self.kind == "undated":
            message = f"no date: {self.reason}"
        elif self.kind == "note":
            message = f"note: {self.reason}"
        else:
            message = self.reason
        if self.hint:
            message += f" ({self.hint})"
        return f"{self.location()}:{who} {message}"


def shown_text(text: str) -> str:
    """The cell's text as a message quotes it: a very long cell only by its start and size."""
    if len(text) <= SHOWN_CHARACTERS:
        return repr(text)
    return f"{text[:SHOWN_CHARACTERS]!r}... ({len(text):,} characters)"


def row_ranges(rows: Iterable[int]) -> str:
    """Row numbers as a note says them: 'rows 3–5, 9, 12–14', the first few runs of many."""
    runs: list[list[int]] = []
    for row in sorted(set(rows)):
        if runs and row == runs[-1][1] + 1:
            runs[-1][1] = row
        else:
            runs.append([row, row])
    named = [str(first) if first == last else f"{first}–{last}"
             for first, last in runs[:SHOWN_RANGES]]
    if len(runs) > SHOWN_RANGES:
        named.append(f"and {len(runs) - SHOWN_RANGES} more runs")
    noun = "row" if len(runs) == 1 and runs[0][0] == runs[0][1] else "rows"
    return f"{noun} {', '.join(named)}"
