"""The streaming SVG writer: ElementTree's escaping and bytes, written piece by piece."""
from __future__ import annotations

import io
import random
import re
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from timelines.render import write
from timelines.render.svg import render_svg, write_svg
from timelines.render.xmlwriter import XMLWriter, escape_attribute, escape_text
from timelines.scene.primitives import GradientRect, Group, Rect, Scene, Text

sys.path.insert(0, str(Path(__file__).resolve().parent))
from test_render_svg import HOSTILE, hostile_scene, labelled_scene, sample_scene  # noqa: E402

SVG_XMLNS = ' xmlns="http://www.w3.org/2000/svg"'
MARKUP = "&<>\"'\r\n\t ]]>;#x3C"


def hostile_strings() -> list[str]:
    rng = random.Random(15)
    made = ["".join(rng.choice(MARKUP + "ab\u00e9\U0001f600") for _ in range(rng.randint(0, 30)))
            for _ in range(300)]
    return [*HOSTILE, "", "\r\n", "\t\t", "&amp;amp;", '"\'"', "a\rb", *made]


def test_escaping_is_elementtrees():
    for text in hostile_strings():
        assert escape_text(text) == ET._escape_cdata(text), repr(text)
        assert escape_attribute(text) == ET._escape_attrib(text), repr(text)


def test_the_writer_writes_what_elementtree_writes_for_the_same_tree():
    for text in hostile_strings():
        given = {"b": text} if text else {}     # an empty value is left out (as svgwrite did)
        root = ET.Element("svg", {**given, "a": "1"})
        ET.SubElement(root, "title").text = text
        ET.SubElement(ET.SubElement(root, "g", {"class": text} if text else {}), "rect",
                      {"x": "0"})
        ET.SubElement(root, "g")
        pieces: list[str] = []
        writer = XMLWriter(pieces.append)
        writer.start("svg", (("b", text), ("a", "1")))
        writer.element("title", (), text)
        writer.start("g", (("class", text),))
        writer.element("rect", (("x", "0"),))
        writer.end()
        writer.start("g")
        writer.close()
        expected = ET.tostring(root, encoding="unicode").replace(" />", "/>")
        assert "".join(pieces) == expected


def test_empty_and_missing_attribute_values_are_left_out():
    pieces: list[str] = []
    writer = XMLWriter(pieces.append)
    writer.element("rect", (("class", ""), ("fill", None), ("x", "0")))
    writer.close()
    assert pieces == ['<rect x="0"/>']


def scenes() -> list[Scene]:
    return [sample_scene(), labelled_scene(), *(hostile_scene(text) for text in HOSTILE)]


@pytest.mark.parametrize("scene", scenes(), ids=lambda scene: scene.title[:12])
def test_the_document_reads_back_and_writes_again_as_the_same_text(scene):
    # What ElementTree writes for the tree it reads from our document is our document: the same
    # escaping, empty elements, attribute order (the root's namespace set aside: ElementTree
    # would give it a prefix).
    output = render_svg(scene)
    body = output.removeprefix('<?xml version="1.0" encoding="utf-8"?>\n').replace(
        SVG_XMLNS, "", 1)
    again = ET.tostring(ET.fromstring(body), encoding="unicode").replace(" />", "/>")
    assert again + "\n" == body


@pytest.mark.parametrize("scene", scenes(), ids=lambda scene: scene.title[:12])
def test_attributes_are_written_in_name_order_as_svgwrite_wrote_them(scene):
    for tag in re.findall(r"<[a-zA-Z][^<>]*>", render_svg(scene)):
        names = re.findall(r' ([-:a-zA-Z0-9]+)="', tag)
        assert names == sorted(names), tag


@pytest.mark.parametrize("mode", ["text", "paths"])
def test_every_way_of_writing_gives_the_same_bytes(mode, tmp_path):
    scene = labelled_scene()
    expected = render_svg(scene, text=mode)
    binary, text = io.BytesIO(), io.StringIO()
    assert render_svg(scene, text=mode, file=binary) is None
    write_svg(scene, text, text=mode)
    write_svg(scene, tmp_path / "a.svg", text=mode)
    write(scene, tmp_path / "b.svg", text=mode)
    assert binary.getvalue() == expected.encode("utf-8")
    assert text.getvalue() == expected
    assert (tmp_path / "a.svg").read_bytes() == (tmp_path / "b.svg").read_bytes() == (
        expected.encode("utf-8"))


def many_records(count: int) -> Scene:
    records = tuple(
        Group((GradientRect(10, 12 * i, 20, 10, "#0072B2", 0.1, 1.0, css_class="fringe"),
               Rect(30, 12 * i, 50, 10, fill="#0072B2", css_class="core"),
               Text(84, 12 * i + 9, f"Member {i} & <kin>", css_class="label")),
              css_class="record", title=f"Member {i}", id=f"record-{i}")
        for i in range(count))
    return Scene(400, 12 * count, records, title="Many")


def test_a_large_document_goes_out_in_bounded_chunks():
    scene = many_records(5000)
    chunks: list[bytes] = []

    class Recorder(io.RawIOBase):
        def writable(self):
            return True

        def write(self, data):
            chunks.append(bytes(data))
            return len(data)

    write_svg(scene, Recorder())
    assert len(chunks) > 5
    assert max(map(len, chunks)) < 1_000_000
    assert b"".join(chunks) == render_svg(scene).encode("utf-8")


def test_a_scene_that_fails_part_way_leaves_the_earlier_file(tmp_path):
    # The whole-chart checks come before the first piece; a bad shape is met only while
    # writing, and the target is replaced only by a complete document.
    broken = Scene(400, 100, (*many_records(2000).children, Rect(0, 0, 5, 5, fill="url(#x)")))
    for target, writer in ((tmp_path / "a.svg", write_svg), (tmp_path / "b.svg", write)):
        target.write_bytes(b"the earlier chart")
        with pytest.raises(ValueError, match="not a colour"):
            writer(broken, target)
        assert target.read_bytes() == b"the earlier chart"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.svg", "b.svg"]
