"""`Chart`: the one front door for Python users, and what the command line itself runs.

A Chart is an immutable spec: the data and every setting. Each setting method returns a new
chart, so a base chart can be varied freely. Nothing is read or drawn until a result is asked
for (`report`, `scene()`, `save()`, the notebook display); the steps then run once per chart
and are kept, so displaying a chart and then saving it reads the table once. (A DataFrame
changed after the chart first read it is not read again: make a new Chart.)

    chart = (timelines.Chart(df, start="born", end="died", label="name", group="family")
             .lanes(pack="ordered", sort="start")
             .titles("The Marrable family"))
    chart                       # shows inline in Jupyter (SVG)
    chart.save("family.svg")    # or .png, .pdf; a binary file object with format="png"
    chart.report.summary()      # rows read, drawn and reported
"""
from __future__ import annotations

import datetime
import io
from collections.abc import Sequence
from dataclasses import fields, replace
from os import PathLike
from pathlib import Path

from ..check.report import Report
from ..dates import DateSettings, settings_from_options
from ..dates.periods import PeriodTable
from ..sources.periods import read_periods_file
from ..errors import TimelineError, UsageError, did_you_mean
from ..layout import LaneSettings
from ..render import output_format, write, write_html, write_pages, write_to
from ..scene.coverage import missing_glyph_notes
from ..scene.encodings import FRINGES
from ..scene.fonts import font_list
from ..scene.page import font_note, parse_font_size, parse_size, png_dpi, tall_note
from ..scene.explore import ExploreData
from ..scene.primitives import TEXT_MODES, Scene
from ..scene.theme import PALETTES
from ..calendar import ERAS
from ..sources import ColumnMap
from ..sources.decoding import checked_encoding
from ..sources.serials import DATE_NUMBERS
from .options import ChartOptions, Privacy
from .pipeline import (
    Arranged, arrange_read, arranged_explore, arranged_page, color_warning, page_options,
    paged_scenes,
    parse_window,
)
from .reading import ReadTable, duration_days, read_source

_COLUMN_PARTS = tuple(f.name for f in fields(ColumnMap))
_LANE_SETTINGS = tuple(f.name for f in fields(LaneSettings))


class Chart:
    """A timeline chart of `data`: a table file's path (CSV, TSV, XLSX, ODS), a pandas
    DataFrame, an iterable of rows (dicts of column name to cell) or of Records.

    The columns that play each part are found by their header names (`start`, `born`,
    `end`, `died`, `label`, `name`, `group`, ...) unless named here: `start`/`end`, or `when`
    for one column holding a whole span; `label`, `group` (lanes are packed per group),
    `color` (a column coloured with a colour-blind-safe palette) and `id`. `sheet` picks a
    spreadsheet's sheet by name or number; `header_row` is the row naming the columns when a
    title or notes stand above it; `encoding` names a text table's encoding (and a bands
    table's), by default found: UTF-8, UTF-16 by its mark, else Windows-1252 with a note."""

    __slots__ = ("_data", "_options", "_window_text", "_cache")

    def __init__(self, data, *, start: str | None = None, end: str | None = None,
                 when: str | None = None, label: str | None = None, group: str | None = None,
                 color: str | None = None, id: str | None = None, sheet: str | None = None,
                 header_row: int = 1, encoding: str | None = None):
        columns = ColumnMap(start=start, end=end, when=when, label=label, group=group,
                            color=color, id=id)
        _check_columns(columns)
        if encoding is not None:
            checked_encoding(encoding)
        self._data = data
        self._options = ChartOptions(columns=columns, sheet=sheet, header_row=header_row,
                                     encoding=encoding)
        self._window_text: tuple[str | None, str | None] = (None, None)
        self._cache: dict[str, object] = {}

    @classmethod
    def from_options(cls, data, options: ChartOptions) -> "Chart":
        """A chart of `data` with every setting taken from `options` (what the command line
        builds from its arguments)."""
        chart = cls(data)
        chart._options = options
        if options.window is not None:
            chart._window_text = (options.window.start_text or None,
                                  options.window.end_text or None)
        return chart

    # --- settings: each returns a new chart ------------------------------------------------

    def columns(self, **parts: str | None) -> "Chart":
        """The columns that play each part, by header name: start, end, when, label, group,
        color, id (None: found by name again, or not used)."""
        _check_names(parts, _COLUMN_PARTS, "column part")
        columns = replace(self._options.columns, **parts)
        _check_columns(columns)
        return self._with(columns=columns)

    def lanes(self, **settings) -> "Chart":
        """How records are grouped, ordered and packed into lanes: subgroup, group_order
        ("first", "name", "size" or names separated by commas), subgroup_order,
        min_group_size, min_subgroup_size, other_group, pack ("compact", "ordered",
        "single"), sort ("start", "end", "duration", "label" or a column), descending,
        lane_gap (a time such as "5y" or a page length such as "4px"), lane_column,
        max_lanes, labels ("beside", "inside", "none"). See README, 'Lanes'."""
        _check_names(settings, _LANE_SETTINGS, "lane setting")
        return self._with(lanes=replace(self._options.lanes, **settings))

    def dates(self, settings: DateSettings | None = None, *, date_numbers: str | None = None,
              periods: "str | Path | PeriodTable | None" = None, **conventions) -> "Chart":
        """How dates are read: a DateSettings, and/or conventions by name (calendar,
        century, before_after, circa_year, day_first, year_start, language, ...:
        docs/dates.md); date_numbers: a spreadsheet's numbers in date columns are "years"
        (the default) or "serials" (days as the spreadsheet counts them); periods: a table
        file of your own named periods and reigns (or a PeriodTable), whose labels then read
        as dates."""
        _check_choice(date_numbers, DATE_NUMBERS, "date_numbers")
        base = settings or self._options.settings
        given = {name.replace("_", "-"): value for name, value in conventions.items()}
        try:
            settings = settings_from_options(given, base)
        except ValueError as error:
            raise UsageError(str(error), hint="see docs/dates.md for each convention") from None
        if periods is not None:
            table = periods if isinstance(periods, PeriodTable) else read_periods_file(
                periods, settings)
            settings = replace(settings, periods=table)
        if date_numbers is None:
            return self._with(settings=settings)
        return self._with(settings=settings, date_numbers=date_numbers)

    def window(self, start: str | None = None, end: str | None = None) -> "Chart":
        """Show only the time from `start` to `end` (dates as fuzzy as anywhere: from the
        earliest day `start` may mean to the latest of `end`; either may be None)."""
        parse_window(start, end, self._options.settings)        # a bad date fails here
        chart = self._with()
        chart._window_text = (start, end)
        return chart

    def titles(self, title: str | None = None, *, subtitle: str | None = None,
               credit: str | None = None, notes: tuple[str, ...] | list[str] | None = None
               ) -> "Chart":
        """Words above and below the chart: a title, a subtitle, a credit or source line at
        the foot, and notes under the chart."""
        changes = {name: value for name, value in (("title", title), ("subtitle", subtitle),
                                                   ("credit", credit)) if value is not None}
        if notes is not None:
            changes["notes"] = (notes,) if isinstance(notes, str) else tuple(notes)
        return self._with(**changes)

    def style(self, *, fringe: str | None = None, era: str | None = None,
              palette: str | tuple[str, ...] | None = None,
              font: str | Sequence[str] | None = None,
              font_size: float | str | None = None, width: float | None = None,
              max_colors: int | None = None) -> "Chart":
        """How the marks look: fringe ("fade", "whisker", "hatch", "dots": the possible
        parts), era ("bce", "bc", "astronomical", "bp": year labels), palette (a name such as
        "okabe-ito", or colours), font (a family or a list of families, "A, B" or ["A", "B"],
        each character set in the first that has it), font_size (points, or "12px"), width
        (px), max_colors (at most this many colours for the colour column: the smallest
        values beyond share one, 'other')."""
        _check_choice(fringe, sorted(FRINGES), "fringe")
        _check_choice(era, ERAS, "era")
        if isinstance(palette, str):
            _check_choice(palette, sorted(PALETTES), "palette")
            palette = PALETTES[palette]
        if font is not None and not isinstance(font, str):
            font = ", ".join(font)
        if max_colors is not None and max_colors < 2:
            raise UsageError(f"max_colors must be at least 2, not {max_colors}")
        theme = self._options.theme.with_options(fringe=fringe, era=era, width=width,
                                                 max_colors=max_colors,
                                                 palette=palette, font_family=font)
        if font_size is not None:
            theme = theme.with_font_size(parse_font_size(str(font_size)))
        return self._with(theme=theme)

    def page(self, *, size: str | None = None, dpi: float | None = None,
             text: str | None = None, pages: bool | None = None) -> "Chart":
        """The page: size ("180x120mm", "7x5in", "1200x800px" or a width alone), dpi of a
        PNG (default 150, or 96 for a size in px), and SVG text as "text" or "paths" (glyph
        outlines, for print shops); pages: a PDF split into pages at group breaks, each the
        size's height (an A4 page of the chart's width without one), the axis on every page."""
        _check_choice(text, TEXT_MODES, "text")
        changes: dict[str, object] = {}
        if size is not None:
            changes["size"] = parse_size(size)
        if dpi is not None or size is not None:
            changes["dpi"] = png_dpi(dpi, changes.get("size", self._options.size))
        if text is not None:
            changes["text"] = text
        if pages is not None:
            changes["pages"] = pages
        return self._with(**changes)

    def ends(self, *, longest: str | None = None, column: str | None = None,
             by_group: dict[str, str] | None = None) -> "Chart":
        """Bound the ends the data leave open (an empty cell, `after 1780` as an end) by a
        longest plausible duration: `longest` for every record ("110y" for lives: a common
        genealogists' rule of thumb, never a default), each group's own in `by_group`
        ({"Apprentice": "7y"}), or each record's own from `column` (a time such as "7y", or a
        number of years); a record's column cell wins over its group, its group over
        `longest`. Without one, such an end is drawn as a short stub whose length says
        nothing."""
        if longest is not None:
            duration_days(longest, "longest")          # a bad duration fails here
        pairs = tuple((str(group), str(text)) for group, text in (by_group or {}).items())
        for group, text in pairs:
            duration_days(text, f"the duration of {group!r}")
        return self._with(longest=longest, longest_column=column, longest_by_group=pairs)

    def events(self, not_before: str | None = None, not_after: str | None = None) -> "Chart":
        """Each row is an event (a wreck, a find, a letter): one moment somewhere between a
        not-before and a not-after date (terminus post quem and ante quem), not a span that
        lasted from one to the other. `not_before`/`not_after` name those columns (else the
        start and end columns are read as them); a `when` cell is then one moment in its
        whole window (`1st century BC`). Drawn as a marker in a shaded window, never a bar."""
        columns = self._options.columns
        if not_before is not None or not_after is not None:
            if columns.when:
                raise UsageError("give either when or not_before/not_after, not both")
            columns = replace(columns, start=not_before or columns.start,
                              end=not_after or columns.end)
        return self._with(columns=columns, events=True)

    def constrain(self, statements: str | PathLike | None) -> "Chart":
        """Narrow the records' windows by a table of statements between them ("the will before
        the death", "apprenticeship lasts 7y"; docs/api.md, analysis.constraints): the chart
        draws the tightened windows; statements that cannot all hold stop it, named."""
        return self._with(constraints=statements)

    def activity(self, per: str | int | None = "decade") -> "Chart":
        """Add a strip under the lanes, on the same time axis: how many of the records drawn
        were active per block of `per` (year, decade, century, millennium or a number of
        years; `analysis.activity`), events and spans each in their own panel. None: none."""
        return self._with(activity=None if per is None else str(per))

    def overview(self, mode: str = "yes", *, where: str | None = None,
                 first: int | None = None) -> "Chart":
        """For a table too large to read lane by lane: per group, the counts of records
        active per block over all the time, above the lanes of a part (chart/overview.py).
        `mode`: "auto" (from 5,000 dated records on: the default), "yes" or "no"; the part:
        the window (`window`), `where` ("COLUMN=VALUE"), the `first` N by start, those whose
        dates bound both ends first and, in a window, those beginning in it (50)."""
        return self._with(overview=mode, where=where, first=first)

    def withhold_living(self, as_of: int | None = None, years: int = 100) -> "Chart":
        """Show records that may be of living persons without their names and details
        (docs/privacy.md): those that could have started within `years` before `as_of`
        (a year; this year by default) with no known end."""
        as_of = datetime.date.today().year if as_of is None else as_of
        return self._with(privacy=Privacy(as_of, years))

    def bands(self, data) -> "Chart":
        """Named periods drawn as pale bands behind the lanes: a table (path, DataFrame or
        rows) with columns label, start, end (or when)."""
        return self._with(bands=data)

    def facet(self, column: str | None, order: str = "first") -> "Chart":
        """One small timeline per value of `column`, all on one time axis (None: one chart);
        `order` as a group order: "first" (earliest start), "name", "size" or values
        separated by commas."""
        return self._with(facet=column, facet_order=order)

    def strict(self, strict: bool = True) -> "Chart":
        """With strict, `save` writes nothing (and raises) when any row is not drawn."""
        return self._with(strict=strict)

    # --- results ------------------------------------------------------------------------------

    @property
    def data(self):
        """What the chart draws: the path, DataFrame, rows or Records it was made with."""
        return self._data

    @property
    def options(self) -> ChartOptions:
        """Every setting, as the pipeline takes them."""
        window = parse_window(*self._window_text, self._options.settings)
        return page_options(replace(self._options, window=window))

    def read(self) -> ReadTable:
        """The records and problems of the table (read and parsed, nothing laid out)."""
        return self._cached("read", lambda: read_source(self._data, self.options))

    @property
    def records(self):
        """The records read from the table, in table order (undated ones included)."""
        return self.read().loaded.records

    @property
    def problems(self):
        """Every row not drawn for a reason in its cells, with row, column, text and why."""
        return self.read().loaded.problems

    @property
    def report(self) -> Report:
        """Rows read, drawn and reported, every problem and warning (`report.summary()`)."""
        return self.layout().report

    def layout(self) -> Arranged:
        """The records checked, inside the window, grouped and packed into lanes."""
        return self._cached("layout", lambda: arrange_read(self.read(), self.options))

    @property
    def summary(self) -> str:
        """One line: rows read, drawn and reported, left out and outside the window."""
        return self.layout().summary(self._options.lanes.max_lanes)

    def scene(self) -> Scene:
        """The renderer-neutral scene: every mark in page units (px)."""
        return self._fitted().scene

    @property
    def warnings(self) -> tuple[str, ...]:
        """About the page: a chart taller than its size, a font other than the measured one."""
        page = self._fitted()
        first_font = font_list(self.options.theme.font_family)[0]   # the list's first family
        return tuple(w for w in (page.warning, font_note(first_font),
                                 *missing_glyph_notes(page.scene),
                                 color_warning(self.layout(), self.options),
                                 tall_note(page.scene)) if w)

    def save(self, target: str | PathLike | object, format: str | None = None
             ) -> Path | None:
        """Write the chart: to a path (the suffix says SVG, PNG or PDF; `format` may say it
        instead), or to a binary file object with `format`. A path is written whole or not at
        all: an earlier file there stays until the new one is complete. Returns the path."""
        if isinstance(target, (str, PathLike)):
            path = Path(target)
            suffix = output_format(path if format is None else path.with_suffix("." + format))
            self._check_strict()
            if suffix == ".html":
                write_html(self.explore(), path)
            elif self._options.pages:
                write_pages(self.pages(), path if suffix == ".pdf" else path.with_suffix(suffix))
            else:
                write(self.scene(), path, dpi=self.options.dpi, text=self.options.text,
                      format=suffix)
            return path
        suffix = output_format(Path("chart." + (format or _name_suffix(target))))
        self._check_strict()
        if suffix == ".html":
            target.write(self.to_html().encode("utf-8"))
        elif self._options.pages and suffix == ".pdf":
            from ..render.mpl import render_pdf_pages
            render_pdf_pages(self.pages(), target)
        else:
            write_to(self.scene(), target, suffix, dpi=self.options.dpi,
                     text=self.options.text)
        return None

    def pages(self) -> list[Scene]:
        """The chart split into pages at group breaks, the axis under each page's lanes (what
        `save` writes as a PDF with `page(pages=True)`)."""
        return paged_scenes(self.layout(), self._fitted(), self.options)

    def to_svg(self) -> str:
        """The chart as SVG text."""
        return self._cached("svg", lambda: self._bytes(".svg").decode("utf-8"))

    def explore(self) -> "ExploreData":
        """What the HTML explorer draws: the chart's placement, in days, as plain data."""
        # The explorer shows every record itself: no overview of a part.
        whole = self if self._options.overview == "no" else self._with(overview="no")
        if whole is not self and "read" in self._cache:
            whole._cache["read"] = self._cache["read"]      # the table, read once
        return self._cached("explore", lambda: arranged_explore(whole.layout(), self.options))

    def to_html(self) -> str:
        """The chart as a self-contained HTML page to explore (zoom, filter, details)."""
        from ..render.html import render_html
        return render_html(self.explore())

    def to_png(self) -> bytes:
        """The chart as PNG bytes, at the page's dpi."""
        return self._bytes(".png")

    def draw(self, ax):
        """Draw the chart's lanes into an existing matplotlib Axes: the same marks, with x in
        years (astronomical: 0 is 1 BCE) on a BCE-aware year axis, group names as y labels.
        The rest of the figure is left as it was. Returns `ax`."""
        from ..render.axes import draw_on_axes

        arranged = self.layout()
        if arranged.scale is None:
            self.scene()                    # raises: nothing to draw, and why
        return draw_on_axes(self.scene(), arranged.scale, ax, era=self.options.theme.era)

    # --- the notebook display -----------------------------------------------------------------

    def _repr_svg_(self) -> str:
        return self.to_svg()

    def _repr_mimebundle_(self, include=None, exclude=None) -> dict[str, str]:
        return {"image/svg+xml": self.to_svg(), "text/plain": repr(self)}

    def __repr__(self) -> str:
        used = ", ".join(f"{name}={value!r}" for name, value in vars_of(self._options.columns))
        return f"Chart({_data_text(self._data)}{', ' if used else ''}{used})"

    # --- helpers ------------------------------------------------------------------------------

    def _with(self, **changes) -> "Chart":
        chart = object.__new__(Chart)
        chart._data = self._data
        chart._options = replace(self._options, **changes)
        chart._window_text = self._window_text
        chart._cache = {}
        return chart

    def _cached(self, key: str, make):
        if key not in self._cache:
            self._cache[key] = make()
        return self._cache[key]

    def _fitted(self):
        return self._cached("page", lambda: arranged_page(self.layout(), self.options))

    def _check_strict(self) -> None:
        """With strict, any row not drawn stops the write, the --bands table's included."""
        arranged = self.layout()
        bands = len(arranged.bands.problems) if arranged.bands else 0
        if self._options.strict and (arranged.not_drawn or bands):
            also = f"; {bands} rows of the bands table not read" if bands else ""
            raise TimelineError(f"nothing written: {self.summary}{also} (strict)")

    def _bytes(self, suffix: str) -> bytes:
        buffer = io.BytesIO()
        write_to(self.scene(), buffer, suffix, dpi=self.options.dpi, text=self.options.text)
        return buffer.getvalue()


def vars_of(columns: ColumnMap):
    return [(name, getattr(columns, name)) for name in _COLUMN_PARTS
            if getattr(columns, name) is not None]


def _data_text(data) -> str:
    if isinstance(data, (str, PathLike)):
        return repr(str(data))
    shape = getattr(data, "shape", None)
    if shape is not None:
        return f"<{type(data).__name__} {shape[0]}x{shape[1]}>"
    return f"<{type(data).__name__}>"


def _name_suffix(target) -> str:
    name = getattr(target, "name", "")
    suffix = Path(name).suffix.lstrip(".") if isinstance(name, str) else ""
    if not suffix:
        raise UsageError("say which format to write to a file object",
                         hint='give format="svg", "png" or "pdf"')
    return suffix


def _check_columns(columns: ColumnMap) -> None:
    if columns.when and (columns.start or columns.end):
        raise UsageError("give either when or start/end, not both",
                         hint="when is one column holding a whole span (1650-1660)")


def _check_names(given: dict, known: tuple[str, ...], what: str) -> None:
    for name in given:
        if name not in known:
            raise UsageError(f"unknown {what} {name!r}",
                             hint=did_you_mean(name, known) or f"known: {', '.join(known)}")


def _check_choice(value, choices, what: str) -> None:
    if value is not None and value not in choices:
        raise UsageError(f"{what} {value!r} is not one of {', '.join(choices)}",
                         hint=did_you_mean(str(value), choices))
