"""Ordinal numbers as English writes them: `17th`, `seventeenth`, `twenty-first`.

Centuries, millennia and days are counted with them; a wrong suffix (`17st`) is refused with
the right one, since it usually marks a typing slip rather than a different number.
"""
from __future__ import annotations

from .reasons import Unreadable

_UNITS = ("first", "second", "third", "fourth", "fifth", "sixth", "seventh", "eighth", "ninth")
_TEENS = ("tenth", "eleventh", "twelfth", "thirteenth", "fourteenth", "fifteenth",
          "sixteenth", "seventeenth", "eighteenth", "nineteenth")
_TENS = ("twent", "thirt", "fort", "fift", "sixt", "sevent", "eight", "ninet")  # + "ieth"/"y"


def _ordinal_words() -> dict[str, int]:
    words = {word: number for number, word in enumerate(_UNITS, start=1)}
    words |= {word: number for number, word in enumerate(_TEENS, start=10)}
    for tens, stem in enumerate(_TENS, start=2):
        words[stem + "ieth"] = 10 * tens                       # twentieth
        for unit, word in enumerate(_UNITS, start=1):
            words[f"{stem}y-{word}"] = 10 * tens + unit        # twenty-first
            words[f"{stem}y {word}"] = 10 * tens + unit        # twenty first
    return words


ORDINAL_WORDS = _ordinal_words()  # first .. ninety-ninth


def ordinal_suffix(number: int) -> str:
    if number % 100 in (11, 12, 13):
        return "th"
    return {1: "st", 2: "nd", 3: "rd"}.get(number % 10, "th")


def ordinal_number(number_text: str, suffix: str, unit: str) -> int:
    """The number of `17th`; refuses 0th and a suffix that does not fit the number."""
    number = int(number_text)
    if number == 0:
        raise Unreadable(f"there is no 0th {unit}", fragment=number_text + suffix)
    expected = ordinal_suffix(number)
    if suffix.lower() != expected:
        raise Unreadable(f"write {number}{expected}, not {number}{suffix}",
                         fragment=number_text + suffix)
    return number


def ordinal_word(word: str) -> int:
    """The number of `seventeenth`; raises Unreadable for a word that is no ordinal."""
    number = ORDINAL_WORDS.get(" ".join(word.lower().split()))
    if number is None:
        raise Unreadable(f"{word!r} is not an ordinal number such as seventeenth",
                         fragment=word)
    return number
