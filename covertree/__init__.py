"""covertree: admissible covers over the boundary of the target's moduli space.

The package is a one-way pipeline of layers::

    symmetric -> graphs -> strata -> monodromy -> gluing -> stabilisation
              -> catalogue -> export -> cli

Every weight and Hurwitz number is an exact :class:`fractions.Fraction`.
"""

__version__ = "0.1.0"

#: Version of the mathematical model (conventions of weights, notation and
#: JSON shapes).  Stored results are keyed by it.
MODEL_VERSION = 1
