"""`timelines lanes` and the lane options of `timelines render`, called in-process."""
from __future__ import annotations

import csv
import io
import json
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given
from hypothesis import settings as hypothesis_settings
from hypothesis import strategies as st

from timelines.chart import ChartOptions, arrange
from timelines.cli.commands import main
from timelines.layout import report as lanes_report
from timelines.sources import ColumnMap

FIXTURES = Path(__file__).parent / "fixtures"
FOUNDERS = str(FIXTURES / "harrowmere-founders.csv")
REGISTER_SCRIPT = Path(__file__).parent.parent / "gallery" / "register" / "make_register.py"
SVG = "{http://www.w3.org/2000/svg}"


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def csv_rows(text: str) -> list[dict[str, str]]:
    return list(csv.DictReader(io.StringIO(text)))


@pytest.fixture
def guild(tmp_path) -> Path:
    table = tmp_path / "guild.csv"
    table.write_text(
        "ref,name,from,until,workshop,role,rank\n"
        "G1,Aldous Perrin,1600,1650,North,master,1\n"
        "G2,Bertilde Ash,1610,1660,North,journeyman,2\n"
        "G3,Corwin Vale,1620,1640,North,master,3\n"
        "G4,Dagny Thorne,1605,1615,Quay,master,4\n"
        "G5,Edric Low,1612,1630,Quay,journeyman,5\n"
        "G6,Fenna Holt,1641,1670,North,journeyman,6\n"
        "G7,Gideon Marsh,1600,1690,Bell,warden,7\n", encoding="utf-8")
    return table


def test_lanes_prints_a_table_per_group(capsys):
    code, out, err = run(capsys, "lanes", "--demo")
    assert code == 0
    header, *rows = out.splitlines()
    assert header.split()[:3] == ["group", "records", "lanes"]
    masters = next(row for row in rows if row.startswith("Masters"))
    # Masters: 4 records, all alive together in the 1650s -> 4 lanes, and no fewer possible
    assert masters.split()[1:4] == ["4", "4", "4"] and "4 at once" in masters
    assert next(row for row in rows if row.startswith("all")).split()[1] == "16"
    assert "16 rows read: 16 drawn" in err


def test_lanes_csv_has_one_row_per_record_with_the_fixed_columns(capsys):
    code, out, _ = run(capsys, "lanes", FOUNDERS, "--format", "csv")
    assert code == 1                             # the fixture has unreadable rows
    assert out.splitlines()[0] == "row,id,group,lane,box_start,box_end"
    rows = csv_rows(out)
    assert len(rows) == 7                        # 6 drawn + 1 undated; 3 unreadable rows
    undated = [row for row in rows if not row["box_start"]]
    assert [row["id"] for row in undated] == ["H6"] and undated[0]["lane"] == ""
    for row in rows:
        if row["box_start"]:
            assert float(row["box_start"]) < float(row["box_end"])
            assert int(row["lane"]) >= 1


def test_lanes_json_matches_the_csv(capsys):
    _, as_csv, _ = run(capsys, "lanes", "--demo", "--format", "csv")
    _, as_json, _ = run(capsys, "lanes", "--demo", "--format", "json")
    records = json.loads(as_json)
    assert [str(r["row"]) for r in records] == [row["row"] for row in csv_rows(as_csv)]
    assert set(records[0]) == {"row", "id", "group", "lane", "box_start", "box_end"}
    assert all(isinstance(r["lane"], int) for r in records)


def test_lanes_read_back_as_pins_give_the_same_lanes(guild, tmp_path, capsys):
    _, out, _ = run(capsys, "lanes", str(guild), "--group", "workshop", "--format", "csv")
    lanes = {row["row"]: row["lane"] for row in csv_rows(out)}
    pinned = tmp_path / "pinned.csv"
    with open(guild, encoding="utf-8") as source, open(pinned, "w", encoding="utf-8") as out_:
        for number, line in enumerate(source, start=1):
            lane = "lane" if number == 1 else lanes[str(number)]
            out_.write(f"{line.rstrip()},{lane}\n")
    _, again, _ = run(capsys, "lanes", str(pinned), "--group", "workshop", "--format", "csv",
                      "--lane-column", "lane", "--pack", "single")
    assert {row["row"]: row["lane"] for row in csv_rows(again)} == lanes


def test_subgroups_add_a_column_and_nest_in_the_table(guild, capsys):
    code, out, _ = run(capsys, "lanes", str(guild), "--group", "workshop", "--subgroup",
                       "role", "--format", "csv")
    assert out.splitlines()[0] == "row,id,group,subgroup,lane,box_start,box_end"
    assert {(r["group"], r["subgroup"]) for r in csv_rows(out)} == {
        ("North", "master"), ("North", "journeyman"), ("Quay", "master"),
        ("Quay", "journeyman"), ("Bell", "warden")}
    _, table, _ = run(capsys, "lanes", str(guild), "--group", "workshop", "--subgroup", "role")
    assert "\n  master " in table and "\n  journeyman " in table


def test_render_draws_group_and_subgroup_headers(guild, tmp_path, capsys):
    out = tmp_path / "guild.svg"
    code, _, _ = run(capsys, "render", str(guild), "--group", "workshop", "--subgroup", "role",
                     "--group-order", "name", "-o", str(out))
    assert code == 0
    root = ET.parse(out).getroot()
    captions = [(t.get("class"), t.text) for t in root.iter(f"{SVG}text")
                if t.get("class") in ("group-label", "subgroup-label")]
    assert [text for kind, text in captions if kind == "group-label"] == ["Bell", "North",
                                                                         "Quay"]
    assert ("subgroup-label", "journeyman") in captions


def test_min_group_size_merges_small_groups(guild, capsys):
    _, out, _ = run(capsys, "lanes", str(guild), "--group", "workshop", "--min-group-size",
                    "3", "--other-group", "Smaller workshops")
    assert "Smaller workshops holds" not in out       # a name with spaces is quoted
    assert "'Smaller workshops' holds the small groups Quay, Bell" in out


def test_an_unknown_group_in_the_order_is_a_usage_error_with_a_hint(guild, capsys):
    code, _, err = run(capsys, "lanes", str(guild), "--group", "workshop", "--group-order",
                       "Quay,Nrth")
    assert code == 2
    assert "error: no group 'Nrth' to put in order" in err
    assert "hint: did you mean 'North'?" in err


def test_an_unknown_sort_column_is_a_usage_error_naming_the_keys(guild, capsys):
    code, _, err = run(capsys, "lanes", str(guild), "--sort", "durration")
    assert code == 2 and "no column 'durration'" in err and "'duration'" in err


def test_sort_by_a_column_and_ordered_packing(guild, capsys):
    _, out, _ = run(capsys, "lanes", str(guild), "--pack", "single", "--sort", "rank",
                    "--descending", "--format", "csv")
    assert [row["id"] for row in sorted(csv_rows(out), key=lambda r: int(r["lane"]))] == [
        "G7", "G6", "G5", "G4", "G3", "G2", "G1"]


def test_max_lanes_reports_what_does_not_fit_and_exits_1(guild, tmp_path, capsys):
    out = tmp_path / "guild.svg"
    code, _, err = run(capsys, "render", str(guild), "--max-lanes", "2", "-o", str(out))
    assert code == 1
    left_out = [line for line in err.splitlines() if "not drawn: no room" in line]
    assert left_out and all(line.startswith("guild.csv:") for line in left_out)
    assert "left out for lack of room (at most 2 lanes a group)" in err
    root = ET.parse(out).getroot()
    drawn = len(root.findall(f".//{SVG}g[@class='record']"))
    assert drawn + len(left_out) == 7               # every row drawn or reported
    notes = [t.text for t in root.iter(f"{SVG}text") if t.get("class") == "left-out"]
    assert notes and notes[0].startswith(f"{len(left_out)} more not drawn")


def test_strict_writes_nothing_when_records_are_left_out(guild, tmp_path, capsys):
    out = tmp_path / "guild.svg"
    code, _, err = run(capsys, "render", str(guild), "--max-lanes", "2", "--strict",
                       "-o", str(out))
    assert code == 1 and not out.exists() and "nothing written" in err


def test_a_pin_that_cannot_be_kept_is_a_warning_and_the_row_still_drawn(tmp_path, capsys):
    table = tmp_path / "pins.csv"
    table.write_text("name,start,end,lane\nA,1600,1650,1\nB,1610,1640,1\nC,1700,1710,x\n",
                     encoding="utf-8")
    code, out, err = run(capsys, "lanes", str(table), "--lane-column", "lane", "--format",
                         "csv")
    assert code == 0
    assert "pins.csv:3: warning: lane 1 is taken there by row 2 (A); placed with the others" in err
    assert "pins.csv:4: warning: lane 'x' is not a lane number" in err
    assert len(csv_rows(out)) == 3


def test_lane_options_are_checked_by_the_parser(capsys, tmp_path):
    for option, value in (("--lane-gap", "5"), ("--max-lanes", "0"), ("--pack", "tight"),
                          ("--min-group-size", "-1"), ("--labels", "above")):
        with pytest.raises(SystemExit) as exited:
            main(["lanes", FOUNDERS, option, value])
        assert exited.value.code == 2
        assert option in capsys.readouterr().err


def test_render_without_output_is_a_usage_error(capsys):
    with pytest.raises(SystemExit) as exited:
        main(["render", "--demo"])
    assert exited.value.code == 2 and "-o" in capsys.readouterr().err


def test_labels_inside_takes_fewer_lanes_and_keeps_every_label_in_a_tooltip(tmp_path,
                                                                               capsys):
    _, beside, _ = run(capsys, "lanes", "--demo", "--format", "json")
    _, inside, err = run(capsys, "lanes", "--demo", "--format", "json", "--labels", "inside")
    most = lambda text: max(r["lane"] for r in json.loads(text))  # noqa: E731
    assert most(inside) <= most(beside)
    assert "kept in the tooltips only" in err


def test_the_invented_register_tries_three_groupings(tmp_path, capsys):
    table = tmp_path / "register.csv"
    subprocess.run([sys.executable, str(REGISTER_SCRIPT), "--rows", "400", "-o", str(table)],
                   check=True)
    common = ["lanes", str(table), "--start", "admitted", "--end", "left", "--label", "name",
              "--id", "ref"]
    for grouping in (["--group", "craft"],
                     ["--group", "ward", "--subgroup", "standing", "--min-subgroup-size", "20"],
                     ["--group", "standing", "--pack", "ordered", "--sort", "duration",
                      "--descending"]):
        code, out, err = run(capsys, *common, *grouping)
        assert code == 1                         # the register holds three broken rows
        assert "400 rows read: 397 drawn, 3 reported" in err
        assert any(line.split()[0] == "all" for line in out.splitlines())
    code, out, _ = run(capsys, *common, "--group", "craft", "--format", "csv")
    assert len(csv_rows(out)) == 398             # 397 drawn + 1 undated


def test_the_register_generator_is_deterministic(tmp_path):
    first, second = tmp_path / "a.csv", tmp_path / "b.csv"
    for path in (first, second):
        subprocess.run([sys.executable, str(REGISTER_SCRIPT), "--rows", "50", "-o", str(path)],
                       check=True)
    assert first.read_bytes() == second.read_bytes()


# The CSV writes box bounds with a fast formatter; it must print what the number would.
@hypothesis_settings(max_examples=2000)
@given(st.one_of(st.floats(min_value=-4e11, max_value=4e11, allow_nan=False),
                 st.integers(min_value=-10**9, max_value=10**9).map(lambda n: n / 1000),
                 st.integers(min_value=-10**6, max_value=10**6).map(lambda n: n + 0.0005)))
def test_day_text_prints_the_rounded_day_number(day):
    days = np.array([day, -day])
    assert lanes_report.day_texts(days) == list(map(str, lanes_report.day_numbers(days)))


IDENTIFIERS = st.text(alphabet=st.sampled_from(list('ab1 ,"\'\r\n;é')), min_size=1, max_size=6)


@hypothesis_settings(max_examples=60, deadline=None)
@given(st.lists(st.tuples(IDENTIFIERS, IDENTIFIERS), min_size=1, max_size=6))
def test_csv_ids_and_groups_read_back_as_written(tmp_path_factory, rows):
    # RFC 4180: a field holding a comma, a quote or a line break is quoted, a quote doubled;
    # the csv module reads the file back to the same cells.
    table = tmp_path_factory.mktemp("quoting") / "people.csv"
    with table.open("w", newline="", encoding="utf-8") as file:
        writer = csv.writer(file)
        writer.writerow(["ref", "start", "end", "kind"])
        writer.writerows((ref, "1650", "1700", kind) for ref, kind in rows)
    written = io.StringIO()
    placement = main_placement(table)
    lanes_report.write_csv(placement, written)
    read = list(csv.reader(io.StringIO(written.getvalue(), newline="")))
    assert read[0] == list(lanes_report.RECORD_COLUMNS)
    assert sorted((row[1], row[2]) for row in read[1:]) == sorted(
        (ref.strip(), kind.strip()) for ref, kind in rows)


def main_placement(table: Path):
    columns = ColumnMap(start="start", end="end", id="ref", label="ref", group="kind")
    (placement,) = arrange(table, ChartOptions(columns=columns)).placements
    return placement
