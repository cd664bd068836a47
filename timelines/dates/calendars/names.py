"""Month names as they are transliterated, and Roman numerals.

A name is listed as spelt in one or more common transliterations (`Ḥeshvan`, `Cheshvan`);
`loose` turns a spelling into a regex that takes any case, an accented letter written with or
without its accent (precomposed, or as a letter and a combining accent: texts are not
normalised to NFC), any apostrophe or none where the spelling has one, and a space, a hyphen
or nothing where it has either. `name_key` folds a written name the same way, to look it up.
"""
from __future__ import annotations

import re
import unicodedata

from ..reasons import Unreadable, closest_word

# The marks that stand for an apostrophe, an ayin or a hamza: ' ` ´ ʻ ʼ ʾ ʿ and the typographic
# quotes (windows.normalise makes those plain, but not the modifier letters).
APOSTROPHES = "'`\u00b4\u02bb\u02bc\u02be\u02bf\u2018\u2019"
_COMBINING_ACCENT = "[\u0300-\u036f]?"


def loose(spelling: str) -> str:
    """A regex for a name as spelt (see the module's docstring)."""
    parts = []
    for char in spelling:
        if char == "'":
            parts.append(f"[{APOSTROPHES}]?")
        elif char in " -":
            parts.append(r"[\s-]?")
        elif not char.isascii():
            bare = unicodedata.normalize("NFD", char)[0]
            parts.append(f"(?:[{char.lower()}{char.upper()}]|{bare}{_COMBINING_ACCENT})")
        else:
            parts.append(re.escape(char))
    return "".join(parts)


def names_pattern(months: dict[int, tuple[str, ...]]) -> str:
    """One alternative per spelling of every month, longest first (`Adar II` before `Adar`),
    grouped by first letter: a text that begins with no month's letter is refused at once."""
    by_first: dict[str, list[str]] = {}
    for spelling in sorted((spelling for names in months.values() for spelling in names),
                           key=len, reverse=True):
        by_first.setdefault(loose(spelling[0].lower()), []).append(loose(spelling[1:]))
    firsts = {char for names in months.values() for name in names
              for char in (name[0].lower(), name[0].upper(),
                           unicodedata.normalize("NFD", name[0])[0])}
    return (f"(?=[{''.join(sorted(firsts))}])(?:"
            + "|".join(f"{first}(?:{'|'.join(rests)})" for first, rests in by_first.items())
            + ")")


def name_key(written: str) -> str:
    """A written name without accents, apostrophes, spaces and hyphens, in lower case."""
    decomposed = unicodedata.normalize("NFD", written)
    return "".join(char for char in decomposed
                   if not unicodedata.combining(char) and char not in APOSTROPHES
                   and char != "-" and not char.isspace()).lower()


def keyed(months: dict[int, tuple[str, ...]]) -> dict[str, int]:
    """{name key: month number} from each month's spellings."""
    return {name_key(spelling): number for number, spellings in months.items()
            for spelling in spellings}


def month_number(written: str, keys: dict[str, int], calendar: str,
                 names: tuple[str, ...]) -> int:
    """The number of a written month name; Unreadable, naming the nearest month, for another."""
    key = name_key(written)
    number = keys.get(key)
    if number is None:
        close = closest_word(key, keys) if key else None
        raise Unreadable(f"{written!r} is not a month of the {calendar} calendar",
                         fragment=written,
                         hint=f"did you mean {names[keys[close] - 1]}?" if close else None)
    return number


ROMAN = re.compile(r"M{0,3}(?:CM|CD|D?C{0,3})(?:XC|XL|L?X{0,3})(?:IX|IV|V?I{0,3})",
                   re.IGNORECASE)
_ROMAN_VALUES = {"M": 1000, "D": 500, "C": 100, "L": 50, "X": 10, "V": 5, "I": 1}


def roman_number(written: str) -> int:
    """The value of a Roman numeral written as is usual (`XIV`, not `XIIII`); any case."""
    if not written or ROMAN.fullmatch(written) is None:
        raise Unreadable(f"{written!r} is not a Roman numeral", fragment=written,
                         hint="write the year as an VIII or an 8")
    values = [_ROMAN_VALUES[char] for char in written.upper()]
    # A numeral worth less than the one after it is taken away (IV = 5 - 1).
    return sum(-value if value < following else value
               for value, following in zip(values, [*values[1:], 0]))


def roman_numeral(number: int) -> str:
    """`VIII` for 8: the usual form, for messages (1 .. 3999)."""
    written = ""
    for value, numeral in ((1000, "M"), (900, "CM"), (500, "D"), (400, "CD"), (100, "C"),
                           (90, "XC"), (50, "L"), (40, "XL"), (10, "X"), (9, "IX"), (5, "V"),
                           (4, "IV"), (1, "I")):
        count, number = divmod(number, value)
        written += numeral * count
    return written
