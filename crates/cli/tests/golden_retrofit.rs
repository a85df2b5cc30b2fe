//! Goldens of the retrofit report on the invented 1973 ranch re-roof: `check --add` with a ring-shank
//! nail and with the stated screw, `--out` writing check.csv and check.pdf. Regression values (our own
//! earlier output), not outside checks; regenerate as tests/golden/README.md says.

use deckhold_tests::{fixture_path, Goldens};
use std::process::Command;

#[test]
fn the_ranch_retrofit_reports_match_their_goldens() {
    let mut goldens = Goldens::new();
    for added in ["rsrs-01", "deck-screw-9x2.5"] {
        let folder = tempfile::tempdir().expect("temp dir");
        let out = folder.path().join("out");
        let output = Command::new(env!("CARGO_BIN_EXE_deckhold"))
            .arg("check")
            .arg(fixture_path("us-retrofit-1970s.json"))
            .arg("--add")
            .arg(added)
            .arg("--out")
            .arg(&out)
            .output()
            .expect("the deckhold binary runs");
        assert_eq!(output.status.code(), Some(0), "{added}: every zone passes");
        let csv = std::fs::read_to_string(out.join("check.csv")).expect("check.csv");
        goldens.check(&format!("us-retrofit-1970s/check-add-{added}.csv"), &csv);
        let pdf = Command::new("pdftotext")
            .arg("-layout")
            .arg(out.join("check.pdf"))
            .arg("-")
            .output()
            .expect("`pdftotext` is missing: install poppler-utils");
        let text = String::from_utf8_lossy(&pdf.stdout);
        assert!(text.contains("Reviewed by"), "{added}: sign-off block");
        assert!(text.contains("qualified person"), "{added}: cautions");
        assert!(
            text.contains("common practice, no source"),
            "{added}: combination rule"
        );
    }
    goldens.finish();
}
