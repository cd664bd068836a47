"""Every documented form in any letter case (docs/dates.md: "Any letter case is read").

The forms are the examples of docs/dates.md and the texts of the test tables (date_forms.py).
For each, its upper, lower, title and random mixed case variants must: raise nothing but a
DateError; read to exactly what the documented spelling reads to (bounds, likely day,
precision, qualifiers), or be refused as it is; keep earliest <= latest; and give an
`iso_form` that reads back to the same bounds. Every documented form is case-insensitive by
nature: English words, eras, units (BP, Ma), and ISO 8601's letters (T, W, X, Y, E, S, Z),
which the standard writes in upper case and the reader takes in either.
"""
from __future__ import annotations

import random

from hypothesis import given, settings as hypothesis_settings, strategies as st

from date_forms import documented_forms
from timelines.dates import DateError, iso_form, parse_date, parse_span
from timelines.dates.quick import quick_span
from timelines.dates.ranges import general_span
from timelines.dates.settings import DEFAULT_SETTINGS

FORMS = documented_forms()
_CASINGS = {"upper": str.upper, "lower": str.lower, "title": str.title,
            "swapped": str.swapcase}


def _outcome(text: str) -> tuple | str:
    """What a text reads to, everything that can be compared; "refused" for a DateError."""
    try:
        span = parse_span(text)
    except DateError:
        return "refused"
    return tuple((side.earliest, side.latest, side.likely, side.precision, side.qualifiers)
                 for side in (span.start, span.end))


def _mixed_case(text: str, rng: random.Random) -> str:
    return "".join(char.upper() if rng.random() < 0.5 else char.lower() for char in text)


def _reads_back(text: str) -> list[str]:
    """Problems with the bounds of a text that reads: their order, and iso_form read back."""
    span = parse_span(text)
    problems = []
    for side in (span.start, span.end):
        if side.earliest is None and side.latest is None:
            continue   # no bound to write: iso_form gives "..", an open side, not a date
        if side.earliest is not None and side.latest is not None and side.earliest > side.latest:
            problems.append(f"{text!r}: earliest after latest")
        again = parse_date(iso_form(side))
        if (again.earliest, again.latest) != (side.earliest, side.latest):
            problems.append(f"{text!r}: iso_form {iso_form(side)!r} reads back otherwise")
    return problems


def test_the_documented_forms_are_collected():
    # Guards the tests below against passing on an empty list (issue 9).
    assert len(FORMS) > 500
    assert {"mid-1650s", "12,500 ± 150 BP", "1984~", "198X", "44 BC"} <= set(FORMS)
    assert sum(_outcome(form) != "refused" for form in FORMS) > 400


def test_every_documented_form_reads_alike_in_upper_lower_title_and_swapped_case():
    differing = [(form, name, _outcome(form), _outcome(change(form)))
                 for form in FORMS for name, change in _CASINGS.items()
                 if _outcome(change(form)) != _outcome(form)]
    assert differing == []


def test_every_case_variant_that_reads_has_ordered_bounds_that_read_back():
    variants = {change(form) for form in FORMS for change in _CASINGS.values()}
    readable = [text for text in sorted(variants) if _outcome(text) != "refused"]
    assert len(readable) > 1000
    assert [problem for text in readable for problem in _reads_back(text)] == []


def test_the_quick_lane_agrees_with_the_general_reader_in_every_case():
    # The quick lane once split `Mid-1650S` at a literal lower-case `mid-` (issue 9).
    for form in FORMS:
        for change in _CASINGS.values():
            text = change(form)
            quick = quick_span(text, DEFAULT_SETTINGS)
            if quick is not None:
                assert quick == general_span(text, DEFAULT_SETTINGS), text


@hypothesis_settings(max_examples=3000, deadline=None)
@given(st.sampled_from(FORMS), st.randoms(use_true_random=False))
def test_a_documented_form_in_random_mixed_case_reads_as_written(form, rng):
    text = _mixed_case(form, rng)
    try:
        outcome = _outcome(text)
    except Exception as error:   # anything but a DateError is a bug (issue 9)
        raise AssertionError(f"{text!r} raised {type(error).__name__}: {error}") from error
    assert outcome == _outcome(form), (form, text)
    if outcome != "refused":
        assert _reads_back(text) == []
