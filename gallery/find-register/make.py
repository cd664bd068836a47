"""An invented find register from the Saltmere excavation: each find dated only by a
not-before and a not-after (terminus post quem and ante quem), drawn as events, one moment
somewhere in each window, never a bar that would claim the find lasted the whole window."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "saltmere-finds.csv"


def chart() -> Chart:
    return (Chart(TABLE, label="find", group="trench")
            .events(not_before="not_before", not_after="not_after")
            .titles("Saltmere excavation: finds by trench (invented)",
                    subtitle="each find is one moment between its not-before and "
                             "not-after dates"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"find-register{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
