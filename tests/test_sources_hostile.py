"""Hostile and unusual tables (issue 9, item 3): a crash in one cell is that cell's problem.

Names and data are invented.
"""
from __future__ import annotations

from datetime import date

import timelines.dates.column as column_reader
import timelines.sources.records as records_module
from timelines.check import check
from timelines.cli import main
from timelines.sources import ColumnMap, Table, load_records


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
