//! Lengths inside messages, in the reader's units.
//!
//! The computing crates write their warnings in SI (`only the 38.1 mm ring-shank length is credited`),
//! because they know nothing of who reads them. A US document must not show millimetres, so the
//! report layer rewrites every `<number> mm` of a message into decimal inches, as fastener sizes are
//! listed (`1.5 in`, `0.131 in`): to 0.001 in, so a shank diameter keeps its precision. SI messages pass
//! unchanged.

use crate::format::{mm_to_in, trimmed};

/// A computing crate's message as a report prints it: plain text (the catalogs write ids in markdown
/// backticks for the docs) with its lengths in the reader's units.
pub fn message_for_reader(message: &str, imperial: bool) -> String {
    lengths_for_reader(&message.replace('`', ""), imperial)
}

/// `message` with every `<number> mm` in decimal inches when `imperial`, else unchanged.
pub fn lengths_for_reader(message: &str, imperial: bool) -> String {
    if !imperial || !message.contains(" mm") {
        return message.to_string();
    }
    let mut out = String::with_capacity(message.len());
    let mut rest = message;
    while let Some(at) = rest.find(" mm") {
        let before = &rest[..at];
        let after = &rest[at + 3..];
        // The unit must end there: " mm" followed by a letter is a word ("mmol", " mmm").
        let unit_ends = !after.starts_with(|c: char| c.is_alphanumeric());
        let number_start = before
            .rfind(|c: char| !(c.is_ascii_digit() || c == '.'))
            .map_or(0, |i| i + 1);
        let number = &before[number_start..];
        match number.parse::<f64>() {
            Ok(mm) if unit_ends && number.starts_with(|c: char| c.is_ascii_digit()) => {
                out.push_str(&before[..number_start]);
                out.push_str(&trimmed(mm_to_in(mm), 3));
                out.push_str(" in");
            }
            _ => {
                out.push_str(before);
                out.push_str(" mm");
            }
        }
        rest = after;
    }
    out.push_str(rest);
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn millimetres_become_inches_to_the_eighth_in_us_messages() {
        // 38.1 mm = 1.5 in and 9.5 mm = 0.374 in (25.4 mm per inch, exact by definition).
        assert_eq!(
            lengths_for_reader(
                "only the 38.1 mm ring-shank length is credited; the smooth 9.5 mm of shank",
                true
            ),
            "only the 1.5 in ring-shank length is credited; the smooth 0.374 in of shank"
        );
    }

    #[test]
    fn si_messages_and_words_that_only_start_with_mm_are_left_alone() {
        let si = "only the 38.1 mm ring-shank length";
        assert_eq!(lengths_for_reader(si, false), si);
        assert_eq!(lengths_for_reader("a 5 mmol note", true), "a 5 mmol note");
        assert_eq!(
            lengths_for_reader("no number mm here", true),
            "no number mm here"
        );
        assert_eq!(
            lengths_for_reader("63.5 mm x 4.50 mm, head 8.64 mm", true),
            "2.5 in x 0.177 in, head 0.34 in"
        );
    }
}
