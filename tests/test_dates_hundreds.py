"""`1600s`, an s on a century year: a century to most writers, a decade to some.

Common practice, no source: "the 1600s" in English prose is the seventeenth century (1600-1699);
tables written by programs that name a decade by its first year write `1600s` for 1600-1609.
The hundreds setting decides, the result is convention_dependent, and reading a table names
the rows. Days: Python's `datetime.date.toordinal()` (R.D., proleptic Gregorian).
"""
from __future__ import annotations

import csv
import datetime
from pathlib import Path

import pytest

from timelines.dates import DateSettings, explain, parse_date, parse_span
from timelines.model import Precision, Qualifier
from timelines.sources import ColumnMap, Table, load_records

DECADES = DateSettings(hundreds="decade")
GALLERY = Path(__file__).resolve().parent.parent / "gallery"


def day(year: int, month: int, day_number: int) -> int:
    return datetime.date(year, month, day_number).toordinal()


# (text, settings, first day, last day, precision)
HUNDREDS = [
    ("1600s", DateSettings(), day(1600, 1, 1), day(1699, 12, 31), Precision.CENTURY),
    ("1600s", DECADES, day(1600, 1, 1), day(1609, 12, 31), Precision.DECADE),
    ("1700's", DECADES, day(1700, 1, 1), day(1709, 12, 31), Precision.DECADE),
    ("THE 1900S", DECADES, day(1900, 1, 1), day(1909, 12, 31), Precision.DECADE),
    ("2000s", DateSettings(), day(2000, 1, 1), day(2099, 12, 31), Precision.CENTURY),
]


@pytest.mark.parametrize("text, settings, first, last, precision", HUNDREDS)
def test_the_hundreds_setting_decides_and_is_named(text, settings, first, last, precision):
    endpoint = parse_date(text, settings)
    assert (endpoint.earliest, endpoint.latest, endpoint.precision) == (first, last, precision)
    assert endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_other_decades_need_no_setting():
    endpoint = parse_date("1650s", DECADES)
    assert endpoint == parse_date("1650s")
    assert not endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_parts_and_ranges_follow_the_setting():
    assert parse_date("early 1600s", DECADES).latest == day(1602, 12, 31)   # thirds: 3/4/3
    span = parse_span("1600s–1700s", DECADES)
    assert span.possible_extent == (day(1600, 1, 1), day(1709, 12, 31))


def test_explain_names_the_setting():
    assert any("setting hundreds = decade" in line for line in explain("1600s", DECADES))


def test_a_table_names_the_rows_in_one_note_per_column():
    table = Table.from_rows("guild.csv", ("name", "admitted", "left"),
                            [("Odile Varn", "1600s", "1650"), ("Bram Oshet", "1650s", "1700s"),
                             ("Ysolde Pell", "1600s", "1610"), ("Tamsin Crell", "1701", "1702")])
    result = load_records(table, ColumnMap(start="admitted", end="left", label="name"))
    notes = [str(problem) for problem in result.problems if problem.kind == "note"]
    assert notes == [
        "guild.csv:2:admitted: note: 2 cells write an s on a century year, read as centuries "
        "(1600s = 1600–1699; rows 2, 4) (--hundreds decade reads 1600s as 1600–1609; writing "
        "1600–1699 says which)",
        "guild.csv:3:left: note: a cell writes an s on a century year, read as centuries "
        "(1600s = 1600–1699; row 3) (--hundreds decade reads 1600s as 1600–1609; writing "
        "1600–1699 says which)",
    ]
    assert len(result.records) == 4   # a note keeps every row on the chart


def test_a_table_without_such_cells_has_no_note():
    table = Table.from_rows("guild.csv", ("name", "admitted"), [("Odile Varn", "1650s")])
    result = load_records(table, ColumnMap(start="admitted", label="name"))
    assert not [problem for problem in result.problems if problem.kind == "note"]


def test_the_gallery_tables_write_no_hundreds():
    # The gallery's own tables say what they mean: 1650s, 1700–1709, 17th century.
    from timelines.dates.text import writes_hundreds
    for path in sorted(GALLERY.glob("*/*.csv")):
        with path.open(encoding="utf-8") as handle:
            for row in csv.reader(handle):
                assert not any(writes_hundreds(cell) for cell in row), (path.name, row)


def test_the_register_generator_writes_century_decades_in_full():
    import importlib.util
    spec = importlib.util.spec_from_file_location(
        "make_register", GALLERY / "register" / "make_register.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    assert module.written_decade(1600) == "1600–1609"
    assert module.written_decade(1650) == "1650s"
