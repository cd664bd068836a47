"""Command line: `timelines render | parse | check | lanes`. Thin over the API; one error
reporter.

Exit codes: 0 success, 1 the input had errors or rows were left out (the chart is still
written unless --strict), 2 usage errors.

The options themselves are defined in `parser`. Settings: `render`, `check` and `lanes`
read `--config FILE` (TOML, keys are the long option names); an option on the command line wins
over the file, the file over the default, and `--print-config` shows each effective setting and
where it came from (see `cli.config`).
"""
from __future__ import annotations

import contextlib
import datetime
import json
import os
import re
import sys
from importlib import resources
from dataclasses import replace
from pathlib import Path

from ..chart import Chart, ChartOptions, Privacy, output_path, parse_window
from ..chart.reading import group_durations
from ..check.report import check
from ..dates import SETTING_HELP, DateSettings, describe, explain, settings_from_options
from ..errors import TimelineError, UsageError
from ..layout import report as lane_report
from ..layout.settings import LaneSettings
from ..layout.window import outside_note
from ..model import collection_paused
from ..scene.page import parse_font_size, parse_size, png_dpi
from ..scene.theme import DEFAULT_THEME, PALETTES
from ..sources import ColumnMap
from ..sources.periods import read_periods_file
from .activity import run_activity
from .config import apply_settings, config_lines
from .constraints import constrained, run_constraints
from .parser import CONFIG_COMMANDS, DEMO, NOT_SETTINGS, UNSET, build_parser
from .progress import Progress
from .relate import run_relate


# Characters a terminal would act on rather than show: C0 and C1 controls (an escape sequence
# can recolour, move or clear the screen; ECMA-48) and the bidirectional controls (UAX #9),
# which can reverse the rest of a line. Tab and newline are the report's own layout.
_TERMINAL_UNSAFE = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f\u202a-\u202e\u2066-\u2069]")


def terminal_text(text: object) -> str:
    """`text` with what a terminal would act on written as escapes (`\\x1b`, `\\u202e`)."""
    return _TERMINAL_UNSAFE.sub(lambda found: ascii(found.group())[1:-1], str(text))


def _say(text: object, file=None) -> None:
    """Print a line that may hold the table's text, safely for a terminal."""
    _print_line(terminal_text(text), file=file or sys.stdout)


def note_narrowed(narrowed: int, statements: str | None) -> None:
    """Say how many bounds the statements of --constraints narrowed (when some were given)."""
    if statements:
        bounds = "1 bound" if narrowed == 1 else f"{narrowed or 'no'} bounds"
        _say(f"note: {bounds} narrowed by the statements of --constraints", file=sys.stderr)


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
        # A command is one short run over a table's worth of objects without cycles (records,
        # placements, scene primitives): the cyclic collector, walking them again and again
        # as they are made, cost a third of a large run. Reference counting frees as usual.
        with collection_paused():
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
    _say(f"error: {error}", file=sys.stderr)
    if getattr(error, "hint", None):
        _say(f"hint: {error.hint}", file=sys.stderr)


def _settings(args) -> DateSettings:
    given = {name: getattr(args, name.replace("-", "_")) for name in SETTING_HELP}
    try:
        settings = settings_from_options(given)
    except ValueError as error:
        raise UsageError(str(error), hint="see docs/dates.md for each convention") from None
    if getattr(args, "periods", None):
        # The periods' own dates are read in the settings given; their labels then read too.
        settings = replace(settings, periods=read_periods_file(
            args.periods, settings, encoding=getattr(args, "encoding", None)))
    return settings


def _columns(args) -> ColumnMap:
    start = _bound_column(args.start, args.not_before, "start", "not-before", args.when)
    end = _bound_column(args.end, args.not_after, "end", "not-after", args.when)
    return ColumnMap(start=start, end=end, when=args.when, label=args.label,
                     group=args.group, color=args.color, id=args.id)


def _bound_column(column: str | None, bound: str | None, part: str, option: str,
                  when: str | None) -> str | None:
    """The start (end) column, or the one --not-before (--not-after) names: an event's."""
    if bound is not None and column is not None:
        raise UsageError(f"give either --{part} or --{option}, not both")
    if bound is not None and when is not None:
        raise UsageError(f"give either --when or --{option}, not both")
    return column if bound is None else bound


def _events(args) -> bool:
    """Whether each row is one event in a window: --events, or a --not-before/--not-after."""
    return bool(args.events or args.not_before or args.not_after)


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
        parser.error("render needs -o OUT.svg, OUT.png, OUT.pdf or OUT.html")
    if args.size and args.width != DEFAULT_THEME.width:
        parser.error("give either --size or --width, not both")
    output_path(args.output)                                # fail before any work
    if args.pages and Path(args.output).suffix.lower() != ".pdf":
        parser.error("--pages writes a PDF: give -o OUT.pdf")
    options = _render_options(args)
    if Path(args.output).suffix.lower() == ".html":
        options = replace(options, overview="no")    # the explorer shows every record itself
    chart = Chart.from_options(_input_path(args, parser), options)
    progress = Progress(4, quiet=args.quiet)
    arranged = _laid_out(chart, progress)
    _print_run(arranged, args, args.era)
    if args.strict and (arranged.not_drawn or _band_problems(arranged)):
        print("error: nothing written (--strict and some rows were not drawn)", file=sys.stderr)
        return 1
    explorer = Path(args.output).suffix.lower() == ".html"
    with progress.step("drawing"):
        chart.explore() if explorer else chart.scene()
    with progress.step(f"writing {Path(args.output).name}"):
        written = chart.save(args.output)
    # The warnings are about the static page (its height, its fonts): the explorer has none.
    for warning in () if explorer else chart.warnings:
        _say(f"warning: {warning}", file=sys.stderr)
    _say(f"wrote {written}", file=sys.stderr)
    return 1 if arranged.not_drawn or _band_problems(arranged) else 0


def _laid_out(chart: Chart, progress: Progress):
    """The chart's table read and laid out, each step shown on a long run."""
    with progress.step(f"reading {Path(str(chart.data)).name}"):
        chart.read()
    with progress.step("checking and laying out"):
        return chart.layout()


def _theme(args):
    """The look the options give; lanes takes the page and font options render takes, so both
    measure the same chart, and the drawing-only ones keep their defaults there."""
    palette = getattr(args, "palette", None)
    theme = DEFAULT_THEME.with_options(
        fringe=getattr(args, "fringe", None), era=args.era, width=args.width,
        palette=PALETTES[palette] if palette else None, font_family=args.font,
        max_colors=getattr(args, "max_colors", None))
    if args.font_size:
        theme = theme.with_font_size(parse_font_size(args.font_size))
    return theme


def _render_options(args) -> ChartOptions:
    theme = _theme(args)
    title = args.title or ("The Fenwold organ builders, 1600–1720 (invented demo data)"
                           if args.demo else "")
    size = parse_size(args.size) if args.size else None
    settings = _settings(args)
    notes = [args.note] if isinstance(args.note, str) else args.note or []  # a config string
    return ChartOptions(
        columns=_columns(args), sheet=args.sheet, header_row=args.header_row,
        encoding=args.encoding,
        settings=settings, theme=theme, title=title,
        strict=args.strict, dpi=png_dpi(args.dpi, size), lanes=_lane_settings(args),
        text=args.text_mode, privacy=_privacy(args), subtitle=args.subtitle,
        credit=args.credit, notes=tuple(notes), window=_window(args, settings),
        bands=args.bands, facet=args.facet, facet_order=args.facet_order, size=size,
        date_numbers=args.date_numbers, pages=args.pages, constraints=args.constraints,
        activity=args.activity, events=_events(args),
        overview=args.overview, where=args.where, first=args.first,
        longest=args.longest, longest_column=args.longest_column,
        longest_by_group=_group_durations(args))


def _group_durations(args) -> tuple[tuple[str, str], ...]:
    return group_durations(args.longest_by_group) if args.longest_by_group else ()


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
    note_narrowed(arranged.narrowed, getattr(args, "constraints", None))
    if arranged.bounded:
        records = "1 record's" if arranged.bounded == 1 else f"{arranged.bounded} records'"
        _say(f"note: {records} open ends bounded by the longest duration (--longest)",
             file=sys.stderr)
    for placement in arranged.placements:
        for line in lane_report.note_lines(placement.notes, era):
            _say(line, file=sys.stderr)
    if arranged.outside:
        named = " (named under the chart)" if args.command == "render" else ""
        print(f"note: {outside_note(len(arranged.outside))}{named}", file=sys.stderr)
    if arranged.bands_off_axis:
        names = ", ".join(repr(band.label) for band in arranged.bands_off_axis)
        _say(f"note: bands not drawn, outside the time shown or undated: {names}",
              file=sys.stderr)
    _say(arranged.summary(args.max_lanes), file=sys.stderr)
    _print_hidden_labels(arranged.placements, getattr(args, "output", None))


def _print_hidden_labels(placements, output: str | None) -> None:
    """How many labels are not on the chart: in an SVG they stay in the tooltips; PNG and PDF
    have none, so there they are simply not shown (labels shown by number are shown)."""
    hidden = sum(s.labels_left_out for placement in placements
                 for s in lane_report.group_summaries(placement) if s.densest is not None)
    if not hidden:
        return
    labels = "1 label did not fit, is" if hidden == 1 else f"{hidden} labels did not fit, are"
    where = ("not shown (a PNG or PDF has no tooltips)"
             if output and Path(output).suffix.lower() in (".png", ".pdf")
             else "kept in the tooltips only")
    print(f"note: {labels} {where} ('timelines lanes' counts them by group; --width gives "
          "more room)", file=sys.stderr)


def run_lanes(args, parser) -> int:
    if args.when and (args.start or args.end):
        parser.error("give either --when or --start/--end, not both")
    if args.size and args.width != DEFAULT_THEME.width:
        parser.error("give either --size or --width, not both")
    theme = _theme(args)
    settings = _settings(args)
    options = ChartOptions(columns=_columns(args), sheet=args.sheet,
                           header_row=args.header_row, encoding=args.encoding,
                           settings=settings,
                           theme=theme, lanes=_lane_settings(args),
                           window=_window(args, settings), date_numbers=args.date_numbers,
                           events=_events(args),
                           longest=args.longest, longest_column=args.longest_column,
                           longest_by_group=_group_durations(args),
                           size=parse_size(args.size) if args.size else None,
                           overview="no")     # the lanes of every record, however many
    chart = Chart.from_options(_input_path(args, parser), options)
    arranged = _laid_out(chart, Progress(2, quiet=args.quiet))
    _print_run(arranged, args, theme.era)
    if arranged.placement is None:
        raise TimelineError("nothing to lay out: no row has a usable date")
    if args.format == "csv":
        lane_report.write_csv(arranged.placement, sys.stdout)
    elif args.format == "json":
        lane_report.write_json(arranged.placement, sys.stdout)
    else:
        for line in lane_report.summary_lines(arranged.placement, theme.era):
            _say(line)
    return 1 if arranged.not_drawn else 0


def _print_problems(problems) -> None:
    for problem in problems:
        _say(problem, file=sys.stderr)



def run_check(args, parser) -> int:
    options = ChartOptions(columns=_columns(args), sheet=args.sheet,
                           header_row=args.header_row, encoding=args.encoding,
                           settings=_settings(args),
                           date_numbers=args.date_numbers, events=_events(args))
    source = _input_path(args, parser)
    with Progress(1, quiet=args.quiet).step(f"reading {source.name}"):
        loaded = Chart.from_options(source, options).read().loaded
        report = check(loaded)
    if args.json:                       # one JSON object: the statements' outcome inside it
        data = report.as_dict()
        if args.constraints:
            outcome = constrained(loaded.records, args.constraints)
            data["constraints"] = outcome.as_dict()
        print(json.dumps(data, ensure_ascii=False, indent=2))
        inconsistent = args.constraints and not outcome.consistent
        return 1 if report.not_drawn or inconsistent else 0
    for line in report.lines():         # the report is this command's output: stdout
        _say(line)
    _say(report.summary())
    inconsistent = args.constraints and run_constraints(loaded.records, args.constraints, _say)
    return 1 if report.not_drawn or inconsistent else 0


def run_parse(args, parser) -> int:
    """One output line (or --explain block) per input text, whatever the text holds: stdin
    is read as a stream, line by line, and a line that is not UTF-8, or that the reader
    fails on unexpectedly, is reported in its own line of output."""
    if args.json and args.explain:
        parser.error("give either --json or --explain, not both")
    settings = _settings(args)
    if not args.text and not args.explain and _has_bytes(sys.stdin) and _has_bytes(sys.stdout):
        return _parse_stream(sys.stdin.buffer, args.json, settings)
    texts = ((text, None) for text in args.text) if args.text else _stdin_lines(sys.stdin)
    failed = 0
    shown: dict[str, tuple[str, bool]] = {}   # a column repeats its values: each shown once
    for number, (text, unreadable) in enumerate(texts):
        if args.explain:
            result = _described(text, unreadable, settings)
            failed += not result["ok"]
            _say(("\n" if number else "") + "\n".join(
                _explanation(text, result, unreadable, settings)))
            continue
        key = text if unreadable is None else None
        if key is None or key not in shown:
            result = _described(text, unreadable, settings)
            line = (_json_line(result) if args.json else _plain(result), result["ok"])
            if key is not None and len(shown) < PARSE_MEMORY:
                shown[key] = line
        else:
            line = shown[key]
        failed += not line[1]
        if args.json:
            _print_line(line[0])            # JSON escapes controls itself
        else:
            _say(line[0])
    return 1 if failed else 0


PARSE_MEMORY = 100_000      # distinct texts whose output is kept for the lines repeating them
_WRITE_EVERY = 4096         # lines written at once when stdin is not a terminal


def _has_bytes(stream) -> bool:
    return hasattr(stream, "buffer")


def _parse_stream(source, as_json: bool, settings: DateSettings) -> int:
    """`parse` of stdin, line by line: each distinct line (as bytes, before decoding) is read
    once and its output kept, so a column of a million cells costs its distinct values and
    the copying of the rest; output goes out in blocks of lines, or line by line to a person
    typing at a terminal."""
    sys.stdout.flush()
    out, encoding = sys.stdout.buffer, sys.stdout.encoding or "utf-8"
    every = 1 if sys.stdin.isatty() else _WRITE_EVERY
    seen: dict[bytes, tuple[bytes, bool]] = {}
    waiting: list[bytes] = []
    failed = 0
    for number, raw in enumerate(source, start=1):
        found = seen.get(raw)
        if found is None:
            text, unreadable = _decoded(raw, number)
            result = _described(text, unreadable, settings)
            line = _json_line(result) if as_json else terminal_text(_plain(result))
            found = ((line + "\n").encode(encoding, "backslashreplace"), not result["ok"])
            if number > 1 and len(seen) < PARSE_MEMORY:      # line 1 may hold a byte-order mark
                seen[raw] = found
        waiting.append(found[0])
        failed += found[1]
        if len(waiting) >= every:
            out.write(b"".join(waiting))
            waiting.clear()
    out.write(b"".join(waiting))
    out.flush()
    return 1 if failed else 0


def _stdin_lines(stream):
    """(text, None) per line of `stream`, or (repr of the bytes, why) for a line that is not
    UTF-8: read as bytes when the stream has them, so one bad byte costs one line only."""
    source = getattr(stream, "buffer", None)
    if source is None:
        for line in stream:
            yield line.rstrip("\r\n"), None
        return
    for number, raw in enumerate(source, start=1):
        yield _decoded(raw, number)


def _decoded(raw: bytes, number: int) -> tuple[str, str | None]:
    """(text, None) of one line of bytes, or (repr of the bytes, why) when it is not UTF-8."""
    raw = raw.rstrip(b"\r\n")
    if number == 1:
        raw = raw.removeprefix(b"\xef\xbb\xbf")      # a byte-order mark
    try:
        return raw.decode("utf-8"), None
    except UnicodeDecodeError as error:
        return (raw.decode("utf-8", "backslashreplace"),
                f"line {number} is not UTF-8 text (byte 0x{raw[error.start]:02x})")


def _described(text: str, unreadable: str | None, settings: DateSettings) -> dict:
    if unreadable is not None:
        return _failed(text, unreadable)
    try:
        return describe(text, settings)
    except Exception as error:          # one line's problem, never the run's: say so
        return _failed(text, f"internal error, please report: {type(error).__name__}: {error}")


def _failed(text: str, reason: str) -> dict:
    return {"input": text, "ok": False, "earliest": None, "latest": None, "likely": None,
            "precision": None, "qualifiers": [], "error": reason}


def _explanation(text: str, result: dict, unreadable: str | None,
                 settings: DateSettings) -> list[str]:
    if unreadable is None:
        try:
            return explain(text, settings)
        except Exception:               # described as an internal error below
            pass
    return [_plain(result)]


def _json_line(result: dict) -> str:
    """JSON in UTF-8 where it can be, escaped ASCII where the text cannot be encoded (a lone
    surrogate from a command-line argument)."""
    line = json.dumps(result, ensure_ascii=False).translate(_LINE_BREAKS_ESCAPED)
    try:
        line.encode("utf-8")
        return line
    except UnicodeEncodeError:
        return json.dumps(result, ensure_ascii=True)


# Characters that end a line for some readers (Python's str.splitlines, JavaScript's line
# terminators) though JSON leaves them raw: escaped, so one input line is one output line.
_LINE_BREAKS_ESCAPED = str.maketrans({"\x85": "\\u0085", "\u2028": "\\u2028",
                                      "\u2029": "\\u2029"})


def _print_line(text: str, file=None) -> None:
    file = file or sys.stdout
    try:
        file.write(text + "\n")       # not print(): a million lines of parse --json, a third faster
    except UnicodeEncodeError:
        file.write(text.encode("utf-8", "backslashreplace").decode("utf-8") + "\n")


def _plain(result: dict) -> str:
    if not result["ok"]:
        return f"{result['input']}: error: {result['error']}"
    qualifiers = f"; {', '.join(result['qualifiers'])}" if result["qualifiers"] else ""
    earliest = result["earliest"] or "open"
    latest = result["latest"] or "open"
    line = f"{result['input']}: {earliest} .. {latest} ({result['precision']}{qualifiers})"
    return line + "".join(_calibrated_text(part["radiocarbon"])
                          for part in (result, result.get("start"), result.get("end"))
                          if part and "radiocarbon" in part)


def _calibrated_text(found: dict) -> str:
    """A calibrated age's 95.4% ranges and curve, after the window: the reading in brief."""
    ranges = ", ".join(f"{r['from']}–{r['to']} ({r['probability']:.1%})"
                       for r in found["ranges"]["95.4%"])
    return f"; calibrated ({found['curve']}), 95.4%: {ranges}, median {found['median']}"


COMMANDS = {"render": run_render, "parse": run_parse, "check": run_check, "lanes": run_lanes,
            "relate": run_relate,
            "activity": run_activity}

__all__ = ["main"]
