//! The built-in demo end to end, against the golden CSV files in `tests/golden/`.
//!
//! A change to any number of the demo's schedule shows up here as a diff. When a change is intended, run
//! `DECKHOLD_UPDATE_GOLDEN=1 cargo test --test demo_golden`, read the diff in git, and commit it with the
//! reason. The demo's inputs are invented (a scenario of our own), so the golden values are regression
//! values, not outside checks; the outside checks live beside the formulas in each crate.

use deckhold_project::{parse_project, run_job, schedule_for, DEMO_PROJECT_JSON};
use deckhold_schedule::{rafter_lines_csv, schedule_csv};
use deckhold_tests::golden_path;

fn compare_or_update(name: &str, actual: &[u8]) {
    let path = golden_path(name);
    if std::env::var_os("DECKHOLD_UPDATE_GOLDEN").is_some() {
        std::fs::write(&path, actual).expect("write golden file");
        return;
    }
    let expected = std::fs::read(&path).unwrap_or_else(|error| {
        panic!(
            "{}: {error}; run with DECKHOLD_UPDATE_GOLDEN=1 to create it",
            path.display()
        )
    });
    if expected != actual {
        let expected = String::from_utf8_lossy(&expected);
        let actual = String::from_utf8_lossy(actual);
        let first_difference = expected
            .lines()
            .zip(actual.lines())
            .enumerate()
            .find(|(_, (e, a))| e != a)
            .map(|(index, (e, a))| format!("line {}:\n  expected: {e}\n  actual:   {a}", index + 1))
            .unwrap_or_else(|| "the files differ in length".to_string());
        panic!(
            "{} differs from the golden file: {first_difference}",
            path.display()
        );
    }
}

#[test]
fn the_demo_schedule_matches_the_golden_csv() {
    let project = parse_project(DEMO_PROJECT_JSON).expect("the demo parses");
    let job = run_job(&project).expect("the demo runs");
    let schedule = schedule_for(&project, &job);
    assert!(schedule.feasible, "the demo works in every zone");
    compare_or_update("demo-schedule.csv", &schedule_csv(&schedule).expect("CSV"));
    compare_or_update(
        "demo-rafter-lines.csv",
        &rafter_lines_csv(&schedule).expect("CSV"),
    );
}

#[test]
fn the_demo_is_the_same_every_run() {
    let project = parse_project(DEMO_PROJECT_JSON).expect("the demo parses");
    let first =
        schedule_csv(&schedule_for(&project, &run_job(&project).expect("runs"))).expect("CSV");
    let second =
        schedule_csv(&schedule_for(&project, &run_job(&project).expect("runs"))).expect("CSV");
    assert_eq!(first, second);
}
