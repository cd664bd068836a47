"""The series of an invented fonds, the Tollbridge Harbour Commission: each series' covering
dates in one cell, many still open ('1821/..') or with an unknown start ('/1905')."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "harbour-commission.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(when="dates", label="series", group="kind",
                                             id="ref"),
                           title="Tollbridge Harbour Commission: series and covering dates "
                                 "(invented)")
    return [render(TABLE, out / f"archive{suffix}", options).written
            for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
