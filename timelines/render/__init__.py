"""Renderers: a Scene in, a file out. Each knows only the scene's primitives.

- `svg` (written as a stream by `xmlwriter`; never imports matplotlib), with `outlines`
  for text as glyph paths; `html`, the explorer page (`explorer.js`, `explorer.css`);
- `mpl` (matplotlib's object API) for PNG and PDF, with `png` writing Agg's pixels;
- `axes`: the same marks drawn into a matplotlib Axes of the caller's, and a BCE-aware year
  locator and formatter for any Axes.

`write` picks the renderer from the file's suffix and imports it only then, so an SVG run never
loads matplotlib. A file is written whole or not at all: into a temporary file beside the
target, renamed over it only when complete, so an interrupted run leaves an earlier chart as it
was.
"""
from __future__ import annotations

import contextlib
import os
import tempfile
from pathlib import Path
from typing import BinaryIO

from ..errors import UsageError
from ..scene.primitives import Scene

FORMATS = (".svg", ".png", ".pdf", ".html")


def output_format(path: str | Path) -> str:
    path = Path(path)
    suffix = path.suffix.lower()
    if suffix not in FORMATS:
        raise UsageError(f"cannot write {path.name!r}: the output must end in .svg, .png, .pdf "
                         "or .html")
    return suffix


def write(scene: Scene, path: str | Path, dpi: float = 150.0, text: str = "text",
          format: str | None = None) -> None:
    """Write `scene` to `path` in the format of its suffix (or `format`, e.g. ".svg")."""
    path = Path(path)
    suffix = format or output_format(path)
    with replacing(path) as file:
        write_to(scene, file, suffix, dpi=dpi, text=text)


def write_pages(scenes: list[Scene], path: str | Path) -> None:
    """Write `scenes` as the pages of one PDF at `path`, whole or not at all."""
    from .mpl import render_pdf_pages

    path = Path(path)
    if output_format(path) != ".pdf":
        raise UsageError(f"cannot write {path.name!r} in pages: pages are for a PDF",
                         hint="give an output ending in .pdf")
    with replacing(path) as file:
        render_pdf_pages(scenes, file)


def write_to(scene: Scene, file: BinaryIO, suffix: str, dpi: float = 150.0,
             text: str = "text") -> None:
    """Write `scene` to a binary file object (a text one takes SVG only)."""
    if suffix == ".svg":
        from .svg import write_svg
        write_svg(scene, file, text=text)    # piece by piece: memory bounded by the scene
    elif suffix == ".png":
        from .mpl import render_png
        render_png(scene, file, dpi=dpi)
    elif suffix == ".pdf":
        from .mpl import render_pdf
        render_pdf(scene, file)
    elif suffix == ".html":
        raise UsageError("an .html explorer is written from the chart's data, not its scene",
                         hint="use Chart.save or write_html")
    else:
        raise UsageError(f"cannot write {suffix!r}: the format must be svg, png or pdf")


def write_html(data, path: str | Path) -> None:
    """Write the explorer page of `data` (scene.explore.ExploreData) to `path`, whole or not
    at all."""
    from .html import render_html
    with replacing(Path(path)) as file:
        file.write(render_html(data).encode("utf-8"))


def writable(path: str | Path) -> Path:
    """`path`, once its folder is known to exist and to take new files: checked before any
    work, so a long run does not end in 'no such folder'."""
    path = Path(path)
    folder = path.parent if str(path.parent) else Path(".")
    if not folder.is_dir():
        raise UsageError(f"cannot write {str(path)!r}: the folder {str(folder)!r} does not exist",
                         hint="create it first, or give another output path")
    if path.is_dir():
        raise UsageError(f"cannot write {str(path)!r}: it is a folder",
                         hint="give a file name such as chart.svg")
    if not os.access(folder, os.W_OK | os.X_OK):
        raise UsageError(f"cannot write {str(path)!r}: the folder {str(folder)!r} is not "
                         "writable", hint="choose a folder of your own")
    return path


@contextlib.contextmanager
def replacing(path: Path):
    """A binary file that becomes `path` when the block ends without an error: written beside
    it, flushed to disk, then renamed over it in one step (POSIX rename is atomic). On any
    error, or an interrupt, the temporary file is removed and `path` is untouched."""
    writable(path)
    folder = path.parent if str(path.parent) else Path(".")
    handle, temporary = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".part", dir=folder)
    try:
        with os.fdopen(handle, "wb") as file:
            yield file
            file.flush()
            os.fsync(file.fileno())
        os.chmod(temporary, _new_file_mode(path))
        os.replace(temporary, path)
    except BaseException:
        with contextlib.suppress(OSError):
            os.unlink(temporary)
        raise


def _new_file_mode(path: Path) -> int:
    """The mode an ordinary new file would get (mkstemp makes its files private), or the
    mode of the file being replaced."""
    try:
        return path.stat().st_mode & 0o777
    except FileNotFoundError:
        mask = os.umask(0)
        os.umask(mask)
        return 0o666 & ~mask

