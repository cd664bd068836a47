# %% [markdown]
# # A tour of timelines from Python
#
# The magistrates of Ostrel, an invented city, from the first river archons around 320 BC to
# the envoys of the first century AD. Their dates are as a register keeps them: `c. 320 BC`,
# `before 300 BC`, `early 3rd century BC`, `280s BC`, `261 BC?`, an empty cell where an end
# was not recorded. Run this file as a script, or open it as a notebook (each `# %%` is a
# cell). It writes its charts into the current folder.

# %%
from pathlib import Path

import pandas as pd

import timelines

HERE = Path(__file__).resolve().parent
people = pd.read_csv(HERE / "ostrel-magistrates.csv", dtype=str, keep_default_na=False)

# %% [markdown]
# ## Every date read into bounds
# `timelines.read` keeps the table and adds, beside each date column, the earliest and latest
# day the cell can mean (ISO dates and fixed day numbers), its precision and qualifiers, and
# the reason when a cell cannot be read.

# %%
dates = timelines.read(people, start="took office", end="left office")
print(dates[["name", "took office", "took office_earliest", "took office_latest",
             "took office_qualifiers"]].to_string(index=False))

# %% [markdown]
# ## A chart, shown inline
# In a notebook the chart displays itself (SVG). Settings return new charts, so variations
# are cheap.

# %%
chart = (timelines.Chart(people, start="took office", end="left office", label="name",
                         group="office")
         .titles("The magistrates of Ostrel", subtitle="An invented city; dates as recorded")
         .style(era="bc"))
print(chart.summary)
try:
    from IPython import get_ipython
    from IPython.display import display
except ImportError:                 # no IPython: nothing to display in
    get_ipython = None
if get_ipython is not None and get_ipython() is not None:
    display(chart)

# %% [markdown]
# ## Saved for print and the web

# %%
chart.save("ostrel.svg")
chart.save("ostrel.png")
chart.style(fringe="hatch").save("ostrel-greyscale.pdf")

# %% [markdown]
# ## Into a figure of your own
# `chart.draw(ax)` draws the lanes into an Axes you already have; `timelines.year_axis(ax)`
# gives any Axes of astronomical years (0 is 1 BC) ticks at round BC years, which
# matplotlib's own axes cannot.

# %%
from matplotlib.figure import Figure  # noqa: E402

from timelines.calendar import fixed_from_decimal_year  # noqa: E402

figure = Figure(figsize=(8, 6), layout="constrained")
lanes, counts = figure.subplots(2, 1, sharex=True, height_ratios=(3, 1))
chart.draw(lanes)
lanes.set_title("Terms of office")
# Possibly in office in each year: from the earliest day a term may have begun to the latest
# it may have ended (an end not recorded could be any time after).
years = list(range(-330, 45))
began = dates["took office_earliest_day"]
ended = dates["left office_latest_day"]
in_office = []
for year in years:
    day = fixed_from_decimal_year(year)
    possible = (began <= day) & ((ended >= day) | ended.isna())
    in_office.append(int(possible.fillna(False).sum()))
counts.step(years, in_office, where="post", color="#555555")
counts.set_ylabel("possibly in office")
timelines.year_axis(counts, era="bc")
figure.savefig("ostrel-figure.png", dpi=100)
