"""Command line: `timelines render | parse | check`. Thin over the API; one error reporter.

Exit codes: 0 success, 1 the input had errors (the chart is still written unless --strict),
2 usage errors.
"""
from __future__ import annotations

import argparse
import contextlib
import json
import sys
from dataclasses import replace
from importlib import resources
from pathlib import Path

from . import __version__
from .calendar import CALENDARS
from .chart import ChartOptions, read_records, render
from .check import check
from .dates import DEFAULT_SETTINGS, DateSettings, describe
from .encodings import FRINGES
from .errors import TimelineError, UsageError
from .sources import ColumnMap
from .theme import DEFAULT_THEME

DEMO = "fenwold-organ-builders.csv"


class _Parser(argparse.ArgumentParser):
    def error(self, message: str):  # usage errors exit 2, as argparse does, with our prefix
        self.print_usage(sys.stderr)
        print(f"error: {message}", file=sys.stderr)
        raise SystemExit(2)


def build_parser() -> argparse.ArgumentParser:
    parser = _Parser(prog="timelines", description="Timeline charts from fuzzy dates.")
    parser.add_argument("--version", action="version", version=f"timelines {__version__}")
    parser.add_argument("--debug", action="store_true", help="show tracebacks")
    commands = parser.add_subparsers(dest="command", required=True, parser_class=_Parser)

    draw = commands.add_parser("render", help="draw a table of dated records as SVG, PNG or PDF")
    draw.add_argument("input", nargs="?", help="CSV, TSV, XLSX or ODS file")
    draw.add_argument("-o", "--output", required=True, help="OUT.svg, OUT.png or OUT.pdf")
    draw.add_argument("--demo", action="store_true", help="use the bundled demo table")
    _table_options(draw)
    draw.add_argument("--title", default="", help="chart title")
    draw.add_argument("--fringe", choices=sorted(FRINGES), help="how possible parts are drawn")
    draw.add_argument("--era", choices=("bce", "bc", "astronomical"), help="year labels")
    draw.add_argument("--width", type=float, help="chart width in px (default 960)")
    draw.add_argument("--dpi", type=float, default=150.0, help="PNG resolution (default 150)")
    draw.add_argument("--strict", action="store_true", help="write nothing if any row fails")

    read = commands.add_parser("parse", help="show how date texts are read")
    read.add_argument("text", nargs="*", help="date texts; stdin lines when none are given")
    read.add_argument("--json", action="store_true", help="one JSON object per input line")
    _date_options(read)

    validate = commands.add_parser("check", help="report what cannot be read in a table")
    validate.add_argument("input", help="CSV, TSV, XLSX or ODS file")
    validate.add_argument("--json", action="store_true", help="the report as JSON")
    _table_options(validate)
    return parser


def _table_options(parser: argparse.ArgumentParser) -> None:
    columns = parser.add_argument_group("columns (detected from common header names if omitted)")
    for name, meaning in (("start", "start dates"), ("end", "end dates"),
                          ("when", "a whole span in one cell, e.g. 1650-1660"),
                          ("label", "labels"), ("group", "the grouping of lanes"),
                          ("color", "the colour category"), ("id", "record identifiers")):
        columns.add_argument(f"--{name}", metavar="COL", help=f"column of {meaning}")
    parser.add_argument("--sheet", help="sheet of an XLSX/ODS workbook (default: the first)")
    _date_options(parser)


def _date_options(parser: argparse.ArgumentParser) -> None:
    parser.add_argument("--calendar", choices=CALENDARS,
                        help="calendar of free-text dates (default: historical)")


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    with _reporting(args.debug) as outcome:
        outcome.code = COMMANDS[args.command](args, parser)
    return outcome.code


class _Outcome:
    code = 0


@contextlib.contextmanager
def _reporting(debug: bool):
    """The one place that turns known errors into `error: ...` / `hint: ...` on stderr."""
    outcome = _Outcome()
    try:
        yield outcome
    except UsageError as error:
        _print_error(error)
        outcome.code = 2
    except TimelineError as error:
        if debug:
            raise
        _print_error(error)
        outcome.code = 1
    except OSError as error:
        if debug:
            raise
        print(f"error: {error.strerror or error}: {error.filename or ''}".rstrip(": "),
              file=sys.stderr)
        outcome.code = 1


def _print_error(error: TimelineError) -> None:
    print(f"error: {error}", file=sys.stderr)
    if getattr(error, "hint", None):
        print(f"hint: {error.hint}", file=sys.stderr)


def _settings(args) -> DateSettings:
    return replace(DEFAULT_SETTINGS, calendar=args.calendar) if args.calendar else DEFAULT_SETTINGS


def _columns(args) -> ColumnMap:
    return ColumnMap(start=args.start, end=args.end, when=args.when, label=args.label,
                     group=args.group, color=args.color, id=args.id)


def _input_path(args, parser) -> Path:
    if args.demo:
        if args.input:
            parser.error("give either INPUT or --demo, not both")
        return Path(str(resources.files("timelines") / "demo" / DEMO))
    if not args.input:
        parser.error("render needs INPUT (a CSV, TSV, XLSX or ODS file) or --demo")
    return Path(args.input)


def run_render(args, parser) -> int:
    if args.when and (args.start or args.end):
        parser.error("give either --when or --start/--end, not both")
    theme = DEFAULT_THEME.with_options(fringe=args.fringe, era=args.era, width=args.width)
    title = args.title or ("The Fenwold organ builders, 1600–1720 (invented demo data)"
                           if args.demo else "")
    options = ChartOptions(columns=_columns(args), sheet=args.sheet, settings=_settings(args),
                           theme=theme, title=title, strict=args.strict, dpi=args.dpi)
    result = render(_input_path(args, parser), args.output, options)
    _print_problems(result.loaded.problems)
    _print_problems(result.report.warnings)
    print(result.report.summary(), file=sys.stderr)
    if result.written is None:
        print("error: nothing written (--strict and some rows were not drawn)", file=sys.stderr)
    else:
        print(f"wrote {result.written}", file=sys.stderr)
    return 1 if result.report.not_drawn else 0


def _print_problems(problems) -> None:
    for problem in problems:
        print(problem, file=sys.stderr)



def run_check(args, parser) -> int:
    options = ChartOptions(columns=_columns(args), sheet=args.sheet, settings=_settings(args))
    loaded = read_records(args.input, options)
    report = check(loaded)
    if args.json:
        print(json.dumps(report.as_dict(), ensure_ascii=False, indent=2))
    else:
        for line in report.lines():     # the report is this command's output: stdout
            print(line)
        print(report.summary())
    return 1 if report.not_drawn else 0


def run_parse(args, parser) -> int:
    settings = _settings(args)
    texts = args.text if args.text else [line.rstrip("\r\n") for line in sys.stdin]
    failed = 0
    for text in texts:
        result = describe(text, settings)
        failed += not result["ok"]
        print(json.dumps(result, ensure_ascii=False) if args.json else _plain(result))
    return 1 if failed else 0


def _plain(result: dict) -> str:
    if not result["ok"]:
        return f"{result['input']}: error: {result['error']}"
    qualifiers = f"; {', '.join(result['qualifiers'])}" if result["qualifiers"] else ""
    earliest = result["earliest"] or "open"
    latest = result["latest"] or "open"
    return f"{result['input']}: {earliest} .. {latest} ({result['precision']}{qualifiers})"


COMMANDS = {"render": run_render, "parse": run_parse, "check": run_check}

__all__ = ["main", "build_parser"]
