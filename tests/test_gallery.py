"""Every gallery example renders, draws every row of its table, and writes SVG and PNG."""
from __future__ import annotations

import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

GALLERY = Path(__file__).resolve().parent.parent / "gallery"
sys.path.insert(0, str(GALLERY))
import make_gallery  # noqa: E402

SCRIPTS = make_gallery.examples()


def test_the_gallery_has_its_examples():
    assert {s.parent.name for s in SCRIPTS} >= {"lifespans", "dynasty", "family", "archive",
                                                "site-phases", "facets", "questions",
                                                "radiocarbon"}


@pytest.mark.parametrize("script", SCRIPTS, ids=lambda s: s.parent.name)
def test_example_renders_svg_and_png(script, tmp_path):
    written = make_gallery.load(script).make(tmp_path)
    suffixes = sorted(p.suffix for p in written)
    assert suffixes == [".png", ".svg"]
    svg = next(p for p in written if p.suffix == ".svg")
    root = ET.parse(svg).getroot()
    records = [g for g in root.iter("{http://www.w3.org/2000/svg}g")
               if g.get("class") == "record"]
    table = next(script.parent.glob("*.csv"))
    rows = len(table.read_text(encoding="utf-8").splitlines()) - 1
    assert len(records) == rows             # every row of the example is drawn
    png = next(p for p in written if p.suffix == ".png")
    assert png.read_bytes().startswith(b"\x89PNG")


def test_gallery_scripts_are_short():
    for script in SCRIPTS:
        assert len(script.read_text(encoding="utf-8").splitlines()) <= 40, script
