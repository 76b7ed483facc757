"""The one JSON layout of every covertree document (all commands alike).

Documents are printed with two-space indentation and keys in the order the
exporter builds them; JSON lines (one compact object per line) are the only
other form.

Examples
--------
>>> print(json_text({"a": [1, 2]}))
{
  "a": [
    1,
    2
  ]
}
>>> json_line({"a": [1, 2]})
'{"a":[1,2]}'
"""

from __future__ import annotations

import json

__all__ = ["json_line", "json_text"]


def json_text(data) -> str:
    """A JSON document in covertree's layout (indent 2, no trailing newline)."""
    return json.dumps(data, indent=2)


def json_line(data) -> str:
    """One compact JSON line (for ``jsonl`` outputs)."""
    return json.dumps(data, separators=(",", ":"))
