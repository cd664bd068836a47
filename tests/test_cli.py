"""The command line, called in-process: exit codes, stdout, stderr and written files."""
from __future__ import annotations

import io
import json
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from timelines.cli.commands import main

FIXTURES = Path(__file__).parent / "fixtures"
SVG = "{http://www.w3.org/2000/svg}"


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_demo_renders_every_row_and_exits_0(tmp_path, capsys):
    code, _, err = run(capsys, "render", "--demo", "-o", str(tmp_path / "demo.svg"))
    assert code == 0
    assert "16 rows read: 16 drawn" in err
    root = ET.parse(tmp_path / "demo.svg").getroot()
    assert len(root.findall(f".//{SVG}g[@class='record']")) == 16


def test_demo_svg_is_byte_identical_across_runs(tmp_path, capsys):
    for name in ("a.svg", "b.svg"):
        run(capsys, "render", "--demo", "-o", str(tmp_path / name))
    assert (tmp_path / "a.svg").read_bytes() == (tmp_path / "b.svg").read_bytes()


@pytest.mark.parametrize("suffix, magic", [(".png", b"\x89PNG\r\n\x1a\n"), (".pdf", b"%PDF")])
def test_demo_writes_png_and_pdf(tmp_path, capsys, suffix, magic):
    out = tmp_path / f"demo{suffix}"
    assert run(capsys, "render", "--demo", "-o", str(out))[0] == 0
    assert out.read_bytes().startswith(magic)


def test_bad_rows_are_reported_by_row_and_column_and_the_rest_drawn(tmp_path, capsys):
    out = tmp_path / "founders.svg"
    code, _, err = run(capsys, "render", str(FIXTURES / "harrowmere-founders.csv"), "-o", str(out))
    assert code == 1
    lines = err.splitlines()
    assert ("harrowmere-founders.csv:4:born: [H3] cannot read '1985-13-01': "
            "month 13 does not exist") in lines
    assert ("harrowmere-founders.csv:9:died: [H8] cannot read '2001-02-29': "
            "2001 is not a leap year") in lines
    assert any(line.startswith("harrowmere-founders.csv:8:died: [H7] the end") for line in lines)
    assert "10 rows read: 6 drawn, 4 reported" in err
    root = ET.parse(out).getroot()
    assert len(root.findall(f".//{SVG}g[@class='record']")) == 6
    notes = " ".join(t.text or "" for t in root.iter(f"{SVG}text") if t.get("class") == "note")
    assert "H6 (row 7)" in notes           # the undated row is listed under the chart


def test_strict_writes_nothing_when_a_row_fails(tmp_path, capsys):
    out = tmp_path / "founders.svg"
    code, _, err = run(capsys, "render", str(FIXTURES / "harrowmere-founders.csv"), "-o",
                       str(out), "--strict")
    assert code == 1 and not out.exists()
    assert "nothing written" in err


def test_usage_errors_exit_2_with_a_hint(tmp_path, capsys):
    code, _, err = run(capsys, "render", str(FIXTURES / "harrowmere-founders.csv"),
                       "--start", "brn", "-o", str(tmp_path / "x.svg"))
    assert code == 2
    assert "error: no column 'brn'" in err and "hint: did you mean 'born'?" in err
    code, _, err = run(capsys, "render", "--demo", "-o", str(tmp_path / "x.gif"))
    assert code == 2 and "must end in .svg, .png, .pdf or .html" in err
    with pytest.raises(SystemExit) as exited:
        main(["render", "-o", str(tmp_path / "x.svg")])
    assert exited.value.code == 2


def test_a_missing_file_is_a_clear_error(tmp_path, capsys):
    code, _, err = run(capsys, "render", str(tmp_path / "nope.csv"), "-o", str(tmp_path / "x.svg"))
    assert code == 1 and err.startswith("error: ") and "nope.csv" in err


def test_parse_json_follows_the_design_contract(capsys):
    code, out, _ = run(capsys, "parse", "--json", " c. 1650 ", "1985/1987", "1985-13-01")
    assert code == 1                       # one input had an error
    first, interval, bad = (json.loads(line) for line in out.splitlines())
    keys = {"input", "ok", "earliest", "latest", "likely", "precision", "qualifiers", "error"}
    assert set(first) == keys
    assert first["input"] == " c. 1650 "   # echoed exactly, spaces included
    assert first["ok"] and "approximate" in first["qualifiers"]
    # ISO 8601-2:2019 interval: the bounds are the possible extent, start and end given apart
    assert set(interval) == keys | {"start", "end"}
    assert (interval["earliest"], interval["latest"]) == ("1985-01-01", "1987-12-31")
    assert interval["start"]["latest"] == "1985-12-31"
    assert bad == {"input": "1985-13-01", "ok": False, "earliest": None, "latest": None,
                   "likely": None, "precision": None, "qualifiers": [],
                   "error": "month 13 does not exist"}


def test_parse_reads_stdin_lines_when_no_text_is_given(capsys, monkeypatch):
    monkeypatch.setattr("sys.stdin", io.StringIO("1650s\n-0043-03-15\n"))
    code, out, _ = run(capsys, "parse", "--json")
    assert code == 0
    decade, ides = (json.loads(line) for line in out.splitlines())
    assert (decade["earliest"], decade["latest"]) == ("1650-01-01", "1659-12-31")
    assert ides["earliest"] == "-0043-03-15"   # ISO 8601 expanded year, astronomical


def test_check_reports_without_drawing(capsys):
    code, out, _ = run(capsys, "check", str(FIXTURES / "harrowmere-founders.csv"), "--json")
    assert code == 1
    report = json.loads(out)
    assert report["counts"]["rows_read"] == 10


def test_bc_table_gets_bc_labels(tmp_path, capsys):
    table = tmp_path / "dynasty.csv"
    table.write_text("name,start,end\nKing Aram,c. 520 BC,480 BC\nQueen Ilse,480 BC,431 BC\n"
                     "King Tobar,431 BC,AD 12\n", encoding="utf-8")
    out = tmp_path / "dynasty.svg"
    assert run(capsys, "render", str(table), "-o", str(out))[0] == 0
    labels = [t.text for t in ET.parse(out).getroot().iter(f"{SVG}text")
              if t.get("class") == "tick-label"]
    assert any(label.endswith(" BCE") for label in labels), labels
    assert "0" not in labels and "0 BCE" not in labels
    code, out_text, err = run(capsys, "render", str(table), "-o", str(tmp_path / "bc.svg"),
                              "--era", "bc")
    labels = [t.text for t in ET.parse(tmp_path / "bc.svg").getroot().iter(f"{SVG}text")
              if t.get("class") == "tick-label"]
    assert any(label.endswith(" BC") for label in labels), labels


def test_demo_shows_every_mark_and_its_legend_explains_each(tmp_path, capsys):
    out = tmp_path / "demo.svg"
    run(capsys, "render", "--demo", "-o", str(out))
    root = ET.parse(out).getroot()
    legend = " ".join(t.text or "" for t in root.iter(f"{SVG}text")
                      if t.get("class") == "legend-text")
    for words in ("certain", "possible", "open", "not recorded", "before", "after",
                  "approximate (c., ~)", "uncertain (?)", "approximate and uncertain",
                  "most likely date", "a dated moment", "a moment somewhere on the line"):
        assert words in legend, words
    classes = {c for e in root.iter() for c in (e.get("class") or "").split()}
    assert {"core", "fringe", "open", "unknown", "bound", "likely", "qualifier",
            "point"} <= classes


def test_each_record_group_has_a_title_with_label_text_and_bounds(tmp_path, capsys):
    out = tmp_path / "demo.svg"
    run(capsys, "render", "--demo", "-o", str(out))
    root = ET.parse(out).getroot()
    titles = [g.find(f"{SVG}title").text for g in root.iter(f"{SVG}g")
              if g.get("class") == "record"]
    [perrin] = [t for t in titles if t.startswith("Aldous Perrin")]
    assert "written: c. 1608 – 1671" in perrin
    assert "possible: 1603-01-01 to 1671-12-31" in perrin


def test_hostile_labels_are_escaped_end_to_end(tmp_path, capsys):
    table = tmp_path / "hostile.csv"
    table.write_text(
        'name,start,end,group\n'
        '"<script>alert(1)</script>",1650,1660,"<g onload=alert(1)>"\n'
        '"javascript:alert(1)",1655,1670,"&amp; &lt;"\n'
        '"\u202eevil \U0001F600 \x07bell",1660,1680,x\n', encoding="utf-8")
    out = tmp_path / "hostile.svg"
    assert run(capsys, "render", str(table), "-o", str(out))[0] == 0
    text = out.read_text(encoding="utf-8")
    root = ET.fromstring(text.encode("utf-8"))            # still well-formed
    assert "<script" not in text and "foreignObject" not in text
    assert not any(name.startswith("on") for e in root.iter() for name in e.attrib)
    assert not any("href" in name for e in root.iter() for name in e.attrib)
    labels = [t.text for t in root.iter(f"{SVG}text") if "label" in (t.get("class") or "")]
    assert "<script>alert(1)</script>" in labels           # shown as text, not markup


def test_colour_column_gets_a_palette_key_in_the_legend(tmp_path, capsys):
    table = tmp_path / "colour.csv"
    table.write_text("name,start,end,workshop\nA,1650,1660,North\nB,1655,1670,Quay\n"
                     "C,1660,1680,North\n", encoding="utf-8")
    out = tmp_path / "colour.svg"
    assert run(capsys, "render", str(table), "--color", "workshop", "-o", str(out))[0] == 0
    root = ET.parse(out).getroot()
    legend = [t.text for t in root.iter(f"{SVG}text") if t.get("class") == "legend-text"]
    assert legend[-2:] == ["North", "Quay"]
    fills = {r.get("fill") for r in root.iter(f"{SVG}rect") if r.get("class") == "core"}
    # Okabe & Ito (2008) blue and orange, the first two of the default palette
    assert {"#0072b2", "#e69f00"} <= {f.lower() for f in fills if f}


def test_text_as_paths_and_a_tol_palette(tmp_path, capsys):
    table = tmp_path / "colour.csv"
    table.write_text("name,start,end,kind\nA,1650,1660,x\nB,1655,1670,y\n", encoding="utf-8")
    out = tmp_path / "paths.svg"
    code, _, _ = run(capsys, "render", str(table), "--color", "kind", "--palette", "tol-bright",
                     "--text", "paths", "-o", str(out))
    assert code == 0
    root = ET.parse(out).getroot()
    assert not list(root.iter(f"{SVG}text"))
    fills = {r.get("fill") for r in root.iter(f"{SVG}rect") if r.get("class") == "core"}
    # Paul Tol's "bright" scheme starts blue, red (SRON/EPS/TN/09-002, from memory)
    assert {"#4477AA", "#EE6677"} <= {f.upper() for f in fills if f}


def test_before_present_axis(tmp_path, capsys):
    table = tmp_path / "phases.csv"
    table.write_text("phase,start,end\nHall,c. 4900 BC,4700 BC\nMound,4300 BC,4100 BC\n",
                     encoding="utf-8")
    out = tmp_path / "bp.svg"
    assert run(capsys, "render", str(table), "--era", "bp", "-o", str(out))[0] == 0
    labels = [t.text for t in ET.parse(out).getroot().iter(f"{SVG}text")
              if t.get("class") == "tick-label"]
    assert labels and all(label.endswith(" BP") for label in labels), labels


def test_withhold_living_replaces_recent_people_without_a_death(tmp_path, capsys):
    table = tmp_path / "family.csv"
    table.write_text("id,name,born,died\nP1,Old Ezra,1850,1920\nP2,Young Ada,1990-05-04,\n",
                     encoding="utf-8")
    out = tmp_path / "family.svg"
    code, _, err = run(capsys, "render", str(table), "--withhold-living", "--as-of", "2026",
                       "-o", str(out))
    assert code == 0 and "1 record of possibly living persons" in err
    text = out.read_text(encoding="utf-8")
    assert "Young Ada" not in text and "1990-05-04" not in text and "P2" not in text
    assert "Old Ezra" in text


def test_parse_explain_says_how_each_bound_was_reached(capsys):
    code, out, _ = run(capsys, "parse", "--explain", "c. 1650")
    assert code == 0
    lines = out.splitlines()
    assert lines[0] == "input: 'c. 1650'"
    assert any("setting circa-year = 5" in line for line in lines)
    assert lines[-1].startswith("result: 1645-01-01 .. 1655-12-31")


def test_date_conventions_are_options_and_config_keys(tmp_path, capsys):
    # 17th century read strictly counts from AD 1: 1601-1700 (common practice, no source)
    code, out, _ = run(capsys, "parse", "--json", "--century", "strict", "17th century")
    assert code == 0 and json.loads(out)["earliest"] == "1601-01-01"
    code, _, err = run(capsys, "parse", "--century", "sometimes", "17th century")
    assert code == 2 and "century must be one of common, strict" in err
    config = tmp_path / "dates.toml"
    config.write_text('century = "strict"\nday-first = "yes"\n', encoding="utf-8")
    table = tmp_path / "t.csv"
    table.write_text("name,start,end\nA,17th century,03/04/1710\n", encoding="utf-8")
    out_file = tmp_path / "t.svg"
    assert run(capsys, "render", str(table), "--config", str(config), "-o", str(out_file))[0] == 0
    [title] = [g.find(f"{SVG}title").text for g in ET.parse(out_file).getroot().iter(f"{SVG}g")
               if g.get("class") == "record"]
    assert "possible: 1601-01-01 to 1710-04-03" in title


@pytest.mark.parametrize("command", ["render", "parse", "check", "lanes"])
def test_every_command_has_working_help(command, capsys):
    with pytest.raises(SystemExit) as exited:
        main([command, "--help"])
    assert exited.value.code == 0
    assert "usage: timelines" in capsys.readouterr().out
