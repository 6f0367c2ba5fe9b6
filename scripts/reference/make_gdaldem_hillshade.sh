#!/usr/bin/env bash
# Reference hill-shade for SurfaceRenderingTest from GDAL's gdaldem (Debian gdal-bin).
# The test grid: 7 x 7 cells of 2 m, depth d(row, col) = 10 + 0.3 col + 0.2 row + 2 exp(-((col-3)^2 + (row-3)^2) / 2)
# (row 0 north). gdaldem works on heights, so the grid is written as heights h = -d (AAIGrid),
# shaded with Horn's slope, azimuth 315 deg, altitude 45 deg, z factor 1; output bytes are
# 1 + 254 x shade (0 is no-data). Interior cells only (rows/cols 1..5) are compared.
# Writes src/test/resources/reference/gdal/hillshade-315-45.asc
set -euo pipefail
cd "$(dirname "$0")/../.."
out=src/test/resources/reference/gdal/hillshade-315-45.asc
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
python3 - "$tmp/heights.asc" <<'PY'
import math, sys
with open(sys.argv[1], "w") as f:
    f.write("ncols 7\nnrows 7\nxllcorner 0\nyllcorner 0\ncellsize 2\n")
    for r in range(7):
        row = []
        for c in range(7):
            d = 10 + 0.3 * c + 0.2 * r + 2 * math.exp(-((c - 3) ** 2 + (r - 3) ** 2) / 2)
            row.append("%.10f" % -d)
        f.write(" ".join(row) + "\n")
PY
gdaldem hillshade -q -az 315 -alt 45 -z 1 -alg Horn "$tmp/heights.asc" "$tmp/shade.tif"
gdal_translate -q -of AAIGrid "$tmp/shade.tif" "$tmp/shade.asc"
{ echo "# gdaldem hillshade -az 315 -alt 45 -z 1 -alg Horn ($(gdalinfo --version)); scripts/reference/make_gdaldem_hillshade.sh"; cat "$tmp/shade.asc"; } > "$out"
echo "wrote $out"
