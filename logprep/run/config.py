"""Settings files: every :class:`~logprep.run.pipeline.ScreenSettings` field (and the sweep
ranges of ``logprep tune``) read from TOML, and the effective settings of a run written back
so the run can be repeated exactly.

Layout: ScreenSettings fields as top-level keys (``sand_cutoff = 0.3``,
``gr_clean = "p5"``); sweep ranges in an optional ``[tune]`` table.  A setting that is None
(not set) is left out of a written file.  Unknown keys, and values of the wrong type, are
errors naming the file and the key.
"""

from __future__ import annotations

import difflib
import tomllib
import types
import typing
from dataclasses import fields
from pathlib import Path

import tomli_w

from logprep.errors import LogprepError

SETTINGS_FILE_NAME = "logprep-settings.toml"
"""File name of the effective settings written next to a run's outputs."""

TUNE_KEYS = ("sand_sweep", "shale_sweep", "bed_sweep")
"""Keys of the ``[tune]`` table: lists of values, or ``"start:stop:step"`` strings."""


PATH_KEYS = ("tops_file",)
"""Settings that name files: relative paths in a settings file are taken from the file's
folder, and a written file holds them absolute."""


class ConfigError(LogprepError, ValueError):
    """A settings file cannot be read or holds an unknown key or a wrong value."""


def _settings_types() -> dict[str, object]:
    from logprep.run.pipeline import ScreenSettings

    hints = typing.get_type_hints(ScreenSettings)
    return {f.name: hints[f.name] for f in fields(ScreenSettings)}


def _accepts(hint, value) -> bool:
    """Whether a TOML value fits a field's type hint (ints count as floats, bools do not)."""
    if value is None:
        return False
    origin = typing.get_origin(hint)
    if origin in (typing.Union, types.UnionType):
        return any(_accepts(h, value) for h in typing.get_args(hint) if h is not type(None))
    if origin is tuple:
        inner = typing.get_args(hint)[0]
        return isinstance(value, list) and all(_accepts(inner, x) for x in value)
    if hint is bool:
        return isinstance(value, bool)
    if hint is float:
        return isinstance(value, (int, float)) and not isinstance(value, bool)
    if isinstance(hint, type):
        return isinstance(value, hint) and not isinstance(value, bool)
    return True


def _type_name(hint) -> str:
    text = str(hint).replace("<class '", "").replace("'>", "").replace("NoneType", "None")
    return text.replace("tuple[float, ...]", "list of numbers")


def parse_settings_dict(data: dict, source: str = "settings") -> tuple[dict, dict]:
    """Split and check a parsed TOML document: ``(settings fields, tune ranges)``.

    Raises :class:`ConfigError` naming ``source`` and the key on an unknown key or a value
    of the wrong type.  Values are not range-checked here; :class:`ScreenSettings` does that.
    """
    types_ = _settings_types()
    settings, tune = {}, {}
    for key, value in data.items():
        if key == "tune" and isinstance(value, dict):
            for k, v in value.items():
                if k not in TUNE_KEYS:
                    raise ConfigError(
                        f"{source}: unknown key [tune] {k!r}; valid keys: {', '.join(TUNE_KEYS)}")
                if not (isinstance(v, str) or (isinstance(v, list) and all(
                        isinstance(x, (int, float)) and not isinstance(x, bool) for x in v))):
                    raise ConfigError(
                        f"{source}: [tune] {k} must be a list of numbers or 'start:stop:step'")
                tune[k] = v
            continue
        if key not in types_:
            near = difflib.get_close_matches(key, list(types_) + ["tune"], n=1)
            raise ConfigError(
                f"{source}: unknown key {key!r}; valid keys: {', '.join(types_)}, and a [tune] "
                f"table with {', '.join(TUNE_KEYS)}" + (f"; did you mean {near[0]!r}?" if near else ""))
        hint = types_[key]
        if not _accepts(hint, value):
            raise ConfigError(f"{source}: {key} = {value!r} is not a {_type_name(hint)}")
        settings[key] = tuple(value) if isinstance(value, list) else value
    return settings, tune


def read_config(path: str | Path) -> tuple[dict, dict]:
    """Read a TOML settings file: ``(ScreenSettings fields given, tune ranges given)``."""
    path = Path(path)
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
    except FileNotFoundError:
        raise ConfigError(f"{path}: settings file not found") from None
    except (OSError, UnicodeDecodeError) as exc:
        raise ConfigError(f"{path}: cannot read ({exc})") from None
    except tomllib.TOMLDecodeError as exc:
        raise ConfigError(f"{path}: not valid TOML ({exc})") from None
    settings, tune = parse_settings_dict(data, str(path))
    for key in PATH_KEYS:
        if isinstance(settings.get(key), str) and not Path(settings[key]).is_absolute():
            settings[key] = str(path.parent / settings[key])
    return settings, tune


def settings_toml(settings, tune: dict | None = None) -> str:
    """The TOML text of ``settings`` (a :class:`ScreenSettings`) and optional tune ranges;
    :func:`read_config` of it gives the same settings back."""
    body = {}
    for key, value in settings.to_dict().items():
        if value is None:
            continue
        if key in PATH_KEYS:
            value = str(Path(value).resolve())
        body[key] = list(value) if isinstance(value, tuple) else value
    if tune:
        body["tune"] = {k: list(v) if isinstance(v, tuple) else v for k, v in tune.items()}
    head = ("# logprep settings: every value used by the run, so it can be repeated with\n"
            "#   logprep screen --config THIS_FILE ...\n"
            "# Settings left out were not set (None).\n")
    return head + tomli_w.dumps(body)


def write_settings(path: str | Path, settings, tune: dict | None = None) -> Path:
    """Write :func:`settings_toml` to ``path`` atomically; returns the path."""
    from logprep.report.writers import write_bytes_atomic

    path = Path(path)
    write_bytes_atomic(path, settings_toml(settings, tune).encode("utf-8"))
    return path
