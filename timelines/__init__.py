"""timelines: honest timeline charts from chronologies with fuzzy, partial and BC dates.

The pipeline runs one way, each stage a pure function of the one before plus options:

    table file --read--> rows --parse--> Records --check--> Report
                                   |
                                   +--layout--> Placement --scene--> Scene --render--> SVG/PNG/PDF

The root keeps the model and the pipeline; each stage is a package that imports only the ones
before it:

- `errors`, `calendar` (integer fixed day numbers, Gregorian and Julian, BC/BCE years) and
  `model` (frozen `Endpoint`, `Span`, `Record`): what every stage shares.
- `dates`: the date language (ISO 8601-1/-2 and historians' free text) -> endpoints and spans.
- `sources`: CSV/TSV/XLSX/ODS -> records, every unreadable cell reported with row and column.
- `check`: counts and warnings; withholding possibly living persons' details.
- `layout`: groups, lanes and labels in fixed days; the user's lane settings; the lanes report.
- `scene`: scale, ticks, marks, legend -> a renderer-neutral `Scene` of primitives.
- `render`: Scene -> SVG (svgwrite), PNG and PDF (matplotlib).
- `chart`: the whole job in named steps; `cli`: a thin command line over it.
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
