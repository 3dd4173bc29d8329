"""Segmented WSP shear walls, AWC SDPWS-2015 §4.3: aspect ratio, distribution in a line,
overturning and hold-downs, Eq. 4.3-1 deflection.

Sources named beside each check. Aspect-ratio limits and factors are from memory of
SDPWS-2015 (Table 4.3.4, §4.3.4.2, §4.3.3.4.1). The bending term is checked against the
cantilever derivation in APA Technical Topics TT-053A, "Wood Structural Panel Shear Wall
Deflection Formula" (Feb. 2007): P = v b, I = 2 A (b/2)^2, delta = P h^3 / (3 E I).
"""

import pytest

from latbook.engine.errors import CodeLimitError
from latbook.engine.sdpws.shear_wall import (
    ASPECT_RATIO_LIMIT_WSP,
    accumulate_hold_down,
    aspect_ratio,
    aspect_ratio_factor_wsp,
    deflection_anchorage_in,
    deflection_bending_in,
    deflection_shear_in,
    distribute_line_shear,
    end_post_compression_lb,
    hold_down_tension_lb,
    line_effective_length_ft,
    line_unit_shear_plf,
    meets_aspect_ratio_limit_wsp,
    net_uplift_lb,
    overturning_moment_lbft,
    resisting_moment_lbft,
    segment_unit_shear_plf,
    shear_wall_deflection_in,
    sliding_unit_shear_plf,
    strength_proportion_factor_wsp,
)

# ---- aspect ratio -----------------------------------------------------------------------


def test_aspect_ratio_limit_is_table_value():
    # SDPWS-2015 Table 4.3.4: blocked WSP shear walls 3.5:1 (from memory).
    assert pytest.approx(3.5, rel=1e-12) == ASPECT_RATIO_LIMIT_WSP
    assert aspect_ratio(8.0, 4.0) == pytest.approx(2.0, rel=1e-12)


@pytest.mark.parametrize(
    ("h_ft", "b_ft", "expected"),
    [
        (8.0, 4.0, 1.0),  # h/b = 2: no reduction
        (8.0, 3.0, 1.25 - 0.125 * 8.0 / 3.0),  # 0.9167
        (9.0, 9.0 / 3.5, 0.8125),  # at the 3.5 limit: 1.25 - 0.4375
    ],
)
def test_aspect_ratio_factor_wsp(h_ft, b_ft, expected):
    # SDPWS-2015 §4.3.4.2: 1.25 - 0.125 h/bs for h/bs > 2 (from memory), wind and seismic
    # (SDPWS-2015 change summary, STRUCTURE magazine, July 2015).
    assert aspect_ratio_factor_wsp(h_ft, b_ft) == pytest.approx(expected, rel=1e-9)


def test_factors_are_continuous_at_two_to_one():
    # Derived by hand: both formulas give 1.0 at h/bs = 2.
    assert aspect_ratio_factor_wsp(8.0, 3.999999) == pytest.approx(1.0, rel=1e-5)
    assert strength_proportion_factor_wsp(8.0, 3.999999) == pytest.approx(1.0, rel=1e-5)


def test_strength_proportion_factor_is_two_b_over_h():
    # SDPWS-2015 §4.3.3.4.1 Exception: 2bs/h (from memory); 2(3)/8 = 0.75.
    assert strength_proportion_factor_wsp(8.0, 3.0) == pytest.approx(0.75, rel=1e-9)


def test_segment_beyond_limit_does_not_qualify():
    # SDPWS-2015 Table 4.3.4 (from memory): 8 ft x 2 ft is h/b = 4 > 3.5.
    assert meets_aspect_ratio_limit_wsp(8.0, 2.0) is False
    assert meets_aspect_ratio_limit_wsp(8.0, 8.0 / 3.5) is True
    with pytest.raises(CodeLimitError):
        aspect_ratio_factor_wsp(8.0, 2.0)
    with pytest.raises(CodeLimitError):
        strength_proportion_factor_wsp(8.0, 2.0)


# ---- distribution in a line -------------------------------------------------------------


def test_equal_factors_split_by_length():
    # eng-tips.com thread "Summing Shear Wall Lines" (qid=380895), reply citing Breyer,
    # "Design of Wood Structures": segments 9, 7, 4 ft, line shear 6,000 lb ->
    # 2,700 / 2,100 / 1,200 lb at 300 plf.
    shares = distribute_line_shear(6_000.0, [9.0, 7.0, 4.0], [1.0, 1.0, 1.0])
    assert shares == pytest.approx([2_700.0, 2_100.0, 1_200.0], rel=1e-9)
    assert line_unit_shear_plf(6_000.0, [9.0, 7.0, 4.0], [1.0, 1.0, 1.0]) == pytest.approx(
        300.0, rel=1e-9
    )


def test_narrow_segment_takes_less_by_hand():
    # Derived by hand: 8 ft and 3 ft segments, 8 ft tall, factors 1.0 and 2bs/h = 0.75:
    # effective length 8 + 2.25 = 10.25 ft; V = 4,100 lb -> 3,200 and 900 lb;
    # effective unit shear 400 plf; physical unit shears 400 and 300 plf.
    factors = [1.0, strength_proportion_factor_wsp(8.0, 3.0)]
    assert line_effective_length_ft([8.0, 3.0], factors) == pytest.approx(10.25, rel=1e-9)
    shares = distribute_line_shear(4_100.0, [8.0, 3.0], factors)
    assert shares == pytest.approx([3_200.0, 900.0], rel=1e-9)
    assert sum(shares) == pytest.approx(4_100.0, rel=1e-12)
    assert line_unit_shear_plf(4_100.0, [8.0, 3.0], factors) == pytest.approx(400.0, rel=1e-9)
    assert segment_unit_shear_plf(shares[1], 3.0) == pytest.approx(300.0, rel=1e-9)


def test_mismatched_inputs_are_refused():
    with pytest.raises(ValueError):
        distribute_line_shear(1_000.0, [4.0, 4.0], [1.0])


# ---- overturning ------------------------------------------------------------------------


def test_overturning_moment_two_levels_by_hand():
    # Derived by hand: 2,000 lb at 18 ft + 1,500 lb at 9 ft = 49,500 lb-ft.
    assert overturning_moment_lbft([2_000.0, 1_500.0], [18.0, 9.0]) == pytest.approx(
        49_500.0, rel=1e-9
    )


def test_resisting_moment_about_compression_end_by_hand():
    # Derived by hand: w = 100 plf, L = 10 ft: wL^2/2 = 5,000 lb-ft; far-end point load
    # 1,000 lb adds 10,000 lb-ft; a load at the pivot adds nothing.
    assert resisting_moment_lbft(100.0, 10.0) == pytest.approx(5_000.0, rel=1e-9)
    assert resisting_moment_lbft(100.0, 10.0, P_left_lb=1_000.0, P_right_lb=700.0) == (
        pytest.approx(15_000.0, rel=1e-9)
    )
    assert resisting_moment_lbft(
        100.0, 10.0, P_left_lb=1_000.0, P_right_lb=500.0, pivot="left"
    ) == pytest.approx(10_000.0, rel=1e-9)


def test_hold_down_matches_awc_manual_form():
    # AWC ASD/LRFD Manual (2001) M14.3, Fig. M14.3-2: chord force = (P h - w L^2/2) / L.
    # Numbers derived by hand: P = 2,000 lb, h = 10 ft, w = 100 plf, L = 10 ft -> 1,500 lb.
    m_ot = overturning_moment_lbft([2_000.0], [10.0])
    m_r = resisting_moment_lbft(100.0, 10.0)
    assert hold_down_tension_lb(m_ot, m_r, 1.0, 10.0, 0.0) == pytest.approx(1_500.0, rel=1e-9)


def test_hold_down_with_dead_factor_and_offset_by_hand():
    # Derived by hand: (20,000 - 0.6 x 5,000) / (10 - 0.5) = 1,789.47 lb.
    assert hold_down_tension_lb(20_000.0, 5_000.0, 0.6, 10.0, 0.5) == pytest.approx(
        17_000.0 / 9.5, rel=1e-9
    )


def test_no_hold_down_when_dead_load_wins():
    # Common practice: resisting moment above overturning -> T = 0; the unfloored value
    # (2,000 - 3,000) / 9.5 = -105.26 lb is still available (derived by hand).
    assert hold_down_tension_lb(2_000.0, 5_000.0, 0.6, 10.0, 0.5) == 0.0
    assert net_uplift_lb(2_000.0, 5_000.0, 0.6, 10.0, 0.5) == pytest.approx(
        -1_000.0 / 9.5, rel=1e-9
    )


def test_story_by_story_accumulation_equals_full_cantilever():
    # Statics, derived by hand: stacked walls, L = 10 ft, no dead load, 9 ft stories,
    # 1,000 lb at the roof and 500 lb at the floor.
    # Full cantilever: (1,000 x 18 + 500 x 9) / 10 = 2,250 lb.
    full = hold_down_tension_lb(
        overturning_moment_lbft([1_000.0, 500.0], [18.0, 9.0]), 0.0, 0.6, 10.0, 0.0
    )
    upper = hold_down_tension_lb(overturning_moment_lbft([1_000.0], [9.0]), 0.0, 0.6, 10.0, 0.0)
    lower = hold_down_tension_lb(overturning_moment_lbft([1_500.0], [9.0]), 0.0, 0.6, 10.0, 0.0)
    assert full == pytest.approx(2_250.0, rel=1e-9)
    assert accumulate_hold_down(lower, upper) == pytest.approx(full, rel=1e-9)


def test_end_post_compression_and_sliding_by_hand():
    # Derived by hand: 20,000 / 9.5 + 800 = 2,905.26 lb; sliding 3,000 lb / 10 ft = 300 plf.
    assert end_post_compression_lb(20_000.0, 10.0, 0.5, 800.0) == pytest.approx(
        20_000.0 / 9.5 + 800.0, rel=1e-9
    )
    assert sliding_unit_shear_plf(3_000.0, 10.0) == pytest.approx(300.0, rel=1e-9)


def test_offset_not_shorter_than_wall_is_refused():
    with pytest.raises(ValueError):
        hold_down_tension_lb(1_000.0, 0.0, 0.6, 4.0, 4.0)


# ---- deflection, SDPWS-2015 Eq. 4.3-1 -----------------------------------------------------

V_PLF, H_FT, E_PSI, A_IN2, B_FT, GA_KIPS_PER_IN, DELTA_A_IN = (
    400.0,
    8.0,
    1.6e6,
    16.5,
    4.0,
    15.0,
    0.1,
)


def test_bending_term_equals_cantilever_chord_model():
    # APA TT-053A derivation: P h^3 / (3 E I), P = v b, I = 2 A (b/2)^2, all in inches.
    b_in, h_in = B_FT * 12.0, H_FT * 12.0
    load_lb = V_PLF * B_FT
    inertia_in4 = 2.0 * A_IN2 * (b_in / 2.0) ** 2
    expected_in = load_lb * h_in**3 / (3.0 * E_PSI * inertia_in4)
    assert deflection_bending_in(V_PLF, H_FT, E_PSI, A_IN2, B_FT) == pytest.approx(
        expected_in, rel=1e-9
    )
    # Derived by hand: 8(400)(512) / (1.6e6 x 16.5 x 4) = 0.015515 in.
    assert deflection_bending_in(V_PLF, H_FT, E_PSI, A_IN2, B_FT) == pytest.approx(
        0.0155152, rel=1e-5
    )


def test_shear_term_by_hand():
    # Derived by hand: v h / (1000 Ga) = 400(8) / 15,000 = 0.21333 in.
    assert deflection_shear_in(V_PLF, H_FT, GA_KIPS_PER_IN) == pytest.approx(0.213333, rel=1e-5)


def test_anchorage_term_is_rigid_body_rotation():
    # Derived by hand (geometry): rotation delta_a / (12 b) rad times height 12 h = 0.2 in.
    rotation_rad = DELTA_A_IN / (B_FT * 12.0)
    assert deflection_anchorage_in(H_FT, DELTA_A_IN, B_FT) == pytest.approx(
        rotation_rad * H_FT * 12.0, rel=1e-9
    )
    assert deflection_anchorage_in(H_FT, DELTA_A_IN, B_FT) == pytest.approx(0.2, rel=1e-9)


def test_total_deflection_is_sum_of_terms():
    # Derived by hand: 0.015515 + 0.213333 + 0.2 = 0.428848 in.
    total = shear_wall_deflection_in(V_PLF, H_FT, E_PSI, A_IN2, B_FT, GA_KIPS_PER_IN, DELTA_A_IN)
    assert total == pytest.approx(0.428848, rel=1e-5)
