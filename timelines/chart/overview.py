"""A table too large to read lane by lane: the overview of all of it, the lanes of a part.

From OVERVIEW_FROM dated records on (or always, or never: the overview setting), `render`
draws per group the counts of records possibly and certainly active per block, with the
expected count (`analysis.activity`: the aoristic sum of events, the summed probability of
spans), on an axis of the whole time, and beneath it the lanes of a part the user chooses:
the records in the --from/--to window, those whose column has a value (`where`, written
COLUMN=VALUE), and at most the first `first` of them by start (FIRST_SHOWN when no part is
chosen, or when the part is itself too large): those whose dates bound both ends first and,
of a window, those whose start lies in it, so that the lanes show whole bars. A table kept as
columns is counted and chosen from on its arrays; Records are made for the lanes alone.

OVERVIEW_FROM is 5,000: at about five records a lane, a thousand lanes, some 22,000 px, more
than twenty screens of a laptop's browser window, where a reader no longer follows a group
from lane to lane (common practice, no source; the explorer, -o chart.html, shows any number).
"""
from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import dataclass

import numpy as np

from ..columnar import RecordColumns
from ..errors import UsageError, did_you_mean
from ..model import Record
from ..sources.fields import ColumnReader
from ..spanarrays import (
    EARLIEST_END, EARLIEST_START, LATEST_END, LATEST_START, SpanFacts, span_facts,
)
from ..scene.overview import Overview
from .activity import activity_series

OVERVIEW_FROM = 5_000
FIRST_SHOWN = 50
OVERVIEW_CHOICES = ("auto", "yes", "no")


@dataclass(frozen=True, slots=True)
class Part:
    records: list[Record]       # the records of the lanes (and the undated, as always)
    overview: Overview
    summarised: int             # dated records only in the overview


def wanted(dated: int, setting: str) -> bool:
    """Whether the overview is drawn for `dated` records under the overview setting."""
    if setting not in OVERVIEW_CHOICES:
        raise UsageError(f"--overview is one of {', '.join(OVERVIEW_CHOICES)}, not {setting!r}")
    return setting == "yes" or setting == "auto" and dated >= OVERVIEW_FROM


def choose_part(records: Sequence[Record], kept: Sequence[Record], window, where: str | None,
                first: int | None, read_column: Callable[[str], ColumnReader],
                era: str = "bce", calendar: str = "historical") -> Part:
    """The overview of the dated `records`, and the part of `kept` (the window's) in lanes.
    A table kept as columns is summarised and chosen from on its arrays: Records are made
    for the part drawn alone."""
    dated = _dated(records)
    chosen, how = _chosen(_dated(kept), window, where, first, read_column)
    lows, highs, _ = _extents(_facts(dated))
    first_day, last_day = float(lows.min()), float(highs.max())     # the whole time, once
    per = _block((last_day - first_day) / 365.2425)
    series = _in_group_order(activity_series(_activity(dated, per, era, calendar)), dated)
    note = (f"{len(dated):,} dated records, too many to read lane by lane: the strips count "
            f"them per {per}, by group. The lanes below show {len(chosen):,} of them: "
            f"{'; '.join(how)}. Every record is in an explorer written with -o chart.html; "
            "--overview no draws all lanes.")
    chosen = list(chosen)
    one_kind = len({s.name.split(": ", 1)[0] for s in series}) == 1
    overview = Overview(tuple(_named(s, one_kind) for s in series), first_day, last_day,
                        _shown(chosen, window) if chosen else None, note)
    return Part(_undated(kept) + chosen, overview, len(dated) - len(chosen))


def _chosen(chosen: Sequence[Record], window, where: str | None, first: int | None,
            read_column: Callable[[str], ColumnReader]) -> tuple[Sequence[Record], list[str]]:
    """The dated records of the window's part that the lanes show, and how they were chosen
    (for the note)."""
    how = []
    if window is not None:
        how.append(f"those from {window.start_text or 'the start'} to "
                   f"{window.end_text or 'the end'} (--from/--to)")
    if where:
        column, value = _where(where)
        texts = read_column(column).texts(chosen)
        matching = [index for index, text in enumerate(texts) if (text or "").strip() == value]
        if not matching:
            raise _nothing_matches(column, value, texts, window)
        chosen = _taken(chosen, matching)
        how.append(f"those with {column} = {value}")
    limit = first if first is not None else FIRST_SHOWN
    cut = len(chosen) > limit
    if cut:
        facts = _facts(chosen)
        low, _, bounded = _extents(facts)
        # Of a window, those surely beginning in it first: whole bars, not ends reaching in
        # from before it, nor starts that may lie anywhere in a century.
        inside = _begin_in(facts, window)
        order = np.lexsort((_rows(chosen), low, ~inside, ~bounded))[:limit]     # stable
        chosen = _taken(chosen, order.tolist())
    if cut or first is not None:
        how.append(f"the first {limit:,} by start, those with both ends bounded first"
                   + (" and, of them, those surely beginning in the window" if window is not None
                      else ""))
    return chosen, how


def _nothing_matches(column: str, value: str, texts: list, window) -> UsageError:
    """The error of a --where that no record answers, with the values there are."""
    where = " in --from/--to" if window is not None else ""
    values = sorted({(text or "").strip() for text in texts} - {""})
    hint = did_you_mean(value, values) or (
        f"{column} holds {', '.join(map(repr, values[:8]))}"
        f"{f' and {len(values) - 8:,} more values' if len(values) > 8 else ''}" if values
        else f"{column} is empty in every dated record{where}")
    return UsageError(f"--where {column}={value}: no dated record{where} has {column} = "
                      f"{value!r}", hint=hint)


def _in_group_order(series, dated: Sequence[Record]) -> list:
    """The strips in the order the groups first appear, as the lanes take them."""
    groups = (dated.column("groups") if isinstance(dated, RecordColumns)
              else [r.group for r in dated])
    order = {group: place for place, group in enumerate(dict.fromkeys(groups))}
    return sorted(series, key=lambda s: order.get(_group_name(s), len(order)))


def _rows(records: Sequence[Record]) -> np.ndarray:
    if isinstance(records, RecordColumns):
        return records.row_numbers()
    return np.array([record.provenance.row for record in records], dtype=np.int64)


def _undated(records: Sequence[Record]) -> list[Record]:
    if isinstance(records, RecordColumns):
        return list(records.undated_part())
    return [r for r in records if r.span is None]


def _dated(records: Sequence[Record]) -> Sequence[Record]:
    if isinstance(records, RecordColumns):
        return records.dated_part()
    return [r for r in records if r.span is not None]


def _taken(records: Sequence[Record], indices: list[int]) -> Sequence[Record]:
    if isinstance(records, RecordColumns):
        return records.take(np.array(indices, dtype=np.intp))
    return [records[index] for index in indices]


def _begin_in(facts: SpanFacts, window) -> np.ndarray:
    """Which records surely begin in the window: their start's window lies inside it."""
    bounds = facts.bounds
    inside = np.ones(len(bounds), dtype=bool)
    if window is not None and window.start is not None:
        inside &= bounds[:, EARLIEST_START] >= window.start          # NaN compares False
    if window is not None and window.end is not None:
        inside &= bounds[:, LATEST_START] <= window.end
    return inside if window is not None else np.zeros(len(bounds), dtype=bool)


def _facts(dated: Sequence[Record]) -> SpanFacts:
    """The span facts of each dated record."""
    if isinstance(dated, RecordColumns):
        return dated.span_facts().take(dated.codes())
    return span_facts([record.span for record in dated])


def _extents(facts: SpanFacts) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Each dated record's (given by its span's facts) first and last day known (its
    earliest bound, or the next one known; its latest, or the one before) and whether its
    dates bound both ends (an end cell left empty could lie anywhere: in a chosen decade
    such a record is drawn as a stub far outside it, which says little, so the part takes
    the bounded first)."""
    bounds = facts.bounds
    low, high = bounds[:, LATEST_END].copy(), bounds[:, EARLIEST_START].copy()
    for column in (EARLIEST_END, LATEST_START, EARLIEST_START):       # the first known wins
        low = np.where(np.isnan(bounds[:, column]), low, bounds[:, column])
    for column in (LATEST_START, EARLIEST_END, LATEST_END):
        high = np.where(np.isnan(bounds[:, column]), high, bounds[:, column])
    bounded = ((~np.isnan(bounds[:, EARLIEST_START]) | facts.open_start)
               & (~np.isnan(bounds[:, LATEST_END]) | facts.open_end))
    return low, high, bounded


def _where(text: str) -> tuple[str, str]:
    column, equals, value = text.partition("=")
    if not equals or not column.strip():
        raise UsageError(f"--where is written COLUMN=VALUE, not {text!r}",
                         hint="for example --where fonds=Harbour Board")
    return column.strip(), value.strip()


def _activity(dated: list[Record], per: str, era: str, calendar: str):
    from ..analysis.activity import activity      # pandas: loaded only for an overview
    grouped = any(dated.column("groups") if isinstance(dated, RecordColumns)
                  else (r.group for r in dated))
    return activity(dated, per=per, group="group" if grouped else None, era=era,
                    calendar=calendar.split(":")[0] if calendar.startswith("historical")
                    else calendar)


def _group_name(series) -> str | None:
    return series.name.split(": ", 1)[1] if ": " in series.name else None


def _named(series, one_kind: bool):
    """A strip's caption: the group alone when the records are of one kind, events or spans
    (the legend says how they are counted); kind and group when both kinds are there."""
    name = series.name
    if one_kind and ": " in name:
        name = name.split(": ", 1)[1]
    return type(series)(name, "", series.starts, series.ends, series.certain,
                        series.possible, series.expected, series.low, series.high)


def _block(years: float) -> str:
    """About a hundred blocks across `years`: year, decade, century, millennium."""
    for block, size in (("year", 1), ("decade", 10), ("century", 100)):
        if years <= 150 * size:
            return block
    return "millennium"


def _shown(records: list[Record], window) -> tuple[float, float]:
    """The days the lanes' axis shows: the window's sides (the last day whole), the
    records' first and last days where it has none."""
    low, high, _ = _extents(_facts(records))
    first, last = float(low.min()), float(high.max()) + 1
    if window is None:
        return first, last
    return (first if window.start is None else float(window.start),
            last if window.end is None else float(window.end) + 1)
