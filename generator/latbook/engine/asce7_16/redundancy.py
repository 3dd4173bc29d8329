"""ASCE 7-16 §12.3.4: redundancy factor rho (from memory of the 2016 text).

§12.3.4.1: rho = 1.0 in SDC B and C (and for drift, diaphragm forces from Eqs. 12.10-1 to
12.10-3, collectors with overstrength, among others). §12.3.4.2: in SDC D to F rho = 1.3 unless
(a) each story resisting more than 35 % of the base shear in the direction of interest complies
with Table 12.3-3, or (b) the structure is regular in plan at all levels and has at least two
bays of seismic force-resisting perimeter framing on each side in each orthogonal direction at
each story resisting more than 35 % of the base shear; for light-frame construction the number
of bays of a shear wall is 2 L / hsx. SDC D with an extreme torsional irregularity (Table 12.3-1
Type 1b) takes rho = 1.3.

Table 12.3-3, shear walls: removing a shear wall or wall pier with height-to-length ratio > 1.0
in any story must not reduce the story strength by more than 33 %, nor create an extreme
torsional irregularity.
"""

RHO_REDUNDANT = 1.0
RHO_NOT_REDUNDANT = 1.3

#: Story shear fraction above which a story must meet §12.3.4.2 (a) or (b).
SIGNIFICANT_STORY_SHEAR = 0.35
#: Table 12.3-3: walls with h/l above this are "removed" one at a time.
REMOVAL_ASPECT_RATIO = 1.0
#: Table 12.3-3: largest permitted story strength reduction.
MAX_STRENGTH_REDUCTION = 0.33
#: §12.3.4.2 (b): bays of perimeter framing needed on each side.
MIN_PERIMETER_BAYS = 2.0

SDC_RHO_ONE = ("A", "B", "C")


def story_is_significant(story_shear_fraction: float) -> bool:
    """True where the story resists more than 35 % of the base shear, §12.3.4.2 [-]."""
    return story_shear_fraction > SIGNIFICANT_STORY_SHEAR


def wall_is_removable(h_over_l: float) -> bool:
    """True for a shear wall or pier of h/l > 1.0, which Table 12.3-3 removes [-]."""
    return h_over_l > REMOVAL_ASPECT_RATIO


def strength_reduction(wall_strength: float, story_strength: float) -> float:
    """Fraction of the story strength lost when one wall is removed, Table 12.3-3 [-]."""
    if story_strength <= 0:
        raise ValueError("story strength must be > 0")
    return wall_strength / story_strength


def removal_test_ok(largest_reduction: float) -> bool:
    """Table 12.3-3: no single removal reduces story strength by more than 33 % [-]."""
    return largest_reduction <= MAX_STRENGTH_REDUCTION


def light_frame_bays(length_ft: float, hsx_ft: float) -> float:
    """Bays of a light-frame shear wall, 2 L / hsx, ASCE 7-16 §12.3.4.2 (b) [-]."""
    if hsx_ft <= 0:
        raise ValueError("story height must be > 0 ft")
    return 2.0 * length_ft / hsx_ft


def perimeter_ok(bays_side_1: float, bays_side_2: float) -> bool:
    """§12.3.4.2 (b): at least two bays of perimeter framing on each side [-]."""
    return bays_side_1 >= MIN_PERIMETER_BAYS and bays_side_2 >= MIN_PERIMETER_BAYS


def rho(sdc: str, condition_met: bool, extreme_torsion_1b: bool) -> float:
    """Redundancy factor for one direction, ASCE 7-16 §12.3.4.1 / §12.3.4.2 [-]."""
    if sdc in SDC_RHO_ONE:
        return RHO_REDUNDANT
    if sdc == "D" and extreme_torsion_1b:
        return RHO_NOT_REDUNDANT
    return RHO_REDUNDANT if condition_met else RHO_NOT_REDUNDANT
