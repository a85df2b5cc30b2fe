//! The crates form layers: the computation never depends on a writer or on the binary, so it stays free of
//! file I/O and a writer change cannot reach a computed value (STYLE.md, "the shape we are heading to").

use std::path::Path;

/// The `[dependencies]` table of a member crate's manifest, as text (dev-dependencies excluded).
fn dependencies_of(krate: &str) -> String {
    let manifest = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("crates")
        .join(krate)
        .join("Cargo.toml");
    let text = std::fs::read_to_string(&manifest).expect("member manifest reads");
    let mut inside = false;
    let mut table = String::new();
    for line in text.lines() {
        let trimmed = line.trim();
        if trimmed.starts_with('[') {
            inside = trimmed == "[dependencies]";
            continue;
        }
        if inside {
            table.push_str(trimmed);
            table.push('\n');
        }
    }
    table
}

#[test]
fn computation_crates_depend_on_no_writer_and_no_binary() {
    let computation = ["core", "wind", "fasten", "deck", "model", "project"];
    for krate in computation {
        let dependencies = dependencies_of(krate);
        assert!(
            !dependencies.is_empty() || krate == "core",
            "{krate}: no [dependencies] table found; the check would pass vacuously"
        );
        for writer in ["deckhold-schedule", "deckhold-cli", "deckhold ="] {
            assert!(
                !dependencies.contains(writer),
                "crates/{krate} depends on {writer}:\n{dependencies}"
            );
        }
    }
}

#[test]
fn the_project_crate_reads_the_report_model_not_the_writers() {
    assert!(dependencies_of("project").contains("deckhold-model"));
}
