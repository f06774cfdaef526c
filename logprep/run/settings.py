"""Every choice of a screening run: :class:`ScreenSettings`, composed of one small frozen
group per stage, each defined, documented and validated in its stage package.

====================  ==========================================  ===================
group (TOML table)    class                                       defined in
====================  ==========================================  ===================
``input``             :class:`~logprep.io.settings.InputSettings`     :mod:`logprep.io`
``clay``              :class:`~logprep.clay.settings.ClaySettings`    :mod:`logprep.clay`
``layers``            :class:`~logprep.layers.settings.LayerSettings` :mod:`logprep.layers`
``field``             :class:`~logprep.fault.settings.FieldSettings`  :mod:`logprep.fault`
``capacity``          :class:`~logprep.fault.settings.CapacitySettings` :mod:`logprep.fault`
``fault_rock``        :class:`~logprep.fault.settings.FaultRockSettings` :mod:`logprep.fault`
====================  ==========================================  ===================

Field names are unique across the groups, so a flat name says which group it belongs to:
``ScreenSettings(sand_cutoff=0.3)``, ``settings.updated(transform="clavier")``, the CLI
options (``dest`` is the field name) and flat keys in settings files all use them.  Read a
value from its group (``settings.layers.sand_cutoff``); a flat read
(``settings.sand_cutoff``) also works, for notebooks and older code.

>>> s = ScreenSettings(sand_cutoff=0.3)
>>> s.layers.sand_cutoff
0.3
"""

from __future__ import annotations

import difflib
from dataclasses import asdict, dataclass, fields, replace

from logprep.clay.settings import ClaySettings
from logprep.errors import SettingsError
from logprep.fault.settings import CapacitySettings, FaultRockSettings, FieldSettings
from logprep.io.settings import InputSettings
from logprep.layers.settings import LayerSettings

GROUPS: dict[str, type] = {
    "input": InputSettings,
    "clay": ClaySettings,
    "layers": LayerSettings,
    "field": FieldSettings,
    "capacity": CapacitySettings,
    "fault_rock": FaultRockSettings,
}
"""Settings groups in pipeline order: attribute (and TOML table) name -> class."""

FIELD_GROUP: dict[str, str] = {f.name: g for g, cls in GROUPS.items() for f in fields(cls)}
"""Flat field name -> its group."""

if len(FIELD_GROUP) != sum(len(fields(c)) for c in GROUPS.values()):  # pragma: no cover
    raise RuntimeError("settings field names must be unique across groups")


def _unknown(name: str) -> SettingsError:
    near = difflib.get_close_matches(name, list(FIELD_GROUP) + list(GROUPS), n=1)
    return SettingsError(f"unknown setting {name!r}; " + (f"did you mean {near[0]!r}?" if near else
                         "see ScreenSettings for the valid names"))


@dataclass(frozen=True, init=False)
class ScreenSettings:
    """Every choice of a screening run, one group per stage (see the module docstring).

    Build it from groups, from flat field names, or both::

        ScreenSettings(clay=ClaySettings(transform="clavier"), sand_cutoff=0.3)
    """

    input: InputSettings
    clay: ClaySettings
    layers: LayerSettings
    field: FieldSettings
    capacity: CapacitySettings
    fault_rock: FaultRockSettings

    def __init__(self, *, input: InputSettings | None = None, clay: ClaySettings | None = None,
                 layers: LayerSettings | None = None, field: FieldSettings | None = None,
                 capacity: CapacitySettings | None = None,
                 fault_rock: FaultRockSettings | None = None, **flat) -> None:
        given = dict(input=input, clay=clay, layers=layers, field=field, capacity=capacity,
                     fault_rock=fault_rock)
        changes: dict[str, dict] = {g: {} for g in GROUPS}
        for name, value in flat.items():
            if name not in FIELD_GROUP:
                raise _unknown(name)
            changes[FIELD_GROUP[name]][name] = value
        for g, cls in GROUPS.items():
            group = given[g] if given[g] is not None else cls()
            if not isinstance(group, cls):
                raise SettingsError(f"settings group {g} must be a {cls.__name__} (got {type(group).__name__}); "
                                    f"pass {g}={cls.__name__}(...) or flat fields")
            object.__setattr__(self, g, replace(group, **changes[g]) if changes[g] else group)

    def __getattr__(self, name: str):
        # only reached when normal lookup fails: a flat field name reads through to its group
        group = FIELD_GROUP.get(name)
        if group is None:
            raise AttributeError(f"{type(self).__name__!s} has no setting {name!r}")
        return getattr(object.__getattribute__(self, group), name)

    def __getstate__(self):
        return {g: getattr(self, g) for g in GROUPS}

    def __setstate__(self, state) -> None:
        for g, value in state.items():
            object.__setattr__(self, g, value)

    @staticmethod
    def field_names() -> tuple[str, ...]:
        """Every flat field name, in group order."""
        return tuple(FIELD_GROUP)

    def to_dict(self) -> dict[str, dict]:
        """``{group: {field: value}}``, the layout of a settings file."""
        return {g: asdict(getattr(self, g)) for g in GROUPS}

    def flat_dict(self) -> dict:
        """``{field: value}`` over every group."""
        return {k: v for group in self.to_dict().values() for k, v in group.items()}

    def updated(self, **changes) -> ScreenSettings:
        """A copy with some settings changed (flat field names or whole groups), validated
        again."""
        groups = {g: getattr(self, g) for g in GROUPS}
        for g in GROUPS:
            if g in changes:
                groups[g] = changes.pop(g)
        return ScreenSettings(**groups, **changes)
