//! `deckhold batch` end to end: the example batch against its golden summary, the same bytes whatever
//! the number of threads, the exit status per outcome, and the per-roof folders with --pdf.
//!
//! The golden summary is a regression value (our own output), not an outside check: the numbers behind
//! it are checked in the library tests. Regenerate it only for a change that explains the difference:
//! `deckhold batch fixtures/batch/roofs.csv --base fixtures/demo-ca-gable.json > tests/golden/batch-summary.csv`.

use std::path::PathBuf;

mod support;
use support::deckhold;

fn repo(path: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../..")
        .join(path)
}

fn batch_of(roofs: &PathBuf, jobs: &str) -> std::process::Output {
    deckhold()
        .args(["batch", "--base"])
        .arg(repo("fixtures/demo-ca-gable.json"))
        .arg(roofs)
        .args(["--jobs", jobs])
        .output()
        .expect("deckhold runs")
}

#[test]
fn the_example_batch_matches_its_golden_summary_and_exits_2_for_its_refused_rows() {
    let output = batch_of(&repo("fixtures/batch/roofs.csv"), "2");
    let golden = std::fs::read_to_string(repo("tests/golden/batch-summary.csv"))
        .expect("the golden summary");
    let summary = String::from_utf8(output.stdout).expect("utf8");
    assert_eq!(summary, golden, "summary.csv differs from the golden file");
    assert_eq!(output.status.code(), Some(2));
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(
        stderr.contains("8 roofs: 5 ok, 1 fail, 2 refused"),
        "{stderr}"
    );
}

#[test]
fn one_thread_and_four_threads_write_the_same_bytes() {
    // Chunk boundaries are crossed in the reader's own tests; here, rows enough for both threads.
    let folder = tempfile::tempdir().expect("temp dir");
    let roofs = folder.path().join("many.csv");
    let mut text = String::from("id,building.footprint.rectangle.length_m,roof.shape,roof.slope\n");
    for index in 0..40 {
        let shape = if index % 2 == 0 { "gable" } else { "hip" };
        let length_m = 8.0 + f64::from(index % 17);
        let slope = ["3:12", "5:12", "7:12", "40:12"][index as usize % 4];
        text.push_str(&format!("r{index},{length_m},{shape},{slope}\n"));
    }
    std::fs::write(&roofs, text).expect("write roofs");
    let one = batch_of(&roofs, "1");
    let four = batch_of(&roofs, "4");
    assert_eq!(one.status.code(), Some(2), "every fourth row is too steep");
    assert_eq!(four.status.code(), one.status.code());
    assert_eq!(one.stdout.len(), four.stdout.len());
    assert!(one.stdout == four.stdout, "--jobs 1 and --jobs 4 differ");
    let lines = String::from_utf8(one.stdout).expect("utf8");
    assert_eq!(lines.lines().count(), 41);
    assert!(lines
        .lines()
        .nth(1)
        .is_some_and(|line| line.starts_with("r0,")));
    assert!(lines
        .lines()
        .last()
        .is_some_and(|line| line.starts_with("r39,")));
}

#[test]
fn all_ok_exits_0_and_a_failing_roof_exits_1() {
    let folder = tempfile::tempdir().expect("temp dir");
    let ok = folder.path().join("ok.csv");
    std::fs::write(
        &ok,
        "id,roof.shape,roof.slope\na,gable,4:12\nb,gable,6:12\n",
    )
    .expect("write");
    assert_eq!(batch_of(&ok, "2").status.code(), Some(0));
    let fails = folder.path().join("fails.csv");
    std::fs::write(
        &fails,
        "id,wind.q50_kpa,wind.topographic_factor,nails\na,0.45,,\nb,1.1,1.8,common-51x2.84\n",
    )
    .expect("write");
    let output = batch_of(&fails, "2");
    assert_eq!(output.status.code(), Some(1));
    let summary = String::from_utf8(output.stdout).expect("utf8");
    assert!(summary
        .lines()
        .nth(2)
        .is_some_and(|line| line.starts_with("b,fails,")));
}

#[test]
fn a_repeated_id_and_a_bad_header_are_refused() {
    let folder = tempfile::tempdir().expect("temp dir");
    let repeated = folder.path().join("repeated.csv");
    std::fs::write(&repeated, "id,roof.shape\na,gable\na,hip\n").expect("write");
    let output = batch_of(&repeated, "2");
    assert_eq!(output.status.code(), Some(2));
    let summary = String::from_utf8(output.stdout).expect("utf8");
    assert!(
        summary.contains("a,refused,row 3, column id: the id 'a' is already used by row 2")
            || summary
                .contains("a,refused,\"row 3, column id: the id 'a' is already used by row 2\""),
        "{summary}"
    );
    let no_id = folder.path().join("no-id.csv");
    std::fs::write(&no_id, "name,roof.shape\na,gable\n").expect("write");
    let output = batch_of(&no_id, "2");
    assert_eq!(output.status.code(), Some(2));
    assert!(output.stdout.is_empty(), "no summary for a refused batch");
    assert!(String::from_utf8_lossy(&output.stderr).contains("no 'id' column"));
}

#[test]
fn out_with_pdf_writes_the_summary_and_a_folder_per_worked_roof() {
    let folder = tempfile::tempdir().expect("temp dir");
    let roofs = folder.path().join("two.csv");
    std::fs::write(
        &roofs,
        "id,roof.shape,roof.slope\nwest,gable,4:12\nsteep,gable,40:12\n",
    )
    .expect("write");
    let out = folder.path().join("out");
    let output = deckhold()
        .args(["batch", "--base"])
        .arg(repo("fixtures/demo-ca-gable.json"))
        .arg(&roofs)
        .arg("--out")
        .arg(&out)
        .args(["--pdf", "--json"])
        .output()
        .expect("runs");
    assert_eq!(output.status.code(), Some(2));
    let counts: serde_json::Value = serde_json::from_slice(&output.stdout).expect("json");
    assert_eq!(counts["ok"], 1);
    assert_eq!(counts["refused"], 1);
    for file in ["schedule.csv", "rafter-lines.csv", "schedule.pdf"] {
        assert!(out.join("west").join(file).is_file(), "{file} missing");
    }
    assert!(!out.join("steep").exists(), "a refused roof gets no folder");
    let summary = std::fs::read_to_string(out.join("summary.csv")).expect("summary");
    assert_eq!(summary.lines().count(), 3);
    assert!(!out.join(".summary.csv.partial").exists());
}

#[test]
fn init_batch_writes_the_example_batch() {
    let folder = tempfile::tempdir().expect("temp dir");
    let path = folder.path().join("roofs.csv");
    deckhold()
        .args(["init", "--batch"])
        .arg(&path)
        .assert()
        .success();
    let written = std::fs::read_to_string(&path).expect("written");
    let example = std::fs::read_to_string(repo("fixtures/batch/roofs.csv")).expect("fixture");
    assert_eq!(written, example);
}
