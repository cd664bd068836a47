"""Where a record's label goes, and the box the label makes with its bar (in days).

Inside the bar when the label and its padding fit in the room inside (the caller says where:
for a chart, the solid core, where the text's contrast is known); else right of the bar, else
left of it, as long as the label stays within the domain; else nowhere: the label is left out
of the picture and the renderer keeps it in the record's tooltip.

A label beside the bar widens the record's box by the pad, its width and a clearance on its
far side, so packing keeps other bars and labels off it. The clearance is what tells a reader
which bar a label belongs to: a label should sit nearer its own bar than the next one.

Label modes: "beside" (the rule above), "inside" (inside or left out: boxes are the bars
alone, the most compact chart with labels), "none" (every label left out).
"""
from __future__ import annotations

import math

LABEL_SIDES = ("inside", "right", "left", "none")
LABEL_MODES = ("beside", "inside", "none")

LabelBox = tuple[float, float, str]   # box start, box end, label side


def label_box(label: str, bar: tuple[float, float], width: float, domain: tuple[float, float],
              pad: float, room: tuple[float, float] | None, clearance: float = 0.0,
              mode: str = "beside") -> LabelBox:
    bar_start, bar_end = bar
    if not (math.isfinite(bar_start) and math.isfinite(bar_end)) or bar_end < bar_start:
        raise ValueError(f"drawn extent {bar} of {label!r} must be finite, start <= end")
    if not (math.isfinite(width) and width >= 0):
        raise ValueError(f"label width {width} of {label!r} must be finite and >= 0")
    if mode == "none":
        return bar_start, bar_end, "none"
    if room is not None and width + 2 * pad <= room[1] - room[0]:
        return bar_start, bar_end, "inside"
    if mode == "inside":
        return bar_start, bar_end, "none"
    if bar_end + pad + width <= domain[1]:
        return bar_start, bar_end + pad + width + clearance, "right"
    if bar_start - pad - width >= domain[0]:
        return bar_start - pad - width - clearance, bar_end, "left"
    return bar_start, bar_end, "none"
