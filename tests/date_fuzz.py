"""Hostile and unusual date texts, made from a fixed seed: the fuzz test's generator.

`fuzz_texts(count, seed)` gives `count` strings, the same ones on every run and machine
(`random.Random` is specified to repeat for a seed). Each mixes fragments of real forms
(digits, eras, qualifiers, unspecified digits, intervals, error terms, ages, months,
centuries, times and offsets, set brackets), mutations of real forms (a character dropped,
doubled, swapped or replaced, a fragment put in, the letter case scrambled), and junk that
cells really hold: control characters, NUL, bidi marks, lone surrogates, combining marks,
digits of other scripts, and numbers of hundreds or thousands of digits.

Invented strings, no network: the test needs nothing but this module.
"""
from __future__ import annotations

import random
import re

SEED = 20240609

# Words of Python's own messages and of the model's invariants (`earliest 5 is after latest
# 4`): a reason that holds one was not written for the person who typed the date.
_INTERNAL = re.compile(r"""
    invalid\ literal | int\(\) | base\ 10 | unpack | is\ after\ latest | outside\ the\ window
  | wholly\ before | NoneType | object\ has\ no | not\ supported\ between | index\ out
  | Exceeds\ the\ limit | recursion | unhashable | subscriptable
""", re.VERBOSE | re.IGNORECASE)


def looks_internal(reason: str) -> bool:
    """Whether a refusal's reason is an internal message rather than one in the user's terms."""
    return _INTERNAL.search(reason) is not None

# Real forms to mutate: one of each family the date language reads (docs/dates.md).
SEEDS = (
    "1650", "44 BC", "AD 1066", "12,000 BC", "1650s", "1650's", "1600s", "17th century",
    "17thC", "C17", "seventeenth century", "2nd millennium BC", "early 17th century",
    "mid-1650s", "late 17th c.", "first half of the 17th century", "April 1650",
    "12 April 1650", "12-Apr-1650", "April 12, 1650", "25/12/1650", "25.12.1650",
    "12/1650", "spring 1650", "winter 1650/51", "Q2 1650", "c. 1650", "ca. 1650", "1650~",
    "1650?", "1650%", "before 1700", "by 1700", "after 1650", "between 1650 and 1660",
    "1650 or 1651", "[ca. 1650]", "1650–1660", "1650-60", "March–May 1650",
    "500 BC – AD 100", "66–56 Ma", "1985–present", "?–1660", "1985-04-12", "19850412",
    "1985-102", "1985-W15-5", "-0043", "+12000", "1985-04-12T10:00Z", "2004-06~-11",
    "?2004-06-~11", "198X", "156X-12-25", "2001-21", "2001-41", "Y170000002", "Y-17E7",
    "1950S2", "Y171010000S3", "[1667,1668,1670..1672]", "{1667,1668}", "1985/1987",
    "../1760", "/1760", "12,500 BP", "65.5 Ma", "12.5 ka", "11,700 b2k",
    "12,500 ± 150 BP", "65.5 ± 0.3 Ma", "3450 ± 40 14C BP", "1650 ± 10", "12 February 1701/02",
    "1701/02", "1700-02-29 (Julian)", "@#DJULIAN@ 2 SEP 1752", "Friday 12 April 1985",
    "2004-01-01T23:20:30+05:30", "0.999999999 Ma", "20XX-41",
)

FRAGMENTS = (
    "0", "1", "9", "12", "44", "99", "650", "1650", "1985", "2004", "0000", "9999", "12,500",
    "65.5", "0.5", ".", ",", " ", "  ", "-", "–", "—", "/", "..", "...", "+", "±", "+/-",
    "c.", "c", "ca.", "circa", "about", "abt.", "before", "after", "by", "since", "not after",
    "early", "mid-", "late", "first half of", "last quarter of", "the", "fl.", "between",
    "and", "or", "to", "from", "present", "?", "~", "%", "(?)", "X", "XX", "XXXX", "S2",
    "E7", "Y", "W15", "Q2", "T", "Z", "T10:00", ":60", "+24", "-05:60", "+14:00", "T24:00",
    "BC", "BCE", "AD", "CE", "B.C.", "BP", "cal BP", "14C BP", "b2k", "ka", "Ma", "Ga",
    "years ago", "million years ago", "April", "Apr.", "May", "Sept", "Xber", "7ber",
    "spring", "winter", "17th", "21st", "17st", "century", "cent.", "millennium", "C17",
    "Julian", "O.S.", "(Gregorian)", "@#DJULIAN@", "Friday", "[", "]", "{", "}", "(", ")",
    "'", "s", "'s", "th", "E", "e", "S", "21", "24", "33", "41", "42", "-13-", "-02-29",
)

JUNK = (
    "\x00", "\x01", "\x1b[31m", "\t", "\n", "\r", "\x7f", "\x85", "\u00a0", "\u200b",
    "\u200e", "\u200f", "\u202a", "\u202e", "\u2066", "\u2069", "\ufeff", "\ufffd",
    "\ud800", "\udfff", "\U0001f600", "\u0301", "\u0663", "\u00b2", "\u2165", "\uff11",
    "\u2024", "\u2013\u2013", "\u00df", "\u0130", "\u212a", "\u017f", "\U0010ffff",
)


def _long_number(rng: random.Random) -> str:
    digits = rng.choice((13, 20, 60, 199, 200, 201, 400, 4301, 5000))
    return rng.choice("123456789") + "".join(rng.choices("0123456789", k=digits - 1))


def _scrambled_case(rng: random.Random, text: str) -> str:
    return "".join(char.upper() if rng.random() < 0.5 else char.lower() for char in text)


def _mutated(rng: random.Random, text: str) -> str:
    """One small edit of a text: what a slip of the keyboard or a bad export does."""
    if not text:
        return rng.choice(FRAGMENTS)
    place = rng.randrange(len(text) + 1)
    edit = rng.randrange(6)
    if edit == 0:
        return text[:place] + text[place + 1:]                        # a character dropped
    if edit == 1:
        return text[:place] + text[place:place + 1] * 2 + text[place + 1:]   # doubled
    if edit == 2:
        return text[:place] + rng.choice(FRAGMENTS) + text[place:]    # a fragment put in
    if edit == 3:
        return text[:place] + rng.choice(JUNK) + text[place:]         # junk put in
    if edit == 4:
        return text[:place] + rng.choice("0123456789X") + text[place + 1:]  # a digit replaced
    return _scrambled_case(rng, text)


def _mixed(rng: random.Random) -> str:
    """Fragments of real forms strung together, now and then with junk or a long number."""
    parts = []
    for _ in range(rng.randint(1, 6)):
        roll = rng.random()
        if roll < 0.80:
            parts.append(rng.choice(FRAGMENTS))
        elif roll < 0.93:
            parts.append(rng.choice(JUNK))
        else:
            parts.append(_long_number(rng))
    return rng.choice(("", " ", " ", "-")).join(parts)


def _one(rng: random.Random) -> str:
    roll = rng.random()
    if roll < 0.45:
        text = rng.choice(SEEDS)
        for _ in range(rng.choice((1, 1, 1, 2, 3))):
            text = _mutated(rng, text)
        return text
    if roll < 0.55:
        return _scrambled_case(rng, rng.choice(SEEDS))
    if roll < 0.97:
        return _mixed(rng)
    return rng.choice(("[", "{", "(")) * rng.choice((3, 50, 99, 5000)) + rng.choice(SEEDS)


def fuzz_texts(count: int, seed: int = SEED) -> list[str]:
    """`count` hostile or unusual texts, the same for the same seed."""
    rng = random.Random(seed)
    return [_one(rng) for _ in range(count)]
