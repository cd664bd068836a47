"""Nothing cut at any page size (issue 10): at a journal column (85 x 60 mm) and a half page
(180 x 120 mm), at 6 to 9 pt, every text of every gallery chart lies inside the page and no
two texts overlap. Checked on the Scene's numbers, with the widths the layout measures."""
from __future__ import annotations

import sys
from pathlib import Path

import pytest

from timelines.scene.primitives import Text, drawable_text, walk
from timelines.scene.textsize import text_ascent, text_descent, text_width

GALLERY = Path(__file__).resolve().parent.parent / "gallery"
sys.path.insert(0, str(GALLERY))
import make_gallery  # noqa: E402

SCRIPTS = make_gallery.examples()
ANCHOR_SHARE = {"start": 0.0, "middle": 0.5, "end": 1.0}
SLACK = 0.5            # px: rounding in the scene's own arithmetic


def text_boxes(scene) -> list[tuple[float, float, float, float, str]]:
    """(left, top, right, bottom, text) of every drawn text, as the layout measures it."""
    boxes = []
    for item in walk(scene.children):
        if isinstance(item, Text) and drawable_text(item.text):
            shown = drawable_text(item.text)
            width = text_width(shown, item.size, item.weight)
            left = item.x - ANCHOR_SHARE[item.anchor] * width
            boxes.append((left, item.y - text_ascent(item.size), left + width,
                          item.y + text_descent(item.size), shown))
    return boxes


def outside_the_page(scene) -> list[str]:
    return [box[4] for box in text_boxes(scene)
            if box[0] < -SLACK or box[1] < -SLACK or box[2] > scene.width + SLACK
            or box[3] > scene.height + SLACK]


def overlapping(scene) -> list[tuple[str, str]]:
    boxes = sorted(text_boxes(scene))
    found = []
    for i, a in enumerate(boxes):
        for b in boxes[i + 1:]:
            if b[0] >= a[2] - SLACK:
                break                          # sorted by left edge: none further can touch
            if a[1] < b[3] - SLACK and b[1] < a[3] - SLACK:
                found.append((a[4], b[4]))
    return found


@pytest.mark.parametrize("size", ["85x60mm", "180x120mm"])
@pytest.mark.parametrize("points", [6, 9])
@pytest.mark.parametrize("script", SCRIPTS, ids=lambda s: s.parent.name)
def test_every_text_fits_the_page_and_stands_alone(script, size, points):
    chart = make_gallery.load(script).chart().page(size=size).style(font_size=points)
    scene = chart.scene()
    assert outside_the_page(scene) == []
    assert overlapping(scene) == []


def test_the_checks_can_fail():
    """A text pushed past the edge, and two texts on one spot, are both found."""
    from timelines.scene.primitives import Scene

    scene = Scene(100, 50, (Text(90, 20, "far too long for the page", 10),
                            Text(10, 40, "one", 10), Text(12, 41, "two", 10)))
    assert outside_the_page(scene) == ["far too long for the page"]
    assert overlapping(scene) == [("one", "two")]
