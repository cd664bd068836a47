"""Renderers: a Scene in, a file out. Each knows only the scene's primitives.

- `svg` (svgwrite; never imports matplotlib), with `outlines` for text as glyph paths;
- `mpl` (matplotlib's object API) for PNG and PDF, with `png` writing Agg's pixels.

`write` picks the renderer from the file's suffix and imports it only then, so an SVG run never
loads matplotlib.
"""
from __future__ import annotations

from pathlib import Path

from ..errors import UsageError
from ..scene.primitives import Scene

FORMATS = (".svg", ".png", ".pdf")


def output_format(path: str | Path) -> str:
    path = Path(path)
    suffix = path.suffix.lower()
    if suffix not in FORMATS:
        raise UsageError(f"cannot write {path.name!r}: the output must end in .svg, .png or .pdf")
    return suffix


def write(scene: Scene, path: str | Path, dpi: float = 150.0, text: str = "text") -> None:
    path = Path(path)
    suffix = output_format(path)
    if suffix == ".svg":
        from .svg import write_svg
        write_svg(scene, path, text=text)
    elif suffix == ".png":
        from .mpl import render_png
        render_png(scene, path, dpi=dpi)
    else:
        from .mpl import render_pdf
        render_pdf(scene, path)
