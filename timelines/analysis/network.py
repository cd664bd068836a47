"""A simple temporal network (Dechter, Meiri & Pearl 1991): instants as nodes, each edge
i -> j of weight w saying `x_j - x_i <= w`, with the reason it is there in the user's terms.

The tightest bounds are shortest paths from the origin; a negative cycle is a set of
statements that cannot all hold. Floyd–Warshall over the dense matrix for small networks (it
gives the minimal network, every pair's tightest distance); Bellman–Ford from the origin for
large ones. `constraints` builds the network from records and statements and reads the
answers back in their terms.
"""
from __future__ import annotations

import math
from dataclasses import dataclass
from typing import TYPE_CHECKING, Callable

import numpy as np

if TYPE_CHECKING:                        # what a reason names, in the user's terms
    from ..model import Record
    from .constraints import Statement

INF = math.inf


@dataclass(frozen=True, slots=True, eq=False)
class Reason:
    """Why an edge of the network is there, in the user's terms. `words` makes the text when
    it is read (only for a contradiction: writing every record's windows out costs more than
    solving the network). Two edges share one Reason when one statement or window made both."""

    words: Callable[[], str]
    statement: Statement | None = None
    record: Record | None = None

    @property
    def text(self) -> str:
        return self.words()




@dataclass(frozen=True, slots=True)
class Contradiction:
    """Statements and windows that cannot all hold: a negative cycle of the network."""

    reasons: tuple[Reason, ...]
    excess: int                     # days more than the statements allow, around the cycle

    @property
    def statements(self) -> tuple[Statement, ...]:
        return tuple(r.statement for r in self.reasons if r.statement is not None)

    def __str__(self) -> str:
        return (" and ".join(reason.text for reason in self.reasons) + " cannot all hold: "
                f"followed round, they ask for {self.excess} days more than they allow")


class Network:
    """Nodes (0 the origin; then each named record's start and end) and edges i -> j of
    weight w (`x_j - x_i <= w`), each with its reason."""

    def __init__(self, records: list[Record]):
        self.records = records
        self.src: list[int] = []
        self.dst: list[int] = []
        self.weight: list[float] = []
        self.reasons: list[Reason] = []

    @property
    def size(self) -> int:
        return 1 + 2 * len(self.records)

    def node(self, index: int, side: str) -> int:
        return 1 + 2 * index + (side == "end")

    def add(self, earlier: int, later: int, low: float, high: float, reason: Reason) -> None:
        """`low <= x_later - x_earlier <= high`."""
        for i, j, w in ((earlier, later, high), (later, earlier, -low)):
            if w != INF:
                self.src.append(i), self.dst.append(j), self.weight.append(w)
                self.reasons.append(reason)

    def arrays(self):
        return (np.array(self.src, dtype=np.int64), np.array(self.dst, dtype=np.int64),
                np.array(self.weight, dtype=np.float64))


# Small networks: Floyd–Warshall over the dense matrix, the minimal network.

def _dense(network: Network) -> tuple[np.ndarray, np.ndarray]:
    """The tightest direct weight of each pair of nodes and the edge that gives it."""
    n = network.size
    weights, edges = np.full((n, n), INF), np.full((n, n), -1, dtype=np.int64)
    for e, (i, j, w) in enumerate(zip(network.src, network.dst, network.weight)):
        if w < weights[i, j]:
            weights[i, j], edges[i, j] = w, e
    return weights, edges


def minimal_network(network: Network) -> tuple[np.ndarray, np.ndarray]:
    """All pairs' tightest distances (Floyd–Warshall; `d[i, j]`: `x_j - x_i <= d`) and the
    node each shortest path last went through (-1: the direct edge)."""
    distance, _ = _dense(network)
    np.fill_diagonal(distance, np.minimum(np.diag(distance), 0))
    via = np.full(distance.shape, -1, dtype=np.int64)
    for k in range(network.size):
        through = distance[:, k, None] + distance[None, k, :]
        better = through < distance
        distance = np.where(better, through, distance)
        via[better] = k
    return distance, via


def floyd_warshall(network: Network):
    distance, via = minimal_network(network)
    on_cycles = np.flatnonzero(np.diag(distance) < 0)
    if len(on_cycles):
        return None, None, _fewest_edge_cycle(network, on_cycles)
    _, edges = _dense(network)

    def path(i: int, j: int) -> list[int]:
        k = via[i, j]
        return [edges[i, j]] if k < 0 else path(i, k) + path(k, j)

    def paths(node: int, earliest: bool, latest: bool) -> list[int]:
        return (path(node, 0) if earliest else []) + (path(0, node) if latest else [])

    return (-distance[:, 0], distance[0, :]), paths, None


def _fewest_edge_cycle(network: Network, nodes: np.ndarray) -> Contradiction:
    """The negative cycle with the fewest edges among `nodes`: the shortest walks of 1, 2, 3
    ... edges, until one returns to its start below zero (such a walk repeats no node, or a
    shorter one would be negative too)."""
    weights, edges = _dense(network)
    weights, edges = weights[np.ix_(nodes, nodes)], edges[np.ix_(nodes, nodes)]
    np.fill_diagonal(weights, INF)
    walks, last = weights.copy(), [np.full(weights.shape, -1, dtype=np.int64)]
    while np.diag(walks).min() >= 0:
        longer, best = _one_edge_longer(walks, weights)
        better = longer < walks
        walks = np.where(better, longer, walks)
        last.append(np.where(better, best, last[-1]))
    start = int(np.argmin(np.diag(walks)))
    cycle, node = [], start
    for level in range(len(last) - 1, -1, -1):
        before = last[level][start, node]
        cycle.append(edges[start if before < 0 else before, node])
        if before < 0:
            break
        node = before
    return _contradiction(network, cycle[::-1], -int(np.diag(walks)[start]))


def _one_edge_longer(walks: np.ndarray, weights: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """The shortest walks one edge longer (i -> m by a walk, m -> j by an edge), and each m."""
    longer, best = np.full(walks.shape, INF), np.full(walks.shape, -1, dtype=np.int64)
    for m in range(len(walks)):
        through = walks[:, m, None] + weights[None, m, :]
        better = through < longer
        longer = np.where(better, through, longer)
        best[better] = m
    return longer, best


def _contradiction(network: Network, cycle: list[int], excess: int) -> Contradiction:
    reasons = tuple(dict.fromkeys(network.reasons[e] for e in cycle))
    return Contradiction(reasons, excess)


# Large networks: Bellman–Ford, one numpy pass over the edges per round.

def bellman_ford(network: Network):
    src, dst, weight = network.arrays()
    everywhere = np.zeros(network.size)                  # a virtual source joined to all
    _, _, cycle = _relaxed(network.size, src, dst, weight, everywhere)
    if cycle is not None:
        return None, None, _contradiction(network, cycle, -int(weight[cycle].sum()))
    from_origin = np.full(network.size, INF)
    from_origin[0] = 0
    latest, forward, _ = _relaxed(network.size, src, dst, weight, from_origin)
    to_origin, backward, _ = _relaxed(network.size, dst, src, weight, from_origin)

    def paths(node: int, earliest: bool, late: bool) -> list[int]:
        return ((_walk_back(backward, dst, node) if earliest else []) +
                (_walk_back(forward, src, node) if late else []))

    return (-to_origin, latest), paths, None


def distances_from(network: Network, node: int) -> np.ndarray:
    """The tightest `x_v - x_node` for every node v (INF: unbounded), by Bellman–Ford from
    `node`; the network must hold no negative cycle."""
    src, dst, weight = network.arrays()
    start = np.full(network.size, INF)
    start[node] = 0
    distance, _, cycle = _relaxed(network.size, src, dst, weight, start)
    if cycle is not None:
        raise ValueError("the network holds a negative cycle")
    return distance


def _relaxed(n: int, src, dst, weight, distance: np.ndarray):
    """Shortest distances from where `distance` is finite, each node's last edge, or a
    negative cycle (edge indices) as soon as the predecessor graph closes one."""
    distance, parent = distance.copy(), np.full(n, -1, dtype=np.int64)
    for _ in range(n):
        through = distance[src] + weight
        better = np.flatnonzero(through < distance[dst])
        if not len(better):
            return distance, parent, None
        order = better[np.argsort(through[better], kind="stable")]
        _, first = np.unique(dst[order], return_index=True)
        chosen = order[first]
        distance[dst[chosen]], parent[dst[chosen]] = through[chosen], chosen
        cycle = _parent_cycle(parent, src, dst[chosen])
        if cycle is not None:
            return distance, parent, cycle
    raise AssertionError("Bellman–Ford did not settle within n rounds")


def _parent_cycle(parent: np.ndarray, src, starts) -> list[int] | None:
    """A cycle of the predecessor graph reached from `starts` (edge indices, in order)."""
    seen: dict[int, int] = {}
    for number, start in enumerate(starts.tolist()):
        node = start
        while node not in seen and parent[node] >= 0:
            seen[node] = number
            node = int(src[parent[node]])
        if node in seen and seen[node] == number and parent[node] >= 0:
            edges, at = [], node
            while True:
                edges.append(int(parent[at]))
                at = int(src[parent[at]])
                if at == node:
                    return edges[::-1]
    return None


def _walk_back(parent: np.ndarray, predecessor, node: int) -> list[int]:
    """The edges of the shortest path tree from the origin to `node`."""
    edges = []
    while parent[node] >= 0:
        edges.append(int(parent[node]))
        node = int(predecessor[parent[node]])
    return edges
