#!/usr/bin/env bash
# End-to-end benchmark of `leadline process` on a synthetic swath day (docs/performance.md).
# Generates the day once (deterministic, seed 1) into $BENCH_DIR, then times RUNS runs of
#   java -jar target/leadline.jar process project.yaml --surface median --out ...
# and prints each run's wall time, the per-stage times of the last run, peak RSS and the median.
#
# usage: scripts/bench/process-10m.sh [SOUNDINGS] [RUNS]     (defaults 10000000 3)
# env:   BENCH_DIR (default /tmp/leadline-bench), JAVA_OPTS (e.g. -Xmx8g), FORMAT=csv|lpb (default csv)
# Needs: mvn -B -q package -DskipTests (target/leadline.jar and target/test-classes).
set -euo pipefail
cd "$(dirname "$0")/../.."
N=${1:-10000000}
RUNS=${2:-3}
DIR=${BENCH_DIR:-/tmp/leadline-bench}
FORMAT=${FORMAT:-csv}
DAY="$DIR/day-$N"
JAR=target/leadline.jar
[ -f "$JAR" ] && [ -d target/test-classes ] || { echo "build first: mvn -B -q package -DskipTests" >&2; exit 2; }
mkdir -p "$DIR"
# the jar and classes are copied so that a rebuild during the runs does not disturb them
STAGE="$DIR/classes-$$"
mkdir -p "$STAGE"
cp "$JAR" "$STAGE/leadline.jar"
cp -r target/classes target/test-classes "$STAGE/"
trap 'rm -rf "$STAGE"' EXIT
if [ ! -f "$DAY/project.yaml" ] || [ ! -f "$DAY/pings.$FORMAT" ]; then
  [ -f target/cp.txt ] || mvn -B -q -o dependency:build-classpath -Dmdep.outputFile=target/cp.txt -Dmdep.includeScope=test
  echo "generating $N soundings into $DAY ..."
  java -cp "$STAGE/classes:$STAGE/test-classes:$(cat target/cp.txt)" org.leadline.bench.SwathDayGenerator \
       --out "$DAY" --soundings "$N" --binary
fi
PROJECT="$DAY/project.yaml"
if [ "$FORMAT" = lpb ]; then
  sed 's/pings\.csv/pings.lpb/' "$DAY/project.yaml" > "$DAY/project-lpb.yaml"
  PROJECT="$DAY/project-lpb.yaml"
fi
echo "machine: $(nproc) cores, $(lscpu | sed -n 's/^Model name: *//p'), $(free -h | awk '/Mem:/{print $2}') RAM"
times=()
for r in $(seq 1 "$RUNS"); do
  OUT="$DIR/out-$N-$r"
  rm -rf "$OUT"
  echo "run $r: load before: $(cut -d' ' -f1-3 /proc/loadavg)"
  /usr/bin/time -v -o "$DIR/time-$r.txt" java ${JAVA_OPTS:-} -jar "$STAGE/leadline.jar" process "$PROJECT" \
       --surface median --out "$OUT" > "$DIR/stdout-$r.txt" 2> "$DIR/stderr-$r.txt"
  wall=$(awk -F': ' '/Elapsed \(wall clock\)/{print $2}' "$DIR/time-$r.txt" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')
  cpu=$(awk -F': ' '/User time/{u=$2} /System time/{s=$2} END{print u+s}' "$DIR/time-$r.txt")
  rss=$(awk -F': ' '/Maximum resident/{printf "%.2f", $2/1048576}' "$DIR/time-$r.txt")
  echo "run $r: wall ${wall} s, cpu ${cpu} s, peak RSS ${rss} GiB, load after: $(cut -d' ' -f1-3 /proc/loadavg)"
  times+=("$wall")
  rm -rf "$OUT"
done
echo "stages of the last run:"
grep "done in" "$DIR/stderr-$RUNS.txt" | sed 's/^/  /'
head -2 "$DIR/stdout-$RUNS.txt" | sed 's/^/  /'
median=$(printf '%s\n' "${times[@]}" | sort -g | awk '{a[NR]=$1} END{ if (NR%2) print a[(NR+1)/2]; else print (a[NR/2]+a[NR/2+1])/2 }')
echo "median wall time of $RUNS runs of $N soundings ($FORMAT): ${median} s"
