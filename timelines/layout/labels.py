"""Where a record's label goes, and the box the label makes with its bar (in days).

Inside the bar when the label and its padding fit in the room inside (the caller says where:
for a chart, the solid core, where the text's contrast is known); else right of the bar, else
left of it, as long as the label stays within the domain; else over the bar's body when it
fits there (the caller says where the body lies: for a chart, the bar between its ends' signs
and arrowheads, where the label is drawn dark on a pale plate so that it reads over any part
of the bar: a bar across the whole of a --from/--to window has no room beside it); else, when
the caller gives a key width, a small number beside the bar (right, else left) that a
numbered key under the chart spells out; else nowhere: the label is left out of the picture
and kept in the tooltip.

A label beside the bar widens the record's box by the pad, its width and a clearance on its
far side, so packing keeps other bars and labels off it. The clearance is what tells a reader
which bar a label belongs to: a label should sit nearer its own bar than the next one.

Label modes: "beside" (the rule above), "inside" (inside or left out: boxes are the bars
alone, the most compact chart with labels), "none" (every label left out).
"""
from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

LABEL_SIDES = ("inside", "right", "left", "none", "key right", "key left", "over")
LABEL_MODES = ("beside", "inside", "none")

LabelBox = tuple[float, float, str]   # box start, box end, label side


def label_box(label: str, bar: tuple[float, float], width: float, domain: tuple[float, float],
              pad: float, room: tuple[float, float] | None, clearance: float = 0.0,
              mode: str = "beside") -> LabelBox:
    """The box and label side of one record (see `label_boxes`)."""
    rooms = np.array([room if room is not None else _NO_ROOM], dtype=float)
    found = label_boxes([label], np.array([bar], dtype=float), np.array([width], dtype=float),
                        domain, pad, rooms, clearance, mode)
    return float(found.start[0]), float(found.end[0]), LABEL_SIDES[found.side[0]]


@dataclass(frozen=True, slots=True)
class LabelBoxes:
    """Box starts and ends (days) and label sides (indexes into LABEL_SIDES) of many records."""

    start: np.ndarray
    end: np.ndarray
    side: np.ndarray


_NO_ROOM = (math.nan, math.nan)     # a record with no room for its label inside
_INSIDE, _RIGHT, _LEFT, _NONE, _KEY_RIGHT, _KEY_LEFT, _OVER = range(len(LABEL_SIDES))


def label_boxes(labels: Sequence[str], bars: np.ndarray, widths: np.ndarray,
                domain: tuple[float, float], pad: float, rooms: np.ndarray,
                clearance: float = 0.0, mode: str = "beside",
                key_width: float | None = None, bodies: np.ndarray | None = None
                ) -> LabelBoxes:
    """Each record's box and label side, from its drawn bar (`bars`, n x 2, in days), its
    label's width and its room inside (`rooms`, n x 2; NaN where there is none); with
    `bodies` (n x 2, NaN where there is none), a label over the bar's body where nothing
    beside has room; with `key_width` (days), a key number for a label that finds no room."""
    bar_start, bar_end = bars[:, 0], bars[:, 1]
    _check(labels, bar_start, bar_end, widths)
    side = np.full(len(labels), _NONE)
    start, end = bar_start.copy(), bar_end.copy()
    if mode == "none":
        return LabelBoxes(start, end, side)
    inside = (widths + 2 * pad) <= (rooms[:, 1] - rooms[:, 0])     # NaN rooms compare False
    side[inside] = _INSIDE
    if mode == "inside":
        return LabelBoxes(start, end, side)
    right = ~inside & ((bar_end + pad) + widths <= domain[1])
    left = ~inside & ~right & ((bar_start - pad) - widths >= domain[0])
    side[right], side[left] = _RIGHT, _LEFT
    end[right] = (((bar_end + pad) + widths) + clearance)[right]
    start[left] = (((bar_start - pad) - widths) - clearance)[left]
    if bodies is not None:
        over = (side == _NONE) & ((widths + 2 * pad) <= (bodies[:, 1] - bodies[:, 0]))
        side[over] = _OVER
    if key_width is not None:
        _key_numbers(side, start, end, bar_start, bar_end, domain, pad, key_width, clearance)
    return LabelBoxes(start, end, side)


def _key_numbers(side, start, end, bar_start, bar_end, domain, pad, width, clearance) -> None:
    """A key number beside the bar for each label left out, where it fits (in place)."""
    left_out = side == _NONE
    right = left_out & (bar_end + pad + width <= domain[1])
    left = left_out & ~right & (bar_start - pad - width >= domain[0])
    side[right], side[left] = _KEY_RIGHT, _KEY_LEFT
    end[right] = (bar_end + pad + width + clearance)[right]
    start[left] = (bar_start - pad - width - clearance)[left]


def _check(labels: Sequence[str], bar_start: np.ndarray, bar_end: np.ndarray,
           widths: np.ndarray) -> None:
    bad_bar = ~(np.isfinite(bar_start) & np.isfinite(bar_end) & (bar_start <= bar_end))
    if bad_bar.any():
        at = int(np.flatnonzero(bad_bar)[0])
        raise ValueError(f"drawn extent {(float(bar_start[at]), float(bar_end[at]))} of "
                         f"{labels[at]!r} must be finite, start <= end")
    bad_width = ~(np.isfinite(widths) & (widths >= 0))
    if bad_width.any():
        at = int(np.flatnonzero(bad_width)[0])
        raise ValueError(f"label width {float(widths[at])} of {labels[at]!r} must be finite "
                         f"and >= 0")
