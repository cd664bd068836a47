"""A seeded fuzz of the date reader (issue 9): 100,000 hostile or unusual texts from
date_fuzz.py, the same on every run. For each: nothing but a DateError is raised, and its
reason is not an internal message; a text that reads has earliest <= latest on each side, an
`iso_form` that reads back to the same bounds, and, when the quick lane claims it, the
general reader's very span. `explain` and `describe` see every tenth text.

Measured on the 2-core development machine: 8 to 13 s for the whole test, by how busy it was.
"""
from __future__ import annotations

from collections import Counter

from date_fuzz import SEED, fuzz_texts, looks_internal
from timelines.dates import DateError, describe, explain, iso_form, parse_date, parse_span
from timelines.dates.quick import quick_span
from timelines.dates.ranges import general_span
from timelines.dates.settings import DEFAULT_SETTINGS

FUZZ_COUNT = 100_000
_SHOWN_PROBLEMS = 10


def _problems_of_span(text: str, span) -> list[str]:
    problems = []
    for side in (span.start, span.end):
        if side.earliest is not None and side.latest is not None and side.earliest > side.latest:
            problems.append(f"{text!r}: earliest after latest")
        if side.earliest is None and side.latest is None:
            continue   # no bound to write: iso_form gives "..", an open side, not a date
        again = parse_date(iso_form(side))
        if (again.earliest, again.latest) != (side.earliest, side.latest):
            problems.append(f"{text!r}: iso_form {iso_form(side)!r} reads back otherwise")
    quick = quick_span(text, DEFAULT_SETTINGS)
    if quick is not None and quick != general_span(text, DEFAULT_SETTINGS):
        problems.append(f"{text!r}: the quick lane and the general reader differ")
    return problems


def _read(parse, text: str, problems: list[str]) -> tuple[object, str]:
    """(what parse(text) gives or None, and "read", "DateError" or "other"); a refusal that
    is not a DateError, or whose reason is an internal message, is a problem."""
    try:
        return parse(text), "read"
    except DateError as error:
        if looks_internal(error.reason):
            problems.append(f"{text!r}: internal reason {error.reason!r}")
        return None, "DateError"
    except Exception as error:   # the bug this test is for: anything but a DateError
        problems.append(f"{text!r}: {parse.__name__} raised {type(error).__name__}: {error}")
        return None, "other"


def _checked(text: str, tally: Counter, problems: list[str]) -> None:
    """Read one text, counting its outcome and noting what is wrong with it."""
    span, outcome = _read(parse_span, text, problems)
    tally[outcome] += 1
    if _read(parse_date, text, problems)[1] == "other":
        tally["other"] += 1
    if span is not None:
        problems.extend(_problems_of_span(text, span))


def fuzz_tally(texts: list[str]) -> tuple[Counter, list[str]]:
    """(outcome counts: read, DateError, other; every problem found)."""
    tally: Counter = Counter()
    problems: list[str] = []
    for index, text in enumerate(texts):
        _checked(text, tally, problems)
        if index % 10 == 0:
            _read(explain, text, problems)
            _read(describe, text, problems)
    return tally, problems


def test_the_generator_repeats_for_its_seed_and_varies():
    first = fuzz_texts(2000)
    assert first == fuzz_texts(2000, SEED)
    assert first != fuzz_texts(2000, SEED + 1)
    assert len(set(first)) > 1500


def test_fuzz_texts_are_read_or_refused_with_a_date_error():
    texts = fuzz_texts(FUZZ_COUNT)
    tally, problems = fuzz_tally(texts)
    assert problems[:_SHOWN_PROBLEMS] == [], f"{len(problems)} problems"
    assert tally["other"] == 0
    assert tally["read"] + tally["DateError"] == FUZZ_COUNT   # parse_span's outcomes
    # A generator that made only junk, or only valid dates, would test little.
    assert tally["read"] > FUZZ_COUNT // 10 and tally["DateError"] > FUZZ_COUNT // 2
