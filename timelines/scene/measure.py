"""The room the drawing needs, measured before the layout packs the lanes.

The layout works in fixed days and knows nothing of fonts or marks; what it packs is what is
drawn. This module measures it on the page and hands it over in days: each bar's drawn extent
with the signs beside it (`drawn_measure`), each label's width (`label_width`), and the time
scale itself, which starts right of the group names (`chart_scale`).
"""
from __future__ import annotations

from typing import Callable, Iterable, Sequence

import numpy as np

from ..columnar import RecordColumns
from ..errors import UsageError
from ..layout import GroupNode, LaneRules, TimeWindow, group_tree
from ..layout.grouping import BY_GROUP
from ..model import Qualifier, Record
from ..spanarrays import EARLIEST_START, LATEST_END, distinct_spans, span_facts
from .bars import drawn_spans, qualifier_kind, stub_days
from .compose import SUBGROUP_INDENT
from .encodings import OPEN_ARROW_REACH
from .scale import TimeScale, nice_domain
from .textsize import text_width, text_widths
from .theme import Theme

# Renderers that hint glyphs (Agg for PNG, cairo) set a line up to about 4% wider than the
# font's own advances (measured here: a 12 px line 3.5% wider in our PNG); labels get that
# room so a label never touches the next bar in any output.
RENDERED_WIDTH_ALLOWANCE = 1.04
# Room kept free beyond a label beside its bar, in label pads: with the lane gap it puts the
# next bar three times as far from the label as the label's own bar, so proximity says which
# bar a label names (Gestalt law of proximity; the factor is common practice, no source).
LABEL_CLEARANCE = 2.0
SIGN_CLEARANCE = 2.0        # px beyond a qualifier sign before the label pad


def days_per_px(scale: TimeScale) -> float:
    return (scale.end - scale.start) / (scale.x1 - scale.x0)


def label_width(scale: TimeScale, theme: Theme) -> Callable[[str], float]:
    """A label's width in days, as the renderers set it."""
    per_px = days_per_px(scale)
    return lambda label: (text_width(label, theme.font_size, families=theme.font_family)
                          * RENDERED_WIDTH_ALLOWANCE * per_px)


def label_widths(scale: TimeScale, theme: Theme) -> Callable[[list[str]], np.ndarray]:
    """`label_width` of many labels at once."""
    per_px = days_per_px(scale)
    return lambda labels: (text_widths(labels, theme.font_size, families=theme.font_family)
                           * RENDERED_WIDTH_ALLOWANCE * per_px)


def key_width(count: int, scale: TimeScale, theme: Theme) -> float:
    """The room in days of a key number (as many digits as `count` has) beside a bar."""
    digits = "8" * len(str(max(count, 1)))
    return (text_width(digits, theme.small_font_size, "bold") * RENDERED_WIDTH_ALLOWANCE
            * days_per_px(scale))


def drawn_measure(scale: TimeScale, theme: Theme):
    """A `measure_spans` for place(): each span's drawn extent, signs beside it included, the
    room for a label on it (its solid core, where the label's contrast is known) and its body
    (the bar between its signs, which a label on a plate may be drawn over), in days."""
    per_px = days_per_px(scale)
    # The widest qualifier sign, '~?', sits 2 px beside a bar end; a label beside it stands
    # three times as far from the sign as the sign from its bar (SIGN_CLEARANCE and the label
    # pad), so the sign reads as the bar's, not as part of the name (Gestalt proximity).
    mark_room = _sign_room_px(theme) * per_px
    marker = theme.bar_height * 0.6 * per_px
    domain = (scale.start, scale.end)
    stub = stub_days(scale, theme)

    def measure_spans(spans: list) -> np.ndarray:
        facts = span_facts(spans)
        drawn = drawn_spans(facts, domain, stub)
        # A qualifier sign's room, by the index of a side's qualifiers: few distinct sets.
        rooms = np.array([mark_room if qualifier_kind(qualifiers) is not None else 0.0
                          for qualifiers in facts.qualifier_sets] or [0.0])
        before, after = rooms[facts.start_qualifiers], rooms[facts.end_qualifiers]
        point = facts.point
        # a diamond is wider than its day; its sign stands on the right
        low = np.where(point, drawn.start_low - marker, drawn.start_low - before)
        high = np.where(point, drawn.end_high + marker + after, drawn.end_high + after)
        room_low = np.where(drawn.has_core, drawn.start_high, np.nan)
        room_high = np.where(drawn.has_core, drawn.end_low, np.nan)
        body = _plain_bars(facts)
        body_low = np.where(body, drawn.start_low, np.nan)
        body_high = np.where(body, drawn.end_high, np.nan)
        return np.column_stack((low, high, room_low, room_high, body_low, body_high))

    return measure_spans


def _plain_bars(facts) -> np.ndarray:
    """Which spans are drawn as a plain bar, nothing on it but its core and fringes, that a
    label may stand over: not a point (a diamond), each side bounded or open, no bracket of a
    'before' or 'after', no likely day's tick, no calibrated date's shading and ranges."""
    plain_sets = np.array([qualifiers.isdisjoint(_MARKED_INSIDE)
                           for qualifiers in facts.qualifier_sets] or [True])
    bounds = facts.bounds
    bounded = ((facts.open_start | ~np.isnan(bounds[:, EARLIEST_START]))
               & (facts.open_end | ~np.isnan(bounds[:, LATEST_END])))
    return (plain_sets[facts.start_qualifiers] & plain_sets[facts.end_qualifiers] & bounded
            & ~facts.point & ~facts.likely & ~facts.start_radiocarbon & ~facts.end_radiocarbon)


# Qualifiers drawn on the bar itself (a bracket; an unknown side's outlined stretch).
_MARKED_INSIDE = frozenset({Qualifier.BEFORE, Qualifier.AFTER, Qualifier.UNKNOWN_START,
                            Qualifier.UNKNOWN_END})


def chart_scale(dated: list[Record], theme: Theme,
                tree: Iterable[GroupNode] | None = None,
                window: TimeWindow | None = None) -> TimeScale:
    """The time axis over every bound of the dated records (or the --from/--to window),
    right of the group names."""
    low, high = _bounds(dated)
    low, high = nice_domain(low, high, era=theme.era, calendar=theme.calendar)
    if window is not None:
        low, high = window.domain(low, high)
    if high <= low:
        raise UsageError(f"no record reaches into the window --from {window.start_text!r} "
                         f"--to {window.end_text!r}", hint="give both --from and --to")
    if tree is None:
        tree = group_tree(dated, BY_GROUP, LaneRules())
    column = group_column_width(tree, theme)
    if column and _any_open_start(dated):
        column += theme.bar_height * OPEN_ARROW_REACH     # a left arrow keeps off the names
    left = theme.margin + column
    left += _start_sign_room(dated, theme, low, (theme.width - theme.margin - left) / (high - low))
    return TimeScale(low, high, left, theme.width - theme.margin)


def _start_sign_room(dated: Sequence[Record], theme: Theme, low: float,
                     px_per_day: float) -> float:
    """Room left of the axis for a start's sign (~, ?) drawn before a bar that starts at the
    axis's first days (a --from window's, or a decade's first day): without it the sign
    stands in the group names. 0 when no such start."""
    room = _sign_room_px(theme)
    if isinstance(dated, RecordColumns):
        facts = dated.span_facts().take(dated.used_codes())
    else:
        facts = span_facts([record.span for record in dated])
    signed = np.array([qualifier_kind(qualifiers) is not None
                       for qualifiers in facts.qualifier_sets] or [False])
    start = facts.bounds[:, EARLIEST_START]
    near = (start >= low) & (start < low + room / px_per_day)     # NaN compares False
    return room if (near & signed[facts.start_qualifiers] & ~facts.point).any() else 0.0


def _sign_room_px(theme: Theme) -> float:
    """The widest qualifier sign, '~?', 2 px beside a bar end, and the clearance beyond it."""
    return text_width("~?", theme.small_font_size, "bold") + 2 + SIGN_CLEARANCE


def _bounds(dated: Sequence[Record]) -> tuple[float, float]:
    """The first and last bound of any dated record."""
    if isinstance(dated, RecordColumns):
        bounds = dated.span_bounds()[dated.used_codes()]
        if not np.isnan(bounds).all():
            return int(np.nanmin(bounds)), int(np.nanmax(bounds))   # whole days
    spans, _ = distinct_spans(r.span for r in dated)      # each distinct one looked at once
    bounds = [day for span in spans
              for day in (span.start.earliest, span.start.latest, span.end.earliest,
                          span.end.latest) if day is not None]
    return min(bounds), max(bounds)


def _any_open_start(dated: Sequence[Record]) -> bool:
    if isinstance(dated, RecordColumns):
        return bool(dated.span_facts().open_start[dated.used_codes()].any())
    return any(record.span.start.is_open for record in dated)


def group_column_width(tree: Iterable[GroupNode], theme: Theme) -> float:
    """Room left of the axis for the names of the groups that hold lanes: group names in
    bold; with subgroups, the subgroup names (their groups get a header row of their own)."""
    tree = list(tree)
    if not any(node.name for node in tree):
        return 0.0
    widths = [0.0]
    for node in tree:
        if node.subgroups:
            widths += [SUBGROUP_INDENT + text_width(_caption(sub.name), theme.group_label_size,
                                                    families=theme.font_family)
                       for sub in node.subgroups]
        else:
            widths.append(text_width(_caption(node.name), theme.group_label_size, "bold",
                                     families=theme.font_family))
    return min(max(widths) + 12, theme.width * 0.3)


def _caption(name: str) -> str:
    return name or "(none)"
