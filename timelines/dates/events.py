"""Event words before a date: what the date is of, and what that says about a life's span.

Genealogists write the event before the date: `b. 1760` (born), `bapt. 4 May 1760`
(baptised), `d. 1799` (died), `bur. 3 June 1801` (buried), `m. 1790` (married), `fl. 1650`
(active). Each language table spells them its own way (`geb.`, `né`, `natus`); translate.py
rewrites those to these words first.

- `b.`, `d.`, `m.`: the date is of the birth, death or marriage itself; the bounds are the
  date's own.
- `bapt.`: a baptism stands for a birth that came before it, by up to the baptism-days
  setting (30 days by default): the window reaches that many days earlier, and is marked
  `convention_dependent`. `bur.` likewise stands for a death, by the burial-days setting (7).
  Common practice, no source: baptism within days to weeks of birth, burial within days of
  death. Set either to 0 to read the date as written.
- `fl.` (frame.py) marks a date of activity, not of a birth or death.
"""
from __future__ import annotations

from ..model import Endpoint, Qualifier
from . import trace
from .settings import DateSettings

EVENT_MEANINGS = {"b.": "birth", "bapt.": "baptism", "d.": "death", "bur.": "burial",
                  "m.": "marriage"}
# The event a baptism or burial stands for, and the setting that says how far before it.
_STANDS_FOR = {"bapt.": ("birth", "baptism_days", "baptism-days"),
               "bur.": ("death", "burial_days", "burial-days")}


def of_event(endpoint: Endpoint, word: str, settings: DateSettings) -> Endpoint:
    """The window of the event a date with an event word stands for."""
    if word not in _STANDS_FOR:
        if trace.on:
            trace.note(f"{word!r}: the date of a {EVENT_MEANINGS[word]}; the bounds are the "
                       "date's own")
        return endpoint
    stands_for, field, option = _STANDS_FOR[word]
    days = getattr(settings, field)
    if days == 0 or endpoint.earliest is None:
        if trace.on:
            trace.note(f"{word!r}: the date of a {EVENT_MEANINGS[word]}, read as written "
                       f"(setting {option} = {days})")
        return endpoint
    widened = Endpoint(endpoint.earliest - days, endpoint.latest, endpoint.precision,
                       endpoint.qualifiers | {Qualifier.CONVENTION_DEPENDENT})
    if trace.on:
        trace.note(f"{word!r}: a {EVENT_MEANINGS[word]}, which stands for the {stands_for} up "
                   f"to {days} days before it (setting {option} = {days}): "
                   f"{trace.bounds(widened)}")
    return widened
