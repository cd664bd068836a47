"""Dates in other languages: one test table per language (tests/fixtures/languages/*.tsv).

Each row is a form as that language's catalogues, archives and registers write it (common
practice, no source) and the English that must read to the same bounds. English is the
reference: its readings are checked against published values elsewhere (test_dates*.py), so a
row here checks that the table carries the words over, not the arithmetic again.
"""
from __future__ import annotations

from pathlib import Path

import pytest

from timelines.dates import DateSettings, explain, parse_span, settings_from_options
from timelines.dates.languages import CODES, MONTHS, WEEKDAYS, WORDS, _table, table
from timelines.dates.translate import DEFAULT, language_codes, lexicon_for, translated
from timelines.errors import DateError

TABLES = Path(__file__).parent / "fixtures" / "languages"


def _rows(code: str) -> list[tuple[str, str]]:
    lines = (TABLES / f"{code}.tsv").read_text(encoding="utf-8").splitlines()
    return [tuple(line.split("\t")) for line in lines if line and not line.startswith("#")]


ROWS = [(code, foreign, english) for code in CODES for foreign, english in _rows(code)]


def test_every_language_has_a_test_table():
    assert sorted(path.stem for path in TABLES.glob("*.tsv")) == sorted(CODES)
    assert all(len(_rows(code)) >= 12 for code in CODES)


@pytest.mark.parametrize("code, foreign, english", ROWS)
def test_each_form_reads_as_its_english_in_its_language(code, foreign, english):
    assert parse_span(foreign, DateSettings(language=code)) == parse_span(english)


@pytest.mark.parametrize("code, foreign, english", ROWS)
def test_the_default_reads_a_form_as_its_language_does_or_refuses_it(code, foreign, english):
    # The default takes only the words no two tables read differently: it may refuse a
    # form (French and Spanish silent `en` is Dutch `and`), never read it otherwise.
    try:
        read = parse_span(foreign)
    except DateError:
        return
    assert read == parse_span(english)


@pytest.mark.parametrize("text, english", [
    # The issue's own examples read with no setting at all.
    ("XVIIe siècle", "17th century"), ("vers 1650", "c. 1650"), ("av. 1700", "before 1700"),
    ("um 1650", "c. 1650"), ("17. Jh.", "17th century"), ("omstreeks 1650", "c. 1650"),
    ("XVII secolo", "17th century"), ("siglo XVII", "17th century"),
    ("XVII century", "17th century"), ("12.IV.1650", "12 April 1650"),
    ("nach 1650", "after 1650"), ("12 de abril de 1650", "12 April 1650"),
])
def test_unambiguous_forms_read_by_default(text, english):
    assert parse_span(text) == parse_span(english)


def test_a_word_two_languages_read_differently_is_left_out_of_the_default():
    # Dutch `en` is `and`; French and Spanish `en` says nothing (en 1650).
    assert "en" not in lexicon_for(DEFAULT).names
    with pytest.raises(DateError):
        parse_span("tussen 1650 en 1660")
    assert parse_span("tussen 1650 en 1660", DateSettings(language="nl")) == \
        parse_span("between 1650 and 1660")
    # Italian m. (morto, died) against English m. (married): English keeps its reading.
    assert lexicon_for(DEFAULT).words["m."][0] == "keep"
    assert lexicon_for("it").words["m."][0] == "d."


def test_the_first_named_language_wins():
    assert lexicon_for("it,en").words["m."][0] == "d."
    assert lexicon_for("en,it").words.get("m.", ("keep",))[0] == "keep"


def test_one_ascii_letter_is_taken_only_when_the_language_is_named():
    assert "y" not in lexicon_for(DEFAULT).words
    assert lexicon_for("es").words["y"][0] == "and"


@pytest.mark.parametrize("code", CODES)
def test_every_month_spelling_reads(code):
    settings = DateSettings(language=code)
    for spelling, concept in table(code).spellings:
        if concept in MONTHS:
            assert parse_span(f"12 {spelling} 1650", settings) == \
                parse_span(f"12 {concept} 1650"), spelling


def test_tables_spell_only_the_readers_words():
    with pytest.raises(ValueError, match="not one of the readers' words"):
        _table("xx", {"language": "Test", "words": {"sometime": ["irgendwann"]}})
    with pytest.raises(ValueError, match="unknown"):
        _table("xx", {"language": "Test", "rules": {"plural": ["s"]}})
    for code in CODES:
        assert {concept for _, concept in table(code).spellings} <= \
            set(MONTHS) | set(WEEKDAYS) | set(WORDS)


def test_english_words_the_readers_read_are_kept_as_written():
    # `ante` is Latin and Italian for before; `terminus ante quem` is English, inclusive.
    assert parse_span("terminus ante quem 410") == parse_span("by 410")
    assert parse_span("12 April 1650 O.S.").start.earliest is not None   # the N. of N.S.
    assert translated("mid-17th century", DateSettings()) == "mid-17th century"


def test_roman_numerals_must_be_well_formed():
    with pytest.raises(DateError):
        parse_span("IIX century")
    with pytest.raises(DateError):
        parse_span("12.XIII.1650")   # no thirteenth month


def test_explain_names_the_language_and_its_table():
    lines = "\n".join(explain("XVIIe siècle"))
    assert "'XVIIe siècle' read as '17th century'" in lines
    assert "French" in lines and "language setting default" in lines
    lines = "\n".join(explain("um 1650", DateSettings(language="de")))
    assert "German" in lines and "language setting de" in lines


def test_the_language_setting_is_checked():
    with pytest.raises(ValueError, match="fr, de"):
        DateSettings(language="fr,xx")
    assert settings_from_options({"language": "FR, en"}).language == "fr,en"
    assert language_codes("fr,en,fr") == ("fr", "en")


@pytest.mark.parametrize("text", ["1650", "c. 1650", "17th century", "12 April 1650",
                                  "before 1700", "1650s", "mid-17th century"])
def test_english_text_passes_through_unchanged(text):
    assert translated(text, DateSettings()) == text


def test_a_form_left_out_of_the_default_says_which_language_reads_it():
    with pytest.raises(DateError) as caught:
        parse_span("tussen 1650 en 1660")
    assert "'en' reads differently in French, Spanish, Dutch" in caught.value.hint
    assert caught.value.hint.endswith("--language nl")
    with pytest.raises(DateError) as caught:
        parse_span("entre 1650 y 1660")
    assert "'y' is Spanish" in caught.value.hint


@pytest.mark.parametrize("text", ["sans date", "s. d.", "o. J.", "ohne Datum", "sin fecha",
                                  "senza data", "zonder datum", "sine anno"])
def test_each_languages_words_for_no_date_make_a_row_undated(text, tmp_path):
    from timelines.sources import ColumnMap, load_records, read_table

    path = tmp_path / "t.csv"
    path.write_text(f"label,when\nA,{text}\nB,1650\n", encoding="utf-8")
    loaded = load_records(read_table(path), ColumnMap(when="when", label="label"))
    [problem] = loaded.problems
    assert problem.kind == "undated" and f"there is no date ('{text}')" in problem.reason
