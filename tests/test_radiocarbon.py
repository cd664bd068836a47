"""dates.radiocarbon: calibration against IntCal20 checked against published calibrations,
the pooled mean of Ward & Wilson (1978), the chi-square survival function against a printed
table, and the BC/AD years without a year zero.

LESSON is Frerebeau N. & Lebrun B., "Calibrating Radiocarbon Dates with R", Programming
Historian (English translation 2025, doi:10.46430/phen0125; file
programminghistorian/jekyll en/lessons/calibrating-radiocarbon-dates-r.md). Its ranges were
computed with rcarbon 1.4 and IntCal20; its data are the Shroud of Turin measurements of
Damon et al. 1989 (Nature 337:611-615), Table 1 of the lesson. Tolerances: ±1 year on range
ends and medians, ±0.005 on probabilities (implementations differ in grid and cut-offs).
"""
from __future__ import annotations

import importlib.resources

import numpy as np
import pytest

from timelines.dates.radiocarbon import (CURVES, Calibration, cal_bp_from_year, cal_bp_label,
                                         calibrate, calibrate_many, chi_square_survival,
                                         load_curve, pool, upper_gamma_regularised,
                                         year_from_cal_bp, year_label)

YEARS, PROBABILITY = 1, 0.005   # tolerances on published range ends and probabilities

# LESSON, Table 1: Sample 1 (the Shroud) as each laboratory measured it, 14C years BP.
SHROUD = {"Arizona": (646, 31), "Oxford": (750, 30), "Zurich": (676, 24)}


def assert_ranges(calibration: Calibration, level: float, published) -> None:
    """The HPD ranges at `level` against published (start cal BP, end cal BP, probability)."""
    found = calibration.ranges(level)
    assert len(found) == len(published), [str(r) for r in found]
    for got, (start, end, probability) in zip(found, published):
        assert got.start_bp == pytest.approx(start, abs=YEARS), str(got)
        assert got.end_bp == pytest.approx(end, abs=YEARS), str(got)
        if probability is not None:
            assert got.probability == pytest.approx(probability, abs=PROBABILITY), str(got)


# -- published calibrations -------------------------------------------------------------------

@pytest.mark.parametrize("lab, published, median", [
    # LESSON, "Date Calibration": hpdi(dates_sam1, credMass = 0.95) and summary()'s MedianBP.
    ("Arizona", [(667, 623, 0.4298236), (612, 555, 0.5305958)], 600),
    ("Oxford", [(725, 660, 0.9505207)], 682),
    ("Zurich", [(671, 633, 0.5776311), (589, 563, 0.3795208)], 648),
])
def test_the_shroud_measurements_calibrate_as_published(lab, published, median):
    age, error = SHROUD[lab]
    calibration = calibrate(age, error, "intcal20")
    assert_ranges(calibration, 0.95, published)
    assert calibration.median_bp == pytest.approx(median, abs=YEARS)


@pytest.mark.parametrize("age, error, published, median", [
    # LESSON, "Date Calibration": the pooled ages of samples 2, 3 and 4 (as the lesson's
    # `dates` table prints them) calibrated, hpdi(..., credMass = 0.95) and MedianBP. Sample 2
    # is on a knife edge: two years of equal probability (839 and 840 cal BP) sit where the
    # running sum passes 0.95, so any change to the cut-off of the tails shows here.
    (937.2838, 15.85498, [(910, 841, 0.5442044), (837, 792, 0.4058215)], 850),
    (1964.4353, 20.41230, [(1974, 1966, 0.02250843), (1943, 1829, 0.93019646)], 1893),
    (723.8513, 19.93236, [(682, 653, 0.9534739)], 670),
])
def test_the_control_samples_calibrate_as_published(age, error, published, median):
    calibration = calibrate(age, error)
    assert_ranges(calibration, 0.95, published)
    assert calibration.median_bp == pytest.approx(median, abs=YEARS)


def test_the_iron_age_plateau_spreads_a_date_over_three_centuries():
    # LESSON, "How to Calibrate?": 2450 ± 75 BP calibrated to 95% (HPDI) lies between 2,719
    # and 2,353 cal BP; at 68% in five ranges of 18%, 8%, 2%, 32% and 8% (rounded).
    calibration = calibrate(2450, 75)
    oldest, youngest = calibration.outer(0.95)
    assert oldest == pytest.approx(2719, abs=YEARS)
    assert youngest == pytest.approx(2353, abs=YEARS)
    shares = [round(100 * r.probability) for r in calibration.ranges(0.68)]
    assert shares == [18, 8, 2, 32, 8]


def test_a_date_reported_in_cal_bp_and_ad():
    # LESSON, "How to Present your Results": ETH-3883, 676 ± 24 BP, is [671;633] (58%) or
    # [589;563] (38%) cal BP, or [1279;1317] (58%) or [1361;1387] (38%) AD (95% HPDI).
    found = calibrate(676, 24).ranges(0.95)
    assert [round(100 * r.probability) for r in found] == [58, 38]
    assert [(r.start_year, r.end_year) for r in found] == [(1279, 1317), (1361, 1387)]
    assert [(r.start_bp, r.end_bp) for r in found] == [(671, 633), (589, 563)]


def test_the_issue_date_gives_two_ranges():
    # The issue writer's values (IntCal20): 3450 ± 40 BP at 95.4% is 1882–1668 BC and
    # 1656–1635 BC. The young end of the second range is checked on its own below.
    found = calibrate(3450, 40).ranges(0.954)
    assert len(found) == 2, [str(r) for r in found]
    assert found[0].start_year == pytest.approx(1 - 1882, abs=YEARS)   # 1882 BC
    assert found[0].end_year == pytest.approx(1 - 1668, abs=YEARS)     # 1668 BC
    assert found[1].start_year == pytest.approx(1 - 1656, abs=YEARS)   # 1656 BC
    assert year_label(found[0].start_year) == "1882 BC"


@pytest.mark.xfail(strict=True, reason=(
    "ours ends at 1633 BC (3582 cal BP), 2 years past the issue's 1635 BC. The issue's two "
    "ranges are the years with probability >= 0.001547, which hold 0.9499 here; 95.4% needs "
    "the next level down, where 3616, 3583 and 3582 cal BP tie (0.9558). A calculator that "
    "puts 0.4% more weight on those years, or a 95% level, gives the issue's end."))
def test_the_issue_dates_second_range_ends_in_1635_bc():
    # The issue writer's values (IntCal20): 3450 ± 40 BP, 95.4%: second range 1656–1635 BC.
    found = calibrate(3450, 40).ranges(0.954)
    assert found[1].end_year == pytest.approx(1 - 1635, abs=YEARS)


# -- pooling several measurements (Ward & Wilson 1978) -----------------------------------------

def test_the_shroud_measurements_pool_as_published():
    # LESSON, "Are the Results from Different Laboratories in Agreement?": Sam. 1 pooled
    # 689.1192 ± 16.03791, T = 6.3518295, p = 0.04175589 (R's 1 - pchisq(T, df = 2)).
    ages, errors = zip(*SHROUD.values())
    pooled = pool(ages, errors)
    assert pooled.mean == pytest.approx(689.1192, abs=1e-4)
    assert pooled.error == pytest.approx(16.03791, abs=1e-5)
    assert pooled.statistic == pytest.approx(6.3518295, abs=1e-7)
    assert pooled.degrees_of_freedom == 2
    assert pooled.p_value == pytest.approx(0.04175589, abs=1e-8)
    assert not pooled.agrees(0.05)           # LESSON: H0 rejected for sample 1 at 0.05


def test_the_control_samples_agree():
    # LESSON, same table: Sam. 2 is 937.2838 ± 15.85498, T = 0.1375815, p = 0.93352200;
    # samples 2, 3 and 4 all pass the test at 0.05 (measurements from LESSON Table 1).
    pooled = pool([927, 940, 941], [32, 30, 23])
    assert pooled.mean == pytest.approx(937.2838, abs=1e-4)
    assert pooled.statistic == pytest.approx(0.1375815, abs=1e-7)
    assert pooled.p_value == pytest.approx(0.93352200, abs=1e-8)
    assert pool([1995, 1980, 1940], [46, 35, 30]).p_value == pytest.approx(0.52134579, abs=1e-8)
    assert pool([722, 755, 685], [43, 30, 34]).p_value == pytest.approx(0.30336618, abs=1e-8)
    assert pooled.agrees(0.05)


@pytest.mark.parametrize("statistic, freedom, survival", [
    # NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.4, upper critical values of the
    # chi-square distribution, column 0.05 (3 decimals, so Q is 0.05 to about 1e-4):
    (3.841, 1, 0.05), (5.991, 2, 0.05), (11.070, 5, 0.05),
    # the same handbook's lower critical values (P(X > x) = 0.95, 0.99, 0.90), as reprinted
    # from its September 2011 edition ("Table 7b Lower Critical Values of Chi-Square"):
    (3.940, 10, 0.95), (14.953, 30, 0.99), (82.358, 100, 0.90),
])
def test_the_chi_square_survival_function_meets_the_table(statistic, freedom, survival):
    assert chi_square_survival(statistic, freedom) == pytest.approx(survival, abs=1e-3)


def test_the_incomplete_gamma_function_meets_closed_forms():
    # Closed forms Q(1, x) = exp(-x) and Q(1/2, x) = erfc(sqrt x) (Abramowitz & Stegun,
    # section 6.5, from memory), on both sides of x = a + 1 (series and continued fraction).
    from math import erfc, exp, sqrt
    for x in (0.1, 0.9, 1.5, 3.0, 12.0, 40.0):
        assert upper_gamma_regularised(1.0, x) == pytest.approx(exp(-x), rel=1e-12)
        assert upper_gamma_regularised(0.5, x) == pytest.approx(erfc(sqrt(x)), rel=1e-10)


# -- every calibration ------------------------------------------------------------------------

def invented_dates(count: int, seed: int) -> tuple[np.ndarray, np.ndarray]:
    rng = np.random.default_rng(seed)
    ages = np.round(rng.uniform(100, 49_000, count), 1)
    errors = np.round(rng.uniform(1, 400, count), 1)
    return ages, errors


def test_every_calibration_sums_to_one():
    # The method (Stuiver & Reimer 1993): the calibrated probabilities are normalised.
    ages, errors = invented_dates(300, seed=3)
    for calibration in calibrate_many(ages, errors, "shcal20"):
        assert calibration.probability.sum() == pytest.approx(1.0, abs=1e-9)
        assert np.all(np.diff(calibration.cal_bp) == 1)
    for age, error in zip(ages[:30], errors[:30]):
        assert calibrate(age, error).probability.sum() == pytest.approx(1.0, abs=1e-9)


def test_many_dates_calibrate_as_one_at_a_time():
    # calibrate_many looks only near each age; calibrate looks over the whole curve.
    ages, errors = invented_dates(200, seed=11)
    ages[:3], errors[:3] = [95, 50_193, 4000], [30, 30, 0.5]     # the curve's ends, a tiny error
    for many, age, error in zip(calibrate_many(ages, errors), ages, errors):
        one = calibrate.__wrapped__(age, error)
        assert np.array_equal(many.cal_bp, one.cal_bp), (age, error)
        np.testing.assert_allclose(many.probability, one.probability, rtol=1e-12, atol=1e-15)
        for level in (0.683, 0.954):
            assert [(r.start_bp, r.end_bp) for r in many.ranges(level)] == \
                [(r.start_bp, r.end_bp) for r in one.ranges(level)]
        assert many.median_bp == one.median_bp


def test_repeated_dates_are_calibrated_once():
    found = calibrate_many([750, 646, 750], [30, 31, 30])
    assert found[0] is found[2] and found[0] is not found[1]
    assert calibrate(750, 30) is calibrate(750.0, 30.0)


def test_the_curve_ends_cut_a_date():
    assert calibrate(50_000, 800).cut_by_curve      # reaches past 55,000 cal BP
    assert not calibrate(3450, 40).cut_by_curve


def test_density_runs_in_calendar_order():
    calibration = calibrate(750, 30)
    years, probability = calibration.density_by_year()
    assert np.array_equal(years, 1950 - calibration.cal_bp[::-1])
    assert np.array_equal(probability, calibration.probability[::-1])


def test_the_curves_load_from_the_package():
    for name, source in CURVES.items():
        curve = load_curve(name)
        assert curve.cal_bp[0] == 0 and curve.cal_bp[-1] == 55_000
        assert np.all(np.diff(curve.cal_bp) == 1) and curve.citation == source.citation
        packaged = importlib.resources.files("timelines.dates") / "curves" / source.file
        assert packaged.read_text("utf-8").startswith("##")   # shipped with its header
    # Reimer et al. 2020, intcal20.14c: the row "0,199,11,-24.5,1.4" (0 cal BP: 199 ± 11).
    assert (load_curve("intcal20").age[0], load_curve("intcal20").sigma[0]) == (199, 11)


# -- years ------------------------------------------------------------------------------------

def test_bc_and_ad_have_no_year_zero():
    # LESSON, "How to Calibrate?": below 1950 cal BP a date is 1950 - x AD, from 1950 cal BP
    # on it is x - 1949 BC (there is no year 0).
    assert year_label(year_from_cal_bp(1950)) == "1 BC"
    assert year_label(year_from_cal_bp(1949)) == "AD 1"
    assert year_label(year_from_cal_bp(3831)) == "1882 BC"
    assert year_label(year_from_cal_bp(725)) == "AD 1225"
    assert year_from_cal_bp(1950) == 0 and cal_bp_from_year(-1881) == 3831
    assert cal_bp_label(725) == "725 cal BP" and cal_bp_label(12_650) == "12,650 cal BP"


# -- errors -----------------------------------------------------------------------------------

@pytest.mark.parametrize("age, error, message", [
    (750, 0, "cannot calibrate 750 ± 0 BP: the error must be a number above 0"),
    (750, -5, "cannot calibrate 750 ± -5 BP: the error must be a number above 0"),
    (60_000, 100, "cannot calibrate 60000 ± 100 BP: IntCal20 covers radiocarbon ages 95 to "
                  "50193 BP"),
    (20, 15, "cannot calibrate 20 ± 15 BP: IntCal20 covers radiocarbon ages 95 to 50193 BP"),
])
def test_an_unusable_date_is_refused_plainly(age, error, message):
    with pytest.raises(ValueError) as raised:
        calibrate(age, error)
    assert str(raised.value) == message
    with pytest.raises(ValueError) as raised:
        calibrate_many([3450, age], [40, error])
    assert str(raised.value) == message


def test_unknown_curves_and_levels_are_refused():
    with pytest.raises(ValueError, match="unknown calibration curve 'intcal13'"):
        calibrate(750, 30, "intcal13")
    with pytest.raises(ValueError, match="above 0 and at most 1"):
        calibrate(750, 30).ranges(95)
    with pytest.raises(ValueError, match="two or more ages"):
        pool([750], [30])
