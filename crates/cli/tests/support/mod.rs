//! Helpers shared by the binary's integration tests: where the fixtures are, and the built binary.

// Each test binary includes this module and uses only some of it.
#![allow(dead_code)]

use assert_cmd::Command;
use std::path::{Path, PathBuf};

/// A file under the repository's `fixtures/`.
pub fn fixture(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../../fixtures")
        .join(name)
}

/// The `deckhold` binary built for this test run.
pub fn deckhold() -> Command {
    Command::cargo_bin("deckhold").expect("the deckhold binary is built")
}

/// `deckhold batch ROOFS --base <the demo> --out OUT`, run to its end.
pub fn batch_over_demo(roofs: &Path, out: &Path) -> std::process::Output {
    deckhold()
        .arg("batch")
        .arg(roofs)
        .arg("--base")
        .arg(fixture("demo-ca-gable.json"))
        .arg("--out")
        .arg(out)
        .output()
        .expect("runs")
}
