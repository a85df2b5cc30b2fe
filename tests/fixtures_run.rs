//! Every project under `fixtures/` runs (or is refused) as it should, through the library pipeline.

use deckhold_project::{check_pattern, parse_project, run_job, schedule_for};
use deckhold_tests::{fixture_text, GOOD_FIXTURES};

#[test]
fn every_good_fixture_runs_to_a_schedule_with_cautions() {
    for name in GOOD_FIXTURES {
        let project =
            parse_project(&fixture_text(name)).unwrap_or_else(|error| panic!("{name}: {error}"));
        let job = run_job(&project).unwrap_or_else(|error| panic!("{name}: {error}"));
        let schedule = schedule_for(&project, &job);
        assert!(!schedule.zones.is_empty(), "{name}");
        assert!(
            schedule
                .cautions
                .iter()
                .any(|c| c.contains("qualified person")),
            "{name}"
        );
        assert!(schedule.total_nail_count > 0, "{name}");
        for zone in &schedule.zones {
            if let Some(spacing_mm) = zone.spacing_mm {
                assert!(
                    zone.utilization <= 1.0 + 1e-9,
                    "{name}: {} {}",
                    zone.label,
                    zone.support_role
                );
                assert!(spacing_mm > 0.0);
            }
        }
    }
}

#[test]
fn the_infeasible_fixture_names_what_would_work() {
    let project = parse_project(&fixture_text("ca-no-feasible-nail.json")).expect("parses");
    let job = run_job(&project).expect("runs");
    let schedule = schedule_for(&project, &job);
    assert!(!schedule.feasible);
    assert!(!schedule.alternatives.is_empty());
    assert!(schedule.zones.iter().any(|zone| zone.spacing_mm.is_none()));
}

/// The existing-pattern fixture checked with `zones` (per-zone spacings) set in its `existing` block.
fn check_existing(zones: serde_json::Value) -> deckhold_project::PatternCheck {
    let mut value: serde_json::Value =
        serde_json::from_str(&fixture_text("ca-existing-pattern.json")).expect("JSON");
    if !zones.is_null() {
        value["existing"]["zones"] = zones;
    }
    let project = deckhold_project::project_from_value(&value).expect("valid");
    let pattern = project.existing.clone().expect("existing");
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    check_pattern(&project, &wind, &pattern).expect("checks")
}

fn row<'a>(
    checked: &'a deckhold_project::PatternCheck,
    label: &str,
    role: &str,
) -> &'a deckhold_project::CheckRow {
    checked
        .rows
        .iter()
        .find(|row| row.label.as_str() == label && row.support_role.as_str() == role)
        .unwrap_or_else(|| panic!("no row {label} {role}"))
}

#[test]
fn the_existing_pattern_is_checked_zone_by_zone() {
    // Worked by hand, as in tests/demo_hand_check.rs (same roof and wind): net uplift corner 2.936 kPa
    // (C_p C_g -5.0), interior 1.4 x 0.4063 x (2.5 + 0.6) - 0.249 = 1.514 kPa (C_p C_g -2.5; both NBC 2020
    // Figure 4.1.7.6.-E as read in crates/wind/data/nbc2020.json, severe-of-two, not confirmed); reaction
    // width 32/28 x 610 = 697.1 mm at the first interior support, 11/28 x 610 = 239.6 mm at the end
    // (Hicks, Civil Engineering Formulas, Table 2.1); the existing 51 x 2.84 mm nail:
    // 0.6 x 16.4 x 2.84^0.82 x 0.42^2.2 x (51 - 11.1) = 0.6 x 5.725 x 39.9 = 137.0 N (CSA O86:19 12.9.5.2,
    // from memory).
    let checked = check_existing(serde_json::Value::Null);
    assert_eq!(checked.rows.len(), 9, "five zones x two support roles, less the overhang corner's panel edges: it lies in the rake overhang past the end-wall member, where the deck cantilevers");
    assert!((checked.resistance.governing_n - 137.0).abs() < 0.5);
    // Corner, intermediate, 300 mm: 2.936 x 0.6971 x 300 = 614.0 N; 614.0 / 137.0 = 4.48 (the closing bay
    // at the gable end carries a little more, never less). It would need 137.0 / (2.936 x 0.6971) = 66.9 mm,
    // and the practical steps below 75 mm fall under the splitting minimum 20 x 2.84 = 56.8 mm (CSA O86:19
    // 12.9.2, from memory) or above 66.9 mm: no spacing works, so no retrofit count is offered.
    let corner = row(&checked, "corner", "intermediate");
    assert!(
        corner.utilization >= 4.48 * 0.999 && corner.utilization <= 4.48 * 1.02,
        "{}",
        corner.utilization
    );
    assert!(!corner.passes);
    assert_eq!(corner.notes.len(), 2, "{:?}", corner.notes);
    assert!(corner.notes[0].starts_with("overloaded: utilization 4.5"));
    assert_eq!(
        corner.notes[1],
        "no practical spacing works with this nail: use another nail"
    );
    assert_eq!(corner.required_spacing_mm, None);
    assert_eq!(corner.added_nails_per_gap, None);
    // Interior, intermediate, 300 mm: 1.514 x 0.6971 x 300 = 316.6 N, utilization 2.31; 150 mm would carry
    // 158.3 N (too much), 125 mm 131.9 N: needs 125 mm, so two nails are added between each pair (one gives
    // 300 / 2 = 150 mm, too wide; two give 300 / 3 = 100 mm).
    let interior = row(&checked, "interior", "intermediate");
    assert!(
        (interior.utilization - 2.31).abs() < 0.03,
        "{}",
        interior.utilization
    );
    assert_eq!(interior.required_spacing_mm, Some(125.0));
    assert_eq!(interior.added_nails_per_gap, Some(2));
    // Interior, panel edge, 150 mm: 1.514 x 0.2396 x 150 = 54.4 N per nail; 54.4 / 137.0 = 0.40: passes
    // with no note.
    let edge = row(&checked, "interior", "panel-edge");
    assert!(
        (edge.utilization - 0.40).abs() < 0.01,
        "{}",
        edge.utilization
    );
    assert!(edge.passes && edge.notes.is_empty());
    assert!(!checked.passes(), "one failing zone fails the pattern");
}

#[test]
fn each_reason_to_fail_a_zone_is_found_on_its_own() {
    // Interior, intermediate at 100 mm: 1.514 x 0.6971 x 100 = 105.5 N < 137.0 N (utilization 0.77):
    // strong enough and inside the limits, so it passes.
    let checked = check_existing(serde_json::json!({
        "interior": { "edge_spacing_mm": 150, "intermediate_spacing_mm": 100 }
    }));
    let interior = row(&checked, "interior", "intermediate");
    assert!(interior.passes, "{:?}", interior.notes);
    assert!(
        (interior.utilization - 0.77).abs() < 0.02,
        "{}",
        interior.utilization
    );
    // At 50 mm it is stronger still, but closer than the splitting minimum 20 d = 20 x 2.84 = 56.8 mm
    // (CSA O86:19 12.9.2, from memory): it fails for that reason alone.
    let checked = check_existing(serde_json::json!({
        "interior": { "edge_spacing_mm": 150, "intermediate_spacing_mm": 50 }
    }));
    let interior = row(&checked, "interior", "intermediate");
    assert!(!interior.passes);
    assert_eq!(
        interior.notes,
        ["closer than the splitting minimum of 57 mm: the member may split"]
    );
    // Interior panel edges at 200 mm: strong enough (0.40 x 200/150 = 0.54) but wider than the 150 mm
    // prescriptive maximum at panel edges (NBC 2020 Table 9.23.3.5.-A, from memory): fails for that alone.
    let checked = check_existing(serde_json::json!({
        "interior": { "edge_spacing_mm": 200, "intermediate_spacing_mm": 100 }
    }));
    let interior = row(&checked, "interior", "panel-edge");
    assert!(interior.utilization < 1.0);
    assert!(!interior.passes);
    assert_eq!(
        interior.notes,
        ["wider than the prescriptive maximum of 150 mm for panel-edge supports"]
    );
}

#[test]
fn every_broken_fixture_is_refused_naming_its_key() {
    let cases = [
        ("broken/malformed.json", "JSON"),
        ("broken/unknown-key.json", "roof.slop"),
        ("broken/missing-key.json", "wind.q50_kpa"),
        ("broken/slope-out-of-range.json", "roof.slope_deg"),
        ("broken/both-units.json", "eave_height"),
        ("broken/unknown-nail.json", "12d-unobtainium"),
        ("broken/unknown-species.json", "balsa"),
        ("broken/negative-spacing.json", "framing.spacing"),
        ("broken/unknown-basis.json", "basis"),
    ];
    for (name, words) in cases {
        let error = parse_project(&fixture_text(name))
            .expect_err(name)
            .to_string();
        assert!(error.contains(words), "{name}: {error}");
    }
    // Refused by the wind method, not the parser: the project is well formed but outside the method.
    for (name, words) in [
        ("broken/too-tall.json", "eave_height"),
        ("broken/not-rectilinear.json", "polygon"),
    ] {
        let error = match parse_project(&fixture_text(name)) {
            Err(error) => error.to_string(),
            Ok(project) => run_job(&project).expect_err(name).to_string(),
        };
        assert!(error.contains(words), "{name}: {error}");
    }
}

#[test]
fn worse_zones_never_get_wider_spacing_than_milder_ones() {
    // The zones' order of severity (corner >= edge >= interior suction) is the standards' own
    // (NBC 2020 Figure 4.1.7.6.-C, ASCE 7-22 Figure 30.3-2 series, from memory); the spacing must follow it.
    for name in ["demo-ca-gable.json", "us-hip.json", "ca-l-shaped-flat.json"] {
        let project = parse_project(&fixture_text(name)).expect("parses");
        let schedule = schedule_for(&project, &run_job(&project).expect("runs"));
        for role in ["panel-edge", "intermediate"] {
            let spacing = |label: &str| {
                schedule
                    .zones
                    .iter()
                    .find(|zone| zone.label.as_str() == label && zone.support_role.as_str() == role)
                    .map(|zone| zone.spacing_mm.unwrap_or(0.0))
            };
            let (Some(corner), Some(edge), Some(interior)) =
                (spacing("corner"), spacing("edge"), spacing("interior"))
            else {
                panic!("{name}: every roof has corner, edge and interior zones");
            };
            assert!(
                corner <= edge && edge <= interior,
                "{name} {role}: {corner} {edge} {interior}"
            );
        }
    }
}

#[test]
fn a_per_zone_pattern_overrides_the_all_zones_spacing() {
    let mut value: serde_json::Value =
        serde_json::from_str(&fixture_text("ca-existing-pattern.json")).expect("JSON");
    value["existing"]["zones"] = serde_json::json!({
        "corner": { "edge_spacing_mm": 100, "intermediate_spacing_mm": 100 }
    });
    let project = deckhold_project::project_from_value(&value).expect("valid");
    let pattern = project.existing.clone().expect("existing");
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let checked = check_pattern(&project, &wind, &pattern).expect("checks");
    for row in &checked.rows {
        let expected = match (row.label.as_str(), row.support_role.as_str()) {
            ("corner", _) => 100.0,
            (_, "panel-edge") => 150.0,
            _ => 300.0,
        };
        assert_eq!(
            row.given_spacing_mm, expected,
            "{} {}",
            row.label, row.support_role
        );
    }
    // Retrofit: a failing zone gets the nails to add between each pair of existing ones.
    for row in checked.rows.iter().filter(|row| row.utilization > 1.0) {
        if let (Some(needed), Some(added)) = (row.required_spacing_mm, row.added_nails_per_gap) {
            assert!(row.given_spacing_mm / f64::from(added + 1) <= needed + 1e-9);
        }
    }
}
