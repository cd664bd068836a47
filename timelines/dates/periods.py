"""Named periods and reigns from the user's own table (issue 16; sources/periods.py reads it).

A row gives a label, aliases, a start and an end (dates in the date language), and a kind,
reign or period. Names match in any letter case and spacing, with or without a leading `the`:
- `Bronze Age`: the start's earliest to the end's latest day, to the year (unless deep time):
  `early`, `mid`, `late` (parts.py) take thirds of its months, from its first day;
- `reign of X`: a reign's window (a period that is no reign is refused);
- `3 X` (as regnal years are cited), `year 3 of X`, `regnal year 3 of X`, `3rd year of X`,
  `third year of X`: the accession day + 2 years .. the day before the accession day + 3
  years. The first regnal year begins on the accession day (English practice: Cheney,
  *Handbook of Dates*; other reckonings exist: `convention_dependent`). An accession window
  widens it (earliest from the earliest accession, latest from the latest); the last year
  ends with the reign, a later one is refused. Anniversaries are in the calendar setting.
"""
from __future__ import annotations

import re
from collections.abc import Callable, Iterable, Mapping
from dataclasses import dataclass, field, replace

from ..errors import DateError
from ..model import Endpoint, Precision, Qualifier
from . import trace
from .ordinals import ordinal_number, ordinal_word
from .reasons import Unreadable
from .settings import DateSettings
from .windows import date_of, month_bounds, normalise, year_of

COLUMNS = ("label", "start", "end", "aliases", "kind")   # in any letter case; kind: reign, period
_KEPT = frozenset({Qualifier.APPROXIMATE, Qualifier.UNCERTAIN})   # what a window keeps
_OF = r"\s+of\s+(?:(?:the\s+)?reign\s+of\s+)?(?P<name>.+)"   # of X, of the reign of X
_REGNAL_YEARS = (
    re.compile(r"(?:regnal\s+)?year\s+(?P<number>[0-9]+)" + _OF),                # year 3 of X
    re.compile(r"(?:(?P<ordinal>[0-9]+)(?P<suffix>st|nd|rd|th)|(?P<word>[a-z]+(?:[\s-]"
               r"(?!regnal\b)[a-z]+)?))\s+(?:regnal\s+)?year" + _OF),           # 3rd, third
    re.compile(r"(?P<number>[0-9]+)\s+(?P<name>.+)"),                           # 3 X
)


@dataclass(frozen=True, slots=True)
class Period:
    """A row of the periods table; its dates as written and its place are for messages."""

    label: str
    aliases: tuple[str, ...]
    start: Endpoint
    end: Endpoint
    is_reign: bool = False
    start_text: str = ""
    end_text: str = ""
    source: str = ""
    row: int | None = None

    def __post_init__(self) -> None:
        if None in (self.start.earliest, self.end.latest) or self.end.latest < self.start.earliest:
            raise ValueError(f"{self.label}: a period needs a start before a bounded end")

    @property
    def window(self) -> Endpoint:
        deep = Precision.DEEP_TIME in (self.start.precision, self.end.precision)
        precision = Precision.DEEP_TIME if deep else Precision.YEAR   # parts: thirds of months
        qualifiers = (self.start.qualifiers | self.end.qualifiers) & _KEPT
        return Endpoint(self.start.earliest, self.end.latest, precision, qualifiers)


@dataclass(frozen=True, slots=True)
class PeriodTable:
    """Periods found by any of their names (`period_key`), no two sharing one; hashable."""

    periods: tuple[Period, ...] = ()
    _index: dict[str, int] = field(init=False, repr=False, compare=False)
    _last_words: frozenset[str] = field(init=False, repr=False, compare=False)

    def __post_init__(self) -> None:
        index: dict[str, int] = {}
        for number, period in enumerate(self.periods):
            for name in (period.label, *period.aliases):
                if index.setdefault(period_key(name), number) != number:
                    raise ValueError(f"{name!r} names two periods")
        object.__setattr__(self, "_index", index)
        object.__setattr__(self, "_last_words", frozenset(k.rpartition(" ")[2] for k in index))

    def find(self, name: str) -> Period | None:
        number = self._index.get(period_key(name))
        return None if number is None else self.periods[number]


def period_key(name: str) -> str:
    """A name as looked up: spacing collapsed, letter case folded, a leading `the` dropped."""
    return normalise(name).casefold().removeprefix("the ")


def read_period(core: str, table: PeriodTable, settings: DateSettings) -> Endpoint | None:
    """The window a period's name, `reign of X` or a regnal year names; None when the text
    names no period of the table; raises Unreadable for a name used in a way it cannot be."""
    key = period_key(core)
    if key.rpartition(" ")[2] not in table._last_words:
        return None    # most texts: no period's name ends them
    period = table.find(key)
    if period is not None:
        return _whole(period, core, "a reign" if period.is_reign else "a period")
    if key.startswith("reign of ") and (period := table.find(key[9:])) is not None:
        return _whole(_reign(period), core, "the reign")
    for form in _REGNAL_YEARS:
        found = form.fullmatch(key)
        if found is not None and (period := table.find(found["name"])) is not None:
            return regnal_year(period, _year_number(found), settings)
    return None


def _whole(period: Period, core: str, what: str) -> Endpoint:
    window = period.window
    if trace.on:
        name = "" if period_key(core) == period_key(period.label) else f" ({period.label})"
        where = f"row {period.row} of {period.source}" if period.row else "given"
        trace.note(f"{core!r}{name}: {what} from the periods table ({where}): "
                   f"{period.start_text} .. {period.end_text}: {trace.bounds(window)}")
    return window


def _reign(period: Period) -> Period:
    if not period.is_reign:
        raise Unreadable(f"{period.label!r} is a period, not a reign", fragment=period.label,
                         hint="mark it a reign in the kind column of the periods table")
    return period


def _year_number(found: re.Match[str]) -> int:
    groups = found.groupdict()
    if groups.get("number"):
        return int(groups["number"])
    if groups["ordinal"]:
        return ordinal_number(groups["ordinal"], groups["suffix"], "regnal year")
    return ordinal_word(groups["word"])


def regnal_year(reign: Period, number: int, settings: DateSettings) -> Endpoint:
    """The window of regnal year `number` of `reign` (conventions: the module's docstring)."""
    calendar, accession = settings.reckoning, _reign(reign).start
    if number < 1:
        raise Unreadable("regnal years count from 1, the year from the accession day", "0")
    years = year_of(reign.end.latest, calendar) - year_of(accession.earliest, calendar)
    most = years + (anniversary(accession.earliest, years, calendar) <= reign.end.latest)  # begun
    if number > most:
        raise Unreadable(f"{reign.label} reigned {reign.start_text} .. {reign.end_text}: at "
                         f"most {most} regnal years, so there is no year {number}",
                         fragment=str(number))
    earliest = anniversary(accession.earliest, number - 1, calendar)
    latest = min(anniversary(accession.latest, number, calendar) - 1, reign.end.latest)
    window = Endpoint(earliest, latest, Precision.YEAR,
                      (accession.qualifiers & _KEPT) | {Qualifier.CONVENTION_DEPENDENT})
    if trace.on:
        trace.note(f"year {number} of the reign of {reign.label} (accession "
                   f"{reign.start_text}): the accession day + {number - 1} years .. the day "
                   f"before the accession day + {number} years, within the reign: "
                   f"{trace.bounds(window)}")
    return window


def anniversary(day: int, years: int, calendar: str) -> int:
    """The day `years` years after `day`: the same day of the month, counted from the month's
    first day, so 29 February falls on 1 March in a common year."""
    year, month, day_of_month = date_of(day, calendar)
    return month_bounds(year + years, month, calendar)[0] + day_of_month - 1


def periods_from_rows(rows: Iterable[Mapping[str, object]], settings: DateSettings,
                      source: str, first_row: int = 2) -> PeriodTable:
    """The periods of rows of cells by column name (COLUMNS), the first numbered `first_row`
    (the header is row 1). The first bad row is raised as a DateError naming file, row,
    column, text and reason, its hint listing the others."""
    # Imported here: the core reader, which .ranges imports, is to import this module.
    from .ranges import parse_endpoint
    if getattr(settings, "periods", None) is not None:   # a name must read as no period
        settings = replace(settings, periods=None)
    periods, problems, names = [], [], {}
    for number, cells in enumerate(rows, start=first_row):
        row = _Row(source, number, cells, lambda text: parse_endpoint(text, settings), names)
        if not any(text for _, text in row.cells.values()):
            continue
        try:
            periods.append(row.period())
        except DateError as error:
            problems.append(error)
    if problems:    # the first, with where the others are
        first, others = problems[0], [f"row {p.row} ({p.column})" for p in problems[1:]]
        hint = "; ".join(filter(None, [first.hint, others and "also " + ", ".join(others)]))
        raise DateError(first.text, first.reason, position=first.position, hint=hint,
                        source=first.source, row=first.row, column=first.column) from first
    return PeriodTable(tuple(periods))


class _Row:
    """A row's cells by role (column name as written, text); the names rows before it gave."""

    def __init__(self, source: str, number: int, cells: Mapping[str, object],
                 parse: Callable[[str], Endpoint], names: dict[str, tuple[int, str]]):
        self.source, self.number, self.parse, self.names = source, number, parse, names
        self.cells = {str(name).strip().casefold(): (str(name), str(value).strip())
                      for name, value in cells.items() if value is not None}

    def text(self, role: str) -> str:
        return self.cells.get(role, (role, ""))[1]

    def failed(self, role: str, text: str, reason: str) -> DateError:
        return DateError(text, reason, source=self.source, row=self.number,
                         column=self.cells.get(role, (role, ""))[0])

    def period(self) -> Period:
        label, kind = self.text("label"), self.text("kind").casefold()
        aliases = tuple(filter(None, map(str.strip, re.split(r"[;|]", self.text("aliases")))))
        for role, name in (("label", label), *(("aliases", alias) for alias in aliases)):
            self.check_name(role, name)
        start, end = self.endpoint("start", "earliest"), self.endpoint("end", "latest")
        if end.latest < start.earliest:
            raise self.failed("end", self.text("end"),
                              f"the end comes before the start {self.text('start')!r}")
        if kind not in ("reign", "period", ""):
            raise self.failed("kind", self.text("kind"), "kind is 'reign' or 'period'")
        return Period(label, aliases, start, end, kind == "reign", self.text("start"),
                      self.text("end"), self.source, self.number)

    def check_name(self, role: str, name: str) -> None:
        """Refuse no name, a name given before, a name that reads as a date (it would hide it)."""
        if not name:
            raise self.failed(role, "", "a period needs a label")
        try:
            as_date = self.parse(name)
        except DateError:
            as_date = None
        if as_date is not None:
            raise self.failed(role, name, f"reads as a date ({as_date}), not as a name")
        row, first = self.names.setdefault(period_key(name), (self.number, name))
        if row != self.number:
            raise self.failed(role, name, f"row {row} already names a period {first!r}; "
                              "two periods cannot share a name")

    def endpoint(self, role: str, bound: str) -> Endpoint:
        text = self.text(role)
        if not text:
            raise self.failed(role, "", f"a period needs a {role}")
        try:
            endpoint = self.parse(text)
        except DateError as error:
            raise error.located(self.source, self.number, self.cells[role][0]) from error
        if getattr(endpoint, bound) is None:
            raise self.failed(role, text, f"a period's {role} needs an {bound} day")
        return endpoint
