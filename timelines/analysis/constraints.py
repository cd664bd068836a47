"""Statements between records as a simple temporal network (Dechter, Meiri & Pearl 1991):
every bound tightened, every contradiction named by the rows that make it.

A statement says how two records lie in time ("the will before the death", "the child's
birth at least 12y after the parent's", "the apprenticeship lasts 7y"). The network's nodes
are an origin (fixed day 0) and the start and the end instant of every record; each window is
a pair of edges from the origin (`earliest <= x <= latest`), each record starts no later than
it ends, and each statement is one or two edges `low <= later - earlier <= high`. In the
distance graph an edge i -> j of weight w says `x_j - x_i <= w`; the shortest path from the
origin to x is x's latest day, minus the shortest path from x to the origin its earliest. A
cycle of negative weight is a set of statements and windows that cannot all hold.

Relations (A RELATION B [GAP]; the gap is the distance from the earlier instant to the later):

    before / ends before the start of      A's end .. B's start   (gap 0.. by default)
    after / starts after the end of        B's end .. A's start
    starts before the start of             A's start .. B's start  (also: ... end of)
    ends before the end of                 A's end .. B's end      (also: ... start of = before)
    starts after the start of / ends after the end of / starts after the end of: the reverse
    during                                 B's start .. A's start and A's end .. B's end
    contains                               the reverse of during
    same start / same end / equals         those instants the same day
    lasts GAP                              A's start .. A's end (no B)

"Before" allows the same day: a day holds both a will and a death. A gap is `7y` (exactly, as
near as days allow), `12y..` (at least), `..5y` (at most), `7y..10y`, in d, w, mo or y; a
year is 365.2425 days (the Gregorian mean: 146097 days in 400 years), and a gap of whole years
becomes the days any such calendar stretch can hold (7y: 2556..2557 days).

Tightening: Floyd–Warshall (numpy, one vectorised step per node) on networks up to
SMALL_NETWORK nodes (about 250 records): it gives the minimal network, every pair's tightest
distance, in n^3 = 1.25e8 elementary steps, under a second. Larger networks (the benchmark's
10,000 records and 20,000 statements: 20,001 nodes, about 80,000 edges) would need 8e12 steps
and 3 GB for the matrix; there Bellman–Ford runs from the origin, forwards for the latest
days and on the reversed graph for the earliest ones, each round one numpy pass over the
edges, as many rounds as the longest chain of statements (O(rounds x edges)); a negative cycle
is found as a cycle of the predecessor graph (Tarjan's subtree-disassembly idea, checked every
round), from a virtual source joined to every node. The contradiction reported on a small
network is the negative cycle with the fewest edges (walks of 1, 2, 3... edges over the nodes
Floyd–Warshall found on negative cycles: the first negative closed walk is a simple cycle);
on a large one, the cycle Bellman–Ford met first.
"""
from __future__ import annotations

import math
import re
from dataclasses import dataclass, replace
from functools import partial
from pathlib import Path

from ..errors import UsageError, did_you_mean
from ..model import Endpoint, Qualifier, Record, Span
from ..sources import read_table
from .network import (  # noqa: F401  (minimal_network: the all-pairs answer, for callers)
    INF, Contradiction, Network, Reason, bellman_ford, distances_from, floyd_warshall,
    minimal_network,
)

SMALL_NETWORK = 500                     # nodes: Floyd–Warshall up to here, Bellman–Ford above
DAYS_PER_UNIT = {"d": 1.0, "w": 7.0, "mo": 365.2425 / 12, "y": 365.2425}
_UNIT_WORDS = {"day": "d", "days": "d", "week": "w", "weeks": "w", "month": "mo",
               "months": "mo", "yr": "y", "year": "y", "years": "y"}
_AMOUNT = re.compile(r"\s*(\d+(?:\.\d*)?|\.\d+)\s*([a-z]+)\s*", re.IGNORECASE)

# relation -> the terms it makes: (earlier instant, later instant, default gap); "A"/"B" the
# statement's first and second record. A given gap applies to the first term.
_ANY = (0.0, INF)
_SAME = (0.0, 0.0)
RELATIONS = {
    "before": ((("A", "end"), ("B", "start"), _ANY),),
    "ends before the start of": ((("A", "end"), ("B", "start"), _ANY),),
    "after": ((("B", "end"), ("A", "start"), _ANY),),
    "starts after the end of": ((("B", "end"), ("A", "start"), _ANY),),
    "starts before the start of": ((("A", "start"), ("B", "start"), _ANY),),
    "starts before the end of": ((("A", "start"), ("B", "end"), _ANY),),
    "ends before the end of": ((("A", "end"), ("B", "end"), _ANY),),
    "starts after the start of": ((("B", "start"), ("A", "start"), _ANY),),
    "ends after the end of": ((("B", "end"), ("A", "end"), _ANY),),
    "ends after the start of": ((("B", "start"), ("A", "end"), _ANY),),
    "during": ((("B", "start"), ("A", "start"), _ANY), (("A", "end"), ("B", "end"), _ANY)),
    "contains": ((("A", "start"), ("B", "start"), _ANY), (("B", "end"), ("A", "end"), _ANY)),
    "same start": ((("A", "start"), ("B", "start"), _SAME),),
    "same end": ((("A", "end"), ("B", "end"), _SAME),),
    "equals": ((("A", "start"), ("B", "start"), _SAME), (("A", "end"), ("B", "end"), _SAME)),
    "lasts": ((("A", "start"), ("A", "end"), _ANY),),
}
_COLUMN_NAMES = {"first": ("a", "first", "record", "from", "subject", "id"),
                 "relation": ("relation", "relation to", "statement", "is"),
                 "second": ("b", "second", "other", "to", "object"),
                 "gap": ("gap", "by", "distance", "duration")}


@dataclass(frozen=True, slots=True)
class Gap:
    """`low <= later - earlier <= high` in days (INF: no upper limit), as written."""

    low: float
    high: float
    text: str


@dataclass(frozen=True, slots=True)
class Statement:
    """One row of the statements table: `first RELATION second [gap]`."""

    first: str
    relation: str
    second: str
    gap: Gap | None
    source: str
    row: int

    def __str__(self) -> str:
        return f"{self.source}:{self.row}"


def parse_gap(text: str) -> Gap:
    """`7y` (as near as whole days allow), `12y..`, `..5y`, `7y..10y`; units d, w, mo, y."""
    low_text, dots, high_text = str(text).strip().partition("..")
    if not dots:
        days = _days(low_text, text)
        return Gap(math.floor(days), math.ceil(days), str(text).strip())
    low = math.floor(_days(low_text, text)) if low_text.strip() else 0.0
    high = math.ceil(_days(high_text, text)) if high_text.strip() else INF
    if low > high:
        raise UsageError(f"the gap {text!r} runs backwards", hint="write the shorter first")
    return Gap(low, high, str(text).strip())


def _days(amount: str, text: str) -> float:
    found = _AMOUNT.fullmatch(amount)
    unit = found.group(2).lower() if found else ""
    unit = _UNIT_WORDS.get(unit, unit)
    if unit not in DAYS_PER_UNIT:
        raise UsageError(f"cannot read the gap {text!r}",
                         hint="a number and a unit: 7y, 12y.., ..5y, 7y..10y, 30d, 6mo, 2w")
    return float(found.group(1)) * DAYS_PER_UNIT[unit]


def read_statements(path: str | Path) -> list[Statement]:
    """The statements of a table file (CSV, TSV, XLSX, ODS), rows numbered as a spreadsheet
    numbers them. Columns by name: first record (a, first, record, id), relation, second
    record (b, second, other), gap (optional); or the first three or four columns."""
    table = read_table(path)
    roles = _statement_columns(table.header)
    statements = []
    for index, row in enumerate(table.rows):
        cells = {role: str(row[column]).strip() for role, column in roles.items()}
        if any(cells.values()):
            statements.append(_statement(cells, table.source, table.first_row + index))
    return statements


def _statement_columns(header: tuple[str, ...]) -> dict[str, int]:
    folded = [name.strip().lower() for name in header]
    roles = {}
    for role, names in _COLUMN_NAMES.items():
        found = [folded.index(name) for name in names if name in folded]
        if found:
            roles[role] = found[0]
    if not {"first", "relation", "second"} <= roles.keys():
        roles = dict(zip(("first", "relation", "second", "gap"), range(len(header))))
    return roles


def _statement(cells: dict[str, str], source: str, row: int) -> Statement:
    relation = " ".join(cells.get("relation", "").lower().replace("-", " ").split())
    where = f"{source}:{row}"
    if relation not in RELATIONS:
        raise UsageError(f"{where}: cannot read the relation {relation!r}",
                         hint=did_you_mean(relation, RELATIONS) or
                         "one of: " + ", ".join(RELATIONS))
    gap = parse_gap(cells["gap"]) if cells.get("gap") else None
    if relation == "lasts" and gap is None:
        raise UsageError(f"{where}: 'lasts' needs a gap, such as 7y")
    return Statement(cells["first"], relation, cells.get("second", ""), gap, source, row)


@dataclass(frozen=True, slots=True)
class Narrowing:
    """One bound of one record narrowed, and the statements that narrowed it."""

    record: Record
    side: str                       # "start" or "end"
    before: Endpoint
    after: Endpoint
    statements: tuple[Statement, ...]

    def __str__(self) -> str:
        by = ", ".join(map(str, self.statements)) or f"its own {_other(self.side)}"
        return (f"{_row(self.record)} {self.side}: {_window(self.before)} → "
                f"{_window(self.after)}, by {by}")


class Links:
    """What the statements say between two records' endpoints beyond their narrowed windows:
    "the will before the death" narrows both windows, but also puts the will's day before
    the death's in every completion, which the windows alone forget. `between(i, j)` gives
    those bounds for the records at places i and j of the table, as `relations.relate`
    takes them; distances are found on demand by Bellman–Ford from each endpoint asked."""

    def __init__(self, network: Network, places: dict[int, int]):
        self._network, self._places = network, places
        self._rows: dict[int, object] = {}

    def __contains__(self, place: int) -> bool:
        return place in self._places

    def between(self, first: int, second: int) -> tuple[tuple[int, int, float], ...]:
        """Edges (u, v, w), `v - u <= w` between the instants A_START, A_END (the record at
        `first`), B_START, B_END (at `second`): a start instant is its first day, an end
        instant the day after its last (relations' time grid). Empty: no statement binds."""
        from .relations import A_END, A_START, B_END, B_START   # relations loads pandas
        points = []
        for place, start, end in ((first, A_START, A_END), (second, B_START, B_END)):
            if place in self._places:
                index = self._places[place]
                points += [(self._network.node(index, "start"), start, 0),
                           (self._network.node(index, "end"), end, 1)]
        edges = []
        for node, point, shift in points:
            row = self._from(node)
            edges += [(point, other, float(row[to]) + other_shift - shift)
                      for to, other, other_shift in points
                      if other != point and row[to] < INF]
        return tuple(edges)

    def _from(self, node: int):
        if node not in self._rows:
            self._rows[node] = distances_from(self._network, node)
        return self._rows[node]


@dataclass(frozen=True, slots=True)
class Tightened:
    """The records with narrowed windows (the same order; untouched ones as they were), what
    narrowed and what contradicts, the method that found it, and the statements' `links`
    between records (None when they contradict)."""

    records: tuple[Record, ...]
    narrowed: tuple[Narrowing, ...]
    contradictions: tuple[Contradiction, ...]
    method: str
    links: Links | None = None

    @property
    def consistent(self) -> bool:
        return not self.contradictions

    def as_dict(self) -> dict:
        """The outcome as plain data for JSON: windows as texts and as fixed days (R.D.;
        null for an open side), statements as `file:row`, each item with its line."""
        return {
            "method": self.method, "consistent": self.consistent,
            "narrowed": [{"row": n.record.provenance.row, "id": n.record.id, "side": n.side,
                          "before": _window(n.before), "after": _window(n.after),
                          "before_days": [n.before.earliest, n.before.latest],
                          "after_days": [n.after.earliest, n.after.latest],
                          "statements": [str(s) for s in n.statements], "line": str(n)}
                         for n in self.narrowed],
            "contradictions": [{"statements": [str(s) for s in c.statements],
                                "reasons": [r.text for r in c.reasons],
                                "excess_days": c.excess, "line": str(c)}
                               for c in self.contradictions],
        }

    def lines(self) -> list[str]:
        if self.contradictions:
            return [f"contradiction: {c}" for c in self.contradictions]
        return [f"narrowed: {n}" for n in self.narrowed]


def _row(record: Record) -> str:
    return f"row {record.provenance.row}"


def _other(side: str) -> str:
    return "end" if side == "start" else "start"


def _window(endpoint: Endpoint) -> str:
    return str(replace(endpoint, qualifiers=frozenset(), likely=None))


def _network(records: list[Record], statements: list[Statement]) -> Network:
    network = Network(records)
    for index, record in enumerate(records):
        _add_record(network, index, record)
    keys = _keys(records)
    for statement in statements:
        _add_statement(network, statement, keys)
    return network


def _keys(records: list[Record]) -> dict[str, int]:
    keys = {record.label: index for index, record in enumerate(records)}
    keys.update({record.id: index for index, record in enumerate(records) if record.id})
    return keys


def _add_record(network: Network, index: int, record: Record) -> None:
    start, end = network.node(index, "start"), network.node(index, "end")
    network.add(start, end, 0, INF, Reason(partial(_in_order, record), record=record))
    if record.span is None:
        return
    for side, node in (("start", start), ("end", end)):
        endpoint = getattr(record.span, side)
        low = -INF if endpoint.earliest is None else endpoint.earliest
        high = INF if endpoint.latest is None else endpoint.latest
        network.add(0, node, low, high,
                    Reason(partial(_in_window, record, side, endpoint), record=record))


def _in_order(record: Record) -> str:
    return f"{_row(record)} ({record.label}) starts no later than it ends"


def _in_window(record: Record, side: str, endpoint: Endpoint) -> str:
    return f"{_row(record)} ({record.label}, {side} {_window(endpoint)})"


def _add_statement(network: Network, statement: Statement, keys: dict[str, int]) -> None:
    named = {"A": statement.first, "B": statement.second or statement.first}
    for name in named.values():
        if name not in keys:
            raise UsageError(f"{statement}: no record {name!r}",
                             hint=did_you_mean(name, keys) or "name records by their id")
    records = network.records
    words = f"{records[keys[named['A']]].label} {statement.relation}"
    if statement.relation != "lasts":
        words += f" {records[keys[named['B']]].label}"
    text = f"{statement} ({words}{' ' + statement.gap.text if statement.gap else ''})"
    reason = Reason(partial(str, text), statement=statement)
    for number, (earlier, later, (low, high)) in enumerate(RELATIONS[statement.relation]):
        if number == 0 and statement.gap is not None:
            low, high = statement.gap.low, statement.gap.high
        network.add(network.node(keys[named[earlier[0]]], earlier[1]),
                    network.node(keys[named[later[0]]], later[1]), low, high, reason)


def tighten(records: list[Record], statements: list[Statement]) -> Tightened:
    """`records` with every window narrowed as far as the statements allow, the report of
    what narrowed (each bound with its statements), or the contradictions if they cannot
    all hold. Only the records the statements name enter the network."""
    named = {name for s in statements for name in (s.first, s.second) if name}
    touched = [i for i, r in enumerate(records) if r.id in named or r.label in named]
    network = _network([records[i] for i in touched], statements)
    small = network.size <= SMALL_NETWORK
    solve = floyd_warshall if small else bellman_ford
    bounds, paths, contradiction = solve(network)
    method = ("Floyd–Warshall" if small else "Bellman–Ford") + f", {network.size} nodes"
    if contradiction is not None:
        return Tightened(tuple(records), (), (contradiction,), method)
    narrowed, tightened = _narrowed(network, bounds, paths)
    result = list(records)
    for index, record in zip(touched, tightened):
        result[index] = record
    links = Links(network, {place: index for index, place in enumerate(touched)})
    return Tightened(tuple(result), tuple(narrowed), (), method, links)


def _narrowed(network: Network, bounds, paths) -> tuple[list[Narrowing], list[Record]]:
    """Each record's new span and the narrowings, a bound's statements read off its path. A
    bound no statement narrowed (a start's latest day by its own end's) is left as it was:
    the chart reads a record's own order already."""
    narrowed, records = [], []
    for index, record in enumerate(network.records):
        sides = {}
        for side in ("start", "end"):
            old = _endpoint(record, side)
            new, statements = _by_statements(network, network.node(index, side), old,
                                             bounds, paths)
            if new != old:
                narrowed.append(Narrowing(record, side, old, new, statements))
            sides[side] = new
        records.append(record if sides == _sides(record) else _with_span(record, sides))
    return narrowed, records


def _by_statements(network: Network, node: int, old: Endpoint, bounds, paths):
    """`old` narrowed on each side whose shortest path holds a statement, and those."""
    earliest, latest = bounds[0][node], bounds[1][node]
    low = old.earliest if old.earliest is not None else -INF
    high = old.latest if old.latest is not None else INF
    found: list[Statement] = []
    if earliest > low:
        by = _unique(network.reasons[e].statement for e in paths(node, True, False))
        low, found = (earliest, found + list(by)) if by else (low, found)
    if latest < high:
        by = _unique(network.reasons[e].statement for e in paths(node, False, True))
        high, found = (latest, found + list(by)) if by else (high, found)
    return _narrow(old, low, high), _unique(found)


def _endpoint(record: Record, side: str) -> Endpoint:
    if record.span is None:
        return Endpoint(None, None, None, frozenset({Qualifier.UNKNOWN_START if side == "start"
                                                     else Qualifier.UNKNOWN_END}))
    return getattr(record.span, side)


def _sides(record: Record) -> dict[str, Endpoint]:
    return {side: _endpoint(record, side) for side in ("start", "end")}


def _narrow(old: Endpoint, earliest: float, latest: float) -> Endpoint:
    """`old` with the window `earliest..latest` (infinite: no bound); the open and unknown
    words dropped once both sides are bounded, a likely day outside the window dropped."""
    low = None if earliest == -INF else int(earliest)
    high = None if latest == INF else int(latest)
    qualifiers = old.qualifiers
    if low is not None and high is not None:
        qualifiers = qualifiers - {Qualifier.OPEN_START, Qualifier.OPEN_END,
                                   Qualifier.UNKNOWN_START, Qualifier.UNKNOWN_END}
    likely = old.likely if old.likely is not None and (low is None or low <= old.likely) and (
        high is None or old.likely <= high) else None
    if (low, high) == (old.earliest, old.latest):
        return old
    return replace(old, earliest=low, latest=high, qualifiers=qualifiers, likely=likely)


def _with_span(record: Record, sides: dict[str, Endpoint]) -> Record:
    start, end = sides["start"], sides["end"]
    span = Span.point(start) if record.span is not None and record.span.is_point and (
        start == end) else Span(start, end)
    return replace(record, span=span)


def _unique(statements) -> tuple[Statement, ...]:
    found = dict.fromkeys(s for s in statements if s is not None)
    return tuple(sorted(found, key=lambda s: (s.source, s.row)))
