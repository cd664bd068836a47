"""The quick lane (timelines/dates/quick.py) gives exactly what the general reader gives."""
from __future__ import annotations

import pytest
from hypothesis import given, settings as hypothesis_settings, strategies as st

from timelines.dates import DateError, DateSettings
from timelines.dates.quick import QUICK, quick_span
from timelines.dates.ranges import general_span

_SETTINGS = [DateSettings(), DateSettings(calendar="julian"), DateSettings(calendar="gregorian"),
             DateSettings(before_after="inclusive", circa_years_for_year=2),
             DateSettings(hundreds="decade"), DateSettings(reform="1752-09-14")]
_MONTHS = ["April", "Apr", "may", "SEPT", "7ber", "Xber", "February", "feb"]
_YEARS = st.integers(min_value=0, max_value=9999).map(str) | st.sampled_from(
    ["1582", "1583", "1700", "1600", "0", "04", "44"])
_DAYS = st.integers(min_value=0, max_value=32).map(str)
_WORDS = st.sampled_from(["c.", "ca.", "c", "ca", "circa", "about", "before", "bef.", "after",
                          "aft.", "by", "C.", "About", "BEFORE"])
_QUICK_SHAPES = st.one_of(
    _YEARS,
    st.dates().map(lambda day: day.isoformat()),
    st.builds("{}-{:02d}-{:02d}".format, st.integers(1000, 9999), st.integers(0, 13),
              st.integers(0, 32)),
    st.builds("{} {} {}".format, _DAYS, st.sampled_from(_MONTHS), _YEARS),
    st.builds("{}-{}-{}".format, _DAYS, st.sampled_from(_MONTHS), _YEARS),
    st.builds("{} {}, {}".format, st.sampled_from(_MONTHS), _DAYS, _YEARS),
    st.builds("{} {} {}".format, st.sampled_from(_MONTHS), _DAYS, _YEARS),
    st.builds("{} {}".format, st.sampled_from(_MONTHS), _YEARS),
    st.integers(10, 999).map(lambda n: f"{n * 10}s"),
    st.builds("{} {}".format, _WORDS, _YEARS),
    st.builds("{} {}".format, _YEARS, st.sampled_from(["BC", "BCE", "bc"])),
    st.builds("{}{}{}".format, st.integers(1000, 9999), st.sampled_from(["–", "-", " to ", "/"]),
              st.integers(1000, 9999)),
    st.builds("{}{} {}".format, st.sampled_from(["", "early ", "mid-", "late ", "Early "]),
              st.sampled_from(["1st", "2nd", "3rd", "4th", "11th", "12th", "13th", "17th", "21st",
                               "22nd", "17st", "2th", "0th"]),
              st.sampled_from(["century", "c.", "Century"])),
    st.builds("{}{}".format, st.sampled_from(["early ", "mid-", "late ", "early"]),
              st.integers(10, 999).map(lambda n: f"{n * 10}s")),
    st.builds("{} {} {}".format, st.sampled_from(["c.", "ca.", "circa", "about"]), _YEARS,
              st.sampled_from(["BC", "BCE"])),
    st.builds("{}{}".format, _YEARS, st.sampled_from(["?", "~", "%"])),
    st.builds("{}{}{}{}{}".format, _DAYS, st.sampled_from(["/", "-"]), _DAYS,
              st.sampled_from(["/", "-"]), st.integers(1000, 9999)),
    st.builds("{} {} {} {}".format, st.sampled_from(["between", "Between", "BETWEEN"]),
              st.integers(1000, 9999), st.sampled_from(["and", "AND"]), st.integers(1000, 9999)),
    st.builds("{}–{} {}".format, st.sampled_from(_MONTHS), st.sampled_from(_MONTHS), _YEARS),
    st.builds("{} {}".format, st.sampled_from(["c.", "ca.", "circa", "about", "C.", "About"]),
              st.integers(10, 999).map(lambda n: f"{n * 10}s")),
    st.builds("{} ± {}".format, _YEARS, st.integers(0, 9999)),
    st.builds("{:,} ± {} BP".format, st.integers(1000, 999_999), st.integers(0, 9999)),
    st.builds("{}.{} {}".format, st.integers(0, 999), st.integers(0, 9),
              st.sampled_from(["Ma", "ma", "MA"])),
    st.builds("{} {} {}/{}".format, _DAYS, st.sampled_from(_MONTHS + ["January", "March", "Mar"]),
              st.integers(1000, 1800), st.integers(0, 99).map("{:02d}".format)),
)


def _general(text, settings):
    try:
        return general_span(text, settings)
    except DateError as error:
        return error.reason


@hypothesis_settings(max_examples=5000)
@given(_QUICK_SHAPES, st.sampled_from(_SETTINGS))
def test_quick_lane_agrees_with_the_general_reader(text, settings):
    quick = quick_span(text, settings)
    if quick is not None:
        assert quick == _general(text, settings), text


@pytest.mark.parametrize("text", ["1650", "1985-04-12", "12 April 1650", "12-Apr-1650",
                                  "April 12, 1650", "April 1650", "1650s", "c. 1650",
                                  "before 1700", "44 BC", "1650–1660", "1650 to 1660", "1650%",
                                  "between 1650 and 1660", "March–May 1650", "c. 1650s",
                                  "1650 ± 10", "12,500 ± 150 BP", "65.5 Ma",
                                  "12 February 1701/02"])
def test_the_common_shapes_take_the_quick_lane(text):
    assert QUICK.fullmatch(text) and quick_span(text, DateSettings()) is not None


@pytest.mark.parametrize("text", ["2001-02-29", "31 April 1650", "10 October 1582",
                                  "1660–1650", "0000-01-01", "1985-13-01",
                                  "between 1660 and 1650", "May–March 1650",
                                  "12 April 1701/02", "12 February 1701/03"])
def test_doubtful_cells_go_to_the_general_reader(text):
    assert quick_span(text, DateSettings()) is None


# Unicode case folding matches 'ſ' (long s) to s, 'ı' (dotless i) to i and the Kelvin sign to
# k; the month names are ASCII, and such a cell must get the general reader's DateError.
@pytest.mark.parametrize("text", ["12 \u017fept 1650", "Ju\u0131y 12, 1650", "12 Ju\u0131y 1650",
                                  "\u017fept 1650", "Ma\u0131\u2013June 1650"])
def test_look_alike_letters_give_a_date_error(text):
    assert quick_span(text, DateSettings()) is None
    with pytest.raises(DateError):
        general_span(text, DateSettings())
