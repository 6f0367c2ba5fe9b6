#!/usr/bin/env bash
# Regenerates the GMT block-statistics reference used by GridderGmtReferenceTest.
# Needs Debian's gmt (GMT 6) and python3. Output (committed) in src/test/resources/reference/gmt/:
#   points.xyz        input soundings x y z (from gmt_block_points.py, fixed seed)
#   blockmean.xyz     cell centre x y, mean z          (gmt blockmean  -r -C)
#   blockmedian.xyz   cell centre x y, median z        (gmt blockmedian -r -C)
#   blockcount.xyz    cell centre x y, count            (gmt blockmean  -r -C -Sn)
#   blockmean_extended.xyz  x y mean s low high         (gmt blockmean  -r -C -E; s = sample
#                     standard deviation, n - 1 denominator; low = least z, the shoalest depth)
# Region 0/100/0/80, 5 m cells, pixel registration (a value belongs to the cell it falls in).
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
out="$here/../../src/test/resources/reference/gmt"
mkdir -p "$out"
out="$(cd "$out" && pwd)"
# run GMT in a scratch folder so its gmt.history does not land in the repository
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
cd "$work"
R=-R0/100/0/80
I=-I5
fmt=--FORMAT_FLOAT_OUT=%.17g
python3 "$here/gmt_block_points.py" > "$out/points.xyz"
gmt blockmean   "$out/points.xyz" $R $I -r -C $fmt > "$out/blockmean.xyz"
gmt blockmedian "$out/points.xyz" $R $I -r -C $fmt > "$out/blockmedian.xyz"
gmt blockmean   "$out/points.xyz" $R $I -r -C -Sn $fmt > "$out/blockcount.xyz"
gmt blockmean   "$out/points.xyz" $R $I -r -C -E $fmt > "$out/blockmean_extended.xyz"
gmt --version > "$out/gmt-version.txt"
wc -l "$out"/*.xyz
