"""The questions a chronology raises, on an invented household: the Corrows, ferry keepers
at Whitlow Ferry. The statements in statements.tsv (a life of at least 45 years, an
apprentice 12 years younger than his master's son, ...) narrow the dates they touch; the
strip under the lanes counts who was alive in each decade, surely, possibly and expected.
docs/analysis.md asks this table who could have known whom."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "corrow-household.csv"
STATEMENTS = HERE / "statements.tsv"


def chart() -> Chart:
    return (Chart(TABLE, label="name", group="role", id="id")
            .constrain(STATEMENTS)
            .activity("decade")
            .titles("The Corrows of Whitlow Ferry, 1700-1830 (invented)",
                    subtitle="dates narrowed by the statements; below, how many were alive "
                             "in each decade"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"questions{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
