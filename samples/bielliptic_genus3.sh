#!/usr/bin/env bash
# Bielliptic genus-3 curves: double covers of an elliptic curve branched at four
# points, over every boundary stratum of Mbar_{1,4} up to codimension 2.
# Writes a standalone LaTeX table and the JSON catalogue.
set -euo pipefail
out=${1:-samples/out}
mkdir -p "$out"
covertree=${COVERTREE:-covertree}
$covertree catalogue --genus 3 --target-genus 1 --degree 2 --codim 2 \
    --format latex --standalone --output "$out/bielliptic_genus3.tex"
$covertree catalogue --genus 3 --target-genus 1 --degree 2 --codim 2 \
    --format json --rows grouped --output "$out/bielliptic_genus3.json"
echo "wrote $out/bielliptic_genus3.tex and $out/bielliptic_genus3.json" >&2
