"""Many frozen slot dataclass objects at once, made from columns of their field values.

A table of 200,000 rows becomes 200,000 Records, Provenances and placed records. Calling a
frozen dataclass's `__init__` for each costs a Python call and an `object.__setattr__` per
field; here each field is set for all objects in one C-level loop over the column, through
the slot's own descriptor (which a frozen dataclass does not guard). For speed alone.

Only for classes whose `__init__` does nothing but store its arguments, or for values the
caller has already checked: `__post_init__` does not run. What comes out equals, hashes and
prints like the same objects made the ordinary way (tests/test_bulk.py checks it).
"""
from __future__ import annotations

import gc
from collections import deque
from collections.abc import Iterable, Iterator
from contextlib import contextmanager
from dataclasses import MISSING, fields
from itertools import repeat
from typing import TypeVar

T = TypeVar("T")

_CONSUME = deque(maxlen=0).extend   # runs a map for its effects, keeping nothing


def many(cls: type[T], count: int, **columns: Iterable[object]) -> list[T]:
    """`count` objects of the slot dataclass `cls`; field `name` of the i-th object is the
    i-th value of `columns[name]`, or the field's default when no column is given.

    Each column must hold at least `count` values (`itertools.repeat(value)` for one value
    shared by all). A field without a default must be given."""
    unknown = set(columns) - {field.name for field in fields(cls)}
    if unknown:
        raise TypeError(f"{cls.__name__} has no field {', '.join(sorted(unknown))}")
    setters = []
    for field in fields(cls):
        if field.name in columns:
            values = columns[field.name]
        elif field.default is not MISSING:
            values = repeat(field.default)
        elif field.default_factory is not MISSING:
            values = (field.default_factory() for _ in range(count))
        else:
            raise TypeError(f"{cls.__name__} needs a column for its field {field.name!r}")
        if hasattr(values, "__len__") and len(values) < count:
            raise ValueError(f"column {field.name!r} holds {len(values)} values, not {count}")
        setters.append((getattr(cls, field.name).__set__, values))
    with collection_paused():
        objects = list(map(object.__new__, repeat(cls, count)))
        for setter, values in setters:
            _CONSUME(map(setter, objects, values))
    return objects


@contextmanager
def collection_paused() -> Iterator[None]:
    """The cyclic garbage collector paused meanwhile, as it was afterwards.

    Reading a table makes a million objects that hold no cycles while a million cells are
    alive: the collector, set off by the allocations, would walk them all again and again
    for nothing (a third of the time of a large load). Reference counting frees as usual."""
    paused = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if paused:
            gc.enable()
