#!/usr/bin/env python3
"""Reads a PNG (8-bit greyscale, RGB or RGBA, not interlaced; standard library only) and checks what it shows.

    report_png_check.py picture.png blank-test
        passes when the picture is not blank: at least 2 % of its pixels differ from the most common colour and
        it has at least 16 distinct colours.
    report_png_check.py picture.png count R G B TOLERANCE MINIMUM
        passes when at least MINIMUM pixels are within TOLERANCE (per channel, 0-255) of the colour R G B.
Prints what it found; exit code 0 on pass, 1 on failure."""
import collections
import struct
import sys
import zlib


def read_png(path):
    data = open(path, 'rb').read()
    if data[:8] != b'\x89PNG\r\n\x1a\n':
        raise SystemExit('%s is not a PNG file' % path)
    at, idat, header = 8, b'', None
    while at < len(data):
        length, kind = struct.unpack('>I4s', data[at:at + 8])
        body = data[at + 8:at + 8 + length]
        if kind == b'IHDR':
            header = struct.unpack('>IIBBBBB', body)
        elif kind == b'IDAT':
            idat += body
        at += 12 + length
    width, height, depth, colour, _, _, interlace = header
    channels = {0: 1, 2: 3, 4: 2, 6: 4}.get(colour)
    if depth != 8 or channels is None or interlace:
        raise SystemExit('%s: only 8-bit, non-interlaced grey/RGB/RGBA PNG files are supported' % path)
    raw = zlib.decompress(idat)
    stride = width * channels
    rows, previous = [], bytearray(stride)
    for y in range(height):
        kind = raw[y * (stride + 1)]
        line = bytearray(raw[y * (stride + 1) + 1:(y + 1) * (stride + 1)])
        unfilter(kind, line, previous, channels)
        rows.append(line)
        previous = line
    pixels = []
    for line in rows:
        for x in range(width):
            p = line[x * channels:(x + 1) * channels]
            pixels.append((p[0], p[0], p[0]) if channels <= 2 else (p[0], p[1], p[2]))
    return width, height, pixels


def unfilter(kind, line, previous, bpp):
    """PNG filter types 0-4 (PNG specification sec. 9), undone in place."""
    for i in range(len(line)):
        left = line[i - bpp] if i >= bpp else 0
        up = previous[i]
        corner = previous[i - bpp] if i >= bpp else 0
        if kind == 1:
            line[i] = (line[i] + left) & 0xff
        elif kind == 2:
            line[i] = (line[i] + up) & 0xff
        elif kind == 3:
            line[i] = (line[i] + (left + up) // 2) & 0xff
        elif kind == 4:
            p = left + up - corner
            pa, pb, pc = abs(p - left), abs(p - up), abs(p - corner)
            predictor = left if pa <= pb and pa <= pc else (up if pb <= pc else corner)
            line[i] = (line[i] + predictor) & 0xff


def main():
    if len(sys.argv) < 3:
        raise SystemExit(__doc__)
    width, height, pixels = read_png(sys.argv[1])
    counts = collections.Counter(pixels)
    background, most = counts.most_common(1)[0]
    share = 1.0 - most / len(pixels)
    print('%s: %d x %d pixels, %d colours, %.1f %% differ from the background %r'
          % (sys.argv[1], width, height, len(counts), 100 * share, background))
    if sys.argv[2] == 'blank-test':
        return 0 if share >= 0.02 and len(counts) >= 16 else 1
    if sys.argv[2] == 'count' and len(sys.argv) == 8:
        r, g, b, tolerance, minimum = (int(v) for v in sys.argv[3:8])
        n = sum(c for (pr, pg, pb), c in counts.items()
                if abs(pr - r) <= tolerance and abs(pg - g) <= tolerance and abs(pb - b) <= tolerance)
        print('%d pixels within %d of (%d, %d, %d); at least %d expected' % (n, tolerance, r, g, b, minimum))
        return 0 if n >= minimum else 1
    raise SystemExit(__doc__)


if __name__ == '__main__':
    sys.exit(main())
