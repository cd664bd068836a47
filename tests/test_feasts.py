"""Feasts, term days and the computus (timelines/dates/feasts.py, computus.py).

Oracles: dateutil.easter (Ouding's algorithm as quoted in the Explanatory Supplement to the
Astronomical Almanac, a different formula from Reingold & Dershowitz's), and the worked values
of Meeus, *Astronomical Algorithms* (2nd ed.), ch. 8, pp. 68-69, as transcribed in the tests of
mcorne/astronomical-algorithms (examples/aa-gregorian-easter-date.php,
aa-julian-easter-date.php). Values marked "from memory" are checked against dateutil too.
"""
from __future__ import annotations

import pytest
from dateutil.easter import EASTER_JULIAN, EASTER_WESTERN
from dateutil.easter import easter as dateutil_easter

from timelines.calendar import (GREGORIAN, JULIAN, fixed_from_gregorian, fixed_from_julian,
                                julian_from_fixed, weekday_from_fixed)
from timelines.dates import trace
from timelines.dates.computus import easter, gregorian_easter, julian_easter, movable_feast
from timelines.dates.feasts import FEAST_FORMS, FEASTS, _key
from timelines.dates.grammar import FormTable
from timelines.dates.reasons import Unreadable
from timelines.dates.settings import NAMED_REFORMS, DateSettings
from timelines.model import Endpoint, Qualifier

TABLE = FormTable(FEAST_FORMS)
DEFAULT = DateSettings()
BRITAIN = DateSettings(reform=NAMED_REFORMS["britain"])
LADY_DAY_BRITAIN = DateSettings(reform=NAMED_REFORMS["britain"], year_start="03-25")
SUNDAY, WEDNESDAY = 7, 3   # weekday_from_fixed counts as ISO 8601: Monday 1 .. Sunday 7


def read(text: str, settings: DateSettings = DEFAULT, era: str | None = None,
         marker: str | None = None) -> Endpoint:
    found = TABLE.match(text)
    assert found is not None, text
    form, match = found
    result = form.read(match, era, marker, settings)
    return result[0] if type(result) is tuple else result


def day_of(text: str, settings: DateSettings = DEFAULT, **kwargs) -> int:
    endpoint = read(text, settings, **kwargs)
    assert endpoint.earliest == endpoint.latest, text
    return endpoint.earliest


# -- the computus ---------------------------------------------------------------------------

def test_gregorian_easter_agrees_with_dateutil_1583_to_4099():
    # dateutil's EASTER_WESTERN is documented valid for 1583..4099.
    wrong = [year for year in range(1583, 4100)
             if gregorian_easter(year) != dateutil_easter(year, EASTER_WESTERN).toordinal()]
    assert not wrong, wrong[:10]


def test_julian_easter_agrees_with_dateutil_326_to_9999():
    # dateutil's EASTER_JULIAN is documented valid "after 326 AD", with no upper bound; it
    # returns the Julian date's numbers in a datetime.date (which ends in 9999).
    def dateutil_fixed(year: int) -> int:
        day = dateutil_easter(year, EASTER_JULIAN)
        return fixed_from_julian(day.year, day.month, day.day)
    wrong = [year for year in range(326, 10000) if julian_easter(year) != dateutil_fixed(year)]
    assert not wrong, wrong[:10]


@pytest.mark.parametrize("year, month, day, source", [
    (1991, 3, 31, "Meeus p. 68"),
    (1992, 4, 19, "Meeus p. 68"),
    (1954, 4, 18, "Meeus p. 68: Clavius's exception for epact 25, golden number 12"),
    (2000, 4, 23, "Meeus p. 68"),
    (1818, 3, 22, "Meeus p. 68: the earliest possible day"),
    (2285, 3, 22, "Meeus p. 68: the earliest possible day"),
    (1886, 4, 25, "Meeus p. 68: the latest possible day"),
    (1943, 4, 25, "Meeus p. 68: the latest possible day"),
    (2038, 4, 25, "from memory (the next latest Easter); dateutil agrees"),
    (1981, 4, 19, "from memory: Clavius's exception for epact 24; dateutil agrees"),
])
def test_gregorian_easter_published_values(year, month, day, source):
    assert gregorian_easter(year) == fixed_from_gregorian(year, month, day), source


@pytest.mark.parametrize("year, month, day, source", [
    (179, 4, 12, "Meeus p. 69"),
    (711, 4, 12, "Meeus p. 69"),
    (1243, 4, 12, "Meeus p. 69"),
    (1066, 4, 16, "from memory (the Easter before Halley's comet, 1066); dateutil agrees"),
    (1582, 4, 15, "from memory (the last Julian Easter of the papal reform); dateutil agrees"),
])
def test_julian_easter_published_values(year, month, day, source):
    assert julian_from_fixed(julian_easter(year)) == (year, month, day), source


def test_easter_is_a_sunday_from_22_march_to_25_april():
    # The limits of both computuses (Meeus ch. 8; Reingold & Dershowitz ch. 8, from memory).
    for year in range(326, 3000):
        for computus, first in ((julian_easter, fixed_from_julian),
                                (gregorian_easter, fixed_from_gregorian)):
            day = computus(year)
            assert weekday_from_fixed(day) == SUNDAY, (computus.__name__, year)
            assert first(year, 3, 22) <= day <= first(year, 4, 25), (computus.__name__, year)


def test_easter_follows_the_reform_of_the_reckoning():
    # Papal reform 15 October 1582: Easter 1582 was still reckoned by the Julian computus.
    assert easter(1582, "historical") == julian_easter(1582) == fixed_from_julian(1582, 4, 15)
    assert easter(1583, "historical") == gregorian_easter(1583)
    # British reform 14 September 1752: every Easter to 1752 is Julian, from 1753 Gregorian.
    assert easter(1752, BRITAIN.reckoning) == julian_easter(1752)
    assert easter(1753, BRITAIN.reckoning) == gregorian_easter(1753)
    assert easter(1200, GREGORIAN) == gregorian_easter(1200)   # proleptic, as asked
    assert easter(2024, JULIAN) == julian_easter(2024)


def test_a_feast_before_the_reform_keeps_the_julian_rule_though_its_easter_does_not():
    # Sweden, reform 1 March 1753: Septuagesima 1753 fell before it (Julian computus), Easter
    # after it (Gregorian computus).
    sweden = DateSettings(reform=NAMED_REFORMS["sweden"]).reckoning
    assert movable_feast(1753, -63, sweden) == (julian_easter(1753) - 63, JULIAN)
    assert movable_feast(1753, 0, sweden) == (gregorian_easter(1753), GREGORIAN)


def test_a_feast_the_reform_falls_between_is_refused():
    # Russia, reform 14 February 1918: the Julian Septuagesima falls after it, the Gregorian
    # before it.
    russia = DateSettings(reform=NAMED_REFORMS["russia"])
    with pytest.raises(Unreadable, match="neither computus held on its day"):
        read("Septuagesima 1918", russia)
    assert day_of("Septuagesima 1918", russia, marker=JULIAN) == julian_easter(1918) - 63


# -- the readers ----------------------------------------------------------------------------

def test_michaelmas_in_the_papal_and_the_british_reckonings():
    # 1650 is Gregorian in the default (papal) reckoning, Julian in the British one.
    assert read("Michaelmas 1650") == Endpoint.day(fixed_from_gregorian(1650, 9, 29))
    assert read("Michaelmas 1650", BRITAIN) == Endpoint.day(fixed_from_julian(1650, 9, 29))


def test_candlemas_with_the_year_from_lady_day():
    # Cheney: with years from 25 March, 2 February "1650" is 2 February 1651 from 1 January.
    endpoint = read("Candlemas 1650", LADY_DAY_BRITAIN)
    assert endpoint.earliest == endpoint.latest == fixed_from_julian(1651, 2, 2)
    assert endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_easter_1582_under_the_papal_reform_is_julian():
    assert day_of("Easter 1582") == fixed_from_julian(1582, 4, 15)


def test_ash_wednesday_is_easter_less_46_days_and_a_wednesday():
    for year in range(1000, 2100, 7):
        day = day_of(f"Ash Wednesday {year}")
        assert day == easter(year, DEFAULT.reckoning) - 46
        assert weekday_from_fixed(day) == WEDNESDAY, year


WRITTEN_FORMS = [
    ("Michaelmas 1650", fixed_from_gregorian(1650, 9, 29), "quarter day"),
    ("Michaelmas, 1650", fixed_from_gregorian(1650, 9, 29), "comma before the year"),
    ("Michaelmass 1650", fixed_from_gregorian(1650, 9, 29), "old spelling"),
    ("Michaelmas Day 1650", fixed_from_gregorian(1650, 9, 29), "with Day"),
    ("the feast of St Michael 1650", fixed_from_gregorian(1650, 9, 29), "feast of"),
    ("Saint Michael's Day 1650", fixed_from_gregorian(1650, 9, 29), "saint's day"),
    ("St. Michael and All Angels 1650", fixed_from_gregorian(1650, 9, 29), "full name"),
    ("Lady Day 1651", fixed_from_gregorian(1651, 3, 25), "quarter day"),
    ("Lady-Day 1651", fixed_from_gregorian(1651, 3, 25), "hyphen"),
    ("the Annunciation 1651", fixed_from_gregorian(1651, 3, 25), "= Lady Day"),
    ("Midsummer Day 1651", fixed_from_gregorian(1651, 6, 24), "quarter day"),
    ("St John the Baptist 1651", fixed_from_gregorian(1651, 6, 24), "= Midsummer"),
    ("Christmas Day 1651", fixed_from_gregorian(1651, 12, 25), "quarter day"),
    ("Lammas 1651", fixed_from_gregorian(1651, 8, 1), "term day"),
    ("Martinmas 1651", fixed_from_gregorian(1651, 11, 11), "term day"),
    ("All Saints' Day 1651", fixed_from_gregorian(1651, 11, 1), "apostrophe day"),
    ("All Hallows 1651", fixed_from_gregorian(1651, 11, 1), "= All Saints"),
    ("Childermas 1651", fixed_from_gregorian(1651, 12, 28), "= Holy Innocents"),
    ("New Year's Day 1651", fixed_from_gregorian(1651, 1, 1), "apostrophe"),
    ("Twelfth Day 1651", fixed_from_gregorian(1651, 1, 6), "= Epiphany"),
    ("St Thomas 1651", fixed_from_gregorian(1651, 12, 21), "the apostle"),
    ("Easter 1700", fixed_from_gregorian(1700, 4, 11), "Gregorian computus"),
    ("Easter Day 1700", fixed_from_gregorian(1700, 4, 11), "with Day"),
    ("Easter Sunday 1700", fixed_from_gregorian(1700, 4, 11), "with Sunday"),
    ("Good Friday 1700", fixed_from_gregorian(1700, 4, 9), "Easter - 2"),
    ("Whitsun 1650", gregorian_easter(1650) + 49, "the movable feast"),
    ("Whit Sunday 1650", gregorian_easter(1650) + 49, "the movable feast"),
    ("Pentecost 1650", gregorian_easter(1650) + 49, "the movable feast"),
    ("Whitsunday term 1650", fixed_from_gregorian(1650, 5, 15), "Scottish term day"),
    ("term of Whitsunday 1650", fixed_from_gregorian(1650, 5, 15), "Scottish term day"),
    ("Scottish Whitsunday 1650", fixed_from_gregorian(1650, 5, 15), "Scottish term day"),
    ("Martinmas term 1650", fixed_from_gregorian(1650, 11, 11), "Scottish term day"),
    ("Shrove Tuesday 1650", gregorian_easter(1650) - 47, "Easter - 47"),
    ("Holy Thursday 1650", gregorian_easter(1650) + 39, "= Ascension Day in English use"),
    ("Corpus Christi 1650", gregorian_easter(1650) + 60, "Easter + 60"),
]


@pytest.mark.parametrize("text, expected, note", WRITTEN_FORMS)
def test_written_forms(text, expected, note):
    assert day_of(text) == expected, note


def test_written_forms_do_not_repeat():
    texts = [text.lower() for text, _, _ in WRITTEN_FORMS]
    assert len(texts) == len(set(texts))


def test_every_spelling_reads_its_feast():
    for feast in FEASTS:
        for spelling in feast.spellings:
            expected = (fixed_from_gregorian(1700, *feast.day) if feast.day
                        else gregorian_easter(1700) + feast.offset)
            assert day_of(f"{spelling} 1700") == expected, spelling


def test_no_spelling_names_two_feasts():
    keys = [_key(spelling) for feast in FEASTS for spelling in feast.spellings]
    assert len(keys) == len(set(keys))


def test_movable_feasts_are_the_published_distances_from_easter():
    # Cheney's table of movable feasts (from memory): Septuagesima is Easter less 63 days.
    offsets = {feast.name: feast.offset for feast in FEASTS if feast.offset is not None}
    assert offsets == {
        "Septuagesima": -63, "Sexagesima": -56, "Quinquagesima": -49, "Shrove Tuesday": -47,
        "Ash Wednesday": -46, "Palm Sunday": -7, "Maundy Thursday": -3, "Good Friday": -2,
        "Easter Day": 0, "Easter Monday": 1, "Low Sunday": 7, "Rogation Sunday": 35,
        "Ascension Day": 39, "Whitsunday": 49, "Whit Monday": 50, "Trinity Sunday": 56,
        "Corpus Christi": 60}


@pytest.mark.parametrize("text", ["Michaelmas term 1650", "Hilary term 1650",
                                  "Easter term 1650", "Trinity term 1650"])
def test_law_terms_are_refused(text):
    with pytest.raises(Unreadable, match="is a law term"):
        read(text)


@pytest.mark.parametrize("text", ["St John 1650", "Hilary 1650", "Michaelmas", "1650 Easter",
                                  "Easter 1650 1651", "Twelfth Night 1650"])
def test_texts_that_are_no_feast_are_left_to_other_forms(text):
    assert TABLE.match(text) is None


def test_an_era_is_read_and_movable_feasts_begin_in_326():
    assert day_of("Easter 1066", era="AD") == fixed_from_julian(1066, 4, 16)
    with pytest.raises(Unreadable, match="before AD 326"):
        read("Easter 300")
    with pytest.raises(Unreadable, match="before AD 326"):
        read("Easter 44", era="BC")


def test_a_calendar_named_in_the_text_chooses_the_computus():
    assert day_of("Easter 1920", marker=JULIAN) == julian_easter(1920)
    assert day_of("Easter 1500", marker=GREGORIAN) == gregorian_easter(1500)


# -- movable feasts and the year-start setting ----------------------------------------------

def test_a_feast_before_lady_day_belongs_to_the_next_modern_year():
    endpoint = read("Shrove Tuesday 1650", LADY_DAY_BRITAIN)
    assert endpoint.earliest == endpoint.latest == julian_easter(1651) - 47
    assert endpoint.has(Qualifier.CONVENTION_DEPENDENT)


def test_easter_after_lady_day_is_the_same_in_both_numberings():
    endpoint = read("Easter 1650", LADY_DAY_BRITAIN)
    assert endpoint == Endpoint.day(julian_easter(1650))


def test_a_year_from_lady_day_with_no_easter_or_two_is_refused():
    # Julian Easter 1668 fell on 22 March, before Lady Day: it belongs to the written 1667,
    # which also holds 7 April 1667; the written 1668 holds none.
    assert julian_from_fixed(julian_easter(1668)) == (1668, 3, 22)
    with pytest.raises(Unreadable, match="holds two days of Easter Day") as two:
        read("Easter 1667", LADY_DAY_BRITAIN)
    assert "Easter Day 1667/68" in two.value.hint
    with pytest.raises(Unreadable, match="holds no Easter Day"):
        read("Easter 1668", LADY_DAY_BRITAIN)


def test_a_dual_year_names_the_feast_in_its_new_style_year():
    assert day_of("Easter 1667/68") == fixed_from_julian(1668, 3, 22)
    assert day_of("Candlemas 1650/51") == fixed_from_julian(1651, 2, 2)
    with pytest.raises(Unreadable, match="dual year"):
        read("Lady Day 1650/51")


def test_a_nativity_year_start_leaves_movable_feasts_in_their_year():
    nativity = DateSettings(reform=NAMED_REFORMS["britain"], year_start="12-25")
    assert read("Easter 1650", nativity) == Endpoint.day(julian_easter(1650))
    christmas = read("Christmas 1650", nativity)   # the first day of the year 1650
    assert christmas.earliest == fixed_from_julian(1649, 12, 25)


# -- explanations ---------------------------------------------------------------------------

def test_notes_name_the_computus_and_the_distance_from_easter():
    with trace.collecting() as notes:
        read("Easter 1700")
        read("Ash Wednesday 1066")
    assert notes == [
        "Easter Day 1700: Gregorian computus (after the reform day 1582-10-15): 1700-04-11",
        ("Ash Wednesday 1066: Julian computus (before the reform day 1582-10-15), Easter Day "
         "-46 days: 1066-03-01 Julian = 1066-03-07")]   # the calendars were 6 days apart
