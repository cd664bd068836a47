"""The public API of timelines.dates: endpoints for start/end columns, spreadsheet cells,
`describe` (DESIGN §5), and properties that hold for any text."""
from __future__ import annotations

import datetime
import json

import numpy
import pandas
import pytest
from hypothesis import given, settings as hypothesis_settings, strategies as st

import timelines.dates as dates
from timelines.calendar import iso_from_fixed
from timelines.dates import (
    DEFAULT_SETTINGS, DateError, DateSettings, describe, endpoint_from_cell, parse_date,
    parse_endpoint, parse_span, span_from_cell,
)
from timelines.errors import DateError as ErrorsDateError
from timelines.model import Endpoint, Precision, Qualifier, Span
from timelines.dates.settings import DateSettings as SettingsDateSettings


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def test_public_names():
    assert set(dates.__all__) == {
        "parse_date", "parse_span", "parse_endpoint", "endpoint_from_cell", "span_from_cell",
        "describe", "DateSettings", "DEFAULT_SETTINGS", "DateError", "explain", "iso_form",
        "parse_column", "parse_span_column", "settings_from_options", "options_from_settings",
        "SETTING_HELP"}
    assert DateError is ErrorsDateError and DateSettings is SettingsDateSettings
    assert DEFAULT_SETTINGS == DateSettings()


def test_parse_span_of_one_date_is_a_point():
    span = parse_span("1650")
    assert span.is_point and span.start == parse_date("1650")


# parse_endpoint: (text, earliest, latest, precision, qualifiers) for a start or end column.
ENDPOINTS = [
    ("1650", "1650-01-01", "1650-12-31", Precision.YEAR, set()),
    ("1985/1987", "1985-01-01", "1987-12-31", Precision.YEAR, {Qualifier.ONE_OF}),   # born between
    ("1650s–1660", "1650-01-01", "1660-12-31", Precision.DECADE, {Qualifier.ONE_OF}),  # the coarser precision
    ("../1760", None, "1760-12-31", Precision.YEAR, {Qualifier.OPEN_START, Qualifier.ONE_OF}),
    ("1984~/1990", "1979-01-01", "1990-12-31", Precision.YEAR,
     {Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT, Qualifier.ONE_OF}),  # qualifiers merged
]


def test_endpoint_table_has_no_repeated_case():
    assert len({row[0] for row in ENDPOINTS}) == len(ENDPOINTS)


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", ENDPOINTS)
def test_parse_endpoint(text, earliest, latest, precision, qualifiers):
    endpoint = parse_endpoint(text)
    assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == (earliest, latest)
    assert endpoint.precision == precision
    assert endpoint.qualifiers == frozenset(qualifiers)


# Cells: (value, expected endpoint or None); day values are proleptic Gregorian (stdlib).
_YEAR_1650 = parse_date("1650")
CELLS = [
    (None, None),
    ("", None),
    ("   ", None),
    (float("nan"), None),
    (pandas.NaT, None),
    (pandas.NA, None),
    (numpy.nan, None),
    (datetime.date(1650, 4, 12), Endpoint.day(datetime.date(1650, 4, 12).toordinal())),
    (datetime.datetime(1985, 4, 12, 23, 20), Endpoint.day(datetime.date(1985, 4, 12).toordinal())),
    (pandas.Timestamp("1985-04-12 10:00"), Endpoint.day(datetime.date(1985, 4, 12).toordinal())),
    (1650, _YEAR_1650),
    (numpy.int64(1650), _YEAR_1650),
    (1650.0, _YEAR_1650),
    (numpy.float64(1650.0), _YEAR_1650),
    (" 1650 ", _YEAR_1650),
    ("1985/1987", parse_endpoint("1985/1987")),
]


@pytest.mark.parametrize("value, expected", CELLS)
def test_endpoint_from_cell(value, expected):
    assert endpoint_from_cell(value) == expected


def test_span_from_cell_keeps_a_range():
    assert span_from_cell("1650–1660") == parse_span("1650–1660")
    assert span_from_cell(1650) == Span.point(_YEAR_1650)
    assert span_from_cell("") is None and span_from_cell(None) is None


def test_year_cells_follow_the_calendar_setting():
    julian = DateSettings(calendar="julian")
    assert endpoint_from_cell(1066, julian) == parse_date("1066", julian)


# (value, exact reason)
BAD_CELLS = [
    (1650.5, "a number that is not a whole year"),
    (float("inf"), "a number that is not a whole year"),
    (True, "a true/false cell is not a date"),
    (object(), "a cell of type object is not a date"),
    (10 ** 20, "year 100000000000000000000 is out of range (at most 12 digits)"),
    ("1985-13-01", "month 13 does not exist"),
]


@pytest.mark.parametrize("value, reason", BAD_CELLS)
def test_bad_cells(value, reason):
    with pytest.raises(DateError) as caught:
        endpoint_from_cell(value)
    assert caught.value.reason == reason
    with pytest.raises(DateError):
        span_from_cell(value)


def test_non_text_to_parse_date_is_a_date_error():
    with pytest.raises(DateError) as caught:
        parse_date(1650)  # type: ignore[arg-type]
    assert caught.value.reason == "expected text, not int"


# describe: the exact objects of DESIGN §5
def test_describe_a_point():
    assert describe(" c. 12 April 1650 ") == {
        "input": " c. 12 April 1650 ", "ok": True,
        "earliest": "1650-03-28", "latest": "1650-04-27", "likely": "1650-04-12",
        "precision": "day", "qualifiers": ["approximate", "convention_dependent"], "error": None,
    }


def test_describe_a_range_gives_the_extent_and_both_ends():
    assert describe("1650s–1660") == {
        "input": "1650s–1660", "ok": True,
        "earliest": "1650-01-01", "latest": "1660-12-31", "likely": None,
        "precision": "decade", "qualifiers": [], "error": None,
        "start": {"earliest": "1650-01-01", "latest": "1659-12-31", "likely": None,
                  "precision": "decade", "qualifiers": []},
        "end": {"earliest": "1660-01-01", "latest": "1660-12-31", "likely": None,
                "precision": "year", "qualifiers": []},
    }


def test_describe_an_open_interval():
    described = describe("../1760")
    assert (described["earliest"], described["latest"]) == (None, "1760-12-31")
    assert described["qualifiers"] == ["open_start"]
    assert described["start"] == {"earliest": None, "latest": None, "likely": None,
                                  "precision": None, "qualifiers": ["open_start"]}


@pytest.mark.parametrize("text", ["n.d.", " s.d. ", "Undated", "?"])
def test_describe_says_a_no_date_word_means_no_date(text):
    # n.d. / s.d. (sine dato): the cataloguers' words for "no date"; common practice, no
    # source. A table cell holding one is empty; parse says so instead of "cannot read".
    described = describe(text)
    assert not described["ok"] and described["error"].startswith("no date: ")
    assert "undated" in described["error"]


def test_describe_an_error():
    assert describe("1985-13-01") == {
        "input": "1985-13-01", "ok": False, "earliest": None, "latest": None, "likely": None,
        "precision": None, "qualifiers": [], "error": "month 13 does not exist",
    }


def test_describe_expanded_years():
    described = describe("+12000")
    assert (described["earliest"], described["latest"]) == ("+12000-01-01", "+12000-12-31")
    assert describe("-0043-03-15")["earliest"] == "-0043-03-15"  # DESIGN §5


def test_describe_key_order_is_stable():
    keys = ["input", "ok", "earliest", "latest", "likely", "precision", "qualifiers", "error"]
    assert list(describe("1650")) == keys
    assert list(describe("1650–1660")) == keys + ["start", "end"]
    assert list(describe("nonsense")) == keys


# Properties over any text
_TOKENS = ["1650", "44", "0", "00", "12", "13", "60", "-", "–", "—", "/", "..", " ", "c.", "c",
           "ca.", "circa ", "before ", "after ", "bef. ", "BC", " BCE", "AD ", " CE", "s", "'s",
           "17th", "1st", " century", " c.", "X", "XX", "~", "?", "%", "-04", "-02-29", "to",
           "April ", "12 ", "Y", "+", "12000", "T10:00", "Z", "P1Y", "mid-"]
_DATE_LIKE = st.lists(st.sampled_from(_TOKENS), max_size=8).map("".join)
_ANY_TEXT = st.one_of(st.text(), _DATE_LIKE)


def _bounds_in_order(endpoint: Endpoint) -> bool:
    return (endpoint.earliest is None or endpoint.latest is None
            or endpoint.earliest <= endpoint.latest)


@hypothesis_settings(max_examples=600)
@given(_ANY_TEXT)
def test_any_text_parses_or_raises_date_error(text):
    for parse in (parse_date, parse_span, parse_endpoint):
        try:
            parse(text)
        except DateError:
            pass


@hypothesis_settings(max_examples=600)
@given(_ANY_TEXT)
def test_describe_never_raises_and_is_json(text):
    described = describe(text)
    assert described["ok"] == (described["error"] is None)
    json.dumps(described)


@hypothesis_settings(max_examples=600)
@given(_ANY_TEXT)
def test_earliest_is_never_after_latest(text):
    try:
        span = parse_span(text)
    except DateError:
        return
    assert _bounds_in_order(span.start) and _bounds_in_order(span.end)
    low, high = span.possible_extent
    assert low is None or high is None or low <= high


@given(st.dates())
def test_iso_days_round_trip_with_stdlib(day):
    # stdlib dates are proleptic Gregorian and toordinal() counts R.D. (DESIGN §3).
    assert parse_date(day.isoformat()) == Endpoint.day(day.toordinal())
    assert endpoint_from_cell(day) == Endpoint.day(day.toordinal())


@given(st.integers(min_value=-9999, max_value=9999))
def test_signed_iso_years_cover_a_whole_gregorian_year(year):
    # Changed for issue 17: -1004 written bare is a signed year number, read by the
    # signed-years setting like -300 (tests/test_signed_years.py); only a zero-padded year is
    # ISO 8601's alone, so years before -999 are written in the expanded form, -01004.
    width = 5 if year < -999 else 4
    text = f"{'-' if year < 0 else '+'}{abs(year):0{width}d}" if year else "0000"
    endpoint = parse_date(text)
    leap = year % 4 == 0 and (year % 100 != 0 or year % 400 == 0)
    assert endpoint.latest - endpoint.earliest + 1 == (366 if leap else 365)


_PLAIN_FORMS = st.one_of(
    st.integers(min_value=1, max_value=9999).map(str),                 # a year
    st.integers(min_value=10, max_value=999).map(lambda n: f"{n * 10}s"),  # a decade (or hundreds)
    st.integers(min_value=4, max_value=20).map(lambda n: f"{n}th century"),
)


@given(_PLAIN_FORMS)
def test_circa_widens_and_before_after_sit_outside(text):
    plain = parse_date(text)
    widened = parse_date(f"c. {text}")
    assert widened.earliest < plain.earliest and widened.latest > plain.latest
    assert parse_date(f"before {text}").latest == plain.earliest - 1
    assert parse_date(f"after {text}").earliest == plain.latest + 1


def test_a_very_long_text_is_refused_early():
    with pytest.raises(DateError) as caught:
        parse_span("1650 " * 100)
    assert caught.value.reason == "too long for a date (499 characters)"
