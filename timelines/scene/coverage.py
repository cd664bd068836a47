"""Characters no installed font has: one plain line per script, naming labels and a remedy.

A renderer draws such a character as its font's missing-glyph box; the reader of the chart
would not know why, so the run says so once (`missing_glyph_notes`), never per glyph.
"""
from __future__ import annotations

from bisect import bisect_right

from .fonts import Face, codepoints, face_for, face_of, faces, font_list
from .primitives import Scene, Text, drawable_text, walk
from .textsize import covered_by_tables

# (first code point, script, what to install): the blocks of Unicode's Blocks.txt (values from
# memory) grouped by script; Debian package names as Debian ships the Noto fonts (from memory:
# fonts-noto-core holds the non-CJK Noto Sans families, fonts-noto-cjk the CJK ones).
_CORE, _CJK = "install fonts-noto-core", "install fonts-noto-cjk"
_OTHER = "install a font for them (Debian's fonts-noto-extra has many) and name it with --font"
_BLOCKS = (
    (0x0000, "Latin", "install fonts-dejavu-core"), (0x0370, "Greek", _CORE),
    (0x0400, "Cyrillic", _CORE), (0x0530, "Armenian", _CORE), (0x0590, "Hebrew", _CORE),
    (0x0600, "Arabic", _CORE), (0x0700, "Syriac", _CORE), (0x0780, "Thaana", _CORE),
    (0x0900, "Devanagari", _CORE), (0x0980, "Bengali", _CORE), (0x0A00, "Gurmukhi", _CORE),
    (0x0A80, "Gujarati", _CORE), (0x0B00, "Oriya", _CORE), (0x0B80, "Tamil", _CORE),
    (0x0C00, "Telugu", _CORE), (0x0C80, "Kannada", _CORE), (0x0D00, "Malayalam", _CORE),
    (0x0D80, "Sinhala", _CORE), (0x0E00, "Thai", _CORE), (0x0E80, "Lao", _CORE),
    (0x0F00, "Tibetan", _CORE), (0x1000, "Myanmar", _CORE), (0x10A0, "Georgian", _CORE),
    (0x1100, "Korean", _CJK), (0x1200, "Ethiopic", _CORE), (0x13A0, "Cherokee", _CORE),
    (0x1400, "other", _OTHER), (0x1780, "Khmer", _CORE), (0x1800, "other", _OTHER),
    (0x1E00, "Latin", _CORE), (0x1F00, "Greek", _CORE), (0x2000, "symbol", _CORE),
    (0x2E80, "Chinese, Japanese or Korean", _CJK), (0xA000, "other", _OTHER),
    (0xAC00, "Korean", _CJK), (0xD800, "other", _OTHER),
    (0xF900, "Chinese, Japanese or Korean", _CJK), (0xFB00, "Latin", _CORE),
    (0xFB1D, "Hebrew", _CORE), (0xFB50, "Arabic", _CORE), (0xFE00, "other", _OTHER),
    (0xFE70, "Arabic", _CORE), (0xFF00, "Chinese, Japanese or Korean", _CJK),
    (0x10000, "other", _OTHER),
    (0x1F000, "emoji", "install an emoji font with outlines, such as Noto Emoji"),
    (0x1FB00, "other", _OTHER), (0x20000, "Chinese, Japanese or Korean", _CJK),
    (0x30000, "other", _OTHER),
)
_STARTS = [start for start, _, _ in _BLOCKS]
_QUOTED_LABELS = 3          # labels named in a line; the rest are counted


def script_of(character: str) -> tuple[str, str]:
    """(script, what to install) for one character, by its Unicode block."""
    _, script, remedy = _BLOCKS[bisect_right(_STARTS, ord(character)) - 1]
    return script, remedy


def script_face(character: str, bold: bool = False) -> Face | None:
    """The Noto Sans face made for the character's script ("Noto Sans Cherokee"), when it is
    installed and has the character: the fallback after the chart's own list, as a browser
    falls back to any installed font."""
    script, _ = script_of(character)
    face = face_of(f"Noto Sans {script}", bold) if script.isalpha() else None
    return face if face is not None and ord(character) in codepoints(face) else None


def missing_glyph_notes(scene: Scene) -> tuple[str, ...]:
    """One line per script whose characters no installed font of the scene's list has."""
    labels_by_script: dict[str, list[str]] = {}
    remedies: dict[str, str] = {}
    for text in _texts_beyond_tables(scene):
        for character in _missing(text, scene.font_family):
            script, remedies[script] = script_of(character)
            labels = labels_by_script.setdefault(script, [])
            if text not in labels:
                labels.append(text)
    return tuple(_note(script, labels, remedies[script])
                 for script, labels in labels_by_script.items())


def _texts_beyond_tables(scene: Scene) -> list[str]:
    texts = (drawable_text(item.text) for item in walk(scene.children) if isinstance(item, Text))
    return list(dict.fromkeys(t for t in texts if t and not covered_by_tables(t)))


def _missing(text: str, families: str) -> list[str]:
    available = faces(font_list(families))
    return [c for c in dict.fromkeys(text) if c.isprintable() and not c.isspace()
            and face_for(c, available) is None and script_face(c) is None]


def _note(script: str, labels: list[str], remedy: str) -> str:
    count = len(labels)
    named = ", ".join(repr(label) for label in labels[:_QUOTED_LABELS])
    more = f" and {count - _QUOTED_LABELS} more" if count > _QUOTED_LABELS else ""
    return (f"{count} label{'s' if count != 1 else ''} hold{'' if count != 1 else 's'} "
            f"{'' if script == 'other' else script + ' '}characters no installed font has, drawn as empty boxes ({named}{more}); "
            f"{remedy}")
