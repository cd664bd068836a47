"""The command line's options: one argparse parser for `render`, `parse`, `check` and `lanes`.

Every long option of `render`, `check` and `lanes` is also a key of the `--config` file (see
`config`); `commands` runs them.
"""
from __future__ import annotations

import argparse
import sys

from .. import __version__
from ..dates import DEFAULT_SETTINGS, SETTING_HELP, options_from_settings
from ..errors import UsageError
from ..layout import GROUP_ORDERS, LABEL_MODES, PACKINGS, SORT_KEYS
from ..layout.distances import parse_distance
from ..layout.settings import LaneSettings
from ..scene.encodings import FRINGES
from ..scene.page import parse_font_size, parse_size
from ..scene.primitives import TEXT_MODES
from ..scene.theme import DEFAULT_THEME, PALETTES
from ..sources.decoding import checked_encoding
from ..sources.serials import DATE_NUMBERS

DEMO = "fenwold-organ-builders.csv"
DATE_DEFAULTS = options_from_settings(DEFAULT_SETTINGS)
ERAS = ("bce", "bc", "astronomical", "bp")
LANE_DEFAULTS = LaneSettings()
# Options that say what to run or where output goes, not how: never read from a config file.
NOT_SETTINGS = frozenset({"help", "input", "output", "demo", "config", "print_config", "json",
                          "format", "command", "debug", "version", "text", "quiet",
                          "explain", "with_id", "on", "alongside"})
CONFIG_COMMANDS = ("render", "check", "lanes", "parse", "relate", "activity")
UNSET = {**{part: "found from the header names" for part in
            ("start", "end", "when", "label", "group", "color", "id")},
         "sheet": "the first sheet", "subgroup": "none", "lane-column": "none",
         "max-lanes": "no limit", "from": "the earliest record", "to": "the latest record",
         "bands": "none", "facet": "none", "size": "--width wide, as tall as the chart",
         "font-size": "9pt", "dpi": "150, or 96 with --size in px", "note": "none",
         "max-colors": "every value its own colour", "longest": "none: open ends drawn short",
         "longest-column": "none", "encoding": "found: UTF-8, UTF-16, Windows-1252"}


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
    _ends_options(draw)
    _text_options(draw)
    draw.add_argument("--fringe", choices=sorted(FRINGES), default=DEFAULT_THEME.fringe,
                      help=f"how possible parts are drawn (default {DEFAULT_THEME.fringe})")
    draw.add_argument("--era", choices=ERAS, default=DEFAULT_THEME.era, help="year labels")
    draw.add_argument("--width", type=float, default=DEFAULT_THEME.width,
                      help=f"chart width in px (default {DEFAULT_THEME.width:g})")
    draw.add_argument("--palette", choices=sorted(PALETTES), default="okabe-ito",
                      help="colours for --color (default okabe-ito; tol-* are Paul Tol's)")
    draw.add_argument("--max-colors", metavar="N", type=_count(2), default=None,
                      help="at most N colours for --color: the smallest values beyond share "
                           "one, 'other' (default: every value its own, repeating past the "
                           "palette's end, with a warning)")
    _page_options(draw)
    draw.add_argument("--constraints", metavar="FILE",
                      help="a table of statements between records (a before b, a lasts 7y, "
                           "...) that narrow their windows: the chart draws them narrowed")
    draw.add_argument("--activity", metavar="PERIOD", nargs="?", const="decade",
                      type=_checked_period, default=None,
                      help="a strip under the lanes: how many records were active per PERIOD "
                           "(year, decade: the default, century, millennium or N years)")
    draw.add_argument("--overview", choices=("auto", "yes", "no"), default="auto",
                      help="a table too large to read lane by lane: per group, counts of "
                           "records active per block over all the time, above the lanes of a "
                           "part (--from/--to, --where, --first); auto: from 5,000 dated "
                           "records on (default: auto)")
    draw.add_argument("--where", metavar="COLUMN=VALUE", default=None,
                      help="with the overview: lanes only for the records whose COLUMN holds "
                           "VALUE")
    draw.add_argument("--first", metavar="N", type=_count(1), default=None,
                      help="with the overview: lanes for the first N records by start, "
                           "those whose dates bound both ends first and, with --from/--to, "
                           "those beginning in the window (default: 50)")
    draw.add_argument("--pages", action="store_true",
                      help="a PDF in pages at group breaks, each the --size height (A4 of the "
                           "chart's width without one), the axis on every page")
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
    _config_options(read)

    validate = commands.add_parser("check", help="report what cannot be read in a table")
    validate.add_argument("input", nargs="?", help="CSV, TSV, XLSX or ODS file")
    validate.add_argument("--json", action="store_true", help="the report as JSON")
    validate.add_argument("--constraints", metavar="FILE",
                          help="a table of statements between records (first, relation, "
                               "second, gap): bounds tightened, contradictions named")
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
    _ends_options(report)
    report.add_argument("--era", choices=ERAS, default=DEFAULT_THEME.era, help="year labels")
    report.add_argument("--width", type=float, default=DEFAULT_THEME.width,
                        help=f"chart width in px (default {DEFAULT_THEME.width:g}): "
                             "labels and page distances take room by it")
    _page_options(report)
    _config_options(report)
    _relate_command(commands)
    _activity_command(commands)
    return parser


def _relate_command(commands) -> None:
    relate = commands.add_parser("relate", help="how two records stand to each other: "
                                                "Allen's relations, certain and possible")
    relate.add_argument("input", help="CSV, TSV, XLSX or ODS file")
    relate.add_argument("a", nargs="?", help="a record's id, else its label")
    relate.add_argument("b", nargs="?", help="another record's id, else its label")
    relate.add_argument("--with", dest="with_id", metavar="ID",
                        help="all of one record's relations to the others")
    relate.add_argument("--alongside", metavar="ID",
                        help="who possibly / certainly shared a day with one record: those "
                             "who could have known it")
    relate.add_argument("--on", metavar="DATE",
                        help="who was possibly / certainly active on DATE (a day in it)")
    relate.add_argument("--samples", metavar="N", type=_count(1),
                        help="each relation's probability: counted exactly when the windows "
                             "are small (up to 4,000,000 choices of days), else from N "
                             "Monte Carlo draws")
    relate.add_argument("--seed", metavar="N", type=_count(0), default=0,
                        help="the draws' seed (default 0)")
    relate.add_argument("--format", choices=("table", "csv", "json"), default="table")
    relate.add_argument("--constraints", metavar="FILE",
                        help="a table of statements between records (a before b, a lasts 7y, "
                             "...): the relations of the windows they narrow")
    _table_options(relate)
    _config_options(relate)


def _activity_command(commands) -> None:
    counts = commands.add_parser("activity", help="how many records were active per decade "
                                                  "(year, century, N years): certain, possible, "
                                                  "expected, and an envelope")
    counts.add_argument("input", nargs="?", help="CSV, TSV, XLSX or ODS file")
    counts.add_argument("--per", metavar="PERIOD", type=_checked_period, default="decade",
                        help="year, decade (default), century, millennium or N years")
    counts.add_argument("--runs", metavar="N", type=_count(0), default=0,
                        help="a Monte Carlo envelope of the count from N runs (default none)")
    counts.add_argument("--seed", metavar="N", type=_count(0), default=0,
                        help="the runs' seed (default 0)")
    counts.add_argument("--era", choices=ERAS, default=DEFAULT_THEME.era, help="year labels")
    counts.add_argument("--format", choices=("table", "csv", "json"), default="table")
    counts.add_argument("-o", "--output", help="OUT.svg, OUT.png or OUT.pdf: the counts as a "
                                              "chart (the table is not printed then)")
    counts.add_argument("--title", default="", help="the chart's title")
    counts.add_argument("--constraints", metavar="FILE",
                        help="a table of statements between records (a before b, a lasts 7y, "
                             "...): the counts of the windows they narrow")
    _config_options(counts)
    _table_options(counts)
    _window_options(counts)


def _checked_period(text: str) -> str:
    from ..analysis.activity import block_width
    try:
        block_width(text)
    except UsageError as error:
        raise argparse.ArgumentTypeError(f"{error} ({error.hint})") from None
    return text


def _table_options(parser: argparse.ArgumentParser) -> None:
    columns = parser.add_argument_group("columns (detected from common header names if omitted)")
    for name, meaning in (("start", "start dates"), ("end", "end dates"),
                          ("when", "a whole span in one cell, e.g. 1650-1660"),
                          ("label", "labels"), ("group", "the grouping of lanes"),
                          ("color", "the colour category"), ("id", "record identifiers")):
        columns.add_argument(f"--{name}", metavar="COL", help=f"column of {meaning}")
    for name, side in (("not-before", "earliest"), ("not-after", "latest")):
        columns.add_argument(f"--{name}", metavar="COL",
                             help=f"column of each event's {side} date (terminus "
                                  f"{'post' if side == 'earliest' else 'ante'} quem); "
                                  "implies --events")
    parser.add_argument("--events", action="store_true",
                        help="each row is one moment (a wreck, a find, a letter) somewhere "
                             "between its start and end (or in its when cell's window), "
                             "not a span lasting from one to the other")
    parser.add_argument("--sheet", help="sheet of an XLSX/ODS workbook (default: the first)")
    parser.add_argument("--header-row", metavar="N", type=_count(1), default=1,
                        help="the row that names the columns, when a title or notes stand "
                             "above it (default 1)")
    parser.add_argument("--encoding", metavar="NAME", type=_encoding, default=None,
                        help="encoding of a text table and of --bands, such as cp1252 "
                             "(default: UTF-8, UTF-16 by its mark, else Windows-1252 with "
                             "a note)")
    parser.add_argument("--date-numbers", choices=DATE_NUMBERS, default="years",
                        help="numbers in a spreadsheet's date columns: years (default; a "
                             "number of five digits or more is refused as a likely date "
                             "serial) or serials (days as the spreadsheet counts them)")
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


def _ends_options(parser: argparse.ArgumentParser) -> None:
    ends = parser.add_argument_group("ends the data leave open")
    ends.add_argument("--longest", metavar="DURATION", type=_duration_text,
                      help="a longest plausible duration (e.g. 110y for lives) bounding an "
                           "empty end cell or a one-sided one (after 1780); without it such "
                           "an end is drawn short")
    ends.add_argument("--longest-column", metavar="COL",
                      help="a column giving each record its own longest duration (7y, or a "
                           "number of years)")
    ends.add_argument("--longest-by-group", metavar="GROUP=TIME,...",
                      help="each group's own longest duration, e.g. 'Apprentice=7y, "
                           "Journeyman=30y' (a list in the config file); the column wins over "
                           "the group, the group over --longest")


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
    words.add_argument("--facet-order", metavar="ORDER", type=_group_order_text,
                       default="first",
                       help="panel order: first (earliest start, the default), name, size, or "
                            "values separated by commas")


def _page_options(parser: argparse.ArgumentParser) -> None:
    page = parser.add_argument_group("page")
    page.add_argument("--size", metavar="WxH", type=_checked(parse_size),
                      help="page size such as 180x120mm, 7x5in or 1200x800px; the chart "
                           "fills the height, bars closer together if it must (overrides "
                           "--width)")
    page.add_argument("--font", default=DEFAULT_THEME.font_family, metavar="FAMILIES",
                      help="font families, comma-separated, each character set in the first "
                           f"that has it (default {DEFAULT_THEME.font_family}, then Noto "
                           "families for other scripts where installed)")
    page.add_argument("--font-size", metavar="SIZE", type=_checked(parse_font_size),
                      help="label size in pt (9) or px (12px); other text scales with it "
                           "(default 9pt)")
    page.add_argument("--dpi", type=_resolution,
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
    parser.add_argument("--quiet", action="store_true",
                        help="no progress line on a long run (shown only on a terminal)")
    parser.add_argument("--config", metavar="FILE",
                        help="TOML file of settings; keys are the long option names")
    parser.add_argument("--print-config", action="store_true",
                        help="print the effective settings and where each came from, and stop")


def _duration_text(text: str) -> str:
    try:
        distance = parse_distance(text)
    except UsageError as error:
        raise argparse.ArgumentTypeError(f"{error} ({error.hint})") from None
    if distance.unit != "days":
        raise argparse.ArgumentTypeError(f"{text!r} is a page length; give a time such as 110y")
    return text


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


def _resolution(text: str) -> float:
    """A PNG resolution in dots an inch: a positive number, at most 2400 (a print shop's
    finest; more gives images few programs open)."""
    try:
        value = float(text)
    except ValueError:
        value = 0.0
    if not 0 < value <= 2400:
        raise argparse.ArgumentTypeError(f"expected a resolution from 1 to 2400 dpi, not {text!r}")
    return value


def _encoding(text: str) -> str:
    try:
        return checked_encoding(text)
    except UsageError as error:
        hint = f" ({error.hint})" if error.hint else ""
        raise argparse.ArgumentTypeError(f"{error}{hint}") from None


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
    conventions.add_argument("--periods", metavar="FILE", default=None,
                             help="a table of your own named periods and reigns (columns "
                                  "label, start, end, and optionally aliases, kind): each "
                                  "label reads as a date (Bronze Age, early Bronze Age, reign "
                                  "of X, 3 X for a regnal year); docs/dates.md")
