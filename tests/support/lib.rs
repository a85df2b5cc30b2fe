//! Shared helpers for the cross-crate tests (see the test files beside this folder) and the golden-file
//! machinery (also used by `crates/cli/tests/golden_fixtures.rs`).

pub mod deck_checks;
pub mod golden;
pub mod outlines;
pub mod reach;
pub mod roofs;

pub use golden::{golden_path, Goldens};

use std::path::PathBuf;

/// Every project under `fixtures/` that runs to a schedule.
pub const GOOD_FIXTURES: &[&str] = &[
    "demo-ca-gable.json",
    "us-hip.json",
    "ca-l-shaped-flat.json",
    "ca-l-hip-bungalow.json",
    "us-t-cross-gable.json",
    "ca-existing-pattern.json",
    "ca-no-feasible-nail.json",
    "template-ca.json",
    "template-us.json",
    "us-retrofit-1970s.json",
    "us-lean-to-addition.json",
];

/// Path of a file under `fixtures/`.
pub fn fixture_path(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("fixtures")
        .join(name)
}

/// Text of a file under `fixtures/`.
pub fn fixture_text(name: &str) -> String {
    let path = fixture_path(name);
    std::fs::read_to_string(&path)
        .unwrap_or_else(|error| panic!("cannot read {}: {error}", path.display()))
}
