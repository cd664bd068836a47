"""Records into groups: collect by a key, merge the small ones, put them in order.

Orders (`GroupOrder`):
- "first": by earliest possible start. A record whose start is unbounded (open or unknown
  start) counts as earlier than any date, undated records as later than any; ties keep the
  order of first appearance.
- "name": by name, without case, numbers by value ("Phase 2" before "Phase 10").
- "size": most records first, ties as in "first".
- a tuple of names: those groups first, in that order (a name matches exactly, else without
  case), the rest after them as in "first". A name no group has is an error.

Records inside a group keep input order. Records without a group (the key gives None or "")
form one group named "" (`NO_GROUP`). Under "name" and "size" it comes after the named
groups, and the remainder group of merged small groups comes last under every order unless
an explicit list names it.
"""
from __future__ import annotations

import re
from collections.abc import Callable, Iterable, Sequence
from operator import attrgetter

import numpy as np

from ..columnar import RecordColumns
from ..spanarrays import EARLIEST_END, EARLIEST_START, LATEST_END, LATEST_START
from ..model import Record

NO_GROUP = ""
GROUP_ORDERS = ("first", "name", "size")

GroupKey = Callable[[Record], str | None]
GroupOrder = str | tuple[str, ...]
Groups = list[tuple[str, Sequence[Record]]]
# The keys a table read as columns groups by without making a Record: its group column, and
# none at all (one group).
BY_GROUP: GroupKey = attrgetter("group")


def NO_KEY(record: Record) -> None:
    return None


class UnknownGroup(ValueError):
    """An explicit group order names a group that does not occur."""

    def __init__(self, name: str, known: Sequence[str]):
        self.name = name
        self.known = tuple(known)
        listed = ", ".join(repr(known_name) for known_name in self.known if known_name)
        super().__init__(f"no group {name!r} to put in order; the groups are {listed}")


def collect_groups(records: Iterable[Record], key: GroupKey) -> Groups:
    """Records by `key`, groups in order of first appearance, records in input order. A
    table's records as columns, grouped by BY_GROUP or NO_KEY, stay columns."""
    if isinstance(records, RecordColumns) and key in (BY_GROUP, NO_KEY):
        return _column_groups(records, key)
    members: dict[str, list[Record]] = {}
    for record in records:
        members.setdefault(key(record) or NO_GROUP, []).append(record)
    return list(members.items())


def group_records(records: Iterable[Record], key: GroupKey, order: GroupOrder = "first"
                  ) -> Groups:
    """Records grouped by `key` and the groups put in `order` (see the module notes)."""
    return order_groups(collect_groups(records, key), order)


def _column_groups(records: RecordColumns, key: GroupKey) -> Groups:
    if key is NO_KEY or records.groups is None:
        return [(NO_GROUP, records)] if len(records) else []
    values = records.column("groups")
    names: dict[str, int] = {}
    code_of = {value: names.setdefault(value or NO_GROUP, len(names))
               for value in dict.fromkeys(values)}
    codes = np.fromiter(map(code_of.__getitem__, values), dtype=np.intp, count=len(values))
    order = np.argsort(codes, kind="stable")          # each group's records in input order
    sizes = np.bincount(codes, minlength=len(names))
    ends = np.cumsum(sizes).tolist()
    return [(name, records.take(order[end - size:end]))
            for name, end, size in zip(names, ends, sizes.tolist())]


def merge_small_groups(groups: Groups, min_size: int, other: str
                       ) -> tuple[Groups, tuple[str, ...]]:
    """Groups of fewer than `min_size` records merged into one group named `other`.

    Merging needs two small groups at least: one alone keeps its name (calling it `other`
    would only hide it). A group already named `other` takes the merged records in. Returns
    the groups, the merged one where the first merged group was, and the merged names."""
    small = [name for name, members in groups if len(members) < min_size and name != other]
    if len(small) < 2:
        return groups, ()
    merged_names = set(small)
    result: Groups = []
    remainder: list[Sequence[Record]] | None = None
    for name, members in groups:
        if name in merged_names or name == other:
            if remainder is None:
                remainder = []
                result.append((other, remainder))
            remainder.append(members)
        else:
            result.append((name, members))
    return [(name, _joined(members) if name == other and members is remainder else members)
            for name, members in result], tuple(small)


def _joined(parts: list[Sequence[Record]]) -> Sequence[Record]:
    """The records of several groups as one, in group order: columns where all are parts of
    one table read as columns."""
    first = parts[0]
    if all(isinstance(part, RecordColumns) and first.same_table(part) for part in parts):
        return first.at(np.concatenate([part.positions for part in parts]))
    return [record for part in parts for record in part]


def order_groups(groups: Groups, order: GroupOrder, *, last: Iterable[str] = ()) -> Groups:
    """`groups` in `order`; the names in `last` (a remainder group) go to the end."""
    last = set(last)
    if isinstance(order, tuple):
        return _listed_order(groups, order, last)
    if order not in GROUP_ORDERS:
        raise ValueError(f"group order must be one of {', '.join(GROUP_ORDERS)} or a tuple "
                         f"of names, not {order!r}")
    firsts = _first_starts(groups)
    position = {name: index for index, (name, _) in enumerate(groups)}

    def key(group: tuple[str, list[Record]]):
        name, members = group
        trailing = name in last or (order != "first" and name == NO_GROUP)
        if order == "name":
            return trailing, natural_key(name), position[name]
        if order == "size":
            return trailing, -len(members), firsts[name], position[name]
        return trailing, firsts[name], position[name]

    return sorted(groups, key=key)


def _listed_order(groups: Groups, names: tuple[str, ...], last: set[str]) -> Groups:
    by_name = dict(groups)
    listed: list[str] = []
    for wanted in names:
        name = _matching_name(wanted, [name for name, _ in groups])
        if name is not None and name not in listed:
            listed.append(name)
    rest = [(name, members) for name, members in groups if name not in listed]
    named_last = last - set(listed)
    return [(name, by_name[name]) for name in listed] + order_groups(rest, "first",
                                                                     last=named_last)


def _matching_name(wanted: str, names: list[str]) -> str | None:
    if wanted in names:
        return wanted
    folded = [name for name in names if name.casefold() == wanted.casefold()]
    return folded[0] if len(folded) == 1 else None


def check_listed_names(names: tuple[str, ...], known: Iterable[str]) -> None:
    """Raise UnknownGroup for a listed name that matches none of `known`."""
    known = list(dict.fromkeys(known))
    for wanted in names:
        if _matching_name(wanted, known) is None:
            raise UnknownGroup(wanted, known)


def _first_starts(groups: Groups) -> dict[str, tuple[int, float]]:
    """Each group's first start (`_start_order`); a table's columns' spans ordered once."""
    orders: dict[int, tuple[np.ndarray, np.ndarray]] = {}
    firsts = {}
    for name, members in groups:
        if isinstance(members, RecordColumns) and len(members):
            key = id(members.spans)
            if key not in orders:
                orders[key] = _span_start_orders(members)
            kinds, days = orders[key]
            codes = members.codes()
            kind = int(kinds[codes].min())
            firsts[name] = (kind, float(days[codes][kinds[codes] == kind].min()))
        else:
            firsts[name] = _first_start(members)
    return firsts


def _span_start_orders(records: RecordColumns) -> tuple[np.ndarray, np.ndarray]:
    """`_start_order` of each distinct span of a table: (kinds, days) arrays."""
    facts = records.span_facts()
    bounds = facts.bounds
    first_known = np.full(len(bounds), np.nan)
    for column in (LATEST_END, EARLIEST_END, LATEST_START, EARLIEST_START):  # first wins
        known = ~np.isnan(bounds[:, column])
        first_known[known] = bounds[known, column]
    kinds = np.where(~facts.dated, 2, np.where(facts.open_start | np.isnan(first_known), 0, 1))
    days = np.where(kinds == 1, first_known, 0.0)
    return kinds, days


def _first_start(records: Sequence[Record]) -> tuple[int, float]:
    # Records of one table share Span objects: order each span once.
    orders = {id(record.span): record for record in records}
    return min(map(_start_order, orders.values()))


def _start_order(record: Record) -> tuple[int, float]:
    # (0, -) an open start (the span runs on into the past), (1, day) a start bounded by a
    # date, (2, -) no date at all. An unknown or 'before' start counts from its first known
    # bound, so one missing birth year does not pull its whole group to the top.
    if record.span is None:
        return 2, 0.0
    start, end = record.span.start, record.span.end
    if start.is_open:
        return 0, 0.0
    # the first known of these, written out: every distinct span of a group passes here
    if start.earliest is not None:
        return 1, float(start.earliest)
    if start.latest is not None:
        return 1, float(start.latest)
    if end.earliest is not None:
        return 1, float(end.earliest)
    if end.latest is not None:
        return 1, float(end.latest)
    return 0, 0.0


_NUMBER = re.compile(r"[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?")
_DIGITS = re.compile(r"(\d+)")


def natural_key(text: str | None) -> tuple:
    """Sort key for a cell: numbers by value (1.25 before 1.5), then text with its digit runs
    by value and case ignored ("Phase 2" before "Phase 10"), then empty cells."""
    text = (text or "").strip()
    if not text:
        return (2,)
    if _NUMBER.fullmatch(text):
        return 0, float(text)
    parts = tuple((0, int(part), "") if part.isdigit() else (1, 0, part.casefold())
                  for part in _DIGITS.split(text) if part)
    return 1, parts
