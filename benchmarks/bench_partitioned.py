"""Partitioned activity: the dask path against the single-machine path on the same rows, in
the same run (time per row, as a ratio).

    python benchmarks/bench_partitioned.py                       # 1,000,000 rows
    python benchmarks/bench_partitioned.py --rows 10000000       # the issue's 10M target
    python benchmarks/bench_partitioned.py --quick               # 100,000, for a smoke run
    python benchmarks/bench_partitioned.py --rows 2000000 --runs 100   # with the envelope

Invented rows of spans with date texts in many forms (a column repeats its values, as real
ones do), read and counted per decade: on one machine by `load_records` + `activity`, and
by `partitioned_activity` on a dask DataFrame of large partitions (1,000,000 rows each,
dask's threaded local scheduler). The two tables must agree. Goal (issue 11): the dask time
per row within 1.5x of the single-machine time per row.
"""
from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np
import pandas as pd

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from timelines.analysis.activity import activity  # noqa: E402
from timelines.analysis.partitioned import partitioned_activity  # noqa: E402
from timelines.sources import ColumnMap, detect_columns, load_records  # noqa: E402
from timelines.sources.frames import table_from_data  # noqa: E402

FORMS = ["c. {y}", "{y}s", "{y}", "before {y}", "{y}~", "{y}/{z}", "{y}-03/{y}-06", ""]


def invented(rows: int, seed: int = 2) -> pd.DataFrame:
    rng = np.random.default_rng(seed)
    years = rng.integers(1500, 1900, rows)
    lengths = rng.integers(0, 60, rows)
    forms = rng.integers(0, len(FORMS), (2, rows))
    vocabulary = {}

    def text(form: int, year: int) -> str:
        key = (form, year)
        if key not in vocabulary:
            vocabulary[key] = FORMS[form].format(y=year, z=year + 1)
        return vocabulary[key]
    return pd.DataFrame({
        "label": "record",
        "start": [text(f, y) for f, y in zip(forms[0], years)],
        "end": [text(f, y) for f, y in zip(forms[1], years + lengths)]})


def one_machine(frame: pd.DataFrame, runs: int) -> pd.DataFrame:
    table = table_from_data(frame)
    loaded = load_records(table, detect_columns(table.header, ColumnMap()))
    return activity(loaded.records, per="decade", runs=runs, seed=1)


def main() -> None:
    import dask
    import dask.dataframe as dd
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rows", type=int, default=1_000_000)
    parser.add_argument("--quick", action="store_true")
    parser.add_argument("--runs", type=int, default=0, help="with a Monte Carlo envelope")
    args = parser.parse_args()
    rows = 100_000 if args.quick else args.rows
    frame = invented(rows)
    start = time.perf_counter()
    single = one_machine(frame, args.runs)
    single_seconds = time.perf_counter() - start
    partitions = max(1, rows // 1_000_000)
    start = time.perf_counter()
    with dask.config.set(scheduler="threads"):
        split = partitioned_activity(dd.from_pandas(frame, npartitions=partitions),
                                     per="decade", runs=args.runs, seed=1)
    dask_seconds = time.perf_counter() - start
    assert single["certain"].tolist() == split["certain"].tolist()
    assert np.allclose(single["expected"], split["expected"], rtol=1e-9)
    if args.runs:
        assert single["high"].tolist() == split["high"].tolist()
    print(f"{rows:,} rows, {partitions} partition(s), {len(single)} decades, "
          f"{args.runs} Monte Carlo runs")
    print(f"one machine: {single_seconds:.1f} s ({single_seconds / rows * 1e6:.1f} µs a row)")
    print(f"dask:        {dask_seconds:.1f} s ({dask_seconds / rows * 1e6:.1f} µs a row)")
    print(f"ratio: dask takes {dask_seconds / single_seconds:.2f}x the single-machine time "
          "per row, same run")


if __name__ == "__main__":
    main()
