"""The whole job in named steps: read -> parse -> check -> layout -> scene -> draw.

`render()` is what `timelines render` runs; `arrange()` stops after the layout (what
`timelines lanes` reports); `build_scene()` is the part after the records exist, for callers
who make records themselves. The user's lane options arrive by name (`LaneSettings`: columns
by header name, distances as text) and become the layout's rules here.
"""
from __future__ import annotations

from dataclasses import dataclass, field, replace
from pathlib import Path
from typing import Callable, Iterable

from .check import Report, check
from .compose import (
    SUBGROUP_INDENT, ChartText, compose, drawn_span, qualifier_kind, title_height,
)
from .config import Distance, parse_distance
from .dates import DEFAULT_SETTINGS, DateSettings
from .errors import TimelineError, UsageError
from .layout import (
    GROUP_ORDERS, LABEL_MODES, PACKINGS, SORT_KEYS, GroupNode, LaneRules, Placement, UnknownGroup,
    group_tree, place,
)
from .model import Record
from .privacy import withhold_possibly_living
from .scale import TimeScale, nice_domain
from .scene import Scene
from .sources import ColumnMap, LoadResult, detect_columns, load_records, read_table
from .sources.columns import column_parts, did_you_mean, existing_column
from .textsize import text_width
from .theme import DEFAULT_THEME, Theme

FORMATS = (".svg", ".png", ".pdf")
# Room kept free beyond a label beside its bar, in label pads: with the lane gap it puts the
# next bar three times as far from the label as the label's own bar, so proximity says which
# bar a label names (Gestalt law of proximity; the factor is common practice, no source).
LABEL_CLEARANCE = 2.0


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


@dataclass(frozen=True, slots=True)
class ChartOptions:
    columns: ColumnMap = field(default_factory=ColumnMap)
    sheet: str | None = None
    settings: DateSettings = DEFAULT_SETTINGS
    theme: Theme = DEFAULT_THEME
    title: str = ""
    strict: bool = False
    dpi: float = 150.0
    lanes: LaneSettings = field(default_factory=LaneSettings)
    text: str = "text"                  # SVG text: "text", or "paths" (glyph outlines)
    privacy: "Privacy | None" = None    # withhold possibly living persons' details


@dataclass(frozen=True, slots=True)
class Privacy:
    """Withhold the details of possibly living persons (see `privacy`, docs/privacy.md)."""

    as_of_year: int
    years: int = 100


@dataclass(frozen=True, slots=True)
class Arranged:
    """A table read, checked and laid out; no scale or placement when nothing is dated."""

    loaded: LoadResult
    report: Report
    columns: ColumnMap
    scale: TimeScale | None
    placement: Placement | None
    withheld: int = 0                   # records shown without their details

    @property
    def not_drawn(self) -> int:
        """Rows without a bar: unreadable, contradictory, undated or left out of the lanes."""
        return self.report.not_drawn + len(self.left_out)

    @property
    def left_out(self) -> tuple[Record, ...]:
        return self.placement.left_out if self.placement else ()

    def summary(self, max_lanes: int | None = None) -> str:
        """The check's one-line summary, with the records the lanes had no room for."""
        if not self.left_out:
            return self.report.summary()
        counts = replace(self.report.counts,
                         drawn=self.report.counts.drawn - len(self.left_out))
        limit = f" (at most {max_lanes} lanes a group)" if max_lanes else ""
        return (f"{replace(self.report, counts=counts).summary()}; "
                f"{len(self.left_out)} left out for lack of room{limit}")


@dataclass(frozen=True, slots=True)
class RunResult:
    loaded: LoadResult
    report: Report
    scene: Scene | None
    written: Path | None
    arranged: Arranged | None = None


def render(source: str | Path, output: str | Path, options: ChartOptions = ChartOptions()
           ) -> RunResult:
    output = Path(output)
    output_format(output)                                   # fail before any work
    arranged = arrange(source, options)                     # read + parse + check + layout
    if options.strict and arranged.not_drawn:
        return RunResult(arranged.loaded, arranged.report, None, None, arranged)
    scene = arranged_scene(arranged, options)               # scene
    write(scene, output, dpi=options.dpi, text=options.text)  # draw
    return RunResult(arranged.loaded, arranged.report, scene, output, arranged)


def arrange(source: str | Path, options: ChartOptions = ChartOptions()) -> Arranged:
    table = read_table(source, options.sheet)                            # read
    columns = detect_columns(table.header, options.columns)
    loaded = load_records(table, columns, options.settings)              # parse
    loaded, withheld = _withhold(loaded, options.privacy)
    report = check(loaded)                                               # check
    dated = [r for r in loaded.records if r.span is not None]
    if not dated:
        return Arranged(loaded, report, columns, None, None, withheld)
    rules, gap = lane_rules(options.lanes, columns, table.header)
    tree = _group_tree(dated, rules)
    scale = chart_scale(dated, options.theme, tree)                      # scale
    placement = lay_out(loaded.records, scale, options.theme, rules, gap,  # layout
                        options.lanes.labels, tree)
    return Arranged(loaded, report, columns, scale, placement, withheld)


def _withhold(loaded: LoadResult, privacy: Privacy | None) -> tuple[LoadResult, int]:
    if privacy is None:
        return loaded, 0
    kept = withhold_possibly_living(loaded.records, privacy.as_of_year, privacy.years)
    return replace(loaded, records=kept.records), kept.count


def read_records(source: str | Path, options: ChartOptions = ChartOptions()) -> LoadResult:
    table = read_table(source, options.sheet)
    columns = detect_columns(table.header, options.columns)
    return load_records(table, columns, options.settings)


def arranged_scene(arranged: Arranged, options: ChartOptions) -> Scene:
    if arranged.placement is None:
        raise TimelineError("nothing to draw: no row has a usable date")
    report = arranged.report
    return placement_scene(arranged.loaded.records, arranged.placement, arranged.scale,
                           options.theme, options.title,
                           not_drawn=report.not_drawn - report.undated)


def build_scene(records: Iterable[Record], theme: Theme = DEFAULT_THEME, title: str = "",
                not_drawn: int = 0, lanes: LaneSettings = LaneSettings(),
                columns: ColumnMap = ColumnMap()) -> Scene:
    records = list(records)
    dated = [r for r in records if r.span is not None]
    if not dated:
        raise TimelineError("nothing to draw: no row has a usable date")
    rules, gap = lane_rules(lanes, columns, None)
    tree = _group_tree(dated, rules)
    scale = chart_scale(dated, theme, tree)                             # scale
    placement = lay_out(records, scale, theme, rules, gap, lanes.labels, tree)  # layout
    return placement_scene(records, placement, scale, theme, title, not_drawn)   # scene


def placement_scene(records: Iterable[Record], placement: Placement, scale: TimeScale,
                    theme: Theme, title: str, not_drawn: int = 0) -> Scene:
    # Colours in order of first appearance in the table, for the records drawn.
    drawn = {id(p.record) for _, group in placement.leaves() for p in group.records}
    colors = color_key([r for r in records if id(r) in drawn], theme)
    text = ChartText(title, placement.undated, not_drawn)
    by_value = dict(colors)
    return compose(placement, scale, theme, text,
                   lambda r: by_value.get(r.color, theme.bar_color), colors,
                   plot_top=title_height(title, theme) + 8)


def chart_scale(dated: list[Record], theme: Theme,
                tree: tuple[GroupNode, ...] | None = None) -> TimeScale:
    """The time axis over every bound of the dated records, right of the group names."""
    bounds = [day for r in dated for day in (r.span.start.earliest, r.span.start.latest,
                                             r.span.end.earliest, r.span.end.latest)
              if day is not None]
    low, high = nice_domain(min(bounds), max(bounds), era=theme.era)
    if tree is None:
        tree = _group_tree(dated, LaneRules())
    left = theme.margin + group_column_width(tree, theme)
    return TimeScale(low, high, left, theme.width - theme.margin)


def group_column_width(tree: Iterable[GroupNode], theme: Theme) -> float:
    """Room left of the axis for the names of the groups that hold lanes: group names in
    bold; with subgroups, the subgroup names (their groups get a header row of their own)."""
    tree = list(tree)
    if not any(node.name for node in tree):
        return 0.0
    widths = [0.0]
    for node in tree:
        if node.subgroups:
            widths += [SUBGROUP_INDENT + text_width(_caption(sub.name), theme.group_label_size)
                       for sub in node.subgroups]
        else:
            widths.append(text_width(_caption(node.name), theme.group_label_size, "bold"))
    return min(max(widths) + 12, theme.width * 0.3)


def _caption(name: str) -> str:
    return name or "(none)"


def _group_tree(records: list[Record], rules: LaneRules) -> tuple[GroupNode, ...]:
    try:
        return group_tree(records, lambda r: r.group, rules)
    except UnknownGroup as error:
        raise UsageError(str(error), hint=did_you_mean(error.name, error.known)) from error


def lay_out(records: list[Record], scale: TimeScale, theme: Theme,
            rules: LaneRules = LaneRules(), gap: Distance = parse_distance("3px"),
            labels: str = "beside", tree: tuple[GroupNode, ...] | None = None) -> Placement:
    """Pack on what is drawn: each bar with its fringes, open ends and the signs beside it,
    labels measured in the renderers' font. `tree`: the groups, when already made."""
    days_per_px = (scale.end - scale.start) / (scale.x1 - scale.x0)
    measured = _drawn_measure(scale, theme, days_per_px)
    try:
        return place(records, domain=(scale.start, scale.end),
                     drawn_extent=lambda r: measured(r.span)[0],
                     label_width=lambda r: text_width(r.label, theme.font_size) * days_per_px,
                     group_key=lambda r: r.group, gap=gap.days(days_per_px),
                     label_pad=theme.label_pad * days_per_px,
                     inside_room=lambda r: measured(r.span)[1],
                     label_clearance=LABEL_CLEARANCE * theme.label_pad * days_per_px,
                     labels=labels, rules=rules, tree=tree)
    except UnknownGroup as error:
        raise UsageError(str(error), hint=did_you_mean(error.name, error.known)) from error


def _drawn_measure(scale: TimeScale, theme: Theme, days_per_px: float):
    """A function giving a span's drawn extent and the room for a label inside it (its solid
    core, where the label's contrast is known, or None), in days."""
    # the widest qualifier sign, '~?', sits beside a bar end
    mark_room = (text_width("~?", theme.small_font_size, "bold") + 3) * days_per_px
    marker = theme.bar_height * 0.6 * days_per_px
    domain = (scale.start, scale.end)
    known: dict[int, tuple] = {}

    def measure(span):
        # Records read from one table share Span objects for equal cells: measure each once.
        found = known.get(id(span))
        if found is not None and found[2] is span:
            return found
        drawn = drawn_span(span, domain)
        before = mark_room if _has_glyph(span.start) and not span.is_point else 0.0
        after = mark_room if _has_glyph(span.end) else 0.0
        if span.is_point:   # a diamond is wider than its day; its sign stands on the right
            extent = (drawn.start_low - marker, drawn.end_high + marker + after)
        else:
            extent = (drawn.start_low - before, drawn.end_high + after)
        core = (drawn.start_high, drawn.end_low) if drawn.has_core else None
        known[id(span)] = found = (extent, core, span)
        return found

    return measure


def _has_glyph(endpoint) -> bool:
    return qualifier_kind(endpoint.qualifiers) is not None


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


def color_key(records: list[Record], theme: Theme) -> tuple[tuple[str, str], ...]:
    values = list(dict.fromkeys(r.color for r in records if r.color))
    return tuple((value, theme.color_for(i)) for i, value in enumerate(values))


def output_format(path: Path) -> str:
    suffix = path.suffix.lower()
    if suffix not in FORMATS:
        raise UsageError(f"cannot write {path.name!r}: the output must end in .svg, .png or .pdf")
    return suffix


def write(scene: Scene, path: Path, dpi: float = 150.0, text: str = "text") -> None:
    suffix = output_format(path)
    if suffix == ".svg":
        from .render.svg import write_svg
        write_svg(scene, path, text=text)
    elif suffix == ".png":
        from .render.mpl import render_png
        render_png(scene, path, dpi=dpi)
    else:
        from .render.mpl import render_pdf
        render_pdf(scene, path)
