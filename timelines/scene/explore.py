"""What the HTML explorer draws, as plain data: the same placement and drawn bounds as the
static chart, in days rather than page px, so the browser can zoom and filter them.

`explore_data` takes what `compose` takes (placement, scale, theme, a record's colour) and
gives `ExploreData`: one column per field, one row per record drawn, in lane order. The
drawn bounds are `bars.drawn_spans`'s (the stub of an unknown end included), so the explorer's
bars cover the same days as the SVG's. `render/html.py` writes it as JSON.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import lru_cache
from operator import attrgetter
from typing import Callable

import numpy as np

from ..calendar import reform_day
from ..layout import Placement
from ..model import Qualifier, Record, Span
from ..spanarrays import distinct_spans
from .bars import drawn_spans, stub_days, tooltip
from .compose import ChartText, describe
from .scale import TimeScale
from .theme import Theme

# Qualifiers the explorer filters by, in the order of its checkboxes.
FILTERED_QUALIFIERS = ("approximate", "uncertain", "open", "before", "after", "unknown",
                       "convention_dependent", "one_of")


@dataclass(frozen=True, slots=True)
class ExploreData:
    title: str
    description: str
    domain: tuple[float, float]                 # fixed days of the static chart's axis
    origin: int                                 # the day the columns' days count from
    sources: tuple[tuple[str, str], ...]        # (file, columns) of `sourceOf`
    era: str                                    # year labels: bce, bc, astronomical, bp
    calendar: str                               # gregorian, julian or historical
    reform: int | None                          # the historical calendar's first Gregorian day
    groups: tuple[tuple[str, int, int], ...]    # (name, first lane, lanes), top to bottom
    colors: tuple[tuple[str, str], ...]         # the colour key: (value, #rrggbb)
    color_title: str
    columns: dict = field(default_factory=dict)  # name -> one value per record
    explanations: dict = field(default_factory=dict)   # written date -> explain lines
    undated: tuple[str, ...] = ()               # "label (row n)" of the rows not drawn
    lane_height: float = 22.0
    bar_height: float = 12.0
    font_family: str = "DejaVu Sans"


def explore_data(placement: Placement, scale: TimeScale, theme: Theme,
                 color_of: Callable[[Record], str], colors: tuple[tuple[str, str], ...],
                 text: ChartText, *, explain: Callable[[str], list[str]] | None = None
                 ) -> ExploreData:
    """The explorer's data of a placement: each drawn record, its lane, its drawn bounds;
    the title and the description (the SVG's <desc>) from `text`."""
    groups, placed = [], []
    lane = 0
    for path, group in placement.leaves():
        groups.append((" / ".join(name for name in path if name), lane, group.lanes))
        placed += [(lane + p.lane, p) for p in group.records]
        lane += group.lanes
    records = [p.record for _, p in placed]
    spans, place = distinct_spans(map(_SPAN, records))
    codes = [place[id(record.span)] for record in records]
    drawn = drawn_spans(spans, (scale.start, scale.end), stub_days(scale, theme))
    color_index = {value: index for index, (value, _) in enumerate(colors)}
    # Days are written from the axis's first whole day: shorter numbers, a smaller page.
    origin = math.floor(scale.start)
    # What depends on the span alone is worked out once per distinct span (records read
    # from one table share them: a register of a million rows holds some 30,000).
    per_span = [(_drawn(row, _bounds(span), origin), _steps(_bounds(span), origin),
                 _qualifier_bits(span), int(span.is_point), int(opens), int(core))
                for span, row, opens, core in zip(
                    spans, zip(drawn.start_low.tolist(), drawn.start_high.tolist(),
                               drawn.end_low.tolist(), drawn.end_high.tolist()),
                    (drawn.open_start.astype(int) + 2 * drawn.open_end.astype(int)).tolist(),
                    drawn.has_core.tolist())]
    of_record = [per_span[code] for code in codes]
    lanes = [lane_number for lane_number, _ in placed]
    sources: dict[tuple[str, str], int] = {}
    columns = {
        "label": [r.label for r in records],
        "id": [r.id or "" for r in records] if any(r.id for r in records) else [],
        "group": _groups_of(lanes, groups),
        "lane": lanes,
        "colorValue": [color_index.get(r.color, -1) for r in records] if colors else [],
        "point": [values[3] or int(r.is_event) for r, values in zip(records, of_record)],
        "drawn": [day for values in of_record for day in values[0]],
        "open": [values[4] for values in of_record],
        "core": [values[5] for values in of_record],
        "bounds": [step for values in of_record for step in values[1]],
        "qualifiers": [values[2] for values in of_record],
        "start": [r.start_text for r in records],
        # null: the start's own cell (a when column, or the same text); "": an empty cell.
        "end": [None if r.end_text == r.start_text and r.start_text else r.end_text
                for r in records],
        "details": [tooltip(r) for r in records] if len(records) <= _MOST_EXPLAINED else [],
        "row": [r.provenance.row for r in records],
        "sourceOf": [sources.setdefault((r.provenance.source, ", ".join(r.provenance.columns)),
                                        len(sources)) for r in records],
    }
    fills = [color_of(r) for r in records]
    palette = sorted(set(fills))
    where = {color: index for index, color in enumerate(palette)}
    columns["palette"] = palette
    columns["fill"] = [where[fill] for fill in fills]
    texts = sorted({text for r in records for text in (r.start_text, r.end_text) if text})
    explanations = {text: explain(text) for text in texts[:_MOST_EXPLAINED]} if explain else {}
    reckoning = theme.calendar
    base = reckoning.split(":")[0]
    return ExploreData(
        title=text.title or "Timeline", description=describe(placement, scale, theme, text),
        domain=(scale.start, scale.end), origin=origin, sources=tuple(sources), era=theme.era,
        calendar=base, reform=reform_day(reckoning) if base == "historical" else None,
        groups=tuple(groups), colors=colors, color_title=text.color_title, columns=columns,
        explanations=explanations,
        undated=tuple(f"{r.label} (row {r.provenance.row})" for r in text.undated),
        lane_height=theme.lane_height, bar_height=theme.bar_height)


# Each distinct written date gets its `parse --explain` lines, and each record the static
# chart's tooltip, up to this many: a catalogue of 100,000 records would otherwise carry
# megabytes of them and take seconds to write; the explorer writes the bounds itself beyond.
_MOST_EXPLAINED = 20_000


def _groups_of(lanes: list[int], groups: list[tuple[str, int, int]]) -> list[int]:
    """The group of each lane number: the one whose lanes hold it (the last, past them)."""
    if not groups:
        return [-1] * len(lanes)
    numbers = np.asarray(lanes, dtype=np.int64)
    firsts = np.array([first for _, first, _ in groups], dtype=np.int64)
    counts = np.array([count for _, _, count in groups], dtype=np.int64)
    found = np.searchsorted(firsts, numbers, side="right") - 1    # the last to begin by it
    held = (found >= 0) & (numbers < firsts[found] + counts[found])
    return np.where(held, found, len(groups) - 1).tolist()


def _drawn(row, bounds: list[int | None], origin: int) -> list[float | int]:
    """A span's drawn bounds, each from its own bound (from `origin` where it has none)."""
    return [_compact(day - (origin if bound is None else bound))
            for day, bound in zip(row, bounds)]


def _steps(days, origin: int) -> list[float | int | None]:
    """Four days as steps: the first from `origin`, each other from the last one known
    before it (None stays None). Short numbers: the page of 100,000 records is megabytes
    smaller. Days to a thousandth (a stub may end inside a day), whole ones without `.0`."""
    steps, last = [], origin
    for day in days:
        if day is None:
            steps.append(None)
            continue
        steps.append(_compact(day - last))
        last = day
    return steps


def _compact(day: float) -> float | int:
    step = round(day, 3)
    return int(step) if step == int(step) else step


def _bounds(span: Span) -> list[int | None]:
    return [span.start.earliest, span.start.latest, span.end.earliest, span.end.latest]


_BITS = {
    "approximate": (Qualifier.APPROXIMATE,),
    "uncertain": (Qualifier.UNCERTAIN,),
    "open": (Qualifier.OPEN_START, Qualifier.OPEN_END),
    "before": (Qualifier.BEFORE,),
    "after": (Qualifier.AFTER,),
    "unknown": (Qualifier.UNKNOWN_START, Qualifier.UNKNOWN_END),
    "convention_dependent": (Qualifier.CONVENTION_DEPENDENT,),
    "one_of": (Qualifier.ONE_OF,),
}


def _qualifier_bits(span: Span) -> int:
    """The span's qualifiers as bits, in the order of FILTERED_QUALIFIERS."""
    return _bits_of(span.start.qualifiers | span.end.qualifiers)


@lru_cache(maxsize=1024)
def _bits_of(found: frozenset[Qualifier]) -> int:
    # few distinct sets of qualifiers occur: each worked out once (speed alone)
    return sum(1 << index for index, name in enumerate(FILTERED_QUALIFIERS)
               if any(q in found for q in _BITS[name]))


_SPAN = attrgetter("span")
