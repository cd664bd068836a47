"""`timelines relate`: how two records stand to each other (Allen's relations, certain and
possible, and the CIDOC CRM comparisons), all of one record's relations (`--with`), who
possibly / certainly shared a day with one record (`--alongside`) or was active on a date
(`--on`). A thin layer over `analysis.relations`.
"""
from __future__ import annotations

import json
import sys

from ..chart import Chart, ChartOptions
from ..dates import parse_endpoint
from ..errors import DateError, UsageError, did_you_mean
from ..model import Record


def run_relate(args, parser) -> int:
    # pandas comes with the relations: loaded by this command only, not by every start.
    from ..analysis.relations import contemporaries, relate, relations_with
    from . import commands    # the shared option readers; commands imports this module
    asked = [bool(args.b), bool(args.with_id), bool(args.on), bool(args.alongside)]
    if sum(asked) != 1 or (args.with_id or args.on or args.alongside) and args.a:
        parser.error("give two records A B, or --with ID, or --alongside ID, or --on DATE")
    options = ChartOptions(columns=commands._columns(args), sheet=args.sheet,
                           header_row=args.header_row, encoding=args.encoding,
                           settings=commands._settings(args),
                           date_numbers=args.date_numbers, events=commands._events(args),
                           constraints=args.constraints)
    read = Chart.from_options(commands._input_path(args, parser), options).read()
    loaded = read.loaded
    commands.note_narrowed(read.narrowed, args.constraints)
    _note_unread(loaded.problems, commands)
    records = list(loaded.records)
    between = read.links.between if read.links else None     # what statements bind
    if args.on:
        _write_frame(contemporaries(records, _date(args.on, options)), args.format, commands)
    elif args.alongside:
        _write_frame(contemporaries(records, find_record(records, args.alongside), between),
                     args.format, commands)
    elif args.with_id:
        _write_frame(relations_with(records, find_record(records, args.with_id), between),
                     args.format, commands)
    else:
        a, b = find_record(records, args.a), find_record(records, args.b)
        links = between(_place(records, a), _place(records, b)) if between else ()
        found = relate(a, b, samples=args.samples, seed=args.seed, links=links)
        _write_relation(found, args.format, commands)
    return 0


def _place(records: list[Record], record: Record) -> int:
    return next(index for index, other in enumerate(records) if other is record)


def find_record(records: list[Record], key: str) -> Record:
    """The record whose id is `key`, else the one record labelled `key`."""
    by_id = [record for record in records if record.id == key]
    found = by_id or [record for record in records if record.label == key]
    if len(found) == 1:
        return found[0]
    if found:
        rows = ", ".join(str(record.provenance.row) for record in found)
        raise UsageError(f"{key!r} names {len(found)} records (rows {rows})",
                         hint="give the record's id (--id COL names the id column)")
    names = {name for record in records for name in (record.id, record.label) if name}
    raise UsageError(f"no record has the id or label {key!r}",
                     hint=did_you_mean(key, names))


def _date(text: str, options: ChartOptions):
    try:
        return parse_endpoint(text, options.settings)
    except DateError as error:
        raise UsageError(f"--on: cannot read {text!r}: {error.reason}") from None


def _note_unread(problems, commands) -> None:
    """How many rows take no part: those with errors or contradictions (notes on a
    convention or on merged cells are no loss)."""
    unread = len({(p.source, p.row) for p in problems if p.kind in ("error", "contradiction")})
    if unread:
        rows = "1 row" if unread == 1 else f"{unread} rows"
        commands._say(f"note: {rows} could not be read and take no part "
                      "(timelines check lists them)", file=sys.stderr)


def _write_frame(frame, form: str, commands) -> None:
    if form == "csv":
        _formulas_guarded(frame).to_csv(sys.stdout, index=False, lineterminator="\n")
    elif form == "json":
        print(frame.to_json(orient="records", force_ascii=False))
    elif frame.empty:
        commands._say("no record")
    else:
        for line in frame.fillna("").to_string(index=False).splitlines():
            commands._say(line)


# What a spreadsheet reads as the start of a formula (OWASP, "CSV Injection"), as in `lanes`.
_FORMULA_STARTS = ("=", "+", "-", "@", "\t", "\r")


def _formulas_guarded(frame):
    """The table's own text (names, labels) with a `'` before what a spreadsheet would run."""
    guarded = frame.copy()
    for column in ("a", "b", "b_label"):
        if column in guarded:
            guarded[column] = [f"'{text}" if str(text).startswith(_FORMULA_STARTS) else text
                               for text in guarded[column]]
    return guarded


def _write_relation(found, form: str, commands) -> None:
    from ..analysis.relations import ALLEN_RELATIONS, CRM_RELATIONS
    if form == "json":
        print(json.dumps(found.as_dict(), ensure_ascii=False, indent=2))
    elif form == "csv":
        print("scheme,relation,certain,possible,probability")
        shares = dict(found.probabilities)
        for scheme, names, certain, possible in (
                ("allen", ALLEN_RELATIONS, {found.certain}, found.possible),
                ("cidoc-crm", CRM_RELATIONS, found.crm_certain, found.crm_possible)):
            for name in names:
                share = shares.get(name, "") if scheme == "allen" else ""
                print(f"{scheme},{name},{name in certain},{name in possible},{share}")
    else:
        for line in relation_lines(found):
            commands._say(line)


def relation_lines(found) -> list[str]:
    from ..analysis.relations import CRM_SOURCE
    """The answer in words: the certain relation or the possible ones, the CRM comparisons,
    and the probabilities with their method."""
    lines = [f"{found.a} {found.certain} {found.b} (certain)" if found.certain else
             f"{found.a} to {found.b}: no relation is certain; possible: "
             f"{', '.join(found.possible)}"]
    lines.append(f"{CRM_SOURCE}:")
    lines += [f"  certainly {found.a} {name} {found.b}" for name in found.crm_certain]
    lines += [f"  possibly  {found.a} {name} {found.b}" for name in found.crm_possible
              if name not in found.crm_certain]
    if found.probabilities:
        lines.append(f"probabilities ({found.method}):")
        lines += [f"  {name}: {share:.4f}" for name, share in found.probabilities]
    elif found.method.startswith("undefined"):
        lines.append(f"probabilities {found.method}")
    return lines

