"""The TOML config file, its merge with the command line, --print-config, and distances.

Sources: TOML 1.0.0 (toml.io) for the file syntax, read by the standard library's tomllib;
CSS Values and Units Level 3 §5.2 for the page units (1in = 96px = 2.54cm, 1pt = 1/72in);
the Gregorian calendar's 146097 days in 400 years for the mean year.
"""
from __future__ import annotations

import tomllib
from pathlib import Path

import pytest

from timelines.cli.commands import main
from timelines.cli.config import (
    COMMAND_LINE, CONFIG_FILE, DEFAULT, Setting, check_keys, config_lines, merge, read_config,
)
from timelines.errors import UsageError
from timelines.layout.distances import parse_distance

FIXTURES = Path(__file__).parent / "fixtures"
FOUNDERS = str(FIXTURES / "harrowmere-founders.csv")


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


# --- distances ---------------------------------------------------------------------------

DISTANCES = [
    ("5y", 5 * 365.2425, "days"),        # mean Gregorian year: 146097 / 400 days
    ("30d", 30.0, "days"),
    ("2 weeks", 14.0, "days"),
    ("6mo", 365.2425 / 2, "days"),
    ("4px", 4.0, "px"),
    ("1in", 96.0, "px"),                 # CSS: 1in = 96px
    ("25.4mm", 96.0, "px"),              # CSS: 1in = 25.4mm
    ("2.54cm", 96.0, "px"),
    ("72pt", 96.0, "px"),                # CSS: 1pt = 1/72in
    (" 0.5Y ", 0.5 * 365.2425, "days"),
]


def test_distance_cases_do_not_repeat():
    assert len({text for text, _, _ in DISTANCES}) == len(DISTANCES)


@pytest.mark.parametrize("text, amount, unit", DISTANCES)
def test_distances(text, amount, unit):
    distance = parse_distance(text)
    assert (distance.amount, distance.unit) == (pytest.approx(amount), unit)


def test_a_page_distance_becomes_days_by_the_scale_and_a_time_stays():
    assert parse_distance("4px").days(days_per_px=10.0) == 40.0
    assert parse_distance("30d").days(days_per_px=10.0) == 30.0


@pytest.mark.parametrize("text", ["5", "px", "-3px", "5 parsecs", "1e3d", ""])
def test_unreadable_distances_are_usage_errors_with_a_hint(text):
    with pytest.raises(UsageError) as raised:
        parse_distance(text)
    assert "5y" in raised.value.hint and "4px" in raised.value.hint


# --- reading and merging -----------------------------------------------------------------


def test_read_config_gives_the_keys_and_values(tmp_path):
    path = tmp_path / "lanes.toml"
    path.write_text('group = "craft"\nmax-lanes = 4\ndescending = true\n'
                    'group-order = ["Weaver", "Dyer"]\n', encoding="utf-8")
    assert read_config(path) == {"group": "craft", "max-lanes": 4, "descending": True,
                                 "group-order": ["Weaver", "Dyer"]}


def test_a_toml_syntax_error_says_where(tmp_path):
    path = tmp_path / "bad.toml"
    path.write_text('pack = "compact"\ngroup = craft\n', encoding="utf-8")
    with pytest.raises(UsageError) as raised:
        read_config(path)
    assert "not a valid TOML file" in str(raised.value)
    assert "line 2" in str(raised.value)          # tomllib names the line and column


def test_sections_and_missing_files_are_usage_errors(tmp_path):
    path = tmp_path / "sections.toml"
    path.write_text('[render]\npack = "single"\n', encoding="utf-8")
    with pytest.raises(UsageError, match=r"\[render\] is a table"):
        read_config(path)
    with pytest.raises(UsageError, match="no such config file"):
        read_config(tmp_path / "nope.toml")


def test_an_unknown_key_gets_a_did_you_mean():
    with pytest.raises(UsageError) as raised:
        check_keys({"lane_gap": "5y"}, ["lane-gap", "pack"], "x.toml")
    assert str(raised.value) == "x.toml: unknown setting 'lane_gap'"
    assert raised.value.hint == "did you mean 'lane-gap'?"


def test_merge_prefers_the_command_line_then_the_file_then_the_default():
    settings = merge({"pack": "compact", "sort": "start", "gap": "3px"},
                     {"pack": "single", "sort": "end"}, {"pack": "ordered"}, "a.toml")
    assert settings["pack"] == Setting("pack", "ordered", COMMAND_LINE)
    assert settings["sort"] == Setting("sort", "end", CONFIG_FILE, "a.toml")
    assert settings["gap"] == Setting("gap", "3px", DEFAULT)


def test_printed_settings_are_a_toml_file_that_reads_back():
    settings = [Setting("title", 'Kings "of" Essar\\', DEFAULT), Setting("max-lanes", 4,
                                                                          COMMAND_LINE),
                Setting("strict", False, DEFAULT), Setting("dpi", 150.0, DEFAULT),
                Setting("subgroup", None, DEFAULT)]
    text = "\n".join(config_lines(settings, {"subgroup": "none"}))
    assert tomllib.loads(text) == {"title": 'Kings "of" Essar\\', "max-lanes": 4,
                                   "strict": False, "dpi": 150.0}
    assert "# subgroup: none" in text and "# command line" in text


# --- through the command line ------------------------------------------------------------


def write_config(tmp_path, text: str) -> str:
    path = tmp_path / "timelines.toml"
    path.write_text(text, encoding="utf-8")
    return str(path)


def test_print_config_shows_each_setting_and_where_it_came_from(tmp_path, capsys):
    config = write_config(tmp_path, 'pack = "single"\nlane-gap = "2y"\nstart = "born"\n')
    code, out, _ = run(capsys, "render", "--config", config, "--print-config",
                       "--lane-gap", "4px")
    assert code == 0
    lines = {line.split(" = ")[0]: line for line in out.splitlines() if " = " in line}
    assert lines["pack"].startswith('pack = "single"') and f"config file {config}" in lines[
        "pack"]
    assert lines["lane-gap"].startswith('lane-gap = "4px"') and "command line" in lines[
        "lane-gap"]
    assert lines["sort"].startswith('sort = "start"') and lines["sort"].endswith("# default")
    assert lines["start"].startswith('start = "born"')
    body = "\n".join(line for line in out.splitlines() if not line.startswith("#"))
    assert tomllib.loads(body)["pack"] == "single"      # the output is a config file itself


def test_the_config_file_sets_options_and_the_command_line_overrides_it(tmp_path, capsys):
    config = write_config(tmp_path, 'pack = "single"\nlabel = "name"\n')
    code, out, _ = run(capsys, "lanes", FOUNDERS, "--config", config, "--format", "csv")
    single = [line.split(",")[3] for line in out.splitlines()[1:] if line.split(",")[3]]
    assert sorted(map(int, single)) == list(range(1, len(single) + 1))
    code, out, _ = run(capsys, "lanes", FOUNDERS, "--config", config, "--format", "csv",
                       "--pack", "compact")
    compact = [line.split(",")[3] for line in out.splitlines()[1:] if line.split(",")[3]]
    assert max(map(int, compact)) < len(single)


@pytest.mark.parametrize("text, message", [
    ('pack = "tight"\n', "pack must be one of compact, ordered, single, not 'tight'"),
    ('strict = "yes"\n', "strict must be true or false"),
    ('max-lanes = 0\n', "max-lanes: expected a whole number >= 1"),
    ('lane-gap = "5"\n', "lane-gap: cannot read the distance '5'"),
    ('lane_gap = "5y"\n', "unknown setting 'lane_gap'"),
    ('title = ["a"]\n', "title cannot be [\"a\"]"),
])
def test_bad_config_values_are_usage_errors(tmp_path, capsys, text, message):
    config = write_config(tmp_path, text)
    code, _, err = run(capsys, "render", FOUNDERS, "-o", str(tmp_path / "x.svg"),
                       "--config", config)
    assert code == 2 and message in err, err
    assert not (tmp_path / "x.svg").exists()


def test_a_key_of_another_command_is_ignored_not_refused(tmp_path, capsys):
    # 'title' and 'dpi' are render's; the same file serves `timelines check` too.
    config = write_config(tmp_path, 'title = "Founders"\ndpi = 300\nstart = "born"\n')
    code, out, _ = run(capsys, "check", FOUNDERS, "--config", config)
    assert code == 1 and "10 rows read" in out


def test_group_order_may_be_a_toml_list(tmp_path, capsys):
    table = tmp_path / "t.csv"
    table.write_text("name,start,end,group\na,1600,1610,X\nb,1620,1630,Y\nc,1640,1650,Z\n",
                     encoding="utf-8")
    config = write_config(tmp_path, 'group-order = ["Z", "X"]\n')
    code, out, _ = run(capsys, "lanes", str(table), "--config", config)
    groups = [line.split()[0] for line in out.splitlines()[1:4]]
    assert code == 0 and groups == ["Z", "X", "Y"]
