"""ASCE 7-16 §12.8: equivalent lateral force procedure (period, Cs, base shear, distribution).

Table values from memory (ASCE 7-16 Tables 12.8-1 and 12.8-2).
Also here: Cs under §11.4.8 exception 2 (Site D, S1 >= 0.2 g) and the §12.8.1.3 limit on Ss for
Cs. Not implemented: §12.8.4 horizontal distribution.
"""

from itertools import accumulate

from latbook.engine.asce7_16._interpolate import interpolate_clamped

#: Approximate period parameters, ASCE 7-16 Table 12.8-2: key -> (Ct, x, description).
#: Ct is for hn in feet.
STRUCTURE_TYPES: dict[str, tuple[float, float, str]] = {
    "steel_moment_frame": (0.028, 0.8, "Steel moment-resisting frames"),
    "concrete_moment_frame": (0.016, 0.9, "Concrete moment-resisting frames"),
    "steel_eccentric_braced_frame": (
        0.03,
        0.75,
        "Steel eccentrically braced frames and steel buckling-restrained braced frames",
    ),
    "all_other": (0.02, 0.75, "All other structural systems"),
}

#: SD1 (g) column of ASCE 7-16 Table 12.8-1, ascending ("<= 0.1" first, ">= 0.4" last).
TABLE_12_8_1_SD1_G: tuple[float, ...] = (0.1, 0.15, 0.2, 0.3, 0.4)

#: Cu for each SD1 in TABLE_12_8_1_SD1_G.
TABLE_12_8_1_CU: tuple[float, ...] = (1.7, 1.6, 1.5, 1.4, 1.4)

#: Governing-equation labels returned by Cs().
LABEL_CS_BASIC = "Eq. 12.8-2"
LABEL_CS_UPPER_SHORT = "Eq. 12.8-3"
LABEL_CS_UPPER_LONG = "Eq. 12.8-4"
LABEL_CS_MIN = "Eq. 12.8-5"
LABEL_CS_MIN_NEAR_FAULT = "Eq. 12.8-6"

#: S1 (g) at or above which Eq. 12.8-6 applies.
S1_NEAR_FAULT_G = 0.6

#: Branches of §11.4.8 exception 2 (Site D, S1 >= 0.2 g).
EXC2_SHORT = "T <= 1.5 Ts: Eq. 12.8-2"
EXC2_MID = "1.5 Ts < T <= TL: 1.5 x Eq. 12.8-3"
EXC2_LONG = "T > TL: 1.5 x Eq. 12.8-4"
EXC2_PREFIX = "exc. 2: "

#: §12.8.1.3 (from memory): Ss need not exceed 1.5 in computing Cs for regular structures of
#: five stories or fewer with T <= 0.5 s, where its conditions hold.
SS_CAP_12_8_1_3_G = 1.5
SS_CAP_MAX_STORIES = 5
SS_CAP_MAX_T_S = 0.5


def Cu(SD1_g: float) -> float:
    """Upper-limit coefficient on calculated period, ASCE 7-16 Table 12.8-1, interpolated."""
    return interpolate_clamped(SD1_g, TABLE_12_8_1_SD1_G, TABLE_12_8_1_CU)


def Ta(Ct: float, hn_ft: float, x: float) -> float:
    """Approximate period Ta = Ct hn^x, ASCE 7-16 §12.8.2.1, Eq. 12.8-7 (s; hn in ft)."""
    if hn_ft <= 0:
        raise ValueError(f"hn must be > 0 ft, got {hn_ft}")
    return Ct * hn_ft**x


def period_used(Ta_s: float, Cu: float, T_computed_s: float | None) -> float:
    """Period for Cs, ASCE 7-16 §12.8.2: Ta if no computed T, else min(T_computed, Cu Ta) (s)."""
    if T_computed_s is None:
        return Ta_s
    return min(T_computed_s, Cu * Ta_s)


def Cs_basic(SDS_g: float, R: float, Ie: float) -> float:
    """Seismic response coefficient SDS/(R/Ie), ASCE 7-16 §12.8.1.1, Eq. 12.8-2 (g)."""
    return SDS_g / (R / Ie)


def Cs_upper_label(T_s: float, TL_s: float) -> str:
    """Which upper-limit equation applies, ASCE 7-16 §12.8.1.1: Eq. 12.8-3 (T <= TL) or 12.8-4."""
    return LABEL_CS_UPPER_SHORT if T_s <= TL_s else LABEL_CS_UPPER_LONG


def Cs_upper(SD1_g: float, T_s: float, TL_s: float, R: float, Ie: float) -> float:
    """Upper limit on Cs, ASCE 7-16 §12.8.1.1, Eq. 12.8-3 (T <= TL) or Eq. 12.8-4 (T > TL) (g)."""
    if T_s <= 0:
        raise ValueError(f"T must be > 0 s, got {T_s}")
    if T_s <= TL_s:
        return SD1_g / (T_s * (R / Ie))
    return SD1_g * TL_s / (T_s**2 * (R / Ie))


def Cs_min(SDS_g: float, Ie: float) -> float:
    """Lower limit on Cs, max(0.044 SDS Ie, 0.01), ASCE 7-16 §12.8.1.1, Eq. 12.8-5 (g)."""
    return max(0.044 * SDS_g * Ie, 0.01)


def Cs_min_near_fault(S1_g: float, R: float, Ie: float) -> float:
    """Lower limit 0.5 S1/(R/Ie) where S1 >= 0.6 g, else 0, ASCE 7-16 Eq. 12.8-6 (g)."""
    if S1_g >= S1_NEAR_FAULT_G:
        return 0.5 * S1_g / (R / Ie)
    return 0.0


def Cs_exception_2(
    SDS_g: float, SD1_g: float, T_s: float, TL_s: float, R: float, Ie: float, Ts_s: float
) -> tuple[float, str]:
    """Cs under ASCE 7-16 §11.4.8 exception 2 (Site D, S1 >= 0.2 g), before the lower bounds:
    Eq. 12.8-2 for T <= 1.5 Ts; 1.5 x Eq. 12.8-3 for TL >= T > 1.5 Ts; 1.5 x Eq. 12.8-4 for
    T > TL. Returns (Cs, branch). SDS_g is the SDS used for Cs; Ts_s = SD1/SDS (s)."""
    if T_s <= 1.5 * Ts_s:
        return Cs_basic(SDS_g, R, Ie), EXC2_SHORT
    if T_s <= TL_s:
        return 1.5 * SD1_g / (T_s * (R / Ie)), EXC2_MID
    return 1.5 * SD1_g * TL_s / (T_s**2 * (R / Ie)), EXC2_LONG


def Cs(
    SDS_g: float,
    SD1_g: float,
    S1_g: float,
    T_s: float,
    TL_s: float,
    R: float,
    Ie: float,
    exception_2_Ts_s: float | None = None,
) -> tuple[float, str]:
    """Seismic response coefficient and its governing equation, ASCE 7-16 §12.8.1.1 (g).

    c = min(Eq. 12.8-2, Eq. 12.8-3 or 12.8-4), or the §11.4.8 exception 2 value where
    `exception_2_Ts_s` (Ts, s) is given; floor = max(Eq. 12.8-5, Eq. 12.8-6);
    Cs = max(c, floor). The label names the equation whose value equals Cs; on a tie the
    precedence is c, then 12.8-5, then 12.8-6 (within c: 12.8-2, then 12.8-3/12.8-4).
    """
    basic = Cs_basic(SDS_g, R, Ie)
    upper = Cs_upper(SD1_g, T_s, TL_s, R, Ie)
    minimum = Cs_min(SDS_g, Ie)
    near_fault = Cs_min_near_fault(S1_g, R, Ie)
    if exception_2_Ts_s is not None:
        ranged, branch = Cs_exception_2(SDS_g, SD1_g, T_s, TL_s, R, Ie, exception_2_Ts_s)
        label = EXC2_PREFIX + branch
    else:
        ranged = min(basic, upper)
        label = LABEL_CS_BASIC if ranged == basic else Cs_upper_label(T_s, TL_s)
    value = max(ranged, max(minimum, near_fault))
    if value == ranged:
        return value, label
    if value == minimum:
        return value, LABEL_CS_MIN
    return value, LABEL_CS_MIN_NEAR_FAULT


def Ss_for_Cs(Ss_g: float, cap_permitted: bool) -> float:
    """Ss used in computing Cs: not more than 1.5 g where §12.8.1.3 is taken and its
    conditions hold, ASCE 7-16 §12.8.1.3 (from memory) (g)."""
    return min(Ss_g, SS_CAP_12_8_1_3_G) if cap_permitted else Ss_g


def base_shear(Cs: float, W_kip: float) -> float:
    """Seismic base shear V = Cs W, ASCE 7-16 §12.8.1, Eq. 12.8-1 (kip)."""
    return Cs * W_kip


def k_exponent(T_s: float) -> float:
    """Distribution exponent k, ASCE 7-16 §12.8.3: 1 at T <= 0.5 s, 2 at T >= 2.5 s, linear."""
    return interpolate_clamped(T_s, (0.5, 2.5), (1.0, 2.0))


def vertical_distribution(
    weights_kip: list[float], heights_ft: list[float], V_kip: float, k: float
) -> dict[str, list[float]]:
    """Story forces Fx = Cvx V, ASCE 7-16 §12.8.3, Eqs. 12.8-11/12.8-12 (kip; heights in ft).

    Levels may be in any order; each output list follows the input order. Keys: 'wx_hx_k'
    (kip ft^k), 'Cvx' (dimensionless), 'Fx_kip' (kip).
    """
    if len(weights_kip) != len(heights_ft) or not weights_kip:
        raise ValueError("weights_kip and heights_ft must be non-empty and of equal length")
    if any(h <= 0 for h in heights_ft):
        raise ValueError("every level height above the base must be > 0 ft")
    if any(w < 0 for w in weights_kip):
        raise ValueError("level weights must be >= 0 kip")
    wx_hx_k = [w * h**k for w, h in zip(weights_kip, heights_ft, strict=True)]
    total = sum(wx_hx_k)
    if total <= 0:
        raise ValueError("sum of wi hi^k must be > 0")
    Cvx = [term / total for term in wx_hx_k]
    return {"wx_hx_k": wx_hx_k, "Cvx": Cvx, "Fx_kip": [c * V_kip for c in Cvx]}


def _check_top_down(Fx_kip: list[float], heights_ft: list[float]) -> None:
    if len(Fx_kip) != len(heights_ft) or not Fx_kip:
        raise ValueError("Fx_kip and heights_ft must be non-empty and of equal length")
    if any(upper <= lower for upper, lower in zip(heights_ft, heights_ft[1:], strict=False)):
        raise ValueError("levels must be ordered top-down: index 0 = roof, heights decreasing")


def story_shears(Fx_kip: list[float], heights_ft: list[float]) -> list[float]:
    """Story shear Vx = sum of Fi at and above level x, ASCE 7-16 §12.8.4, Eq. 12.8-13 (kip).

    Levels ordered top-down (index 0 = roof, heights strictly decreasing); Vx[i] is the shear
    in the story just below level i, so the last entry is the base shear.
    """
    _check_top_down(Fx_kip, heights_ft)
    return list(accumulate(Fx_kip))


def overturning_moments(Fx_kip: list[float], heights_ft: list[float]) -> list[float]:
    """Overturning moment at each level, sum over i above x of Fi (hi - hx), ASCE 7-16 §12.8.5
    (kip ft).

    Levels ordered top-down (index 0 = roof, heights strictly decreasing); the roof entry is 0.
    The moment at the base is base_overturning_moment().
    """
    _check_top_down(Fx_kip, heights_ft)
    return [
        sum(Fx_kip[i] * (heights_ft[i] - hx) for i in range(x)) for x, hx in enumerate(heights_ft)
    ]


def base_overturning_moment(Fx_kip: list[float], heights_ft: list[float]) -> float:
    """Overturning moment at the base, sum of Fi hi, ASCE 7-16 §12.8.5 (kip ft; heights in ft)."""
    _check_top_down(Fx_kip, heights_ft)
    return sum(f * h for f, h in zip(Fx_kip, heights_ft, strict=True))
