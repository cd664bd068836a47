"""A tall chart as PDF pages (issue 10, item 7): split at group breaks, every group once, the
axis under the lanes of every page, the heading first and the legend last."""
from __future__ import annotations

import re

import pytest

from timelines import Chart
from timelines.cli import main
from timelines.errors import UsageError
from timelines.scene.primitives import Group, Text, walk

ROWS = [{"name": f"Member {i}", "craft": f"Craft {i % 9}", "start": str(1600 + (i * 7) % 150),
         "end": str(1610 + (i * 7) % 150)} for i in range(700)]


def _chart() -> Chart:
    return Chart(ROWS, group="craft", label="name").titles("A register in pages (invented)")


def _records(scene) -> list[str]:
    return [g.title.split("\n")[0] for g in walk(scene.children)
            if isinstance(g, Group) and g.css_class == "record"]


def test_every_record_lands_on_exactly_one_page_under_an_axis():
    chart = _chart()
    pages = chart.pages()
    assert len(pages) > 2
    drawn = [name for page in pages for name in _records(page)]
    assert sorted(drawn) == sorted(_records(chart.scene()))
    for page in pages:
        axes = [g for g in page.children if isinstance(g, Group) and g.css_class == "axis"]
        assert len(axes) == 1
        groups = [g for g in page.children if g.css_class.startswith("group")]
        lowest = max(t.y for g in groups for t in walk(g.children) if isinstance(t, Text))
        assert axes[0].children[0].y1 > lowest                 # the axis is under the lanes
        assert page.height <= chart.scene().width * 297 / 210 + 1   # an A4 page at most


def test_the_heading_opens_and_the_legend_closes():
    pages = _chart().pages()
    titles = [[t for t in page.children if isinstance(t, Text) and t.css_class == "title"]
              for page in pages]
    assert [len(found) for found in titles] == [1] + [0] * (len(pages) - 1)
    legends = [[g for g in page.children if g.css_class == "legend"] for page in pages]
    assert [len(found) for found in legends] == [0] * (len(pages) - 1) + [1]


def test_the_pdf_has_those_pages_and_repeats_byte_for_byte(tmp_path):
    chart = _chart().page(pages=True)
    chart.save(tmp_path / "a.pdf")
    chart.save(tmp_path / "b.pdf")
    written = (tmp_path / "a.pdf").read_bytes()
    assert written == (tmp_path / "b.pdf").read_bytes()
    # ISO 32000-1, 7.7.3.3: each page object has /Type /Page
    assert len(re.findall(rb"/Type /Page\b", written)) == len(chart.pages())


def test_pages_are_for_one_panel_and_for_pdf(tmp_path, capsys):
    with pytest.raises(UsageError, match="splits a chart of one panel"):
        _chart().facet("craft").pages()
    code = None
    try:
        code = main(["render", "x.csv", "--pages", "-o", str(tmp_path / "x.svg")])
    except SystemExit as stop:
        code = stop.code
    assert code == 2 and "--pages writes a PDF" in capsys.readouterr().err
