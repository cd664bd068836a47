"""The whole job in named steps: read -> parse -> check -> layout -> scene -> draw.

`render()` is what `timelines render` runs; `arrange()` stops after the layout (what
`timelines lanes` reports); `build_scene()` is the part after the records exist, for callers
who make records themselves. The user's lane options arrive by name (`LaneSettings`, made into
the layout's rules by `layout.settings`). Around the lanes: the time window of --from/--to
(`layout.window`, its dates read by `parse_window`), background bands from a second table
(`scene.bands`), one panel per value of a facet column (`scene.facets`) and the page size the
chart is fitted to (`scene.page`).
"""
from __future__ import annotations

from dataclasses import dataclass, replace
from functools import partial
from pathlib import Path
from typing import Callable, Iterable, Sequence


from ..check.report import Report, check
from ..dates import DEFAULT_SETTINGS, DateError, DateSettings, explain, parse_endpoint
from ..errors import TimelineError, UsageError, did_you_mean
from ..layout import (
    GroupNode, LaneRules, LaneSettings, Placement, TimeWindow, UnknownGroup, group_records,
    group_tree, lane_rules, place, split_by_window,
)
from ..layout.grouping import BY_GROUP, check_listed_names
from ..layout.settings import group_order
from ..layout.distances import Distance, parse_distance
from ..columnar import RecordColumns
from ..model import Record
from ..render import output_format, writable, write
from ..scene.activity import ActivitySeries
from ..scene.bands import on_axis
from ..scene.explore import ExploreData, explore_data
from ..scene.overview import Overview
from ..scene.compose import ChartText, colors_of, compose, title_height
from ..scene.facets import Panel, compose_facets, panel_width
from ..scene.measure import (
    LABEL_CLEARANCE, chart_scale, days_per_px, drawn_measure, key_width, label_width,
    label_widths,
)
from ..scene.fonts import font_list
from ..scene.page import FittedPage, fit_height, font_note
from ..scene.pages import split_pages
from ..scene.primitives import Scene
from ..scene.scale import TimeScale
from ..scene.theme import DEFAULT_THEME, Theme
from ..sources import ColumnMap, LoadResult
from ..sources.columns import existing_column
from ..sources.fields import column_reader
from .activity import activity_notes, activity_series
from .options import ChartOptions
from .overview import choose_part, wanted
from .reading import ReadTable, read_bands, read_source

_GROUP = BY_GROUP   # a record's group: the C-level getter; a table's columns group at once


@dataclass(frozen=True, slots=True)
class Arranged:
    """A table read, checked and laid out; no scale or placement when nothing is dated.
    With `--facet`, `panels` holds each value's placement (all on one `scale`) instead."""

    loaded: LoadResult
    report: Report
    columns: ColumnMap
    scale: TimeScale | None
    placement: Placement | None
    withheld: int = 0                   # records shown without their details
    outside: tuple[Record, ...] = ()    # dated records wholly outside --from/--to
    bands: LoadResult | None = None     # the --bands table
    panels: tuple[Panel, ...] = ()      # with --facet: one placement per value
    bounded: int = 0                    # records whose open side --longest bounded
    narrowed: int = 0                   # bounds the --constraints statements narrowed
    overview: Overview | None = None    # a large table's counts above the lanes of a part
    summarised: int = 0                 # dated records in the overview only, not in lanes

    @property
    def placements(self) -> tuple[Placement, ...]:
        if self.panels:
            return tuple(panel.placement for panel in self.panels)
        return (self.placement,) if self.placement else ()

    @property
    def bands_off_axis(self) -> tuple[Record, ...]:
        """Bands with no part in the time shown (or no usable date): not drawn."""
        if self.bands is None or self.scale is None:
            return ()
        return tuple(on_axis(self.bands.records, (self.scale.start, self.scale.end))[1])

    @property
    def not_drawn(self) -> int:
        """Rows without a bar: unreadable, contradictory, undated or left out of the lanes.
        Rows outside --from/--to are not counted: the user chose to leave them out."""
        return self.report.not_drawn + len(self.left_out)

    @property
    def left_out(self) -> tuple[Record, ...]:
        return tuple(record for placement in self.placements for record in placement.left_out)

    def summary(self, max_lanes: int | None = None) -> str:
        """The check's one-line summary, with the records the lanes had no room for and those
        outside the window."""
        hidden = len(self.left_out) + len(self.outside) + self.summarised
        counts = replace(self.report.counts, drawn=self.report.counts.drawn - hidden)
        text = replace(self.report, counts=counts).summary()
        if self.summarised:
            text += f"; {self.summarised} counted in the overview only (--overview)"
        if self.left_out:
            limit = f" (at most {max_lanes} lanes a group)" if max_lanes else ""
            text += f"; {len(self.left_out)} left out for lack of room{limit}"
        if self.outside:
            text += f"; {len(self.outside)} outside --from/--to"
        return text


@dataclass(frozen=True, slots=True)
class RunResult:
    loaded: LoadResult
    report: Report
    scene: Scene | None
    written: Path | None
    arranged: Arranged | None = None
    warnings: tuple[str, ...] = ()      # about the page: a chart taller than --size, the font


def render(source: str | Path, output: str | Path, options: ChartOptions = ChartOptions()
           ) -> RunResult:
    output = Path(output)
    output_format(output)                                   # fail before any work
    options = page_options(options)
    arranged = arrange(source, options)                     # read + parse + check + layout
    if options.strict and arranged.not_drawn:
        return RunResult(arranged.loaded, arranged.report, None, None, arranged)
    page = arranged_page(arranged, options)                 # scene, fitted to the page
    write(page.scene, output, dpi=options.dpi, text=options.text)  # draw
    first_font = font_list(options.theme.font_family)[0]     # the list's first family
    warnings = tuple(w for w in (page.warning, font_note(first_font)) if w)
    return RunResult(arranged.loaded, arranged.report, page.scene, output, arranged, warnings)


def paged_scenes(arranged: Arranged, page: FittedPage, options: ChartOptions) -> list[Scene]:
    """The chart as pages at group breaks (`scene.pages`), each as tall as the --size height
    or, without one, an A4 page of the chart's width (ISO 216: 210 x 297 mm)."""
    if arranged.panels:
        raise UsageError("--pages splits a chart of one panel", hint="leave out --facet")
    if arranged.bands is not None:
        raise UsageError("--pages does not split a chart with --bands yet",
                         hint="leave out --bands, or write one tall page")
    if options.activity:
        raise UsageError("--pages does not split a chart with --activity yet",
                         hint="leave out --activity, or draw `timelines activity` apart")
    size = options.size
    height = size.height if size and size.height else page.scene.width * 297 / 210
    return split_pages(page.scene, arranged.scale, page.theme, height)


def output_path(path: str | Path) -> Path:
    """`path` once it is known that a chart can be written there: a format the suffix names,
    a folder that exists and takes files. For checking before any work is done."""
    output_format(path)
    return writable(path)


def page_options(options: ChartOptions) -> ChartOptions:
    """Options with what the drawing takes from elsewhere in its theme: the page width of
    `size` (where the layout measures it) and the calendar the dates were read in (the
    axis counts in it)."""
    theme = replace(options.theme, calendar=options.settings.reckoning)
    if options.size is not None:
        theme = replace(theme, width=options.size.width)
    return replace(options, theme=theme)


def arrange(source: object, options: ChartOptions = ChartOptions()) -> Arranged:
    """Read, parse, check and lay out `source` (anything `read_source` takes)."""
    return arrange_read(read_source(source, page_options(options)), options)


def arrange_read(read: ReadTable, options: ChartOptions = ChartOptions()) -> Arranged:
    """Check and lay out what `read_source` gave."""
    options = page_options(options)
    loaded, columns, header = read.loaded, read.columns, read.header
    report = check(loaded, findings=read.findings)                       # check
    kept, outside = split_by_window(loaded.records, options.window)      # the window
    bands = (read_bands(options.bands, options.settings, options.date_numbers,
                        options.encoding) if options.bands is not None else None)
    part = None
    if not options.facet and wanted(report.counts.drawn, options.overview):
        part = choose_part(loaded.records, kept, options.window, options.where, options.first,
                           lambda name: column_reader(columns, header, name, "--where"),
                           options.theme.era, options.theme.calendar)
        kept, outside = part.records, []          # the others are in the overview
    arranged = Arranged(loaded, report, columns, None, None, read.withheld, tuple(outside),
                        bands, bounded=read.bounded, narrowed=read.narrowed,
                        overview=part.overview if part else None,
                        summarised=part.summarised if part else 0)
    dated = _dated(kept)
    if not dated:
        return arranged
    rules, gap = lane_rules(options.lanes, partial(column_reader, columns, header))
    if options.facet:
        return _arrange_panels(arranged, dated, options, header, rules, gap)
    tree = _group_tree(dated, rules)
    scale = chart_scale(dated, options.theme, tree, options.window)      # scale
    placement = lay_out(kept, scale, options.theme, rules, gap,          # layout
                        options.lanes.labels, tree)
    return replace(arranged, scale=scale, placement=placement)


def _dated(records: Sequence[Record]) -> Sequence[Record]:
    """The records with a span; a table's columns stay columns."""
    if isinstance(records, RecordColumns):
        return records.dated_part()
    return [r for r in records if r.span is not None]


def _arrange_panels(arranged: Arranged, dated: list[Record], options: ChartOptions,
                    header, rules: LaneRules, gap: Distance) -> Arranged:
    """One placement per value of the facet column, all on one time scale and one width."""
    facet = existing_column(header, options.facet, "facet") if header else options.facet
    order = group_order(options.facet_order)
    facets = group_records(dated, column_reader(arranged.columns, header, facet, "facet"),
                           order)
    if isinstance(order, tuple):
        try:
            check_listed_names(order, [name for name, _ in facets])
        except UnknownGroup as error:
            raise UsageError(f"--facet-order: {error}",
                             hint=did_you_mean(error.name, error.known)) from error
    theme = replace(options.theme, width=panel_width(options.theme.width, len(facets)))
    # Faceted by the group column, a panel is one group: no group names inside it.
    group_of = (lambda r: None) if facet == arranged.columns.group else _GROUP
    trees = [_group_tree(members, rules, group_of) for _, members in facets]
    scale = chart_scale(dated, theme, [node for tree in trees for node in tree], options.window)
    panels = tuple(Panel(name, lay_out(members, scale, theme, rules, gap, options.lanes.labels,
                                       tree))
                   for (name, members), tree in zip(facets, trees))
    return replace(arranged, scale=scale, panels=panels)


def arranged_scene(arranged: Arranged, options: ChartOptions) -> Scene:
    return arranged_page(arranged, options).scene


def arranged_page(arranged: Arranged, options: ChartOptions) -> FittedPage:
    """The scene of an arranged table, fitted to the page height of `options.size`."""
    if arranged.scale is None and arranged.outside:
        raise UsageError(f"nothing to draw: all {len(arranged.outside)} dated records lie "
                         "outside --from/--to", hint="widen the window or leave it out")
    if arranged.scale is None:
        raise TimelineError("nothing to draw: no row has a usable date")
    options = page_options(options)
    records = arranged.loaded.records
    report = arranged.report
    text = ChartText(options.title, tuple(r for r in records if r.span is None),
                     report.not_drawn - report.undated, subtitle=options.subtitle,
                     credit=options.credit, notes=options.notes, outside=arranged.outside,
                     color_title=arranged.columns.color or "")
    bands = arranged.bands.records if arranged.bands else ()
    if arranged.panels:
        if options.activity:
            raise UsageError("--activity adds its strip under a chart of one panel",
                             hint="leave out --facet, or draw `timelines activity` apart")
        facet = options.facet or ""
        return fit_height(lambda theme: compose_facets(
            arranged.panels, arranged.scale, theme, text, *_colors(records, arranged, theme),
            facet=facet, bands=bands), options.theme, options.size)
    counts, count_notes = activity_strip_series(arranged, options)
    text = replace(text, notes=(*text.notes, *count_notes))
    return fit_height(lambda theme: placement_scene(
        records, arranged.placement, arranged.scale, theme, text=text, bands=bands,
        activity=counts, overview=arranged.overview), options.theme, options.size)


def arranged_explore(arranged: Arranged, options: ChartOptions) -> ExploreData:
    """The HTML explorer's data of an arranged table: the same placement as the chart."""
    if arranged.scale is None or arranged.placement is None:
        arranged_page(arranged, options)          # raises: nothing to draw, and why
        raise UsageError("the explorer draws one panel", hint="leave out --facet")
    options = page_options(options)
    records = arranged.loaded.records
    report = arranged.report
    text = ChartText(options.title, tuple(r for r in records if r.span is None),
                     report.not_drawn - report.undated, subtitle=options.subtitle,
                     credit=options.credit, notes=options.notes, outside=arranged.outside,
                     color_title=arranged.columns.color or "")
    settings = options.settings
    return explore_data(arranged.placement, arranged.scale, options.theme,
                        *_colors(records, arranged, options.theme), text,
                        explain=lambda written: explain(written, settings))


def activity_strip_series(arranged: Arranged, options: ChartOptions
                          ) -> tuple[list[ActivitySeries], tuple[str, ...]]:
    """With --activity, the counts per block of the records drawn (`analysis.activity`),
    over the chart's time span, one series per kind of record, and the notes on what the
    counts leave out."""
    drawn = [p.record for _, group in arranged.placement.leaves() for p in group.records]
    if not options.activity or not drawn:
        return [], ()
    from ..analysis.activity import activity    # pandas: loaded only when asked for
    table = activity(drawn, per=options.activity, start=int(arranged.scale.start),
                     end=int(arranged.scale.end), era=options.theme.era)
    return activity_series(table), activity_notes(table)


def _colors(records, arranged: Arranged, theme: Theme):
    """(colour of a record, the colour key) for the records drawn, in table order."""
    return _drawn_colors(records, arranged.placements, theme)


def _drawn_colors(records, placements, theme: Theme):
    drawn = {id(p.record) for placement in placements
             for _, group in placement.leaves() for p in group.records}
    return colors_of([r for r in records if id(r) in drawn], theme)


def color_warning(arranged: Arranged, options: ChartOptions) -> str | None:
    """A warning when the colour column has more values than the palette has colours."""
    theme = options.theme
    values = len({r.color for r in arranged.loaded.records if r.color and r.span})
    if theme.max_colors is not None or values <= len(theme.palette):
        return None
    return (f"the colour column {arranged.columns.color!r} has {values} values and the "
            f"palette {len(theme.palette)} colours, so colours repeat; --max-colors "
            f"{len(theme.palette)} gives the smallest values one colour, 'other'")


def build_scene(records: Iterable[Record], theme: Theme = DEFAULT_THEME, title: str = "",
                not_drawn: int = 0, lanes: LaneSettings = LaneSettings(),
                columns: ColumnMap = ColumnMap(), window: TimeWindow | None = None,
                bands: Iterable[Record] = (), text: ChartText | None = None) -> Scene:
    """The scene of records made by the caller (no table): what `render` draws."""
    records = list(records)
    kept, outside = split_by_window(records, window)
    dated = _dated(kept)
    if not dated:
        raise TimelineError("nothing to draw: no row has a usable date")
    rules, gap = lane_rules(lanes, partial(column_reader, columns, None))
    tree = _group_tree(dated, rules)
    scale = chart_scale(dated, theme, tree, window)                             # scale
    placement = lay_out(kept, scale, theme, rules, gap, lanes.labels, tree)     # layout
    text = text or ChartText(title, placement.undated, not_drawn)
    return placement_scene(records, placement, scale, theme, text=replace(       # scene
        text, outside=tuple(outside)), bands=tuple(bands))


def placement_scene(records: Iterable[Record], placement: Placement, scale: TimeScale,
                    theme: Theme, title: str = "", not_drawn: int = 0, *,
                    text: ChartText | None = None, bands: Iterable[Record] = (),
                    activity: Sequence[ActivitySeries] = (),
                    overview: Overview | None = None) -> Scene:
    # Colours in order of first appearance in the table, for the records drawn.
    color_of, colors = _drawn_colors(records, (placement,), theme)
    text = text or ChartText(title, placement.undated, not_drawn)
    return compose(placement, scale, theme, text, color_of, colors,
                   plot_top=title_height(text, theme) + 8, bands=tuple(bands),
                   activity=activity, overview=overview)


def _group_tree(records: list[Record], rules: LaneRules,
                group_of: Callable[[Record], str | None] = _GROUP
                ) -> tuple[GroupNode, ...]:
    try:
        return group_tree(records, group_of, rules)
    except UnknownGroup as error:
        raise UsageError(str(error), hint=did_you_mean(error.name, error.known)) from error


def lay_out(records: list[Record], scale: TimeScale, theme: Theme,
            rules: LaneRules = LaneRules(), gap: Distance = parse_distance("3px"),
            labels: str = "beside", tree: tuple[GroupNode, ...] | None = None) -> Placement:
    """Pack on what is drawn: each bar with its fringes, open ends and the signs beside it,
    labels measured in the renderers' font. `tree`: the groups, when already made."""
    per_px = days_per_px(scale)
    try:
        return place(records, domain=(scale.start, scale.end),
                     measure_spans=drawn_measure(scale, theme),
                     label_width=label_width(scale, theme),
                     group_key=_GROUP, gap=gap.days(per_px),
                     label_pad=theme.label_pad * per_px,
                     label_clearance=LABEL_CLEARANCE * theme.label_pad * per_px,
                     labels=labels, rules=rules, tree=tree,
                     key_width=key_width(len(records), scale, theme),
                     label_widths=label_widths(scale, theme))
    except UnknownGroup as error:
        raise UsageError(str(error), hint=did_you_mean(error.name, error.known)) from error


def parse_window(start_text: str | None, end_text: str | None,
                 settings: DateSettings = DEFAULT_SETTINGS) -> TimeWindow | None:
    """The window of `--from`/`--to` texts (None when neither is given)."""
    if not start_text and not end_text:
        return None
    start = _window_bound(start_text, "--from", settings, earliest=True)
    end = _window_bound(end_text, "--to", settings, earliest=False)
    return TimeWindow(start, end, start_text or "", end_text or "")


def _window_bound(text: str | None, option: str, settings: DateSettings, *,
                  earliest: bool) -> int | None:
    if not text:
        return None
    try:
        endpoint = parse_endpoint(text, settings)
    except DateError as error:
        raise UsageError(f"{option}: cannot read {text!r}: {error.reason}",
                         hint=error.hint or "give a date such as 1650, 1650-06 or 44 BC"
                         ) from error
    day = endpoint.earliest if earliest else endpoint.latest
    if day is None:
        side = "start" if earliest else "end"
        raise UsageError(f"{option} {text!r} has no day to {side} the axis at",
                         hint="give a bounded date such as 1650")
    return day
