"""Columns as three invented practitioners write them (issue 3, "done when"): a curator's
object register, an archaeologist's phasing sheet, a genealogist's family export (GEDCOM
date phrases). Every cell reads to the bounds the writer meant, or fails saying why.
The people, objects and places behind these cells are fictional; the cells alone matter.
Bounds: common practice, no source, with the settings defaults of docs/dates.md; Julian
days are checked against convertdate.julian.
"""
from __future__ import annotations

import math

import convertdate.julian
import pytest

from timelines.calendar import JD_OFFSET, iso_from_fixed
from timelines.dates import (
    DateError, endpoint_from_cell, explain, parse_column, parse_endpoint,
)


def _iso(fixed):
    return None if fixed is None else iso_from_fixed(fixed)


def _julian_iso(year, month, day):
    return iso_from_fixed(math.floor(convertdate.julian.to_jd(year, month, day) + 0.5) - JD_OFFSET)


# The curator: a register of an invented town museum (object made/acquired)
CURATOR = [
    ("c. 1720", "1715-01-01", "1725-12-31"),
    ("early 18th century", "1700-01-01", "1732-12-31"),
    ("1740s", "1740-01-01", "1749-12-31"),
    ("before 1760", None, "1759-12-31"),
    ("1755?", "1755-01-01", "1755-12-31"),
    ("2nd quarter of the 18th century", "1725-01-01", "1749-12-31"),
    ("1760–65", "1760-01-01", "1765-12-31"),
    ("mid-18th c.", "1733-01-01", "1766-12-31"),
    ("ca. 1750-1760", "1745-01-01", "1760-12-31"),
    ("18th century (?)", "1700-01-01", "1799-12-31"),
    ("[ca. 1790]", "1785-01-01", "1795-12-31"),
    ("1796/1799", "1796-01-01", "1799-12-31"),
    ("12 April 1801", "1801-04-12", "1801-04-12"),
    ("Spring 1802", "1802-03-01", "1802-05-31"),
]

# The archaeologist: phases of an invented excavation
ARCHAEOLOGIST = [
    ("3200 ± 40 BP", "-1290-01-01", "-1210-12-31"),
    ("12.8 ka", "-10899-01-01", "-10800-12-31"),
    ("c. 2500 BC", _julian_iso(-2504, 1, 1), _julian_iso(-2494, 12, 31)),
    ("late 3rd millennium BC", _julian_iso(-2331, 1, 1), _julian_iso(-1999, 12, 31)),  # the last 333 of 2999-2000 BC
    ("5th–4th century BC", _julian_iso(-498, 1, 1), _julian_iso(-299, 12, 31)),
    ("TPQ AD 43", _julian_iso(43, 1, 1), None),
    ("terminus ante quem 410", None, _julian_iso(410, 12, 31)),
    ("AD 43–60", _julian_iso(43, 1, 1), _julian_iso(60, 12, 31)),
    ("1st century AD", _julian_iso(1, 1, 1), _julian_iso(99, 12, 31)),
    ("-0499/-0400", "-0499-01-01", "-0400-12-31"),
]

# The genealogist: dates from a family-history export
GENEALOGIST = [
    ("ABT 1780", "1775-01-01", "1785-12-31"),
    ("BEF 12 MAR 1802", None, "1802-03-11"),
    ("BET 1790 AND 1795", "1790-01-01", "1795-12-31"),
    ("11 Feb 1731/32", "1732-02-22", "1732-02-22"),
    ("FROM 1801 TO 1810", "1801-01-01", "1810-12-31"),
    ("3 Xber 1788", "1788-12-03", "1788-12-03"),
    ("CAL 1756", "1756-01-01", "1756-12-31"),
    ("EST 1750", "1745-01-01", "1755-12-31"),
    ("AFT 1790", "1791-01-01", None),
    ("@#DJULIAN@ 2 SEP 1752", _julian_iso(1752, 9, 2), _julian_iso(1752, 9, 2)),
    ("14 September 1752", "1752-09-14", "1752-09-14"),
    ("25/12/1790", "1790-12-25", "1790-12-25"),
]


@pytest.mark.parametrize("sheet", [CURATOR, ARCHAEOLOGIST, GENEALOGIST],
                         ids=["curator", "archaeologist", "genealogist"])
def test_every_cell_reads_as_meant(sheet):
    assert len({row[0] for row in sheet}) == len(sheet)
    results = parse_column([row[0] for row in sheet])
    # strict: a reader that returned fewer results (or none) must fail here, not pass.
    for (text, earliest, latest), endpoint in zip(sheet, results, strict=True):
        assert not isinstance(endpoint, DateError), (text, endpoint)
        assert (_iso(endpoint.earliest), _iso(endpoint.latest)) == (earliest, latest), text
        assert endpoint == parse_endpoint(text)
        assert explain(text)[-1].startswith(("result:", "certain core:")), text


# Cells that cannot be read, and what the writer is told
FAILURES = [
    ("03/04/1790", "03/04/1790 could be 3 April or March 4"),
    ("31 Sept 1790", "day 31 does not exist in month 9 (it has 30 days)"),
    ("29 Feb 1790", "1790 is not a leap year in the gregorian calendar"),
    ("c. 18th", "not a date form timelines reads"),
    ("1790/80", "1790/80 is not a dual year: a dual year names a year and the next one"),
    ("0 BC", "BC/AD counting has no year zero"),
    ("1985-13-01", "month 13 does not exist"),
    ("Aprl 1790", "not a date form timelines reads"),
]


@pytest.mark.parametrize("text, reason", FAILURES)
def test_failures_say_why(text, reason):
    result = parse_column([text])[0]
    assert isinstance(result, DateError) and result.reason == reason
    lines = explain(text)
    assert f"error: {reason}" in lines


@pytest.mark.parametrize("text", ["n.d.", "s.d.", "undated", "unknown", "?", "  "])
def test_words_for_no_date_are_empty_cells(text):
    assert endpoint_from_cell(text) is None
