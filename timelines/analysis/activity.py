"""How many were active in each block of time: certain, possible and expected counts, and a
Monte Carlo envelope of the count (Ratcliffe 2000; Crema 2012).

What "active" means depends on what a record is, and the two are never summed together:

- an **event** (a wreck, a find, a letter: one moment somewhere in its window) contributes to
  a block the share of its window inside the block: the aoristic weight (Ratcliffe 2000,
  block weights as Crema 2012). Over all blocks a record's weights sum to 1 (less where its
  window reaches past the blocks asked for);
- a **span** (a life, a reign, a series: the whole interval was occupied) contributes the
  probability that it overlaps the block, its start and end uniform and independent within
  their windows, conditioned on start <= end (the completions where the end would come first
  are not possible, so they are left out and the rest weighed again). A life 1650-1700 counts
  1 in every decade between, not a fifth.

Time is continuous here: a window of days `earliest..latest` (both included) is the interval
[earliest, latest + 1) of fixed days, a moment uniform on it. A block is half-open,
[block_start, block_end): its first day is in it, `block_end` is the first day of the next.

Blocks are whole numbers of calendar years (the calendar the dates were read in, so a year as
written falls in one block), aligned on astronomical year numbers: the block of width N holding
year y begins at the year N * floor(y / N). So decades run 1650-1659 and centuries 1600-1699
(the common usage), and every block, before the era too, is N years long: the decade of
astronomical years -10..-1 is labelled 11 BCE-2 BCE, and [0, 10) is 1 BCE-9 CE. This is the
number line with negative years that published aoristic implementations use (Palmisano, Bevan
& Shennan 2017's blocks of 200 years from 2200 BC); a decade of BC numbers (159-150 BC) would
leave a short block at the era, where the year 0 is missing.

A window with no bound on a side (an open or unknown end, a `before 1700`) cannot be weighed:
such a record counts as possible in every block it can reach (and as certain where it surely
is), but is left out of `expected` and the envelope; the `unweighed` column says how many of
the possible were left out there, and `attrs["unweighed"]` how many in all.
"""
from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass

import numpy as np
import pandas as pd

from ..calendar import HISTORICAL, gregorian_year_from_fixed, year_range, year_text
from ..errors import UsageError
from ..model import EVENT, SPAN, Record
from .calibrated import calibrated_expected, calibrated_points, simulate_calibrated
from .windows import Parts, record_parts
from .windows import event_windows, record_keys, span_windows  # noqa: F401 - this module's API

PERIODS = {"year": 1, "decade": 10, "century": 100, "millennium": 1000}
# The envelope's percentiles of the simulated count per block: the central 95% and the median,
# each an observed count (numpy's "inverted_cdf": the smallest count whose share of runs at or
# below it reaches the percentile), so the band is never a fraction of a record.
ENVELOPE = (2.5, 50.0, 97.5)
MAX_BLOCKS = 200_000
PAIRS_PER_CHUNK = 4_000_000     # record-block pairs held at once (memory bound only)
KIND_NAMES = {EVENT: "events", SPAN: "spans"}
METHODS = {EVENT: "aoristic sum (Ratcliffe 2000; Crema 2012 block weights)",
           SPAN: "probability of overlap, uniform independent ends, start <= end"}
COLUMNS = ["kind", "block_start", "block_end", "label", "certain", "possible", "expected",
           "unweighed"]


@dataclass(frozen=True)
class Blocks:
    """Consecutive blocks of `width` years: `first_years[i]` the astronomical year block i
    begins with, `edges[i]..edges[i+1]` its days, half-open."""

    width: int
    first_years: np.ndarray
    edges: np.ndarray

    def __len__(self) -> int:
        return len(self.first_years)

    def labels(self, era: str = "bce") -> list[str]:
        """`1650–1659`, `11 BCE–2 BCE`, `1 BCE–9 CE`; a block of one year, its year."""
        if self.width == 1:
            return [year_text(int(year), era) for year in self.first_years]
        return [f"{year_text(int(year), era)}–"
                f"{year_text(int(year) + self.width - 1, era, mark_common_era=year <= 0)}"
                for year in self.first_years]


def block_width(per: str | int) -> int:
    """Years in a block: `year`, `decade`, `century`, `millennium`, or a whole number."""
    if isinstance(per, str) and per in PERIODS:
        return PERIODS[per]
    try:
        width = int(per)
    except (TypeError, ValueError):
        width = 0
    if width < 1:
        raise UsageError(f"cannot make blocks of {per!r}",
                         hint="give year, decade, century, millennium or a number of years")
    return width


def blocks_between(first_day: int, last_day: int, width: int,
                   calendar: str = HISTORICAL) -> Blocks:
    """The blocks of `width` years from the one holding `first_day` to the one holding
    `last_day`, years as `calendar` counts them."""
    first, last = (_block_year(day, width, calendar) for day in (first_day, last_day))
    count = (last - first) // width + 1
    if count > MAX_BLOCKS:
        raise UsageError(f"{count:,} blocks of {width} years are too many to count",
                         hint="give a wider --per, or --from/--to")
    years = np.arange(first, last + width, width, dtype=np.int64)
    edges = [year_range(int(year), calendar)[0] for year in years]
    edges.append(year_range(last + width, calendar)[0])
    return Blocks(width, years, np.asarray(edges, dtype=np.float64))


def _block_year(day: int, width: int, calendar: str) -> int:
    """The first year of the block holding `day` (the calendar's years, not Gregorian's)."""
    year = width * math.floor(gregorian_year_from_fixed(day) / width)
    while year_range(year, calendar)[0] > day:
        year -= width
    while year_range(year + width, calendar)[0] <= day:
        year += width
    return year


# -- block indexes and record-block pairs ------------------------------------------------------

def _first_block_reached(edges: np.ndarray, low: np.ndarray) -> np.ndarray:
    """The block holding the moment `low` (-1 before the first, len(blocks) past the last)."""
    return np.searchsorted(edges, low, side="right") - 1


def _last_block_before(edges: np.ndarray, high: np.ndarray) -> np.ndarray:
    """The last block beginning before `high`: the one holding the end of [.., high)."""
    return np.searchsorted(edges, high, side="left") - 1


def _range_counts(first: np.ndarray, last: np.ndarray, blocks: int) -> np.ndarray:
    """How many ranges first..last (clipped to the blocks) cover each block."""
    first, last = np.clip(first, 0, None), np.clip(last, None, blocks - 1)
    some = first <= last
    steps = np.bincount(first[some], minlength=blocks + 1)
    steps -= np.bincount(last[some] + 1, minlength=blocks + 1)
    return np.cumsum(steps)[:blocks]


def _pairs(first: np.ndarray, last: np.ndarray, blocks: int):
    """(record index, block index) for every block of each range first..last, clipped, in
    chunks of at most PAIRS_PER_CHUNK pairs (a record's range never split)."""
    first, last = np.clip(first, 0, None), np.clip(last, None, blocks - 1)
    lengths = np.clip(last - first + 1, 0, None)
    ends = np.cumsum(lengths)
    start = 0
    while start < len(first):
        stop = max(start + 1, int(np.searchsorted(ends, _at(ends, start - 1) + PAIRS_PER_CHUNK,
                                                  side="right")))
        records = np.repeat(np.arange(start, stop), lengths[start:stop])
        offsets = np.arange(len(records)) - np.repeat(ends[start:stop] - lengths[start:stop]
                                                      - _at(ends, start - 1),
                                                      lengths[start:stop])
        yield records, first[records] + offsets
        start = stop


def _at(array: np.ndarray, index: int) -> int:
    return int(array[index]) if index >= 0 else 0


# -- events: the aoristic sum ---------------------------------------------------------------

def event_counts(low: np.ndarray, high: np.ndarray, edges: np.ndarray) -> dict[str, np.ndarray]:
    """Certain, possible and expected (aoristic) counts per block of events in [low, high)."""
    blocks = len(edges) - 1
    first, last = _first_block_reached(edges, low), _last_block_before(edges, high)
    inside = (first == last) & (first >= 0) & (first < blocks)
    weighed = np.isfinite(low) & np.isfinite(high)
    return {"certain": np.bincount(first[inside], minlength=blocks)[:blocks],
            "possible": _range_counts(first, last, blocks),
            "expected": _aoristic_sum(low[weighed], high[weighed], edges),
            "unweighed": _range_counts(first[~weighed], last[~weighed], blocks)}


def _aoristic_sum(low: np.ndarray, high: np.ndarray, edges: np.ndarray) -> np.ndarray:
    """Per block, the sum of each window's share inside it (Crema 2012's block weights)."""
    blocks = len(edges) - 1
    total = np.zeros(blocks)
    first, last = _first_block_reached(edges, low), _last_block_before(edges, high)
    for records, block in _pairs(first, last, blocks):
        inside = (np.minimum(high[records], edges[block + 1])
                  - np.maximum(low[records], edges[block]))
        total += np.bincount(block, inside / (high[records] - low[records]), minlength=blocks)
    return total


# -- spans: the probability of overlap --------------------------------------------------------

def span_counts(s0, s1, t0, t1, edges: np.ndarray) -> dict[str, np.ndarray]:
    """Certain, possible and expected counts per block of spans starting in [s0, s1) and
    ending in [t0, t1). Certain: every completion with start <= end overlaps the block (the
    windows first tightened by start <= end); possible: one does."""
    blocks = len(edges) - 1
    first, last = _first_block_reached(edges, s0), _last_block_before(edges, t1)
    core_first, core_last = _certain_blocks(s0, s1, t0, t1, edges)
    weighed = np.isfinite(s0) & np.isfinite(s1) & np.isfinite(t0) & np.isfinite(t1)
    certain = _range_counts(core_first, core_last, blocks)
    expected = (_range_counts(core_first[weighed], core_last[weighed], blocks)
                + _overlap_sum(*(a[weighed] for a in (s0, s1, t0, t1, first, last,
                                                        core_first, core_last)), edges))
    return {"certain": certain, "possible": _range_counts(first, last, blocks),
            "expected": expected, "unweighed": _range_counts(first[~weighed], last[~weighed],
                                                             blocks)}


def _certain_blocks(s0, s1, t0, t1, edges):
    """The first and last block every completion overlaps: blocks ending at or after the
    latest start and beginning at or before the earliest end, both tightened by start <= end
    (a start cannot come after the latest end, nor an end before the earliest start)."""
    latest_start, earliest_end = np.minimum(s1, t1), np.maximum(t0, s0)
    return (np.searchsorted(edges, latest_start, side="left") - 1,
            np.searchsorted(edges, earliest_end, side="right") - 1)


def _overlap_sum(s0, s1, t0, t1, first, last, core_first, core_last, edges) -> np.ndarray:
    """Per block outside each span's certain blocks, the sum of its probability of overlap."""
    blocks = len(edges) - 1
    core = (np.clip(core_first, 0, None) <= np.clip(core_last, None, blocks - 1))
    before_core = np.where(core, np.clip(core_first, 0, None) - 1, last)
    after_core = np.where(core, np.clip(core_last, None, blocks - 1) + 1, last + 1)
    total = np.zeros(blocks)
    for range_first, range_last in ((first, before_core), (after_core, last)):
        for records, block in _pairs(range_first, range_last, blocks):
            chance = overlap_probability(s0[records], s1[records], t0[records], t1[records],
                                         edges[block], edges[block + 1])
            total += np.bincount(block, chance, minlength=blocks)
    return total


def overlap_probability(s0, s1, t0, t1, block_start, block_end):
    """P(start < block_end and end > block_start | start <= end), start uniform on [s0, s1),
    end on [t0, t1), independent: the area of the part of the rectangle of (start, end) where
    start <= end that overlaps the block, over the area where start <= end (closed form)."""
    origin = s0                      # measured from the earliest start: small numbers, exact
    feasible = _area_start_not_after_end(s0 - origin, s1 - origin, t0 - origin, t1 - origin)
    overlapping = _area_start_not_after_end(
        s0 - origin, np.minimum(s1, block_end) - origin,
        np.maximum(t0, block_start) - origin, t1 - origin)
    return overlapping / feasible


def _area_start_not_after_end(a0, a1, c0, c1):
    """Area of {(x, y): a0 <= x < a1, c0 <= y < c1, x <= y}: the integral over y of
    clip(y, a0, a1) - a0, whose antiderivative is (ramp(y - a0)^2 - ramp(y - a1)^2) / 2."""
    a1, c1 = np.maximum(a1, a0), np.maximum(c1, c0)     # an empty side: no area

    def antiderivative(y):
        return (np.maximum(y - a0, 0) ** 2 - np.maximum(y - a1, 0) ** 2) / 2
    return antiderivative(c1) - antiderivative(c0)


# -- the Monte Carlo envelope (Crema 2012) ---------------------------------------------------

def keyed_uniform(seed: int, keys: np.ndarray, first_run: int, runs: int,
                  draw: int) -> np.ndarray:
    """Uniform numbers in [0, 1), runs x records: run `first_run + r`'s `draw`-th number
    (0 or 1) for the record keyed `keys[i]`. Each number depends only on (seed, key, run,
    draw), never on which records are drawn alongside, so a table cut into partitions or
    groups draws the same numbers for each record. A counter-based generator: SplitMix64's
    output function (Steele, Lea & Flood 2014) over a per-record state, one step per number."""
    with np.errstate(over="ignore"):
        record = _mix64(_mix64(np.uint64(seed % 2 ** 64)) ^ keys.astype(np.uint64))
        steps = (np.arange(first_run, first_run + runs, dtype=np.uint64) * np.uint64(2)
                 + np.uint64(draw + 1)) * _GOLDEN
        bits = _mix64(record[None, :] + steps[:, None])
    bits >>= np.uint64(11)
    uniform = bits.astype(np.float64)
    uniform *= 2.0 ** -53
    return uniform


_GOLDEN = np.uint64(0x9E3779B97F4A7C15)


def _mix64(z):
    """SplitMix64's finaliser: a bijection of 64-bit words that scatters nearby inputs
    (in place on a fresh array `z`; a new one for a scalar)."""
    if np.ndim(z) == 0:
        z = np.array(z, dtype=np.uint64)
    z ^= z >> np.uint64(30)
    z *= np.uint64(0xBF58476D1CE4E5B9)
    z ^= z >> np.uint64(27)
    z *= np.uint64(0x94D049BB133111EB)
    z ^= z >> np.uint64(31)
    return z


def simulate_events(low, high, edges, runs: int, seed: int, keys: np.ndarray) -> np.ndarray:
    """Counts per block (runs x blocks), each run every event's moment drawn uniformly from
    its window (numbers keyed by record: `keyed_uniform`)."""
    blocks = len(edges) - 1
    counts = np.zeros((runs, blocks), dtype=np.int64)
    for first_run, chunk in _run_chunks(runs, len(low)):
        moments = low + keyed_uniform(seed, keys, first_run, chunk, 0) * (high - low)
        block = _first_block_reached(edges, moments)
        inside = (block >= 0) & (block < blocks)
        flat = (np.arange(chunk)[:, None] * blocks + block)[inside]
        counts[first_run:first_run + chunk] = np.bincount(
            flat, minlength=chunk * blocks).reshape(chunk, blocks)
    return counts


def simulate_spans(s0, s1, t0, t1, edges, runs: int, seed: int, keys: np.ndarray) -> np.ndarray:
    """Counts per block (runs x blocks), each run every span's start and end drawn uniformly
    from their windows, given start <= end (drawn exactly, not by rejection; numbers keyed
    by record: `keyed_uniform`)."""
    blocks = len(edges) - 1
    counts = np.zeros((runs, blocks), dtype=np.int64)
    for first_run, chunk in _run_chunks(runs, len(s0)):
        start = draw_start(s0, s1, t0, t1, keyed_uniform(seed, keys, first_run, chunk, 0))
        later = np.maximum(t0, start)
        end = later + keyed_uniform(seed, keys, first_run, chunk, 1) * (t1 - later)
        first = np.clip(_first_block_reached(edges, start), 0, None)
        last = np.clip(_last_block_before(edges, end), None, blocks - 1)
        row = np.broadcast_to(np.arange(chunk)[:, None] * (blocks + 1), first.shape)
        some = first <= last
        steps = np.bincount((row + first)[some], minlength=chunk * (blocks + 1))
        steps -= np.bincount((row + last + 1)[some], minlength=chunk * (blocks + 1))
        counts[first_run:first_run + chunk] = np.cumsum(
            steps.reshape(chunk, blocks + 1), axis=1)[:, :blocks]
    return counts


def draw_start(s0, s1, t0, t1, uniform):
    """Starts drawn from their distribution given start <= end, by its inverse: the density
    of a start x is proportional to the length of the end window after it, t1 - max(t0, x),
    flat before t0 and falling to 0 at t1 (measured from s0, so the numbers stay small)."""
    latest = np.minimum(s1, t1) - s0
    end_low, end_high = t0 - s0, t1 - s0
    bend = np.clip(end_low, 0, latest)                         # where the density bends
    flat = bend * (end_high - end_low)
    falling = ((end_high - bend) ** 2 - (end_high - latest) ** 2) / 2
    mass = uniform * (flat + falling)
    on_flat = mass < flat
    falling_start = end_high - np.sqrt(np.maximum(
        (end_high - bend) ** 2 - 2 * (mass - flat), 0))
    return s0 + np.where(on_flat, mass / (end_high - end_low), falling_start)


def _run_chunks(runs: int, records: int):
    """(first run, runs in the chunk): as many runs at once as PAIRS_PER_CHUNK allows."""
    size = max(1, PAIRS_PER_CHUNK // max(records, 1))
    for first in range(0, runs, size):
        yield first, min(size, runs - first)


def envelope(counts: np.ndarray) -> dict[str, np.ndarray]:
    """The ENVELOPE percentiles of the simulated counts per block: low, median, high."""
    if counts.shape[1] == 0:
        return {name: np.zeros(0) for name in ("low", "median", "high")}
    low, median, high = np.percentile(counts, ENVELOPE, axis=0, method="inverted_cdf")
    return {"low": low, "median": median, "high": high}


# -- the table ---------------------------------------------------------------------------------

def activity(records: Iterable[Record], per: str | int = "decade", start: int | None = None,
             end: int | None = None, group: str | None = None, runs: int = 0, seed: int = 0,
             calendar: str = HISTORICAL, era: str = "bce") -> pd.DataFrame:
    """How many records were active per block of `per` (year, decade, century, millennium or
    a number of years), from the block holding fixed day `start` to the one holding `end`
    (default: the records' earliest and latest bounds). One row per block, per kind of record
    (events and spans are never summed together) and per group when `group` names one
    ("group": the record's group, else a field of the row).

    Columns: `kind` ("events" or "spans"), `group` when asked, `block_start` and `block_end`
    (fixed days; the block is half-open, [block_start, block_end)), `label` (its years, BCE
    aware, no year 0), `certain` (records certainly active in the block), `possible`
    (possibly active), `expected` (events: the aoristic sum, Ratcliffe 2000 with Crema 2012's
    block weights; spans: the sum of each span's probability of overlapping the block, ends
    uniform and independent in their windows given start <= end), `unweighed` (of the
    possible, those whose unbounded windows kept them out of `expected`); with `runs` > 0 the
    Monte Carlo envelope of the count: `low`, `median`, `high`, the 2.5th, 50th and 97.5th
    percentiles over the runs (Crema 2012). Each record's draws depend only on `seed`, its
    key (`record_keys`: its row) and the run, so a group's envelope is the same whether the
    table is grouped, cut into partitions (`partitioned`) or not. `attrs` name the kinds
    held, the methods, the undated records and the unweighed ones in all."""
    width = block_width(per)
    found = record_parts(records if isinstance(records, Sequence) else list(records), group)
    windows = {key: part.windows for key, part in found.parts.items()}
    blocks = _blocks_for(windows.values(), width, start, end, calendar)
    frames = [_part_table(key, part.windows, blocks, runs, seed, era, part.keys, part.members)
              for key, part in found.parts.items()]
    table = _joined(frames, group is not None, runs > 0)
    table.attrs.update(_attrs(found, windows, width, runs))
    return table


def _blocks_for(windows, width: int, start: int | None, end: int | None,
                calendar: str) -> Blocks | None:
    """The blocks from `start` (default: the earliest bound) to `end` (the latest)."""
    bounds = [day for arrays in windows for day in _finite_days(arrays)]
    if start is None:
        start = min((low for low, _ in bounds), default=None)
    if end is None:
        end = max((high for _, high in bounds), default=None)
    if start is None or end is None:
        return None
    if end < start:
        raise UsageError("the blocks would end before they begin")
    return blocks_between(int(start), int(end), width, calendar)


def _finite_days(arrays: tuple[np.ndarray, ...]):
    """The earliest and latest finite day among windows [low, high) (one pair, if any)."""
    lows = np.concatenate([a[np.isfinite(a)] for a in arrays[::2]])
    highs = np.concatenate([a[np.isfinite(a)] - 1 for a in arrays[1::2]])
    days = np.concatenate([lows, highs])
    return [(days.min(), days.max())] if len(days) else []


def _part_table(key: tuple, windows: tuple, blocks: Blocks | None, runs: int,
                seed: int, era: str, keys: np.ndarray, members: Sequence[Record] = ()
                ) -> pd.DataFrame:
    kind, group = key
    if blocks is None:
        return pd.DataFrame()
    edges = blocks.edges
    counts = event_counts(*windows, edges) if kind == EVENT else span_counts(*windows, edges)
    # Calibrated radiocarbon dates weigh by their probability, not their window (calibrated.py).
    dated_by_c14 = calibrated_points(members) if len(members) else np.zeros(0, dtype=bool)
    plain = tuple(array[~dated_by_c14] for array in windows) if dated_by_c14.any() else windows
    if dated_by_c14.any():
        c14 = [members[index] for index in np.flatnonzero(dated_by_c14).tolist()]
        flat = event_counts(*plain, edges) if kind == EVENT else span_counts(*plain, edges)
        counts["expected"] = flat["expected"] + calibrated_expected(c14, edges)
    columns = {"kind": KIND_NAMES[kind], "group": group, "block_start": edges[:-1],
               "block_end": edges[1:], "label": blocks.labels(era), **counts}
    if runs > 0:
        simulation = simulated(kind, plain, edges, runs, seed, keys[~dated_by_c14]
                               if dated_by_c14.any() else keys)
        if dated_by_c14.any():
            simulation += simulate_calibrated(c14, keys[dated_by_c14], edges, runs, seed)
        columns.update(envelope(simulation))
    table = pd.DataFrame(columns)
    return table.astype({"block_start": "int64", "block_end": "int64"})


def simulated(kind: str, windows: tuple, edges, runs: int, seed: int,
              keys: np.ndarray) -> np.ndarray:
    """The simulated counts (runs x blocks) of the weighable records (bounded on every
    side), record i drawn with key `keys[i]`."""
    weighed = np.logical_and.reduce([np.isfinite(a) for a in windows])
    chosen = [a[weighed] for a in windows]
    if kind == EVENT:
        return simulate_events(*chosen, edges, runs, seed, keys[weighed])
    return simulate_spans(*chosen, edges, runs, seed, keys[weighed])


def _joined(frames: list[pd.DataFrame], grouped: bool, simulated: bool) -> pd.DataFrame:
    columns = COLUMNS[:1] + (["group"] if grouped else []) + COLUMNS[1:]
    columns += ["low", "median", "high"] if simulated else []
    frames = [frame for frame in frames if len(frame)]
    if not frames:
        return pd.DataFrame(columns=columns)
    return pd.concat(frames, ignore_index=True)[columns]


def _attrs(found: Parts, windows: dict, width: int, runs: int) -> dict:
    unweighed = {KIND_NAMES[kind]: 0 for kind, _ in windows}
    for (kind, _), arrays in windows.items():
        bounded = np.logical_and.reduce([np.isfinite(a) for a in arrays])
        unweighed[KIND_NAMES[kind]] += int((~bounded).sum())
    kinds = sorted({kind for kind, _ in windows}, key=lambda kind: kind != EVENT)
    return {"kind": found.held, "per": width, "runs": runs,
            "methods": {KIND_NAMES[kind]: METHODS[kind] for kind in kinds},
            "envelope": ENVELOPE if runs else None,
            "undated": found.undated,
            "unweighed": unweighed}
