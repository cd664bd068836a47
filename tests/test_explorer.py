"""The HTML explorer's page, read as text and parsed (tests/test_explorer_browser.py drives
it in Chromium): self-contained, inert data, the same records and lanes as the chart.

Sources: Content Security Policy Level 3 (W3C), hash-source: `'sha256-'` + base64 of the
SHA-256 of the inline element's text; HTML Living Standard 4.12.1.3, the restrictions on
the contents of script elements (no `</script`, no `<!--`).
"""
from __future__ import annotations

import base64
import hashlib
import json
import re
from html.parser import HTMLParser

import pytest

from timelines import Chart

HOSTILE = [
    "</script><script>alert(1)</script>",
    "<img src=x onerror=alert(1)>",
    "javascript:alert(1)",
    "<!-- a comment -->",
    "line\u2028separator",
    "quote \" and ' and & and >",
]


def _csv(tmp_path, rows: list[tuple[str, str, str, str]]):
    path = tmp_path / "t.csv"
    quoted = ('"' + cell.replace('"', '""') + '"' for row in rows for cell in row)
    cells = list(quoted)
    lines = ["label,start,end,group"] + [",".join(cells[i:i + 4]) for i in range(0, len(cells), 4)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


@pytest.fixture
def hostile_page(tmp_path):
    rows = [(label, f"c. {1650 + i}", f"{1700 + i}", "g<b>" if i % 2 else "plain")
            for i, label in enumerate(HOSTILE)]
    return Chart(_csv(tmp_path, rows)).to_html()


class _Page(HTMLParser):
    """Elements, attributes and the texts of script and style elements."""

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.tags: list[tuple[str, dict]] = []
        self.scripts: list[tuple[dict, str]] = []
        self.styles: list[str] = []
        self._open: tuple[str, dict] | None = None

    def handle_starttag(self, tag, attrs):
        self.tags.append((tag, dict(attrs)))
        if tag == "script":
            self.scripts.append((dict(attrs), ""))
            self._open = (tag, dict(attrs))
        elif tag == "style":
            self.styles.append("")
            self._open = (tag, dict(attrs))

    def handle_data(self, data):
        if self._open is not None and self._open[0] == "script":
            attrs, text = self.scripts[-1]
            self.scripts[-1] = (attrs, text + data)
        elif self._open is not None:
            self.styles[-1] += data

    def handle_endtag(self, tag):
        self._open = None


def _parsed(page: str) -> _Page:
    parser = _Page()
    parser.feed(page)
    return parser


def _digest(text: str) -> str:
    return "sha256-" + base64.b64encode(hashlib.sha256(text.encode("utf-8")).digest()).decode()


def test_the_page_allows_only_its_own_script_and_style(hostile_page):
    page = _parsed(hostile_page)
    [policy] = [attrs["content"] for tag, attrs in page.tags
                if tag == "meta" and attrs.get("http-equiv") == "Content-Security-Policy"]
    directives = dict(part.strip().split(" ", 1) for part in policy.split(";"))
    assert directives["default-src"] == "'none'"
    [(_, script)] = [(attrs, text) for attrs, text in page.scripts if "type" not in attrs]
    assert directives["script-src"] == f"'{_digest(script)}'"
    [style] = page.styles
    assert directives["style-src"] == f"'{_digest(style)}'"


def test_nothing_on_the_page_points_elsewhere(hostile_page):
    page = _parsed(hostile_page)
    for tag, attrs in page.tags:
        assert not {"src", "href", "action", "srcset"} & set(attrs), (tag, attrs)
        assert not any(name.startswith("on") for name in attrs), (tag, attrs)
    markup = re.sub(r'<script type="application/json".*?</script>', "", hostile_page, flags=re.S)
    # The SVG namespace is a name createElementNS needs (Namespaces in XML), not a place.
    markup = markup.replace('"http://www.w3.org/2000/svg"', "")
    assert "http://" not in markup and "https://" not in markup


def test_hostile_labels_stay_inside_the_data_block_as_text(hostile_page):
    page = _parsed(hostile_page)
    [(attrs, block)] = [(a, t) for a, t in page.scripts if a.get("type") == "application/json"]
    assert attrs["id"] == "tl-data"
    assert "<" not in block and ">" not in block and "&" not in block
    assert "\u2028" not in block
    # Exactly two script elements: the data and our own script; the labels opened none.
    assert len([tag for tag, _ in page.tags if tag == "script"]) == 2
    data = json.loads(block)
    assert sorted(data["records"]["label"]) == sorted(HOSTILE)
    assert {name for name, _, _ in data["groups"]} == {"g<b>", "plain"}


def test_the_same_table_gives_the_same_bytes(tmp_path):
    path = _csv(tmp_path, [("A", "1650", "1660", "x"), ("B", "c. 1655", "1700s", "y")])
    assert Chart(path).to_html() == Chart(path).to_html()


def test_the_data_holds_every_record_drawn_in_its_lane(tmp_path):
    rows = [(f"R{i}", f"{1600 + 3 * i}", f"{1620 + 3 * i}", "abc"[i % 3]) for i in range(40)]
    chart = Chart(_csv(tmp_path, rows), group="group")
    data = chart.explore()
    placement = chart.layout().placement
    lanes = [(first, count) for _, first, count in data.groups]
    assert sum(count for _, count in lanes) == sum(g.lanes for _, g in placement.leaves())
    assert len(data.columns["label"]) == 40
    # Each record in a lane of its own group, and no two overlapping in one lane.
    for index, lane in enumerate(data.columns["lane"]):
        first, count = lanes[data.columns["group"][index]]
        assert first <= lane < first + count
    by_lane: dict[int, list] = {}
    drawn = data.columns["drawn"]                       # four per record, flat
    for index, lane in enumerate(data.columns["lane"]):
        by_lane.setdefault(lane, []).append((drawn[4 * index], drawn[4 * index + 3]))
    for spans in by_lane.values():
        spans.sort()
        assert all(a[1] <= b[0] for a, b in zip(spans, spans[1:]))


def test_records_sharing_spans_give_the_data_of_records_each_with_its_own(tmp_path):
    """The data worked out once per distinct span (records of a table share them) is the
    data of the same records each holding a span object of its own."""
    import copy

    from timelines.model import Span

    forms = ["1650", "c. 1655", "1700s", "../1660", "1650/..", "before 1690", "", "1650?"]
    rows = [(f"R{i}", forms[i % 8], forms[(3 * i + 1) % 8] if i % 5 else "1702",
             "abc"[i % 3]) for i in range(60)]
    shared = list(Chart(_csv(tmp_path, rows), group="group").layout().loaded.records)
    own = [copy.copy(record) for record in shared]
    for record in own:
        if record.span is not None:
            object.__setattr__(record, "span", Span(copy.copy(record.span.start),
                                                    copy.copy(record.span.end)))
    assert len({id(r.span) for r in own}) > len({id(r.span) for r in shared})
    columns = [Chart(records, group="group").explore().columns for records in (shared, own)]
    assert json.dumps(columns[0]) == json.dumps(columns[1])


def test_explanations_are_those_of_parse_explain(tmp_path):
    from timelines.dates import explain

    chart = Chart(_csv(tmp_path, [("A", "c. 1650", "before 1700", "g")]))
    data = chart.explore()
    assert data.explanations["c. 1650"] == explain("c. 1650")
    assert data.explanations["before 1700"] == explain("before 1700")


def test_the_command_line_writes_an_explorer(tmp_path, capsys):
    from timelines.cli import main

    path = _csv(tmp_path, [("A", "1650", "1660", "g"), ("B", "", "", "g")])
    out = tmp_path / "chart.html"
    assert main(["render", str(path), "-o", str(out)]) == 1      # one row undated
    err = capsys.readouterr().err
    assert "2 rows read: 1 drawn, 1 reported (1 undated)" in err
    assert out.read_text(encoding="utf-8").startswith("<!DOCTYPE html>")
    assert json.loads(_parsed(out.read_text(encoding="utf-8")).scripts[0][1])["undated"] == \
        ["B (row 3)"]


def test_a_large_tables_data_is_compressed_and_decodes_to_the_same_json(tmp_path, monkeypatch):
    import gzip

    from timelines.render import html

    path = _csv(tmp_path, [(f"R{i}", f"{1600 + i}", f"{1650 + i}", "g") for i in range(30)])
    plain = _parsed(Chart(path).to_html()).scripts[0][1]
    monkeypatch.setattr(html, "COMPRESS_FROM", 100)
    page = Chart(path).to_html()
    [(attrs, block)] = [(a, t) for a, t in _parsed(page).scripts if a.get("id") == "tl-data"]
    assert attrs["type"] == "application/gzip"
    assert gzip.decompress(base64.b64decode(block)).decode("utf-8") == plain
    assert Chart(path).to_html() == page                 # gzip without a time stamp
