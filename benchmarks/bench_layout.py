"""Layout speed: lane packing against a naive first fit, and a register through `lanes`.

    python benchmarks/bench_layout.py            # 1,000,000 spans; a 200,000-row register
    python benchmarks/bench_layout.py --quick    # a tenth of each, for a smoke run

1. Packing. `pack_lanes` (a sweep over sorted starts and ends with a heap of free lanes,
   O(n log n)) against the textbook naive first fit (each box, in start order, scans the
   lanes from the top for the first whose last box has ended: O(n * lanes)), on the same
   spans, in the same run; both must give the same lanes. Goal: 1,000,000 spans in at most
   1.5 s. The time per n log n at growing n shows the order of growth.
2. A register. An invented 200,000-row register (gallery/register/make_register.py) read,
   parsed, checked, laid out and written as the `timelines lanes --format csv` rows, against
   `pandas.read_csv` reading the same file's cells as text (as bench_big.py reads them). The
   goal is DESIGN.md's for whole runs, `lanes` within 6x read_csv, which bench_big.py measures
   process against process (start-up and imports included); here each stage is timed apart
   in one process, so a slow stage shows; and the least any run must do (reading the cells as
   text, parsing each distinct date once, the lane sweep, writing the finished text), each
   part timed alone, shows how much of the time is left for everything else.
"""
from __future__ import annotations

import argparse
import io
import math
import random
import sys
import tempfile
import time
from functools import partial
from operator import attrgetter
from pathlib import Path

import numpy as np
import pandas as pd

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "gallery" / "register"))

import make_register  # noqa: E402

from timelines.chart import ChartOptions, lay_out  # noqa: E402
from timelines.check import check  # noqa: E402
from timelines.dates import parse_column  # noqa: E402
from timelines.layout import LaneSettings, group_tree, lane_rules, max_overlap_depth, pack_lanes  # noqa: E402
from timelines.layout import report as lane_report  # noqa: E402
from timelines.scene.measure import chart_scale  # noqa: E402
from timelines.sources import ColumnMap, detect_columns, load_records, read_table  # noqa: E402
from timelines.sources.fields import column_reader  # noqa: E402


def spans(count: int, mean_days: float, seed: int = 1) -> list[tuple[float, float]]:
    """Starts over 10,000 years, exponential lengths: a depth of about count*mean/range."""
    rng = random.Random(seed)
    result = []
    for _ in range(count):
        start = rng.uniform(0, 3_652_425.0)
        result.append((start, start + rng.expovariate(1 / mean_days)))
    return result


def naive_first_fit(boxes: list[tuple[float, float]]) -> list[int]:
    lanes = [0] * len(boxes)
    lane_ends: list[float] = []
    for index in sorted(range(len(boxes)), key=lambda i: boxes[i][0]):
        start, end = boxes[index]
        for lane, last_end in enumerate(lane_ends):
            if last_end < start:
                lane_ends[lane] = end
                break
        else:
            lane = len(lane_ends)
            lane_ends.append(end)
        lanes[index] = lane
    return lanes


def timed(work, repeat: int = 1):
    best, result = math.inf, None
    for _ in range(repeat):
        began = time.perf_counter()
        result = work()
        best = min(best, time.perf_counter() - began)
    return best, result


def bench_packing(count: int) -> None:
    print(f"packing: {count:,} spans")
    for mean, label in ((300.0, "shallow"), (4000.0, "deep")):
        boxes = spans(count, mean)
        ours, lanes = timed(lambda: pack_lanes(boxes))
        depth = max_overlap_depth(boxes)
        assert max(lanes) + 1 == depth, "pack_lanes must use the overlap depth in lanes"
        naive, naive_lanes = timed(lambda: naive_first_fit(boxes))
        assert naive_lanes == lanes, "both give each box the lowest free lane"
        print(f"  {label:8} depth {depth:5}: pack_lanes {ours:6.2f} s"
              f"{' (goal <= 1.5 s)' if count >= 1_000_000 else ''}, naive first fit "
              f"{naive:6.2f} s: {naive / ours:5.1f}x slower")
    print("  order of growth (shallow spans): seconds per n log2 n")
    for size in (count // 100, count // 10, count):
        boxes = spans(size, 300.0, seed=size)
        seconds, _ = timed(lambda: pack_lanes(boxes), repeat=3 if size < count else 1)
        per_step = 1e9 * seconds / (size * math.log2(size))
        print(f"    n = {size:>9,}: {seconds:6.3f} s, {per_step:5.1f} ns per n log2 n")


def bench_register(rows: int) -> None:
    print(f"register: {rows:,} rows through read, parse, check, layout and CSV output")
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "register.csv"
        make_register.main(["--rows", str(rows), "-o", str(path)])
        # The cells as text, as bench_big's baseline reads them (pandas 3 reads a plain
        # read_csv's strings into Arrow, which is no reading of a table as it is written).
        baseline, _ = timed(lambda: pd.read_csv(path, dtype=str, keep_default_na=False),
                            repeat=3)
        given = ColumnMap(start="admitted", end="left", label="name", id="ref", group="craft")
        options = ChartOptions(columns=given, lanes=LaneSettings())
        stages: dict[str, float] = {}

        def stage(name, work):
            seconds, result = timed(work)
            stages[name] = seconds
            return result

        table = stage("read_table", lambda: read_table(path))
        columns = detect_columns(table.header, given)
        loaded = stage("parse (load_records)", lambda: load_records(table, columns))
        stage("check", lambda: check(loaded))
        dated = [r for r in loaded.records if r.span is not None]

        def layout():
            rules, gap = lane_rules(options.lanes, partial(column_reader, columns, table.header))
            tree = group_tree(dated, attrgetter("group"), rules)
            scale = chart_scale(dated, options.theme, tree)
            return lay_out(loaded.records, scale, options.theme, rules, gap, tree=tree)

        placement = stage("layout (group, measure, pack)", layout)
        stage("csv output", lambda: lane_report.write_csv(placement, io.StringIO()))
        floors = least_work(path, table, columns, placement)
    total = sum(stages.values())
    print(f"  pandas.read_csv: {baseline:.2f} s (best of 3)")
    for name, seconds in stages.items():
        print(f"  {name:30} {seconds:6.2f} s  {seconds / baseline:5.1f}x read_csv")
    print(f"  {'total':30} {total:6.2f} s  {total / baseline:5.1f}x read_csv "
          "(in one process; whole runs: bench_big.py, goal <= 6x)")
    without_sources = total - stages["read_table"] - stages["parse (load_records)"]
    print(f"  {'after the records exist':30} {without_sources:6.2f} s  "
          f"{without_sources / baseline:5.1f}x read_csv")
    print("  the least any run must do, each part timed alone:")
    running = 0.0
    for name, seconds in floors.items():
        running += seconds
        print(f"    {name:40} {seconds:6.2f} s  {seconds / baseline:5.1f}x read_csv, "
              f"{running / baseline:5.1f}x so far")


def least_work(path: Path, table, columns, placement) -> dict[str, float]:
    """What no implementation of the job can skip, each part timed alone with nothing else:
    reading every cell as text, parsing each distinct date cell once, the lane sweep over the
    final boxes, writing each box bound as a number, and writing the finished output text."""
    read, _ = timed(lambda: pd.read_csv(path, dtype=object, keep_default_na=False,
                                        na_filter=False), repeat=3)
    date_columns = [table.columns[table.header.index(name)]
                    for name in (columns.start, columns.end)]
    distinct = [list(dict.fromkeys(column)) for column in date_columns]
    parse, _ = timed(lambda: [parse_column(values) for values in distinct], repeat=3)
    boxes = [[(p.box_start, p.box_end) for p in group.records]
             for _, group in placement.leaves()]
    sweep, _ = timed(lambda: [pack_lanes(group, placement.gap) for group in boxes], repeat=3)
    bounds = np.array([bound for group in boxes for box in group for bound in box])
    numbers, _ = timed(lambda: lane_report.day_texts(bounds), repeat=3)
    text = io.StringIO()
    lane_report.write_csv(placement, text)
    lines = text.getvalue().splitlines()
    write, _ = timed(lambda: io.StringIO().write("\n".join(lines)), repeat=3)
    return {"cells read as text (pandas)": read,
            f"distinct date cells parsed ({sum(map(len, distinct)):,})": parse,
            "lane sweep over the final boxes": sweep,
            f"box bounds written as numbers ({len(bounds):,})": numbers,
            "output text written": write}


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="a tenth of the sizes")
    args = parser.parse_args()
    scale = 10 if args.quick else 1
    bench_packing(1_000_000 // scale)
    bench_register(200_000 // scale)


if __name__ == "__main__":
    main()
