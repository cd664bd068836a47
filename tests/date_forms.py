"""Every date form the project documents, as written: the examples in backticks in
docs/dates.md and the first column of every table in tests/test_dates*.py.

Some are refusals on purpose (`0 BC`, `'60s`, `1985-13-01`) and some are fragments the prose
names (`circa`, `Sept`): the tests that use this list compare each form with its own variants,
so a form need not read to be useful here. The tables are read with `ast`, not imported, so
that no test module runs twice.
"""
from __future__ import annotations

import ast
import re
from pathlib import Path

_ROOT = Path(__file__).resolve().parent.parent
_BACKTICKED = re.compile(r"`([^`\n]+)`")


def documented_forms() -> list[str]:
    """Each documented form once, in a stable order."""
    return sorted(set(_doc_examples()) | set(_table_texts()))


def _doc_examples() -> list[str]:
    return _BACKTICKED.findall((_ROOT / "docs" / "dates.md").read_text(encoding="utf-8"))


def _table_texts() -> list[str]:
    texts = []
    for path in sorted((_ROOT / "tests").glob("test_dates*.py")):
        tree = ast.parse(path.read_text(encoding="utf-8"))
        for node in tree.body:
            if isinstance(node, ast.Assign) and isinstance(node.value, (ast.List, ast.Tuple)):
                texts.extend(_first_strings(node.value.elts))
    return texts


def _first_strings(rows: list[ast.expr]) -> list[str]:
    """The first element of each row that is a tuple starting with a string."""
    return [row.elts[0].value for row in rows
            if isinstance(row, ast.Tuple) and row.elts
            and isinstance(row.elts[0], ast.Constant) and isinstance(row.elts[0].value, str)]
