"""Hostile and unusual texts (issue 9, "Nothing lost"): the reader raises nothing but a
DateError, says in the user's terms what is wrong with the text, and says it quickly; and the
forms that once broke it read as documented."""
from __future__ import annotations

import time

import pytest

from date_fuzz import looks_internal
from timelines.calendar import iso_from_fixed
from timelines.dates import (
    DateError, describe, endpoint_from_cell, explain, parse_date, parse_endpoint, parse_span,
)
from timelines.dates.ranges import general_span
from timelines.dates.settings import DEFAULT_SETTINGS
from timelines.model import Precision, Qualifier


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _short_id(value) -> str:
    """A test id for a text of thousands of characters (or a number str() refuses)."""
    shown = ascii(value) if not isinstance(value, int) else f"int of {value.bit_length()} bits"
    return shown if len(shown) <= 32 else f"{shown[:24]}...({len(shown)})"


# (text, exact reason, where the fault stands): refusals added for issue 9.
_OFFSET_RANGE = "out of range (offsets run from -14:00 to +14:00)"
REFUSALS = [
    # ISO 8601-1 (ISO 8601:2004 before it), from memory: minutes 00-59, seconds 00-60, hours
    # 00-24 with 24 only as 24:00:00, the end of the day.
    ("2004-01-01T24:00:01", "24:00:01 is past the end of the day: hour 24 is only 24:00:00", 11),
    ("2004-01-01T24:30", "24:30 is past the end of the day: hour 24 is only 24:00:00", 11),
    ("2004-01-01T10:60", "'T10:60' is not a time of day", 10),
    ("2004-01-01T23:59:61", "'T23:59:61' is not a time of day", 10),
    # A UTC offset's minutes run 00-59 too (ISO 8601-1, from memory) ...
    ("2004-01-01T10:10:10-05:60", "the UTC offset -05:60 has no minute 60 (minutes run 00 to 59)",
     19),
    ("20040101T101010-0560", "the UTC offset -0560 has no minute 60 (minutes run 00 to 59)", 15),
    # ... and it is at most 14 hours either way: W3C XML Schema 1.1 Part 2, timezoneFrag (from
    # memory); UTC+14:00 (Line Islands) and UTC-12:00 are the widest zones in use.
    ("2004-01-01T23:20:30+24", f"the UTC offset +24 is {_OFFSET_RANGE}", 19),
    ("2004-01-01T10:00+15", f"the UTC offset +15 is {_OFFSET_RANGE}", 16),
    ("2004-01-01T10:00-14:01", f"the UTC offset -14:01 is {_OFFSET_RANGE}", 16),
    # ISO 8601-2 sets do not nest (from memory); a catalogue's bracket around one is a second
    # level. Deeper nesting is refused before it is read.
    ("[[[[1650]]]]", "brackets nested 4 deep; a date nests them at most 3 deep", 0),
    ("[" * 60 + "1650" + "]" * 60, "brackets nested 60 deep; a date nests them at most 3 deep", 0),
    ("{" * 5000, "too long for a date (5000 characters)", None),
    ("[" * 5000, "too long for a date (5000 characters)", None),
    ("9" * 5000, "too long for a date (5000 characters)", None),
    ("1650 " * 2000, "too long for a date (9999 characters)", None),
    ("1e999999 Ma", "not a date form timelines reads", None),
    ("Y9E99", "year Y9E99 is out of range (at most 12 digits)", 0),
    ("XXXX-41", "a year with no known digit says nothing", 0),
    # Characters that do not show: no date holds one, and the writer cannot see it.
    ("\x00", "holds U+0000, a control character", 0),
    ("1650\x00", "holds U+0000, a control character", 4),
    ("\x1b[31m1650", "holds U+001B, a control character", 0),
    ("\u200f1650", "holds U+200F (right-to-left mark), an invisible formatting character", 0),
    ("\u202e1650", "holds U+202E (right-to-left override), an invisible formatting character", 0),
    ("\ufeff1650",
     "holds U+FEFF (zero width no-break space), an invisible formatting character", 0),
    ("c. 1650\u200b", "holds U+200B (zero width space), an invisible formatting character", 7),
    ("1650–\x001660", "holds U+0000, a control character", 5),
    ("\ud800", "holds U+D800, half of a surrogate pair, not a character (the text was decoded "
               "wrongly)", 0),
]


def test_refusal_table_has_no_repeated_case():
    assert len({row[0] for row in REFUSALS}) == len(REFUSALS)


@pytest.mark.parametrize("text, reason, position", REFUSALS,
                         ids=[_short_id(row[0]) for row in REFUSALS])
def test_refusals_say_what_is_wrong(text, reason, position):
    for parse in (parse_span, parse_date, parse_endpoint):
        with pytest.raises(DateError) as caught:
            parse(text)
        assert (caught.value.reason, caught.value.position) == (reason, position)


# Times and offsets at the very limits are read: the day as written, at day precision.
@pytest.mark.parametrize("text", [
    "2004-01-01T24:00",              # end of the day (ISO 8601:2004, from memory)
    "2004-01-01T24:00:00.000Z",
    "2004-01-01T23:59:60Z",          # a leap second
    "2004-01-01T10:00+14:00",        # Line Islands, UTC+14:00
    "2004-01-01T10:00-12:00",        # UTC-12:00
    "20040101T240000",
])
def test_times_at_the_limits_are_read(text):
    endpoint = parse_date(text)
    assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == ("2004-01-01", "2004-01-01")


# Forms docs/dates.md documents, in capitals: once a ValueError from the quick lane, which
# split the text at literal lower-case words; and a digit-led part word missed in capitals.
@pytest.mark.parametrize("written, documented", [
    ("Mid-17th century", "mid-17th century"),
    ("MID-1650S", "mid-1650s"),
    ("12,500 ± 150 bp", "12,500 ± 150 BP"),
    ("LATE 17TH C.", "late 17th c."),
    ("2ND QUARTER OF THE 18TH CENTURY", "2nd quarter of the 18th century"),
])
def test_capitalised_forms_read_as_documented(written, documented):
    assert parse_span(written) == parse_span(documented)
    assert parse_span(written) == general_span(written, DEFAULT_SETTINGS)


# (text, earliest, latest, precision, qualifiers): valid forms once refused with an internal
# invariant's text ("earliest N is after latest N", "invalid literal for int()").
READINGS = [
    # 0.999999999 Ma is the ages 999,999.9985..999,999.9995 years: inside one year, the one
    # that 1,000,000 years before 1950 names (BP counts from 1950: Stuiver & Polach 1977,
    # from memory): 1950 - 1,000,000 = -998050.
    ("0.999999999 Ma", "-998050-01-01", "-998050-12-31", Precision.DEEP_TIME, set()),
    # 11,765.5 b2k straddles two years before 2000: 11,765 and 11,766.
    ("11,765.500 b2k", "-9766-01-01", "-9765-12-31", Precision.DEEP_TIME, set()),
    # ISO 8601-2 significant digits (from memory): Y171010000S3 is the years 171,000,000 ..
    # 171,999,999; ~ widens each side by the circa-deep-time default, 10% of its distance
    # from 1950, outwards for years after 1950 as for years before it.
    ("Y171010000S3~", "+153900195-01-01", "+189199803-12-31", Precision.DEEP_TIME,
     {Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT}),
    ("Y-171010000S3~", "-189200193-01-01", "-153899805-12-31", Precision.DEEP_TIME,
     {Qualifier.APPROXIMATE, Qualifier.CONVENTION_DEPENDENT}),
    # ISO 8601-2 sub-year groupings (from memory): 41 is the second semester, July-December;
    # with unspecified digits, that half of any year 2000..2099.
    ("20XX-41", "2000-07-01", "2099-12-31", Precision.CENTURY, {Qualifier.UNSPECIFIED}),
    ("200X-33", "2000-01-01", "2009-03-31", Precision.DECADE, {Qualifier.UNSPECIFIED}),
    # 24: winter, read in the hemisphere setting (northern: December to February).
    ("20XX-24", "2000-12-01", "2100-02-28", Precision.CENTURY,
     {Qualifier.UNSPECIFIED, Qualifier.CONVENTION_DEPENDENT}),
    # A set's run may have an open side; the other elements still bound it.
    ("[1667,1668,by 1670..1672]", None, "1672-12-31", Precision.YEAR,
     {Qualifier.ONE_OF, Qualifier.BEFORE}),
]


def test_reading_table_has_no_repeated_case():
    assert len({row[0] for row in READINGS}) == len(READINGS)


@pytest.mark.parametrize("text, earliest, latest, precision, qualifiers", READINGS)
def test_forms_once_refused_with_internal_text_read(text, earliest, latest, precision,
                                                     qualifiers):
    endpoint = parse_date(text)
    assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == (earliest, latest)
    assert endpoint.precision == precision
    assert endpoint.qualifiers == frozenset(qualifiers)


# Cells too big to write out: a DateError naming their size, not Python's int limit.
HUGE_CELLS = [
    (10 ** 5000, "a whole number of about 5,001 digits",
     "year of about 5,001 digits is out of range (at most 12 digits)"),
    (-(10 ** 5000), "a whole number of about 5,001 digits",
     "year of about 5,001 digits is out of range (at most 12 digits)"),
    (1e300, "1e+300", "year of about 301 digits is out of range (at most 12 digits)"),
]


@pytest.mark.parametrize("value, text, reason", HUGE_CELLS,
                         ids=[_short_id(row[0]) for row in HUGE_CELLS])
def test_huge_number_cells_are_refused_by_their_size(value, text, reason):
    with pytest.raises(DateError) as caught:
        endpoint_from_cell(value)
    assert (caught.value.text, caught.value.reason) == (text, reason)


HOSTILE = [
    "{" * 5000, "[" * 5000, "(" * 5000, "9" * 5000, "1e999999 Ma", "x" * 10_000, "\x00" * 300,
    "\ud800", "\udfff1650", "1650\u202e", "[" * 99 + "1650" + "]" * 99, "{" * 99 + "}" * 99,
    "9" * 199, "9" * 13 + " Ma", "9" * 13 + "." + "9" * 12 + " Ga", "Y" + "9" * 12 + "E99S99",
    "1 " * 99, "- " * 99, "1-" * 99, "c. " * 66, "1650 or " * 24, "12 April " * 22,
    "[" + "1650," * 39 + "1650]", "[" + ".., " * 60 + "]", "X" * 199, "X-" * 99, "?" * 199,
    "1" * 100 + " " + "1" * 98, "0." * 99, "twenty-" * 28, "first half of " * 14,
    "9" * 13 + "." + "9" * 150 + " Ma",
]


@pytest.mark.parametrize("casing", [str, str.upper, str.lower, str.title])
def test_hostile_texts_are_refused_quickly_in_their_own_words(casing):
    started = time.perf_counter()
    for text in map(casing, HOSTILE):
        for parse in (parse_span, parse_date, parse_endpoint):
            with pytest.raises(DateError) as caught:
                parse(text)
            assert not looks_internal(caught.value.reason), (text[:40], caught.value.reason)
        assert describe(text)["ok"] is False
        assert explain(text)[0] == f"input: {text!r}"
    # Each text is short work (about 0.1 ms); a regex or a loop gone quadratic takes seconds.
    assert time.perf_counter() - started < 2.0
