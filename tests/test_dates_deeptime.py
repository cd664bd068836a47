"""Ages before present and error terms. BP counts back from 1950 (Stuiver & Polach 1977,
"Reporting of 14C data", from memory), b2k from 2000; the bounds follow by arithmetic from
that definition and the rule that a value without an error term stands for every age that
rounds to it at its last written digit. Years are proleptic Gregorian (stdlib for AD years).
"""
from __future__ import annotations

import pytest
from hypothesis import given, strategies as st

from timelines.calendar import gregorian_year_range, iso_from_fixed
from timelines.dates import DateError, parse_date, parse_span
from timelines.model import Precision, Qualifier

A = Qualifier.APPROXIMATE
DEEP, YEAR = Precision.DEEP_TIME, Precision.YEAR


def _years(first, last):
    return gregorian_year_range(first)[0], gregorian_year_range(last)[1]


def _middle(year):
    first, last = gregorian_year_range(year)
    return (first + last) // 2


# (text, first year, last year, likely year or None, precision, qualifiers); astronomical years
AGES = [
    ("12,500 ± 150 BP", 1950 - 12650, 1950 - 12350, 1950 - 12500, DEEP, {A}),  # issue 3 example
    ("12500 ± 150 BP", 1950 - 12650, 1950 - 12350, 1950 - 12500, DEEP, {A}),
    ("12,500 +/- 150 BP", 1950 - 12650, 1950 - 12350, 1950 - 12500, DEEP, {A}),
    ("12500±150 cal BP", 1950 - 12650, 1950 - 12350, 1950 - 12500, DEEP, {A}),
    ("12,500 BP", 1950 - 12500, 1950 - 12500, 1950 - 12500, DEEP, set()),      # every digit counts
    ("0 BP", 1950, 1950, 1950, DEEP, set()),                                   # the present of BP
    ("500 years BP", 1450, 1450, 1450, DEEP, set()),
    ("10,000 years ago", 1950 - 10000, 1950 - 10000, 1950 - 10000, DEEP, set()),
    ("12.5 ka", 1950 - 12549, 1950 - 12450, 1950 - 12500, DEEP, set()),        # 12.45..12.55 ka
    ("12 ka", 1950 - 12499, 1950 - 11500, 1950 - 12000, DEEP, set()),          # 11.5..12.5 ka
    ("12.5 kya", 1950 - 12549, 1950 - 12450, 1950 - 12500, DEEP, set()),
    ("65.5 Ma", 1950 - 65_549_999, 1950 - 65_450_000, 1950 - 65_500_000, DEEP, set()),  # issue 3 example
    ("66 Ma", 1950 - 66_499_999, 1950 - 65_500_000, 1950 - 66_000_000, DEEP, set()),
    ("66.0 Ma", 1950 - 66_049_999, 1950 - 65_950_000, 1950 - 66_000_000, DEEP, set()),  # a written zero counts
    ("65.5 ± 0.3 Ma", 1950 - 65_800_000, 1950 - 65_200_000, 1950 - 65_500_000, DEEP, {A}),
    ("66 million years ago", 1950 - 66_499_999, 1950 - 65_500_000, 1950 - 66_000_000, DEEP, set()),
    ("2.5 Ga", 1950 - 2_549_999_999, 1950 - 2_450_000_000, 1950 - 2_500_000_000, DEEP, set()),
    ("11,700 b2k", 2000 - 11700, 2000 - 11700, 2000 - 11700, DEEP, set()),    # ice cores count from 2000
    # a calendar year with an error term, in the calendar setting (Gregorian from 1583 on)
    ("1650 ± 10", 1640, 1660, 1650, YEAR, {A}),                                # issue 3 example
    ("1650 +/- 10 years", 1640, 1660, 1650, YEAR, {A}),
    ("1650±10", 1640, 1660, 1650, YEAR, {A}),
]


def test_age_table_has_no_repeated_case():
    assert len({row[0] for row in AGES}) == len(AGES)


@pytest.mark.parametrize("text, first, last, likely, precision, qualifiers", AGES)
def test_ages(text, first, last, likely, precision, qualifiers):
    endpoint = parse_date(text)
    assert (endpoint.earliest, endpoint.latest) == _years(first, last)
    assert endpoint.likely == _middle(likely)
    assert (endpoint.precision, endpoint.qualifiers) == (precision, frozenset(qualifiers))


def test_likely_day_is_the_middle_of_the_nominal_year():
    # 1650 has 365 days: the middle day is the 183rd, 2 July (docs/dates.md).
    assert iso_from_fixed(parse_date("1650 ± 10").likely) == "1650-07-02"


def test_an_error_term_on_a_bc_year():
    # 3000 BC ± 50 years: 3050 BC .. 2950 BC, in the calendar setting (Julian then).
    endpoint = parse_date("3000 ± 50 BC")
    assert endpoint.earliest == parse_date("3050 BC").earliest
    assert endpoint.latest == parse_date("2950 BC").latest
    year = parse_date("3000 BC")
    assert endpoint.likely == (year.earliest + year.latest) // 2


def test_ranges_of_ages_share_their_unit():
    span = parse_span("66–56 Ma")
    assert span.start == parse_date("66 Ma") and span.end == parse_date("56 Ma")
    span = parse_span("12,500–12,000 BP")
    assert span.start == parse_date("12,500 BP") and span.end == parse_date("12,000 BP")


def test_circa_on_deep_time_widens_by_a_share_of_the_age():
    # 10% of the age on each side (circa-deep-time default): 11,000 .. 9,000 BP.
    widened = parse_date("c. 10,000 BP")
    assert (widened.earliest, widened.latest) == _years(1950 - 11000, 1950 - 9000)
    assert widened.has(A) and widened.has(Qualifier.CONVENTION_DEPENDENT)


@pytest.mark.parametrize("text, reason", [
    ("56–66 Ma", "the end comes before the start"),
    ("12,500 BP BC", "an age before present takes no era (BC, AD)"),
])
def test_age_errors(text, reason):
    with pytest.raises(DateError) as caught:
        parse_span(text)
    assert caught.value.reason == reason


@given(st.integers(min_value=0, max_value=10 ** 9), st.integers(min_value=0, max_value=10 ** 6))
def test_an_age_with_an_error_term_is_centred(age, error):
    endpoint = parse_date(f"{age} ± {error} BP")
    first, last = _years(1950 - age - error, 1950 - age + error)
    assert (endpoint.earliest, endpoint.latest) == (first, last)
    assert endpoint.earliest <= endpoint.likely <= endpoint.latest
