"""Dates written in other calendars: each form's regex, and its reader.

- Islamic: `12 Rabi' I 1200 AH`, `Rabiʿ al-awwal 1200 A.H.`, `Muharram 1200 H`, `1200 AH`,
  `1200 hijri`. The era (AH, A.H., H, hijri) is always written: the month names are
  transliterated in too many ways to be known alone, so any name is taken and looked up.
- Hebrew: `15 Nisan 5760`, `Adar II 5760`, `Cheshvan 5760 AM`, and a year `5760 AM`,
  `5760 A.M. (Hebrew)`. In a leap year plain `Adar` is Adar I (see PLAIN_ADAR_NOTE).
- Coptic: `1 Thout 1716`, `Thout 1716 A.M.`, `1716 AM (Coptic)`, `1716 Coptic`.
- A year in AM alone is Hebrew from 3000 on, and refused below (see `read_year_am`).
- Ethiopian: `1 Meskerem 2016 EC`, `Meskerem 2016 E.C.`, `2016 EC`, `2016 Ethiopian`.
- French Republican: republican_forms.py.
- Julian Day: `JD 2451545`, `JDN 2451545`, `JD 2451545.5` (see `read_julian_day`).
Every reader returns (endpoint, calendar name) over the whole unit written, a day, a month or
a year; a date that does not exist is refused, naming the part at fault. A calendar word
beside these dates (Julian, O.S., Gregorian) is refused: they name their calendar themselves.
"""
from __future__ import annotations

import re

from ...calendar import fixed_from_jdn
from ...model import Endpoint, Qualifier
from .. import trace
from ..grammar import FLAGS, Form
from ..reasons import Unreadable
from ..settings import DateSettings
from . import coptic, hebrew, islamic, spellings
from .names import keyed, month_number, name_key, names_pattern
from .reckonings import COPTIC, ETHIOPIC, HEBREW, ISLAMIC, no_marker, unit, written_day
from .republican_forms import FRENCH_REPUBLICAN_FORMS

CALENDAR_WORDS = {
    "islamic": "Islamic calendar (arithmetic; the observed calendar may differ by a day or two)",
    "hebrew": "Hebrew calendar (fixed arithmetic; a day begins at the sunset before)",
    "french-republican": "French Republican calendar (as used in years I-XIV, Romme's rule "
                         "after)",
    "coptic": "Coptic calendar (years of the martyrs, Anno Martyrum)",
    "ethiopic": "Ethiopian calendar (E.C.)",
    "julian-day": "Julian Day (days counted from noon, Universal Time)",
}

# Possessive digits (as months.py writes them): a number is never given back to be read in part.
_DAY = r"(?P<day>[0-9]{1,2}+)(?P<suffix>st|nd|rd|th)?"
_YEAR = r"(?P<year>[0-9]{1,5}+)"
# A word of a transliterated name: ASCII and accented Latin letters, modifier letters (ʿ ʾ),
# combining accents, apostrophes and hyphens.
_NAME_CHARACTERS = "a-z'`\u00b4\u2018\u2019\u00c0-\u024f\u02b0-\u02ff\u0300-\u036f\u1e00-\u1eff-"
_NAME = rf"[{_NAME_CHARACTERS}]+(?:\s+[{_NAME_CHARACTERS}]+){{0,3}}"
_HIJRA = r"(?: A\.?\s?H\.? | H\.? | hijri | \(\s*hijri\s*\) )"
_AM = r"A\.?\s?M\.?"
_EC = r"E\.?\s?C\.?"


def _calendar_word(*words: str) -> str:
    """`Coptic` or `(Coptic)` after a date."""
    alternatives = "|".join(words)
    return rf"(?: \(\s*(?:{alternatives})\s*\) | (?:{alternatives}) )"


ISLAMIC_DATE = re.compile(rf"""
    (?= (?: [^h]*+ h )++ (?: ijri )? \.? \)? \Z )   # ends as the era does: a quick refusal
    (?: (?: {_DAY} \s+ )? (?P<month> {_NAME} ) ,?\s+ )? {_YEAR} \s* {_HIJRA}
    # 12 Rabi' I 1200 AH, Muharram 1200 H, 1200 A.H.
""", FLAGS)

HEBREW_DATE = re.compile(rf"""
    (?: {_DAY} \s+ )? (?P<month> {names_pattern(spellings.HEBREW)} ) ,?\s+ {_YEAR}
    (?: \s* {_AM} )? (?: \s* {_calendar_word("Hebrew", "Jewish")} )?
    # 15 Nisan 5760, Adar II 5760, Tishri 5760 AM
""", FLAGS)

YEAR_AM = re.compile(rf"""
    {_YEAR} (?=\s*[a-z(])
    (?: \s* (?P<era> {_AM} ) )?
    (?: \s* (?P<word> {_calendar_word("Hebrew", "Jewish", "Coptic")} ) )?
    # 5760 AM, 5760 A.M. (Hebrew), 1716 AM (Coptic), 1716 Coptic
""", FLAGS)

COPTIC_DATE = re.compile(rf"""
    (?: {_DAY} \s+ )? (?P<month> {names_pattern(spellings.COPTIC)} )
    ,?\s+ {_YEAR} (?: \s* {_AM} )? (?: \s* {_calendar_word("Coptic")} )?
    # 1 Thout 1716, Thout 1716 A.M., 1 Thout 1716 (Coptic)
""", FLAGS)

ETHIOPIC_DATE = re.compile(rf"""
    (?: {_DAY} \s+ )? (?P<month> {names_pattern(spellings.ETHIOPIC)} )
    ,?\s+ {_YEAR} (?: \s* {_EC} )? (?: \s* {_calendar_word("Ethiopian", "Ethiopic")} )?
    # 1 Meskerem 2016 EC, Meskerem 2016 E.C.
""", FLAGS)

ETHIOPIC_YEAR = re.compile(rf"""
    {_YEAR} (?=\s*[a-z(]) (?: \s* {_EC} )? (?: \s* {_calendar_word("Ethiopian", "Ethiopic")} )?
    # 2016 EC, 2016 E.C., 2016 (Ethiopian)
""", FLAGS)

JULIAN_DAY = re.compile(r"""
    (?P<kind> JDN | JD ) \s* (?P<number> [0-9]{1,10}+ ) (?: \. (?P<fraction> [0-9]+ ) )?
    # JD 2451545, JDN 2451545, JD 2451545.5
""", FLAGS)

_ISLAMIC_KEYS = keyed(spellings.ISLAMIC)
_HEBREW_KEYS = keyed(spellings.HEBREW)
_COPTIC_KEYS = keyed(spellings.COPTIC)
_ETHIOPIC_KEYS = keyed(spellings.ETHIOPIC)
# The first Hebrew year read from a bare AM: Coptic years (from AD 284) are below 2000 today,
# and a Coptic year of 3000 would be AD 3283; Hebrew year 3000 was 761 BC.
HEBREW_FROM = 3000
PLAIN_ADAR_NOTE = ("in a leap year 'Adar' alone is read as Adar I, the month numbered Adar in "
                   "every year (Reingold & Dershowitz), as the Mishnah reads a plain Adar in a "
                   "leap year (Nedarim 8:6, from memory); write Adar II for the second")


def read_islamic(match: re.Match[str], era: str | None, marker: str | None,
                 settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, ISLAMIC)
    month = (None if match["month"] is None else
             month_number(match["month"], _ISLAMIC_KEYS, "Islamic", islamic.MONTH_NAMES))
    return unit(ISLAMIC, match, int(match["year"]), month, written_day(match))


def read_hebrew(match: re.Match[str], era: str | None, marker: str | None,
                settings: DateSettings) -> tuple[Endpoint, str]:
    """A Hebrew day or month. Plain `Adar` in a leap year is read as Adar I and marked
    convention_dependent: R&D number it 12, Adar, in every year, and the Mishnah reads a
    plain Adar of a leap year as the first (Nedarim 8:6, from memory); but Purim and many
    anniversaries are kept in Adar II, so the writer may have meant it: Adar I or Adar II
    says which. Adar I or Adar II in a common year is refused: the year is likely wrong."""
    no_marker(marker, HEBREW)
    year, written = int(match["year"]), match["month"]
    month = _HEBREW_KEYS[name_key(written)]
    leap = year >= 1 and hebrew.is_hebrew_leap_year(year)
    if month == hebrew.ADAR_II and not leap or (
            month == hebrew.ADAR and not leap and name_key(written) != spellings.PLAIN_ADAR):
        raise Unreadable(f"{year} is a common year of the Hebrew calendar: it has one Adar",
                         fragment=written, hint="write Adar, or check the year")
    endpoint, calendar = unit(HEBREW, match, year, month, written_day(match))
    if month == hebrew.ADAR and leap and name_key(written) == spellings.PLAIN_ADAR:
        if trace.on:
            trace.note(PLAIN_ADAR_NOTE)
        qualifiers = endpoint.qualifiers | {Qualifier.CONVENTION_DEPENDENT}
        endpoint = Endpoint(endpoint.earliest, endpoint.latest, endpoint.precision, qualifiers)
    return endpoint, calendar


def read_year_am(match: re.Match[str], era: str | None, marker: str | None,
                 settings: DateSettings) -> tuple[Endpoint, str]:
    """A year in AM: Hebrew (Anno Mundi) or Coptic (Anno Martyrum) as the word beside it
    says. Without one, a year from HEBREW_FROM on is Hebrew, and a lower one is refused as
    ambiguous. (The Byzantine Anno Mundi, from 5509 BC, is not read.)"""
    year = int(match["year"])
    word = name_key(match["word"] or "").strip("()")
    if word == "coptic":
        no_marker(marker, COPTIC)
        return unit(COPTIC, match, year, None, None)
    no_marker(marker, HEBREW)
    if not word and year < HEBREW_FROM:
        raise Unreadable(f"{match[0]} could be a Hebrew year (Anno Mundi) or a Coptic one "
                         "(Anno Martyrum)", fragment=match[0],
                         hint=f"write {year} AM (Hebrew) or {year} AM (Coptic)")
    if not word and trace.on:
        trace.note(f"AM with a year of {HEBREW_FROM} or more: the Hebrew year (Anno Mundi); a "
                   "Coptic year (Anno Martyrum) is below 2000 today")
    return unit(HEBREW, match, year, None, None)


def read_coptic(match: re.Match[str], era: str | None, marker: str | None,
                settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, COPTIC)
    month = month_number(match["month"], _COPTIC_KEYS, "Coptic", coptic.COPTIC_MONTH_NAMES)
    return unit(COPTIC, match, int(match["year"]), month, written_day(match))


def read_ethiopic(match: re.Match[str], era: str | None, marker: str | None,
                  settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, ETHIOPIC)
    month = None
    if "month" in match.re.groupindex:
        month = month_number(match["month"], _ETHIOPIC_KEYS, "Ethiopian",
                             coptic.ETHIOPIC_MONTH_NAMES)
    return unit(ETHIOPIC, match, int(match["year"]), month,
                written_day(match) if month else None)


def read_julian_day(match: re.Match[str], era: str | None, marker: str | None,
                    settings: DateSettings) -> tuple[Endpoint, str]:
    """The civil day (Universal Time) that holds a Julian Day.

    Julian Days count days from noon (JD 0 is noon, 1 January 4713 BC, Julian; Meeus,
    *Astronomical Algorithms*, ch. 7). A whole number (`JD 2451545`, `JDN 2451545`) is the
    day number, the civil day at whose noon it begins: 2000-01-01. With a fraction it is an
    instant, read as the civil day that holds it: `JD 2451545.0` is noon of 2000-01-01,
    `JD 2451545.5` midnight beginning 2000-01-02. A day number has no fraction (`JDN` with
    one is refused)."""
    if marker is not None:
        raise Unreadable("a Julian Day counts days in no calendar; Julian or Gregorian does "
                         "not apply to it", fragment=marker)
    number, fraction = int(match["number"]), match["fraction"]
    if fraction is not None and match["kind"].upper() == "JDN":
        raise Unreadable("a Julian Day Number is a whole number", fragment=match[0],
                         hint=f"write JD {match['number']}.{fraction} for an instant")
    # From half a day past noon on, the instant lies in the next civil day.
    day_number = number + (1 if fraction is not None and fraction[0] >= "5" else 0)
    endpoint = Endpoint.day(fixed_from_jdn(day_number))
    if trace.on:
        trace.note(f"{match[0]}: Julian Day, {_julian_day_words(fraction, day_number > number)}"
                   f" (Universal Time): {trace.bounds(endpoint)}")
    return endpoint, "julian-day"


def _julian_day_words(fraction: str | None, after_midnight: bool) -> str:
    if fraction is None:
        return "a day number: the civil day at whose noon it begins"
    if after_midnight:
        return "an instant after midnight: the civil day after its noon"
    return "an instant before midnight: the civil day of its noon"


OTHER_CALENDAR_FORMS: tuple[Form, ...] = (
    Form("Islamic date", ISLAMIC_DATE, read_islamic, takes_era=False, starts="digit letter"),
    Form("Hebrew date", HEBREW_DATE, read_hebrew, takes_era=False, starts="digit letter"),
    Form("year A.M.", YEAR_AM, read_year_am, takes_era=False),
    Form("Coptic date", COPTIC_DATE, read_coptic, takes_era=False, starts="digit letter"),
    Form("Ethiopian date", ETHIOPIC_DATE, read_ethiopic, takes_era=False,
         starts="digit letter"),
    Form("Ethiopian year", ETHIOPIC_YEAR, read_ethiopic, takes_era=False),
    *FRENCH_REPUBLICAN_FORMS,
    Form("Julian Day", JULIAN_DAY, read_julian_day, takes_era=False, starts="letter"),
)
