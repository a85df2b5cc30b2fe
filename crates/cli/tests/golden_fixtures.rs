//! Goldens for every fixture: the console text, both CSVs and the PDF's text (via `pdftotext -layout`),
//! produced by the `deckhold` binary exactly as a user runs it.
//!
//! One data-driven test over [`CASES`]: a new fixture gets goldens by adding one line there (and running the
//! update command in `tests/golden/README.md`). Every file in `fixtures/` must be listed, so a fixture added
//! without goldens fails [`every_fixture_has_a_golden_case`]. All values here are regression values (our
//! own earlier output), not outside checks.

use deckhold_tests::{fixture_path, Goldens};
use std::path::Path;
use std::process::Command;

/// (fixture file under `fixtures/`, command). `run` writes the CSVs and the PDF as well as the console text;
/// `check` plan-checks the fixture's `existing` block; a broken fixture records the refusal.
const CASES: &[(&str, &str)] = &[
    ("demo-ca-gable.json", "run"),
    ("us-hip.json", "run"),
    ("ca-l-shaped-flat.json", "run"),
    ("ca-l-hip-bungalow.json", "run"),
    ("us-t-cross-gable.json", "run"),
    ("us-lean-to-addition.json", "run"),
    ("ca-existing-pattern.json", "run"),
    ("ca-existing-pattern.json", "check"),
    ("ca-no-feasible-nail.json", "run"),
    ("template-ca.json", "run"),
    ("template-us.json", "run"),
    ("template-ca.json", "check"),
    ("template-us.json", "check"),
    ("us-retrofit-1970s.json", "run"),
    ("us-retrofit-1970s.json", "check"),
    ("broken/both-units.json", "run"),
    ("broken/malformed.json", "run"),
    ("broken/missing-key.json", "run"),
    ("broken/negative-spacing.json", "run"),
    ("broken/not-rectilinear.json", "run"),
    ("broken/slope-out-of-range.json", "run"),
    ("broken/too-tall.json", "run"),
    ("broken/unknown-basis.json", "run"),
    ("broken/unknown-key.json", "run"),
    ("broken/unknown-nail.json", "run"),
    ("broken/unknown-species.json", "run"),
];

/// Golden folder of one case: `tests/golden/<fixture path without .json>/<command>-...`.
fn golden_name(fixture: &str, command: &str, part: &str) -> String {
    let stem = fixture.trim_end_matches(".json");
    format!("{stem}/{command}-{part}")
}

/// Replaces the run's temporary folder (and the repository path) so the text is the same on every machine.
fn normalized(text: &[u8], out: &Path) -> String {
    let root = fixture_path("").display().to_string();
    String::from_utf8_lossy(text)
        .replace(&out.display().to_string(), "<out>")
        .replace(&root, "fixtures/")
}

fn pdf_text(path: &Path) -> String {
    let output = Command::new("pdftotext")
        .arg("-layout")
        .arg(path)
        .arg("-")
        .output()
        .expect("`pdftotext` is missing: install poppler-utils (apt-get install poppler-utils)");
    assert!(
        output.status.success(),
        "pdftotext failed on {}",
        path.display()
    );
    String::from_utf8_lossy(&output.stdout).into_owned()
}

fn run_case(goldens: &mut Goldens, fixture: &str, command: &str) {
    let folder = tempfile::tempdir().expect("temp dir");
    let out = folder.path().join("out");
    let mut deckhold = Command::new(env!("CARGO_BIN_EXE_deckhold"));
    deckhold.arg(command).arg(fixture_path(fixture));
    if command == "run" {
        deckhold.arg("--out").arg(&out);
    }
    let output = deckhold.output().expect("the deckhold binary runs");
    let status = output
        .status
        .code()
        .map_or_else(|| "killed by a signal".to_string(), |code| code.to_string());
    let console = format!(
        "$ deckhold {command} fixtures/{fixture}{}\nexit status: {status}\n--- stdout\n{}--- stderr\n{}",
        if command == "run" { " --out <out>" } else { "" },
        normalized(&output.stdout, &out),
        normalized(&output.stderr, &out),
    );
    goldens.check(&golden_name(fixture, command, "console.txt"), &console);
    if command != "run" || !output.status.success() && output.status.code() != Some(1) {
        // Refused (exit 2): nothing is written, which the console golden's exit status records.
        assert!(
            !out.exists(),
            "{fixture}: a refused run wrote {}",
            out.display()
        );
        return;
    }
    for file in ["schedule.csv", "rafter-lines.csv"] {
        let text = std::fs::read_to_string(out.join(file))
            .unwrap_or_else(|error| panic!("{fixture}: {file}: {error}"));
        goldens.check(&golden_name(fixture, command, file), &text);
    }
    goldens.check(
        &golden_name(fixture, command, "schedule-pdf.txt"),
        &pdf_text(&out.join("schedule.pdf")),
    );
}

#[test]
fn every_fixture_matches_its_goldens() {
    let mut goldens = Goldens::new();
    for (fixture, command) in CASES {
        run_case(&mut goldens, fixture, command);
    }
    goldens.finish();
}

/// Every `.json` under `fixtures/` (relative path with `/`).
fn fixture_files(folder: &Path, prefix: &str, found: &mut Vec<String>) {
    let entries =
        std::fs::read_dir(folder).unwrap_or_else(|error| panic!("{}: {error}", folder.display()));
    for entry in entries.filter_map(Result::ok) {
        let path = entry.path();
        let name = entry.file_name().to_string_lossy().into_owned();
        if path.is_dir() {
            fixture_files(&path, &format!("{prefix}{name}/"), found);
        } else if name.ends_with(".json") {
            found.push(format!("{prefix}{name}"));
        }
    }
}

#[test]
fn every_fixture_has_a_golden_case() {
    let mut found = Vec::new();
    fixture_files(&fixture_path(""), "", &mut found);
    found.sort();
    let missing: Vec<&String> = found
        .iter()
        .filter(|name| !CASES.iter().any(|(fixture, _)| fixture == name))
        .collect();
    assert!(
        missing.is_empty(),
        "fixtures without goldens: {missing:?}; add a line to CASES in {} and run the update command in \
         tests/golden/README.md",
        file!()
    );
    assert!(
        found.len() >= 18,
        "the fixtures folder was found: {found:?}"
    );
}
