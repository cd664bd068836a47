"""Small multiples: the ferries of four crossings on an invented estuary, one small timeline
per crossing on one shared time axis, coloured by the kind of boat."""
from pathlib import Path

from timelines import Chart

HERE = Path(__file__).parent
TABLE = HERE / "merrow-ferries.csv"


def chart() -> Chart:
    return (Chart(TABLE, label="operator", color="kind").facet("crossing")
            .titles("Ferries of the Merrow estuary, 1780–1940 (invented)",
                    subtitle="One timeline per crossing, on one time axis",
                    credit="Source: invented data for the timelines gallery."))


def make(out: Path = HERE) -> list[Path]:
    drawn = chart()
    return [drawn.save(out / f"facets{suffix}") for suffix in (".svg", ".png")]


if __name__ == "__main__":
    make()
