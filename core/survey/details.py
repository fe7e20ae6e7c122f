"""A member's girder details in the survey record (part of document version 2): its
transverse stiffeners with their readings and loss bands, its supports with the bearing
length, the bracing of each flange (discrete brace points, a continuous deck, U-frames) and
its fatigue traffic.

Values are kept as entered: dimensions of a stiffener (``b``, ``t``, ...) and of its loss
bands in the survey's length unit, positions along the member in the survey's position unit,
readings and the other quantities with their own units. :mod:`core.survey.model` holds these
in :class:`core.survey.model.Member` (it imports this module after its own classes, so
import :mod:`core.survey` or :mod:`core.survey.model` first); the engine objects come from
:mod:`core.assess.details`.
"""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from core.survey.model import Quantity, _Model

StiffenerRole = Literal["bearing", "intermediate"]
ROLES: tuple[str, ...] = ("bearing", "intermediate")
BracingKind = Literal["none", "discrete", "continuous", "u_frames"]
BRACING_KINDS: tuple[str, ...] = ("none", "discrete", "continuous", "u_frames")


class StiffenerReading(_Model):
    """A thickness reading on a stiffener: of its projecting elements (plates, outstanding
    legs) or of its angles' connected legs, over the whole stiffener (``band`` None) or in
    one of its loss bands (``band`` its id)."""

    id: str = Field(min_length=1, max_length=200)
    element: Literal["projecting", "connected"] = "projecting"
    band: str | None = None
    value: float
    unit: str = Field(min_length=1)
    location: str = ""
    instrument: str = ""
    time: str = ""
    who: str = ""


class StiffenerBand(_Model):
    """A loss band of a stiffener, from ``lo`` to ``hi`` above its bottom end (length
    unit), e.g. the bottom 150 mm of a bearing stiffener: the remaining thickness of the
    projecting elements ``t`` and of the connected legs ``t_conn`` (length unit; absent: from
    the band's readings, else as built) and the width lost at the toes ``b_lost``."""

    id: str = Field(min_length=1, max_length=200)
    lo: float = Field(ge=0.0)
    hi: float = Field(gt=0.0)
    t: float | None = Field(default=None, gt=0.0)
    t_conn: float | None = Field(default=None, gt=0.0)
    b_lost: float = Field(default=0.0, ge=0.0)
    note: str = ""


class Stiffener(_Model):
    """A transverse stiffener at ``position`` (position unit): a bearing stiffener over a
    support or an intermediate one; plates or angles (``per_side`` 1 or 2 angles on each of
    ``sides`` faces of the web), with or without fillers ``t_fill`` between the connected
    legs and the web, riveted or welded to the web. Dimensions in the length unit: ``b``
    projecting width (an angle's outstanding leg from its heel), ``t`` thickness, ``b_conn``
    an angle's connected leg, ``clip`` the corner clip at each element's inner end."""

    id: str = Field(min_length=1, max_length=200)
    position: float
    role: StiffenerRole = "intermediate"
    kind: Literal["plates", "angles"] = "plates"
    b: float = Field(gt=0.0)
    t: float = Field(gt=0.0)
    b_conn: float | None = Field(default=None, gt=0.0)
    per_side: int = Field(default=1, ge=1, le=2)
    sides: int = Field(default=2, ge=1, le=2)
    t_fill: float = Field(default=0.0, ge=0.0)
    fillers_carry_load: bool = False
    clip: float = Field(default=0.0, ge=0.0)
    connection: Literal["riveted", "welded"] = "riveted"
    readings: list[StiffenerReading] = Field(default_factory=list)
    bands: list[StiffenerBand] = Field(default_factory=list)
    note: str = ""


class Support(_Model):
    """A support (bearing) of the member at ``position`` (position unit), with its bearing
    length ``N`` along the member, the girder's ``overhang`` beyond the bearing's centre
    (absent: 0, the girder ends at the bearing) and the bearing stiffener over it (its id;
    absent: the bearing stiffener recorded nearest, within the web depth)."""

    id: str = Field(min_length=1, max_length=200)
    position: float
    N: Quantity
    overhang: Quantity | None = None
    stiffener: str | None = None


class UFrames(_Model):
    """U-frames holding a compression flange laterally, at ``positions`` (position unit): a
    floor beam and the verticals (the girder's stiffeners there). Their spring stiffness is
    ``Cd`` (force per length) when entered, else computed from the vertical (``vertical``:
    the stiffener at the frame, or ``Iv``), ``hv`` (flange centroid to the floor beam's
    axis), the floor beam's ``Iq`` and span ``bq`` and the joint's rotational stiffness
    ``Cj`` (absent: rigid)."""

    positions: list[float] = Field(min_length=1, max_length=100)
    Cd: Quantity | None = None
    vertical: str | None = None
    Iv: Quantity | None = None
    hv: Quantity | None = None
    Iq: Quantity | None = None
    bq: Quantity | None = None
    Cj: Quantity | None = None


class FlangeBracing(_Model):
    """How one flange is held laterally: ``none`` (only at the supports), ``discrete``
    brace points (``points``, position unit; the supports count too), ``continuous`` (a deck
    fixed to it) or ``u_frames``."""

    kind: BracingKind = "none"
    points: list[float] = Field(default_factory=list, max_length=500)
    u_frames: UFrames | None = None


class Bracing(_Model):
    """The bracing of the top and the bottom flange (absent: held at the supports only,
    the conservative reading)."""

    top: FlangeBracing | None = None
    bottom: FlangeBracing | None = None


class FatigueData(_Model):
    """The traffic for the fatigue check of the member's riveted details: ``ADTT_SL`` the
    single-lane average daily truck traffic over the life (highway bridges)."""

    ADTT_SL: float | None = Field(default=None, gt=0.0, le=1e5)
