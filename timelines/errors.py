"""Exceptions. The library raises these and never prints; the CLI reports them in one place."""
from __future__ import annotations

import difflib
from collections.abc import Iterable


class TimelineError(Exception):
    """Base of every error the library raises on purpose."""

    hint: str | None = None


class UsageError(TimelineError):
    """An option or argument that cannot work (unknown column, bad size, unknown name)."""

    def __init__(self, message: str, hint: str | None = None):
        super().__init__(message)
        self.hint = hint


class SourceError(TimelineError):
    """A table that cannot be read at all (missing file, unknown format, no header)."""

    def __init__(self, message: str, hint: str | None = None):
        super().__init__(message)
        self.hint = hint


class DateError(ValueError, TimelineError):
    """A date value that cannot be read, with where it came from and why.

    `str()` gives `source:row:column: cannot read 'text': reason`, leaving out the location
    parts that are unknown, so the same error reads well from the parser and from a spreadsheet.
    """

    def __init__(
        self,
        text: str,
        reason: str,
        *,
        position: int | None = None,
        hint: str | None = None,
        source: str | None = None,
        row: int | None = None,
        column: str | None = None,
    ):
        self.text = text
        self.reason = reason
        self.position = position
        self.hint = hint
        self.source = source
        self.row = row
        self.column = column
        super().__init__(str(self))

    def located(self, source: str | None, row: int | None, column: str | None) -> "DateError":
        """The same error, placed at a cell of a table."""
        placed = DateError(
            self.text, self.reason, position=self.position, hint=self.hint,
            source=source, row=row, column=column,
        )
        placed.__cause__ = self.__cause__ or self
        return placed

    def location(self) -> str:
        parts = [str(p) for p in (self.source, self.row, self.column) if p is not None]
        return ":".join(parts)

    def __str__(self) -> str:
        where = self.location()
        prefix = f"{where}: " if where else ""
        message = f"{prefix}cannot read {self.text!r}: {self.reason}"
        if self.hint:
            message += f" ({self.hint})"
        return message


def did_you_mean(name: str, choices: Iterable[str]) -> str | None:
    """A hint naming the choices closest to `name` (letter case aside), or None."""
    choices = list(choices)
    by_folded = {choice.casefold(): choice for choice in choices}
    close = difflib.get_close_matches(name.casefold(), list(by_folded), n=3, cutoff=0.6)
    if not close:
        return None
    return "did you mean " + " or ".join(repr(by_folded[match]) for match in close) + "?"
