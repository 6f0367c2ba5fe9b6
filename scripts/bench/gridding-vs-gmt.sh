#!/usr/bin/env bash
# Median gridding of N XYZ points (default 10 million), Leadline against GMT blockmedian, on the same
# file, same 1 m pixel-registered cells, both reading the file and writing the cell medians
# (docs/performance.md). Prints each tool's median wall time over RUNS runs and the ratio.
#
# usage: scripts/bench/gridding-vs-gmt.sh [N] [RUNS]          (defaults 10000000 3)
# env:   BENCH_DIR (default /tmp/leadline-bench)
# Needs: Debian's gmt; mvn -B -q package -DskipTests; target/cp.txt (see process-10m.sh).
set -euo pipefail
cd "$(dirname "$0")/../.."
N=${1:-10000000}
RUNS=${2:-3}
DIR=${BENCH_DIR:-/tmp/leadline-bench}
mkdir -p "$DIR"
[ -f target/cp.txt ] || mvn -B -q -o dependency:build-classpath -Dmdep.outputFile=target/cp.txt -Dmdep.includeScope=test
STAGE="$DIR/gridclasses-$$"
mkdir -p "$STAGE"
cp -r target/classes target/test-classes "$STAGE/"
trap 'rm -rf "$STAGE"' EXIT
CP="$STAGE/classes:$STAGE/test-classes:$(cat target/cp.txt)"
XYZ="$DIR/points-$N.xyz"
[ -f "$XYZ" ] || java -cp "$CP" org.leadline.bench.MedianGridXyz generate "$XYZ" "$N" 1
R=-R0/3000/0/1000
wall() { /usr/bin/time -f %e -o "$DIR/t.txt" "$@"; cat "$DIR/t.txt"; }
lt=(); gt=()
# GMT writes its history in the working folder: run it in a scratch folder
GMTDIR=$(mktemp -d)
for r in $(seq 1 "$RUNS"); do
  echo "run $r: load $(cut -d' ' -f1-3 /proc/loadavg)"
  t=$(wall java -cp "$CP" org.leadline.bench.MedianGridXyz grid "$XYZ" 1 0 3000 0 1000 "$DIR/leadline-median.xyz")
  lt+=("$t"); echo "  leadline: $t s"
  t=$( cd "$GMTDIR" && wall sh -c "gmt blockmedian '$XYZ' $R -I1 -r -C --FORMAT_FLOAT_OUT=%.3f > '$DIR/gmt-median.xyz'" )
  gt+=("$t"); echo "  gmt blockmedian: $t s"
done
rm -rf "$GMTDIR"
med() { printf '%s\n' "$@" | sort -g | awk '{a[NR]=$1} END{ if (NR%2) print a[(NR+1)/2]; else print (a[NR/2]+a[NR/2+1])/2 }'; }
L=$(med "${lt[@]}"); G=$(med "${gt[@]}")
# same cells, same medians? (both files sorted by x, y; medians compared to the written 3 decimals)
cmp_out=$(python3 - "$DIR/leadline-median.xyz" "$DIR/gmt-median.xyz" <<'PY'
import sys
def load(p):
    d = {}
    for line in open(p):
        f = line.split()
        if len(f) >= 3: d[(round(float(f[0]), 3), round(float(f[1]), 3))] = float(f[2])
    return d
a, b = load(sys.argv[1]), load(sys.argv[2])
common = a.keys() & b.keys()
diff = max((abs(a[k] - b[k]) for k in common), default=0.0)
print(f"cells: leadline {len(a)}, gmt {len(b)}, common {len(common)}; largest median difference {diff:.4f} m")
PY
)
echo "$cmp_out"
echo "gmt: $(gmt --version)"
awk -v l="$L" -v g="$G" -v n="$N" -v r="$RUNS" 'BEGIN{printf "median of %d runs, %d points: leadline %.2f s, gmt blockmedian %.2f s, ratio gmt/leadline %.1f\n", r, n, l, g, g/l}'
