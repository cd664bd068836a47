"""`timelines lanes`: how the records were grouped and packed, to read or to reuse.

- `summary_lines(placement, era)`: a table with one row per group (and subgroup): the
  records drawn, the lanes they take, the fewest lanes any packing could use (the most boxes
  that share one moment) and when that moment is, the labels left out of the picture;
- `record_rows(placement)`: one row per record, `row,id,group,lane,box_start,box_end` (with
  `subgroup` after `group` when there are subgroups): the lane counted from 1 within its
  group, as `--lane-column` reads it back, and the box the record occupies in fixed day
  numbers (R.D.), fractions allowed. Records with no lane (undated, or left out for lack of
  room) have an empty lane; undated ones an empty box too.
"""
from __future__ import annotations

import json
import re
from collections.abc import Callable, Iterable, Iterator
from dataclasses import dataclass
from itertools import chain, repeat
from operator import attrgetter
from typing import TextIO

import numpy as np

from ..calendar import gregorian_year_from_fixed, iso_from_fixed, year_text
from . import Density, GroupPlacement, LayoutNote, Placement, densest_moment
from .placed import PlacedColumns

RECORD_COLUMNS = ("row", "id", "group", "lane", "box_start", "box_end")
# A chart spanning less than this many days gives its moments as dates, not years.
SHORT_CHART_DAYS = 20 * 365
NOTES_PER_GROUP = 20


@dataclass(frozen=True, slots=True)
class GroupSummary:
    path: tuple[str, ...]       # group, or group and subgroup
    records: int                # drawn in its lanes
    lanes: int
    fewest: int                 # no packing of these boxes takes fewer lanes
    densest: Density | None     # None for a group whose subgroups hold the lanes
    labels_left_out: int        # kept in the tooltips only
    left_out: int               # records with no room within the lanes allowed
    merged: tuple[str, ...] = ()


def group_summaries(placement: Placement) -> list[GroupSummary]:
    rows: list[GroupSummary] = []
    for group in placement.groups:
        if not group.subgroups:
            rows.append(_leaf_summary((group.name,), group, placement.gap))
            continue
        leaves = [_leaf_summary((group.name, sub.name), sub, placement.gap)
                  for sub in group.subgroups]
        rows.append(GroupSummary((group.name,), sum(r.records for r in leaves), group.lanes,
                                 sum(r.fewest for r in leaves), None,
                                 sum(r.labels_left_out for r in leaves),
                                 sum(r.left_out for r in leaves), group.merged))
        rows += leaves
    return rows


def _leaf_summary(path: tuple[str, ...], group: GroupPlacement, gap: float) -> GroupSummary:
    placed = group.records
    if isinstance(placed, PlacedColumns):
        density = densest_moment(np.column_stack((placed.box_start, placed.box_end)), gap)
        hidden = sum(1 for side, label in zip(placed.sides, placed.records.column("labels"))
                     if side == "none" and label)
    else:
        density = densest_moment([(p.box_start, p.box_end) for p in placed], gap)
        hidden = sum(1 for p in placed if p.label_side == "none" and p.record.label)
    return GroupSummary(path, len(group.records), group.lanes, density.depth, density, hidden,
                        len(group.left_out), group.merged)


def summary_lines(placement: Placement, era: str = "bce") -> list[str]:
    """The table of groups, then a line for each merged group, then what the columns mean."""
    summaries = group_summaries(placement)
    in_days = placement.domain[1] - placement.domain[0] < SHORT_CHART_DAYS
    header = ("group", "records", "lanes", "fewest possible", "densest moment",
              "labels left out")
    rows = [(_group_cell(s), str(s.records), str(s.lanes), str(s.fewest),
             _densest_cell(s.densest, era, in_days), str(s.labels_left_out))
            for s in summaries]
    leaves = [s for s in summaries if s.densest is not None]
    rows.append(("all", str(sum(s.records for s in leaves)), str(placement.lanes),
                 str(sum(s.fewest for s in leaves)), "", str(sum(s.labels_left_out
                                                                 for s in leaves))))
    lines = _aligned([header, *rows], right=(1, 2, 3, 5))
    for s in summaries:
        where = _where(s.path)
        if s.merged:
            lines.append(f"{where} holds the small groups {', '.join(s.merged)}")
        if s.left_out and s.densest is not None:
            lines.append(f"{where}: {s.left_out} more not drawn for lack of room "
                         "(listed on stderr)")
    lines.append("fewest possible: no packing needs fewer lanes; it is the most boxes (bar, "
                 "marks, label beside) that share one moment, the densest moment")
    return lines


def _where(path: tuple[str, ...]) -> str:
    return " / ".join(repr(name) if name else "(none)" for name in path)


def _group_cell(summary: GroupSummary) -> str:
    name = summary.path[-1] or "(none)"
    return ("  " + name) if len(summary.path) > 1 else name


def _densest_cell(density: Density | None, era: str, in_days: bool) -> str:
    if density is None or density.depth == 0:
        return ""
    return (f"{period_text(density.start, density.end, era, in_days)}: "
            f"{density.depth} at once")


def period_text(start: float, end: float, era: str = "bce", in_days: bool = False) -> str:
    """A stretch of fixed days as a reader says it: years, or ISO dates `in_days` (for a
    chart spanning a few years, where a year says too little)."""
    if in_days:
        first, last = iso_from_fixed(int(start // 1)), iso_from_fixed(int(end // 1))
    else:
        first = year_text(gregorian_year_from_fixed(int(start // 1)), era)
        last = year_text(gregorian_year_from_fixed(int(end // 1)), era)
    return first if first == last else f"{first}–{last}"


def _aligned(rows: list[tuple[str, ...]], right: tuple[int, ...]) -> list[str]:
    widths = [max(len(row[i]) for row in rows) for i in range(len(rows[0]))]
    return ["  ".join(cell.rjust(widths[i]) if i in right else cell.ljust(widths[i])
                      for i, cell in enumerate(row)).rstrip() for row in rows]


def note_lines(notes: Iterable[LayoutNote], era: str = "bce",
               most: int = NOTES_PER_GROUP) -> list[str]:
    """A line for each note, at most `most` records left out of each group and then one line
    saying how many more: a tight --max-lanes can leave out thousands."""
    lines: list[str] = []
    shown: dict[tuple[str, ...], int] = {}
    for note in notes:
        if note.kind == "left out":
            shown[note.path] = shown.get(note.path, 0) + 1
            if shown[note.path] > most:
                continue
        lines.append(note_line(note, era))
    for path, count in shown.items():
        if count > most:
            lines.append(f"... and {count - most} more not drawn in {_where(path)} "
                         "('timelines lanes --format csv' lists every record, with an empty "
                         "lane)")
    return lines


def note_line(note: LayoutNote, era: str = "bce") -> str:
    """One stderr line for a layout note, as problems are printed: `file:row: [id] ...`."""
    record = note.record
    who = f" [{record.id}]" if record.id else ""
    when = period_text(*note.box, era, in_days=note.box[1] - note.box[0] < SHORT_CHART_DAYS)
    if note.kind == "left out":
        return f"{record.provenance}:{who} not drawn: {note.reason} ({when})"
    return f"{record.provenance}:{who} warning: {note.reason}"


def record_columns(placement: Placement) -> tuple[str, ...]:
    if any(group.subgroups for group in placement.groups):
        return ("row", "id", "group", "subgroup", "lane", "box_start", "box_end")
    return RECORD_COLUMNS


def record_rows(placement: Placement) -> list[dict[str, object]]:
    """One dict per record: the placed ones by group, lane and box, then those with no lane."""
    columns = record_columns(placement)
    return [dict(zip(columns, row)) for row in record_tuples(placement)]


def record_tuples(placement: Placement, days: Callable[[np.ndarray], list] | None = None
                  ) -> Iterator[tuple]:
    """The record rows as tuples in the order of `record_columns`; None where empty. `days`
    gives box bounds as written (by default numbers, rounded to a milliday)."""
    days = days or day_numbers
    placed = (zip(*columns) for columns in _placed_columns(placement, days))
    return chain(chain.from_iterable(placed), _unplaced_rows(placement, days))


def _placed_columns(placement: Placement, days: Callable[[np.ndarray], list]
                    ) -> Iterator[list[Iterable]]:
    """The rows of each group's placed records, as columns."""
    nested = "subgroup" in record_columns(placement)
    for path, group in placement.leaves():
        yield _group_columns(group, path if nested else path[:1], days)


def _unplaced_rows(placement: Placement, days: Callable[[np.ndarray], list]) -> Iterator[tuple]:
    """The rows of the records left out for lack of room, then of the undated ones."""
    nested = "subgroup" in record_columns(placement)
    left_out = [note for note in placement.notes if note.kind == "left out"]
    bounds = days(np.array([note.box for note in left_out], dtype=float).reshape(-1))
    for note, start, end in zip(left_out, bounds[0::2], bounds[1::2]):
        yield (note.record.provenance.row, note.record.id or "",
               *(note.path if nested else note.path[:1]), None, start, end)
    for record in placement.undated:
        yield (record.provenance.row, record.id or "",
               *((record.group or "", "") if nested else (record.group or "",)),
               None, None, None)


def _group_columns(group: GroupPlacement, names: tuple[str, ...],
                   days: Callable[[np.ndarray], list]) -> list[Iterable]:
    """A group's placed records by lane, then box start (ties in their order), column by
    column: a group may hold a hundred thousand records."""
    count = len(group.records)
    if isinstance(group.records, PlacedColumns):
        return _columns_of_columns(group.records, names, days)
    lanes = np.fromiter(map(_LANE, group.records), dtype=np.int64, count=count)
    starts = np.fromiter(map(_BOX_START, group.records), dtype=float, count=count)
    order = np.lexsort((starts, lanes))     # lexsort is stable
    placed = [group.records[index] for index in order.tolist()]
    ends = np.fromiter(map(_BOX_END, placed), dtype=float, count=count)
    records = list(map(_RECORD, placed))
    ids = [identifier or "" for identifier in map(_ID, records)]
    return [list(map(_ROW, map(_PROVENANCE, records))), ids,
            *([name] * count for name in names), (lanes[order] + 1).tolist(),
            days(starts[order]), days(ends)]


def _columns_of_columns(placed: PlacedColumns, names: tuple[str, ...],
                        days: Callable[[np.ndarray], list]) -> list[Iterable]:
    """_group_columns of a group placed as columns: read from its arrays."""
    order = np.lexsort((placed.box_start, placed.lanes))
    records = placed.records.take(order)
    ids = [identifier or "" for identifier in records.column("ids")]
    return [records.row_numbers().tolist(), ids, *([name] * len(order) for name in names),
            (placed.lanes[order] + 1).tolist(), days(placed.box_start[order]),
            days(placed.box_end[order])]


_LANE, _BOX_START, _BOX_END = attrgetter("lane"), attrgetter("box_start"), attrgetter("box_end")
_RECORD, _ID, _PROVENANCE, _ROW = (attrgetter("record"), attrgetter("id"),
                                   attrgetter("provenance"), attrgetter("row"))


def day_numbers(days: np.ndarray) -> list[int | float]:
    """Box bounds as numbers: millidays are finer than anything drawn, and rounding keeps
    the output byte-stable; whole days as integers."""
    return [int(rounded) if rounded.is_integer() else rounded
            for rounded in (round(day, 3) for day in days.tolist())]


def day_texts(days: np.ndarray) -> list[str]:
    """`str()` of each of `day_numbers(days)`, made faster for the CSV: three decimals with
    the trailing zeros dropped. Both round each float's exact binary value to the nearest
    milliday (tests/test_lanes_cli.py checks they agree)."""
    days = np.where(np.abs(days) < 0.0005, 0.0, days)      # rounds to 0, never to "-0"
    fixed = map("%.3f".__mod__, days.tolist())
    return list(map(str.rstrip, map(str.rstrip, fixed, repeat("0")), repeat(".")))


def write_csv(placement: Placement, stream: TextIO) -> None:
    """The record rows as CSV (RFC 4180 quoting; a field with a comma, a quote or a line
    break is quoted). The placed records' rows are joined column by column: a register of
    200,000 rows took longer to hand to the csv module, row by row, than to lay out.

    A cell of the table's own text (id, group) that a spreadsheet would run as a formula
    (it begins with =, +, -, @, a tab or a carriage return) is written with a single quote
    before it, as OWASP's advice on CSV injection has it; numbers are ours and left alone."""
    names = record_columns(placement)
    stream.write(",".join(names) + "\n")
    table_text = range(1, len(names) - 3)     # id and group names: between row and lane
    for columns in _placed_columns(placement, day_texts):
        if columns[0]:
            texts = [_csv_fields(column, place in table_text)
                     for place, column in enumerate(columns)]
            stream.write("\n".join(map(",".join, zip(*texts))) + "\n")
    for row in _unplaced_rows(placement, day_texts):   # a few rows: one at a time
        stream.write(",".join(_csv_field(cell, place in table_text)
                              for place, cell in enumerate(row)) + "\n")


_CSV_SPECIAL = re.compile(r'[,"\r\n]')
# What a spreadsheet reads as the start of a formula (OWASP, "CSV Injection").
_FORMULA_STARTS = frozenset("=+-@\t\r")
_FORMULA_LINE = re.compile(r"^[=+\-@\t\r]", re.MULTILINE)


def _csv_fields(column: list, table_text: bool = False) -> list[str]:
    """Each cell of a column as a CSV field: numbers as str() writes them, text quoted when
    it holds a comma, a quote or a line break (a quote inside doubled); `table_text`: the
    table's own text, kept from being run as a formula."""
    if not column or type(column[0]) is not str:
        return list(map(str, column))
    # A cell beginning as a formula begins a line of the column joined by line breaks (so do
    # the lines of a cell holding a break: the cell by cell path below sorts those out).
    risky = table_text and _FORMULA_LINE.search("\n".join(column)) is not None
    if not risky and not _CSV_SPECIAL.search("".join(column)):
        return column                       # the usual case: nothing to quote
    return [_csv_field(cell, table_text) for cell in column]


def _csv_field(cell: object, table_text: bool = False) -> str:
    """One cell as a CSV field (see _csv_fields); None is an empty cell."""
    if cell is None:
        return ""
    if type(cell) is not str:
        return str(cell)
    if table_text and cell[:1] in _FORMULA_STARTS:
        cell = "'" + cell
    if not _CSV_SPECIAL.search(cell):
        return cell
    doubled = cell.replace('"', '""')
    return f'"{doubled}"'


def write_json(placement: Placement, stream: TextIO) -> None:
    """A JSON array of the record rows, one object a line."""
    rows = record_rows(placement)
    stream.write("[\n" + ",\n".join(json.dumps(row, ensure_ascii=False) for row in rows)
                 + ("\n]\n" if rows else "]\n"))
