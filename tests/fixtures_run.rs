//! Every project under `fixtures/` runs (or is refused) as it should, through the library pipeline.

use deckhold_project::{check_pattern, parse_project, run_job, schedule_for};
use deckhold_tests::fixture_text;

#[test]
fn every_good_fixture_runs_to_a_schedule_with_cautions() {
    for name in [
        "demo-ca-gable.json",
        "us-hip.json",
        "ca-l-shaped-flat.json",
        "ca-existing-pattern.json",
        "ca-no-feasible-nail.json",
        "template-ca.json",
        "template-us.json",
    ] {
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

#[test]
fn the_existing_pattern_is_checked_zone_by_zone() {
    let project = parse_project(&fixture_text("ca-existing-pattern.json")).expect("parses");
    let pattern = project
        .existing
        .clone()
        .expect("the fixture has an existing block");
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let checked = check_pattern(&project, &wind, &pattern).expect("checks");
    assert!(!checked.rows.is_empty());
    for row in &checked.rows {
        // A row passes exactly when it is strong enough and inside the prescriptive limits.
        assert_eq!(row.passes, row.notes.is_empty());
        if row.utilization > 1.0 {
            assert!(!row.passes);
        }
    }
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
