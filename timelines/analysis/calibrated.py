"""Calibrated radiocarbon dates in the activity counts: each contributes its probability per
block, not a flat share of its window (the summed probability of the dates).

A record dated by one calibrated radiocarbon age (a point whose endpoint carries
`Endpoint.radiocarbon`, dates/c14.py) is one moment whose calendar year has the calibrated
probability; its weight in a block is the probability of the years inside it, and in each
Monte Carlo run its year is drawn from that probability (by the inverse of its cumulative sum,
from the record's keyed numbers, so the draws do not depend on grouping or partitions). Its
certain and possible counts follow its window, the 95.4% ranges, as every record's do.

A summed probability is not a count of people or of events: the shape of the calibration
curve alone puts peaks and troughs in it (Crema 2024, from memory); docs/analysis.md says so.
A span whose two ends are calibrated dates keeps the uniform reading of its windows.
"""
from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from ..columnar import RecordColumns
from ..model import Record


def calibrated_points(records: Sequence[Record]) -> np.ndarray:
    """Which records are one calibrated radiocarbon date (a boolean per record)."""
    if isinstance(records, RecordColumns):
        facts = records.span_facts()
        return (facts.dated & facts.point & facts.start_radiocarbon)[records.codes()]
    return np.array([record.span is not None and record.span.is_point
                     and record.span.start.radiocarbon is not None for record in records],
                    dtype=bool)


def _profile(record: Record) -> tuple[np.ndarray, np.ndarray]:
    """(middle day of each year, its probability) of a calibrated date."""
    days, density = record.span.start.radiocarbon.yearly()
    return np.asarray(days, dtype=np.float64), np.asarray(density, dtype=np.float64)


def calibrated_expected(records: Sequence[Record], edges: np.ndarray) -> np.ndarray:
    """The summed probability per block [edges[i], edges[i+1]) of the calibrated dates."""
    blocks = len(edges) - 1
    total = np.zeros(blocks)
    for record in records:
        days, probability = _profile(record)
        block = np.searchsorted(edges, days, side="right") - 1
        inside = (block >= 0) & (block < blocks)
        total += np.bincount(block[inside], weights=probability[inside], minlength=blocks)
    return total


def simulate_calibrated(records: Sequence[Record], keys: np.ndarray, edges: np.ndarray,
                        runs: int, seed: int) -> np.ndarray:
    """Counts per block (runs x blocks), each run each date's year drawn from its calibrated
    probability with the record's keyed numbers."""
    from .activity import keyed_uniform            # activity imports this module
    blocks = len(edges) - 1
    counts = np.zeros((runs, blocks), dtype=np.int64)
    if not len(records):
        return counts
    uniform = keyed_uniform(seed, np.asarray(keys), 0, runs, 0)       # runs x records
    for column, record in enumerate(records):
        days, probability = _profile(record)
        cumulative = np.cumsum(probability)
        chosen = np.minimum(np.searchsorted(cumulative, uniform[:, column] * cumulative[-1],
                                            side="right"), len(days) - 1)
        block = np.searchsorted(edges, days[chosen], side="right") - 1
        inside = (block >= 0) & (block < blocks)
        np.add.at(counts, (np.flatnonzero(inside), block[inside]), 1)
    return counts
