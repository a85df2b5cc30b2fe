//! Goldens of `compare --out`: compare.csv on a Canadian and a US fixture (regression values, our own
//! earlier output, not outside checks; regenerate as tests/golden/README.md says), and the shape of the
//! one-page compare.pdf.

use deckhold_tests::{fixture_path, Goldens};
use std::process::Command;

fn pdf_text(path: &std::path::Path) -> String {
    let output = Command::new("pdftotext")
        .arg("-layout")
        .arg(path)
        .arg("-")
        .output()
        .expect("`pdftotext` is missing: install poppler-utils");
    String::from_utf8_lossy(&output.stdout).into_owned()
}

#[test]
fn compare_outputs_match_their_goldens() {
    let mut goldens = Goldens::new();
    for (fixture, input) in [
        ("demo-ca-gable.json", "wind.q50_kpa"),
        ("us-retrofit-1970s.json", "wind.speed_mph"),
    ] {
        let folder = tempfile::tempdir().expect("temp dir");
        let out = folder.path().join("out");
        let output = Command::new(env!("CARGO_BIN_EXE_deckhold"))
            .arg("compare")
            .arg(fixture_path(fixture))
            .arg("--out")
            .arg(&out)
            .output()
            .expect("the deckhold binary runs");
        assert_eq!(output.status.code(), Some(0), "{fixture}");
        let csv = std::fs::read_to_string(out.join("compare.csv")).expect("compare.csv");
        let stem = fixture.trim_end_matches(".json");
        goldens.check(&format!("{stem}/compare.csv"), &csv);
        assert!(
            csv.lines().skip(1).all(|line| line.contains(input)),
            "{fixture}: every candidate's reach is on the basis's own wind input"
        );

        let text = pdf_text(&out.join("compare.pdf"));
        for expected in [
            "Nails compared",
            "Nail comparison",
            "withdrawal",
            "pull-through",
            "prescr. up to",
            "nails on roof",
            "found by bisection to within",
            "qualified person",
            "page 1 of 1",
        ] {
            assert!(
                text.contains(expected),
                "{fixture}: compare.pdf lacks {expected:?}:\n{text}"
            );
        }
        // The page is plain text: no markdown marks (the reach method names its input in backticks).
        assert!(
            !text.contains('`'),
            "{fixture}: a backtick in compare.pdf:\n{text}"
        );
        // Every candidate of the CSV is on the page.
        for line in csv.lines().skip(1) {
            let nail = line.split(',').next().expect("a nail id");
            assert!(text.contains(nail), "{fixture}: {nail} is not on the page");
        }
    }
    goldens.finish();
}
