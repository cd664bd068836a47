"""A sign of life on long runs: one line on stderr naming the step and the time it has taken.

A million rows take minutes to read, lay out and draw; a silent terminal for that long looks
like a hang. The line appears only when the run has taken `AFTER` seconds, only when stderr is
a terminal (never in a pipe, a file or a test), never with `--quiet`, and it is wiped when the
step ends, so nothing of it stays in the output.
"""
from __future__ import annotations

import contextlib
import sys
import threading
import time

AFTER = 2.0          # seconds of silence before the line appears
EVERY = 0.25         # seconds between updates
BAR = 20             # characters of the bar


class Progress:
    """`with progress.step("reading register.csv"):` around each long step of a run."""

    def __init__(self, steps: int, stream=None, quiet: bool = False):
        self.stream = stream or sys.stderr
        self.steps, self.done = steps, 0
        self.started = time.monotonic()
        isatty = getattr(self.stream, "isatty", None)
        self.shown = not quiet and isatty is not None and isatty()
        self._drawn = False

    @contextlib.contextmanager
    def step(self, name: str):
        if not self.shown:
            yield
            return
        finished = threading.Event()
        updater = threading.Thread(target=self._update, args=(name, finished), daemon=True)
        updater.start()
        try:
            yield
        finally:
            finished.set()
            updater.join()
            self.done += 1
            self._wipe()

    def line(self, name: str) -> str:
        filled = round(BAR * self.done / self.steps)
        seconds = time.monotonic() - self.started
        return (f"timelines: [{'#' * filled}{'-' * (BAR - filled)}] {name} "
                f"(step {self.done + 1} of {self.steps}, {seconds:.0f} s)")

    def _update(self, name: str, finished: threading.Event) -> None:
        while not finished.wait(EVERY):
            if time.monotonic() - self.started >= AFTER:
                self.stream.write("\r\x1b[K" + self.line(name))   # ECMA-48: erase the line
                self.stream.flush()
                self._drawn = True

    def _wipe(self) -> None:
        if self._drawn:
            self.stream.write("\r\x1b[K")
            self.stream.flush()
            self._drawn = False
