"""ELF procedure (ASCE 7-16 §12.8): Cu, Ta, period used, Cs and its governing equation, base
shear, k, vertical distribution, story shears and overturning moments.

Table values typed from memory (ASCE 7-16 Tables 12.8-1 and 12.8-2). No published ASCE 7-16 ELF
worked example could be read in the stored reference pages searched, so the building case at
the end is derived by hand from the equations.
"""

import pytest

from latbook.engine.asce7_16 import elf

# ---------------------------------------------------------------- Table 12.8-2 and Eq. 12.8-7


@pytest.mark.parametrize(
    ("key", "Ct", "x"),
    [
        # from memory (ASCE 7-16 Table 12.8-2), Ct for hn in ft
        ("steel_moment_frame", 0.028, 0.8),
        ("concrete_moment_frame", 0.016, 0.9),
        ("steel_eccentric_braced_frame", 0.03, 0.75),
        ("all_other", 0.02, 0.75),
    ],
)
def test_structure_types_match_table_12_8_2(key, Ct, x):
    table_Ct, table_x, description = elf.STRUCTURE_TYPES[key]
    assert (table_Ct, table_x) == pytest.approx((Ct, x), rel=1e-12)
    assert description


def test_eccentric_braced_row_covers_buckling_restrained_braces():
    # ASCE 7-16 Table 12.8-2 groups steel EBFs with steel BRBFs (from memory)
    assert "buckling-restrained" in elf.STRUCTURE_TYPES["steel_eccentric_braced_frame"][2]


@pytest.mark.parametrize(
    ("Ct", "hn_ft", "x", "expected_s"),
    [
        # derived by hand from Eq. 12.8-7: 30^0.75 = 12.819
        (0.02, 30.0, 0.75, 0.25637),
        # 100^0.8 = 10^1.6 = 39.811; 0.028 * 39.811
        (0.028, 100.0, 0.8, 1.11470),
        # 10^0.9 = 7.9433; 0.016 * 7.9433
        (0.016, 10.0, 0.9, 0.127093),
    ],
)
def test_Ta_eq_12_8_7(Ct, hn_ft, x, expected_s):
    assert elf.Ta(Ct, hn_ft, x) == pytest.approx(expected_s, rel=1e-4)


# ---------------------------------------------------------------------------- Table 12.8-1


@pytest.mark.parametrize(
    ("SD1_g", "expected"),
    [
        # from memory (ASCE 7-16 Table 12.8-1) cells
        (0.4, 1.4),
        (0.3, 1.4),
        (0.2, 1.5),
        (0.15, 1.6),
        (0.1, 1.7),
        # beyond the ends: ">= 0.4" and "<= 0.1"
        (0.75, 1.4),
        (0.05, 1.7),
        # derived by hand by straight-line interpolation
        (0.25, 1.45),
        (0.125, 1.65),
        (0.35, 1.4),
    ],
)
def test_Cu_table_12_8_1(SD1_g, expected):
    assert elf.Cu(SD1_g) == pytest.approx(expected, rel=1e-9)


# ------------------------------------------------------------------------------ §12.8.2


def test_period_used_is_Ta_without_computed_period():
    assert elf.period_used(0.25, 1.4, None) == pytest.approx(0.25, rel=1e-12)


def test_period_used_caps_computed_period_at_Cu_Ta():
    # §12.8.2: T shall not exceed Cu Ta = 1.4 * 0.25 = 0.35 s
    assert elf.period_used(0.25, 1.4, 0.60) == pytest.approx(0.35, rel=1e-12)


def test_period_used_keeps_computed_period_below_cap():
    assert elf.period_used(0.25, 1.4, 0.30) == pytest.approx(0.30, rel=1e-12)


# ----------------------------------------------------------------------------- §12.8.1.1


def test_Cs_pieces_hand_values():
    # derived by hand from Eqs. 12.8-2..12.8-6
    assert elf.Cs_basic(1.0, 6.5, 1.0) == pytest.approx(0.153846, rel=1e-5)
    assert elf.Cs_basic(1.0, 6.5, 1.5) == pytest.approx(0.230769, rel=1e-5)
    assert elf.Cs_upper(0.5, 1.0, 8.0, 6.5, 1.0) == pytest.approx(0.0769231, rel=1e-5)
    assert elf.Cs_upper(0.5, 10.0, 8.0, 2.0, 1.0) == pytest.approx(0.02, rel=1e-9)
    assert elf.Cs_min(1.0, 1.0) == pytest.approx(0.044, rel=1e-9)
    assert elf.Cs_min(0.1, 1.0) == pytest.approx(0.01, rel=1e-9)
    assert elf.Cs_min_near_fault(0.75, 8.0, 1.0) == pytest.approx(0.046875, rel=1e-9)
    assert elf.Cs_min_near_fault(0.59, 8.0, 1.0) == 0.0


@pytest.mark.parametrize(
    ("SDS_g", "SD1_g", "S1_g", "T_s", "TL_s", "R", "Ie", "expected", "label"),
    [
        # derived by hand from Eqs. 12.8-2..12.8-6
        (1.0, 0.5, 0.5, 0.25, 8.0, 6.5, 1.0, 0.153846, "Eq. 12.8-2"),
        (1.0, 0.5, 0.5, 1.0, 8.0, 6.5, 1.0, 0.0769231, "Eq. 12.8-3"),
        (0.2, 0.6, 0.3, 9.0, 8.0, 3.0, 1.0, 0.0197531, "Eq. 12.8-4"),  # 0.6*8/(81*3)
        (1.0, 0.5, 0.5, 4.0, 8.0, 8.0, 1.0, 0.044, "Eq. 12.8-5"),
        (0.1, 0.05, 0.05, 3.0, 8.0, 8.0, 1.0, 0.01, "Eq. 12.8-5"),  # the 0.01 floor
        (1.0, 0.6, 0.75, 2.0, 8.0, 8.0, 1.0, 0.046875, "Eq. 12.8-6"),
        # tie: 1.0/6.5 == 0.5/(0.5*6.5) -> Eq. 12.8-2 takes precedence
        (1.0, 0.5, 0.5, 0.5, 8.0, 6.5, 1.0, 0.153846, "Eq. 12.8-2"),
    ],
)
def test_Cs_value_and_governing_label(SDS_g, SD1_g, S1_g, T_s, TL_s, R, Ie, expected, label):
    value, governing = elf.Cs(SDS_g, SD1_g, S1_g, T_s, TL_s, R, Ie)
    assert value == pytest.approx(expected, rel=1e-5)
    assert governing == label


def test_base_shear_eq_12_8_1():
    assert elf.base_shear(0.15, 400.0) == pytest.approx(60.0, rel=1e-12)


# -------------------------------------------------------------------------------- §12.8.3


@pytest.mark.parametrize(
    ("T_s", "expected"),
    [
        (0.1, 1.0),
        (0.5, 1.0),
        (1.0, 1.25),  # derived by hand: 1 + (1.0 - 0.5)/2
        (1.5, 1.5),
        (2.0, 1.75),
        (2.5, 2.0),
        (4.0, 2.0),
    ],
)
def test_k_exponent_interpolation(T_s, expected):
    assert elf.k_exponent(T_s) == pytest.approx(expected, rel=1e-12)


def test_vertical_distribution_k_2_hand_case():
    # derived by hand: w = 100, 100 kip at 20, 10 ft; k = 2 -> wh^k 40000, 10000; Cvx 0.8, 0.2
    result = elf.vertical_distribution([100.0, 100.0], [20.0, 10.0], 50.0, 2.0)
    assert result["wx_hx_k"] == pytest.approx([40000.0, 10000.0], rel=1e-12)
    assert result["Cvx"] == pytest.approx([0.8, 0.2], rel=1e-12)
    assert result["Fx_kip"] == pytest.approx([40.0, 10.0], rel=1e-12)


def test_vertical_distribution_k_1_5_hand_case():
    # derived by hand: 20^1.5 = 89.443, 10^1.5 = 31.623 -> Cvx = 89.443/121.066 = 0.73880
    result = elf.vertical_distribution([100.0, 100.0], [20.0, 10.0], 1.0, 1.5)
    assert result["Cvx"] == pytest.approx([0.73880, 0.26120], rel=1e-4)


def test_vertical_distribution_keeps_input_order():
    top_down = elf.vertical_distribution([100.0, 150.0, 150.0], [30.0, 20.0, 10.0], 10.0, 1.0)
    bottom_up = elf.vertical_distribution([150.0, 150.0, 100.0], [10.0, 20.0, 30.0], 10.0, 1.0)
    assert bottom_up["Fx_kip"] == pytest.approx(top_down["Fx_kip"][::-1], rel=1e-12)


def test_story_functions_reject_bottom_up_order():
    with pytest.raises(ValueError, match="top-down"):
        elf.story_shears([1.0, 2.0], [10.0, 20.0])
    with pytest.raises(ValueError, match="top-down"):
        elf.overturning_moments([1.0, 2.0], [10.0, 20.0])


# ------------------------------------------------------- building case, derived by hand
# Derived by hand from the equations (not a published example). Three-storey light-frame
# building, site class C, Ss = 1.25 g, S1 = 0.5 g, risk category II, TL = 8 s, R = 6.5
# (wood structural panel shear walls; R from memory, ASCE 7-16 Table 12.2-1), hn = 30 ft,
# "all other" structure type. Levels top-down: roof 100 kip at 30 ft, level 3 150 kip at
# 20 ft, level 2 150 kip at 10 ft.
#   Fa = 1.2, Fv = 1.5 -> SDS = 1.0, SD1 = 0.5; Ta = 0.02 * 30^0.75 = 0.2564 s; k = 1
#   Cs = min(1.0/6.5, 0.5/(0.2564*6.5)) = 0.15385 (Eq. 12.8-2); V = 0.15385 * 400 = 61.538 kip
#   wh = 3000, 3000, 1500 (sum 7500) -> Cvx = 0.4, 0.4, 0.2 -> Fx = 24.615, 24.615, 12.308
#   Vx = 24.615, 49.231, 61.538
#   M at 20 ft = 24.615*10 = 246.15; at 10 ft = 24.615*20 + 24.615*10 = 738.46
#   M at base = 24.615*30 + 24.615*20 + 12.308*10 = 1353.85 kip ft

WEIGHTS_KIP = [100.0, 150.0, 150.0]
HEIGHTS_FT = [30.0, 20.0, 10.0]


def test_building_case_elf_chain():
    from latbook.engine.asce7_16 import site
    from latbook.engine.asce7_16.importance import Ie_seismic

    SDS_g = site.SDS(site.SMS(site.Fa("C", 1.25), 1.25))
    SD1_g = site.SD1(site.SM1(site.Fv("C", 0.5), 0.5))
    Ie = Ie_seismic("II")
    Ct, x, _ = elf.STRUCTURE_TYPES["all_other"]
    T_s = elf.period_used(elf.Ta(Ct, 30.0, x), elf.Cu(SD1_g), None)
    assert T_s == pytest.approx(0.2564, rel=1e-3)

    Cs, governing = elf.Cs(SDS_g, SD1_g, 0.5, T_s, 8.0, 6.5, Ie)
    assert Cs == pytest.approx(0.15385, rel=1e-4)
    assert governing == "Eq. 12.8-2"

    V_kip = elf.base_shear(Cs, sum(WEIGHTS_KIP))
    assert V_kip == pytest.approx(61.538, rel=1e-4)

    k = elf.k_exponent(T_s)
    assert k == pytest.approx(1.0, rel=1e-12)

    dist = elf.vertical_distribution(WEIGHTS_KIP, HEIGHTS_FT, V_kip, k)
    assert dist["wx_hx_k"] == pytest.approx([3000.0, 3000.0, 1500.0], rel=1e-9)
    assert dist["Cvx"] == pytest.approx([0.4, 0.4, 0.2], rel=1e-9)
    assert dist["Fx_kip"] == pytest.approx([24.615, 24.615, 12.308], rel=1e-4)

    Fx = dist["Fx_kip"]
    assert elf.story_shears(Fx, HEIGHTS_FT) == pytest.approx([24.615, 49.231, 61.538], rel=1e-4)
    assert elf.overturning_moments(Fx, HEIGHTS_FT) == pytest.approx([0.0, 246.15, 738.46], rel=1e-4)
    assert elf.base_overturning_moment(Fx, HEIGHTS_FT) == pytest.approx(1353.85, rel=1e-4)


# --- ASCE 7-16 §11.4.8 exception 2 and §12.8.1.3 -------------------------------------------
# Hand cases (derived) with SDS = 1.0, SD1 = 0.68 (Site D, Ss 1.5, S1 0.6), R = 6.5, Ie = 1.0:
# Ts = 0.68 s, 1.5 Ts = 1.02 s.


@pytest.mark.parametrize(
    ("T_s", "TL_s", "expected", "branch"),
    [
        (0.25, 8.0, 1.0 / 6.5, elf.EXC2_SHORT),  # T <= 1.5 Ts: Eq. 12.8-2 = 0.1538
        (1.02, 8.0, 1.0 / 6.5, elf.EXC2_SHORT),  # at 1.5 Ts exactly
        (1.2, 8.0, 1.5 * 0.68 / (1.2 * 6.5), elf.EXC2_MID),  # 1.5 x Eq. 12.8-3 = 0.1308
        (10.0, 8.0, 1.5 * 0.68 * 8.0 / (100.0 * 6.5), elf.EXC2_LONG),  # 1.5 x Eq. 12.8-4
    ],
)
def test_Cs_exception_2_branches(T_s, TL_s, expected, branch):
    value, got = elf.Cs_exception_2(1.0, 0.68, T_s, TL_s, 6.5, 1.0, 0.68)
    assert value == pytest.approx(expected, rel=1e-12)
    assert got == branch


def test_Cs_exception_2_continuous_at_1_5_Ts():
    # derived: 1.5 SD1 / (1.5 Ts R/Ie) = SDS / (R/Ie) at T = 1.5 Ts
    below, _ = elf.Cs_exception_2(1.0, 0.68, 1.02, 8.0, 6.5, 1.0, 0.68)
    above, _ = elf.Cs_exception_2(1.0, 0.68, 1.02 + 1e-9, 8.0, 6.5, 1.0, 0.68)
    assert above == pytest.approx(below, rel=1e-8)


def test_Cs_with_exception_2_drops_the_eq_12_8_3_cap_below_1_5_Ts():
    # derived: T = 0.9 s <= 1.02 s -> Cs = Eq. 12.8-2 = 0.1538 although Eq. 12.8-3 gives
    # 0.68 / (0.9 x 6.5) = 0.1162; without the exception Cs would be 0.1162
    with_exc, label = elf.Cs(1.0, 0.68, 0.6, 0.9, 8.0, 6.5, 1.0, exception_2_Ts_s=0.68)
    without, plain = elf.Cs(1.0, 0.68, 0.6, 0.9, 8.0, 6.5, 1.0)
    assert with_exc == pytest.approx(1.0 / 6.5, rel=1e-12)
    assert label == elf.EXC2_PREFIX + elf.EXC2_SHORT
    assert without == pytest.approx(0.68 / (0.9 * 6.5), rel=1e-12)
    assert plain == elf.LABEL_CS_UPPER_SHORT


def test_Ss_for_Cs_limit_12_8_1_3():
    # ASCE 7-16 §12.8.1.3 (from memory): Ss = 1.5 where permitted; unchanged otherwise
    assert elf.Ss_for_Cs(2.1, True) == 1.5
    assert elf.Ss_for_Cs(1.2, True) == 1.2
    assert elf.Ss_for_Cs(2.1, False) == 2.1
