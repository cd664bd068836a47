"""Phases of three invented excavation sites in the Hollow Barrow valley, on an axis counted
in years before present (AD 1950), as archaeologists report them."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "hollow-barrow.csv"


def chart() -> Chart:
    return (Chart(TABLE, label="phase", group="context").style(era="bp")
            .titles("Hollow Barrow valley: site phases (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"site-phases{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
