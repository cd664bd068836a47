"""The kings of an invented river kingdom, Essar, in the first millennium BC: reigns with
approximate and bounded ends on an axis labelled BC."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.scene.theme import DEFAULT_THEME
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "essar-kings.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(label="ruler", group="house"),
                           theme=DEFAULT_THEME.with_options(era="bc"),
                           title="Kings of Essar, 720–400 BC (invented)")
    return [render(TABLE, out / f"dynasty{suffix}", options).written
            for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
