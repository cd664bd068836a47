"""Speed of the date language against baselines measured in the same run (DESIGN §6).

    python benchmarks/bench_dates.py [--quick]

Prints three comparisons, each as seconds and a ratio:
1. 100,000 distinct mixed fuzzy strings through `parse_span`, against calling
   `dateutil.parser.parse` on each (a failure caught, as a reader would): target ours at least
   5x faster;
2. a 1,000,000-cell column with realistic repetition (about 5,000 distinct values) through
   `parse_column`: target under 0.5 s;
3. a plain ISO 8601 column of 1,000,000 `YYYY-MM-DD` cells (about 146,000 distinct days, as
   issue 15 has it) through `parse_column` (an Endpoint per cell, shared per day) and through
   `parse_column_coded` (what the reader uses: the days as an array, a code per cell),
   against `pandas.to_datetime(format="ISO8601")` on the same list: target within 2x.

The strings are invented, drawn with a fixed seed: what historians', curators', archaeologists'
and genealogists' cells look like (see `fuzzy_strings`). A script, not a test: timings depend
on the machine; the ratios are what to compare.
"""
from __future__ import annotations

import argparse
import datetime
import random
import sys
import time
from pathlib import Path
from typing import Callable

sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

from timelines.dates import DateError, parse_column, parse_span  # noqa: E402
from timelines.dates.column import parse_column_coded  # noqa: E402

_MONTHS = ("January", "February", "March", "April", "May", "June", "July", "August",
           "September", "October", "November", "December")
_ORDINALS = {1: "st", 2: "nd", 3: "rd"}


def _ordinal(number: int) -> str:
    return f"{number}{'th' if 10 <= number % 100 <= 20 else _ORDINALS.get(number % 10, 'th')}"


def _day(rng: random.Random) -> tuple[int, int, int]:
    year = rng.randint(1000, 2020)
    month = rng.randint(1, 12)
    return year, month, rng.randint(1, 28)


# Each maker writes one kind of cell; the weights say how often practitioners write it.
def _makers() -> list[tuple[int, Callable[[random.Random], str]]]:
    return [
        (12, lambda r: str(r.randint(1, 2020))),
        (12, lambda r: datetime.date(*_day(r)).isoformat()),
        (8, lambda r: "{2} {0} {1}".format(_MONTHS[r.randint(0, 11)], *_day(r)[::2])),
        (4, lambda r: "{0} {2}, {1}".format(_MONTHS[r.randint(0, 11)], *_day(r)[::2])),
        (3, lambda r: f"{_day(r)[2]}-{_MONTHS[r.randint(0, 11)][:3]}-{r.randint(1000, 2020)}"),
        (5, lambda r: f"{_MONTHS[r.randint(0, 11)]} {r.randint(1000, 2020)}"),
        (6, lambda r: f"{r.choice(['c.', 'ca.', 'circa', 'about', 'c'])} {r.randint(500, 2020)}"),
        (2, lambda r: f"{r.randint(1000, 2020)}{r.choice(['~', '?', '%'])}"),
        (5, lambda r: f"{r.choice(['before', 'bef.', 'after', 'aft.', 'by'])} "
                      f"{r.randint(1000, 2020)}"),
        (6, lambda r: f"{r.choice(['', 'early ', 'mid-', 'late ', 'c. '])}"
                      f"{r.randint(50, 201) * 10}s"),
        (6, lambda r: f"{r.choice(['', 'early ', 'late ', 'mid-', 'first half of the '])}"
                      f"{_ordinal(r.randint(1, 21))} {r.choice(['century', 'c.', 'cent.'])}"),
        (8, lambda r: f"{(y := r.randint(1000, 2000))}{r.choice(['–', '-', ' to '])}"
                      f"{y + r.randint(1, 60)}"),
        (2, lambda r: f"{_MONTHS[r.randint(0, 5)]}–{_MONTHS[r.randint(6, 11)]} "
                      f"{r.randint(1000, 2020)}"),
        (4, lambda r: f"{r.choice(['', 'c. '])}{r.randint(1, 5000)} {r.choice(['BC', 'BCE'])}"),
        (1, lambda r: f"{_ordinal(r.randint(1, 30))} century BC"),
        (3, lambda r: f"{r.randint(1000, 2000)}/{r.randint(2001, 2020)}"),
        (2, lambda r: f"{r.randint(100, 202)}X"),
        (3, lambda r: "{2:02d}/{1:02d}/{0}".format(*_day(r)[:2], r.randint(13, 28))),
        (2, lambda r: f"{r.randint(1, 30)},{r.randint(0, 999):03d} ± {r.randint(1, 9)}0 BP"),
        (1, lambda r: f"{r.randint(1, 500)}.{r.randint(0, 9)} Ma"),
        (2, lambda r: f"{r.randint(1, 24)} {_MONTHS[r.randint(0, 2)]} "
                      f"{(y := r.randint(1600, 1750))}/{(y + 1) % 100:02d}"),
        (1, lambda r: f"between {(y := r.randint(1000, 2000))} and {y + r.randint(1, 20)}"),
        (1, lambda r: f"{r.randint(1000, 2000)} ± {r.randint(1, 50)}"),
        (1, lambda r: f"nonsense {r.randint(1, 10 ** 6)}"),   # cells that are not dates
    ]


def fuzzy_strings(count: int, seed: int = 1650) -> list[str]:
    """`count` distinct invented cells in the mix `_makers` describes."""
    rng = random.Random(seed)
    makers = _makers()
    weights = [weight for weight, _ in makers]
    seen: dict[str, None] = {}
    while len(seen) < count:
        for maker in rng.choices([m for _, m in makers], weights, k=count):
            seen.setdefault(maker(rng), None)
            if len(seen) == count:
                break
    return list(seen)


def _timed(function: Callable[[], object], repeat: int = 3) -> float:
    best = float("inf")
    for _ in range(repeat):
        start = time.perf_counter()
        function()
        best = min(best, time.perf_counter() - start)
    return best


def _parse_each(strings: list[str]) -> None:
    for text in strings:
        try:
            parse_span(text)
        except DateError:
            pass


def _dateutil_each(strings: list[str]) -> None:
    import dateutil.parser
    for text in strings:
        try:
            dateutil.parser.parse(text)
        except (ValueError, OverflowError):
            pass


def _cold_caches() -> None:
    """Empty the parser's remembered year and month bounds: each timed run starts cold."""
    for name, module in list(sys.modules.items()):
        if name.startswith("timelines.dates"):
            for value in vars(module).values():
                if callable(getattr(value, "cache_clear", None)):
                    value.cache_clear()


def distinct_strings(count: int) -> tuple[float, float]:
    strings = fuzzy_strings(count)

    def ours() -> None:
        _cold_caches()
        _parse_each(strings)

    # Best of three runs each, interleaved, so that a busy machine hurts both alike.
    times = [(_timed(ours, 1), _timed(lambda: _dateutil_each(strings), 1)) for _ in range(3)]
    return min(t[0] for t in times), min(t[1] for t in times)


def repeated_column(cells: int, distinct: int) -> float:
    rng = random.Random(1700)
    values = fuzzy_strings(distinct, seed=1701)
    column = [values[min(int(rng.paretovariate(1.2)) - 1, distinct - 1)] if rng.random() < 0.5
              else rng.choice(values) for _ in range(cells)]
    return _timed(lambda: parse_column(column))


def iso_column(cells: int) -> tuple[float, float, float]:
    import pandas
    rng = random.Random(1850)
    first = datetime.date(1850, 1, 1).toordinal()
    # 1,000,000 draws from 146,400 days leave about 146,000 distinct ones
    days = 146_400 * cells // 1_000_000
    column = [datetime.date.fromordinal(first + rng.randrange(days)).isoformat()
              for _ in range(cells)]
    return (_timed(lambda: parse_column(column)), _timed(lambda: parse_column_coded(column)),
            _timed(lambda: pandas.to_datetime(column, format="ISO8601")))


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="a tenth of the sizes")
    args = parser.parse_args(argv)
    scale = 10 if args.quick else 1
    ours, baseline = distinct_strings(100_000 // scale)
    print(f"distinct strings ({100_000 // scale:,}): ours {ours:.3f} s, dateutil {baseline:.3f} s,"
          f" ours {baseline / ours:.1f}x faster (target >= 5x)")
    column = repeated_column(1_000_000 // scale, 5_000 // scale)
    print(f"repeated column ({1_000_000 // scale:,} cells, {5_000 // scale:,} distinct): "
          f"{column:.3f} s (target < 0.5 s)")
    ours, coded, pandas_time = iso_column(1_000_000 // scale)
    print(f"ISO column ({1_000_000 // scale:,} cells): parse_column {ours:.3f} s, "
          f"parse_column_coded {coded:.3f} s, pandas.to_datetime {pandas_time:.3f} s, ratios "
          f"{ours / pandas_time:.2f} and {coded / pandas_time:.2f} (target <= 2)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
