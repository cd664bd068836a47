"""Fades (GradientRects) painted straight onto a matplotlib renderer, many at once.

Raster backends get each ramp at device resolution, partly covered edge pixels faded in as an
antialiased SVG rect edge is; vector backends (PDF) one row of samples scaled onto the rect.
The arithmetic for all fades of a run is done in one pass of numpy (`_device_fades`), element
by element the same as one fade at a time (tests/test_render_mpl.py checks it).
"""
from __future__ import annotations

from typing import TYPE_CHECKING

import functools

import numpy

from timelines.scene.primitives import GradientRect

if TYPE_CHECKING:                      # the page a painter draws on
    from timelines.render.mpl import _Page

# A fade in a PDF is one row of 256 samples: as fine as 8-bit alpha resolves, so no steps show.
GRADIENT_SAMPLES = 256


def paint_fades(fades: list[GradientRect], renderer, affine, page: _Page):
    """Raster backends get each ramp at device resolution, with partly covered edge pixels
    faded in as an antialiased SVG rect edge is; vector backends (PDF) get one row of samples
    scaled onto the rect. Either way a finished image goes to the renderer, not through
    AxesImage's general resampler (ten times the cost)."""
    from matplotlib.colors import to_rgb
    from matplotlib.transforms import Affine2D

    corners = [point for fade in fades
               for point in ((fade.x, fade.y + fade.height), (fade.x + fade.width, fade.y))]
    boxes = affine.transform(corners).reshape(-1, 4)   # left, bottom, right, top; y up
    gc = renderer.new_gc()
    gc.set_clip_rectangle(page.axes.bbox)
    if renderer.option_scale_image():
        for fade, (left, bottom, right, top) in zip(fades, boxes):
            image = _sample_row(to_rgb(fade.fill), fade.opacity_left, fade.opacity_right,
                                fade.stops)
            renderer.draw_image(gc, left, bottom, image, Affine2D().scale(right - left,
                                                                          top - bottom))
            yield
    else:
        for placed in _device_fades(fades, boxes, renderer.width, renderer.height):
            if placed is not None:
                renderer.draw_image(gc, *placed)
            yield
    gc.restore()


def _device_fades(fades: list[GradientRect], boxes, canvas_width: float, canvas_height: float):
    """(column, row, RGBA image) for each fade, covering its box (device px, y up) on the
    visible canvas, or None if it misses the canvas. All fades are worked out in one pass of
    array arithmetic, element by element the same operations as one fade at a time."""
    left, bottom, right, top = boxes.T
    columns = _Ranges(numpy.maximum(numpy.floor(left), 0),
                      numpy.minimum(numpy.ceil(right), canvas_width))
    rows = _Ranges(numpy.maximum(numpy.floor(bottom), 0),
                   numpy.minimum(numpy.ceil(top), canvas_height))
    low, high = left[columns.owner], right[columns.owner]
    centres = (numpy.clip(columns.values + 0.5, low, high) - low) / (high - low)
    opacity_left = numpy.array([fade.opacity_left for fade in fades])[columns.owner]
    opacity_right = numpy.array([fade.opacity_right for fade in fades])[columns.owner]
    ramp = _opacity_ramp(opacity_left, opacity_right, centres)
    for index in (i for i, fade in enumerate(fades) if fade.stops):      # through many stops
        mine = columns.owner == index
        ramp[mine] = _through_stops(fades[index].stops, centres[mine])
    across = ramp * _coverage(columns.values, low, high)
    down = _coverage(rows.values, bottom[rows.owner], top[rows.owner])
    images = _fade_images(fades, columns, rows, across, down)
    return [None if image is None else (int(columns.first[i]), int(rows.first[i]), image)
            for i, image in enumerate(images)]


def _fade_images(fades: list[GradientRect], columns: _Ranges, rows: _Ranges, across, down):
    """Each fade's RGBA image, or None if it has no pixels: its colour, and as alpha the
    product of its column's value `across` and its row's `down`. Rows count up from the
    fade's lowest device row (y grows upward), and Agg's draw_image puts an image's row 0 at
    its lowest row too: so image row k takes row k's coverage."""
    from matplotlib.colors import to_rgb

    sizes = rows.counts * columns.counts
    pixels = _Ranges(numpy.zeros(len(fades)), sizes)      # each fade's pixels 0, 1, ...
    owner = pixels.owner
    row, column = numpy.divmod(pixels.values.astype(numpy.intp), columns.counts[owner])
    alpha = down[rows.starts[owner] + row] * across[columns.starts[owner] + column]
    images = numpy.empty((len(alpha), 4), dtype=numpy.uint8)
    images[:, :3] = numpy.round(numpy.array([to_rgb(fade.fill) for fade in fades]) * 255)[owner]
    images[:, 3] = numpy.round(alpha * 255)
    return [None if size == 0 else
            images[start:start + size].reshape(rows.counts[i], columns.counts[i], 4)
            for i, (start, size) in enumerate(zip(pixels.starts, sizes))]


class _Ranges:
    """The integers first, first + 1, ... below stop for many (first, stop) pairs, end to end
    in `values`, with each one's `owner` (its pair), and each pair's `counts` and `starts`
    (where its values begin)."""

    def __init__(self, first, stop):
        self.first = first
        self.counts = numpy.maximum(numpy.ceil(stop - first), 0).astype(numpy.intp)
        self.starts = numpy.cumsum(self.counts) - self.counts
        self.owner = numpy.repeat(numpy.arange(len(self.counts)), self.counts)
        self.values = first[self.owner] + (numpy.arange(len(self.owner)) - self.starts[self.owner])


@functools.lru_cache(maxsize=4096)
def _sample_row(rgb: tuple[float, float, float], left: float, right: float,
                stops: tuple[float, ...] = ()):
    """One row of samples for a vector backend. The same array object for the same fade, so
    the PDF writer (which keys images by identity) stores each distinct fade once."""
    centres = (numpy.arange(GRADIENT_SAMPLES) + 0.5) / GRADIENT_SAMPLES
    alpha = (_through_stops(stops, centres) if stops
             else _opacity_ramp(left, right, centres))[None]
    image = numpy.empty((*alpha.shape, 4), dtype=numpy.uint8)
    image[..., :3] = numpy.round(numpy.asarray(rgb) * 255)
    image[..., 3] = numpy.round(alpha * 255)
    image.flags.writeable = False
    return image


def _opacity_ramp(left, right, position):
    """Opacity at `position` (0 at the left edge .. 1 at the right edge)."""
    return numpy.clip(left + (right - left) * position, 0.0, 1.0)


def _through_stops(stops: tuple[float, ...], position):
    """Opacity at `position` (0 .. 1) through `stops` spaced evenly from 0 to 1."""
    return numpy.clip(numpy.interp(position, numpy.linspace(0.0, 1.0, len(stops)), stops),
                      0.0, 1.0)


def _coverage(pixels, low, high):
    """The part of each device pixel [p, p+1) that lies inside [low, high]."""
    return numpy.clip(numpy.minimum(pixels + 1, high) - numpy.maximum(pixels, low), 0.0, 1.0)
