"""Small multiples: the ferries of four crossings on an invented estuary, one small timeline
per crossing on one shared time axis, coloured by the kind of boat."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "merrow-ferries.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(label="operator", color="kind"), facet="crossing",
                           title="Ferries of the Merrow estuary, 1780–1940 (invented)",
                           subtitle="One timeline per crossing, on one time axis",
                           credit="Source: invented data for the timelines gallery.")
    written = []
    for suffix in (".svg", ".png"):
        written.append(render(TABLE, out / f"facets{suffix}", options).written)
    return written


if __name__ == "__main__":
    make()
