"""A figure for a journal column: the correspondents of an invented letter-writer, Hanne
Pellory, at 85 mm wide and 7 pt, as an article's single column takes it (SVG, and PNG at
300 dpi for print)."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "pellory-letters.csv"


def chart() -> Chart:
    return (Chart(TABLE, label="correspondent", color="role")
            .page(size="85x70mm", dpi=300).style(font_size=7)
            .titles("Letters to and from Hanne Pellory, 1784–1791 (invented)"))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"journal-column{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
