"""Hurwitz problems and Hurwitz numbers by characters (Frobenius' formula)."""
