"""Nothing lost at the command line: every input line answered, every write whole or not at all,
the report printed whatever happens to the write."""
from __future__ import annotations

import csv
import io
import json
import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

from timelines.cli.commands import main

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "timelines" / "demo" / "fenwold-organ-builders.csv"


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def _parse_process(data: bytes, *options: str) -> tuple[int, list[str]]:
    done = subprocess.run([sys.executable, "-m", "timelines", "parse", *options], input=data,
                          capture_output=True, cwd=ROOT)
    return done.returncode, done.stdout.decode("utf-8").splitlines()


# --- timelines parse ------------------------------------------------------------------------

def test_parse_answers_every_line_even_bytes_that_are_not_utf8():
    data = b"1650s\n\xff\xfe broken\nc. 1650\r\n\n1985-13-01\n" + "44 BC\n".encode()
    code, lines = _parse_process(data, "--json")
    assert code == 1                                     # some lines failed
    results = [json.loads(line) for line in lines]
    assert len(results) == 6                             # one line out per line in
    assert [r["ok"] for r in results] == [True, False, True, False, False, True]
    assert results[1]["error"] == "line 2 is not UTF-8 text (byte 0xff)"
    assert results[2]["input"] == "c. 1650"              # CRLF line ends are dropped


def test_parse_json_is_valid_utf8_for_any_argument():
    lone = "a\udcffb"                                      # a byte the OS could not decode
    done = subprocess.run([sys.executable, "-m", "timelines", "parse", "--json", "1650", lone],
                          capture_output=True, cwd=ROOT,
                          env={**os.environ, "PYTHONIOENCODING": "utf-8"})
    lines = done.stdout.decode("utf-8").splitlines()      # strict: raises if not UTF-8
    assert len(lines) == 2 and json.loads(lines[1])["input"] == lone


def test_an_unexpected_failure_is_that_lines_problem(capsys, monkeypatch):
    from timelines.cli import commands

    real = commands.describe

    def failing(text, settings):
        if text == "boom":
            raise ZeroDivisionError("division by zero")
        return real(text, settings)

    monkeypatch.setattr(commands, "describe", failing)
    code, out, _ = run(capsys, "parse", "--json", "1650", "boom", "1660")
    results = [json.loads(line) for line in out.splitlines()]
    assert len(results) == 3 and code == 1
    assert results[1]["error"] == ("internal error, please report: ZeroDivisionError: "
                                   "division by zero")
    assert results[2]["earliest"] == "1660-01-01"


def test_a_long_stream_gives_one_line_per_line(tmp_path):
    lines = [f"{1000 + n % 900}" if n % 7 else f"c. {1500 + n % 300}s?" for n in range(50_000)]
    lines[123] = "\x00\x1b[31m"                           # controls in the middle
    lines[124] = "c. 1650\u2028\x85"                      # line breaks to some readers
    code, out = _parse_process(("\n".join(lines) + "\n").encode(), "--json")
    assert len(out) == len(lines)
    assert [json.loads(line)["input"] for line in out[120:125]] == lines[120:125]


# --- writes ---------------------------------------------------------------------------------

def test_a_failing_writer_leaves_the_earlier_chart_and_still_reports(tmp_path, capsys,
                                                                       monkeypatch):
    target = tmp_path / "chart.svg"
    assert run(capsys, "render", str(DEMO), "-o", str(target))[0] == 0
    before = target.read_bytes()

    def broken(*args, **kwargs):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr("timelines.render.svg.render_svg", broken)
    code, _, err = run(capsys, "render", str(DEMO), "--title", "new", "-o", str(target))
    assert code == 1
    assert "16 rows read: 16 drawn" in err                # the report came first
    assert "No space left on device" in err
    assert target.read_bytes() == before                  # the earlier chart is intact
    assert [p.name for p in tmp_path.iterdir()] == ["chart.svg"]   # no temporary file left


def test_the_output_folder_is_checked_before_any_work(tmp_path, capsys):
    code, _, err = run(capsys, "render", str(DEMO), "-o", str(tmp_path / "none" / "c.svg"))
    assert code == 2
    assert "the folder" in err and "does not exist" in err
    assert "rows read" not in err                          # nothing was read


def test_killing_a_render_mid_write_leaves_the_earlier_chart(tmp_path):
    """A real run killed (SIGKILL) while it writes a large PNG: the target keeps the earlier
    chart, whole."""
    table = tmp_path / "big.csv"
    subprocess.run([sys.executable, str(ROOT / "gallery" / "register" / "make_register.py"),
                    "--rows", "3000", "-o", str(table)], check=True, cwd=ROOT)
    target = tmp_path / "chart.png"
    target.write_bytes(b"the earlier chart")
    command = [sys.executable, "-m", "timelines", "render", str(table), "--start", "admitted",
               "--end", "left", "--dpi", "200", "-o", str(target)]
    process = subprocess.Popen(command, cwd=ROOT, stdout=subprocess.DEVNULL,
                               stderr=subprocess.DEVNULL)
    deadline = time.monotonic() + 120
    while time.monotonic() < deadline and process.poll() is None:
        if any(p.name.endswith(".part") for p in tmp_path.iterdir()):
            os.kill(process.pid, signal.SIGKILL)           # mid-write
            break
        time.sleep(0.005)
    process.wait()
    if process.returncode == 0:
        pytest.skip("the run finished before it could be killed mid-write")
    assert process.returncode == -signal.SIGKILL
    assert target.read_bytes() == b"the earlier chart"


# --- safe text out --------------------------------------------------------------------------

HOSTILE = ('label,start,end,kind\n'
           '\ufeffplain,1650,1660,=HYPERLINK("x")\n'
           '"with\ufeffmark",1655,1670,+1\n'
           '"rlo \u202e reversed",1660,1680,@sum\n'
           '"\x1b[31mred",1665,1670,-2\n')


@pytest.fixture
def hostile(tmp_path) -> Path:
    path = tmp_path / "hostile.csv"
    path.write_text(HOSTILE, encoding="utf-8")
    return path


def test_lanes_csv_keeps_formulas_from_running(hostile, capsys):
    code, out, _ = run(capsys, "lanes", str(hostile), "--group", "kind", "--format", "csv")
    assert code == 0
    rows = list(csv.DictReader(io.StringIO(out)))
    # OWASP, "CSV Injection": a cell a spreadsheet would run gets a leading single quote
    assert sorted(row["group"] for row in rows) == ["'+1", "'-2", "'=HYPERLINK(\"x\")",
                                                    "'@sum"]
    assert all(row["box_start"].isdigit() for row in rows)      # numbers untouched


def test_negative_days_in_lanes_csv_are_not_quoted(tmp_path, capsys):
    path = tmp_path / "bc.csv"
    path.write_text("label,start,end\nold,200 BC,100 BC\n", encoding="utf-8")
    code, out, _ = run(capsys, "lanes", str(path), "--format", "csv")
    row = out.splitlines()[1].split(",")
    assert row[4].startswith("-") and row[5].startswith("-")


def test_terminal_output_escapes_control_characters(hostile, capsys):
    code, out, err = run(capsys, "lanes", str(hostile), "--group", "label")
    assert "\x1b" not in out and "\u202e" not in out
    assert "\\x1b[31mred" in out and "\\u202e" in out
    bad = hostile.parent / "bad.csv"
    bad.write_text("label,start,end\n\x1b[2Jwipe,1985-13-01,\n", encoding="utf-8")
    run(capsys, "check", str(bad))
    code, out, err = run(capsys, "render", str(bad), "-o", str(hostile.parent / "b.svg"))
    assert "\x1b" not in err


def test_invisible_and_bidi_characters_never_break_a_writer(hostile, tmp_path, capsys):
    for suffix in (".svg", ".png", ".pdf"):
        code, _, err = run(capsys, "render", str(hostile), "-o", str(tmp_path / f"h{suffix}"))
        assert code == 0, err
    import xml.etree.ElementTree as ET

    texts = [t.text or "" for t in ET.parse(tmp_path / "h.svg").getroot().iter(
        "{http://www.w3.org/2000/svg}text")]
    reversed_label = next(text for text in texts if "reversed" in text)
    assert reversed_label.endswith("\u202c")          # the override is closed in its label
    assert not any("\ufeff" in text for text in texts)


def test_strict_covers_the_bands_table(tmp_path, capsys):
    bands = tmp_path / "bands.csv"
    bands.write_text("label,start,end\nGood years,1650,1660\nBad,1985-13-01,1990\n",
                     encoding="utf-8")
    target = tmp_path / "strict.svg"
    code, _, err = run(capsys, "render", str(DEMO), "--bands", str(bands), "--strict",
                       "-o", str(target))
    assert code == 1
    assert "month 13 does not exist" in err and "nothing written" in err
    assert not target.exists()


def test_nothing_drawable_still_names_every_rows_reason(tmp_path, capsys):
    path = tmp_path / "none.csv"
    path.write_text("label,start,end\na,1985-13-01,\nb,,\nc,2001-02-29,2002\n", encoding="utf-8")
    code, _, err = run(capsys, "render", str(path), "-o", str(tmp_path / "none.svg"))
    assert code == 1
    assert "month 13 does not exist" in err
    assert "2001 is not a leap year" in err
    assert "no date" in err
    assert "nothing to draw" in err


# --- progress on long runs ------------------------------------------------------------------

class _Terminal(io.StringIO):
    def isatty(self) -> bool:
        return True


def test_progress_shows_on_a_terminal_and_is_wiped_after(monkeypatch):
    from timelines.cli import progress

    monkeypatch.setattr(progress, "AFTER", 0.0)
    monkeypatch.setattr(progress, "EVERY", 0.01)
    terminal = _Terminal()
    shown = progress.Progress(2, stream=terminal)
    with shown.step("reading big.csv"):
        time.sleep(0.1)
    written = terminal.getvalue()
    assert "timelines: [----------------------------------------"[:24] in written
    assert "reading big.csv (step 1 of 2" in written
    assert written.endswith("\r\x1b[K")                  # wiped when the step ended


def test_progress_stays_off_in_pipes_and_with_quiet(monkeypatch, tmp_path, capsys):
    from timelines.cli import progress

    monkeypatch.setattr(progress, "AFTER", 0.0)
    monkeypatch.setattr(progress, "EVERY", 0.001)
    quiet = _Terminal()
    with progress.Progress(1, stream=quiet, quiet=True).step("reading"):
        time.sleep(0.02)
    assert quiet.getvalue() == ""
    code, _, err = run(capsys, "render", str(DEMO), "-o", str(tmp_path / "d.svg"))
    assert code == 0 and "\r" not in err and "timelines: [" not in err


# --- spreadsheet readings the command line offers -------------------------------------------

def _workbook(path: Path) -> Path:
    from openpyxl import Workbook

    book = Workbook()
    sheet = book.active
    sheet.append(["name", "house", "born", "died"])
    sheet.append(["Aldric", "Hollin", "c. 1650", 1702])
    sheet.append(["Berenice", None, 1675, "before 1740"])
    sheet.append(["Cato", "Marrow", 39448, 39500])        # day serials in a General cell
    sheet.merge_cells("B2:B3")
    book.save(path)
    return path


def test_check_shows_what_reading_did_to_the_table(tmp_path, capsys):
    code, out, _ = run(capsys, "check", str(_workbook(tmp_path / "m.xlsx")))
    assert "m.xlsx:3: note: merged cells" in out
    assert "39448 looks like a date serial (2008-01-01" in out
    code, out, _ = run(capsys, "check", str(tmp_path / "m.xlsx"), "--json")
    assert [note["row"] for note in json.loads(out)["notes"]] == [3]


def test_date_numbers_serials_reads_serials(tmp_path, capsys):
    # Excel's 1900 date system: serial 39448 is 2008-01-01 (ECMA-376 Part 1, 18.17.4.1,
    # from memory; openpyxl's from_excel agrees)
    table = _workbook(tmp_path / "m.xlsx")
    code, out, _ = run(capsys, "lanes", str(table), "--date-numbers", "serials",
                       "--format", "json")
    import datetime as dt

    boxes = {row["row"]: row for row in json.loads(out)}
    assert boxes[4]["box_start"] <= dt.date(2008, 1, 1).toordinal()


# --- small things a trial found (issue 10, item 11) -------------------------------------------

def test_a_title_above_the_header_is_found_and_named(tmp_path, capsys):
    from openpyxl import Workbook

    book = Workbook()
    sheet = book.active
    for row in (["Register of the Pellory household, copied 1802"], [],
                ["name", "born", "died"], ["Aldric", "c. 1650", 1702]):
        sheet.append(row)
    book.save(tmp_path / "titled.xlsx")
    code, _, err = run(capsys, "check", str(tmp_path / "titled.xlsx"))
    assert code == 2 and "hint: if the column names are in row 3, give --header-row 3" in err
    code, out, _ = run(capsys, "check", str(tmp_path / "titled.xlsx"), "--header-row", "3")
    assert code == 0 and "1 row read: 1 drawn" in out


def test_rows_below_a_header_row_keep_their_spreadsheet_numbers(tmp_path, capsys):
    path = tmp_path / "t.csv"
    path.write_text("A note on provenance\n\nlabel,start,end\na,1650,1660\nb,1985-13-01,\n",
                    encoding="utf-8")
    code, out, _ = run(capsys, "check", str(path), "--header-row", "3")
    assert "t.csv:5:start: cannot read '1985-13-01'" in out


def test_usage_mistakes_are_usage_errors(tmp_path, capsys):
    code, _, err = run_exit(capsys, "render", str(DEMO), "--dpi", "0", "-o",
                            str(tmp_path / "d.png"))
    assert code == 2 and "expected a resolution from 1 to 2400 dpi" in err
    code, _, err = run_exit(capsys, "render", str(DEMO), "--facet", "category",
                            "--facet-order", "Jorneymen", "-o", str(tmp_path / "d.svg"))
    assert code == 2 and "did you mean 'Journeymen'?" in err


def test_parse_reads_a_config_file(tmp_path, capsys):
    config = tmp_path / "dates.toml"
    config.write_text('century = "strict"\n', encoding="utf-8")
    code, out, _ = run(capsys, "parse", "--config", str(config), "17th century")
    assert "1601-01-01 .. 1700-12-31" in out


def test_lanes_measures_the_chart_render_draws(capsys):
    narrow = run(capsys, "lanes", str(DEMO), "--size", "85x60mm", "--font-size", "6")[1]
    wide = run(capsys, "lanes", str(DEMO))[1]
    assert narrow != wide


def run_exit(capsys, *argv):
    try:
        code = main(list(argv))
    except SystemExit as stop:
        code = stop.code
    out, err = capsys.readouterr()
    return code, out, err
