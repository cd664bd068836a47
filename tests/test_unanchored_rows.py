"""Rows whose dates give a bar nothing to start from, or whose known dates are out of order,
found by the columnar tests (test_columnar.py): each is reported or drawn, never a crash."""
from __future__ import annotations

from timelines.chart.options import ChartOptions
from timelines.chart.pipeline import arrange
from timelines.check.report import check
from timelines.sources import ColumnMap, Table, load_records

COLUMNS = ColumnMap(start="from", end="to", label="name")


def _table(*rows: tuple[str, str, str]) -> Table:
    return Table.from_rows("rows.csv", ("name", "from", "to"), rows)


def test_an_open_start_with_nothing_known_is_undated_and_said_so():
    # `..` says the span runs on into the past; with an empty end no day is known at all.
    loaded = load_records(_table(("Vell", "..", ""), ("Orm", "1650", "1700")), COLUMNS)
    report = check(loaded)
    assert (report.counts.drawn, report.counts.undated) == (1, 1)
    assert "there is no date ('..')" in str(report.undated_rows[0])


def test_a_stub_never_ends_before_its_span_starts():
    # `after 1701` ends a span that began in 1704; `before 1700` starts one that ended in
    # 1690. The stub of the unbounded side is drawn from the latest (earliest) day known.
    arranged = arrange(_table(("Ysel", "1704", "after 1701"), ("Dunn", "before 1700", "1690"),
                              ("Pell", "1650", "1700")),
                       ChartOptions(columns=COLUMNS, overview="no"))
    placed = [p for _, group in arranged.placement.leaves() for p in group.records]
    assert len(placed) == 3
    assert all(p.bar_start <= p.bar_end for p in placed)
