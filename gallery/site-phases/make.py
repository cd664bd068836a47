"""Phases of three invented excavation sites in the Hollow Barrow valley, on an axis counted
in years before present (AD 1950), as archaeologists report them."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.scene.theme import DEFAULT_THEME
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "hollow-barrow.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(label="phase", group="context"),
                           theme=DEFAULT_THEME.with_options(era="bp"),
                           title="Hollow Barrow valley: site phases (invented)")
    return [render(TABLE, out / f"site-phases{suffix}", options).written
            for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
