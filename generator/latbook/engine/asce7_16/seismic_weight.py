"""ASCE 7-16 §12.7.2: effective seismic weight W of a level from its parts (kip).

Items of §12.7.2 (from memory): 1. in storage areas, 25 % of the floor live load (exceptions
a and b not implemented: the load is always included); 2. where provision for partitions is
required (§4.3.2), the actual partition weight or 10 psf of floor area, whichever is greater;
3. total operating weight of permanent equipment; 4. where the flat roof snow load pf exceeds
30 psf, 20 % of the uniform design snow load regardless of roof slope; 5. weight of landscaping
(not modelled separately: give it as an area load).
"""

#: §12.7.2 item 2: minimum partition weight, psf of floor area.
PARTITION_MIN_PSF = 10.0
#: §12.7.2 item 4: flat roof snow load above which snow is included, psf; included fraction.
SNOW_THRESHOLD_PSF = 30.0
SNOW_FRACTION = 0.20
#: §12.7.2 item 1: fraction of the storage floor live load included.
STORAGE_FRACTION = 0.25

KIP_PER_LB = 1.0 / 1000.0


def _check_nonnegative(**values: float) -> None:
    for name, value in values.items():
        if value < 0:
            raise ValueError(f"{name} must be >= 0, got {value}")


def area_weight_kip(dead_psf: float, area_sf: float) -> float:
    """Dead load of an area (roof, floor, ceiling): psf x area, §12.7.2 (kip)."""
    _check_nonnegative(dead_psf=dead_psf, area_sf=area_sf)
    return dead_psf * area_sf * KIP_PER_LB


def tributary_height_ft(story_below_ft: float, story_above_ft: float) -> float:
    """Wall height tributary to a level: half the story below plus half the story above (0 at
    the roof), the usual lumping of wall weight to the levels for §12.7.2 (common practice) (ft).
    A parapet above the roof is added to the roof's walls in full."""
    _check_nonnegative(story_below_ft=story_below_ft, story_above_ft=story_above_ft)
    return 0.5 * story_below_ft + 0.5 * story_above_ft


def wall_weight_kip(dead_psf: float, height_ft: float, length_ft: float) -> float:
    """Wall dead load: psf of wall surface x tributary height x length, §12.7.2 (kip)."""
    _check_nonnegative(dead_psf=dead_psf, height_ft=height_ft, length_ft=length_ft)
    return dead_psf * height_ft * length_ft * KIP_PER_LB


def partition_psf(actual_psf: float) -> float:
    """Partition load included: the actual weight or 10 psf, whichever is greater, ASCE 7-16
    §12.7.2 item 2 (psf)."""
    _check_nonnegative(actual_psf=actual_psf)
    return max(actual_psf, PARTITION_MIN_PSF)


def snow_psf(pf_psf: float) -> float:
    """Snow load included: 20 % of pf where pf > 30 psf, else 0, ASCE 7-16 §12.7.2 item 4
    (psf)."""
    _check_nonnegative(pf_psf=pf_psf)
    return SNOW_FRACTION * pf_psf if pf_psf > SNOW_THRESHOLD_PSF else 0.0


def storage_psf(live_psf: float) -> float:
    """Storage live load included: 25 % of the floor live load, ASCE 7-16 §12.7.2 item 1 (psf)."""
    _check_nonnegative(live_psf=live_psf)
    return STORAGE_FRACTION * live_psf
