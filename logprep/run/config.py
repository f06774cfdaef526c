"""Settings files: every :class:`~logprep.run.settings.ScreenSettings` field (and the sweep
ranges of ``logprep tune``) read from TOML, and the effective settings of a run written back
so the run can be repeated exactly.

Layout: one table per settings group (``[clay]``, ``[layers]``, ``[field]``, ``[capacity]``,
``[fault_rock]``, ``[input]``; see :mod:`logprep.run.settings`) holding that group's fields
(``[layers]`` ``sand_cutoff = 0.3``); sweep ranges in an optional ``[tune]`` table.  Files of
the first release, with every field as a top-level key (``sand_cutoff = 0.3``), are still
read.  A setting that is None (not set) is left out of a written file.  Unknown keys, keys in
the wrong table, and values of the wrong type are errors naming the file and the key.
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
from logprep.report.writers import write_bytes_atomic
from logprep.run.settings import FIELD_GROUP, GROUPS

SETTINGS_FILE_NAME = "logprep-settings.toml"
"""File name of the effective settings written next to a run's outputs."""

TUNE_KEYS = ("sand_sweep", "shale_sweep", "bed_sweep")
"""Keys of the ``[tune]`` table: lists of values, or ``"start:stop:step"`` strings."""


PATH_KEYS = ("tops_file", "closures_file")
"""Settings that name files: relative paths in a settings file are taken from the file's
folder, and a written file holds them absolute."""


class ConfigError(LogprepError, ValueError):
    """A settings file cannot be read or holds an unknown key or a wrong value."""


def _settings_types() -> dict[str, object]:
    """Flat field name -> its type hint, over every settings group."""
    out = {}
    for cls in GROUPS.values():
        hints = typing.get_type_hints(cls)
        out.update({f.name: hints[f.name] for f in fields(cls)})
    return out


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


def _flatten_groups(data: dict, source: str):
    """``(key, value)`` pairs of a settings document with each group table opened up; a
    flat top-level field (first-release layout) passes as it is.  A field in the wrong
    table, or given twice, is an error."""
    seen: dict[str, str] = {}
    for key, value in data.items():
        if key in GROUPS and isinstance(value, dict):
            for k, v in value.items():
                if k in FIELD_GROUP and FIELD_GROUP[k] != key:
                    raise ConfigError(f"{source}: [{key}] {k} belongs in the [{FIELD_GROUP[k]}] table; "
                                      "move the line there")
                if k not in FIELD_GROUP:
                    valid = [f for f, g in FIELD_GROUP.items() if g == key]
                    near = difflib.get_close_matches(k, valid, n=1)
                    raise ConfigError(
                        f"{source}: unknown key [{key}] {k!r}; valid keys there: {', '.join(valid)}"
                        + (f"; did you mean {near[0]!r}?" if near else ""))
                if k in seen:
                    raise ConfigError(f"{source}: {k} is given twice ({seen[k]} and [{key}]); keep "
                                      "one of them")
                seen[k] = f"[{key}]"
                yield k, v
        else:
            if key in seen:
                raise ConfigError(f"{source}: {key} is given twice ({seen[key]} and at the top "
                              "level); keep one of them")
            seen[key] = "the top level"
            yield key, value


def parse_settings_dict(data: dict, source: str = "settings") -> tuple[dict, dict]:
    """Split and check a parsed TOML document: ``(settings fields, tune ranges)``.

    Raises :class:`ConfigError` naming ``source`` and the key on an unknown key or a value
    of the wrong type.  Values are not range-checked here; :class:`ScreenSettings` does that.
    """
    types_ = _settings_types()
    settings, tune = {}, {}
    for key, value in _flatten_groups(data, source):
        if key == "uncertainty" and isinstance(value, dict):
            continue  # the Monte Carlo spreads: read by read_uncertainty
        if key == "tune" and isinstance(value, dict):
            for k, v in value.items():
                if k not in TUNE_KEYS:
                    raise ConfigError(
                        f"{source}: unknown key [tune] {k!r}; valid keys: {', '.join(TUNE_KEYS)}")
                if not (isinstance(v, str) or (isinstance(v, list) and all(
                        isinstance(x, (int, float)) and not isinstance(x, bool) for x in v))):
                    raise ConfigError(
                        f"{source}: [tune] {k} must be a list of numbers or 'start:stop:step'; "
                        "write for example [0.2, 0.3] or '0.2:0.4:0.05'")
                tune[k] = v
            continue
        if key not in types_:
            near = difflib.get_close_matches(key, list(types_) + list(GROUPS) + ["tune"], n=1)
            raise ConfigError(
                f"{source}: unknown key {key!r}; valid keys: the tables {', '.join(f'[{g}]' for g in GROUPS)} "
                f"and [tune] ({', '.join(TUNE_KEYS)}), or a setting's name at the top level ("
                f"{', '.join(types_)})" + (f"; did you mean {near[0]!r}?" if near else ""))
        hint = types_[key]
        if not _accepts(hint, value):
            raise ConfigError(f"{source}: {key} = {value!r} is not a {_type_name(hint)}; "
                              f"write {key} as a {_type_name(hint)}")
        settings[key] = tuple(value) if isinstance(value, list) else value
    return settings, tune


def read_config(path: str | Path) -> tuple[dict, dict]:
    """Read a TOML settings file: ``(ScreenSettings fields given, tune ranges given)``."""
    path = Path(path)
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
    except FileNotFoundError:
        raise ConfigError(f"{path}: settings file not found; check the path given to --config") from None
    except (OSError, UnicodeDecodeError) as exc:
        raise ConfigError(f"{path}: cannot read ({exc}); save the settings file as UTF-8 text "
                          "and check the path given to --config") from None
    except tomllib.TOMLDecodeError as exc:
        raise ConfigError(f"{path}: not valid TOML ({exc}); fix that line (key = value, "
                          "strings in quotes), or write a fresh file with logprep's own settings output") from None
    settings, tune = parse_settings_dict(data, str(path))
    for key in PATH_KEYS:
        if isinstance(settings.get(key), str) and not Path(settings[key]).is_absolute():
            settings[key] = str(path.parent / settings[key])
    return settings, tune


def read_uncertainty(path: str | Path | None):
    """The Monte Carlo spreads (:class:`~logprep.fault.uncertainty.Spreads`) of a settings
    file's ``[uncertainty]`` table; the defaults without a file or a table."""
    from logprep.fault.uncertainty import Spreads, spreads_from_dict

    if path is None:
        return Spreads()
    path = Path(path)
    try:
        data = tomllib.loads(path.read_text(encoding="utf-8"))
    except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
        raise ConfigError(f"{path}: cannot read the settings file ({exc}); save it as "
                          "UTF-8 TOML and check the path given to --config") from None
    table = data.get("uncertainty", {})
    if not isinstance(table, dict):
        raise ConfigError(f"{path}: uncertainty must be a table; write it as an [uncertainty] "
                          "table with one key = value per line")
    return spreads_from_dict(table, str(path))


def uncertainty_table(spreads) -> dict:
    """The ``[uncertainty]`` table of :func:`settings_toml` for a Spreads."""
    from dataclasses import asdict

    table = asdict(spreads)
    table["transform_weights"] = {k: w for k, w in spreads.transform_weights}
    return table


def settings_toml(settings, tune: dict | None = None, uncertainty=None) -> str:
    """The TOML text of ``settings`` (a :class:`ScreenSettings`), optional tune ranges and
    Monte Carlo spreads; :func:`read_config` and :func:`read_uncertainty` of it give the
    same back."""
    body = {}
    for group, values in settings.to_dict().items():
        table = {}
        for key, value in values.items():
            if value is None:
                continue
            if key in PATH_KEYS:
                value = str(Path(value).resolve())
            table[key] = list(value) if isinstance(value, tuple) else value
        body[group] = table
    if tune:
        body["tune"] = {k: list(v) if isinstance(v, tuple) else v for k, v in tune.items()}
    if uncertainty is not None:
        body["uncertainty"] = uncertainty_table(uncertainty)
    head = ("# logprep settings: every value used by the run, so it can be repeated with\n"
            "#   logprep screen --config THIS_FILE ...\n"
            "# Settings left out were not set (None).\n")
    return head + tomli_w.dumps(body)


def write_settings(path: str | Path, settings, tune: dict | None = None, uncertainty=None) -> Path:
    """Write :func:`settings_toml` to ``path`` atomically; returns the path."""
    path = Path(path)
    write_bytes_atomic(path, settings_toml(settings, tune, uncertainty).encode("utf-8"))
    return path
