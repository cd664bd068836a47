"""Statements between records as a simple temporal network (analysis/constraints.py)."""
from __future__ import annotations

import pytest

import timelines.analysis.constraints as constraints
from timelines.analysis.constraints import Statement, parse_gap, read_statements, tighten
from timelines.calendar import fixed_from_gregorian
from timelines.errors import UsageError
from timelines.model import Endpoint, Provenance, Record, Span

SOLVERS = pytest.mark.parametrize("small_network", [constraints.SMALL_NETWORK, 0],
                                  ids=["floyd-warshall", "bellman-ford"])


def _record(key: str, start: tuple, end: tuple, row: int) -> Record:
    return Record(key, Span(Endpoint(*start), Endpoint(*end)), Provenance("people.csv", row),
                  id=key)


def _said(first: str, relation: str, second: str, gap: str | None, row: int) -> Statement:
    return Statement(first, relation, second, parse_gap(gap) if gap else None,
                     "statements.csv", row)


def _windows(record: Record) -> tuple:
    start, end = record.span.start, record.span.end
    return start.earliest, start.latest, end.earliest, end.latest


# Dechter, Meiri & Pearl (1991), "Temporal constraint networks", Artificial Intelligence 49,
# the John-and-Fred story (from memory: the paper's numbers could not be looked up here, so
# the story is taken as the brief tells it). Minutes after 7:00 stand for days. John's
# journey: left home 7:10..7:20 (start 10..20); Fred's: arrived 7:50..8:00 (end 50..60); John
# arrived 10..20 minutes after Fred left home.
JOHN = _record("john", (10, 20), (None, None), 2)
FRED = _record("fred", (None, None), (50, 60), 3)


def _story(john_takes: str, fred_takes: str) -> list[Statement]:
    return [_said("john", "lasts", "", john_takes, 2), _said("fred", "lasts", "", fred_takes, 3),
            _said("john", "ends after the start of", "fred", "10d..20d", 4)]


@SOLVERS
def test_john_by_car_and_fred_by_carpool_is_consistent_with_one_scenario(monkeypatch,
                                                                           small_network):
    # By hand: John arrives at 10..20 + 30..40 = 40..60; Fred leaves at 50..60 − 40..50 =
    # 0..20, so John arrives at most 20 + 20 = 40: John arrives at 40 exactly, so he left at
    # 10 (40 − 30, within 10..20), Fred left at 20 (40 − 20, the latest he could) and arrived
    # at 60 (20 + 40, the latest allowed). The minimal network is a single scenario:
    # John 7:10–7:40, Fred 7:20–8:00.
    monkeypatch.setattr(constraints, "SMALL_NETWORK", small_network)
    result = tighten([JOHN, FRED], _story("30d..40d", "40d..50d"))
    assert result.consistent
    assert [_windows(r) for r in result.records] == [(10, 10, 40, 40), (20, 20, 60, 60)]
    assert str(result.narrowed[0]).startswith("row 2 start: ")
    assert all(n.statements for n in result.narrowed)


def test_the_minimal_network_holds_every_pair():
    # The same story: John arrives exactly 20 minutes after Fred leaves (x2 − x3 = 20).
    network = constraints._network([JOHN, FRED], _story("30d..40d", "40d..50d"))
    distance, _ = constraints.minimal_network(network)
    john_arrives, fred_leaves = network.node(0, "end"), network.node(1, "start")
    assert distance[fred_leaves, john_arrives] == 20 and distance[john_arrives, fred_leaves] == -20


@SOLVERS
def test_john_by_bus_and_fred_by_carpool_is_a_negative_cycle(monkeypatch, small_network):
    # By hand: John arrives at 10 + 60 = 70 at the earliest; Fred leaves at 60 − 40 = 20 at
    # the latest, so John arrives by 20 + 20 = 40: 30 minutes short. The cycle: John's start
    # window, the bus, "John arrived 10..20 after Fred left", the carpool, Fred's end window.
    monkeypatch.setattr(constraints, "SMALL_NETWORK", small_network)
    result = tighten([JOHN, FRED], _story("60d..", "40d..50d"))
    assert not result.consistent
    [contradiction] = result.contradictions
    assert contradiction.excess == 30
    assert sorted(s.row for s in contradiction.statements) == [2, 3, 4]
    assert {r.record.id for r in contradiction.reasons if r.record} == {"john", "fred"}
    assert result.records == (JOHN, FRED)


# An invented family (fixed days from the Gregorian calendar).
def _year(year: int) -> tuple[int, int]:
    return fixed_from_gregorian(year, 1, 1), fixed_from_gregorian(year, 12, 31)


def _family() -> list[Record]:
    will = _record("will", _year(1690), _year(1690), 2)                 # written in 1690
    death = _record("death", (_year(1680)[0], _year(1700)[1]),
                    (_year(1680)[0], _year(1700)[1]), 3)                # died 1680..1700
    apprentice = _record("apprenticeship", (_year(1650)[0], _year(1655)[1]),
                         (_year(1655)[0], _year(1665)[1]), 4)           # 1650..55 to 1655..65
    parent = _record("parent", _year(1640), (None, None), 5)            # born 1640
    child = _record("child", (_year(1640)[0], _year(1670)[1]), (None, None), 6)
    return [will, death, apprentice, parent, child]


@SOLVERS
def test_a_will_an_apprenticeship_and_a_child_tighten_by_hand(monkeypatch, small_network):
    monkeypatch.setattr(constraints, "SMALL_NETWORK", small_network)
    statements = [_said("will", "before", "death", None, 2),
                  _said("apprenticeship", "lasts", "", "7y", 3),
                  _said("child", "starts after the start of", "parent", "12y..", 4)]
    will, death, apprentice, parent, child = tighten(_family(), statements).records
    # The death is not before the will was written: 1690-01-01..1700-12-31.
    assert _windows(death)[:2] == (_year(1690)[0], _year(1700)[1])
    # Seven years are 2556.7 days: 2556..2557. The end, 1655..1665, becomes the start's
    # window moved on by them: 1650-01-01 + 2556 (1656-12-31) .. 1655-12-31 + 2557
    # (1662-12-31); the start keeps 1650..1655 (1665-12-31 − 2556 is later than 1655).
    assert _windows(apprentice) == (_year(1650)[0], _year(1655)[1],
                                    _year(1650)[0] + 2556, _year(1655)[1] + 2557)
    assert _year(1650)[0] + 2556 == fixed_from_gregorian(1656, 12, 31)
    # A child born at least 12 years (4382 days) after a parent born in 1640.
    assert _windows(child)[0] == _year(1640)[0] + 4382
    assert will == _family()[0] and parent == _family()[3]          # untouched


@SOLVERS
def test_a_contradiction_names_the_rows(monkeypatch, small_network):
    monkeypatch.setattr(constraints, "SMALL_NETWORK", small_network)
    # The burial (1685..1688) allows a death 1680..1688, the will (1690) one from 1690 on.
    burial = _record("burial", (_year(1685)[0], _year(1688)[1]),
                     (_year(1685)[0], _year(1688)[1]), 7)
    statements = [_said("will", "before", "death", None, 2),
                  _said("death", "before", "burial", "..1y", 3)]
    result = tighten([*_family(), burial], statements)
    [contradiction] = result.contradictions
    text = str(contradiction)
    assert "statements.csv:2 (will before death)" in text
    assert "statements.csv:3 (death before burial ..1y)" in text
    assert "row 2 (will" in text and "row 7 (burial" in text and "cannot all hold" in text
    # 1690-01-01 (the will's earliest) to 1688-12-31 (the burial's latest): 366 days short.
    assert contradiction.excess == _year(1690)[0] - _year(1688)[1]


def test_gaps_read_as_whole_days():
    assert (parse_gap("7y").low, parse_gap("7y").high) == (2556, 2557)
    assert (parse_gap("12y..").low, parse_gap("12y..").high) == (4382, constraints.INF)
    assert (parse_gap("..5y").low, parse_gap("..5y").high) == (0, 1827)
    assert (parse_gap("30d").low, parse_gap("30d").high) == (30, 30)
    with pytest.raises(UsageError):
        parse_gap("7 fortnights")


def test_statements_are_read_from_a_table(tmp_path):
    path = tmp_path / "statements.csv"
    path.write_text("a,relation,b,gap\nwill,before,death,\napprenticeship,Lasts,,7y\n",
                    encoding="utf-8")
    first, second = read_statements(path)
    assert (first.first, first.relation, first.second, first.row) == ("will", "before",
                                                                      "death", 2)
    assert (second.relation, second.gap.text, str(second)) == ("lasts", "7y",
                                                               "statements.csv:3")
    path.write_text("a,relation,b\nwill,befor,death\n", encoding="utf-8")
    with pytest.raises(UsageError, match="statements.csv:2.*befor"):
        read_statements(path)


def test_check_with_constraints_prints_narrowings_and_contradictions(tmp_path, capsys):
    from timelines.cli import main
    people = tmp_path / "people.csv"
    people.write_text("id,label,start,end\nwill,Will,1690,1690\n"
                      "death,Death,1680-1700,1680-1700\nburial,Burial,1685-1688,1685-1688\n",
                      encoding="utf-8")
    good, bad = tmp_path / "good.csv", tmp_path / "statements.csv"
    good.write_text("a,relation,b\nwill,before,death\n", encoding="utf-8")
    bad.write_text("a,relation,b\nwill,before,death\ndeath,before,burial\n", encoding="utf-8")
    assert main(["check", str(people), "--constraints", str(good)]) == 0
    assert ("row 3 start: 1680-01-01..1700-12-31 → 1690-01-01..1700-12-31, by good.csv:2"
            in capsys.readouterr().out)
    assert main(["check", str(people), "--constraints", str(bad)]) == 1
    out = capsys.readouterr().out
    assert "statements.csv:2 (Will before Death)" in out and "cannot all hold" in out


def test_render_draws_the_tightened_windows(tmp_path, capsys):
    from timelines import Chart
    from timelines.cli import main
    from timelines.errors import TimelineError

    people = tmp_path / "people.csv"
    people.write_text("id,label,start,end\nwill,Will,1690,1690\n"
                      "death,Death,1680-1700,1680-1700\nburial,Burial,1685-1688,1685-1688\n",
                      encoding="utf-8")
    good, bad = tmp_path / "good.csv", tmp_path / "bad.csv"
    good.write_text("a,relation,b\nwill,before,death\n", encoding="utf-8")
    bad.write_text("a,relation,b\nwill,before,death\ndeath,before,burial\n", encoding="utf-8")
    chart = Chart(people).constrain(good)
    death = next(r for r in chart.records if r.id == "death")
    assert death.span.start.earliest == fixed_from_gregorian(1690, 1, 1)   # by the will
    assert chart.layout().narrowed == 2             # its start and its end
    assert main(["render", str(people), "--constraints", str(good),
                 "-o", str(tmp_path / "c.svg")]) == 0
    assert "2 bounds narrowed by the statements of --constraints" in capsys.readouterr().err
    with pytest.raises(TimelineError, match="cannot all hold"):
        Chart(people).constrain(bad).records
    assert main(["render", str(people), "--constraints", str(bad),
                 "-o", str(tmp_path / "d.svg")]) == 1
    assert not (tmp_path / "d.svg").exists()


def test_check_json_holds_the_constraints_outcome_in_one_object(tmp_path, capsys):
    import json

    from timelines.cli import main
    people = tmp_path / "people.csv"
    people.write_text("id,label,start,end\nwill,Will,1690,1690\n"
                      "death,Death,1680-1700,1680-1700\nburial,Burial,1685-1688,1685-1688\n",
                      encoding="utf-8")
    good, bad = tmp_path / "good.csv", tmp_path / "bad.csv"
    good.write_text("a,relation,b\nwill,before,death\n", encoding="utf-8")
    bad.write_text("a,relation,b\nwill,before,death\ndeath,before,burial\n", encoding="utf-8")
    assert main(["check", str(people), "--json", "--constraints", str(good)]) == 0
    data = json.loads(capsys.readouterr().out)      # the whole output parses as one object
    outcome = data["constraints"]
    assert outcome["consistent"] and data["counts"]["rows_read"] == 3
    start = next(n for n in outcome["narrowed"] if n["side"] == "start")
    assert (start["row"], start["id"], start["statements"]) == (3, "death", ["good.csv:2"])
    assert start["after_days"] == [fixed_from_gregorian(1690, 1, 1),
                                   fixed_from_gregorian(1700, 12, 31)]
    assert main(["check", str(people), "--json", "--constraints", str(bad)]) == 1
    outcome = json.loads(capsys.readouterr().out)["constraints"]
    assert not outcome["consistent"] and outcome["narrowed"] == []
    (contradiction,) = outcome["contradictions"]
    assert sorted(contradiction["statements"]) == ["bad.csv:2", "bad.csv:3"]
    assert contradiction["excess_days"] > 0 and "cannot all hold" in contradiction["line"]


def test_the_analysis_guide_shows_what_check_prints(capsys):
    # docs/analysis.md quotes `check --constraints` on gallery/questions: keep it true.
    from pathlib import Path

    from timelines.cli import main
    root = Path(__file__).resolve().parent.parent
    folder = root / "gallery" / "questions"
    guide = (root / "docs" / "analysis.md").read_text(encoding="utf-8")
    assert main(["check", str(folder / "corrow-household.csv"), "--label", "name", "--id", "id",
                 "--constraints", str(folder / "statements.tsv")]) == 0
    narrowed = [line for line in capsys.readouterr().out.splitlines()
                if line.startswith("narrowed:")]
    assert narrowed and all(line in guide for line in narrowed)


# -- what statements bind between two records, for relate -------------------------------------

def _completions(records, statements):
    """Every integer choice of the four days (first and last of each record, first <= last)
    that keeps every statement: brute force, the reference for the links."""
    import itertools
    a, b = records
    ranges = [range(w[0], w[1] + 1) for r in (a, b) for w in
              ((r.span.start.earliest, r.span.start.latest),
               (r.span.end.earliest, r.span.end.latest))]
    for a0, a1, b0, b1 in itertools.product(*ranges):
        if a0 > a1 or b0 > b1:
            continue
        days = {("a", "start"): a0, ("a", "end"): a1, ("b", "start"): b0, ("b", "end"): b1}
        keeps = True
        for statement in statements:
            first, second = statement.first, statement.second or statement.first
            for number, (earlier, later, (low, high)) in enumerate(
                    constraints.RELATIONS[statement.relation]):
                if number == 0 and statement.gap is not None:
                    low, high = statement.gap.low, statement.gap.high
                names = {"A": first, "B": second}
                gap = days[(names[later[0]], later[1])] - days[(names[earlier[0]], earlier[1])]
                keeps &= low <= gap <= high
        if keeps:
            yield a0, a1 + 1, b0, b1 + 1


@SOLVERS
def test_relations_under_statements_agree_with_brute_force(monkeypatch, small_network):
    # The relations possible once statements hold are exactly those of the completions that
    # keep them, counted by brute force; the narrowed windows alone would allow more.
    import random

    from timelines.analysis.relations import ALLEN_RELATIONS, classify, relate
    monkeypatch.setattr(constraints, "SMALL_NETWORK", small_network)
    chooser = random.Random(5)
    relations = ["before", "after", "starts before the start of", "ends before the end of",
                 "during", "same start", "ends after the start of", "lasts"]
    wider = 0
    for trial in range(150):
        records = []
        for key in "ab":
            first = chooser.randint(0, 8)
            last = first + chooser.randint(0, 8)
            records.append(_record(key, (first, first + chooser.randint(0, 4)),
                                   (last, last + chooser.randint(0, 4)), 2))
        relation = chooser.choice(relations)
        low = chooser.randint(0, 5)
        gap = chooser.choice([None, f"{low}d..", f"..{low}d", f"{low}d..{low + 2}d"])
        said = [_said("a", relation, "" if relation == "lasts" else "b", gap, 2)]
        outcome = tighten(records, said)
        expected = {ALLEN_RELATIONS[int(code)] for code in
                    {int(classify(*c)) for c in _completions(records, said)}}
        if not outcome.consistent:
            assert not expected, (trial, said)
            continue
        a, b = outcome.records
        found = relate(a, b, links=outcome.links.between(0, 1))
        assert set(found.possible) == expected, (trial, relation, gap)
        wider += set(relate(a, b).possible) != expected
    assert wider > 10          # the links mattered: windows alone over-report in many trials


def test_relate_and_alongside_under_statements(tmp_path, capsys):
    from timelines.cli.commands import main
    table = tmp_path / "people.csv"
    table.write_text("id,name,born,died\np1,Anna Wray,1650,1700\np3,Cora Wray,c. 1700,1740\n",
                     encoding="utf-8")
    said = tmp_path / "said.csv"
    said.write_text("first,relation,second,gap\np1,before,p3,2d..\n", encoding="utf-8")
    assert main(["relate", str(table), "p1", "p3"]) == 0
    assert "no relation is certain" in capsys.readouterr().out
    assert main(["relate", str(table), "p1", "p3", "--constraints", str(said)]) == 0
    printed = capsys.readouterr()
    assert printed.out.splitlines()[0] == "p1 before p3 (certain)"
    assert "bound narrowed by the statements of --constraints" in printed.err
    assert main(["relate", str(table), "--alongside", "p1", "--constraints", str(said),
                 "--format", "json"]) == 0
    assert capsys.readouterr().out.strip() == "[]"          # Cora came after Anna's death
    assert main(["relate", str(table), "--with", "p1", "--constraints", str(said),
                 "--format", "csv"]) == 0
    assert "p1,p3,Cora Wray,1,before,before" in capsys.readouterr().out.splitlines()


def test_activity_counts_the_narrowed_windows(tmp_path, capsys):
    # A life "1650s" to "before 1700" counts possibly in the 1690s; "lasts ..30y" ends it by
    # the end of 1689.
    from timelines.cli.commands import main
    table = tmp_path / "people.csv"
    table.write_text("id,name,born,died\np1,Anna Wray,1650s,before 1700\n", encoding="utf-8")
    said = tmp_path / "said.csv"
    said.write_text("first,relation,second,gap\np1,lasts,,..30y\n", encoding="utf-8")
    assert main(["activity", str(table), "--format", "csv"]) == 0
    plain = capsys.readouterr().out
    assert main(["activity", str(table), "--format", "csv", "--constraints", str(said)]) == 0
    narrowed = capsys.readouterr()
    assert "narrowed by the statements of --constraints" in narrowed.err
    possible = {line.split(",")[3]: line.split(",")[5] for line in narrowed.out.splitlines()[1:]}
    assert ",1690–1699,0,1," in plain                       # possibly active then
    assert list(possible)[-1] == "1680–1689" and possible["1680–1689"] == "1"   # no longer
