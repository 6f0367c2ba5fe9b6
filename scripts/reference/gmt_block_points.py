#!/usr/bin/env python3
"""Deterministic random soundings for the GMT blockmean/blockmedian reference (fixed seed).

Writes x y z lines (metres) inside the region 0/100/0/80 used by make_gmt_block_reference.sh.
Coordinates are kept off the 5 m cell boundaries so that the cell a point falls in does not
depend on how a boundary point is assigned. Python's random.Random(seed) (Mersenne Twister) is
reproducible across Python 3 versions for random().
"""
import math
import random
import sys

rng = random.Random(20261202)
out = sys.stdout
n = 0
while n < 3000:
    x = round(rng.random() * 100.0, 3)
    y = round(rng.random() * 80.0, 3)
    if x % 5.0 == 0.0 or y % 5.0 == 0.0 or x <= 0.0 or y <= 0.0 or x >= 100.0 or y >= 80.0:
        continue
    # a sloping seabed with a bump, plus noise; a few cells get coarse duplicates (even counts)
    z = 20.0 + 0.1 * x + 3.0 * math.exp(-((x - 50) ** 2 + (y - 40) ** 2) / 400.0) + rng.gauss(0.0, 0.3)
    if x > 90.0 and y > 70.0:
        continue  # leave one corner of the region empty
    out.write(f"{x:.3f} {y:.3f} {z:.3f}\n")
    n += 1
