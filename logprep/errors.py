"""One exception family for every problem a user can fix.

Each class also inherits the matching built-in, so ``except ValueError`` still works for
callers that do not know logprep.  Messages say where, what, and how to fix it.
"""


class LogprepError(Exception):
    """Root of every user-facing logprep error."""


class LasReadError(LogprepError, ValueError):
    """A file could not be read as a depth-indexed LAS log."""


class CurveNotFoundError(LogprepError, KeyError):
    """A required curve (depth index, gamma ray, ...) is missing."""

    def __str__(self) -> str:  # KeyError quotes its message; keep it plain
        return str(self.args[0]) if self.args else ""


class SettingsError(LogprepError, ValueError):
    """A setting is out of range, inconsistent, or unknown."""


class OutputError(LogprepError, OSError):
    """Results could not be written."""
