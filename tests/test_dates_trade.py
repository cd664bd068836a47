"""Trade free text: the words historians, cataloguers and genealogists write around dates,
months and days in both orders, numeric dates, parts of units, centuries in words and codes,
millennia, BC forms and ranges that share parts. Years from 1583 on unless said, so that the
default historical reckoning is Gregorian and the ISO strings are the dates as written.
Trade conventions are "common practice, no source"; settings defaults per docs/dates.md.
"""
from __future__ import annotations

import math

import convertdate.julian
import dateutil.parser
import pytest

from timelines.calendar import JD_OFFSET, iso_from_fixed
from timelines.dates import DateError, DateSettings, parse_date, parse_endpoint, parse_span
from timelines.model import Precision, Qualifier

DAY, MONTH, SEASON, YEAR = Precision.DAY, Precision.MONTH, Precision.SEASON, Precision.YEAR
DECADE, CENTURY, MILLENNIUM = Precision.DECADE, Precision.CENTURY, Precision.MILLENNIUM
A, U, C = Qualifier.APPROXIMATE, Qualifier.UNCERTAIN, Qualifier.CONVENTION_DEPENDENT
BEFORE, AFTER, ONE_OF = Qualifier.BEFORE, Qualifier.AFTER, Qualifier.ONE_OF


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _window(endpoint):
    return _iso(endpoint.earliest), _iso(endpoint.latest), endpoint.precision, endpoint.qualifiers


def _julian(year, month, day):
    # convertdate gives the JD at midnight (x.5); JDN = floor(JD + 0.5) = R.D. + 1721425.
    return math.floor(convertdate.julian.to_jd(year, month, day) + 0.5) - JD_OFFSET


# (text, earliest, latest, precision, qualifiers), default settings
TRADE_DATES = [
    # approximate words: circa ±5 years at year precision (settings default)
    ("abt. 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),        # GEDCOM ABT: common practice, no source
    ("ABT 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),         # GEDCOM upper case
    ("approx 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),      # common practice, no source
    ("approximately 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),
    ("around 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),
    ("EST 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),         # GEDCOM estimated
    ("c.1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),           # no space after the point
    # uncertain: the bounds stay
    ("probably 1650", "1650-01-01", "1650-12-31", YEAR, {U}),       # common practice, no source
    ("possibly 1650", "1650-01-01", "1650-12-31", YEAR, {U}),
    ("? 1650", "1650-01-01", "1650-12-31", YEAR, {U}),
    ("1650 (?)", "1650-01-01", "1650-12-31", YEAR, {U}),            # catalogue usage
    ("1650s?", "1650-01-01", "1659-12-31", DECADE, {U}),            # issue 3 example
    ("17th century?", "1600-01-01", "1699-12-31", CENTURY, {U, C}),
    ("c. 1650?", "1645-01-01", "1655-12-31", YEAR, {A, U, C}),
    ("CAL 1650", "1650-01-01", "1650-12-31", YEAR, {U}),            # GEDCOM calculated
    # before: exclusive by the setting; the words "by", "not after" and the terminus allow the date
    ("pre-1700", None, "1699-12-31", YEAR, {BEFORE, C}),            # common practice, no source
    ("ante 1700", None, "1699-12-31", YEAR, {BEFORE, C}),
    ("by 1700", None, "1700-12-31", YEAR, {BEFORE}),                # the words allow 1700 itself
    ("not after 1700", None, "1700-12-31", YEAR, {BEFORE}),
    ("no later than 1700", None, "1700-12-31", YEAR, {BEFORE}),
    ("terminus ante quem 1700", None, "1700-12-31", YEAR, {BEFORE}),  # archaeology: the latest possible date
    ("t.a.q. 1700", None, "1700-12-31", YEAR, {BEFORE}),
    ("1700 or earlier", None, "1700-12-31", YEAR, {BEFORE}),
    ("1700 or before", None, "1700-12-31", YEAR, {BEFORE}),
    # after
    ("post-1650", "1651-01-01", None, YEAR, {AFTER, C}),
    ("AFT 1650", "1651-01-01", None, YEAR, {AFTER, C}),             # GEDCOM
    ("since 1650", "1650-01-01", None, YEAR, {AFTER}),
    ("not before 1650", "1650-01-01", None, YEAR, {AFTER}),
    ("no earlier than 1650", "1650-01-01", None, YEAR, {AFTER}),
    ("terminus post quem 1650", "1650-01-01", None, YEAR, {AFTER}),  # archaeology: a coin of 1650 in a layer
    ("TPQ 1650", "1650-01-01", None, YEAR, {AFTER}),
    ("1650 or later", "1650-01-01", None, YEAR, {AFTER}),
    ("by 12 April 1650", None, "1650-04-12", DAY, {BEFORE}),
    ("probably before 1700", None, "1699-12-31", YEAR, {U, BEFORE, C}),
    # between and or: one window over both
    ("between 1650 and 1660", "1650-01-01", "1660-12-31", YEAR, {ONE_OF}),   # common practice, no source
    ("BET 1650 AND 1660", "1650-01-01", "1660-12-31", YEAR, {ONE_OF}),       # GEDCOM
    ("between 12 and 14 April 1650", "1650-04-12", "1650-04-14", DAY, {ONE_OF}),
    ("between March and May 1650", "1650-03-01", "1650-05-31", MONTH, {ONE_OF}),
    ("between 1650 and 60", "1650-01-01", "1660-12-31", YEAR, {ONE_OF}),
    ("between c. 1650 and 1660", "1645-01-01", "1660-12-31", YEAR, {ONE_OF, A, C}),
    ("1650 or 1651", "1650-01-01", "1651-12-31", YEAR, {ONE_OF}),
    ("1650 or 51", "1650-01-01", "1651-12-31", YEAR, {ONE_OF}),
    ("either 1650 or 1651", "1650-01-01", "1651-12-31", YEAR, {ONE_OF}),
    ("12 or 13 April 1650", "1650-04-12", "1650-04-13", DAY, {ONE_OF}),
    ("April or May 1650", "1650-04-01", "1650-05-31", MONTH, {ONE_OF}),
    # months and days, both orders, ordinals, separators
    ("12th April 1985", "1985-04-12", "1985-04-12", DAY, set()),
    ("April 12th, 1985", "1985-04-12", "1985-04-12", DAY, set()),
    ("12-Apr-1985", "1985-04-12", "1985-04-12", DAY, set()),
    ("12/Apr/1985", "1985-04-12", "1985-04-12", DAY, set()),
    ("12 APR 1985", "1985-04-12", "1985-04-12", DAY, set()),        # GEDCOM
    ("1985 April 12", "1985-04-12", "1985-04-12", DAY, set()),      # year first, common practice
    ("Friday 12 April 1985", "1985-04-12", "1985-04-12", DAY, set()),   # a Friday (stdlib weekday)
    ("Fri., April 12, 1985", "1985-04-12", "1985-04-12", DAY, set()),
    ("1st May 1650", "1650-05-01", "1650-05-01", DAY, set()),
    ("2nd May 1650", "1650-05-02", "1650-05-02", DAY, set()),
    ("23rd May 1650", "1650-05-23", "1650-05-23", DAY, set()),
    ("Apr-1985", "1985-04-01", "1985-04-30", MONTH, set()),
    ("April, 1985", "1985-04-01", "1985-04-30", MONTH, set()),
    ("April of 1985", "1985-04-01", "1985-04-30", MONTH, set()),
    ("1985 April", "1985-04-01", "1985-04-30", MONTH, set()),
    ("Febr. 1704", "1704-02-01", "1704-02-29", MONTH, set()),
    ("7ber 1650", "1650-09-01", "1650-09-30", MONTH, set()),        # parish registers: 7ber = September (from memory)
    ("9ber 1650", "1650-11-01", "1650-11-30", MONTH, set()),
    ("Xber 1650", "1650-12-01", "1650-12-31", MONTH, set()),
    ("12 Xber 1650", "1650-12-12", "1650-12-12", DAY, set()),
    # numeric dates: unambiguous ones need no setting
    ("25/12/1650", "1650-12-25", "1650-12-25", DAY, set()),         # issue 3: 25/12/1650 is clear
    ("12/25/1650", "1650-12-25", "1650-12-25", DAY, set()),
    ("04/04/1650", "1650-04-04", "1650-04-04", DAY, set()),         # both readings agree
    ("25-12-1650", "1650-12-25", "1650-12-25", DAY, set()),
    ("25.12.1650", "1650-12-25", "1650-12-25", DAY, set()),
    ("03.04.1650", "1650-04-03", "1650-04-03", DAY, {C}),           # dots are day first: common practice, no source
    ("1650/12/25", "1650-12-25", "1650-12-25", DAY, set()),         # year first: no ambiguity
    ("12/1650", "1650-12-01", "1650-12-31", MONTH, set()),
    # decades and parts of decades: thirds 3/4/3 (settings default)
    ("early 1650s", "1650-01-01", "1652-12-31", DECADE, {C}),       # issue 3 example
    ("mid-1650s", "1653-01-01", "1656-12-31", DECADE, {C}),
    ("late 1650s", "1657-01-01", "1659-12-31", DECADE, {C}),
    ("the 1650s", "1650-01-01", "1659-12-31", DECADE, set()),
    ("first half of the 1650s", "1650-01-01", "1654-12-31", DECADE, set()),
    ("c. early 1650s", "1645-01-01", "1657-12-31", DECADE, {A, C}),
    # centuries: words, codes, parts (thirds 33/34/33), halves and quarters (exact)
    ("seventeenth century", "1600-01-01", "1699-12-31", CENTURY, {C}),
    ("Seventeenth-century", "1600-01-01", "1699-12-31", CENTURY, {C}),
    ("the twenty-first century", "2000-01-01", "2099-12-31", CENTURY, {C}),
    ("twenty first century", "2000-01-01", "2099-12-31", CENTURY, {C}),
    ("C17", "1600-01-01", "1699-12-31", CENTURY, {C}),              # cataloguers' shorthand: common practice
    ("C17th", "1600-01-01", "1699-12-31", CENTURY, {C}),
    ("17thC", "1600-01-01", "1699-12-31", CENTURY, {C}),
    ("early 17th century", "1600-01-01", "1632-12-31", CENTURY, {C}),
    ("mid-17th century", "1633-01-01", "1666-12-31", CENTURY, {C}),
    ("mid 17th c.", "1633-01-01", "1666-12-31", CENTURY, {C}),
    ("middle of the 17th century", "1633-01-01", "1666-12-31", CENTURY, {C}),
    ("late 17th century", "1667-01-01", "1699-12-31", CENTURY, {C}),
    ("end of the 17th century", "1667-01-01", "1699-12-31", CENTURY, {C}),
    ("first half of the 17th century", "1600-01-01", "1649-12-31", CENTURY, {C}),
    ("second half of the 17th century", "1650-01-01", "1699-12-31", CENTURY, {C}),
    ("latter half of the 17th century", "1650-01-01", "1699-12-31", CENTURY, {C}),
    ("first quarter of the 18th century", "1700-01-01", "1724-12-31", CENTURY, {C}),
    ("second quarter of the 17th century", "1625-01-01", "1649-12-31", CENTURY, {C}),
    ("3rd quarter of the 17th century", "1650-01-01", "1674-12-31", CENTURY, {C}),
    ("last quarter of the 18th c.", "1775-01-01", "1799-12-31", CENTURY, {C}),
    ("early 1600s", "1600-01-01", "1632-12-31", CENTURY, {C}),
    # years, months as parts
    ("early 1650", "1650-01-01", "1650-04-30", YEAR, {C}),          # thirds of twelve months
    ("late 1650", "1650-09-01", "1650-12-31", YEAR, {C}),
    ("first half of 1650", "1650-01-01", "1650-06-30", YEAR, set()),
    ("second quarter of 1650", "1650-04-01", "1650-06-30", YEAR, set()),
    ("mid-April 1650", "1650-04-11", "1650-04-20", MONTH, {C}),     # thirds of thirty days
    ("late April 1650", "1650-04-21", "1650-04-30", MONTH, {C}),
    ("early May 1650", "1650-05-01", "1650-05-10", MONTH, {C}),
    ("first half of May 1650", "1650-05-01", "1650-05-15", MONTH, set()),
    # seasons and quarters (northern hemisphere, meteorological seasons: settings default)
    ("spring 1650", "1650-03-01", "1650-05-31", SEASON, {C}),
    ("Summer of 1650", "1650-06-01", "1650-08-31", SEASON, {C}),
    ("autumn 1650", "1650-09-01", "1650-11-30", SEASON, {C}),
    ("fall 1650", "1650-09-01", "1650-11-30", SEASON, {C}),
    ("winter 1650", "1650-12-01", "1651-02-28", SEASON, {C}),
    ("winter 1650/51", "1650-12-01", "1651-02-28", SEASON, {C}),
    ("Q2 1650", "1650-04-01", "1650-06-30", SEASON, set()),
    ("1650 Q4", "1650-10-01", "1650-12-31", SEASON, set()),
    # floruit: a date of activity, bounds unchanged
    ("fl. 1650", "1650-01-01", "1650-12-31", YEAR, set()),
    ("floruit 1650s", "1650-01-01", "1659-12-31", DECADE, set()),
]


def test_trade_table_has_no_repeated_case():
    texts = [row[0] for row in TRADE_DATES]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", TRADE_DATES)
def test_trade_dates(text, earliest, latest, precision, qualifiers):
    assert _window(parse_date(text)) == (earliest, latest, precision, frozenset(qualifiers))


@pytest.mark.parametrize("text", ["Friday 12 April 1985", "April 12th, 1985", "12-Apr-1985",
                                  "1985 April 12", "12/25/1650", "25.12.1650"])
def test_full_dates_agree_with_dateutil(text):
    # dateutil reads a date with every field present as proleptic Gregorian; in the Gregorian
    # setting both must give the same day.
    gregorian = DateSettings(calendar="gregorian")
    expected = dateutil.parser.parse(text, dayfirst=text.count(".") == 2).date().toordinal()
    assert parse_date(text, gregorian).earliest == expected


# (text, settings, earliest, latest, qualifiers): the documented settings move the bounds
SETTINGS_CASES = [
    ("03/04/1650", DateSettings(day_first=True), "1650-04-03", "1650-04-03", {C}),
    ("03/04/1650", DateSettings(day_first=False), "1650-03-04", "1650-03-04", {C}),
    ("25/12/1650", DateSettings(day_first=False), "1650-12-25", "1650-12-25", set()),  # no ambiguity
    ("early 17th century", DateSettings(early_mid_late="overlapping"), "1600-01-01", "1639-12-31", {C}),
    ("mid-17th century", DateSettings(early_mid_late="overlapping"), "1630-01-01", "1669-12-31", {C}),
    ("late 17th century", DateSettings(early_mid_late="overlapping"), "1660-01-01", "1699-12-31", {C}),
    ("early 17th century", DateSettings(century="strict"), "1601-01-01", "1633-12-31", {C}),
    ("second millennium", DateSettings(century="strict"), "1001-01-07", "2000-12-31", {C}),  # Julian 1001-01-01 (convertdate)
    ("second millennium", DateSettings(), "1000-01-06", "1999-12-31", {C}),                  # Julian 1000-01-01 (convertdate)
    ("spring 1650", DateSettings(hemisphere="southern"), "1650-09-01", "1650-11-30", {C}),
    ("summer 1650", DateSettings(hemisphere="southern"), "1650-12-01", "1651-02-28", {C}),
    ("before 1700", DateSettings(before_after="inclusive"), None, "1700-12-31", {BEFORE, C}),
    ("by 1700", DateSettings(before_after="exclusive"), None, "1700-12-31", {BEFORE}),  # words, not setting
    ("c. 1650", DateSettings(circa_years_for_year=0), "1650-01-01", "1650-12-31", {A, C}),
]


def test_settings_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in SETTINGS_CASES]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, earliest, latest, qualifiers", SETTINGS_CASES)
def test_settings_move_the_bounds(text, settings, earliest, latest, qualifiers):
    endpoint = parse_date(text, settings)
    assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == (earliest, latest)
    assert endpoint.qualifiers == frozenset(qualifiers)


# (text, settings, first Julian (y, m, d), last Julian (y, m, d)): BC and early AD are Julian
# in the default historical reckoning; checked against convertdate.julian (astronomical years).
JULIAN_CASES = [
    ("early 5th century BC", DateSettings(), (-498, 1, 1), (-466, 12, 31)),   # 499-467 BC: parts count forward in time
    ("late 1650s BC", DateSettings(), (-1651, 1, 1), (-1649, 12, 31)),        # 1652-1650 BC, the last 3 years (thirds 3/4/3)
    ("2nd millennium BC", DateSettings(), (-1998, 1, 1), (-999, 12, 31)),     # common: 1999-1000 BC
    ("2nd millennium BC", DateSettings(century="strict"), (-1999, 1, 1), (-1000, 12, 31)),  # strict: 2000-1001 BC
    ("1st millennium", DateSettings(), (1, 1, 1), (999, 12, 31)),             # no year 0: AD 1-999
    ("3rd millennium BCE", DateSettings(), (-2998, 1, 1), (-1999, 12, 31)),
    ("fifth century BC", DateSettings(), (-498, 1, 1), (-399, 12, 31)),
    ("C5 BC", DateSettings(), (-498, 1, 1), (-399, 12, 31)),
    ("first century BC", DateSettings(), (-98, 1, 1), (0, 12, 31)),
    ("c. 44 BCE", DateSettings(), (-48, 1, 1), (-38, 12, 31)),
    ("12,000 BC", DateSettings(), (-11999, 1, 1), (-11999, 12, 31)),
    ("late 1st century AD", DateSettings(), (67, 1, 1), (99, 12, 31)),        # AD 1-99: 99 years, thirds 33/33/33
    ("12 February 1500", DateSettings(), (1500, 2, 12), (1500, 2, 12)),
]


def test_julian_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in JULIAN_CASES]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, first, last", JULIAN_CASES)
def test_bc_and_early_forms_agree_with_convertdate(text, settings, first, last):
    endpoint = parse_date(text, settings)
    assert (endpoint.earliest, endpoint.latest) == (_julian(*first), _julian(*last))


# (text, start earliest, start latest, end earliest, end latest): ranges that share parts
SHARED_RANGES = [
    ("March–May 1650", "1650-03-01", "1650-03-31", "1650-05-01", "1650-05-31"),   # issue 3 example
    ("Jan.–Mar. 1650", "1650-01-01", "1650-01-31", "1650-03-01", "1650-03-31"),
    ("12–14 April 1650", "1650-04-12", "1650-04-12", "1650-04-14", "1650-04-14"),  # issue 3 example
    ("12-14 April 1650", "1650-04-12", "1650-04-12", "1650-04-14", "1650-04-14"),
    ("April 12–14, 1650", "1650-04-12", "1650-04-12", "1650-04-14", "1650-04-14"),
    ("12 April – 3 May 1650", "1650-04-12", "1650-04-12", "1650-05-03", "1650-05-03"),
    ("spring–summer 1650", "1650-03-01", "1650-05-31", "1650-06-01", "1650-08-31"),
    ("17th–18th century", "1600-01-01", "1699-12-31", "1700-01-01", "1799-12-31"),  # issue 3 example
    ("17th-18th centuries", "1600-01-01", "1699-12-31", "1700-01-01", "1799-12-31"),
    ("late 17th–early 18th century", "1667-01-01", "1699-12-31", "1700-01-01", "1732-12-31"),
    ("early–mid 17th century", "1600-01-01", "1632-12-31", "1633-01-01", "1666-12-31"),
    ("early to mid 1650s", "1650-01-01", "1652-12-31", "1653-01-01", "1656-12-31"),
    ("1650s–60s", "1650-01-01", "1659-12-31", "1660-01-01", "1669-12-31"),
    ("c. 1650–60", "1645-01-01", "1655-12-31", "1660-01-01", "1660-12-31"),
    ("from 1650 to 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("FROM 1650 TO 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),  # GEDCOM
    ("1650 until 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("1650 – 1701/02", "1650-01-01", "1650-12-31", "1702-01-12", "1702-04-04"),     # a dual year at the end
    ("after 1650 – before 1700", "1651-01-01", None, None, "1699-12-31"),
    ("1650–1660?", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
]


def test_shared_range_table_has_no_repeated_case():
    assert len({row[0] for row in SHARED_RANGES}) == len(SHARED_RANGES)


@pytest.mark.parametrize("text, start_earliest, start_latest, end_earliest, end_latest",
                         SHARED_RANGES)
def test_ranges_that_share_parts(text, start_earliest, start_latest, end_earliest, end_latest):
    span = parse_span(text)
    assert (_iso(span.start.earliest), _iso(span.start.latest)) == (start_earliest, start_latest)
    assert (_iso(span.end.earliest), _iso(span.end.latest)) == (end_earliest, end_latest)


# (text, Julian start year, Julian end year): ranges across the era, convertdate.julian
ERA_RANGES = [
    ("500 BC – AD 100", -499, 100),          # issue 3 example
    ("10 BC to AD 10", -9, 10),              # issue 3 example
    ("5th–4th century BC", -498, -299),      # 499-400 BC to 399-300 BC: common reading
    ("2nd–1st millennium BC", -1998, 0),
    ("c. 500 BC – AD 100", -504, 100),
    ("44–40 BCE", -43, -39),
]


def test_era_range_table_has_no_repeated_case():
    assert len({row[0] for row in ERA_RANGES}) == len(ERA_RANGES)


@pytest.mark.parametrize("text, start_year, end_year", ERA_RANGES)
def test_ranges_across_the_era(text, start_year, end_year):
    span = parse_span(text)
    assert span.start.earliest == _julian(start_year, 1, 1)
    assert span.end.latest == _julian(end_year, 12, 31)


def test_open_and_unknown_range_sides():
    running = parse_span("1985–present")
    assert running.end.has(Qualifier.OPEN_END) and running.end.latest is None
    assert parse_span("1650–?").end.has(Qualifier.UNKNOWN_END)
    assert parse_span("?–1660").start.has(Qualifier.UNKNOWN_START)


def test_a_two_bound_range_collapses_for_a_column():
    endpoint = parse_endpoint("between 1650 and 1660")
    assert endpoint == parse_date("between 1650 and 1660")


# (text, exact reason)
TRADE_ERRORS = [
    ("03/04/1650", "03/04/1650 could be 3 April or March 4"),           # issue 3: names both readings
    ("03-04-1650", "03-04-1650 could be 3 April or March 4"),
    ("25/12/50", "a two-digit year does not say its century"),
    ("25/12.1650", "the day, month and year are separated by different marks"),
    ("13/13/1650", "month 13 does not exist"),
    ("Monday 12 April 1985", "that day was a Friday, not a Monday"),
    ("12st April 1650", "write 12th, not 12st"),
    ("xyz century", "'xyz' is not an ordinal number such as seventeenth"),
    ("C0", "there is no 0th century"),
    ("c. before 1650 before", "not a date form timelines reads"),
    ("before after 1650", "one date cannot have two bounds"),
    ("early late 1650s", "one part of a unit at a time"),
    ("c. c. 1650", "approximate twice (both c. and ~); write one of them"),
    ("second quarter of the 1650s", "a decade does not divide into quarters"),
    ("early 12 April 1650", "'early' applies to a month, year, decade, century or millennium, "
                            "not to a day"),
    ("between 1660 and 1650", "the second date comes before the first"),
    ("spring 1650/51", "only a winter is written with two years (winter 1650/51)"),
    ("1650s–1640s", "the end comes before the start"),
    ("12 Aprl 1650", "not a date form timelines reads"),
    ("c. 18th", "not a date form timelines reads"),
]


def test_trade_error_table_has_no_repeated_case():
    assert len({row[0] for row in TRADE_ERRORS}) == len(TRADE_ERRORS)


@pytest.mark.parametrize("text, reason", TRADE_ERRORS)
def test_trade_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason


# (text, hint, position): suggestions that help and where the fault stands
HINTS = [
    ("12 Aprl 1650", "did you mean April?", 3),
    ("c. 18th", "expected a date such as 1650, c. 1650, 1650s, 17th century, 1650-04-12, 44 BC",
     None),
    ("0 BC", "1 BC is the year before AD 1", 0),
    ("03/04/1650", "set day-first (yes: day/month/year, no: month/day/year) or write the "
                   "month as a word", 0),
    ("25/12/50", "write the year in full, such as 1650", 6),
    ("1650s–1640s", "did you mean 1640s – 1650s?", 6),
    ("56–66 Ma", "ages count back from the present: write the older first (66–56 Ma)", 3),
]


def test_hint_table_has_no_repeated_case():
    assert len({row[0] for row in HINTS}) == len(HINTS)


@pytest.mark.parametrize("text, hint, position", HINTS)
def test_errors_point_at_the_text_and_suggest(text, hint, position):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert (caught.value.hint, caught.value.position) == (hint, position)
