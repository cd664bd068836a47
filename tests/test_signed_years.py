"""Years written as bare signed numbers and the year 0 (issue 17, item 2).

The conversions are checked against the calendar's own BC/AD rule, not against our code: BC/AD
counting has no year zero, so 1 BC is followed by AD 1 and the year written -n (n BC) is the
astronomical year 1 - n; astronomers and ISO 8601 count a year 0 (= 1 BC), so their -n is
(n + 1) BC (from memory: Meeus, *Astronomical Algorithms*, ch. 7). Julian Day 0 began on
Julian 1 January 4713 BC (Meeus, ch. 7, from memory; DESIGN §3: JDN = R.D. + 1721425).
convertdate's Gregorian calendar counts astronomical years and checks the ISO reading.
Every table is invented.
"""
from __future__ import annotations

import json

import openpyxl
import pytest
from convertdate import gregorian
from hypothesis import given, strategies as st

from timelines.cli.commands import main
from timelines.dates import (
    DateError, DateSettings, endpoint_from_cell, explain, iso_form, parse_date, parse_span,
    settings_from_options,
)
from timelines.dates.options import SETTING_HELP
from timelines.model import Qualifier
from timelines.sources import ColumnMap, load_records, read_records, read_table

BC = DateSettings()                                          # the default
ASTRONOMICAL = DateSettings(signed_years="astronomical")
ZERO_AS_1BC = DateSettings(year_zero="1bc")
DECIDED = Qualifier.CONVENTION_DEPENDENT
JDN_OF_RD_0 = 1721425                                        # DESIGN §3


def _bounds(endpoint):
    return endpoint.earliest, endpoint.latest


def _rd_of_gregorian(year: int, month: int = 1, day: int = 1) -> int:
    """R.D. of a proleptic Gregorian day, astronomical year, by convertdate (JD at noon)."""
    return int(gregorian.to_jd(year, month, day) + 0.5) - JDN_OF_RD_0


# (text, settings, same bounds as this text read with the default settings, why)
SAME_AS = [
    ("-300", BC, "300 BC", "BC/AD: -300 is 300 BC"),
    ("-25", BC, "25 BC", "BC/AD: -25 is 25 BC"),
    ("-150", BC, "150 BC", "BC/AD"),
    ("-1", BC, "1 BC", "BC/AD: -1 is 1 BC, the year before AD 1"),
    ("-1500", BC, "1500 BC", "four digits unpadded follow the setting too"),
    ("-12000", BC, "12000 BC", "more than four digits too"),
    ("\u2212300", BC, "300 BC", "a typeset minus sign, U+2212"),
    ("-300", ASTRONOMICAL, "-0300", "astronomical: read as ISO 8601 reads -0300"),
    ("-1500", ASTRONOMICAL, "-01500", "EDTF's -1500, ISO's expanded -01500"),
    ("-1", ASTRONOMICAL, "-0001", "astronomical -1 is 2 BC"),
    ("0", ASTRONOMICAL, "0000", "astronomical year 0 is 1 BC"),
    ("0", ZERO_AS_1BC, "1 BC", "year-zero 1bc"),
    ("-0", ZERO_AS_1BC, "1 BC", "a signed zero likewise"),
    ("25", BC, "AD 25", "a short positive year is a year AD"),
    ("150", BC, "AD 150", "likewise"),
    ("+150", BC, "AD 150", "a plus sign on a short year"),
    ("-0300", ASTRONOMICAL, "-0300", "zero-padded: ISO 8601 whatever the setting"),
]


def test_same_as_table_has_no_repeated_case():
    cases = [(text, settings) for text, settings, _, _ in SAME_AS]
    assert len(cases) == len(set(cases))


@pytest.mark.parametrize("text, settings, same, why", SAME_AS)
def test_signed_numbers_read_as_their_written_equivalent(text, settings, same, why):
    assert _bounds(parse_date(text, settings)) == _bounds(parse_date(same)), why


def test_bc_reading_follows_the_calendars_bc_ad_rule_with_no_year_zero():
    # n BC is the astronomical year 1 - n: -300 is the Julian year -299.
    minus_300 = parse_date("-300")
    assert _bounds(minus_300) == _bounds(parse_date("-0299 (Julian)"))
    # 1 BC is followed by AD 1: no year between them.
    assert parse_date("-1").latest + 1 == parse_date("1").earliest
    # Julian Day 0 began on 1 January 4713 BC (Julian): R.D. -1721425.
    assert parse_date("-4713").earliest == -JDN_OF_RD_0


def test_astronomical_reading_is_the_iso_year_by_convertdate():
    for year in (-300, -25, -1, 0, -4712):
        endpoint = parse_date(str(year), ASTRONOMICAL)
        assert endpoint.earliest == _rd_of_gregorian(year)
        assert endpoint.latest == _rd_of_gregorian(year + 1) - 1
    # Astronomical counting has a year 0 between -1 (2 BC) and 1 (AD 1).
    assert parse_date("-1", ASTRONOMICAL).latest + 1 == parse_date("0", ASTRONOMICAL).earliest
    # -300 is 301 BC: a year earlier than the BC/AD reading, a year apart in astronomical years.
    assert parse_date("-300", ASTRONOMICAL).earliest == _rd_of_gregorian(-300)


@given(st.integers(min_value=1, max_value=9999))
def test_every_signed_year_reads_as_n_bc_or_as_the_iso_year(number):
    assert _bounds(parse_date(f"-{number}")) == _bounds(parse_date(f"{number} BC"))
    assert _bounds(parse_date(f"-{number}", ASTRONOMICAL)) == _bounds(
        parse_date(f"-{number:05d}"))


def test_what_the_setting_decided_is_convention_dependent_and_nothing_else():
    for text, settings in (("-300", BC), ("-300", ASTRONOMICAL), ("0", ZERO_AS_1BC),
                           ("0", ASTRONOMICAL), ("c. -300", BC), ("-300?", BC)):
        assert DECIDED in parse_date(text, settings).qualifiers, (text, settings)
    for text in ("-0300", "0000", "25", "+150", "300 BC", "-0043-03-15"):
        assert DECIDED not in parse_date(text).qualifiers, text


def test_a_year_zero_is_reported_never_read_silently():
    for text in ("0", "-0", "+0", "00", "000"):
        with pytest.raises(DateError) as caught:
            parse_date(text)
        assert caught.value.reason == "the year 0 does not exist in BC/AD counting"
        assert "--year-zero 1bc" in caught.value.hint and "1 BC is followed by AD 1" in (
            caught.value.hint)
    with pytest.raises(DateError, match="does not exist"):
        endpoint_from_cell(0)
    with pytest.raises(DateError, match="does not exist"):
        endpoint_from_cell(0.0)


def test_words_marks_and_ranges_around_a_signed_year():
    year = parse_date("-300")
    assert parse_date("-300?").has(Qualifier.UNCERTAIN)
    assert parse_date("c. -300").earliest < year.earliest
    assert parse_date("before -300").latest == year.earliest - 1
    span = parse_span("-300 – -150")
    assert (span.start.earliest, span.end.latest) == (
        parse_date("300 BC").earliest, parse_date("150 BC").latest)
    with pytest.raises(DateError, match="a signed year number takes no era"):
        parse_date("-300 BC")


def test_number_cells_follow_the_same_setting():
    for number in (-300, -300.0, -25):
        assert _bounds(endpoint_from_cell(number)) == _bounds(parse_date(str(int(number))))
        assert _bounds(endpoint_from_cell(number, ASTRONOMICAL)) == _bounds(
            parse_date(str(int(number)), ASTRONOMICAL))
    assert DECIDED in endpoint_from_cell(-300).qualifiers
    assert _bounds(endpoint_from_cell(150)) == _bounds(parse_date("AD 150"))


def test_explain_says_which_reading_was_used():
    assert any("setting signed-years = bc" in line and "300 BC" in line
               for line in explain("-300"))
    assert any("setting signed-years = astronomical" in line and "301 BC" in line
               for line in explain("-300", ASTRONOMICAL))
    assert any("counted astronomically as the standard says" in line
               for line in explain("-0300"))


def test_parse_command_explains_and_takes_the_option(capsys):
    assert main(["parse", "--explain", "--", "-300"]) == 0
    assert "signed-years = bc" in capsys.readouterr().out
    assert main(["parse", "--json", "--signed-years", "astronomical", "--", "-300"]) == 0
    result = json.loads(capsys.readouterr().out)
    assert (result["earliest"], result["latest"]) == ("-0300-01-01", "-0300-12-31")
    assert result["qualifiers"] == ["convention_dependent"]


def test_the_settings_are_options_of_every_command(capsys):
    assert settings_from_options({"signed-years": "ASTRONOMICAL", "year-zero": "1bc"}) == (
        DateSettings(signed_years="astronomical", year_zero="1bc"))
    with pytest.raises(ValueError, match="signed-years must be one of bc, astronomical"):
        settings_from_options({"signed-years": "iso"})
    assert "default: bc" in SETTING_HELP["signed-years"]
    for command in ("render", "parse", "check", "lanes"):
        with pytest.raises(SystemExit):
            main([command, "--help"])
        shown = capsys.readouterr().out
        assert "--signed-years" in shown and "--year-zero" in shown, command


def test_iso_form_of_a_year_before_999_bc_reads_back():
    for text in ("-01500", "-0300", "-012000"):
        endpoint = parse_date(text)
        assert _bounds(parse_date(iso_form(endpoint))) == _bounds(endpoint), text
    assert iso_form(parse_date("-01500")) == "-01500"


REGISTER = ("id;place;not_before;not_after\n"
            "E1;Saint-Étienne-des-Prés;-300;-150\n"     # a window of one and a half centuries
            "E2;Les Forges-sur-Aube;-25;25\n"           # across the turn of the era
            "E3;Île-Bréhat;0;150\n"                     # a year 0
            "E4;Cœurville;-1200;-601\n"                 # six centuries
            "E5;Mont-Sainté;-44;-44\n")                 # one year


def test_a_windows_1252_register_with_signed_years(tmp_path):
    path = tmp_path / "register.csv"
    path.write_bytes(REGISTER.encode("cp1252"))
    loaded = read_records(path, ColumnMap(start="not_before", end="not_after"), encoding=None)
    [error] = [problem for problem in loaded.problems if problem.kind == "error"]
    assert (error.row, error.column, error.text) == (4, "not_before", "0")
    first = loaded.records[0].span
    assert (first.start.earliest, first.end.latest) == (
        parse_date("300 BC").earliest, parse_date("150 BC").latest)
    # 25 BC .. AD 25 is 50 Julian years, not 51: astronomical -24 .. 25, of which 13 are
    # leap years (every fourth, -24 .. 24).
    across = loaded.records[1].span
    assert across.end.latest + 1 - across.start.earliest == 50 * 365 + 13
    both = read_records(path, ColumnMap(start="not_before", end="not_after"),
                        DateSettings(year_zero="1bc"), encoding=None)
    assert not [problem for problem in both.problems if problem.kind == "error"]
    assert both.records[2].span.start.earliest == parse_date("1 BC").earliest


def test_one_command_reads_every_row_with_one_note_each(tmp_path, capsys):
    path = tmp_path / "register.csv"
    path.write_bytes(REGISTER.replace(";0;", ";1;").encode("cp1252"))
    code = main(["check", str(path), "--start", "not_before", "--end", "not_after"])
    said = "".join(capsys.readouterr())
    assert code == 0, said
    assert said.count("note:") == 2
    assert "read as Windows-1252 (cp1252)" in said
    assert ("register.csv:2: note: 7 cells write a year as a signed number, read as BC/AD "
            "years with no year zero (-300 = 300 BC; 'not_before' rows 2–3, 5–6; "
            "'not_after' rows 2, 5–6) (--signed-years astronomical reads -300 as 301 BC, "
            "as ISO 8601 does; writing 300 BC says which)") in said
    assert "5 rows read: 5 drawn" in said


def test_a_spreadsheets_number_cells(tmp_path):
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.append(["place", "not_before", "not_after"])
    for row in (["Saint-Étienne-des-Prés", -300, -150], ["Île-Bréhat", 0, 150],
                ["Cœurville", -91246, -25]):     # -91246: openpyxl's serial of 1650-03-04
        sheet.append(row)
    path = tmp_path / "register.xlsx"
    book.save(path)
    table = read_table(path)
    loaded = load_records(table, ColumnMap(start="not_before", end="not_after"), BC)
    errors = {(p.row, p.column): p.reason for p in loaded.problems if p.kind == "error"}
    assert errors[(3, "not_before")] == "the year 0 does not exist in BC/AD counting"
    assert errors[(4, "not_before")].startswith("-91246 is a date serial (1650-03-04")
    [record] = loaded.records
    assert _bounds(record.span.start) == _bounds(parse_date("300 BC"))
    assert DECIDED in record.span.start.qualifiers
