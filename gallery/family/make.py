"""Four generations of an invented family, the Marrables of Cressing, as a genealogist records
them: 'before' a baptism, 'after' the last census, deaths never found.

Every person here is invented and long dead. A real family chart can name living people: check
the rules that apply to you before you publish one, and leave out or withhold the details of
anyone who may still be living (for example, everyone born in the last 100 years)."""
from pathlib import Path

from timelines.chart import ChartOptions, render
from timelines.scene.theme import DEFAULT_THEME
from timelines.sources import ColumnMap

HERE = Path(__file__).parent
TABLE = HERE / "marrable.csv"


def make(out: Path = HERE) -> list[Path]:
    options = ChartOptions(columns=ColumnMap(group="generation"),
                           theme=DEFAULT_THEME.with_options(width=1100),  # room for long names
                           title="The Marrable family of Cressing, four generations (invented)")
    return [render(TABLE, out / f"family{suffix}", options).written
            for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
