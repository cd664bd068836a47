"""Withholding possibly living persons' details (invented records; the rule is a setting)."""
from __future__ import annotations

from timelines.calendar import fixed_from_gregorian as day
from timelines.check.living import WITHHELD_LABEL, possibly_living, withhold_possibly_living
from timelines.model import Endpoint, Precision, Provenance, Qualifier, Record, Span


def person(label, born, died=None) -> Record:
    start = Endpoint.day(day(*born))
    end = Endpoint.day(day(*died)) if died else Endpoint.open(Qualifier.UNKNOWN_END)
    return Record(label, Span(start, end), Provenance("family.csv", 2), start_text="x",
                  id="P1", fields=(("note", "lives in Cressing"),))


def test_born_recently_without_a_death_is_possibly_living():
    assert possibly_living(person("Ada", (1990, 5, 4)), as_of_year=2026)
    assert not possibly_living(person("Ada", (1990, 5, 4), (2020, 1, 2)), as_of_year=2026)
    assert not possibly_living(person("Old", (1850, 1, 1)), as_of_year=2026)   # over 100 years


def test_withheld_records_keep_their_place_but_not_their_details():
    result = withhold_possibly_living([person("Ada", (1990, 5, 4)), person("Old", (1850, 1, 1))],
                                      as_of_year=2026)
    assert result.count == 1
    hidden, kept = result.records
    assert hidden.label == WITHHELD_LABEL and hidden.fields == () and hidden.id is None
    assert hidden.start_text == ""
    # only the year of birth remains
    assert (hidden.span.start.earliest, hidden.span.start.latest) == (day(1990, 1, 1),
                                                                       day(1990, 12, 31))
    assert hidden.span.start.precision == Precision.YEAR
    assert kept.label == "Old"
