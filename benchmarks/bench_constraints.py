"""Constraint speed: 10,000 invented records tightened by 20,000 statements between them,
against a plain Python Bellman–Ford over the same network in the same run.

    python benchmarks/bench_constraints.py            # 10,000 records, 20,000 statements
    python benchmarks/bench_constraints.py --quick    # 1,000 and 2,000, for a smoke run

`tighten(records, statements)` end to end (the network built from the records and
statements, Bellman–Ford, the paths that name each narrowed bound's statements), and the
solver alone (one numpy pass over the edges per round, from every node for the cycle check,
then from the origin both ways) against a loop that relaxes edge by
edge until nothing changes (a cycle check from every node, then bounds only); the numpy solver and the loop must give the same
tightest bounds on the same network. The statements hold
for invented true dates, so the network is consistent and every bound is computed.
"""
from __future__ import annotations

import argparse
import math
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from timelines.analysis.constraints import Statement, _network, tighten  # noqa: E402
from timelines.analysis.network import bellman_ford  # noqa: E402
from timelines.calendar import fixed_from_gregorian  # noqa: E402
from timelines.model import Endpoint, Provenance, Record, Span  # noqa: E402

FIRST_DAY = fixed_from_gregorian(1500, 1, 1)     # invented lives fall in 1500-1900


def invented(count: int, statements: int, seed: int = 11):
    """Lives with windows of up to 20 years round true dates, and 'before' / 'starts before
    the start of' statements that the true dates satisfy."""
    rng = np.random.default_rng(seed)
    born = FIRST_DAY + rng.integers(0, 140_000, count)
    died = born + rng.integers(1, 30_000, count)
    slack = rng.integers(0, 7_300, (4, count))
    records = [Record(f"person {i}", Span(Endpoint(int(b - s0), int(b + s1)),
                                          Endpoint(int(d - s2), int(d + s3))),
                      Provenance("people.csv", i + 2), id=f"p{i}")
               for i, (b, d, s0, s1, s2, s3) in enumerate(zip(born, died, *slack))]
    said = []
    while len(said) < statements:
        a, b = (int(x) for x in rng.integers(0, count, 2))
        if died[a] < born[b]:
            said.append(Statement(f"p{a}", "before", f"p{b}", None, "statements.csv",
                                  len(said) + 2))
        elif born[a] < born[b]:
            said.append(Statement(f"p{a}", "starts before the start of", f"p{b}", None,
                                  "statements.csv", len(said) + 2))
    return records, said


def loop_bounds(network) -> tuple[list[float], list[float]]:
    """The plain loop: Bellman–Ford edge by edge from the origin, forwards (latest) and
    backwards (earliest), until a round changes nothing."""
    edges = list(zip(network.src, network.dst, network.weight))

    def relax(forward: bool, everywhere: bool = False) -> list[float]:
        distance = [0.0 if everywhere else math.inf] * network.size
        distance[0] = 0.0
        for _ in range(network.size):
            changed = False
            for i, j, w in edges:
                u, v = (i, j) if forward else (j, i)
                if distance[u] + w < distance[v]:
                    distance[v] = distance[u] + w
                    changed = True
            if not changed:
                return distance
        raise AssertionError("a negative cycle: the invented statements should all hold")

    relax(True, everywhere=True)        # the same cycle check as tighten's: from every node
    return [-d for d in relax(False)], relax(True)


def timed(function, *args):
    start = time.perf_counter()
    result = function(*args)
    return result, time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true")
    args = parser.parse_args()
    count, statements = (1_000, 2_000) if args.quick else (10_000, 20_000)
    records, said = invented(count, statements)
    result, seconds = timed(tighten, records, said)
    assert result.consistent, "the invented statements hold for the true dates"
    named = {name for statement in said for name in (statement.first, statement.second)}
    network = _network([r for r in records if r.id in named], said)
    (earliest, latest), loop_seconds = timed(loop_bounds, network)
    ((numpy_earliest, numpy_latest), _, _), numpy_seconds = timed(bellman_ford, network)
    assert np.array_equal(numpy_earliest, earliest) and np.array_equal(numpy_latest, latest), \
        "the numpy Bellman–Ford and the plain loop disagree"
    print(f"{count:,} records, {statements:,} statements ({result.method}, "
          f"{len(network.src):,} edges): {len(result.narrowed):,} bounds narrowed")
    print(f"tighten, end to end (network, solver, paths, report): {seconds:.2f} s")
    print(f"solver alone: numpy Bellman–Ford {numpy_seconds:.3f} s, "
          f"plain Python loop {loop_seconds:.3f} s")
    print(f"ratio: the numpy solver takes {numpy_seconds / loop_seconds:.2f}x the loop's time; "
          f"end to end {seconds / loop_seconds:.1f}x the loop's solve, same run")

if __name__ == "__main__":
    main()
