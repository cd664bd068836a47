"""The bytes of a text table as text: which encoding reads them, and what to tell the reader.

The rule, in order (docs/dates.md, *Text files and their encodings*):

1. a byte-order mark names the encoding: UTF-8 (EF BB BF, which Excel writes before "CSV
   UTF-8") or UTF-16 (FF FE, FE FF: a spreadsheet's "Unicode text");
2. an encoding the caller names (`--encoding`, `encoding=`) is used as named, and a byte it
   cannot read is an error;
3. otherwise UTF-8;
4. bytes that are not UTF-8 are read as Windows-1252, with one note naming it and the first
   line whose text it decided.

Why Windows-1252 and not a detector: it is what Windows in the western European languages
and the Americas writes for a "CSV (Comma delimited)" or "ANSI" text, so what older catalogue
and collection systems export (common practice, no source). Latin-1 (ISO 8859-1) differs from
it only in bytes 0x80-0x9F, where Latin-1 has control characters that no table means, so a
Latin-1 file reads the same; and Latin-1 reads any bytes at all, so it could never refuse a
file that is not text, while Windows-1252 leaves five bytes undefined (0x81, 0x8D, 0x8F, 0x90,
0x9D; Python's cp1252 codec). A statistical detector (charset-normalizer) has little to go on
in a table of ASCII with a few accented names, and its answer may change from one version to
the next; the rule reads a file the same way everywhere, and the note quotes the text it read,
so that a wrong guess (a Central European or Mac file) is seen and `--encoding` corrects it.

Still refused, with a hint: bytes Windows-1252 does not define, a NUL byte (binary data), and a
file that mixes UTF-8 with another encoding (no one encoding reads it cleanly).
"""
from __future__ import annotations

import codecs
import re
from dataclasses import dataclass
from encodings.aliases import aliases

from ..errors import SourceError, UsageError, did_you_mean
from .problems import Problem

FALLBACK = "cp1252"
FALLBACK_NAME = "Windows-1252"
_MARKS = ((codecs.BOM_UTF8, "utf-8-sig"), (codecs.BOM_UTF16_LE, "utf-16"),
          (codecs.BOM_UTF16_BE, "utf-16"))
SAVE_AS_UTF8 = "save the file as UTF-8 (in a spreadsheet program: 'CSV UTF-8')"
_NAME_IT = "or name its encoding with --encoding, such as --encoding cp1252"
# A character only UTF-8 writes (two bytes or more): not ASCII, and not a byte that failed to
# read, which surrogateescape keeps as U+DC80..U+DCFF.
_READ_AS_UTF8 = re.compile("[\x80-\udc7f\udd00-\U0010ffff]")
_NOT_ASCII = re.compile(rb"[\x80-\xff]")
_FIELD_END = re.compile(r'[,;\t|"\r\n]')        # what ends a cell's text in a line


@dataclass(frozen=True, slots=True)
class Decoded:
    text: str
    encoding: str                  # the codec that read it, as Python names it
    notes: tuple[Problem, ...] = ()


def decoded_text(raw: bytes, source: str, encoding: str | None = None) -> Decoded:
    """The text of a table file's bytes, by the rule of the module; raises SourceError."""
    marked = next((name for mark, name in _MARKS if raw.startswith(mark)), None)
    if marked is not None or encoding is not None:
        chosen = marked or _with_mark_dropped(encoding)
        return Decoded(_strictly(raw, chosen, source), chosen)
    try:
        return Decoded(raw.decode("utf-8"), "utf-8")
    except UnicodeDecodeError as error:
        return _fallback(raw, source, error)


def _with_mark_dropped(encoding: str) -> str:
    """utf-8 given by name still drops a byte-order mark (that never reaches here: read above)."""
    return "utf-8-sig" if codecs.lookup(encoding).name == "utf-8" else encoding


def _strictly(raw: bytes, encoding: str, source: str) -> str:
    try:
        return raw.decode(encoding)
    except UnicodeDecodeError as error:
        raise SourceError(f"{source}: {_not_read(raw, error, _shown_name(encoding))}",
                          hint=SAVE_AS_UTF8) from error


def _shown_name(encoding: str) -> str:
    return encoding.removesuffix("-sig")


def _not_read(raw: bytes, error: UnicodeDecodeError, name: str) -> str:
    line = raw.count(b"\n", 0, error.start) + 1
    return f"line {line} is not {name} text (byte 0x{raw[error.start]:02x})"


def _fallback(raw: bytes, source: str, not_utf8: UnicodeDecodeError) -> Decoded:
    """Bytes that are not UTF-8, read as Windows-1252 when that reads them cleanly."""
    refusal = _why_not_fallback(raw, not_utf8)
    if refusal is not None:
        raise SourceError(f"{source}: {refusal}", hint=f"{SAVE_AS_UTF8}, {_NAME_IT}")
    text = raw.decode(FALLBACK)
    return Decoded(text, FALLBACK, (_fallback_note(raw, text, source),))


def _why_not_fallback(raw: bytes, not_utf8: UnicodeDecodeError) -> str | None:
    """Why no one encoding reads the file cleanly, or None when Windows-1252 does."""
    first = _not_read(raw, not_utf8, "UTF-8")
    if b"\x00" in raw:
        return f"{first}, and holds a NUL byte: it is not a text table"
    try:
        raw.decode(FALLBACK)
    except UnicodeDecodeError as error:
        return f"{first}, nor {FALLBACK_NAME} ({_not_read(raw, error, FALLBACK_NAME)})"
    mixed = _utf8_line(raw)
    if mixed is not None:
        return (f"{first}, but line {mixed} is: the file mixes UTF-8 with another encoding, "
                "and no one encoding reads it")
    return None


def _utf8_line(raw: bytes) -> int | None:
    """The first line holding a character that only UTF-8 reads (two bytes or more), if any."""
    text = raw.decode("utf-8", "surrogateescape")
    found = _READ_AS_UTF8.search(text)
    return None if found is None else text.count("\n", 0, found.start()) + 1


def _fallback_note(raw: bytes, text: str, source: str) -> Problem:
    """The note of a file read as Windows-1252: the first line it decided, quoting its text."""
    # One byte is one character in Windows-1252, so a byte's place is its character's place.
    first = _NOT_ASCII.search(raw).start()      # there is one: the bytes are not UTF-8
    line = raw.count(b"\n", 0, first) + 1
    reason = (f"the file is not UTF-8 text; read as {FALLBACK_NAME} ({FALLBACK}), first on "
              f"line {line}: {_cell_around(text, first)!r}")
    hint = ("if that does not read right, name the encoding with --encoding; a file saved "
            "as 'CSV UTF-8' needs none")
    return Problem(source, line, None, None, "", reason, "note", hint=hint)


def _cell_around(text: str, place: int, longest: int = 40) -> str:
    """The text of the cell that holds character `place`, as a note quotes it."""
    start = max((found.end() for found in _FIELD_END.finditer(text, 0, place)), default=0)
    ends = _FIELD_END.search(text, place)
    cell = text[start:ends.start() if ends else len(text)].strip()
    return cell if len(cell) <= longest else cell[:longest] + "..."


def checked_encoding(name: str) -> str:
    """`name` when Python knows it as a text encoding; else a UsageError with a suggestion."""
    try:
        known = codecs.lookup(name)
    except (LookupError, TypeError):
        hint = did_you_mean(str(name), encoding_names()) or (
            "common ones: utf-8, cp1252 (Windows-1252), latin-1, utf-16, mac-roman, cp1250")
        raise UsageError(f"unknown encoding {name!r}", hint=hint) from None
    if not getattr(known, "_is_text_encoding", True):   # rot13, base64, zlib: not for text
        raise UsageError(f"{name!r} is not a text encoding",
                         hint="name a text encoding, such as utf-8 or cp1252")
    return name


def encoding_names() -> list[str]:
    """Every encoding name and alias Python knows, written with hyphens (windows-1252)."""
    names = {*aliases, *aliases.values()}
    return sorted({name.replace("_", "-") for name in names})
