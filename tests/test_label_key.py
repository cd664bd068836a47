"""No label silently lost (issue 10): a label with no room beside its bar becomes a small number
there, spelled out in a key under the chart, in every format; only a bar with no room even for
its number keeps its label in the tooltip, and the run says so, format by format."""
from __future__ import annotations

import numpy as np

from timelines import Chart
from timelines.cli import main
from timelines.layout.labels import LABEL_SIDES, label_boxes
from timelines.scene.primitives import Group, Text, walk

# A bar filling the domain leaves no room beside it for a label, and a bar near its end none
# for the label on the right.
DOMAIN = (0.0, 100.0)


def _sides(bars, widths, key_width=None):
    found = label_boxes(["a"] * len(bars), np.array(bars, dtype=float),
                        np.array(widths, dtype=float), DOMAIN, 1.0,
                        np.full((len(bars), 2), np.nan), 2.0, "beside", key_width)
    return [LABEL_SIDES[side] for side in found.side], found


def test_a_label_without_room_becomes_a_key_number_where_one_fits():
    sides, found = _sides([(0, 97), (10, 97), (0, 100)], [30, 30, 30], key_width=3.0)
    assert sides == ["none", "key left", "none"]   # 97+1+3 > 100 right; 0-1-3 < 0 left
    assert found.start[1] == 10 - 1 - 3 - 2.0       # the number's room, and clearance
    sides, _ = _sides([(0, 90)], [30], key_width=3.0)
    assert sides == ["key right"]
    assert _sides([(0, 90)], [30])[0] == ["none"]  # no key width: left out, as before


ROWS = [{"name": "Hanne Pellory", "start": "1784", "end": "1791"},
        {"name": "Mattias Crewe, printer to the Varrin press", "start": "1780", "end": "1790"},
        {"name": "Odile Varrin", "start": "1786", "end": "1791"}]


def test_a_label_too_long_for_its_side_is_shortened_with_an_ellipsis():
    chart = Chart(ROWS, label="name").page(size="110mm").style(font_size=9)
    texts = [t for t in walk(chart.scene().children) if isinstance(t, Text)]
    [short] = [t.text for t in texts if t.text.endswith("…") and t.css_class == "label"]
    assert ROWS[1]["name"].startswith(short[:-1]) and len(short) > 10
    assert not [t for t in texts if t.css_class == "label key"]
    [record] = [g for g in walk(chart.scene().children) if isinstance(g, Group)
                and g.css_class == "record" and g.title.startswith("Mattias")]
    assert record.title.splitlines()[0] == ROWS[1]["name"]      # whole in the tooltip


def test_key_numbers_are_drawn_and_spelled_out_under_the_chart(monkeypatch):
    from timelines.layout import boxes

    monkeypatch.setattr(boxes, "SHORTEST_SHOWN", 10_000)     # no label may be shortened
    chart = Chart(ROWS, label="name").page(size="85mm").style(font_size=9)
    texts = [t for t in walk(chart.scene().children) if isinstance(t, Text)]
    keys = [t.text for t in texts if t.css_class == "label key"]
    assert keys == ["1"]
    note = " ".join(t.text for t in texts if t.css_class == "note")   # wrapped to the page
    assert note == "Labels by number: 1 Mattias Crewe, printer to the Varrin press."
    placed = chart.layout().placement.keyed
    assert [(p.key, p.record.label) for p in placed] == [(1, ROWS[1]["name"])]


def test_the_run_says_where_hidden_labels_are_for_each_format(tmp_path, capsys):
    # --labels inside: a label that does not fit inside its bar is left out (no key number)
    table = tmp_path / "t.csv"
    lines = ["name,start,end"] + [f"Member {i} of a long name indeed,{1700 + 30 * i},"
                                  f"{1705 + 30 * i}" for i in range(3)]
    table.write_text("\n".join(lines) + "\n", encoding="utf-8")
    main(["render", str(table), "--labels", "inside", "-o", str(tmp_path / "t.svg")])
    svg_note = capsys.readouterr().err
    main(["render", str(table), "--labels", "inside", "-o", str(tmp_path / "t.png")])
    png_note = capsys.readouterr().err
    assert "kept in the tooltips only" in svg_note
    assert "not shown (a PNG or PDF has no tooltips)" in png_note
