"""Cold start: a fresh process rendering a 1,000-row table to SVG, against a fresh process that
only imports pandas (DESIGN.md §6: "costs little more than importing pandas").

    python benchmarks/bench_coldstart.py [ROWS]      (default 1,000)

Each command runs in its own interpreter, as a user's shell runs it; the best of seven runs of
each is compared, in the same run of this script.
"""
from __future__ import annotations

import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT / "gallery" / "register"))

import make_register  # noqa: E402

RUNS = 7


def best_of(command: list[str]) -> float:
    best = float("inf")
    for _ in range(RUNS):
        began = time.perf_counter()
        done = subprocess.run(command, capture_output=True, cwd=ROOT)
        # exit 1: rows reported (the invented register holds a few bad cells on purpose)
        if done.returncode not in (0, 1):
            raise SystemExit(done.stderr.decode())
        best = min(best, time.perf_counter() - began)
    return best


def main() -> None:
    rows = int(sys.argv[1]) if len(sys.argv) > 1 else 1_000
    with tempfile.TemporaryDirectory() as folder:
        table, chart = Path(folder) / "register.csv", Path(folder) / "register.svg"
        make_register.main(["--rows", str(rows), "-o", str(table)])
        python = sys.executable
        bare = best_of([python, "-c", "pass"])
        pandas = best_of([python, "-c", "import pandas"])
        ours = best_of([python, "-m", "timelines", "render", str(table), "--start", "admitted",
                        "--end", "left", "--label", "name", "--group", "craft", "-o",
                        str(chart)])
    print(f"{rows:,} rows to SVG in a fresh process, best of {RUNS}")
    print(f"  python doing nothing:   {bare:.2f} s")
    print(f"  python importing pandas: {pandas:.2f} s")
    print(f"  timelines render:        {ours:.2f} s, {ours / pandas:.2f}x importing pandas")


if __name__ == "__main__":
    main()
