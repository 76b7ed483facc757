#!/usr/bin/env bash
# Trigonal genus-3 curves: simply branched triple covers of the line (ten branch
# points), over the open stratum and every boundary divisor of Mbar_{0,10},
# grouped by how the branch points split.
set -euo pipefail
out=${1:-samples/out}
mkdir -p "$out"
covertree=${COVERTREE:-covertree}
$covertree catalogue --genus 3 --target-genus 0 --degree 3 --codim 1 \
    --format latex --standalone --output "$out/trigonal_genus3.tex"
$covertree catalogue --genus 3 --target-genus 0 --degree 3 --codim 1 \
    --format json --rows grouped --output "$out/trigonal_genus3.json"
echo "wrote $out/trigonal_genus3.tex and $out/trigonal_genus3.json" >&2
