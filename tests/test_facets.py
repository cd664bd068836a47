"""Small multiples (--facet COL): one panel per value, in a grid, on one time axis, with one
legend for the page. Checked on the Scene's numbers."""
from __future__ import annotations

import xml.etree.ElementTree as ET

import pytest

from timelines.chart import ChartOptions, arrange, arranged_scene
from timelines.cli.commands import main
from timelines.errors import UsageError
from timelines.scene.facets import grid_columns, panel_width
from timelines.scene.primitives import shifted
from timelines.scene.primitives import GradientRect, Group, Line, Polygon, Rect, Text, find, walk
from timelines.sources import ColumnMap

SVG = "{http://www.w3.org/2000/svg}"
# Five crossings; every crossing has a record of 1800..1850 to compare positions by.
TABLE = """name,crossing,kind,start,end
North A,North,boat,1800,1850
North B,North,boat,c. 1850,1880
South A,South,steam,1800,1850
South B,South,boat,1860?,..
East A,East,boat,1800,1850
West A,West,steam,1800,1850
West B,West,steam,after 1851,1900
Mill A,Mill,boat,1800,1850
"""


@pytest.fixture()
def table(tmp_path):
    path = tmp_path / "ferries.csv"
    path.write_text(TABLE, encoding="utf-8")
    return path


def scene_of(path, **options):
    chosen = ChartOptions(columns=ColumnMap(group="kind"), facet="crossing", **options)
    return arranged_scene(arrange(path, chosen), chosen)


def panels(scene) -> list[Group]:
    return [p for p in scene.children if isinstance(p, Group) and "panel" in p.css_class.split()]


def record(scene, label: str) -> Group:
    return next(p for p in walk(scene.children)
                if isinstance(p, Group) and p.css_class == "record"
                and p.title.startswith(label + "\n"))


def core_of(group: Group) -> Rect:
    return next(p for p in walk(group.children) if isinstance(p, Rect) and p.css_class == "core")


@pytest.mark.parametrize("count, width, columns", [
    (1, 960, 1), (2, 960, 2), (3, 960, 2), (4, 960, 2), (5, 960, 2),
    (4, 1400, 2),            # three fit side by side, but 2 + 2 reads better than 3 + 1
    (6, 1400, 3), (7, 1400, 3), (5, 400, 1), (9, 3000, 3),
])
def test_columns_follow_the_page_width_and_even_out_the_rows(count, width, columns):
    assert grid_columns(count, width) == columns
    assert panel_width(width, count) == width / columns


def test_shifted_moves_every_primitive_and_keeps_groups():
    group = Group((Rect(1, 2, 3, 4), GradientRect(1, 2, 3, 4, "#000000", 0, 1),
                   Line(1, 2, 3, 4), Polygon(((1, 2), (3, 4))), Text(1, 2, "x")), id="g")
    moved = shifted(group, 10, 100)
    rect, fade, line, polygon, text = moved.children
    assert (rect.x, rect.y, rect.width, fade.x, fade.y) == (11, 102, 3, 11, 102)
    assert (line.x1, line.y1, line.x2, line.y2) == (11, 102, 13, 104)
    assert polygon.points == ((11, 102), (13, 104)) and (text.x, text.y) == (11, 102)
    assert moved.id == "g"


def test_one_titled_panel_per_value_in_a_grid(table):
    scene = scene_of(table)
    titles = [t.text for t in find(scene, "panel-title")]
    assert titles == ["North", "South", "East", "West", "Mill"]     # first start, then table
    boxes = panels(scene)
    assert [p.id for p in boxes] == [f"panel-{i}" for i in range(1, 6)]
    # two columns on the default 960 px page: panel titles at x = margin and 480 + margin
    xs = [t.x for t in find(scene, "panel-title")]
    assert xs == pytest.approx([16, 496, 16, 496, 16])
    ys = [t.y for t in find(scene, "panel-title")]
    assert ys[0] == ys[1] < ys[2] == ys[3] < ys[4]


def test_panels_share_one_time_axis(table):
    scene = scene_of(table)
    # the same dates land at the same x within a column, one panel width apart across
    north, south, east, west = (core_of(record(scene, f"{name} A"))
                                for name in ("North", "South", "East", "West"))
    assert north.x == pytest.approx(east.x) and south.x == pytest.approx(west.x)
    assert south.x - north.x == pytest.approx(480.0)
    assert north.width == pytest.approx(south.width)
    axes = [line for line in find(scene, "axis-line")]
    assert len(axes) == 5 and len({(a.x2 - a.x1) for a in axes}) == 1


def test_one_legend_for_the_page_and_every_record_drawn_once(table):
    scene = scene_of(table)
    assert len(find(scene, "legend")) == 1
    legend_y = find(scene, "legend")[0].children[0].y
    assert legend_y > max(line.y1 for line in find(scene, "axis-line"))   # below the data
    labels = [g.title.splitlines()[0] for g in walk(scene.children)
              if isinstance(g, Group) and g.css_class == "record"]
    assert sorted(labels) == sorted(line.split(",")[0] for line in TABLE.splitlines()[1:])
    assert "Small multiples by crossing: 5 timelines (North, South, East, West, Mill)" \
        in scene.desc


def test_groups_inside_panels_and_none_when_faceted_by_the_group_column(table):
    by_kind = scene_of(table)
    assert {t.text for t in find(by_kind, "group-label")} == {"boat", "steam"}
    chosen = ChartOptions(columns=ColumnMap(group="crossing"), facet="crossing")
    same = arranged_scene(arrange(table, chosen), chosen)
    assert find(same, "group-label") == []


def test_an_unknown_facet_column_is_a_usage_error_with_a_hint(table):
    with pytest.raises(UsageError) as raised:
        arrange(table, ChartOptions(facet="crosing"))
    assert "crosing" in str(raised.value) and "crossing" in raised.value.hint


def test_cli_facet_writes_panels_in_the_svg(table, tmp_path, capsys):
    out = tmp_path / "facets.svg"
    assert main(["render", str(table), "-o", str(out), "--facet", "crossing",
                 "--group", "kind"]) == 0
    root = ET.parse(out).getroot()
    panel_groups = [g for g in root.iter(f"{SVG}g")
                    if "panel" in (g.get("class") or "").split()]
    assert len(panel_groups) == 5
    assert "panel-north" in panel_groups[0].get("class")
    assert "8 rows read: 8 drawn" in capsys.readouterr().err


def test_facets_with_bands_give_identical_bytes_on_every_run(table, tmp_path, capsys):
    bands = tmp_path / "periods.csv"
    bands.write_text("label,start,end\nThe long frost,1820s,c. 1835\n", encoding="utf-8")
    for name in ("a.svg", "b.svg"):
        assert main(["render", str(table), "-o", str(tmp_path / name), "--facet", "crossing",
                     "--bands", str(bands), "--from", "1790", "--to", "1890"]) == 0
    assert (tmp_path / "a.svg").read_bytes() == (tmp_path / "b.svg").read_bytes()
    root = ET.parse(tmp_path / "a.svg").getroot()
    bands_drawn = [g for g in root.iter(f"{SVG}g") if g.get("class") == "band"]
    assert len(bands_drawn) == 5                  # the band behind each of the five panels
