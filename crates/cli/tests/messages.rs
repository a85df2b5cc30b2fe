//! Messages that help: each refusal names the key as written, suggests the near allowed key, lists the
//! allowed keys, and exits with status 2; limits hold at their boundary; input size is bounded.

use serde_json::{json, Value};
use std::path::PathBuf;
use std::process::Command;

fn demo() -> Value {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../../fixtures/demo-ca-gable.json");
    serde_json::from_str(&std::fs::read_to_string(path).expect("demo")).expect("JSON")
}

/// Runs `deckhold zones` on `text`, returning the exit code and standard error.
fn zones_on(text: &[u8]) -> (Option<i32>, String) {
    let folder = tempfile::tempdir().expect("temp dir");
    let path = folder.path().join("project.json");
    std::fs::write(&path, text).expect("writes");
    let output = Command::new(env!("CARGO_BIN_EXE_deckhold"))
        .arg("zones")
        .arg(&path)
        .output()
        .expect("runs");
    (
        output.status.code(),
        String::from_utf8_lossy(&output.stderr).to_string(),
    )
}

fn refused(project: &Value) -> String {
    let (code, message) = zones_on(project.to_string().as_bytes());
    assert_eq!(code, Some(2), "{message}");
    assert!(!message.contains("panicked"), "{message}");
    message
}

#[test]
fn a_misspelt_required_key_is_named_with_the_key_it_resembles() {
    let mut project = demo();
    let rectangle = &mut project["building"]["footprint"]["rectangle"];
    rectangle["lenght_m"] = rectangle["length_m"].take();
    rectangle
        .as_object_mut()
        .expect("object")
        .remove("length_m");
    let message = refused(&project);
    assert!(
        message.contains(
            "building.footprint.rectangle.lenght_m: unknown key; did you mean \"length_m\"?"
        ),
        "{message}"
    );
    assert!(
        message.contains("length_ft"),
        "every allowed key is listed: {message}"
    );
}

#[test]
fn a_misspelt_optional_key_is_named_with_the_nearest_allowed_key_and_the_full_list() {
    let mut project = demo();
    project["roof"]["dead_lod_kpa"] = project["roof"]["dead_load_kpa"].take();
    project["roof"]
        .as_object_mut()
        .expect("object")
        .remove("dead_load_kpa");
    let message = refused(&project);
    assert!(
        message.contains("roof.dead_lod_kpa: unknown key; did you mean \"dead_load_kpa\"?"),
        "{message}"
    );
    for allowed in ["shape", "slope_deg", "eave_overhang_mm", "rake_overhang_in"] {
        assert!(message.contains(allowed), "{allowed} listed: {message}");
    }
}

#[test]
fn impossible_dates_are_refused_when_read() {
    for date in [
        "2026-02-30",
        "2025-02-29",
        "2026-13-01",
        "2026-04-31",
        "2026-1-01",
    ] {
        let mut project = demo();
        project["project"]["date"] = json!(date);
        let message = refused(&project);
        assert!(message.contains("project.date"), "{message}");
        assert!(message.contains("calendar date"), "{message}");
    }
    let mut project = demo();
    project["project"]["date"] = json!("2024-02-29");
    let (code, message) = zones_on(project.to_string().as_bytes());
    assert_eq!(code, Some(0), "a leap day is a date: {message}");
}

#[test]
fn control_characters_in_a_key_are_shown_escaped() {
    let mut project = demo();
    project["roof"]["\u{1b}[31mred"] = json!(1);
    let message = refused(&project);
    assert!(message.contains("\\u{1b}[31mred"), "{message}");
    assert!(
        !message.contains('\u{1b}'),
        "no raw escape reaches the terminal"
    );
}

#[test]
fn text_and_list_limits_hold_at_their_boundary() {
    // deckhold_core::limits::TEXT_CHARS: 200 characters accepted, 201 refused.
    let mut project = demo();
    project["project"]["name"] = json!("é".repeat(200));
    assert_eq!(zones_on(project.to_string().as_bytes()).0, Some(0));
    project["project"]["name"] = json!("é".repeat(201));
    let message = refused(&project);
    assert!(
        message.contains("project.name: 201 characters is outside 0..200 characters"),
        "{message}"
    );
    // NAILS_COUNT: 20 accepted, 21 refused.
    let mut project = demo();
    let nail = project["nails"][0].clone();
    project["nails"] = Value::Array(vec![nail.clone(); 20]);
    assert_eq!(zones_on(project.to_string().as_bytes()).0, Some(0));
    project["nails"] = Value::Array(vec![nail; 21]);
    let message = refused(&project);
    assert!(
        message.contains("nails: 21 entries is outside 1..20 entries"),
        "{message}"
    );
}

#[test]
fn physical_limits_hold_at_their_boundary() {
    // Each (block, key, at the limit, beyond): the value at the limit passes the reader, beyond is refused
    // naming the key. The wind method may still refuse a value at the limit for its own reasons (eave
    // height over the low-building limit), so "accepted" here means "not refused for this key's range".
    let cases = [
        ("building", "eave_height_m", 1.0, 0.99),
        ("roof", "dead_load_kpa", 5.0, 5.01),
        ("roof", "eave_overhang_mm", 1500.0, 1500.5),
        ("wind", "q50_kpa", 3.0, 3.01),
        ("wind", "topographic_factor", 1.0, 0.99),
        ("framing", "spacing_mm", 1220.0, 1220.5),
        ("deck", "thickness_mm", 40.0, 40.1),
    ];
    for (block, key, at_limit, beyond) in cases {
        let mut project = demo();
        project[block][key] = json!(at_limit);
        let (_, message) = zones_on(project.to_string().as_bytes());
        assert!(
            !message.contains(&format!("{block}.{key}: {at_limit}")),
            "{block}.{key} = {at_limit} is at the limit: {message}"
        );
        project[block][key] = json!(beyond);
        let message = refused(&project);
        assert!(
            message.contains(&format!("{block}.{key}: {beyond}")),
            "{message}"
        );
        assert!(message.contains("is outside"), "{message}");
    }
}

#[test]
#[cfg(target_os = "linux")]
fn reading_stops_at_the_file_size_limit() {
    let output = Command::new(env!("CARGO_BIN_EXE_deckhold"))
        .args(["zones", "/dev/zero"])
        .output()
        .expect("runs");
    let message = String::from_utf8_lossy(&output.stderr);
    assert_eq!(output.status.code(), Some(2), "{message}");
    assert!(message.contains("larger than 1048576 bytes"), "{message}");
}

#[test]
fn a_key_written_twice_is_refused_naming_it_and_both_positions() {
    let text = "{\n  \"basis\": \"nbc2020-o86\",\n  \"basis\": \"asce7-22-nds2018-asd\"\n}";
    let (code, message) = zones_on(text.as_bytes());
    assert_eq!(code, Some(2), "{message}");
    assert!(
        message.contains("basis: written twice (line 2, column 3 and line 3, column 3)"),
        "{message}"
    );
}

#[test]
fn a_misspelt_word_species_or_nail_is_named_with_the_near_one() {
    let mut project = demo();
    project["roof"]["shape"] = json!("gabel");
    let message = refused(&project);
    assert!(message.contains("roof.shape"), "{message}");
    assert!(message.contains("did you mean \"gable\"?"), "{message}");
    let mut project = demo();
    project["framing"]["species"] = json!("sfp");
    let message = refused(&project);
    assert!(message.contains("framing.species"), "{message}");
    assert!(message.contains("spf"), "{message}");
}
