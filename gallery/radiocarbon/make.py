"""Radiocarbon ages as what they are, on an invented site: Fenwick Knoll, four phases
dated by twelve determinations of an invented laboratory (QRL). Each age is calibrated with
IntCal20 and drawn by its probability: darker where the calendar years are likelier, in
separate patches where the calibrated date falls in separate ranges (Burial 402, near the
'Hallstatt plateau' of the curve, spreads over three centuries). The long house's span runs
from one calibrated date to another; the legend names the curve and its citation."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "fenwick-knoll.csv"


def chart() -> Chart:
    return (Chart(TABLE, when="date", label="context", group="phase", id="id")
            .titles("Fenwick Knoll: twelve radiocarbon dates, calibrated (invented)",
                    subtitle="IntCal20; shading follows each date's probability, the line "
                             "beneath marks its 68.3% ranges"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"radiocarbon{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
