"""`present`, `now`, `today`, `ongoing`: an end that has not come.

Alone in an end cell (or as the end of a range) the span runs on, known to last at least until
the present setting's day (today unless set): the end window's earliest day records it. In a
start cell they are refused. Days: Python's `datetime.date.toordinal()` (R.D.).
"""
from __future__ import annotations

import datetime

import pytest

from timelines.dates import DateError, DateSettings, explain, parse_column, parse_span
from timelines.dates import settings_from_options
from timelines.model import Endpoint, Qualifier
from timelines.sources import ColumnMap, Table, load_records

AS_OF = DateSettings(present="2024-06-30")
AS_OF_DAY = datetime.date(2024, 6, 30).toordinal()
OPEN_END = Endpoint.open(Qualifier.OPEN_END)
OPEN_START = Endpoint.open(Qualifier.OPEN_START)

RUNNING_ON = [
    ("present", AS_OF_DAY),
    ("Now", AS_OF_DAY),
    ("TODAY", AS_OF_DAY),
    ("ongoing", AS_OF_DAY),
]


@pytest.mark.parametrize("text, first_day", RUNNING_ON)
def test_an_end_cell_runs_on_from_the_present_day(text, first_day):
    endpoint = parse_column([text], AS_OF, open_cell=OPEN_END)[0]
    assert (endpoint.earliest, endpoint.latest) == (first_day, None)
    assert endpoint.is_open and endpoint.has(Qualifier.OPEN_END)


def test_the_present_is_today_unless_set():
    endpoint = parse_column(["present"], open_cell=OPEN_END)[0]
    assert endpoint.earliest == datetime.date.today().toordinal()


@pytest.mark.parametrize("text", ["present", "now", "today", "ongoing"])
def test_a_start_cell_refuses_them_with_a_reason(text):
    error = parse_column([text], AS_OF, open_cell=OPEN_START)[0]
    assert isinstance(error, DateError)
    assert error.reason == f"{text!r} can end a span (it runs on to the present), not start one"


def test_a_range_ends_the_same_way():
    span = parse_span("1985–present", AS_OF)
    assert span.end == parse_column(["present"], AS_OF, open_cell=OPEN_END)[0]
    assert span.possible_extent[1] is None


def test_explain_names_the_day():
    lines = explain("1985–present", AS_OF)
    assert ("'present': the span runs on, at least until 2024-06-30 (setting present = "
            "2024-06-30): 2024-06-30 .. open") in lines


def test_a_table_reads_present_in_the_end_column_and_refuses_it_in_the_start():
    table = Table.from_rows("staff.csv", ("name", "from", "to"),
                            [("Odile Varn", "1990", "present"), ("Bram Oshet", "now", "2000")])
    result = load_records(table, ColumnMap(start="from", end="to", label="name"), AS_OF)
    assert [record.span.end.earliest for record in result.records] == [AS_OF_DAY]
    assert [str(problem) for problem in result.problems] == [
        "staff.csv:3:from: cannot read 'now': 'now' can end a span (it runs on to the present), "
        "not start one (leave the start empty when it is not known, or write .. when the span "
        "runs on into the past)"]


@pytest.mark.parametrize("value, message", [("yesterday", "today or a day"),
                                            ("2024-02-30", "today or a day")])
def test_a_bad_present_setting_is_refused(value, message):
    with pytest.raises(ValueError, match=message):
        settings_from_options({"present": value})
