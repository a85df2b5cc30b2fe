//! The limits the binary itself holds (the rest are probed through the reader in
//! crates/project/tests/limit_boundaries.rs): the project file's size and the batch file's columns,
//! field length and row ids, each at its limit (accepted) and one past it (refused, exit 2, named).

mod support;

use deckhold_core::limits::{BATCH_COLUMNS, BATCH_FIELD_CHARS, FILE_SIZE, ROOF_ID_CHARS};
use support::{batch_over_demo, deckhold, fixture};

/// The demo project padded with trailing spaces to exactly `bytes` bytes.
fn padded_demo(dir: &std::path::Path, bytes: usize) -> std::path::PathBuf {
    let mut text = std::fs::read_to_string(fixture("demo-ca-gable.json")).expect("demo");
    text.push_str(&" ".repeat(bytes - text.len()));
    let path = dir.join(format!("padded-{bytes}.json"));
    std::fs::write(&path, text).expect("write");
    path
}

#[test]
fn the_project_file_size_holds_at_its_limit() {
    let dir = tempfile::tempdir().expect("tempdir");
    let max = FILE_SIZE.max_count();
    let at = deckhold()
        .arg("zones")
        .arg(padded_demo(dir.path(), max))
        .output()
        .expect("runs");
    assert_eq!(at.status.code(), Some(0), "{at:?}");
    let beyond = deckhold()
        .arg("zones")
        .arg(padded_demo(dir.path(), max + 1))
        .output()
        .expect("runs");
    let message = String::from_utf8_lossy(&beyond.stderr);
    assert_eq!(beyond.status.code(), Some(2), "{message}");
    assert!(
        message.contains("project file") && message.contains(&max.to_string()),
        "{message}"
    );
}

/// Runs a batch file over the demo; returns (exit status, summary.csv or stderr text).
fn batch(dir: &std::path::Path, name: &str, text: &str) -> (Option<i32>, String) {
    let roofs = dir.join(format!("{name}.csv"));
    std::fs::write(&roofs, text).expect("write");
    let out = dir.join(name);
    let output = batch_over_demo(&roofs, &out);
    let summary = std::fs::read_to_string(out.join("summary.csv")).unwrap_or_default();
    (
        output.status.code(),
        format!("{summary}{}", String::from_utf8_lossy(&output.stderr)),
    )
}

#[test]
fn batch_columns_hold_at_their_limit() {
    let dir = tempfile::tempdir().expect("tempdir");
    let header = |count: usize| {
        let mut names = vec!["id".to_string()];
        names.extend((1..count).map(|i| format!("x.k{i}")));
        format!("{}\n", names.join(","))
    };
    let max = BATCH_COLUMNS.max_count();
    let (status, text) = batch(dir.path(), "at", &header(max));
    assert_eq!(status, Some(0), "{text}");
    let (status, text) = batch(dir.path(), "beyond", &header(max + 1));
    assert_eq!(status, Some(2), "{text}");
    assert!(
        text.contains("header") && text.contains(&(max + 1).to_string()),
        "{text}"
    );
}

#[test]
fn batch_fields_and_ids_hold_at_their_limits() {
    let dir = tempfile::tempdir().expect("tempdir");
    let field = BATCH_FIELD_CHARS.max_count();
    let id = ROOF_ID_CHARS.max_count();
    let text = format!(
        "id,project.notes\n{},{}\n{},short\nlong-note,{}\n",
        "a".repeat(id),
        "n".repeat(field),
        "b".repeat(id + 1),
        "n".repeat(field + 1),
    );
    let (status, summary) = batch(dir.path(), "fields", &text);
    assert_eq!(status, Some(2), "two rows refused: {summary}");
    let lines: Vec<&str> = summary.lines().collect();
    assert!(
        lines[1].starts_with(&format!("{},ok,", "a".repeat(id))),
        "{}",
        lines[1]
    );
    assert!(
        lines[2].contains(",refused,") && lines[2].contains("column id"),
        "{}",
        lines[2]
    );
    assert!(
        lines[3].contains(",refused,") && lines[3].contains("project.notes"),
        "{}",
        lines[3]
    );
}
