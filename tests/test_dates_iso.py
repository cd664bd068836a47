"""ISO 8601-1 / ISO 8601-2 (EDTF) forms: dates, qualifiers, unspecified digits, intervals.

Examples are those of ISO 8601-1:2019, ISO 8601-2:2019 and its EDTF profile (Library of
Congress, 2019), recalled from the documents ("from memory"); the bounds follow from the
standard's definition (a value covers its whole unit, proleptic Gregorian calendar) and are
cross-checked against convertdate.gregorian and the stdlib's proleptic Gregorian `date`.
"""
from __future__ import annotations

import datetime
import math

import convertdate.gregorian
import pytest

from timelines.calendar import JD_OFFSET, iso_from_fixed
from timelines.dates import DateError, DateSettings, parse_date, parse_span
from timelines.model import Precision, Qualifier

DAY, MONTH, YEAR = Precision.DAY, Precision.MONTH, Precision.YEAR
DECADE, CENTURY, MILLENNIUM = Precision.DECADE, Precision.CENTURY, Precision.MILLENNIUM
A, U, X = Qualifier.APPROXIMATE, Qualifier.UNCERTAIN, Qualifier.UNSPECIFIED
C = Qualifier.CONVENTION_DEPENDENT
OS, OE = Qualifier.OPEN_START, Qualifier.OPEN_END
US, UE = Qualifier.UNKNOWN_START, Qualifier.UNKNOWN_END


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _window(endpoint):
    return _iso(endpoint.earliest), _iso(endpoint.latest), endpoint.precision, endpoint.qualifiers


# (text, earliest, latest, precision, qualifiers). Widths of `~` and `%` are the DateSettings
# circa defaults (±15 days, ±31 days, ±5 years): common practice, no source.
ISO_DATES = [
    ("1985-04-12", "1985-04-12", "1985-04-12", DAY, set()),     # ISO 8601-1:2019 calendar date, complete (from memory)
    ("1985-04", "1985-04-01", "1985-04-30", MONTH, set()),      # ISO 8601-1 reduced precision, a month (from memory)
    ("1985", "1985-01-01", "1985-12-31", YEAR, set()),          # ISO 8601-1 reduced precision, a year (from memory)
    ("+001985-04-12", "1985-04-12", "1985-04-12", DAY, set()),  # ISO 8601-1 expanded representation (from memory)
    ("+001985", "1985-01-01", "1985-12-31", YEAR, set()),       # ISO 8601-1 expanded, a year (from memory)
    # Changed for issue 17: a bare -1985 is a signed year number, read by the signed-years
    # setting (BC/AD by default); EDTF's reading of it, with --signed-years astronomical, is
    # checked in tests/test_signed_years.py. The zero-padded expanded form is ISO's alone.
    ("-01985", "-1985-01-01", "-1985-12-31", YEAR, set()),      # ISO 8601-1 expanded negative year (from memory)
    ("-0043", "-0043-01-01", "-0043-12-31", YEAR, set()),       # DESIGN §3: signed years are astronomical
    ("+12000", "+12000-01-01", "+12000-12-31", YEAR, set()),    # DESIGN §5 expanded form
    ("-0043-03-15", "-0043-03-15", "-0043-03-15", DAY, set()),  # DESIGN §5 example
    ("0000", "0000-01-01", "0000-12-31", YEAR, set()),          # ISO 8601-1: year 0000 is 1 BC (astronomical)
    ("Y170000002", "+170000002-01-01", "+170000002-12-31", YEAR, set()),   # EDTF Level 1 letter-prefixed year (from memory)
    ("Y-170000002", "-170000002-01-01", "-170000002-12-31", YEAR, set()),  # EDTF Level 1 (from memory)
    ("1985-04-12T23:20:30", "1985-04-12", "1985-04-12", DAY, set()),       # EDTF Level 0 date and time (from memory)
    ("1985-04-12T23:20:30Z", "1985-04-12", "1985-04-12", DAY, set()),      # EDTF Level 0, UTC (from memory)
    ("1985-04-12T23:20:30-04", "1985-04-12", "1985-04-12", DAY, set()),    # EDTF Level 0, offset (from memory)
    ("1985-04-12T23:20:30+04:30", "1985-04-12", "1985-04-12", DAY, set()), # EDTF Level 0, offset (from memory)
    ("1985-04-12 00:00:00", "1985-04-12", "1985-04-12", DAY, set()),       # common practice, no source: spreadsheet export
    ("1900-02", "1900-02-01", "1900-02-28", MONTH, set()),      # DESIGN §3: 1900 is no Gregorian leap year
    ("2000-02", "2000-02-01", "2000-02-29", MONTH, set()),      # DESIGN §3: 2000 is a Gregorian leap year
    ("2000-02-29", "2000-02-29", "2000-02-29", DAY, set()),     # Gregorian rule: divisible by 400
    ("1984?", "1984-01-01", "1984-12-31", YEAR, {U}),           # EDTF Level 1 qualification: year uncertain (from memory)
    ("2004-06~", "2004-05-01", "2004-07-31", MONTH, {A, C}),    # EDTF Level 1: year-month approximate (from memory)
    ("2004-06-11%", "2004-05-27", "2004-06-26", DAY, {A, U, C}),  # EDTF Level 1: uncertain and approximate (from memory)
    ("1984~", "1979-01-01", "1989-12-31", YEAR, {A, C}),        # ISO 8601-2 approximate year
    ("1984-06%", "1984-05-01", "1984-07-31", MONTH, {A, U, C}), # ISO 8601-2 both, on a month
    ("201X", "2010-01-01", "2019-12-31", DECADE, {X}),          # EDTF Level 1 unspecified digits (from memory)
    ("20XX", "2000-01-01", "2099-12-31", CENTURY, {X}),         # EDTF Level 1 (from memory)
    ("2004-XX", "2004-01-01", "2004-12-31", YEAR, {X}),         # EDTF Level 1 unspecified month (from memory)
    ("1985-04-XX", "1985-04-01", "1985-04-30", MONTH, {X}),     # EDTF Level 1 unspecified day (from memory)
    ("1985-XX-XX", "1985-01-01", "1985-12-31", YEAR, {X}),      # EDTF Level 1 (from memory)
    ("198X", "1980-01-01", "1989-12-31", DECADE, {X}),          # DESIGN §3: 198X = 1980..1989
    ("19XX", "1900-01-01", "1999-12-31", CENTURY, {X}),         # ISO 8601-2 unspecified digits
    ("1XXX", "1000-01-01", "1999-12-31", MILLENNIUM, {X}),      # ISO 8601-2 unspecified digits
    ("-019X", "-0199-01-01", "-0190-12-31", DECADE, {X}),       # ISO 8601-2: the digits of a negative year
    ("198x", "1980-01-01", "1989-12-31", DECADE, {X}),          # common practice, no source: lower-case x accepted
    ("201X~", "2005-01-01", "2024-12-31", DECADE, {X, A, C}),   # ISO 8601-2 qualifier on unspecified digits
]


def test_iso_table_has_no_repeated_case():
    texts = [row[0] for row in ISO_DATES]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", ISO_DATES)
def test_iso_dates(text, earliest, latest, precision, qualifiers):
    assert _window(parse_date(text)) == (earliest, latest, precision, frozenset(qualifiers))


# (text, Gregorian y, m, d) cross-checked with convertdate.gregorian (astronomical years) and
# JDN = R.D. + 1721425 (DESIGN §3); convertdate's to_jd gives the JD at midnight (.5).
GREGORIAN_DAYS = [
    ("-0043-03-15", (-43, 3, 15)),
    ("0000-02-29", (0, 2, 29)),        # year 0 is a Gregorian leap year (divisible by 400)
    ("-4713-11-24", (-4713, 11, 24)),  # Meeus ch. 7: JD 0 = Gregorian -4713-11-24 (from memory)
    ("1582-10-15", (1582, 10, 15)),
    ("1945-11-12", (1945, 11, 12)),    # Reingold & Dershowitz's running example, R.D. 710347
]


def test_gregorian_cross_check_has_no_repeated_case():
    assert len({row[0] for row in GREGORIAN_DAYS}) == len(GREGORIAN_DAYS)


@pytest.mark.parametrize("text, ymd", GREGORIAN_DAYS)
def test_iso_days_agree_with_convertdate(text, ymd):
    expected = math.floor(convertdate.gregorian.to_jd(*ymd) + 0.5) - JD_OFFSET
    assert parse_date(text).earliest == expected


def test_reingold_dershowitz_running_example():
    assert parse_date("1945-11-12").earliest == 710347  # Reingold & Dershowitz (from memory)


@pytest.mark.parametrize("day", [datetime.date(1, 1, 1), datetime.date(1582, 10, 15),
                                 datetime.date(2000, 2, 29), datetime.date(9999, 12, 31)])
def test_iso_days_agree_with_stdlib(day):
    # stdlib datetime is proleptic Gregorian and toordinal() counts R.D.
    assert parse_date(day.isoformat()).earliest == day.toordinal()


def test_iso_forms_are_gregorian_whatever_the_calendar_setting():
    julian = DateSettings(calendar="julian")
    assert parse_date("1650-04-12", julian) == parse_date("1650-04-12")
    assert parse_date("1500-04", julian).earliest == datetime.date(1500, 4, 1).toordinal()


def test_approximate_day_keeps_its_likely_day():
    endpoint = parse_date("2004-06-11~")
    assert _iso(endpoint.likely) == "2004-06-11"  # the written day is the likeliest: common practice, no source


def test_circa_width_follows_settings():
    narrow = DateSettings(circa_years_for_year=1)
    assert _window(parse_date("1984~", narrow))[:2] == ("1983-01-01", "1985-12-31")


# (text, start earliest, start latest, end earliest, end latest, start qualifiers, end qualifiers)
ISO_INTERVALS = [
    ("1964/2008", "1964-01-01", "1964-12-31", "2008-01-01", "2008-12-31", set(), set()),  # EDTF Level 0 interval (from memory)
    ("2004-06/2006-08", "2004-06-01", "2004-06-30", "2006-08-01", "2006-08-31", set(), set()),  # EDTF Level 0 (from memory)
    ("2004-02-01/2005-02-08", "2004-02-01", "2004-02-01", "2005-02-08", "2005-02-08", set(), set()),  # EDTF Level 0 (from memory)
    ("2004-02-01/2005-02", "2004-02-01", "2004-02-01", "2005-02-01", "2005-02-28", set(), set()),  # EDTF Level 0 (from memory)
    ("2004-02-01/2005", "2004-02-01", "2004-02-01", "2005-01-01", "2005-12-31", set(), set()),  # EDTF Level 0 (from memory)
    ("2005/2006-02", "2005-01-01", "2005-12-31", "2006-02-01", "2006-02-28", set(), set()),  # EDTF Level 0 (from memory)
    ("1985/1987", "1985-01-01", "1985-12-31", "1987-01-01", "1987-12-31", set(), set()),  # DESIGN §1 example
    ("1985-04-12/..", "1985-04-12", "1985-04-12", None, None, set(), {OE}),  # EDTF Level 1 open end (from memory)
    ("1985-04/..", "1985-04-01", "1985-04-30", None, None, set(), {OE}),     # EDTF Level 1 (from memory)
    ("1985/..", "1985-01-01", "1985-12-31", None, None, set(), {OE}),        # EDTF Level 1 (from memory)
    ("../1985-04-12", None, None, "1985-04-12", "1985-04-12", {OS}, set()),  # EDTF Level 1 open start (from memory)
    ("../1985-04", None, None, "1985-04-01", "1985-04-30", {OS}, set()),     # EDTF Level 1 (from memory)
    ("../1985", None, None, "1985-01-01", "1985-12-31", {OS}, set()),        # EDTF Level 1 (from memory)
    ("1985-04-12/", "1985-04-12", "1985-04-12", None, None, set(), {UE}),    # EDTF Level 1 unknown end (from memory)
    ("1985/", "1985-01-01", "1985-12-31", None, None, set(), {UE}),          # EDTF Level 1 (from memory)
    ("/1985-04-12", None, None, "1985-04-12", "1985-04-12", {US}, set()),    # EDTF Level 1 unknown start (from memory)
    ("/1985", None, None, "1985-01-01", "1985-12-31", {US}, set()),          # EDTF Level 1 (from memory)
    ("1984~/2004-06", "1979-01-01", "1989-12-31", "2004-06-01", "2004-06-30", {A, C}, set()),  # EDTF Level 1 extended interval (from memory)
    ("1984?/2004%", "1984-01-01", "1984-12-31", "1999-01-01", "2009-12-31", {U}, {A, U, C}),  # EDTF Level 1 (from memory)
    ("1500/1510", "1500-01-01", "1500-12-31", "1510-01-01", "1510-12-31", set(), set()),  # ISO years in an interval are Gregorian
    ("1985 / 1987", "1985-01-01", "1985-12-31", "1987-01-01", "1987-12-31", set(), set()),  # common practice, no source: spaces
    ("1985-06/1985", "1985-06-01", "1985-06-30", "1985-01-01", "1985-12-31", set(), set()),  # end window holds the start
]


def test_interval_table_has_no_repeated_case():
    texts = [row[0] for row in ISO_INTERVALS]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, start_earliest, start_latest, end_earliest, end_latest, "
                         "start_qualifiers, end_qualifiers", ISO_INTERVALS)
def test_iso_intervals(text, start_earliest, start_latest, end_earliest, end_latest,
                       start_qualifiers, end_qualifiers):
    span = parse_span(text)
    assert (_iso(span.start.earliest), _iso(span.start.latest)) == (start_earliest, start_latest)
    assert (_iso(span.end.earliest), _iso(span.end.latest)) == (end_earliest, end_latest)
    assert span.start.qualifiers == frozenset(start_qualifiers)
    assert span.end.qualifiers == frozenset(end_qualifiers)


def test_open_and_unknown_sides_carry_no_bound_and_no_precision():
    span = parse_span("../1760")
    assert (span.start.earliest, span.start.latest, span.start.precision) == (None, None, None)


# (text, exact reason). Reasons are short and plain; the DateError names the text.
ISO_ERRORS = [
    ("1985-13-01", "month 13 does not exist"),
    ("1985-00", "month 0 does not exist"),
    ("2001-02-29", "2001 is not a leap year"),             # Gregorian rule: not divisible by 4
    ("1900-02-29", "1900 is not a leap year"),             # Gregorian rule: century not divisible by 400
    ("-0043-02-29", "-0043 is not a leap year"),
    ("1985-04-31", "day 31 does not exist in 1985-04 (it has 30 days)"),
    ("1985-04-00", "day 0 does not exist in 1985-04 (it has 30 days)"),
    ("1990/1980", "the end comes before the start"),
    ("XXXX", "a year with no known digit says nothing"),
    ("1985-04-12T25:00", "'T25:00' is not a time of day"),
    ("P1Y/1985", "durations (P...) in intervals are not supported yet"),
    ("1985/P1Y", "durations (P...) in intervals are not supported yet"),
    ("../..", "an interval needs a date on at least one side"),
    ("/", "an interval needs a date on at least one side"),
    ("1985/1986/1987", "an interval has exactly one '/'"),
    ("1984~~", "approximate twice (both c. and ~); write one of them"),
    ("1650/52", "1650/52 is not a dual year: a dual year names a year and the next one"),
]


def test_error_table_has_no_repeated_case():
    texts = [row[0] for row in ISO_ERRORS]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, reason", ISO_ERRORS)
def test_iso_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason
    assert caught.value.text == text


def test_error_message_names_text_and_reason():
    with pytest.raises(DateError) as caught:
        parse_date("1985-13-01")
    assert str(caught.value) == "cannot read '1985-13-01': month 13 does not exist"
    assert caught.value.position == 5


def test_a_bad_interval_side_gets_a_hint():
    with pytest.raises(DateError) as caught:
        parse_span("c. 1650/1660")
    assert caught.value.reason == "'c. 1650' is not an ISO 8601 date"
    assert "1985/1987" in caught.value.hint
