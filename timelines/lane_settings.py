"""The user's lane options, by name, made into the layout's rules.

`LaneSettings` holds what the command line and a config file say, columns by header name and
distances as text; `lane_rules` checks them against the table's header and gives the
`LaneRules` and the lane gap the layout takes. `column_reader` reads any column of a record
by its header name (the facet, sort, subgroup and lane columns).
"""
from __future__ import annotations

from dataclasses import dataclass
from typing import Callable

from .config import Distance, parse_distance
from .errors import UsageError
from .layout import GROUP_ORDERS, LABEL_MODES, PACKINGS, SORT_KEYS, LaneRules
from .model import Record
from .sources import ColumnMap
from .sources.columns import column_parts, did_you_mean, existing_column


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


def lane_rules(settings: LaneSettings, columns: ColumnMap, header: tuple[str, ...] | None
               ) -> tuple[LaneRules, Distance]:
    """The layout's rules from the user's settings; column names checked against `header`
    (None: records made by the caller, whose other columns are in `Record.fields`)."""
    for value, choices in ((settings.pack, PACKINGS), (settings.labels, LABEL_MODES)):
        if value not in choices:
            raise UsageError(f"{value!r} is not one of {', '.join(choices)}",
                             hint=did_you_mean(value, choices))
    # The sort keys are words, whatever their case; anything else names a column.
    sort = settings.sort.strip().casefold()
    if sort not in SORT_KEYS:
        sort = column_reader(columns, header, settings.sort, "sort", keywords=SORT_KEYS)
    rules = LaneRules(
        subgroup_key=_optional_reader(columns, header, settings.subgroup, "subgroup"),
        group_order=group_order(settings.group_order),
        subgroup_order=group_order(settings.subgroup_order),
        min_group_size=settings.min_group_size,
        min_subgroup_size=settings.min_subgroup_size, other_group=settings.other_group or "Other",
        pack=settings.pack, sort=sort, descending=settings.descending,
        lane_of=_optional_reader(columns, header, settings.lane_column, "lane column"),
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


def _optional_reader(columns: ColumnMap, header, name: str | None, part: str):
    return None if name is None else column_reader(columns, header, name, part)


def column_reader(columns: ColumnMap, header: tuple[str, ...] | None, name: str, part: str,
                  keywords: tuple[str, ...] = ()) -> Callable[[Record], str | None]:
    """A function giving a record's text in column `name` (checked against `header`)."""
    if header is not None:
        try:
            name = existing_column(header, name, part)
        except UsageError as error:
            hint = did_you_mean(name, (*keywords, *header)) if keywords else error.hint
            raise UsageError(str(error), hint=hint) from None
    role = next((role for role, column in column_parts(columns) if column == name), None)
    if role in ("label", "id", "group", "color"):
        return lambda record: getattr(record, role)
    if role in ("start", "when"):
        return lambda record: record.start_text
    if role == "end":
        return lambda record: record.end_text

    def field_text(record: Record) -> str | None:
        for column, text in record.fields:
            if column == name:
                return text
        return None

    return field_text
