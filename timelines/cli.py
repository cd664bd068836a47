"""Command line: `timelines render | parse | check | lanes`. Thin over the API; one error
reporter.

Exit codes: 0 success, 1 the input had errors or rows were left out (the chart is still
written unless --strict), 2 usage errors.

Settings: `render`, `check` and `lanes` read `--config FILE` (TOML, keys are the long option
names); an option on the command line wins over the file, the file over the default, and
`--print-config` shows each effective setting and where it came from (see `config`).
"""
from __future__ import annotations

import argparse
import contextlib
import datetime
import json
import os
import sys
from importlib import resources
from pathlib import Path

from . import __version__
from . import lanes as lane_report
from .chart import ChartOptions, LaneSettings, Privacy, arrange, read_records, render
from .check import check
from .config import apply_settings, config_lines, parse_distance
from .dates import (
    DEFAULT_SETTINGS, SETTING_HELP, DateSettings, describe, explain, options_from_settings,
    settings_from_options,
)
from .encodings import FRINGES
from .errors import TimelineError, UsageError
from .layout import GROUP_ORDERS, LABEL_MODES, PACKINGS, SORT_KEYS
from .page import parse_font_size, parse_size, png_dpi
from .sources import ColumnMap
from .scene import TEXT_MODES
from .theme import DEFAULT_THEME, PALETTES
from .window import outside_note, parse_window

DEMO = "fenwold-organ-builders.csv"
DATE_DEFAULTS = options_from_settings(DEFAULT_SETTINGS)
ERAS = ("bce", "bc", "astronomical", "bp")
LANE_DEFAULTS = LaneSettings()
# Options that say what to run or where output goes, not how: never read from a config file.
NOT_SETTINGS = frozenset({"help", "input", "output", "demo", "config", "print_config", "json",
                          "format", "command", "debug", "version", "text"})
CONFIG_COMMANDS = ("render", "check", "lanes")
UNSET = {**{part: "found from the header names" for part in
            ("start", "end", "when", "label", "group", "color", "id")},
         "sheet": "the first sheet", "subgroup": "none", "lane-column": "none",
         "max-lanes": "no limit", "from": "the earliest record", "to": "the latest record",
         "bands": "none", "facet": "none", "size": "--width wide, as tall as the chart",
         "font-size": "9pt", "dpi": "150, or 96 with --size in px", "note": "none"}


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
    draw.add_argument("-o", "--output", help="OUT.svg, OUT.png or OUT.pdf")
    draw.add_argument("--demo", action="store_true", help="use the bundled demo table")
    _table_options(draw)
    _lane_options(draw)
    _window_options(draw)
    _text_options(draw)
    draw.add_argument("--fringe", choices=sorted(FRINGES), default=DEFAULT_THEME.fringe,
                      help=f"how possible parts are drawn (default {DEFAULT_THEME.fringe})")
    draw.add_argument("--era", choices=ERAS, default=DEFAULT_THEME.era, help="year labels")
    draw.add_argument("--width", type=float, default=DEFAULT_THEME.width,
                      help=f"chart width in px (default {DEFAULT_THEME.width:g})")
    draw.add_argument("--palette", choices=sorted(PALETTES), default="okabe-ito",
                      help="colours for --color (default okabe-ito; tol-* are Paul Tol's)")
    _page_options(draw)
    draw.add_argument("--text", dest="text_mode", choices=TEXT_MODES, default="text",
                      help="SVG text as text (default) or as glyph outlines (paths) for print")
    _privacy_options(draw)
    draw.add_argument("--strict", action="store_true",
                      help="write nothing if any row is not drawn")
    _config_options(draw)

    read = commands.add_parser("parse", help="show how date texts are read")
    read.add_argument("text", nargs="*", help="date texts; stdin lines when none are given")
    read.add_argument("--json", action="store_true", help="one JSON object per input line")
    read.add_argument("--explain", action="store_true",
                      help="say how each bound was reached: form, rule, convention setting")
    _date_options(read)

    validate = commands.add_parser("check", help="report what cannot be read in a table")
    validate.add_argument("input", nargs="?", help="CSV, TSV, XLSX or ODS file")
    validate.add_argument("--json", action="store_true", help="the report as JSON")
    _table_options(validate)
    _config_options(validate)

    report = commands.add_parser("lanes", help="show how records are grouped and packed "
                                               "into lanes")
    report.add_argument("input", nargs="?", help="CSV, TSV, XLSX or ODS file")
    report.add_argument("--demo", action="store_true", help="use the bundled demo table")
    report.add_argument("--format", choices=("table", "csv", "json"), default="table",
                        help="a table per group (default), or one row per record: "
                             "row,id,group,lane,box_start,box_end")
    _table_options(report)
    _lane_options(report)
    _window_options(report)
    report.add_argument("--era", choices=ERAS, default=DEFAULT_THEME.era, help="year labels")
    report.add_argument("--width", type=float, default=DEFAULT_THEME.width,
                        help=f"chart width in px (default {DEFAULT_THEME.width:g}): "
                             "labels and page distances take room by it")
    _config_options(report)
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


def _lane_options(parser: argparse.ArgumentParser) -> None:
    lanes = parser.add_argument_group("lanes")
    defaults = LANE_DEFAULTS
    lanes.add_argument("--subgroup", metavar="COL", help="column nesting groups inside --group")
    for level in ("group", "subgroup"):
        lanes.add_argument(f"--{level}-order", metavar="ORDER", type=_group_order_text,
                           default=defaults.group_order,
                           help=f"{level} order: first (earliest start, the default), name, "
                                f"size (largest first), or {level} names separated by commas")
    for level in ("group", "subgroup"):
        lanes.add_argument(f"--min-{level}-size", metavar="N", type=_count(0),
                           default=getattr(defaults, f"min_{level}_size"),
                           help=f"merge {level}s of fewer than N records into one "
                                "(see --other-group)")
    lanes.add_argument("--other-group", metavar="NAME", default=defaults.other_group,
                       help=f"name of the merged small groups (default {defaults.other_group})")
    lanes.add_argument("--pack", choices=PACKINGS, default=defaults.pack,
                       help="compact: fewest lanes (default); ordered: keep the --sort order "
                            "top to bottom; single: one record per lane")
    lanes.add_argument("--sort", metavar="KEY", default=defaults.sort,
                       help=f"{', '.join(SORT_KEYS)} (default start) or a column")
    lanes.add_argument("--descending", action="store_true", help="sort from the largest")
    lanes.add_argument("--lane-gap", metavar="DISTANCE", type=_distance_text,
                       default=defaults.lane_gap,
                       help="least space between bars in one lane: a time (5y, 6mo, 30d) or a "
                            f"page distance (4px, 1mm); default {defaults.lane_gap}")
    lanes.add_argument("--lane-column", metavar="COL",
                       help="column of lane numbers (1, 2, ...) pinning records to a lane")
    lanes.add_argument("--max-lanes", metavar="N", type=_count(1),
                       help="at most N lanes a group; records that find no room are "
                            "listed and not drawn")
    lanes.add_argument("--labels", choices=LABEL_MODES, default=defaults.labels,
                       help="beside: inside the bar when it fits, else beside it (default); "
                            "inside: inside or only in the tooltip, for the most compact "
                            "lanes; none: tooltips only")


def _window_options(parser: argparse.ArgumentParser) -> None:
    window = parser.add_argument_group("time shown")
    window.add_argument("--from", dest="window_from", metavar="DATE",
                        help="start the axis at the earliest day of DATE (e.g. 1650, 44 BC); "
                             "records wholly before it are listed, not drawn")
    window.add_argument("--to", dest="window_to", metavar="DATE",
                        help="end the axis at the latest day of DATE; records reaching past "
                             "either edge are cut there and marked as continuing")


def _text_options(parser: argparse.ArgumentParser) -> None:
    words = parser.add_argument_group("words on the chart")
    words.add_argument("--title", default="", help="chart title")
    words.add_argument("--subtitle", default="", help="a line under the title")
    words.add_argument("--credit", default="", help="a source or credit line at the foot")
    words.add_argument("--note", action="append", metavar="TEXT",
                       help="a note under the chart (repeat for more)")
    words.add_argument("--bands", metavar="FILE",
                       help="a table of named periods (label, start, end) drawn behind "
                            "the lanes")
    words.add_argument("--facet", metavar="COL",
                       help="one small timeline per value of COL, in a grid on one time axis")


def _page_options(parser: argparse.ArgumentParser) -> None:
    page = parser.add_argument_group("page")
    page.add_argument("--size", metavar="WxH", type=_checked(parse_size),
                      help="page size such as 180x120mm, 7x5in or 1200x800px; the chart "
                           "fills the height, bars closer together if it must (overrides "
                           "--width)")
    page.add_argument("--font", default=DEFAULT_THEME.font_family, metavar="FAMILY",
                      help=f"font family (default {DEFAULT_THEME.font_family}, whose "
                           "metrics label room is always measured with)")
    page.add_argument("--font-size", metavar="SIZE", type=_checked(parse_font_size),
                      help="label size in pt (9) or px (12px); other text scales with it "
                           "(default 9pt)")
    page.add_argument("--dpi", type=float,
                      help="PNG resolution (default 150, or 96 with --size in px)")


def _privacy_options(parser: argparse.ArgumentParser) -> None:
    living = parser.add_argument_group("living people (see docs/privacy.md)")
    living.add_argument("--withhold-living", action="store_true",
                        help="replace the details of possibly living persons: no end date "
                             "and a start within --living-years of --as-of")
    living.add_argument("--as-of", metavar="YEAR", type=int,
                        help="the reference year for --withhold-living (default: this year)")
    living.add_argument("--living-years", metavar="N", type=_count(1), default=100,
                        help="how recent a start counts as possibly living (default 100)")


def _config_options(parser: argparse.ArgumentParser) -> None:
    parser.add_argument("--config", metavar="FILE",
                        help="TOML file of settings; keys are the long option names")
    parser.add_argument("--print-config", action="store_true",
                        help="print the effective settings and where each came from, and stop")


def _group_order_text(text: str) -> str:
    if not text.strip():
        raise argparse.ArgumentTypeError(f"give {', '.join(GROUP_ORDERS)} or group names "
                                         "separated by commas")
    return text


def _checked(parse):
    """An argparse type keeping the option's text, once `parse` has read it without error
    (the text, not the value, so --print-config shows what was written)."""
    def text_of(text: str) -> str:
        try:
            parse(text)
        except UsageError as error:
            raise argparse.ArgumentTypeError(f"{error} ({error.hint})") from None
        return text
    text_of.__name__ = parse.__name__.removeprefix("parse_")
    return text_of


_distance_text = _checked(parse_distance)


def _count(least: int):
    def count(text: str) -> int:
        try:
            number = int(text)
        except ValueError:
            number = least - 1
        if number < least:
            raise argparse.ArgumentTypeError(f"expected a whole number >= {least}, "
                                             f"not {text!r}")
        return number
    count.__name__ = "number"
    return count


def _date_options(parser: argparse.ArgumentParser) -> None:
    conventions = parser.add_argument_group("date conventions (docs/dates.md)")
    for name, meaning in SETTING_HELP.items():
        conventions.add_argument(f"--{name}", metavar="VALUE", default=DATE_DEFAULTS[name],
                                 help=meaning.replace("%", "%%"))  # argparse formats help


def main(argv: list[str] | None = None) -> int:
    argv = sys.argv[1:] if argv is None else list(argv)
    parser = build_parser()
    args = parser.parse_args(argv)
    with _reporting(args.debug) as outcome:
        if args.command in CONFIG_COMMANDS:
            settings = apply_settings(build_parser, argv, args, CONFIG_COMMANDS, NOT_SETTINGS)
            if args.print_config:
                print(f"# timelines {args.command}: effective settings "
                      "(command line over config file over default)")
                print("\n".join(config_lines(settings.values(), UNSET)))
                return 0
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
    except BrokenPipeError:
        # The reader stopped early (`timelines lanes ... | head`): not an error of ours.
        sys.stdout = open(os.devnull, "w")
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
    given = {name: getattr(args, name.replace("-", "_")) for name in SETTING_HELP}
    try:
        return settings_from_options(given)
    except ValueError as error:
        raise UsageError(str(error), hint="see docs/dates.md for each convention") from None


def _columns(args) -> ColumnMap:
    return ColumnMap(start=args.start, end=args.end, when=args.when, label=args.label,
                     group=args.group, color=args.color, id=args.id)


def _lane_settings(args) -> LaneSettings:
    return LaneSettings(
        subgroup=args.subgroup, group_order=args.group_order,
        subgroup_order=args.subgroup_order, min_group_size=args.min_group_size,
        min_subgroup_size=args.min_subgroup_size,
        other_group=args.other_group, pack=args.pack, sort=args.sort,
        descending=args.descending, lane_gap=args.lane_gap, lane_column=args.lane_column,
        max_lanes=args.max_lanes, labels=args.labels)


def _privacy(args) -> Privacy | None:
    if not args.withhold_living:
        return None
    as_of = args.as_of if args.as_of is not None else datetime.date.today().year
    return Privacy(as_of, args.living_years)


def _input_path(args, parser) -> Path:
    if getattr(args, "demo", False):
        if args.input:
            parser.error("give either INPUT or --demo, not both")
        return Path(str(resources.files("timelines") / "demo" / DEMO))
    if not args.input:
        demo = " or --demo" if hasattr(args, "demo") else ""
        parser.error(f"{args.command} needs INPUT (a CSV, TSV, XLSX or ODS file){demo}")
    return Path(args.input)


def run_render(args, parser) -> int:
    if args.when and (args.start or args.end):
        parser.error("give either --when or --start/--end, not both")
    if not args.output:
        parser.error("render needs -o OUT.svg, OUT.png or OUT.pdf")
    if args.size and args.width != DEFAULT_THEME.width:
        parser.error("give either --size or --width, not both")
    result = render(_input_path(args, parser), args.output, _render_options(args))
    _print_run(result.arranged, args, args.era)
    for warning in result.warnings:
        print(f"warning: {warning}", file=sys.stderr)
    if result.written is None:
        print("error: nothing written (--strict and some rows were not drawn)", file=sys.stderr)
    else:
        print(f"wrote {result.written}", file=sys.stderr)
    return 1 if result.arranged.not_drawn or _band_problems(result.arranged) else 0


def _render_options(args) -> ChartOptions:
    theme = DEFAULT_THEME.with_options(fringe=args.fringe, era=args.era, width=args.width,
                                       palette=PALETTES[args.palette], font_family=args.font)
    if args.font_size:
        theme = theme.with_font_size(parse_font_size(args.font_size))
    title = args.title or ("The Fenwold organ builders, 1600–1720 (invented demo data)"
                           if args.demo else "")
    size = parse_size(args.size) if args.size else None
    settings = _settings(args)
    notes = [args.note] if isinstance(args.note, str) else args.note or []  # a config string
    return ChartOptions(
        columns=_columns(args), sheet=args.sheet, settings=settings, theme=theme, title=title,
        strict=args.strict, dpi=png_dpi(args.dpi, size), lanes=_lane_settings(args),
        text=args.text_mode, privacy=_privacy(args), subtitle=args.subtitle,
        credit=args.credit, notes=tuple(notes), window=_window(args, settings),
        bands=args.bands, facet=args.facet, size=size)


def _window(args, settings: DateSettings):
    return parse_window(args.window_from, args.window_to, settings)


def _band_problems(arranged) -> int:
    return len(arranged.bands.problems) if arranged and arranged.bands else 0


def _print_run(arranged, args, era: str) -> None:
    """Every problem, warning and layout note on stderr, then the summary line."""
    _print_problems(arranged.loaded.problems)
    _print_problems(arranged.report.warnings)
    if arranged.bands:
        _print_problems(arranged.bands.problems)
    if arranged.withheld:
        people = "1 record" if arranged.withheld == 1 else f"{arranged.withheld} records"
        print(f"note: {people} of possibly living persons shown without their details "
              "(--withhold-living)", file=sys.stderr)
    for placement in arranged.placements:
        for line in lane_report.note_lines(placement.notes, era):
            print(line, file=sys.stderr)
    if arranged.outside:
        named = " (named under the chart)" if args.command == "render" else ""
        print(f"note: {outside_note(len(arranged.outside))}{named}", file=sys.stderr)
    if arranged.bands_off_axis:
        names = ", ".join(repr(band.label) for band in arranged.bands_off_axis)
        print(f"note: bands not drawn, outside the time shown or undated: {names}",
              file=sys.stderr)
    print(arranged.summary(args.max_lanes), file=sys.stderr)
    _print_hidden_labels(arranged.placements)


def _print_hidden_labels(placements) -> None:
    hidden = sum(s.labels_left_out for placement in placements
                 for s in lane_report.group_summaries(placement) if s.densest is not None)
    if hidden:
        labels = "1 label did not fit, is" if hidden == 1 else f"{hidden} labels did not fit, are"
        print(f"note: {labels} kept in the tooltips only ('timelines lanes' counts them by "
              "group; --width gives more room)", file=sys.stderr)


def run_lanes(args, parser) -> int:
    if args.when and (args.start or args.end):
        parser.error("give either --when or --start/--end, not both")
    theme = DEFAULT_THEME.with_options(era=args.era, width=args.width)
    settings = _settings(args)
    options = ChartOptions(columns=_columns(args), sheet=args.sheet, settings=settings,
                           theme=theme, lanes=_lane_settings(args),
                           window=_window(args, settings))
    arranged = arrange(_input_path(args, parser), options)
    _print_run(arranged, args, theme.era)
    if arranged.placement is None:
        raise TimelineError("nothing to lay out: no row has a usable date")
    if args.format == "csv":
        lane_report.write_csv(arranged.placement, sys.stdout)
    elif args.format == "json":
        lane_report.write_json(arranged.placement, sys.stdout)
    else:
        print("\n".join(lane_report.summary_lines(arranged.placement, theme.era)))
    return 1 if arranged.not_drawn else 0


def _print_problems(problems) -> None:
    for problem in problems:
        print(problem, file=sys.stderr)



def run_check(args, parser) -> int:
    options = ChartOptions(columns=_columns(args), sheet=args.sheet, settings=_settings(args))
    loaded = read_records(_input_path(args, parser), options)
    report = check(loaded)
    if args.json:
        print(json.dumps(report.as_dict(), ensure_ascii=False, indent=2))
    else:
        for line in report.lines():     # the report is this command's output: stdout
            print(line)
        print(report.summary())
    return 1 if report.not_drawn else 0


def run_parse(args, parser) -> int:
    if args.json and args.explain:
        parser.error("give either --json or --explain, not both")
    settings = _settings(args)
    texts = args.text if args.text else [line.rstrip("\r\n") for line in sys.stdin]
    failed = 0
    for number, text in enumerate(texts):
        result = describe(text, settings)
        failed += not result["ok"]
        if args.explain:
            print(("\n" if number else "") + "\n".join(explain(text, settings)))
        else:
            print(json.dumps(result, ensure_ascii=False) if args.json else _plain(result))
    return 1 if failed else 0


def _plain(result: dict) -> str:
    if not result["ok"]:
        return f"{result['input']}: error: {result['error']}"
    qualifiers = f"; {', '.join(result['qualifiers'])}" if result["qualifiers"] else ""
    earliest = result["earliest"] or "open"
    latest = result["latest"] or "open"
    return f"{result['input']}: {earliest} .. {latest} ({result['precision']}{qualifiers})"


COMMANDS = {"render": run_render, "parse": run_parse, "check": run_check, "lanes": run_lanes}

__all__ = ["main", "build_parser"]
