#!/usr/bin/python3
"""Reference table for MapProjection with the optional EPSG data set (build profile -Pepsg).

Uses Debian's python3-pyproj (pyproj 3.4.1, PROJ 9.1.1). Run from the repository root:

    /usr/bin/python3 scripts/reference/make_pyproj_epsg_table.py > src/test/resources/reference/pyproj-epsg.csv

Codes chosen to exercise what the EPSG data set adds: a northing-first axis order (NZTM 2193),
another polar stereographic (3031), a spherical-development Mercator (3857), and a datum shift
(British National Grid 27700, OSGB 1936; the operation PROJ used is written in the comment).
"""
import sys
from pyproj import CRS, Transformer, __version__ as pyproj_version, proj_version_str

points = {
    2193: [(-36.85, 174.76), (-41.29, 174.78), (-45.87, 170.50), (-43.53, 172.64)],
    3031: [(-70.0, 0.0), (-77.85, 166.67), (-85.0, -120.0), (-65.2, 64.0)],
    3857: [(0.0, 0.0), (51.5, -0.12), (-33.9, 18.4), (60.0, 179.0)],
    27700: [(52.658007833, 1.716073973), (50.1, -5.5), (57.15, -2.1), (54.0, -3.0)],
}
out = sys.stdout
out.write("# WGS84 to projected CRS through PROJ %s / pyproj %s; scripts/reference/make_pyproj_epsg_table.py\n"
          % (proj_version_str, pyproj_version))
table = []
for code, pts in points.items():
    t = Transformer.from_crs(CRS.from_epsg(4326), CRS.from_epsg(code), always_xy=True)
    for la, lo in pts:
        e, n = t.transform(lo, la)          # always_xy: lon, lat in; easting, northing out
        table.append((code, la, lo, e, n))
    # after a transform, PROJ reports the operation it actually used
    out.write("# EPSG:%d %s: %s\n" % (code, CRS.from_epsg(code).name, t.description))
out.write("code,lat,lon,easting,northing\n")
for code, la, lo, e, n in table:
    out.write("EPSG:%d,%.9f,%.9f,%.6f,%.6f\n" % (code, la, lo, e, n))
