"""Feasts and term days as dates: `Michaelmas 1650`, `Lady Day, 1651`, `Easter Day 1700`,
`the feast of St Michael 1650`, `Whitsunday term 1650`, `Candlemas 1650/51`.

Fixed feasts are a day of the month, read like `29 September 1650` (oldstyle.day_endpoint),
so the year-start setting applies: with years from Lady Day, `Candlemas 1650` is 2 February
1651 as counted from 1 January. Movable feasts are days from Easter Day, in the computus and
the written year that computus.py explains. A dual year (`Candlemas 1650/51`, `Easter
1667/68`) names the feast in its New Style year, Julian, as for any day (oldstyle.py).
The days of the quarter days, the Scottish term days and the movable feasts' distances from
Easter are those of Cheney, *A Handbook of Dates for Students of British History* (from
memory); the other fixed feasts are those of the English church calendar (common practice).

Conventions, decided here:
- `Whitsunday`, `Whitsun`, `Whit Sunday` and `Pentecost` are the movable feast, Easter + 49
  days; `Whitsunday term`, `term of Whitsunday` and `Scottish Whitsunday` are the Scottish
  term day, 15 May; `Holy Thursday` is Ascension Day, as English usage has it; `St Thomas` is
  the apostle (21 December), not Becket; `St John` alone (27 December or 24 June) is left out;
- the English law terms (`Hilary`, `Easter`, `Trinity`, `Michaelmas term`) were sittings of
  some weeks, not days: they are refused, pointing at the feast. The Scottish term days
  (`Candlemas`, `Whitsunday`, `Lammas`, `Martinmas term`) are days.
"""
from __future__ import annotations

import re
from dataclasses import dataclass

from ..calendar import JULIAN, fixed_from_calendar
from ..model import Endpoint
from . import trace
from .computus import feast_in_year
from .grammar import FLAGS, Form
from .oldstyle import day_endpoint, dual_year, within_dual
from .reasons import Unreadable
from .settings import DateSettings
from .text import written_year

# Where each day comes from, as the notes of `explain` name it.
QUARTER_DAY = "an English quarter day (Cheney, from memory)"
# The Term and Quarter Days (Scotland) Act 1990 moved Whitsunday and Martinmas to 28 May and
# 28 November (from memory); the older days are read here, as the documents have them.
SCOTTISH_TERM = "a Scottish term day (Cheney, from memory)"
CHURCH = "a fixed feast of the church calendar (common practice)"
MOVABLE = "a movable feast (Cheney, from memory)"


@dataclass(frozen=True, slots=True)
class Feast:
    name: str                          # as notes and messages write it
    spellings: tuple[str, ...]         # lower case; "st" also reads St., Saint; a space also
                                       # reads a hyphen or nothing; "'" may be left out
    day: tuple[int, int] | None = None   # (month, day) of a fixed feast
    offset: int | None = None          # days from Easter Day of a movable feast
    source: str = CHURCH


FEASTS = (
    Feast("New Year's Day", ("new year's day", "circumcision"), day=(1, 1)),
    Feast("Epiphany", ("epiphany", "twelfth day"), day=(1, 6)),
    Feast("St Hilary", ("st hilary", "hilarymas"), day=(1, 13)),
    Feast("Candlemas", ("candlemas", "purification"), day=(2, 2), source=SCOTTISH_TERM),
    Feast("Lady Day", ("lady day", "annunciation"), day=(3, 25), source=QUARTER_DAY),
    Feast("Whitsunday term (Scotland)", ("scottish whit sunday",), day=(5, 15),
          source=SCOTTISH_TERM),
    Feast("Midsummer Day", ("midsummer", "st john the baptist", "st john baptist",
                            "nativity of st john the baptist"), day=(6, 24), source=QUARTER_DAY),
    Feast("St James", ("st james", "st james the apostle"), day=(7, 25)),
    Feast("Lammas", ("lammas",), day=(8, 1), source=SCOTTISH_TERM),
    Feast("Michaelmas", ("michaelmas", "st michael", "st michael and all angels",
                         "st michael the archangel"), day=(9, 29), source=QUARTER_DAY),
    Feast("All Saints", ("all saints", "all hallows", "hallowmas"), day=(11, 1)),
    Feast("Martinmas", ("martinmas", "martlemas", "st martin"), day=(11, 11),
          source=SCOTTISH_TERM),
    Feast("St Thomas", ("st thomas", "st thomas the apostle"), day=(12, 21)),
    Feast("Christmas", ("christmas", "xmas", "nativity of our lord"), day=(12, 25),
          source=QUARTER_DAY),
    Feast("Holy Innocents", ("holy innocents", "innocents", "childermas"), day=(12, 28)),
    Feast("Septuagesima", ("septuagesima", "septuagesima sunday"), offset=-63, source=MOVABLE),
    Feast("Sexagesima", ("sexagesima", "sexagesima sunday"), offset=-56, source=MOVABLE),
    Feast("Quinquagesima", ("quinquagesima", "quinquagesima sunday", "shrove sunday"),
          offset=-49, source=MOVABLE),
    Feast("Shrove Tuesday", ("shrove tuesday",), offset=-47, source=MOVABLE),
    Feast("Ash Wednesday", ("ash wednesday",), offset=-46, source=MOVABLE),
    Feast("Palm Sunday", ("palm sunday",), offset=-7, source=MOVABLE),
    Feast("Maundy Thursday", ("maundy thursday",), offset=-3, source=MOVABLE),
    Feast("Good Friday", ("good friday",), offset=-2, source=MOVABLE),
    Feast("Easter Day", ("easter", "easter sunday"), offset=0, source=MOVABLE),
    Feast("Easter Monday", ("easter monday",), offset=1, source=MOVABLE),
    Feast("Low Sunday", ("low sunday",), offset=7, source=MOVABLE),
    Feast("Rogation Sunday", ("rogation sunday",), offset=35, source=MOVABLE),
    Feast("Ascension Day", ("ascension", "holy thursday"), offset=39, source=MOVABLE),
    Feast("Whitsunday", ("whit sunday", "whit sun", "pentecost"), offset=49, source=MOVABLE),
    Feast("Whit Monday", ("whit monday",), offset=50, source=MOVABLE),
    Feast("Trinity Sunday", ("trinity sunday",), offset=56, source=MOVABLE),
    Feast("Corpus Christi", ("corpus christi",), offset=60, source=MOVABLE),
)
_BY_NAME = {feast.name: feast for feast in FEASTS}
# Term days by the name before `term`: Scottish term days are days; English law terms are not.
_SCOTTISH_WHITSUNDAY = "Whitsunday term (Scotland)"
TERM_DAYS = {"whit sunday": _SCOTTISH_WHITSUNDAY, "whit sun": _SCOTTISH_WHITSUNDAY,
             "candlemas": "Candlemas", "lammas": "Lammas", "martinmas": "Martinmas",
             "martlemas": "Martinmas"}
LAW_TERMS = {"hilary": "St Hilary", "easter": "Easter", "trinity": "Trinity Sunday",
             "michaelmas": "Michaelmas"}


def _key(text: str) -> str:
    """A spelling as the table looks it up: `Saint Michael's` -> `stmichael`."""
    text = re.sub(r"\bsaint\b|\bst\b", "st", text.lower())
    return re.sub(r"[^a-z]", "", re.sub(r"mass\b", "mas", text))


_BY_SPELLING = {_key(spelling): feast for feast in FEASTS for spelling in feast.spellings}
_TERM_DAYS = {_key(spelling): _BY_NAME[name] for spelling, name in TERM_DAYS.items()}


def _spelled(spelling: str) -> str:
    """The regex of one spelling: `st` also St., Saint; -mas also -mass (Michaelmass)."""
    words = [r"(?:st\.?|saint)" if word == "st" else re.escape(word).replace("'", "'?")
             + ("s?" if word.endswith("mas") else "") for word in spelling.split()]
    return r"[\s-]*".join(words)


def _names(spellings) -> str:
    return "|".join(_spelled(s) for s in sorted(spellings, key=len, reverse=True))


_YEAR = r"""(?: \s*,\s* | \s+ ) (?:(?:of|in)\s+)?
            (?P<year>[0-9]{1,4}) (?:/(?P<next>[0-9]{1,4}))?   # 1650, or dual 1650/51"""
FEAST_YEAR = re.compile(rf"""
    (?:the\s+)? (?:feast\s+of\s+(?:the\s+)?)?            # the feast of St Michael
    (?P<feast>{_names(s for f in FEASTS for s in f.spellings)})
    (?: (?:'s|s'|')? [\s-]* day )?                        # Michaelmas Day, St James's Day
    {_YEAR}
""", FLAGS)
_TERM_NAMES = _names([*TERM_DAYS, *LAW_TERMS])
TERM_YEAR = re.compile(rf"""
    (?: term\s+of\s+(?P<term_of>{_TERM_NAMES})            # term of Whitsunday
      | (?P<term>{_TERM_NAMES}) [\s-]+ term )            # Whitsunday term, Michaelmas term
    {_YEAR}
""", FLAGS)


def read_feast(match: re.Match[str], era: str | None, marker: str | None,
               settings: DateSettings) -> Endpoint | tuple[Endpoint, str]:
    return _read(_BY_SPELLING[_key(match["feast"])], match, era, marker, settings)


def read_term(match: re.Match[str], era: str | None, marker: str | None,
              settings: DateSettings) -> Endpoint | tuple[Endpoint, str]:
    name = match["term"] or match["term_of"]
    key = _key(name)
    if key in LAW_TERMS:
        raise Unreadable(f"{name.capitalize()} term is a law term, sittings of some weeks, "
                         "not a day", fragment=match[0],
                         hint=f"for the feast write {LAW_TERMS[key]} {match['year']}; for the "
                              "term write its months")
    return _read(_TERM_DAYS[key], match, era, marker, settings)


def _read(feast: Feast, match: re.Match[str], era: str | None, marker: str | None,
          settings: DateSettings) -> Endpoint | tuple[Endpoint, str]:
    if match["next"] is not None:
        return _in_dual_year(feast, match, marker, settings)
    year = written_year(match["year"], era)
    calendar = marker or settings.reckoning
    if feast.day is not None:
        endpoint = day_endpoint(year, *feast.day, calendar, settings)
        if trace.on:
            trace.note(f"{feast.name} {year}: day {feast.day[1]} of month {feast.day[0]}, "
                       f"{feast.source}: {trace.bounds(endpoint)}")
        return endpoint
    return feast_in_year(feast.name, feast.offset, year, calendar, settings)


def _in_dual_year(feast: Feast, match: re.Match[str], marker: str | None,
                  settings: DateSettings) -> tuple[Endpoint, str]:
    """`Candlemas 1650/51`: the feast in the New Style year, Julian, between 1 January and
    the Old Style new year (oldstyle.py)."""
    new_year = dual_year(match["year"], match["next"])
    if marker not in (None, JULIAN):
        raise Unreadable("a dual year belongs to the Old Style (Julian) calendar",
                         fragment=match["next"])
    day = (Endpoint.day(fixed_from_calendar(new_year, *feast.day, JULIAN)) if feast.offset is None
           else feast_in_year(feast.name, feast.offset, new_year, JULIAN))
    endpoint = within_dual(day, new_year, settings, match[0])
    if trace.on:
        trace.note(f"{feast.name} {match['year']}/{match['next']}: New Style {new_year}, "
                   f"Julian calendar: {trace.bounds(endpoint)}")
    return endpoint, JULIAN


FEAST_FORMS = (
    Form("feast", FEAST_YEAR, read_feast, starts="letter"),
    Form("term day", TERM_YEAR, read_term, starts="letter"),
)
