"""The series of an invented fonds, the Tollbridge Harbour Commission: each series' covering
dates in one cell, many still open ('1821/..') or with an unknown start ('/1905')."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "harbour-commission.csv"


def chart() -> Chart:
    return (Chart(TABLE, when="dates", label="series", group="kind", id="ref")
            .titles("Tollbridge Harbour Commission: series and covering dates (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"archive{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
