"""Big tables (issue 15): time and peak memory of whole commands on a large invented table,
each against its baseline in the same run, each command in a process of its own.

    python benchmarks/bench_big.py [--rows N]        (default 1,000,000)

1. `timelines check` and `timelines lanes --format csv` on an N-row register against
   `pandas.read_csv` of the same file (targets: check within 3x the time and 2x the memory;
   lanes within 6x and 3x), and the same on an N-row table of plain ISO days (`YYYY-MM-DD`
   starts and ends, about 146,000 distinct days a column: read as arrays of days);
2. `timelines parse --json` of an N-line column with 5,000 distinct values against a script
   that memoises `dateutil.parser.parse` per distinct line (target: within 1.5x);
3. `timelines render --overview yes` to PNG and SVG of a tenth of N rows against the same
   read_csv (the overview's cost: not a target of the issue, shown for the note).
Peak memory is the child's maximum resident set (`resource.getrusage(RUSAGE_CHILDREN)`, read
by a small wrapper process around each command). A script, not a test: compare the ratios.
"""
from __future__ import annotations

import argparse
import random
import subprocess
import sys
import tempfile
import time
from datetime import date
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent

_WRAPPER = """
import resource, subprocess, sys, time
started = time.perf_counter()
done = subprocess.run(sys.argv[1:], stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
elapsed = time.perf_counter() - started
print(elapsed, resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss, done.returncode)
"""

_READ_CSV = "import pandas, sys; pandas.read_csv(sys.argv[1], dtype=str, keep_default_na=False)"
_DATEUTIL = """
import json, sys
from dateutil import parser
seen = {}
for line in sys.stdin:
    text = line.rstrip("\\n")
    if text not in seen:
        try:
            seen[text] = json.dumps({"input": text, "ok": True,
                                     "date": parser.parse(text).date().isoformat()})
        except (ValueError, OverflowError):
            seen[text] = json.dumps({"input": text, "ok": False})
    sys.stdout.write(seen[text] + "\\n")
"""


def measured(command: list[str], stdin: Path | None = None) -> tuple[float, float]:
    """(seconds, peak MB) of one command run in a process of its own."""
    wrapper = [sys.executable, "-c", _WRAPPER, *command]
    with open(stdin, "rb") if stdin else open("/dev/null", "rb") as source:
        out = subprocess.run(wrapper, stdin=source, capture_output=True, text=True, check=True)
    seconds, kilobytes, _ = out.stdout.split()
    return float(seconds), int(kilobytes) / 1024


def register(path: Path, rows: int, seed: int = 15) -> None:
    """Invented members: fuzzy admission dates, an end for most, a craft as group."""
    rng = random.Random(seed)
    forms = ("{y}", "c. {y}", "{y}-{m:02d}-{d:02d}", "before {y}", "{y}s")
    crafts = [f"craft {n}" for n in range(24)]
    with open(path, "w", encoding="utf-8") as file:
        file.write("ref,name,craft,admitted,left\n")
        for row in range(rows):
            year = rng.randint(1550, 1880)
            form = forms[row % 5]
            start = form.format(y=year - year % 10 if form == "{y}s" else year,
                                m=rng.randint(1, 12), d=rng.randint(1, 28))
            end = "" if row % 9 == 0 else str(year + rng.randint(1, 50))
            file.write(f"R{row},Member {row},{crafts[row % 24]},{start},{end}\n")


def iso_register(path: Path, rows: int, seed: int = 17) -> None:
    """Invented members with plain ISO days: an admission day in 1600-1999, a leaving day up
    to 55 years on, a twentieth of the leaving days not known."""
    rng = random.Random(seed)
    first = date(1600, 1, 1).toordinal()
    with open(path, "w", encoding="utf-8") as file:
        file.write("ref,name,craft,admitted,left\n")
        for row in range(rows):
            start = first + rng.randint(0, 146_000)
            end = "" if row % 20 == 0 else date.fromordinal(start + rng.randint(0, 20_000))
            file.write(f"R{row},Member {row},craft {row % 24},"
                       f"{date.fromordinal(start).isoformat()},{end}\n")


def column(path: Path, rows: int, distinct: int = 5000, seed: int = 16) -> None:
    rng = random.Random(seed)
    values = [f"c. {1500 + i % 400}" if i % 3 == 0 else f"{1500 + i % 400}-{i % 12 + 1:02d}"
              for i in range(distinct)]
    with open(path, "w", encoding="utf-8") as file:
        file.writelines(values[rng.randrange(distinct)] + "\n" for _ in range(rows))


def _line(name: str, ours: tuple[float, float], base: tuple[float, float], targets: str) -> None:
    print(f"{name}: {ours[0]:.1f} s, {ours[1]:.0f} MB; baseline {base[0]:.1f} s, {base[1]:.0f} MB;"
          f" ratio {ours[0] / base[0]:.2f}x time, {ours[1] / base[1]:.2f}x memory ({targets})")


def main(argv: list[str] | None = None) -> int:
    options = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    options.add_argument("--rows", type=int, default=1_000_000)
    args = options.parse_args(argv)
    timelines = [sys.executable, "-m", "timelines"]
    with tempfile.TemporaryDirectory() as folder:
        table, lines = Path(folder) / "register.csv", Path(folder) / "column.txt"
        small = Path(folder) / "small.csv"
        register(table, args.rows)
        register(small, args.rows // 10)
        column(lines, args.rows)
        days = Path(folder) / "days.csv"
        iso_register(days, args.rows)
        for name, path in (("", table), (" (plain ISO days)", days)):
            base = measured([sys.executable, "-c", _READ_CSV, str(path)])
            _line(f"check {args.rows:,}{name}", measured(
                [*timelines, "check", str(path), "--start", "admitted", "--end", "left"]),
                base, "target 3x time, 2x memory")
            _line(f"lanes --format csv {args.rows:,}{name}", measured(
                [*timelines, "lanes", str(path), "--start", "admitted", "--end", "left",
                 "--group", "craft", "--format", "csv"]), base, "target 6x, 3x")
        _line(f"parse --json {args.rows:,} lines, 5,000 distinct",
              measured([*timelines, "parse", "--json"], stdin=lines),
              measured([sys.executable, "-c", _DATEUTIL], stdin=lines), "target 1.5x time")
        small_base = measured([sys.executable, "-c", _READ_CSV, str(small)])
        for suffix in ("png", "svg"):
            out = Path(folder) / f"overview.{suffix}"
            _line(f"render {args.rows // 10:,} with the overview to {suffix.upper()}", measured(
                [*timelines, "render", str(small), "--start", "admitted", "--end", "left",
                 "--group", "craft", "-o", str(out)]), small_base, "no target")
    return 0


if __name__ == "__main__":
    started = time.perf_counter()
    code = main()
    print(f"({time.perf_counter() - started:.0f} s in all)")
    sys.exit(code)
