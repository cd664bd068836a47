"""The pipeline: the whole job in named steps, and the `Chart` object that runs them.

- `options`: `ChartOptions`, every setting as the pipeline takes them;
- `reading`: the read and parse steps, and what the settings do to the records before layout;
- `pipeline`: check -> layout -> scene -> draw as functions over a `ChartOptions` (`render`,
  `arrange`, `build_scene`, ...);
- `spec`: `Chart`, the immutable chart spec Python users hold and the command line runs.
"""
from .options import ChartOptions, Privacy
from .pipeline import (
    Arranged, RunResult, arrange, arrange_read, arranged_page, arranged_scene, build_scene,
    lay_out, output_path, parse_window, placement_scene, render,
)
from .reading import ReadTable, read_bands, read_records, read_source
from .spec import Chart

__all__ = ["Arranged", "Chart", "ChartOptions", "Privacy", "ReadTable", "RunResult", "arrange",
           "arrange_read", "arranged_page", "arranged_scene", "build_scene", "lay_out",
           "output_path", "parse_window", "placement_scene", "read_bands", "read_records",
           "read_source", "render"]
