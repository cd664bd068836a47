"""Four generations of an invented family, the Marrables of Cressing, as a genealogist records
them: 'before' a baptism, 'after' the last census, deaths never found.

Every person here is invented and long dead. A real family chart can name living people: check
the rules that apply to you before you publish one, and leave out or withhold the details of
anyone who may still be living (for example, everyone born in the last 100 years)."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "marrable.csv"


def chart() -> Chart:
    return (Chart(TABLE, group="generation").style(width=1100)   # room for long names
            .titles("The Marrable family of Cressing, four generations (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"family{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
