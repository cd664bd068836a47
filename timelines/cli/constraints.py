"""`timelines check TABLE --constraints FILE`: the table's records tightened by a table of
statements (analysis/constraints.py); each narrowed bound, or each contradiction, printed."""
from __future__ import annotations

from ..analysis.constraints import Tightened, read_statements, tighten
from ..model import Record


def constrained(records: list[Record], path: str) -> Tightened:
    """The records tightened by the statements in `path`."""
    return tighten(records, read_statements(path))


def run_constraints(records: list[Record], path: str, say) -> int:
    """Print what the statements in `path` narrowed, or what contradicts (exit 1)."""
    result = constrained(records, path)
    for line in result.lines():
        say(line)
    if result.consistent:
        say(f"{len(result.narrowed)} bounds narrowed by the statements ({result.method})")
        return 0
    say(f"the statements cannot all hold ({result.method})")
    return 1
