"""Bad input for the site, weight, rho and §12.8.1.3 parts of the spec: refused with the JSON
path and the rule, exit 2, nothing written (the CLI path of tests/test_cli_bad_input.py)."""

from __future__ import annotations

import copy

import pytest

from tests.test_cli_bad_input import SENTINEL, demo, run_build

TAKEOFF = {
    "areas": [{"name": "roof", "dead_psf": 15.0, "area_sf": 2688.0}],
    "walls": [{"name": "exterior", "kind": "exterior", "dead_psf": 12.0, "length_ft": 212.0}],
}


def _with(mutate) -> dict:
    data = copy.deepcopy(demo())
    mutate(data)
    return data


def _takeoff_on_roof(data, **changes) -> None:
    roof = data["building"]["levels"][2]
    del roof["seismic_weight_kip"]
    roof["weight_takeoff"] = copy.deepcopy(TAKEOFF) | changes


CASES = [
    (
        "negative psf",
        lambda d: (
            _takeoff_on_roof(d),
            d["building"]["levels"][2]["weight_takeoff"]["areas"][0].update(dead_psf=-5.0),
        ),
        "$.building.levels[2].weight_takeoff.areas[0].dead_psf",
        "greater_than_equal",
    ),
    (
        "takeoff and typed weight both",
        lambda d: d["building"]["levels"][1].update(weight_takeoff=copy.deepcopy(TAKEOFF)),
        "$.building.levels[1].weight_takeoff",
        "one_weight",
    ),
    (
        "no weight at all",
        lambda d: d["building"]["levels"][0].pop("seismic_weight_kip"),
        "$.building.levels[0].seismic_weight_kip",
        "required",
    ),
    (
        "parapet below the roof",
        lambda d: (
            d["building"]["levels"][0].pop("seismic_weight_kip"),
            d["building"]["levels"][0].update(
                weight_takeoff={
                    "walls": [
                        {
                            "name": "w",
                            "kind": "exterior",
                            "dead_psf": 10.0,
                            "length_ft": 50.0,
                            "parapet_height_ft": 3.0,
                        }
                    ]
                }
            ),
        ),
        "$.building.levels[0].weight_takeoff.walls[0].parapet_height_ft",
        "parapet",
    ),
    (
        "takeoff summing to zero",
        lambda d: _takeoff_on_roof(
            d, areas=[{"name": "r", "dead_psf": 0.0, "area_sf": 10.0}], walls=[]
        ),
        "$.building.levels[2].weight_takeoff",
        "positive",
    ),
    (
        "default site class that is not D",
        lambda d: d["seismic"]["ground_motion"].update(site_class_basis="default_D"),
        "$.seismic.ground_motion.site_class_basis",
        "site_class_basis",
    ),
    (
        "rho typed with a determined method",
        lambda d: d["seismic"].update(rho_method="removal_test"),
        "$.seismic.rho",
        "rho_override",
    ),
    (
        "§12.8.1.3 taken in risk category III",
        lambda d: (
            d["seismic"].update(limit_Ss_for_Cs=True),
            d["building"].update(risk_category="III"),
        ),
        "$.seismic.limit_Ss_for_Cs",
        "conditions",
    ),
    (
        "§12.8.1.3 taken with a declared irregularity",
        lambda d: d["seismic"].update(
            limit_Ss_for_Cs=True, declared_irregularities={"diaphragm_discontinuity_3": True}
        ),
        "$.seismic.limit_Ss_for_Cs",
        "conditions",
    ),
]


@pytest.mark.parametrize("name,mutate,where,rule", CASES, ids=[c[0] for c in CASES])
def test_refused_with_path_and_rule(name, mutate, where, rule, tmp_path, capsys):
    code, err, out = run_build(_with(mutate), tmp_path, capsys)
    assert code == 2, err
    assert where in err
    assert f"[{rule}]" in err
    assert "Traceback" not in err
    assert out.read_bytes() == SENTINEL


def test_conditions_message_names_the_failed_condition(tmp_path, capsys):
    data = _with(
        lambda d: (
            d["seismic"].update(limit_Ss_for_Cs=True),
            d["building"].update(risk_category="III"),
        )
    )
    _, err, _ = run_build(data, tmp_path, capsys)
    assert "12.8.1.3" in err and "risk category III or IV" in err


def test_archived_spec_with_typed_rho_still_builds(tmp_path, capsys):
    # archived specs give "rho" with no rho_method: the typed value, as before
    code, err, out = run_build(demo(), tmp_path, capsys)
    assert code == 0, err
    assert out.read_bytes() != SENTINEL
