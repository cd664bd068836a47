"""Layout: grouping, ordering, label placement and lane packing, in fixed days. Pure and
deterministic; imports only the model, the calendar (for the report's dates) and errors.

- `packing`: boxes into lanes (the compact sweep, first fit in an order, the most that fit in
  k lanes) and the densest moment of a set of boxes;
- `grouping`: records into groups, small groups merged, groups in order;
- `labels`: inside, beside or left out: where a label goes and the box it makes;
- `boxes`: each record's bar, label room and box as arrays, from the caller's measures;
- `placement`: `place()`, the whole step from records to a `Placement`;
- `settings`: the user's lane options by name (`LaneSettings`) made into `LaneRules`;
- `distances`: a lane gap as a time (`5y`) or a page length (`4px`), and page units;
- `window`: the time `--from`/`--to` shows, and the records wholly outside it;
- `report`: the `timelines lanes` report of a placement (tables, CSV, JSON).

What a record occupies in its lane is its box: the bar as drawn (the caller's `measure_spans`,
fringes, open ends and marks beside it included) plus the room of a label beside it; with a
gap `g`, the box `[start, end]` holds `[start, end + g]`, and boxes in one lane never share a
point. Under this rule compact packing uses exactly the maximum overlap depth in lanes.
"""
from .boxes import SpanMeasure, each_span
from .grouping import (
    GROUP_ORDERS, NO_GROUP, GroupKey, GroupOrder, UnknownGroup, collect_groups, group_records,
    merge_small_groups, natural_key, order_groups,
)
from .labels import LABEL_MODES, LABEL_SIDES, label_box
from .packing import (
    LEFT_OUT, Density, densest_moment, first_fit, max_overlap_depth, most_that_fit, pack_lanes,
)
from .placement import (
    PACKINGS, SORT_KEYS, GroupNode, GroupPlacement, LaneRules, LayoutNote, PlacedRecord, Placement,
    group_tree, place,
)
from .settings import LaneSettings, lane_rules
from .window import TimeWindow, split_by_window

__all__ = [
    "collect_groups", "densest_moment", "Density", "each_span", "first_fit", "GROUP_ORDERS",
    "group_records", "group_tree", "GroupKey", "GroupNode", "GroupOrder", "GroupPlacement",
    "label_box", "LABEL_MODES", "LABEL_SIDES", "lane_rules", "LaneRules", "LaneSettings",
    "LayoutNote", "LEFT_OUT", "max_overlap_depth", "merge_small_groups", "most_that_fit",
    "natural_key", "NO_GROUP", "order_groups", "pack_lanes", "PACKINGS", "place", "PlacedRecord",
    "Placement", "SORT_KEYS", "SpanMeasure", "split_by_window", "TimeWindow", "UnknownGroup",
]
