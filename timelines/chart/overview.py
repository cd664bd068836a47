"""A table too large to read lane by lane: the overview of all of it, the lanes of a part.

From OVERVIEW_FROM dated records on (or always, or never: the overview setting), `render`
draws per group the counts of records possibly and certainly active per block, with the
expected count (`analysis.activity`: the aoristic sum of events, the summed probability of
spans), on an axis of the whole time, and beneath it the lanes of a part the user chooses:
the records in the --from/--to window, those whose column has a value (`where`, written
COLUMN=VALUE), and at most the first `first` of them by start (FIRST_SHOWN when no part is
chosen, or when the part is itself too large).

OVERVIEW_FROM is 5,000: at about five records a lane, a thousand lanes, some 22,000 px, more
than twenty screens of a laptop's browser window, where a reader no longer follows a group
from lane to lane (common practice, no source; the explorer, -o chart.html, shows any number).
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

from ..errors import UsageError
from ..model import Record
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


def choose_part(records: list[Record], kept: list[Record], window, where: str | None,
                first: int | None, read_column: Callable[[str], Callable[[Record], str | None]],
                era: str = "bce", calendar: str = "historical") -> Part:
    """The overview of the dated `records`, and the part of `kept` (the window's) in lanes."""
    dated = [r for r in records if r.span is not None]
    chosen = [r for r in kept if r.span is not None]
    how = []
    if window is not None:
        how.append(f"those from {window.start_text or 'the start'} to "
                   f"{window.end_text or 'the end'} (--from/--to)")
    if where:
        column, value = _where(where)
        value_of = read_column(column)
        chosen = [r for r in chosen if (value_of(r) or "").strip() == value]
        how.append(f"those with {column} = {value}")
    limit = first if first is not None else FIRST_SHOWN
    if len(chosen) > limit or first is not None:
        if len(chosen) > limit:
            chosen = sorted(chosen, key=_start)[:limit]
        how.append(f"the first {limit:,} by start, those with both ends bounded first")
    undated = [r for r in kept if r.span is None]
    first, last = min(map(_low, dated)), max(map(_high, dated))    # the whole time, once
    per = _block((last - first) / 365.2425)
    table = _activity(dated, per, era, calendar)
    note = (f"{len(dated):,} dated records, too many to read lane by lane: the strips count "
            f"them per {per}, by group. The lanes below show {len(chosen):,} of them: "
            f"{'; '.join(how)}. Every record is in an explorer written with -o chart.html; "
            "--overview no draws all lanes.")
    shown = _window_days(chosen) if chosen else None
    # The strips in the order the groups first appear, as the lanes take them.
    order = {group: place for place, group in enumerate(dict.fromkeys(r.group for r in dated))}
    series = sorted(activity_series(table), key=lambda s: order.get(_group_name(s), len(order)))
    overview = Overview(tuple(_named(s) for s in series),
                        first, last, shown, note)
    return Part(undated + chosen, overview, len(dated) - len(chosen))


def _where(text: str) -> tuple[str, str]:
    column, equals, value = text.partition("=")
    if not equals or not column.strip():
        raise UsageError(f"--where is written COLUMN=VALUE, not {text!r}",
                         hint="for example --where fonds=Harbour Board")
    return column.strip(), value.strip()


def _activity(dated: list[Record], per: str, era: str, calendar: str):
    from ..analysis.activity import activity      # pandas: loaded only for an overview
    grouped = any(r.group for r in dated)
    return activity(dated, per=per, group="group" if grouped else None, era=era,
                    calendar=calendar.split(":")[0] if calendar.startswith("historical")
                    else calendar)


def _group_name(series) -> str | None:
    return series.name.split(": ", 1)[1] if ": " in series.name else None


def _named(series):
    """A strip's caption: the group alone (the legend says how records are counted)."""
    name = series.name
    if name.startswith("spans: "):
        name = name[len("spans: "):]
    return type(series)(name, "", series.starts, series.ends, series.certain,
                        series.possible, series.expected, series.low, series.high)


def _block(years: float) -> str:
    """About a hundred blocks across `years`: year, decade, century, millennium."""
    for block, size in (("year", 1), ("decade", 10), ("century", 100)):
        if years <= 150 * size:
            return block
    return "millennium"


def _low(record: Record) -> float:
    start = record.span.start
    return next(d for d in (start.earliest, start.latest, record.span.end.earliest,
                            record.span.end.latest) if d is not None)


def _high(record: Record) -> float:
    end = record.span.end
    return next(d for d in (end.latest, end.earliest, record.span.start.latest,
                            record.span.start.earliest) if d is not None)


def _start(record: Record) -> tuple[bool, float, int]:
    """The order the part is chosen in: records whose dates bound both ends first (an empty
    end cell could lie anywhere: in a chosen decade such a record is drawn as a stub far
    outside it, which says little), then by start, then by row."""
    return not _bounded(record), _low(record), record.provenance.row


def _bounded(record: Record) -> bool:
    start, end = record.span.start, record.span.end
    return ((start.earliest is not None or start.is_open)
            and (end.latest is not None or end.is_open))


def _window_days(records: list[Record]) -> tuple[float, float]:
    return min(map(_low, records)), max(map(_high, records)) + 1
