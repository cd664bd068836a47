"""How each calendar's month names are written in Latin letters: the transliterations in
common use, one tuple per month number (see names.py for what else each spelling takes: any
case, accents or none, any apostrophe or none). Common usage, no one source; a name missing
here is refused with the nearest one as a hint.
"""
from __future__ import annotations

from itertools import product


def _joined(firsts: tuple[str, ...], seconds: tuple[str, ...]) -> tuple[str, ...]:
    return tuple(f"{first} {second}" for first, second in product(firsts, seconds))


# Islamic months: the paired names are written with many articles (al-, ul-, el-, ath-) and
# the first and second of a pair also as I and II. The Arabic ayin and hamza (ʿ ʾ) may stand
# or be left out, as may the macrons and dots of a scholarly transliteration (Rabīʿ, Ramaḍān).
_FIRST = ("al-Awwal", "al-Awal", "ul-Awwal", "el-Awwal", "I")
_SECOND = ("al-Thani", "ath-Thani", "ul-Thani", "al-Sani", "us-Sani", "al-Akhir", "ul-Akhir",
           "al-Akhar", "al-Akhira", "al-Akhirah", "II")
_RABI = ("Rabi'", "Rabi'a", "Rabee")
_JUMADA = ("Jumada", "Jumadi", "Jamadi")
_DHU = ("Dhu al-", "Dhu'l-", "Dhul", "Dhi al-", "Zu al-", "Zul", "Thul")
ISLAMIC = {
    1: ("Muharram", "Moharram", "Muharrem"),
    2: ("Safar", "Safer"),
    3: _joined(_RABI, _FIRST),
    4: _joined(_RABI, _SECOND),
    5: _joined(_JUMADA, (*_FIRST, "al-Ula", "al-Oula", "ul-Ula")),
    6: _joined(_JUMADA, (*_SECOND, "al-Ukhra")),
    7: ("Rajab", "Radjab"),
    8: ("Sha'ban", "Shaaban", "Chaban"),
    9: ("Ramadan", "Ramadhan", "Ramazan"),
    10: ("Shawwal", "Shawal", "Shauwal"),
    11: tuple(dhu + qada for dhu in _DHU for qada in ("Qa'da", "Qa'dah", "Qi'da", "Qi'dah")),
    12: tuple(dhu + hijja for dhu in _DHU for hijja in ("Hijja", "Hijjah")),
}

# Hebrew months, numbered from Nisan. Month 12 is Adar I in a leap year; plain Adar is read
# as the forms module says (PLAIN_ADAR).
HEBREW = {
    1: ("Nisan", "Nissan"),
    2: ("Iyyar", "Iyar", "Iar"),
    3: ("Sivan", "Siwan"),
    4: ("Tammuz", "Tamuz"),
    5: ("Av", "Ab", "Menachem Av"),
    6: ("Elul",),
    7: ("Tishri", "Tishrei", "Tisri"),
    8: ("Ḥeshvan", "Cheshvan", "Ḥeshwan", "Marḥeshvan", "Marcheshvan", "Mar-Cheshvan"),
    9: ("Kislev", "Kislew", "Chislev", "Chisleu"),
    10: ("Tevet", "Teveth", "Tebet", "Tebeth"),
    11: ("Shevat", "Sh'vat", "Shebat", "Sebat"),
    12: ("Adar", "Adar I", "Adar Rishon", "Adar Aleph"),
    13: ("Adar II", "Adar Sheni", "Adar Bet", "Ve'adar", "Ve-Adar"),
}
PLAIN_ADAR = "adar"   # the key of Adar written without I or II

FRENCH_REPUBLICAN = {
    1: ("Vendémiaire",), 2: ("Brumaire",), 3: ("Frimaire",), 4: ("Nivôse",),
    5: ("Pluviôse",), 6: ("Ventôse",), 7: ("Germinal",), 8: ("Floréal",), 9: ("Prairial",),
    10: ("Messidor",), 11: ("Thermidor", "Fervidor"), 12: ("Fructidor",),
}

# Coptic months: the Bohairic Coptic names, their Egyptian Arabic forms and the Greek ones.
COPTIC = {
    1: ("Thout", "Thoout", "Tout", "Thoth"),
    2: ("Paopi", "Paope", "Baba", "Babah", "Phaophi"),
    3: ("Hathor", "Hator", "Hatour", "Hatur", "Athyr"),
    4: ("Koiak", "Kiahk", "Kiyahk", "Khoiak", "Choiak"),
    5: ("Tobi", "Tuba", "Toba", "Tubah", "Tybi"),
    6: ("Meshir", "Mechir", "Amshir", "Emshir"),
    7: ("Paremhat", "Paremhotep", "Baramhat", "Phamenoth"),
    8: ("Parmouti", "Paremoude", "Baramouda", "Barmouda", "Pharmouthi"),
    9: ("Pashons", "Pachons", "Bashans", "Bashons"),
    10: ("Paoni", "Paone", "Payni", "Baouna", "Bauna"),
    11: ("Epip", "Epep", "Epiphi", "Abib", "Ebib"),
    12: ("Mesori", "Mesore", "Misra", "Mesra"),
    13: ("Pi Kogi Enavot", "Kogi Enavot", "Nasie", "Nesi", "Epagomenae"),
}

# Ethiopian months, as the Amharic names are commonly written (ä for the first-order vowel).
ETHIOPIC = {
    1: ("Meskerem", "Mäskäräm", "Maskaram"),
    2: ("Tikimt", "Tekemt", "Teqemt", "Tiqimt"),
    3: ("Hidar", "Hedar", "Khidar"),
    4: ("Tahsas", "Tahesas", "Takhsas", "Tahisas"),
    5: ("Tir", "Ter", "Tirr"),
    6: ("Yekatit", "Yäkatit", "Yakatit"),
    7: ("Megabit", "Mägabit", "Maggabit", "Magabit"),
    8: ("Miazia", "Miyazya", "Miyazia"),
    9: ("Genbot", "Ginbot", "Gunbot"),
    10: ("Sene", "Säne", "Sane"),
    11: ("Hamle", "Ḥamle"),
    12: ("Nehasse", "Nähase", "Nehase", "Nahase"),
    13: ("Pagume", "Ṗagume", "Pagumen"),
}
