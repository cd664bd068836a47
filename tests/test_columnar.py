"""A table read as columns (`columnar.RecordColumns`) gives what the same records as objects
give: the same Records, the same check, the same lanes, boxes and lanes report.

The object path (a tuple of Records, laid out one Record at a time) is the reference here:
it is the path every hand-made list of Records takes, tested on its own elsewhere against
published intervals and brute force. These tests hold the columnar path to it on tables
with every kind of row: fuzzy, open, unknown, undated, unreadable, contradictory, repeated."""
from __future__ import annotations

import io
import random
from dataclasses import replace

import numpy as np
import pytest

from timelines.calendar import fixed_from_gregorian
from timelines.check.report import check
from timelines.chart.options import ChartOptions
from timelines.chart.pipeline import arrange
from timelines.columnar import RecordColumns
from timelines.layout import LaneSettings, TimeWindow
from timelines.layout.report import record_tuples, summary_lines, write_csv
from timelines.sources import ColumnMap, LoadResult, Table, load_records

FORMS = ("{y}", "c. {y}", "{y}-{m:02d}-{d:02d}", "before {y}", "{y}s", "after {y}", "{y}?",
         "..", "", "n.d.", "{y}/{z}", "early {c}th century", "not a date", "{y}~")


def _table(rows: int, seed: int) -> Table:
    """Invented members with every kind of cell, repeated values and a few duplicate ids."""
    rng = random.Random(seed)
    body = []
    for row in range(rows):
        year = rng.randint(1550, 1880)
        values = dict(y=year, z=year + 1, m=rng.randint(1, 12), d=rng.randint(1, 28),
                      c=year // 100 + 1)
        start = rng.choice(FORMS).format(**values)
        end = rng.choice(FORMS[:9]).format(**{**values, "y": year + rng.randint(-5, 60)})
        ident = f"R{row % (rows - 3)}"                     # three ids repeat
        group = rng.choice(["Masters", "Journeymen", "", "Apprentices", "=SUM(A1)"])
        label = rng.choice([f"Member {row}", "", f"Member, {row}"])
        body.append((ident, label, group, start, end, rng.choice(["a", "b", "1"])))
    return Table.from_rows("members.csv", ("id", "name", "group", "admitted", "left", "lane"),
                           body)


COLUMNS = ColumnMap(start="admitted", end="left", label="name", group="group", id="id")


@pytest.fixture(scope="module")
def loaded() -> LoadResult:
    return load_records(_table(600, 7), COLUMNS)


def test_a_table_is_read_as_columns(loaded):
    assert isinstance(loaded.records, RecordColumns)
    assert len(loaded.records) == len(list(loaded.records))


def test_each_record_is_made_once_and_shared_by_the_parts(loaded):
    records = loaded.records
    first = list(records)
    assert all(a is b for a, b in zip(first, records))
    part = records.take(np.arange(len(records))[::-3])
    assert all(a is b for a, b in zip(part, first[::-3]))
    assert records[5] is first[5] and records[-1] is first[-1]
    assert records[2:9] == first[2:9]


def test_a_record_asked_for_alone_is_the_one_iteration_gives():
    records = load_records(_table(50, 3), COLUMNS).records
    single = records[7]
    assert list(records)[7] is single


def test_columns_equal_their_records(loaded):
    records = loaded.records
    objects = tuple(records)
    assert records == objects and records == list(objects)
    assert records.column("labels") == [record.label for record in objects]
    assert records.column("ids") == [record.id for record in objects]
    assert records.row_numbers().tolist() == [record.provenance.row for record in objects]
    assert records.dated().tolist() == [record.span is not None for record in objects]
    bounds = records.span_bounds()[records.codes()]
    for record, row in zip(objects, bounds.tolist()):
        span = record.span
        want = ([np.nan] * 4 if span is None else
                [np.nan if day is None else day for day in (
                    span.start.earliest, span.start.latest, span.end.earliest, span.end.latest)])
        assert row == pytest.approx(want, nan_ok=True)


def test_check_of_columns_is_check_of_objects(loaded):
    objects = LoadResult(tuple(loaded.records), loaded.problems, loaded.rows_read)
    by_columns, by_objects = check(loaded), check(objects)
    assert by_columns == by_objects
    assert by_columns.warnings            # the repeated ids, at least
    assert by_columns.counts.undated and by_columns.counts.unreadable


def _rows(arranged) -> list[tuple]:
    return list(record_tuples(arranged.placement))


def _csv(arranged) -> str:
    stream = io.StringIO()
    write_csv(arranged.placement, stream)
    return stream.getvalue()


LANE_SETTINGS = [
    LaneSettings(),
    LaneSettings(pack="ordered", sort="label"),
    LaneSettings(pack="single", sort="end", descending=True),
    LaneSettings(max_lanes=3),
    LaneSettings(min_group_size=150),
    LaneSettings(group_order="name"),
    LaneSettings(group_order="size"),
    LaneSettings(labels="inside"),
    LaneSettings(labels="none"),
    LaneSettings(lane_column="lane"),
    LaneSettings(subgroup="lane"),
]


@pytest.mark.parametrize("lanes", LANE_SETTINGS, ids=repr)
def test_lanes_of_columns_are_lanes_of_objects(loaded, lanes):
    options = ChartOptions(columns=COLUMNS, lanes=lanes, overview="no")
    by_columns = arrange(_table(600, 7), options)
    by_objects = arrange(tuple(loaded.records), replace(options, columns=ColumnMap()))
    assert isinstance(by_columns.loaded.records, RecordColumns)
    assert not isinstance(by_objects.loaded.records, RecordColumns)
    assert _rows(by_columns) == _rows(by_objects)
    assert _csv(by_columns) == _csv(by_objects)
    assert summary_lines(by_columns.placement) == summary_lines(by_objects.placement)
    assert by_columns.scale == by_objects.scale
    for (path, group), (other_path, other) in zip(by_columns.placement.leaves(),
                                                   by_objects.placement.leaves()):
        assert path == other_path
        assert tuple(group.records) == tuple(other.records)   # every PlacedRecord, equal


def test_a_window_splits_columns_as_it_splits_objects(loaded):
    window = TimeWindow(fixed_from_gregorian(1700, 1, 1), fixed_from_gregorian(1760, 12, 31),
                        "1700", "1760")
    options = ChartOptions(columns=COLUMNS, window=window, overview="no")
    by_columns = arrange(_table(600, 7), options)
    by_objects = arrange(tuple(loaded.records), replace(options, columns=ColumnMap()))
    assert by_columns.outside == by_objects.outside and by_columns.outside
    assert _rows(by_columns) == _rows(by_objects)


def test_the_formula_guard_reads_the_column_as_a_whole():
    """A group name beginning like a formula is written with a quote before it, in the
    columns' quick path as in the cell by cell one."""
    arranged = arrange(_table(200, 11), ChartOptions(columns=COLUMNS, overview="no"))
    text = _csv(arranged)
    assert ",'=SUM(A1)," in text and ",=SUM(A1)," not in text


# --- activity ------------------------------------------------------------------------------
def _activity_equal(records, **options) -> None:
    from timelines.analysis.activity import activity
    by_columns = activity(records, **options)
    by_objects = activity(tuple(records), **options)
    pd = pytest.importorskip("pandas")
    pd.testing.assert_frame_equal(by_columns, by_objects)
    assert by_columns.attrs == by_objects.attrs
    assert len(by_columns)


@pytest.mark.parametrize("options", [
    dict(per="decade"), dict(per="century", group="group", runs=30, seed=4),
    dict(per=25, group="lane"), dict(per="decade", group="no such column")],
    ids=["decade", "groups and envelope", "a field", "a missing field"])
def test_activity_of_columns_is_activity_of_objects(loaded, options):
    _activity_equal(loaded.records, **options)


def test_activity_of_events_and_radiocarbon_dates_as_columns():
    body = [("R1", "Wreck", "coast", "3450 ± 40 14C BP", ""),
            ("R2", "Find", "inland", "1650", "1660"),
            ("R3", "Letter", "coast", "c. 1655", "after 1650"),
            ("R4", "Hearth", "inland", "3300 ± 30 14C BP", ""),
            ("R5", "Undated", "coast", "", "")]
    table = Table.from_rows("finds.csv", ("id", "name", "group", "admitted", "left"), body)
    events = load_records(table, COLUMNS, events=True).records
    spans = load_records(table, COLUMNS).records
    assert isinstance(events, RecordColumns) and isinstance(spans, RecordColumns)
    # A `when` cell of one calibrated date is a point weighed by its probability.
    when = load_records(Table.from_rows("finds.csv", ("id", "name", "group", "date"),
                                        [row[:4] for row in body]),
                        ColumnMap(when="date", label="name", group="group", id="id")).records
    from timelines.analysis.calibrated import calibrated_points
    assert calibrated_points(when).tolist() == [True, False, False, True, False]
    for records in (events, spans, when):
        _activity_equal(records, per="millennium", group="group", runs=10)


@pytest.mark.parametrize("window, where, first", [
    (None, None, None), ((1700, 1760), None, 40), (None, "group=Masters", 25)],
    ids=["all", "window", "where"])
def test_the_overview_of_columns_is_the_overview_of_objects(loaded, window, where, first):
    from timelines.chart.overview import choose_part
    from timelines.layout.window import split_by_window
    from timelines.sources.fields import column_reader

    if window is not None:
        window = TimeWindow(fixed_from_gregorian(window[0], 1, 1),
                            fixed_from_gregorian(window[1], 12, 31), "1700", "1760")

    def part(records):
        kept, _ = split_by_window(records, window)
        return choose_part(records, kept, window, where, first,
                           lambda name: column_reader(COLUMNS, None, name, "--where"))

    by_columns, by_objects = part(loaded.records), part(tuple(loaded.records))
    assert isinstance(split_by_window(loaded.records, window)[0], RecordColumns)
    assert by_columns.records == by_objects.records and by_columns.records
    assert by_columns.overview == by_objects.overview
    assert by_columns.summarised == by_objects.summarised
