"""check(): counts, the summary line, the warning rules, and the lines a command line prints."""
from __future__ import annotations

import json
from dataclasses import dataclass
from datetime import date

from timelines.check.report import CheckLimits, Finding, check
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span


def year(number: int, precision: Precision = Precision.YEAR) -> Endpoint:
    # Fixed days from the stdlib: date.toordinal() counts R.D. days (Python docs, datetime).
    return Endpoint(date(number, 1, 1).toordinal(), date(number, 12, 31).toordinal(), precision)


def record(row: int, start: int | None, end: int | None, *, id: str | None = None,
           text: tuple[str, str] | None = None) -> Record:
    span = None if start is None else Span(year(start), year(end if end is not None else start))
    start_text, end_text = text or ("" if start is None else str(start),
                                    "" if end is None else str(end))
    return Record(f"row {row}", span, Provenance("guild.csv", row), start_text, end_text, id=id)


@dataclass(frozen=True)
class FakeProblem:
    """Stands for sources.Problem: check() relies only on these attributes and str()."""

    source: str
    row: int
    column: str | None
    id: str | None
    kind: str

    def __str__(self) -> str:
        return f"{self.source}:{self.row}: {self.kind}"


@dataclass(frozen=True)
class FakeLoad:
    records: tuple
    problems: tuple
    rows_read: int


def test_counts_and_summary_add_up_to_the_rows_read():
    records = (record(2, 1650, 1700), record(3, 1660, 1710), record(5, None, None))
    problems = (
        FakeProblem("guild.csv", 4, "born", None, "error"),
        FakeProblem("guild.csv", 4, "died", None, "error"),   # two bad cells, one row
        FakeProblem("guild.csv", 5, None, None, "undated"),
        FakeProblem("guild.csv", 6, "died", None, "contradiction"),
    )
    report = check(FakeLoad(records, problems, rows_read=5))
    counts = report.counts
    assert (counts.rows_read, counts.drawn, counts.undated) == (5, 2, 1)
    assert (counts.unreadable, counts.contradictory, counts.reported) == (1, 1, 3)
    assert counts.drawn + counts.reported == counts.rows_read
    assert report.summary() == ("5 rows read: 2 drawn, 3 reported "
                                "(1 unreadable, 1 contradictory, 1 undated)")
    assert len(report.errors) == 3 and len(report.undated_rows) == 1
    assert report.not_drawn == 3 and report.undated == 1 and not report.ok


def test_summary_of_a_clean_table_and_singular_words():
    assert check([record(2, 1650, 1700)]).summary() == "1 row read: 1 drawn"
    clean = check([record(2, 1650, 1700), record(3, 1651, 1701)])
    assert clean.summary() == "2 rows read: 2 drawn" and clean.ok and clean.lines() == ()


def test_plain_records_count_their_undated_ones():
    report = check([record(2, 1650, 1700), record(3, None, None)])
    assert report.summary() == "2 rows read: 1 drawn, 1 reported (1 undated)"


def test_duplicate_id_is_reported_on_each_later_row_with_the_first_row():
    records = (record(2, 1650, 1700, id="P1"), record(3, 1650, 1700, id="P2"),
               record(7, 1650, 1700, id="P1"))
    problems = (FakeProblem("guild.csv", 9, "born", "P1", "error"),)
    report = check(FakeLoad(records, problems, rows_read=4))
    assert [str(w) for w in report.warnings] == [
        "guild.csv:7: [P1] warning: the id 'P1' is also on row 2",
        "guild.csv:9: [P1] warning: the id 'P1' is also on row 2",
    ]
    assert report.summary() == "4 rows read: 3 drawn, 1 reported (1 unreadable); 2 warnings"


def test_rows_without_an_id_are_never_duplicates():
    assert check([record(2, 1650, 1700), record(3, 1650, 1700)]).warnings == ()


def test_long_span_warning_above_the_limit():
    # 165 to 1650: 1486 whole years (1650 - 165 + 1 = 1486), a dropped digit.
    records = [record(2, 165, 1650, id="P1", text=("165", "1650")), record(3, 1650, 1700)]
    (warning,) = check(records).warnings
    assert str(warning) == ("guild.csv:2: [P1] warning: '165 – 1650' may last about 1486 years, "
                            "more than 1000; is a year mistyped?")
    assert warning.kind == "long span"


def test_long_span_limit_is_inclusive_and_can_be_switched_off():
    exactly = record(2, 1001, 2000)  # 1000 years: 1001-01-01 .. 2000-12-31
    assert check([exactly]).warnings == ()
    assert len(check([record(2, 1000, 2000)]).warnings) == 1  # 1001 years
    assert check([record(2, 165, 1650)], CheckLimits(max_extent_years=None)).warnings == ()
    assert len(check([record(2, 1650, 1751)], CheckLimits(max_extent_years=100)).warnings) == 1


def test_coarse_and_open_spans_are_exempt_from_the_long_span_rule():
    # Some 1100 years of millennium precision, in the BCE fixed days (negative R.D.).
    fourth_millennium = Endpoint(-1_460_000, -1_095_000, Precision.MILLENNIUM)
    millennia = Record("Neolithic", Span(fourth_millennium, Endpoint(-1_060_000, -1_059_636)),
                       Provenance("sites.csv", 2))
    running = Record("Abbey", Span(Endpoint.open(Qualifier.OPEN_START), year(1200)),
                     Provenance("sites.csv", 3))
    assert check([millennia, running]).warnings == ()


def test_lines_interleave_errors_undated_and_warnings_by_row():
    records = (record(2, 1650, 1700, id="A"), record(4, None, None, id="A"))
    problems = (FakeProblem("guild.csv", 3, "born", None, "error"),
                FakeProblem("guild.csv", 4, None, "A", "undated"))
    report = check(FakeLoad(records, problems, rows_read=3))
    assert report.lines() == (
        "guild.csv:3: error",
        "guild.csv:4: undated",
        "guild.csv:4: [A] warning: the id 'A' is also on row 2",
    )


def test_as_dict_is_plain_json_data():
    records = (record(2, 165, 1650, id="P1"),)
    problems = (FakeProblem("guild.csv", 3, "born", "P2", "error"),)
    data = check(FakeLoad(records, problems, rows_read=2)).as_dict()
    assert json.loads(json.dumps(data)) == data
    assert data["counts"] == {"rows_read": 2, "drawn": 1, "undated": 0, "unreadable": 1,
                              "contradictory": 0, "warnings": 1, "reported": 1}
    assert data["errors"][0]["line"] == "guild.csv:3: error"
    assert data["warnings"][0]["kind"] == "long span"
    assert data["summary"] == "2 rows read: 1 drawn, 1 reported (1 unreadable); 1 warning"


def test_finding_line_without_id_or_column():
    finding = Finding("guild.csv", 5, None, None, "something", "long span")
    assert str(finding) == "guild.csv:5: warning: something"
