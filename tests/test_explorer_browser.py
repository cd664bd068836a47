"""The HTML explorer in a real browser: Debian's Chromium driven by Playwright for Python.

Loaded from disk as a user would open it: no console errors, no request beyond the file;
zoom with the wheel re-ticks the axis as the static chart's axis would (the tick rules of
scene/scale.py, ported to the script, agree with Python's on the same inputs); the overview's
brush, the group and search filters and their counts, keyboard focus and the details it shows,
the URL hash, and saving the view as SVG. Skipped, with the reason, where Chromium or
Playwright is missing (.ci/run installs both).
"""
from __future__ import annotations

import json
import xml.etree.ElementTree as ElementTree
from pathlib import Path

import pytest

from timelines import Chart
from timelines.calendar import historical_calendar
from timelines.scene.scale import TimeScale, ticks

CHROMIUM_PATHS = ("/usr/lib/chromium/chromium", "/usr/bin/chromium")
REGISTER = Path(__file__).resolve().parent.parent / "gallery" / "register" / "register.csv"


@pytest.fixture(scope="module")
def browser():
    chromium = next((path for path in CHROMIUM_PATHS if Path(path).exists()), None)
    if chromium is None:
        pytest.skip("Chromium is not installed (Debian: apt-get install chromium)")
    sync_api = pytest.importorskip("playwright.sync_api", reason="needs Playwright (pip)")
    with sync_api.sync_playwright() as playwright:
        launched = playwright.chromium.launch(executable_path=chromium, args=["--no-sandbox"])
        yield launched
        launched.close()


@pytest.fixture(scope="module")
def register_page(tmp_path_factory):
    path = tmp_path_factory.mktemp("explorer") / "register.html"
    Chart(REGISTER, start="admitted", end="left", label="name", group="craft",
          color="standing").save(path)
    return path


class Opened:
    """A page opened from disk, with what it logged and asked for."""

    def __init__(self, browser, path: Path, hash_: str = ""):
        self.errors: list[str] = []
        self.requests: list[str] = []
        self.page = browser.new_page(viewport={"width": 1280, "height": 860})
        self.page.on("console", lambda m: self.errors.append(m.text) if m.type == "error"
                     else None)
        self.page.on("pageerror", lambda e: self.errors.append(str(e)))
        self.page.on("request", lambda r: self.requests.append(r.url))
        self.page.goto(path.as_uri() + hash_)
        self.page.wait_for_function("document.body.dataset.ready === '1'")

    def state(self) -> dict:
        return self.page.evaluate("window.timelinesExplorer.state()")

    def close(self, path: Path) -> None:
        assert self.errors == []
        foreign = [url for url in self.requests
                   if not url.startswith((path.as_uri(), "data:", "blob:"))]
        assert foreign == []
        self.page.close()


@pytest.fixture
def opened(browser, register_page):
    page = Opened(browser, register_page)
    yield page
    page.close(register_page)


def _axis_labels(opened: Opened) -> list[str]:
    return opened.page.evaluate("window.timelinesExplorer.state().ticks")


def test_it_opens_from_disk_with_every_record_shown(opened):
    state = opened.state()
    assert state["total"] == 2997 and state["shown"] == 2997
    assert "2,997 of 2,997 shown" in opened.page.locator("#tl-count").inner_text()


@pytest.mark.parametrize("start, end, max_ticks, era, calendar", [
    (577000, 577400, 8, "bce", "gregorian"),             # days and months, 1580s
    (560000, 660000, 8, "bce", "historical"),            # years across the 1582 reform
    (-30000, 30000, 10, "bce", "historical"),            # across the era boundary
    (-30000, 30000, 10, "bc", "julian"),
    (-30000, 30000, 10, "astronomical", "gregorian"),
    (600000, 720000, 6, "bp", "gregorian"),
    (-4e9, 7e5, 8, "bce", "gregorian"),                  # millions of years
    (639000, 640200, 12, "bce", "britain"),              # Britain's reform of 1752
    (711000, 711020, 8, "bce", "gregorian"),             # single days
])
def test_the_scripts_ticks_agree_with_the_static_axis(opened, start, end, max_ticks, era,
                                                      calendar):
    reform = None
    python_calendar = calendar
    if calendar == "britain":
        reform, calendar = 639797, "historical"            # 1752-09-14
        python_calendar = historical_calendar(reform)
    expected = [(t.day, t.label) for t in ticks(TimeScale(start, end, 0, 1), max_ticks=max_ticks,
                                                era=era, calendar=python_calendar)]
    found = opened.page.evaluate(
        "([s, e, m, era, cal, reform]) => window.timelinesExplorer.ticks(s, e, m, era, cal,"
        " reform).map(t => [t.day, t.label])", [start, end, max_ticks, era, calendar, reform])
    assert [tuple(pair) for pair in found] == expected


def test_the_wheel_zooms_and_re_ticks(opened):
    before = opened.state()
    box = opened.page.locator("#tl-main").bounding_box()
    opened.page.mouse.move(box["x"] + box["width"] / 2, box["y"] + 100)
    for _ in range(12):
        opened.page.mouse.wheel(0, -300)
        opened.page.wait_for_timeout(30)
    after = opened.state()
    assert after["to"] - after["from"] < (before["to"] - before["from"]) / 4
    labels = _axis_labels(opened)
    expected = [t.label for t in ticks(TimeScale(after["from"], after["to"], 0, 1),
                                       max_ticks=after["maxTicks"], era="bce",
                                       calendar="historical")]
    assert labels == expected


def test_search_and_group_filters_update_the_count(opened):
    names = json.loads(opened.page.locator("#tl-data").text_content())["records"]["label"]
    opened.page.fill("#tl-search", names[0].split()[-1])
    opened.page.wait_for_timeout(100)
    wanted = sum(names[0].split()[-1].lower() in name.lower() for name in names)
    assert opened.state()["shown"] == wanted
    assert f"{wanted:,} of 2,997 shown" in opened.page.locator("#tl-count").inner_text()
    opened.page.fill("#tl-search", "")
    opened.page.locator(".tl-group-toggle").first.click()
    state = opened.state()
    assert state["hiddenGroups"] == [0] and state["shown"] < 2997
    assert opened.page.locator(".tl-group-toggle").first.get_attribute("aria-pressed") == "false"


def test_the_overview_brush_sets_the_range(opened):
    box = opened.page.locator("#tl-overview").bounding_box()
    y = box["y"] + box["height"] / 2
    opened.page.mouse.move(box["x"] + box["width"] * 0.4, y)
    opened.page.mouse.down()
    opened.page.mouse.move(box["x"] + box["width"] * 0.5, y, steps=5)
    opened.page.mouse.up()
    state = opened.state()
    domain = json.loads(opened.page.locator("#tl-data").text_content())["domain"]
    width = domain[1] - domain[0]
    assert abs((state["to"] - state["from"]) - 0.1 * width) < 0.03 * width


def test_keyboard_focus_shows_the_records_details(opened):
    opened.page.focus("#tl-main")
    opened.page.keyboard.press("Home")
    opened.page.keyboard.press("ArrowDown")
    state = opened.state()
    assert state["selected"] is not None
    details = opened.page.locator("#tl-details").inner_text()
    data = json.loads(opened.page.locator("#tl-data").text_content())
    label = data["records"]["label"][state["selected"]]
    assert label in details and "register.csv, row" in details
    assert "possible" in details


def test_a_link_reopens_the_view(browser, register_page, opened):
    opened.page.fill("#tl-search", "Rushmore")
    opened.page.click("#tl-zoom-in")
    opened.page.wait_for_timeout(400)                      # the hash is written after a pause
    link = opened.page.evaluate("location.hash")
    state = opened.state()
    again = Opened(browser, register_page, link)
    try:
        reopened = again.state()
        assert reopened["query"] == "Rushmore" and reopened["shown"] == state["shown"]
        assert abs(reopened["from"] - state["from"]) <= 1 and abs(reopened["to"] - state["to"]) <= 1
    finally:
        again.close(register_page)


def test_the_view_saves_as_svg_with_its_records(opened):
    opened.page.fill("#tl-search", "Rushmore")
    opened.page.wait_for_timeout(100)
    svg = opened.page.evaluate("window.timelinesExplorer.svgText()")
    root = ElementTree.fromstring(svg)
    assert root.tag == "{http://www.w3.org/2000/svg}svg"
    texts = " ".join(node.text or "" for node in root.iter())
    assert "Rushmore" in texts
    assert "script" not in {node.tag.split("}")[-1] for node in root.iter()}
    with opened.page.expect_download() as download:
        opened.page.click("#tl-save-svg")
    assert download.value.suggested_filename.endswith(".svg")


def test_hostile_labels_stay_text_in_the_browser(browser, tmp_path):
    path = tmp_path / "t.csv"
    path.write_text('label,start,end\n"<img src=x onerror=window.hit=1>",1650,1660\n'
                    '"</script><script>window.hit=2</script>",1655,1670\n'
                    '"javascript:window.hit=3",1660,1690\n', encoding="utf-8")
    html = tmp_path / "t.html"
    Chart(path).save(html)
    page = Opened(browser, html)
    try:
        page.page.focus("#tl-main")
        for _ in range(3):
            page.page.keyboard.press("ArrowDown")
        assert page.page.evaluate("window.hit") is None
        assert page.page.locator("img").count() == 0
        labels = json.loads(page.page.locator("#tl-data").text_content())["records"]["label"]
        shown = labels[page.state()["selected"]]
        assert shown in page.page.locator("#tl-details").inner_text()
        page.page.keyboard.press("Home")
        assert "<img src=x onerror=window.hit=1>" in page.page.locator("#tl-details").inner_text()
    finally:
        page.close(html)


def test_a_compressed_data_block_draws_the_same(browser, tmp_path, monkeypatch):
    from timelines.render import html

    rows = "\n".join(f"R{i},c. {1600 + i},{1650 + i},g{i % 3}" for i in range(200))
    table = tmp_path / "t.csv"
    table.write_text("label,start,end,group\n" + rows + "\n", encoding="utf-8")
    plain, packed = tmp_path / "plain.html", tmp_path / "packed.html"
    Chart(table, group="group").save(plain)
    monkeypatch.setattr(html, "COMPRESS_FROM", 100)
    Chart(table, group="group").save(packed)
    assert 'type="application/gzip"' in packed.read_text(encoding="utf-8")
    seen = []
    for path in (plain, packed):
        page = Opened(browser, path)
        try:
            seen.append((page.state(), page.page.evaluate("window.timelinesExplorer.csvText()")))
        finally:
            page.close(path)
    assert seen[0] == seen[1] and seen[0][0]["total"] == 200 and seen[0][1].count("\n") == 201


def test_who_else_was_possibly_active_then(opened, register_page):
    """The details' button keeps the record's group and the records of it whose possible
    extents meet the record's, an empty end reaching without limit (checked here against
    the records' own bounds, read in Python)."""
    from timelines.sources import ColumnMap, load_records, read_table

    opened.page.fill("#tl-search", "Tamsin Larkhurst")
    opened.page.focus("#tl-main")
    opened.page.keyboard.press("Home")
    opened.page.fill("#tl-search", "")
    opened.page.click("#tl-alongside")
    state = opened.state()
    assert state["time"] == "possibly" and len(state["hiddenGroups"]) == 9
    records = [r for r in load_records(read_table(REGISTER), ColumnMap(
        start="admitted", end="left", label="name", group="craft")).records if r.span]
    data = json.loads(opened.page.locator("#tl-data").text_content())["records"]
    row = data["row"][state["selected"]]
    [me] = [r for r in records if r.provenance.row == row]
    low, high = me.span.possible_extent

    def reaches(record):
        first, last = record.span.possible_extent
        return ((first is None or first <= high) and (last is None or last >= low))
    expected = sum(r.group == me.group and reaches(r) for r in records)
    assert state["shown"] == expected
