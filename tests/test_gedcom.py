"""GEDCOM dates as genealogy programs export them (GEDCOM 5.5.1, DATE_VALUE; from memory).

The keywords carry meanings the date language already has; each row says which. The calendar
escapes for the Hebrew and French Republican calendars are rewritten into the written forms
that tests/test_other_calendars.py checks against convertdate, so here they are compared with
those forms.
"""
from __future__ import annotations

import pytest

from timelines.dates import DateError, explain, parse_span
from timelines.model import Qualifier


@pytest.mark.parametrize("gedcom, meaning", [
    ("ABT 1650", "c. 1650"),              # about
    ("EST 1650", "c. 1650"),              # estimated
    ("BEF 1700", "before 1700"),
    ("AFT 1650", "after 1650"),
    ("BET 1650 AND 1660", "between 1650 and 1660"),
    ("FROM 1650 TO 1660", "1650 to 1660"),
    ("12 APR 1650", "12 April 1650"),
    ("@#DJULIAN@ 12 APR 1650", "12 April 1650 (Julian)"),
    ("INT 1650 (from a will)", "1650"),   # interpreted from the phrase in brackets
    ("@#DHEBREW@ 15 NSN 5760", "15 Nisan 5760"),
    ("@#DHEBREW@ ADS 5760", "Adar II 5760"),
    ("@#DHEBREW@ 5760", "5760 AM"),
    ("@#DFRENCH R@ 18 BRUM 8", "18 Brumaire an VIII"),
    ("@#DFRENCH R@ 8", "an VIII"),
    ("ABT @#DHEBREW@ NSN 5760", "c. Nisan 5760"),
])
def test_gedcom_keywords_read_as_their_meaning(gedcom, meaning):
    assert parse_span(gedcom) == parse_span(meaning)


def test_calculated_is_uncertain():
    assert parse_span("CAL 1650").start.has(Qualifier.UNCERTAIN)


def test_two_escapes_in_one_range():
    span = parse_span("BET @#DFRENCH R@ 1 VEND 8 AND @#DFRENCH R@ 18 BRUM 8")
    assert span == parse_span("between 1 Vendémiaire an VIII and 18 Brumaire an VIII")


@pytest.mark.parametrize("text, reason", [
    ("@#DROMAN@ 12 1650", "names no calendar"),
    ("@#DUNKNOWN@ 1650", "names no calendar"),
    ("@#DHEBREW@ 15 XYZ 5760", "no GEDCOM month code"),
    ("@#DHEBREW@", "followed by a date"),
])
def test_what_cannot_be_counted_is_refused_with_its_reason(text, reason):
    with pytest.raises(DateError, match=reason):
        parse_span(text)


def test_explain_shows_the_phrase_and_the_escape():
    assert any("interpreted from the phrase 'from a will'" in line
               for line in explain("INT 1650 (from a will)"))
    assert any("GEDCOM @#DHEBREW@" in line for line in explain("@#DHEBREW@ 15 NSN 5760"))
