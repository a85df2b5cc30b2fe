//! Warnings for user text the PDF cannot show as written: the field is named and the characters are
//! listed by code point, as the PDF prints them. Never a silent `?`.
//!
//! The PDF shows Latin, Greek and Cyrillic (built-in Helvetica, or the embedded DejaVu Sans subset).
//! Scripts outside DejaVu Sans (CJK, for instance) print as code points: no system font is read, so the
//! same input gives the same bytes on every machine.

use deckhold_schedule::{unshowable_chars, ProjectInfo};

/// One warning per project field with characters the PDF prints as code points.
pub fn unshowable_warnings(info: &ProjectInfo) -> Vec<String> {
    let fields = [
        ("project.name", &info.name),
        ("project.site", &info.site),
        ("project.owner", &info.owner),
        ("project.prepared_by", &info.prepared_by),
        ("project.notes", &info.notes),
    ];
    fields
        .iter()
        .filter_map(|(field, text)| {
            let missing = unshowable_chars(text);
            if missing.is_empty() {
                return None;
            }
            let points: Vec<String> = missing
                .iter()
                .map(|c| format!("U+{:04X}", *c as u32))
                .collect();
            Some(format!(
                "{field}: the PDF's fonts (Helvetica, DejaVu Sans) have no glyph for {}; \
                 the PDF prints these code points in their place",
                points.join(" ")
            ))
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn info(name: &str) -> ProjectInfo {
        ProjectInfo {
            name: name.to_string(),
            site: "Port Aubrey".to_string(),
            owner: String::new(),
            prepared_by: String::new(),
            date: "2026-01-01".to_string(),
            notes: String::new(),
        }
    }

    #[test]
    fn a_cjk_name_is_named_with_its_code_points() {
        let warnings = unshowable_warnings(&info("\u{4E2D}\u{6587} house"));
        assert_eq!(warnings.len(), 1);
        assert!(warnings[0].starts_with("project.name: "), "{}", warnings[0]);
        assert!(warnings[0].contains("U+4E2D U+6587"), "{}", warnings[0]);
    }

    #[test]
    fn cyrillic_and_greek_need_no_warning() {
        assert!(unshowable_warnings(&info(
            "\u{0414}\u{043E}\u{043C} \u{03A3}\u{03C0}\u{03AF}\u{03C4}\u{03B9}"
        ))
        .is_empty());
    }
}
