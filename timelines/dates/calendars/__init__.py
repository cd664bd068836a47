"""Dates written in other calendars, read into fixed day numbers (R.D.).

- `islamic.py`: the arithmetic Islamic (Hijri) calendar;
- `hebrew.py`: the Hebrew calendar, with its molad and postponements;
- `republican.py`: the French Republican calendar, as used in years I-XIV, Romme's rule after;
- `coptic.py`: the Coptic and the Ethiopian calendars;
- `spellings.py`: each calendar's month names in their common transliterations; `names.py`:
  the regexes and look-ups that take them in any case, with accents and apostrophes or
  without, and Roman numerals;
- `forms.py`: the written forms (`12 Rabi' I 1200 AH`, `15 Nisan 5760`, `1 Thout 1716
  Coptic`, `1 Meskerem 2016 EC`, `JD 2451545`; French Republican ones such as `18 Brumaire
  an VIII` in `republican_forms.py`) as `OTHER_CALENDAR_FORMS`, and the words that name each
  calendar in an explanation, `CALENDAR_WORDS`; `reckonings.py`: what their readers share.
Julian Day numbers need no module: `calendar.fixed_from_jdn` converts them.
"""
