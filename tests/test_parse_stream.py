"""`timelines parse` reading stdin as a stream (a real process, real pipes): each distinct line
read once, and the output the same as for the texts given one by one."""
from __future__ import annotations

import json
import subprocess
import sys


def _run(stdin: bytes, *args: str) -> subprocess.CompletedProcess:
    return subprocess.run([sys.executable, "-m", "timelines", "parse", *args], input=stdin,
                          capture_output=True, check=False)


def test_a_streamed_column_reads_as_its_lines_one_by_one():
    lines = ["c. 1650", "1650s", "bad date", "c. 1650", "1701/02", "", "c. 1650", "XVIIe siècle"]
    streamed = _run(("\ufeff" + "\n".join(lines) + "\n").encode("utf-8"), "--json")
    single = [json.loads(_run(b"", "--json", text).stdout) if text else None for text in lines]
    got = [json.loads(line) for line in streamed.stdout.decode("utf-8").splitlines()]
    assert len(got) == len(lines)
    for text, one, many in zip(lines, single, got):
        assert many["input"] == text
        if one is not None:
            assert one == many
    assert streamed.returncode == 1                      # a line was not a date


def test_a_line_that_is_not_utf8_costs_that_line_only():
    out = _run(b"1650\n\xff\xfe\n1660\n1650\n").stdout.decode("utf-8").splitlines()
    assert out[0].startswith("1650: 1650-01-01") and out[3] == out[0]
    assert "line 2 is not UTF-8 text (byte 0xff)" in out[1]
    assert out[2].startswith("1660: ")
