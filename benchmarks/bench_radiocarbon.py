"""Radiocarbon calibration speed: 10,000 distinct invented dates calibrated against IntCal20 by
`calibrate_many` (vectorised over the dates, only over the years each can reach) against a
plain loop of per-date calibrations over the whole curve, in the same run.

    python benchmarks/bench_radiocarbon.py            # 10,000 invented dates
    python benchmarks/bench_radiocarbon.py --quick    # 1,000, for a smoke run

The loop calls `calibrate.__wrapped__` (the same calibration as `calibrate`, without its cache)
for each date; both must keep the same years with the same 95.4% ranges. Also times the
highest-density ranges of every date. Goal: 10,000 distinct dates in a second or two.
"""
from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from timelines.dates.radiocarbon import calibrate, calibrate_many, load_curve  # noqa: E402


def invented_dates(count: int, seed: int = 5) -> tuple[np.ndarray, np.ndarray]:
    """Distinct (age, error) pairs: ages 200-45,000 BP, errors 15-300 years, to 0.1 year."""
    rng = np.random.default_rng(seed)
    ages = np.round(rng.uniform(200, 45_000, count), 1)
    errors = np.round(rng.uniform(15, 300, count), 1)
    pairs = np.unique(np.column_stack([ages, errors]), axis=0)
    return pairs[:, 0], pairs[:, 1]


def loop_whole_curve(ages: np.ndarray, errors: np.ndarray) -> list:
    """The plain loop: one calibration over all 55,001 years of the curve per date."""
    whole_curve = calibrate.__wrapped__
    return [whole_curve(float(age), float(error)) for age, error in zip(ages, errors)]


def timed(function, *args, **kwargs):
    started = time.perf_counter()
    result = function(*args, **kwargs)
    return result, time.perf_counter() - started


def main() -> None:
    options = argparse.ArgumentParser()
    options.add_argument("--quick", action="store_true")
    count = 1_000 if options.parse_args().quick else 10_000
    ages, errors = invented_dates(count)
    _, loading = timed(load_curve, "intcal20")
    many, vectorised = timed(calibrate_many, ages, errors)
    looped, plain = timed(loop_whole_curve, ages, errors)
    ranges, ranging = timed(lambda: [c.ranges(0.954) for c in many])
    for fast, slow, found in zip(many, looped, ranges):
        assert np.array_equal(fast.cal_bp, slow.cal_bp), "kept years differ"
        assert [(r.start_bp, r.end_bp) for r in found] == \
            [(r.start_bp, r.end_bp) for r in slow.ranges(0.954)], "ranges differ"
    years = sum(len(c.cal_bp) for c in many)
    print(f"IntCal20 read and interpolated to single years: {loading:.2f} s")
    print(f"{len(ages):,} distinct dates ({years / len(ages):.0f} years kept on average): "
          f"calibrate_many {vectorised:.2f} s, plain loop over the whole curve {plain:.2f} s, "
          f"ratio {plain / vectorised:.1f}x")
    print(f"95.4% highest-density ranges of all {len(ages):,}: {ranging:.2f} s")


if __name__ == "__main__":
    main()
