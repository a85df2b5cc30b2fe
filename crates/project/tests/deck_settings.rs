//! The deck settings that shape the layout (`deck.blocking`, ...): read in both unit systems, used by
//! the layout, refused by name when they make no sense.

use deckhold_deck::layout::LineKind;
use deckhold_project::job::deck_layout;
use deckhold_project::{project_from_value, EdgeBlocking};
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
