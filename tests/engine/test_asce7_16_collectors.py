"""ASCE 7-16 §12.10.2.1 collector forces and the Ω0 they use.

Sources: the wording of §12.10.2.1 items 1-3 and Exceptions 1 and 2, and Table 12.2-1 (entries
A.15-A.17 and B.22-B.24 light-frame shear walls; note g) are from memory; the research notes
read the light-frame exception in an earlier edition's wording (ASCE 7-05). The numbers below are
derived by hand from those rules.
"""

from __future__ import annotations

import pytest

from latbook.engine import collector
from latbook.engine.asce7_16 import collectors as c


def test_light_frame_entries_take_exception_1_by_default():
    assert c.light_frame_exception_default("A.15")
    assert c.light_frame_exception_default("B.22")
    assert not c.light_frame_exception_default("A.18")  # flat-strap bracing, not sheathed
    assert not c.light_frame_exception_default("other")


def test_note_g_omega0_reduction():
    assert c.omega0_used(3.0, True) == 2.5
    assert c.omega0_used(2.5, True) == 2.0
    assert c.omega0_used(3.0, False) == 3.0
    with pytest.raises(ValueError):
        c.omega0_used(2.0, True)


def test_exception_2_caps_items_1_and_2():
    # derived: Ω0 x F_x line force 9000, Ω0 x Eq. 12.10-1 8000, Ω0 x Eq. 12.10-3 7000,
    # Eq. 12.10-2 at the basic combination 3000 -> min(9000, 7000) = 7000
    assert c.collector_force_overstrength_lb(9000.0, 8000.0, 7000.0, 3000.0) == 7000.0
    # item 3 governs where the cap falls below it
    assert c.collector_force_overstrength_lb(2000.0, 1500.0, 5000.0, 2500.0) == 2500.0


def test_basic_collector_force():
    assert c.collector_force_basic_lb(1200.0, 900.0) == 1200.0


def test_collector_shares_follow_L_k():
    # derived: line 30 ft, R = 3000 lb; walls 0-10 (k = 1) and 20-30 (k = 0.5):
    # ΣLk = 15; at s = 10: 3000 x 10/30 - 3000 x 10/15 = -1000; at s = 20: 2000 - 2000 = 0
    segs = [(0.0, 10.0), (20.0, 10.0)]
    ks = [1.0, 0.5]
    assert collector.collector_force_at_lb(30.0, 3000.0, segs, 10.0, ks) == pytest.approx(-1000.0)
    assert collector.collector_force_at_lb(30.0, 3000.0, segs, 20.0, ks) == pytest.approx(0.0)
    assert collector.collector_force_at_lb(30.0, 3000.0, segs, 30.0, ks) == pytest.approx(
        0.0, abs=1e-9
    )
    # without factors the shares follow length (k = 1): at s = 10: 1000 - 1500 = -500
    assert collector.collector_force_at_lb(30.0, 3000.0, segs, 10.0) == pytest.approx(-500.0)
