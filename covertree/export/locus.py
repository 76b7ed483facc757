r"""JSON, LaTeX and table rows for locus classes and cover-space integrals.

The JSON documents are contracts (keys are only ever added).  ``locus``::

    {"problem": {"genus", "target_genus", "degree", "profiles"},
     "dimension": N,
     "class": {"lambda": "p/q", "delta_0": "p/q", ...},
     "class_unordered": {... same keys ...},
     "symmetry": n,
     "tests": [{"monomial": "...", "cover_space": "p/q", "from_class": "p/q"}, ...],
     "consistent": true,
     "family": "p/q", "family_unordered": "p/q"}   (the last two only with a family)

``class`` is the class of the labelled problem, ``class_unordered`` divided by
``symmetry`` (the permutations of branch points with equal profiles); genus 2
has the keys ``delta_0, delta_1`` only.  For a marked source (``problem``
then has ``marks``) the classes live on ``Mbar_{G,n}`` and have the keys
``lambda``, ``psi_1 .. psi_n`` and one per boundary divisor (``delta_0``,
``delta_i_{a,b,...}``), ``symmetry`` only permutes unmarked branch points, and
two more keys say how the generators were reduced::

     "basis": ["lambda", "psi_1", ...],
     "relations": {"delta_0": {"lambda": "10", ...}, ...}

(generators outside the basis have coefficient 0 in the classes; each
relation writes one of them in the basis).  ``integral``::

    {"problem": {...}, "source": "...", "target": "...", "value": "p/q"}

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.locus.divisor import locus_class
>>> c = locus_class(HurwitzProblem.build(2, 1, genus=2))
>>> print(locus_to_latex(c))
\[ [\overline{\mathcal{H}}] = 6\,\delta_{0} + 24\,\delta_{1}, \qquad \tfrac{1}{2}\,[\overline{\mathcal{H}}] = 3\,\delta_{0} + 12\,\delta_{1} \]
"""

from __future__ import annotations

from fractions import Fraction

from covertree.export.rational import latex_rational, rational_str
from covertree.locus.divisor import LocusClass
from covertree.locus.integrals import CoverSpaceIntegral
from covertree.export.jsontext import json_text

__all__ = ["locus_to_dict", "locus_to_json", "locus_to_latex", "class_text", "integral_to_dict", "integral_to_json"]


def locus_to_dict(result: LocusClass, family: dict[str, Fraction] | None = None) -> dict:
    """The ``locus`` JSON document as a dict; ``family`` holds the family numbers."""
    doc = {
        "problem": result.problem.to_dict(),
        "dimension": result.dimension,
        "class": {k: rational_str(v) for k, v in result.labelled.items()},
        "class_unordered": {k: rational_str(v) for k, v in result.unordered.items()},
        "symmetry": result.symmetry,
        "tests": [{"monomial": t.monomial.notation, "cover_space": rational_str(t.cover_space),
                   "from_class": rational_str(t.from_class)} for t in result.tests],
        "consistent": result.consistent,
    }
    if result.basis:
        doc["basis"] = list(result.basis)
        doc["relations"] = {k: {b: rational_str(c) for b, c in v.items()} for k, v in result.relations.items()}
    if family is not None:
        doc["family"] = rational_str(family["labelled"])
        doc["family_unordered"] = rational_str(family["unordered"])
    return doc


def locus_to_json(result: LocusClass, family: dict[str, Fraction] | None = None) -> str:
    return json_text(locus_to_dict(result, family))


def class_text(coefficients: dict[str, Fraction], latex: bool = False) -> str:
    """``9 lambda - delta_0 - 3 delta_1`` (or its LaTeX form); ``0`` when empty.

    >>> class_text({"lambda": Fraction(9), "delta_0": Fraction(-1), "delta_1": Fraction(0)})
    '9 lambda - delta_0'
    """
    terms = []
    for name, value in coefficients.items():
        if not value:
            continue
        symbol = _latex_symbol(name) if latex else name
        size = abs(value)
        number = latex_rational(size) if latex else rational_str(size)
        body = symbol if size == 1 else (rf"{number}\,{symbol}" if latex else f"{number} {symbol}")
        terms.append(("-" if value < 0 else "+", body))
    if not terms:
        return "0"
    first_sign, first = terms[0]
    text = ("-" if first_sign == "-" else "") + first
    return text + "".join(f" {s} {b}" for s, b in terms[1:])


def _latex_symbol(name: str) -> str:
    r"""``\lambda``, ``\psi_{k}``, ``\delta_{i}`` or ``\delta_{i,\{a,b\}}``.

    >>> print(_latex_symbol("delta_1_{}"), _latex_symbol("psi_2"), _latex_symbol("delta_0_{1,2}"))
    \delta_{1,\{\}} \psi_{2} \delta_{0,\{1,2\}}
    """
    if name == "lambda":
        return r"\lambda"
    head, _, tail = name.partition("_")
    number, _, legs = tail.partition("_")
    if legs:
        return rf"\delta_{{{number},\{{{legs.strip('{}')}\}}}}"
    return rf"\{head}_{{{number}}}"


def locus_to_latex(result: LocusClass) -> str:
    """One displayed equation: the labelled class and the unordered one."""
    lab = class_text(result.labelled, latex=True)
    unordered = class_text(result.unordered, latex=True)
    factor = latex_rational(Fraction(1, result.symmetry)).replace(r"\frac", r"\tfrac")
    return (rf"\[ [\overline{{\mathcal{{H}}}}] = {lab}, \qquad "
            rf"{factor}\,[\overline{{\mathcal{{H}}}}] = {unordered} \]")


def integral_to_dict(result: CoverSpaceIntegral) -> dict:
    return {"problem": result.problem.to_dict(), "source": result.source.notation,
            "target": result.target.notation, "value": rational_str(result.value)}


def integral_to_json(result: CoverSpaceIntegral) -> str:
    return json_text(integral_to_dict(result))
