"""Symmetric-group layer: permutations on plain tuples, partitions, characters."""
