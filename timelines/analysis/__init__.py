"""Analysis: the questions a chronology raises, answered from the bounds of its dates.

Pure functions over records (under the model, not under rendering), returning plain values
and pandas DataFrames for the command line and the API:

- `relations`: Allen's interval relations between two records, certain / possible
  (Allen 1983), and who could have been contemporaries;
- `activity`: how many were active per block of time, aoristic for events and by overlap
  for spans, with a Monte Carlo envelope (Crema 2012);
- `constraints`: statements between records as a simple temporal network (Dechter, Meiri &
  Pearl 1991): bounds tightened, contradictions named; `network` holds the network itself and
  its solvers (Floyd–Warshall, Bellman–Ford, the shortest negative cycle).
"""
