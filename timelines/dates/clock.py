"""The time of day after an ISO 8601 date: checked, then set aside, since a date with a time is
read at day precision and the day as written (the UTC offset does not move it).

Limits, from ISO 8601-1 (and ISO 8601:2004 before it), from memory: hours 00 to 24, where 24
is only 24:00:00, the end of the day; minutes 00 to 59; seconds 00 to 60, where 60 is a leap
second. A UTC offset's minutes run 00 to 59 and the offset is at most 14 hours either way: the
limit of W3C XML Schema 1.1 Part 2 (timezoneFrag, from memory), and the widest zones in use
(UTC-12:00 to UTC+14:00 in the IANA time zone database).
"""
from __future__ import annotations

import re

from .grammar import FLAGS
from .reasons import Unreadable

TIME_OF_DAY = re.compile(r"""
    [T\x20]
    (?P<clock>
        (?P<hour>[0-9]{2})
        (?: :?(?P<minute>[0-9]{2})     # extended 23:20 or basic 2320
            (?: :?(?P<second>[0-9]{2}) (?P<fraction>[.,][0-9]+)? )?   # a decimal fraction
        )?
    )
    (?: Z                                                        # UTC
      | (?P<offset> (?P<offset_hour>[+-][0-9]{2}) (?::?(?P<offset_minute>[0-9]{2}))? )
    )?
""", FLAGS)

_CLOCK_LIMITS = (("hour", 24), ("minute", 59), ("second", 60))
_WIDEST_OFFSET_MINUTES = 14 * 60
_TIME_HINT = "a date with a time looks like 1985-04-12T23:20:30"


def check_time(time_text: str) -> None:
    """Refuse a time of day or UTC offset that cannot exist; raises Unreadable."""
    match = TIME_OF_DAY.fullmatch(time_text)
    if match is None or any(int(match[name] or 0) > limit for name, limit in _CLOCK_LIMITS):
        raise Unreadable(f"{time_text.strip()!r} is not a time of day", fragment=time_text,
                         hint=_TIME_HINT)
    if match["hour"] == "24" and not _is_end_of_day(match):
        raise Unreadable(f"{match['clock']} is past the end of the day: hour 24 is only "
                         "24:00:00", fragment=match["clock"], hint=_TIME_HINT)
    if match["offset"]:
        _check_offset(match["offset"], match["offset_hour"], match["offset_minute"])


def _is_end_of_day(match: re.Match[str]) -> bool:
    rest = (match["minute"] or "") + (match["second"] or "") + (match["fraction"] or "")[1:]
    return not rest.strip("0")


def _check_offset(offset: str, hour_text: str, minute_text: str | None) -> None:
    minutes = int(minute_text or 0)
    if minutes > 59:
        raise Unreadable(f"the UTC offset {offset} has no minute {minutes} (minutes run 00 to "
                         "59)", fragment=offset, hint=_TIME_HINT)
    if abs(int(hour_text)) * 60 + minutes > _WIDEST_OFFSET_MINUTES:
        raise Unreadable(f"the UTC offset {offset} is out of range (offsets run from -14:00 to "
                         "+14:00)", fragment=offset, hint=_TIME_HINT)
