"""timelines: honest timeline charts from chronologies with fuzzy, partial and BC dates.

    import timelines
    chart = timelines.Chart("register.csv", start="born", end="died", group="family")
    chart.save("family.svg")                  # or .png, .pdf; shows inline in Jupyter
    frame = timelines.read(df)                # the bounds of every date, as DataFrame columns
    timelines.year_axis(ax)                   # BCE-aware year ticks on any matplotlib Axes

The pipeline runs one way, each stage a pure function of the one before plus options:

    table file --read--> rows --parse--> Records --check--> Report
                                   |
                                   +--layout--> Placement --scene--> Scene --render--> SVG/PNG/PDF

The root keeps the model and the pipeline; each stage is a package that imports only the ones
before it:

- `errors`, `calendar` (integer fixed day numbers, Gregorian and Julian, BC/BCE years) and
  `model` (frozen `Endpoint`, `Span`, `Record`): what every stage shares.
- `dates`: the date language (ISO 8601-1/-2 and historians' free text) -> endpoints and spans.
- `sources`: CSV/TSV/XLSX/ODS and DataFrames -> records, every unreadable cell reported.
- `check`: counts and warnings; withholding possibly living persons' details.
- `layout`: groups, lanes and labels in fixed days; the user's lane settings; the lanes report.
- `scene`: scale, ticks, marks, legend -> a renderer-neutral `Scene` of primitives.
- `render`: Scene -> SVG (a streaming XML writer), PNG and PDF (matplotlib), an HTML explorer;
  drawing into one's own Axes.
- `chart`: the whole job in named steps and the `Chart` object; `cli`: a thin command line.

matplotlib and pandas are imported only when something asks for them.
"""
import sys as _sys

__version__ = "0.1.0"

from .chart import Chart, ChartOptions
from .dates import DateSettings, parse_date, parse_endpoint, parse_span
from .errors import DateError, SourceError, TimelineError, UsageError
from .layout import LaneSettings
from .model import Endpoint, Precision, Provenance, Qualifier, Record, Span
from .sources.frames import parse_series, read, register_accessor

# matplotlib helpers, loaded on first use (an SVG run never imports matplotlib).
_FROM_AXES = ("EraYearFormatter", "EraYearLocator", "year_axis")

__all__ = [
    "Chart", "ChartOptions", "DateError", "DateSettings", "Endpoint", "EraYearFormatter",
    "EraYearLocator", "LaneSettings", "Precision", "Provenance", "Qualifier", "Record",
    "SourceError", "Span", "TimelineError", "UsageError", "parse_date", "parse_endpoint",
    "parse_series", "parse_span", "read", "register_accessor", "year_axis",
]


def __getattr__(name: str):
    if name in _FROM_AXES:
        from .render import axes
        return getattr(axes, name)
    raise AttributeError(f"module 'timelines' has no attribute {name!r}")


if "pandas" in _sys.modules:          # a notebook that has pandas gets `series.dates` now
    register_accessor()
