"""The explorer: one self-contained HTML file to look at a chronology in a browser.

`render_html(data)` writes a page that needs nothing from the network: the data of
`scene.explore.ExploreData` as JSON in a `<script type="application/json">` block, our own
script (explorer.js) and style (explorer.css) inline, and a Content-Security-Policy that
forbids every other source, so the page neither fetches nor runs anything else. The static
chart's title and description are the page's accessible summary.

Safety: the JSON is written with `<`, `>`, `&` and the line separators as \\u escapes, so no
text in the data can close the block (`</script>`) or be read as markup; the script puts
every text into the page as text (`textContent`), never as HTML, and runs no `eval`.

Data contract (the names explorer.js reads; one list entry per record, in lane order):
- `title`, `description`, `domain` [first, last fixed day of the axis], `era`, `calendar`,
  `reform` (first Gregorian day of a historical calendar, or null), `laneHeight`, `barHeight`;
- `groups` [[name, first lane, lanes]], `colors` [[value, #rrggbb]] (the colour key),
  `colorTitle`, `qualifierNames` (the bits of `qualifiers`), `undated` ["label (row n)"];
- `records`: columns `label`, `id`, `group` (index into groups), `lane` (from the top),
  `fill` (index into `palette`), `colorValue` (index into colors, -1 none), `point` (1: a
  moment), `drawn` (four numbers per record, flat: start low, start high, end low, end high;
  the fringe runs from low to high, the core from start high to end low when `core` is 1),
  `open` (bit 1: the start runs on past the axis, bit 2: the end), `bounds` (four per record,
  flat: start earliest, start latest, end earliest, end latest; null: no bound). `bounds`
  holds steps: a record's first day counts from `origin`, each other from the last one known
  before it; `drawn` holds each day's difference from its bound (from `origin` where the bound
  is null), mostly 0. `id` and `colorValue` are empty lists when no record has one; `qualifiers` (bits of `qualifierNames`), `start`,
  `end` (the cells as written; an `end` of null is the start's own cell), `details` (the static
  chart's tooltip lines; only up to 20,000 records, an empty list beyond: the explorer then
  writes them from `bounds`), `row` (the spreadsheet's row number) and `sourceOf` (index into
  `sources`: [file, the columns read]);
- `explanations`: {written date: the lines of `timelines parse --explain`}.
"""
from __future__ import annotations

import base64
import gzip
import hashlib
import html
import json
import re
from importlib import resources

from ..scene.explore import FILTERED_QUALIFIERS, ExploreData
from ..scene.primitives import drawable_text

# JSON inside <script>: nothing in it may end the element or start a comment (HTML Living
# Standard, 4.12.1.3 "Restrictions for contents of script elements").
_JSON_ESCAPES = (("<", "\\u003c"), (">", "\\u003e"), ("&", "\\u0026"),
                 ("\u2028", "\\u2028"), ("\u2029", "\\u2029"))
# A lone surrogate in the data (a DataFrame's string may hold one) has no UTF-8 form: it is
# written as JSON's \uXXXX escape (RFC 8259, section 7), the same string to the page's script.
_SURROGATE = re.compile("[\ud800-\udfff]")


def render_html(data: ExploreData) -> str:
    """The page, as text; the same data give the same bytes."""
    script = _resource("explorer.js")
    style = _resource("explorer.css")
    policy = "; ".join((
        "default-src 'none'",
        f"script-src '{_digest(script)}'",
        f"style-src '{_digest(style)}'",
        "img-src data: blob:",
        "base-uri 'none'",
        "form-action 'none'",
    ))
    title = html.escape(drawable_text(data.title or "Timeline"))
    summary = html.escape(drawable_text(data.description))
    return "\n".join((
        "<!DOCTYPE html>",
        '<html lang="en">',
        "<head>",
        '<meta charset="utf-8">',
        f'<meta http-equiv="Content-Security-Policy" content="{policy}">',
        '<meta name="viewport" content="width=device-width, initial-scale=1">',
        f"<title>{title}</title>",
        f"<style>{style}</style>",
        "</head>",
        "<body>",
        '<main id="tl-app" aria-describedby="tl-summary">',
        f'<h1 id="tl-title">{title}</h1>',
        f'<p id="tl-summary">{summary}</p>',
        '<noscript><p>This page draws its chart with a script; the static chart (SVG, PNG) '
        "shows the same records.</p></noscript>",
        "</main>",
        _data_block(data_json(data)),
        f"<script>{script}</script>",
        "</body>",
        "</html>",
        "",
    ))


# Above this many characters of JSON, the block is gzip-compressed and written in base64: the
# browser's HTML parser reads a page of 100,000 records' JSON (about 9 MB) slower than the
# script then needs to draw it; compressed, the page is a fifth of the size.
COMPRESS_FROM = 2_000_000


def _data_block(text: str) -> str:
    if len(text) <= COMPRESS_FROM:
        return f'<script type="application/json" id="tl-data">{text}</script>'
    packed = gzip.compress(text.encode("utf-8"), compresslevel=6, mtime=0)   # deterministic
    return (f'<script type="application/gzip" id="tl-data">'
            f'{base64.b64encode(packed).decode("ascii")}</script>')


def data_json(data: ExploreData) -> str:
    """The data block: compact JSON with every character that could end it escaped."""
    payload = {
        "title": drawable_text(data.title), "description": drawable_text(data.description),
        "domain": list(data.domain), "origin": data.origin,
        "sources": [list(source) for source in data.sources],
        "era": data.era, "calendar": data.calendar,
        "reform": data.reform, "laneHeight": data.lane_height, "barHeight": data.bar_height,
        "fontFamily": data.font_family,
        "groups": [list(group) for group in data.groups],
        "colors": [list(color) for color in data.colors], "colorTitle": data.color_title,
        "qualifierNames": list(FILTERED_QUALIFIERS), "undated": list(data.undated),
        "records": data.columns, "explanations": data.explanations,
    }
    text = json.dumps(payload, ensure_ascii=False, separators=(",", ":"), sort_keys=True,
                      allow_nan=False)
    for char, escaped in _JSON_ESCAPES:     # str.replace: fast on a page of many megabytes
        text = text.replace(char, escaped)
    return _SURROGATE.sub(lambda found: f"\\u{ord(found.group()):04x}", text)


def _digest(text: str) -> str:
    """A CSP source expression for an inline element's exact text (CSP Level 3, hash-source)."""
    return "sha256-" + base64.b64encode(hashlib.sha256(text.encode("utf-8")).digest()).decode()


def _resource(name: str) -> str:
    return resources.files(__package__).joinpath(name).read_text(encoding="utf-8")
