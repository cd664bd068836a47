"""A small streaming XML writer: tags and escaped text go out as they come, no element tree.

The idea is matplotlib's SVG backend's (`backends/backend_svg.py`): a renderer that calls
`start`, `element` and `end` in document order needs no tree, so a document of a million
elements costs the memory of a buffer, not of a million objects. The output is the one
ElementTree gives for the same tree with `tostring(..., encoding="unicode")`, empty elements
closed by a bare `/>`: text and attribute values are escaped exactly as ElementTree escapes them
(`escape_text`, `escape_attribute`), and attributes are written in the order given. Nothing is
indented: whitespace between elements would be content.

Pieces are gathered and handed to `write` in chunks of about CHUNK_PIECES pieces, so a file
receives a few large writes rather than millions of small ones.
"""
from __future__ import annotations

from collections.abc import Callable, Iterable

CHUNK_PIECES = 4096     # pieces joined into one call of `write`: ~100 KB of a chart's SVG
Attributes = Iterable[tuple[str, "str | None"]]


def escape_text(text: str) -> str:
    """Character data as ElementTree escapes it (`_escape_cdata`): `&`, `<` and `>`. Escaping
    `>` too keeps `]]>` out of text."""
    if "&" in text:
        text = text.replace("&", "&amp;")
    if "<" in text:
        text = text.replace("<", "&lt;")
    if ">" in text:
        text = text.replace(">", "&gt;")
    return text


def escape_attribute(value: str) -> str:
    """A double-quoted attribute value as ElementTree escapes it (`_escape_attrib`, Python
    3.11): markup characters and the quote, then CR, LF and tab as character references, since
    a parser would normalise them to spaces when written as they are (XML 1.0 section 3.3.3)."""
    if "&" in value:
        value = value.replace("&", "&amp;")
    if "<" in value:
        value = value.replace("<", "&lt;")
    if ">" in value:
        value = value.replace(">", "&gt;")
    if '"' in value:
        value = value.replace('"', "&quot;")
    if "\r" in value:
        value = value.replace("\r", "&#13;")
    if "\n" in value:
        value = value.replace("\n", "&#10;")
    if "\t" in value:
        value = value.replace("\t", "&#09;")
    return value


def attribute_text(attributes: Attributes) -> str:
    """` name="value"` for each pair in the order given; a value that is None or empty is left
    out, as svgwrite leaves it out."""
    return "".join([f' {name}="{escape_attribute(value)}"' for name, value in attributes
                    if value])


class XMLWriter:
    """Writes one XML document through `write(str)`, element by element.

    `start` opens an element whose content follows, `end` closes the latest one still open
    (as `<x .../>` when nothing was written into it), `element` writes a whole element with
    optional text, `raw` writes markup as it is (the XML declaration, a final line end).
    Call `close` at the end: it closes what is open and hands over the last chunk."""

    def __init__(self, write: Callable[[str], object]) -> None:
        self._write = write
        self._pieces: list[str] = []
        self._open: list[str] = []        # tags of the elements started and not yet ended
        self._pending = False             # the latest start tag still lacks its ">"

    def raw(self, markup: str) -> None:
        self._put(markup)

    def start(self, tag: str, attributes: Attributes = ()) -> None:
        self._put(f"<{tag}{attribute_text(attributes)}")
        self._open.append(tag)
        self._pending = True

    def element(self, tag: str, attributes: Attributes = (), text: str | None = None) -> None:
        if text:
            self._put(f"<{tag}{attribute_text(attributes)}>{escape_text(text)}</{tag}>")
        else:
            self._put(f"<{tag}{attribute_text(attributes)}/>")

    def end(self) -> None:
        tag = self._open.pop()
        if self._pending:
            self._pending = False
            self._pieces.append("/>")
        else:
            self._put(f"</{tag}>")

    def close(self) -> None:
        while self._open:
            self.end()
        self._flush()

    def _put(self, piece: str) -> None:
        if self._pending:               # content follows: the start tag ends here
            self._pending = False
            self._pieces.append(">")
        self._pieces.append(piece)
        if len(self._pieces) >= CHUNK_PIECES:
            self._flush()

    def _flush(self) -> None:
        if self._pieces:
            self._write("".join(self._pieces))
            self._pieces.clear()
