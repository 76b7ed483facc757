"""Exception hierarchy of covertree.

The library never prints or exits: it raises a subclass of
:class:`CovertreeError`.  The command-line layer turns each into a one-line
message on stderr and exit status 2 (bad input) or 1 (a failed self-check).
"""


class CovertreeError(Exception):
    """Base class of every error covertree raises on purpose."""


class InputError(CovertreeError, ValueError):
    """A value given by the user is not allowed (names the value and the rule)."""


class ProfileError(InputError):
    """A ramification profile is malformed or does not sum to the degree."""


class ProblemError(InputError):
    """A Hurwitz problem is inconsistent (Riemann-Hurwitz, unstable target...)."""


class GraphError(InputError):
    """A graph is malformed, disconnected or not stable of the requested type."""


class NotationError(GraphError):
    """A graph string cannot be parsed; the message names the position."""


class TooLargeError(InputError):
    """A run is estimated beyond the work limit before it starts (names the
    size that makes it infeasible and the largest feasible value)."""


class LimitError(CovertreeError):
    """A run would exceed a user-set limit (for instance ``--max-covers``)."""


class IdentityError(CovertreeError):
    """A built-in self-check (the degeneration identity) failed: a bug."""
