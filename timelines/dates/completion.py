"""What one date of a pair lends the other, as writers leave out what the two share:

- the end's year and era to a start without one: `March–May 1650`, `12 April – 3 May 1650`;
- the end's month and year to a start that is a day: `12–14 April 1650`; the start's month to
  an end that is a day, month-first: `April 12–14, 1650`;
- the end's unit to a start that is an ordinal or a number: `17th–18th century`,
  `late 17th–early 18th century`, `2nd–1st millennium BC`, `66–56 Ma`, `12,500–12,000 BP`;
  and an end's unit after a part word alone: `early–mid 17th century`;
- two digits after a plain three- or four-digit year abbreviate it: `1650–60` is 1650 to 1660
  (inclusive numbers as the Chicago Manual of Style writes them, from memory), `1650s–60s`;
- an end in BC lends its era to a start written without one or a sign: `500–400 BC`.
The same holds for `between X and Y` and `X or Y`.
"""
from __future__ import annotations

import re

from . import trace
from .grammar import FLAGS
from .months import MONTHS

_ERA = r"(?:B\.?\s?C\.?(?:\s?E\.?)?|A\.?\s?D\.?|C\.?\s?E\.?)"
_ORDINAL = r"[0-9]{1,3}(?:st|nd|rd|th)"

_DAY = re.compile(rf"[0-9]{{1,2}}(?:st|nd|rd|th)?", FLAGS)
END_DAY_AND_REST = re.compile(r"[0-9]{1,2}(?:st|nd|rd|th)? \s+ (?P<rest>(?:of\s+)?[a-z].*)",
                              FLAGS)
START_MONTH_DAY = re.compile(r"(?P<month>[a-z]+\.?) \s+ [0-9]{1,2}(?:st|nd|rd|th)?", FLAGS)
END_DAY_COMMA_YEAR = re.compile(r"[0-9]{1,2}(?:st|nd|rd|th)? , \s* (?P<year>[0-9].*)", FLAGS)
_MONTH_OR_SEASON = ("(?:" + "|".join(sorted(MONTHS, key=len, reverse=True))
                    + r"|spring|summer|autumn|fall|winter)\.?")
NO_YEAR = re.compile(rf"""
    {_MONTH_OR_SEASON} (?:\s+[0-9]{{1,2}}(?:st|nd|rd|th)?)?             # March, April 12
  | [0-9]{{1,2}}(?:st|nd|rd|th)? (?:\s+of)? \s+ {_MONTH_OR_SEASON}     # 12 April
  | Q[1-4]                                                            # Q1
""", FLAGS)
END_YEAR = re.compile(rf".*? [\s,] \s* (?P<year>[0-9]{{1,12}}(?:/[0-9]{{1,4}})? (?:\s*{_ERA})?)",
                      FLAGS)
START_ORDINAL = re.compile(rf"(?:.*\s)? (?:{_ORDINAL} | [a-z]+(?:-[a-z]+)?th | first | second"
                           rf" | third | [a-z]+-(?:first|second|third))", FLAGS)
END_UNIT = re.compile(rf""".*? \s* (?P<unit>(?:centuries|century|cent\.?|c\.?|millennium
                      |millennia|mill\.?) (?:\s+{_ERA})?)""", FLAGS)
START_NUMBER = re.compile(r"(?:.*\s)? [0-9][0-9,]*(?:\.[0-9]+)?", FLAGS)
END_AGE_UNIT = re.compile(r"""[0-9][0-9,.]* \s* (?P<unit>cal\.?\s*BP | BP | b2k | ka | kya
                          | Ma | mya | Ga | gya | (?:years?|yrs?)\s+(?:BP|ago)
                          | (?:thousand|million|billion)\s+years\s+ago)""", FLAGS)
PART_ALONE = re.compile(r"early|mid|middle|late", FLAGS)
END_PART_AND_REST = re.compile(r"(?:early|mid-?|middle|late) \s* (?P<rest>.+)", FLAGS)
PLAIN_YEAR_END = re.compile(r"(?:.*\D)? (?P<digits>[0-9]{3,4})", FLAGS)
TWO_DIGITS = re.compile(r"[0-9]{2}")
DECADE_END = re.compile(r"(?:.*\D)? (?P<digits>[0-9]{2})[0-9]0'?s", FLAGS)
SHORT_DECADE = re.compile(r"'?[0-9]0'?s", FLAGS)
HAS_ERA = re.compile(rf"(?:.*[0-9\s])? {_ERA} | {_ERA}\s*[0-9].*", FLAGS)
ENDS_BC = re.compile(r".*(?:[0-9]|\s)B\.?\s?C\.?(?:\s?E\.?)?", FLAGS)


def completed(start: str, end: str) -> tuple[str, str]:
    """(start, end) with what each lends the other written out."""
    written = start, end
    end = _unabbreviated(start, end)
    start, end = _day_and_month(start, end)
    start = _with_unit(start, end)
    start = _with_year(start, end)
    start = _with_era(start, end)
    if trace.on:
        changed = [f"{old!r} as {new!r}" for old, new in zip(written, (start, end)) if old != new]
        if changed:
            trace.note(f"the two dates lend each other what they share: {', '.join(changed)}")
    return start, end


def _unabbreviated(start: str, end: str) -> str:
    year = PLAIN_YEAR_END.fullmatch(start)
    if year and TWO_DIGITS.fullmatch(end):
        return year["digits"][:-2] + end
    decade = DECADE_END.fullmatch(start)
    if decade and SHORT_DECADE.fullmatch(end):
        return decade["digits"] + end.lstrip("'")
    return end


def _day_and_month(start: str, end: str) -> tuple[str, str]:
    if _DAY.fullmatch(start):
        rest = END_DAY_AND_REST.fullmatch(end)
        if rest:
            return f"{start} {rest['rest']}", end
    month_day = START_MONTH_DAY.fullmatch(start)
    day_year = END_DAY_COMMA_YEAR.fullmatch(end)
    if month_day and day_year:
        return f"{start}, {day_year['year']}", f"{month_day['month']} {end}"
    return start, end


def _with_unit(start: str, end: str) -> str:
    if PART_ALONE.fullmatch(start):
        rest = END_PART_AND_REST.fullmatch(end)
        return f"{start} {rest['rest']}" if rest else start
    unit = END_UNIT.fullmatch(end)
    if unit and START_ORDINAL.fullmatch(start):
        return f"{start} {unit['unit']}"
    age = END_AGE_UNIT.fullmatch(end)
    if age and START_NUMBER.fullmatch(start):
        return f"{start} {age['unit']}"
    return start


def _with_year(start: str, end: str) -> str:
    year = END_YEAR.fullmatch(end)
    if year and NO_YEAR.fullmatch(start):
        return f"{start} {year['year']}"
    return start


def _with_era(start: str, end: str) -> str:
    if (start and start[0] not in "+-" and not HAS_ERA.fullmatch(start)
            and ENDS_BC.fullmatch(end)):
        return f"{start} BC"
    return start
