"""Colours: the palette, greyscale lightness and text contrast, against published formulas."""
from __future__ import annotations

from itertools import combinations

import pytest

from timelines.scene.theme import OKABE_ITO, PALETTES, lightness, relative_luminance, text_color_on


def test_okabe_ito_is_the_published_set():
    # Okabe & Ito (2008), "Color Universal Design", the eight RGB values (from memory).
    assert {c.upper() for c in OKABE_ITO} == {
        "#000000", "#E69F00", "#56B4E9", "#009E73", "#F0E442", "#0072B2", "#D55E00", "#CC79A7"}


def test_the_first_five_default_colours_stay_apart_in_greyscale():
    # Greyscale keeps only lightness; CIE L* 10 apart is a clear step (common practice, no
    # source). Beyond five categories no palette of eight hues can keep this.
    for a, b in combinations(OKABE_ITO[:5], 2):
        assert abs(lightness(a) - lightness(b)) >= 10, (a, b)


@pytest.mark.parametrize("colour, expected", [
    ("#000000", 0.0), ("#ffffff", 1.0),
    ("#808080", 0.2158605),    # sRGB 128 -> linear 0.21586 (IEC 61966-2-1 formula)
])
def test_relative_luminance_follows_wcag(colour, expected):
    # WCAG 2.1, definition of relative luminance.
    assert relative_luminance(colour) == pytest.approx(expected, abs=1e-6)


def test_lightness_of_black_white_and_middle_grey():
    # CIE 1976 L*: Y = 0.18 (middle grey) has L* of about 49.5 (from memory).
    assert lightness("#000000") == pytest.approx(0.0)
    assert lightness("#ffffff") == pytest.approx(100.0)
    assert lightness("#777777") == pytest.approx(50.0, abs=1.0)


def test_text_on_a_bar_takes_the_higher_contrast():
    assert text_color_on("#0072B2") == "#ffffff"
    assert text_color_on("#F0E442") == "#000000"


def test_every_palette_is_valid_hex():
    for name, colours in PALETTES.items():
        assert all(len(c) == 7 and c.startswith("#") for c in colours), name
        int("".join(c[1:] for c in colours), 16)
