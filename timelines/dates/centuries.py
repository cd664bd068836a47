"""Centuries and millennia: `17th century`, `seventeenth century`, `C17`, `2nd millennium BC`.

Written forms: an ordinal in figures (`17th`; a wrong suffix such as `17st` is refused) or in
words (`seventeenth`, `twenty-first`), then `century`, `centuries`, `cent.`, `c.` or `c`
(`17th c.`, `17thC`, `17th-century`); the cataloguer's `C17` / `C17th`; a millennium
`2nd millennium`, `second millennium`, `2nd mill.`. Parts (`early 17th century`) are in parts.py.

Bounds follow `settings.century`, for millennia as for centuries, and are marked
`convention_dependent`:
- common (default): AD nth = (n-1)00 .. (n-1)99, the years whose hundreds are n-1
  (17th = 1600..1699; the 1st century, having no year 0, is AD 1..99); BC nth mirrors it:
  (n-1)99 BC .. (n-1)00 BC (5th century BC = 499..400 BC, astronomical -498..-399;
  1st century BC = 99..1 BC). The 2nd millennium is 1000..1999.
- strict: AD nth = (n-1)01 .. n00 (17th = 1601..1700); BC nth = n00 BC .. (n-1)01 BC
  (5th century BC = 500..401 BC, astronomical -499..-400). The 2nd millennium is 1001..2000.
"""
from __future__ import annotations

import re

from ..model import Endpoint, Precision, Qualifier
from . import trace
from .grammar import FLAGS, Form
from .ordinals import ordinal_number, ordinal_suffix, ordinal_word
from .settings import DateSettings
from .text import counted_years
from .windows import years

_CENTURY_WORD = r"(?:centuries|century|cent\.?|c\.?)"
_MILLENNIUM_WORD = r"(?:millennium|millennia|mill\.?)"
_ORDINAL_WORD = r"(?P<word>[a-z]+(?:[\s-][a-z]+)?)"

CENTURY = re.compile(rf"""
    (?P<number>[0-9]{{1,3}}) (?P<suffix>st|nd|rd|th)   # ordinal: 1st, 2nd, 3rd, 17th, 21st
    [\s-]* {_CENTURY_WORD}                             # 17th century, 17th-century, 17thC
""", FLAGS)

CENTURY_IN_WORDS = re.compile(rf"""
    {_ORDINAL_WORD} [\s-]+ {_CENTURY_WORD}              # seventeenth century, twenty-first century
""", FLAGS)

CENTURY_CODE = re.compile(r"""
    C (?P<number>[0-9]{1,2}) (?P<suffix>st|nd|rd|th)?  # C17, C17th: the cataloguer's shorthand
""", FLAGS)

MILLENNIUM = re.compile(rf"""
    (?P<number>[0-9]{{1,2}}) (?P<suffix>st|nd|rd|th) [\s-]* {_MILLENNIUM_WORD}   # 2nd millennium
""", FLAGS)

MILLENNIUM_IN_WORDS = re.compile(rf"""
    {_ORDINAL_WORD} [\s-]+ {_MILLENNIUM_WORD}           # second millennium
""", FLAGS)


def read_century(match: re.Match[str], era: str | None, marker: str | None,
                 settings: DateSettings) -> Endpoint:
    return counted_unit(_number(match, "century"), 100, era, marker, settings)


def read_millennium(match: re.Match[str], era: str | None, marker: str | None,
                    settings: DateSettings) -> Endpoint:
    return counted_unit(_number(match, "millennium"), 1000, era, marker, settings)


def _number(match: re.Match[str], unit: str) -> int:
    if "word" in match.re.groupindex:
        return ordinal_word(match["word"])
    # C17 has no suffix to check: give it the right one.
    suffix = match["suffix"] or ordinal_suffix(int(match["number"]))
    return ordinal_number(match["number"], suffix, unit)


def counted_unit(number: int, size: int, era: str | None, marker: str | None,
                 settings: DateSettings) -> Endpoint:
    """The nth century (size 100) or millennium (size 1000) in the century setting."""
    low, high = unit_numbers(number, size, settings.century)
    first, last = counted_years(low, high, era)
    precision = Precision.CENTURY if size == 100 else Precision.MILLENNIUM
    endpoint = years(first, last, marker or settings.reckoning, precision,
                     {Qualifier.CONVENTION_DEPENDENT})
    if trace.on:
        unit = "century" if size == 100 else "millennium"
        trace.note(f"{unit} {number}{' BC' if era == 'BC' else ''}: years {low}..{high} "
                   f"counted {'back' if era == 'BC' else 'forward'} (setting century = "
                   f"{settings.century}): {trace.bounds(endpoint)}")
    return endpoint


def unit_numbers(number: int, size: int, convention: str) -> tuple[int, int]:
    """The year numbers of the nth unit, counted away from the epoch (AD or BC alike)."""
    if convention == "strict":
        return (number - 1) * size + 1, number * size
    return max(1, (number - 1) * size), (number - 1) * size + size - 1


CENTURY_FORMS = (
    Form("century", CENTURY, read_century),
    Form("century", CENTURY_CODE, read_century, starts="letter"),
    Form("millennium", MILLENNIUM, read_millennium),
    Form("century", CENTURY_IN_WORDS, read_century, starts="letter"),
    Form("millennium", MILLENNIUM_IN_WORDS, read_millennium,
         starts="letter"),
)
