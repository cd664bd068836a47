"""The pipeline: the whole job in named steps, and the `Chart` object that runs them.

- `pipeline`: read -> parse -> check -> layout -> scene -> draw as functions over a
  `ChartOptions` (`render`, `arrange`, `build_scene`, ...);
- `spec`: `Chart`, the immutable chart spec Python users hold and the command line runs.
"""
from .pipeline import (
    Arranged, ChartOptions, Privacy, ReadTable, RunResult, arrange, arrange_read, arranged_page,
    arranged_scene, build_scene, lay_out, output_path, parse_window, placement_scene, read_bands,
    read_records, read_source, render,
)
from .spec import Chart

__all__ = ["Arranged", "Chart", "ChartOptions", "Privacy", "ReadTable", "RunResult", "arrange",
           "arrange_read", "arranged_page", "arranged_scene", "build_scene", "lay_out",
           "output_path", "parse_window", "placement_scene", "read_bands", "read_records",
           "read_source", "render"]
