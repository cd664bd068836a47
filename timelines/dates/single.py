"""One date: a set, `between X and Y`, `X or Y`, or a core with its words (frame.py).

- `between 1650 and 1660`, `bet. 1650 and 1660` (GEDCOM's BET ... AND): one window from the
  first's earliest to the second's latest day, `one_of`;
- `1650 or 1651`, `12 or 13 April 1650`: the same window, `one_of` (the window also holds
  the days between the two: an endpoint is one window);
- `1650 or earlier`, `1650 or before`: on or before 1650; `1650 or later`, `or after`: on or
  after (the words allow the date itself, so no convention is involved);
- sets `[..]` and `{..}`: sets.py.
The two dates of a pair lend each other what they share (completion.py).

Forms return None when the text is not written their way and raise when it is but the date
cannot exist; so a text matched by no form gets one general reason and hint.
"""
from __future__ import annotations

import re
import unicodedata

from ..errors import DateError
from ..model import Endpoint, Qualifier
from . import trace
from .completion import completed
from .frame import read_framed
from .grammar import FLAGS
from .months import misspelt_month
from .reasons import DATE_HINT, Unreadable, date_error, locate
from .sets import read_set
from .settings import DEFAULT_SETTINGS, DateSettings
from .translate import language_hint, translated
from .windows import after, before, normalise, spanning

NOT_READ = "not a date form timelines reads"

BETWEEN = re.compile(r"""
    (?:between|betw\.?|bet\.?|btw\.?) \s+ (?P<first>.+?) \s+ (?:and|&) \s+ (?P<second>.+)
""", FLAGS)

EITHER = re.compile(r"""
    (?:either\s+)? (?P<first>.+?) \s+ or \s+ (?P<second>.+)
""", FLAGS)

_OPEN_SIDE_WORDS = {"earlier": before, "before": before, "later": after, "after": after}

# Signs that a text holds two dates: a dash, "to", or an interval's slash.
_RANGE_MARK = re.compile(r"[\u2012-\u2015/]|\sto\s", re.IGNORECASE)

# Longer texts are notes, not dates; refusing them early keeps every regex here linear.
MAX_DATE_LENGTH = 200


def parse_date(text: str, settings: DateSettings = DEFAULT_SETTINGS) -> Endpoint:
    """One date (no range) as an endpoint window; raises DateError."""
    cleaned = prepared(text)
    try:
        endpoint = read_single(translated(cleaned, settings), settings)
    except DateError:
        raise
    except ValueError as error:
        raise date_error(text, error) from error
    if endpoint is None:
        raise not_a_date(text, cleaned)
    return endpoint


def prepared(text: object) -> str:
    """The text normalised for the readers; refuses what is not text or far too long."""
    if not isinstance(text, str):
        raise DateError(str(text), f"expected text, not {type(text).__name__}")
    cleaned = normalise(text)
    if len(cleaned) > MAX_DATE_LENGTH:
        raise DateError(text, f"too long for a date ({len(cleaned)} characters)")
    if not cleaned.isprintable():
        raise _unprintable(text, cleaned)
    return cleaned


def _unprintable(text: str, cleaned: str) -> DateError:
    """The error for a character that does not show (NUL, a bidi mark, a byte-order mark, half
    of a surrogate pair): no date form holds one, and whoever reads the cell cannot see it."""
    char = next(char for char in cleaned if not char.isprintable())
    name = unicodedata.name(char, "")
    shown = f"U+{ord(char):04X}" + (f" ({name.lower()})" if name else "")
    kind = _UNSEEN_KINDS.get(unicodedata.category(char), "a character that does not show")
    return DateError(text, f"holds {shown}, {kind}", position=text.find(char),
                     hint="remove it: a date holds only characters that show")


# Unicode general categories of the characters str.isprintable refuses (spaces are made plain
# or taken out before this check).
_UNSEEN_KINDS = {"Cc": "a control character", "Cf": "an invisible formatting character",
                 "Cs": "half of a surrogate pair, not a character (the text was decoded wrongly)",
                 "Co": "a private-use character", "Cn": "an unassigned code point"}


def read_single(text: str, settings: DateSettings) -> Endpoint | None:
    """A normalised single date, or None when no form claims it; raises Unreadable."""
    if not text:
        return None
    if text[0] in "[{":
        return read_set(text, settings, read_single)
    if text[:3].lower() in ("bet", "btw"):
        pair = BETWEEN.fullmatch(text)
        if pair is not None:
            return _pair(pair["first"], pair["second"], "between", settings)
    if " or " in text.lower():
        pair = EITHER.fullmatch(text)
        if pair is not None:
            return _either(pair["first"], pair["second"], settings)
    return read_framed(text, settings)


def _either(first: str, second: str, settings: DateSettings) -> Endpoint | None:
    side = _OPEN_SIDE_WORDS.get(second.lower())
    if side is None:
        return _pair(first, second, "or", settings)
    endpoint = read_framed(first, settings)
    return None if endpoint is None else side(endpoint, settings, inclusive=True)


def _pair(first_text: str, second_text: str, word: str,
          settings: DateSettings) -> Endpoint | None:
    """`between X and Y` / `X or Y`: one window over both dates."""
    first_text, second_text = completed(first_text, second_text)
    first = read_framed(first_text, settings)
    second = read_framed(second_text, settings)
    if first is None or second is None:
        return None
    if (first.earliest is not None and second.latest is not None
            and second.latest < first.earliest):
        raise Unreadable("the second date comes before the first", fragment=second_text,
                         hint=f"write the earlier first: {second_text} {word} {first_text}")
    endpoint = spanning(first, second, Qualifier.ONE_OF)
    if trace.on:
        trace.note(f"'{word}': one window from the first date's earliest to the second's "
                   f"latest day: {trace.bounds(endpoint)}")
    return endpoint


def not_a_date(text: str, cleaned: str) -> DateError:
    """The error for a text that no form claims."""
    if not cleaned:
        return DateError(text, "there is no date here",
                         hint="an empty cell is read as no date, not through the parser")
    if _RANGE_MARK.search(cleaned):
        return DateError(text, "a range where one date is expected", hint=DATE_HINT)
    named = language_hint(normalise(text))
    if named:
        return DateError(text, NOT_READ, hint=named)
    misspelt = misspelt_month(cleaned)
    if misspelt:
        word, hint = misspelt
        return DateError(text, NOT_READ, position=locate(text, word), hint=hint)
    return DateError(text, NOT_READ, hint=DATE_HINT)
