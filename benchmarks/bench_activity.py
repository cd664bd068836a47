"""Activity speed: the aoristic sum of 1,000,000 events per decade, vectorised, against a
plain Python loop over the same windows in the same run.

    python benchmarks/bench_activity.py            # 1,000,000 invented finds
    python benchmarks/bench_activity.py --quick    # 100,000, for a smoke run

`activity(records, per="decade")` (windows read from the records, then numpy over
record-block pairs) against a loop that weighs each window's share in each block it touches;
both must give the same sums. Also times the spans' overlap probability on the same windows
read as lives, a 100-run envelope, and its record-keyed random numbers against numpy's
Generator. Goal: 1M records in seconds (DESIGN.md section 6).
"""
from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from timelines.analysis.activity import activity, keyed_uniform  # noqa: E402
from timelines.calendar import GREGORIAN, fixed_from_gregorian  # noqa: E402
from timelines.model import EVENT, Endpoint, Provenance, Record, Span  # noqa: E402

FIRST_DAY = fixed_from_gregorian(1500, 1, 1)     # invented finds fall in 1500-1900
HERE = Provenance("invented.csv", 2)


def invented_finds(count: int, seed: int = 7) -> list[Record]:
    """Events with windows from a day to 60 years, somewhere in 1500-1900."""
    rng = np.random.default_rng(seed)
    low = FIRST_DAY + rng.integers(0, 125_000, count)
    high = low + rng.integers(0, 22_000, count)
    return [Record("find", Span.point(Endpoint(int(a), int(b))), HERE, kind=EVENT)
            for a, b in zip(low, high)]


def as_lives(records: list[Record]) -> list[Record]:
    """The same windows as lives: born in the first tenth, died in the last."""
    lives = []
    for record in records:
        low, high = record.span.start.earliest, record.span.end.latest
        tenth = (high - low) // 10
        lives.append(Record("life", Span(Endpoint(low, low + tenth),
                                         Endpoint(high - tenth, high)), HERE))
    return lives


def loop_aoristic(records: list[Record], edges: list[int]) -> list[float]:
    """The plain loop: each window's share of each block it touches."""
    sums = [0.0] * (len(edges) - 1)
    for record in records:
        low, high = record.span.start.earliest, record.span.end.latest + 1
        for block in range(len(sums)):
            if edges[block] >= high:
                break
            inside = min(high, edges[block + 1]) - max(low, edges[block])
            if inside > 0:
                sums[block] += inside / (high - low)
    return sums


def timed(function, *args, **kwargs):
    started = time.perf_counter()
    result = function(*args, **kwargs)
    return result, time.perf_counter() - started


def main() -> None:
    options = argparse.ArgumentParser()
    options.add_argument("--quick", action="store_true")
    count = 100_000 if options.parse_args().quick else 1_000_000
    finds = invented_finds(count)
    table, vectorised = timed(activity, finds, per="decade", calendar=GREGORIAN)
    edges = [*table["block_start"], int(table["block_end"].iloc[-1])]
    sums, looped = timed(loop_aoristic, finds, edges)
    assert np.allclose(table["expected"], sums, rtol=1e-9, atol=1e-6), "sums differ"
    print(f"{count:,} events, {len(table)} decades: aoristic sum {vectorised:.2f} s, "
          f"plain loop {looped:.2f} s, ratio {looped / vectorised:.1f}x")
    lives = as_lives(finds)
    _, spans = timed(activity, lives, per="decade", calendar=GREGORIAN)
    print(f"{count:,} spans: probability of overlap {spans:.2f} s")
    _, envelope = timed(activity, finds[:100_000], per="decade", runs=100, seed=1,
                        calendar=GREGORIAN)
    print(f"100,000 events, 100 runs: envelope {envelope:.2f} s")
    keys = np.arange(100_000)
    _, keyed = timed(keyed_uniform, 1, keys, 0, 100, 0)
    _, plain = timed(np.random.default_rng(1).random, (100, 100_000))
    print(f"10,000,000 uniform numbers: keyed by record {keyed:.2f} s, numpy Generator "
          f"{plain:.2f} s, ratio {keyed / plain:.1f}x (the price of partition-free draws)")


if __name__ == "__main__":
    main()
