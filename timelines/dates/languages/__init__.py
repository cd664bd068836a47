"""The words of the date language, one table per language: the TOML files beside this module.

A table maps the words the readers understand (English: `January`, `c.`, `before`, `century`,
`b.` ...) to the spellings of one language (`janvier`, `vers`, `avant`, `siècle`, `né` ...),
and lists the words that shape a date rather than name a unit (`[rules]`: words that open a
range, decade words, ordinal endings, connectors, silent words). A new language is a new file
and a test table; translate.py reads every table the same way.

- `CODES`: the languages there are, by ISO 639-1 code (`en`, `fr`, `de`, `it`, `es`, `nl`, `la`);
- `table(code)`: one language's `Table`, read once.
"""
from __future__ import annotations

import tomllib
from dataclasses import dataclass
from importlib import resources

CODES = ("en", "fr", "de", "it", "es", "nl", "la")
# The concepts a table may spell: month and weekday names, and the readers' own words.
MONTHS = ("January", "February", "March", "April", "May", "June", "July", "August",
          "September", "October", "November", "December")
WEEKDAYS = ("Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday")
WORDS = ("c.", "probably", "before", "after", "by", "since", "between", "and", "or", "to",
         "early", "mid", "late", "first half of", "second half of", "first quarter of",
         "second quarter of", "third quarter of", "last quarter of", "century", "millennium",
         "spring", "summer", "autumn", "winter", "BC", "AD", "present", "unknown",
         "b.", "bapt.", "d.", "bur.", "m.", "fl.")
# What an event word says the date is of; the readers' event words are these keys.
EVENTS = {"b.": "birth", "bapt.": "baptism", "d.": "death", "bur.": "burial",
          "m.": "marriage", "fl.": "activity (floruit)"}
RULES = ("from", "decade_before", "decade_after", "ordinal_suffixes", "connectors", "silent")


@dataclass(frozen=True, slots=True)
class Table:
    code: str
    name: str                                   # "French"
    spellings: tuple[tuple[str, str], ...]      # (spelling, the readers' word), in file order
    rules: tuple[tuple[str, tuple[str, ...]], ...]   # (rule, its words)

    def rule(self, name: str) -> tuple[str, ...]:
        return dict(self.rules).get(name, ())


def table(code: str) -> Table:
    """One language's table, read once; raises ValueError for a language without one."""
    found = _TABLES.get(code)
    if found is None:
        if code not in CODES:
            raise ValueError(f"no date words for language {code!r}; there are "
                             f"{', '.join(CODES)}")
        text = resources.files(__package__).joinpath(f"{code}.toml").read_text(
            encoding="utf-8")
        found = _TABLES[code] = _table(code, tomllib.loads(text))
    return found


_TABLES: dict[str, Table] = {}   # read once, like a module's regexes at import


def _table(code: str, data: dict) -> Table:
    spellings: list[tuple[str, str]] = []
    for section, concepts in (("months", MONTHS), ("weekdays", WEEKDAYS), ("words", WORDS)):
        for concept, written in data.get(section, {}).items():
            if concept not in concepts:
                raise ValueError(f"{code}.toml [{section}]: {concept!r} is not one of the "
                                 f"readers' words ({', '.join(concepts)})")
            spellings += [(spelling, concept) for spelling in written]
    rules = data.get("rules", {})
    unknown = set(rules) - set(RULES)
    if unknown:
        raise ValueError(f"{code}.toml [rules]: unknown {', '.join(sorted(unknown))}")
    return Table(code, data["language"], tuple(spellings),
                 tuple((name, tuple(rules.get(name, ()))) for name in RULES))
