"""Segmented wood shear walls: aspect ratio, distribution in a line, overturning, deflection.

AWC SDPWS-2015 §4.3. Clause numbers and the aspect-ratio provisions are quoted from memory
of the 2015 edition (Table 4.3.4, §4.3.4.2, §4.3.3.4.1, §4.3.6); the SDPWS-2015 change
summary (STRUCTURE magazine, July 2015) confirms the new WSP aspect-ratio strength factor
applies to both wind and seismic design.

Distribution within a line (one formulation, used throughout latbook):
  each full-height segment i carries V_i = V * (L_i k_i) / sum(L_j k_j), i.e. in proportion
  to its design capacity (SDPWS-2015 §4.3.3.4.1 Exception). k_i is the segment's capacity
  factor (1.0 for h/b <= 2). The check is made on effective length:
      v_eff = V / sum(L_j k_j)  <=  unreduced design unit shear capacity,
  which is the same demand/capacity ratio for every segment. The segment's physical unit
  shear v_i = V_i / L_i (= k_i v_eff) is the v used for deflection (Eq. 4.3-1) and sill
  anchorage.

Overturning (rigid-body statics of a segment, AWC ASD/LRFD Manual M14.3 form):
  M_ot about the segment base; the dead-load resisting moment is taken about the compression
  (pivot) end; hold-down T = (M_ot - dead_factor M_r) / (L - offset). Two ways to stack
  stories; use ONE: (a) pass every level's force with its height above this segment's base
  (full cantilever moment; do not accumulate), or (b) pass only this story's shear at this
  story's height and add the stacked hold-down force from the wall above with
  `accumulate_hold_down`.
"""

from typing import Literal

from latbook.engine.errors import CodeLimitError

ASPECT_RATIO_LIMIT_WSP = 3.5
"""Maximum h/bs for blocked wood structural panel shear walls, SDPWS-2015 Table 4.3.4
(from memory)."""

ASPECT_RATIO_LIMITS: dict[str, float] = {
    "wsp_blocked": ASPECT_RATIO_LIMIT_WSP,
    "wsp_unblocked": 2.0,
}
"""Maximum h/bs by sheathing, SDPWS-2015 Table 4.3.4 (from memory)."""

WSP_FULL_STRENGTH_ASPECT_RATIO = 2.0
"""h/bs above which WSP shear wall strength is reduced, SDPWS-2015 §4.3.4.2 (from memory)."""


def aspect_ratio(h_ft: float, b_ft: float) -> float:
    """Shear wall segment aspect ratio h/bs, SDPWS-2015 §4.3.4 [-]."""
    if h_ft <= 0 or b_ft <= 0:
        raise ValueError("height and length must be positive")
    return h_ft / b_ft


def meets_aspect_ratio_limit_wsp(
    h_ft: float, b_ft: float, limit: float = ASPECT_RATIO_LIMIT_WSP
) -> bool:
    """True where h/bs <= the Table 4.3.4 limit, so the segment counts as a shear wall,
    SDPWS-2015 §4.3.4 [-]."""
    return aspect_ratio(h_ft, b_ft) <= limit + 1e-12


def _require_qualifying(h_ft: float, b_ft: float) -> float:
    ratio = aspect_ratio(h_ft, b_ft)
    if not meets_aspect_ratio_limit_wsp(h_ft, b_ft):
        raise CodeLimitError(
            f"h/bs = {ratio:.3f} exceeds {ASPECT_RATIO_LIMIT_WSP} for wood structural panel "
            "shear walls (SDPWS-2015 Table 4.3.4); the segment cannot resist shear"
        )
    return ratio


def aspect_ratio_factor_wsp(h_ft: float, b_ft: float) -> float:
    """WSP strength factor 1.0 for h/bs <= 2, else 1.25 - 0.125 h/bs (wind and seismic),
    SDPWS-2015 §4.3.4.2 (from memory) [-]."""
    ratio = _require_qualifying(h_ft, b_ft)
    if ratio <= WSP_FULL_STRENGTH_ASPECT_RATIO:
        return 1.0
    return 1.25 - 0.125 * ratio


def strength_proportion_factor_wsp(h_ft: float, b_ft: float) -> float:
    """Factor 2bs/h (1.0 for h/bs <= 2) on nominal capacity that permits distribution in
    proportion to design capacity, SDPWS-2015 §4.3.3.4.1 Exception (from memory) [-]."""
    ratio = _require_qualifying(h_ft, b_ft)
    if ratio <= WSP_FULL_STRENGTH_ASPECT_RATIO:
        return 1.0
    return 2.0 / ratio


def line_effective_length_ft(lengths_ft: list[float], factors: list[float]) -> float:
    """Effective length of a line, sum(L_i k_i), SDPWS-2015 §4.3.3.4.1 [ft]."""
    if len(lengths_ft) != len(factors):
        raise ValueError("one factor per segment length is required")
    if not lengths_ft:
        raise ValueError("a shear wall line needs at least one segment")
    if any(length <= 0 for length in lengths_ft) or any(k <= 0 for k in factors):
        raise ValueError("segment lengths and factors must be positive")
    return sum(length * k for length, k in zip(lengths_ft, factors, strict=True))


def distribute_line_shear(
    V_lb: float, lengths_ft: list[float], factors: list[float]
) -> list[float]:
    """Line shear split to segments in proportion to L_i k_i (design capacity),
    SDPWS-2015 §4.3.3.4.1 [lb]."""
    effective_ft = line_effective_length_ft(lengths_ft, factors)
    return [V_lb * length * k / effective_ft for length, k in zip(lengths_ft, factors, strict=True)]


def line_unit_shear_plf(V_lb: float, lengths_ft: list[float], factors: list[float]) -> float:
    """Effective unit shear V / sum(L_i k_i), to compare with the unreduced design unit shear
    capacity, SDPWS-2015 §4.3.3.4.1 [plf]."""
    return V_lb / line_effective_length_ft(lengths_ft, factors)


def segment_unit_shear_plf(V_segment_lb: float, L_ft: float) -> float:
    """Physical unit shear in one segment v = V_i / L_i (the v of Eq. 4.3-1),
    SDPWS-2015 §4.3.2 [plf]."""
    if L_ft <= 0:
        raise ValueError("segment length must be positive")
    return V_segment_lb / L_ft


def overturning_moment_lbft(
    shears_lb_above: list[float], heights_above_base_ft: list[float]
) -> float:
    """Overturning moment at the segment base, sum V_j h_j with h_j from this base to where
    level j's shear acts, statics for SDPWS-2015 §4.3.6.4.2 uplift anchorage [lb-ft]."""
    if len(shears_lb_above) != len(heights_above_base_ft):
        raise ValueError("one height per shear is required")
    if any(h < 0 for h in heights_above_base_ft):
        raise ValueError("heights above the segment base must be non-negative")
    return sum(v * h for v, h in zip(shears_lb_above, heights_above_base_ft, strict=True))


def resisting_moment_lbft(
    w_dead_plf: float,
    L_ft: float,
    P_left_lb: float = 0.0,
    P_right_lb: float = 0.0,
    pivot: Literal["right", "left"] = "right",
) -> float:
    """Dead-load resisting moment about the compression (pivot) end: w L^2/2 plus the end
    point load at the far end times L, statics (AWC Manual M14.3) [lb-ft].

    pivot="right" (default) is the compression end for a lateral load acting toward the right
    (+x); the uplift end is then the left one, so P_left_lb has arm L and P_right_lb, acting
    at the pivot, has none. pivot="left" is the mirror case.
    """
    if L_ft <= 0:
        raise ValueError("segment length must be positive")
    if pivot not in ("right", "left"):
        raise ValueError("pivot must be 'right' or 'left'")
    far_end_load_lb = P_left_lb if pivot == "right" else P_right_lb
    return w_dead_plf * L_ft**2 / 2.0 + far_end_load_lb * L_ft


def _moment_arm_ft(L_ft: float, offset_ft: float) -> float:
    arm_ft = L_ft - offset_ft
    if arm_ft <= 0:
        raise ValueError("offset_ft must be smaller than the segment length")
    return arm_ft


def net_uplift_lb(
    M_ot_lbft: float, M_r_lbft: float, dead_factor: float, L_ft: float, offset_ft: float
) -> float:
    """Unfloored net uplift (M_ot - dead_factor M_r)/(L - offset); negative means the dead
    load holds the end down, SDPWS-2015 §4.3.6.4.2 (statics) [lb]."""
    return (M_ot_lbft - dead_factor * M_r_lbft) / _moment_arm_ft(L_ft, offset_ft)


def hold_down_tension_lb(
    M_ot_lbft: float, M_r_lbft: float, dead_factor: float, L_ft: float, offset_ft: float
) -> float:
    """Hold-down tension T = (M_ot - dead_factor M_r)/(L - offset), floored at 0,
    SDPWS-2015 §4.3.6.4.2 [lb].

    offset_ft is the sum of the distances from the wall ends to the hold-down centroid and to
    the compression post centroid; dead_factor is the load-combination factor on D (e.g. 0.6
    for ASD wind, ASCE 7-16 §2.4.1).
    """
    return max(0.0, net_uplift_lb(M_ot_lbft, M_r_lbft, dead_factor, L_ft, offset_ft))


def accumulate_hold_down(T_this_story_lb: float, T_from_above_lb: float) -> float:
    """Hold-down tension in a stacked wall: this story's plus the hold-down force delivered
    from the wall above, statics (common practice) [lb]."""
    return T_this_story_lb + T_from_above_lb


def end_post_compression_lb(
    M_ot_lbft: float, L_ft: float, offset_ft: float, gravity_at_end_lb: float
) -> float:
    """End-post compression M_ot/(L - offset) plus the gravity load on the post,
    SDPWS-2015 §4.3.6.1.1 (statics) [lb]."""
    return M_ot_lbft / _moment_arm_ft(L_ft, offset_ft) + gravity_at_end_lb


def sliding_unit_shear_plf(V_lb: float, L_ft: float) -> float:
    """Unit shear to be carried by the sill anchorage, V / L, SDPWS-2015 §4.3.6.4.1 [plf]."""
    return segment_unit_shear_plf(V_lb, L_ft)


def deflection_bending_in(
    v_plf: float, h_ft: float, E_psi: float, A_in2: float, b_ft: float
) -> float:
    """Bending term 8 v h^3 / (E A b) of SDPWS-2015 Eq. 4.3-1 [in]
    (v plf, h ft, E psi, A end-post area in^2, b ft)."""
    if E_psi <= 0 or A_in2 <= 0 or b_ft <= 0:
        raise ValueError("E, A and b must be positive")
    return 8.0 * v_plf * h_ft**3 / (E_psi * A_in2 * b_ft)


def deflection_shear_in(v_plf: float, h_ft: float, Ga_kips_per_in: float) -> float:
    """Shear term v h / (1000 Ga) of SDPWS-2015 Eq. 4.3-1 [in] (v plf, h ft, Ga kips/in)."""
    if Ga_kips_per_in <= 0:
        raise ValueError("Ga must be positive")
    return v_plf * h_ft / (1000.0 * Ga_kips_per_in)


def deflection_anchorage_in(h_ft: float, delta_a_in: float, b_ft: float) -> float:
    """Anchorage term h delta_a / b of SDPWS-2015 Eq. 4.3-1 [in]
    (delta_a = total vertical elongation of the wall anchorage, in)."""
    if b_ft <= 0:
        raise ValueError("b must be positive")
    return h_ft * delta_a_in / b_ft


def shear_wall_deflection_in(
    v_plf: float,
    h_ft: float,
    E_psi: float,
    A_in2: float,
    b_ft: float,
    Ga_kips_per_in: float,
    delta_a_in: float,
) -> float:
    """Shear wall deflection, sum of bending, shear and anchorage terms,
    SDPWS-2015 Eq. 4.3-1 [in] (v plf, h ft, E psi, A in^2, b ft, Ga kips/in, delta_a in)."""
    return (
        deflection_bending_in(v_plf, h_ft, E_psi, A_in2, b_ft)
        + deflection_shear_in(v_plf, h_ft, Ga_kips_per_in)
        + deflection_anchorage_in(h_ft, delta_a_in, b_ft)
    )


def chord_rotation_rad(
    M_top_lbft: float, M_base_lbft: float, h_ft: float, E_psi: float, A_in2: float, b_ft: float
) -> float:
    """Rotation of a segment's top relative to its base from the axial strain of its two end
    posts, h (M_top + M_base) / (E A b^2): chord forces M/b varying linearly over the height;
    with M_top = 0 it is the slope of the bending term of Eq. 4.3-1 (1.5 x 8vh^3/(EAb) / h),
    mechanics of materials [rad] (M lb-ft, h ft, E psi, A in^2, b ft)."""
    if E_psi <= 0 or A_in2 <= 0 or b_ft <= 0:
        raise ValueError("E, A and b must be positive")
    return h_ft * (M_top_lbft + M_base_lbft) / (E_psi * A_in2 * b_ft**2)


def anchorage_rotation_rad(delta_a_in: float, b_ft: float) -> float:
    """Rigid-body rotation of a segment from its anchorage elongation, Δa / b (the anchorage
    term of Eq. 4.3-1 over h) [rad] (Δa in, b ft)."""
    if b_ft <= 0:
        raise ValueError("b must be positive")
    return delta_a_in / (12.0 * b_ft)
