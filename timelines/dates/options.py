"""The date settings by the names the command line and the config file use.

- `SETTING_HELP`: option name -> one line of help, default included;
- `settings_from_options({"circa-year": "10", "day-first": "yes"})` -> DateSettings, raising
  ValueError with a plain message for an unknown name or a bad value. Values may be strings
  (from a command line) or already typed (from a TOML file: int, bool);
- `options_from_settings(settings)` -> the same names with the values as strings.
"""
from __future__ import annotations

import difflib
from dataclasses import dataclass, replace
from typing import Callable, Mapping

from ..calendar import CALENDARS
from .settings import (
    BOUND_READINGS, CENTURY_READINGS, DEFAULT_SETTINGS, HEMISPHERES, HUNDREDS_READINGS,
    BP_READINGS, CURVE_NAMES, MAX_CIRCA, NAMED_REFORMS, PART_READINGS, SIGNED_YEAR_READINGS, SINGLE_VALUE_READINGS,
    TODAY, YEAR_ZERO_READINGS, DateSettings,
)


@dataclass(frozen=True, slots=True)
class _Option:
    field: str
    help: str
    read: Callable[[str, object], object]   # (option name, value) -> the field's value
    show: Callable[[object], str] = str


def _choice(choices: tuple[str, ...]) -> Callable[[str, object], object]:
    def read(name: str, value: object) -> object:
        if isinstance(value, str) and value.strip().lower() in choices:
            return value.strip().lower()
        raise ValueError(f"{name} must be one of {', '.join(choices)}, not {value!r}")
    return read


def _whole_number(limit: int) -> Callable[[str, object], object]:
    def read(name: str, value: object) -> object:
        if isinstance(value, str) and value.strip().isdigit():
            value = int(value.strip())
        if type(value) is not int or not 0 <= value <= limit:
            raise ValueError(f"{name} must be a whole number from 0 to {limit}, not {value!r}")
        return value
    return read


_DAY_FIRST = {"yes": True, "true": True, "no": False, "false": False, "refuse": None}


def _day_first(name: str, value: object) -> object:
    if value is None or type(value) is bool:
        return value
    if isinstance(value, str) and value.strip().lower() in _DAY_FIRST:
        return _DAY_FIRST[value.strip().lower()]
    raise ValueError(f"{name} must be yes, no or refuse, not {value!r}")


def _show_day_first(value: object) -> str:
    return {True: "yes", False: "no", None: "refuse"}[value]


def _year_start(name: str, value: object) -> object:
    text = value.strip() if isinstance(value, str) else value
    try:
        replace(DEFAULT_SETTINGS, year_start=text)
    except ValueError:
        raise ValueError(f"{name} is a day written MM-DD, such as 01-01 or 03-25, "
                         f"not {value!r}") from None
    return text


def _reform(name: str, value: object) -> object:
    """A named reform (britain) or the first Gregorian day written YYYY-MM-DD."""
    text = value.strip().lower() if isinstance(value, str) else value
    text = NAMED_REFORMS.get(text, text)
    try:
        replace(DEFAULT_SETTINGS, reform=text)
    except ValueError as error:
        if isinstance(text, str) and text[:1].isdigit():
            raise ValueError(f"{name} {value!r}: {error}") from None
        raise ValueError(f"{name} is the first Gregorian day, YYYY-MM-DD, or one of "
                         f"{', '.join(NAMED_REFORMS)}, not {value!r}") from None
    return text


def _present(name: str, value: object) -> object:
    text = value.strip().lower() if isinstance(value, str) else value
    try:
        replace(DEFAULT_SETTINGS, present=text)
    except ValueError:
        raise ValueError(f"{name} is today or a day written YYYY-MM-DD, "
                         f"not {value!r}") from None
    return text


def _language(name: str, value: object) -> object:
    text = value.strip().lower().replace(" ", "") if isinstance(value, str) else value
    replace(DEFAULT_SETTINGS, language=text)   # raises ValueError naming the languages
    return text


_DAYS, _YEARS = _whole_number(MAX_CIRCA), _whole_number(MAX_CIRCA)
OPTIONS: dict[str, _Option] = {
    "calendar": _Option("calendar", "calendar of free-text dates: historical (Julian before "
                        "1582-10-15), gregorian or julian (default: historical)",
                        _choice(CALENDARS)),
    "circa-day": _Option("circa_days_for_day", "days c./~ adds on each side of a day "
                         "(default: 15)", _DAYS),
    "circa-month": _Option("circa_days_for_month", "days c./~ adds on each side of a month or "
                           "season (default: 31)", _DAYS),
    "circa-year": _Option("circa_years_for_year", "years c./~ adds on each side of a year "
                          "(default: 5)", _YEARS),
    "circa-decade": _Option("circa_years_for_decade", "years c./~ adds on each side of a "
                            "decade (default: 5)", _YEARS),
    "circa-century": _Option("circa_years_for_century", "years c./~ adds on each side of a "
                             "century (default: 25)", _YEARS),
    "circa-millennium": _Option("circa_years_for_millennium", "years c./~ adds on each side "
                                "of a millennium (default: 250)", _YEARS),
    "circa-deep-time": _Option("circa_percent_for_deep_time", "percent of the age c. adds on "
                               "each side of a BP/ka/Ma date (default: 10)", _whole_number(100)),
    "century": _Option("century", "17th century is 1600-1699 (common) or 1601-1700 (strict); "
                       "millennia alike (default: common)", _choice(CENTURY_READINGS)),
    "before-after": _Option("before_after", "'before 1700' ends 1699-12-31 (exclusive) or "
                            "1700-12-31 (inclusive) (default: exclusive)",
                            _choice(BOUND_READINGS)),
    "day-first": _Option("day_first", "03/04/1650 is 3 April (yes), 4 March (no), or an error "
                         "when ambiguous (default: refuse)", _day_first, _show_day_first),
    "early-mid-late": _Option("early_mid_late", "early/mid/late cut a unit in thirds or give "
                              "each part 40%, overlapping (default: thirds)",
                              _choice(PART_READINGS)),
    "year-start": _Option("year_start", "day the year number changes in free text, MM-DD, "
                          "e.g. 03-25 for Lady Day (default: 01-01)", _year_start),
    "hemisphere": _Option("hemisphere", "months of the seasons: northern or southern "
                          "(default: northern)", _choice(HEMISPHERES)),
    "reform": _Option("reform", "first Gregorian day of the historical calendar, YYYY-MM-DD, "
                      f"or {', '.join(NAMED_REFORMS)} (default: 1582-10-15; britain is "
                      "1752-09-14)", _reform),
    "single-value": _Option("single_value", "a single value in a when column (1650, 19th "
                            "century) covers its whole unit (unit) or is one moment in it "
                            "(moment) (default: unit)", _choice(SINGLE_VALUE_READINGS)),
    "hundreds": _Option("hundreds", "1600s (an s on a century year) is the century 1600-1699 "
                        "or the decade 1600-1609 (default: century)",
                        _choice(HUNDREDS_READINGS)),
    "present": _Option("present", "the day present/now/today/ongoing in an end cell stand "
                       f"for: {TODAY} or YYYY-MM-DD (default: {TODAY})", _present),
    "signed-years": _Option("signed_years", "a bare signed year such as -300 counts BC/AD "
                            "with no year zero (bc: 300 BC) or astronomically (astronomical: "
                            "301 BC); -0300 is ISO 8601, always astronomical (default: bc)",
                            _choice(SIGNED_YEAR_READINGS)),
    "bp": _Option("bp", "3450 ± 40 BP is calendar years before 1950 (calendar) or a "
                  "radiocarbon age to calibrate (radiocarbon); 14C BP, uncal BP and a lab code "
                  "say radiocarbon either way (default: calendar)", _choice(BP_READINGS)),
    "curve": _Option("curve", "calibration curve of radiocarbon ages that name none: "
                     "intcal20 (Reimer et al. 2020) or shcal20 (Hogg et al. 2020) "
                     "(default: intcal20)", _choice(CURVE_NAMES)),
    "language": _Option("language", "languages of the words in dates: default (English and "
                        "the forms of fr, de, it, es, nl, la that read one way only) or codes "
                        "joined by commas, the first winning (fr,en) (default: default)",
                        _language),
    "baptism-days": _Option("baptism_days", "days a birth may come before a baptism written "
                            "bapt. (0: the date as written) (default: 30)", _DAYS),
    "burial-days": _Option("burial_days", "days a death may come before a burial written bur. "
                           "(0: the date as written) (default: 7)", _DAYS),
    "year-zero": _Option("year_zero", "a bare year 0 with signed-years bc: refuse (no such "
                         "year) or 1bc (read as 1 BC) (default: refuse)",
                         _choice(YEAR_ZERO_READINGS)),
}

SETTING_HELP: dict[str, str] = {name: option.help for name, option in OPTIONS.items()}
_OPTION_OF_FIELD = {option.field: name for name, option in OPTIONS.items()}


def option_name(field: str) -> str:
    """The option name of a DateSettings field (circa_years_for_year -> circa-year)."""
    return _OPTION_OF_FIELD[field]


def settings_from_options(options: Mapping[str, object],
                          base: DateSettings = DEFAULT_SETTINGS) -> DateSettings:
    """DateSettings from option names and values; names not given keep `base`'s values."""
    changes: dict[str, object] = {}
    for name, value in options.items():
        option = OPTIONS.get(name)
        if option is None:
            raise ValueError(_unknown_option(name))
        changes[option.field] = option.read(name, value)
    return replace(base, **changes)


def _unknown_option(name: object) -> str:
    close = difflib.get_close_matches(str(name), list(OPTIONS), n=1)
    known = f"did you mean {close[0]!r}?" if close else f"known: {', '.join(OPTIONS)}"
    return f"unknown date setting {name!r}; {known}"


def options_from_settings(settings: DateSettings = DEFAULT_SETTINGS) -> dict[str, str]:
    """Every option name with its value in `settings`, written as settings_from_options reads it."""
    return {name: option.show(getattr(settings, option.field)) for name, option in OPTIONS.items()}

