"""Rendering speed and size: N spans end to end to SVG and PNG, against matplotlib's own
`broken_barh` drawing the same bars in the same run (DESIGN.md §6, issue 5).

    python benchmarks/bench_render.py [N] [svg|png ...]    (default 100,000; both formats)

Prints seconds, bytes and the ratios ours / matplotlib's. A script, not a test: timings on a
shared machine are noisy, so compare the ratios printed by one run.

Each side of the PNG runs in a Python process of its own, which reports its time and its
peak memory: the resident set's high-water mark of its own address space (`VmHWM` in
/proc/self/status, which starts afresh at exec). The child's `ru_maxrss`, read by `wait4`,
would not do: on Linux it keeps the mark of the forked parent's image before the exec, so a
run that drew the SVG first reported the parent's 0.9 GB as the PNG's. matplotlib's side holds the whole
page as one Agg canvas (N = 100,000 at 150 dpi: 1,500 x 967,000 px, 5.8 GB), and Agg draws
nothing over 2^23 px a side (2^16 before matplotlib 3.10, its pull request 28904: about 6,000
spans at 150 dpi). Ours draws and writes the PNG in bands of rows
(`timelines.render.mpl.PNG_BAND_HEIGHT`): its memory follows the band, and no page is too
tall for it.
"""
from __future__ import annotations

import os
import random
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from timelines.calendar import fixed_from_gregorian
from timelines.chart import build_scene
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.render import write
from timelines.scene.primitives import GradientRect, Rect, walk

DPI = 150.0


def make_records(n: int, seed: int = 1) -> list[Record]:
    """Invented spans: years 1500-1900, a quarter approximate, some open or unknown."""
    rng = random.Random(seed)
    records = []
    for i in range(n):
        start = rng.randint(1500, 1880)
        end = start + rng.randint(1, 60)
        qualifiers = frozenset({Qualifier.APPROXIMATE}) if i % 4 == 0 else frozenset()
        first = Endpoint(fixed_from_gregorian(start, 1, 1), fixed_from_gregorian(start, 12, 31),
                         Precision.YEAR, qualifiers)
        last = (Endpoint.open(Qualifier.UNKNOWN_END) if i % 50 == 0 else
                Endpoint(fixed_from_gregorian(end, 1, 1), fixed_from_gregorian(end, 12, 31),
                         Precision.YEAR))
        records.append(Record(f"Person {i}", Span(first, last), Provenance("bench", i + 2),
                              group=f"Group {i % 8}"))
    return records


def timed(action) -> float:
    began = time.perf_counter()
    action()
    return time.perf_counter() - began


def bar_rows(scene) -> dict[tuple[float, float], list[tuple[float, float]]]:
    """Every bar part of our scene (core and fringe rectangles), grouped by lane row."""
    rows: dict[tuple[float, float], list[tuple[float, float]]] = {}
    for item in walk(scene.children):
        if isinstance(item, (Rect, GradientRect)) and item.width > 0:
            rows.setdefault((item.y, item.height), []).append((item.x, item.width))
    return rows


def matplotlib_bars(scene, rows, path: Path, dpi: float) -> None:
    """The same bars at the same places on a page of the same size, drawn by matplotlib's
    broken_barh (one call per lane row), without fades, labels, axis or legend."""
    from matplotlib.figure import Figure

    figure = Figure(figsize=(scene.width / 96, scene.height / 96))
    axes = figure.add_axes((0, 0, 1, 1))
    axes.set_xlim(0, scene.width)
    axes.set_ylim(scene.height, 0)
    axes.set_axis_off()
    for (y, height), spans in rows.items():
        axes.broken_barh(spans, (y, height), facecolors="#0072B2")
    metadata = {"Date": None} if path.suffix == ".svg" else {"Software": None}
    figure.savefig(path, dpi=dpi, metadata=metadata)


def png_side(side: str, n: int, path: Path) -> None:
    """One side of the PNG run, in a process of its own: prints its seconds."""
    records = make_records(n)
    if side == "ours":   # ours end to end: layout and scene included, as a user's run
        seconds = timed(lambda: write(build_scene(records), path, dpi=DPI))
    else:
        scene = build_scene(records)
        rows = bar_rows(scene)
        seconds = timed(lambda: matplotlib_bars(scene, rows, path, DPI))
    print(seconds, _peak_kib())


def _peak_kib() -> int:
    """This process's peak resident set since its exec, in KiB (Linux: VmHWM)."""
    with open("/proc/self/status", encoding="ascii") as status:
        line = next(line for line in status if line.startswith("VmHWM:"))
    return int(line.split()[1])


def in_child(side: str, n: int, path: Path) -> tuple[float, float]:
    """(seconds, peak resident GB) of `png_side` run in a fresh Python process."""
    child = subprocess.Popen([sys.executable, __file__, "--png-side", side, str(n), str(path)],
                             stdout=subprocess.PIPE, text=True)
    output = child.stdout.read()
    if child.wait():
        raise SystemExit(f"{side}: the PNG failed (exit {child.returncode})")
    seconds, peak = output.split()[-2:]
    return float(seconds), int(peak) * 1024 / 1e9


def compare_png(n: int, folder: Path) -> None:
    ours, theirs = folder / "ours.png", folder / "theirs.png"
    our_time, our_memory = in_child("ours", n, ours)
    their_time, their_memory = in_child("theirs", n, theirs)
    our_size, their_size = os.path.getsize(ours), os.path.getsize(theirs)
    print(f"png: ours {our_time:.2f} s, {our_size / 1e6:.1f} MB, peak {our_memory:.2f} GB; "
          f"matplotlib broken_barh {their_time:.2f} s, {their_size / 1e6:.1f} MB, "
          f"peak {their_memory:.2f} GB; time ratio {our_time / their_time:.2f}, "
          f"size ratio {our_size / their_size:.2f}, memory ratio "
          f"{our_memory / their_memory:.2f}")


def main() -> None:
    if sys.argv[1:2] == ["--png-side"]:
        png_side(sys.argv[2], int(sys.argv[3]), Path(sys.argv[4]))
        return
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 100_000
    formats = [f".{name}" for name in sys.argv[2:]] or [".svg", ".png"]
    records = make_records(n)
    folder = Path(tempfile.mkdtemp())
    print(f"{n:,} spans")
    scene = build_scene(records)
    rows = bar_rows(scene)
    print(f"page {scene.width:.0f} x {scene.height:.0f} px, {sum(map(len, rows.values())):,} bars")
    for suffix in formats:
        if suffix == ".png":
            compare_png(n, folder)
            continue
        ours, theirs = folder / f"ours{suffix}", folder / f"theirs{suffix}"
        # ours end to end: layout and scene included, as a user's run
        our_time = timed(lambda: write(build_scene(records), ours, dpi=DPI))
        their_time = timed(lambda: matplotlib_bars(scene, rows, theirs, DPI))
        our_size, their_size = os.path.getsize(ours), os.path.getsize(theirs)
        print(f"{suffix[1:]}: ours {our_time:.2f} s, {our_size / 1e6:.1f} MB; "
              f"matplotlib broken_barh {their_time:.2f} s, {their_size / 1e6:.1f} MB; "
              f"time ratio {our_time / their_time:.2f}, size ratio {our_size / their_size:.2f}")

if __name__ == "__main__":
    main()
