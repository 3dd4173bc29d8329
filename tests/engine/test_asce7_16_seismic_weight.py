"""Seismic weight parts, ASCE 7-16 §12.7.2. Rules (10 psf partitions, 20 % of pf above 30 psf,
25 % of storage live load) from memory of §12.7.2 items 1, 2 and 4; values are hand cases
(derived)."""

import pytest

from latbook.engine.asce7_16 import seismic_weight as sw


def test_area_weight_is_psf_times_area_in_kip():
    # derived: 15 psf x 2,688 sf = 40,320 lb = 40.32 kip
    assert sw.area_weight_kip(15.0, 2688.0) == pytest.approx(40.32, rel=1e-12)


def test_tributary_height_half_below_half_above():
    # derived: stories of 10.5 ft below and 10.5 ft above -> 10.5 ft; roof: 10.5 / 2
    assert sw.tributary_height_ft(10.5, 10.5) == pytest.approx(10.5, rel=1e-12)
    assert sw.tributary_height_ft(10.5, 0.0) == pytest.approx(5.25, rel=1e-12)


def test_wall_weight():
    # derived: 12 psf x 5.25 ft x 212 ft = 13,356 lb
    assert sw.wall_weight_kip(12.0, 5.25, 212.0) == pytest.approx(13.356, rel=1e-12)


@pytest.mark.parametrize(("actual", "used"), [(0.0, 10.0), (8.0, 10.0), (10.0, 10.0), (15.0, 15.0)])
def test_partitions_greater_of_actual_and_10_psf(actual, used):
    # from memory (ASCE 7-16 §12.7.2 item 2)
    assert sw.partition_psf(actual) == used


@pytest.mark.parametrize(("pf", "used"), [(25.0, 0.0), (30.0, 0.0), (30.5, 6.1), (50.0, 10.0)])
def test_snow_20_percent_only_above_30_psf(pf, used):
    # from memory (ASCE 7-16 §12.7.2 item 4): 20 % of the uniform design snow load where the
    # flat roof snow load exceeds 30 psf (the whole load, not the excess)
    assert sw.snow_psf(pf) == pytest.approx(used, rel=1e-12)


def test_storage_25_percent_of_live_load():
    # from memory (ASCE 7-16 §12.7.2 item 1): 125 psf storage -> 31.25 psf
    assert sw.storage_psf(125.0) == pytest.approx(31.25, rel=1e-12)


def test_negative_loads_are_refused():
    with pytest.raises(ValueError):
        sw.area_weight_kip(-1.0, 10.0)
    with pytest.raises(ValueError):
        sw.partition_psf(-0.5)
