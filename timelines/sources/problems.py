"""What reading a table has to say about a row or a cell: one `Problem` per item, each a line
`file:row[:column]: [id] message` that names where and why."""
from __future__ import annotations

from dataclasses import dataclass

# error, contradiction: the row is kept off the chart; undated: listed under the chart.
PROBLEM_KINDS = ("error", "undated", "contradiction")
SHOWN_CHARACTERS = 60   # of a cell's text in a one-line message; the Problem keeps it all


@dataclass(frozen=True, slots=True)
class Problem:
    """Something to report about one row (or one cell of it).

    kind "error": a cell could not be read; "contradiction": the end lies wholly before the
    start. Both keep the row off the chart. kind "undated": the row has no date at all; it is
    a Record with no span, listed in a note under the chart."""

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

