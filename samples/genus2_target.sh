#!/usr/bin/env bash
# Genus-4 double covers of a genus-2 curve branched at two points, over the
# open stratum and the boundary divisors of Mbar_{2,2}.
set -euo pipefail
out=${1:-samples/out}
mkdir -p "$out"
covertree=${COVERTREE:-covertree}
$covertree catalogue --genus 4 --target-genus 2 --degree 2 --codim 1 \
    --format latex --standalone --output "$out/genus2_target.tex"
$covertree catalogue --genus 4 --target-genus 2 --degree 2 --codim 1 \
    --format json --rows grouped --output "$out/genus2_target.json"
echo "wrote $out/genus2_target.tex and $out/genus2_target.json" >&2
