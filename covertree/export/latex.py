r"""The LaTeX document wrapper shared by the exporters' ``standalone`` output.

Examples
--------
>>> print(latex_document("x", "T", ["booktabs"]))
\documentclass{article}
\usepackage[margin=2cm]{geometry}
\usepackage{booktabs}
\begin{document}
\section*{T}
x
\end{document}
<BLANKLINE>
"""

from __future__ import annotations

from collections.abc import Sequence


def latex_document(body: str, title: str | None, packages: Sequence[str],
                   geometry: str = "margin=2cm") -> str:
    """A complete article (compiles with pdflatex) around ``body``."""
    lines = [r"\documentclass{article}", r"\usepackage[" + geometry + "]{geometry}",
             r"\usepackage{" + ",".join(packages) + "}", r"\begin{document}"]
    if title:
        lines.append(r"\section*{" + title + "}")
    lines += [body, r"\end{document}", ""]
    return "\n".join(lines)


#: The packages a document needs for every LaTeX fragment covertree prints
#: (tables: booktabs and longtable; pictures: tikz; formulas: amsmath).
PASTE_PACKAGES = ("amsmath", "booktabs", "longtable", "tikz")


def wrapped_cell(text: str) -> str:
    r"""A cell of a ``p{...}`` column set ragged right (no package needed):
    long notations break at their ``\allowbreak`` points instead of stretching.

    >>> print(wrapped_cell("$x$"))
    {\raggedright $x$\par}
    """
    return r"{\raggedright " + text + r"\par}"


def sized_longtable(columns: str, header: Sequence[str], rows: Sequence[str], size: str = "",
                    tabcolsep: str = "") -> str:
    r"""The one table style of covertree: a booktabs ``longtable`` (it breaks
    across pages, repeats its header and is centred on the line), optionally
    set in a smaller ``size`` with narrower column gaps, inside a group.

    ``rows`` are complete LaTeX rows (ending in ``\\`` or rules).

    >>> print(sized_longtable("rl", ["a", "b"], [r"1 & x \\"], size="small"))
    {\small
    \begin{longtable}{rl}
    \toprule
    a & b \\
    \midrule
    \endhead
    \bottomrule
    \endlastfoot
    1 & x \\
    \end{longtable}}
    """
    lines = [r"\begin{longtable}{" + columns + "}", r"\toprule", " & ".join(header) + r" \\",
             r"\midrule", r"\endhead", r"\bottomrule", r"\endlastfoot", *rows, r"\end{longtable}"]
    if not (size or tabcolsep):
        return "\n".join(lines)
    opening = "{" + ("\\" + size if size else "") + (f"\\setlength{{\\tabcolsep}}{{{tabcolsep}}}" if tabcolsep else "")
    return "\n".join([opening, *lines]) + "}"
