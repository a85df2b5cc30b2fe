//! Control characters in user text (a terminal escape, a bell, a line break) never reach an output raw:
//! the console, every CSV and the PDF text show them escaped (`\u{1b}`); JSON escapes them itself.

mod support;

use std::path::Path;
use std::process::Command;
use support::{batch_over_demo, deckhold, fixture};

/// Text with an escape sequence that would recolour a terminal and retitle its window, and a bell.
const HOSTILE: &str = "Shed \u{1b}[31mred\u{1b}]0;title\u{7} end";
const ESCAPED: &str = "Shed \\u{1b}[31mred\\u{1b}]0;title\\u{7} end";

/// `fixture` with the hostile text in every free-text field of `project`, written to `dir`.
fn hostile_project(dir: &Path, fixture_name: &str) -> std::path::PathBuf {
    let text = std::fs::read_to_string(fixture(fixture_name)).expect("fixture reads");
    let mut project: serde_json::Value = serde_json::from_str(&text).expect("fixture parses");
    for key in ["name", "site", "owner", "prepared_by", "notes"] {
        project["project"][key] = serde_json::Value::from(HOSTILE);
    }
    if let Some(fasteners) = project.get_mut("fasteners").and_then(|f| f.as_array_mut()) {
        for fastener in fasteners {
            fastener["source"] = serde_json::Value::from(format!("report {HOSTILE}"));
        }
    }
    let path = dir.join("project.json");
    std::fs::write(&path, serde_json::to_vec(&project).expect("json")).expect("write");
    path
}

/// The control characters in `bytes` other than the line break.
fn raw_controls(bytes: &[u8]) -> Vec<char> {
    String::from_utf8_lossy(bytes)
        .chars()
        .filter(|c| c.is_control() && *c != '\n')
        .collect()
}

fn pdf_text(pdf: &Path) -> String {
    let output = Command::new("pdftotext")
        .arg(pdf)
        .arg("-")
        .output()
        .expect("`pdftotext` is missing: install poppler-utils");
    String::from_utf8(output.stdout).expect("utf8")
}

#[test]
fn run_console_csvs_pdf_and_json_show_control_characters_escaped() {
    let dir = tempfile::tempdir().expect("tempdir");
    let project = hostile_project(dir.path(), "demo-ca-gable.json");
    let out = dir.path().join("out");
    let output = deckhold()
        .arg("run")
        .arg(&project)
        .args(["--json", "--out"])
        .arg(&out)
        .output()
        .expect("runs");
    assert_eq!(output.status.code(), Some(0), "{output:?}");
    // Console (JSON on stdout with --json, messages on stderr).
    assert_eq!(raw_controls(&output.stdout), vec![], "stdout");
    assert_eq!(raw_controls(&output.stderr), vec![], "stderr");
    let json = std::fs::read_to_string(out.join("schedule.json")).expect("schedule.json");
    assert!(json.contains("\\u001b"), "serde escapes JSON");

    let plain = deckhold().arg("run").arg(&project).output().expect("runs");
    assert_eq!(raw_controls(&plain.stdout), vec![], "console summary");
    let console = String::from_utf8_lossy(&plain.stdout);
    assert!(
        console.contains(ESCAPED),
        "the name is shown escaped:\n{console}"
    );

    for file in ["schedule.csv", "rafter-lines.csv", "schedule.json"] {
        let bytes = std::fs::read(out.join(file)).expect("file reads");
        assert_eq!(raw_controls(&bytes), vec![], "{file}");
    }
    // pdftotext ends each page with a form feed; that one is its own, not ours.
    let text = pdf_text(&out.join("schedule.pdf")).replace('\u{c}', "");
    assert_eq!(raw_controls(text.as_bytes()), vec![], "PDF text");
    assert!(text.contains(ESCAPED), "the PDF shows the name escaped");
}

#[test]
fn check_console_csv_and_pdf_show_control_characters_escaped() {
    let dir = tempfile::tempdir().expect("tempdir");
    let project = hostile_project(dir.path(), "ca-existing-pattern.json");
    let out = dir.path().join("out");
    let output = deckhold()
        .arg("check")
        .arg(&project)
        .arg("--out")
        .arg(&out)
        .output()
        .expect("runs");
    assert!(matches!(output.status.code(), Some(0 | 1)), "{output:?}");
    assert_eq!(raw_controls(&output.stdout), vec![], "stdout");
    assert_eq!(raw_controls(&output.stderr), vec![], "stderr");
    let csv = std::fs::read(out.join("check.csv")).expect("check.csv");
    assert_eq!(raw_controls(&csv), vec![], "check.csv");
    // pdftotext ends each page with a form feed; that one is its own, not ours.
    let text = pdf_text(&out.join("check.pdf")).replace('\u{c}', "");
    assert_eq!(raw_controls(text.as_bytes()), vec![], "check.pdf text");
    assert!(text.contains("\\u{1b}"), "the PDF shows the escapes");
}

#[test]
fn a_refused_value_is_named_escaped() {
    let dir = tempfile::tempdir().expect("tempdir");
    let text = std::fs::read_to_string(fixture("demo-ca-gable.json")).expect("reads");
    let mut project: serde_json::Value = serde_json::from_str(&text).expect("parses");
    project["project"]["date"] = serde_json::Value::from("2026-\u{1b}[2J-01");
    let path = dir.path().join("bad.json");
    std::fs::write(&path, serde_json::to_vec(&project).expect("json")).expect("write");
    let output = deckhold().arg("run").arg(&path).output().expect("runs");
    assert_eq!(output.status.code(), Some(2));
    assert_eq!(raw_controls(&output.stderr), vec![], "stderr");
    assert!(String::from_utf8_lossy(&output.stderr).contains("project.date"));
}

#[test]
fn batch_summary_csv_and_console_show_a_row_id_escaped() {
    let dir = tempfile::tempdir().expect("tempdir");
    let roofs = dir.path().join("roofs.csv");
    std::fs::write(&roofs, "id,roof.slope\nh\u{1b}[31m1,4:12\nh2,\u{1b}[2J\n").expect("write");
    let out = dir.path().join("out");
    let output = batch_over_demo(&roofs, &out);
    assert_eq!(output.status.code(), Some(2), "{output:?}");
    assert_eq!(raw_controls(&output.stdout), vec![], "stdout");
    assert_eq!(raw_controls(&output.stderr), vec![], "stderr");
    let summary = std::fs::read(out.join("summary.csv")).expect("summary.csv");
    assert_eq!(raw_controls(&summary), vec![], "summary.csv");
    assert!(String::from_utf8_lossy(&summary).contains("\nh\\u{1b}[31m1,refused,"));
}
