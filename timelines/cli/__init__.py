"""Command line: `timelines render | parse | check | lanes`, a thin layer over the API.

- `parser`: the argparse parser, every option of every command;
- `config`: settings from a TOML file, and where each effective setting came from;
- `commands`: each command run, and the one place that reports errors.
"""
from .commands import main

__all__ = ["main"]
