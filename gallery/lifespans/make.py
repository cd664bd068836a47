"""Lifespans of an invented family of bell founders: births and deaths known to the day, the
year, the decade, only 'about', only 'before' or 'after', or not at all."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "bellfounders.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(group="foundry"),
                           title="Bell founders of Sallowby, 1700–1820 (invented)")
    written = []
    for suffix in (".svg", ".png"):
        written.append(render(TABLE, out / f"lifespans{suffix}", options).written)
    return written


if __name__ == "__main__":
    make()
