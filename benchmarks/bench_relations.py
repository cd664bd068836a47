"""Contemporaries speed: all pairs of 3,000 records, vectorised, against a plain Python loop.

    python benchmarks/bench_relations.py            # 3,000 invented lives
    python benchmarks/bench_relations.py --quick    # 600, for a smoke run

`contemporary_pairs` (numpy comparisons over the upper triangle of all pairs) against the
plain double loop over the same tightened windows, in the same run; both must list the same
pairs with the same certainty. Goal: 3,000 records all-pairs in seconds (DESIGN.md section 6).
Also times `relate` (the five-point temporal problem) per pair, for `relate --with`.
"""
from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from timelines.analysis.relations import (  # noqa: E402
    contemporary_pairs, record_bounds, relate)
from timelines.model import Endpoint, Provenance, Record, Span  # noqa: E402

FIRST_DAY = 584_389          # R.D. of 1601-01-01: the invented lives fall in 1600-1900


def invented_lives(count: int, seed: int = 7) -> list[Record]:
    """`count` lives: birth somewhere in a window of up to ten years, death 20-80 years on,
    also in a window; one in twenty with no known death."""
    generator = np.random.default_rng(seed)
    born = FIRST_DAY + generator.integers(0, 300 * 365, count)
    born_width = generator.integers(0, 10 * 365, count)
    died = born + generator.integers(20 * 365, 80 * 365, count)
    died_width = generator.integers(0, 5 * 365, count)
    unknown = generator.random(count) < 0.05
    return [Record(f"life {index}",
                   Span(Endpoint(int(born[index]), int(born[index] + born_width[index])),
                        Endpoint(None, None) if unknown[index] else
                        Endpoint(int(died[index]), int(died[index] + died_width[index]))),
                   Provenance("invented.csv", index + 2), id=f"p{index}")
            for index in range(count)]


def python_loop(records: list[Record]) -> list[tuple[int, int, bool]]:
    """The baseline: each pair compared in Python, the same tests on the same windows."""
    far_past, far_future = -(10**18), 10**18
    bounds = []
    for record in records:
        one = record_bounds(record)
        bounds.append((one.first_earliest, one.first_latest,
                       far_past if one.last_earliest is None else one.last_earliest,
                       far_future if one.last_latest is None else one.last_latest))
    pairs = []
    for i in range(len(bounds)):
        first_earliest, first_latest, last_earliest, last_latest = bounds[i]
        for j in range(i + 1, len(bounds)):
            other = bounds[j]
            if first_earliest <= other[3] and other[0] <= last_latest:
                pairs.append((i, j, first_latest <= other[2] and other[1] <= last_earliest))
    return pairs


def timed(function, *args):
    began = time.perf_counter()
    result = function(*args)
    return result, time.perf_counter() - began


def main() -> None:
    options = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    options.add_argument("--quick", action="store_true")
    count = 600 if options.parse_args().quick else 3000
    records = invented_lives(count)
    frame, vectorised = timed(contemporary_pairs, records)
    looped, plain = timed(python_loop, records)
    assert list(zip(frame["a_index"], frame["b_index"], frame["certain"])) == looped
    pairs = count * (count - 1) // 2
    print(f"{count} records, {pairs:,} pairs; {len(frame):,} possibly contemporary, "
          f"{int(frame['certain'].sum()):,} certainly")
    print(f"contemporary_pairs (numpy):  {vectorised:8.3f} s")
    print(f"plain Python double loop:    {plain:8.3f} s")
    print(f"ratio loop / vectorised:     {plain / vectorised:8.1f}x")
    sample = [(records[i], records[i + 1]) for i in range(0, min(count, 2000) - 1)]
    _, relating = timed(lambda: [relate(a, b) for a, b in sample])
    print(f"relate, per pair:            {relating / len(sample) * 1e6:8.1f} us")


if __name__ == "__main__":
    main()
