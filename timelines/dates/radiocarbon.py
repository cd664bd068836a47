"""Calibrating radiocarbon ages against IntCal20 or SHCal20 (the probability method of Stuiver &
Reimer 1993 and Bronk Ramsey 2008), and pooling several measurements of one event (Ward &
Wilson 1978).

A measured age `age ± error` (14C years BP) becomes a probability for each calendar year:

1. the curve (cal BP, 14C age, sigma), published every 1 to 20 years, is interpolated linearly
   to every whole year from 55,000 to 0 cal BP;
2. year t weighs the likelihood of the measured age given the curve there: a normal density
   with both variances, exp(-(age - mu(t))² / 2v) / sqrt(v), v = error² + sigma(t)²;
3. a year whose likelihood is below TAIL = 1e-3 of the highest weighs nothing, and the rest
   are normalised to sum 1; the years reported run without gaps from the oldest to the
   youngest year kept (a dropped year between them has probability 0). For a normal
   distribution the cut lies at 3.7 sigma and drops 2e-4 of the mass. Of the cuts tried
   (none, and 1e-2 to 1e-5 of the highest), 1e-3 reproduced the published rcarbon ranges of
   Frerebeau & Lebrun 2021 most closely. The same years are kept whether a date is calibrated
   over the whole curve (`calibrate`) or only over the stretch it can reach (`calibrate_many`);
4. the highest-density ranges (HPD) at a level: the years in descending order of probability
   until their sum reaches the level; every year as probable as the one that reached it is
   taken too (ties are all in or all out, so no order among equals is needed). Consecutive
   years form one range, reported oldest first with its own probability;
5. the median: the first year, counting from the oldest, where the running sum reaches 0.5.

Years are whole calendar years before AD 1950 ("cal BP", Stuiver & Polach 1977, from memory);
astronomical year = 1950 - cal BP, so 1950 cal BP is 1 BC (year 0) and 1949 cal BP is AD 1.
A date whose kept years touch an end of the curve is cut there (`Calibration.cut_by_curve`).
Every calibration quotes its curve's citation (`Curve.citation`; curves/README.md, CC BY 4.0).
"""
from __future__ import annotations

import io
import math
from collections.abc import Sequence
from dataclasses import dataclass
from functools import lru_cache
from importlib import resources

import numpy as np
from numpy.lib.stride_tricks import sliding_window_view

from ..calendar import PRESENT_YEAR, year_text

TAIL = 1e-3                  # years kept: likelihood at least this share of the highest
# calibrate_many looks only where the curve lies within WINDOW_SIGMAS combined sigmas of an
# age. A year beyond weighs less than exp(-K²/2) (s_max / s_min) exp(h² / 2 s_min²) of the
# highest, h being half the largest yearly step of the curve: the curve passes within h of any
# age it covers. IntCal20 (s 9-1024, h 17.5): 1e-5; SHCal20 (s 5-1008, h 13.5): 1.1e-4; both
# under TAIL, for any error.
WINDOW_SIGMAS = 6.0
ERROR_STEP = 1.1             # windows are found for errors rounded up to a power of this
CELLS_PER_CHUNK = 250_000    # date-year cells held at once by calibrate_many (memory bound)
PRECISION = 1e-15            # relative size of the last term the gamma function adds


@dataclass(frozen=True, slots=True)
class CurveSource:
    file: str       # inside timelines/dates/curves/
    title: str
    citation: str


CURVES = {
    "intcal20": CurveSource(
        "intcal20.14c", "IntCal20",
        "Reimer P. et al. 2020, The IntCal20 Northern Hemisphere radiocarbon age calibration "
        "curve (0-55 cal kBP), Radiocarbon 62(4):725-757, doi:10.1017/RDC.2020.41 (CC BY 4.0)"),
    "shcal20": CurveSource(
        "shcal20.14c", "SHCal20",
        "Hogg A. G. et al. 2020, SHCal20 Southern Hemisphere calibration, 0-55,000 years cal "
        "BP, Radiocarbon 62(4):759-778, doi:10.1017/RDC.2020.59 (CC BY 4.0)"),
}


@dataclass(frozen=True, slots=True, eq=False)
class Curve:
    """A calibration curve at every whole year: `cal_bp` ascending (0, 1, ... 55000), the
    curve's 14C `age` and its `sigma` there."""

    name: str
    citation: str
    cal_bp: np.ndarray
    age: np.ndarray
    sigma: np.ndarray

    @property
    def age_range(self) -> tuple[float, float]:
        """The youngest and oldest 14C age on the curve: the ages it can calibrate."""
        return float(self.age.min()), float(self.age.max())


@lru_cache(maxsize=None)
def load_curve(name: str) -> Curve:
    """The curve `name` ("intcal20" or "shcal20") read from the package's data files."""
    if name not in CURVES:
        raise ValueError(f"unknown calibration curve {name!r}; choose one of "
                         f"{', '.join(CURVES)}")
    source = CURVES[name]
    text = (resources.files(__package__) / "curves" / source.file).read_text("utf-8")
    rows = np.loadtxt(io.StringIO(text), delimiter=",", comments="#", usecols=(0, 1, 2))
    rows = rows[np.argsort(rows[:, 0])]          # the files run from old to young
    years = np.arange(int(rows[0, 0]), int(rows[-1, 0]) + 1)
    age = np.interp(years, rows[:, 0], rows[:, 1])
    sigma = np.interp(years, rows[:, 0], rows[:, 2])
    for array in (years, age, sigma):
        array.flags.writeable = False
    return Curve(name, source.citation, years, age, sigma)


# -- one calibrated date -----------------------------------------------------------------------

@dataclass(frozen=True, slots=True)
class CalRange:
    """One highest-density range: whole years `start_bp` (the older) to `end_bp`, both in."""

    start_bp: int
    end_bp: int
    probability: float

    @property
    def start_year(self) -> int:
        return year_from_cal_bp(self.start_bp)

    @property
    def end_year(self) -> int:
        return year_from_cal_bp(self.end_bp)

    def __str__(self) -> str:
        return (f"{_thousands(self.start_bp)}–{cal_bp_label(self.end_bp)} "
                f"({year_label(self.start_year)}–{year_label(self.end_year)}): "
                f"{self.probability:.1%}")


@dataclass(frozen=True, slots=True, eq=False)
class Calibration:
    """A calibrated date: `probability[i]` of calendar year `cal_bp[i]`, the years consecutive
    from `youngest_bp` on (cal BP ascending); the probabilities sum to 1."""

    age: float
    error: float
    curve: str
    youngest_bp: int
    probability: np.ndarray

    @property
    def cal_bp(self) -> np.ndarray:
        return np.arange(self.youngest_bp, self.youngest_bp + len(self.probability))

    def ranges(self, level: float = 0.954) -> tuple[CalRange, ...]:
        """The highest-density ranges holding `level` of the probability, oldest first."""
        chosen = self.probability >= _hpd_cutoff(self.probability, level)
        edges = np.diff(np.concatenate([[0], chosen.astype(np.int8), [0]]))
        firsts, lasts = np.flatnonzero(edges == 1), np.flatnonzero(edges == -1) - 1
        found = [CalRange(self.youngest_bp + int(last), self.youngest_bp + int(first),
                          float(self.probability[first:last + 1].sum()))
                 for first, last in zip(firsts, lasts)]
        return tuple(reversed(found))

    def outer(self, level: float = 0.954) -> tuple[int, int]:
        """The oldest and the youngest year (cal BP) of all ranges at `level`."""
        found = self.ranges(level)
        return found[0].start_bp, found[-1].end_bp

    @property
    def median_bp(self) -> int:
        """The first year, counting from the oldest, where the running sum reaches 0.5."""
        running = np.cumsum(self.probability[::-1])
        oldest = self.youngest_bp + len(running) - 1
        return oldest - int(min(np.searchsorted(running, 0.5), len(running) - 1))

    @property
    def cut_by_curve(self) -> bool:
        """True when the kept years reach an end of the curve: the date was cut there."""
        years = load_curve(self.curve).cal_bp
        oldest = self.youngest_bp + len(self.probability) - 1
        return bool(self.youngest_bp == years[0] or oldest == years[-1])

    def density_by_year(self) -> tuple[np.ndarray, np.ndarray]:
        """(astronomical years ascending, probability of each) for drawing."""
        return year_from_cal_bp(self.cal_bp[::-1]), self.probability[::-1]


def _hpd_cutoff(probability: np.ndarray, level: float) -> float:
    """The least probability a year needs to be in the highest-density ranges at `level`."""
    if not 0 < level <= 1:
        raise ValueError(f"a probability level lies above 0 and at most 1, not {level}")
    descending = np.sort(probability)[::-1]
    reached = np.searchsorted(np.cumsum(descending), level)   # first sum >= level
    return float(descending[min(reached, len(descending) - 1)])


@lru_cache(maxsize=4096)
def calibrate(age: float, error: float, curve: str = "intcal20") -> Calibration:
    """`age ± error` (14C years BP) calibrated against `curve` over the whole curve, cached
    per (age, error, curve); `calibrate.__wrapped__` is the same without the cache. Raises
    ValueError for an error not above 0 or an age outside the curve."""
    age, error = float(age), float(error)
    table = load_curve(curve)
    _check_date(age, error, table)
    likelihood = _likelihood(age, error, table.age, table.sigma)
    return _calibrations([age], [error], table, table.cal_bp[:1], likelihood[None, :])[0]


def _check_date(age: float, error: float, curve: Curve) -> None:
    if not (math.isfinite(error) and error > 0):
        raise ValueError(f"cannot calibrate {age:g} ± {error:g} BP: the error must be a "
                         "number above 0")
    youngest, oldest = curve.age_range
    if not (math.isfinite(age) and youngest <= age <= oldest):
        raise ValueError(f"cannot calibrate {age:g} ± {error:g} BP: {CURVES[curve.name].title} "
                         f"covers radiocarbon ages {youngest:g} to {oldest:g} BP")


def _likelihood(age, error, mu: np.ndarray, sigma: np.ndarray) -> np.ndarray:
    """The normal likelihood of `age` at each curve year (row-wise for column vectors of ages
    and errors): exp(-(age - mu)² / 2v) / sqrt(v), v = error² + sigma²."""
    variance = sigma * sigma + error * error
    exponent = age - mu                          # computed in place: these tables are large
    exponent *= exponent
    exponent /= variance
    exponent *= -0.5
    return np.exp(exponent, out=exponent) / np.sqrt(variance, out=variance)


def _calibrations(ages, errors, curve: Curve, first, likelihood: np.ndarray
                  ) -> list[Calibration]:
    """The Calibrations of dates whose likelihoods are the rows of `likelihood`, row i running
    from cal BP `first[i]` on: the years under TAIL of the row's highest dropped (they weigh
    0), the rest normalised, each kept from its first to its last year that weighs."""
    highest = likelihood.max(axis=1, keepdims=True)
    if not np.all(highest > 0):     # cannot happen for an age on the curve: its steps are small
        raise ValueError(f"no year of {curve.name} lies near one of the ages")
    weighed = likelihood >= TAIL * highest
    likelihood = np.where(weighed, likelihood, 0.0)
    probability = likelihood / likelihood.sum(axis=1, keepdims=True)
    low = weighed.argmax(axis=1)
    high = weighed.shape[1] - weighed[:, ::-1].argmax(axis=1)
    return [Calibration(float(age), float(error), curve.name, int(start + a),
                        _frozen(row[a:b].copy()))
            for age, error, start, row, a, b in zip(ages, errors, first, probability, low, high)]


def _frozen(array: np.ndarray) -> np.ndarray:
    array.flags.writeable = False   # cached calibrations are shared
    return array


# -- many dates at once ------------------------------------------------------------------------

@lru_cache(maxsize=None)
def _padded(name: str) -> tuple[np.ndarray, np.ndarray]:
    """The curve's age and sigma followed by as many copies of their last values, so that a
    window of any width starting at any year can be read as a view."""
    curve = load_curve(name)
    return tuple(np.concatenate([column, np.full(len(column), column[-1])])
                 for column in (curve.age, curve.sigma))


@lru_cache(maxsize=None)
def _reach(name: str, step: int) -> tuple[np.ndarray, np.ndarray]:
    """Bounds to find the years an age with an error up to e = ERROR_STEP ** step can reach:
    the running maximum (young to old) of the curve's upper band mu + K sqrt(e² + s²) and the
    running minimum (old to young) of its lower band, K = WINDOW_SIGMAS."""
    curve = load_curve(name)
    band = WINDOW_SIGMAS * np.sqrt(ERROR_STEP ** (2 * step) + curve.sigma ** 2)
    upper = np.maximum.accumulate(curve.age + band)
    lower = np.minimum.accumulate((curve.age - band)[::-1])[::-1]
    return upper, lower


def _windows(ages: np.ndarray, errors: np.ndarray, curve: Curve):
    """First year index and width of the stretch of curve each date can reach: from the first
    year whose upper band reaches up to the age to the last whose lower band reaches down to
    it. Every year within K combined sigmas of the age lies between."""
    steps = np.ceil(np.log(errors) / math.log(ERROR_STEP)).astype(int)
    first, last = np.empty(len(ages), dtype=int), np.empty(len(ages), dtype=int)
    for step in np.unique(steps):
        upper, lower = _reach(curve.name, int(step))
        chosen = steps == step
        first[chosen] = np.searchsorted(upper, ages[chosen])
        last[chosen] = np.searchsorted(lower, ages[chosen], side="right") - 1
    return first, np.maximum(last - first + 1, 1)


def calibrate_many(ages: Sequence[float], errors: Sequence[float],
                   curve: str = "intcal20") -> tuple[Calibration, ...]:
    """Each `ages[i] ± errors[i]` calibrated against `curve`: the same Calibration as
    `calibrate` gives (same years, same probabilities to rounding), computed once per distinct
    pair, vectorised over the dates and only over the years each can reach."""
    ages, errors = np.asarray(ages, dtype=float), np.asarray(errors, dtype=float)
    if ages.shape != errors.shape or ages.ndim != 1:
        raise ValueError(f"ages and errors must be two lists of one length, not "
                         f"{ages.shape} and {errors.shape}")
    table = load_curve(curve)
    youngest, oldest = table.age_range
    usable = np.isfinite(errors) & (errors > 0) & (ages >= youngest) & (ages <= oldest)
    if not usable.all():                          # raise for the first unusable date
        bad = int(np.argmin(usable))
        _check_date(float(ages[bad]), float(errors[bad]), table)
    pairs, back = np.unique(np.column_stack([ages, errors]), axis=0, return_inverse=True)
    done = _calibrate_pairs(pairs[:, 0], pairs[:, 1], table)
    return tuple(done[i] for i in back.reshape(-1))


def _calibrate_pairs(ages: np.ndarray, errors: np.ndarray, curve: Curve) -> list[Calibration]:
    """Calibrations of distinct dates, in chunks of windows of similar width (little padding)
    of up to CELLS_PER_CHUNK cells."""
    first, width = _windows(ages, errors, curve)
    order = np.argsort(width, kind="stable")
    done: list[Calibration | None] = [None] * len(ages)
    start = 0
    while start < len(order):
        cells = np.arange(1, len(order) - start + 1) * width[order[start:]]   # ascending
        chunk = order[start:start + max(1, np.searchsorted(cells, CELLS_PER_CHUNK, "right"))]
        for i, calibration in zip(chunk, _calibrate_chunk(ages[chunk], errors[chunk],
                                                          first[chunk], width[chunk], curve)):
            done[i] = calibration
        start += len(chunk)
    return done


def _calibrate_chunk(ages, errors, first, width, curve: Curve) -> list[Calibration]:
    """One chunk: a (dates x years) table of likelihoods over each date's window."""
    steps = np.arange(int(width.max()))
    mu, sigma = (sliding_window_view(column, len(steps))[first] for column in _padded(curve.name))
    likelihood = _likelihood(ages[:, None], errors[:, None], mu, sigma)
    likelihood[steps >= width[:, None]] = 0.0       # padding past a date's window
    return _calibrations(ages, errors, curve, curve.cal_bp[first], likelihood)


# -- several measurements of one event ---------------------------------------------------------

@dataclass(frozen=True, slots=True)
class Pooled:
    """Ward & Wilson's (1978) pooled age of measurements of one event and its test."""

    mean: float                # inverse-variance weighted mean, 14C years BP
    error: float               # 1 / sqrt(sum 1/e²)
    statistic: float           # T = sum (a - mean)² / e²
    degrees_of_freedom: int    # n - 1
    p_value: float             # chance of a T this large if all measure one age (chi-square)

    def agrees(self, alpha: float = 0.05) -> bool:
        """True when the measurements may be of one age: the p-value is above `alpha`."""
        return self.p_value > alpha


def pool(ages: Sequence[float], errors: Sequence[float]) -> Pooled:
    """Ward & Wilson's (1978) case I: the pooled mean of measurements of one event and the
    chi-square test that they agree (T against chi-square with n - 1 degrees of freedom)."""
    ages, errors = np.asarray(ages, dtype=float), np.asarray(errors, dtype=float)
    if ages.shape != errors.shape or ages.ndim != 1 or len(ages) < 2:
        raise ValueError("pooling needs two or more ages, each with its error")
    if not np.all(errors > 0):
        raise ValueError(f"every error must be above 0, not {errors.tolist()}")
    weights = 1 / errors ** 2
    mean = float(np.sum(weights * ages) / np.sum(weights))
    statistic = float(np.sum(weights * (ages - mean) ** 2))
    freedom = len(ages) - 1
    return Pooled(mean, float(1 / math.sqrt(np.sum(weights))), statistic, freedom,
                  chi_square_survival(statistic, freedom))


def chi_square_survival(statistic: float, degrees_of_freedom: int) -> float:
    """P(X >= statistic) for X chi-square with `degrees_of_freedom`: Q(k/2, T/2)."""
    if degrees_of_freedom < 1:
        raise ValueError(f"degrees of freedom start at 1, not {degrees_of_freedom}")
    return upper_gamma_regularised(degrees_of_freedom / 2, max(statistic, 0.0) / 2)


def upper_gamma_regularised(a: float, x: float) -> float:
    """Q(a, x) = Γ(a, x) / Γ(a), by the series for P = 1 - Q below x = a + 1 and by the
    continued fraction above it, where each converges fast (Press et al., Numerical Recipes,
    2nd ed., §6.2, gser and gcf)."""
    if x <= 0:
        return 1.0
    scale = math.exp(-x + a * math.log(x) - math.lgamma(a))   # e^-x x^a / Γ(a)
    if x < a + 1:
        return 1.0 - scale * _gamma_series(a, x)
    return scale * _gamma_fraction(a, x)


def _gamma_series(a: float, x: float) -> float:
    # P(a, x) Γ(a) e^x x^-a = sum over n of x^n / (a (a+1) ... (a+n))
    term = total = 1 / a
    for n in range(1, 1000):
        term *= x / (a + n)
        total += term
        if abs(term) < abs(total) * PRECISION:
            break
    return total


def _gamma_fraction(a: float, x: float) -> float:
    # Q(a, x) Γ(a) e^x x^-a = 1/(x+1-a- 1(1-a)/(x+3-a- 2(2-a)/(x+5-a- ...))), modified Lentz
    tiny = 1e-300
    b = x + 1 - a
    c, d = 1 / tiny, 1 / b
    fraction = d
    for i in range(1, 1000):
        an = -i * (i - a)
        b += 2
        d = an * d + b
        d = tiny if abs(d) < tiny else d
        c = b + an / c
        c = tiny if abs(c) < tiny else c
        d = 1 / d
        fraction *= d * c
        if abs(d * c - 1) < PRECISION:
            break
    return fraction


# -- years -------------------------------------------------------------------------------------

def year_from_cal_bp(bp):
    """Astronomical year of a cal BP year (or array): 1950 - bp, so 1950 cal BP is year 0."""
    return PRESENT_YEAR - bp


def cal_bp_from_year(year):
    """Cal BP of an astronomical year (or array): 1950 - year."""
    return PRESENT_YEAR - year


def year_label(year: int) -> str:
    """An astronomical year written BC/AD with no year zero: '1882 BC', '1 BC', 'AD 1'."""
    return year_text(int(year), "bc", mark_common_era=True)


def cal_bp_label(bp: int) -> str:
    """'725 cal BP'; thousands separated from 10,000 on ('12,650 cal BP')."""
    return f"{_thousands(bp)} cal BP"


def _thousands(number: int) -> str:
    # Four-digit years are written without a separator (as calendar.year_text writes them).
    return f"{number:,}" if abs(number) >= 10_000 else str(number)
