"""The read and parse steps of the pipeline: a table (a file, a DataFrame, rows or Records)
into records and problems, and what the settings do to the records before any layout:
possibly living persons' details withheld, open ends bounded by a longest duration, windows
narrowed by statements between records."""
from __future__ import annotations

from dataclasses import dataclass, replace
from os import PathLike

from ..analysis.constraints import Links, read_statements, tighten
from ..check.durations import bound_by_longest
from ..check.living import withhold_possibly_living
from ..check.report import Finding
from ..dates import DEFAULT_SETTINGS, DateSettings
from ..errors import TimelineError, UsageError
from ..layout.distances import DAYS_PER_UNIT, parse_distance
from ..model import Record
from ..sources import ColumnMap, LoadResult, detect_columns, load_records, read_table
from ..sources.conventions import bp_age_notes, signed_year_notes
from ..sources.fields import column_reader
from ..sources.frames import table_from_data
from ..sources.tables import TITLE_ROW, Table
from .options import ChartOptions, Privacy


@dataclass(frozen=True, slots=True)
class ReadTable:
    """What the read and parse steps give: the records and problems of a table, the columns
    that played each part, and the table's header (None for records made by the caller)."""

    loaded: LoadResult
    columns: ColumnMap
    header: tuple[str, ...] | None
    withheld: int = 0                   # records shown without their details
    bounded: int = 0                    # records whose open side --longest bounded
    findings: tuple[Finding, ...] = ()  # what those steps found worth a warning
    narrowed: int = 0                   # bounds the --constraints statements narrowed
    links: Links | None = None          # what those statements say between records


def read_source(data: object, options: ChartOptions = ChartOptions()) -> ReadTable:
    """Read and parse `data`: a table file's path, a pandas DataFrame, an iterable of rows
    (mappings of column name to cell), or an iterable of Records made by the caller."""
    if isinstance(data, (str, PathLike)):
        table = read_table(data, options.sheet, header_row=options.header_row,   # read
                           encoding=options.encoding)
    else:
        table = table_from_data(data)
    if isinstance(table, LoadResult):                                   # records as given
        columns, header, loaded = options.columns, None, table
    else:
        columns, header = _detected_columns(table, options.columns), table.header
        table = _with_signed_year_notes(table, columns, options.settings)
        loaded = load_records(table, columns, options.settings,          # parse
                              date_numbers=options.date_numbers, events=options.events)
    loaded, withheld = _withhold(loaded, options.privacy)
    read = ReadTable(loaded, columns, header, withheld)
    return _tightened(_bound_open_sides(read, options), options)


def _tightened(read: ReadTable, options: ChartOptions) -> ReadTable:
    """The records' windows narrowed by the statements of `--constraints` (a simple temporal
    network, analysis.constraints); statements that cannot all hold stop the run, named."""
    if options.constraints is None:
        return read
    result = tighten(list(read.loaded.records), read_statements(options.constraints))
    if not result.consistent:
        error = TimelineError("the statements cannot all hold: "
                              + str(result.contradictions[0]))
        error.hint = "timelines check TABLE --constraints FILE lists what each statement narrows"
        raise error
    return replace(read, loaded=replace(read.loaded, records=result.records),
                   narrowed=len(result.narrowed), links=result.links)


def _detected_columns(table: Table, given: ColumnMap) -> ColumnMap:
    """The table's columns by part; when none is a date column and the header looks like a
    title above the real one, the error says which row to give as --header-row."""
    try:
        return detect_columns(table.header, given)
    except UsageError as error:
        titles = [note.hint for note in table.notes if TITLE_ROW in note.reason]
        if titles:
            raise UsageError(str(error), hint=titles[0]) from error
        raise


def _bound_open_sides(read: ReadTable, options: ChartOptions) -> ReadTable:
    """Unknown and one-sided ends bounded by the user's longest plausible duration."""
    if (options.longest is None and options.longest_column is None
            and not options.longest_by_group):
        return read
    longest_of = _longest_of(options, read.columns, read.header)
    text = ("the longest duration set for it" if options.longest_column
            or options.longest_by_group else f"--longest {options.longest}")
    bounded = bound_by_longest(read.loaded.records, longest_of, text)
    return replace(read, loaded=replace(read.loaded, records=bounded.records),
                   bounded=bounded.count, findings=read.findings + bounded.findings)


def _longest_of(options: ChartOptions, columns: ColumnMap, header):
    """A record's longest duration in days: its cell of --longest-column when it holds one
    (a time such as 90y, or a number of years), else its group's (--longest-by-group), else
    --longest."""
    table_wide = duration_days(options.longest, "--longest") if options.longest else None
    by_group = {group: duration_days(text, f"--longest-by-group {group}")
                for group, text in options.longest_by_group}

    def fallback_of(record: Record) -> float | None:
        return by_group.get(record.group or "", table_wide)

    if options.longest_column is None:
        return fallback_of
    read_cell = column_reader(columns, header, options.longest_column, "longest column")
    known: dict[str, float | None] = {}

    def longest_of(record: Record) -> float | None:
        text = (read_cell(record) or "").strip()
        if text not in known:
            known[text] = _cell_days(text) if text else None
        return known[text] if known[text] is not None else fallback_of(record)

    return longest_of


def group_durations(text: str) -> tuple[tuple[str, str], ...]:
    """`Apprentice=7y, Journeyman=30y` as (group, duration) pairs; a usage error for a part
    without a name and a time."""
    pairs = []
    for part in (piece.strip() for piece in text.split(",")):
        name, equals, duration = part.rpartition("=")
        if not part or not equals or not name.strip():
            raise UsageError(f"cannot read {part!r} in {text!r}",
                             hint="give group names and times: Apprentice=7y, Journeyman=30y")
        duration_days(duration.strip(), f"the duration of {name.strip()!r}")
        pairs.append((name.strip(), duration.strip()))
    return tuple(pairs)


def duration_days(text: str, option: str) -> float:
    """A time such as 110y or 18mo in days; a usage error for a page length or no time."""
    distance = parse_distance(text)
    if distance.unit != "days":
        raise UsageError(f"{option} {text!r} is a page length, not a time",
                         hint="give a time such as 110y, 40y or 18mo")
    return distance.amount


def _cell_days(text: str) -> float | None:
    """A duration cell: `90y`, `18mo`, or a bare number of years; None when unreadable."""
    try:
        return float(text) * DAYS_PER_UNIT["y"]
    except ValueError:
        pass
    try:
        return duration_days(text, "a duration")
    except UsageError:
        return None


def read_bands(source: object, settings: DateSettings = DEFAULT_SETTINGS,
               date_numbers: str = "years", encoding: str | None = None) -> LoadResult:
    """The named periods of a `--bands` table (a path, a DataFrame or rows): columns label,
    start, end (or when); a text file in `encoding`, or as read_table finds it."""
    if isinstance(source, (str, PathLike)):
        given = read_table(source, encoding=encoding)
    else:
        given = table_from_data(source)
    if isinstance(given, LoadResult):
        return given
    columns = detect_columns(given.header, ColumnMap())
    return load_records(_with_signed_year_notes(given, columns, settings), columns, settings,
                        date_numbers=date_numbers)


def _with_signed_year_notes(table: Table, columns: ColumnMap,
                            settings: DateSettings) -> Table:
    """The table with a note when its date columns write years as signed numbers (-300),
    and one when they write ages as `3450 ± 40 BP` read as calendar years."""
    notes = signed_year_notes(table, columns, settings) + bp_age_notes(table, columns, settings)
    return replace(table, notes=table.notes + notes) if notes else table


def _withhold(loaded: LoadResult, privacy: Privacy | None) -> tuple[LoadResult, int]:
    if privacy is None:
        return loaded, 0
    kept = withhold_possibly_living(loaded.records, privacy.as_of_year, privacy.years)
    return replace(loaded, records=kept.records), kept.count


def read_records(source: object, options: ChartOptions = ChartOptions()) -> LoadResult:
    """Read and parse `source` (anything `read_source` takes), nothing withheld."""
    return read_source(source, replace(options, privacy=None)).loaded
