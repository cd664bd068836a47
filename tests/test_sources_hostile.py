"""Hostile and unusual tables (issue 9, items 3 and 5): a crash in one cell is that cell's
problem; spreadsheet serials, Excel's 1900-02-29, the 1904 date system, merged cells, formulas
with no saved value, error values, size guards, and the empty-sheet message.

Every workbook is written in tmp_path by the test: by openpyxl, by pandas with odfpy, or part by
part with zipfile when a case needs XML no writer produces (a forged dimension, a zip bomb, a
merged block in ODS). Names and data are invented. Serial numbers are checked against
Microsoft's published values (from memory: "January 1, 2008 is serial number 39448" in the
DATE function's documentation; the 1900 and 1904 systems lie 1,462 days apart, "Date systems
in Excel") and against openpyxl's own conversion (openpyxl.utils.datetime.from_excel).
"""
from __future__ import annotations

import time
import tracemalloc
import zipfile
from datetime import date, datetime
from pathlib import Path

import openpyxl
import pandas as pd
import pytest
from openpyxl.utils.datetime import CALENDAR_MAC_1904, from_excel

import timelines.dates.column as column_reader
import timelines.sources.records as records_module
from timelines.check import check
from timelines.cli import main
from timelines.errors import SourceError, UsageError
from timelines.sources import ColumnMap, Table, load_records, read_records, read_table
from timelines.sources import sheets as sheet_limits

SERIAL_HINT = "--date-numbers serials reads the numbers of date columns as date serials"


def day(year: int, month: int, day_of_month: int) -> int:
    return date(year, month, day_of_month).toordinal()   # R.D. (Python docs, toordinal)


def lines(result) -> list[str]:
    return [str(problem) for problem in result.problems]


# ---------------------------------------------------------------------------------------------
# A crash in one cell is that cell's problem

def failing_for(text: str, monkeypatch, name: str = "endpoint_from_cell"):
    """Make the column reader's cell parser raise ZeroDivisionError for one text."""
    real = getattr(column_reader, name)
    calls: list[object] = []

    def parser(value, settings):
        calls.append(value)
        if value == text:
            raise ZeroDivisionError("division by zero")
        return real(value, settings)

    monkeypatch.setattr(column_reader, name, parser)
    return calls


def test_a_crash_in_one_cell_is_that_cells_problem(monkeypatch):
    calls = failing_for("1666", monkeypatch)
    rows = [("P1", "Odile Varn", "1650", "1700"), ("P2", "Tamsin Crell", "1666", "1720"),
            ("P3", "Bram Oshet", "1680", "1666"), ("P4", "Ysolde Pell", "1650", "1710")]
    table = Table.from_rows("guild.csv", ("id", "name", "born", "died"), rows)
    result = load_records(table, ColumnMap(start="born", end="died", label="name", id="id"))
    assert [r.label for r in result.records] == ["Odile Varn", "Ysolde Pell"]
    assert lines(result) == [
        "guild.csv:3:born: [P2] cannot read '1666': internal error, please report "
        "(ZeroDivisionError: division by zero)",
        "guild.csv:4:died: [P3] cannot read '1666': internal error, please report "
        "(ZeroDivisionError: division by zero)",
    ]
    counts = check(result).counts
    assert (counts.rows_read, counts.drawn, counts.unreadable) == (4, 2, 2)
    # each column is still read whole first, and only after a failure value by value: no
    # value is read more than twice in a column ('1710' comes after the fault in 'died')
    assert calls.count("1650") == 2 and calls.count("1710") == 1


def test_a_crash_in_a_when_cell_is_that_cells_problem(monkeypatch):
    failing_for("1650s", monkeypatch, "span_from_cell")
    table = Table.from_rows("events.csv", ("event", "when"),
                            [("Fire", "1650s"), ("Flood", "1662"), ("Fair", "1650s")])
    result = load_records(table, ColumnMap(when="when", label="event"))
    assert [r.label for r in result.records] == ["Flood"]
    assert lines(result)[0] == ("events.csv:2:when: cannot read '1650s': internal error, "
                                "please report (ZeroDivisionError: division by zero)")
    assert len(result.problems) == 2


def test_a_crash_joining_start_and_end_is_the_rows_problem(monkeypatch):
    real = records_module.checked_span

    def joining(start, end):
        if start.earliest == day(1666, 1, 1):
            raise RuntimeError("bad join")
        return real(start, end)

    monkeypatch.setattr(records_module, "checked_span", joining)
    table = Table.from_rows("t.csv", ("born", "died"), [("1650", "1700"), ("1666", "1720")])
    result = load_records(table, ColumnMap(start="born", end="died"))
    assert len(result.records) == 1
    assert lines(result) == ["t.csv:3:died: cannot read '1720': internal error, please "
                             "report (RuntimeError: bad join)"]


def test_check_reports_a_crashing_cell_and_exits_1(tmp_path, monkeypatch, capsys):
    failing_for("c. 1666", monkeypatch)
    path = tmp_path / "guild.csv"
    path.write_text("name,born,died\nOdile Varn,1650,1700\nTamsin Crell,c. 1666,1720\n",
                    encoding="utf-8")
    code = main(["check", str(path)])
    out = capsys.readouterr().out
    assert code == 1
    assert ("guild.csv:3:born: cannot read 'c. 1666': internal error, please report "
            "(ZeroDivisionError: division by zero)") in out.splitlines()
    assert "2 rows read: 1 drawn, 1 reported (1 unreadable)" in out


# ---------------------------------------------------------------------------------------------
# Workbooks written by openpyxl

def workbook(path: Path, rows: list[list[object]], *, formats: dict[str, str] | None = None,
             epoch=None, merged: tuple[str, ...] = (), title: str = "People") -> Path:
    """One sheet of `rows`; `formats` gives cells (e.g. 'B2') a number format."""
    book = openpyxl.Workbook()
    if epoch is not None:
        book.epoch = epoch
    sheet = book.active
    sheet.title = title
    for row in rows:
        sheet.append(row)
    for reference, number_format in (formats or {}).items():
        sheet[reference].number_format = number_format
    for block in merged:
        sheet.merge_cells(block)
    book.save(path)
    return path


def test_a_general_number_that_looks_like_a_serial_is_refused_with_its_day(tmp_path):
    path = workbook(tmp_path / "serials.xlsx", [
        ["name", "born", "died"], ["Odile Varn", 1650, 1702], ["Tamsin Crell", 39448, None],
        ["Bram Oshet", 39448.75, 3000000]])
    result = read_records(path)
    assert [r.label for r in result.records] == ["Odile Varn"]
    assert lines(result) == [
        "serials.xlsx:3:born: cannot read '39448': 39448 looks like a date serial (2008-01-01 "
        f"in Excel's 1900 date system), not a year ({SERIAL_HINT})",
        "serials.xlsx:4:born: cannot read '39448.75': 39448.75 looks like a date serial "
        f"(2008-01-01 18:00:00 in Excel's 1900 date system), not a year ({SERIAL_HINT})",
        "serials.xlsx:4:died: cannot read '3000000': a year of more than four digits is "
        "written as text with a sign (+12000) or an era (12000 BC)",
    ]


def test_numbers_read_as_serials_on_request(tmp_path):
    path = workbook(tmp_path / "serials.xlsx", [
        ["name", "born"], ["A", 39448], ["B", 1650], ["C", 61], ["D", 59], ["E", 60],
        ["F", 0.5], ["G", -3], ["H", 2958465], ["I", 2958466], ["J", "c. 1650"]])
    result = read_records(path, date_numbers="serials")
    starts = {r.label: r.span.start.earliest for r in result.records}
    assert starts["A"] == day(2008, 1, 1)                   # Microsoft's published value
    for label, serial in (("B", 1650), ("C", 61), ("G", -3), ("H", 2958465)):   # openpyxl agrees
        assert starts[label] == from_excel(serial).date().toordinal(), label
    assert starts["C"] == day(1900, 3, 1) and starts["D"] == day(1900, 2, 28)
    assert starts["J"] == day(1645, 1, 1)                   # text is read as text
    assert lines(result) == [
        "serials.xlsx:6:born: cannot read '1900-02-29': 1900-02-29 did not exist (1900 was "
        "not a leap year); Excel counts it as serial 60 to match Lotus 1-2-3 (correct the "
        "date in the spreadsheet)",
        "serials.xlsx:7:born: cannot read '12:00:00': a time of day with no date",
        "serials.xlsx:10:born: cannot read '2958466': 2958466 is not a day of Excel's 1900 "
        "date system (AD 1 to 9999)",
    ]


def test_date_numbers_must_be_years_or_serials():
    table = Table.from_rows("t.csv", ("born",), [("1650",)])
    with pytest.raises(UsageError, match="date numbers are read as years or serials"):
        load_records(table, ColumnMap(start="born"), date_numbers="days")


def test_text_tables_have_no_serials(tmp_path):
    # A CSV cell is text: '39448' is read by the date language, whatever date_numbers says.
    path = tmp_path / "t.csv"
    path.write_text("name,born\nOdile,39448\nTamsin,1650\n", encoding="utf-8")
    for reading in ("years", "serials"):
        result = read_records(path, date_numbers=reading)
        assert [r.label for r in result.records] == ["Tamsin"]
        assert "a year of more than four digits" in lines(result)[0]


def test_date_formatted_cells_are_read_as_dates(tmp_path):
    # Days before 1900 are negative serials, as openpyxl (and pandas through it) writes them.
    path = workbook(tmp_path / "dated.xlsx", [["name", "born"], ["Odile", datetime(1901, 3, 4)],
                                              ["Tamsin", datetime(2008, 1, 1, 18, 0)],
                                              ["Bram", datetime(1650, 3, 4)]])
    with zipfile.ZipFile(path) as archive:
        assert b"<v>-91246</v>" in archive.read("xl/worksheets/sheet1.xml")
    table = read_table(path)
    assert table.columns[1] == [datetime(1901, 3, 4), datetime(2008, 1, 1, 18, 0),
                                datetime(1650, 3, 4)]
    first, second, third = read_records(path).records
    assert first.span.start.earliest == day(1901, 3, 4)
    assert second.start_text == "2008-01-01 18:00:00"
    assert third.span.start.earliest == day(1650, 3, 4)


def test_serial_60_formatted_as_a_date_is_a_day_that_did_not_exist(tmp_path):
    path = workbook(tmp_path / "leap.xlsx", [["name", "born"], ["A", 59], ["B", 60], ["C", 61]],
                    formats={f"B{row}": "yyyy-mm-dd" for row in (2, 3, 4)})
    # openpyxl turns serials 59 and 60 into the same day: the reason for our own reader
    loaded = openpyxl.load_workbook(path).active
    assert loaded["B2"].value == loaded["B3"].value == datetime(1900, 2, 28)
    table = read_table(path)
    assert table.columns[1][0] == datetime(1900, 2, 28)
    assert table.columns[1][2] == datetime(1900, 3, 1)
    assert str(table.columns[1][1]) == "1900-02-29"          # as the spreadsheet shows it
    result = read_records(path)
    assert [r.label for r in result.records] == ["A", "C"]
    assert lines(result) == [
        "leap.xlsx:3:born: cannot read '1900-02-29': 1900-02-29 did not exist (1900 was not a "
        "leap year); Excel counts it as serial 60 to match Lotus 1-2-3 (correct the date in "
        "the spreadsheet)"]


def test_the_1904_date_system_is_honoured(tmp_path):
    path = workbook(tmp_path / "mac.xlsx",
                    [["name", "born", "died"], ["A", datetime(2008, 1, 1), 37986],
                     ["B", 0, 1650]],
                    epoch=CALENDAR_MAC_1904, formats={"B3": "yyyy-mm-dd"})
    with zipfile.ZipFile(path) as archive:    # openpyxl wrote a 1904 workbook
        assert b'date1904="1"' in archive.read("xl/workbook.xml")
    table = read_table(path)
    assert table.columns[1] == [datetime(2008, 1, 1), datetime(1904, 1, 1)]
    serial = read_records(path, date_numbers="serials").records
    # 2008-01-01 is 39448 in the 1900 system, 1,462 days fewer in the 1904 one
    assert serial[0].span.end.earliest == day(2008, 1, 1)
    assert serial[1].span.end.earliest == day(1908, 7, 8)      # 1904-01-01 + 1650 days
    assert "(2008-01-01 in Excel's 1904 date system)" in lines(read_records(path))[0]


def test_merged_group_cells_fill_the_rows_they_cover(tmp_path):
    path = workbook(tmp_path / "guild.xlsx", [
        ["name", "born", "died", "group", "notes"],
        ["Odile Varn", 1650, 1702, "North Yard", "heading across"],
        ["Tamsin Crell", 1655, 1710, None, None],
        ["Bram Oshet", 1660, 1720, None, None],
        ["Ysolde Pell", 1670, 1730, "Quay Lane", None],
        ["Anselm Dorr", 1675, 1731, None, None],
        [None, None, None, None, None]],
        merged=("D2:D4", "D5:D9", "E2:F2"))
    result = read_records(path)
    assert [(r.label, r.group) for r in result.records] == [
        ("Odile Varn", "North Yard"), ("Tamsin Crell", "North Yard"),
        ("Bram Oshet", "North Yard"), ("Ysolde Pell", "Quay Lane"), ("Anselm Dorr", "Quay Lane")]
    assert result.rows_read == 5          # the block past the table's end adds no rows
    assert lines(result) == [
        "guild.xlsx:3: note: merged cells: each merged block's value is read in every row it "
        "covers ('group' rows 3–4, 6)"]
    assert read_table(path).header == ("name", "born", "died", "group", "notes")


def test_a_formula_with_no_saved_value_is_reported_as_such(tmp_path):
    path = workbook(tmp_path / "formulas.xlsx", [
        ["name", "born", "died", "group"],
        ["Odile Varn", "=DATE(1650,1,1)", 1702, "North Yard"],
        ["=A4&\" (copy)\"", 1655, 1710, '=D2'],
        ["Bram Oshet", 1660, 1720, '=D2']])
    result = read_records(path)
    assert [(r.label, r.group) for r in result.records] == [("row 3", None), ("Bram Oshet", None)]
    assert lines(result) == [
        "formulas.xlsx:3:name: note: a formula has no saved value (row 3); read as empty "
        "(open and save the file in a spreadsheet program)",
        "formulas.xlsx:3:group: note: 2 formulas have no saved value (rows 3–4); read as "
        "empty (open and save the file in a spreadsheet program)",
        "formulas.xlsx:2:born: cannot read '=DATE(1650,1,1)': a formula with no saved value "
        "(open and save the file in a spreadsheet program)",
    ]


def test_error_values_are_reported_in_date_columns_and_shown_elsewhere(tmp_path):
    path = workbook(tmp_path / "errors.xlsx", [
        ["name", "born", "group"], ["Odile Varn", "#DIV/0!", "North Yard"],
        ["Tamsin Crell", 1655, "#N/A"]])
    result = read_records(path)
    assert [(r.label, r.group) for r in result.records] == [("Tamsin Crell", "#N/A")]
    assert lines(result) == ["errors.xlsx:2:born: cannot read '#DIV/0!': the spreadsheet shows "
                             "the error #DIV/0!, not a value (correct the cell in the spreadsheet)"]


def test_an_empty_sheet_names_the_sheets(tmp_path):
    book = openpyxl.Workbook()
    book.active.title = "Cover"
    book.create_sheet("People").append(["name", "born"])
    book.create_sheet("Blank")
    path = tmp_path / "book.xlsx"
    book.save(path)
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert str(caught.value) == ("book.xlsx: the sheet 'Cover' is empty; the sheets are 'Cover' "
                                 "(empty), 'People' (holds data), 'Blank' (empty)")
    assert caught.value.hint == "choose a sheet that holds data, e.g. --sheet 'People'"
    with pytest.raises(SourceError, match="the sheet 'Blank' is empty") as caught:
        read_table(path, sheet="Blank")


def test_a_workbook_with_no_data_says_so(tmp_path):
    path = tmp_path / "blank.xlsx"
    openpyxl.Workbook().save(path)
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert str(caught.value) == ("blank.xlsx: the sheet 'Sheet' is empty; the sheets are "
                                 "'Sheet' (empty)")
    assert caught.value.hint == "no sheet holds data: is this the file you meant?"


def test_cells_agree_with_openpyxl(tmp_path):
    # The outside reader for ordinary cells: text, whole and decimal numbers, true/false,
    # dates and date-times, blanks inside a row.
    rows = [["id", "name", "born", "weight", "living", "seen"]]
    for number in range(1, 60):
        rows.append([f"P{number}", f"Person {number} Varn" if number % 7 else None,
                     1600 + number, number / 8, number % 3 == 0,
                     datetime(1870 + number, 1 + number % 12, 1 + number % 28, number % 24)])
    path = workbook(tmp_path / "agree.xlsx", rows)
    theirs = list(openpyxl.load_workbook(path, read_only=True).active.values)
    ours = read_table(path)
    assert len(ours.rows) == len(theirs) - 1
    for mine, their in zip(ours.rows, theirs[1:]):
        assert mine == tuple("" if value is None else value for value in their)


# ---------------------------------------------------------------------------------------------
# Workbooks written part by part

WORKBOOK_NS = ('xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" '
               'xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"')
RELATIONSHIPS = "http://schemas.openxmlformats.org/officeDocument/2006/relationships"


def handmade_xlsx(path: Path, sheet_data: str, *, shared: str = "", before_data: str = "",
                  after_data: str = "") -> Path:
    """A minimal workbook (ECMA-376 Part 1) with one sheet 'Data'; style 1 is a date format."""
    relation = "http://schemas.openxmlformats.org/package/2006/relationships"
    parts = {
        "[Content_Types].xml": (
            '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">'
            '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.'
            'relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>'
            '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-'
            'officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/worksheets/'
            'sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml'
            '.worksheet+xml"/><Override PartName="/xl/styles.xml" ContentType="application/vnd.'
            'openxmlformats-officedocument.spreadsheetml.styles+xml"/><Override PartName="/xl/'
            'sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.'
            'spreadsheetml.sharedStrings+xml"/></Types>'),
        "_rels/.rels": (f'<Relationships xmlns="{relation}"><Relationship Id="rId1" '
                        f'Type="{RELATIONSHIPS}/officeDocument" Target="xl/workbook.xml"/>'
                        '</Relationships>'),
        "xl/workbook.xml": (f'<workbook {WORKBOOK_NS}><sheets><sheet name="Data" sheetId="1" '
                            'r:id="rId1"/></sheets></workbook>'),
        "xl/_rels/workbook.xml.rels": (
            f'<Relationships xmlns="{relation}">'
            f'<Relationship Id="rId1" Type="{RELATIONSHIPS}/worksheet" '
            'Target="worksheets/sheet1.xml"/>'
            f'<Relationship Id="rId2" Type="{RELATIONSHIPS}/styles" Target="styles.xml"/>'
            f'<Relationship Id="rId3" Type="{RELATIONSHIPS}/sharedStrings" '
            'Target="/xl/sharedStrings.xml"/></Relationships>'),
        "xl/styles.xml": (f'<styleSheet {WORKBOOK_NS}><cellXfs count="2"><xf numFmtId="0"/>'
                          '<xf numFmtId="14"/></cellXfs></styleSheet>'),
        "xl/sharedStrings.xml": f'<sst {WORKBOOK_NS}>{shared}</sst>',
        "xl/worksheets/sheet1.xml": (f'<worksheet {WORKBOOK_NS}>{before_data}<sheetData>'
                                     f'{sheet_data}</sheetData>{after_data}</worksheet>'),
    }
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as archive:
        for name, text in parts.items():
            archive.writestr(name, text)
    return path


@pytest.mark.filterwarnings("ignore:Workbook contains no default style")   # openpyxl's, below
def test_shared_rich_and_escaped_text_formulas_and_booleans(tmp_path):
    shared = ('<si><t>name</t></si><si><t>born</t></si>'
              '<si><r><t>Odile </t></r><r><rPr><b/></rPr><t>Varn</t></r>'
              '<rPh sb="0" eb="1"><t>ignored</t></rPh></si>'
              '<si><t xml:space="preserve">Line_x000D_two _x005F_x0041_</t></si>')
    path = handmade_xlsx(tmp_path / "hand.xlsx", (
        '<row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" t="s"><v>1</v></c></row>'
        '<row r="2"><c r="A2" t="s"><v>2</v></c><c r="B2"><f>1600+50</f><v>1650</v></c>'
        '<c r="C2" t="b"><v>1</v></c></row>'
        '<row r="3"><c r="A3" t="s"><v>3</v></c><c r="B3" s="1"><v>39448</v></c>'
        '<c r="C3" t="str"><f>""</f><v></v></c></row>'), shared=shared)
    table = read_table(path)
    assert table.header == ("name", "born", "column 3")
    # _xHHHH_ writes a character XML cannot hold; _x005F_ an underscore (ECMA-376 Part 1,
    # 22.9.2.19 ST_Xstring, from memory)
    assert table.rows == (("Odile Varn", 1650, True), ("Line\rtwo _x0041_", datetime(2008, 1, 1), ""))
    loaded = openpyxl.load_workbook(path).active        # openpyxl reads the same file
    assert loaded["B3"].value == datetime(2008, 1, 1) and loaded["C2"].value is True


def test_a_forged_dimension_is_not_trusted(tmp_path):
    path = handmade_xlsx(tmp_path / "forged.xlsx", (
        '<row r="1"><c r="A1" t="inlineStr"><is><t>name</t></is></c>'
        '<c r="B1" t="inlineStr"><is><t>born</t></is></c></row>'
        '<row r="2"><c r="A2" t="inlineStr"><is><t>Odile Varn</t></is></c><c r="B2"><v>1650</v>'
        '</c></row>'), before_data='<dimension ref="A1:XFD1048576"/>')
    assert path.stat().st_size < 5_000
    tracemalloc.start()
    started = time.perf_counter()
    table = read_table(path)
    elapsed = time.perf_counter() - started
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    assert table.rows == (("Odile Varn", 1650),)
    assert elapsed < 2 and peak < 20_000_000


def test_a_value_in_the_last_cell_is_refused_naming_the_size(tmp_path):
    book = openpyxl.Workbook()
    book.active.append(["name", "born"])
    book.active.append(["Odile Varn", 1650])
    book.active["XFD1048576"] = "stray"
    path = tmp_path / "stray.xlsx"
    book.save(path)
    assert path.stat().st_size < 10_000
    tracemalloc.start()
    with pytest.raises(SourceError) as caught:
        read_table(path)
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    assert str(caught.value) == (
        "stray.xlsx: the sheet 'Sheet' has values as far as cell XFD1048576: 1,048,576 rows by "
        "16,384 columns, 17,179,869,184 cells, more than timelines reads (50,000,000)")
    assert "Ctrl+End" in caught.value.hint
    assert peak < 20_000_000


def test_a_zip_bomb_is_refused_before_it_is_read(tmp_path):
    path = handmade_xlsx(tmp_path / "bomb.xlsx", "")
    # The sheet part rewritten: 120 MB of empty rows, packed about 1,000 to 1.
    with zipfile.ZipFile(path) as source:
        parts = {name: source.read(name) for name in source.namelist()}
    sheet = parts.pop("xl/worksheets/sheet1.xml").decode()
    opening, closing = sheet.split("<sheetData>")[0], "</sheetData></worksheet>"
    block = "<row/>" * 200_000                                   # 1.2 MB
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as archive:
        for name, data in parts.items():
            archive.writestr(name, data)
        with archive.open("xl/worksheets/sheet1.xml", "w", force_zip64=True) as stream:
            stream.write((opening + "<sheetData>").encode())
            for _ in range(100):
                stream.write(block.encode())
            stream.write(closing.encode())
    assert path.stat().st_size < 500_000
    started = time.perf_counter()
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert time.perf_counter() - started < 1
    message = str(caught.value)
    assert message.startswith("bomb.xlsx: the sheet 'Data' would expand from ")
    assert " to 120.0 MB (" in message
    assert message.endswith("more than timelines reads (1.0 GB; 100.0 MB when packed more than "
                            "100 to 1)")


def test_a_part_over_the_absolute_limit_is_refused(tmp_path, monkeypatch):
    monkeypatch.setattr(sheet_limits, "MAX_PART_BYTES", 1_000)
    path = handmade_xlsx(tmp_path / "large.xlsx", "<row r='1'><c r='A1'><v>1650</v></c></row>"
                         * 40)
    with pytest.raises(SourceError, match=r"^large.xlsx: the sheet 'Data' would expand from "):
        read_table(path)


def test_an_entity_expansion_bomb_is_refused(tmp_path):
    laughs = ('<!DOCTYPE sst [<!ENTITY a "aaaaaaaaaa">'
              + "".join(f'<!ENTITY {chr(98 + n)} "{("&" + chr(97 + n) + ";") * 10}">'
                        for n in range(8)) + ']>')
    path = handmade_xlsx(tmp_path / "laughs.xlsx",
                         '<row r="1"><c r="A1" t="s"><v>0</v></c></row>', shared="<si><t>&i;</t></si>")
    with zipfile.ZipFile(path) as source:
        parts = {name: source.read(name) for name in source.namelist()}
    parts["xl/sharedStrings.xml"] = (laughs + parts["xl/sharedStrings.xml"].decode()).encode()
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as archive:
        for name, data in parts.items():
            archive.writestr(name, data)
    with pytest.raises(SourceError, match="^laughs.xlsx: cannot open it as a spreadsheet"):
        read_table(path)


# ---------------------------------------------------------------------------------------------
# OpenDocument spreadsheets

ODS_NAMESPACES = (
    'xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0" '
    'xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0" '
    'xmlns:text="urn:oasis:names:tc:opendocument:xmlns:text:1.0" '
    'xmlns:calcext="urn:org:documentfoundation:names:experimental:calc:xmlns:calcext:1.0" '
    'office:version="1.2"')


def handmade_ods(path: Path, tables: str, settings: str = "") -> Path:
    """A minimal OpenDocument spreadsheet (OpenDocument 1.2 Part 3: mimetype first, stored)."""
    content = (f'<office:document-content {ODS_NAMESPACES}><office:body><office:spreadsheet>'
               f'{settings}{tables}</office:spreadsheet></office:body></office:document-content>')
    manifest = ('<manifest:manifest xmlns:manifest="urn:oasis:names:tc:opendocument:xmlns:'
                'manifest:1.0"><manifest:file-entry manifest:full-path="/" manifest:media-type='
                '"application/vnd.oasis.opendocument.spreadsheet"/><manifest:file-entry '
                'manifest:full-path="content.xml" manifest:media-type="text/xml"/>'
                '</manifest:manifest>')
    with zipfile.ZipFile(path, "w") as archive:
        archive.writestr("mimetype", "application/vnd.oasis.opendocument.spreadsheet")
        archive.writestr("content.xml", content, zipfile.ZIP_DEFLATED)
        archive.writestr("META-INF/manifest.xml", manifest, zipfile.ZIP_DEFLATED)
    return path


def text_cell(text: str, extra: str = "") -> str:
    return (f'<table:table-cell office:value-type="string" {extra}><text:p>{text}</text:p>'
            '</table:table-cell>')


def number_cell(number: float, extra: str = "") -> str:
    return (f'<table:table-cell office:value-type="float" office:value="{number}" {extra}>'
            f'<text:p>{number}</text:p></table:table-cell>')


def ods_row(*cells: str, extra: str = "") -> str:
    return f'<table:table-row {extra}>{"".join(cells)}</table:table-row>'


def test_ods_merged_cells_formulas_errors_and_repeats(tmp_path):
    covered = "<table:covered-table-cell/>"
    rows = "".join([
        ods_row(text_cell("name"), text_cell("born"), text_cell("group")),
        ods_row(text_cell("Odile Varn"), number_cell(1650),
                text_cell("North Yard", 'table:number-rows-spanned="2"')),
        ods_row(text_cell("Tamsin  Crell"), number_cell(1655), covered),
        ods_row(text_cell("Bram Oshet"), '<table:table-cell table:formula="of:=1600+60"/>',
                text_cell("Quay Lane")),
        ods_row(text_cell("Ysolde Pell"), '<table:table-cell office:value-type="float" '
                'office:value="0" calcext:value-type="error" table:formula="of:=1/0">'
                '<text:p>#DIV/0!</text:p></table:table-cell>', text_cell("Quay Lane")),
        ods_row(text_cell("Anselm Dorr"), number_cell(1670), text_cell("Mill Row"),
                extra='table:number-rows-repeated="2"'),
        ods_row('<table:table-cell table:number-columns-repeated="1024"/>',
                extra='table:number-rows-repeated="1048570"'),
    ]).replace("Tamsin  Crell", 'Tamsin<text:s/> Crell')
    path = handmade_ods(tmp_path / "guild.ods",
                        f'<table:table table:name="People">{rows}</table:table>')
    table = read_table(path)
    assert table.row_count == 6 and table.rows[1][0] == "Tamsin  Crell"
    result = read_records(path)
    assert [(r.label, r.group, r.provenance.row) for r in result.records] == [
        ("Odile Varn", "North Yard", 2), ("Tamsin  Crell", "North Yard", 3),
        ("Anselm Dorr", "Mill Row", 6), ("Anselm Dorr", "Mill Row", 7)]
    assert lines(result) == [
        "guild.ods:3: note: merged cells: each merged block's value is read in every row it "
        "covers ('group' row 3)",
        "guild.ods:4:born: cannot read 'of:=1600+60': a formula with no saved value (open and "
        "save the file in a spreadsheet program)",
        "guild.ods:5:born: cannot read '#DIV/0!': the spreadsheet shows the error #DIV/0!, not "
        "a value (correct the cell in the spreadsheet)",
    ]


def test_ods_repetition_bombs_are_refused_naming_the_size(tmp_path):
    many = ods_row('<table:table-cell table:number-columns-repeated="16384" '
                   'office:value-type="string"><text:p>x</text:p></table:table-cell>',
                   extra='table:number-rows-repeated="1048576"')
    path = handmade_ods(tmp_path / "bomb.ods", f'<table:table table:name="S">{many}</table:table>')
    assert path.stat().st_size < 2_000
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert str(caught.value) == (
        "bomb.ods: the sheet 'S' has values as far as cell XFD1048576: 1,048,576 rows by 16,384 "
        "columns, 17,179,869,184 cells, more than timelines reads (50,000,000)")
    wide = ods_row(text_cell("x", 'table:number-columns-repeated="1000000000"'))
    path = handmade_ods(tmp_path / "wide.ods", f'<table:table table:name="S">{wide}</table:table>')
    with pytest.raises(SourceError, match="row 1 of the sheet 'S' has values beyond column 16,384"):
        read_table(path)


def test_ods_null_date_and_dates(tmp_path):
    rows = "".join([
        ods_row(text_cell("name"), text_cell("born")),
        ods_row(text_cell("A"), '<table:table-cell office:value-type="date" '
                'office:date-value="1650-03-04"/>'),
        ods_row(text_cell("B"), '<table:table-cell office:value-type="date" '
                'office:date-value="-0043-03-15"/>'),
        ods_row(text_cell("C"), number_cell(39448))])
    settings = ('<table:calculation-settings><table:null-date table:date-value="1904-01-01"/>'
                '</table:calculation-settings>')
    path = handmade_ods(tmp_path / "dates.ods", f'<table:table table:name="D">{rows}</table:table>',
                        settings)
    result = read_records(path, date_numbers="serials")
    assert [(r.label, r.span.start.earliest) for r in result.records] == [
        ("A", day(1650, 3, 4)), ("C", day(2012, 1, 2))]       # 1904-01-01 + 39448 days
    assert lines(result) == [
        "dates.ods:3:born: cannot read '-0043-03-15': a date cell before AD 1 (or after 9999) "
        "is not read: which year it means depends on the program that wrote it (write it as "
        "text, such as '44 BC')"]


def test_ods_empty_sheet_names_the_sheets(tmp_path):
    path = tmp_path / "book.ods"
    with pd.ExcelWriter(path, engine="odf") as writer:
        pd.DataFrame({"name": ["Odile Varn"], "born": [1650]}).to_excel(
            writer, sheet_name="People", index=False)
        pd.DataFrame().to_excel(writer, sheet_name="Empty", index=False)
    with pytest.raises(SourceError) as caught:
        read_table(path, sheet="Empty")
    assert str(caught.value) == ("book.ods: the sheet 'Empty' is empty; the sheets are 'People' "
                                 "(holds data), 'Empty' (empty)")


def test_ods_cells_agree_with_pandas_and_odfpy(tmp_path):
    # The outside reader: pandas with odfpy, on a file odfpy wrote.
    frame = pd.DataFrame({"id": [f"P{n}" for n in range(1, 40)],
                          "name": [f"Person {n} Varn" if n % 5 else "" for n in range(1, 40)],
                          "born": [1600 + n for n in range(1, 40)],
                          "weight": [n / 8 for n in range(1, 40)],
                          "seen": [datetime(1900 + n, 1 + n % 12, 1 + n % 28) for n in range(1, 40)]},
                         dtype=object)
    path = tmp_path / "agree.ods"
    frame.to_excel(path, engine="odf", index=False)
    theirs = pd.read_excel(path, engine="odf", header=None, dtype=object, na_filter=False)
    ours = read_table(path)
    assert ours.header == tuple(theirs.iloc[0])
    assert len(ours.rows) == len(theirs) - 1
    for mine, (_, their) in zip(ours.rows, theirs.iloc[1:].iterrows()):
        expected = tuple(value.to_pydatetime() if hasattr(value, "to_pydatetime") else value
                         for value in their)
        assert mine == expected


# ---------------------------------------------------------------------------------------------
# A lone surrogate (a DataFrame's string may hold one: it has no UTF-8 form)

def test_a_lone_surrogate_in_a_label_is_drawn_in_every_format(tmp_path):
    import json
    import re
    import xml.etree.ElementTree as ET

    from timelines import Chart

    frame = pd.DataFrame({"name": ["Ann\ud800e Varn", "Bo Lisk"], "start": ["1700", "1701"],
                          "end": ["1710", "1712"]}, dtype=object)
    chart = Chart(frame)
    for suffix in ("svg", "png", "pdf", "html"):
        chart.save(tmp_path / f"chart.{suffix}")            # measured and written, no error
    svg = ET.parse(tmp_path / "chart.svg").getroot()
    texts = [element.text for element in svg.iter() if element.tag.endswith("text")]
    assert "Anne Varn" in texts                    # drawn without the code point, as XML needs
    page = (tmp_path / "chart.html").read_text(encoding="utf-8")
    block = re.search(r'id="tl-data">(.*?)</script>', page, re.S).group(1)
    assert "Ann\ud800e Varn" in json.loads(block)["records"]["label"]   # escaped, kept whole
