//! The project file reader, key by key: every key of the two `init` templates (which hold every key of the
//! file) is read, i.e. changing its value changes the project; each kind of refusal names the key exactly
//! as the user wrote it.

use deckhold_project::{parse_project, project_from_value, ProjectError};
use serde_json::{json, Value};
use std::path::PathBuf;

fn template(name: &str) -> Value {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../../fixtures")
        .join(name);
    let text = std::fs::read_to_string(&path)
        .unwrap_or_else(|error| panic!("{}: {error}", path.display()));
    serde_json::from_str(&text).expect("template JSON")
}

/// Every leaf of the document with its key path (array elements as their index).
fn leaves(value: &Value, path: &mut Vec<String>, found: &mut Vec<(Vec<String>, Value)>) {
    match value {
        Value::Object(map) => {
            for (key, child) in map {
                path.push(key.clone());
                leaves(child, path, found);
                path.pop();
            }
        }
        Value::Array(items) => {
            for (index, child) in items.iter().enumerate() {
                path.push(index.to_string());
                leaves(child, path, found);
                path.pop();
            }
        }
        leaf => found.push((path.clone(), leaf.clone())),
    }
}

fn at<'a>(value: &'a mut Value, path: &[String]) -> &'a mut Value {
    path.iter()
        .fold(value, |node, key| match key.parse::<usize>() {
            Ok(index) if node.is_array() => &mut node[index],
            _ => &mut node[key.as_str()],
        })
}

/// Another valid value for a leaf: numbers nudged, flags flipped, words swapped for another allowed word.
fn another(key: &str, value: &Value) -> Value {
    match value {
        Value::Bool(flag) => json!(!flag),
        Value::Number(number) => {
            let x = number.as_f64().expect("finite");
            match key {
                "internal_category" => json!(1),
                "between_mm" => json!(3),
                _ if x == 0.0 => json!(1),
                _ if key.starts_with("panel_") => json!(x * 0.95),
                _ => json!(x * 1.1),
            }
        }
        Value::String(word) => json!(match (key, word.as_str()) {
            ("basis", "nbc2020-o86") => "nbc2020-o86".to_string(),
            ("date", _) => "2026-11-21".to_string(),
            ("shape", "hip") => "gable".to_string(),
            ("shape", _) => "hip".to_string(),
            ("slope", "6:12") => "7:12".to_string(),
            ("slope", _) => "6:12".to_string(),
            ("ridge_along", _) => "width".to_string(),
            ("runs_along", _) => "length".to_string(),
            ("terrain", _) => "rough".to_string(),
            ("importance", _) => "high".to_string(),
            ("exposure", _) => "B".to_string(),
            ("enclosure", _) => "partially-enclosed".to_string(),
            ("species", "spf") => "dfl".to_string(),
            ("species", _) => "spf".to_string(),
            ("member", _) => "rafter".to_string(),
            ("panel", "osb") => "plywood".to_string(),
            ("panel", _) => "osb".to_string(),
            ("stagger", _) => "none".to_string(),
            ("service", _) => "wet".to_string(),
            ("nail", _) | ("0" | "1" | "2", _) => {
                if word.contains('x') {
                    "common-76x3.66".to_string()
                } else if word == "10d-common" {
                    "16d-common".to_string()
                } else {
                    "10d-common".to_string()
                }
            }
            (_, other) => format!("{other} (changed)"),
        }),
        other => other.clone(),
    }
}

/// The project as the reader understood it: everything but the echo of the file as written (which changes
/// with any key, read or not).
fn as_read(project: &deckhold_project::Project) -> String {
    let mut project = project.clone();
    project.as_written = deckhold_project::as_written::AsWritten::Rows(Vec::new());
    format!("{project:?}")
}

#[test]
fn every_key_of_both_templates_is_read() {
    for name in ["template-ca.json", "template-us.json"] {
        let original = template(name);
        let base =
            as_read(&project_from_value(&original).unwrap_or_else(|e| panic!("{name}: {e}")));
        let mut found = Vec::new();
        leaves(&original, &mut Vec::new(), &mut found);
        assert!(found.len() >= 40, "{name}: {} keys", found.len());
        let mut ignored = Vec::new();
        for (path, value) in &found {
            // The basis is read (it selects the whole method); the other basis is its own template.
            if path == &["basis"] {
                continue;
            }
            let key = path.last().expect("a key");
            let mut changed = original.clone();
            *at(&mut changed, path) = another(key, value);
            match project_from_value(&changed) {
                Ok(project) => {
                    if as_read(&project) == base {
                        ignored.push(path.join("."));
                    }
                }
                Err(error) => panic!(
                    "{name}: {} changed to {} is refused ({error}); pick another valid value in `another`",
                    path.join("."),
                    another(key, value)
                ),
            }
        }
        assert!(
            ignored.is_empty(),
            "{name}: keys read but never used: {ignored:?}"
        );
    }
}

#[test]
fn units_are_converted_to_si_at_the_reader() {
    // 1 ft = 0.3048 m and 1 in = 25.4 mm exactly (international yard and pound, 1959); 1 psf =
    // 0.047880 kPa.
    let project = project_from_value(&template("template-us.json")).expect("valid");
    let text = format!("{project:?}");
    for (what, value) in [
        ("eave height 19 ft", 19.0 * 0.3048),
        ("spacing 24 in", 24.0 * 25.4),
        ("edge spacing 6 in", 6.0 * 25.4),
    ] {
        let shown = format!("{value:?}");
        assert!(text.contains(&shown), "{what}: {shown} not in {text}");
    }
}

fn refusal(change: impl FnOnce(&mut Value)) -> String {
    let mut value = template("template-ca.json");
    change(&mut value);
    project_from_value(&value).expect_err("refused").to_string()
}

#[test]
fn each_kind_of_refusal_names_the_key_as_written() {
    // Out of range: the key path with its unit, the value and the range.
    let message = refusal(|v| v["roof"]["dead_load_kpa"] = json!(-1));
    assert!(message.starts_with("roof.dead_load_kpa: -1"), "{message}");
    let message = refusal(|v| v["framing"]["spacing_mm"] = json!(5000));
    assert!(message.starts_with("framing.spacing_mm: 5000"), "{message}");
    // Wrong type.
    let message = refusal(|v| v["deck"]["treated"] = json!("no"));
    assert!(message.starts_with("deck.treated: expected"), "{message}");
    // Unknown key, with the keys allowed there.
    let message = refusal(|v| v["wind"]["q50"] = json!(0.4));
    assert!(message.starts_with("wind.q50: unknown key"), "{message}");
    assert!(message.contains("q50_kpa"), "{message}");
    // Missing.
    let message = refusal(|v| {
        v["deck"].as_object_mut().expect("deck").remove("panel");
    });
    assert_eq!(message, "deck.panel: missing (required)");
    // Both unit variants of one quantity.
    let message = refusal(|v| v["building"]["eave_height_ft"] = json!(14));
    assert!(
        message.contains("eave_height_m") && message.contains("eave_height_ft"),
        "{message}"
    );
    // A word not in the list.
    let message = refusal(|v| v["roof"]["shape"] = json!("dome"));
    assert!(message.starts_with("roof.shape:"), "{message}");
    // In an array: the index is part of the key.
    let message = refusal(|v| v["nails"][1] = json!("12d-unobtainium"));
    assert!(message.starts_with("nails[1]:"), "{message}");
    // Inside the existing pattern's per-zone block.
    let message = refusal(|v| v["existing"]["zones"]["corner"]["edge_spacing_mm"] = json!(-5));
    assert!(
        message.starts_with("existing.zones.corner.edge_spacing_mm: -5"),
        "{message}"
    );
}

#[test]
fn text_that_is_not_json_is_refused_as_such() {
    let error = parse_project("{ \"basis\": ").expect_err("refused");
    assert!(matches!(error, ProjectError::Json(_)), "{error}");
    assert!(error
        .to_string()
        .starts_with("project file is not valid JSON"));
}
