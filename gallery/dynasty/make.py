"""The kings of an invented river kingdom, Essar, in the first millennium BC: reigns with
approximate and bounded ends on an axis labelled BC."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "essar-kings.csv"


def chart() -> Chart:
    return (Chart(TABLE, label="ruler", group="house").style(era="bc")
            .titles("Kings of Essar, 720–400 BC (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"dynasty{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
