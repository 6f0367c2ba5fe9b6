#!/usr/bin/env python3
"""Writes the bad-input catalogue's files under src/test/resources/bad-inputs/ (issue 8).

Run from the repository root: python3 scripts/testdata/make_bad_inputs.py
The good base survey (good/) is invented: two 60-ping single-beam lines in about 12-14 m of water,
a cast to 25 m, a gauge record and a vessel. Each bad file breaks one thing; catalogue.csv (kept
by hand, not generated) says what Leadline must answer. Very large files (a 10 MB line) are made
by the test itself so that the repository stays small.
"""
import gzip, math, os, random, zlib

OUT = os.path.join("src", "test", "resources", "bad-inputs")
os.makedirs(os.path.join(OUT, "good"), exist_ok=True)

def w(name, text, newline="\n", bom=False):
    data = text.replace("\n", newline).encode("utf-8")
    if bom:
        data = b"\xef\xbb\xbf" + data
    with open(os.path.join(OUT, name), "wb") as f:
        f.write(data)

def wb(name, data):
    with open(os.path.join(OUT, name), "wb") as f:
        f.write(data)

def junk(seed, n=4096):
    """n bytes of binary garbage, the same on every run."""
    rnd = random.Random(seed)
    return bytes(rnd.randrange(256) for _ in range(n))

def t(sec):
    m, s = divmod(sec, 60)
    return "2026-05-14T09:%02d:%02d.000Z" % (m, s)

# ---- good base survey --------------------------------------------------------------------------
rows = []
for line, lon0 in (("L1", 9.9000), ("L2", 9.9004)):
    for k in range(60):
        sec = k if line == "L1" else 60 + k
        lat = 53.5500 + k * 1.0e-5
        depth = 12.0 + 0.03 * k + (0.5 if line == "L2" else 0.0)
        twtt = 2 * depth / 1495.0
        rows.append((t(sec), "%.7f" % lat, "%.7f" % lon0, "%.6f" % twtt, line))
HEADER = "time,lat,lon,twtt,line\n"
def pings(rs, header=HEADER, sep=","):
    return header.replace(",", sep) + "".join(sep.join(r) + "\n" for r in rs)
w("good/pings.csv", pings(rows))

cast = "# time: 2026-05-14T08:55:00Z\n# lat: 53.5503\n# lon: 9.9002\ndepth,temperature,salinity\n"
for z in range(0, 26):
    cast += "%.1f,%.3f,%.3f\n" % (z, 12.0 - 0.05 * z, 33.0 + 0.04 * z)
w("good/cast.csv", cast)

tide = "time,level\n" + "".join("2026-05-14T%02d:%02d:00Z,%.3f\n" % (8 + (55 + m) // 60, (55 + m) % 60, 1.20 + 0.01 * m)
                                 for m in range(0, 12))
w("good/tide.csv", tide)

vessel = """name: Test launch
draft_m: 0.5
sounder:
  set_speed_m_s: 1495
  beam_width_deg: 8
"""
w("good/vessel.yaml", vessel)

# ---- ping tables -------------------------------------------------------------------------------
w("pings-empty.csv", "")
w("pings-header-only.csv", HEADER)
w("pings-truncated.csv", pings(rows[:40]) + "2026-05-14T09:00:40.000Z,53.5504")  # cut mid-row, no line end
w("pings-semicolons.csv", pings(rows, sep=";"))
w("pings-tabs.csv", pings(rows, sep="\t"))
w("pings-missing-twtt.csv", "time,lat,lon,line\n" + "".join(",".join((r[0], r[1], r[2], r[4])) + "\n" for r in rows))
w("pings-missing-lon.csv", "time,lat,twtt,line\n" + "".join(",".join((r[0], r[1], r[3], r[4])) + "\n" for r in rows))
w("pings-depth-ft.csv", "time,lat,lon,depth_ft,line\n"
  + "".join(",".join((r[0], r[1], r[2], "%.2f" % (float(r[3]) * 1495 / 2 / 0.3048), r[4])) + "\n" for r in rows))
deep = [list(r) for r in rows]
deep[17][3] = "21.4"  # a 21 s two-way time: 16 km of water
w("pings-too-deep.csv", pings(deep))
nan = [list(r) for r in rows]; nan[9][3] = "NaN"
w("pings-nan.csv", pings(nan))
inf = [list(r) for r in rows]; inf[4][1] = "Infinity"
w("pings-infinity.csv", pings(inf))
back = [list(r) for r in rows]; back[30][0], back[31][0] = back[31][0], back[30][0]
w("pings-time-backwards.csv", pings(back))
lat = [list(r) for r in rows]; lat[22][1] = "95.5500000"
w("pings-latitude-95.csv", pings(lat))
w("pings-bom.csv", pings(rows), bom=True)
w("pings-crlf.csv", pings(rows), newline="\r\n")
w("pings-bom-crlf.csv", pings(rows), newline="\r\n", bom=True)
heave = HEADER.replace("line", "heave,line")
w("pings-heave-10m.csv", heave + "".join(",".join((r[0], r[1], r[2], r[3], "10.2" if i in (50, 51) else "0.1", r[4])) + "\n"
                                         for i, r in enumerate(rows)))
wb("pings-gzip.csv", gzip.compress(pings(rows).encode(), mtime=0))
wb("pings-binary.csv", junk(8))
w("pings-unclosed-quote.csv", pings(rows[:10]) + '2026-05-14T09:00:10.000Z,"53.5501,9.9000,0.016,L1\n' + pings(rows[11:20], header=""))

lat1 = pings(rows[:12]).encode("utf-8").replace(b",L1\n", b",L\xfcne\n")  # Latin-1 u-umlaut from line 2 on
wb("pings-latin1.csv", lat1)
w("pings-depth-too-deep.csv", "time,lat,lon,depth,line\n"
  + "".join(",".join((r[0], r[1], r[2], "%.2f" % (39000.0 if i == 3 else float(r[3]) * 1495 / 2), r[4])) + "\n"
            for i, r in enumerate(rows)))

# ---- casts -------------------------------------------------------------------------------------
head = "# time: 2026-05-14T08:55:00Z\n# lat: 53.5503\n# lon: 9.9002\n"
w("cast-empty.csv", "")
w("cast-conductivity-as-salinity.csv", head + "depth,temperature,salinity\n"
  + "".join("%.1f,%.3f,%.3f\n" % (z, 12.0 - 0.05 * z, 45.0 + 0.2 * z) for z in range(0, 26)))
w("cast-shallow.csv", head + "depth,temperature,salinity\n"
  + "".join("%.1f,%.3f,%.3f\n" % (z, 12.0 - 0.05 * z, 33.0 + 0.04 * z) for z in range(0, 6)))
w("cast-warm.csv", head + "depth,temperature,salinity\n"
  + "".join("%.1f,%.3f,%.3f\n" % (z, 19.0 - 0.05 * z, 33.0 + 0.04 * z) for z in range(0, 26)))
w("cast-semicolons.csv", head + "depth;temperature;salinity\n"
  + "".join("%.1f;%.3f;%.3f\n" % (z, 12.0 - 0.05 * z, 33.0 + 0.04 * z) for z in range(0, 26)))
w("cast-infinity.csv", head + "depth,temperature,salinity\n"
  + "".join("%.1f,%s,%.3f\n" % (z, "-Infinity" if z == 7 else "%.3f" % (12.0 - 0.05 * z), 33.0) for z in range(0, 26)))
w("cast-depth-ft.csv", head + "depth_ft,temperature,salinity\n"
  + "".join("%.1f,%.3f,%.3f\n" % (z / 0.3048, 12.0 - 0.05 * z, 33.0) for z in range(0, 26)))
w("cast-latitude-91.csv", head.replace("53.5503", "91.5") + "depth,temperature,salinity\n0,12,33\n10,11,33\n")
w("cast-truncated.csv", head + "depth,temperature,salinity\n0.0,12.000,33.000\n1.0,11.9")
wb("cast-binary.csv", junk(9))

# ---- water levels ------------------------------------------------------------------------------
tl = tide.splitlines()
w("tide-repeated-time.csv", "\n".join(tl[:6] + [tl[5].replace("1.250", "1.251")] + tl[6:]) + "\n")
w("tide-out-of-order.csv", "\n".join(tl[:4] + [tl[5], tl[4]] + tl[6:]) + "\n")
w("tide-missing-level.csv", "time,height_ft\n" + "\n".join(l for l in tl[1:]) + "\n")
w("tide-nan.csv", "\n".join(tl[:3] + [tl[3].split(",")[0] + ",nan"] + tl[4:]) + "\n")
w("tide-semicolons.csv", "\n".join(l.replace(",", ";") for l in tl) + "\n")
w("tide-bom-crlf.csv", tide, newline="\r\n", bom=True)

# ---- NMEA --------------------------------------------------------------------------------------
def s(body):
    c = 0
    for ch in body:
        c ^= ord(ch)
    return "$%s*%02X" % (body, c)
def nmea_log(bad=()):
    out = [s("GPZDA,090000.00,14,05,2026,00,00")]
    for k in range(120):
        hh, mm, ss = 9, k // 60, k % 60
        latm = 33.0 + k * 0.0006
        out.append(s("GPGGA,%02d%02d%02d.00,5333.%04d,N,00954.0000,E,1,10,0.9,5.0,M,40.0,M,," % (hh, mm, ss, int(latm * 100) % 10000)))
        d = 12.0 + 0.03 * (k % 60)
        out.append(s("SDDBT,%.1f,f,%.2f,M,%.1f,F" % (d / 0.3048, d, d / 1.8288)))
    for i in bad:
        out[i] = out[i][:-2] + ("00" if out[i][-2:] != "00" else "01")
    return "\n".join(out) + "\n"
w("nmea-bad-checksums.nmea", nmea_log(bad=(5, 6, 41)))
wb("nmea-binary.nmea", junk(10))
w("nmea-empty.nmea", "")
w("nmea-bom-crlf.nmea", nmea_log(), newline="\r\n", bom=True)

# ---- vessel ------------------------------------------------------------------------------------
w("vessel-empty.yaml", "")
w("vessel-tab-indent.yaml", "draft_m: 0.5\nsounder:\n\tset_speed_m_s: 1495\n")
w("vessel-draft-ft.yaml", "draft_ft: 1.6\n")
w("vessel-truncated.yaml", "draft_m: 0.5\nsounder:\n  set_speed_m_s: [1495\n")
w("vessel-nan.yaml", "draft_m: .nan\n")
wb("vessel-binary.yaml", junk(11))

# ---- projects (path safety) --------------------------------------------------------------------
w("project-dotdot.yaml", "inputs:\n  soundings: [good/pings.csv, ../bad-inputs/good/pings.csv]\n")
w("project-absolute.yaml", "inputs:\n  soundings: good/pings.csv\n  vessel: /etc/hostname\n")
w("project-missing-file.yaml", "inputs:\n  soundings: good/pings.csv\n  casts: [good/cast-that-is-not-there.csv]\n")
w("project-good.yaml", "inputs:\n  soundings: good/pings.csv\n  casts: good/cast.csv\n  tide: good/tide.csv\n"
  "  vessel: good/vessel.yaml\nsettings:\n  cell_m: 2\n")

# ---- edit journal ------------------------------------------------------------------------------
HEAD = "# leadline edit journal, format 1"
def jline(seq, when, body_tail):
    body = "%d\t%s\tmaria\treject\t%s" % (seq, when, body_tail)
    return body + "\t%08x" % (zlib.crc32(body.encode()) & 0xFFFFFFFF)
j1 = jline(1, "2026-05-14T10:00:00Z", "3..5\t\t\t\t\tfish")
j2 = jline(2, "2026-05-14T10:01:00Z", "8\t\t\t\t\tspike")
j3 = jline(3, "2026-05-14T10:02:00Z", "11\t\t\t\t\tspike")
w("journal-good.journal", "\n".join([HEAD, j1, j2, j3]) + "\n")
w("journal-bad-crc.journal", "\n".join([HEAD, j1, j2[:-8] + "deadbeef", j3]) + "\n")
w("journal-torn-last-line.journal", "\n".join([HEAD, j1, j2, j3[:20]]))
w("journal-no-header.journal", "\n".join([j1, j2]) + "\n")

# ---- tide zones ------------------------------------------------------------------------------
w("tidezones-truncated.geojson", '{"type": "FeatureCollection", "features": [{"type": "Feature", "properties": {"name": "A"')
wb("tidezones-binary.geojson", junk(14))

# ---- bar check ---------------------------------------------------------------------------------
w("barcheck-semicolons.csv", "bar_depth;reading\n2;2.05\n4;4.08\n6;6.12\n")
w("barcheck-nan.csv", "bar_depth,reading\n2,2.05\n4,NaN\n6,6.12\n")
w("barcheck-empty.csv", "")
wb("barcheck-binary.csv", junk(12))
w("barcheck-bom-crlf.csv", "# set_speed: 1500\nbar_depth,reading\n2,2.05\n4,4.08\n6,6.12\n", newline="\r\n", bom=True)

# ---- navigation / attitude ---------------------------------------------------------------------
w("navigation-repeated-time.csv", "time,lat,lon\n" + "".join("%s,%s,%s\n" % (t(k if k != 7 else 6), "53.55%03d" % k, "9.9")
                                                            for k in range(0, 20)))
w("attitude-heave-10m.csv", "time,heave,roll,pitch\n" + "".join("%s,%s,0.5,0.2\n" % (t(k), "-10.5" if k == 33 else "0.05")
                                                            for k in range(0, 121)))
print("written to", OUT)
