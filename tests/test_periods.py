"""Named periods and reigns from the user's own table (issue 16): labels, aliases, parts,
`reign of X`, regnal years, and the table's rows and files.

The periods and rulers are invented (test data for our own table format). Oracles: Python's
`datetime.date.toordinal()` (proleptic Gregorian R.D.) and convertdate's `julian` module
(JD at midnight = JDN - 0.5) for Julian days. The convention that decides a regnal year is
named beside its checks: the first regnal year begins on the accession day and each later one
on its anniversary (English practice; Cheney, *Handbook of Dates*, from memory).
"""
from __future__ import annotations

import datetime
from pathlib import Path

import openpyxl
import pytest
from convertdate import julian as cd_julian

from timelines.calendar import JD_OFFSET
from timelines.dates import DEFAULT_SETTINGS, DateError, DateSettings, parse_endpoint, trace
from timelines.dates.parts import part_from_words, part_of
from timelines.dates.periods import (
    Period, PeriodTable, period_key, periods_from_rows, read_period, regnal_year,
)
from timelines.dates.reasons import Unreadable
from timelines.errors import SourceError
from timelines.model import Endpoint, Precision, Qualifier
from timelines.sources.periods import read_periods_file

EXAMPLE = Path(__file__).resolve().parent.parent / "docs" / "examples" / "periods.csv"
GREGORIAN = DateSettings(calendar="gregorian")

ROWS = [
    {"label": "Bronze Age", "start": "c. 3300 BC", "end": "1200 BC"},
    {"label": "Long Peace", "start": "1300", "end": "1399", "aliases": "the Quiet Century"},
    {"label": "Aldric II", "start": "1102-03-14", "end": "1130-07-01", "kind": "reign",
     "aliases": "Aldric the Younger; the Younger King"},
    {"label": "Tovan the Fair", "start": "1155", "end": "1181", "kind": "Reign",
     "aliases": "Tovan | Tovan I"},
    {"label": "Queen Maelis", "start": "14 March 1102", "end": "1120", "kind": "reign"},
    {"label": "Orrin", "start": "1 March 2 BC", "end": "AD 10", "kind": "reign"},
    {"label": "Edda", "start": "1104-02-29", "end": "1112", "kind": "reign"},
    {"label": "", "start": "", "end": ""},                                   # a blank row
]


def gregorian(year: int, month: int, day: int) -> int:
    return datetime.date(year, month, day).toordinal()


def julian(year: int, month: int, day: int) -> int:
    """R.D. of a Julian date by convertdate (its JD is at midnight: JDN - 0.5)."""
    return int(cd_julian.to_jd(year, month, day) + 0.5) - JD_OFFSET


def window(earliest: int, latest: int) -> tuple[int, int]:
    return earliest, latest


def bounds(endpoint: Endpoint) -> tuple[int | None, int | None]:
    return endpoint.earliest, endpoint.latest


@pytest.fixture(scope="module")
def table() -> PeriodTable:
    return periods_from_rows(ROWS, DEFAULT_SETTINGS, "periods.csv")


@pytest.fixture(scope="module")
def gregorian_table() -> PeriodTable:
    """The same rows, their dates read in the proleptic Gregorian calendar."""
    return periods_from_rows(ROWS, GREGORIAN, "periods.csv")


def read(text: str, table: PeriodTable, settings: DateSettings = DEFAULT_SETTINGS):
    return read_period(text, table, settings)


# Labels and aliases -------------------------------------------------------------------------

def test_a_label_is_the_window_from_the_earliest_start_to_the_latest_end(table):
    found = read("Bronze Age", table)
    assert bounds(found) == (parse_endpoint("c. 3300 BC").earliest,
                             parse_endpoint("1200 BC").latest)
    # c. 3300 BC widens by 5 years (circa setting): 3305 BC; 1200 BC ends on its 31 December.
    assert bounds(found) == window(julian(-3304, 1, 1), julian(-1199, 12, 31))
    assert found.precision == Precision.YEAR
    assert found.qualifiers == {Qualifier.APPROXIMATE}
    assert bounds(read("Aldric II", table)) == window(gregorian(1102, 3, 14),
                                                      gregorian(1130, 7, 1))


NAMES = [
    ("Bronze Age", "Bronze Age"),
    ("bronze age", "Bronze Age"),
    ("BRONZE   AGE", "Bronze Age"),
    ("the Bronze Age", "Bronze Age"),
    ("Quiet Century", "Long Peace"),
    ("the quiet century", "Long Peace"),
    ("Aldric the Younger", "Aldric II"),
    ("Younger King", "Aldric II"),
    ("tovan", "Tovan the Fair"),
    ("Tovan I", "Tovan the Fair"),
]


def test_name_table_has_no_repeated_case():
    assert len({text for text, _ in NAMES}) == len(NAMES)


@pytest.mark.parametrize("text, label", NAMES)
def test_labels_and_aliases_in_any_case_and_spacing(table, text, label):
    assert read(text, table) == table.find(label).window


@pytest.mark.parametrize("text", ["1650", "3 March 1650", "March", "Age", "Bronze", "Aldric",
                                  "reign of Aldric", "3 Aldric", "year 3 of Aldric III", ""])
def test_texts_that_name_no_period_are_left_to_the_date_forms(table, text):
    assert read(text, table) is None


def test_an_empty_table_names_nothing():
    assert read_period("Bronze Age", PeriodTable(), DEFAULT_SETTINGS) is None


def test_the_table_is_frozen_hashable_and_equal_by_its_periods(table):
    again = periods_from_rows(ROWS, DEFAULT_SETTINGS, "periods.csv")
    assert again == table and hash(again) == hash(table)
    assert {table: 1}[again] == 1
    with pytest.raises(AttributeError):
        table.periods = ()
    assert period_key("  The  Younger\u00a0King ") == "younger king"


def test_a_table_refuses_two_periods_of_one_name(table):
    with pytest.raises(ValueError, match="'tovan' names two periods"):
        edda = table.find("Edda")
        PeriodTable((table.find("Tovan"), Period("tovan", (), edda.start, edda.end)))


# early, mid, late: parts.py's thirds on the period's window ---------------------------------

def test_thirds_of_a_period_are_thirds_of_its_months(gregorian_table):
    """The early-mid-late setting's thirds, as for centuries; a year-precise window is cut
    into months: 1300-1399 is 1200 months, 400 each."""
    period = read("Long Peace", gregorian_table, GREGORIAN)
    parts = {word: bounds(part_of(period, part_from_words(word), "gregorian", GREGORIAN))
             for word in ("early", "mid", "late")}
    assert parts == {"early": (gregorian(1300, 1, 1), gregorian(1333, 4, 30)),
                     "mid": (gregorian(1333, 5, 1), gregorian(1366, 8, 31)),
                     "late": (gregorian(1366, 9, 1), gregorian(1399, 12, 31))}
    early = part_of(period, part_from_words("early"), "gregorian", GREGORIAN)
    assert early.has(Qualifier.CONVENTION_DEPENDENT)


def test_the_early_third_of_a_reign_begins_on_the_accession_day(table):
    reign = read("reign of Aldric II", table)
    early = part_of(reign, part_from_words("early"), DEFAULT_SETTINGS.reckoning,
                    DEFAULT_SETTINGS)
    late = part_of(reign, part_from_words("late"), DEFAULT_SETTINGS.reckoning,
                   DEFAULT_SETTINGS)
    assert early.earliest == gregorian(1102, 3, 14) and late.latest == gregorian(1130, 7, 1)
    assert early.latest < late.earliest


# reign of X ---------------------------------------------------------------------------------

def test_reign_of_a_ruler_is_the_reign(table):
    assert read("reign of Aldric II", table) == read("Aldric II", table)
    assert read("the reign of Aldric the Younger", table) == read("Aldric II", table)


def test_reign_of_a_period_is_refused(table):
    with pytest.raises(Unreadable, match="'Bronze Age' is a period, not a reign"):
        read("reign of the Bronze Age", table)


# Regnal years -------------------------------------------------------------------------------

# Accession 1102-03-14 (ISO 8601: proleptic Gregorian). Convention: regnal year 1 begins on
# the accession day, year n on its (n - 1)th anniversary (Cheney, *Handbook of Dates*).
YEAR_3 = (gregorian(1104, 3, 14), gregorian(1105, 3, 13))
REGNAL_FORMS = [
    "3 Aldric II", "year 3 of Aldric II", "regnal year 3 of Aldric II", "3rd year of Aldric II",
    "third year of Aldric II", "the third regnal year of Aldric II",
    "3rd regnal year of Aldric II",
    "year 3 of the reign of Aldric II", "3 Aldric the Younger", "3RD YEAR OF ALDRIC II",
]


def test_regnal_form_table_has_no_repeated_case():
    assert len(set(REGNAL_FORMS)) == len(REGNAL_FORMS)


@pytest.mark.parametrize("text", REGNAL_FORMS)
def test_regnal_year_forms(table, text):
    assert bounds(read(text, table)) == YEAR_3


def test_regnal_years_run_from_the_accession_day(table):
    # Year 1 begins on the accession day and ends the day before its first anniversary.
    assert bounds(read("1 Aldric II", table)) == (gregorian(1102, 3, 14), gregorian(1103, 3, 13))
    found = read("3 Aldric II", table)
    assert found.precision == Precision.YEAR
    assert found.qualifiers == {Qualifier.CONVENTION_DEPENDENT}   # other reckonings exist
    assert bounds(read("3 Aldric II", table, GREGORIAN)) == YEAR_3


def test_anniversaries_are_counted_in_the_calendar_of_the_setting(table):
    # 14 March 1102 in the historical calendar is Julian; so are its anniversaries.
    assert bounds(read("3 Queen Maelis", table)) == (julian(1104, 3, 14), julian(1105, 3, 13))


def test_a_year_only_accession_widens_the_regnal_year(gregorian_table):
    # Accession some day of 1155: year 3 begins at the earliest on 1 January 1157 (accession
    # 1 January 1155) and ends at the latest on 30 December 1158 (accession 31 December 1155).
    found = read("3 Tovan", gregorian_table, GREGORIAN)
    assert bounds(found) == (gregorian(1157, 1, 1), gregorian(1158, 12, 30))


def test_the_last_regnal_year_ends_with_the_reign(table):
    # Year 29 began on 1130-03-14; the reign ended on 1130-07-01.
    assert bounds(read("29 Aldric II", table)) == (gregorian(1130, 3, 14), gregorian(1130, 7, 1))


def test_a_regnal_year_beyond_the_reign_is_refused(table):
    with pytest.raises(Unreadable) as caught:
        read("30 Aldric II", table)
    assert caught.value.reason == ("Aldric II reigned 1102-03-14 .. 1130-07-01: at most 29 "
                                   "regnal years, so there is no year 30")
    assert caught.value.fragment == "30"


@pytest.mark.parametrize("text, reason", [
    ("0 Aldric II", "regnal years count from 1"),
    ("year 0 of Aldric II", "regnal years count from 1"),
    ("3th year of Aldric II", "write 3rd, not 3th"),
    ("3 Bronze Age", "'Bronze Age' is a period, not a reign"),
])
def test_a_known_name_used_wrongly_is_refused(table, text, reason):
    with pytest.raises(Unreadable, match=reason):
        read(text, table)


def test_leap_day_accession_keeps_its_anniversary_on_1_march_in_common_years(gregorian_table):
    # Our choice: the anniversary is the same day of the month counted from its first day.
    assert read("2 Edda", gregorian_table, GREGORIAN).earliest == gregorian(1105, 3, 1)
    assert read("5 Edda", gregorian_table, GREGORIAN).earliest == gregorian(1108, 2, 29)


def test_regnal_years_cross_from_bc_to_ad_without_a_year_zero(gregorian_table):
    # 1 March 2 BC + 2 years = 1 March AD 1 (astronomical years -1 .. 1).
    assert bounds(read("3 Orrin", gregorian_table, GREGORIAN)) == (gregorian(1, 3, 1),
                                                                   gregorian(2, 2, 28))


def test_regnal_year_of_a_period_made_in_code():
    reign = Period("Aldric II", (), Endpoint.day(gregorian(1102, 3, 14)),
                   Endpoint.day(gregorian(1130, 7, 1)), is_reign=True)
    assert bounds(regnal_year(reign, 3, GREGORIAN)) == YEAR_3


# Notes for `timelines parse --explain` ------------------------------------------------------

def test_trace_notes_say_where_the_period_came_from(table):
    with trace.collecting() as notes:
        read("Bronze Age", table)
        read("3 Aldric II", table)
    assert notes == [
        ("'Bronze Age': a period from the periods table (row 2 of periods.csv): c. 3300 BC .. "
         "1200 BC: -3305-12-05 .. -1199-12-20"),
        ("year 3 of the reign of Aldric II (accession 1102-03-14): the accession day + 2 years "
         ".. the day before the accession day + 3 years, within the reign: 1104-03-14 .. "
         "1105-03-13"),
    ]


# Rows of the table --------------------------------------------------------------------------

def bad(rows: list[dict]) -> DateError:
    with pytest.raises(DateError) as caught:
        periods_from_rows(rows, DEFAULT_SETTINGS, "periods.csv")
    return caught.value


GOOD = {"label": "Iron Age", "start": "1200 BC", "end": "AD 40"}


def test_a_bad_date_names_file_row_column_and_text():
    error = bad([GOOD, {"Label": "Ashfall", "Start": "c. 18th", "End": "AD 300"}])
    assert (error.source, error.row, error.column, error.text) == (
        "periods.csv", 3, "Start", "c. 18th")
    assert str(error).startswith("periods.csv:3:Start: cannot read 'c. 18th': ")
    assert isinstance(error.__cause__, DateError)


@pytest.mark.parametrize("row, column, text, reason", [
    ({"label": "", "start": "1200", "end": "1300"}, "label", "", "a period needs a label"),
    ({"label": "A", "start": "", "end": "1300"}, "start", "", "a period needs a start"),
    ({"label": "A", "start": "1300", "end": "1200"}, "end", "1200",
     "the end comes before the start '1300'"),
    ({"label": "A", "start": "1200", "end": "after 1300"}, "end", "after 1300",
     "a period's end needs an latest day"),
    ({"label": "A", "start": "before 1200", "end": "1300"}, "start", "before 1200",
     "a period's start needs an earliest day"),
    ({"label": "1650s", "start": "1650", "end": "1659"}, "label", "1650s",
     "reads as a date (1650-01-01..1659-12-31), not as a name"),
    ({"label": "A", "aliases": "B; 1650", "start": "1650", "end": "1659"}, "aliases", "1650",
     "reads as a date (1650-01-01..1650-12-31), not as a name"),
    ({"label": "A", "start": "1200", "end": "1300", "kind": "king"}, "kind", "king",
     "kind is 'reign' or 'period'"),
])
def test_bad_rows_are_refused_with_their_reason(row, column, text, reason):
    error = bad([GOOD, row])
    assert (error.row, error.column, error.text, error.reason) == (3, column, text, reason)


def test_two_rows_of_one_name_are_refused_naming_both():
    error = bad([{**GOOD, "aliases": "Age of Iron"}, GOOD | {"label": "Ashfall"},
                 {"label": "the age of iron", "start": "1", "end": "2"}])
    assert (error.row, error.column, error.text) == (4, "label", "the age of iron")
    assert error.reason == ("row 2 already names a period 'Age of Iron'; two periods cannot "
                            "share a name")


def test_every_bad_row_is_listed_not_only_the_first():
    error = bad([GOOD, {"label": "A", "start": "x", "end": "1"},
                 {"label": "B", "start": "1", "end": "2", "kind": "?"}, GOOD])
    assert error.row == 3 and error.hint.endswith("also row 4 (kind), row 5 (label)")


def test_an_alias_that_repeats_its_own_label_is_harmless():
    periods = periods_from_rows([GOOD | {"aliases": "IRON AGE; Age of Iron"}],
                                DEFAULT_SETTINGS, "periods.csv")
    assert periods.find("iron age") is periods.find("age of iron")


# Files ----------------------------------------------------------------------------------------

CSV = ("Label,START,End,Aliases,Kind,note\n"
       "Bronze Age,c. 3300 BC,1200 BC,,,invented\n"
       "\n"
       "Aldric II,1102-03-14,1130-07-01,Aldric the Younger|Younger King,reign,\n")


def test_a_csv_file_with_headers_in_any_case(tmp_path):
    path = tmp_path / "periods.csv"
    path.write_text(CSV, encoding="utf-8")
    periods = read_periods_file(path)
    assert [period.label for period in periods.periods] == ["Bronze Age", "Aldric II"]
    assert periods.find("younger king").row == 4       # the blank line keeps its number
    assert bounds(read_period("3 Aldric II", periods, DEFAULT_SETTINGS)) == YEAR_3


def test_a_tsv_file_reads_the_same(tmp_path):
    csv_path, tsv_path = tmp_path / "periods.csv", tmp_path / "periods.tsv"
    csv_path.write_text(CSV, encoding="utf-8")
    tsv_path.write_text(CSV.replace(",", "\t"), encoding="utf-8")
    from_csv, from_tsv = read_periods_file(csv_path), read_periods_file(tsv_path)
    assert [p.window for p in from_tsv.periods] == [p.window for p in from_csv.periods]
    assert from_tsv.find("Aldric II").source == "periods.tsv"


def test_an_xlsx_file_reads_its_date_cells(tmp_path):
    book = openpyxl.Workbook()
    book.active.append(["label", "start", "end", "kind"])
    book.active.append(["Aldric II", datetime.datetime(1702, 3, 14), 1730, "reign"])
    book.save(tmp_path / "periods.xlsx")
    periods = read_periods_file(tmp_path / "periods.xlsx")
    assert periods.find("Aldric II").start == Endpoint.day(gregorian(1702, 3, 14))


def test_a_bad_cell_in_a_file_names_its_row_and_column(tmp_path):
    path = tmp_path / "periods.csv"
    path.write_text("label,start,end\nBronze Age,c. 3300 BC,1200 BC\nIron Age,1200 BC,c. 4th\n",
                    encoding="utf-8")
    with pytest.raises(DateError, match=r"^periods.csv:3:end: cannot read 'c. 4th': "):
        read_periods_file(path)


def test_a_file_without_an_end_column_is_refused(tmp_path):
    path = tmp_path / "periods.csv"
    path.write_text("label,start,ende\nBronze Age,c. 3300 BC,1200 BC\n", encoding="utf-8")
    with pytest.raises(SourceError) as caught:
        read_periods_file(path)
    assert str(caught.value) == ("periods.csv: a periods table needs a label, a start and an "
                                 "end column; there is no end column among 'label', 'start', "
                                 "'ende'")
    assert caught.value.hint == "did you mean 'ende'?"


def test_the_example_table_reads():
    periods = read_periods_file(EXAMPLE)
    assert periods.find("Aldric the Younger") is periods.find("Aldric II")
    assert periods.find("Aldric II").is_reign and not periods.find("Bronze Age").is_reign
    assert bounds(read_period("3 Aldric II", periods, DEFAULT_SETTINGS)) == YEAR_3


# --- wired into the date language and the command line ---------------------------------------
def test_period_labels_read_as_dates_through_the_settings():
    from dataclasses import replace

    from timelines.dates import DEFAULT_SETTINGS, parse_span
    from timelines.sources.periods import read_periods_file

    example = Path(__file__).resolve().parent.parent / "docs" / "examples" / "periods.csv"
    table = read_periods_file(example)
    settings = replace(DEFAULT_SETTINGS, periods=table)
    reign = parse_span("reign of Aldric II", settings).start
    assert (reign.earliest, reign.latest) == (_fixed("1102-03-14"), _fixed("1130-07-01"))
    year_3 = parse_span("3 Aldric II", settings).start
    assert (year_3.earliest, year_3.latest) == (_fixed("1104-03-14"), _fixed("1105-03-13"))
    early = parse_span("early Bronze Age", settings).start
    whole = parse_span("Bronze Age", settings).start
    assert early.earliest == whole.earliest and early.latest < whole.latest
    # A range of two labels, and circa around one.
    span = parse_span("reign of Aldric I – reign of Queen Maelis", settings)
    assert span.start.latest < span.end.earliest
    with pytest.raises(DateError):
        parse_span("Bronze Age")            # without the table, no such date


def test_the_command_line_reads_a_periods_file(tmp_path, capsys):
    from timelines.cli import main

    example = Path(__file__).resolve().parent.parent / "docs" / "examples" / "periods.csv"
    assert main(["parse", "--periods", str(example), "--json", "3 Aldric II"]) == 0
    out = capsys.readouterr().out
    assert '"earliest": "1104-03-14"' in out and '"latest": "1105-03-13"' in out


def _fixed(iso: str) -> int:
    return datetime.date.fromisoformat(iso).toordinal()
