"""The words around a date's core: `c. 1650`, `before the early 1650s`, `1650s?`, `44 BC`,
`12 February 1701 O.S.`: the words, the era and the marks are taken off, leaving the core.

Words before the core (any case, any number, each at most once):
- approximate: `c.`, `c`, `ca.`, `circa`, `about`, `abt.`, `approx.`, `approximately`,
  `around`, `est.` (GEDCOM's estimated); widened by the circa settings (windows.py);
- uncertain: `probably`, `prob.`, `possibly`, `perhaps`, `? `, `cal.` (GEDCOM's calculated);
- before, ending as the before-after setting says: `before`, `bef.`, `pre-`, `ante`;
  before, the date itself allowed: `by`, `not after`, `no later than`, `terminus ante quem`,
  `t.a.q.`; after, as the setting says: `after`, `aft.`, `post-`; after, the date itself
  allowed: `since`, `not before`, `no earlier than`, `terminus post quem`, `t.p.q.`;
- a part of the unit: `early`, `mid-`, `middle of`, `late`, `beginning of` (early), `end of`
  (late), `first half of`, `second quarter of`, `last quarter of` ... (parts.py);
- a calendar: `Julian`, `Gregorian`, `O.S.`, `N.S.`, GEDCOM's `@#DJULIAN@`, `@#DGREGORIAN@`;
- `fl.`, `floruit`: the writer's mark for a date of activity; the bounds are the date's own;
- event words (events.py): `b.` birth, `d.` death, `m.` marriage say what the date is of; `bapt.`
  and `bur.` reach back to the birth and death they stand for, by the baptism-days and
  burial-days settings. Other spellings (`born`, `né`, `geb.`) are rewritten to these first
  (translate.py);
- `the`, which says nothing.
An era before (`AD 1066`) or after (`44 BC`, `44bc`, `5th c. BCE`) the core. Marks after it:
`?`, `(?)` uncertain; `~` approximate; `%` both (ISO 8601-2); a calendar, bare or in brackets
(`O.S.`, `(Julian)`, `N.S.`, `Gregorian`, `Old Style`, `New Style`).

The words apply in one order whatever order they are written in: the part first, then circa,
then uncertainty, then the bound: `before c. 1650` ends where c. 1650 begins.
"""
from __future__ import annotations

import re
from dataclasses import dataclass

from ..calendar import GREGORIAN, JULIAN
from ..model import Endpoint, Qualifier
from . import trace
from .calendars.forms import CALENDAR_WORDS
from .core import read_core
from .events import of_event
from .grammar import FLAGS
from .parts import Part, part_from_words, part_of
from .periods import read_period
from .reasons import Unreadable
from .settings import DateSettings
from .windows import after, approximate, before, qualified

_WORD_KINDS = r"""
    (?P<approximate> circa | ca\. | ca(?=[\s0-9]) | c\. | c(?=\s|[0-9]{3})
                   | about | abt\.? | approx\.? | approximately | around | est\.? )
  | (?P<uncertain> probably | prob\. | possibly | poss\. | perhaps | \?(?=\s)
                 | cal\.?(?=\s) | calculated )
  | (?P<before> before | bef\.? | pre- | pre(?=\s) | ante )
  | (?P<before_inclusive> by | not\s+after | no\s+later\s+than | terminus\s+ante\s+quem
                        | t\.a\.q\. | taq )
  | (?P<after> after | aft\.? | post- | post(?=\s) )
  | (?P<after_inclusive> since | not\s+before | no\s+earlier\s+than | terminus\s+post\s+quem
                       | t\.p\.q\. | tpq )
  | (?P<part> (?: first | second | latter | third | fourth | last | final | 1st | 2nd | 3rd
                | 4th ) \s+ (?: half | quarter ) (?:\s+of)?
            | early | mid- | mid | middle(?:\s+of)? | late | (?:beginning|start|end)\s+of )
  | (?P<calendar> julian | gregorian | o\.s\. | n\.s\. | old\s+style | new\s+style
                | @\#DJULIAN@ | @\#DGREGORIAN@ )
  | (?P<floruit> fl\.? | floruit )
  | (?P<event> b\. | bapt\. | d\. | bur\. | m\. )
  | (?P<the> the )
"""
_AFTER_WORD = r"(?: \s+ | (?<=[.\-@]) | (?=[0-9]) )"   # c.1650, mid-17th, c1650
_ERA_BEFORE = r"(?P<era> A\.?\s?D\.? | C\.?\s?E\.? ) (?=\s|[0-9])"   # AD 1066

WORD = re.compile(rf"(?: {_ERA_BEFORE} | {_WORD_KINDS} ) {_AFTER_WORD}", FLAGS)

# Eras and marks after the core, written out as they stand; the suffix is found by matching
# these backwards from the end of the text (one short match, whatever the core's length).
_ERAS_AFTER = ("B.C.E.", "B. C. E.", "BCE", "B.C.", "B. C.", "BC", "A.D.", "A. D.", "AD",
               "C.E.", "C. E.", "CE")
_SYMBOL_MARKS = ("(?)", "[?]", "?", "~", "%")
_CALENDAR_MARKS = ("O.S.", "O. S.", "OS", "N.S.", "N. S.", "NS", "Old Style", "New Style",
                   "Julian", "Gregorian")


def _backwards(words: tuple[str, ...]) -> str:
    return "|".join(re.escape(word[::-1]) for word in sorted(words, key=len, reverse=True))


_CALENDAR_BACKWARDS = _backwards(_CALENDAR_MARKS)
SUFFIX_BACKWARDS = re.compile(rf"""
    (?P<marks> (?: (?: {_backwards(_SYMBOL_MARKS)}
                     | (?: \)(?:{_CALENDAR_BACKWARDS})\( | (?:{_CALENDAR_BACKWARDS}) ) (?=\s) )
                   \s* )* )
    (?P<era> (?: {_backwards(_ERAS_AFTER)} ) (?: \s+ | (?=[0-9]) ) )?
""", FLAGS)

_CALENDAR_FORWARDS = "|".join(re.escape(mark) for mark in _CALENDAR_MARKS)
MARK = re.compile(rf"""
    \s* (?: (?P<uncertain> \(\?\) | \[\?\] | \? ) | (?P<approximate> ~ ) | (?P<both> % )
         | \(? (?P<calendar> {_CALENDAR_FORWARDS} ) \)? )
""", FLAGS)
_WORD_START = frozenset("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ?@")
# `2nd quarter of`: a part word that begins with a digit; compared in lower case, as the
# WORD regex reads it (`2ND QUARTER OF THE 18TH CENTURY` was once missed here).
_ORDINAL_WORD_START = frozenset({"1st ", "2nd ", "3rd ", "4th "})

_JULIAN_NAMES = ("julian", "os", "oldstyle", "@#djulian@")


@dataclass(slots=True)
class Around:
    """What the words and marks around a core say."""

    approximate: str | None = None    # the word or mark, as written
    uncertain: str | None = None
    bound: str | None = None          # "before", "before_inclusive", "after", "after_inclusive"
    part: Part | None = None
    calendar: str | None = None
    floruit: bool = False
    event: str | None = None          # "b.", "bapt.", "d.", "bur.", "m."
    era: str | None = None            # "AD" when written before the core (AD 1066)


def read_framed(text: str, settings: DateSettings) -> Endpoint | None:
    """A date with its words, era and marks; None when its core is no date form."""
    if not text:
        return None
    if settings.periods is not None:
        named = read_period(text, settings.periods, settings)   # Late Bronze Age, as named
        if named is not None:
            return named
    has_words = _may_have_words(text)
    suffix = None if text[-1].isdigit() else SUFFIX_BACKWARDS.match(text[::-1])
    if not has_words and (suffix is None or not suffix.end()):
        found = read_core(text, None, None, settings)  # a bare core: most cells
        return None if found is None else found[0]
    around = Around()
    begin = _read_words(text, around) if has_words else 0
    end = len(text)
    era = around.era
    if suffix is not None:
        if suffix["marks"]:
            _read_marks(text[end - suffix.end("marks"):], around)
        if suffix["era"]:
            if era is not None:
                raise Unreadable("the date has two eras", fragment=suffix["era"][::-1].strip())
            era = "BC" if suffix["era"].strip()[-1] in "Bb" else "AD"
        end -= suffix.end()
    core = text[begin:end].strip()
    if not core:
        return None
    if around.calendar is not None and trace.on:
        trace.note(f"the text names the {around.calendar} calendar: it overrides the calendar "
                   f"setting ({settings.calendar})")
    found = read_core(core, era, around.calendar, settings)
    if found is None and settings.periods is not None:
        named = read_period(core, settings.periods, settings)   # early Bronze Age
        found = None if named is None else (named, around.calendar or settings.reckoning)
    if found is None:
        return None
    return _applied(*found, around, settings)


def _may_have_words(text: str) -> bool:
    return text[0] in _WORD_START or text[:4].lower() in _ORDINAL_WORD_START


def _read_words(text: str, around: Around) -> int:
    """Read the words before the core into `around`; the position where the core begins."""
    position = 0
    while position < len(text) and _may_have_words(text[position:position + 4]):
        found = WORD.match(text, position)
        if found is None:
            break
        position = found.end()
        kind, written = found.lastgroup, found[0].strip()
        if kind == "era":
            around.era = "AD"
        elif kind == "approximate":
            _set(around, "approximate", written)
        elif kind == "uncertain":
            _set(around, "uncertain", written)
        elif kind.startswith(("before", "after")):
            if around.bound is not None:
                raise Unreadable("one date cannot have two bounds", fragment=written,
                                 hint="a range looks like after 1650 – before 1700")
            around.bound = kind
        elif kind == "part":
            if around.part is not None:
                raise Unreadable("one part of a unit at a time", fragment=written)
            around.part = part_from_words(written)
        elif kind == "calendar":
            _set_calendar(around, written)
        elif kind == "floruit":
            around.floruit = True
        elif kind == "event":
            if around.event is not None:
                raise Unreadable("one event word at a time", fragment=written)
            around.event = written.lower()
    return position


def _read_marks(marks: str, around: Around) -> None:
    for found in MARK.finditer(marks):
        if found["uncertain"]:
            _set(around, "uncertain", found["uncertain"])
        elif found["approximate"]:
            _set(around, "approximate", "~")
        elif found["both"]:
            _set(around, "approximate", "%")
            _set(around, "uncertain", "%")
        else:
            _set_calendar(around, found["calendar"])


def _set(around: Around, name: str, written: str) -> None:
    if getattr(around, name) is not None:
        if name == "approximate":
            raise Unreadable("approximate twice (both c. and ~); write one of them",
                             fragment=written)
        raise Unreadable(f"uncertain twice ({getattr(around, name)} and {written}); write one",
                         fragment=written)
    setattr(around, name, written)


def _set_calendar(around: Around, written: str) -> None:
    key = "".join(written.lower().replace(".", "").split())
    calendar = JULIAN if key in _JULIAN_NAMES else GREGORIAN
    if around.calendar not in (None, calendar):
        raise Unreadable("the date names two calendars", fragment=written)
    around.calendar = calendar


def _applied(base: Endpoint, calendar: str, around: Around, settings: DateSettings) -> Endpoint:
    endpoint = base
    if calendar in CALENDAR_WORDS:
        # Hijri, Hebrew, Republican ... dates: their own units end at the reader; c. widens
        # by the settings' days and years as counted in the Gregorian calendar.
        if around.part is not None:
            raise Unreadable("early, mid and late are read in the Julian and Gregorian "
                             "calendars only", fragment=around.part.words,
                             hint="write the months or days of that calendar")
        calendar = GREGORIAN
    if around.part is not None:
        endpoint = part_of(endpoint, around.part, calendar, settings)
    if around.approximate is not None:
        endpoint = approximate(endpoint, settings, calendar)
    if around.uncertain is not None:
        endpoint = qualified(endpoint, Qualifier.UNCERTAIN)
        if trace.on:
            trace.note(f"{around.uncertain!r}: uncertain; the bounds stay as they are")
    if around.floruit and trace.on:
        trace.note("fl. (floruit): a date of activity; the bounds are the date's own")
    if around.event is not None:
        endpoint = of_event(endpoint, around.event, settings)
    if around.bound is not None:
        inclusive = True if around.bound.endswith("inclusive") else None
        bound = before if around.bound.startswith("before") else after
        endpoint = bound(endpoint, settings, inclusive)
    return endpoint
