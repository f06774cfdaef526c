"""One exception family for every problem a user can fix.

Each class also inherits the matching built-in, so ``except ValueError`` still works for
callers that do not know logprep.  Messages say where, what, and how to fix it.
"""

import math
from dataclasses import fields


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


def require_finite_fields(settings) -> None:
    """Raise :class:`SettingsError` when a numeric field of the dataclass ``settings`` is
    NaN or infinite (a settings file or a notebook can pass one)."""
    for f in fields(settings):
        value = getattr(settings, f.name)
        if isinstance(value, (int, float)) and not isinstance(value, bool) and not math.isfinite(value):
            raise SettingsError(f"setting {f.name} must be a finite number (got {value}); give "
                                f"a number (not nan or inf) in the option or the settings file")
