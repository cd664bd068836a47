"""Lifespans of an invented family of bell founders: births and deaths known to the day, the
year, the decade, only 'about', only 'before' or 'after', or not at all."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "bellfounders.csv"


def chart() -> Chart:
    return (Chart(TABLE, group="foundry")
            .titles("Bell founders of Sallowby, 1700–1820 (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"lifespans{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
