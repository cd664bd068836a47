"""One sheet of an XLSX/XLSM workbook, streamed row by row with the standard library's parser.

Not pandas nor openpyxl's sheet reader, because they turn a date-formatted cell into a date
before its serial can be seen (serials 59 and 60 both become 1900-02-28), read a formula with
no saved value as an empty cell, leave merged cells empty, and, with defusedxml installed, parse
in pure Python (about 4 s for 50,000 rows). openpyxl still decides which number formats are
dates (`openpyxl.styles.numbers`), as it did under pandas.

The parts read (ECMA-376 Part 1, from memory): `_rels/.rels` names the workbook part; the
workbook names the sheets and its date system (`workbookPr date1904`); its relationships name
each sheet's part, the shared strings and the styles; the styles' `cellXfs` say which cell
styles are date formats; a sheet holds `sheetData` rows of cells and `mergeCells`.
XML safety: Python's expat (2.4.1 on) refuses entity-expansion bombs and ElementTree fetches
no external entity (Python documentation, "XML vulnerabilities")."""
from __future__ import annotations

import posixpath
import re
import zlib
from collections.abc import Iterator
from dataclasses import dataclass
from datetime import datetime
from pathlib import Path
from xml.etree.ElementTree import Element, ParseError, fromstring, iterparse
from zipfile import BadZipFile, ZipFile

from ..errors import SourceError
from .serials import EXCEL_1900, EXCEL_1904, DateSystem, day_from_serial
from .sheets import (
    MAX_COLUMNS, SheetCells, UnreadableCell, checked_part, empty_sheet_error, error_value,
    formula_without_value, sheet_name,
)

MAIN = "{http://schemas.openxmlformats.org/spreadsheetml/2006/main}"
OFFICE_RELATIONSHIP = "{http://schemas.openxmlformats.org/officeDocument/2006/relationships}id"
PACKAGE_RELATIONSHIP = "{http://schemas.openxmlformats.org/package/2006/relationships}"
ROW, CELL, VALUE, FORMULA = MAIN + "row", MAIN + "c", MAIN + "v", MAIN + "f"
TEXT, RUN, INLINE = MAIN + "t", MAIN + "r", MAIN + "is"
# Number formats 27-36 and 50-58 are the East Asian date and time formats, which a workbook
# does not spell out and openpyxl does not list (ECMA-376 Part 1, 18.8.30; from memory).
EAST_ASIAN_DATE_FORMATS = frozenset(range(27, 37)) | frozenset(range(50, 59))
_ESCAPED = re.compile(r"_x([0-9A-Fa-f]{4})_")   # ST_Xstring: _x000D_ is a carriage return
UNOPENABLE_HINT = "open it in a spreadsheet program and save it again"


@dataclass(frozen=True, slots=True)
class _Workbook:
    sheets: dict[str, str]          # sheet name -> its part, in the workbook's order
    shared_strings: str | None
    styles: str | None
    date_system: DateSystem


def read_xlsx(path: Path, wanted: str | int | None) -> tuple[SheetCells, DateSystem]:
    """The chosen sheet's cells and the workbook's date system."""
    try:
        archive = ZipFile(path)
    except (BadZipFile, OSError, ValueError) as error:
        raise unopenable(path.name, error) from error
    with archive:
        try:
            return _read(archive, path.name, wanted)
        except (BadZipFile, KeyError, IndexError, ParseError, ValueError, EOFError,
                zlib.error) as error:
            raise unopenable(path.name, error) from error


def unopenable(file_name: str, error: Exception) -> SourceError:
    return SourceError(f"{file_name}: cannot open it as a spreadsheet ({error})",
                       hint=UNOPENABLE_HINT)


def _read(archive: ZipFile, file_name: str,
          wanted: str | int | None) -> tuple[SheetCells, DateSystem]:
    book = _workbook(archive, file_name)
    name = sheet_name(file_name, list(book.sheets), wanted)
    reader = _SheetReader(archive, file_name, book)
    cells = reader.cells(name)
    if cells.is_empty:
        holdings = [(other, other != name and reader.holds_data(other)) for other in book.sheets]
        raise empty_sheet_error(file_name, name, holdings)
    return cells, book.date_system


def _workbook(archive: ZipFile, file_name: str) -> _Workbook:
    package = _relationships(archive, "_rels/.rels", file_name)
    part = _target(package, "/officeDocument") or "xl/workbook.xml"
    book = _xml(archive, part, file_name)
    if book.tag != MAIN + "workbook":
        raise ValueError(f"its workbook part is {book.tag}, not an Excel workbook")
    properties = book.find(MAIN + "workbookPr")
    date1904 = properties is not None and properties.get("date1904", "0").lower() in ("1", "true")
    related = _relationships(archive, posixpath.join(posixpath.dirname(part), "_rels",
                                                     posixpath.basename(part) + ".rels"),
                             file_name)
    sheets = {}
    for sheet in book.iterfind(f"{MAIN}sheets/{MAIN}sheet"):
        kind, target = related.get(sheet.get(OFFICE_RELATIONSHIP, ""), ("", ""))
        if kind.endswith("/worksheet"):   # chart sheets hold no cells
            sheets[sheet.get("name", "")] = target
    return _Workbook(sheets, _target(related, "/sharedStrings"), _target(related, "/styles"),
                     EXCEL_1904 if date1904 else EXCEL_1900)


def _relationships(archive: ZipFile, part: str, file_name: str) -> dict[str, tuple[str, str]]:
    """Id -> (type, part) of a relationships part; {} when there is none."""
    if part not in archive.NameToInfo:
        return {}
    folder = posixpath.dirname(posixpath.dirname(part))   # the folder above _rels/
    found = {}
    for item in _xml(archive, part, file_name).iter(PACKAGE_RELATIONSHIP + "Relationship"):
        target = item.get("Target", "")
        if item.get("TargetMode") != "External":
            target = (target.lstrip("/") if target.startswith("/")
                      else posixpath.normpath(posixpath.join(folder, target)))
            found[item.get("Id", "")] = (item.get("Type", ""), target)
    return found


def _target(relationships: dict[str, tuple[str, str]], kind: str) -> str | None:
    return next((part for type_, part in relationships.values() if type_.endswith(kind)), None)


def _xml(archive: ZipFile, part: str, file_name: str) -> Element:
    checked_part(archive, part, file_name, f"its part {part}")
    return fromstring(archive.read(part))


def _completed(archive: ZipFile, part: str, container: str, tags: set[str]) -> Iterator[Element]:
    """The elements of `tags` in `part`, each once complete; the finished ones are dropped
    from their `container`, so that a long part is streamed in little memory.

    Only start events are asked for, half as many as start and end: an element is complete
    when the next one of `tags` starts, or when the part ends."""
    holder = pending = None
    with archive.open(part) as stream:
        for _, element in iterparse(stream, events=("start",)):
            tag = element.tag
            if tag in tags:
                if pending is not None:
                    yield pending
                    if holder is not None:
                        del holder[:-1]
                pending = element
            elif tag == container:
                holder = element
    if pending is not None:
        yield pending


class _SheetReader:
    """Reads sheets of one workbook: its shared strings and date styles loaded once."""

    def __init__(self, archive: ZipFile, file_name: str, book: _Workbook) -> None:
        self.archive, self.file_name, self.book = archive, file_name, book
        self.strings = self._shared_strings()
        self.date_styles = self._date_styles()
        self._columns: dict[str, int] = {}

    def cells(self, name: str, first_value_only: bool = False) -> SheetCells:
        part = self.book.sheets[name]
        checked_part(self.archive, part, self.file_name, f"the sheet {name!r}")
        cells = SheetCells(self.file_name, name)
        number = 0
        for element in _completed(self.archive, part, MAIN + "sheetData",
                                  {ROW, MAIN + "mergeCell"}):
            if element.tag == ROW:
                number = int(element.get("r") or number + 1)
                cells.add_row(number, self._row_values(element, cells))
                if first_value_only and not cells.is_empty:
                    break
            else:
                _add_merged(cells, element.get("ref", ""))
        return cells

    def holds_data(self, name: str) -> bool | None:
        """Whether a sheet holds any value; None when it is over the size guard."""
        try:
            return not self.cells(name, first_value_only=True).is_empty
        except SourceError:
            return None

    def _row_values(self, row: Element, cells: SheetCells) -> list[object]:
        values: list[object] = []
        column = 0
        for cell in row:
            if cell.tag != CELL:
                continue
            reference = cell.get("r")
            column = self._column(reference) if reference else column + 1
            value = self._value(cell)
            if value == "":
                continue
            if type(value) is UnreadableCell:
                cells.marked.add(column - 1)
            if column == len(values) + 1:
                values.append(value)
            elif column > len(values):
                values.extend([""] * (column - 1 - len(values)))
                values.append(value)
            else:
                values[column - 1] = value   # a cell out of order
        return values

    def _column(self, reference: str) -> int:
        letters = reference.rstrip("0123456789")
        try:
            return self._columns[letters]
        except KeyError:
            return self._columns.setdefault(letters, column_number(letters, reference))

    def _value(self, cell: Element) -> object:
        """A cell's value as plain Python ("" when empty), or an UnreadableCell."""
        kind = cell.get("t", "n")
        value = cell.findtext(VALUE)
        if not value:
            return self._without_value(cell, kind, value)
        if kind == "n":
            return self._number(value, cell.get("s", "0"))
        if kind == "s":
            return self.strings[int(value)]
        if kind == "b":
            return value.strip() in ("1", "true")
        if kind == "e":
            return error_value(value)
        if kind == "d":               # a date written as ISO 8601 text (strict workbooks)
            return _iso_date_time(value)
        return _unescaped(value)      # "str": a formula's text result

    @staticmethod
    def _without_value(cell: Element, kind: str, value: str | None) -> object:
        """A cell with no value or an empty one: an inline string, an empty cell, a formula's
        empty text, or a formula whose result was never saved."""
        formula = cell.find(FORMULA)
        if formula is not None and (value is None or kind != "str"):
            return formula_without_value("=" + (formula.text or ""))
        return _text_of(cell.find(INLINE)) if kind == "inlineStr" else ""

    def _number(self, text: str, style: str) -> object:
        try:
            number = _number_from(text)
        except ValueError:
            return UnreadableCell(text, "the file stores it as a number, but it is not one", text)
        if style in self.date_styles:
            return day_from_serial(number, self.book.date_system)
        if type(number) is float and number.is_integer():
            return int(number)            # 1650.0: a whole number, as spreadsheets store them
        return number

    def _shared_strings(self) -> list[str]:
        part = self.book.shared_strings
        if part is None or part not in self.archive.NameToInfo:
            return []
        checked_part(self.archive, part, self.file_name, "its shared text")
        return [_text_of(item)
                for item in _completed(self.archive, part, MAIN + "sst", {MAIN + "si"})]

    def _date_styles(self) -> frozenset[str]:
        """The cell styles (by index, as the `s` attribute writes them) that show dates."""
        part = self.book.styles
        if part is None or part not in self.archive.NameToInfo:
            return frozenset()
        root = _xml(self.archive, part, self.file_name)
        custom = {int(item.get("numFmtId", -1)): item.get("formatCode", "")
                  for item in root.iterfind(f"{MAIN}numFmts/{MAIN}numFmt")}
        return frozenset(str(index) for index, style in
                         enumerate(root.iterfind(f"{MAIN}cellXfs/{MAIN}xf"))
                         if _is_date_format(int(style.get("numFmtId", 0)), custom))


def _number_from(text: str) -> int | float:
    try:
        return int(text)              # most numbers in a register are whole: years, counts
    except ValueError:
        return float(text)


def _is_date_format(number_format: int, custom: dict[int, str]) -> bool:
    from openpyxl.styles.numbers import BUILTIN_FORMATS, is_date_format, is_timedelta_format

    code = custom.get(number_format) or BUILTIN_FORMATS.get(number_format)
    if code is None:
        return number_format in EAST_ASIAN_DATE_FORMATS
    # a duration ([h]:mm) counts hours, not days since the epoch: it stays a number
    return is_date_format(code) and not is_timedelta_format(code)


def _text_of(item: Element | None) -> str:
    """The text of a shared or inline string: its <t>, or its rich-text runs' <t> joined
    (phonetic guides, <rPh>, left out)."""
    if item is None:
        return ""
    plain = item.find(TEXT)
    if plain is not None:
        return _unescaped(plain.text or "")
    return _unescaped("".join(run.findtext(TEXT) or "" for run in item.iterfind(RUN)))


def _unescaped(text: str) -> str:
    # Characters XML cannot hold are written _xHHHH_; _x005F_ escapes a literal underscore.
    if "_x" not in text:
        return text
    return _ESCAPED.sub(lambda found: chr(int(found.group(1), 16)), text)


def _add_merged(cells: SheetCells, reference: str) -> None:
    first, _, last = reference.partition(":")
    if last:
        (first_row, first_column), (last_row, last_column) = map(_row_column, (first, last))
        cells.merged.append((first_row, first_column, last_row, last_column))


def _row_column(reference: str) -> tuple[int, int]:
    letters = reference.rstrip("0123456789")
    return int(reference[len(letters):]), column_number(letters, reference)


def column_number(letters: str, reference: str) -> int:
    """A column's number from its letters: A -> 1, XFD -> 16384."""
    number = 0
    for letter in letters.upper():
        number = number * 26 + ord(letter) - ord("A") + 1
    if not (letters.isascii() and letters.isalpha() and number <= MAX_COLUMNS):
        raise ValueError(f"cell {reference} lies outside a sheet's columns A to XFD")
    return number


def _iso_date_time(text: str) -> object:
    try:
        return datetime.fromisoformat(text.strip())
    except ValueError:
        return text
