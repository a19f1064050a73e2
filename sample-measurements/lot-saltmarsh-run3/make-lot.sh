#!/usr/bin/env bash
# Makes the invented lot "saltmarsh-run3" in sweeps/ (demo data: made by polebench's board
# synthesizer, never measured). Run from the repository root after `mvn -q -DskipTests package`.
# Forty HP-12 boards, each built with its parts drawn within their tolerances (--draw-seed):
#   boards 1-36   from a wrong reel on C2 (4.7 uF for 10 uF: hp12-run3-wrong-reel.stage.yaml)
#   boards 37-40  after the reel was changed (the design, ../hydrophone-preamp-ce.stage.yaml)
#   single-board faults: 009 C3 = 47 uF (a decade slip), 017 C3 = 100 uF (a wrong value),
#   026 Q1 bias current x0.6, 038 C1 = 0.47 uF (a decade slip)
#   033 a sweep file cut short by a full disk: an input problem, written by hand below
set -euo pipefail
pb() { java -jar target/polebench.jar "$@"; }
here=sample-measurements/lot-saltmarsh-run3
mkdir -p "$here/sweeps"
for n in $(seq 1 40); do
  id=$(printf 'HP12-R3-%03d' "$n")
  out="$here/sweeps/$(printf 'hp12-r3-%03d' "$n").csv"
  [ "$n" -eq 33 ] && continue
  stage="$here/hp12-run3-wrong-reel.stage.yaml"
  [ "$n" -ge 37 ] && stage=sample-measurements/hydrophone-preamp-ce.stage.yaml
  fault=()
  case "$n" in
    9)  fault=(--fault C3=47u) ;;
    17) fault=(--fault C3=100u) ;;
    26) fault=(--fault bias:Q1=0.6) ;;
    38) fault=(--fault C1=0.47u) ;;
  esac
  pb synthesize --force --stage "$stage" --draw-seed $((3000 + n)) --seed $((3100 + n)) --board "$id" \
     --points 81 --from 0.2Hz --to 2MHz "${fault[@]}" --out "$out" > /dev/null
done
# board 33: the header and the first row of a sweep, then the write stopped mid-row (invented)
pb synthesize --force --stage "$here/hp12-run3-wrong-reel.stage.yaml" --draw-seed 3033 --seed 3133 \
   --board HP12-R3-033 --points 81 --from 0.2Hz --to 2MHz --out "$here/sweeps/hp12-r3-033.csv" > /dev/null
head -n 12 "$here/sweeps/hp12-r3-033.csv" > "$here/sweeps/hp12-r3-033.part"
printf '1.17946,-1.1' >> "$here/sweeps/hp12-r3-033.part"
mv "$here/sweeps/hp12-r3-033.part" "$here/sweeps/hp12-r3-033.csv"
