//! docs/project-format.md lists the limits exactly as `deckhold limits` prints them (generated from the
//! one table in crates/core/src/limits.rs); a stale doc fails here.

use std::path::PathBuf;
use std::process::Command;

const BEGIN: &str = "<!-- limits:begin -->\n";
const END: &str = "<!-- limits:end -->";

#[test]
fn the_format_doc_lists_the_limits_table() {
    let output = Command::new(env!("CARGO_BIN_EXE_deckhold"))
        .arg("limits")
        .output()
        .expect("runs");
    assert!(output.status.success());
    let table = String::from_utf8(output.stdout).expect("UTF-8");
    assert!(table.contains("`roof.slope_deg` | 0..45 deg"), "{table}");
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../../docs/project-format.md");
    let doc = std::fs::read_to_string(&path).expect("the format doc");
    let start = doc.find(BEGIN).expect("the doc has a limits:begin marker") + BEGIN.len();
    let end = doc.find(END).expect("the doc has a limits:end marker");
    if std::env::var_os("DECKHOLD_UPDATE_GOLDEN").is_some() {
        let updated = format!("{}{table}{}", &doc[..start], &doc[end..]);
        std::fs::write(&path, updated).expect("writes the doc");
        return;
    }
    assert_eq!(
        &doc[start..end],
        table,
        "docs/project-format.md's limits are stale: rerun with DECKHOLD_UPDATE_GOLDEN=1"
    );
}
