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
