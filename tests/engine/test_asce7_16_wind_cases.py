"""ASCE 7-16 roof uplift, minimum load case and torsional load cases (ch. 26-27, App. D).

Sources: Fig. 27.3-1 roof Cp and its note on interpolation, read from a copy of the same
figure in ASCE/SEI 7-22 ch. 27 (values unchanged from ASCE 7-16: from memory); Table 26.13-1
GCpi: enclosed and partially enclosed from memory, partially open ±0.18 read in a quotation of the
ASCE 7-16 commentary C26.2; Fig. 27.3-8 case factors 0.75 / 0.563 and e = 0.15 B read from the
same 7-22 copy; Appendix D, D1.1 wording read in a copy of ASCE 7-10 (figure number
updated in 7-16, from memory); §27.1.5 16 psf / 8 psf from memory.
"""

from __future__ import annotations

import pytest

from latbook.engine.asce7_16 import wind_cases as wc


@pytest.mark.parametrize(
    ("h_over_L", "zone", "Cp"),
    [
        (0.3, 0, -0.9),
        (0.5, 1, -0.9),
        (0.5, 2, -0.5),
        (0.2, 3, -0.3),
        (1.0, 0, -1.3),
        (1.5, 1, -0.7),
        (1.0, 3, -0.7),
        # interpolation between like signs (Fig. 27.3-1 note), derived: h/L = 0.75 is midway
        (0.75, 0, -1.1),
        (0.75, 2, -0.6),
        (0.75, 3, -0.5),
    ],
)
def test_roof_cp_fig_27_3_1(h_over_L, zone, Cp):
    assert wc.roof_zone_cp(h_over_L, zone) == pytest.approx(Cp, abs=1e-12)


def test_roof_zones_by_distance_from_the_windward_edge():
    h = 20.0
    assert [wc.roof_zone_index(d, h) for d in (0.0, 10.0, 10.5, 20.0, 39.0, 40.5)] == [
        0,
        0,
        1,
        1,
        2,
        3,
    ]


def test_gcpi_table_26_13_1():
    assert wc.GCPI_BY_ENCLOSURE == {
        "enclosed": 0.18,
        "partially_enclosed": 0.55,
        "partially_open": 0.18,
    }


def test_net_roof_uplift():
    # derived: qh = 20 psf, G = 0.85, Cp = -0.9, GCpi = +0.18 -> 20 (0.18 + 0.765) = 18.9 psf
    assert wc.roof_net_uplift_psf(20.0, 0.85, -0.9, 0.18) == pytest.approx(18.9, rel=1e-12)


def test_minimum_case_force():
    # §27.1.5: 16 psf on a 10 ft band and 8 psf on a 3 ft roof projection, 50 ft wide
    assert wc.minimum_case_force_kip(10.0, 50.0, 3.0) == pytest.approx(9.2, rel=1e-12)


@pytest.mark.parametrize(
    ("n", "h", "exempt"),
    [(1, 30.0, True), (1, 35.0, True), (2, 40.0, True), (3, 30.0, False), (4, 45.0, False)],
)
def test_appendix_d_d1_1(n, h, exempt):
    # flexible diaphragms: two stories or less are exempt whatever h; one story at any h too
    assert wc.torsional_cases_exempt(n, h, flexible_diaphragms=True) is exempt


def test_one_story_exemption_needs_h_30_ft_without_flexible_diaphragms():
    assert wc.torsional_cases_exempt(1, 30.0, flexible_diaphragms=False)
    assert not wc.torsional_cases_exempt(1, 31.0, flexible_diaphragms=False)


def test_eccentric_line_load_has_the_case_2_moment():
    # derived: the linear load carries 0.75 F and its moment about the centre is 0.75 F x 0.15 B
    F_kip, B = 12.0, 60.0
    w0, w1 = wc.eccentric_line_load_plf(F_kip, 0.75, B, +1)
    total_lb = (w0 + w1) / 2.0 * B
    moment = (w1 - w0) / B * B**3 / 12.0
    assert total_lb == pytest.approx(0.75 * F_kip * 1000.0, rel=1e-12)
    assert moment == pytest.approx(0.75 * F_kip * 1000.0 * 0.15 * B, rel=1e-12)
