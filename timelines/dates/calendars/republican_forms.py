"""French Republican dates as written (the calendar itself: republican.py).

- a day `18 Brumaire an VIII`, `1er vendémiaire an II`, `18 brumaire de l'an VIII`, and in
  English `18 Brumaire Year VIII`; a month `Brumaire an VIII`; a year `an VIII`, `an 8`,
  `l'an VIII`, `Year VIII`;
- the complementary days that end each year (month 13 here): `1er jour complémentaire an II`,
  `3e sansculottide an II`, by name `jour de la Vertu an II` .. `jour de la Révolution an III`
  (the sixth, in a leap year only), and all of them as one unit, `jours complémentaires an II`,
  `sansculottides an II`.
Any case; accents written or not. The year is in Roman numerals (any case) or in figures of
one or two digits: `an 1650` is refused, since in French it may be the Christian year 1650;
`Year` takes Roman numerals only.
"""
from __future__ import annotations

import re

from ...model import Endpoint
from ..grammar import FLAGS, Form
from ..reasons import Unreadable
from ..settings import DateSettings
from . import republican, spellings
from .names import APOSTROPHES, keyed, loose, name_key, names_pattern, roman_number
from .reckonings import FRENCH_REPUBLICAN, no_marker, unit

_YEAR = r"(?P<year> [IVXLCDM]++ | [0-9]{1,4}+ )"
_AN = rf"(?: (?:de\s+)? (?:l[{APOSTROPHES}]\s*)? an | year ) \s+ {_YEAR}"
_COMPLEMENTARY_DAY = rf"(?: jours? \s+ {loose('complémentaire')}s? | sans-?culottides? )"
_FESTIVALS = "|".join(loose(name) for name in republican.COMPLEMENTARY_DAY_NAMES)

FRENCH_DATE = re.compile(rf"""
    (?: (?P<day> [0-9]{{1,2}}+ ) (?P<first> er )? \s+ )?
    (?P<month> {names_pattern(spellings.FRENCH_REPUBLICAN)} ) ,?\s+ {_AN}
    # 18 Brumaire an VIII, 1er vendémiaire an II, Brumaire de l'an VIII
""", FLAGS)

COMPLEMENTARY_DAY = re.compile(rf"""
    (?: (?P<number> [1-6] ) (?P<ordinal> er | e | {loose('ème')} | eme )? \s+
        {_COMPLEMENTARY_DAY}                          # 1er jour complémentaire, 3e sansculottide
      | jour \s+ (?: de\s+la | du | des | de\s+l[{APOSTROPHES}] ) \s*
        (?P<festival> {_FESTIVALS} )                  # jour de la Révolution
      | (?P<all> (?:les\s+)? {_COMPLEMENTARY_DAY} )   # (les) jours complémentaires
    ) ,?\s+ {_AN}
""", FLAGS)

FRENCH_YEAR = re.compile(rf"""
    (?: (?:l[{APOSTROPHES}]\s*)? an \s+ (?=[0-9IVXLCDM]) | year \s+ (?=[IVXLCDM]) ) {_YEAR}
    # an VIII, an 8, l'an VIII, Year VIII
""", FLAGS)

_MONTH_KEYS = keyed(spellings.FRENCH_REPUBLICAN)
_FESTIVAL_KEYS = {name_key(name): number
                  for number, name in enumerate(republican.COMPLEMENTARY_DAY_NAMES, start=1)}


def republican_year(match: re.Match[str]) -> int:
    """The year of `an VIII` or `an 8`."""
    written = match["year"]
    if not written.isdigit():
        return roman_number(written)
    if len(written) > 2:
        raise Unreadable(f"a year of the French Republic in figures has one or two digits, "
                         f"not {written}", fragment=written,
                         hint=f"write it in Roman numerals; 'an {written}' may be the Christian "
                              f"year {int(written)}")
    return int(written)


def read_french_date(match: re.Match[str], era: str | None, marker: str | None,
                     settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, FRENCH_REPUBLICAN)
    day = None if match["day"] is None else int(match["day"])
    if match["first"] and day != 1:
        raise Unreadable(f"'er' marks the first day only (1er), not day {day}",
                         fragment=match["day"] + match["first"], hint=f"write {day}")
    month = _MONTH_KEYS[name_key(match["month"])]
    return unit(FRENCH_REPUBLICAN, match, republican_year(match), month, day)


def read_complementary_day(match: re.Match[str], era: str | None, marker: str | None,
                           settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, FRENCH_REPUBLICAN)
    year = republican_year(match)
    if match["all"]:
        return unit(FRENCH_REPUBLICAN, match, year, 13, None)
    if match["festival"]:
        return unit(FRENCH_REPUBLICAN, match, year, 13, _FESTIVAL_KEYS[name_key(
            match["festival"])])
    day, ordinal = int(match["number"]), name_key(match["ordinal"] or "")
    if ordinal and (ordinal == "er") != (day == 1):
        expected = "1er" if day == 1 else f"{day}e"
        raise Unreadable(f"write {expected}, not {match['number']}{match['ordinal']}",
                         fragment=match["number"] + match["ordinal"])
    return unit(FRENCH_REPUBLICAN, match, year, 13, day)


def read_french_year(match: re.Match[str], era: str | None, marker: str | None,
                     settings: DateSettings) -> tuple[Endpoint, str]:
    no_marker(marker, FRENCH_REPUBLICAN)
    return unit(FRENCH_REPUBLICAN, match, republican_year(match), None, None)


FRENCH_REPUBLICAN_FORMS = (
    Form("French Republican date", FRENCH_DATE, read_french_date, takes_era=False,
         starts="digit letter"),
    Form("French Republican complementary day", COMPLEMENTARY_DAY, read_complementary_day,
         takes_era=False, starts="digit letter"),
    Form("French Republican year", FRENCH_YEAR, read_french_year, takes_era=False,
         starts="letter"),
)
