//! Goldens of the retrofit report on the invented 1973 ranch re-roof: `check --add` with a ring-shank
//! nail and with the stated screw: the console text, `--json`, and `--out` writing check.csv and check.pdf. Regression values (our own
//! earlier output), not outside checks; regenerate as tests/golden/README.md says.

use deckhold_tests::{fixture_path, Goldens};
use std::path::Path;
use std::process::Command;

/// The run's temporary folder as `<out>`, so the text is the same on every machine.
fn normalized(text: &[u8], out: &Path) -> String {
    String::from_utf8_lossy(text).replace(&out.display().to_string(), "<out>")
}

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
        let console = format!(
            "$ deckhold check fixtures/us-retrofit-1970s.json --add {added} --out <out>\n\
             exit status: 0\n--- stdout\n{}--- stderr\n{}",
            normalized(&output.stdout, &out),
            normalized(&output.stderr, &out),
        );
        goldens.check(
            &format!("us-retrofit-1970s/check-add-{added}-console.txt"),
            &console,
        );
        let json = Command::new(env!("CARGO_BIN_EXE_deckhold"))
            .arg("check")
            .arg(fixture_path("us-retrofit-1970s.json"))
            .arg("--add")
            .arg(added)
            .arg("--json")
            .output()
            .expect("the deckhold binary runs");
        assert_eq!(
            json.status.code(),
            Some(0),
            "{added}: --json, every zone passes"
        );
        assert!(
            json.stderr.is_empty(),
            "{added}: --json writes nothing else"
        );
        goldens.check(
            &format!("us-retrofit-1970s/check-add-{added}.json"),
            &String::from_utf8_lossy(&json.stdout),
        );
        let csv = std::fs::read_to_string(out.join("check.csv")).expect("check.csv");
        goldens.check(&format!("us-retrofit-1970s/check-add-{added}.csv"), &csv);
        // Page 1 alone is what a reviewer signs off: project, basis, the pattern given, pass/fail and
        // utilization per zone, what to add where, the review block, the cautions; titled as a
        // plan-check report, not as the schedule.
        let pdf = Command::new("pdftotext")
            .args(["-layout", "-f", "1", "-l", "1"])
            .arg(out.join("check.pdf"))
            .arg("-")
            .output()
            .expect("`pdftotext` is missing: install poppler-utils");
        let text = String::from_utf8_lossy(&pdf.stdout);
        for expected in [
            "Larkspur Court ranch re-roof",
            "ASCE 7-22",
            "Pattern given",
            "6d-common: 6 in o.c. at panel edges, 12 in o.c. at intermediate supports",
            "util.",
            "what to add, where",
            "set 3 in from",
            "PASS in every zone",
            "Reviewed by",
            "qualified person",
            "common practice, no source",
            "Plan-check report",
            "page 1 of 2",
        ] {
            assert!(
                text.contains(expected),
                "{added}: page 1 lacks {expected:?}:\n{text}"
            );
        }
        assert!(
            !text.contains("nailing schedule"),
            "{added}: the report is not titled as the schedule"
        );
        // The whole report is plain text: no markdown marks (the catalogs write ids in backticks).
        let whole = Command::new("pdftotext")
            .arg(out.join("check.pdf"))
            .arg("-")
            .output()
            .expect("`pdftotext` is missing: install poppler-utils");
        let whole = String::from_utf8_lossy(&whole.stdout);
        assert!(
            !whole.contains('`'),
            "{added}: a backtick in the report:\n{whole}"
        );
        for zone in [
            "corner (3)",
            "edge (2)",
            "interior (1)",
            "overhang-edge (2-oh)",
        ] {
            assert!(text.contains(zone), "{added}: page 1 lacks zone {zone}");
        }
    }
    goldens.finish();
}
