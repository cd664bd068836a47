"""`text_widths` measures many labels at once and must give exactly what `text_width` gives
one at a time: the layout may use either, and a label must not move by the last bit depending on
which. Every comparison here is `==` on floats, never approx."""
from __future__ import annotations

import random

import numpy as np
import pytest

from timelines.scene import textsize
from timelines.scene.textsize import text_width, text_widths

TABLE = sorted(textsize._ADVANCE_REGULAR)


def _one_at_a_time(texts, size_px=12.0, weight="normal", families=None):
    return [text_width(text, size_px, weight, families) for text in texts]


def _assert_same(texts, size_px=12.0, weight="normal", families=None):
    widths = text_widths(texts, size_px, weight, families)
    assert isinstance(widths, np.ndarray) and widths.dtype == np.float64
    assert widths.shape == (len(texts),)
    assert widths.tolist() == _one_at_a_time(texts, size_px, weight, families)


def test_no_texts_no_widths():
    widths = text_widths([], 12.0)
    assert widths.dtype == np.float64 and widths.shape == (0,)


def test_ascii_labels():
    _assert_same(["Member 12345", "Hanne Pellory", "A", "AV", "W" * 40, "x y z", "(1784-1791)"])


def test_accents_and_other_table_characters():
    texts = ["Odile Varrin", "Müller", "Ångström", "Żółć", "naïve café", "©®±×÷", "œuvre",
             "Æsir", "\xa0nbsp\xa0", "soft\xadhyphen"]
    assert all(textsize.covered_by_tables(text) for text in texts)
    _assert_same(texts)


def test_empty_strings_anywhere():
    _assert_same([""])
    _assert_same(["", "", ""])
    _assert_same(["", "Member 1", "", "Member 2", ""])


def test_a_nul_is_a_character_not_padding():
    # numpy pads its fixed-width strings with NULs; a real NUL is not in the tables, so
    # text_width shapes (or estimates) the text, and text_widths must do the same.
    _assert_same(["\x00", "a\x00", "\x00a", "a\x00b", "ab", "a", "\x00\x00"])


def test_characters_beyond_the_tables_fall_back_to_text_width():
    # Shaped with the fonts that draw them, or estimated if none can be read: either way
    # equal to text_width.
    texts = ["שלום", "中文标签", "Member 7", "Ἀθῆναι עברית", "mixed 中 text", "नमस्ते", "Member 8",
             "emoji \U0001f600", "\u2265 beyond"]
    assert not all(textsize.covered_by_tables(text) for text in texts)
    _assert_same(texts)
    _assert_same(texts, families="DejaVu Sans")


@pytest.mark.parametrize("weight", ["normal", "bold", "700", "600", "lighter", "400"])
def test_weights(weight):
    _assert_same(["Member 12345", "Müller", "", "שלום", "Wide WWW"], weight=weight)


@pytest.mark.parametrize("size_px", [12.0, 9.0, 7.5, 10.3, 1e-3, 144.0, 1 / 3, 12])
def test_sizes(size_px):
    _assert_same(["Member 12345", "Odile Varrin", "ż", "", "iiii", "中"], size_px=size_px)


def test_lengths_mixed_across_chunk_boundaries(monkeypatch):
    monkeypatch.setattr(textsize, "_WIDTHS_CHUNK", 4)
    texts = ["", "a", "Member 1", "W" * 300, "", "", "", "", "中文", "b" * 5000, "x\x00", "",
             "Müller", "שלום Member", "", "last"]
    _assert_same(texts)
    _assert_same(texts[:5])     # a part-filled last chunk
    _assert_same(texts[:8])     # a chunk of empty texts only


def test_a_chunk_with_only_texts_beyond_the_tables(monkeypatch):
    monkeypatch.setattr(textsize, "_WIDTHS_CHUNK", 2)
    _assert_same(["中", "文", "Member", "שלום", ""])


def test_random_table_strings_equal_text_width(monkeypatch):
    """Property: any string of table characters, any length, in any position of any chunk."""
    monkeypatch.setattr(textsize, "_WIDTHS_CHUNK", 97)
    rng = random.Random(20240611)
    texts = ["".join(rng.choices(TABLE, k=rng.choice([0, 1, 2, 5, 12, 40, 300])))
             for _ in range(2000)]
    for weight in ("normal", "bold"):
        for size_px in (12.0, rng.uniform(1, 100)):
            _assert_same(texts, size_px=size_px, weight=weight)


def test_random_strings_with_some_characters_beyond_the_tables(monkeypatch):
    monkeypatch.setattr(textsize, "_WIDTHS_CHUNK", 50)
    rng = random.Random(7)
    beyond = ["\x00", "中", "ש", "\u0301", "\u200b"]
    texts = ["".join(rng.choices(TABLE + beyond if rng.random() < 0.1 else TABLE,
                                 k=rng.randrange(0, 20)))
             for _ in range(300)]
    _assert_same(texts)


def test_text_width_is_unchanged():
    # text_widths only adds a way in: the one-at-a-time measure is what it always was.
    units = sum(textsize._ADVANCE_REGULAR[ch] for ch in "Member 12345")
    assert text_width("Member 12345", 12.0) == units * 12.0 / textsize.UNITS_PER_EM
