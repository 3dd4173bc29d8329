"""The project spec: pydantic models of the JSON a user writes.

Every dimensional field carries its unit in its name. Models forbid unknown keys so a
typo is reported, not ignored. Cross-field rules live in `latbook.spec.rules`.
"""

from __future__ import annotations

from typing import Annotated, Literal

from pydantic import AfterValidator, BaseModel, BeforeValidator, ConfigDict, Field, model_validator

from latbook.spec.text_rules import not_a_boolean, storable_text

MAX_LEVELS = 12
MAX_WALL_LINES = 80
MAX_SEGMENTS_PER_STORY = 40
MAX_OPENINGS_PER_STORY = 40
MAX_ASSEMBLIES = 40
MAX_TEXT = 500
MAX_REVISIONS = 20

Identifier = Annotated[
    str,
    Field(
        min_length=1,
        max_length=12,
        pattern=r"^[A-Za-z0-9][A-Za-z0-9_-]*$",
        description="Short id: letters, digits, '_' or '-', starting with a letter or digit.",
    ),
]
Text = Annotated[
    str,
    Field(
        max_length=MAX_TEXT,
        description="Free text; no control characters other than tab and line feed.",
    ),
    AfterValidator(storable_text),
]
PositiveFt = Annotated[float, Field(gt=0, le=2000)]
Coordinate = Annotated[float, Field(ge=-5000, le=5000)]


class _Strict(BaseModel):
    # allow_inf_nan=False: NaN and Infinity are reported as "not a finite number"
    model_config = ConfigDict(extra="forbid", frozen=True, allow_inf_nan=False)


RevisionLabel = Annotated[
    str,
    Field(min_length=1, max_length=12, description="e.g. A, 1 or P2."),
    AfterValidator(storable_text),
]
RevisionDate = Annotated[
    str,
    Field(max_length=40, description="Issue date as the engineer writes it, e.g. 2026-12-02."),
    AfterValidator(storable_text),
]
RevisionText = Annotated[str, Field(max_length=200), AfterValidator(storable_text)]
Initials = Annotated[str, Field(max_length=40), AfterValidator(storable_text)]


class Revision(_Strict):
    """One issue of the calculation: a row of the Cover's revision block."""

    revision: RevisionLabel
    date: RevisionDate = ""
    description: RevisionText = Field("", description="What the issue is for or what changed.")
    by: Initials = Field("", description="Name or initials.")


class Project(_Strict):
    """Who, what and which revision: printed on the cover and in every page header."""

    name: Text = Field(min_length=1)
    number: Text = ""
    location: Text = ""
    client: Text = ""
    engineer: Text = ""
    checker: Text = ""
    date: Text = Field("", description="Issue date as the engineer writes it, e.g. 2026-12-02.")
    revision: Text = "0"
    notes: Text = ""
    revisions: list[Revision] = Field(
        default_factory=list,
        max_length=MAX_REVISIONS,
        description="Issues of the calculation, oldest first, for the Cover's revision block; "
        "the last is the current one (revision and date, where given, must match it). Empty: "
        "one row from revision and date.",
    )
    preliminary: bool = Field(
        False,
        description="true marks the calculation 'PRELIMINARY - not for construction' on the "
        "Cover and on every sheet.",
    )


class CodeBasis(_Strict):
    """The standards the calculation follows. Only these editions are implemented."""

    loads: Literal["ASCE 7-16"] = "ASCE 7-16"
    wood: Literal["AWC SDPWS-2015"] = "AWC SDPWS-2015"


class Plan(_Strict):
    """Rectangular plan extents of a level's diaphragm, ft."""

    x_min_ft: Coordinate = 0.0
    x_max_ft: Coordinate
    y_min_ft: Coordinate = 0.0
    y_max_ft: Coordinate

    @model_validator(mode="after")
    def _extents_positive(self) -> Plan:
        if not self.x_max_ft > self.x_min_ft:
            raise ValueError("x_max_ft must be greater than x_min_ft")
        if not self.y_max_ft > self.y_min_ft:
            raise ValueError("y_max_ft must be greater than y_min_ft")
        return self


Psf = Annotated[float, Field(ge=0, le=2000)]
AreaSf = Annotated[float, Field(gt=0, le=1.0e7)]


class AreaWeight(_Strict):
    """A named area load at the level (roof, floor, ceiling...): dead psf x area."""

    name: Text = Field(min_length=1)
    dead_psf: Psf
    area_sf: AreaSf


class WallWeight(_Strict):
    """Walls at the level: psf of wall surface x tributary height x length. The tributary
    height is half the story below plus half the story above (ASCE 7-16 §12.7.2), plus a
    parapet at the highest level."""

    name: Text = Field(min_length=1)
    kind: Literal["exterior", "interior"]
    dead_psf: Psf
    length_ft: Annotated[float, Field(gt=0, le=1.0e5)]
    parapet_height_ft: Annotated[float, Field(ge=0, le=20)] = Field(
        0.0, description="Parapet above the highest level (only there), ft."
    )


class PartitionWeight(_Strict):
    """Partitions where provision for them is made (ASCE 7-16 §12.7.2 item 2): the actual
    weight or 10 psf of floor area, whichever is greater."""

    actual_psf: Psf
    area_sf: AreaSf


class SnowWeight(_Strict):
    """Flat roof snow load pf (ASCE 7-16 §12.7.2 item 4): 20 % of it where pf > 30 psf."""

    pf_psf: Psf
    area_sf: AreaSf


class StorageWeight(_Strict):
    """Floor live load of storage areas (ASCE 7-16 §12.7.2 item 1): 25 % of it is included
    (exceptions a and b of item 1 not taken)."""

    live_psf: Psf
    area_sf: AreaSf


class EquipmentWeight(_Strict):
    """Permanent equipment (ASCE 7-16 §12.7.2 item 3), kip."""

    name: Text = Field(min_length=1)
    weight_kip: Annotated[float, Field(ge=0, le=1.0e5)]


class WeightTakeoff(_Strict):
    """The level's effective seismic weight w_x as the sum of its parts, ASCE 7-16 §12.7.2."""

    areas: list[AreaWeight] = Field(default_factory=list, max_length=40)
    walls: list[WallWeight] = Field(default_factory=list, max_length=40)
    partitions: PartitionWeight | None = Field(
        None, description="Give where provision for partitions is made (§4.3.2)."
    )
    snow: SnowWeight | None = None
    storage: StorageWeight | None = None
    equipment: list[EquipmentWeight] = Field(default_factory=list, max_length=40)


class Level(_Strict):
    """A diaphragm level: its elevation above the base, seismic weight and plan."""

    id: Identifier
    name: Text = ""
    elevation_ft: Annotated[float, Field(gt=0, le=400)]
    seismic_weight_kip: Annotated[float, Field(gt=0, le=1.0e6)] | None = Field(
        None, description="Typed w_x; give this or weight_takeoff, not both."
    )
    weight_takeoff: WeightTakeoff | None = Field(
        None, description="w_x from its parts (Weights sheet); give this or seismic_weight_kip."
    )
    plan: Plan
    wall_height_ft: Annotated[float, Field(gt=0, le=400)] | None = Field(
        None,
        description="Sheathed height of the shear walls in the story below this level (story "
        "height less the floor depth), ft: drives the aspect ratio and Eq. 4.3-1 (AWC "
        "SDPWS-2015 §4.3.4, §4.3.2). Blank: the story height. A segment's height_ft overrides "
        "it; the story height stays the drift height hsx.",
    )
    diaphragm_assembly: Identifier | None = Field(
        None, description="Id of an entry in assemblies.diaphragms."
    )


class Building(_Strict):
    """Levels and the ordering convention they are listed in."""

    level_order: Literal["bottom_up", "top_down"] = Field(
        "bottom_up", description="Order of `levels`: elevations must strictly follow it."
    )
    risk_category: Literal["I", "II", "III", "IV"] = "II"
    levels: list[Level] = Field(min_length=1, max_length=MAX_LEVELS)


class SiteClassMotion(_Strict):
    """Mapped accelerations and site class: Fa, Fv from ASCE 7-16 Tables 11.4-1/11.4-2."""

    method: Literal["site_class"]
    Ss_g: Annotated[float, Field(ge=0, le=5.0)]
    S1_g: Annotated[float, Field(ge=0, le=3.0)]
    site_class: Literal["A", "B", "C", "D", "E"]
    site_class_basis: Literal["site_data", "default_D", "B_unmeasured_vs"] = Field(
        "site_data",
        description="'site_data': site class from ASCE 7-16 ch. 20; 'default_D': soil "
        "properties not known, Site D by §11.4.3 (Fa not less than 1.2, §11.4.4); "
        "'B_unmeasured_vs': Site B without measured shear-wave velocity (Fa = Fv = 1.0).",
    )


class DirectMotion(_Strict):
    """Design accelerations given directly (e.g. from a site-specific study)."""

    method: Literal["direct"]
    SDS_g: Annotated[float, Field(gt=0, le=4.0)]
    SD1_g: Annotated[float, Field(gt=0, le=3.0)]
    S1_g: Annotated[float, Field(ge=0, le=3.0)]


GroundMotion = Annotated[SiteClassMotion | DirectMotion, Field(discriminator="method")]


TABLE_12_2_1_ENTRIES = ("A.15", "A.16", "A.17", "A.18", "B.22", "B.23", "B.24", "other")


class IrregularityDeclarations(_Strict):
    """Irregularities of ASCE 7-16 Tables 12.3-1 / 12.3-2 the tool cannot judge: the
    designer's declaration (false: not present)."""

    torsional_1a: bool = False
    extreme_torsional_1b: bool = False
    diaphragm_discontinuity_3: bool = False
    vertical_geometric_3: bool = False


class SeismicSystem(_Strict):
    """Seismic force-resisting system (ASCE 7-16 Table 12.2-1 row chosen by the engineer)."""

    label: Text = Field(min_length=1)
    R: Annotated[float, Field(ge=1.0, le=8.0)]
    Cd: Annotated[float, Field(ge=1.0, le=6.5)]
    Omega0: Annotated[float, Field(ge=1.0, le=3.0)]
    table_12_2_1_entry: Literal[TABLE_12_2_1_ENTRIES] = Field(  # type: ignore[valid-type]
        "other",
        description="ASCE 7-16 Table 12.2-1 entry of the system: A.15-A.17 and B.22-B.24 are the "
        "light-frame shear-wall systems for which the collector exception of §12.10.2.1 is the "
        "default; 'other' for any other system.",
    )


class Seismic(_Strict):
    """Seismic hazard and system for the equivalent lateral force procedure."""

    ground_motion: GroundMotion
    system: SeismicSystem
    structure_type: Literal[
        "steel_moment_frame", "concrete_moment_frame", "steel_eccentric_braced_frame", "all_other"
    ] = Field("all_other", description="ASCE 7-16 Table 12.8-2 row for Ct and x.")
    TL_s: Annotated[float, Field(gt=0, le=20)] = 8.0
    T_computed_s: Annotated[float, Field(gt=0, le=10)] | None = Field(
        None, description="Period from a substantiated analysis; capped at Cu Ta."
    )
    rho_method: Literal["typed", "removal_test", "perimeter_bays"] = Field(
        "typed",
        description="How rho is set: 'typed' (the designer's value, an override of §12.3.4), "
        "'removal_test' (§12.3.4.2 a, Table 12.3-3) or 'perimeter_bays' (§12.3.4.2 b).",
    )
    # a JSON true equals 1.0 in Python: refused before the literal check
    rho: Annotated[Literal[1.0, 1.3], BeforeValidator(not_a_boolean)] = Field(
        1.0, description="Redundancy factor typed by the designer (rho_method 'typed' only)."
    )
    limit_Ss_for_Cs: bool = Field(
        False,
        description="Take Ss = 1.5 in computing Cs (ASCE 7-16 §12.8.1.3); refused unless all "
        "of its conditions hold.",
    )
    declared_irregularities: IrregularityDeclarations = Field(
        default_factory=IrregularityDeclarations,
        description="Irregularities this tool cannot judge, as declared by the designer.",
    )
    collector_light_frame_exception: bool | None = Field(
        None,
        description="ASCE 7-16 §12.10.2.1 Exception 1 (structure braced entirely by light-frame "
        "shear walls: collectors designed for the §12.10.1.1 forces without overstrength). "
        "Blank: taken where system.table_12_2_1_entry is a light-frame shear-wall entry, not "
        "taken otherwise. false: declined (collectors in SDC C-F take the overstrength forces). "
        "true: declared by the designer.",
    )
    omega0_flexible_diaphragm_reduction: bool = Field(
        False,
        description="ASCE 7-16 Table 12.2-1 footnote g: with flexible diaphragms, Ω0 may be "
        "reduced by 0.5 where the tabulated Ω0 is 2.5 or more. Every diaphragm here is analysed "
        "as flexible. Default false (the tabulated Ω0).",
    )


class Wind(_Strict):
    """MWFRS wind, directional procedure (ASCE 7-16 ch. 26-27 Part 1)."""

    V_mph: Annotated[float, Field(ge=85, le=300)]
    exposure: Literal["B", "C", "D"]
    Kzt: Annotated[float, Field(ge=1.0, le=3.0)] = 1.0
    Kd: Annotated[float, Field(gt=0, le=1.0)] = 0.85
    ground_elevation_ft: Annotated[float, Field(ge=-500, le=15000)] = 0.0
    use_Ke: bool = Field(True, description="False takes Ke = 1.0, always permitted (§26.9).")
    G: Annotated[float, Field(gt=0, le=2.0)] = 0.85
    enclosure: Literal["enclosed", "partially_enclosed", "partially_open"] = Field(
        "enclosed", description="ASCE 7-16 §26.2 enclosure class; GCpi from Table 26.13-1."
    )
    mean_roof_height_ft: Annotated[float, Field(gt=0, le=400)]
    parapet_height_ft: Annotated[float, Field(ge=0, le=20)] = 0.0
    roof_slope_deg: Annotated[float, Field(ge=0, le=10)] = Field(
        0.0,
        description="Roof slope θ. Roof uplift uses ASCE 7-16 Fig. 27.3-1 for θ <= 10° (and for "
        "wind parallel to the ridge); steeper roofs are outside this tool.",
    )
    roof_projection_above_h_ft: Annotated[float, Field(ge=0, le=100)] = Field(
        0.0,
        description="Height of the roof's projection on a vertical plane above the mean roof "
        "height (ridge height minus h; 0 for a flat roof): loaded with 8 psf in the §27.1.5 "
        "minimum case.",
    )
    torsional_load_cases: Literal["by_appendix_d", "all_cases", "cases_1_and_3"] = Field(
        "by_appendix_d",
        description="ASCE 7-16 Fig. 27.3-8 load cases applied to the diaphragms: by_appendix_d "
        "(Cases 1 and 3 only where Appendix D, D1.1 exempts the building, else all four); "
        "all_cases; cases_1_and_3 (only for a building that D1.1 exempts).",
    )


DIAPHRAGM_SHEATHING = (
    "wsp_blocked",
    "wsp_unblocked",
    "lumber_single_straight",
    "lumber_single_diagonal",
    "lumber_double_diagonal",
)
"""Diaphragm sheathing types of AWC SDPWS-2015 Table 4.2.4 (latbook's own names)."""

WALL_SHEATHING = (
    "wsp_blocked",
    "wsp_unblocked",
    "particleboard_blocked",
    "structural_fiberboard",
    "gypsum_board_blocked",
    "gypsum_board_unblocked",
    "portland_cement_plaster_blocked",
    "portland_cement_plaster_unblocked",
    "lumber_diagonal",
)
"""Shear-wall sheathing types of AWC SDPWS-2015 Table 4.3.4 (latbook's own names)."""


class DiaphragmAssembly(_Strict):
    """A diaphragm sheathing/nailing assembly and its nominal unit shear capacities."""

    id: Identifier
    description: Text = ""
    sheathing: Literal[DIAPHRAGM_SHEATHING] = Field(  # type: ignore[valid-type]
        "wsp_blocked",
        description="Sheathing type: sets the maximum aspect ratio L/W of AWC SDPWS-2015 "
        "Table 4.2.4.",
    )
    vs_nominal_plf: Annotated[float, Field(gt=0, le=10000)]
    vw_nominal_plf: Annotated[float, Field(gt=0, le=15000)]
    chord_capacity_lb: Annotated[float, Field(gt=0, le=1.0e7)] | None = Field(
        None,
        description="Chord axial capacity at the design method's level (ASD allowable or "
        "LRFD design strength), lb; optional, gives a chord demand/capacity ratio.",
    )
    collector_capacity_lb: Annotated[float, Field(gt=0, le=1.0e7)] | None = Field(
        None,
        description="Collector (drag strut) axial capacity at the design method's level, lb; "
        "optional, gives a collector demand/capacity ratio.",
    )
    Ga_kips_per_in: Annotated[float, Field(gt=0, le=500)] | None = Field(
        None,
        description="Apparent diaphragm shear stiffness Ga, kips/in (AWC SDPWS-2015 Tables "
        "4.2A-C, §4.2.2); optional, with the chord and splice inputs gives the diaphragm "
        "deflection (Eq. 4.2-1).",
    )
    chord_E_psi: Annotated[float, Field(gt=0, le=5.0e7)] | None = Field(
        None, description="Chord modulus of elasticity E, psi (SDPWS-2015 Eq. 4.2-1); optional."
    )
    chord_A_in2: Annotated[float, Field(gt=0, le=500)] | None = Field(
        None, description="Chord cross-section area A, in² (SDPWS-2015 Eq. 4.2-1); optional."
    )
    chord_splice_slip_in: Annotated[float, Field(ge=0, le=1.0)] | None = Field(
        None,
        description="Chord splice slip Δc at the induced unit shear, in, taken as given for "
        "every splice (SDPWS-2015 Eq. 4.2-1); 0 for chords without slip; optional.",
    )
    chord_splice_spacing_ft: Annotated[float, Field(gt=0, le=1000)] | None = Field(
        None,
        description="Largest distance between chord splices, ft: Σ(xΔc) of SDPWS-2015 Eq. "
        "4.2-1 is taken as its upper bound for splices at most this far apart; optional.",
    )


class ShearWallAssembly(_Strict):
    """A shear-wall assembly: nominal capacities, stiffness and end-post/hold-down data.

    The capacities and Ga are those of face 1; a wall sheathed on both faces gives face 2's
    sheathing, capacities and Ga (AWC SDPWS-2015 §4.3.3.2 combines them)."""

    id: Identifier
    description: Text = ""
    sheathing: Literal[WALL_SHEATHING] = Field(  # type: ignore[valid-type]
        "wsp_blocked",
        description="Sheathing type of face 1: sets the aspect-ratio limit and factor of AWC "
        "SDPWS-2015 Table 4.3.4, §4.3.4.",
    )
    vs_nominal_plf: Annotated[float, Field(gt=0, le=10000)]
    vw_nominal_plf: Annotated[float, Field(gt=0, le=15000)]
    Ga_seismic_kips_per_in: Annotated[float, Field(gt=0, le=500)]
    Ga_wind_kips_per_in: Annotated[float, Field(gt=0, le=500)] | None = None
    face2_sheathing: Literal[WALL_SHEATHING] | None = Field(  # type: ignore[valid-type]
        None, description="Sheathing type of the opposite face; blank: sheathed on one face."
    )
    face2_vs_nominal_plf: Annotated[float, Field(gt=0, le=10000)] | None = None
    face2_vw_nominal_plf: Annotated[float, Field(gt=0, le=15000)] | None = None
    face2_Ga_kips_per_in: Annotated[float, Field(gt=0, le=500)] | None = Field(
        None,
        description="Apparent shear stiffness of face 2 (wind and seismic), added to face 1's "
        "for Eq. 4.3-1 where face 2 counts.",
    )
    end_post_E_psi: Annotated[float, Field(gt=0, le=5.0e7)] = 1.6e6
    end_post_A_in2: Annotated[float, Field(gt=0, le=500)]
    hold_down_delta_in: Annotated[float, Field(ge=0, le=2.0)] = Field(
        description="Anchorage elongation Δa taken as given (not scaled with the force) for "
        "segments that give no rated hold-down elongation, in."
    )

    @model_validator(mode="after")
    def _face2_complete(self) -> ShearWallAssembly:
        given = [
            self.face2_sheathing is not None,
            self.face2_vs_nominal_plf is not None,
            self.face2_vw_nominal_plf is not None,
            self.face2_Ga_kips_per_in is not None,
        ]
        if any(given) and not all(given):
            raise ValueError(
                "a second face needs face2_sheathing, face2_vs_nominal_plf, "
                "face2_vw_nominal_plf and face2_Ga_kips_per_in together"
            )
        return self


class Assemblies(_Strict):
    diaphragms: list[DiaphragmAssembly] = Field(default_factory=list, max_length=MAX_ASSEMBLIES)
    shear_walls: list[ShearWallAssembly] = Field(default_factory=list, max_length=MAX_ASSEMBLIES)


class Segment(_Strict):
    """A full-height shear-wall segment on a wall line at one story."""

    id: Identifier
    start_ft: Annotated[float, Field(ge=0, le=5000)] = Field(
        description="Distance along the line from the line's start (plan minimum), ft."
    )
    length_ft: Annotated[float, Field(gt=0, le=1000)]
    assembly: Identifier
    height_ft: PositiveFt | None = Field(None, description="Default: the story height.")
    dead_load_plf: Annotated[float, Field(ge=0, le=20000)] = 0.0
    point_load_start_lb: Annotated[float, Field(ge=0, le=1.0e6)] = 0.0
    point_load_end_lb: Annotated[float, Field(ge=0, le=1.0e6)] = 0.0
    hold_down_offset_ft: Annotated[float, Field(ge=0, le=5)] = 0.25
    hold_down_continues_below: bool = Field(
        False, description="True: the hold-down stacks onto the segment below."
    )
    roof_bearing_width_ft: Annotated[float, Field(ge=0, le=2000)] | None = Field(
        None,
        description="Width of roof bearing on the segment, ft, for the wind uplift on the roof "
        "(ASCE 7-16 Fig. 27.3-1, Table 26.13-1). Blank: in the top story, the line's tributary "
        "width at the roof (half the distance to the neighbouring parallel lines, the whole "
        "overhang at an outermost line); 0 in lower stories. 0: carries no roof.",
    )
    hold_down_capacity_lb: Annotated[float, Field(gt=0, le=1.0e6)] | None = Field(
        None,
        description=(
            "Hold-down tension capacity at the design method's level (allowable for ASD, design"
            " strength for LRFD), lb: the engineer's input from the hold-down manufacturer's"
            " published values. Blank: no hold-down check (the Summary says so)."
        ),
    )
    hold_down_elongation_in: Annotated[float, Field(ge=0, le=2.0)] | None = Field(
        None,
        description="Hold-down elongation at its rated load (manufacturer's value), in. Given: "
        "Δa of Eq. 4.3-1 is this times the hold-down force at the deflection level over the "
        "rated load, plus shrinkage and crushing. Blank: the assembly's hold_down_delta_in, "
        "as given.",
    )
    hold_down_rated_load_lb: Annotated[float, Field(gt=0, le=1.0e6)] | None = Field(
        None,
        description="Load at which hold_down_elongation_in is rated (allowable or design), lb; "
        "required with it.",
    )
    shrinkage_in: Annotated[float, Field(ge=0, le=2.0)] = Field(
        0.0,
        description="Wood shrinkage in the anchorage path of this story, added to Δa, in.",
    )
    crushing_in: Annotated[float, Field(ge=0, le=1.0)] = Field(
        0.0,
        description="Crushing of the sill or bearing under the compression post, added to Δa, in.",
    )
    post_D_lb: Annotated[float, Field(ge=0, le=1.0e6)] | None = Field(
        None,
        description="Tributary dead load on the compression end post (the larger end), lb, "
        "added to the dead point load in the compression combinations. Blank with the other "
        "post loads blank: the compression column is the overturning part and dead point load "
        "only.",
    )
    post_L_lb: Annotated[float, Field(ge=0, le=1.0e6)] | None = Field(
        None, description="Tributary floor live load L on the end post, lb."
    )
    post_Lr_lb: Annotated[float, Field(ge=0, le=1.0e6)] | None = Field(
        None, description="Tributary roof live load Lr on the end post, lb."
    )
    post_S_lb: Annotated[float, Field(ge=0, le=1.0e6)] | None = Field(
        None, description="Tributary snow load S on the end post, lb."
    )
    sill_anchor_capacity_lb: Annotated[float, Field(gt=0, le=1.0e5)] | None = Field(
        None,
        description="Lateral capacity of one sill anchor bolt or fastener at the design "
        "method's level, lb (bottom story only): gives the required spacing. Blank: no "
        "anchorage spacing.",
    )


class Opening(_Strict):
    start_ft: Annotated[float, Field(ge=0, le=5000)]
    length_ft: Annotated[float, Field(gt=0, le=1000)]
    label: Text = ""


class LineStory(_Strict):
    """The walls of one wall line in the story below `level` (the level they support)."""

    level: Identifier
    segments: list[Segment] = Field(default_factory=list, max_length=MAX_SEGMENTS_PER_STORY)
    openings: list[Opening] = Field(default_factory=list, max_length=MAX_OPENINGS_PER_STORY)


class WallLine(_Strict):
    """A line of shear walls parallel to x or y at a fixed plan position."""

    id: Identifier
    direction: Literal["x", "y"] = Field(
        description="'x': the line runs parallel to x and resists loads in x."
    )
    position_ft: Coordinate = Field(description="y of an x-line, or x of a y-line, ft.")
    stories: list[LineStory] = Field(min_length=1, max_length=MAX_LEVELS)


class ShearWallOptions(_Strict):
    """Choices for the shear-wall checks."""

    line_distribution: Literal["deflection", "capacity"] = Field(
        "deflection",
        description="How a line's shear is shared by its segments (AWC SDPWS-2015 §4.3.3.4.1): "
        "'deflection' (the same top displacement by Eq. 4.3-1, the rule; two fixed passes "
        "because Δa depends on the hold-down force) or 'capacity' (the Exception: in proportion "
        "to L k v, the segments' design capacities).",
    )


class DiaphragmOptions(_Strict):
    """Choices for the diaphragm checks."""

    cantilever_deflection_tolerated: bool = Field(
        False,
        description="AWC SDPWS-2015 §4.2.5.2: where calculations show that the diaphragm "
        "deflections can be tolerated, the cantilever length-to-width ratio may be up to 1.5 "
        "(wood structural panels); default false: 1.0 for one story, 0.67 for more.",
    )


class DriftLimits(_Strict):
    seismic_row: Literal[
        "four_story_drift_tolerant", "masonry_cantilever", "other_masonry", "all_other"
    ] = Field("all_other", description="ASCE 7-16 Table 12.12-1 row.")
    wind_ratio: Annotated[float, Field(ge=100, le=2000)] = Field(
        400, description="Wind drift limit h/ratio: serviceability, common practice, no code limit."
    )
    wind_serviceability_factor: Annotated[float, Field(ge=0.2, le=1.0)] = Field(
        0.42,
        description="Factor on strength-level W for the wind drift check (serviceability). "
        "Default 0.42: about the 10-year mean recurrence interval wind of the ASCE 7-16 "
        "Appendix C commentary (CC.2.2), the factor IBC 2018 Table 1604.3 note f allows for "
        "deflection (common practice). 1.0: strength-level W.",
    )


class Spec(_Strict):
    """A latbook project spec."""

    model_config = ConfigDict(
        extra="forbid", frozen=True, populate_by_name=True, allow_inf_nan=False
    )

    schema_ref: Text | None = Field(None, alias="$schema", description="Editor hint; ignored.")
    project: Project
    code: CodeBasis = CodeBasis()
    design_method: Literal["ASD", "LRFD"]
    building: Building
    seismic: Seismic | None = None
    wind: Wind | None = None
    assemblies: Assemblies = Assemblies()
    wall_lines: list[WallLine] = Field(default_factory=list, max_length=MAX_WALL_LINES)
    drift: DriftLimits = DriftLimits()
    diaphragms: DiaphragmOptions = DiaphragmOptions()
    shear_walls: ShearWallOptions = ShearWallOptions()

    @model_validator(mode="after")
    def _some_load(self) -> Spec:
        if self.seismic is None and self.wind is None:
            raise ValueError("give at least one of 'seismic' or 'wind'")
        return self
