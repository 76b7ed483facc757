"""Intersection numbers on moduli spaces of stable curves.

:mod:`~covertree.intersection.psi` integrates monomials in psi classes and
``kappa_1`` over ``Mbar_{g,n}`` (Witten–Kontsevich by the DVV recursion, the
genus-0 multinomial formula, string and dilaton).
"""
