"""analysis.relations: Allen's relations certain / possible, CIDOC CRM comparisons, Monte Carlo
probabilities, contemporaries; each outside source named where it is used."""
from __future__ import annotations

import itertools
import json
import math
import random
from datetime import date

import pytest

from timelines.analysis.relations import (
    ALLEN_RELATIONS, APART, CONVERSES, CRM_RELATIONS, classify, compose, contemporaries,
    contemporary_pairs, exact_shares, record_bounds, relate, relation_shares, relations_with)
from timelines.errors import TimelineError
from timelines.model import EVENT, Endpoint, Provenance, Record, Span


def window(earliest: int | None, latest: int | None) -> Endpoint:
    return Endpoint(earliest, latest)


def span(label: str, first: tuple, last: tuple, kind: str = "span", id: str | None = None):
    return Record(label, Span(window(*first), window(*last)), Provenance("invented.csv", 2),
                  kind=kind, id=id)


def exact(label: str, first_day: int, last_day: int) -> Record:
    return span(label, (first_day, first_day), (last_day, last_day))


def event(label: str, earliest: int | None, latest: int | None) -> Record:
    point = window(earliest, latest)
    return Record(label, Span(point, point), Provenance("invented.csv", 2), kind=EVENT)


def year(number: int) -> tuple[int, int]:
    # Fixed days from the stdlib: date.toordinal() counts R.D. days (Python docs, datetime).
    return date(number, 1, 1).toordinal(), date(number, 12, 31).toordinal()


# Allen (1983), "Maintaining knowledge about temporal intervals", CACM 26(11), Fig. 2: the
# thirteen relations drawn as pairs of intervals. Here as whole days: A covers days 10..19
# (instants 10 to 20); B as below. X meets Y when X's last day is the day before Y's first.
ALLEN_EXAMPLES = [
    ((25, 30), "before"),          # X < Y: X ends before Y starts, with a gap
    ((20, 30), "meets"),           # X m Y: X's end is Y's start
    ((15, 30), "overlaps"),        # X o Y
    ((15, 19), "finished-by"),     # X fi Y (Y finishes X)
    ((12, 17), "contains"),        # X di Y (Y during X)
    ((10, 30), "starts"),          # X s Y
    ((10, 19), "equals"),          # X = Y
    ((10, 15), "started-by"),      # X si Y
    ((5, 30), "during"),           # X d Y
    ((5, 19), "finishes"),         # X f Y
    ((5, 15), "overlapped-by"),    # X oi Y
    ((0, 9), "met-by"),            # X mi Y
    ((0, 5), "after"),             # X > Y
]


@pytest.mark.parametrize("b_days, expected", ALLEN_EXAMPLES)
def test_the_thirteen_relations_on_exact_intervals(b_days, expected):
    found = relate(exact("A", 10, 19), exact("B", *b_days))
    assert found.possible == (expected,) and found.certain == expected
    assert relate(exact("B", *b_days), exact("A", 10, 19)).certain == CONVERSES[expected]


def test_the_examples_cover_the_thirteen_once():
    assert sorted(name for _, name in ALLEN_EXAMPLES) == sorted(ALLEN_RELATIONS)
    assert len(set(ALLEN_RELATIONS)) == 13


def test_allens_converse_table():
    # Allen (1983), Fig. 2: each relation with its inverse symbol: < >, m mi, o oi, d di,
    # s si, f fi, and = its own inverse.
    written = {"before": "after", "meets": "met-by", "overlaps": "overlapped-by",
               "during": "contains", "starts": "started-by", "finishes": "finished-by",
               "equals": "equals"}
    both_ways = {**written, **{inverse: name for name, inverse in written.items()}}
    assert CONVERSES == both_ways


# Allen (1983), Fig. 4, the transitivity table: entries FROM MEMORY (symbols < m o d s f =
# and their inverses), each the relations A may have to C given A r1 B and B r2 C.
ALL = set(ALLEN_RELATIONS)
SHARING_TIME = ALL - APART
COMPOSITION_ENTRIES = [
    ("before", "before", {"before"}),
    ("before", "after", ALL),
    ("meets", "meets", {"before"}),
    ("overlaps", "overlaps", {"before", "meets", "overlaps"}),
    ("during", "during", {"during"}),
    ("starts", "starts", {"starts"}),
    ("finishes", "finishes", {"finishes"}),
    ("before", "during", {"before", "overlaps", "meets", "during", "starts"}),
    ("during", "before", {"before"}),
    ("during", "after", {"after"}),
    ("during", "contains", ALL),
    ("contains", "during", SHARING_TIME),       # Allen's "o oi dur con ="
    ("meets", "during", {"overlaps", "during", "starts"}),
    ("overlaps", "during", {"overlaps", "during", "starts"}),
    ("starts", "during", {"during"}),
    ("meets", "met-by", {"finished-by", "equals", "finishes"}),
    ("met-by", "meets", {"starts", "equals", "started-by"}),
]


@pytest.mark.parametrize("first, second, expected", COMPOSITION_ENTRIES)
def test_allens_composition_table_entries(first, second, expected):
    assert set(compose(first, second)) == expected


def test_the_composition_table_as_a_whole():
    table = {(r, s): set(compose(r, s)) for r in ALLEN_RELATIONS for s in ALLEN_RELATIONS}
    # Its 169 entries hold 409 relations in all (Allen 1983, Fig. 4; the total FROM MEMORY).
    assert sum(map(len, table.values())) == 409
    for (r, s), found in table.items():
        assert table["equals", s] == {s} and table[r, "equals"] == {r}   # equals: identity
        # Converses: (r . s)^-1 = s^-1 . r^-1 (an algebraic law of relation composition).
        assert {CONVERSES[x] for x in found} == table[CONVERSES[s], CONVERSES[r]]


def test_compose_names_an_unknown_relation():
    with pytest.raises(TimelineError, match="'precedes' is not one of Allen's relations"):
        compose("precedes", "before")


@pytest.mark.parametrize("points", [4, 5, 6, 7])
def test_the_counting_priors_over_n_points(points):
    # The counting priors of the interval algebra (as in the issue, after Allen 1983): over
    # n distinct points, of all ordered pairs of intervals with ends among them, the six
    # strict relations occur C(n,4) times each, the six sharing one end C(n,3), equals C(n,2).
    intervals = list(itertools.combinations(range(points), 2))
    counts = dict.fromkeys(ALLEN_RELATIONS, 0)
    for (a_start, a_end), (b_start, b_end) in itertools.product(intervals, repeat=2):
        found = relate(exact("A", a_start, a_end - 1), exact("B", b_start, b_end - 1))
        counts[found.certain] += 1
    strict = ("before", "overlaps", "contains", "during", "overlapped-by", "after")
    sharing = ("meets", "finished-by", "starts", "started-by", "finishes", "met-by")
    assert all(counts[name] == math.comb(points, 4) for name in strict)
    assert all(counts[name] == math.comb(points, 3) for name in sharing)
    assert counts["equals"] == math.comb(points, 2)


def test_classify_agrees_with_relate_on_exact_intervals():
    intervals = list(itertools.combinations(range(6), 2))
    pairs = list(itertools.product(intervals, repeat=2))
    codes = classify(*zip(*[(a[0], a[1], b[0], b[1]) for a, b in pairs]))
    for (a, b), code in zip(pairs, codes):
        found = relate(exact("A", a[0], a[1] - 1), exact("B", b[0], b[1] - 1))
        assert found.certain == ALLEN_RELATIONS[code]


def test_two_lives_with_overlapping_windows_are_possibly_many_things_and_certainly_none():
    # Invented lives: A born c. 1650 (1645-1655), died 1700-1710; B born 1660-1690, died
    # 1695-1730.
    a = span("A", (year(1645)[0], year(1655)[1]), (year(1700)[0], year(1710)[1]))
    b = span("B", (year(1660)[0], year(1690)[1]), (year(1695)[0], year(1730)[1]))
    found = relate(a, b)
    assert found.certain is None
    assert {"overlaps", "contains", "finished-by"} <= set(found.possible)
    assert APART.isdisjoint(found.possible)           # they certainly shared some days
    assert "starts before the start of" in found.crm_certain
    assert "ends before the end of" in found.crm_possible
    assert "ends before the end of" not in found.crm_certain


def test_disjoint_windows_make_a_certain_before():
    a = span("A", year(1600), year(1640))
    b = span("B", year(1650), year(1690))
    found = relate(a, b)
    assert found.certain == "before" and found.possible == ("before",)
    assert set(found.crm_certain) == set(CRM_RELATIONS)
    assert relate(b, a).certain == "after"


def test_a_record_is_tightened_by_its_own_start_not_after_its_end():
    # A's start window reaches day 100, but its end is at the latest day 20: so is its start.
    # Without that step A could start after B's start, and `before` would not be certain.
    a = span("A", (0, 100), (10, 20))
    b = span("B", (22, 30), (40, 50))
    assert record_bounds(a).first_latest == 20
    assert relate(a, b).certain == "before"


def test_unbounded_sides_are_unbounded_windows():
    open_start = span("A", (None, None), (10, 20))
    later = span("B", (30, 40), (50, 60))
    assert relate(open_start, later).certain == "before"
    unknown_end = span("C", (0, 5), (None, None))
    found = relate(unknown_end, later)
    assert {"before", "meets", "overlaps", "contains"} <= set(found.possible)
    assert "after" not in found.possible and found.certain is None


def _completions(record: Record):
    """Every integer choice of (first day, last day) within the record's own windows."""
    start, end = record.span.start, record.span.end
    if record.kind == EVENT:
        return [(day, day) for day in range(start.earliest, end.latest + 1)]
    return [(first, last) for first in range(start.earliest, start.latest + 1)
            for last in range(end.earliest, end.latest + 1) if first <= last]


def _random_record(generator: random.Random, label: str) -> Record:
    if generator.random() < 0.25:
        low = generator.randint(0, 8)
        return event(label, low, low + generator.randint(0, 3))
    first = sorted(generator.randint(0, 8) for _ in range(2))
    last = sorted(generator.randint(first[0], 10) for _ in range(2))
    return span(label, tuple(first), tuple(last))


def test_brute_force_over_all_integer_completions_agrees_exactly():
    # The check (deliverable 4): on small random cases, the certain / possible sets
    # must equal those found by trying every integer completion of the windows.
    generator = random.Random(11)
    for _ in range(300):
        a, b = _random_record(generator, "A"), _random_record(generator, "B")
        seen, crm_seen = set(), []
        for (a_first, a_last), (b_first, b_last) in itertools.product(
                _completions(a), _completions(b)):
            instants = (a_first, a_last + 1, b_first, b_last + 1)
            seen.add(ALLEN_RELATIONS[int(classify(*instants))])
            crm_seen.append({name for name, test in _CRM_TESTS.items() if test(*instants)})
        found = relate(a, b)
        assert set(found.possible) == seen
        assert found.certain == (next(iter(seen)) if len(seen) == 1 else None)
        assert set(found.crm_possible) == set().union(*crm_seen)
        assert set(found.crm_certain) == set.intersection(*crm_seen)


# CIDOC CRM comparisons of start and end instants (from memory of P173-P176, P182-P185).
_CRM_TESTS = {
    "starts before or with the end of": lambda as_, ae, bs, be: as_ <= be,
    "starts before the end of": lambda as_, ae, bs, be: as_ < be,
    "starts before or with the start of": lambda as_, ae, bs, be: as_ <= bs,
    "starts before the start of": lambda as_, ae, bs, be: as_ < bs,
    "ends before or with the start of": lambda as_, ae, bs, be: ae <= bs,
    "ends before the start of": lambda as_, ae, bs, be: ae < bs,
    "ends before or with the end of": lambda as_, ae, bs, be: ae <= be,
    "ends before the end of": lambda as_, ae, bs, be: ae < be,
}


def test_converses_hold_for_fuzzy_pairs():
    generator = random.Random(5)
    for _ in range(200):
        a, b = _random_record(generator, "A"), _random_record(generator, "B")
        assert set(relate(b, a).possible) == {CONVERSES[name] for name in relate(a, b).possible}


def test_monte_carlo_against_the_closed_form_for_two_events_in_one_window():
    # Two events, each a uniform day of the same n-day window, independent: on whole days
    # P(equals) = 1/n, P(meets) = (n-1)/n^2, P(before) = (n-1)(n-2)/(2n^2) (counting the
    # ordered pairs of days; P(before) tends to 1/2 as the window grows).
    days = 10
    window = record_bounds(event("A", 0, days - 1))
    shares = relation_shares(window, window, samples=200_000, seed=3)
    expected = {"equals": 1 / days, "meets": (days - 1) / days**2,
                "before": (days - 1) * (days - 2) / (2 * days**2)}
    for name, probability in expected.items():
        error = 4 * math.sqrt(probability * (1 - probability) / 200_000)
        assert abs(shares[name] - probability) < error
    assert abs(sum(shares.values()) - 1) < 1e-9
    # Counted exactly, the same windows give the closed form itself.
    exact = exact_shares(window, window)
    assert all(exact[name] == pytest.approx(value, abs=1e-15) for name, value in expected.items())
    found = relate(event("A", 0, days - 1), event("B", 0, days - 1), samples=1000)
    assert dict(found.probabilities)["equals"] == pytest.approx(1 / days, abs=1e-15)
    assert found.method.startswith("exact: all 100 choices of days counted")


def test_exact_counting_agrees_with_brute_force_and_monte_carlo_for_spans():
    a, b = span("A", (0, 6), (4, 12)), span("B", (3, 9), (8, 15))
    ab, bb = record_bounds(a), record_bounds(b)
    # Brute force over every choice of the four days, first not after last in each record.
    counts, total = dict.fromkeys(ALLEN_RELATIONS, 0), 0
    for a0, a1, b0, b1 in itertools.product(range(0, 7), range(4, 13), range(3, 10),
                                            range(8, 16)):
        if a0 <= a1 and b0 <= b1:
            total += 1
            counts[relate(exact("A", a0, a1), exact("B", b0, b1)).certain] += 1
    counted = exact_shares(ab, bb)
    assert all(counted[name] == pytest.approx(counts[name] / total, abs=1e-15)
               for name in ALLEN_RELATIONS)
    sampled = relation_shares(ab, bb, samples=100_000, seed=5)
    for name, probability in counted.items():
        assert abs(sampled[name] - probability) <= 4 * math.sqrt(
            probability * (1 - probability) / 100_000) + 1e-12
    # Too many choices to count (lives dated to a decade at each end): Monte Carlo, named.
    lives = relate(span("A", (0, 3652), (20000, 23652)), span("B", (0, 3652), (20000, 23652)),
                   samples=2000, seed=1)
    assert lives.method.startswith("Monte Carlo: 2000 samples, seed 1")


def test_probabilities_are_deterministic_and_undefined_when_unbounded():
    a, b = span("A", (0, 10), (30, 40)), span("B", (5, 20), (25, 50))
    assert relate(a, b, samples=5000, seed=1) == relate(a, b, samples=5000, seed=1)
    unbounded = relate(span("C", (None, None), (30, 40)), b, samples=5000)
    assert unbounded.probabilities == () and "undefined" in unbounded.method
    assert relate(a, b).probabilities == () and "no probabilities" in relate(a, b).method


def test_contemporaries_of_a_record_and_of_a_date():
    target = span("Anna", year(1650), year(1700), id="p1")
    records = [target,
               span("Ben", year(1660), year(1690), id="p2"),             # certainly
               span("Cora", (year(1690)[0], year(1710)[1]), year(1740), id="p3"),  # possibly
               span("Dirk", year(1600), year(1640), id="p4"),           # never
               Record("undated", None, Provenance("invented.csv", 6))]
    found = contemporaries(records, target)
    assert list(found["b"]) == ["p2", "p3"] and list(found["certain"]) == [True, False]
    assert set(found.columns) >= {"a", "b", "certain", "possible"}
    on_date = contemporaries(records, "1695")
    assert dict(zip(on_date["b"], on_date["certain"])) == {"p1": True, "p3": False}
    on_day = contemporaries(records, date(1620, 6, 1).toordinal())
    assert list(on_day["b"]) == ["p4"]


def test_contemporary_pairs_agree_with_relate():
    generator = random.Random(8)
    records = [_random_record(generator, f"r{index}") for index in range(40)]
    pairs = contemporary_pairs(records)
    listed = {(a, b): certain for a, b, certain in
              zip(pairs["a_index"], pairs["b_index"], pairs["certain"])}
    for a_index, b_index in itertools.combinations(range(len(records)), 2):
        possible = set(relate(records[a_index], records[b_index]).possible)
        shares_a_day = bool(possible - APART)
        assert ((a_index, b_index) in listed) == shares_a_day
        if shares_a_day:
            assert listed[a_index, b_index] == possible.isdisjoint(APART)


def test_relations_with_one_record():
    target = exact("A", 10, 19)
    records = [target, exact("B", 25, 30), exact("C", 12, 17)]
    frame = relations_with(records, target)
    assert list(frame["certain"]) == ["before", "contains"]
    assert list(frame.columns) == ["a", "b", "b_label", "b_index", "certain", "possible"]


# --- the command ------------------------------------------------------------------------------

INVENTED_FAMILY = """id,name,born,died
p1,Anna Wray,1650,1700
p2,Ben Wray,1660,1690
p3,Cora Wray,c. 1700,1740
p4,Dirk Wray,1600,1640
p5,Ben Wray,1702,1760
"""


@pytest.fixture
def family(tmp_path):
    path = tmp_path / "family.csv"
    path.write_text(INVENTED_FAMILY, encoding="utf-8")
    return str(path)


def run(*argv):
    from timelines.cli.commands import main
    return main(["relate", *argv])


def test_relate_two_records_by_id_and_label(family, capsys):
    assert run(family, "p1", "Dirk Wray") == 0
    assert capsys.readouterr().out.splitlines()[0] == "p1 after p4 (certain)"
    assert run(family, "p1", "p3", "--format", "json", "--samples", "2000") == 0
    answer = json.loads(capsys.readouterr().out)
    assert answer["certain"] is None and "overlaps" in answer["possible"]
    assert "Monte Carlo" in answer["method"]
    assert abs(sum(answer["probabilities"].values()) - 1) < 1e-9


def test_relate_with_one_record_and_on_a_date(family, capsys):
    assert run(family, "--with", "p1", "--format", "csv") == 0
    lines = capsys.readouterr().out.splitlines()
    assert lines[0] == "a,b,b_label,b_index,certain,possible"
    assert "p1,p2,Ben Wray,1,contains,contains" in lines
    assert run(family, "--on", "1697", "--format", "json") == 0
    active = json.loads(capsys.readouterr().out)
    assert {row["b"]: row["certain"] for row in active} == {"p1": True, "p3": False}


def test_relate_alongside_lists_who_could_have_known_a_record(family, capsys):
    # Anna (1650-1700): Ben (1660-1690) surely shared her years, Cora (c. 1700-) possibly;
    # Dirk (died 1640) and the younger Ben (born 1702) never did, and are not listed.
    assert run(family, "--alongside", "p1", "--format", "json") == 0
    rows = json.loads(capsys.readouterr().out)
    assert {row["b"]: row["certain"] for row in rows} == {"p2": True, "p3": False}
    with pytest.raises(SystemExit):                               # one question at a time
        run(family, "p1", "--alongside", "p2")
    assert "--alongside ID" in capsys.readouterr().err


def test_relate_usage_errors(family, capsys):
    assert run(family, "p1", "p9") == 2
    assert "no record has the id or label 'p9'" in capsys.readouterr().err
    assert run(family, "Ben Wray", "p1") == 2
    assert "names 2 records" in capsys.readouterr().err
    with pytest.raises(SystemExit) as stopped:
        run(family, "p1")
    assert stopped.value.code == 2


def test_relate_csv_keeps_formulas_from_running(tmp_path, capsys):
    path = tmp_path / "risky.csv"
    path.write_text("id,name,born,died\nq1,=HYPERLINK(1),1650,1700\nq2,Plain,1660,1690\n",
                    encoding="utf-8")
    assert run(str(path), "--with", "q2", "--format", "csv") == 0
    assert "q2,q1,'=HYPERLINK(1),0,during,during" in capsys.readouterr().out.splitlines()
