"""Every setting of a chart, as the pipeline takes them: what the command line builds from
its arguments and `Chart`'s setting methods change one at a time."""
from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

from ..dates import DEFAULT_SETTINGS, DateSettings
from ..layout import LaneSettings, TimeWindow
from ..scene.page import PageSize
from ..scene.theme import DEFAULT_THEME, Theme
from ..sources import ColumnMap


@dataclass(frozen=True, slots=True)
class ChartOptions:
    columns: ColumnMap = field(default_factory=ColumnMap)
    sheet: str | None = None
    header_row: int = 1                 # the row naming the columns (titles may stand above)
    settings: DateSettings = DEFAULT_SETTINGS
    theme: Theme = DEFAULT_THEME
    title: str = ""
    strict: bool = False
    dpi: float = 150.0
    lanes: LaneSettings = field(default_factory=LaneSettings)
    text: str = "text"                  # SVG text: "text", or "paths" (glyph outlines)
    privacy: "Privacy | None" = None    # withhold possibly living persons' details
    subtitle: str = ""
    credit: str = ""                    # a source or credit line at the foot of the page
    notes: tuple[str, ...] = ()         # the user's notes under the chart
    window: TimeWindow | None = None    # --from/--to: the time the axis shows
    bands: object = None                # a table of named periods drawn behind the lanes
    facet: str | None = None            # a column: one small timeline per value
    size: PageSize | None = None        # the page; its width overrides the theme's
    facet_order: str = "first"          # first, name, size, or facet values separated by commas
    pages: bool = False                 # a PDF split into pages at group breaks
    constraints: str | Path | None = None   # statements between records that tighten bounds
    activity: str | None = None         # a block (decade, century, 25 ...): counts under the lanes
    # A table too large to read lane by lane: "auto" draws the overview (counts per block and
    # group, overview.py) above the lanes of a part from OVERVIEW_FROM records on; "yes",
    # "no" force it. The part: --from/--to, `where` (COLUMN=VALUE), and the first `first`
    # records by start.
    overview: str = "auto"
    where: str | None = None
    first: int | None = None
    longest: str | None = None          # a longest plausible duration bounding open sides
    longest_column: str | None = None   # a column giving each record its own
    longest_by_group: tuple[tuple[str, str], ...] = ()   # (group, duration): each group's own
    date_numbers: str = "years"         # a spreadsheet's numbers in date columns: years or serials
    encoding: str | None = None         # of text tables (and --bands): None, found (decoding.py)
    events: bool = False                # each row one moment in a window (not-before, not-after)


@dataclass(frozen=True, slots=True)
class Privacy:
    """Withhold the details of possibly living persons (see `check.living`, docs/privacy.md)."""

    as_of_year: int
    years: int = 100
