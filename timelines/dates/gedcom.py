"""GEDCOM's calendar escapes for the calendars beside the Julian and Gregorian:
`@#DHEBREW@ 15 NSN 5760`, `@#DFRENCH R@ 18 BRUM 8`, rewritten into the written forms of
calendars/ (`15 Nisan 5760`, `18 Brumaire an 8`). `@#DJULIAN@` and `@#DGREGORIAN@` are read by
frame.py itself. The month codes are GEDCOM 5.5.1's (from memory); `ADR` is Adar, read as
calendars/ reads a plain Adar. `@#DROMAN@` and `@#DUNKNOWN@` name no calendar one can count in,
and are refused with that reason.
"""
from __future__ import annotations

import re

from . import trace
from .reasons import Unreadable

HEBREW_MONTHS = {"TSH": "Tishri", "CSH": "Cheshvan", "KSL": "Kislev", "TVT": "Tevet",
                 "SHV": "Shevat", "ADR": "Adar", "ADS": "Adar II", "NSN": "Nisan",
                 "IYR": "Iyar", "SVN": "Sivan", "TMZ": "Tammuz", "AAV": "Av", "ELL": "Elul"}
FRENCH_MONTHS = {"VEND": "Vendémiaire", "BRUM": "Brumaire", "FRIM": "Frimaire",
                 "NIVO": "Nivôse", "PLUV": "Pluviôse", "VENT": "Ventôse",
                 "GERM": "Germinal", "FLOR": "Floréal", "PRAI": "Prairial",
                 "MESS": "Messidor", "THER": "Thermidor", "FRUC": "Fructidor",
                 "COMP": "jour complémentaire"}
ESCAPE = re.compile(r"@\#D(?P<name>HEBREW|FRENCH\s+R|ROMAN|UNKNOWN)@\s*", re.IGNORECASE)
_DATE = re.compile(r"(?:(?P<day>[0-9]{1,2})\s+)?(?:(?P<month>[A-Z]{3,4})\s+)?(?P<year>[0-9]{1,4})",
                   re.IGNORECASE)


def rewritten(text: str) -> str:
    """The text with its GEDCOM calendar escapes written out (`BET @#DFRENCH R@ 1 VEND 8 AND
    @#DFRENCH R@ 18 BRUM 8` has two); the text itself without one."""
    found = ESCAPE.search(text)
    while found is not None:
        text = _one(text, found)
        found = ESCAPE.search(text)
    return text


def _one(text: str, found: re.Match[str]) -> str:
    name = " ".join(found["name"].upper().split())
    if name in ("ROMAN", "UNKNOWN"):
        raise Unreadable(f"GEDCOM's @#D{name}@ names no calendar to count days in",
                         fragment=found[0].strip())
    before, after = text[:found.start()], text[found.end():]
    date = _DATE.match(after)
    if date is None:
        raise Unreadable(f"a GEDCOM @#D{name}@ escape is followed by a date", fragment=found[0])
    hebrew = name == "HEBREW"
    months = HEBREW_MONTHS if hebrew else FRENCH_MONTHS
    month = date["month"]
    if month is not None and month.upper() not in months:
        raise Unreadable(f"{month} is no GEDCOM month code of the "
                         f"{'Hebrew' if hebrew else 'French Republican'} calendar",
                         fragment=month, hint=", ".join(months))
    parts = [date["day"], months[month.upper()] if month else None,
             date["year"] + " AM" if hebrew and not month else
             date["year"] if hebrew else f"an {date['year']}"]
    written = " ".join(part for part in parts if part)
    result = (before + after[:date.start()] + written + after[date.end():]).strip()
    if trace.on:
        trace.note(f"GEDCOM @#D{name}@: {after.strip()!r} written as {written!r}")
    return result
