"""Ends the data leave open are drawn for what they are (issue 10): short stubs whose length
says nothing, or bounds the user's longest plausible duration sets; open ends run on."""
from __future__ import annotations

import pytest

from timelines import Chart
from timelines.calendar import fixed_from_gregorian as day
from timelines.chart import build_scene
from timelines.errors import UsageError
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from timelines.scene.primitives import GradientRect, Group, walk

DAYS_PER_YEAR = 365.2425          # the mean Gregorian year (146,097 days in 400 years)
ROWS = [
    {"name": "Orrin Vell", "born": "1650", "died": ""},           # death not recorded
    {"name": "Sabra Vell", "born": "1655", "died": "after 1680"},  # one-sided
    {"name": "Tamsin Vell", "born": "", "died": "1702"},           # birth not recorded
    {"name": "Ulric Vell", "born": "1620", "died": "1690"},
    {"name": "Vesna Vell", "born": "44 BC", "died": "AD 20"},      # far away in time
]


def _stretches(chart: Chart, name: str) -> list[GradientRect]:
    [group] = [g for g in walk(chart.scene().children)
               if isinstance(g, Group) and g.css_class == "record" and g.title.startswith(name)]
    return [p for p in walk(group.children) if isinstance(p, GradientRect)
            and "unknown" in p.css_class.split()]


def _chart(rows=ROWS) -> Chart:
    return Chart(rows, start="born", end="died", label="name")


def test_open_sides_without_a_duration_are_stubs_of_one_page_length():
    chart = _chart()
    stub = chart.options.theme.stub_length
    for name in ("Orrin", "Sabra", "Tamsin"):
        [stretch] = _stretches(chart, name)
        assert stretch.width == pytest.approx(stub), name
    # the 44 BC row does not stretch Orrin's unknown end over two thousand years
    legend = [t.text for t in walk(chart.scene().children)
              if getattr(t, "css_class", "") == "legend-text"]
    assert "not recorded: an empty cell, drawn short; it could lie anywhere beyond" in legend
    assert "no limit on this side: drawn short, it could lie further on" in legend


def test_a_longest_duration_bounds_unknown_and_one_sided_ends():
    chart = _chart().ends(longest="110y")
    orrin, sabra, tamsin = (next(r for r in chart.records if r.label.startswith(name))
                            for name in ("Orrin", "Sabra", "Tamsin"))
    # unknown death: no later than the latest possible birth plus 110 years
    latest_birth = day(1650, 12, 31)
    assert orrin.span.end.latest == int(latest_birth + 110 * DAYS_PER_YEAR)
    assert Qualifier.DURATION_BOUND in orrin.span.end.qualifiers
    assert Qualifier.UNKNOWN_END in orrin.span.end.qualifiers     # still not recorded
    # after 1680: from 1681 to the latest birth (1655) plus 110 years
    assert sabra.span.end.earliest == day(1681, 1, 1)
    assert sabra.span.end.latest == int(day(1655, 12, 31) + 110 * DAYS_PER_YEAR)
    # unknown birth: no earlier than the earliest possible death less 110 years
    assert tamsin.span.start.earliest == int(day(1702, 1, 1) - 110 * DAYS_PER_YEAR)
    [stretch] = _stretches(chart, "Orrin")
    scale = chart.layout().scale
    assert stretch.x + stretch.width == pytest.approx(scale.x(orrin.span.end.latest))
    assert "limited by the longest duration set for it" in next(
        g.title for g in walk(chart.scene().children)
        if isinstance(g, Group) and (g.title or "").startswith("Orrin"))
    assert chart.layout().bounded == 3


def test_a_record_already_longer_than_the_duration_is_left_open_and_named():
    rows = [{"name": "Wyn", "born": "1650", "died": "after 1780"},
            {"name": "Xan", "born": "1700", "died": "1750"}]
    chart = _chart(rows).ends(longest="110y")
    wyn = chart.records[0]
    assert wyn.span.end.latest is None                          # not bounded
    [warning] = chart.report.warnings
    assert warning.row == 0 and "already takes longer than --longest 110y" in warning.message


def test_a_column_gives_each_record_its_own_duration():
    rows = [{"name": "Yorick", "born": "1650", "died": "", "kind": "apprentice", "max": "7y"},
            {"name": "Zelda", "born": "1650", "died": "", "kind": "life", "max": "110"}]
    chart = _chart(rows).ends(column="max")
    yorick, zelda = chart.records
    assert yorick.span.end.latest == int(day(1650, 12, 31) + 7 * DAYS_PER_YEAR)
    assert zelda.span.end.latest == int(day(1650, 12, 31) + 110 * DAYS_PER_YEAR)


def test_open_ends_still_run_to_the_edge():
    shop = Record("Shop", Span(Endpoint(day(1679, 1, 1), day(1679, 12, 31), Precision.YEAR),
                               Endpoint.open(Qualifier.OPEN_END)), Provenance("t.csv", 2))
    other = Record("Other", Span(Endpoint.day(day(1600, 1, 1)), Endpoint.day(day(1720, 1, 1))),
                   Provenance("t.csv", 3))
    scene = build_scene([shop, other])
    [group] = [g for g in walk(scene.children)
               if isinstance(g, Group) and (g.title or "").startswith("Shop")]
    assert "possible: 1679-01-01 to open" in group.title


def test_the_duration_must_be_a_time():
    with pytest.raises(UsageError, match="is a page length, not a time"):
        _chart().ends(longest="40px").records


# --- tall charts ------------------------------------------------------------------------------

def _register(rows: int, groups: int) -> list[dict]:
    return [{"name": f"Member {i}", "craft": f"Craft {i % groups}",
             "start": str(1600 + (i * 7) % 150), "end": str(1610 + (i * 7) % 150)}
            for i in range(rows)]


def _axes(chart: Chart) -> list[Group]:
    return [g for g in walk(chart.scene().children)
            if isinstance(g, Group) and g.css_class.startswith("axis")]


def test_a_short_chart_has_one_axis_at_its_foot():
    [axis] = _axes(Chart(ROWS, start="born", end="died", label="name"))
    assert axis.css_class == "axis"


def test_a_tall_chart_repeats_its_axis_above_and_at_group_breaks():
    chart = Chart(_register(600, 12), group="craft", label="name")
    axes = _axes(chart)
    kinds = [a.css_class for a in axes]
    assert kinds[0] == "axis axis-top" and kinds[-1] == "axis"
    repeats = [a for a in axes if a.css_class == "axis axis-repeat"]
    assert repeats                                 # the lanes are several pages tall
    labels = [t.text for t in repeats[0].children]
    assert labels == [t.text for t in axes[-1].children if t.css_class == "tick-label"]
    ys = [a.children[0].y for a in repeats]
    assert all(b - a > 1000 for a, b in zip(ys, ys[1:]))   # a page apart, no closer


def test_a_chart_taller_than_viewers_show_says_what_to_do():
    chart = Chart(_register(3000, 3), group="craft", label="name").lanes(pack="single")
    [note] = [w for w in chart.warnings if "more than many viewers show" in w]
    assert "--max-lanes" in note and "--facet" in note


def test_each_group_may_have_its_own_longest_duration(tmp_path, capsys):
    rows = [{"name": "Yorick", "born": "1650", "died": "", "standing": "Apprentice"},
            {"name": "Zelda", "born": "1650", "died": "", "standing": "Master"},
            {"name": "Abel", "born": "1650", "died": "", "standing": "Guest"}]
    chart = Chart(rows, start="born", end="died", label="name", group="standing").ends(
        longest="90y", by_group={"Apprentice": "7y", "Master": "60y"})
    yorick, zelda, abel = chart.records
    latest_birth = day(1650, 12, 31)
    assert yorick.span.end.latest == int(latest_birth + 7 * DAYS_PER_YEAR)
    assert zelda.span.end.latest == int(latest_birth + 60 * DAYS_PER_YEAR)
    assert abel.span.end.latest == int(latest_birth + 90 * DAYS_PER_YEAR)   # the table's
    # the same from the command line and from a config file (a list there)
    from timelines.cli import main

    table = tmp_path / "t.csv"
    table.write_text("name,born,died,standing\nYorick,1650,,Apprentice\n", encoding="utf-8")
    config = tmp_path / "ends.toml"
    config.write_text('longest-by-group = ["Apprentice=7y", "Master=60y"]\n', encoding="utf-8")
    outputs = []
    for argv in (["--longest-by-group", "Apprentice=7y, Master=60y"], ["--config", str(config)],
                 []):
        code = main(["lanes", str(table), "--group", "standing", "--format", "json", *argv])
        outputs.append(capsys.readouterr().out)
        assert code == 0
    assert outputs[0] == outputs[1] != outputs[2]        # option and file agree; both bound
    code = main(["lanes", str(table), "--longest-by-group", "Apprentice"])
    assert code == 2 and "give group names and times" in capsys.readouterr().err


def test_parse_explain_says_how_a_chart_draws_a_side_without_a_limit(capsys):
    from timelines.cli import main

    main(["parse", "--explain", "after 1780"])
    lines = capsys.readouterr().out.splitlines()
    assert any(line.startswith("no later limit: a chart draws this side short; --longest")
               for line in lines)
    main(["parse", "--explain", "1650-1660"])
    assert "limit" not in capsys.readouterr().out
