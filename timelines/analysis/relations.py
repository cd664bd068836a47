"""Allen's interval relations between records dated by windows, and who could have been
contemporaries.

Time on a day grid. A record covers whole days: its start is the instant at the beginning of
its first day, its end the instant at the end of its last day (the beginning of the next).
A span 1650-01-01..1650-12-31 therefore runs from the instant R.D.(1650-01-01) to the instant
R.D.(1651-01-01); every record is a proper interval (start before end), as Allen's algebra
needs; a record *meets* another when its last day is the day before the other's first (the
CIDOC CRM's "ends with the start of"); two records that share a day overlap in some way. An
event (a letter, a find: `Record.kind == "event"`) is one day somewhere in its window.

Each record is first tightened by its own constraint (its first day is not after its last:
the start's latest is at most the end's latest, the end's earliest at least the start's
earliest). A relation (Allen 1983) is a conjunction of `<` and `=` between the four endpoint
instants; it is *possible* when some choice of the four days in their windows satisfies it,
decided exactly as a simple temporal problem over five points (the four instants and a time
origin; Dechter, Meiri & Pearl 1991): the windows and constraints are a distance graph, and
the relation is possible unless adding its constraints makes a negative cycle. It is
*certain* when it is the only possible one. Open and unknown sides are unbounded windows.

Probabilities, when asked for, assume each endpoint uniform over the days of its window,
independent, conditioned on each record's start not after its end. They are exact when the
choices of days are few enough to count every one (up to EXACT_LIMIT pairs of choices: two
events dated to a year each, or spans dated to a month or so), else estimated by Monte Carlo
(numpy, a SeedSequence seed); the output names the method. A window with no
bound has no uniform distribution: the probabilities are then undefined, and say so.
"""
from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass
from functools import cache

import numpy as np
import pandas as pd

from ..dates import parse_endpoint
from ..errors import TimelineError
from ..model import EVENT, Endpoint, Record

# Allen (1983), the thirteen relations of A to B, in his order: each one's converse is its
# mirror in this tuple (before/after, meets/met-by, ..., equals its own).
ALLEN_RELATIONS = ("before", "meets", "overlaps", "finished-by", "contains", "starts",
                   "equals", "started-by", "during", "finishes", "overlapped-by", "met-by",
                   "after")
CONVERSES = dict(zip(ALLEN_RELATIONS, reversed(ALLEN_RELATIONS)))
# The relations in which A and B share no day (they are not contemporaries).
APART = frozenset({"before", "meets", "met-by", "after"})

# The five points of the temporal problem: a time origin and the four endpoint instants.
ORIGIN, A_START, A_END, B_START, B_END = range(5)
_POINTS = 5
# Bounds between the instants that statements add (constraints.Links): (u, v, w), v - u <= w.
Links = tuple[tuple[int, int, float], ...]
Between = Callable[[int, int], Links]
# Each relation's point constraints (Allen 1983, Fig. 2, written as endpoint comparisons).
RELATION_CONSTRAINTS = {
    "before": ((A_END, "<", B_START),),
    "meets": ((A_END, "=", B_START),),
    "overlaps": ((A_START, "<", B_START), (B_START, "<", A_END), (A_END, "<", B_END)),
    "finished-by": ((A_START, "<", B_START), (A_END, "=", B_END)),
    "contains": ((A_START, "<", B_START), (B_END, "<", A_END)),
    "starts": ((A_START, "=", B_START), (A_END, "<", B_END)),
    "equals": ((A_START, "=", B_START), (A_END, "=", B_END)),
    "started-by": ((A_START, "=", B_START), (B_END, "<", A_END)),
    "during": ((B_START, "<", A_START), (A_END, "<", B_END)),
    "finishes": ((B_START, "<", A_START), (A_END, "=", B_END)),
    "overlapped-by": ((B_START, "<", A_START), (A_START, "<", B_END), (B_END, "<", A_END)),
    "met-by": ((B_END, "=", A_START),),
    "after": ((B_END, "<", A_START),),
}
# CIDOC CRM (ISO 21127) endpoint comparisons of A to B, FROM MEMORY of the CRM's properties
# P173-P176 and P182-P185 (names and numbers not checked against the standard's text here):
# each one point constraint between an endpoint of A and one of B.
CRM_RELATIONS = {
    "starts before or with the end of": (A_START, "<=", B_END),      # P173
    "starts before the end of": (A_START, "<", B_END),               # P174
    "starts before or with the start of": (A_START, "<=", B_START),  # P175
    "starts before the start of": (A_START, "<", B_START),           # P176
    "ends before or with the start of": (A_END, "<=", B_START),      # P182
    "ends before the start of": (A_END, "<", B_START),               # P183
    "ends before or with the end of": (A_END, "<=", B_END),          # P184
    "ends before the end of": (A_END, "<", B_END),                   # P185
}
CRM_SOURCE = "CIDOC CRM (ISO 21127) P173-P176, P182-P185, from memory"
BOUNDS_ONLY = "bounds only (no probabilities asked for)"
EXACT_LIMIT = 4_000_000     # choices of days (A's times B's) counted exactly; above: Monte Carlo
_EXACT_CHUNK = 1_000_000    # pairs classified at once: memory stays bounded

# Stand-ins for "no bound" in the day arrays: far past any fixed day, with room to add one.
NO_EARLIEST = np.iinfo(np.int64).min // 4
NO_LATEST = np.iinfo(np.int64).max // 4


@dataclass(frozen=True, slots=True)
class Bounds:
    """A record's days tightened by its own constraint: its first day in
    `first_earliest..first_latest`, its last in `last_earliest..last_latest` (None: no
    bound); `one_day` for an event (first and last the same day)."""

    first_earliest: int | None
    first_latest: int | None
    last_earliest: int | None
    last_latest: int | None
    one_day: bool = False

    @property
    def is_bounded(self) -> bool:
        return None not in (self.first_earliest, self.first_latest, self.last_earliest,
                            self.last_latest)


@dataclass(frozen=True, slots=True)
class Relation:
    """What can be said of how A stands to B: the possible Allen relations (in Allen's
    order), the certain one if only one is possible, the CIDOC CRM endpoint comparisons
    certain and possible, and the probability of each possible relation with the method
    that gave it (empty, and the method saying why, when none was asked for or defined)."""

    a: str
    b: str
    possible: tuple[str, ...]
    certain: str | None
    crm_certain: tuple[str, ...]
    crm_possible: tuple[str, ...]
    probabilities: tuple[tuple[str, float], ...] = ()
    method: str = BOUNDS_ONLY

    def as_dict(self) -> dict:
        return {"a": self.a, "b": self.b, "certain": self.certain,
                "possible": list(self.possible), "crm_source": CRM_SOURCE,
                "crm_certain": list(self.crm_certain), "crm_possible": list(self.crm_possible),
                "probabilities": dict(self.probabilities), "method": self.method}


# --- one record's bounds ---------------------------------------------------------------------

def record_bounds(record: Record) -> Bounds:
    """The record's first and last day windows after its own constraint (first <= last)."""
    if record.span is None:
        raise TimelineError(f"{record_name(record)} has no usable date: nothing to relate")
    start, end = record.span.start, record.span.end
    if record.kind == EVENT:
        return Bounds(start.earliest, end.latest, start.earliest, end.latest, one_day=True)
    return Bounds(start.earliest, _least(start.latest, end.latest),
                  _most(end.earliest, start.earliest), end.latest)


def date_bounds(date: int | str | Endpoint) -> Bounds:
    """A date as one day somewhere in its window: a fixed day, an Endpoint, or a text read
    with `dates.parse_endpoint` (`1650` is a day in 1650, not known which)."""
    if isinstance(date, str):
        date = parse_endpoint(date)
    if isinstance(date, Endpoint):
        return Bounds(date.earliest, date.latest, date.earliest, date.latest, one_day=True)
    return Bounds(int(date), int(date), int(date), int(date), one_day=True)


def record_name(record: Record) -> str:
    """How outputs name a record: its id where it has one, else its label."""
    return record.id if record.id else record.label


def _least(one: int | None, other: int | None) -> int | None:
    return other if one is None else one if other is None else min(one, other)


def _most(one: int | None, other: int | None) -> int | None:
    return other if one is None else one if other is None else max(one, other)


# --- the temporal problem over five points ---------------------------------------------------

def _distance_graph(a: Bounds, b: Bounds, links: Links = ()) -> list[list[float]]:
    """Shortest distances between the five points (`d[u][v]`: the most `v - u` can be),
    from the four instants' windows, each record's own constraint and the `links` between
    them (statements: `constraints.Links`), closed by Floyd-Warshall (five points: a
    handful of steps)."""
    distances = [[0 if u == v else math.inf for v in range(_POINTS)] for u in range(_POINTS)]
    for bounds, start, end in ((a, A_START, A_END), (b, B_START, B_END)):
        for point, low, high in ((start, bounds.first_earliest, bounds.first_latest),
                                 (end, _next(bounds.last_earliest), _next(bounds.last_latest))):
            _tighten(distances, ORIGIN, point, math.inf if high is None else high)
            _tighten(distances, point, ORIGIN, math.inf if low is None else -low)
        _tighten(distances, end, start, -1)                 # start before end, a day apart
        if bounds.one_day:
            _tighten(distances, start, end, 1)              # an event: exactly one day
    for u, v, most in links:
        _tighten(distances, u, v, most)
    for middle in range(_POINTS):
        for u in range(_POINTS):
            for v in range(_POINTS):
                distances[u][v] = min(distances[u][v], distances[u][middle] + distances[middle][v])
    return distances


def _next(day: int | None) -> int | None:
    """The instant ending a day: the beginning of the next."""
    return None if day is None else day + 1


def _tighten(distances: list[list[float]], u: int, v: int, most: float) -> None:
    distances[u][v] = min(distances[u][v], most)


def _edges(constraint: tuple[int, str, int]) -> list[tuple[int, int, int]]:
    """`x < y`, `x <= y` or `x = y` as edges `(u, v, w)` meaning `v - u <= w`."""
    x, comparison, y = constraint
    if comparison == "<":
        return [(y, x, -1)]
    if comparison == "<=":
        return [(y, x, 0)]
    return [(y, x, 0), (x, y, 0)]


def _satisfiable(distances: list[list[float]], constraints) -> bool:
    """Whether the closed graph stays free of negative cycles with `constraints` added, each
    edge checked against the distances and then folded into a copy of them."""
    closed = [row[:] for row in distances]
    for constraint in constraints:
        for u, v, most in _edges(constraint):
            if most + closed[v][u] < 0:
                return False
            for i in range(_POINTS):
                through = closed[i][u] + most
                row = closed[i]
                for j in range(_POINTS):
                    row[j] = min(row[j], through + closed[v][j])
    return True


def _certain(distances: list[list[float]], constraint: tuple[int, str, int]) -> bool:
    """Whether every choice satisfies `constraint`: its negation is unsatisfiable."""
    x, comparison, y = constraint
    negation = (y, "<=", x) if comparison == "<" else (y, "<", x)
    return not _satisfiable(distances, [negation])


# --- relate -----------------------------------------------------------------------------------

def relate(a: Record, b: Record, samples: int | None = None, seed: int = 0,
           links: Links = ()) -> Relation:
    """How record `a` stands to record `b`: the possible and certain Allen relations and
    CIDOC CRM comparisons; with `samples`, the probability of each relation. `links`: what
    statements say between their endpoints (`constraints.Tightened.links.between`)."""
    return relate_bounds(record_bounds(a), record_bounds(b), record_name(a), record_name(b),
                         samples, seed, links)


def relate_bounds(a: Bounds, b: Bounds, a_name: str = "A", b_name: str = "B",
                  samples: int | None = None, seed: int = 0, links: Links = ()) -> Relation:
    distances = _distance_graph(a, b, links)
    possible = tuple(name for name, constraints in RELATION_CONSTRAINTS.items()
                     if _satisfiable(distances, constraints))
    crm_possible = tuple(name for name, constraint in CRM_RELATIONS.items()
                         if _satisfiable(distances, [constraint]))
    crm_certain = tuple(name for name in crm_possible
                        if _certain(distances, CRM_RELATIONS[name]))
    probabilities, method = _probabilities(a, b, possible, samples, seed, links)
    return Relation(a_name, b_name, possible, possible[0] if len(possible) == 1 else None,
                    crm_certain, crm_possible, probabilities, method)


def _probabilities(a: Bounds, b: Bounds, possible: tuple[str, ...], samples: int | None,
                   seed: int, links: Links) -> tuple[tuple[tuple[str, float], ...], str]:
    if samples is None:
        return (), BOUNDS_ONLY
    if not (a.is_bounded and b.is_bounded):
        return (), ("undefined: a window with no bound has no uniform distribution, "
                    "so no probability")
    assumption = ("each endpoint a uniform day of its window, independent, start not after "
                  "end in each record" + (", the statements between them holding"
                                          if links else ""))
    choices = _choices(a) * _choices(b)
    if choices <= EXACT_LIMIT:
        shares = exact_shares(a, b, links)
        method = f"exact: all {choices:,} choices of days counted; {assumption}"
    else:
        shares = relation_shares(a, b, samples, seed, links)
        method = f"Monte Carlo: {samples} samples, seed {seed}; {assumption}"
    return tuple((name, shares[name]) for name in possible), method


def _choices(bounds: Bounds) -> int:
    """How many (first day, last day) pairs a record has, first not after last: for each
    first day, the last days from it (or the window's earliest) to the window's latest."""
    first = np.arange(bounds.first_earliest, bounds.first_latest + 1)
    if bounds.one_day:
        return len(first)
    lasts = bounds.last_latest - np.maximum(first, bounds.last_earliest) + 1
    return int(np.clip(lasts, 0, None).sum())


def _day_pairs(bounds: Bounds) -> tuple[np.ndarray, np.ndarray]:
    """Every (first day, last day) a record can have, first not after last."""
    first = np.arange(bounds.first_earliest, bounds.first_latest + 1)
    if bounds.one_day:
        return first, first
    last = np.arange(bounds.last_earliest, bounds.last_latest + 1)
    first, last = (grid.ravel() for grid in np.meshgrid(first, last, indexing="ij"))
    keep = first <= last
    return first[keep], last[keep]


def exact_shares(a: Bounds, b: Bounds, links: Links = ()) -> dict[str, float]:
    """The probability of each relation, every choice of days counted (uniform days,
    independent, start not after end, given the `links`): exact, for windows small enough
    to enumerate."""
    a_first, a_last = _day_pairs(a)
    b_first, b_last = _day_pairs(b)
    counts = np.zeros(len(ALLEN_RELATIONS), dtype=np.int64)
    rows = max(1, _EXACT_CHUNK // max(1, len(b_first)))
    for at in range(0, len(a_first), rows):       # a block of A's choices against all of B's
        instants = np.broadcast_arrays(a_first[at:at + rows, None],
                                       a_last[at:at + rows, None] + 1,
                                       b_first[None, :], b_last[None, :] + 1)
        keep = _holding(links, instants)
        codes = classify(*(points[keep] for points in instants))
        counts += np.bincount(codes.ravel(), minlength=len(ALLEN_RELATIONS))
    return _shares(counts)


def relation_shares(a: Bounds, b: Bounds, samples: int, seed: int = 0,
                    links: Links = ()) -> dict[str, float]:
    """The share of `samples` draws (uniform days, start not after end) in each relation;
    with `links`, of the draws that keep them (drawn until `samples` are kept, or until
    100 x `samples` draws keep none: then the shares are NaN, the links all but excluding)."""
    a_seed, b_seed = np.random.SeedSequence(seed).spawn(2)
    a_rng, b_rng = np.random.default_rng(a_seed), np.random.default_rng(b_seed)
    counts = np.zeros(len(ALLEN_RELATIONS), dtype=np.int64)
    for _ in range(100):
        instants = (*_draw_days(a, samples, a_rng), *_draw_days(b, samples, b_rng))
        instants = (instants[0], instants[1] + 1, instants[2], instants[3] + 1)
        keep = _holding(links, instants)
        codes = classify(*(points[keep] for points in instants))[:samples - counts.sum()]
        counts += np.bincount(codes, minlength=len(ALLEN_RELATIONS))
        if counts.sum() >= samples:
            break
    return _shares(counts)


def _holding(links: Links, instants) -> np.ndarray:
    """Where the four instants (A's start and end, B's start and end) keep every link."""
    keep = np.ones(np.shape(instants[0]), dtype=bool)
    for u, v, most in links:
        keep &= instants[v - 1] - instants[u - 1] <= most
    return keep


def _shares(counts: np.ndarray) -> dict[str, float]:
    total = counts.sum()
    return {name: float(counts[index] / total) if total else math.nan
            for index, name in enumerate(ALLEN_RELATIONS)}


def _draw_days(bounds: Bounds, samples: int, generator) -> tuple[np.ndarray, np.ndarray]:
    """`samples` pairs (first day, last day), uniform in their windows, by rejection of the
    draws where the first falls after the last."""
    firsts, lasts, kept = [], [], 0
    while kept < samples:
        first = generator.integers(bounds.first_earliest, bounds.first_latest + 1, samples)
        if bounds.one_day:
            last = first
        else:
            last = generator.integers(bounds.last_earliest, bounds.last_latest + 1, samples)
        keep = first <= last
        firsts.append(first[keep])
        lasts.append(last[keep])
        kept += int(keep.sum())
    return np.concatenate(firsts)[:samples], np.concatenate(lasts)[:samples]


def classify(a_start, a_end, b_start, b_end) -> np.ndarray:
    """The index in ALLEN_RELATIONS of each exact pair of intervals (arrays of instants,
    each start before its end), by Allen's definitions."""
    a_start, a_end, b_start, b_end = map(np.asarray, (a_start, a_end, b_start, b_end))
    starts = np.sign(a_start - b_start)     # -1: A starts first, 0 together, 1 after
    ends = np.sign(a_end - b_end)
    codes = np.select(
        [a_end < b_start, a_end == b_start, b_end < a_start, b_end == a_start],
        [0, 1, 12, 11], default=-1)
    # Sharing time: the relation follows from how the starts and the ends compare.
    # Rows: A starts first, together, after; columns: A ends first, together, after.
    shared = np.array([[2, 3, 4], [5, 6, 7], [8, 9, 10]])[starts + 1, ends + 1]
    return np.where(codes >= 0, codes, shared)


def compose(first: str, second: str) -> tuple[str, ...]:
    """Allen's composition: if A `first` B and B `second` C, the relations A may have to C,
    in ALLEN_RELATIONS order. Decided by enumeration: three intervals have six endpoints, so
    every order of them appears among intervals with ends on six points; of those triples
    whose A-B and B-C relations match, the A-C relations found are exactly the possible ones."""
    for name in (first, second):
        if name not in CONVERSES:
            raise TimelineError(f"{name!r} is not one of Allen's relations: "
                                + ", ".join(ALLEN_RELATIONS))
    ab, bc, ac = _all_triples()
    wanted = (ab == ALLEN_RELATIONS.index(first)) & (bc == ALLEN_RELATIONS.index(second))
    return tuple(ALLEN_RELATIONS[code] for code in np.unique(ac[wanted]))


@cache
def _all_triples():
    """Every triple of intervals with ends on six points, and their pairwise relations."""
    pairs = np.array([(s, e) for s in range(6) for e in range(s + 1, 6)])
    index = np.array(np.meshgrid(*(np.arange(len(pairs)),) * 3, indexing="ij")).reshape(3, -1)
    (a0, a1), (b0, b1), (c0, c1) = (pairs[which].T for which in index)
    return classify(a0, a1, b0, b1), classify(b0, b1, c0, c1), classify(a0, a1, c0, c1)



# --- contemporaries ---------------------------------------------------------------------------

def contemporaries(records: list[Record], target: Record | int | str | Endpoint,
                   between: Between | None = None) -> pd.DataFrame:
    """Every record that possibly shares a day with `target` (a record, or a date: a fixed
    day, an Endpoint or a text, read as one day somewhere in its window), and whether it
    certainly does: columns a, b, b_index (the record's place in `records`), certain,
    possible; the certain first, then in table order. `between(i, j)`: the links statements
    make between the records at places i and j (`constraints.Links.between`), weighed
    for the pairs they bind."""
    if isinstance(target, Record):
        bounds, name = record_bounds(target), record_name(target)
    else:
        bounds, name = date_bounds(target), str(target)
    dated = [(index, record) for index, record in enumerate(records)
             if record.span is not None and record is not target]
    days = _day_arrays([record_bounds(record) for _, record in dated])
    mine = _day_arrays([bounds])
    possible = _possibly_share(mine, days, 0, slice(None))
    certain = _certainly_share(mine, days, 0, slice(None))
    if between is not None and isinstance(target, Record):
        _linked_sharing(records, target, dated, between, possible, certain)
    frame = pd.DataFrame({"a": name, "b": [record_name(r) for _, r in dated],
                          "b_label": [r.label for _, r in dated],
                          "b_index": [index for index, _ in dated],
                          "certain": certain, "possible": possible})
    frame = frame[frame["possible"]].sort_values(["certain", "b_index"],
                                                 ascending=[False, True], kind="stable")
    return frame.reset_index(drop=True)


def _linked_sharing(records, target, dated, between, possible, certain) -> None:
    """`possible` and `certain` again, from all their relations, for the pairs that
    statements link (the windows alone can keep a pair the statements part)."""
    place = _place(records, target)
    for row, (index, record) in enumerate(dated):
        links = between(place, index)
        if links:
            found = relate_bounds(record_bounds(target), record_bounds(record), links=links)
            possible[row] = any(name not in APART for name in found.possible)
            certain[row] = bool(found.possible) and APART.isdisjoint(found.possible)


def _place(records: list[Record], target: Record) -> int:
    return next(index for index, record in enumerate(records) if record is target)


def contemporary_pairs(records: list[Record]) -> pd.DataFrame:
    """Every pair of dated records that possibly share a day, vectorised over all pairs:
    columns a, b (names, categorical), a_index, b_index (places in `records`, a_index <
    b_index), certain, possible. Pairs not listed certainly share no day."""
    indexes = [index for index, record in enumerate(records) if record.span is not None]
    days = _day_arrays([record_bounds(records[index]) for index in indexes])
    first, second, certain = _sharing_pairs(days)
    names, codes = np.unique(np.array([record_name(records[index]) for index in indexes],
                                      dtype=object).astype(str), return_inverse=True)
    places = np.asarray(indexes, dtype=np.int64)
    return pd.DataFrame({"a": pd.Categorical.from_codes(codes[first], names),
                         "b": pd.Categorical.from_codes(codes[second], names),
                         "a_index": places[first], "b_index": places[second],
                         "certain": certain, "possible": np.ones(len(first), dtype=bool)})


_ROWS_AT_ONCE = 2048     # rows of the pair matrix compared at once: memory stays bounded


def _sharing_pairs(days: dict[str, np.ndarray]) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """The pairs (i < j) that possibly share a day, and whether certainly: the comparisons
    broadcast over blocks of rows of the pair matrix, the upper triangle kept."""
    found = []
    count = len(days["first_earliest"])
    for top in range(0, count, _ROWS_AT_ONCE):
        rows = slice(top, min(top + _ROWS_AT_ONCE, count))
        block = {name: column[rows, None] for name, column in days.items()}
        possible = _possibly_share(block, days, slice(None), slice(None))
        possible &= np.arange(count)[None, :] > np.arange(rows.start, rows.stop)[:, None]
        row, column = np.nonzero(possible)
        certain = _certainly_share(block, days, slice(None), slice(None))[row, column]
        found.append((row + top, column, certain))
    if not found:
        return np.zeros(0, np.int64), np.zeros(0, np.int64), np.zeros(0, bool)
    return tuple(np.concatenate(parts) for parts in zip(*found))


def _day_arrays(bounds: list[Bounds]) -> dict[str, np.ndarray]:
    """The tightened windows as int64 columns, unbounded sides as far stand-ins."""
    def column(name: str, missing: int) -> np.ndarray:
        return np.array([missing if getattr(one, name) is None else getattr(one, name)
                         for one in bounds], dtype=np.int64)
    return {"first_earliest": column("first_earliest", NO_EARLIEST),
            "first_latest": column("first_latest", NO_LATEST),
            "last_earliest": column("last_earliest", NO_EARLIEST),
            "last_latest": column("last_latest", NO_LATEST)}


def _possibly_share(one: dict, other: dict, mine, theirs) -> np.ndarray:
    """Some choice of days makes the two share a day: each may start by the other's last
    day (the extreme choices satisfy both at once, the windows being tightened)."""
    return ((one["first_earliest"][mine] <= other["last_latest"][theirs])
            & (other["first_earliest"][theirs] <= one["last_latest"][mine]))


def _certainly_share(one: dict, other: dict, mine, theirs) -> np.ndarray:
    """Every choice of days makes the two share a day: each starts by the other's end at
    the latest start and the earliest end."""
    return ((one["first_latest"][mine] <= other["last_earliest"][theirs])
            & (other["first_latest"][theirs] <= one["last_earliest"][mine]))


def relations_with(records: list[Record], target: Record,
                   between: Between | None = None) -> pd.DataFrame:
    """How `target` stands to every other dated record: columns a, b, b_label, b_index,
    certain (the certain relation, or None), possible (the possible ones, space-separated);
    `between` as for `contemporaries`."""
    bounds, name = record_bounds(target), record_name(target)
    place = _place(records, target) if between is not None else None
    rows = []
    for index, record in enumerate(records):
        if record.span is None or record is target:
            continue
        links = between(place, index) if between is not None else ()
        found = relate_bounds(bounds, record_bounds(record), name, record_name(record),
                              links=links)
        rows.append({"a": name, "b": found.b, "b_label": record.label, "b_index": index,
                     "certain": found.certain, "possible": " ".join(found.possible)})
    return pd.DataFrame(rows, columns=["a", "b", "b_label", "b_index", "certain", "possible"])
