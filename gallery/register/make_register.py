"""Write an invented register of guild members as CSV, for trying groupings on real-sized data.

The Quillon Vale cloth guild never existed: every name, ward and date is made up by a seeded
random generator, so the same arguments always write the same file. Dates are written the ways
a register's transcriber writes them (`c. 1640`, `1650s` or `1700–1709`, `before 1690`, `164X`, `1702/1704`,
an empty cell when the end was not recorded, `..` when the membership ran on past the register).
A few rows are wrong on purpose (a month 13, an end before its start) so that the reports show.

    python gallery/register/make_register.py                 # 3000 rows -> register.csv
    python gallery/register/make_register.py --rows 200000 -o /tmp/big.csv
"""
from __future__ import annotations

import argparse
import csv
import random
from pathlib import Path

FIRST = ("Ansel", "Berna", "Cosmo", "Dervla", "Elric", "Fenna", "Galen", "Hesper", "Ivo",
         "Jessamy", "Kestrel", "Lorcan", "Maudry", "Niall", "Orla", "Piran", "Quenby", "Rowan",
         "Senna", "Tamsin", "Ulric", "Verity", "Wystan", "Yseult", "Zillah")
SURNAME_HEADS = ("Ash", "Bram", "Corn", "Dun", "Elder", "Fal", "Gorse", "Hollin", "Ivy", "Kell",
                 "Lark", "Marl", "Nettle", "Oak", "Pell", "Quill", "Rush", "Sedge", "Thorn",
                 "Wend")
SURNAME_TAILS = ("by", "combe", "ditch", "field", "gate", "hurst", "ley", "more", "stead", "wick")
# craft -> share of the register; the last three are small on purpose (for --min-group-size)
CRAFTS = (("Weaver", 30), ("Dyer", 14), ("Fuller", 12), ("Spinner", 16), ("Carder", 10),
          ("Shearman", 9), ("Tenter-keeper", 6), ("Warden", 1.5), ("Clerk", 1),
          ("Bell-ringer", 0.5))
WARDS = (("North Quay", 20), ("Millbrook", 18), ("Tanner's Row", 15), ("Saltgate", 14),
         ("Upper Vale", 12), ("Fordham End", 10), ("Chapel Green", 8), ("Outer Marsh", 3))
STANDINGS = (("freeman", 55), ("apprentice", 25), ("journeyman", 17), ("widow member", 3))
FIRST_YEAR, LAST_YEAR = 1580, 1780
HEADER = ("ref", "name", "craft", "ward", "standing", "admitted", "left")


def pick(rng: random.Random, weighted) -> str:
    names, weights = zip(*weighted)
    return rng.choices(names, weights)[0]


def written_year(rng: random.Random, year: int, side: str) -> str:
    """A year as a transcriber writes it; mostly plain, sometimes fuzzy."""
    roll = rng.random()
    if roll < 0.55:
        return str(year)
    if roll < 0.70:
        return f"c. {year}"
    if roll < 0.76:
        return written_decade(year // 10 * 10)
    if roll < 0.80:
        return f"{year}?"
    if roll < 0.83:
        return f"{str(year)[:3]}X"
    if roll < 0.87:
        return f"{year}/{year + rng.randint(1, 3)}"
    if roll < 0.91:
        return f"before {year}" if side == "end" else f"after {year}"
    month, day = rng.randint(1, 12), rng.randint(1, 28)
    return f"{year:04d}-{month:02d}-{day:02d}"


def written_decade(first: int) -> str:
    """A decade as nobody can misread it: `1650s`, but `1600–1609` for the decade that begins
    a century, since `1600s` is the whole century to most readers."""
    return f"{first}–{first + 9}" if first % 100 == 0 else f"{first}s"


def member(rng: random.Random, number: int) -> tuple[str, ...]:
    standing = pick(rng, STANDINGS)
    admitted = rng.randint(FIRST_YEAR, LAST_YEAR - 5)
    length = {"apprentice": 7, "journeyman": 6}.get(standing, 22)
    left = admitted + max(1, int(rng.gauss(length, length / 3)))
    name = (f"{rng.choice(FIRST)} {rng.choice(SURNAME_HEADS)}{rng.choice(SURNAME_TAILS)}")
    end_roll = rng.random()
    if end_roll < 0.05:
        end = ""                                   # not recorded
    elif end_roll < 0.07 or left > LAST_YEAR:
        end = ".."                                 # still a member when the register ends
    else:
        end = written_year(rng, left, "end")
    start = written_year(rng, admitted, "start")
    return (f"QV-{number:05d}", name, pick(rng, CRAFTS), pick(rng, WARDS), standing, start,
            end)


MISTAKES = {  # row offset -> (admitted, left): the transcriber's slips, kept to be reported
    17: ("1685-13-01", "1690"),
    204: ("1702", "1697"),
    333: ("", ""),
}


def register(rows: int, seed: int = 1580) -> list[tuple[str, ...]]:
    rng = random.Random(seed)
    table = [member(rng, number) for number in range(1, rows + 1)]
    for offset, (start, end) in MISTAKES.items():
        if offset < rows:
            row = list(table[offset])
            row[5], row[6] = start, end
            table[offset] = tuple(row)
    return table


def main(argv: list[str] | None = None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rows", type=int, default=3000)
    parser.add_argument("--seed", type=int, default=1580)
    parser.add_argument("-o", "--output", default=str(Path(__file__).with_name("register.csv")))
    args = parser.parse_args(argv)
    with open(args.output, "w", newline="", encoding="utf-8") as handle:
        writer = csv.writer(handle, lineterminator="\n")
        writer.writerow(HEADER)
        writer.writerows(register(args.rows, args.seed))


if __name__ == "__main__":
    main()
