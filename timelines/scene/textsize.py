"""Text measurement for DejaVu Sans without loading a font: advance widths from a table.

Layout and compose need label widths long before anything is drawn, and the SVG path must
never load matplotlib. The tables below are the fonts' own advance widths (hmtx, in font
units) for the characters a chronology is likely to hold, generated once from matplotlib's
bundled DejaVuSans.ttf and DejaVuSans-Bold.ttf by tools/make_textsize.py. Kerning is ignored:
it moves ordinary labels by well under 2%, tightly kerned capitals such as "AV" by more; nine
in ten of DejaVu's kerning pairs tighten, so the estimate errs wide, which keeps labels apart.
Oblique DejaVu Sans has the regular advances.

Text with characters beyond the tables (Hebrew, Arabic, Devanagari, CJK, ...) is shaped with
the fonts that draw it (`shaping.shape_line`: direction, font fallback, HarfBuzz) and measured
as shaped, once per string. Only if no font file can be read is it estimated from the tables
(`estimated_width`), characters not in the table in this order:
- combining marks, format and control characters take no width (renderers draw none);
- an accented letter is measured by its base letter (canonical decomposition: ǎ -> a);
- East Asian wide and fullwidth characters (CJK, most emoji) take 1 em, the square cell their
  fonts are drawn on (common practice, no source);
- anything else takes the advance of DejaVu's missing-glyph box, 0.6 em: exactly what
  matplotlib draws when DejaVu lacks the glyph, and between DejaVu's mean lowercase (0.56 em) and
  capital (0.67 em) widths, so a fallback font's letters are neither badly under- nor over-sized.
"""
from __future__ import annotations

import unicodedata
from functools import lru_cache

# numpy only for the annotations: the table path loads nothing, and `text_widths` imports
# numpy when it is first asked for many widths at once (`typing` too would be a load).
TYPE_CHECKING = False
if TYPE_CHECKING:
    import numpy as np

_ZERO_WIDTH_CATEGORIES = frozenset({"Mn", "Me", "Cf", "Cc"})
_BOLD_WEIGHTS = frozenset({"bold", "bolder", "600", "700", "800", "900"})


def text_width(text: str, size_px: float, weight: str = "normal",
               families: str | None = None) -> float:
    """Advance width in px of one line of `text` at `size_px`, set in the chart's families
    (a comma-separated list; None: the default list, DejaVu Sans first)."""
    table = _ADVANCE_BOLD if weight in _BOLD_WEIGHTS else _ADVANCE_REGULAR
    try:
        units = sum(map(table.__getitem__, text))
    except KeyError:
        return _shaped_width(text, "bold" if table is _ADVANCE_BOLD else "normal",
                             families) * size_px
    return units * size_px / UNITS_PER_EM


# `text_widths` measures this many texts at a time, so its arrays (about 8 bytes for each
# character of the chunk) stay small however many labels there are: for ordinary labels they
# fit the processor's cache (measured: chunks of 65,536 45-character labels took twice as long).
_WIDTHS_CHUNK = 4096


def text_widths(texts: list[str], size_px: float, weight: str = "normal",
                families: str | None = None) -> np.ndarray:
    """`text_width` of each of `texts`, equal to it bit for bit, as a float64 array.

    Laying out a million records measures a million labels; this sums the table advances with
    numpy instead of a Python loop per label. The sums are exact integers, scaled to px by the
    same expression as `text_width`, so the floats are the same. Texts with a character beyond
    the tables are measured by `text_width` itself.
    """
    import numpy as np

    widths = np.empty(len(texts), dtype=np.float64)
    for start in range(0, len(texts), _WIDTHS_CHUNK):
        chunk = texts[start:start + _WIDTHS_CHUNK]
        widths[start:start + len(chunk)] = _chunk_widths(chunk, size_px, weight, families)
    return widths


def _chunk_widths(texts: list[str], size_px: float, weight: str,
                  families: str | None) -> np.ndarray:
    """`text_widths` of one chunk: the texts the tables cover at once, the rest one by one."""
    import numpy as np

    units, covered = _table_units(texts, weight in _BOLD_WEIGHTS)
    widths = units * size_px / UNITS_PER_EM
    for i in np.flatnonzero(~covered).tolist():
        widths[i] = text_width(texts[i], size_px, weight, families)
    return widths


def _table_units(texts: list[str], bold: bool) -> tuple[np.ndarray, np.ndarray]:
    """Summed advances in font units of each text (int64, exact) and whether the tables cover
    it; the sum of a text they do not cover is meaningless.

    The texts are joined into one run of code points and summed per text (`reduceat`), so
    nothing is padded: a long text costs its own length, and a NUL is just a character the
    tables lack. `surrogatepass` keeps a lone surrogate a code point, left to `text_width`.
    """
    import numpy as np

    lengths = np.fromiter(map(len, texts), dtype=np.intp, count=len(texts))
    codes = np.frombuffer("".join(texts).encode("utf-32-le", "surrogatepass"), dtype=np.uint32)
    # One spare element at the end: `reduceat` needs every start, an empty last text's too,
    # to index into the array.
    advances = np.zeros(len(codes) + 1, dtype=np.int32)
    np.take(_advance_lookup(bold), codes, mode="clip", out=advances[:-1])
    starts = np.cumsum(lengths) - lengths
    empty = lengths == 0
    # `reduceat` gives an empty text the element at its start, not 0: set those apart.
    units = np.add.reduceat(advances, starts, dtype=np.int64)
    units[empty] = 0
    if advances.min() >= 0:         # the usual chunk: every character in the tables
        return units, np.ones(len(texts), dtype=bool)
    covered = np.minimum.reduceat(advances, starts) >= 0
    covered[empty] = True
    return units, covered


@lru_cache(maxsize=2)
def _advance_lookup(bold: bool) -> np.ndarray:
    """The advance table as an array indexed by code point, -1 for characters not in it; its
    last entry, -1, stands for every code point beyond the table (`take(mode="clip")`)."""
    import numpy as np

    table = _ADVANCE_BOLD if bold else _ADVANCE_REGULAR
    lookup = np.full(max(map(ord, table)) + 2, -1, dtype=np.int32)
    for ch, units in table.items():
        lookup[ord(ch)] = units
    lookup.setflags(write=False)
    return lookup


def covered_by_tables(text: str) -> bool:
    """Whether every character of `text` is in the tables (the fast path, drawn by DejaVu
    Sans left to right, one glyph per character)."""
    return all(map(_ADVANCE_REGULAR.__contains__, text))


@lru_cache(maxsize=65536)
def _shaped_width(text: str, weight: str, families: str | None) -> float:
    """Width in em of text the tables do not cover, as shaped with the fonts that draw it;
    the table estimate when it cannot be shaped (no font file could be read)."""
    from .primitives import clean_text
    from .shaping import shape_line

    try:
        # What is drawn: without the code points no renderer writes (a lone surrogate, which
        # has no UTF-8 form and would stop the shaper).
        return shape_line(clean_text(text), weight, families).width
    except (OSError, IndexError):
        return estimated_width(text, 1.0, weight)


def estimated_width(text: str, size_px: float, weight: str = "normal") -> float:
    """Width in px from the tables alone, characters outside them estimated (module notes)."""
    table = _ADVANCE_BOLD if weight in _BOLD_WEIGHTS else _ADVANCE_REGULAR
    return sum(_advance_units(ch, table) for ch in text) * size_px / UNITS_PER_EM


def text_ascent(size_px: float) -> float:
    """Height above the baseline of DejaVu Sans' line box (hhea ascender), in px."""
    return ASCENT_UNITS * size_px / UNITS_PER_EM


def text_descent(size_px: float) -> float:
    """Depth below the baseline of DejaVu Sans' line box (hhea descender), in px, positive."""
    return DESCENT_UNITS * size_px / UNITS_PER_EM


def text_height(size_px: float) -> float:
    """Height of one line box, ascent plus descent (DejaVu Sans has no line gap), in px."""
    return text_ascent(size_px) + text_descent(size_px)


def cap_height(size_px: float) -> float:
    """Height of capital letters above the baseline, in px.

    To centre a label on a bar visually, put its baseline at `centre + cap_height(size) / 2`.
    """
    return CAP_HEIGHT_UNITS * size_px / UNITS_PER_EM


def x_height(size_px: float) -> float:
    """Height of lowercase letters without ascenders above the baseline, in px."""
    return X_HEIGHT_UNITS * size_px / UNITS_PER_EM


def _advance_units(ch: str, table: dict[str, int]) -> int:
    width = table.get(ch)
    if width is None:
        width = _fallback_units(ch, table)
    return width


def _fallback_units(ch: str, table: dict[str, int]) -> int:
    if unicodedata.category(ch) in _ZERO_WIDTH_CATEGORIES:
        return 0
    base = unicodedata.normalize("NFD", ch)[0]
    if base != ch and base in table:
        return table[base]
    if unicodedata.east_asian_width(ch) in ("W", "F"):
        return UNITS_PER_EM
    return MISSING_GLYPH_UNITS


# --- GENERATED by tools/make_textsize.py: do not edit by hand ---
# DejaVu Sans as bundled with matplotlib 3.11.2.
UNITS_PER_EM = 2048
ASCENT_UNITS = 1901
DESCENT_UNITS = 483
CAP_HEIGHT_UNITS = 1493
X_HEIGHT_UNITS = 1120
MISSING_GLYPH_UNITS = 1229
_ADVANCE_REGULAR = {
    ' ': 651, '!': 821, '"': 942, '#': 1716, '$': 1303, '%': 1946, '&': 1597, "'": 563, '(': 799,
    ')': 799, '*': 1024, '+': 1716, ',': 651, '-': 739, '.': 651, '/': 690, '0': 1303, '1': 1303,
    '2': 1303, '3': 1303, '4': 1303, '5': 1303, '6': 1303, '7': 1303, '8': 1303, '9': 1303,
    ':': 690, ';': 690, '<': 1716, '=': 1716, '>': 1716, '?': 1087, '@': 2048, 'A': 1401,
    'B': 1405, 'C': 1430, 'D': 1577, 'E': 1294, 'F': 1178, 'G': 1587, 'H': 1540, 'I': 604,
    'J': 604, 'K': 1343, 'L': 1141, 'M': 1767, 'N': 1532, 'O': 1612, 'P': 1235, 'Q': 1612,
    'R': 1423, 'S': 1300, 'T': 1251, 'U': 1499, 'V': 1401, 'W': 2025, 'X': 1403, 'Y': 1251,
    'Z': 1403, '[': 799, '\\': 690, ']': 799, '^': 1716, '_': 1024, '`': 1024, 'a': 1255,
    'b': 1300, 'c': 1126, 'd': 1300, 'e': 1260, 'f': 721, 'g': 1300, 'h': 1298, 'i': 569, 'j': 569,
    'k': 1186, 'l': 569, 'm': 1995, 'n': 1298, 'o': 1253, 'p': 1300, 'q': 1300, 'r': 842,
    's': 1067, 't': 803, 'u': 1298, 'v': 1212, 'w': 1675, 'x': 1212, 'y': 1212, 'z': 1075,
    '{': 1303, '|': 690, '}': 1303, '~': 1716, '\xa0': 651, '\xa1': 821, '\xa2': 1303,
    '\xa3': 1303, '\xa4': 1303, '\xa5': 1303, '\xa6': 690, '\xa7': 1024, '\xa8': 1024,
    '\xa9': 2048, '\xaa': 965, '\xab': 1253, '\xac': 1716, '\xad': 739, '\xae': 2048, '\xaf': 1024,
    '\xb0': 1024, '\xb1': 1716, '\xb2': 821, '\xb3': 821, '\xb4': 1024, '\xb5': 1303, '\xb6': 1303,
    '\xb7': 651, '\xb8': 1024, '\xb9': 821, '\xba': 965, '\xbb': 1253, '\xbc': 1985, '\xbd': 1985,
    '\xbe': 1985, '\xbf': 1087, '\xc0': 1401, '\xc1': 1401, '\xc2': 1401, '\xc3': 1401,
    '\xc4': 1401, '\xc5': 1401, '\xc6': 1995, '\xc7': 1430, '\xc8': 1294, '\xc9': 1294,
    '\xca': 1294, '\xcb': 1294, '\xcc': 604, '\xcd': 604, '\xce': 604, '\xcf': 604, '\xd0': 1587,
    '\xd1': 1532, '\xd2': 1612, '\xd3': 1612, '\xd4': 1612, '\xd5': 1612, '\xd6': 1612,
    '\xd7': 1716, '\xd8': 1612, '\xd9': 1499, '\xda': 1499, '\xdb': 1499, '\xdc': 1499,
    '\xdd': 1251, '\xde': 1239, '\xdf': 1290, '\xe0': 1255, '\xe1': 1255, '\xe2': 1255,
    '\xe3': 1255, '\xe4': 1255, '\xe5': 1255, '\xe6': 2011, '\xe7': 1126, '\xe8': 1260,
    '\xe9': 1260, '\xea': 1260, '\xeb': 1260, '\xec': 569, '\xed': 569, '\xee': 569, '\xef': 569,
    '\xf0': 1253, '\xf1': 1298, '\xf2': 1253, '\xf3': 1253, '\xf4': 1253, '\xf5': 1253,
    '\xf6': 1253, '\xf7': 1716, '\xf8': 1253, '\xf9': 1298, '\xfa': 1298, '\xfb': 1298,
    '\xfc': 1298, '\xfd': 1212, '\xfe': 1300, '\xff': 1212, '\u0100': 1401, '\u0101': 1255,
    '\u0102': 1401, '\u0103': 1255, '\u0104': 1401, '\u0105': 1255, '\u0106': 1430, '\u0107': 1126,
    '\u0108': 1430, '\u0109': 1126, '\u010a': 1430, '\u010b': 1126, '\u010c': 1430, '\u010d': 1126,
    '\u010e': 1577, '\u010f': 1300, '\u0110': 1587, '\u0111': 1300, '\u0112': 1294, '\u0113': 1260,
    '\u0114': 1294, '\u0115': 1260, '\u0116': 1294, '\u0117': 1260, '\u0118': 1294, '\u0119': 1260,
    '\u011a': 1294, '\u011b': 1260, '\u011c': 1587, '\u011d': 1300, '\u011e': 1587, '\u011f': 1300,
    '\u0120': 1587, '\u0121': 1300, '\u0122': 1587, '\u0123': 1300, '\u0124': 1540, '\u0125': 1298,
    '\u0126': 1876, '\u0127': 1423, '\u0128': 604, '\u0129': 569, '\u012a': 604, '\u012b': 569,
    '\u012c': 604, '\u012d': 569, '\u012e': 604, '\u012f': 569, '\u0130': 604, '\u0131': 569,
    '\u0132': 1208, '\u0133': 1138, '\u0134': 604, '\u0135': 569, '\u0136': 1343, '\u0137': 1186,
    '\u0138': 1186, '\u0139': 1141, '\u013a': 569, '\u013b': 1141, '\u013c': 569, '\u013d': 1141,
    '\u013e': 768, '\u013f': 1141, '\u0140': 700, '\u0141': 1151, '\u0142': 582, '\u0143': 1532,
    '\u0144': 1298, '\u0145': 1532, '\u0146': 1298, '\u0147': 1532, '\u0148': 1298, '\u0149': 1666,
    '\u014a': 1532, '\u014b': 1298, '\u014c': 1612, '\u014d': 1253, '\u014e': 1612, '\u014f': 1253,
    '\u0150': 1612, '\u0151': 1253, '\u0152': 2191, '\u0153': 2095, '\u0154': 1423, '\u0155': 842,
    '\u0156': 1423, '\u0157': 842, '\u0158': 1423, '\u0159': 842, '\u015a': 1300, '\u015b': 1067,
    '\u015c': 1300, '\u015d': 1067, '\u015e': 1300, '\u015f': 1067, '\u0160': 1300, '\u0161': 1067,
    '\u0162': 1251, '\u0163': 803, '\u0164': 1251, '\u0165': 803, '\u0166': 1251, '\u0167': 803,
    '\u0168': 1499, '\u0169': 1298, '\u016a': 1499, '\u016b': 1298, '\u016c': 1499, '\u016d': 1298,
    '\u016e': 1499, '\u016f': 1298, '\u0170': 1499, '\u0171': 1298, '\u0172': 1499, '\u0173': 1298,
    '\u0174': 2025, '\u0175': 1675, '\u0176': 1251, '\u0177': 1212, '\u0178': 1251, '\u0179': 1403,
    '\u017a': 1075, '\u017b': 1403, '\u017c': 1075, '\u017d': 1403, '\u017e': 1075, '\u017f': 721,
    '\u0370': 1340, '\u0371': 1163, '\u0372': 1765, '\u0373': 1326, '\u0374': 570, '\u0375': 570,
    '\u0376': 1532, '\u0377': 1331, '\u037a': 1024, '\u037b': 1125, '\u037c': 1126, '\u037d': 1125,
    '\u037e': 690, '\u0384': 1024, '\u0385': 1024, '\u0386': 1418, '\u0387': 651, '\u0388': 1528,
    '\u0389': 1784, '\u038a': 836, '\u038c': 1664, '\u038e': 1689, '\u038f': 1691, '\u0390': 693,
    '\u0391': 1401, '\u0392': 1405, '\u0393': 1141, '\u0394': 1401, '\u0395': 1294, '\u0396': 1403,
    '\u0397': 1540, '\u0398': 1612, '\u0399': 604, '\u039a': 1343, '\u039b': 1401, '\u039c': 1767,
    '\u039d': 1532, '\u039e': 1294, '\u039f': 1612, '\u03a0': 1540, '\u03a1': 1235, '\u03a3': 1294,
    '\u03a4': 1251, '\u03a5': 1251, '\u03a6': 1612, '\u03a7': 1403, '\u03a8': 1612, '\u03a9': 1565,
    '\u03aa': 604, '\u03ab': 1251, '\u03ac': 1350, '\u03ad': 1107, '\u03ae': 1298, '\u03af': 693,
    '\u03b0': 1185, '\u03b1': 1350, '\u03b2': 1307, '\u03b3': 1212, '\u03b4': 1253, '\u03b5': 1107,
    '\u03b6': 1114, '\u03b7': 1298, '\u03b8': 1253, '\u03b9': 693, '\u03ba': 1207, '\u03bb': 1212,
    '\u03bc': 1303, '\u03bd': 1144, '\u03be': 1142, '\u03bf': 1253, '\u03c0': 1233, '\u03c1': 1300,
    '\u03c2': 1202, '\u03c3': 1298, '\u03c4': 1233, '\u03c5': 1185, '\u03c6': 1351, '\u03c7': 1183,
    '\u03c8': 1351, '\u03c9': 1715, '\u03ca': 693, '\u03cb': 1185, '\u03cc': 1253, '\u03cd': 1185,
    '\u03ce': 1715, '\u03cf': 1343, '\u03d0': 1258, '\u03d1': 1268, '\u03d2': 1431, '\u03d3': 1725,
    '\u03d4': 1431, '\u03d5': 1351, '\u03d6': 1715, '\u03d7': 1359, '\u03d8': 1612, '\u03d9': 1253,
    '\u03da': 1328, '\u03db': 1202, '\u03dc': 1178, '\u03dd': 939, '\u03de': 1351, '\u03df': 1351,
    '\u03e0': 1772, '\u03e1': 1285, '\u03e2': 1912, '\u03e3': 1715, '\u03e4': 1553, '\u03e5': 1350,
    '\u03e6': 1621, '\u03e7': 1259, '\u03e8': 1406, '\u03e9': 1243, '\u03ea': 1572, '\u03eb': 1280,
    '\u03ec': 1432, '\u03ed': 1253, '\u03ee': 1251, '\u03ef': 1098, '\u03f0': 1359, '\u03f1': 1300,
    '\u03f2': 1126, '\u03f3': 569, '\u03f4': 1612, '\u03f5': 1260, '\u03f6': 1260, '\u03f7': 1239,
    '\u03f8': 1300, '\u03f9': 1430, '\u03fa': 1767, '\u03fb': 1333, '\u03fc': 1300, '\u03fd': 1440,
    '\u03fe': 1430, '\u03ff': 1440, '\u0400': 1294, '\u0401': 1294, '\u0402': 1610, '\u0403': 1249,
    '\u0404': 1430, '\u0405': 1300, '\u0406': 604, '\u0407': 604, '\u0408': 604, '\u0409': 2240,
    '\u040a': 2140, '\u040b': 1610, '\u040c': 1454, '\u040d': 1532, '\u040e': 1248, '\u040f': 1540,
    '\u0410': 1401, '\u0411': 1405, '\u0412': 1405, '\u0413': 1249, '\u0414': 1600, '\u0415': 1294,
    '\u0416': 2206, '\u0417': 1313, '\u0418': 1532, '\u0419': 1532, '\u041a': 1454, '\u041b': 1540,
    '\u041c': 1767, '\u041d': 1540, '\u041e': 1612, '\u041f': 1540, '\u0420': 1235, '\u0421': 1430,
    '\u0422': 1251, '\u0423': 1248, '\u0424': 1763, '\u0425': 1403, '\u0426': 1590, '\u0427': 1404,
    '\u0428': 2190, '\u0429': 2240, '\u042a': 1705, '\u042b': 1807, '\u042c': 1405, '\u042d': 1430,
    '\u042e': 2211, '\u042f': 1423, '\u0430': 1255, '\u0431': 1263, '\u0432': 1207, '\u0433': 1076,
    '\u0434': 1416, '\u0435': 1260, '\u0436': 1845, '\u0437': 1089, '\u0438': 1331, '\u0439': 1331,
    '\u043a': 1237, '\u043b': 1309, '\u043c': 1545, '\u043d': 1339, '\u043e': 1253, '\u043f': 1339,
    '\u0440': 1300, '\u0441': 1126, '\u0442': 1193, '\u0443': 1212, '\u0444': 1751, '\u0445': 1212,
    '\u0446': 1394, '\u0447': 1210, '\u0448': 1874, '\u0449': 1929, '\u044a': 1447, '\u044b': 1617,
    '\u044c': 1207, '\u044d': 1124, '\u044e': 1724, '\u044f': 1232, '\u0450': 1260, '\u0451': 1260,
    '\u0452': 1280, '\u0453': 1076, '\u0454': 1124, '\u0455': 1067, '\u0456': 569, '\u0457': 569,
    '\u0458': 569, '\u0459': 1848, '\u045a': 1840, '\u045b': 1335, '\u045c': 1237, '\u045d': 1331,
    '\u045e': 1212, '\u045f': 1339, '\u2000': 1024, '\u2001': 2048, '\u2002': 1024, '\u2003': 2048,
    '\u2004': 675, '\u2005': 512, '\u2006': 342, '\u2007': 1303, '\u2008': 651, '\u2009': 409,
    '\u200a': 204, '\u200b': 0, '\u200c': 0, '\u200d': 0, '\u200e': 0, '\u200f': 0, '\u2010': 739,
    '\u2011': 739, '\u2012': 1303, '\u2013': 1024, '\u2014': 2048, '\u2015': 2048, '\u2016': 1024,
    '\u2017': 1024, '\u2018': 651, '\u2019': 651, '\u201a': 651, '\u201b': 651, '\u201c': 1061,
    '\u201d': 1061, '\u201e': 1061, '\u201f': 1061, '\u2020': 1024, '\u2021': 1024, '\u2022': 1208,
    '\u2023': 1208, '\u2024': 685, '\u2025': 1367, '\u2026': 2048, '\u2027': 651, '\u2028': 0,
    '\u2029': 0, '\u202a': 0, '\u202b': 0, '\u202c': 0, '\u202d': 0, '\u202e': 0, '\u202f': 409,
    '\u2030': 2748, '\u2031': 3554, '\u2032': 465, '\u2033': 765, '\u2034': 1065, '\u2035': 465,
    '\u2036': 765, '\u2037': 1065, '\u2038': 694, '\u2039': 819, '\u203a': 819, '\u203b': 1716,
    '\u203c': 994, '\u203d': 1087, '\u203e': 1024, '\u203f': 1646, '\u2040': 1646, '\u2041': 512,
    '\u2042': 2048, '\u2043': 1024, '\u2044': 342, '\u20ac': 1303, '\u2116': 2130, '\u2122': 2048,
    '\u2190': 1716, '\u2191': 1716, '\u2192': 1716, '\u2193': 1716, '\u2194': 1716, '\u2195': 1716,
    '\u2212': 1716, '\u2248': 1716, '\u2260': 1716, '\u2261': 1716, '\u2262': 1716, '\u2263': 1716,
    '\u2264': 1716, '\u2265': 1716,
}
_ADVANCE_BOLD = {
    ' ': 713, '!': 934, '"': 1067, '#': 1716, '$': 1425, '%': 2052, '&': 1786, "'": 627, '(': 936,
    ')': 936, '*': 1071, '+': 1716, ',': 778, '-': 850, '.': 778, '/': 748, '0': 1425, '1': 1425,
    '2': 1425, '3': 1425, '4': 1425, '5': 1425, '6': 1425, '7': 1425, '8': 1425, '9': 1425,
    ':': 819, ';': 819, '<': 1716, '=': 1716, '>': 1716, '?': 1188, '@': 2048, 'A': 1585,
    'B': 1561, 'C': 1503, 'D': 1700, 'E': 1399, 'F': 1399, 'G': 1681, 'H': 1714, 'I': 762,
    'J': 762, 'K': 1587, 'L': 1305, 'M': 2038, 'N': 1714, 'O': 1741, 'P': 1501, 'Q': 1741,
    'R': 1577, 'S': 1475, 'T': 1397, 'U': 1663, 'V': 1585, 'W': 2259, 'X': 1579, 'Y': 1483,
    'Z': 1485, '[': 936, '\\': 748, ']': 936, '^': 1716, '_': 1024, '`': 1024, 'a': 1382,
    'b': 1466, 'c': 1214, 'd': 1466, 'e': 1389, 'f': 891, 'g': 1466, 'h': 1458, 'i': 702, 'j': 702,
    'k': 1362, 'l': 702, 'm': 2134, 'n': 1458, 'o': 1407, 'p': 1466, 'q': 1466, 'r': 1010,
    's': 1219, 't': 979, 'u': 1458, 'v': 1335, 'w': 1892, 'x': 1321, 'y': 1335, 'z': 1192,
    '{': 1458, '|': 748, '}': 1458, '~': 1716, '\xa0': 713, '\xa1': 934, '\xa2': 1425,
    '\xa3': 1425, '\xa4': 1303, '\xa5': 1425, '\xa6': 748, '\xa7': 1024, '\xa8': 1024,
    '\xa9': 2048, '\xaa': 1155, '\xab': 1323, '\xac': 1716, '\xad': 850, '\xae': 2048,
    '\xaf': 1024, '\xb0': 1024, '\xb1': 1716, '\xb2': 897, '\xb3': 897, '\xb4': 1024, '\xb5': 1507,
    '\xb6': 1303, '\xb7': 778, '\xb8': 1024, '\xb9': 897, '\xba': 1155, '\xbb': 1323, '\xbc': 2120,
    '\xbd': 2120, '\xbe': 2120, '\xbf': 1188, '\xc0': 1585, '\xc1': 1585, '\xc2': 1585,
    '\xc3': 1585, '\xc4': 1585, '\xc5': 1585, '\xc6': 2222, '\xc7': 1503, '\xc8': 1399,
    '\xc9': 1399, '\xca': 1399, '\xcb': 1399, '\xcc': 762, '\xcd': 762, '\xce': 762, '\xcf': 762,
    '\xd0': 1716, '\xd1': 1714, '\xd2': 1741, '\xd3': 1741, '\xd4': 1741, '\xd5': 1741,
    '\xd6': 1741, '\xd7': 1716, '\xd8': 1741, '\xd9': 1663, '\xda': 1663, '\xdb': 1663,
    '\xdc': 1663, '\xdd': 1483, '\xde': 1511, '\xdf': 1473, '\xe0': 1382, '\xe1': 1382,
    '\xe2': 1382, '\xe3': 1382, '\xe4': 1382, '\xe5': 1382, '\xe6': 2146, '\xe7': 1214,
    '\xe8': 1389, '\xe9': 1389, '\xea': 1389, '\xeb': 1389, '\xec': 702, '\xed': 702, '\xee': 702,
    '\xef': 702, '\xf0': 1407, '\xf1': 1458, '\xf2': 1407, '\xf3': 1407, '\xf4': 1407,
    '\xf5': 1407, '\xf6': 1407, '\xf7': 1716, '\xf8': 1407, '\xf9': 1458, '\xfa': 1458,
    '\xfb': 1458, '\xfc': 1458, '\xfd': 1335, '\xfe': 1466, '\xff': 1335, '\u0100': 1585,
    '\u0101': 1382, '\u0102': 1585, '\u0103': 1382, '\u0104': 1585, '\u0105': 1382, '\u0106': 1503,
    '\u0107': 1214, '\u0108': 1503, '\u0109': 1214, '\u010a': 1503, '\u010b': 1214, '\u010c': 1503,
    '\u010d': 1214, '\u010e': 1700, '\u010f': 1466, '\u0110': 1716, '\u0111': 1466, '\u0112': 1399,
    '\u0113': 1389, '\u0114': 1399, '\u0115': 1389, '\u0116': 1399, '\u0117': 1389, '\u0118': 1399,
    '\u0119': 1389, '\u011a': 1399, '\u011b': 1389, '\u011c': 1681, '\u011d': 1466, '\u011e': 1681,
    '\u011f': 1466, '\u0120': 1681, '\u0121': 1466, '\u0122': 1681, '\u0123': 1466, '\u0124': 1714,
    '\u0125': 1458, '\u0126': 1994, '\u0127': 1618, '\u0128': 762, '\u0129': 702, '\u012a': 762,
    '\u012b': 702, '\u012c': 762, '\u012d': 702, '\u012e': 762, '\u012f': 702, '\u0130': 762,
    '\u0131': 702, '\u0132': 1524, '\u0133': 1404, '\u0134': 762, '\u0135': 702, '\u0136': 1587,
    '\u0137': 1362, '\u0138': 1362, '\u0139': 1305, '\u013a': 702, '\u013b': 1305, '\u013c': 702,
    '\u013d': 1305, '\u013e': 982, '\u013f': 1305, '\u0140': 1140, '\u0141': 1315, '\u0142': 760,
    '\u0143': 1714, '\u0144': 1458, '\u0145': 1714, '\u0146': 1458, '\u0147': 1714, '\u0148': 1458,
    '\u0149': 2013, '\u014a': 1714, '\u014b': 1458, '\u014c': 1741, '\u014d': 1407, '\u014e': 1741,
    '\u014f': 1407, '\u0150': 1741, '\u0151': 1407, '\u0152': 2390, '\u0153': 2241, '\u0154': 1577,
    '\u0155': 1010, '\u0156': 1577, '\u0157': 1010, '\u0158': 1577, '\u0159': 1010, '\u015a': 1475,
    '\u015b': 1219, '\u015c': 1475, '\u015d': 1219, '\u015e': 1475, '\u015f': 1219, '\u0160': 1475,
    '\u0161': 1219, '\u0162': 1397, '\u0163': 979, '\u0164': 1397, '\u0165': 979, '\u0166': 1397,
    '\u0167': 979, '\u0168': 1663, '\u0169': 1458, '\u016a': 1663, '\u016b': 1458, '\u016c': 1663,
    '\u016d': 1458, '\u016e': 1663, '\u016f': 1458, '\u0170': 1663, '\u0171': 1458, '\u0172': 1663,
    '\u0173': 1458, '\u0174': 2259, '\u0175': 1892, '\u0176': 1483, '\u0177': 1335, '\u0178': 1483,
    '\u0179': 1485, '\u017a': 1192, '\u017b': 1485, '\u017c': 1192, '\u017d': 1485, '\u017e': 1192,
    '\u017f': 891, '\u0370': 1429, '\u0371': 1157, '\u0372': 2093, '\u0373': 1712, '\u0374': 618,
    '\u0375': 618, '\u0376': 1714, '\u0377': 1435, '\u037a': 1024, '\u037b': 1214, '\u037c': 1126,
    '\u037d': 1125, '\u037e': 819, '\u0384': 904, '\u0385': 1024, '\u0386': 1633, '\u0387': 778,
    '\u0388': 1732, '\u0389': 2066, '\u038a': 1154, '\u038c': 1824, '\u038e': 2007, '\u038f': 1831,
    '\u0390': 798, '\u0391': 1585, '\u0392': 1561, '\u0393': 1305, '\u0394': 1585, '\u0395': 1399,
    '\u0396': 1485, '\u0397': 1714, '\u0398': 1741, '\u0399': 762, '\u039a': 1587, '\u039b': 1585,
    '\u039c': 2038, '\u039d': 1714, '\u039e': 1294, '\u039f': 1741, '\u03a0': 1714, '\u03a1': 1501,
    '\u03a3': 1399, '\u03a4': 1397, '\u03a5': 1483, '\u03a6': 1741, '\u03a7': 1579, '\u03a8': 1740,
    '\u03a9': 1741, '\u03aa': 762, '\u03ab': 1483, '\u03ac': 1407, '\u03ad': 1140, '\u03ae': 1458,
    '\u03af': 798, '\u03b0': 1383, '\u03b1': 1407, '\u03b2': 1466, '\u03b3': 1395, '\u03b4': 1407,
    '\u03b5': 1140, '\u03b6': 1210, '\u03b7': 1458, '\u03b8': 1407, '\u03b9': 798, '\u03ba': 1455,
    '\u03bb': 1296, '\u03bc': 1507, '\u03bd': 1395, '\u03be': 1210, '\u03bf': 1407, '\u03c0': 1620,
    '\u03c1': 1466, '\u03c2': 1214, '\u03c3': 1595, '\u03c4': 1307, '\u03c5': 1383, '\u03c6': 1602,
    '\u03c7': 1321, '\u03c8': 1626, '\u03c9': 1780, '\u03ca': 798, '\u03cb': 1383, '\u03cc': 1407,
    '\u03cd': 1383, '\u03ce': 1780, '\u03cf': 1587, '\u03d0': 1333, '\u03d1': 1353, '\u03d2': 1528,
    '\u03d3': 2010, '\u03d4': 1528, '\u03d5': 1631, '\u03d6': 1780, '\u03d7': 1523, '\u03d8': 1741,
    '\u03d9': 1407, '\u03da': 1503, '\u03db': 1214, '\u03dc': 1399, '\u03dd': 1011, '\u03de': 1438,
    '\u03df': 1351, '\u03e0': 1882, '\u03e1': 1284, '\u03e2': 2238, '\u03e3': 1715, '\u03e4': 1704,
    '\u03e5': 1466, '\u03e6': 1900, '\u03e7': 1523, '\u03e8': 1502, '\u03e9': 1332, '\u03ea': 1615,
    '\u03eb': 1374, '\u03ec': 1540, '\u03ed': 1466, '\u03ee': 1397, '\u03ef': 1208, '\u03f0': 1523,
    '\u03f1': 1466, '\u03f2': 1214, '\u03f3': 702, '\u03f4': 1741, '\u03f5': 1320, '\u03f6': 1319,
    '\u03f7': 1511, '\u03f8': 1466, '\u03f9': 1503, '\u03fa': 2038, '\u03fb': 1499, '\u03fc': 1466,
    '\u03fd': 1430, '\u03fe': 1503, '\u03ff': 1430, '\u0400': 1399, '\u0401': 1399, '\u0402': 1799,
    '\u0403': 1305, '\u0404': 1503, '\u0405': 1475, '\u0406': 762, '\u0407': 762, '\u0408': 762,
    '\u0409': 2364, '\u040a': 2314, '\u040b': 1799, '\u040c': 1674, '\u040d': 1714, '\u040e': 1579,
    '\u040f': 1714, '\u0410': 1585, '\u0411': 1561, '\u0412': 1561, '\u0413': 1305, '\u0414': 1824,
    '\u0415': 1399, '\u0416': 2507, '\u0417': 1455, '\u0418': 1714, '\u0419': 1714, '\u041a': 1674,
    '\u041b': 1701, '\u041c': 2038, '\u041d': 1714, '\u041e': 1741, '\u041f': 1714, '\u0420': 1501,
    '\u0421': 1503, '\u0422': 1397, '\u0423': 1579, '\u0424': 2031, '\u0425': 1579, '\u0426': 1900,
    '\u0427': 1655, '\u0428': 2530, '\u0429': 2715, '\u042a': 1924, '\u042b': 2122, '\u042c': 1561,
    '\u042d': 1503, '\u042e': 2404, '\u042f': 1577, '\u0430': 1382, '\u0431': 1430, '\u0432': 1296,
    '\u0433': 1070, '\u0434': 1654, '\u0435': 1389, '\u0436': 2038, '\u0437': 1190, '\u0438': 1435,
    '\u0439': 1435, '\u043a': 1390, '\u043b': 1500, '\u043c': 1674, '\u043d': 1415, '\u043e': 1407,
    '\u043f': 1415, '\u0440': 1466, '\u0441': 1214, '\u0442': 1187, '\u0443': 1335, '\u0444': 2032,
    '\u0445': 1321, '\u0446': 1518, '\u0447': 1406, '\u0448': 2175, '\u0449': 2264, '\u044a': 1539,
    '\u044b': 1852, '\u044c': 1295, '\u044d': 1214, '\u044e': 1991, '\u044f': 1315, '\u0450': 1389,
    '\u0451': 1389, '\u0452': 1462, '\u0453': 1070, '\u0454': 1214, '\u0455': 1219, '\u0456': 702,
    '\u0457': 702, '\u0458': 702, '\u0459': 2030, '\u045a': 1958, '\u045b': 1504, '\u045c': 1390,
    '\u045d': 1435, '\u045e': 1335, '\u045f': 1415, '\u2000': 1024, '\u2001': 2048, '\u2002': 1024,
    '\u2003': 2048, '\u2004': 675, '\u2005': 512, '\u2006': 342, '\u2007': 1425, '\u2008': 778,
    '\u2009': 409, '\u200a': 204, '\u200b': 0, '\u200c': 0, '\u200d': 0, '\u200e': 0, '\u200f': 0,
    '\u2010': 850, '\u2011': 850, '\u2012': 1425, '\u2013': 1024, '\u2014': 2048, '\u2015': 2048,
    '\u2016': 1024, '\u2017': 1024, '\u2018': 778, '\u2019': 778, '\u201a': 778, '\u201b': 778,
    '\u201c': 1346, '\u201d': 1346, '\u201e': 1346, '\u201f': 1346, '\u2020': 1024, '\u2021': 1024,
    '\u2022': 1309, '\u2023': 1309, '\u2024': 682, '\u2025': 1366, '\u2026': 2048, '\u2027': 713,
    '\u2028': 0, '\u2029': 0, '\u202a': 0, '\u202b': 0, '\u202c': 0, '\u202d': 0, '\u202e': 0,
    '\u202f': 409, '\u2030': 2949, '\u2031': 3864, '\u2032': 540, '\u2033': 915, '\u2034': 1290,
    '\u2035': 540, '\u2036': 915, '\u2037': 1290, '\u2038': 1501, '\u2039': 844, '\u203a': 844,
    '\u203b': 1991, '\u203c': 1284, '\u203d': 1188, '\u203e': 1024, '\u203f': 1696, '\u2040': 1696,
    '\u2041': 674, '\u2042': 2095, '\u2043': 1024, '\u2044': 342, '\u20ac': 1425, '\u2116': 2464,
    '\u2122': 2048, '\u2190': 1716, '\u2191': 1716, '\u2192': 1716, '\u2193': 1716, '\u2194': 1716,
    '\u2195': 1716, '\u2212': 1716, '\u2248': 1716, '\u2260': 1716, '\u2261': 1716, '\u2262': 1716,
    '\u2263': 1716, '\u2264': 1716, '\u2265': 1716,
}
# --- end of generated tables ---
