"""Write docs/api.md from the code: the signatures and docstrings of the public API.

`python tools/make_api_docs.py` rewrites the page; tests/test_docs.py fails when the page and
the code differ, so the page cannot drift. The prose between the entries lives here.
"""
from __future__ import annotations

import dataclasses
import enum
import inspect
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

import timelines  # noqa: E402
from timelines.chart import Chart  # noqa: E402

PAGE = ROOT / "docs" / "api.md"

INTRO = """\
# timelines from Python

*This page is generated from the code by `tools/make_api_docs.py`; edit the docstrings, not
the page.*

Everything the command line does is here too, through one object: a `Chart` holds the data
and every setting, and each setting method returns a new chart. In a notebook:

```python
import pandas as pd
import timelines

people = pd.read_csv("houses.csv")              # dates as people write them: c. 1650, 1690s
chart = timelines.Chart(people, start="born", end="died", label="name", group="house")
chart                                           # the chart, inline (SVG)
chart.report.summary()                          # '5 rows read: 5 drawn'
chart.titles("Three houses").save("houses.svg") # the same bytes `timelines render` writes
timelines.read(people)                          # each date's bounds as DataFrame columns
people["born"].dates.parse()                    # one column's bounds
timelines.year_axis(ax)                         # BCE-aware year ticks on any Axes
chart.draw(ax)                                  # the lanes in an Axes of your own
```

A worked example that runs in the tests: `docs/examples/notebook_tour.py`.

Dates inside are integer *fixed day numbers* (R.D. 1 = 0001-01-01 of the proleptic Gregorian
calendar, the count of Python's `date.toordinal()`); years are astronomical (0 = 1 BCE). On a
matplotlib axis they are *decimal years*: each 1 January a whole number.
"""

SECTIONS = [
    ("The chart", [Chart]),
    ("Dates for DataFrames", [timelines.read, timelines.parse_series,
                              timelines.register_accessor]),
    ("Reading one date", [timelines.parse_date, timelines.parse_span,
                          timelines.parse_endpoint]),
    ("The model", [timelines.Endpoint, timelines.Span, timelines.Record]),
    ("matplotlib", ["year_axis", "EraYearLocator", "EraYearFormatter"]),
]


def signature(function) -> str:
    """`(a: int, *, b: str = 'x') -> Chart`: as inspect gives it, with the annotations (which
    are strings here, `from __future__ import annotations`) written without their quotes."""
    shown = inspect.signature(function)
    parameters = []
    star = False
    for parameter in shown.parameters.values():
        if parameter.name in ("self", "cls"):
            continue
        text = parameter.name
        if parameter.kind is parameter.VAR_POSITIONAL:
            text, star = "*" + text, True
        elif parameter.kind is parameter.VAR_KEYWORD:
            text = "**" + text
        elif parameter.kind is parameter.KEYWORD_ONLY and not star:
            parameters.append("*")
            star = True
        if parameter.annotation is not parameter.empty:
            text += f": {_annotation(parameter.annotation)}"
        if parameter.default is not parameter.empty:
            text += f" = {_default(parameter.default)}"
        parameters.append(text)
    result = f"({', '.join(parameters)})"
    if shown.return_annotation is not shown.empty:
        result += f" -> {_annotation(shown.return_annotation)}"
    return result


def _default(value) -> str:
    """A default as a reader writes it: `Precision.DAY`, `DateSettings()` for the defaults."""
    if isinstance(value, enum.Enum):
        return f"{type(value).__name__}.{value.name}"
    if dataclasses.is_dataclass(value) and value == type(value)():
        return f"{type(value).__name__}()"
    return repr(value)


def _annotation(annotation) -> str:
    text = annotation if isinstance(annotation, str) else inspect.formatannotation(annotation)
    return text.strip("'\"")


def entry(obj, level: str = "###", owner: str = "timelines") -> list[str]:
    """A heading with the signature, then the docstring."""
    name = obj.__name__
    if isinstance(obj, type):
        shown = signature(obj.__init__) if "__init__" in vars(obj) else ""
        shown = shown.removesuffix(" -> None")
    else:
        shown = signature(obj)
    lines = [f"{level} `{owner}.{name}{shown}`", ""]
    doc = inspect.getdoc(obj)
    if doc:
        lines += [doc, ""]
    return lines


def members(cls: type) -> list[str]:
    """The public methods and properties of a class, in the order of its source."""
    lines = []
    for name, member in cls.__dict__.items():
        if name.startswith("_"):
            continue
        if isinstance(member, property):
            doc = inspect.getdoc(member) or ""
            lines += [f"#### `.{name}`", "", *([doc, ""] if doc else [])]
        elif isinstance(member, classmethod):
            lines += entry(member.__func__, "####", f"{cls.__name__}")
        elif inspect.isfunction(member):
            doc = inspect.getdoc(member) or ""
            lines += [f"#### `.{name}{signature(member)}`", "", *([doc, ""] if doc else [])]
    return lines


def page() -> str:
    lines = [INTRO]
    for title, objects in SECTIONS:
        lines += [f"## {title}", ""]
        for obj in objects:
            obj = getattr(timelines, obj) if isinstance(obj, str) else obj
            lines += entry(obj)
            if obj is Chart:
                lines += members(Chart)
    return "\n".join(lines).rstrip() + "\n"


if __name__ == "__main__":
    PAGE.write_text(page(), encoding="utf-8")
    print(f"wrote {PAGE.relative_to(ROOT)}")
