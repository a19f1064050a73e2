#!/usr/bin/env bash
# Regenerates the demo scope records in this folder (invented demo data: made by polebench's
# board synthesizer from the demo hydrophone stage, never measured). Run from the repository
# root after `mvn -q -DskipTests package`. Every record's comments repeat the fault and the seed.
set -euo pipefail
pb() { java -jar target/polebench.jar "$@"; }
s=sample-measurements
rm -f $s/waveforms/hp12-board-31/*.csv
pb synthesize --force --stage $s/hydrophone-preamp-ce.stage.yaml --fault C2=1u --seed 31 --points 25 \
   --waveforms --amplitude 10m --record-noise 100u --record-samples 600 --record-periods 3.7 \
   --out $s/waveforms/hp12-board-31
