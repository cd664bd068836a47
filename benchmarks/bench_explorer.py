"""The HTML explorer in headless Chromium, against a blank page in the same run (issue 12).

    python benchmarks/bench_explorer.py [N ...]     (default: 3000 100000)

For each N: invented records (years 1500-1900, some fuzzy) are written to an .html explorer;
Chromium (Debian's, driven by Playwright) loads it from disk until the first draw, five times,
and a blank page as often; then the main view is zoomed in and out 20 times with the wheel
and each step timed until its redraw. Prints the median load against the blank page's (the
targets: 3,000 records within 2x, 100,000 within 4x) and the median zoom step (target at
100,000: 50 ms). Also the page size and the time to write it. A script, not a test: the ratios
printed by one run are what to compare.
"""
from __future__ import annotations

import random
import statistics
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

from timelines import Chart  # noqa: E402

CHROMIUM = "/usr/lib/chromium/chromium"
LOADS = 5
ZOOMS = 20


def write_table(path: Path, count: int, seed: int = 12) -> None:
    """An invented catalogue: series with covering dates, a quarter of them fuzzy."""
    rng = random.Random(seed)
    forms = ("{s}", "c. {s}", "{s}s", "before {s}")
    lines = ["label,start,end,group"]
    for index in range(count):
        start = rng.randint(1500, 1880)
        written = forms[index % 4].format(s=start - start % 10 if index % 4 == 2 else start)
        lines.append(f"Series {index + 1},{written},{start + rng.randint(1, 40)},"
                     f"fonds {index % 12 + 1}")
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")


def _load_ms(page, url: str, ready: str) -> float:
    started = time.perf_counter()
    page.goto(url)
    page.wait_for_function(ready)
    return (time.perf_counter() - started) * 1000


def measure(browser, folder: Path, count: int) -> None:
    table, html, blank = folder / f"t{count}.csv", folder / f"t{count}.html", folder / "b.html"
    write_table(table, count)
    started = time.perf_counter()
    Chart(table, group="group").save(html)
    written = time.perf_counter() - started
    blank.write_text("<!DOCTYPE html><title>blank</title><p>blank</p>", encoding="utf-8")
    page = browser.new_page(viewport={"width": 1400, "height": 900})
    loads, blanks = [], []
    for _ in range(LOADS):
        blanks.append(_load_ms(page, blank.as_uri(), "document.readyState === 'complete'"))
        loads.append(_load_ms(page, html.as_uri(), "document.body.dataset.ready === '1'"))
    box = page.locator("#tl-main").bounding_box()
    page.mouse.move(box["x"] + box["width"] / 2, box["y"] + min(200, box["height"] / 2))
    steps = []
    for step in range(ZOOMS):
        before = page.evaluate("window.timelinesExplorer.redrawCount")
        started = time.perf_counter()
        page.mouse.wheel(0, -240 if step % 2 == 0 else 240)
        page.wait_for_function(f"window.timelinesExplorer.redrawCount > {before}")
        steps.append((time.perf_counter() - started) * 1000)
    page.close()
    load, base = statistics.median(loads), statistics.median(blanks)
    print(f"{count:,} records: page {html.stat().st_size / 1e6:.1f} MB written in {written:.1f} s;"
          f" load {load:.0f} ms vs blank {base:.0f} ms = {load / base:.1f}x "
          f"(target {'2' if count <= 3000 else '4'}x); zoom step median "
          f"{statistics.median(steps):.0f} ms (target 50 ms at 100,000)")


def main(argv: list[str]) -> int:
    from playwright.sync_api import sync_playwright

    counts = [int(arg) for arg in argv] or [3000, 100_000]
    with tempfile.TemporaryDirectory() as folder, sync_playwright() as playwright:
        browser = playwright.chromium.launch(executable_path=CHROMIUM, args=["--no-sandbox"])
        for count in counts:
            measure(browser, Path(folder), count)
        browser.close()
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
