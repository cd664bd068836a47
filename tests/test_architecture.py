"""The direction of imports, read from the source with `ast` (DESIGN.md §2)."""
from __future__ import annotations

import ast
import subprocess
import sys
from pathlib import Path

PACKAGE = Path(__file__).resolve().parent.parent / "timelines"

# stage -> the project modules and stages it may import: only downward, never a later stage.
# The root keeps the model (errors, calendar, model, spanarrays: spans as arrays, and
# columnar: a table's records as columns) and the pipeline (chart); each stage is a package (DESIGN.md §2).
MODEL = {"errors", "calendar", "model", "spanarrays", "columnar"}
ALLOWED = {
    "errors": set(),
    "calendar": set(),
    "model": {"calendar", "errors"},
    "spanarrays": {"model"},
    "columnar": {"model", "spanarrays"},
    "dates": MODEL,                                      # the date language
    "sources": MODEL | {"dates"},                        # read: tables -> records
    "check": MODEL,                                      # counts, warnings, living persons
    "analysis": MODEL | {"dates", "sources"},            # relations, activity, constraints
    "layout": MODEL,                                     # groups, lanes, labels, the lanes report
    "scene": MODEL | {"layout"},                         # marks in page units
    "render": {"scene", "errors"},                       # renderers know only the scene
    "chart": MODEL | {"dates", "sources", "check", "layout", "scene", "render", "analysis"},
    "cli": MODEL | {"dates", "sources", "check", "layout", "scene", "chart", "analysis",
                    "__init__"},
    "__init__": MODEL | {"dates", "sources", "check", "layout", "scene", "render", "chart",
                         "analysis"},
    "__main__": {"cli"},
}
# third-party package -> the only modules allowed to import it
THIRD_PARTY = {
    "pandas": {"sources.tables", "sources.frames", "analysis"},
    "matplotlib": {"render.mpl", "render.fades", "render.glyphs", "render.axes"},
    "svgwrite": {"render.svg"},
    "dateutil": {"dates"},
    "fontTools": {"render.outlines", "scene.fonts"},
    "uharfbuzz": {"scene.shaping"},
    "bidi": {"scene.shaping"},
}
# The stages as the tree shows them: the root holds only the model and the pipeline.
ROOT_MODULES = {"__init__", "__main__", "errors", "calendar", "model", "spanarrays",
                "columnar"}
STAGES = {"dates", "sources", "check", "analysis", "layout", "scene", "render", "chart", "cli"}


def _modules():
    for path in sorted(PACKAGE.rglob("*.py")):
        relative = path.relative_to(PACKAGE).with_suffix("")
        parts = relative.parts
        yield ".".join(parts), parts, ast.parse(path.read_text(encoding="utf-8"))


def _imports(parts: tuple[str, ...], tree: ast.AST):
    """(project module, third-party top-level name) pairs imported by one module."""
    package = parts[:-1]
    for node in ast.walk(tree):
        if isinstance(node, ast.ImportFrom):
            if node.level:
                base = package[: len(package) - node.level + 1]
                target = [*base, *(node.module.split(".") if node.module else [])]
                names = [target] if node.module else [[*base, a.name] for a in node.names]
                for name in names:
                    yield _module_of(name), None
            else:
                yield None, node.module.split(".")[0]
        elif isinstance(node, ast.Import):
            for alias in node.names:
                yield None, alias.name.split(".")[0]


def _module_of(name: list[str]) -> str:
    """The top-level project module a dotted import names; a plain name from the package
    itself (`from . import __version__`) belongs to `__init__`."""
    if not name:
        return "__init__"
    top = PACKAGE / name[0]
    return name[0] if top.is_dir() or top.with_suffix(".py").exists() else "__init__"


def test_project_imports_go_only_downward():
    wrong = []
    for name, parts, tree in _modules():
        layer = parts[0]
        allowed = ALLOWED[layer] | {layer}
        for project, _ in _imports(parts, tree):
            if project is not None and project not in allowed:
                wrong.append(f"{name} imports {project}")
    assert not wrong, wrong


def test_heavy_libraries_stay_in_their_modules():
    wrong = []
    for name, parts, tree in _modules():
        for _, third in _imports(parts, tree):
            owners = THIRD_PARTY.get(third)
            if owners is not None and not any(name == o or name.startswith(o + ".")
                                              or parts[0] == o for o in owners):
                wrong.append(f"{name} imports {third}")
    assert not wrong, wrong


def test_every_module_has_a_rule():
    assert {parts[0] for _, parts, _ in _modules()} <= set(ALLOWED)


def test_the_tree_shows_the_pipeline():
    """The root holds the model and the pipeline; every other module lives in its stage."""
    root = {path.stem for path in PACKAGE.glob("*.py")}
    packages = {path.parent.name for path in PACKAGE.glob("*/__init__.py")}
    assert root == ROOT_MODULES
    assert packages == STAGES


def test_renderers_know_only_the_primitives():
    """The file renderers draw a Scene's primitives and nothing else of the scene stage; the
    matplotlib Axes helpers also take the scale's tick rules, so both axes tick alike. Text
    is drawn as the scene stage shaped and measured it: the fonts and the shaping are shared
    (docs/design.md, "Text in any script")."""
    allowed = {"scene.primitives", "scene.fonts", "scene.shaping", "render", "errors"}
    wrong = []
    for name, parts, tree in _modules():
        if parts[0] != "render":
            continue
        for node in ast.walk(tree):
            if isinstance(node, ast.ImportFrom) and (node.level or node.module.startswith(
                    "timelines")):
                target = _dotted(parts, node)
                # The Axes helpers tick as the chart does; the HTML explorer draws the
                # scene stage's explore data (records in days, scene/explore.py), not shapes.
                extra = ({"scene.scale"} if name == "render.axes" else
                         {"scene.explore"} if name == "render.html" else set())
                if not any(target == a or target.startswith(a + ".") for a in allowed | extra):
                    wrong.append(f"{name} imports {target}")
    assert not wrong, wrong


def _dotted(parts: tuple[str, ...], node: ast.ImportFrom) -> str:
    """The project module an ImportFrom names, dotted from the package root."""
    if not node.level:
        return node.module.removeprefix("timelines.")
    base = list(parts[:-1])[: len(parts) - node.level]
    return ".".join([*base, *(node.module.split(".") if node.module else [])])


def test_svg_path_does_not_load_matplotlib(tmp_path):
    script = (
        "import sys\n"
        "from timelines.cli import main\n"
        f"code = main(['render', '--demo', '-o', {str(tmp_path / 'demo.svg')!r}])\n"
        "assert 'matplotlib' not in sys.modules, 'matplotlib was imported'\n"
        "sys.exit(code)\n"
    )
    done = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True)
    assert done.returncode == 0, done.stderr
    assert (tmp_path / "demo.svg").stat().st_size > 1000
