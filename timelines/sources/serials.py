"""Spreadsheet date serials: how a workbook counts days, and the numbers of a date column.

A spreadsheet stores a date as a number of days, shown as a date only by the cell's format. A
date-formatted cell arrives as a `datetime`; a number in a "General" cell arrives as the
number, and 45123 is then either the year 45123 or the day 2023-07-16. `date_numbers` decides:

- "years" (the default): a number is a year, as 1650 in a cell usually is; a negative one or
  0 as the signed-years and year-zero settings read the text `-300` or `0` (dates/signed.py).
  A number of five digits or more is refused, as the text `45123` is, and the message says
  which day it would be as a serial: Excel's serials pass 9999 in May 1927, so such a number
  is far more often a date that lost its format than a year; a negative one (-91246) is a
  day before 1900 as openpyxl and LibreOffice count them, or a year before 9999 BC;
- "serials": every number of a date column is a day counted in the workbook's date system.

Date systems (from memory: Microsoft, "Date systems in Excel" and "Excel incorrectly assumes
that the year 1900 is a leap year"; OpenDocument 1.2, table:null-date):
- Excel 1900: serial 1 is 1900-01-01; serial 60 is 1900-02-29, a day that did not exist, kept
  for compatibility with Lotus 1-2-3; serial 61 is 1900-03-01; the last is 2958465 (9999-12-31);
  serial 0, shown as 1900-01-00, is no day: a cell holding less than 1 is a time of day;
- Excel 1904 (older Mac workbooks, the workbook property date1904): serial 0 is 1904-01-01;
- OpenDocument: serial 0 is the document's null date, 1899-12-30 unless it says otherwise,
  and there is no 29 February 1900.
Excel counts no day before its first, but other programs write earlier days as negative
serials counted back from 1899-12-30 (1900 system) or 1904-01-01: openpyxl, and pandas through
it, write 1650-03-04 as -91246; LibreOffice does the same. They are read so.
"""
from __future__ import annotations

import math
from dataclasses import dataclass
from datetime import date, datetime, time, timedelta

from .sheets import UnreadableCell

DATE_NUMBERS = ("years", "serials")
DATE_NUMBERS_OPTION = "--date-numbers"
LARGEST_YEAR_NUMBER = 9999     # as in text: a year of more than four digits needs a sign
_SECONDS_A_DAY = 86_400


@dataclass(frozen=True, slots=True)
class DateSystem:
    """How a workbook counts days: serial n is `day_zero` + n days."""

    name: str                      # as a message says it
    day_zero: date
    lotus_leap_day: bool = False   # serial 60 is 1900-02-29 and days 1-59 shift by one

    @property
    def last_serial(self) -> int:
        return (date(9999, 12, 31) - self.day_zero).days


EXCEL_1900 = DateSystem("Excel's 1900 date system", date(1899, 12, 30), lotus_leap_day=True)
EXCEL_1904 = DateSystem("Excel's 1904 date system", date(1904, 1, 1))


def opendocument_system(null_date: date = date(1899, 12, 30)) -> DateSystem:
    return DateSystem(f"the document's date system (day 0 = {null_date.isoformat()})",
                      null_date)


def day_from_serial(serial: float, system: DateSystem) -> datetime | UnreadableCell:
    """The day (and time of day) a serial names, or why it names none."""
    whole = math.floor(serial)
    if system.lotus_leap_day and whole == 60:
        return UnreadableCell("1900-02-29", "1900-02-29 did not exist (1900 was not a leap "
                              "year); Excel counts it as serial 60 to match Lotus 1-2-3",
                              "1900-02-29", hint="correct the date in the spreadsheet")
    if system.lotus_leap_day and whole == 0:
        shown = _time_of_day(serial - whole).isoformat()
        return UnreadableCell(shown, "a time of day with no date", shown)
    if whole > system.last_serial or system.day_zero.toordinal() + whole < 1:
        return UnreadableCell(_number_text(serial), f"{_number_text(serial)} is not a day "
                              f"of {system.name} (AD 1 to 9999)", _number_text(serial))
    if system.lotus_leap_day and 0 < whole < 60:
        whole += 1                 # before the day that did not exist: one day later
    day = system.day_zero + timedelta(days=whole)
    return datetime.combine(day, _time_of_day(serial - math.floor(serial)))


def _time_of_day(fraction: float) -> time:
    # to the millisecond, as spreadsheets keep it; a fraction that rounds to a whole day
    # stays the last millisecond of the day
    milliseconds = min(round(fraction * _SECONDS_A_DAY * 1000), _SECONDS_A_DAY * 1000 - 1)
    seconds, millisecond = divmod(milliseconds, 1000)
    return time(seconds // 3600, seconds // 60 % 60, seconds % 60, millisecond * 1000)


def _number_text(number: float) -> str:
    return str(int(number)) if float(number).is_integer() else repr(float(number))


def date_column_values(values: list[object], system: DateSystem | None,
                       date_numbers: str) -> list[object]:
    """A date column's cells with its numbers read as `date_numbers` says: days for
    "serials"; for "years", numbers of more than four digits refused (see the module)."""
    if system is None or not {int, float} & set(map(type, values)):
        return values              # a text table, or a sheet with no number in the column
    read = _as_serial if date_numbers == "serials" else _as_year
    read_once: dict[object, object] = {}

    def value_read(value: object) -> object:
        if type(value) not in (int, float):
            return value
        if value not in read_once:
            read_once[value] = read(value, system)
        return read_once[value]

    return list(map(value_read, values))


def _as_serial(number: int | float, system: DateSystem) -> object:
    if math.isnan(number) or math.isinf(number):
        return number              # left to the date reader, which says why
    return day_from_serial(number, system)


def _as_year(number: int | float, system: DateSystem) -> object:
    """A number as a year (negative ones as the signed-years setting reads them), or why a
    number of more than four digits is refused: as a date serial it names a day."""
    if not abs(number) > LARGEST_YEAR_NUMBER or math.isinf(number):
        return number
    text = _number_text(number)
    hint = f"{DATE_NUMBERS_OPTION} serials reads the numbers of date columns as date serials"
    day = day_from_serial(number, system)
    if not isinstance(day, datetime):
        return UnreadableCell(text, "a year of more than four digits is written as text "
                              "with a sign (+12000) or an era (12000 BC)", text)
    shown = day.date().isoformat() if day.time() == time() else day.isoformat(sep=" ")
    if number < 0:   # openpyxl and LibreOffice write days before 1900 so: 1650 is -91246
        return UnreadableCell(text, f"{text} is a date serial ({shown} in {system.name}) or "
                              "a year before 9999 BC", text, "write such a year as text, "
                              f"such as 12000 BC; {hint}")
    return UnreadableCell(text, f"{text} looks like a date serial ({shown} in "
                          f"{system.name}), not a year", text, hint)
