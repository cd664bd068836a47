"""Render every gallery example to SVG and PNG beside its table:

    python gallery/make_gallery.py

Each example is a folder holding its invented table and a `make.py` whose `make(out)` renders
it; the tests run them all into a temporary folder.
"""
from __future__ import annotations

import importlib.util
from pathlib import Path

GALLERY = Path(__file__).resolve().parent


def examples() -> list[Path]:
    return sorted(path for path in GALLERY.glob("*/make.py"))


def load(script: Path):
    spec = importlib.util.spec_from_file_location(f"gallery_{script.parent.name}", script)
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def main() -> None:
    for script in examples():
        for path in load(script).make(script.parent):
            print(f"wrote {path.relative_to(GALLERY)}")


if __name__ == "__main__":
    main()
