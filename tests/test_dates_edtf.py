"""ISO 8601-1 basic, ordinal and week dates; ISO 8601-2 (EDTF) levels 1 and 2: qualifiers on
components, unspecified digits anywhere, sub-year groupings, long years, significant digits
and sets. Examples are those of ISO 8601-1/-2:2019 and the EDTF specification (Library of
Congress, 2019), recalled ("from memory"); week and ordinal dates are checked against the
stdlib (`date.fromisocalendar`, `date.toordinal`), proleptic Gregorian like ISO 8601.
"""
from __future__ import annotations

import datetime

import pytest
from hypothesis import given, strategies as st

from timelines.calendar import iso_from_fixed
from timelines.dates import DateError, DateSettings, parse_date, parse_endpoint, parse_span
from timelines.model import Precision, Qualifier

DAY, MONTH, SEASON, YEAR = Precision.DAY, Precision.MONTH, Precision.SEASON, Precision.YEAR
DECADE, CENTURY, MILLENNIUM = Precision.DECADE, Precision.CENTURY, Precision.MILLENNIUM
A, U, X, C = (Qualifier.APPROXIMATE, Qualifier.UNCERTAIN, Qualifier.UNSPECIFIED,
              Qualifier.CONVENTION_DEPENDENT)
ONE, ALL = Qualifier.ONE_OF, Qualifier.ALL_OF


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _window(endpoint):
    return _iso(endpoint.earliest), _iso(endpoint.latest), endpoint.precision, endpoint.qualifiers


# (text, earliest, latest, precision, qualifiers)
ISO_FORMS = [
    ("19850412", "1985-04-12", "1985-04-12", DAY, set()),          # ISO 8601-1 basic calendar date (from memory)
    ("19850412T101530", "1985-04-12", "1985-04-12", DAY, set()),   # ISO 8601-1 basic date and time (from memory)
    ("19850412T101530Z", "1985-04-12", "1985-04-12", DAY, set()),
    ("1985-102", "1985-04-12", "1985-04-12", DAY, set()),          # ISO 8601-1 ordinal date (from memory)
    ("1985102", "1985-04-12", "1985-04-12", DAY, set()),           # ISO 8601-1 ordinal, basic (from memory)
    ("2000-366", "2000-12-31", "2000-12-31", DAY, set()),          # the last day of a leap year
    ("1985-W15-5", "1985-04-12", "1985-04-12", DAY, set()),        # ISO 8601-1 week date (from memory)
    ("1985W155", "1985-04-12", "1985-04-12", DAY, set()),          # ISO 8601-1 week date, basic (from memory)
    ("1985-W15", "1985-04-08", "1985-04-14", DAY, set()),          # ISO 8601-1 week: Monday..Sunday (from memory)
    ("1985W15", "1985-04-08", "1985-04-14", DAY, set()),
    ("2004-W53-7", "2005-01-02", "2005-01-02", DAY, set()),        # a 53-week year: its last day falls in 2005
    ("2009-W01-1", "2008-12-29", "2008-12-29", DAY, set()),        # week 1 can begin in December
    ("+001985-04-12", "1985-04-12", "1985-04-12", DAY, set()),     # ISO 8601-1 expanded (from memory)
    # ISO 8601-2 qualifiers on components (level 2)
    ("2004-06~-11", "2004-05-11", "2004-07-12", DAY, {A, C}),       # EDTF level 2: year and month approximate (from memory); month circa ±31 days
    ("2004~-06-11", "1999-01-01", "2009-12-31", DAY, {A, C}),       # year approximate: year circa ±5 years
    ("2004-~06-11", "2004-05-11", "2004-07-12", DAY, {A, C}),       # month only (left of the month)
    ("?2004-06-~11", "2004-05-27", "2004-06-26", DAY, {A, U, C}),   # EDTF level 2: year uncertain, day approximate (from memory)
    ("2004?-06-11", "2004-06-11", "2004-06-11", DAY, {U}),          # EDTF level 2: year uncertain (from memory)
    ("2004-06-11%", "2004-05-27", "2004-06-26", DAY, {A, U, C}),    # EDTF level 1: the whole date (from memory)
    ("2004-%06", "2004-05-01", "2004-07-31", MONTH, {A, U, C}),
    # unspecified digits anywhere, bounded to existing days (level 2)
    ("156X-12-25", "1560-12-25", "1569-12-25", DECADE, {X}),        # EDTF level 2 (from memory)
    ("15XX-12-25", "1500-12-25", "1599-12-25", CENTURY, {X}),       # EDTF level 2 (from memory)
    ("XXXX-12-XX", None, None, None, None),                         # no year digit: refused below
    ("1XXX-XX", "1000-01-01", "1999-12-31", MILLENNIUM, {X}),       # EDTF level 2 (from memory)
    ("1XXX-12", "1000-12-01", "1999-12-31", MILLENNIUM, {X}),       # EDTF level 2 (from memory)
    ("1984-1X", "1984-10-01", "1984-12-31", YEAR, {X}),             # EDTF level 2 (from memory): months 10-12
    ("1985-04-3X", "1985-04-30", "1985-04-30", MONTH, {X}),         # April has no 31st
    ("1985-02-3X", None, None, None, None),                         # February has no 30th or 31st: refused below
    ("2000-02-2X", "2000-02-20", "2000-02-29", MONTH, {X}),
    ("1X50", "1050-01-01", "1950-12-31", MILLENNIUM, {X}),
    ("-019X", "-0199-01-01", "-0190-12-31", DECADE, {X}),
    ("XX44", "0044-01-01", "9944-12-31", MILLENNIUM, {X}),
    ("198X-04", "1980-04-01", "1989-04-30", DECADE, {X}),
    ("1985-XX-12", "1985-01-12", "1985-12-12", YEAR, {X}),
    # sub-year groupings 21-41 (seasons read in the northern hemisphere by default)
    ("2001-21", "2001-03-01", "2001-05-31", SEASON, {C}),          # EDTF level 1 spring (from memory)
    ("2001-22", "2001-06-01", "2001-08-31", SEASON, {C}),
    ("2001-23", "2001-09-01", "2001-11-30", SEASON, {C}),
    ("2001-24", "2001-12-01", "2002-02-28", SEASON, {C}),          # winter from December
    ("2001-25", "2001-03-01", "2001-05-31", SEASON, {C}),          # ISO 8601-2: spring, northern hemisphere
    ("2001-29", "2001-09-01", "2001-11-30", SEASON, {C}),          # ISO 8601-2: spring, southern hemisphere
    ("2001-33", "2001-01-01", "2001-03-31", SEASON, set()),        # ISO 8601-2: quarter 1
    ("2001-36", "2001-10-01", "2001-12-31", SEASON, set()),        # quarter 4
    ("2001-37", "2001-01-01", "2001-04-30", SEASON, set()),        # quadrimester 1
    ("2001-39", "2001-09-01", "2001-12-31", SEASON, set()),        # quadrimester 3
    ("2001-40", "2001-01-01", "2001-06-30", SEASON, set()),        # semester 1
    ("2001-41", "2001-07-01", "2001-12-31", SEASON, set()),        # semester 2
    ("2001-21~", "2001-01-29", "2001-07-01", SEASON, {A, C}),      # circa ±31 days on a season
    ("2001-21?", "2001-03-01", "2001-05-31", SEASON, {U, C}),
    # long years, exponents, significant digits (level 1 and 2)
    ("Y-17E7", "-170000000-01-01", "-170000000-12-31", YEAR, set()),     # EDTF level 2 (from memory)
    ("Y17E7", "+170000000-01-01", "+170000000-12-31", YEAR, set()),
    ("1950S2", "1900-01-01", "1999-12-31", CENTURY, set()),            # EDTF level 2: 1900..1999, estimated 1950 (from memory)
    ("Y171010000S3", "+171000000-01-01", "+171999999-12-31", Precision.DEEP_TIME, set()),  # EDTF level 2 (from memory)
    ("Y3388E2S3", "+338000-01-01", "+338999-12-31", MILLENNIUM, set()),  # EDTF level 2: 338000..338999 (from memory)
    ("-1950S2", "-1999-01-01", "-1900-12-31", CENTURY, set()),
    # sets (level 2)
    ("[1667,1668,1670..1672]", "1667-01-01", "1672-12-31", YEAR, {ONE}),     # EDTF level 2 one of (from memory)
    ("[..1760-12-03]", None, "1760-12-03", DAY, {ONE, Qualifier.BEFORE}),      # EDTF: on or before (from memory)
    ("[1760-12..]", "1760-12-01", None, MONTH, {ONE, Qualifier.AFTER}),        # EDTF: December 1760 or later (from memory)
    ("[1760-01, 1760-02, 1760-12..]", "1760-01-01", None, MONTH, {ONE, Qualifier.AFTER}),  # EDTF (from memory)
    ("{1667,1668,1670..1672}", "1667-01-01", "1672-12-31", YEAR, {ALL}),     # EDTF level 2 all of (from memory)
    ("{1960, 1961-12}", "1960-01-01", "1961-12-31", YEAR, {ALL}),              # EDTF level 2 (from memory)
    ("[1650]", "1650-01-01", "1650-12-31", YEAR, set()),                      # a set of one date is the date
    ("[1650?]", "1650-01-01", "1650-12-31", YEAR, {U}),                       # a catalogue's supplied date
    ("[ca. 1650]", "1645-01-01", "1655-12-31", YEAR, {A, C}),
    ("[April 12, 1650]", "1650-04-12", "1650-04-12", DAY, set()),
]


_ROWS = [row for row in ISO_FORMS if row[1] is not None or row[2] is not None]


def test_iso_form_table_has_no_repeated_case():
    texts = [row[0] for row in ISO_FORMS]
    assert len(texts) == len(set(texts))


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", _ROWS)
def test_iso_forms(text, earliest, latest, precision, qualifiers):
    assert _window(parse_date(text)) == (earliest, latest, precision, frozenset(qualifiers))


def test_significant_digits_give_a_likely_day():
    assert _iso(parse_date("1950S2").likely) == "1950-07-02"


# (text, exact reason)
ISO_ERRORS = [
    ("XXXX-12-XX", "a year with no known digit says nothing"),
    ("1985-02-3X", "no existing date matches these digits"),
    ("1985-13", "the end comes before the start"),
    ("1985-367", "day 367 does not exist in 1985 (it has 365 days)"),
    ("1985-W54", "week 54 does not exist in 1985 (it has 52 weeks)"),
    ("1985-W15-8", "day 8 of the week does not exist (Monday 1 .. Sunday 7)"),
    ("19851312", "month 13 does not exist"),
    ("1950S5", "1950 has 4 digits, not 5 significant ones"),
    ("[1650}", "a set opened with [ closes with ]"),
    ("[]", "an empty set holds no date"),
    ("[1650,,1651]", "a set has an empty element"),
    ("[1672..1670]", "the run '1672..1670' ends before it begins"),
    ("[1650, nonsense]", "'nonsense' in the set is not a date"),
    ("1985-04-12 BC", "an ISO 8601 date takes no era (BC, AD)"),
]


def test_iso_error_table_has_no_repeated_case():
    assert len({row[0] for row in ISO_ERRORS}) == len(ISO_ERRORS)


@pytest.mark.parametrize("text, reason", ISO_ERRORS)
def test_iso_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason


def test_intervals_take_level_2_sides():
    span = parse_span("2004-06~-11/2004-06-~20")
    assert span.start.has(A) and span.end.has(A)
    span = parse_span("156X/1570")
    assert _iso(span.start.earliest) == "1560-01-01"
    assert parse_endpoint("2001-21/2001-22").latest == parse_date("2001-22").latest


def test_iso_seasons_follow_the_hemisphere_setting():
    southern = DateSettings(hemisphere="southern")
    assert _window(parse_date("2001-21", southern))[:2] == ("2001-09-01", "2001-11-30")
    assert _window(parse_date("2001-25", southern))[:2] == ("2001-03-01", "2001-05-31")  # code names the hemisphere


@given(st.dates())
def test_week_dates_agree_with_stdlib(day):
    year, week, weekday = day.isocalendar()
    if not 1 <= year <= 9999:
        return
    assert parse_date(f"{year:04d}-W{week:02d}-{weekday}").earliest == day.toordinal()
    assert parse_date(f"{year:04d}W{week:02d}{weekday}").earliest == day.toordinal()


@given(st.dates(min_value=datetime.date(1000, 1, 1)))
def test_ordinal_and_basic_dates_agree_with_stdlib(day):
    ordinal = day.timetuple().tm_yday
    assert parse_date(f"{day.year:04d}-{ordinal:03d}").earliest == day.toordinal()
    assert parse_date(day.strftime("%Y%m%d")).earliest == day.toordinal()


@given(st.dates(min_value=datetime.date(1000, 1, 1)), st.integers(min_value=0, max_value=3))
def test_unspecified_digits_hold_the_days_they_allow(day, hidden):
    # Hide the last `hidden` digits of the year: the window holds the day, and its bounds
    # are days that exist with the same month and day.
    year_text = f"{day.year:04d}"
    pattern = year_text[:4 - hidden] + "X" * hidden
    endpoint = parse_date(f"{pattern}-{day.month:02d}-{day.day:02d}")
    assert endpoint.earliest <= day.toordinal() <= endpoint.latest
    for bound in (endpoint.earliest, endpoint.latest):
        found = datetime.date.fromordinal(bound)
        assert (found.month, found.day) == (day.month, day.day)
        assert str(found.year).zfill(4)[:4 - hidden] == year_text[:4 - hidden]
