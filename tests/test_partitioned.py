"""Activity on a dask DataFrame (issue 11, item 3): the partition-wise path gives the same
counts as the single-machine `activity` for 1, 2 and 7 partitions, on dask's local
scheduler. The reference is this project's own single-machine path, itself checked against
published numbers in test_activity.py (Palmisano, Bevan & Shennan 2017; Poisson-binomial)."""
from __future__ import annotations

import numpy as np
import pandas as pd
import pytest

from timelines.analysis.activity import activity
from timelines.model import EVENT, SPAN
from timelines.sources import ColumnMap, detect_columns, load_records
from timelines.sources.frames import table_from_data

dd = pytest.importorskip("dask.dataframe", reason="the dask extra is not installed")
dask = pytest.importorskip("dask")
from timelines.analysis.partitioned import partitioned_activity, window_partition  # noqa: E402

FORMS = ["c. {y}", "{y}s", "{y}", "before {y}", "{y}~", "{b} BC", "{y}/{z}", "", "not a date",
         "../{y}", "{y}-03/{y}-06"]


def invented_rows(count: int, seed: int = 4) -> pd.DataFrame:
    """Rows with a mix of date forms, some before the era, some empty or unreadable."""
    rng = np.random.default_rng(seed)
    rows = []
    for i in range(count):
        year = int(rng.integers(1500, 1900))
        start = FORMS[int(rng.integers(len(FORMS)))].format(y=year, b=int(rng.integers(1, 300)),
                                                           z=year + 1)
        end = FORMS[int(rng.integers(len(FORMS) - 3))].format(
            y=year + int(rng.integers(0, 60)), b=1, z=year + 61)
        rows.append({"label": f"record {i}", "start": start, "end": end})
    return pd.DataFrame(rows)


def single_machine(frame: pd.DataFrame, kind: str, per) -> pd.DataFrame:
    table = table_from_data(frame)
    loaded = load_records(table, detect_columns(table.header, ColumnMap()),
                          events=kind == EVENT)
    return activity(loaded.records, per=per)


@pytest.mark.parametrize("kind", [SPAN, EVENT])
@pytest.mark.parametrize("partitions", [1, 2, 7])
def test_the_same_counts_as_one_machine(kind, partitions):
    frame = invented_rows(300)
    expected = single_machine(frame, kind, "decade")
    with dask.config.set(scheduler="threads"):
        found = partitioned_activity(dd.from_pandas(frame, npartitions=partitions),
                                     per="decade", kind=kind)
    assert len(found) == len(expected) > 10
    for name in ("block_start", "block_end", "label", "certain", "possible", "unweighed"):
        assert found[name].tolist() == expected[name].tolist(), name
    np.testing.assert_allclose(found["expected"], expected["expected"], rtol=1e-12, atol=1e-9)
    assert set(found["kind"]) == {"spans" if kind == SPAN else "events"}
    # Every row is counted or said to be left out: none is lost without a word.
    table = table_from_data(frame)
    loaded = load_records(table, detect_columns(table.header, ColumnMap()),
                          events=kind == EVENT)
    dated = sum(record.span is not None for record in loaded.records)
    assert found.attrs["rows"] == 300 and found.attrs["not_counted"] == 300 - dated > 0


def test_windows_are_days_with_nan_for_no_date_and_negative_before_the_era():
    frame = pd.DataFrame({"label": ["a", "b", "c"], "start": ["44 BC", "", "1650"],
                          "end": ["44 BC", "", "../1700"]})
    windows = window_partition(frame)
    assert windows.loc[0, "s0"] < 0 and windows.loc[0, "t1"] < 0      # before the era
    days = ["s0", "s1", "t0", "t1"]
    assert windows.loc[1, days].isna().all()                           # no date: NaN, not 0
    assert list(windows.columns) == days + ["group"]
    assert windows[days].dtypes.eq("float64").all()
    assert windows["group"].tolist() == ["", "", ""]                   # no group asked


def test_given_blocks_are_kept_for_every_partition():
    frame = invented_rows(120, seed=9)
    with dask.config.set(scheduler="threads"):
        one, seven = (partitioned_activity(dd.from_pandas(frame, npartitions=n), per=25,
                                           start=-1000, end=800_000) for n in (1, 7))
    pd.testing.assert_frame_equal(one, seven, check_exact=False, rtol=1e-12)


@pytest.mark.parametrize("kind", [SPAN, EVENT])
@pytest.mark.parametrize("partitions", [1, 2, 7])
def test_groups_and_envelope_as_one_machine(kind, partitions):
    # Each record's Monte Carlo numbers are keyed by its row, and each run's counts are summed
    # across partitions before the percentiles: the envelope cannot depend on the cut.
    frame = invented_rows(240, seed=13)
    frame["circle"] = ["north", "south", "east"] * 80
    table = table_from_data(frame)
    loaded = load_records(table, detect_columns(table.header, ColumnMap()),
                          events=kind == EVENT)
    expected = activity(loaded.records, per="decade", group="circle", runs=300, seed=2)
    with dask.config.set(scheduler="threads"):
        found = partitioned_activity(dd.from_pandas(frame, npartitions=partitions),
                                     per="decade", kind=kind, group="circle", runs=300, seed=2)
    assert list(found.columns) == list(expected.columns)
    assert sorted(set(found["group"])) == ["east", "north", "south"]
    for name in ("group", "block_start", "label", "certain", "possible", "low", "median",
                 "high"):
        assert found[name].tolist() == expected[name].tolist(), name
    np.testing.assert_allclose(found["expected"], expected["expected"], rtol=1e-12, atol=1e-9)
    assert (found["high"] > found["low"]).any()
