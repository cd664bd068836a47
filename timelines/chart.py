"""The whole job in named steps: read -> parse -> check -> layout -> scene -> draw.

`render()` is what `timelines render` runs; `build_scene()` is the part after the records
exist, for callers who make records themselves.
"""
from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path
from typing import Iterable

from .check import Report, check
from .compose import ChartText, compose, drawn_span, qualifier_kind, title_height
from .dates import DEFAULT_SETTINGS, DateSettings
from .errors import TimelineError, UsageError
from .layout import Placement, place
from .model import Record
from .scale import TimeScale, nice_domain
from .scene import Scene
from .sources import ColumnMap, LoadResult, detect_columns, load_records, read_table
from .textsize import text_width
from .theme import DEFAULT_THEME, Theme

FORMATS = (".svg", ".png", ".pdf")


@dataclass(frozen=True, slots=True)
class ChartOptions:
    columns: ColumnMap = field(default_factory=ColumnMap)
    sheet: str | None = None
    settings: DateSettings = DEFAULT_SETTINGS
    theme: Theme = DEFAULT_THEME
    title: str = ""
    strict: bool = False
    dpi: float = 150.0


@dataclass(frozen=True, slots=True)
class RunResult:
    loaded: LoadResult
    report: Report
    scene: Scene | None
    written: Path | None


def render(source: str | Path, output: str | Path, options: ChartOptions = ChartOptions()
           ) -> RunResult:
    output = Path(output)
    output_format(output)                                   # fail before any work
    loaded = read_records(source, options)                  # read + parse
    report = check(loaded)                                  # check
    if options.strict and report.not_drawn:
        return RunResult(loaded, report, None, None)
    not_drawn = report.not_drawn - report.undated
    scene = build_scene(loaded.records, options.theme, options.title, not_drawn=not_drawn)
    write(scene, output, dpi=options.dpi)                   # draw
    return RunResult(loaded, report, scene, output)


def read_records(source: str | Path, options: ChartOptions = ChartOptions()) -> LoadResult:
    table = read_table(source, options.sheet)
    columns = detect_columns(table.header, options.columns)
    return load_records(table, columns, options.settings)


def build_scene(records: Iterable[Record], theme: Theme = DEFAULT_THEME, title: str = "",
                not_drawn: int = 0) -> Scene:
    records = list(records)
    dated = [r for r in records if r.span is not None]
    if not dated:
        raise TimelineError("nothing to draw: no row has a usable date")
    scale = chart_scale(dated, theme)                                   # scale
    placement = lay_out(records, scale, theme)                          # layout
    colors = color_key(dated, theme)
    text = ChartText(title, placement.undated, not_drawn)
    by_value = dict(colors)
    return compose(placement, scale, theme, text,                       # scene
                   lambda r: by_value.get(r.color, theme.bar_color), colors,
                   plot_top=title_height(title, theme) + 8)


def chart_scale(dated: list[Record], theme: Theme) -> TimeScale:
    bounds = [day for r in dated for day in (r.span.start.earliest, r.span.start.latest,
                                             r.span.end.earliest, r.span.end.latest)
              if day is not None]
    low, high = nice_domain(min(bounds), max(bounds), era=theme.era)
    left = theme.margin + group_column_width(dated, theme)
    return TimeScale(low, high, left, theme.width - theme.margin)


def group_column_width(records: list[Record], theme: Theme) -> float:
    names = {r.group for r in records if r.group}
    if not names:
        return 0.0
    widest = max(text_width(name, theme.group_label_size, "bold") for name in names)
    return min(widest + 12, theme.width * 0.3)


def lay_out(records: list[Record], scale: TimeScale, theme: Theme) -> Placement:
    days_per_px = (scale.end - scale.start) / (scale.x1 - scale.x0)
    # the widest qualifier sign, '~?', sits beside a bar end
    mark_room = (text_width("~?", theme.small_font_size, "bold") + 3) * days_per_px
    marker = theme.bar_height * 0.6 * days_per_px

    def extent(record: Record) -> tuple[float, float]:
        span = record.span
        geometry = drawn_span(span, (scale.start, scale.end))
        if span.is_point:   # a diamond is wider than its day; its sign stands on the right
            return (geometry.start_low - marker,
                    geometry.end_high + marker + (mark_room if _has_glyph(span.end) else 0))
        return (geometry.start_low - (mark_room if _has_glyph(span.start) else 0),
                geometry.end_high + (mark_room if _has_glyph(span.end) else 0))

    def core(record: Record) -> tuple[float, float] | None:
        # Labels sit only on the solid core, where their contrast is known.
        geometry = drawn_span(record.span, (scale.start, scale.end))
        return (geometry.start_high, geometry.end_low) if geometry.has_core else None

    return place(records, domain=(scale.start, scale.end), drawn_extent=extent,
                 label_width=lambda r: text_width(r.label, theme.font_size) * days_per_px,
                 group_key=lambda r: r.group, gap=3 * days_per_px,
                 label_pad=theme.label_pad * days_per_px, inside_room=core)


def _has_glyph(endpoint) -> bool:
    return qualifier_kind(endpoint.qualifiers) is not None


def color_key(records: list[Record], theme: Theme) -> tuple[tuple[str, str], ...]:
    values = list(dict.fromkeys(r.color for r in records if r.color))
    return tuple((value, theme.color_for(i)) for i, value in enumerate(values))


def output_format(path: Path) -> str:
    suffix = path.suffix.lower()
    if suffix not in FORMATS:
        raise UsageError(f"cannot write {path.name!r}: the output must end in .svg, .png or .pdf")
    return suffix


def write(scene: Scene, path: Path, dpi: float = 150.0) -> None:
    suffix = output_format(path)
    if suffix == ".svg":
        from .render.svg import write_svg
        write_svg(scene, path)
    elif suffix == ".png":
        from .render.mpl import render_png
        render_png(scene, path, dpi=dpi)
    else:
        from .render.mpl import render_pdf
        render_pdf(scene, path)
