"""model.many makes the same objects as the dataclass's own constructor, only faster."""
from __future__ import annotations

import dataclasses
import gc
from itertools import repeat

import pytest

from timelines.model import Endpoint, Provenance, Record, Span, collection_paused, many


def test_many_equals_the_constructor_field_by_field():
    span = Span(Endpoint(10, 20), Endpoint(30, 40))
    labels, rows = ["Odile", "Tamsin", "Brannoc"], [2, 3, 4]
    provenances = many(Provenance, 3, source=repeat("t.csv"), row=rows,
                       columns=repeat(("start",)))
    made = many(Record, 3, label=labels, span=[span, None, span], provenance=provenances,
                group=["North", None, "South"])
    expected = [Record(label, chosen, Provenance("t.csv", row, ("start",)), group=group)
                for label, chosen, row, group in zip(labels, [span, None, span], rows,
                                                     ["North", None, "South"])]
    assert made == expected
    assert [hash(r) for r in made] == [hash(r) for r in expected]
    assert [repr(r) for r in made] == [repr(r) for r in expected]
    assert made[0].fields == () and made[0].start_text == ""       # the defaults


def test_objects_stay_frozen():
    made = many(Provenance, 1, source=["t.csv"], row=[2])
    with pytest.raises(dataclasses.FrozenInstanceError):
        made[0].row = 3  # type: ignore[misc]


def test_wrong_columns_are_refused():
    with pytest.raises(TypeError, match="no field colour"):
        many(Provenance, 1, source=["t.csv"], row=[2], colour=["red"])
    with pytest.raises(TypeError, match="needs a column for its field 'row'"):
        many(Provenance, 1, source=["t.csv"])
    with pytest.raises(ValueError, match="holds 1 values, not 2"):
        many(Provenance, 2, source=repeat("t.csv"), row=[2])


def test_no_objects():
    assert many(Provenance, 0, source=[], row=[]) == []


def test_the_collector_is_paused_meanwhile_and_restored():
    assert gc.isenabled()
    with collection_paused():
        assert not gc.isenabled()
    assert gc.isenabled()
    gc.disable()
    try:
        with collection_paused():
            pass
        assert not gc.isenabled()         # it was off before: it stays off
    finally:
        gc.enable()
