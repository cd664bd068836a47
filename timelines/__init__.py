"""timelines: honest timeline charts from chronologies with fuzzy, partial and BC dates.

The pipeline runs one way, each stage a pure function of the one before plus options:

    table file --read--> rows --parse--> Records --check--> Report
                                   |
                                   +--layout--> Placement --compose--> Scene --render--> SVG/PNG/PDF

- `calendar`: integer fixed day numbers (R.D.), Gregorian and Julian, BC/BCE years.
- `model`: frozen `Endpoint` (earliest/latest window, precision, qualifiers), `Span`, `Record`.
- `dates`: the date language (ISO 8601-1/-2 and historians' free text) -> endpoints and spans.
- `sources`: CSV/TSV/XLSX/ODS -> records, every unreadable cell reported with row and column.
- `check`: counts and warnings. `layout`: groups and lanes. `scale`: days -> page x, ticks.
- `encodings`, `compose`, `legend`: marks -> a renderer-neutral `Scene`.
- `render.svg` (svgwrite) and `render.mpl` (matplotlib): Scene -> files.
- `chart.render()` runs it all; `cli` is a thin command line over it.
"""
__version__ = "0.1.0"

from .dates import DateSettings, parse_date, parse_endpoint, parse_span  # noqa: E402
from .errors import DateError, SourceError, TimelineError, UsageError  # noqa: E402
from .model import Endpoint, Precision, Provenance, Qualifier, Record, Span  # noqa: E402

__all__ = [
    "DateError", "DateSettings", "Endpoint", "Precision", "Provenance", "Qualifier", "Record",
    "SourceError", "Span", "TimelineError", "UsageError", "parse_date", "parse_endpoint",
    "parse_span",
]
