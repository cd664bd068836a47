"""Activity on a dask DataFrame, partition by partition (the optional extra
`pip install 'timelines[dask]'`): the same counts as `activity.activity` on one machine.

Two passes over the partitions, each a pure module-level function with explicit `meta`:

1. `window_partition` reads a partition's date columns (the same reader as a table file:
   `sources.load_records` with the settings given) into numeric windows in fixed days:
   events `[low, high)`, spans a start window `[s0, s1)` and an end window `[t0, t1)`;
   an unbounded side is -inf/+inf, an undated or unreadable row NaN. Never -1 or 0 for "no
   date": days before the era are negative numbers like any other.
2. The blocks are decided once, for all partitions, before the counting pass: from `start`
   and `end` when given, else from the smallest and largest finite day (dask reductions over
   the windows, which are persisted so that the dates are read only once).
3. `count_partition` counts each partition in those blocks (`event_counts`, `span_counts`),
   per group when asked; the counts are sums over records, so the partitions' rows are summed
   per group and block.
4. With `runs`, `simulate_partition` simulates each partition's counts per run (Crema 2012),
   every record's numbers keyed by its global row (`activity.keyed_uniform`): the counts of
   each run are summed across partitions before the percentiles are taken, and the answer is
   the same for any partitioning, and the same as `activity.activity` on the rows read on one
   machine (whose keys are the rows as `iloc` counts them).

A calibrated radiocarbon date is weighed here by its window (uniform), not by its
probability as `activity.activity` weighs it (calibrated.py): the windows hold no densities.

A date column's reading can depend on the whole column (a column of bare numbers read as
years or as spreadsheet days, say): give `settings` and `date_numbers` so every partition
reads alike.
"""
from __future__ import annotations

import math

import numpy as np
import pandas as pd

from ..calendar import HISTORICAL
from ..dates import DEFAULT_SETTINGS, DateSettings
from ..errors import UsageError
from ..model import EVENT, SPAN
from ..sources import ColumnMap, detect_columns, load_records
from ..sources.frames import table_from_data
from .activity import (ENVELOPE, KIND_NAMES, METHODS, block_width, blocks_between, envelope,
                       event_counts, simulated, span_counts)
from .windows import column_group_values, fact_windows

WINDOW_COLUMNS = {EVENT: ("low", "high"), SPAN: ("s0", "s1", "t0", "t1")}
COUNT_COLUMNS = ("certain", "possible", "expected", "unweighed")


def window_meta(kind: str) -> pd.DataFrame:
    """The empty frame `window_partition` returns for `kind`: float64 days, the group."""
    return pd.DataFrame({**{name: pd.Series(dtype="float64") for name in WINDOW_COLUMNS[kind]},
                         "group": pd.Series(dtype="object")})


def window_partition(frame: pd.DataFrame, kind: str = SPAN, columns: ColumnMap = ColumnMap(),
                     settings: DateSettings = DEFAULT_SETTINGS, date_numbers: str = "years",
                     group: str | None = None) -> pd.DataFrame:
    """Each row's windows in fixed days (NaN: no usable date), in the partition's order, and
    its group ("" when no `group` is asked: the record's group, or a field, as in `activity`)."""
    table = table_from_data(frame.reset_index(drop=True))
    loaded = load_records(table, detect_columns(table.header, columns), settings,
                          date_numbers=date_numbers, events=kind == EVENT)
    records = loaded.records                  # the table's columns: no Record is made
    windows = np.full((len(frame), len(WINDOW_COLUMNS[kind])), np.nan)
    groups = np.full(len(frame), "", dtype=object)
    offsets = records.row_numbers() - table.first_row
    groups[offsets] = column_group_values(records, group)
    dated = records.dated()
    if dated.any():
        per_span = fact_windows(records.span_facts(), kind)
        codes = records.codes()[dated]
        windows[offsets[dated]] = np.column_stack([array[codes] for array in per_span])
    found = pd.DataFrame(windows, columns=list(WINDOW_COLUMNS[kind]), index=frame.index)
    found["group"] = groups
    return found


def count_meta() -> pd.DataFrame:
    return pd.DataFrame({"group": pd.Series(dtype="object"), "block": pd.Series(dtype="int64"),
                         **{name: pd.Series(dtype="float64") for name in COUNT_COLUMNS}})


def count_partition(windows: pd.DataFrame, kind: str, edges: np.ndarray) -> pd.DataFrame:
    """A partition's counts per group and block (one row per block for each group its dated
    rows hold) in the global `edges`."""
    frames = [count_meta()]
    for group, part in _dated_groups(windows, kind):
        arrays = [part[name].to_numpy(dtype=np.float64) for name in WINDOW_COLUMNS[kind]]
        counts = event_counts(*arrays, edges) if kind == EVENT else span_counts(*arrays, edges)
        frames.append(pd.DataFrame({"group": group,
                                    "block": np.arange(len(edges) - 1, dtype=np.int64),
                                    **{name: np.asarray(counts[name], dtype=np.float64)
                                       for name in COUNT_COLUMNS}}))
    return pd.concat(frames, ignore_index=True)


def simulation_meta() -> pd.DataFrame:
    return pd.DataFrame({"group": pd.Series(dtype="object"), "run": pd.Series(dtype="int64"),
                         "block": pd.Series(dtype="int64"), "count": pd.Series(dtype="int64")})


def simulate_partition(windows: pd.DataFrame, kind: str, edges: np.ndarray, runs: int,
                       seed: int, offsets: list[int], partition_info=None) -> pd.DataFrame:
    """A partition's simulated counts per group, run and block, each row drawn with its global
    row as key (`offsets[n]`: the rows before partition n)."""
    number = partition_info["number"] if partition_info else 0
    keyed = windows.assign(key=offsets[number] + np.arange(len(windows), dtype=np.int64))
    frames = [simulation_meta()]
    blocks = len(edges) - 1
    for group, part in _dated_groups(keyed, kind):
        arrays = tuple(part[name].to_numpy(dtype=np.float64) for name in WINDOW_COLUMNS[kind])
        counts = simulated(kind, arrays, edges, runs, seed, part["key"].to_numpy(np.int64))
        frames.append(pd.DataFrame({"group": group,
                                    "run": np.repeat(np.arange(runs, dtype=np.int64), blocks),
                                    "block": np.tile(np.arange(blocks, dtype=np.int64), runs),
                                    "count": counts.ravel()}))
    return pd.concat(frames, ignore_index=True)


def _dated_groups(windows: pd.DataFrame, kind: str):
    usable = windows.dropna(subset=list(WINDOW_COLUMNS[kind]))
    return sorted(usable.groupby("group", sort=False), key=lambda item: item[0])


def partitioned_activity(frame, per: str | int = "decade", kind: str = SPAN,
                         columns: ColumnMap = ColumnMap(), start: int | None = None,
                         end: int | None = None, group: str | None = None, runs: int = 0,
                         seed: int = 0, settings: DateSettings = DEFAULT_SETTINGS,
                         date_numbers: str = "years", calendar: str = HISTORICAL,
                         era: str = "bce") -> pd.DataFrame:
    """The counts per block of the dask DataFrame `frame` (rows of one `kind`), as
    `activity.activity` gives them for the same rows read on one machine: columns kind,
    [group,] block_start, block_end, label, certain, possible, expected, unweighed [, low,
    median, high with `runs`]; `attrs` say how many rows were read and how many had no usable
    date (empty or unreadable: `timelines check` on a sample names them) and so are in no
    count."""
    dask = _dask()
    windows = frame.map_partitions(window_partition, kind, columns, settings, date_numbers,
                                   group, meta=window_meta(kind))
    if start is None or end is None or runs > 0:   # read once, kept for the later passes
        windows = windows.persist()
    if start is None or end is None:
        low, high = _finite_range(windows, kind)
        start = low if start is None else start
        end = high if end is None else end
    names = ["kind", *(["group"] if group else []), "block_start", "block_end", "label",
             *COUNT_COLUMNS, *(["low", "median", "high"] if runs > 0 else [])]
    if start is None or end is None:
        return pd.DataFrame(columns=names)
    blocks = blocks_between(int(start), int(end), block_width(per), calendar)
    edges = blocks.edges
    parts = windows.map_partitions(count_partition, kind, edges, meta=count_meta())
    undated = windows[list(WINDOW_COLUMNS[kind])].isna().all(axis=1)
    summed, not_counted, rows = dask.compute(parts.groupby(["group", "block"]).sum(),
                                             undated.sum(), undated.count())
    envelopes = _envelopes(windows, kind, edges, runs, seed) if runs > 0 else {}
    tables = []
    for name in sorted(summed.index.get_level_values("group").unique()):
        counts = summed.xs(name, level="group").reindex(range(len(edges) - 1), fill_value=0.0)
        table = pd.DataFrame({"kind": KIND_NAMES[kind], "group": name,
                              "block_start": edges[:-1], "block_end": edges[1:],
                              "label": blocks.labels(era)})
        for column in COUNT_COLUMNS:
            values = counts[column].to_numpy()
            table[column] = values if column == "expected" else values.round().astype("int64")
        tables.append(table.assign(**envelopes.get(name, {})))
    table = (pd.concat(tables, ignore_index=True) if tables else pd.DataFrame(columns=names))
    table = table[names].astype({"block_start": "int64", "block_end": "int64"})
    table.attrs["methods"] = {KIND_NAMES[kind]: METHODS[kind]}
    table.attrs["rows"], table.attrs["not_counted"] = int(rows), int(not_counted)
    table.attrs["envelope"] = ENVELOPE if runs > 0 else None
    return table


def _envelopes(windows, kind: str, edges: np.ndarray, runs: int, seed: int) -> dict:
    """Per group, the envelope of the count per block: each run's counts summed across the
    partitions first, then the percentiles over the runs."""
    lengths = windows.map_partitions(len).compute()
    offsets = np.concatenate([[0], np.cumsum(lengths)]).tolist()
    simulations = windows.map_partitions(simulate_partition, kind, edges, runs, seed, offsets,
                                         meta=simulation_meta())
    summed = simulations.groupby(["group", "run", "block"])["count"].sum().compute()
    blocks = len(edges) - 1
    found = {}
    for name in summed.index.get_level_values("group").unique():
        counts = np.zeros((runs, blocks), dtype=np.int64)
        part = summed.xs(name, level="group")
        counts[part.index.get_level_values("run"), part.index.get_level_values("block")] = part
        found[name] = envelope(counts)
    return found


def _dask():
    try:
        import dask
    except ImportError:
        raise UsageError("partitioned_activity needs dask",
                         hint="pip install 'timelines[dask]'") from None
    return dask


def _finite_range(windows, kind: str) -> tuple[int | None, int | None]:
    """The smallest and largest finite day of any window, over all partitions."""
    names = WINDOW_COLUMNS[kind]
    finite = windows.replace([math.inf, -math.inf], np.nan)
    lows = [finite[name].min() for name in names[::2]]
    highs = [finite[name].max() for name in names[1::2]]
    found = _dask().compute(*lows, *highs)
    low = [v for v in found[:len(lows)] if not pd.isna(v)]
    high = [v - 1 for v in found[len(lows):] if not pd.isna(v)]
    return (int(min(low + high)) if low or high else None,
            int(max(low + high)) if low or high else None)
