//! The limits of the wind methods at their exact boundaries (added for mutants that survived the wind
//! crate's tests: a `>=` turned `>` at a refusal, a `>` turned `>=` at the 7 degree figure boundary).

use deckhold_wind::{analyze, RoofShape};

mod support;
use support::{asce, input, nbc};

#[test]
fn nbc_refuses_a_building_as_tall_as_it_is_narrow() {
    // NBC 2020 4.1.7.6.(1): the low-building coefficients apply when H is "less than the smaller plan
    // dimension" (from memory): a flat roof at 9.0 m on a 9 m wide building is outside, 8.9 m inside.
    let error = analyze(&input(RoofShape::Flat, 0.0, 9.0, nbc())).expect_err("H = least dimension");
    assert!(
        error.to_string().contains("building.eave_height_m"),
        "{error}"
    );
    assert!(analyze(&input(RoofShape::Flat, 0.0, 8.9, nbc())).is_ok_and(|a| !a.zones.is_empty()));
}

#[test]
fn asce_accepts_a_building_as_tall_as_it_is_narrow() {
    // ASCE 7-22 26.2, low-rise building: mean roof height h "not exceeding the least horizontal dimension"
    // (from memory): h = 9.0 m on a 9 m wide building is inside, 9.1 m outside.
    assert!(analyze(&input(RoofShape::Flat, 0.0, 9.0, asce())).is_ok_and(|a| !a.zones.is_empty()));
    let error =
        analyze(&input(RoofShape::Flat, 0.0, 9.1, asce())).expect_err("h > least dimension");
    assert!(
        error.to_string().contains("building.eave_height_m"),
        "{error}"
    );
}

fn warns(analysis: &deckhold_wind::WindAnalysis, words: &str) -> bool {
    analysis.warnings.iter().any(|w| w.contains(words))
}

#[test]
fn asce_takes_a_7_degree_roof_on_the_low_slope_figure_and_warns_of_hip_zones_only_on_sloped_hips() {
    // ASCE 7-22 Figure 30.3-2A covers roofs with theta <= 7 deg (from memory): a 7.0 deg gable is on it
    // (its zone 1' simplification is stated), a 7.5 deg gable is not.
    let low = analyze(&input(RoofShape::Gable, 7.0, 3.0, asce())).expect("7 deg");
    assert!(warns(&low, "Figure 30.3-2A"), "{:?}", low.warnings);
    let sloped = analyze(&input(RoofShape::Gable, 7.5, 3.0, asce())).expect("7.5 deg");
    assert!(!warns(&sloped, "Figure 30.3-2A"), "{:?}", sloped.warnings);
    // The hip zone-3 reading is said on sloped hips only, never on gables or on a 7 deg hip.
    assert!(
        !warns(&sloped, "hip roofs: zone 3"),
        "{:?}",
        sloped.warnings
    );
    let hip = analyze(&input(RoofShape::Hip, 20.0, 3.0, asce())).expect("hip");
    assert!(warns(&hip, "hip roofs: zone 3"), "{:?}", hip.warnings);
    let low_hip = analyze(&input(RoofShape::Hip, 7.0, 3.0, asce())).expect("7 deg hip");
    assert!(
        !warns(&low_hip, "hip roofs: zone 3"),
        "{:?}",
        low_hip.warnings
    );
}
