"""Records as `activity` counts them: parts by kind and group, each record's windows and key.

A window is a record's bounds as a continuous interval [low, high) of fixed days, -inf/+inf
where unbounded (activity.py's notes say why); a key is what a record's Monte Carlo draws are
made with. `record_parts` splits records into the parts counted apart, by (kind, group value),
and gives each part's windows, keys and members: from the Record objects of a list, or, for a
table kept as columns (`columnar.RecordColumns`), from its arrays, each distinct span's
windows worked out once and no Record made.
"""
from __future__ import annotations

import math
from collections.abc import Callable, Sequence
from dataclasses import dataclass

import numpy as np

from ..columnar import RecordColumns
from ..model import EVENT, Record, holds
from ..spanarrays import EARLIEST_END, EARLIEST_START, LATEST_END, LATEST_START, SpanFacts


@dataclass(frozen=True, slots=True)
class Part:
    """The records of one (kind, group value): their windows (event: low, high; span: s0,
    s1, t0, t1), their Monte Carlo keys, and the records themselves."""

    windows: tuple[np.ndarray, ...]
    keys: np.ndarray
    members: Sequence[Record]


@dataclass(frozen=True, slots=True)
class Parts:
    parts: dict[tuple[str, str], Part]   # events first, then by group value
    held: str                            # what the dated records are (model.holds)
    undated: int


def record_parts(records: Sequence[Record], group: str | None) -> Parts:
    """The dated records by (kind, group value): "group" reads a record's group, another
    name a field of its row, None puts all in one part ("")."""
    if isinstance(records, RecordColumns):
        return _column_parts(records, group)
    keys = dict(zip(map(id, records), record_keys(records)))
    dated = [record for record in records if record.span is not None]
    value = group_value(group)
    members: dict[tuple, list[Record]] = {}
    for record in dated:
        members.setdefault((record.kind, value(record)), []).append(record)
    parts = {key: Part(_windows(key[0], found), np.array([keys[id(r)] for r in found],
                                                         dtype=np.int64), found)
             for key, found in members.items()}
    return Parts(_in_order(parts), holds(dated), len(records) - len(dated))


def record_keys(records: Sequence[Record]) -> np.ndarray:
    """The key each record's Monte Carlo draws are made with: its row in the table (a
    DataFrame's rows as `iloc` counts them, so a dask frame's global row gives the same key),
    or its place in `records` where rows repeat (records joined from several tables)."""
    rows = np.array([record.provenance.row for record in records], dtype=np.int64)
    return _keys_of_rows(rows)


def _keys_of_rows(rows: np.ndarray) -> np.ndarray:
    distinct = len(rows) < 2 or (np.diff(np.sort(rows)) != 0).all()
    return rows if distinct else np.arange(len(rows), dtype=np.int64)


def _in_order(parts: dict[tuple, Part]) -> dict[tuple, Part]:
    """Kinds events first, groups in name order."""
    return {key: parts[key] for key in sorted(parts, key=lambda k: (k[0] != EVENT, k[1]))}


def group_value(group: str | None) -> Callable[[Record], str]:
    if group is None:
        return lambda record: ""
    if group == "group":
        return lambda record: record.group or ""
    return lambda record: dict(record.fields).get(group) or ""


def _windows(kind: str, members: Sequence[Record]) -> tuple[np.ndarray, ...]:
    return event_windows(members) if kind == EVENT else span_windows(members)


# -- a table's columns -------------------------------------------------------------------------

def _column_parts(records: RecordColumns, group: str | None) -> Parts:
    keys = _keys_of_rows(records.row_numbers())
    dated = np.flatnonzero(records.dated())
    table = records.take(dated)
    values = column_group_values(table, group)
    names = sorted(set(values))
    place = dict(zip(names, range(len(names))))
    codes = np.fromiter(map(place.__getitem__, values), dtype=np.intp, count=len(values))
    order = np.argsort(codes, kind="stable")          # each part's records in table order
    cuts = np.cumsum(np.bincount(codes, minlength=len(names)))[:-1]
    per_span = fact_windows(records.span_facts(), records.kind)
    span_codes = table.codes()
    parts = {}
    for name, members in zip(names, np.split(order, cuts)):
        windows = tuple(array[span_codes[members]] for array in per_span)
        parts[(records.kind, name)] = Part(windows, keys[dated[members]], table.take(members))
    held = holds(records.records(records.positions[dated[:1]]))   # one table: one kind
    return Parts(_in_order(parts), held, len(records) - len(dated))


def column_group_values(records: RecordColumns, group: str | None) -> list[str]:
    """`group_value` of each record of a table's columns."""
    if group is None:
        return [""] * len(records)
    texts = records.column("groups") if group == "group" else records.field(group)
    return [text or "" for text in texts]


def fact_windows(facts: SpanFacts, kind: str) -> tuple[np.ndarray, ...]:
    """`event_windows` or `span_windows` of spans given by their facts."""
    bounds = facts.bounds
    earliest_start, latest_start = bounds[:, EARLIEST_START], bounds[:, LATEST_START]
    earliest_end, latest_end = bounds[:, EARLIEST_END], bounds[:, LATEST_END]
    if kind == EVENT:
        return _low(earliest_start), _high(latest_end)
    past = facts.open_start & np.isnan(earliest_start)     # ran on from the past: before all
    on = facts.open_end & np.isnan(latest_end)             # runs on: after all
    return (np.where(past, -math.inf, _low(earliest_start)),
            np.where(past, -math.inf, _high(latest_start)),
            np.where(on, math.inf, _low(earliest_end)),
            np.where(on, math.inf, _high(latest_end)))


def _low(days: np.ndarray) -> np.ndarray:
    """A window's low side from an earliest day: -inf where there is none."""
    return np.where(np.isnan(days), -math.inf, days)


def _high(days: np.ndarray) -> np.ndarray:
    """A window's high side from a latest day (the day after it): inf where there is none."""
    return np.where(np.isnan(days), math.inf, days + 1)


# -- Record objects ----------------------------------------------------------------------------

def event_windows(records: Sequence[Record]) -> tuple[np.ndarray, np.ndarray]:
    """Each event's moment window [low, high) in fixed days."""
    low = [_or(r.span.start.earliest, -math.inf) for r in records]
    high = [_or(r.span.end.latest, math.inf - 1) + 1 for r in records]
    return np.asarray(low, dtype=np.float64), np.asarray(high, dtype=np.float64)


def span_windows(records: Sequence[Record]) -> tuple[np.ndarray, ...]:
    """Each span's start window [s0, s1) and end window [t0, t1). An open start (the span ran
    on from the past) is surely before every block, an open end surely after."""
    starts = [_start_window(r.span.start) for r in records]
    ends = [_end_window(r.span.end) for r in records]
    s0, s1 = np.asarray(starts, dtype=np.float64).reshape(-1, 2).T
    t0, t1 = np.asarray(ends, dtype=np.float64).reshape(-1, 2).T
    return s0, s1, t0, t1


def _start_window(endpoint) -> tuple[float, float]:
    if endpoint.is_open and endpoint.earliest is None:
        return -math.inf, -math.inf
    return _or(endpoint.earliest, -math.inf), _or(endpoint.latest, math.inf - 1) + 1


def _end_window(endpoint) -> tuple[float, float]:
    if endpoint.is_open and endpoint.latest is None:
        return math.inf, math.inf
    return _or(endpoint.earliest, -math.inf), _or(endpoint.latest, math.inf - 1) + 1


def _or(value, default):
    return default if value is None else value
