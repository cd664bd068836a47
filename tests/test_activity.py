"""analysis.activity: counts per block for events (aoristic) and spans (overlap), and the
Monte Carlo envelope against its exact distribution. Invented records throughout."""
from __future__ import annotations

import numpy as np
import pytest

from timelines.analysis.activity import (activity, blocks_between, event_counts,
                                         overlap_probability, span_counts)
from timelines.calendar import GREGORIAN, fixed_from_gregorian, fixed_from_julian
from timelines.model import EVENT, Endpoint, Provenance, Qualifier, Record, Span

HERE = Provenance("invented.csv", 2)


def first_day(year: int) -> int:
    return fixed_from_gregorian(year, 1, 1)


def last_day(year: int) -> int:
    return fixed_from_gregorian(year, 12, 31)


def event(first_year: int, last_year: int, group: str | None = None) -> Record:
    window = Endpoint(first_day(first_year), last_day(last_year))
    return Record("find", Span.point(window), HERE, group=group, kind=EVENT)


def life(born: tuple[int, int], died: tuple[int, int], group: str | None = None) -> Record:
    start = Endpoint(first_day(born[0]), last_day(born[1]))
    end = Endpoint(first_day(died[0]), last_day(died[1]))
    return Record("life", Span(start, end), HERE, group=group)


def days(first_year: int, last_year: int) -> int:
    return last_day(last_year) - first_day(first_year) + 1


# -- events: the aoristic sum (Ratcliffe 2000; block weights as Crema 2012) ------------------

def test_each_events_weights_sum_to_one():
    # Crema 2012, "Modelling temporal uncertainty in archaeological analysis", J. Archaeol.
    # Method Theory 19: an event's weights over the blocks it can fall in sum to 1.
    rng = np.random.default_rng(7)
    for _ in range(40):
        first = int(rng.integers(1500, 1700))
        record = event(first, first + int(rng.integers(0, 80)))
        table = activity([record], per=int(rng.integers(1, 30)), calendar=GREGORIAN)
        assert table["expected"].sum() == pytest.approx(1.0, abs=1e-12)


def test_a_window_straddling_blocks_is_shared_by_its_days():
    # Ratcliffe 2000 (aoristic analysis): the share of the window inside each block.
    table = activity([event(1645, 1654)], per="decade", calendar=GREGORIAN)
    shares = dict(zip(table["label"], table["expected"]))
    assert shares["1640–1649"] == pytest.approx(days(1645, 1649) / days(1645, 1654))
    assert shares["1650–1659"] == pytest.approx(days(1650, 1654) / days(1645, 1654))
    assert list(table["certain"]) == [0, 0] and list(table["possible"]) == [1, 1]


def test_an_event_within_one_block_is_certain_there():
    table = activity([event(1652, 1653), event(1650, 1659)], per="decade", calendar=GREGORIAN)
    assert list(table["certain"]) == [2] and list(table["expected"]) == [pytest.approx(2.0)]


def test_blocks_are_half_open():
    # An event on the first day of 1660 falls in 1660-1669, not in 1650-1659.
    moment = Endpoint.day(first_day(1660))
    records = [event(1655, 1655), Record("x", Span.point(moment), HERE, kind=EVENT)]
    table = activity(records, per="decade", calendar=GREGORIAN)
    assert table["block_end"][0] == first_day(1660) == table["block_start"][1]
    assert list(table["expected"]) == [1.0, 1.0]


def test_palmisano_bevan_shennan_2017_aoristic_sums():
    # The four sites of Palmisano, Bevan & Shennan (2017, "Comparing archaeological proxies
    # for long-term population patterns", J. Archaeol. Sci. 87), as the R package kairos
    # tests them (tesselle/kairos tests/testthat/test-aoristic.R, "Exemple from Palmisano et
    # al. 2017": from -2200,-2000,-1600,-2000 to -1400,-1600,-1400,-1400, step 200); the
    # sums 0.25, 1.083333, 1.083333, 1.583333 and counts 1, 3, 3, 3 as issue 11 gives them
    # (we did not find the package's stored output). The numbers are a line with negative
    # years: -2200 is the start of astronomical year -2200 (2201 BC), -1400 the end of -1401.
    sites = [(-2200, -1400), (-2000, -1600), (-1600, -1400), (-2000, -1400)]
    records = [event(start, stop - 1) for start, stop in sites]
    table = activity(records, per=200, calendar=GREGORIAN)
    assert list(table["expected"]) == pytest.approx([0.25, 1.083333, 1.083333, 1.583333],
                                                    abs=1e-4)   # leap days: blocks differ
    assert list(table["possible"]) == [1, 3, 3, 3]
    assert list(table["label"]) == ["2201 BCE–2002 BCE", "2001 BCE–1802 BCE",
                                    "1801 BCE–1602 BCE", "1601 BCE–1402 BCE"]


# -- spans: the probability of overlap ------------------------------------------------------

def test_a_life_counts_fully_in_every_decade_it_covers():
    table = activity([life((1650, 1650), (1700, 1700))], per="decade", calendar=GREGORIAN)
    assert list(table["label"]) == [f"{decade}–{decade + 9}" for decade in range(1650, 1710, 10)]
    assert list(table["certain"]) == [1] * 6
    assert list(table["expected"]) == [1.0] * 6        # not a fifth in each


def test_overlap_probability_against_a_fine_grid():
    # The closed form against a midpoint grid over the (start, end) rectangle, the region
    # start > end left out: independent uniform ends conditioned on start <= end.
    s0, s1, t0, t1 = 0.0, 30.0, 10.0, 50.0
    grid = 1200
    starts = s0 + (np.arange(grid) + 0.5) * (s1 - s0) / grid
    ends = t0 + (np.arange(grid) + 0.5) * (t1 - t0) / grid
    start, end = np.meshgrid(starts, ends)
    feasible = start <= end
    for block_start, block_end in [(-5, 5), (5, 12), (20, 25), (28, 40), (45, 60), (0, 50)]:
        overlaps = feasible & (start < block_end) & (end > block_start)
        exact = overlap_probability(np.array([s0]), np.array([s1]), np.array([t0]),
                                    np.array([t1]), block_start, block_end)[0]
        assert exact == pytest.approx(overlaps.sum() / feasible.sum(), abs=2e-3)


def test_a_span_whose_windows_overlap_is_weighed_given_start_before_end():
    # Start and end in the same window: given start <= end, the span certainly touches the
    # window's one block and reaches no other.
    record = life((1650, 1659), (1650, 1659))
    table = activity([record], per="decade", calendar=GREGORIAN)
    assert list(table["certain"]) == [1] and list(table["expected"]) == [pytest.approx(1.0)]


def test_possible_and_certain_blocks_of_uncertain_ends():
    # Born 1645-1654, died 1685-1694: certainly alive 1650s-1680s, possibly 1640s and 1690s.
    table = activity([life((1645, 1654), (1685, 1694))], per="decade", calendar=GREGORIAN)
    assert list(table["certain"]) == [0, 1, 1, 1, 1, 0]
    assert list(table["possible"]) == [1] * 6
    assert table["expected"][0] == pytest.approx(days(1645, 1649) / days(1645, 1654), abs=1e-9)


def test_unbounded_windows_are_possible_but_not_weighed():
    before = Record("wreck", Span.point(Endpoint(None, last_day(1665), None,
                                                 frozenset({Qualifier.BEFORE}))),
                    HERE, kind=EVENT)
    table = activity([event(1650, 1669), before], per="decade", calendar=GREGORIAN)
    assert list(table["possible"]) == [2, 2]
    assert list(table["unweighed"]) == [1, 1]
    assert table["expected"].sum() == pytest.approx(1.0)
    assert table.attrs["unweighed"] == {"events": 1}


def test_an_open_start_is_certain_until_its_end():
    running = Record("series", Span(Endpoint.open(Qualifier.OPEN_START),
                                    Endpoint(first_day(1672), last_day(1672))), HERE)
    table = activity([running, life((1650, 1650), (1679, 1679))], per="decade",
                     calendar=GREGORIAN)
    assert list(table["certain"]) == [2, 2, 2]
    assert list(table["expected"]) == [1.0, 1.0, 1.0]
    assert table.attrs["unweighed"] == {"spans": 1}


# -- kinds, groups, labels -------------------------------------------------------------------

def test_events_and_spans_are_never_summed_together():
    table = activity([event(1650, 1659), life((1650, 1650), (1659, 1659))], per="decade",
                     calendar=GREGORIAN)
    assert list(table["kind"]) == ["events", "spans"]
    assert table.attrs["kind"] == "events and spans"


def test_group_sums_equal_the_total():
    rng = np.random.default_rng(3)
    records = []
    for number in range(60):
        first = int(rng.integers(1600, 1700))
        group = "abc"[number % 3]
        records.append(event(first, first + int(rng.integers(0, 40)), group))
        records.append(life((first, first + 3), (first + 20, first + 30), group))
    whole = activity(records, per="decade", calendar=GREGORIAN)
    grouped = activity(records, per="decade", group="group", calendar=GREGORIAN)
    summed = grouped.groupby(["kind", "block_start"], sort=True)[
        ["certain", "possible", "expected"]].sum().reset_index()
    whole = whole.sort_values(["kind", "block_start"]).reset_index(drop=True)
    for column in ("certain", "possible"):
        assert list(summed[column]) == list(whole[column])
    assert np.allclose(summed["expected"], whole["expected"], atol=1e-9)


def test_labels_have_no_year_zero():
    blocks = blocks_between(first_day(-25), last_day(15), 10, GREGORIAN)
    assert blocks.labels() == ["31 BCE–22 BCE", "21 BCE–12 BCE", "11 BCE–2 BCE",
                               "1 BCE–9 CE", "10–19"]
    assert blocks.labels("bc") == ["31 BC–22 BC", "21 BC–12 BC", "11 BC–2 BC", "1 BC–AD 9",
                                   "10–19"]
    years = blocks_between(first_day(-1), last_day(1), 1, GREGORIAN)
    assert years.labels() == ["2 BCE", "1 BCE", "1"]


def test_blocks_follow_the_calendar_the_dates_were_read_in():
    # A Julian year 1500 (historical reckoning) lies wholly in the historical block of 1500.
    julian_day = fixed_from_julian(1500, 1, 3)       # Gregorian 1500-01-12
    blocks = blocks_between(julian_day, julian_day, 1)
    assert blocks.labels() == ["1500"] and blocks.edges[0] == fixed_from_julian(1500, 1, 1)
    assert blocks.edges[1] - blocks.edges[0] == 366    # a Julian leap year


# -- the Monte Carlo envelope against the exact Poisson-binomial distribution ----------------

def poisson_binomial(probabilities) -> np.ndarray:
    """The exact pmf of a sum of independent Bernoulli trials, by convolution (the
    Poisson-binomial distribution; e.g. Hong 2013, Comput. Stat. Data Anal. 59)."""
    pmf = np.array([1.0])
    for p in probabilities:
        pmf = np.convolve(pmf, [1 - p, p])
    return pmf


def percentile_of(pmf: np.ndarray, percent: float) -> int:
    """The smallest count whose cumulative probability reaches `percent`."""
    return int(np.searchsorted(np.cumsum(pmf), percent / 100 - 1e-12))


def _check_envelope(table, probabilities_by_block, runs):
    for row, probabilities in zip(table.itertuples(), probabilities_by_block):
        pmf = poisson_binomial(probabilities)
        mean = float(np.dot(np.arange(len(pmf)), pmf))
        spread = np.sqrt(sum(p * (1 - p) for p in probabilities))
        assert row.expected == pytest.approx(mean, abs=1e-9)
        for column, percent in (("low", 2.5), ("median", 50.0), ("high", 97.5)):
            assert abs(getattr(row, column) - percentile_of(pmf, percent)) <= 1
        assert spread == 0 or abs(row.median - mean) <= 2 * spread


def test_event_envelope_against_the_exact_distribution():
    rng = np.random.default_rng(11)
    records = [event(int(y), int(y) + int(rng.integers(0, 25)))
               for y in rng.integers(1600, 1650, size=80)]
    runs = 4000
    table = activity(records, per="decade", runs=runs, seed=1, calendar=GREGORIAN)
    weights = [[_share(r, row) for r in records] for row in table.itertuples()]
    _check_envelope(table, weights, runs)


def test_span_envelope_against_the_exact_distribution():
    rng = np.random.default_rng(12)
    records = [life((int(y), int(y) + int(rng.integers(0, 15))),
                    (int(y) + int(rng.integers(5, 20)), int(y) + int(rng.integers(20, 40))))
               for y in rng.integers(1600, 1650, size=80)]
    table = activity(records, per="decade", runs=4000, seed=1, calendar=GREGORIAN)
    chances = []
    for row in table.itertuples():
        chances.append([span_counts(*_span_arrays(r), np.array(
            [row.block_start, row.block_end], dtype=float))["expected"][0] for r in records])
    _check_envelope(table, chances, 4000)


def test_simulated_mean_matches_the_expected_count():
    records = [life((1600 + k, 1605 + k), (1610 + k, 1640 + k)) for k in range(0, 60, 3)]
    runs = 5000
    table = activity(records, per="decade", runs=runs, seed=5, calendar=GREGORIAN)
    from timelines.analysis.activity import simulate_spans, span_windows
    edges = np.append(table["block_start"].to_numpy(float), table["block_end"].iloc[-1])
    counts = simulate_spans(*span_windows(records), edges, runs, 9, np.arange(len(records)))
    standard_error = counts.std(axis=0) / np.sqrt(runs) + 1e-9
    assert np.all(np.abs(counts.mean(axis=0) - table["expected"]) < 4 * standard_error)


def test_the_envelope_repeats_with_its_seed():
    records = [event(1600 + k, 1630 + k) for k in range(30)]
    first = activity(records, runs=300, seed=4, calendar=GREGORIAN)
    assert first.equals(activity(records, runs=300, seed=4, calendar=GREGORIAN))


def _share(record: Record, row) -> float:
    low, high = record.span.start.earliest, record.span.end.latest + 1
    inside = min(high, row.block_end) - max(low, row.block_start)
    return max(inside, 0) / (high - low)


def _span_arrays(record: Record):
    start, end = record.span.start, record.span.end
    return (np.array([start.earliest], float), np.array([start.latest + 1], float),
            np.array([end.earliest], float), np.array([end.latest + 1], float))


def test_event_counts_take_arrays():
    edges = np.array([0.0, 10.0, 20.0])
    counts = event_counts(np.array([5.0, 0.0]), np.array([15.0, 10.0]), edges)
    assert list(counts["expected"]) == [1.5, 0.5] and list(counts["certain"]) == [1, 0]


# -- the command -----------------------------------------------------------------------------

def _register(tmp_path):
    path = tmp_path / "finds.csv"
    path.write_text("id,label,not_before,not_after,site\n1,sherd,1645,1654,North\n"
                    "2,coin,1650,1650,North\n3,lamp,1660,1672,South\n4,wreck,,1665,South\n",
                    encoding="utf-8")
    return str(path)


def test_command_table_names_the_kind_and_the_unweighed(tmp_path, capsys):
    from timelines.cli.commands import main
    code = main(["activity", _register(tmp_path), "--not-before", "not_before",
                 "--not-after", "not_after", "--runs", "200", "--seed", "1"])
    out, err = capsys.readouterr()
    assert code == 0
    assert out.startswith("events per decade: aoristic sum")
    assert "1650–1659" in out and "envelope: 2.5th-97.5th percentile of 200 runs" in out
    assert "note: 1 record (events) with no bound on a side" in err


def test_command_csv_and_json(tmp_path, capsys):
    import csv
    import io
    import json
    from timelines.cli.commands import main
    table = _register(tmp_path)
    options = ["--not-before", "not_before", "--not-after", "not_after", "--group", "site"]
    assert main(["activity", table, *options, "--format", "csv"]) == 0
    rows = list(csv.DictReader(io.StringIO(capsys.readouterr().out)))
    assert {row["group"] for row in rows} == {"North", "South"}
    assert sum(float(row["expected"]) for row in rows) == pytest.approx(3.0)
    assert main(["activity", table, *options, "--format", "json", "--per", "century"]) == 0
    answer = json.loads(capsys.readouterr().out)
    assert answer["holds"] == "events" and answer["unweighed"] == {"events": 1}
    assert [row["label"] for row in answer["rows"]] == ["1600–1699", "1600–1699"]


def test_command_refuses_an_unknown_period(tmp_path, capsys):
    from timelines.cli.commands import main
    with pytest.raises(SystemExit) as exit_:
        main(["activity", _register(tmp_path), "--per", "fortnight"])
    assert exit_.value.code == 2
    assert "cannot make blocks of 'fortnight'" in capsys.readouterr().err


# -- the keyed draws behind the envelope -------------------------------------------------------

def test_keyed_draws_are_uniform_and_unrelated():
    from timelines.analysis.activity import keyed_uniform
    keys = np.arange(20_000)
    first = keyed_uniform(7, keys, 0, 5, 0)
    second = keyed_uniform(7, keys, 0, 5, 1)
    assert first.shape == (5, 20_000) and first.min() >= 0 and first.max() < 1
    # Pearson's chi-square over 20 equal bins, 19 degrees of freedom: the 0.999 quantile is
    # 43.8 (standard chi-square tables, e.g. NIST/SEMATECH e-Handbook 1.3.6.7.4).
    observed = np.histogram(first, bins=20, range=(0, 1))[0]
    expected = first.size / 20
    assert ((observed - expected) ** 2 / expected).sum() < 43.8
    # The two numbers of a record, and neighbouring keys, are unrelated (|r| < 4/sqrt(n)).
    bound = 4 / np.sqrt(first.size)
    assert abs(np.corrcoef(first.ravel(), second.ravel())[0, 1]) < bound
    assert abs(np.corrcoef(first[:, :-1].ravel(), first[:, 1:].ravel())[0, 1]) < bound
    # A run's numbers depend on the run, not on the chunk it is drawn in.
    assert np.array_equal(keyed_uniform(7, keys, 3, 2, 0), first[3:5])
    assert not np.array_equal(keyed_uniform(8, keys, 0, 5, 0), first)


def test_a_groups_envelope_is_the_same_drawn_alone():
    # Each record's draws are keyed by its row, so grouping (or cutting the table into
    # partitions) does not change a record's simulated moments.
    rng = np.random.default_rng(21)
    records = []
    for row in range(60):
        first = int(rng.integers(1600, 1680))
        window = Endpoint(first_day(first), last_day(first + int(rng.integers(0, 30))))
        records.append(Record("find", Span.point(window), Provenance("invented.csv", row + 2),
                              group="ab"[row % 2], kind=EVENT))
    grouped = activity(records, group="group", runs=400, seed=3, calendar=GREGORIAN,
                       start=first_day(1600), end=last_day(1720))
    alone = activity([r for r in records if r.group == "b"], runs=400, seed=3,
                     calendar=GREGORIAN, start=first_day(1600), end=last_day(1720))
    mine = grouped[grouped["group"] == "b"].reset_index(drop=True)
    for name in ("low", "median", "high"):
        assert mine[name].tolist() == alone[name].tolist()
