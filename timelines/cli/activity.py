"""`timelines activity`: how many records were active per block of time (certain, possible,
expected, and with --runs a Monte Carlo envelope), as a table, CSV or JSON. A thin layer over
`analysis.activity`; every output names what the table holds (events or spans) and how each
was counted.
"""
from __future__ import annotations

import json
import sys

from ..chart import Chart, ChartOptions, output_path, parse_window
from ..chart.activity import save_activity
from ..scene.theme import DEFAULT_THEME
from ..errors import TimelineError

# Tables are pandas DataFrames (annotations only: the CLI leaves pandas to analysis).
FORMATS = ("table", "csv", "json")
ENVELOPE_WORDS = "2.5th-97.5th percentile of {runs} runs (seed {seed}), median between"


def run_activity(args, parser) -> int:
    from . import commands    # the shared option readers; commands imports this module
    if args.when and (args.start or args.end):
        parser.error("give either --when or --start/--end, not both")
    settings = commands._settings(args)
    options = ChartOptions(columns=commands._columns(args), sheet=args.sheet,
                           header_row=args.header_row, encoding=args.encoding,
                           settings=settings, date_numbers=args.date_numbers,
                           events=commands._events(args), constraints=args.constraints)
    read = Chart.from_options(commands._input_path(args, parser), options).read()
    loaded = read.loaded
    commands.note_narrowed(read.narrowed, args.constraints)
    for problem in loaded.problems:
        commands._say(problem, file=sys.stderr)
    window = parse_window(args.window_from, args.window_to, settings)
    from ..analysis.activity import activity   # pandas: loaded when counts are asked for
    table = activity(loaded.records, per=args.per, group="group" if args.group else None,
                     runs=args.runs, seed=args.seed, calendar=settings.calendar,
                     era=args.era, start=window and window.start, end=window and window.end)
    if table.empty:
        raise TimelineError("nothing to count: no row has a usable date")
    if args.output:
        output_path(args.output)
        theme = DEFAULT_THEME.with_options(era=args.era, calendar=settings.reckoning)
        commands._say(f"wrote {save_activity(table, args.output, args.title, theme)}",
                      file=sys.stderr)
    else:
        _write(table, args, commands._say)
    # Notes (a convention used, merged cells filled) are said, not counted as rows lost.
    unread = len({(p.source, p.row) for p in loaded.problems
                  if p.kind in ("error", "contradiction")})
    _print_notes(table, unread, commands._say)
    return 1 if unread else 0


def _write(table: pandas.DataFrame, args, say) -> None:
    if args.format == "csv":
        table.to_csv(sys.stdout, index=False, float_format="%.6g", lineterminator="\n")
    elif args.format == "json":
        print(json.dumps(_as_json(table, args), ensure_ascii=False, indent=2))
    else:
        for line in _table_lines(table, args):
            say(line)


def _as_json(table: pandas.DataFrame, args) -> dict:
    attrs = table.attrs
    return {"holds": attrs["kind"], "per": _period_name(args.per), "block_years": attrs["per"],
            "blocks": "half-open: block_start included, block_end (fixed day) excluded",
            "methods": attrs["methods"], "unweighed": attrs["unweighed"],
            "envelope": _envelope_words(args) if args.runs else None,
            "rows": json.loads(table.to_json(orient="records"))}


def _table_lines(table: pandas.DataFrame, args) -> list[str]:
    """A heading per kind (and group), what the numbers are, then one line per block."""
    lines = []
    keys = ["kind", "group"] if "group" in table else ["kind"]
    for key, rows in table.groupby(keys, sort=False):
        key = key if isinstance(key, tuple) else (key,)
        heading = f"{key[0]} per {_period_name(args.per)}"
        heading += f", group {key[1]!r}" if len(key) > 1 else ""
        lines += ["" if lines else None, heading + f": {table.attrs['methods'][key[0]]}"]
        shown = _shown_columns(table, args.runs)
        lines += [_row_line(None, shown)] + [_row_line(row, shown)
                                             for row in rows.itertuples()]
    if args.runs:
        lines.append(f"envelope: {_envelope_words(args)}")
    return [line for line in lines if line is not None]


def _shown_columns(table: pandas.DataFrame, runs: int) -> list[str]:
    """The counts, `unweighed` only where some record was, the envelope when run."""
    shown = ["certain", "possible", "expected"]
    shown += ["unweighed"] if table["unweighed"].any() else []
    return shown + (["low", "median", "high"] if runs else [])


def _row_line(row, shown: list[str]) -> str:
    """A block's line (the heading when `row` is None), the counts right-aligned."""
    if row is None:
        return f"{'block':<24}" + "".join(f"{name:>10}" for name in shown)
    cells = [f"{value:.2f}" if name == "expected" else f"{value:g}"
             for name, value in ((name, getattr(row, name)) for name in shown)]
    return f"{row.label:<24}" + "".join(f"{cell:>10}" for cell in cells)


def _print_notes(table: pandas.DataFrame, problems: int, say) -> None:
    """On stderr: records left out of the expected counts, and what the table holds."""
    for kind, count in table.attrs["unweighed"].items():
        if count:
            records = "1 record" if count == 1 else f"{count} records"
            say(f"note: {records} ({kind}) with no bound on a side counted as possible where "
                "they can reach, left out of expected and the envelope", file=sys.stderr)
    unread = f", {problems} rows not read" if problems else ""
    say(f"counted {table.attrs['kind']}{unread}", file=sys.stderr)


def _period_name(per: str) -> str:
    from ..analysis.activity import PERIODS
    return per if per in PERIODS else f"{per} years"


def _envelope_words(args) -> str:
    return ENVELOPE_WORDS.format(runs=args.runs, seed=args.seed)
