"""Which installed font draws which character: the family list, the font files, their cmaps.

A chart names a list of families, as CSS does (`font_list`): the user's, then the default list
(DejaVu Sans, whose advance tables `textsize` keeps, then Noto families for other scripts). Each
character is drawn by the first face in the list that has it, as browsers and matplotlib fall
back (`face_for`). Font files are found without fontconfig or matplotlib: matplotlib's bundled
DejaVu first (the outlines and the PNG have always used it), then the usual font folders; a
file is opened (fontTools, name table only) when its name looks like a wanted family, so the
search costs milliseconds, once per run. Nothing here runs for text the DejaVu tables cover.
"""
from __future__ import annotations

import importlib.util
import os
import re
from collections.abc import Iterator, Sequence
from dataclasses import dataclass
from functools import cache
from pathlib import Path

# DejaVu Sans first: Latin, Greek and Cyrillic are drawn and measured as before. Then the Noto
# families Debian's fonts-noto-core and fonts-noto-cjk install (package contents from memory),
# and the emoji fonts: Noto Color Emoji shows in browsers; our own renderers draw outlines only,
# so they use a monochrome Noto Emoji when one is installed.
DEFAULT_FONTS = (
    "DejaVu Sans", "Noto Sans", "Noto Sans Hebrew", "Noto Sans Arabic", "Noto Sans Devanagari",
    "Noto Sans Bengali", "Noto Sans Thai", "Noto Sans Armenian", "Noto Sans Georgian",
    "Noto Sans Ethiopic", "Noto Sans CJK SC", "Noto Sans CJK JP", "Noto Sans CJK KR",
    "Noto Emoji", "Noto Color Emoji",
)
_QUOTES = "\"' "
_FONT_SUFFIXES = (".ttf", ".otf", ".ttc", ".otc")
# Family names from the name table: typographic family (16) first, then the legacy one (1).
_FAMILY_NAME_IDS = (16, 1)
_BOLD_WEIGHT_CLASS = 600                    # OpenType OS/2 usWeightClass: 600 is semibold


def font_list(families: str | Sequence[str] | None) -> tuple[str, ...]:
    """The families to draw with: those given (a comma-separated string as in CSS, or a
    sequence), then the default list, each once."""
    if families is None:
        families = ()
    if isinstance(families, str):
        families = families.split(",")
    names = [name.strip(_QUOTES) for name in families]
    seen: dict[str, str] = {}
    for name in [*names, *DEFAULT_FONTS]:
        if name:
            seen.setdefault(name.casefold(), name)
    return tuple(seen.values())


@dataclass(frozen=True, slots=True)
class Face:
    """One face of an installed font file (`index` selects it in a .ttc collection)."""

    path: str
    index: int
    family: str
    bold: bool
    plain: bool = True      # the family's Regular or Bold, not a Light, Condensed, ... style


def faces(families: tuple[str, ...], weight: str = "normal") -> tuple[Face, ...]:
    """The installed faces of `families`, in order, of the weight nearest `weight`; families
    not installed are left out, as are colour-bitmap fonts our renderers cannot outline."""
    found = (face_of(family, weight == "bold") for family in families)
    return tuple(face for face in found if face is not None)


@cache
def face_of(family: str, bold: bool) -> Face | None:
    """The installed face of `family` nearest the weight asked for, or None."""
    order = {path: i for i, path in enumerate(_font_files())}
    for files in _files_named_like(family):
        candidates = [face for path in files for face in _faces_in(path)
                      if face.family.casefold() == family.casefold()]
        if candidates:
            return min(candidates, key=lambda face: (face.bold != bold, not face.plain,
                                                     order[Path(face.path)], face.index))
    return None


@cache
def codepoints(face: Face) -> frozenset[int]:
    """The characters `face` has a glyph for."""
    from fontTools.ttLib import TTFont

    with TTFont(face.path, fontNumber=face.index, lazy=True) as font:
        return frozenset(font.getBestCmap() or {})


def face_for(character: str, available: tuple[Face, ...]) -> Face | None:
    """The first face that has `character`, as CSS font fallback picks (None if none has)."""
    code = ord(character)
    for face in available:
        if code in codepoints(face):
            return face
    return None


def font_folders() -> list[Path]:
    """Where fonts are looked for: matplotlib's bundled DejaVu (found without importing it),
    then the system's, the local and the user's folders (the XDG and fontconfig defaults)."""
    folders = []
    spec = importlib.util.find_spec("matplotlib")
    if spec is not None and spec.submodule_search_locations:
        folders.append(Path(spec.submodule_search_locations[0]) / "mpl-data" / "fonts" / "ttf")
    data_home = os.environ.get("XDG_DATA_HOME") or str(Path.home() / ".local" / "share")
    folders += [Path("/usr/share/fonts"), Path("/usr/local/share/fonts"),
                Path(data_home) / "fonts", Path.home() / ".fonts"]
    return [folder for folder in folders if folder.is_dir()]


@cache
def _font_files() -> tuple[Path, ...]:
    """Every font file under the font folders, in a fixed order (outputs are deterministic)."""
    files: list[Path] = []
    for folder in font_folders():
        for root, dirs, names in os.walk(folder):
            dirs.sort()
            files += [Path(root) / name for name in sorted(names)
                      if name.lower().endswith(_FONT_SUFFIXES)]
    return tuple(files)


def _files_named_like(family: str) -> Iterator[list[Path]]:
    """Files whose name, up to the style, could belong to `family`, closest first: the same
    name ("DejaVuSans.ttf" for "DejaVu Sans"), a shorter one ("NotoSansCJK-Bold.ttc" for
    "Noto Sans CJK SC"), a longer one. A family whose files are named otherwise is not found
    (opening every installed font to read its name would cost half a second a run)."""
    wanted = _squashed(family)
    stems = [(_squashed(re.split(r"[-_]", path.stem)[0]), path) for path in _font_files()]
    yield [path for stem, path in stems if stem == wanted]
    yield [path for stem, path in stems if stem and wanted.startswith(stem) and stem != wanted]
    yield [path for stem, path in stems if stem.startswith(wanted) and stem != wanted]


@cache
def _faces_in(path: Path) -> tuple[Face, ...]:
    """The outline faces in one file (several in a collection); none if it cannot be read."""
    from fontTools.ttLib import TTLibError
    from fontTools.ttLib.ttCollection import TTCollection
    from fontTools.ttLib.ttFont import TTFont

    try:
        if path.suffix.lower() in (".ttc", ".otc"):
            with TTCollection(str(path), lazy=True) as collection:
                return tuple(_face(path, i, font) for i, font in enumerate(collection.fonts)
                             if _has_outlines(font))
        with TTFont(str(path), lazy=True) as font:
            return (_face(path, 0, font),) if _has_outlines(font) else ()
    except (OSError, TTLibError, KeyError, ValueError):
        return ()


def _face(path: Path, index: int, font) -> Face:
    name = next(filter(None, (font["name"].getDebugName(i) for i in _FAMILY_NAME_IDS)), "")
    weight = font["OS/2"].usWeightClass if "OS/2" in font else 400
    style = font["name"].getDebugName(17) or font["name"].getDebugName(2) or ""
    return Face(str(path), index, name, weight >= _BOLD_WEIGHT_CLASS,
                style in ("Regular", "Bold", "Book"))


def _has_outlines(font) -> bool:
    return "glyf" in font or "CFF " in font or "CFF2" in font


def _squashed(name: str) -> str:
    return re.sub(r"[^0-9a-z]", "", name.casefold())
