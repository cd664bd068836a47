"""sources: reading tables, finding columns, rows into Records and Problems, no row lost.

Fixtures are invented (tests/fixtures/harrowmere-*.csv/.tsv); spreadsheets are written into
tmp_path by openpyxl (XLSX) and pandas with the odf engine (ODS) so that no binary file is kept.
Expected fixed days come from the stdlib: `date.toordinal()` counts Reingold & Dershowitz's
R.D. days (Python docs, datetime.date.toordinal).
"""
from __future__ import annotations

import csv
import io
import subprocess
import sys

from datetime import date, datetime
from pathlib import Path

import openpyxl
import pandas as pd
import pytest
from hypothesis import given, settings as hypothesis_settings, strategies as st

# the column reader load_records hands each distinct date cell to
import timelines.dates.column as column_reader
from timelines.check import check
from timelines.errors import SourceError, UsageError
from timelines.model import Qualifier
from timelines.sources import (
    ColumnMap, Problem, Table, detect_columns, load_records, read_records, read_table,
)
from timelines.sources.tables import SMALL_TEXT, TEXT_READERS, text_columns

FIXTURES = Path(__file__).parent / "fixtures"
FOUNDERS = FIXTURES / "harrowmere-founders.csv"
CHRONOLOGY = FIXTURES / "harrowmere-chronology.tsv"


def day(year: int, month: int, day_of_month: int) -> int:
    return date(year, month, day_of_month).toordinal()


def load(path: Path, columns: ColumnMap = ColumnMap(), **options):
    return read_records(path, columns, **options)


def assert_no_row_lost(result) -> None:
    """Every row read is a Record or has a Problem that keeps it off the chart, never both."""
    off_chart = {p.row for p in result.problems if p.kind in ("error", "contradiction")}
    kept = {r.provenance.row for r in result.records}
    assert not off_chart & kept
    assert len(kept) == len(result.records)
    assert len(kept) + len(off_chart) == result.rows_read
    undated = {p.row for p in result.problems if p.kind == "undated"}
    assert undated == {r.provenance.row for r in result.records if r.span is None}


# ---------------------------------------------------------------------------------------------
# read_table

def test_csv_cells_reach_the_parser_as_written():
    table = read_table(FOUNDERS)
    assert table.source == "harrowmere-founders.csv"
    assert table.header == ("id", "name", "born", "died", "workshop")
    assert table.rows[0] == ("H1", "Odile Varn", "1650", "1702", "North Yard")
    assert table.rows[9][2] == "0043"          # leading zeros kept: not the number 43
    assert table.rows[8] == ("",) * 5          # the blank line keeps its place (row 10)
    assert all(len(row) == 5 for row in table.rows)


def test_utf8_byte_order_mark_is_dropped(tmp_path):
    # The byte-order mark is U+FEFF; its UTF-8 bytes (EF BB BF) come from the stdlib codec.
    path = tmp_path / "marked.csv"
    path.write_bytes("\ufeff".encode("utf-8") + "name,born\nAné Sollu,1650\n".encode("utf-8"))
    assert path.read_bytes().startswith(b"\xef\xbb\xbf")
    table = read_table(path)
    assert table.header == ("name", "born")
    assert table.rows == (("Ané Sollu", "1650"),)


def test_utf16_text_export_is_read(tmp_path):
    # A spreadsheet's "Unicode text" export: UTF-16 with its mark, tab separated, .txt.
    path = tmp_path / "export.txt"
    path.write_bytes("name\tborn\nAné Sollu\t1650\n".encode("utf-16"))
    assert read_table(path).rows == (("Ané Sollu", "1650"),)


def test_text_that_is_not_utf8_is_refused_with_advice(tmp_path):
    # Changed for issue 17: such a file used to be refused when no encoding was named; now it
    # is read as Windows-1252 with a note (tests/test_encodings_read.py). Naming UTF-8 still
    # refuses it, with the same message and advice as before.
    path = tmp_path / "legacy.csv"
    path.write_bytes("name,born\nOdile,1650\nAné,1651\n".encode("cp1252"))  # é = 0xE9
    with pytest.raises(SourceError) as caught:
        read_table(path, encoding="utf-8")
    assert str(caught.value) == "legacy.csv: line 3 is not utf-8 text (byte 0xe9)"
    assert caught.value.hint == "save the file as UTF-8 (in a spreadsheet program: 'CSV UTF-8')"
    assert read_table(path, encoding="cp1252").rows[1] == ("Ané", "1651")


def test_tsv_and_delimiters_found_from_the_header(tmp_path):
    assert read_table(CHRONOLOGY).header == ("Date", "Event", "Category")
    semicolons = tmp_path / "european.csv"  # where the decimal mark is a comma
    semicolons.write_text("name;born\nOdile;1650,5\n", encoding="utf-8")
    assert read_table(semicolons).rows == (("Odile", "1650,5"),)
    pipes = tmp_path / "export.txt"
    pipes.write_text("name|born|died\nOdile|1650|1702\n", encoding="utf-8")
    assert read_table(pipes).header == ("name", "born", "died")


def test_header_blanks_and_repeats_get_names(tmp_path):
    path = tmp_path / "odd.csv"
    path.write_text("name,,name,born\nA,x,B,1650\n", encoding="utf-8")
    assert read_table(path).header == ("name", "column 2", "name (2)", "born")


@pytest.mark.parametrize("name, content, message, hint", [
    ("missing.csv", None, "{folder}/missing.csv: no such file",
     "check the path and the spelling of the file name"),
    ("people.xls", b"x", "people.xls: cannot read files of type '.xls'",
     "save it as one of .csv, .tsv, .tab, .txt, .xlsx, .xlsm, .ods"),
    ("empty.csv", b"", "empty.csv: the file is empty",
     "the first row should name the columns, e.g. label,start,end"),
    ("blank.csv", b"\n\n", "blank.csv: the file is empty",
     "the first row should name the columns, e.g. label,start,end"),
    ("ragged.csv", b"a,b\n1,2\n1,2,3\n", "ragged.csv: line 3 has 3 cells, the header has 2",
     "every line should have as many cells as the header"),
    ("headless.csv", b",\n1,2\n", "headless.csv: row 1 is empty; it should name the columns",
     "put the column names (e.g. label, start, end) in the first row"),
])
def test_unreadable_files_raise_source_errors_with_hints(tmp_path, name, content, message, hint):
    path = tmp_path / name
    if content is not None:
        path.write_bytes(content)
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert str(caught.value) == message.format(folder=tmp_path)
    assert caught.value.hint == hint


def test_a_damaged_spreadsheet_is_a_source_error(tmp_path):
    path = tmp_path / "broken.xlsx"
    path.write_bytes(b"not a zip archive")
    opening = "^broken.xlsx: cannot open it as a spreadsheet"
    with pytest.raises(SourceError, match=opening) as caught:
        read_table(path)
    assert caught.value.hint == "open it in a spreadsheet program and save it again"


def test_a_sheet_cannot_be_chosen_in_a_text_file():
    with pytest.raises(UsageError, match="has no sheets"):
        read_table(FOUNDERS, sheet="People")


def write_workbook(path: Path) -> Path:
    """Two sheets; the second holds real dates, whole-number years, text and blanks."""
    book = openpyxl.Workbook()
    notes = book.active
    notes.title = "Notes"
    notes.append(["About", "invented data"])
    people = book.create_sheet("People")
    people.append(["Id", "Name", "Born", "Died", "Pieces"])
    people.append(["W1", "Odile Varn", datetime(1901, 3, 4), 1950, 12])
    people.append(["W2", "Tamsin Crell", 1655, "c. 1710", 3.5])
    people.append(["W3", "Bram Oshet", None, None, None])
    people.append([None, None, None, None, None])          # a formatted but empty row
    people.append(["W4", "Ysolde Pell", "1985-13-01", 1740.0, None])
    book.save(path)
    return path


def test_xlsx_sheet_by_name_number_and_case(tmp_path):
    path = write_workbook(tmp_path / "founders.xlsx")
    assert read_table(path).header == ("About", "invented data")   # first sheet by default
    by_name = read_table(path, sheet="People")
    assert read_table(path, sheet="people") == by_name
    assert read_table(path, sheet="2") == by_name                  # counted from 1
    assert by_name.header == ("Id", "Name", "Born", "Died", "Pieces")


def test_xlsx_missing_sheet_lists_the_sheets(tmp_path):
    path = write_workbook(tmp_path / "founders.xlsx")
    # a sheet name is the user's option: a usage error (exit 2), not a fault of the file
    with pytest.raises(UsageError) as caught:
        read_table(path, sheet="Peple")
    assert str(caught.value) == "founders.xlsx: no sheet 'Peple'; the sheets are 'Notes', 'People'"
    assert caught.value.hint == "did you mean 'People'?"
    with pytest.raises(UsageError, match="no sheet '3'"):
        read_table(path, sheet="3")


def test_xlsx_cells_keep_their_types(tmp_path):
    table = read_table(write_workbook(tmp_path / "founders.xlsx"), sheet="People")
    first, second, empty = table.rows[0], table.rows[1], table.rows[2]
    assert first[2] == datetime(1901, 3, 4) and type(first[2]) is datetime
    assert first[3] == 1950 and type(first[3]) is int
    assert second[2] == 1655 and type(second[2]) is int
    assert second[4] == 3.5
    assert empty[2:] == ("", "", "")
    assert table.rows[4][3] == 1740 and type(table.rows[4][3]) is int  # whole 1740.0


def test_ods_cells_keep_their_types(tmp_path):
    path = tmp_path / "founders.ods"
    frame = pd.DataFrame({"Name": ["Odile Varn", "Tamsin Crell"],
                          "Born": [date(1650, 3, 4), 1655],
                          "Died": ["c. 1710", ""]}, dtype=object)
    frame.to_excel(path, engine="odf", index=False, sheet_name="Founders")
    table = read_table(path, sheet="Founders")
    assert table.header == ("Name", "Born", "Died")
    assert table.rows[0][1] == datetime(1650, 3, 4) and type(table.rows[0][1]) is datetime
    assert table.rows[1][1] == 1655 and type(table.rows[1][1]) is int
    assert table.rows[1][2] == ""


# ---------------------------------------------------------------------------------------------
# detect_columns

@pytest.mark.parametrize("header, expected", [
    (("Name", "Born", "Died"), ColumnMap(start="Born", end="Died", label="Name")),
    (("Title", "Start Date", "END_DATE", "Category", "Colour", "Ref"),
     ColumnMap(start="Start Date", end="END_DATE", label="Title", group="Category",
               color="Colour", id="Ref")),
    (("ID", "Event", "Date", "Type"), ColumnMap(when="Date", label="Event", group="Type", id="ID")),
    (("label", "from", "until"), ColumnMap(start="from", end="until", label="label")),
    (("Begin", "Name"), ColumnMap(start="Begin", label="Name")),          # no end: ends unknown
    (("Period", "No."), ColumnMap(when="Period", id="No.")),
])
def test_detect_columns_from_common_header_names(header, expected):
    assert detect_columns(header, ColumnMap()) == expected


def test_start_and_end_take_precedence_over_when():
    # A table with both keeps "Date" as an ordinary field rather than guessing its part.
    detected = detect_columns(("Date", "Start", "End"), ColumnMap())
    assert detected == ColumnMap(start="Start", end="End")


def test_a_named_when_column_is_not_overruled_by_a_start_column():
    assert detect_columns(("Date", "Start", "Name"), ColumnMap(when="Date")) == ColumnMap(
        when="Date", label="Name")


def test_named_columns_are_kept_and_matched_without_case_or_spaces():
    header = ("Id", "Full name", "Baptised", "Buried")
    given = ColumnMap(start="baptised", end="Buried", label="full  name")
    assert detect_columns(header, given) == ColumnMap(
        start="Baptised", end="Buried", label="Full name", id="Id")


def test_named_column_that_does_not_exist_suggests_one():
    with pytest.raises(UsageError) as caught:
        detect_columns(("id", "name", "born", "died"), ColumnMap(start="brn"))
    assert str(caught.value) == ("no column 'brn' (given for start); "
                                 "the columns are 'id', 'name', 'born', 'died'")
    assert caught.value.hint == "did you mean 'born'?"


def test_no_date_column_tells_how_to_name_one():
    with pytest.raises(UsageError) as caught:
        detect_columns(("name", "workshop"), ColumnMap())
    assert str(caught.value) == "no date column found among 'name', 'workshop'"
    assert "--start" in caught.value.hint and "--when" in caught.value.hint


def test_when_cannot_be_combined_with_start_or_end():
    with pytest.raises(UsageError, match="cannot be combined"):
        detect_columns(("a", "b"), ColumnMap(when="a", start="b"))


# ---------------------------------------------------------------------------------------------
# load_records: start and end columns

def test_founders_report_lines_are_exact():
    result = load(FOUNDERS)
    assert [str(problem) for problem in result.problems] == [
        # ISO 8601-1 months run 01..12; 2001 is no Gregorian leap year (not divisible by 4).
        "harrowmere-founders.csv:4:born: [H3] cannot read '1985-13-01': month 13 does not exist",
        "harrowmere-founders.csv:7: [H6] no date: the 'born' and 'died' cells are empty",
        "harrowmere-founders.csv:8:died: [H7] the end ('1690') lies wholly before "
        "the start ('1720')",
        "harrowmere-founders.csv:9:born: [H8] cannot read 'c. 18th': not a date form timelines reads "
        "(expected a date such as 1650, c. 1650, 1650s, 17th century, 1650-04-12, 44 BC)",
        "harrowmere-founders.csv:9:died: [H8] cannot read '2001-02-29': 2001 is not a leap year",
    ]
    assert [p.kind for p in result.problems] == [
        "error", "undated", "contradiction", "error", "error"]


def test_founders_counts_and_no_row_lost():
    result = load(FOUNDERS)
    assert result.rows_read == 10                     # 11 data lines less the blank one
    assert_no_row_lost(result)
    report = check(result)
    assert report.summary() == ("10 rows read: 6 drawn, 4 reported "
                                "(2 unreadable, 1 contradictory, 1 undated); 1 warning")
    # '0043' is the ISO year 43: a 1600-year span is the typical dropped-digit warning.
    assert [str(w) for w in report.warnings] == [
        "harrowmere-founders.csv:11: [H9] warning: '0043 – 1650' may last about 1608 years, "
        "more than 1000; is a year mistyped?"]


def test_founders_records():
    records = {r.provenance.row: r for r in load(FOUNDERS).records}
    assert sorted(records) == [2, 3, 5, 6, 7, 11, 12]
    first = records[2]
    assert (first.label, first.id, first.start_text, first.end_text) == (
        "Odile Varn", "H1", "1650", "1702")
    assert first.span.start.earliest == day(1650, 1, 1)
    assert first.span.end.latest == day(1702, 12, 31)
    assert first.fields == (("workshop", "North Yard"),)
    assert first.provenance.source == "harrowmere-founders.csv"
    assert first.provenance.columns == ("born", "died", "name", "id")


def test_empty_start_or_end_is_an_unknown_end():
    records = {r.provenance.row: r for r in load(FOUNDERS).records}
    no_start, no_end = records[5].span, records[6].span
    assert no_start.start.qualifiers == {Qualifier.UNKNOWN_START}
    assert no_start.start.earliest is None and no_start.end.latest == day(1698, 12, 31)
    assert no_end.end.qualifiers == {Qualifier.UNKNOWN_END}
    assert no_end.end.latest is None


def test_two_dots_in_a_start_or_end_cell_leave_that_side_open():
    # ISO 8601-2:2019 (EDTF level 1): ".." is an open start or end of an interval; from memory.
    table = Table.from_rows("t.csv", ("name", "from", "until"),
                  (("Ashgrove", "1679", " .. "), ("Lantern Lane", "..", "1661")))
    running, before = (r.span for r in load_records(table, detect_columns(table.header)).records)
    assert running.end.qualifiers == {Qualifier.OPEN_END} and running.end.is_open
    assert before.start.qualifiers == {Qualifier.OPEN_START}
    assert before.end.latest == day(1661, 12, 31)


def test_label_falls_back_to_the_id_then_the_row_number():
    records = {r.provenance.row: r for r in load(FOUNDERS).records}
    assert records[7].label == "H6" and records[7].span is None     # undated, still a Record
    assert records[12].label == "row 12" and records[12].id is None


def test_every_cell_error_of_every_row_is_collected():
    table = Table.from_rows("bad.csv", ("born", "died"), (("x1", "x2"), ("1650", "x3"), ("x1", "1700")))
    result = load_records(table, ColumnMap(start="born", end="died"))
    assert [(p.row, p.column, p.text) for p in result.problems] == [
        (2, "born", "x1"), (2, "died", "x2"), (3, "died", "x3"), (4, "born", "x1")]
    assert result.records == () and result.rows_read == 3


def test_start_only_map_leaves_the_ends_unknown():
    table = Table.from_rows("t.csv", ("name", "born"), (("Odile", "1650"), ("Tamsin", ""), ("", "")))
    result = load_records(table, ColumnMap(start="born", label="name"))
    assert result.rows_read == 2                      # a wholly blank row is no record
    dated, undated = result.records
    assert dated.span.end.qualifiers == {Qualifier.UNKNOWN_END}
    assert undated.span is None and undated.label == "Tamsin"
    assert str(result.problems[0]) == "t.csv:3: no date: the 'born' cell is empty"


def test_group_color_and_other_fields():
    table = Table.from_rows("t.csv", ("name", "born", "died", "guild", "hue", "note"),
                  (("Odile", "1650", "1702", "Founders", "blue", "see file 3"),
                   ("Tamsin", "1655", "1710", "", "", "")))
    columns = detect_columns(table.header, ColumnMap(group="guild", color="hue"))
    first, second = load_records(table, columns).records
    assert (first.group, first.color) == ("Founders", "blue")
    assert first.fields == (("note", "see file 3"),)
    assert (second.group, second.color, second.fields) == (None, None, (("note", ""),))


def test_load_records_checks_the_names_it_is_given():
    table = Table.from_rows("t.csv", ("name", "born"), (("Odile", "1650"),))
    with pytest.raises(UsageError, match="did you mean|no column 'brn'"):
        load_records(table, ColumnMap(start="brn"))
    with pytest.raises(UsageError, match="no date column"):
        load_records(table, ColumnMap(label="name"))


# ---------------------------------------------------------------------------------------------
# load_records: one column holding each date or range

def test_chronology_when_column():
    result = load(CHRONOLOGY)
    assert_no_row_lost(result)
    assert result.rows_read == 5
    assert [str(p) for p in result.problems] == [
        "harrowmere-chronology.tsv:4:Date: cannot read '1990/1980': the end comes before the start",
        "harrowmere-chronology.tsv:5: no date: the 'Date' cell is empty",
    ]
    records = {r.provenance.row: r for r in result.records}
    wall = records[2]
    assert (wall.label, wall.group, wall.start_text, wall.end_text) == (
        "Harbour wall rebuilt", "Works", "1650-1660", "")
    assert wall.span.possible_extent == (day(1650, 1, 1), day(1660, 12, 31))
    fire = records[6].span
    # Changed with issue 10 (item 6): a single value in a when column is covering dates, the
    # whole year 1712 (it was read as a moment somewhere in 1712, drawn at mid-year).
    assert not fire.is_point
    assert fire.certain_core == (day(1712, 1, 1), day(1712, 12, 31))
    assert records[5].span is None and records[5].label == "Bell recast"


# ---------------------------------------------------------------------------------------------
# Spreadsheets through load_records

def test_xlsx_records_from_typed_cells(tmp_path):
    path = write_workbook(tmp_path / "founders.xlsx")
    result = load(path, sheet="People")
    assert result.rows_read == 4                       # the empty formatted row is skipped
    assert_no_row_lost(result)
    records = {r.provenance.row: r for r in result.records}
    odile = records[2]
    assert (odile.start_text, odile.end_text) == ("1901-03-04", "1950")
    assert odile.span.start.earliest == odile.span.start.latest == day(1901, 3, 4)
    assert odile.span.end.earliest == day(1950, 1, 1) and odile.span.end.latest == day(1950, 12, 31)
    assert odile.fields == (("Pieces", "12"),)
    assert records[3].start_text == "1655" and records[3].fields == (("Pieces", "3.5"),)
    assert records[4].span is None
    assert [str(p) for p in result.problems] == [
        "founders.xlsx:4: [W3] no date: the 'Born' and 'Died' cells are empty",
        "founders.xlsx:6:Born: [W4] cannot read '1985-13-01': month 13 does not exist",
    ]


def test_spreadsheet_values_reach_the_parser_with_their_types(tmp_path, monkeypatch):
    seen = []
    real = column_reader.endpoint_from_cell

    def recording(value, settings):
        seen.append(value)
        return real(value, settings)

    monkeypatch.setattr(column_reader, "endpoint_from_cell", recording)
    load(write_workbook(tmp_path / "founders.xlsx"), sheet="People")
    assert datetime(1901, 3, 4) in seen and type(seen[0]) is datetime
    assert any(type(value) is int and value == 1950 for value in seen)


def test_ods_records(tmp_path):
    path = tmp_path / "founders.ods"
    frame = pd.DataFrame({"Name": ["Odile Varn", "Tamsin Crell"],
                          "Born": [date(1650, 3, 4), 1655], "Died": [1702, "c. 1710"]},
                         dtype=object)
    frame.to_excel(path, engine="odf", index=False)
    first, second = load(path).records
    assert first.start_text == "1650-03-04" and first.span.start.earliest == day(1650, 3, 4)
    assert second.start_text == "1655" and second.end_text == "c. 1710"


# ---------------------------------------------------------------------------------------------
# Speed: each distinct value is parsed once per load

def test_each_distinct_cell_is_parsed_once(monkeypatch):
    calls = []
    real = column_reader.endpoint_from_cell

    def counting(value, settings):
        calls.append(value)
        return real(value, settings)

    monkeypatch.setattr(column_reader, "endpoint_from_cell", counting)
    rows = tuple((str(1650 + n % 3), "1700" if n % 2 else "bad") for n in range(300))
    result = load_records(Table.from_rows("t.csv", ("born", "died"), rows),
                          ColumnMap(start="born", end="died"))
    assert sorted(calls) == ["1650", "1651", "1652", "1700", "bad"]
    assert len(result.records) == 150 and len(result.problems) == 150


def test_a_very_long_cell_is_quoted_by_its_start_and_kept_whole():
    text = "1650 " + "x" * 5000
    result = load_records(Table.from_rows("t.csv", ("name", "born"), (("Odile", text),)),
                          ColumnMap(label="name", start="born"))
    (problem,) = result.problems
    assert problem.text == text
    assert str(problem).startswith("t.csv:2:born: cannot read '1650 xxx")
    assert "... (5,005 characters)" in str(problem) and len(str(problem)) < 250


def test_problem_kind_is_checked():
    with pytest.raises(ValueError, match="kind must be one of"):
        Problem("t.csv", 2, "born", None, "x", "why", "oops")


# ---------------------------------------------------------------------------------------------
# No row is ever lost, whatever the cells hold

CELLS = st.sampled_from(["", " ", "1650", "c. 1650", "1650s", "44 BC", "1985-13-01", "..",
                         "17th century", "nonsense", "1700", "1600", "before 1700"])


@hypothesis_settings(max_examples=200, deadline=None)
@given(st.lists(st.tuples(st.sampled_from(["", "P1", "P2"]), CELLS, CELLS), max_size=12))
def test_every_row_is_drawn_listed_or_reported(rows):
    table = Table.from_rows("random.csv", ("id", "start", "end"), tuple(rows))
    result = load_records(table, ColumnMap(start="start", end="end", id="id"))
    assert_no_row_lost(result)
    assert result.rows_read == sum(1 for row in rows if row != ("", "", ""))
    counts = check(result).counts
    assert counts.drawn + counts.reported == counts.rows_read


def test_xlsm_is_read_like_xlsx(tmp_path):
    path = write_workbook(tmp_path / "founders.xlsx").rename(tmp_path / "founders.xlsm")
    assert read_table(path, sheet="People").header == ("Id", "Name", "Born", "Died", "Pieces")


# ---------------------------------------------------------------------------------------------
# A small text table is read by the csv module, a large one by pandas: the same cells either way

TEXT_CELLS = st.text(alphabet=st.sampled_from(list('ab1 ,;|\t"\'\n\r-é?')), max_size=6)


@hypothesis_settings(max_examples=400, deadline=None)
@given(st.sampled_from([",", ";", "\t", "|"]), st.lists(TEXT_CELLS, min_size=1, max_size=4),
       st.lists(st.lists(TEXT_CELLS, max_size=5), max_size=6),
       st.sampled_from(["\n", "\r\n"]), st.sampled_from(["", "\ufeff"]))
def test_both_text_readers_give_the_same_cells(delimiter, header, rows, line_end, mark):
    # Written with the csv module's quoting (RFC 4180 style), rows of any length: shorter
    # rows are padded, longer ones are an error, blank lines are rows of empty cells.
    stream = io.StringIO()
    csv.writer(stream, delimiter=delimiter, lineterminator=line_end).writerows([header, *rows])
    text = mark + stream.getvalue()
    outcomes = []
    for reader in TEXT_READERS:
        try:
            outcomes.append(text_columns(text, delimiter, reader))
        except ValueError as error:
            outcomes.append(str(error))
    assert outcomes[0] == outcomes[1]


def test_large_text_tables_go_to_pandas_and_small_ones_do_not_load_it(tmp_path):
    path = tmp_path / "people.csv"
    path.write_text("name,born\nOdile Varn,1650\n", encoding="utf-8")
    code = ("import sys; from timelines.sources import read_table; "
            f"read_table({str(path)!r}); print('pandas' in sys.modules)")
    loaded = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                            check=True).stdout.strip()
    assert loaded == "False"
    big = "name,born\n" + "Odile Varn,1650\n" * (SMALL_TEXT // 16 + 1)
    assert text_columns(big, ",") == text_columns(big, ",", "pandas")
