#!/usr/bin/env bash
# Regenerates the demo board sweeps in this folder (invented demo data: made by polebench's
# board synthesizer from the demo stages, never measured). Run from the repository root after
# `mvn -q -DskipTests package`. Each file's own notes repeat its fault, noise and seed. A board
# written in an instrument profile's layout gets noise within that profile's stated accuracy
# (±0.05 dB, ±0.5° read as rectangular: u = 0.029 dB, 0.29°), so that the sweep agrees with
# the accuracy its profile claims; reconcile tests the scatter against it.
set -euo pipefail
pb() { java -jar target/polebench.jar "$@"; }
d=sample-measurements/boards
s=sample-measurements
pb synthesize --force --stage $s/hydrophone-preamp-ce.stage.yaml --seed 11 --points 81 \
   --out $d/hp12-healthy.sweep.csv
pb synthesize --force --stage $s/hydrophone-preamp-ce.stage.yaml --fault C3=47u --seed 12 --points 81 \
   --noise 0.025dB,0.25deg --layout db-degrees --out $d/hp12-decade-slip-c3.csv
pb synthesize --force --stage $s/hydrophone-preamp-ce.stage.yaml --fault bias:Q1=0.6 --seed 13 --points 81 \
   --noise 0.025dB,0.25deg --layout semicolon-decimal-comma --out $d/hp12-low-bias-q1.txt
pb synthesize --force --stage $s/vibration-buffer-cs.stage.yaml --fault C3=50u --seed 14 --points 81 \
   --layout two-channel-rms --out $d/vb3-aged-c3.csv
pb synthesize --force --stage $s/geophone-two-stage.stage.yaml --fault CE2=110u --seed 15 --points 81 \
   --noise 0.025dB,0.25deg --layout khz-radians --out $d/gf2-aged-ce2.txt
