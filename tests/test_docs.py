"""The docs that cannot drift: the API page is what the code says, and the worked example runs."""
from __future__ import annotations

import importlib.util
import runpy
import xml.etree.ElementTree as ElementTree
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def _generator():
    spec = importlib.util.spec_from_file_location("make_api_docs",
                                                  ROOT / "tools" / "make_api_docs.py")
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def test_the_api_page_is_what_the_code_says():
    written = (ROOT / "docs" / "api.md").read_text(encoding="utf-8")
    assert written == _generator().page(), "run: python tools/make_api_docs.py"


def test_the_api_page_names_every_public_name():
    import timelines

    written = (ROOT / "docs" / "api.md").read_text(encoding="utf-8")
    undocumented = [name for name in timelines.__all__
                    if f"timelines.{name}" not in written and f"`{name}`" not in written]
    # Errors, settings and enums are named in the text of the entries that raise or take them.
    assert set(undocumented) <= {"ChartOptions", "DateError", "DateSettings", "LaneSettings",
                                 "Precision", "Provenance", "Qualifier", "SourceError",
                                 "TimelineError", "UsageError"}, undocumented


def test_the_notebook_tour_runs(tmp_path, monkeypatch, capsys):
    monkeypatch.chdir(tmp_path)
    runpy.run_path(str(ROOT / "docs" / "examples" / "notebook_tour.py"), run_name="__main__")
    printed = capsys.readouterr().out
    assert "10 rows read: 10 drawn" in printed
    assert "c. 320 BC" in printed
    svg = ElementTree.parse(tmp_path / "ostrel.svg").getroot()
    assert svg.tag == "{http://www.w3.org/2000/svg}svg"
    assert (tmp_path / "ostrel.png").read_bytes().startswith(b"\x89PNG")
    assert (tmp_path / "ostrel-greyscale.pdf").read_bytes().startswith(b"%PDF")
    assert (tmp_path / "ostrel-figure.png").stat().st_size > 10_000
