"""Spans as arrays (`spanarrays`): the facts read off arrays are the facts the Span objects
state, and a table of plain ISO days read as arrays (`DaySpans`) gives what the general path
gives, without making a Span for each row.

The object path is the reference: `span_facts` of Span objects reads each one's own
attributes, and the general reader parses each cell with the date language (tested against
ISO 8601 and Python's calendar elsewhere). The days themselves are checked against Python's
`date.toordinal()`, which counts proleptic Gregorian days from 0001-01-01 = 1 as R.D. does
(Reingold & Dershowitz, Calendrical Calculations)."""
from __future__ import annotations

import datetime
import io
import random

import numpy as np
import pytest
from hypothesis import given, strategies as st

from timelines.chart.options import ChartOptions
from timelines.chart.pipeline import arrange
from timelines.check.report import check
from timelines.dates import column as column_module
from timelines.dates import parse_span
from timelines.layout import LaneSettings, TimeWindow
from timelines.layout.report import write_csv
from timelines.model import Endpoint, Qualifier, Span
from timelines.sources import ColumnMap, Table, load_records
from timelines.spanarrays import PRECISIONS, DaySpans, SpanFacts, span_facts

_DAYS = st.one_of(st.none(), st.integers(min_value=1, max_value=800_000))


def _expected(start: int | None, end: int | None) -> Span | None:
    if start is None and end is None:
        return None
    if start is not None and start == end:
        return Span.point(Endpoint.day(start))
    return Span(Endpoint.day(start) if start is not None else
                Endpoint.open(Qualifier.UNKNOWN_START),
                Endpoint.day(end) if end is not None else Endpoint.open(Qualifier.UNKNOWN_END))


def _ordered(pairs):
    return [(a, b) if a is None or b is None else (min(a, b), max(a, b)) for a, b in pairs]


def _nan(days):
    return np.array([np.nan if day is None else day for day in days], dtype=float)


def _facts_equal(one: SpanFacts, other: SpanFacts) -> None:
    for name in ("dated", "open_start", "open_end", "point", "start_precision",
                 "end_precision", "start_radiocarbon", "end_radiocarbon", "likely"):
        assert getattr(one, name).tolist() == getattr(other, name).tolist(), name
    np.testing.assert_array_equal(one.bounds, other.bounds)
    for side in ("start_qualifiers", "end_qualifiers"):
        assert ([one.qualifier_sets[code] for code in getattr(one, side).tolist()]
                == [other.qualifier_sets[code] for code in getattr(other, side).tolist()]), side


@given(st.lists(st.tuples(_DAYS, _DAYS), max_size=25).map(_ordered))
def test_day_spans_are_the_spans_made_the_ordinary_way(pairs):
    spans = DaySpans(_nan([a for a, _ in pairs]), _nan([b for _, b in pairs]))
    assert list(spans) == [_expected(a, b) for a, b in pairs]
    assert all(spans[index] is spans[index] for index in range(len(spans)))   # made once
    _facts_equal(spans.facts(), span_facts(list(spans)))
    if pairs:
        picked = np.array([len(pairs) - 1, 0])
        _facts_equal(spans.take(picked).facts(), spans.facts().take(picked))


def test_day_spans_refuse_an_end_before_its_start():
    with pytest.raises(ValueError, match="ends before it starts"):
        DaySpans(np.array([10.0]), np.array([9.0]))


@pytest.mark.parametrize("text", [
    "1650", "c. 1650", "../1760", "1760/..", "/1760", "before 1700", "1650?", "1701-03-04",
    "1650–1660", "44 BC", "65.5 Ma", "early 17th century", "1984~", "198X", "1650%",
    "[1667,1668]", "3rd millennium BC", "3450 ± 40 14C BP", "1650–1660 ± 5",
    "3450 ± 40 14C BP–3300 ± 30 14C BP"])
def test_span_facts_state_what_each_span_says(text):
    span = parse_span(text)
    facts = span_facts([span, None])
    assert facts.bounds[0].tolist() == pytest.approx(
        [np.nan if day is None else day for day in (span.start.earliest, span.start.latest,
                                                     span.end.earliest, span.end.latest)],
        nan_ok=True)
    assert facts.dated.tolist() == [True, False]
    assert facts.open_start[0] == span.start.is_open and facts.open_end[0] == span.end.is_open
    assert facts.point[0] == span.is_point and not facts.point[1]
    assert facts.qualifier_sets[facts.start_qualifiers[0]] == span.start.qualifiers
    assert facts.qualifier_sets[facts.end_qualifiers[0]] == span.end.qualifiers
    for code, endpoint in ((facts.start_precision[0], span.start),
                           (facts.end_precision[0], span.end)):
        assert (PRECISIONS[code] if code >= 0 else None) == endpoint.precision
    assert facts.start_radiocarbon.tolist() == [span.start.radiocarbon is not None, False]
    assert facts.end_radiocarbon.tolist() == [span.end.radiocarbon is not None, False]
    assert facts.likely.tolist() == [span.start.likely is not None
                                     or span.end.likely is not None, False]


# --- the reader ------------------------------------------------------------------------------
def _iso_table(rows: int, seed: int) -> Table:
    """Invented members with plain ISO days: empty cells, equal days, an end before its
    start, rows with no date, repeated pairs."""
    rng = random.Random(seed)
    body = []
    for row in range(rows):
        start = datetime.date(1600, 1, 1) + datetime.timedelta(days=rng.randint(0, 40_000))
        end = start + datetime.timedelta(days=rng.choice([0, 1, 30, 9_000, -200]))
        cells = [start.isoformat(), end.isoformat()]
        kind = rng.random()
        if kind < 0.1:
            cells[0] = ""
        elif kind < 0.2:
            cells[1] = ""
        elif kind < 0.25:
            cells = ["", ""]
        elif kind < 0.35:
            cells = ["1650-06-01", "1652-01-31"]
        body.append((f"R{row}", f"Member {row}", rng.choice(["Masters", "Wardens", ""]), *cells))
    return Table.from_rows("members.csv", ("id", "name", "group", "admitted", "left"), body)


COLUMNS = ColumnMap(start="admitted", end="left", label="name", group="group", id="id")


def _made(spans: DaySpans) -> int:
    """How many Span objects `spans` has made so far."""
    return sum(span is not None for span in spans._made.values())


@pytest.fixture()
def general_path(monkeypatch):
    """The reader with the bulk ISO path turned off: every cell parsed by the language."""
    def read(events: bool = False, table: Table | None = None):
        with monkeypatch.context() as patched:
            patched.setattr(column_module, "_iso_days", lambda values: None)
            return load_records(table or _iso_table(400, 5), COLUMNS, events=events)
    return read


def test_a_table_of_days_is_read_as_arrays():
    loaded = load_records(_iso_table(400, 5), COLUMNS)
    assert isinstance(loaded.records.spans, DaySpans)
    assert _made(loaded.records.spans) == 0        # no Span made yet (the module's notes)
    assert not check(loaded).warnings
    assert _made(loaded.records.spans) == 0        # nor by a check that finds nothing


@pytest.mark.parametrize("events", [False, True])
def test_a_table_of_days_reads_as_the_general_path_reads_it(general_path, events):
    loaded = load_records(_iso_table(400, 5), COLUMNS, events=events)
    reference = general_path(events)
    assert not isinstance(reference.records.spans, DaySpans)
    assert tuple(loaded.records) == tuple(reference.records)
    assert loaded.problems == reference.problems
    kinds = {problem.kind for problem in loaded.problems}
    assert {"undated", "contradiction"} <= kinds
    assert check(loaded) == check(reference)


def test_one_column_of_days_reads_as_the_general_path_reads_it(general_path):
    table = _iso_table(100, 9)
    columns = ColumnMap(start="admitted", label="name")
    by_days = load_records(table, columns)
    assert isinstance(by_days.records.spans, DaySpans)
    with pytest.MonkeyPatch.context() as patched:
        patched.setattr(column_module, "_iso_days", lambda values: None)
        reference = load_records(table, columns)
    assert tuple(by_days.records) == tuple(reference.records)
    assert by_days.problems == reference.problems


def _csv(arranged) -> str:
    stream = io.StringIO()
    write_csv(arranged.placement, stream)
    return stream.getvalue()


@pytest.mark.parametrize("options", [
    ChartOptions(columns=COLUMNS, overview="no"),
    ChartOptions(columns=COLUMNS, overview="no", lanes=LaneSettings(pack="ordered")),
    ChartOptions(columns=COLUMNS, overview="no", window=TimeWindow(
        datetime.date(1650, 1, 1).toordinal(), datetime.date(1660, 12, 31).toordinal(),
        "1650", "1660")),
], ids=["compact", "ordered", "window"])
def test_lanes_of_a_table_of_days_are_the_general_paths(monkeypatch, options):
    by_days = arrange(_iso_table(400, 5), options)
    assert isinstance(by_days.loaded.records.spans, DaySpans)
    with monkeypatch.context() as patched:
        patched.setattr(column_module, "_iso_days", lambda values: None)
        reference = arrange(_iso_table(400, 5), options)
    assert _csv(by_days) == _csv(reference)
    assert by_days.scale == reference.scale and by_days.outside == reference.outside
    # Packing, the time scale and the window read arrays; Spans are made for the records
    # the window leaves out (listed with their dates) and no others.
    assert _made(by_days.loaded.records.spans) == len(by_days.outside)
