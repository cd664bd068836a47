"""Dates written in other languages, rewritten into the words the readers understand.

`translated(text, settings)` rewrites `XVIIe siècle` as `17th century`, `um 1650` as `c. 1650`,
`12 de abril de 1650` as `12 April 1650`, `b. 1760`'s spellings (`born`, `geb.`, `né`) as the
readers' event words, with the words of the language tables (languages/). The rules are the
same for every language; only the words differ:
1. a word that opens a range (`de 1650 à 1660`, `von 1650 bis 1660`) is read only first;
2. decades: a decade word before (`années 1650`) or an ending after (`1650er Jahre`);
3. the words of the tables, the longest first, each as a whole word;
4. connectors between day, month and year (`de`, `mensis`), silent words (`le`, `im Jahr`), and
   a day written with a dot before a month (`12. April`);
5. centuries and millennia: an ordinal in figures or Roman numerals with the language's ending
   (`XVIIe`, `17.`, `17de`), or bare Roman numerals beside the word, on either side (`XVII
   secolo`, `siglo XVII`, `XVII century`);
6. Roman-numeral months between a day and a year (`12.IV.1650`), in any language.

The language setting chooses the tables: `default` is English with the forms of the other
tables that no two tables read differently and that are longer than one letter (`vers`, `um`,
`siècle`, but not Italian `m.` (died), which English reads as married); a list such as `fr,en`
takes every word of those languages, the first named winning where two differ.
"""
from __future__ import annotations

import re
from dataclasses import dataclass

from . import gedcom, trace
from .languages import CODES, EVENTS, MONTHS, table
from .ordinals import ordinal_suffix

DEFAULT = "default"
KEEP = "keep"   # the use of an English word the readers read as it stands
_LETTER = r"[^\W\d_]"
_ROMAN = re.compile(r"(?:X{0,3})(?:IX|IV|V?I{0,3})", re.IGNORECASE | re.ASCII)
_ROMAN_VALUES = {"I": 1, "V": 5, "X": 10}
_MONTH_NAMES = "|".join(MONTHS)
_UNIT_WORD = r"(?:century|centuries|millennium|millennia)(?!\w)"
_NUMBER = r"(?P<num>[0-9]{1,2}|(?ai:[ivx]{1,6}))"   # any case, ASCII only (not the Turkish İ)
ROMAN_MONTH = re.compile(r"(?<!\S)(?P<day>[0-9]{1,2})(?P<sep>[./ -])(?P<month>(?ai:[ivx]{1,4}))"
                         r"(?P=sep)(?P<year>[0-9]{3,4})(?!\S)")
_DAY_DOT = re.compile(rf"(?<![0-9.])([0-9]{{1,2}})\.\s*(?=(?:{_MONTH_NAMES})(?!\w))",
                      re.IGNORECASE)
_BARE_BEFORE = re.compile(rf"(?<![\w.]){_NUMBER}\.?\s*(?={_UNIT_WORD})", re.IGNORECASE)
_BARE_AFTER = re.compile(rf"(?<!\w)(?P<word>century|millennium)\s+{_NUMBER}(?!\w)",
                         re.IGNORECASE)
_INTERPRETED = re.compile(r"INT\s+(?P<date>.+?)\s*\((?P<phrase>[^()]*)\)", re.IGNORECASE)
_TOKEN = re.compile(r"[^\W\d_]+'?|\u2020")
# A Roman numeral with an ordinal ending, as a word: xvii, xviie, xviith, xviième.
_ROMAN_WORD = re.compile(r"(?<!\w)(?ai:[ivx])+[^\W\d_ivx]{0,3}(?!\w)")   # not the X of 198X


@dataclass(frozen=True, slots=True)
class Lexicon:
    """The words of the chosen languages, compiled: each word -> (its use, the languages)."""

    words: dict[str, tuple[str, str]]    # lower-case word -> (the readers' word, languages)
    names: dict[str, str]                # lower-case word or rule word -> its languages
    first_tokens: frozenset[str]         # the first token of every word: a quick refusal
    phrases: re.Pattern[str] | None
    rules: dict[str, re.Pattern[str] | None]
    suffixes: re.Pattern[str] | None


def translated(text: str, settings) -> str:
    """The text in the readers' words; the text itself when nothing in it is foreign."""
    if "@" in text:
        text = gedcom.rewritten(text)
    lexicon = lexicon_for(settings.language)
    if not _may_translate(text, lexicon):
        return text
    used: list[str] = []
    result = _rewritten(text, lexicon, used)
    if result != text and trace.on:
        names = list(dict.fromkeys(name for names in used if names
                                   for name in names.split(", ")))
        files = {table(code).name: f"languages/{code}.toml" for code in CODES}
        source = (f"the words of {', '.join(f'{name} ({files[name]})' for name in names)}"
                  if names else "Roman numerals read as numbers")
        trace.note(f"{text!r} read as {result!r} ({source}; language setting "
                   f"{settings.language})")
    return result


def language_hint(text: str) -> str | None:
    """For a text no form reads: a word in it that only a named language reads (Dutch `en`
    is left out of the default), and the setting that reads it."""
    default = lexicon_for(DEFAULT)
    tokens = _TOKEN.findall(text)
    words = [token.lower() for token in tokens]
    for token, word in zip(tokens, words):
        readers = _word_languages().get(word, ()) if word not in default.names else ()
        if readers:
            names = ", ".join(table(code).name for code in readers)
            why = ("reads differently in " + names if len(readers) > 1
                   else f"is {names} and too short to guess")
            # The language whose words cover most of the text: tussen ... en is Dutch.
            likely = max(readers, key=lambda code: sum(code in _word_languages().get(w, ())
                                                       for w in words))
            return (f"{token!r} {why}, so the default language setting leaves it out; "
                    f"name the language: --language {likely}")
    return None


def _word_languages() -> dict[str, tuple[str, ...]]:
    """Each word of every table -> the codes of the languages that have it (built once)."""
    if _WORD_LANGUAGES:
        return _WORD_LANGUAGES
    found: dict[str, list[str]] = {}
    for code in CODES:
        for word, _ in _uses(table(code)):
            codes = found.setdefault(word.lower(), [])
            if code not in codes:
                codes.append(code)
    _WORD_LANGUAGES.update((word, tuple(codes)) for word, codes in found.items())
    return _WORD_LANGUAGES


_WORD_LANGUAGES: dict[str, tuple[str, ...]] = {}


def _may_translate(text: str, lexicon: Lexicon) -> bool:
    for token in _TOKEN.findall(text):
        if token.lower() in lexicon.first_tokens:
            return True
    return _ROMAN_WORD.search(text) is not None


def _is_roman(token: str) -> bool:
    return bool(token) and _ROMAN.fullmatch(token) is not None


def _rewritten(text: str, lexicon: Lexicon, used: list[str]) -> str:
    interpreted = _INTERPRETED.fullmatch(text)
    if interpreted:
        # GEDCOM's INT: a date interpreted from a phrase, which is kept only as a note.
        text = interpreted["date"]
        trace.note(f"INT (GEDCOM): {text!r} interpreted from the phrase "
                   f"{interpreted['phrase']!r}")
    text = _apply(lexicon.rules["from"], text, lambda m: "from ", lexicon, used)
    text = _apply(lexicon.rules["decade_before"], text, lambda m: m["year"] + "s", lexicon, used)
    text = _apply(lexicon.rules["decade_after"], text, lambda m: m["year"] + "s", lexicon, used)
    text = _apply(lexicon.phrases, text, lambda m: _phrase(m, lexicon), lexicon, used)
    text = _apply(lexicon.rules["connectors"], text, lambda m: m["left"] + " ", lexicon, used)
    text = _apply(lexicon.rules["silent"], text, lambda m: " ", lexicon, used)
    text = _DAY_DOT.sub(r"\1 ", " ".join(text.split()))
    if lexicon.rules["day_ordinal"] is not None:
        text = lexicon.rules["day_ordinal"].sub(lambda m: m["day"] + " ", text)
    if re.search(_UNIT_WORD, text, re.IGNORECASE):
        text = _ordinals(text, lexicon, used)
    return ROMAN_MONTH.sub(_roman_month, " ".join(text.split()))


def _phrase(match: re.Match[str], lexicon: Lexicon) -> str:
    use = lexicon.words[match[0].lower()][0]
    return match[0] if use == KEEP else f" {use} "


def _apply(pattern: re.Pattern[str] | None, text: str, replace, lexicon: Lexicon,
           used: list[str]) -> str:
    if pattern is None:
        return text

    def each(match: re.Match[str]) -> str:
        word = match["word"] if "word" in match.re.groupindex else match[0]
        key = word.lower().strip()
        if lexicon.words.get(key, ("", ""))[0] != KEEP:
            used.append(lexicon.names.get(key, ""))
        return replace(match)
    return pattern.sub(each, text)


def _ordinals(text: str, lexicon: Lexicon, used: list[str]) -> str:
    """`XVIIe century`, `17. century`, `century XVII`, `XVII century` -> `17th century`."""
    def ordinal(match: re.Match[str]) -> str:
        number = _number(match["num"])
        return match[0] if number is None else f"{number}{ordinal_suffix(number)}"

    if lexicon.suffixes is not None:
        text = lexicon.suffixes.sub(ordinal, text)
    text = _BARE_BEFORE.sub(lambda m: ordinal(m) + " ", text)
    return _BARE_AFTER.sub(lambda m: f"{ordinal(m)} {m['word']}", text)


def _number(written: str) -> int | None:
    """17, or XVII read as 17; None for a Roman numeral that is not well formed."""
    if not written.isascii():
        return None
    if written.isdigit():
        return int(written) or None
    upper = written.upper()
    if not _is_roman(upper):
        return None
    values = [_ROMAN_VALUES[letter] for letter in upper]
    return sum(-value if value < following else value
               for value, following in zip(values, values[1:] + [0])) or None


def _roman_month(match: re.Match[str]) -> str:
    month = _number(match["month"])
    if month is None or not 1 <= month <= 12:
        return match[0]
    return f"{match['day']} {MONTHS[month - 1]} {match['year']}"


def lexicon_for(setting: str) -> Lexicon:
    """The compiled words of a language setting (`default`, or codes such as `fr,en`),
    compiled once, when a text first needs them (like the readers' regexes at import)."""
    lexicon = _LEXICONS.get(setting)
    if lexicon is None:
        lexicon = _LEXICONS[setting] = _lexicon(setting)
    return lexicon


_LEXICONS: dict[str, Lexicon] = {}


def _lexicon(setting: str) -> Lexicon:
    entries: dict[tuple[str, str], str] = {}   # (lower-case word, use) -> language names
    suffixes: list[str] = []   # ordinal endings act only after a number beside a century word
    for code in language_codes(setting):
        language = table(code)
        suffixes += language.rule("ordinal_suffixes")
        for word, use in _uses(language):
            names = entries.get((word.lower(), use))
            entries[word.lower(), use] = language.name if names is None else (
                names if language.name in names else f"{names}, {language.name}")
    uses: dict[str, list[str]] = {}
    for word, use in entries:
        uses.setdefault(word, []).append(use)
    english = {word.lower() for word, _ in _uses(table("en"))}
    kept = {}
    for (word, use), names in entries.items():
        if _conflicting(uses[word]):
            # The first named language wins; under `default` neither reading is taken.
            if setting == DEFAULT and word not in english or use != uses[word][0]:
                continue
        elif setting == DEFAULT and word not in english and _one_letter(word):
            continue
        kept[word, use] = names
    return _compiled(kept, sorted(set(suffixes), key=len, reverse=True))


def _conflicting(uses: list[str]) -> bool:
    """Whether one word is read two ways. Rule words act only in their own place (first in
    the text, between a day and a month), in a fixed order, so one word may serve several
    rules (French and Spanish `de`); a word of the readers' own is one reading only."""
    return len(uses) > 1 and not all(use.startswith("rule:") for use in uses)


def _one_letter(word: str) -> bool:
    """`e`, `a`, `y`: too short to take for a foreign word unless the language is named
    (abbreviations with a point, `s.`, `h.`, are taken)."""
    return len(word) == 1 and word.isascii()


def language_codes(setting: str) -> tuple[str, ...]:
    """The table codes of a language setting; raises ValueError for an unknown one."""
    if setting == DEFAULT:
        return ("en",) + tuple(code for code in CODES if code != "en")
    codes = tuple(dict.fromkeys(part.strip().lower() for part in setting.split(",")))
    for code in codes:
        if code not in CODES:
            raise ValueError(f"language is default or codes from {', '.join(CODES)} joined "
                             f"by commas (fr,en), not {setting!r}")
    return codes


def _uses(language) -> list[tuple[str, str]]:
    """(word, use) of a table: a use is the readers' word, or `rule:<name>` for rule words.
    English's own spellings of the readers' words are read by the readers themselves and kept
    as written (so that `terminus ante quem` is not Latin `ante`); only its other spellings
    of event words (born, buried) are rewritten."""
    uses = [(spelling, concept if language.code != "en" or concept in EVENTS and
             spelling != concept else KEEP) for spelling, concept in language.spellings]
    for rule, rule_words in language.rules:
        if rule == "ordinal_suffixes":
            continue
        uses += [(word, f"rule:{rule}") for word in rule_words]
    return uses


def _compiled(entries: dict[tuple[str, str], str], suffixes: list[str]) -> Lexicon:
    def of(use: str) -> list[str]:
        return sorted((word for word, kind in entries if kind == use), key=len, reverse=True)

    words = {word: (use, names) for (word, use), names in entries.items()
             if not use.startswith("rule:")}
    names = {word: names for (word, use), names in entries.items()}
    years = r"(?P<year>[0-9]{2,3}0)"
    rules = {
        "from": _alternation(of("rule:from"), r"^(?P<word>{})\s+(?=\S)"),
        "decade_before": _alternation(of("rule:decade_before"),
                                      rf"(?<!\w)(?P<word>{{}})\s+{years}(?![0-9])"),
        "decade_after": _alternation(of("rule:decade_after"),
                                     rf"(?<![0-9]){years}(?P<word>{{}})(?!\w)"),
        "connectors": _alternation(of("rule:connectors"),
                                   rf"(?P<left>[0-9]|\b(?:{_MONTH_NAMES}))\s+(?P<word>{{}})"
                                   rf"\s+(?=[0-9]|(?:{_MONTH_NAMES})(?!\w))"),
        "silent": _alternation(of("rule:silent"), r"(?<!\w)(?P<word>{})(?!\w)"),
    }
    endings = [suffix for suffix in suffixes if suffix != "."]
    suffix_pattern = _alternation(endings, rf"(?<![\w.]){_NUMBER}(?P<word>{{}})(?!\w)")
    # 1er avril, 1st April: the day's ordinal ending is dropped before a month's name.
    rules["day_ordinal"] = _alternation(endings, rf"(?<![\w.])(?P<day>[0-9]{{1,2}})(?:{{}})\s+"
                                                 rf"(?=(?:{_MONTH_NAMES})(?!\w))")
    return Lexicon(words, names,
                   frozenset(_first_token(word) for word, use in entries if use != KEEP),
                   _alternation(sorted(words, key=len, reverse=True), "{}", whole=True),
                   rules, suffix_pattern)


def _alternation(words: list[str], template: str, whole: bool = False) -> re.Pattern[str] | None:
    if not words:
        return None
    parts = [_bounded(word) if whole else re.escape(word) for word in words]
    return re.compile(template.replace("{}", "|".join(parts), 1), re.IGNORECASE)


def _bounded(word: str) -> str:
    """A word that stands alone: no letter or digit runs on into it on either side."""
    before = r"(?<![\w.])" if re.match(r"\w", word) else ""   # not the S of O.S.
    # A point may touch a number (v.1650) but not a letter: the N. of N.S. is no word.
    after = r"(?!\w)" if re.search(r"\w$", word) else r"(?![^\W\d_])"
    return before + re.escape(word) + after


def _first_token(word: str) -> str:
    tokens = _TOKEN.findall(word.lower())
    return tokens[0] if tokens else word.lower()
