"""Values made by timelines/dates/built.py (the quick lane's and the bulk column's shortcut)
are the very values the ordinary constructors make."""
from __future__ import annotations

import dataclasses
import datetime
import gc

import pytest
from hypothesis import given, strategies as st

from timelines.dates import parse_column, parse_endpoint
from timelines.dates.built import checked_span, checked_window, day_point, days, point
from timelines.model import Endpoint, Precision, Qualifier, Span

_MARKS = frozenset({Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT})


def _same(built, ordinary) -> None:
    assert built == ordinary and hash(built) == hash(ordinary) and repr(built) == repr(ordinary)


@given(st.integers(-10 ** 9, 10 ** 9), st.integers(0, 10 ** 6))
def test_built_values_equal_the_ordinary_ones(earliest, width):
    latest = earliest + width
    _same(checked_window(earliest, latest, Precision.YEAR),
          Endpoint(earliest, latest, Precision.YEAR))
    _same(checked_window(earliest, latest, Precision.YEAR, _MARKS, latest),
          Endpoint(earliest, latest, Precision.YEAR, _MARKS, latest))
    _same(day_point(earliest), Span.point(Endpoint.day(earliest)))
    _same(point(Endpoint.day(latest)), Span.point(Endpoint.day(latest)))
    _same(checked_span(Endpoint.day(earliest), Endpoint.day(latest)),
          Span(Endpoint.day(earliest), Endpoint.day(latest)))
    built_days = days([earliest, latest])
    assert len(built_days) == 2
    _same(built_days[0], Endpoint.day(earliest))
    _same(built_days[1], Endpoint.day(latest))


def test_built_values_stay_frozen_and_replaceable():
    endpoint = checked_window(10, 20, Precision.YEAR)
    with pytest.raises(dataclasses.FrozenInstanceError):
        endpoint.earliest = 5
    assert dataclasses.replace(endpoint, qualifiers=_MARKS) == Endpoint(10, 20, Precision.YEAR,
                                                                       _MARKS)


@pytest.mark.parametrize("enabled", [True, False])
def test_building_a_column_leaves_the_collector_as_it_was(enabled):
    was = gc.isenabled()
    (gc.enable if enabled else gc.disable)()
    try:
        days(list(range(100)))
        assert gc.isenabled() is enabled
    finally:
        (gc.enable if was else gc.disable)()


# Oracle: stdlib datetime (date.isoformat writes the ISO 8601 calendar date).
@given(st.lists(st.dates(min_value=datetime.date(1, 1, 1)), min_size=1, max_size=40))
def test_a_bulk_iso_column_gives_exactly_what_the_parser_gives(dates):
    column = [day.isoformat() for day in dates]
    assert parse_column(column) == [parse_endpoint(text) for text in column]
