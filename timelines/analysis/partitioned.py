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
3. `count_partition` counts each partition in those blocks (`event_counts`, `span_counts`);
   the counts are sums over records, so the partitions' rows are summed per block.

A date column's reading can depend on the whole column (a column of bare numbers read as
years or as spreadsheet days, say): give `settings` and `date_numbers` so every partition
reads alike. The Monte Carlo envelope is not computed here yet (single machine: `runs`).
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
from .activity import (KIND_NAMES, METHODS, block_width, blocks_between, event_counts,
                       event_windows, span_counts, span_windows)

WINDOW_COLUMNS = {EVENT: ("low", "high"), SPAN: ("s0", "s1", "t0", "t1")}
COUNT_COLUMNS = ("certain", "possible", "expected", "unweighed")


def window_meta(kind: str) -> pd.DataFrame:
    """The empty frame `window_partition` returns for `kind`: float64 days."""
    return pd.DataFrame({name: pd.Series(dtype="float64") for name in WINDOW_COLUMNS[kind]})


def window_partition(frame: pd.DataFrame, kind: str = SPAN, columns: ColumnMap = ColumnMap(),
                     settings: DateSettings = DEFAULT_SETTINGS, date_numbers: str = "years"
                     ) -> pd.DataFrame:
    """Each row's windows in fixed days (NaN: no usable date), in the partition's order."""
    table = table_from_data(frame.reset_index(drop=True))
    loaded = load_records(table, detect_columns(table.header, columns), settings,
                          date_numbers=date_numbers, events=kind == EVENT)
    windows = np.full((len(frame), len(WINDOW_COLUMNS[kind])), np.nan)
    rows = [record.provenance.row for record in loaded.records if record.span is not None]
    dated = [record for record in loaded.records if record.span is not None]
    if dated:
        arrays = event_windows(dated) if kind == EVENT else span_windows(dated)
        windows[np.asarray(rows) - table.first_row] = np.column_stack(arrays)
    return pd.DataFrame(windows, columns=list(WINDOW_COLUMNS[kind]), index=frame.index)


def count_meta() -> pd.DataFrame:
    return pd.DataFrame({"block": pd.Series(dtype="int64"),
                         **{name: pd.Series(dtype="float64") for name in COUNT_COLUMNS}})


def count_partition(windows: pd.DataFrame, kind: str, edges: np.ndarray) -> pd.DataFrame:
    """A partition's counts per block (one row per block) in the global `edges`."""
    usable = windows.dropna()
    arrays = [usable[name].to_numpy(dtype=np.float64) for name in WINDOW_COLUMNS[kind]]
    counts = event_counts(*arrays, edges) if kind == EVENT else span_counts(*arrays, edges)
    return pd.DataFrame({"block": np.arange(len(edges) - 1, dtype=np.int64),
                         **{name: np.asarray(counts[name], dtype=np.float64)
                            for name in COUNT_COLUMNS}})


def partitioned_activity(frame, per: str | int = "decade", kind: str = SPAN,
                         columns: ColumnMap = ColumnMap(), start: int | None = None,
                         end: int | None = None, settings: DateSettings = DEFAULT_SETTINGS,
                         date_numbers: str = "years", calendar: str = HISTORICAL,
                         era: str = "bce") -> pd.DataFrame:
    """The counts per block of the dask DataFrame `frame` (rows of one `kind`), as
    `activity.activity` gives them for the same rows read on one machine: columns kind,
    block_start, block_end, label, certain, possible, expected, unweighed; `attrs` say how
    many rows were read and how many had no usable date (empty or unreadable: `timelines
    check` on a sample names them) and so are in no count."""
    _dask()
    windows = frame.map_partitions(window_partition, kind, columns, settings, date_numbers,
                                   meta=window_meta(kind))
    if start is None or end is None:          # read once, kept for the counting pass
        windows = windows.persist()
        low, high = _finite_range(windows, kind)
        start = low if start is None else start
        end = high if end is None else end
    if start is None or end is None:
        return pd.DataFrame(columns=["kind", "block_start", "block_end", "label",
                                     *COUNT_COLUMNS])
    blocks = blocks_between(int(start), int(end), block_width(per), calendar)
    edges = blocks.edges
    parts = windows.map_partitions(count_partition, kind, edges, meta=count_meta())
    undated = windows.isna().all(axis=1)       # no usable date: counted here, not lost
    summed, not_counted, rows = _dask().compute(parts.groupby("block").sum(), undated.sum(),
                                                undated.count())
    summed = summed.reindex(range(len(edges) - 1), fill_value=0.0)
    table = pd.DataFrame({"kind": KIND_NAMES[kind], "block_start": edges[:-1],
                          "block_end": edges[1:], "label": blocks.labels(era)})
    for name in COUNT_COLUMNS:
        values = summed[name].to_numpy()
        table[name] = values.round().astype("int64") if name != "expected" else values
    table = table.astype({"block_start": "int64", "block_end": "int64"})
    table.attrs["methods"] = {KIND_NAMES[kind]: METHODS[kind]}
    table.attrs["rows"], table.attrs["not_counted"] = int(rows), int(not_counted)
    return table


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
