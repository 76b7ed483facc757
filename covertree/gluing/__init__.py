"""Gluing layer: local covers matched across the nodes of the base, up to
isomorphism, with automorphism groups and multiplicities."""
