"""Checking a JSON document against its shape before anything is built from
it (the sweep documents that ``covertree merge`` reads back).

A shape is a small value: a Python type (``int``, ``str``, ``bool``; ``int``
never accepts ``True``), :data:`RATIONAL` (a text ``p`` or ``p/q`` with
``q > 0``), a one-element list ``[SHAPE]`` (a list of such items), a dict of
keys to shapes (an object with at least those keys; others are allowed, as
keys are only ever added), :class:`Nullable` or :class:`MapOf`.  A mismatch
raises :class:`~covertree.errors.InputError` naming the place in the document
(``strata[3].landing.delta_0``), what was expected and a short quote of what
was found.

Examples
--------
>>> check_shape({"a": [int]}, {"a": [1, 2]}, "doc")
>>> check_shape({"a": [int]}, {"a": [1, "2"]}, "doc")
Traceback (most recent call last):
...
covertree.errors.InputError: doc: a[1] should be an integer, not '2'
>>> check_shape({"w": RATIONAL}, {"w": "1/0"}, "doc")
Traceback (most recent call last):
...
covertree.errors.InputError: doc: w should be a rational p/q with q > 0, not '1/0'
"""

from __future__ import annotations

import json
import re
import reprlib
from dataclasses import dataclass

from covertree.errors import InputError

__all__ = ["RATIONAL", "MapOf", "Nullable", "check_shape", "load_json"]

#: Deepest nesting of arrays and objects accepted by :func:`load_json`.
MAX_DEPTH = 32

RATIONAL = "rational"
_RATIONAL = re.compile(r"^-?[0-9]{1,4000}(/0*[1-9][0-9]{0,3999})?$", re.ASCII)
_NAMES = {int: "an integer", str: "a text", bool: "true or false", RATIONAL: "a rational p/q with q > 0"}


@dataclass(frozen=True)
class Nullable:
    """``null`` or a value of ``shape``."""

    shape: object


@dataclass(frozen=True)
class MapOf:
    """An object whose keys are free and whose values all have ``shape``."""

    shape: object


def short(value) -> str:
    """``repr`` of a value, at most about 40 characters.

    >>> short("x" * 100)
    "'xxxxxxxxxxxxxxxxx...xxxxxxxxxxxxxxxxxx'"
    """
    shortened = reprlib.Repr()
    shortened.maxstring = shortened.maxother = 40
    shortened.maxlist = shortened.maxdict = 4
    return shortened.repr(value)


def load_json(data: bytes, name: str):
    """Decode UTF-8 JSON ``data`` (file ``name``), refusing other encodings
    and nesting deeper than :data:`MAX_DEPTH` before parsing.

    >>> load_json(b'{"a": [1]}', "doc")
    {'a': [1]}
    >>> load_json(b"[" * 1000, "doc")
    Traceback (most recent call last):
    ...
    covertree.errors.InputError: doc: JSON nested deeper than 32 levels; not a covertree document
    """
    try:
        text = data.decode("utf-8")
    except UnicodeDecodeError as error:
        raise InputError(f"{name}: not UTF-8 text (byte {error.start}); not a covertree document") from None
    if _depth(text) > MAX_DEPTH:
        raise InputError(f"{name}: JSON nested deeper than {MAX_DEPTH} levels; not a covertree document")
    try:
        return json.loads(text)
    except (json.JSONDecodeError, RecursionError) as error:
        raise InputError(f"{name} is not JSON ({short(str(error))})") from None


def _depth(text: str) -> int:
    """The deepest nesting of brackets outside strings."""
    brackets = re.sub(r'"(?:[^"\\]|\\.)*"', "", text)
    depth = deepest = 0
    for char in re.sub(r"[^\[\]{}]", "", brackets):
        depth += 1 if char in "[{" else -1
        deepest = max(deepest, depth)
    return deepest


def check_shape(shape, value, name: str, where: str = "") -> None:
    """Raise :class:`InputError` unless ``value`` has ``shape`` (see the module)."""
    if isinstance(shape, Nullable):
        if value is not None:
            check_shape(shape.shape, value, name, where)
    elif isinstance(shape, dict):
        _check_object(shape, value, name, where)
    elif isinstance(shape, MapOf):
        _expect(isinstance(value, dict), "an object", value, name, where)
        for key, item in value.items():
            check_shape(shape.shape, item, name, f"{where}.{key}" if where else key)
    elif isinstance(shape, list):
        _expect(isinstance(value, list), "a list", value, name, where)
        for i, item in enumerate(value):
            check_shape(shape[0], item, name, f"{where}[{i}]")
    else:
        _expect(_is(shape, value), _NAMES[shape], value, name, where)


def _check_object(shape: dict, value, name: str, where: str) -> None:
    _expect(isinstance(value, dict), "an object", value, name, where)
    for key, inner in shape.items():
        inside = f"{where}.{key}" if where else key
        if key not in value:
            raise InputError(f"{name}: {inside} is missing; not a covertree document of this kind")
        check_shape(inner, value[key], name, inside)


def _is(shape, value) -> bool:
    if shape is int:
        return isinstance(value, int) and not isinstance(value, bool)
    if shape is RATIONAL:
        return isinstance(value, str) and _RATIONAL.match(value) is not None
    return isinstance(value, shape)


def _expect(holds: bool, expected: str, value, name: str, where: str) -> None:
    if not holds:
        raise InputError(f"{name}: {where or 'the document'} should be {expected}, not {short(value)}")
