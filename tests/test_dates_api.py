"""The date API around the parser: `explain`, the settings by option name, `iso_form`,
`parse_column`, and properties that hold for any text (hypothesis)."""
from __future__ import annotations

import dataclasses
import datetime

import pytest
from hypothesis import given, settings as hypothesis_settings, strategies as st

from timelines.calendar import iso_from_fixed
from timelines.dates import (
    DEFAULT_SETTINGS, SETTING_HELP, DateError, DateSettings, endpoint_from_cell, explain,
    iso_form, options_from_settings, parse_column, parse_date, parse_endpoint, parse_span,
    parse_span_column, settings_from_options,
)
from timelines.dates.column import DayEndpoints, parse_column_coded
from timelines.model import Endpoint, Precision


# --- explain ------------------------------------------------------------------------------
def test_explain_names_form_rule_and_setting():
    lines = explain("c. 1650s")
    assert lines == [
        "input: 'c. 1650s'",
        "dates below: ISO 8601, proleptic Gregorian, astronomical years (-0043 is 44 BC)",
        "'1650s': decade, historical calendar (Julian before 1582-10-15, Gregorian after): "
        "1650-01-01 .. 1659-12-31",
        "approximate: widened by 5 years on each side (setting circa-decade = 5): "
        "1645-01-01 .. 1664-12-31",
        "result: 1645-01-01 .. 1664-12-31, decade precision; approximate, convention_dependent",
    ]


def test_explain_a_range_gives_both_ends_extent_and_core():
    lines = explain("1650–60")
    assert "the two dates lend each other what they share: '60' as '1660'" in lines
    assert lines[-4:] == [
        "start: 1650-01-01 .. 1650-12-31, year precision",
        "end: 1660-01-01 .. 1660-12-31, year precision",
        "possible extent: 1650-01-01 .. 1660-12-31",
        "certain core: 1650-12-31 .. 1660-01-01",
    ]


def test_explain_an_error_points_at_it():
    assert explain("1985-13-01")[-4:] == [
        "error: month 13 does not exist",
        "at: 1985-13-01",
        "         ^",
        "suggestion: day and month swapped? 1985-01-13",
    ]


@pytest.mark.parametrize("text, suggestion", [
    ("2001-02-29", "suggestion: 2001-02-28 or 2001-03-01?"),
    ("1990/1980", "suggestion: did you mean 1980/1990?"),
    ("c. 18th", "suggestion: a century is written 18th century"),
    ("1985-13-14", None),     # no month 14 either: nothing to suggest
])
def test_explain_suggests_the_likely_slip(text, suggestion):
    lines = explain(text)
    assert (lines[-1] == suggestion) if suggestion else not lines[-1].startswith("suggestion")


@pytest.mark.parametrize("text, expected", [
    ("early 17th century", "(setting early-mid-late = thirds)"),
    ("17th century", "(setting century = common)"),
    ("before 1700", "(setting before-after = exclusive)"),
    ("by 1700", "the words say the date itself is allowed"),
    ("03.04.1650", "dots are written day first"),
    ("spring 1650", "setting hemisphere"),
    ("1701/02", "dual year (Old Style/New Style)"),
    ("12,500 ± 150 BP", "12,350..12,650 years before 1950"),
    ("1950S2", "estimated 1950"),
    ("156X-12-25", "unspecified digits X"),
    ("[1667,1668]", "set (one of) of 2 elements"),
    ("1700-02-29 (Julian)", "the text names the julian calendar"),
    ("fl. 1650", "a date of activity"),
    ("1984?", "uncertain; the bounds stay as they are"),
])
def test_explain_says_which_rule_decided(text, expected):
    assert any(expected in line for line in explain(text)), explain(text)


def test_explain_uses_the_settings_given():
    lines = explain("03/04/1650", DateSettings(day_first=True))
    assert "numeric date read as day 3, month 4 (setting day-first = yes)" in lines


def test_explain_collects_nothing_afterwards():
    explain("c. 1650")
    from timelines.dates import trace
    assert not trace.on


# --- settings by option name ----------------------------------------------------------------
def test_every_setting_has_one_option_with_help_and_default():
    # periods is a table, given as a file (--periods FILE, Chart.dates(periods=...)).
    fields = {field.name for field in dataclasses.fields(DateSettings)} - {"periods"}
    assert len(SETTING_HELP) == len(fields)
    assert all("(default: " in help_line for help_line in SETTING_HELP.values())
    assert settings_from_options({}) == DEFAULT_SETTINGS


def test_options_round_trip():
    settings = DateSettings(calendar="julian", circa_years_for_year=10, day_first=True,
                            year_start="03-25", early_mid_late="overlapping",
                            hemisphere="southern", century="strict", before_after="inclusive")
    assert settings_from_options(options_from_settings(settings)) == settings
    assert options_from_settings()["day-first"] == "refuse"


@pytest.mark.parametrize("options, expected", [
    ({"calendar": "Julian"}, {"calendar": "julian"}),
    ({"circa-year": "10"}, {"circa_years_for_year": 10}),
    ({"circa-year": 10}, {"circa_years_for_year": 10}),                 # TOML gives an int
    ({"day-first": "yes"}, {"day_first": True}),
    ({"day-first": False}, {"day_first": False}),
    ({"day-first": "refuse"}, {"day_first": None}),
    ({"year-start": "03-25"}, {"year_start": "03-25"}),
    ({"century": "strict", "before-after": "inclusive"},
     {"century": "strict", "before_after": "inclusive"}),
    ({"circa-deep-time": "20"}, {"circa_percent_for_deep_time": 20}),
])
def test_settings_from_options(options, expected):
    assert settings_from_options(options) == dataclasses.replace(DEFAULT_SETTINGS, **expected)


@pytest.mark.parametrize("options, message", [
    ({"circa-yaer": "5"}, "unknown date setting 'circa-yaer'; did you mean 'circa-year'?"),
    ({"calendar": "mayan"}, "calendar must be one of historical, gregorian, julian, not 'mayan'"),
    ({"circa-year": "-1"}, "circa-year must be a whole number from 0 to 1000000, not '-1'"),
    ({"circa-year": True}, "circa-year must be a whole number from 0 to 1000000, not True"),
    ({"circa-deep-time": 150}, "circa-deep-time must be a whole number from 0 to 100, not 150"),
    ({"day-first": "maybe"}, "day-first must be yes, no or refuse, not 'maybe'"),
    ({"year-start": "25-03"}, "year-start is a day written MM-DD, such as 01-01 or 03-25, "
                              "not '25-03'"),
    ({"year-start": "02-30"}, "year-start is a day written MM-DD, such as 01-01 or 03-25, "
                              "not '02-30'"),
    ({"early-mid-late": "halves"}, "early-mid-late must be one of thirds, overlapping, "
                                   "not 'halves'"),
])
def test_bad_options_say_what_is_wrong(options, message):
    with pytest.raises(ValueError) as caught:
        settings_from_options(options)
    assert str(caught.value) == message


def test_date_settings_refuse_bad_values_directly():
    with pytest.raises(ValueError, match="year_start is written MM-DD"):
        DateSettings(year_start="march")
    with pytest.raises(ValueError, match="circa_days_for_day must be a whole number"):
        DateSettings(circa_days_for_day=-1)


# --- iso_form -------------------------------------------------------------------------------
@pytest.mark.parametrize("text, form", [
    ("1650", "1650"),
    ("April 1650", "1650-04"),
    ("12 April 1650", "1650-04-12"),
    ("c. 1650", "[1645..1655]"),
    ("c. 12 April 1650", "[1650-03-28..1650-04-27]"),
    ("before 1700", "[..1699]"),
    ("after 1650s", "[1660..]"),
    ("1500", "[1500-01-10..1501-01-10]"),  # Julian 1500 in Gregorian days (convertdate: 9, then 10 days apart)
    ("44 BC", "[-0044-12-30..-0043-12-29]"),
    ("-0043", "-0043"),
    ("+12000", "+12000"),
    ("spring 1650", "[1650-03..1650-05]"),
])
def test_iso_form(text, form):
    assert iso_form(parse_date(text)) == form


def test_iso_form_writes_early_gregorian_years_as_months():
    # Before 1583 free text reads 1500 in the Julian calendar: the form must not say 1500.
    assert iso_form(parse_date("1500", DateSettings(calendar="gregorian"))) == "[1500-01..1500-12]"


def test_iso_form_of_no_bound():
    assert iso_form(parse_span("../1760").start) == ".."


# --- parse_column ---------------------------------------------------------------------------
def test_parse_column_reads_each_distinct_value_once():
    column = ["1650", "c. 1650", "", None, "1650", "nonsense", 1650, 1650.0]
    results = parse_column(column)
    assert results[0] is results[4]                         # shared, not re-read
    assert results[1] == parse_date("c. 1650")
    assert results[2] is None and results[3] is None
    assert isinstance(results[5], DateError) and results[5].reason == "not a date form timelines reads"
    assert results[6] == results[7] == endpoint_from_cell(1650)


def test_parse_span_column_keeps_ranges():
    assert parse_span_column(["1650–1660", ""]) == [parse_span("1650–1660"), None]


def test_an_iso_column_reads_in_bulk_as_the_parser_does():
    column = ["1985-04-12", "0000-02-29", "1582-10-04", "1985-04-12", "9999-12-31"]
    results = parse_column(column)
    assert results == [parse_endpoint(text) for text in column]
    assert results[0] is results[3]


@pytest.mark.parametrize("column", [
    ["1985-04-12", "2001-02-29"],        # an impossible day: each cell its own result
    ["1985-04-12", "+985-04-12"],        # a sign: not the plain form
    ["1985-04-12", "1985-04-1 "],
    ["1985-04-12", 1985],
])
def test_an_iso_column_with_an_odd_cell_takes_the_general_path(column):
    results = parse_column(column)
    assert results[0] == parse_endpoint("1985-04-12")
    expected = [endpoint_from_cell(value) if not _fails(value) else None for value in column]
    # strict: a reader that returned fewer results (or none) must fail here, not pass.
    for result, value, wanted in zip(results, column, expected, strict=True):
        if wanted is None:
            assert isinstance(result, DateError)
        else:
            assert result == wanted


def _fails(value) -> bool:
    try:
        endpoint_from_cell(value)
    except DateError:
        return True
    return False


@given(st.lists(st.dates(min_value=datetime.date(1, 1, 1)), min_size=1, max_size=30))
def test_bulk_iso_days_agree_with_stdlib(days):
    results = parse_column([day.isoformat() for day in days])
    assert [result.earliest for result in results] == [day.toordinal() for day in days]


# Python's date.toordinal() counts proleptic Gregorian days from 0001-01-01 = 1, as R.D. does
# (Reingold & Dershowitz, Calendrical Calculations): an outside reference for each day.
@given(st.lists(st.one_of(st.dates(min_value=datetime.date(1, 1, 1)), st.just(None)),
                min_size=1, max_size=30).filter(lambda cells: any(cells)))
def test_bulk_iso_days_with_empty_cells_agree_with_stdlib(days):
    column = ["" if day is None else day.isoformat() for day in days]
    coded = parse_column_coded(column)
    assert isinstance(coded.results, DayEndpoints)          # the bulk path, blanks and all
    results = coded.expanded()
    assert [None if result is None else (result.earliest, result.latest, result.precision)
            for result in results] == [None if day is None else
                                       (day.toordinal(), day.toordinal(), Precision.DAY)
                                       for day in days]
    assert results == [endpoint_from_cell(cell) for cell in column]    # as the general path


@pytest.mark.parametrize("column", [["", ""], ["", " "], ["1985-04-12", " "]])
def test_a_column_of_only_blanks_or_spaces_is_not_read_in_bulk(column):
    coded = parse_column_coded(column)
    assert not isinstance(coded.results, DayEndpoints)
    assert coded.expanded() == [endpoint_from_cell(cell) for cell in column]


# --- properties over any text ----------------------------------------------------------------
_TOKENS = ["1650", "44", "0", "12", "13", "60", "1701/02", "-", "–", "/", "..", " ", "c.", "ca.",
           "about ", "abt ", "probably ", "before ", "by ", "not after ", "after ", "since ",
           "between ", " and ", " or ", "early ", "mid-", "late ", "first half of the ",
           "second quarter of ", "BC", " BCE", "AD ", "s", "17th", " century", "seventeenth",
           "C17", " millennium", "X", "XX", "~", "?", "%", "-04", "-02-29", "-21", "-W15", "-5",
           "to", "April ", "12 ", "Apr-", "Y", "+", "E7", "S2", "12,500", " ± 150", " BP", " Ma",
           "65.5", " ka", "[", "]", "{", "}", ",", "O.S.", " (Julian)", "N.S.", "T10:00",
           "spring ", "Q2 ", "25/12/", "03/04/", "fl. ", "the ", "present", "Friday "]
_DATE_LIKE = st.lists(st.sampled_from(_TOKENS), max_size=8).map("".join)
_ANY_TEXT = st.one_of(st.text(max_size=40), _DATE_LIKE)


@hypothesis_settings(max_examples=1500)
@given(_ANY_TEXT)
def test_any_text_parses_or_raises_date_error(text):
    for parse in (parse_date, parse_span, parse_endpoint):
        try:
            parse(text)
        except DateError:
            pass
    assert explain(text)[0] == f"input: {text!r}"


@hypothesis_settings(max_examples=1500)
@given(_DATE_LIKE)
def test_bounds_are_in_order_and_the_normal_form_reads_back(text):
    try:
        span = parse_span(text)
    except DateError:
        return
    for endpoint in (span.start, span.end):
        if endpoint.earliest is not None and endpoint.latest is not None:
            assert endpoint.earliest <= endpoint.latest
        if endpoint.earliest is None and endpoint.latest is None:
            continue
        again = parse_date(iso_form(endpoint))
        assert (again.earliest, again.latest) == (endpoint.earliest, endpoint.latest), (
            text, iso_form(endpoint))


@given(st.integers(min_value=-10 ** 6, max_value=10 ** 6),
       st.integers(min_value=0, max_value=4000))
def test_iso_form_of_any_window_reads_back(first, length):
    endpoint = Endpoint(first, first + length, Precision.DAY)
    again = parse_date(iso_form(endpoint))
    assert (again.earliest, again.latest) == (endpoint.earliest, endpoint.latest), (
        iso_from_fixed(first), iso_form(endpoint))
