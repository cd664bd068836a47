"""Event words before a date (b., bapt., d., bur., m., fl.) and what they say about a span.

How far a baptism or burial reaches back to the birth or death it stands for is a setting;
the defaults (30 and 7 days) are common practice, no source.
"""
from __future__ import annotations

import datetime

import pytest

from timelines.dates import DateSettings, explain, parse_date, parse_span, settings_from_options
from timelines.model import Qualifier


def _day(text: str) -> int:
    return datetime.date.fromisoformat(text).toordinal()


@pytest.mark.parametrize("word", ["b.", "born", "d.", "died", "m.", "married", "†", "fl."])
def test_birth_death_and_marriage_keep_the_dates_own_bounds(word):
    assert parse_date(f"{word} 4 May 1760") == parse_date("4 May 1760")


@pytest.mark.parametrize("word", ["bapt.", "baptised", "chr.", "christened"])
def test_a_baptism_reaches_back_to_the_birth(word):
    endpoint = parse_date(f"{word} 4 May 1760")
    assert (endpoint.earliest, endpoint.latest) == (_day("1760-04-04"), _day("1760-05-04"))
    assert endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_a_burial_reaches_back_to_the_death_by_its_setting():
    endpoint = parse_date("bur. 3 June 1801")
    assert (endpoint.earliest, endpoint.latest) == (_day("1801-05-27"), _day("1801-06-03"))
    wider = parse_date("bur. 3 June 1801", DateSettings(burial_days=14))
    assert wider.earliest == _day("1801-05-20")


def test_zero_days_reads_the_date_as_written():
    settings = settings_from_options({"baptism-days": "0"})
    assert parse_date("bapt. 4 May 1760", settings) == parse_date("4 May 1760")


def test_an_event_word_in_a_range_applies_to_its_side():
    span = parse_span("bapt. 4 May 1760 – bur. 3 June 1801")
    assert span.start.earliest == _day("1760-04-04")
    assert span.end.earliest == _day("1801-05-27")


def test_two_event_words_are_refused():
    with pytest.raises(ValueError, match="one event word"):
        parse_date("b. bapt. 1760")


def test_explain_says_what_the_event_stands_for():
    lines = "\n".join(explain("bapt. 4 May 1760"))
    assert "stands for the birth up to 30 days before it (setting baptism-days = 30)" in lines
    assert "floruit" in "\n".join(explain("fl. 1650–1670"))
