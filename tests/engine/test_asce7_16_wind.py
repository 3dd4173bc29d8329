"""ASCE 7-16 ch. 26-27 Part 1 MWFRS wind, checked against the standard's tables and hand work.

Sources: ASCE 7-16 Table 26.10-1 (K_z), Table 26.9-1 (K_e), Table 26.11-1 (alpha, zg),
Fig. 27.3-1 (Cp), Fig. 27.3-8 (Case 2). Table values are typed from memory (no copy of the
standard at hand); no published ASCE 7-16 q_z worked example could be found in the reference
corpora searched, so the q_z and story-force checks are derived by hand from the equations with
the arithmetic written out beside them.
"""

import pytest

from latbook.engine.asce7_16 import wind

# ASCE 7-16 Table 26.10-1, exposures B, C, D (from memory). The table's two-decimal entries
# sit up to just under 0.01 below the note formula in places (e.g. C at 25 ft: formula 0.9453,
# table 0.94; C at 60 ft: formula 1.1366, table 1.13), i.e. they read as truncated rather than
# rounded, so the tolerance is 0.01 (adjacent rows differ by 0.04 to 0.05).
TABLE_26_10_1_KZ = [
    # (z_ft, B, C, D)
    (15.0, 0.57, 0.85, 1.03),
    (20.0, 0.62, 0.90, 1.08),
    (25.0, 0.66, 0.94, 1.12),
    (30.0, 0.70, 0.98, 1.16),
    (40.0, 0.76, 1.04, 1.22),
    (50.0, 0.81, 1.09, 1.27),
    (60.0, 0.85, 1.13, 1.31),
]
KZ_TABLE_TOL = 0.01


@pytest.mark.parametrize(("z_ft", "kz_b", "kz_c", "kz_d"), TABLE_26_10_1_KZ)
def test_Kz_matches_table_26_10_1(z_ft, kz_b, kz_c, kz_d):
    # ASCE 7-16 Table 26.10-1 (from memory)
    assert wind.Kz(z_ft, "B") == pytest.approx(kz_b, abs=KZ_TABLE_TOL)
    assert wind.Kz(z_ft, "C") == pytest.approx(kz_c, abs=KZ_TABLE_TOL)
    assert wind.Kz(z_ft, "D") == pytest.approx(kz_d, abs=KZ_TABLE_TOL)


@pytest.mark.parametrize(("exposure", "kz_0_to_15"), [("B", 0.57), ("C", 0.85), ("D", 1.03)])
def test_Kz_below_15_ft_uses_the_0_to_15_ft_row(exposure, kz_0_to_15):
    # ASCE 7-16 Table 26.10-1 row "0-15 ft" (from memory) and its note: z < 15 ft -> 15 ft
    assert wind.Kz(8.0, exposure) == pytest.approx(kz_0_to_15, abs=KZ_TABLE_TOL)
    assert wind.Kz(8.0, exposure) == pytest.approx(wind.Kz(15.0, exposure), rel=1e-12)


def test_exposure_constants_table_26_11_1():
    # ASCE 7-16 Table 26.11-1 (from memory): B 7.0/1200 ft, C 9.5/900 ft, D 11.5/700 ft
    assert wind.EXPOSURE_CONSTANTS["B"] == (pytest.approx(7.0), pytest.approx(1200.0))
    assert wind.EXPOSURE_CONSTANTS["C"] == (pytest.approx(9.5), pytest.approx(900.0))
    assert wind.EXPOSURE_CONSTANTS["D"] == (pytest.approx(11.5), pytest.approx(700.0))


def test_Kz_rejects_unknown_exposure():
    with pytest.raises(ValueError, match="exposure"):
        wind.Kz(20.0, "A")


@pytest.mark.parametrize(
    ("elevation_ft", "ke_table"),
    [(0.0, 1.00), (1000.0, 0.96), (2000.0, 0.93), (3000.0, 0.90), (5000.0, 0.83), (6000.0, 0.80)],
)
def test_Ke_matches_table_26_9_1(elevation_ft, ke_table):
    # ASCE 7-16 Table 26.9-1 (from memory); two-decimal table, so abs 0.006
    assert wind.Ke(elevation_ft) == pytest.approx(ke_table, abs=0.006)


def test_Ke_may_be_taken_as_one():
    # ASCE 7-16 Table 26.9-1 note 3 (from memory): K_e = 1.0 permitted in all cases
    assert wind.Ke_used(5000.0, take_Ke_as_1=True) == 1.0
    assert wind.Ke_used(5000.0, take_Ke_as_1=False) == pytest.approx(0.83, abs=0.006)


def test_qz_hand_check_exposure_c_30_ft():
    # Derived by hand, ASCE 7-16 Eq. 26.10-1 with the Table 26.10-1 K_z = 0.98 (C, 30 ft):
    # 0.00256 x 0.98 x 1.0 x 0.85 x 1.0 x 115^2 = 0.00256 x 0.98 x 0.85 x 13225 = 28.202 psf
    assert wind.qz(0.98, 1.0, 0.85, 1.0, 115.0) == pytest.approx(28.202, rel=1e-4)


def test_qz_hand_check_with_elevation_and_topography():
    # Derived by hand: 0.00256 x 0.70 x 1.2 x 0.85 x 0.90 x 100^2 = 16.450 psf
    assert wind.qz(0.70, 1.2, 0.85, 0.90, 100.0) == pytest.approx(16.450, rel=1e-4)


@pytest.mark.parametrize(
    ("L_over_B", "cp"),
    [(0.5, -0.5), (1.0, -0.5), (2.0, -0.3), (3.0, -0.25), (4.0, -0.2), (6.0, -0.2)],
)
def test_Cp_leeward_fig_27_3_1(L_over_B, cp):
    # ASCE 7-16 Fig. 27.3-1 (from memory): -0.5 (0-1), -0.3 (2), -0.2 (>=4); L/B = 3 is the
    # straight-line interpolation the figure permits: (-0.3 + -0.2)/2 = -0.25
    assert wind.Cp_leeward(L_over_B) == pytest.approx(cp, rel=1e-9)


def test_fixed_coefficients():
    # ASCE 7-16 (from memory): Fig. 27.3-1 windward 0.8 and side -0.7; §26.11.1 G = 0.85;
    # Table 26.6-1 K_d = 0.85; §27.3.4 GCpn +1.5 / -1.0; §27.1.5 16 psf
    assert wind.CP_WINDWARD == 0.8
    assert wind.CP_SIDE == -0.7
    assert wind.G_RIGID == 0.85
    assert wind.KD_MWFRS_BUILDING == 0.85
    assert wind.GCPN_WINDWARD == 1.5
    assert wind.GCPN_LEEWARD == -1.0
    assert wind.P_MIN_WALL_PSF == 16.0


def test_wall_and_parapet_pressure_hand_check():
    # Derived by hand: 20 psf x 0.85 x 0.8 = 13.6 psf (Eq. 27.3-1, external part)
    assert wind.wall_pressure(20.0, 0.85, 0.8) == pytest.approx(13.6, rel=1e-9)
    # Derived by hand: 20 psf x (-1.0) = -20 psf (§27.3.4)
    assert wind.parapet_pressure(20.0, -1.0) == pytest.approx(-20.0, rel=1e-9)


def test_tributary_bands_three_levels():
    # Integration rule of the module docstring, derived by hand: roof 30, floors 20 and 10, h 32
    bands = wind.tributary_bands([30.0, 20.0, 10.0], 32.0)
    assert bands == [
        (pytest.approx(25.0), pytest.approx(32.0)),
        (pytest.approx(15.0), pytest.approx(25.0)),
        (pytest.approx(5.0), pytest.approx(15.0)),
    ]


def test_tributary_bands_reject_bottom_up_order():
    with pytest.raises(ValueError, match="top-down"):
        wind.tributary_bands([10.0, 20.0], 20.0)


# Two-story box, derived by hand from Eqs. 26.10-1 / 27.3-1 and the Table 26.10-1 note formula:
# roof diaphragm 20 ft = h, floor 10 ft, B = 40 ft, L/B = 1.5, exposure B, V = 115 mph,
# K_zt = K_e = 1.0, K_d = G = 0.85.
#   0.00256 x 0.85 x 115^2 = 28.7776
#   K_z(20) = 2.01 (20/1200)^(2/7) = 0.62397; K_z(15) = 2.01 (15/1200)^(2/7) = 0.57474
#   q_h = 28.7776 x 0.62397 = 17.956 psf; q_15 = 16.539 psf
#   Cp_leeward(1.5) = -0.4; p_leeward = 17.956 x 0.85 x -0.4 = -6.1050 psf
#   roof band 15-20 ft: p_w = 17.956 x 0.68 = 12.210; p_net = 18.315 psf; w = 91.575 plf;
#     F = 91.575 x 40 / 1000 = 3.6630 kip > 16 x 5 x 40 / 1000 = 3.20 kip
#   floor band 5-15 ft: p_w = 16.539 x 0.68 = 11.247; p_net = 17.352 psf; w = 173.52 plf;
#     F = 6.9406 kip > 6.40 kip
#   shears 3.6630, 10.604 kip; overturning 3.6630 x 20 + 6.9406 x 10 = 142.67 kip-ft
HAND_TOL = 2e-4


@pytest.fixture
def two_story_levels():
    return wind.level_forces(
        elevations_ft_topdown=[20.0, 10.0],
        widths_ft_topdown=[40.0, 40.0],
        roof_height_ft=20.0,
        L_over_B=1.5,
        exposure="B",
        V_mph=115.0,
    )


def test_level_forces_two_story_hand_check(two_story_levels):
    roof, floor = two_story_levels
    assert (roof["z_lo_ft"], roof["z_hi_ft"]) == (pytest.approx(15.0), pytest.approx(20.0))
    assert roof["Kz_top"] == pytest.approx(0.62397, rel=HAND_TOL)
    assert roof["qz_top_psf"] == pytest.approx(17.956, rel=HAND_TOL)
    assert roof["p_leeward_psf"] == pytest.approx(-6.1050, rel=HAND_TOL)
    assert roof["p_net_psf"] == pytest.approx(18.315, rel=HAND_TOL)
    assert roof["w_plf"] == pytest.approx(91.575, rel=HAND_TOL)
    assert roof["F_kip"] == pytest.approx(3.6630, rel=HAND_TOL)
    assert roof["F_min_kip"] == pytest.approx(3.20, rel=1e-9)
    assert roof["F_design_kip"] == pytest.approx(3.6630, rel=HAND_TOL)
    assert roof["governs"] == wind.GOVERNS_PRESSURE == "pressure"
    assert floor["qz_top_psf"] == pytest.approx(16.539, rel=HAND_TOL)
    assert floor["p_net_psf"] == pytest.approx(17.352, rel=HAND_TOL)
    assert floor["F_design_kip"] == pytest.approx(6.9406, rel=HAND_TOL)
    assert floor["governs"] == "pressure"


def test_story_shears_and_overturning_hand_check(two_story_levels):
    forces_kip = [level["F_level_kip"] for level in two_story_levels]
    assert wind.story_shears(forces_kip) == [
        pytest.approx(3.6630, rel=HAND_TOL),
        pytest.approx(10.604, rel=HAND_TOL),
    ]
    assert wind.base_overturning_kipft(forces_kip, [20.0, 10.0]) == pytest.approx(
        142.67, rel=HAND_TOL
    )


def test_minimum_16_psf_governs_at_low_wind_speed():
    # Derived by hand, same box at V = 90 mph: 0.00256 x 0.85 x 90^2 = 17.6256;
    # q_h = 17.6256 x 0.62397 = 10.998 psf; p_net = 10.998 x 0.85 x (0.8 + 0.4) = 11.218 psf;
    # F = 11.218 x 5 x 40 / 1000 = 2.2435 kip < 3.20 kip -> the 16 psf minimum governs
    roof = wind.level_forces([20.0, 10.0], [40.0, 40.0], 20.0, 1.5, "B", 90.0)[0]
    assert roof["F_kip"] == pytest.approx(2.2435, rel=HAND_TOL)
    assert roof["F_design_kip"] == pytest.approx(3.20, rel=1e-9)
    assert roof["governs"] == wind.GOVERNS_MINIMUM == "16 psf minimum"


def test_parapet_force_hand_check():
    # Derived by hand, §27.3.4: h 20 ft, h_p 3 ft, B 40 ft, exposure C, V 115 mph, K_d 0.85:
    # K_z(23) = 2.01 (23/900)^(2/9.5) = 0.92882; q_p = 28.7776 x 0.92882 = 26.729 psf;
    # p_net = (1.5 + 1.0) x 26.729 = 66.823 psf; F = 66.823 x 3 x 40 / 1000 = 8.0187 kip
    levels = wind.level_forces([20.0], [40.0], 20.0, 1.0, "C", 115.0, parapet_height_ft=3.0)
    roof = levels[0]
    parapet = roof["parapet"]
    assert parapet["qp_psf"] == pytest.approx(26.729, rel=HAND_TOL)
    assert parapet["p_net_psf"] == pytest.approx(66.823, rel=HAND_TOL)
    assert roof["F_parapet_kip"] == pytest.approx(8.0187, rel=HAND_TOL)
    assert roof["F_level_kip"] == pytest.approx(roof["F_design_kip"] + 8.0187, rel=HAND_TOL)
    assert parapet["z_centroid_ft"] == pytest.approx(21.5)
    # overturning of the parapet alone: 8.0187 x 21.5 = 172.40 kip-ft (derived by hand)
    assert wind.base_overturning_kipft(
        [0.0], [20.0], roof["F_parapet_kip"], parapet["z_centroid_ft"]
    ) == pytest.approx(172.40, rel=HAND_TOL)


def test_case2_fig_27_3_8():
    # ASCE 7-16 Fig. 27.3-8 Case 2 (from memory): 0.75 of Case 1, e = 0.15 B.
    # Derived by hand: F = 10 kip, B = 60 ft -> 7.5 kip, e = 9 ft, M_T = 67.5 kip-ft
    assert wind.case2_eccentricity_ft(60.0) == pytest.approx(9.0, rel=1e-12)
    assert wind.case2_force(10.0) == pytest.approx(7.5, rel=1e-12)
    assert wind.case2_torsion(10.0, 60.0) == pytest.approx(67.5, rel=1e-12)
