"""ASCE 7-16 ch. 26-27 Part 1: MWFRS wind on enclosed / partially enclosed rigid buildings.

Directional procedure, walls only (horizontal force on the building). Each published equation is
its own small function; the story-force functions compose them with this fixed rule, which the
workbook copies cell for cell:

* Levels are listed top-down (index 0 = roof) with diaphragm elevations above grade z_i (ft).
  ``roof_height_ft`` is the mean roof height h.
* Tributary band of level i: from z_lo = z_i - (z_i - z_below)/2 (z_below = 0 for the lowest
  level, so the lowest band stops at mid-height of the first story; the half story below goes
  straight to the foundation and is excluded) up to z_hi = z_i + (z_above - z_i)/2 (midpoint to
  the level above), or z_hi = h for the roof.
* Windward pressure of a band = q_z evaluated at z_hi (top of band; conservative because K_z
  grows with height) x G x Cp_windward. Leeward pressure = q_h x G x Cp_leeward (q_h at h).
* p_net = p_windward - p_leeward, both signed (leeward negative), so magnitudes add.
* w_i = p_net x (z_hi - z_lo) (plf per ft of building width); F_i = w_i x B_i / 1000 (kip), B_i =
  building width perpendicular to the wind at level i.
* Parapet (roof level only): F_p = (p_p,windward - p_p,leeward) x h_p x B_roof / 1000, with q_p at
  the top of the parapet (h + h_p); its line of action for overturning is h + h_p/2.
* §27.1.5 minimum: F_min,i = 16 psf x (z_hi - z_lo) x B_i / 1000; the design band force is the
  larger, and ``governs`` reads GOVERNS_PRESSURE or GOVERNS_MINIMUM. The parapet force is added
  on top of the roof's design band force (no separate minimum on the parapet).
* Base overturning = sum F_i z_i (band force at the diaphragm elevation) + F_p (h + h_p/2).

Internal pressure q_i(GCpi) is equal and opposite on the windward and leeward walls, so it cancels
in the net horizontal force and is not carried here.
"""

import math
from itertools import accumulate
from typing import NamedTuple

from latbook.engine.asce7_16._interpolate import interpolate_clamped


class ExposureConstants(NamedTuple):
    """Terrain exposure constants of ASCE 7-16 Table 26.11-1 used by K_z."""

    alpha: float
    zg_ft: float


#: ASCE 7-16 Table 26.11-1: power-law exponent alpha and gradient height zg (ft).
EXPOSURE_CONSTANTS: dict[str, ExposureConstants] = {
    "B": ExposureConstants(alpha=7.0, zg_ft=1200.0),
    "C": ExposureConstants(alpha=9.5, zg_ft=900.0),
    "D": ExposureConstants(alpha=11.5, zg_ft=700.0),
}

#: ASCE 7-16 Table 26.10-1 note: below this height K_z is evaluated at 15 ft (all exposures).
KZ_MIN_HEIGHT_FT = 15.0

CP_WINDWARD = 0.8  # ASCE 7-16 Fig. 27.3-1, windward wall, all L/B (use with q_z)
CP_SIDE = -0.7  # ASCE 7-16 Fig. 27.3-1, side walls, all L/B (use with q_h)
G_RIGID = 0.85  # ASCE 7-16 §26.11.1, gust-effect factor permitted for rigid buildings
KD_MWFRS_BUILDING = 0.85  # ASCE 7-16 Table 26.6-1, buildings, MWFRS
GCPN_WINDWARD = 1.5  # ASCE 7-16 §27.3.4, windward parapet
GCPN_LEEWARD = -1.0  # ASCE 7-16 §27.3.4, leeward parapet
P_MIN_WALL_PSF = 16.0  # ASCE 7-16 §27.1.5, on wall area projected normal to the wind
P_MIN_ROOF_PSF = 8.0  # ASCE 7-16 §27.1.5, on roof area projected on a vertical plane (not used
# by level_forces: the bands stop at h, so a sloped roof's projection above h is not loaded)

#: Fig. 27.3-1 leeward wall Cp against L/B (linear interpolation permitted, held beyond ends).
LEEWARD_L_OVER_B: tuple[float, ...] = (1.0, 2.0, 4.0)
LEEWARD_CP: tuple[float, ...] = (-0.5, -0.3, -0.2)

#: Fig. 27.3-8 Case 2: fraction of Case 1 pressures and eccentricity as a fraction of B.
CASE2_PRESSURE_FRACTION = 0.75
CASE2_ECCENTRICITY_FRACTION = 0.15

GOVERNS_PRESSURE = "pressure"
GOVERNS_MINIMUM = "16 psf minimum"


# --- Chapter 26: velocity pressure ---------------------------------------------------------


def _exposure(exposure: str) -> ExposureConstants:
    try:
        return EXPOSURE_CONSTANTS[exposure]
    except KeyError:
        raise ValueError(
            f"exposure must be one of {tuple(EXPOSURE_CONSTANTS)}, got {exposure!r}"
        ) from None


def Kz(z_ft: float, exposure: str) -> float:
    """K_z = 2.01 (z/zg)^(2/alpha), ASCE 7-16 Table 26.10-1 note (dimensionless).

    For z < 15 ft, z is taken as 15 ft; ASCE 7-16 does this for every exposure (B, C and D).
    """
    if z_ft < 0.0:
        raise ValueError(f"height above grade must be >= 0 ft, got {z_ft}")
    constants = _exposure(exposure)
    if z_ft > constants.zg_ft:
        raise ValueError(f"z = {z_ft} ft exceeds zg = {constants.zg_ft} ft (Table 26.10-1 note)")
    z_used_ft = max(z_ft, KZ_MIN_HEIGHT_FT)
    return 2.01 * (z_used_ft / constants.zg_ft) ** (2.0 / constants.alpha)


def Ke(ground_elevation_ft: float) -> float:
    """Ground elevation factor K_e = exp(-0.0000362 z_g), ASCE 7-16 Table 26.9-1 note 2 (z_g in ft).

    Table 26.9-1 note 3 always permits K_e = 1.0 (see ``Ke_used``).
    """
    return math.exp(-0.0000362 * ground_elevation_ft)


def Ke_used(ground_elevation_ft: float, take_Ke_as_1: bool) -> float:
    """K_e carried into q_z: 1.0 if so chosen, else the Table 26.9-1 formula (ASCE 7-16 §26.9)."""
    return 1.0 if take_Ke_as_1 else Ke(ground_elevation_ft)


def qz(Kz: float, Kzt: float, Kd: float, Ke: float, V_mph: float) -> float:
    """Velocity pressure q_z = 0.00256 K_z K_zt K_d K_e V^2, ASCE 7-16 Eq. 26.10-1 (psf; mph)."""
    return 0.00256 * Kz * Kzt * Kd * Ke * V_mph**2


# --- Chapter 27 Part 1: pressures -----------------------------------------------------------


def Cp_leeward(L_over_B: float) -> float:
    """Leeward wall Cp, ASCE 7-16 Fig. 27.3-1: -0.5 at L/B <= 1, -0.3 at 2, -0.2 at >= 4."""
    if L_over_B <= 0.0:
        raise ValueError(f"L/B must be > 0, got {L_over_B}")
    return interpolate_clamped(L_over_B, LEEWARD_L_OVER_B, LEEWARD_CP)


def wall_pressure(q_psf: float, G: float, Cp: float) -> float:
    """External wall pressure q G Cp, ASCE 7-16 Eq. 27.3-1 without q_i(GCpi) (psf).

    The internal term is equal and opposite on windward and leeward walls and cancels in the
    net horizontal force on the building.
    """
    return q_psf * G * Cp


def parapet_pressure(qp_psf: float, GCpn: float) -> float:
    """Parapet pressure p_p = q_p (GCpn), ASCE 7-16 §27.3.4, Eq. 27.3-3 (psf)."""
    return qp_psf * GCpn


# --- Story forces (integration rule in the module docstring) --------------------------------


def tributary_bands(
    elevations_ft_topdown: list[float], roof_height_ft: float
) -> list[tuple[float, float]]:
    """Wall band (z_lo_ft, z_hi_ft) tributary to each level, top-down (ASCE 7-16 §27.3.1 use).

    Rule in the module docstring: midpoints between levels, ground level 0 below the lowest
    level, mean roof height h above the roof.
    """
    z = list(elevations_ft_topdown)
    if not z:
        raise ValueError("at least one level is required")
    if any(z_i <= 0.0 for z_i in z):
        raise ValueError("level elevations must be above grade (> 0 ft)")
    if any(z[i] <= z[i + 1] for i in range(len(z) - 1)):
        raise ValueError("elevations must be listed top-down and strictly decreasing")
    if roof_height_ft < z[0]:
        raise ValueError(
            f"roof height h = {roof_height_ft} ft is below the roof level z = {z[0]} ft"
        )
    bands: list[tuple[float, float]] = []
    for i, z_i in enumerate(z):
        z_below_ft = z[i + 1] if i + 1 < len(z) else 0.0
        z_lo_ft = z_i - (z_i - z_below_ft) / 2.0
        z_hi_ft = roof_height_ft if i == 0 else z_i + (z[i - 1] - z_i) / 2.0
        bands.append((z_lo_ft, z_hi_ft))
    return bands


def band_force_kip(p_psf: float, z_lo_ft: float, z_hi_ft: float, width_ft: float) -> float:
    """Force of a pressure on a wall band, p (z_hi - z_lo) B / 1000, ASCE 7-16 §27.3 (kip)."""
    return p_psf * (z_hi_ft - z_lo_ft) * width_ft / 1000.0


def parapet_force(
    roof_height_ft: float,
    parapet_height_ft: float,
    width_ft: float,
    exposure: str,
    V_mph: float,
    Kzt: float,
    Ke: float,
    Kd: float = KD_MWFRS_BUILDING,
) -> dict:
    """Net parapet force (p_p,windward - p_p,leeward) h_p B / 1000, ASCE 7-16 §27.3.4 (kip).

    q_p is evaluated at the top of the parapet, h + h_p. Keys: z_top_ft, Kz_top, qp_psf,
    p_windward_psf, p_leeward_psf, p_net_psf, z_centroid_ft, F_kip.
    """
    if parapet_height_ft < 0.0:
        raise ValueError(f"parapet height must be >= 0 ft, got {parapet_height_ft}")
    z_top_ft = roof_height_ft + parapet_height_ft
    Kz_top = Kz(z_top_ft, exposure)
    qp_psf = qz(Kz_top, Kzt, Kd, Ke, V_mph)
    p_windward_psf = parapet_pressure(qp_psf, GCPN_WINDWARD)
    p_leeward_psf = parapet_pressure(qp_psf, GCPN_LEEWARD)
    p_net_psf = p_windward_psf - p_leeward_psf
    return {
        "z_top_ft": z_top_ft,
        "Kz_top": Kz_top,
        "qp_psf": qp_psf,
        "p_windward_psf": p_windward_psf,
        "p_leeward_psf": p_leeward_psf,
        "p_net_psf": p_net_psf,
        "z_centroid_ft": roof_height_ft + parapet_height_ft / 2.0,
        "F_kip": band_force_kip(p_net_psf, roof_height_ft, z_top_ft, width_ft),
    }


def level_forces(
    elevations_ft_topdown: list[float],
    widths_ft_topdown: list[float],
    roof_height_ft: float,
    L_over_B: float,
    exposure: str,
    V_mph: float,
    Kzt: float = 1.0,
    Ke: float = 1.0,
    Kd: float = KD_MWFRS_BUILDING,
    G: float = G_RIGID,
    parapet_height_ft: float = 0.0,
) -> list[dict]:
    """MWFRS wind force at each level, top-down, ASCE 7-16 §27.3.1 with the §27.1.5 minimum (kip).

    One dict per level with keys: level_index, z_ft, z_lo_ft, z_hi_ft, width_ft, Kz_top,
    qz_top_psf, qh_psf, p_windward_psf, p_leeward_psf, p_net_psf, w_plf, F_kip, F_min_kip,
    F_design_kip, governs, F_parapet_kip, F_level_kip, parapet. ``parapet`` is the
    ``parapet_force`` dict on the roof entry (when h_p > 0) and None elsewhere; F_level_kip =
    F_design_kip + F_parapet_kip is the force delivered to the diaphragm.
    """
    if len(widths_ft_topdown) != len(elevations_ft_topdown):
        raise ValueError("one building width per level is required")
    if any(b <= 0.0 for b in widths_ft_topdown):
        raise ValueError("building widths must be > 0 ft")
    bands = tributary_bands(elevations_ft_topdown, roof_height_ft)
    qh_psf = qz(Kz(roof_height_ft, exposure), Kzt, Kd, Ke, V_mph)
    p_leeward_psf = wall_pressure(qh_psf, G, Cp_leeward(L_over_B))
    parapet = None
    if parapet_height_ft > 0.0:
        parapet = parapet_force(
            roof_height_ft, parapet_height_ft, widths_ft_topdown[0], exposure, V_mph, Kzt, Ke, Kd
        )
    levels: list[dict] = []
    for i, ((z_lo_ft, z_hi_ft), width_ft) in enumerate(zip(bands, widths_ft_topdown, strict=True)):
        Kz_top = Kz(z_hi_ft, exposure)
        qz_top_psf = qz(Kz_top, Kzt, Kd, Ke, V_mph)
        p_windward_psf = wall_pressure(qz_top_psf, G, CP_WINDWARD)
        p_net_psf = p_windward_psf - p_leeward_psf
        F_kip = band_force_kip(p_net_psf, z_lo_ft, z_hi_ft, width_ft)
        F_min_kip = band_force_kip(P_MIN_WALL_PSF, z_lo_ft, z_hi_ft, width_ft)
        governs = GOVERNS_PRESSURE if F_kip >= F_min_kip else GOVERNS_MINIMUM
        F_design_kip = max(F_kip, F_min_kip)
        level_parapet = parapet if i == 0 else None
        F_parapet_kip = level_parapet["F_kip"] if level_parapet else 0.0
        levels.append(
            {
                "level_index": i,
                "z_ft": elevations_ft_topdown[i],
                "z_lo_ft": z_lo_ft,
                "z_hi_ft": z_hi_ft,
                "width_ft": width_ft,
                "Kz_top": Kz_top,
                "qz_top_psf": qz_top_psf,
                "qh_psf": qh_psf,
                "p_windward_psf": p_windward_psf,
                "p_leeward_psf": p_leeward_psf,
                "p_net_psf": p_net_psf,
                "w_plf": p_net_psf * (z_hi_ft - z_lo_ft),
                "F_kip": F_kip,
                "F_min_kip": F_min_kip,
                "F_design_kip": F_design_kip,
                "governs": governs,
                "F_parapet_kip": F_parapet_kip,
                "F_level_kip": F_design_kip + F_parapet_kip,
                "parapet": level_parapet,
            }
        )
    return levels


def story_shears(level_forces_kip_topdown: list[float]) -> list[float]:
    """Story shear below each level: sum of the level forces at and above it, top-down (kip).

    ASCE 7-16 §27.3 forces summed down the building (the §12.8.4 pattern applied to wind).
    """
    return list(accumulate(level_forces_kip_topdown))


def base_overturning_kipft(
    level_forces_kip_topdown: list[float],
    elevations_ft_topdown: list[float],
    parapet_force_kip: float = 0.0,
    parapet_centroid_ft: float = 0.0,
) -> float:
    """Base overturning moment sum F_i z_i + F_p (h + h_p/2), ASCE 7-16 §27.3 forces (kip-ft).

    ``level_forces_kip_topdown`` are the band design forces without the parapet.
    """
    if len(level_forces_kip_topdown) != len(elevations_ft_topdown):
        raise ValueError("one force per level elevation is required")
    moment_kipft = sum(
        F_kip * z_ft
        for F_kip, z_ft in zip(level_forces_kip_topdown, elevations_ft_topdown, strict=True)
    )
    return moment_kipft + parapet_force_kip * parapet_centroid_ft


# --- Fig. 27.3-8 design wind load cases -----------------------------------------------------


def case2_eccentricity_ft(B_ft: float) -> float:
    """Case 2 eccentricity e = 0.15 B, ASCE 7-16 Fig. 27.3-8 (ft)."""
    return CASE2_ECCENTRICITY_FRACTION * B_ft


def case2_force(F_kip: float) -> float:
    """Case 2 force: 0.75 of the Case 1 (windward + leeward) force, ASCE 7-16 Fig. 27.3-8 (kip)."""
    return CASE2_PRESSURE_FRACTION * F_kip


def case2_torsion(F_kip: float, B_ft: float) -> float:
    """Case 2 torsion M_T = 0.75 F x 0.15 B, ASCE 7-16 Fig. 27.3-8 (kip-ft)."""
    return case2_force(F_kip) * case2_eccentricity_ft(B_ft)
