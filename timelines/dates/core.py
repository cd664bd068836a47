"""The core of one date, without the words around it: which form it is, and its window.

All forms in one table, in order of precedence (the first whose regex matches all of the core
wins): digits only ISO 8601 writes, free-text years, ISO 8601-1 and -2, dual years and
decades, centuries and millennia, months and days, ages and error terms. The forms never
claim the same text except where the order says so: digits alone are a free-text year,
unless only ISO 8601 can mean them (`0044`, `19850412`). A core written with an era is tried
only against the forms that take one.
"""
from __future__ import annotations

from ..calendar import GREGORIAN, iso_from_fixed, reform_of
from ..model import Endpoint
from . import trace
from .centuries import CENTURY_FORMS
from .c14 import RADIOCARBON_FORMS
from .calendars.forms import CALENDAR_WORDS, OTHER_CALENDAR_FORMS
from .deeptime import AGE_FORMS
from .edtf import EDTF_FORMS
from .feasts import FEAST_FORMS
from .grammar import FormTable
from .iso import ISO_DIGIT_FORMS, ISO_FORMS
from .months import MONTH_FORMS
from .reasons import Unreadable
from .settings import DateSettings
from .signed import SIGNED_YEAR_FORMS
from .text import YEAR_FORMS

# A bare signed number (-300) before the ISO forms, which would claim -1500 and -12000 as
# astronomical years: only a zero-padded year (-0300) is left to ISO 8601 (signed.py).
_FORMS = (ISO_DIGIT_FORMS + YEAR_FORMS[:1] + SIGNED_YEAR_FORMS + ISO_FORMS + EDTF_FORMS
          + YEAR_FORMS[1:] + CENTURY_FORMS + MONTH_FORMS + FEAST_FORMS + RADIOCARBON_FORMS
          + AGE_FORMS + OTHER_CALENDAR_FORMS)
ALL_FORMS = FormTable(_FORMS)
# With an era (44 BC) only the forms that take one are tried: 0044 BC is a year, not ISO.
ERA_FORMS = FormTable(tuple(form for form in _FORMS if form.takes_era))
ISO_ONLY = FormTable(ISO_DIGIT_FORMS + ISO_FORMS + EDTF_FORMS)


def read_core(core: str, era: str | None, marker: str | None, settings: DateSettings,
              table: FormTable = ALL_FORMS) -> tuple[Endpoint, str] | None:
    """The window of a date's core and the calendar it was read in, or None when no form
    claims the core; raises Unreadable.

    `era` is "BC", "AD" or None; `marker` the calendar the text names, or None."""
    found = (ERA_FORMS if era is not None and table is ALL_FORMS else table).match(core)
    if found is None:
        without_era = table.match(core) if era is not None else None
        if without_era is not None:
            name = without_era[0].name
            article = "an" if name[0] in "aeiouAEIOU" else "a"
            raise Unreadable(f"{article} {name} takes no era (BC, AD)", fragment=core,
                             hint=_ISO_YEARS if name.startswith("ISO") else None)
        return None
    form, match = found
    place = trace.place() if trace.on else 0
    result = form.read(match, era, marker, settings)
    if result is None:
        return None
    # A reader returns the calendar too when it chose one itself (dual years are Julian).
    endpoint, calendar = result if type(result) is tuple else (
        result, marker or (GREGORIAN if form.gregorian else settings.reckoning))
    if trace.on:
        trace.note_at(place, f"{core!r}{f' ({era})' if era else ''}: {form.name}, "
                             f"{calendar_words(calendar)}: {trace.bounds(endpoint)}")
    return endpoint, calendar


_ISO_YEARS = "ISO 8601 years are astronomical and signed: -0043 is 44 BC"


def iso_date(text: str, settings: DateSettings, marker: str | None = None) -> Endpoint | None:
    """An ISO 8601 (-1 or -2) date alone, as an interval's side holds one; None otherwise."""
    found = read_core(text, None, marker, settings, ISO_ONLY)
    return None if found is None else found[0]


def calendar_words(calendar: str) -> str:
    if calendar in CALENDAR_WORDS:
        return CALENDAR_WORDS[calendar]
    reform = reform_of(calendar)
    if reform is not None:
        return (f"historical calendar (Julian before {iso_from_fixed(reform.first_day)}, "
                "Gregorian after)")
    if calendar == GREGORIAN:
        return "proleptic Gregorian calendar"
    return "Julian calendar"
