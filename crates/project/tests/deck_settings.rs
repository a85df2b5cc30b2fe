//! The deck settings that shape the layout (`deck.blocking`, ...): read in both unit systems, used by
//! the layout, refused by name when they make no sense.

use deckhold_deck::layout::LineKind;
use deckhold_project::job::deck_layout;
use deckhold_project::{project_from_value, EdgeBlocking, StartCorner};
use serde_json::{json, Value};
use std::path::PathBuf;

fn fixture(name: &str) -> Value {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../../fixtures")
        .join(name);
    serde_json::from_str(&std::fs::read_to_string(path).expect("fixture")).expect("JSON")
}

fn blocking_count(project: &Value) -> usize {
    let project = project_from_value(project).expect("valid project");
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let layout = deck_layout(&project, &wind).expect("layout");
    layout
        .framing
        .iter()
        .filter(|l| l.kind == LineKind::Blocking)
        .count()
}

#[test]
fn blocking_is_read_in_both_unit_systems_and_lays_blocking_lines() {
    for name in ["demo-ca-gable.json", "template-us.json"] {
        let mut project = fixture(name);
        assert_eq!(blocking_count(&project), 0, "{name}: none unless asked");
        project["deck"]["blocking"] = json!("course-joints");
        let read = project_from_value(&project).expect("valid");
        assert_eq!(read.deck.blocking, EdgeBlocking::CourseJoints);
        assert!(blocking_count(&project) > 0, "{name}: blocking laid");
        project["deck"]["blocking"] = json!("none");
        assert_eq!(blocking_count(&project), 0, "{name}");
    }
}

#[test]
fn nonsense_blocking_is_refused_naming_the_key() {
    let mut project = fixture("template-us.json");
    for nonsense in [json!("all"), json!(true), json!(2)] {
        project["deck"]["blocking"] = nonsense.clone();
        let error = project_from_value(&project).expect_err("refused");
        assert!(
            error.to_string().starts_with("deck.blocking"),
            "{nonsense}: {error}"
        );
    }
}

#[test]
fn the_laying_start_is_read_in_both_unit_systems() {
    let mut ca = fixture("demo-ca-gable.json");
    ca["deck"]["start_corner"] = json!("larger-coordinate");
    ca["deck"]["first_course_width_mm"] = json!(900);
    ca["deck"]["first_panel_length_mm"] = json!(1830);
    let read = project_from_value(&ca).expect("valid");
    assert_eq!(read.deck.start_corner, StartCorner::LargerCoordinate);
    assert_eq!(read.deck.first_course_width_mm, 900.0);
    assert_eq!(read.deck.first_panel_length_mm, 1830.0);
    let mut us = fixture("template-us.json");
    us["deck"]["first_course_width_in"] = json!(24);
    us["deck"]["first_panel_length_in"] = json!(72);
    let read = project_from_value(&us).expect("valid");
    assert_eq!(read.deck.start_corner, StartCorner::SmallerCoordinate);
    assert!((read.deck.first_course_width_mm - 609.6).abs() < 1e-9);
    assert!((read.deck.first_panel_length_mm - 1828.8).abs() < 1e-9);
    // Defaults: whole panels.
    let read = project_from_value(&fixture("template-us.json")).expect("valid");
    assert_eq!(read.deck.first_course_width_mm, read.deck.panel_width_mm);
    assert_eq!(read.deck.first_panel_length_mm, read.deck.panel_length_mm);
}

#[test]
fn a_nonsense_laying_start_is_refused_naming_the_key_written() {
    for (key, value) in [
        ("start_corner", json!("north")),
        ("first_course_width_mm", json!(2000)),
        ("first_course_width_mm", json!(10)),
        ("first_panel_length_mm", json!(3000)),
        ("first_panel_length_in", json!(-1)),
    ] {
        let mut project = fixture("demo-ca-gable.json");
        project["deck"][key] = value.clone();
        let error = project_from_value(&project).expect_err("refused");
        assert!(
            error.to_string().starts_with(&format!("deck.{key}")),
            "{key} = {value}: {error}"
        );
    }
}

#[test]
fn laying_from_the_larger_coordinate_starts_on_the_last_line() {
    // The demo's south plane P1 has lines 1..31 from x = 0 to 18.3 m: laying from the larger x starts
    // at its eave corner x = 18.6 m (0.3 m rake overhang) on line 31.
    let mut value = fixture("demo-ca-gable.json");
    value["deck"]["start_corner"] = json!("larger-coordinate");
    let project = project_from_value(&value).expect("valid");
    let job = deckhold_project::run_job(&project).expect("runs");
    let schedule = deckhold_project::schedule_for(&project, &job);
    let first = &schedule.laying_starts[0];
    assert_eq!(first.plane, "P1");
    assert_eq!(first.first_line, Some(31));
    assert!(
        (first.corner_m[0] - 18.6).abs() < 1e-9,
        "{:?}",
        first.corner_m
    );
    let plain = project_from_value(&fixture("demo-ca-gable.json")).expect("valid");
    let job = deckhold_project::run_job(&plain).expect("runs");
    assert_eq!(
        deckhold_project::schedule_for(&plain, &job).laying_starts[0].first_line,
        Some(1)
    );
}
