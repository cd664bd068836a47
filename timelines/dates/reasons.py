"""Why a text cannot be read, said once: `Unreadable` inside the readers, `DateError` outside.

Readers raise `Unreadable(reason, fragment=, hint=)` (a ValueError) naming the part of the text
at fault; `reading(text)` turns it, or any plain ValueError from the calendar arithmetic, into a
`DateError` about the whole text, with the fragment's position in the text as written.
"""
from __future__ import annotations

import difflib
from contextlib import contextmanager
from typing import Iterable, Iterator

from ..errors import DateError

DATE_HINT = "expected a date such as 1650, c. 1650, 1650s, 17th century, 1650-04-12, 44 BC"
RANGE_HINT = "a range looks like 1650–1660, 1650 to 1660, 500 BC – AD 100 or 1985/1987"


class Unreadable(ValueError):
    """A reader's refusal: the reason, the fragment of the text at fault, and a suggestion."""

    def __init__(self, reason: str, fragment: str | None = None, hint: str | None = None):
        super().__init__(reason)
        self.reason = reason
        self.fragment = fragment
        self.hint = hint


@contextmanager
def reading(text: str) -> Iterator[None]:
    """Turn an Unreadable or plain ValueError raised while reading `text` into a DateError."""
    try:
        yield
    except DateError:
        raise
    except ValueError as error:
        raise date_error(text, error) from error


def date_error(text: str, error: ValueError) -> DateError:
    if isinstance(error, Unreadable):
        return DateError(text, error.reason, position=locate(text, error.fragment),
                         hint=error.hint)
    return DateError(text, str(error))


def locate(text: str, fragment: str | None) -> int | None:
    """Where `fragment` first stands in `text` (any case), 0-based; None when it does not."""
    if not fragment:
        return None
    place = text.lower().find(fragment.lower())
    return None if place < 0 else place


def closest_word(word: str, known: Iterable[str]) -> str | None:
    """The known word closest to a misspelt one, if any is close (a slip keeps the first
    letter: comparing only those keeps the errors of a long column quick)."""
    word = word.lower()
    alike = [name for name in known if name[0] == word[0]]
    close = difflib.get_close_matches(word, alike, n=1, cutoff=0.75)
    return close[0] if close else None
