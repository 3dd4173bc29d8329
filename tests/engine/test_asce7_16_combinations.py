"""ASCE 7-16 §2.3 / §2.4 lateral load combinations with the §12.4 seismic load effects.

Source: ASCE 7-16 §2.3.1 (LRFD 4: 1.2D + 1.0W + L + 0.5(Lr or S or R); 5: 0.9D + 1.0W),
§2.3.6 (6: 1.2D + Ev + Eh + L + 0.2S; 7: 0.9D - Ev + Eh), §2.4.1 (ASD 5: D + 0.6W;
7: 0.6D + 0.6W), §2.4.5 (8: 1.0D + 0.7Ev + 0.7Eh; 10: 0.6D - 0.7Ev + 0.7Eh), §12.4.2
(Eh = rho QE, Ev = 0.2 SDS D), §12.4.3 (Emh = Omega0 QE), §12.3.4 (rho = 1.0 or 1.3).
All typed from memory; the expected factors below are that text with Ev substituted by hand.
"""

import pytest

from latbook.engine.asce7_16 import combinations as combos

SDS_G = 1.0
RHO = 1.3
OMEGA0 = 2.5


def test_asd_factors():
    # From memory, ASCE 7-16 §2.4.1 / §2.4.5 with Ev = 0.2 SDS D (hand substitution, SDS = 1.0):
    # (1.0 + 0.7 x 0.2 x 1.0) = 1.14; (0.6 - 0.14) = 0.46; 0.7 x 1.3 = 0.91; 0.7 x 2.5 = 1.75
    f = combos.lateral_factors("ASD", SDS_G, RHO, OMEGA0)
    assert f.wind_lateral == pytest.approx(0.6)
    assert f.wind_dead_additive == pytest.approx(1.0)
    assert f.wind_dead_resisting == pytest.approx(0.6)
    assert f.seismic_dead_additive == pytest.approx(1.14)
    assert f.seismic_dead_resisting == pytest.approx(0.46)
    assert f.seismic_lateral == pytest.approx(0.91)
    assert f.overstrength_lateral == pytest.approx(1.75)


def test_lrfd_factors():
    # From memory, ASCE 7-16 §2.3.1 / §2.3.6 with Ev = 0.2 SDS D (hand substitution, SDS = 1.0):
    # 1.2 + 0.2 = 1.4; 0.9 - 0.2 = 0.7; 1.0 x 1.3 = 1.3; Omega0 = 2.5
    f = combos.lateral_factors("LRFD", SDS_G, RHO, OMEGA0)
    assert f.wind_lateral == pytest.approx(1.0)
    assert f.wind_dead_additive == pytest.approx(1.2)
    assert f.wind_dead_resisting == pytest.approx(0.9)
    assert f.seismic_dead_additive == pytest.approx(1.4)
    assert f.seismic_dead_resisting == pytest.approx(0.7)
    assert f.seismic_lateral == pytest.approx(1.3)
    assert f.overstrength_lateral == pytest.approx(2.5)


def test_factors_at_lower_sds():
    # Hand substitution, SDS = 0.5, rho = 1.0: ASD 0.6 - 0.07 = 0.53; LRFD 0.9 - 0.1 = 0.8
    assert combos.lateral_factors("ASD", 0.5, 1.0, 2.5).seismic_dead_resisting == pytest.approx(
        0.53
    )
    assert combos.lateral_factors("LRFD", 0.5, 1.0, 2.5).seismic_dead_resisting == pytest.approx(
        0.8
    )
    assert combos.lateral_factors("ASD", 0.5, 1.0, 2.5).seismic_lateral == pytest.approx(0.7)


def test_combination_names_cite_the_7_16_numbers():
    # Combination numbers of ASCE 7-16 §2.3.1/§2.3.6/§2.4.1/§2.4.5 (from memory)
    asd = combos.lateral_factors("ASD", SDS_G, RHO, OMEGA0)
    lrfd = combos.lateral_factors("LRFD", SDS_G, RHO, OMEGA0)
    assert asd.wind_additive_name == "ASD D + 0.6W (ASCE 7-16 §2.4.1, comb. 5)"
    assert asd.wind_resisting_name == "ASD 0.6D + 0.6W (ASCE 7-16 §2.4.1, comb. 7)"
    assert "§2.4.5, comb. 8" in asd.seismic_additive_name
    assert "§2.4.5, comb. 10" in asd.seismic_resisting_name
    assert "§2.3.1, comb. 4" in lrfd.wind_additive_name
    assert "§2.3.1, comb. 5" in lrfd.wind_resisting_name
    assert "§2.3.6, comb. 6" in lrfd.seismic_additive_name
    assert "§2.3.6, comb. 7" in lrfd.seismic_resisting_name


def test_combination_rows():
    rows = combos.lateral_factors("LRFD", SDS_G, RHO, OMEGA0).combinations()
    assert len(rows) == 6
    # 0.9D + 1.0W carries no seismic term; the overstrength counter-gravity row uses 0.7D, 2.5QE
    assert (rows[1].D_factor, rows[1].W_factor, rows[1].QE_factor) == (
        pytest.approx(0.9),
        pytest.approx(1.0),
        0.0,
    )
    assert (rows[5].D_factor, rows[5].QE_factor) == (pytest.approx(0.7), pytest.approx(2.5))


def test_seismic_load_effects_section_12_4():
    # Hand check of §12.4.2 / §12.4.3: Eh = 1.3 x 10 = 13; Ev = 0.2 x 1.2 x 50 = 12; Emh = 25
    assert combos.Eh(1.3, 10.0) == pytest.approx(13.0)
    assert combos.Ev(1.2, 50.0) == pytest.approx(12.0)
    assert combos.Emh(2.5, 10.0) == pytest.approx(25.0)


@pytest.mark.parametrize("rho", [1.0, 1.3])
def test_redundancy_factor_accepts_the_two_values(rho):
    # ASCE 7-16 §12.3.4 (from memory): rho is 1.0 or 1.3
    assert combos.validate_redundancy_factor(rho) == rho


@pytest.mark.parametrize("rho", [1.1, 1.5, 0.0])
def test_redundancy_factor_rejects_other_values(rho):
    with pytest.raises(ValueError, match="1.0 or 1.3"):
        combos.validate_redundancy_factor(rho)


def test_method_must_be_asd_or_lrfd():
    assert combos.lateral_factors("lrfd", SDS_G, 1.0, 2.5).method == "LRFD"
    with pytest.raises(ValueError, match="method"):
        combos.lateral_factors("WSD", SDS_G, 1.0, 2.5)


def test_gravity_lateral_combinations_for_end_posts():
    # ASCE 7-16 §2.4.1 comb. 6a: D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R) (from memory)
    g = combos.gravity_lateral_combination("ASD", "wind")
    assert (g.lateral, g.D, g.L, g.Lr, g.S) == pytest.approx((0.45, 1.0, 0.75, 0.75, 0.75))
    # §2.4.5 comb. 9: (1.0 + 0.105SDS)D + 0.525ρQE + 0.75L + 0.75(Lr or S or R) (from memory)
    g = combos.gravity_lateral_combination("ASD", "seis", SDS_g=1.0, rho=1.3)
    assert (g.lateral, g.D, g.L, g.S) == pytest.approx((0.6825, 1.105, 0.75, 0.75))
    # LRFD §2.3.1 comb. 4 and §2.3.6 comb. 6 (from memory)
    g = combos.gravity_lateral_combination("LRFD", "wind")
    assert (g.lateral, g.D, g.L, g.Lr, g.S) == pytest.approx((1.0, 1.2, 1.0, 0.5, 0.5))
    g = combos.gravity_lateral_combination("LRFD", "seis", SDS_g=0.5, rho=1.0)
    assert (g.lateral, g.D, g.L, g.Lr, g.S) == pytest.approx((1.0, 1.3, 1.0, 0.0, 0.2))
