#!/usr/bin/env sh
# Bielliptic genus-2 curves: the class of the locus of genus-2 curves with a
# degree-2 map to an elliptic curve, and its number on the pencil of genus-2
# curves branched over five fixed points of the line and a moving sixth
# (delta_0 degree 10, delta_1 degree 0).
set -e
covertree locus -g 2 -t 1 -d 2 --family "delta_0=10,delta_1=0"
covertree locus -g 2 -t 1 -d 2 --family "delta_0=10,delta_1=0" -f json | python3 -c '
import json, sys
d = json.load(sys.stdin)
print("family number, labelled branch points:", d["family"])
print("family number, unordered branch points:", d["family_unordered"])'
