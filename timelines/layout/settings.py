"""The user's lane options, by name, made into the layout's rules.

`LaneSettings` holds what the command line and a config file say, columns by header name and
distances as text; `lane_rules` checks them and gives the `LaneRules` and the lane gap the
layout takes. Columns are read through a `ColumnReader` the caller gives (the table's
`sources.fields.column_reader`), which checks each name against the table's header.
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

from ..errors import UsageError, did_you_mean
from ..model import Record
from .distances import Distance, parse_distance
from .grouping import GROUP_ORDERS
from .labels import LABEL_MODES
from .placement import PACKINGS, SORT_KEYS, LaneRules

# (column name, what it is for, option words offered beside the header's names) -> a function
# giving a record's text in that column.
ColumnReader = Callable[..., Callable[[Record], "str | None"]]


@dataclass(frozen=True, slots=True)
class LaneSettings:
    """How lanes are grouped, ordered and packed, as the user names things (see layout)."""

    subgroup: str | None = None          # a column nesting groups inside the --group column
    group_order: str = "first"           # first, name, size, or names separated by commas
    subgroup_order: str = "first"
    min_group_size: int = 0              # smaller groups merge into `other_group`
    min_subgroup_size: int = 0           # the same for the subgroups of each group
    other_group: str = "Other"
    pack: str = "compact"                # compact, ordered or single
    sort: str = "start"                  # start, end, duration, label or a column name
    descending: bool = False
    lane_gap: str = "3px"                # a time (5y, 30d) or a page distance (4px, 1mm)
    lane_column: str | None = None       # a column of lane numbers pinning records
    max_lanes: int | None = None         # per group; what does not fit is reported
    labels: str = "beside"               # beside, inside (or left out) or none


def lane_rules(settings: LaneSettings, read_column: ColumnReader
               ) -> tuple[LaneRules, Distance]:
    """The layout's rules from the user's settings, columns read through `read_column`."""
    for value, choices in ((settings.pack, PACKINGS), (settings.labels, LABEL_MODES)):
        if value not in choices:
            raise UsageError(f"{value!r} is not one of {', '.join(choices)}",
                             hint=did_you_mean(value, choices))
    # The sort keys are words, whatever their case; anything else names a column.
    sort = settings.sort.strip().casefold()
    if sort not in SORT_KEYS:
        sort = read_column(settings.sort, "sort", keywords=SORT_KEYS)
    rules = LaneRules(
        subgroup_key=_optional_reader(read_column, settings.subgroup, "subgroup"),
        group_order=group_order(settings.group_order),
        subgroup_order=group_order(settings.subgroup_order),
        min_group_size=settings.min_group_size,
        min_subgroup_size=settings.min_subgroup_size, other_group=settings.other_group or "Other",
        pack=settings.pack, sort=sort, descending=settings.descending,
        lane_of=_optional_reader(read_column, settings.lane_column, "lane column"),
        max_lanes=settings.max_lanes)
    return rules, parse_distance(settings.lane_gap)


def group_order(text: str) -> str | tuple[str, ...]:
    """"first", "name", "size", or a comma-separated list of group names ("Masters," is a
    list of one name, for a group called like an order)."""
    if text.strip() in GROUP_ORDERS:
        return text.strip()
    names = tuple(name.strip() for name in text.split(",") if name.strip())
    if not names:
        raise UsageError(f"cannot read the group order {text!r}",
                         hint="give first, name, size or group names separated by commas")
    return names


def _optional_reader(read_column: ColumnReader, name: str | None, part: str):
    return None if name is None else read_column(name, part)
