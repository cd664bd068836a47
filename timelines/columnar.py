"""Records as columns: what a large table is from the reader to the packer.

A table of a million rows holds far fewer distinct dates than rows (a register repeats its
decades and years), and most commands need of each row only its dates, its group and its row
number. `RecordColumns` keeps a table's records that way: the distinct spans once
(`spans`, None for an undated row) and, per record, numpy arrays of its row number and of the
index of its span (`span_of`), beside plain lists of its texts. Counting, checking and lane
packing work on those arrays; a `Record` object is made only for a record something asks for
(one that is drawn, named in a warning, or iterated over), each once, so a record asked for
twice is the same object.

It is a `Sequence[Record]`: anything that takes records takes it, and gets the same Records,
in the same order, as a tuple of them would give.
"""
from __future__ import annotations

from collections.abc import Iterator, Sequence
from itertools import repeat
from typing import overload

import numpy as np

from .model import Provenance, Record, Span, many
from .spanarrays import DaySpans, SpanFacts, span_facts


class _Made:
    """The Record objects of a table made so far, shared by the table and its parts."""

    __slots__ = ("objects", "made", "facts")

    def __init__(self, count: int) -> None:
        self.objects = np.empty(count, dtype=object)
        self.made = np.zeros(count, dtype=bool)
        self.facts: SpanFacts | None = None          # of the distinct spans


class RecordColumns(Sequence):
    """The records of one table, as columns (module notes). `rows`, `span_of` and
    `positions` are numpy arrays of one value per record; the text columns are lists, or
    None where the table has no such column (the text is then "", the id, group and colour
    None); `fields` the other columns kept, as (name, texts) pairs. A part of a table
    (`take`) keeps the table's own distinct spans and Records."""

    __slots__ = ("source", "columns", "spans", "span_of", "rows", "labels", "start_texts",
                 "end_texts", "ids", "groups", "colors", "fields", "kind", "positions",
                 "_made", "_whole")

    def __init__(self, *, source: str, columns: tuple[str, ...], spans: Sequence[Span | None],
                 span_of: np.ndarray, rows: np.ndarray, labels: list[str],
                 start_texts: list[str] | None, end_texts: list[str] | None,
                 ids: list[str | None] | None, groups: list[str | None] | None,
                 colors: list[str | None] | None,
                 fields: tuple[tuple[str, list[str]], ...] = (), kind: str) -> None:
        count = len(rows)
        for name, column in (("span_of", span_of), ("labels", labels),
                             ("start_texts", start_texts), ("end_texts", end_texts),
                             ("ids", ids), ("groups", groups), ("colors", colors),
                             *fields):
            if column is not None and len(column) != count:
                raise ValueError(f"column {name} holds {len(column)} values, not {count}")
        self.source, self.columns, self.kind = source, columns, kind
        self.spans = spans if isinstance(spans, DaySpans) else tuple(spans)
        self.span_of = np.asarray(span_of, dtype=np.intp)
        self.rows = np.asarray(rows, dtype=np.int64)
        self.labels, self.start_texts, self.end_texts = labels, start_texts, end_texts
        self.ids, self.groups, self.colors, self.fields = ids, groups, colors, fields
        self.positions = np.arange(count)        # of each record in the whole table
        self._made = _Made(count)
        self._whole = True                       # positions are 0, 1, ... of the table

    # -- the Sequence ---------------------------------------------------------------------

    def __len__(self) -> int:
        return len(self.positions)

    @overload
    def __getitem__(self, index: int) -> Record: ...
    @overload
    def __getitem__(self, index: slice) -> list[Record]: ...

    def __getitem__(self, index):
        if isinstance(index, slice):
            return self.records(self.positions[index])
        position = self.positions[index]                 # IndexError as a list gives it
        return self.records(np.array([position]))[0]

    def __iter__(self) -> Iterator[Record]:
        return iter(self.records())

    def __eq__(self, other: object) -> bool:
        if isinstance(other, (RecordColumns, tuple)):
            return tuple(self) == tuple(other)
        if isinstance(other, list):
            return list(self) == other
        return NotImplemented

    __hash__ = None  # type: ignore[assignment]

    def __repr__(self) -> str:
        return f"<{len(self)} records of {self.source} as columns>"

    # -- parts and objects ----------------------------------------------------------------

    def take(self, indices: np.ndarray | Sequence[int]) -> "RecordColumns":
        """The records at `indices` (of this sequence), as columns, in that order."""
        return self.at(self.positions[np.asarray(indices, dtype=np.intp)])

    def at(self, positions: np.ndarray) -> "RecordColumns":
        """The records at `positions` of the whole table, as columns, in that order."""
        part = object.__new__(RecordColumns)
        for name in self.__slots__:
            setattr(part, name, getattr(self, name))
        part.positions = np.asarray(positions, dtype=np.intp)
        part._whole = False
        return part

    def same_table(self, other: object) -> bool:
        """Whether `other` is a part of the same table (it shares the spans and Records)."""
        return isinstance(other, RecordColumns) and other._made is self._made

    def records(self, positions: np.ndarray | None = None) -> list[Record]:
        """The Record objects at `positions` of the whole table (by default every one of
        this sequence), made where not made before."""
        positions = self.positions if positions is None else positions
        made = self._made
        missing = positions[~made.made[positions]]
        if len(missing):
            missing = np.sort(missing)            # each once (np.unique hashes: slower)
            missing = missing[np.concatenate(([True], missing[1:] != missing[:-1]))]
            made.objects[missing] = self._make(missing)
            made.made[missing] = True
        return made.objects[positions].tolist()

    def _make(self, positions: np.ndarray) -> list[Record]:
        count = len(positions)
        picked = positions.tolist()

        def pick(column: list | None, empty: object) -> object:
            return repeat(empty) if column is None else _picked(column, picked)

        rows = self.rows[positions].tolist()
        provenances = many(Provenance, count, source=repeat(self.source), row=rows,
                           columns=repeat(self.columns))
        spans = [self.spans[code] for code in self.span_of[positions].tolist()]
        return many(Record, count, label=pick(self.labels, ""), span=spans,
                    provenance=provenances, start_text=pick(self.start_texts, ""),
                    end_text=pick(self.end_texts, ""), id=pick(self.ids, None),
                    group=pick(self.groups, None), color=pick(self.colors, None),
                    fields=self._fields(picked), kind=repeat(self.kind))

    def _fields(self, picked: list[int]) -> object:
        """Each record's (name, text) pairs of the other columns."""
        if not self.fields:
            return repeat(())
        names = [name for name, _ in self.fields]
        values = zip(*(_picked(column, picked) for _, column in self.fields))
        return [tuple(zip(names, row)) for row in values]

    # -- columns of this sequence ---------------------------------------------------------

    def codes(self) -> np.ndarray:
        """The index of each record's span in `spans`."""
        return self.span_of[self.positions]

    def used_codes(self) -> np.ndarray:
        """The indices of the spans some record of this sequence has, in order (each once)."""
        return np.flatnonzero(np.bincount(self.codes(), minlength=len(self.spans)))

    def row_numbers(self) -> np.ndarray:
        return self.rows[self.positions]

    def column(self, name: str) -> list:
        """A text column of this sequence ("labels", "ids", "groups", ...); None values
        where the table has no such column."""
        values = getattr(self, name)
        if values is None:
            return [None] * len(self)
        if self._whole:
            return values
        return _picked(values, self.positions.tolist())

    def field(self, name: str) -> list[str | None]:
        """The texts of the other column `name` (one of `fields`) of this sequence; None
        values where the table has no such column."""
        for field_name, values in self.fields:
            if field_name == name:
                return values if self._whole else _picked(values, self.positions.tolist())
        return [None] * len(self)

    def dated(self) -> np.ndarray:
        """Which records have a span (a boolean array)."""
        return self.dated_spans()[self.codes()]

    def dated_spans(self) -> np.ndarray:
        return self.span_facts().dated

    def span_facts(self) -> SpanFacts:
        """The facts of each distinct span (`spanarrays.SpanFacts`), worked out once for the
        table and its parts."""
        if self._made.facts is None:
            self._made.facts = span_facts(self.spans)
        return self._made.facts

    def span_bounds(self) -> np.ndarray:
        """Each distinct span's earliest and latest start and end (the columns named at the
        top of `spanarrays`), in fixed days; NaN where a side has no bound or no date."""
        return self.span_facts().bounds

    def spans_at(self, codes: np.ndarray) -> Sequence[Span | None]:
        """The distinct spans at `codes`, in that order (kept as arrays where they are)."""
        if isinstance(self.spans, DaySpans):
            return self.spans.take(codes)
        return [self.spans[code] for code in codes.tolist()]

    def dated_part(self) -> "RecordColumns":
        """The records that have a span, as columns."""
        return self.take(np.flatnonzero(self.dated()))

    def undated_part(self) -> "RecordColumns":
        return self.take(np.flatnonzero(~self.dated()))


def _picked(values: list, positions: list[int]) -> list:
    """values[p] for each p."""
    return [values[p] for p in positions]
