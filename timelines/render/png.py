"""Pixels -> a PNG file (ISO/IEC 15948, section numbers below), with numpy and zlib only.

Written here rather than by Pillow, whose encoder tries all five filters on every row: on
a tall chart that costs more than drawing it. Every row gets the Up filter (the row above
subtracted), which suits charts, where most rows repeat the one above.

The rows may come in bands, one after another (`write_png_rows`): each is filtered,
compressed and written out as IDAT chunks fill before the next is asked for, so a page of any
height is written holding one band of it.
"""
from __future__ import annotations

import contextlib
import itertools
import os
import re
import struct
import zlib
from collections.abc import Iterable

import numpy

# zlib level 3 after the Up filter: on the benchmark chart as small as level 6 (0.1 % apart) in
# half the time; level 1 is 2 % larger and hardly faster.
PNG_COMPRESSION = 3
PNG_BAND_ROWS = 256           # rows filtered and compressed at a time, to stay in the cache
PNG_IDAT_BYTES = 1 << 20      # compressed data per IDAT chunk
PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"                     # 5.2
# 11.3.4.3: a keyword is 1-79 Latin-1 characters without leading or trailing spaces; we
# accept the printable ASCII part of that.
PNG_KEYWORD = re.compile(r"[!-~](?:[ -~]{0,77}[!-~])?")


def write_png(path, pixels: numpy.ndarray, dpi: float, metadata: dict[str, str]) -> None:
    """Write height x width x 3 (RGB) or x 4 (RGBA) 8-bit pixels as a PNG file (a path, or a
    binary file object), with `metadata` as text chunks and `dpi` as the physical size."""
    height, width, _ = pixels.shape
    write_png_rows(path, width, height, [pixels], dpi, metadata)


def write_png_rows(path, width: int, height: int, bands: Iterable[numpy.ndarray], dpi: float,
                   metadata: dict[str, str]) -> None:
    """Write a PNG of `width` x `height` pixels whose rows come as `bands`: 8-bit arrays of
    some rows x width x 3 (RGB) or x 4 (RGBA), top to bottom, `height` rows in all, the first
    band's channels for every band. A band is read in full before the next is asked for, so
    its maker may draw the next into the same buffer. `path` is a path or a binary file."""
    bands = iter(bands)
    first = next(bands, None)
    if first is None or first.ndim != 3 or first.shape[2] not in (3, 4):
        raise ValueError("the rows of a PNG come as bands of rows x width x 3 or 4 pixels")
    channels = first.shape[2]
    colour_type = {3: 2, 4: 6}[channels]      # 11.2.2: truecolour, truecolour with alpha
    header = struct.pack(">IIBBBBB", width, height, 8, colour_type, 0, 0, 0)
    per_metre = int(dpi / 0.0254 + 0.5)       # 11.3.5.3: pixels per metre, unit 1 = metre
    with _binary_file(path) as file:
        file.write(PNG_SIGNATURE)
        file.write(_png_chunk(b"IHDR", header))
        file.writelines(_text_chunk(key, value) for key, value in metadata.items())
        file.write(_png_chunk(b"pHYs", struct.pack(">IIB", per_metre, per_metre, 1)))
        pending = bytearray()                 # compressed data not yet in a full IDAT chunk
        for data in _compressed_rows(itertools.chain([first], bands), width, height, channels):
            pending += data
            if len(pending) >= PNG_IDAT_BYTES:
                whole = len(pending) - len(pending) % PNG_IDAT_BYTES
                file.writelines(_png_chunk(b"IDAT", pending[start:start + PNG_IDAT_BYTES])
                                for start in range(0, whole, PNG_IDAT_BYTES))
                del pending[:whole]
        if pending:
            file.write(_png_chunk(b"IDAT", bytes(pending)))
        file.write(_png_chunk(b"IEND", b""))


@contextlib.contextmanager
def _binary_file(path):
    if isinstance(path, (str, os.PathLike)):
        with open(path, "wb") as file:
            yield file
    else:
        yield path


def _compressed_rows(bands, width: int, height: int, channels: int):
    """The zlib stream of the filtered rows (9.2: a filter-type byte, 2 = Up, before each), in
    pieces as the compressor gives them out."""
    compressor = zlib.compressobj(PNG_COMPRESSION)
    # rows[0] holds the row above the piece (zeros above row 0, 9.2), across bands too. A
    # piece comes in one channel at a time: numpy copies 3 bytes of every 4 several times
    # slower in one go. zlib takes in all of a piece before compress() returns, so the
    # buffers serve every piece.
    rows = numpy.zeros((PNG_BAND_ROWS + 1, width, channels), dtype=numpy.uint8)
    flat = rows.reshape(PNG_BAND_ROWS + 1, -1)
    filtered = numpy.empty((PNG_BAND_ROWS, flat.shape[1] + 1), dtype=numpy.uint8)
    filtered[:, 0] = 2
    done = 0
    for band in bands:
        if band.ndim != 3 or band.shape[1:] != (width, channels):
            raise ValueError(f"a band of {band.shape} pixels in a PNG of {width} x {height} "
                             f"x {channels}")
        if done + len(band) > height:
            raise ValueError(f"more than the {height} rows of the PNG")
        for start in range(0, len(band), PNG_BAND_ROWS):
            piece = band[start:start + PNG_BAND_ROWS]
            count = len(piece)
            for channel in range(channels):
                rows[1:count + 1, :, channel] = piece[..., channel]
            numpy.subtract(flat[1:count + 1], flat[:count], out=filtered[:count, 1:])  # mod 256
            yield compressor.compress(filtered[:count])
            rows[0] = rows[count]
        done += len(band)
    if done != height:
        raise ValueError(f"{done} rows for a PNG of {height}")
    yield compressor.flush()


def _png_chunk(kind: bytes, data: bytes) -> bytes:
    # 5.3: length, type, data, and the CRC-32 of type and data
    crc = zlib.crc32(data, zlib.crc32(kind))
    return struct.pack(">I", len(data)) + kind + data + struct.pack(">I", crc)


def _text_chunk(key: str, value: str) -> bytes:
    """tEXt (11.3.4.3) for Latin-1 text, else iTXt (11.3.4.5): uncompressed UTF-8 with empty
    language tag and translated keyword."""
    keyword = key.encode("latin-1")
    try:
        return _png_chunk(b"tEXt", keyword + b"\0" + value.encode("latin-1"))
    except UnicodeEncodeError:
        return _png_chunk(b"iTXt", keyword + b"\0\0\0\0\0" + value.encode("utf-8"))
