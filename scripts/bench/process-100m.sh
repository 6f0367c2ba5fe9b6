#!/usr/bin/env bash
# Large-day benchmark of `leadline process` in a bounded heap (docs/performance.md, issue 7:
# 100 million soundings with at most an 8 GiB heap, median surface, peak memory reported).
# Generates the synthetic swath day once (deterministic, seed 1; binary pings streamed to
# pings.lpb, about 80 bytes per sounding; the ping CSV only with --csv, about 100 bytes per
# sounding) into $BENCH_DIR/day-N, then times RUNS runs of
#   java -Xmx8g -jar leadline.jar process project.yaml --out DIR
# under /usr/bin/time -v and prints each run's wall time, CPU time (user + sys), peak RSS, the
# 1-minute load before and after, the per-stage lines the CLI prints, and the median wall time.
# A run that fails (e.g. out of memory) is reported with its exit code and left out of the median.
#
# usage: scripts/bench/process-100m.sh [SOUNDINGS] [RUNS] [--csv]      (defaults 100000000 1)
# env:   BENCH_DIR (default /tmp/leadline-bench), HEAP (default 8g), JAVA_OPTS (more JVM options),
#        FORMAT=lpb|csv (default lpb; csv needs the day generated with --csv)
# Needs: mvn -B -q package -DskipTests (target/leadline.jar and target/test-classes).
set -euo pipefail
cd "$(dirname "$0")/../.."
N=100000000
RUNS=1
CSV=0
pos=0
for a in "$@"; do
  case "$a" in
    --csv) CSV=1 ;;
    -h|--help) sed -n '2,16p' "$0"; exit 0 ;;
    *) pos=$((pos + 1)); if [ $pos = 1 ]; then N=$a; elif [ $pos = 2 ]; then RUNS=$a; else echo "unexpected argument $a" >&2; exit 2; fi ;;
  esac
done
DIR=${BENCH_DIR:-/tmp/leadline-bench}
HEAP=${HEAP:-8g}
FORMAT=${FORMAT:-lpb}
DAY="$DIR/day-$N"
JAR=target/leadline.jar
[ -f "$JAR" ] && [ -d target/test-classes ] || { echo "build first: mvn -B -q package -DskipTests" >&2; exit 2; }
[ "$FORMAT" = csv ] && [ $CSV = 0 ] && { echo "FORMAT=csv needs --csv (the day's ping CSV)" >&2; exit 2; }
mkdir -p "$DIR"
# the jar and classes are copied so that a rebuild during the runs does not disturb them
STAGE="$DIR/classes-$$"
mkdir -p "$STAGE"
cp "$JAR" "$STAGE/leadline.jar"
cp -r target/classes target/test-classes "$STAGE/"
trap 'rm -rf "$STAGE"' EXIT

# the generator writes project.yaml last: its presence means the day is complete
if [ ! -f "$DAY/project.yaml" ] || [ ! -f "$DAY/pings.lpb" ] || { [ $CSV = 1 ] && [ ! -f "$DAY/pings.csv" ]; }; then
  [ -f target/cp.txt ] || mvn -B -q -o dependency:build-classpath -Dmdep.outputFile=target/cp.txt -Dmdep.includeScope=test
  need=$(( N * (CSV ? 180 : 80) / 1000000000 + 1 ))
  echo "generating $N soundings into $DAY (about $need GB; free: $(df -h --output=avail "$DIR" | tail -1 | tr -d ' ')) ..."
  rm -f "$DAY/project.yaml"
  GEN_OPTS=(--binary)
  [ $CSV = 1 ] || GEN_OPTS+=(--no-csv)
  # the generator streams: a small heap is enough whatever N is
  /usr/bin/time -f "generation: wall %e s, cpu %U+%S s, peak RSS %M KiB" \
    java -Xmx512m -cp "$STAGE/classes:$STAGE/test-classes:$(cat target/cp.txt)" org.leadline.bench.SwathDayGenerator \
       --out "$DAY" --soundings "$N" "${GEN_OPTS[@]}"
fi
if [ "$FORMAT" = lpb ]; then
  sed 's/pings\.csv/pings.lpb/' "$DAY/project.yaml" > "$DAY/project-lpb.yaml"
  PROJECT="$DAY/project-lpb.yaml"
  INPUT="$DAY/pings.lpb"
else
  PROJECT="$DAY/project.yaml"
  INPUT="$DAY/pings.csv"
fi
echo "machine: $(nproc) cores, $(lscpu | sed -n 's/^Model name: *//p'), $(free -h | awk '/Mem:/{print $2}') RAM, $(java -version 2>&1 | head -1)"
echo "input: $INPUT ($(du -h "$INPUT" | cut -f1)), heap -Xmx$HEAP ${JAVA_OPTS:-}"
times=()
for r in $(seq 1 "$RUNS"); do
  OUT="$DIR/out-$N-$r"
  rm -rf "$OUT"
  echo "run $r: load before: $(cut -d' ' -f1-3 /proc/loadavg)"
  set +e
  /usr/bin/time -v -o "$DIR/time-$N-$r.txt" java -Xmx"$HEAP" ${JAVA_OPTS:-} -jar "$STAGE/leadline.jar" process "$PROJECT" \
       --out "$OUT" > "$DIR/stdout-$N-$r.txt" 2> "$DIR/stderr-$N-$r.txt"
  rc=$?
  set -e
  wall=$(awk -F': ' '/Elapsed \(wall clock\)/{print $2}' "$DIR/time-$N-$r.txt" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')
  cpu=$(awk -F': ' '/User time/{u=$2} /System time/{s=$2} END{print u+s}' "$DIR/time-$N-$r.txt")
  rss=$(awk -F': ' '/Maximum resident/{printf "%.2f", $2/1048576}' "$DIR/time-$N-$r.txt")
  status=ok
  [ $rc = 0 ] || status="FAILED (exit $rc)"
  echo "run $r: $status, wall ${wall} s, cpu ${cpu} s, peak RSS ${rss} GiB, load after: $(cut -d' ' -f1-3 /proc/loadavg)"
  echo "run $r stages:"
  grep "done in" "$DIR/stderr-$N-$r.txt" | sed 's/^/  /' || true
  if [ $rc = 0 ]; then
    times+=("$wall")
    head -3 "$DIR/stdout-$N-$r.txt" | sed 's/^/  /'
  else
    grep -v -e "done in" -e "^[[:space:]]*at " "$DIR/stderr-$N-$r.txt" | tail -5 | sed "s/^/  /" || true
  fi
  rm -rf "$OUT"
done
if [ ${#times[@]} = 0 ]; then
  echo "median wall time of $RUNS runs of $N soundings ($FORMAT, -Xmx$HEAP): n/a (no run succeeded)"
  exit 1
fi
median=$(printf '%s\n' "${times[@]}" | sort -g | awk '{a[NR]=$1} END{ if (NR%2) print a[(NR+1)/2]; else print (a[NR/2]+a[NR/2+1])/2 }')
echo "median wall time of ${#times[@]} successful of $RUNS runs of $N soundings ($FORMAT, -Xmx$HEAP): ${median} s"
