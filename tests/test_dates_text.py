"""Historians' free text: years, decades, centuries, circa, before/after, eras, month names,
and ranges. Trade conventions are "common practice, no source"; dates in the Julian calendar
are cross-checked with convertdate.julian, Gregorian ones with the stdlib and dateutil.
"""
from __future__ import annotations

import datetime
import math

import convertdate.gregorian
import convertdate.julian
import dateutil.parser
import pytest

from timelines.calendar import JD_OFFSET, iso_from_fixed
from timelines.dates import DEFAULT_SETTINGS, DateError, DateSettings, parse_date, parse_span
from timelines.model import Precision, Qualifier

DAY, MONTH, YEAR = Precision.DAY, Precision.MONTH, Precision.YEAR
DECADE, CENTURY = Precision.DECADE, Precision.CENTURY
A, C = Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT
BEFORE, AFTER = Qualifier.BEFORE, Qualifier.AFTER

STRICT = DateSettings(century="strict")
INCLUSIVE = DateSettings(before_after="inclusive")
JULIAN = DateSettings(calendar="julian")
GREGORIAN = DateSettings(calendar="gregorian")


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _window(endpoint):
    return _iso(endpoint.earliest), _iso(endpoint.latest), endpoint.precision, endpoint.qualifiers


def _fixed_from_jd(jd: float) -> int:
    # convertdate's to_jd gives the JD at midnight (x.5); JDN = floor(JD + 0.5) = R.D. + 1721425.
    return math.floor(jd + 0.5) - JD_OFFSET


def _julian(year, month, day):
    return _fixed_from_jd(convertdate.julian.to_jd(year, month, day))  # astronomical years


# (text, earliest, latest, precision, qualifiers) in the default settings. Years from 1583 on,
# where the default historical reckoning is Gregorian, so the ISO strings are the dates written.
TEXT_DATES = [
    ("1650", "1650-01-01", "1650-12-31", YEAR, set()),          # DESIGN §3: a value covers its unit
    ("  1650  ", "1650-01-01", "1650-12-31", YEAR, set()),      # common practice, no source: cells are stripped
    ("1650s", "1650-01-01", "1659-12-31", DECADE, set()),       # DESIGN §3: 1650s = 1650..1659
    ("1650's", "1650-01-01", "1659-12-31", DECADE, set()),      # common practice, no source
    ("1650\u2019s", "1650-01-01", "1659-12-31", DECADE, set()), # common practice, no source: typographic apostrophe
    # common practice, no source: "the 1600s" is a century to most, a decade to some; issue 10
    # made the reading a setting (hundreds, default century), so it is convention_dependent.
    ("1600s", "1600-01-01", "1699-12-31", CENTURY, {C}),
    ("17th century", "1600-01-01", "1699-12-31", CENTURY, {C}), # DESIGN §3 common usage (settings default)
    ("17th c.", "1600-01-01", "1699-12-31", CENTURY, {C}),      # common practice, no source
    ("17th c", "1600-01-01", "1699-12-31", CENTURY, {C}),       # common practice, no source
    ("17th cent.", "1600-01-01", "1699-12-31", CENTURY, {C}),   # common practice, no source
    ("17th-century", "1600-01-01", "1699-12-31", CENTURY, {C}), # common practice, no source
    ("17TH CENTURY", "1600-01-01", "1699-12-31", CENTURY, {C}), # any case
    ("18th century", "1700-01-01", "1799-12-31", CENTURY, {C}), # common practice, no source
    ("21st century", "2000-01-01", "2099-12-31", CENTURY, {C}), # common practice, no source
    ("22nd century", "2100-01-01", "2199-12-31", CENTURY, {C}), # common practice, no source
    ("23rd century", "2200-01-01", "2299-12-31", CENTURY, {C}), # common practice, no source
    ("c. 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),      # common practice, no source: circa ±5 years (settings)
    ("ca. 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),     # common practice, no source
    ("ca 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),      # common practice, no source
    ("circa 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),   # common practice, no source
    ("c 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),       # common practice, no source
    ("c1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),        # common practice, no source
    ("C. 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),      # any case
    ("about 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}),   # DESIGN §3 lists "about"
    ("approx. 1650", "1645-01-01", "1655-12-31", YEAR, {A, C}), # common practice, no source
    ("c. 1650s", "1645-01-01", "1664-12-31", DECADE, {A, C}),   # circa ±5 years on a decade (settings)
    ("c. 18th century", "1675-01-01", "1824-12-31", CENTURY, {A, C}),  # circa ±25 years on a century (settings)
    ("c. April 1650", "1650-03-01", "1650-05-31", MONTH, {A, C}),      # circa ±31 days on a month (settings)
    ("c. 12 April 1650", "1650-03-28", "1650-04-27", DAY, {A, C}),     # circa ±15 days on a day (settings)
    ("c. 1985-04-12", "1985-03-28", "1985-04-27", DAY, {A, C}),        # circa on an ISO date
    ("before 1700", None, "1699-12-31", YEAR, {BEFORE, C}),     # DESIGN §3: exclusive default ends 1699-12-31
    ("bef. 1700", None, "1699-12-31", YEAR, {BEFORE, C}),       # DESIGN §1 lists "bef."
    ("BEFORE 1700", None, "1699-12-31", YEAR, {BEFORE, C}),     # any case
    ("after 1700", "1701-01-01", None, YEAR, {AFTER, C}),       # symmetrical to before
    ("aft. 1700", "1701-01-01", None, YEAR, {AFTER, C}),        # common practice, no source
    ("before 12 April 1650", None, "1650-04-11", DAY, {BEFORE, C}),
    ("after 1650s", "1660-01-01", None, DECADE, {AFTER, C}),
    ("before c. 1650", None, "1644-12-31", YEAR, {BEFORE, A, C}),
    ("before 1985-04", None, "1985-03-31", MONTH, {BEFORE, C}), # before an ISO date
    ("AD 1650", "1650-01-01", "1650-12-31", YEAR, set()),       # common practice, no source
    ("A.D. 1650", "1650-01-01", "1650-12-31", YEAR, set()),     # common practice, no source
    ("1650 AD", "1650-01-01", "1650-12-31", YEAR, set()),       # common practice, no source
    ("1650 CE", "1650-01-01", "1650-12-31", YEAR, set()),       # common practice, no source
    ("April 1650", "1650-04-01", "1650-04-30", MONTH, set()),   # common practice, no source
    ("Apr 1650", "1650-04-01", "1650-04-30", MONTH, set()),     # common practice, no source
    ("apr. 1650", "1650-04-01", "1650-04-30", MONTH, set()),    # any case
    ("Sept. 1650", "1650-09-01", "1650-09-30", MONTH, set()),   # common practice, no source
    ("February 1704", "1704-02-01", "1704-02-29", MONTH, set()),# Gregorian leap year
    ("12 April 1650", "1650-04-12", "1650-04-12", DAY, set()),  # common practice, no source
    ("12 Apr 1650", "1650-04-12", "1650-04-12", DAY, set()),    # common practice, no source
    ("12th April 1650", "1650-04-12", "1650-04-12", DAY, set()),        # common practice, no source
    ("12th of April 1650", "1650-04-12", "1650-04-12", DAY, set()),     # common practice, no source
    ("April 12, 1650", "1650-04-12", "1650-04-12", DAY, set()), # common practice, no source
    ("April 12 1650", "1650-04-12", "1650-04-12", DAY, set()),  # common practice, no source
]


def test_text_table_has_no_repeated_case():
    texts = [row[0] for row in TEXT_DATES]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", TEXT_DATES)
def test_text_dates(text, earliest, latest, precision, qualifiers):
    assert _window(parse_date(text)) == (earliest, latest, precision, frozenset(qualifiers))


# (text, settings, earliest, latest): the documented convention settings move the bounds.
CONVENTIONS = [
    ("17th century", STRICT, "1601-01-01", "1700-12-31"),   # DESIGN §3 strict reading 1601-1700
    ("21st century", STRICT, "2001-01-01", "2100-12-31"),   # strict: the century ends with its 100th year
    ("before 1700", INCLUSIVE, None, "1700-12-31"),         # DESIGN §3 inclusive ends 1700-12-31
    ("after 1700", INCLUSIVE, "1700-01-01", None),
    ("c. 1650", DateSettings(circa_years_for_year=10), "1640-01-01", "1660-12-31"),
    ("c. 12 April 1650", DateSettings(circa_days_for_day=1), "1650-04-11", "1650-04-13"),
]


def test_convention_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in CONVENTIONS]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, earliest, latest", CONVENTIONS)
def test_convention_settings(text, settings, earliest, latest):
    endpoint = parse_date(text, settings)
    assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == (earliest, latest)
    assert endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_circa_keeps_the_written_day_as_likely():
    assert _iso(parse_date("c. 12 April 1650").likely) == "1650-04-12"


# (text, settings, Julian first day, Julian last day), astronomical years, checked against
# convertdate.julian. The default historical reckoning is Julian before 1582-10-15.
JULIAN_DATES = [
    ("44 BC", DEFAULT_SETTINGS, (-43, 1, 1), (-43, 12, 31)),        # 44 BC = astronomical -43
    ("44 BCE", DEFAULT_SETTINGS, (-43, 1, 1), (-43, 12, 31)),
    ("44 B.C.", DEFAULT_SETTINGS, (-43, 1, 1), (-43, 12, 31)),
    ("44bc", DEFAULT_SETTINGS, (-43, 1, 1), (-43, 12, 31)),
    ("1 BC", DEFAULT_SETTINGS, (0, 1, 1), (0, 12, 31)),             # no year zero: 1 BC = year 0
    ("AD 1066", DEFAULT_SETTINGS, (1066, 1, 1), (1066, 12, 31)),
    ("1066 AD", DEFAULT_SETTINGS, (1066, 1, 1), (1066, 12, 31)),
    ("1066 CE", DEFAULT_SETTINGS, (1066, 1, 1), (1066, 12, 31)),
    ("1066", DEFAULT_SETTINGS, (1066, 1, 1), (1066, 12, 31)),
    ("15 March 44 BC", DEFAULT_SETTINGS, (-43, 3, 15), (-43, 3, 15)),
    ("March 44 BC", DEFAULT_SETTINGS, (-43, 3, 1), (-43, 3, 31)),
    ("29 February 1500", DEFAULT_SETTINGS, (1500, 2, 29), (1500, 2, 29)),  # Julian leap year
    ("4 October 1582", DEFAULT_SETTINGS, (1582, 10, 4), (1582, 10, 4)),    # last Julian day (DESIGN §3)
    ("1200s", DEFAULT_SETTINGS, (1200, 1, 1), (1299, 12, 31)),
    ("1650s BC", DEFAULT_SETTINGS, (-1658, 1, 1), (-1649, 12, 31)),        # 1659..1650 BC
    ("c. 44 BC", DEFAULT_SETTINGS, (-48, 1, 1), (-38, 12, 31)),            # circa ±5 years, in Julian years
    ("c. 3000 BC", DEFAULT_SETTINGS, (-3004, 1, 1), (-2994, 12, 31)),
    ("1st century", DEFAULT_SETTINGS, (1, 1, 1), (99, 12, 31)),            # common: no year 0, so AD 1..99
    ("2nd century", DEFAULT_SETTINGS, (100, 1, 1), (199, 12, 31)),
    ("1st century BC", DEFAULT_SETTINGS, (-98, 1, 1), (0, 12, 31)),        # common: 99..1 BC
    ("5th century BC", DEFAULT_SETTINGS, (-498, 1, 1), (-399, 12, 31)),    # common: 499..400 BC
    ("5th c. BCE", DEFAULT_SETTINGS, (-498, 1, 1), (-399, 12, 31)),
    ("1st century", STRICT, (1, 1, 1), (100, 12, 31)),                     # strict: AD 1..100
    ("1st century BC", STRICT, (-99, 1, 1), (0, 12, 31)),                  # strict: 100..1 BC
    ("5th century BC", STRICT, (-499, 1, 1), (-400, 12, 31)),              # strict: 500..401 BC
    ("12 April 1650", JULIAN, (1650, 4, 12), (1650, 4, 12)),               # the calendar setting
    ("29 February 1700", JULIAN, (1700, 2, 29), (1700, 2, 29)),            # Julian leap year
    ("1650", JULIAN, (1650, 1, 1), (1650, 12, 31)),
]


def test_julian_table_has_no_repeated_case():
    keys = [(row[0], row[1]) for row in JULIAN_DATES]
    assert len(keys) == len(set(keys))


@pytest.mark.parametrize("text, settings, first, last", JULIAN_DATES)
def test_julian_dates_agree_with_convertdate(text, settings, first, last):
    endpoint = parse_date(text, settings)
    assert (endpoint.earliest, endpoint.latest) == (_julian(*first), _julian(*last))


def test_ides_of_march_44_bc():
    # convertdate.julian.to_jd takes astronomical years: -43 is 44 BC.
    assert parse_date("15 March 44 BC").earliest == _fixed_from_jd(convertdate.julian.to_jd(-43, 3, 15))
    assert parse_date("15 March 44 BC").earliest == 1705426 - JD_OFFSET  # JD 1705425.5 (convertdate)


def test_gregorian_reform_days_follow_each_other():
    # DESIGN §3: Gregorian 1582-10-15 follows Julian 1582-10-04 in the historical reckoning.
    assert parse_date("15 October 1582").earliest == parse_date("4 October 1582").earliest + 1


# (text, Gregorian y, m, d) in the gregorian setting, checked against convertdate.gregorian
GREGORIAN_DATES = [
    ("12 April 1650", (1650, 4, 12)),
    ("15 March 44 BC", (-43, 3, 15)),
    ("1 January 1000", (1000, 1, 1)),
]


def test_gregorian_table_has_no_repeated_case():
    assert len({row[0] for row in GREGORIAN_DATES}) == len(GREGORIAN_DATES)


@pytest.mark.parametrize("text, ymd", GREGORIAN_DATES)
def test_gregorian_setting_agrees_with_convertdate(text, ymd):
    expected = _fixed_from_jd(convertdate.gregorian.to_jd(*ymd))
    assert parse_date(text, GREGORIAN).earliest == expected


@pytest.mark.parametrize("text", ["April 12, 1650", "12 April 1985", "1 Sept 1752"])
def test_full_dates_agree_with_dateutil(text):
    # dateutil reads a date with every field present as proleptic Gregorian.
    expected = dateutil.parser.parse(text).date().toordinal()
    assert parse_date(text, GREGORIAN).earliest == expected


def test_year_in_gregorian_setting_agrees_with_stdlib():
    endpoint = parse_date("1066", GREGORIAN)
    expected = (datetime.date(1066, 1, 1).toordinal(), datetime.date(1066, 12, 31).toordinal())
    assert (endpoint.earliest, endpoint.latest) == expected


def test_before_bc_ends_the_day_before():
    endpoint = parse_date("before 44 BC")
    assert (endpoint.earliest, endpoint.latest) == (None, _julian(-44, 12, 31))


# (text, start earliest, start latest, end earliest, end latest) in the default settings
TEXT_RANGES = [
    ("1650–1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),   # common practice, no source: en dash
    ("1650—1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),   # em dash
    ("1650 — 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("1650-1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),   # hyphen between years
    ("1650 - 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("1650 to 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("1650 TO 1660", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),
    ("1650–60", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),     # Chicago Manual inclusive numbers (from memory)
    ("1650-60", "1650-01-01", "1650-12-31", "1660-01-01", "1660-12-31"),     # no month 60: a range
    ("1650s-1670s", "1650-01-01", "1659-12-31", "1670-01-01", "1679-12-31"),
    ("1650s–1670s", "1650-01-01", "1659-12-31", "1670-01-01", "1679-12-31"),
    ("c. 1650–1660", "1645-01-01", "1655-12-31", "1660-01-01", "1660-12-31"),
    ("c. 1650-1660", "1645-01-01", "1655-12-31", "1660-01-01", "1660-12-31"),
    ("1650 to c. 1660", "1650-01-01", "1650-12-31", "1655-01-01", "1665-12-31"),
    ("April 1650 to May 1651", "1650-04-01", "1650-04-30", "1651-05-01", "1651-05-31"),
    ("1985-04-12 – 1985-05-01", "1985-04-12", "1985-04-12", "1985-05-01", "1985-05-01"),
    ("-0500 - -0400", "-0500-01-01", "-0500-12-31", "-0400-01-01", "-0400-12-31"),  # ISO years, a sign after the hyphen
]


def test_range_table_has_no_repeated_case():
    texts = [row[0] for row in TEXT_RANGES]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, start_earliest, start_latest, end_earliest, end_latest",
                         TEXT_RANGES)
def test_text_ranges(text, start_earliest, start_latest, end_earliest, end_latest):
    span = parse_span(text)
    assert (_iso(span.start.earliest), _iso(span.start.latest)) == (start_earliest, start_latest)
    assert (_iso(span.end.earliest), _iso(span.end.latest)) == (end_earliest, end_latest)


# (text, Julian start year, Julian end year) checked against convertdate.julian
BC_RANGES = [
    ("500 BC – AD 100", -499, 100),
    ("500–400 BC", -499, -399),     # the end's BC serves the start too: common practice, no source
    ("44 – 40 BC", -43, -39),
]


def test_bc_range_table_has_no_repeated_case():
    assert len({row[0] for row in BC_RANGES}) == len(BC_RANGES)


@pytest.mark.parametrize("text, start_year, end_year", BC_RANGES)
def test_bc_ranges_agree_with_convertdate(text, start_year, end_year):
    span = parse_span(text)
    assert span.start.earliest == _julian(start_year, 1, 1)
    assert span.end.latest == _julian(end_year, 12, 31)


@pytest.mark.parametrize("text", ["1985-04", "-0043-03-15", "1985-04-12", "17th-century",
                                  "1650", "1985-XX"])
def test_hyphenated_dates_are_not_ranges(text):
    assert parse_span(text).is_point


# (text, exact reason)
TEXT_ERRORS = [
    ("0 BC", "BC/AD counting has no year zero"),
    ("0 AD", "BC/AD counting has no year zero"),
    ("0 BCE", "BC/AD counting has no year zero"),
    ("17st century", "write 17th, not 17st"),
    ("1th century", "write 1st, not 1th"),
    ("11st century", "write 11th, not 11st"),
    ("0th century", "there is no 0th century"),
    ("'60s", "a two-digit decade does not say its century; write it in full, such as 1960s"),
    ("60s", "a two-digit decade does not say its century; write it in full, such as 1960s"),
    ("12000", "a year of more than four digits needs a sign (+12000) or an era (12000 BC)"),
    ("31 April 1650", "day 31 does not exist in month 4 (it has 30 days)"),
    ("29 February 1700", "1700 is not a leap year in the gregorian calendar"),  # Gregorian from 1582
    ("29 February 1501", "1501 is not a leap year in the julian calendar"),
    ("10 October 1582", "1582-10-05..14 do not exist in the historical reckoning "
                        "(Julian 4 October was followed by Gregorian 15 October)"),
    ("c. 1984~", "approximate twice (both c. and ~); write one of them"),
    ("hello", "not a date form timelines reads"),
    ("Aprl 1650", "not a date form timelines reads"),
    ("", "there is no date here"),
    ("1650–1640", "the end comes before the start"),
    ("AD 100 – 200 BC", "the end comes before the start"),
    ("1985-13", "the end comes before the start"),
    ("1650–", "the range has no end"),
    ("–1660", "the range has no start"),
    ("1650 – 1660 – 1670", "a range has one start and one end"),
    ("1650-04-12-1660", "more than one hyphen could end the start here"),
    ("1650–16y0", "the end '16y0' is not a date form timelines reads"),
    ("1650–2001-02-29", "the end '2001-02-29': 2001 is not a leap year"),
]


def test_text_error_table_has_no_repeated_case():
    texts = [row[0] for row in TEXT_ERRORS]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, reason", TEXT_ERRORS)
def test_text_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason


def test_unknown_text_gets_the_general_hint():
    with pytest.raises(DateError) as caught:
        parse_date("hello")
    assert caught.value.hint == ("expected a date such as 1650, c. 1650, 1650s, 17th century, "
                                 "1650-04-12, 44 BC")


def test_a_range_is_not_one_date():
    with pytest.raises(DateError) as caught:
        parse_date("1650–1660")
    assert caught.value.reason == "a range where one date is expected"


def test_an_abbreviated_end_before_its_start_says_how_it_was_read():
    with pytest.raises(DateError) as caught:
        parse_span("1985-13")
    assert caught.value.hint == "13 after 1985 reads as 1913; months are written 1650-04"
