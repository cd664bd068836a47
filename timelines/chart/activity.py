"""The activity chart's steps: a table of counts from `analysis.activity` drawn by
`scene.activity` and written by `render`, one panel per kind of record (and group)."""
from __future__ import annotations

from pathlib import Path

from ..render import write
from ..scene.activity import ActivitySeries, activity_scene
from ..scene.primitives import Scene
from ..scene.theme import DEFAULT_THEME, Theme


def activity_series(table) -> list[ActivitySeries]:
    """One series per kind (and group) of the counts DataFrame `activity()` returns."""
    keys = ["kind", "group"] if "group" in table.columns else ["kind"]
    methods = table.attrs.get("methods", {})
    series = []
    for key, rows in table.groupby(keys, sort=False):
        key = key if isinstance(key, tuple) else (key,)
        name = key[0] if len(key) == 1 else f"{key[0]}: {key[1]}"
        envelope = "high" in rows.columns
        series.append(ActivitySeries(
            name, methods.get(key[0], ""), _floats(rows["block_start"]),
            _floats(rows["block_end"]), _floats(rows["certain"]), _floats(rows["possible"]),
            _floats(rows["expected"]), _floats(rows["low"]) if envelope else (),
            _floats(rows["high"]) if envelope else ()))
    return series


def activity_chart(table, title: str = "", theme: Theme = DEFAULT_THEME) -> Scene:
    return activity_scene(activity_series(table), title, theme, activity_notes(table))


def activity_notes(table) -> tuple[str, ...]:
    """What the counts leave out: records with no bound on a side cannot be weighed."""
    notes = []
    for kind, count in table.attrs.get("unweighed", {}).items():
        if count:
            records = "1 record" if count == 1 else f"{count} records"
            notes.append(f"{records} ({kind}) with no bound on a side are in the certain and "
                         "possible counts where they can reach, not in the expected count or "
                         "the envelope.")
    return tuple(notes)


def save_activity(table, path: str | Path, title: str = "", theme: Theme = DEFAULT_THEME,
                  dpi: float = 150.0) -> Path:
    """Write the activity chart of `table` to `path` (SVG, PNG or PDF by its suffix)."""
    write(activity_chart(table, title, theme), path, dpi=dpi)
    return Path(path)


def _floats(column) -> tuple[float, ...]:
    return tuple(float(value) for value in column.tolist())
