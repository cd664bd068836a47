"""The sheets of an OpenDocument spreadsheet (.ods), streamed from its content.xml with the
standard library's parser.

Not pandas with odfpy, because odfpy builds the whole document in memory, in pure Python, and
pandas then repeats every repeated cell and row as written: a few kilobytes saying "this cell,
16,384 times, in 1,048,576 rows" exhaust memory. Here a repeated row is kept once with its
count, and the count is bounded (sheets.py) before anything is laid out.

What is read (OpenDocument 1.2 Part 1, 9.1 and 19.385, from memory): each table:table is a
sheet named by table:name; its table:table-row elements (also inside header-row and row-group
elements) hold table:table-cell and table:covered-table-cell elements; `number-rows-repeated`
and `number-columns-repeated` repeat them; `number-rows-spanned` merges cells down; the value
is an attribute by office:value-type (float, percentage, currency, date, time, boolean,
string), the text the paragraphs inside. LibreOffice marks error results with calcext:value-type
"error"; table:null-date gives day 0 of the document's serials."""
from __future__ import annotations

import re
import zlib
from datetime import date, datetime
from pathlib import Path
from xml.etree.ElementTree import Element, ParseError, iterparse
from zipfile import BadZipFile, ZipFile

from ..errors import SourceError
from .serials import DateSystem, opendocument_system
from .sheets import (
    MAX_COLUMNS, SheetCells, UnreadableCell, checked_part, empty_sheet_error, error_value,
    formula_without_value, sheet_name,
)
from .xlsx import unopenable

OFFICE = "{urn:oasis:names:tc:opendocument:xmlns:office:1.0}"
TABLE = "{urn:oasis:names:tc:opendocument:xmlns:table:1.0}"
TEXT = "{urn:oasis:names:tc:opendocument:xmlns:text:1.0}"
CALCEXT = "{urn:org:documentfoundation:names:experimental:calc:xmlns:calcext:1.0}"
SHEET, ROW, NULL_DATE = TABLE + "table", TABLE + "table-row", TABLE + "null-date"
CELLS = frozenset({TABLE + "table-cell", TABLE + "covered-table-cell"})
PARAGRAPHS = frozenset({TEXT + "p", TEXT + "h"})
SPACES, TAB, LINE_BREAK = TEXT + "s", TEXT + "tab", TEXT + "line-break"
ANNOTATION = OFFICE + "annotation"
MAX_SPACES = 100_000   # in one run (text:s): far beyond any cell, far below memory's end
NUMBER_TYPES = frozenset({"float", "percentage", "currency"})
# xsd:date / xsd:dateTime as the value of a date cell
_DATE_VALUE = re.compile(r"(-?\d{4,})-(\d\d)-(\d\d)(?:T(\d\d):(\d\d):(\d\d)(?:\.(\d+))?)?")


def read_ods(path: Path, wanted: str | int | None) -> tuple[SheetCells, DateSystem]:
    """The chosen sheet's cells and the document's date system."""
    try:
        archive = ZipFile(path)
    except (BadZipFile, OSError, ValueError) as error:
        raise unopenable(path.name, error) from error
    with archive:
        try:
            sheets, system = _sheets(archive, path.name)
        except (BadZipFile, KeyError, ParseError, ValueError, EOFError, zlib.error) as error:
            raise unopenable(path.name, error) from error
    name = sheet_name(path.name, list(sheets), wanted)
    if sheets[name].is_empty:
        holdings = [(other, not cells.is_empty) for other, cells in sheets.items()]
        raise empty_sheet_error(path.name, name, holdings)
    return sheets[name], system


def _sheets(archive: ZipFile, file_name: str) -> tuple[dict[str, SheetCells], DateSystem]:
    """Every sheet's rows, in one pass over content.xml."""
    checked_part(archive, "content.xml", file_name, "its content")
    sheets: dict[str, SheetCells] = {}
    system = opendocument_system()
    sheet, holder, number = None, None, 0
    with archive.open("content.xml") as stream:
        for event, element in iterparse(stream, events=("start", "end")):
            if event == "start":
                if element.tag == SHEET:
                    name = element.get(TABLE + "name", f"Sheet{len(sheets) + 1}")
                    sheet = sheets.setdefault(name, SheetCells(file_name, name))
                    holder, number = element, 0
            elif element.tag == ROW and sheet is not None:
                repeat = _count(element, "number-rows-repeated")
                sheet.add_row(number + 1, _row_values(element, sheet, number + 1), repeat)
                number += repeat
                element.clear()
                del holder[:]                # the finished rows: a long sheet in little memory
            elif element.tag == NULL_DATE:
                system = opendocument_system(date.fromisoformat(
                    element.get(TABLE + "date-value", "1899-12-30")[:10]))
    return sheets, system


def _row_values(row: Element, sheet: SheetCells, number: int) -> list[object]:
    values: list[object] = []
    column = 0                                # cells passed so far
    for cell in row:
        if cell.tag not in CELLS:
            continue
        repeat = _count(cell, "number-columns-repeated")
        value = _value(cell)
        if value != "":
            if column + repeat > MAX_COLUMNS:
                raise SourceError(f"{sheet.file_name}: row {number} of the sheet {sheet.sheet!r} "
                                  f"has values beyond column {MAX_COLUMNS:,}, the last a sheet "
                                  "has", hint="open it in a spreadsheet program and save it again")
            if isinstance(value, UnreadableCell):
                sheet.marked.update(range(column, column + repeat))
            values.extend([""] * (column - len(values)))
            values.extend([value] * repeat)
            _add_merged(sheet, cell, number, column + 1)
        column += repeat
    return values


def _count(element: Element, attribute: str) -> int:
    """A repeat or span count: a whole number from 1 on."""
    count = int(element.get(TABLE + attribute, "1"))
    if count < 1:
        raise ValueError(f"table:{attribute} is {count}")
    return count


def _add_merged(sheet: SheetCells, cell: Element, number: int, column: int) -> None:
    rows = _count(cell, "number-rows-spanned")
    columns = _count(cell, "number-columns-spanned")
    if rows > 1 or columns > 1:
        sheet.merged.append((number, column, number + rows - 1, column + columns - 1))


def _value(cell: Element) -> object:
    """A cell's value as plain Python ("" when empty), or an UnreadableCell."""
    kind = cell.get(OFFICE + "value-type")
    if cell.get(CALCEXT + "value-type") == "error":
        return error_value(_text(cell))
    if kind is None:
        formula = cell.get(TABLE + "formula")
        return _text(cell) if formula is None else formula_without_value(formula)
    if kind in NUMBER_TYPES:
        return _number(cell.get(OFFICE + "value", ""), kind)
    if kind == "date":
        return _date(cell.get(OFFICE + "date-value", ""))
    if kind == "boolean":
        return cell.get(OFFICE + "boolean-value", "").strip().lower() == "true"
    if kind == "string":
        written = cell.get(OFFICE + "string-value")
        return _text(cell) if written is None else written
    return _text(cell)                        # a time, or a type to come: as it is shown


def _number(text: str, kind: str) -> object:
    try:
        number = float(text)
    except ValueError:
        return UnreadableCell(text, "the file stores it as a number, but it is not one", text)
    if kind == "float" and number.is_integer():
        return int(number)                    # 1650.0: a whole number, as spreadsheets store it
    return number


def _date(text: str) -> object:
    found = _DATE_VALUE.fullmatch(text.strip().rstrip("Z"))
    if not found:
        return UnreadableCell(text, "the file stores it as a date, but it is not one", text)
    year, month, day, hour, minute, second, fraction = found.groups()
    if not 1 <= int(year) <= 9999:
        # xsd:date counts no year 0 in XML Schema 1.0 and counts one in 1.1: which one the
        # writer meant cannot be told, so a date before AD 1 is refused rather than guessed.
        return UnreadableCell(text, "a date cell before AD 1 (or after 9999) is not read: "
                              "which year it means depends on the program that wrote it", text,
                              hint="write it as text, such as '44 BC'")
    microsecond = int((fraction or "0")[:6].ljust(6, "0"))
    return datetime(int(year), int(month), int(day), int(hour or 0), int(minute or 0),
                    int(second or 0), microsecond)


def _text(cell: Element) -> str:
    """The text of a cell's paragraphs, one line each, as a spreadsheet shows it."""
    return "\n".join(_paragraph(item) for item in cell if item.tag in PARAGRAPHS)


def _spaces(element: Element) -> int:
    count = int(element.get(TEXT + "c", "1"))
    if not 0 <= count <= MAX_SPACES:
        raise ValueError(f"a run of {count:,} spaces in a cell")
    return count


def _paragraph(element: Element) -> str:
    if not len(element):
        return element.text or ""
    parts = [element.text or ""]
    for child in element:
        if child.tag == SPACES:
            parts.append(" " * _spaces(child))
        elif child.tag == TAB:
            parts.append("\t")
        elif child.tag == LINE_BREAK:
            parts.append("\n")
        elif child.tag != ANNOTATION:
            parts.append(_paragraph(child))
        parts.append(child.tail or "")
    return "".join(parts)
