"""The shape shared by every date form, and the one regex that says which form a text has.

A `Form` is a name, a regex for the whole core of a date (without the words around it such as
`c.` or `before`, see `frame.py`) and a reader. `FormTable` joins the forms' regexes into one
alternation: the regex engine, not a Python loop, finds the first form that matches, which is
what keeps reading a million distinct cells fast. The chosen form's own regex then matches again
for its named groups (the joined regex keeps none, so that names may repeat between forms).
"""
from __future__ import annotations

import re
from dataclasses import dataclass
from typing import Callable

from ..model import Endpoint
from .settings import DateSettings

FLAGS = re.VERBOSE | re.IGNORECASE | re.ASCII

# (match, era "BC"/"AD"/None, calendar named in the text or None, settings) -> the endpoint,
# or (endpoint, calendar) when the reader chose the calendar itself, or None: not this form.
Reader = Callable[[re.Match[str], "str | None", "str | None", DateSettings],
                  "Endpoint | tuple[Endpoint, str] | None"]


@dataclass(frozen=True, slots=True)
class Form:
    name: str           # what the form is, in words: "decade", "ISO 8601 week date"
    pattern: re.Pattern[str]
    read: Reader
    takes_era: bool = True   # False: an era (BC, AD) beside this form is refused
    gregorian: bool = False  # ISO 8601 forms and ages: proleptic Gregorian unless the text
                             # names a calendar; other forms follow the calendar setting
    starts: str = "digit"    # what the core can begin with: "digit", "letter", "other"
                             # (signs, quotes, qualifiers), several joined by spaces


_NAMED_GROUP = re.compile(r"\(\?P<\w+>")


class FormTable:
    """Forms in order of precedence, dispatched by one joined regex per kind of first
    character (a digit, a letter, anything else), so that each text meets only the forms
    that can begin as it does."""

    def __init__(self, forms: tuple[Form, ...]):
        self.forms = forms
        self._by_start = {start: _joined(forms, start) for start in ("digit", "letter", "other")}

    def match(self, text: str) -> tuple[Form, re.Match[str]] | None:
        """The first form whose regex matches all of `text`, with its own match."""
        first = text[:1]
        start = "digit" if first.isdigit() else "letter" if first.isalpha() else "other"
        found = self._by_start[start].fullmatch(text)
        if found is None:
            return None
        form = self.forms[int(found.lastgroup[1:])]
        return form, form.pattern.fullmatch(text)


def _joined(forms: tuple[Form, ...], start: str) -> re.Pattern[str]:
    alternatives = [f"(?P<f{index}>\n{_NAMED_GROUP.sub('(?:', form.pattern.pattern)}\n)"
                    for index, form in enumerate(forms) if start in form.starts.split()]
    return re.compile("|".join(alternatives) or "(?!)", FLAGS)
