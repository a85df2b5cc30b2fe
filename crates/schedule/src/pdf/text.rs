//! Built-in font metrics (Helvetica and Helvetica-Bold, WinAnsi encoding) and line wrapping.
//!
//! The PDF uses the standard Type 1 fonts every viewer carries, so for the report's own words nothing is
//! embedded and no system font is read. A text with a character the built-in fonts cannot show (a name in
//! Cyrillic, say) is set whole in the embedded face instead ([`super::embedded`]). Their advance widths (1/1000 em, by WinAnsi code 0x20..=0xFF) are the Adobe Core 14 AFM
//! metrics, taken from groff's `devps/HR` and `devps/HB` font files (generated from those AFMs).

use std::borrow::Cow;

use printpdf::BuiltinFont;

/// Points per millimetre.
pub(crate) const PT_PER_MM: f64 = 72.0 / deckhold_core::units::MM_PER_IN;

/// The two faces the report uses.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Font {
    Regular,
    Bold,
}

impl Font {
    pub(crate) fn builtin(self) -> BuiltinFont {
        match self {
            Font::Regular => BuiltinFont::Helvetica,
            Font::Bold => BuiltinFont::HelveticaBold,
        }
    }

    fn widths(self) -> &'static [u16; 224] {
        match self {
            Font::Regular => &HELVETICA_WIDTHS,
            Font::Bold => &HELVETICA_BOLD_WIDTHS,
        }
    }
}

/// The WinAnsi (CP1252) code of `c`, when the encoding has it.
pub(crate) fn winansi_code(c: char) -> Option<u8> {
    match c as u32 {
        code @ (0x20..=0x7E | 0xA0..=0xFF) => Some(code as u8),
        _ => Some(match c {
            '\u{20AC}' => 0x80,
            '\u{201A}' => 0x82,
            '\u{0192}' => 0x83,
            '\u{201E}' => 0x84,
            '\u{2026}' => 0x85,
            '\u{2020}' => 0x86,
            '\u{2021}' => 0x87,
            '\u{02C6}' => 0x88,
            '\u{2030}' => 0x89,
            '\u{0160}' => 0x8A,
            '\u{2039}' => 0x8B,
            '\u{0152}' => 0x8C,
            '\u{017D}' => 0x8E,
            '\u{2018}' => 0x91,
            '\u{2019}' => 0x92,
            '\u{201C}' => 0x93,
            '\u{201D}' => 0x94,
            '\u{2022}' => 0x95,
            '\u{2013}' => 0x96,
            '\u{2014}' => 0x97,
            '\u{02DC}' => 0x98,
            '\u{2122}' => 0x99,
            '\u{0161}' => 0x9A,
            '\u{203A}' => 0x9B,
            '\u{0153}' => 0x9C,
            '\u{017E}' => 0x9E,
            '\u{0178}' => 0x9F,
            _ => return None,
        }),
    }
}

/// ASCII stand-ins for the symbols of the report's own formulas the built-in fonts cannot show.
fn stand_in(c: char) -> Option<&'static str> {
    Some(match c {
        '\u{2264}' => "<=",
        '\u{2265}' => ">=",
        '\u{2212}' | '\u{2010}' | '\u{2011}' => "-",
        '\u{00A0}' | '\u{2009}' | '\u{202F}' | '\t' | '\n' | '\r' => " ",
        '\u{2248}' => "~",
        '\u{03B1}' => "alpha",
        '\u{03B2}' => "beta",
        '\u{03B3}' => "gamma",
        '\u{03B4}' => "delta",
        '\u{0394}' => "Delta",
        '\u{03B8}' => "theta",
        '\u{03BB}' => "lambda",
        '\u{03BC}' => "\u{00B5}",
        '\u{03C1}' => "rho",
        '\u{03C3}' => "sigma",
        '\u{03C6}' | '\u{03D5}' => "phi",
        '\u{03C8}' => "psi",
        '\u{03C9}' => "omega",
        '\u{2080}' => "0",
        '\u{2081}' => "1",
        '\u{2082}' => "2",
        '\u{2083}' => "3",
        '\u{2084}' => "4",
        '\u{2090}' => "a",
        '\u{2091}' => "e",
        '\u{209A}' => "p",
        '\u{209C}' => "t",
        _ => return None,
    })
}

/// Whether the built-in fonts can show `c`, as itself, through a stand-in or escaped (a control character).
fn builtin_shows(c: char) -> bool {
    c.is_control() || matches!(winansi_code(c), Some(code) if code != 0xA0) || stand_in(c).is_some()
}

/// Whether `text` must be set in the embedded face: it has a character the built-in fonts cannot show.
pub(crate) fn needs_embedded(text: &str) -> bool {
    // ASCII is all in WinAnsi or a control character (escaped): the report's own words end here.
    !text.is_ascii() && !text.chars().all(builtin_shows)
}

/// `text` as the page shows it. Text the built-in fonts can show keeps its characters, with ASCII
/// stand-ins for formula symbols; other text keeps every character the embedded face has, and the rest
/// print as code points (`[U+4E2D]`). Control characters print escaped (`\u{1b}`), line breaks and tabs
/// as spaces. Idempotent: printing printable text changes nothing.
pub(crate) fn printable(text: &str) -> Cow<'_, str> {
    if text.bytes().all(|b| (0x20..0x7F).contains(&b)) {
        return Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len());
    let embedded = needs_embedded(text);
    for c in text.chars() {
        match c {
            '\t' | '\n' | '\r' => out.push(' '),
            c if c.is_control() => out.extend(c.escape_unicode()),
            c if embedded => match stand_in(c) {
                _ if super::embedded::has_glyph(c) => out.push(c),
                Some(stand_in) => out.push_str(stand_in),
                None => out.push_str(&format!("[U+{:04X}]", c as u32)),
            },
            c => match (winansi_code(c), stand_in(c)) {
                (Some(code), _) if code != 0xA0 => out.push(c),
                (_, Some(stand_in)) => out.push_str(stand_in),
                _ => out.push(c),
            },
        }
    }
    Cow::Owned(out)
}

/// The characters of `text` that no font of the PDF can show (they print as code points).
pub fn unshowable_chars(text: &str) -> Vec<char> {
    if !needs_embedded(text) {
        return Vec::new();
    }
    text.chars()
        .filter(|c| !c.is_control() && !builtin_shows(*c) && !super::embedded::has_glyph(*c))
        .collect()
}

/// Width of `text` set in `font` at `size_pt`, in mm.
pub(crate) fn width_mm(text: &str, font: Font, size_pt: f64) -> f64 {
    Advance::of(text, font, needs_embedded(text)).width_mm(font, size_pt)
}

/// The advance of a piece of text in whole font units, so that the advances of two pieces add up to
/// exactly what measuring both together gives: wrapping measures each word once, not each line so far.
/// A line is set in the embedded face when any of its characters needs it, so both sums are kept.
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
struct Advance {
    /// In the built-in face, 1/1000 em; a character without a built-in glyph counts as `?`.
    builtin_thousandths: u64,
    /// In the embedded face, its units; kept only for text that may need that face.
    embedded_units: u64,
    /// Some character needs the embedded face.
    embedded: bool,
}

impl Advance {
    /// The advance of `text`; with `may_embed` false the embedded face is not looked at (text none of
    /// whose pieces needs it).
    fn of(text: &str, font: Font, may_embed: bool) -> Advance {
        Advance {
            builtin_thousandths: builtin_thousandths(text, font),
            embedded_units: if may_embed {
                super::embedded::advance_units(text, font)
            } else {
                0
            },
            embedded: may_embed && needs_embedded(text),
        }
    }

    /// The advance of this piece followed by `next`.
    fn then(self, next: Advance) -> Advance {
        Advance {
            builtin_thousandths: self.builtin_thousandths + next.builtin_thousandths,
            embedded_units: self.embedded_units + next.embedded_units,
            embedded: self.embedded || next.embedded,
        }
    }

    fn width_mm(self, font: Font, size_pt: f64) -> f64 {
        if self.embedded {
            super::embedded::units_to_em(self.embedded_units, font) * size_pt / PT_PER_MM
        } else {
            self.builtin_thousandths as f64 / 1000.0 * size_pt / PT_PER_MM
        }
    }
}

/// Advance of `text` in the built-in `font`, 1/1000 em; a character without a built-in glyph counts as
/// a question mark.
fn builtin_thousandths(text: &str, font: Font) -> u64 {
    let widths = font.widths();
    let advance = |code: u8| match widths[usize::from(code - 0x20)] {
        0 => u64::from(widths[usize::from(b'?' - 0x20)]),
        width => u64::from(width),
    };
    if text.is_ascii() {
        return text
            .bytes()
            .map(|b| if b >= 0x20 { advance(b) } else { advance(b'?') })
            .sum();
    }
    text.chars()
        .map(|c| match winansi_code(c) {
            Some(code) if code >= 0x20 => advance(code),
            _ => advance(b'?'),
        })
        .sum()
}

/// `text` broken into lines no wider than `max_width_mm`, at spaces; a word wider than a line is broken
/// between characters. Empty text gives no lines.
pub(crate) fn wrap(text: &str, font: Font, size_pt: f64, max_width_mm: f64) -> Vec<String> {
    let text = printable(text);
    let may_embed = needs_embedded(&text);
    let measure = |piece: &str| Advance::of(piece, font, may_embed);
    let fits = |advance: Advance| advance.width_mm(font, size_pt) <= max_width_mm;
    let space = measure(" ");
    let mut lines = Vec::new();
    let mut current = String::new();
    let mut current_advance = Advance::default();
    for word in words(&text) {
        let word_advance = measure(&word);
        if current.is_empty() && fits(word_advance) {
            current = word.into_owned();
            current_advance = word_advance;
            continue;
        }
        if !current.is_empty() {
            let joined = current_advance.then(space).then(word_advance);
            if fits(joined) {
                current.push(' ');
                current.push_str(&word);
                current_advance = joined;
                continue;
            }
            lines.push(std::mem::take(&mut current));
            current_advance = Advance::default();
            if fits(word_advance) {
                current = word.into_owned();
                current_advance = word_advance;
                continue;
            }
        }
        for c in word.chars() {
            let mut buffer = [0u8; 4];
            let c_advance = measure(c.encode_utf8(&mut buffer));
            if !fits(current_advance.then(c_advance)) && !current.is_empty() {
                lines.push(std::mem::take(&mut current));
                current_advance = Advance::default();
            }
            current.push(c);
            current_advance = current_advance.then(c_advance);
        }
    }
    if !current.is_empty() {
        lines.push(current);
    }
    lines
}

/// Units that stay on the line of the number before them.
const UNITS: [&str; 14] = [
    "mm",
    "m",
    "m\u{00B2}",
    "in",
    "ft",
    "kPa",
    "psf",
    "N",
    "lbf",
    "kg",
    "lb",
    "deg",
    "%",
    "Pa",
];

/// The words of `text`, a number and its unit kept together as one word ("63 mm"); only such a pair is
/// a new string.
fn words(text: &str) -> Vec<Cow<'_, str>> {
    let mut words: Vec<Cow<'_, str>> = Vec::new();
    for word in text.split_whitespace() {
        let bare = word.trim_end_matches([',', ';', '.', ')']);
        let unit = UNITS.contains(&bare);
        match words.last_mut() {
            Some(last) if unit && last.ends_with(|c: char| c.is_ascii_digit()) => {
                let joined = last.to_mut();
                joined.push(' ');
                joined.push_str(word);
            }
            _ => words.push(Cow::Borrowed(word)),
        }
    }
    words
}

/// `text` on one line, cut with an ellipsis when wider than `max_width_mm`.
pub(crate) fn fit(text: &str, font: Font, size_pt: f64, max_width_mm: f64) -> String {
    let text = printable(text);
    if width_mm(&text, font, size_pt) <= max_width_mm {
        return text.into_owned();
    }
    let mut cut = String::new();
    for c in text.chars() {
        let mut candidate = cut.clone();
        candidate.push(c);
        candidate.push('\u{2026}');
        if width_mm(&candidate, font, size_pt) > max_width_mm {
            break;
        }
        cut.push(c);
    }
    cut.push('\u{2026}');
    cut
}

/// Height of one line of `size_pt` type with the report's leading, mm.
pub(crate) fn line_height_mm(size_pt: f64) -> f64 {
    size_pt * 1.22 / PT_PER_MM
}

/// Helvetica advance widths, 1/1000 em, WinAnsi codes 0x20..=0xFF (Adobe Core 14 AFM).
#[rustfmt::skip]
pub(crate) const HELVETICA_WIDTHS: [u16; 224] = [
    278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278, 278, // 0x20
    556, 556, 556, 556, 556, 556, 556, 556, 556, 556, 278, 278, 584, 584, 584, 556, // 0x30
    1015, 667, 667, 722, 722, 667, 611, 778, 722, 278, 500, 667, 556, 833, 722, 778, // 0x40
    667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469, 556, // 0x50
    333, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500, 222, 833, 556, 556, // 0x60
    556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584, 0, // 0x70
    556, 0, 222, 556, 333, 1000, 556, 556, 333, 1000, 667, 333, 1000, 0, 611, 0, // 0x80
    0, 222, 222, 333, 333, 350, 556, 1000, 333, 1000, 500, 333, 944, 0, 500, 667, // 0x90
    278, 333, 556, 556, 556, 556, 260, 556, 333, 737, 370, 556, 584, 333, 737, 333, // 0xA0
    400, 584, 333, 333, 333, 578, 537, 278, 333, 333, 365, 556, 834, 834, 834, 611, // 0xB0
    667, 667, 667, 667, 667, 667, 1000, 722, 667, 667, 667, 667, 278, 278, 278, 278, // 0xC0
    722, 722, 778, 778, 778, 778, 778, 584, 778, 722, 722, 722, 722, 667, 667, 611, // 0xD0
    556, 556, 556, 556, 556, 556, 889, 500, 556, 556, 556, 556, 278, 278, 278, 278, // 0xE0
    556, 556, 556, 556, 556, 556, 556, 584, 611, 556, 556, 556, 556, 500, 556, 500, // 0xF0
];
/// Helvetica-Bold advance widths, 1/1000 em, WinAnsi codes 0x20..=0xFF (Adobe Core 14 AFM).
#[rustfmt::skip]
pub(crate) const HELVETICA_BOLD_WIDTHS: [u16; 224] = [
    278, 333, 474, 556, 556, 889, 722, 238, 333, 333, 389, 584, 278, 333, 278, 278, // 0x20
    556, 556, 556, 556, 556, 556, 556, 556, 556, 556, 333, 333, 584, 584, 584, 611, // 0x30
    975, 722, 722, 722, 722, 667, 611, 778, 722, 278, 556, 722, 611, 833, 722, 778, // 0x40
    667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 333, 278, 333, 584, 556, // 0x50
    333, 556, 611, 556, 611, 556, 333, 611, 611, 278, 278, 556, 278, 889, 611, 611, // 0x60
    611, 611, 389, 556, 333, 611, 556, 778, 556, 556, 500, 389, 280, 389, 584, 0, // 0x70
    556, 0, 278, 556, 500, 1000, 556, 556, 333, 1000, 667, 333, 1000, 0, 611, 0, // 0x80
    0, 278, 278, 500, 500, 350, 556, 1000, 333, 1000, 556, 333, 944, 0, 500, 667, // 0x90
    278, 333, 556, 556, 556, 556, 280, 556, 333, 737, 370, 556, 584, 333, 737, 333, // 0xA0
    400, 584, 333, 333, 333, 611, 556, 278, 333, 333, 365, 556, 834, 834, 834, 611, // 0xB0
    722, 722, 722, 722, 722, 722, 1000, 722, 667, 667, 667, 667, 278, 278, 278, 278, // 0xC0
    722, 722, 778, 778, 778, 778, 778, 584, 778, 722, 722, 722, 722, 667, 667, 611, // 0xD0
    556, 556, 556, 556, 556, 556, 889, 556, 556, 556, 556, 556, 278, 278, 278, 278, // 0xE0
    611, 611, 611, 611, 611, 611, 611, 584, 611, 611, 611, 611, 611, 556, 611, 556, // 0xF0
];

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn helvetica_widths_match_the_afm() {
        // Adobe Core 14 AFM, Helvetica: 'H' = 722, 'i' = 222, space = 278 (1/1000 em).
        assert_relative_eq!(
            width_mm("H", Font::Regular, 1000.0 * PT_PER_MM),
            722.0 / 1000.0 * 1000.0,
            max_relative = 1e-9
        );
        assert_relative_eq!(
            width_mm("i i", Font::Regular, PT_PER_MM),
            (222.0 + 278.0 + 222.0) / 1000.0,
            max_relative = 1e-9
        );
        // Helvetica-Bold: 'i' = 278, degree sign = 400.
        assert_relative_eq!(
            width_mm("i\u{00B0}", Font::Bold, PT_PER_MM),
            (278.0 + 400.0) / 1000.0,
            max_relative = 1e-9
        );
    }

    #[test]
    fn printable_replaces_what_winansi_lacks() {
        assert_eq!(printable("p \u{2264} 1.5 kPa"), "p <= 1.5 kPa");
        assert_eq!(printable("\u{03C6} = 0.6"), "phi = 0.6");
        assert_eq!(
            printable("Qu\u{00E9}bec, 2 m\u{00B2}"),
            "Qu\u{00E9}bec, 2 m\u{00B2}"
        );
        assert_eq!(printable("\u{4E2D}"), "[U+4E2D]");
    }

    #[test]
    fn other_scripts_keep_their_letters_and_never_print_a_question_mark() {
        let cyrillic = "\u{0414}\u{043E}\u{043C} \u{2116}5";
        assert!(needs_embedded(cyrillic));
        assert_eq!(printable(cyrillic), cyrillic);
        let greek = "\u{03A3}\u{03C0}\u{03AF}\u{03C4}\u{03B9}";
        assert_eq!(printable(greek), greek);
        assert_eq!(
            printable("\u{0416}\u{4E2D}\u{6587}"),
            "\u{0416}[U+4E2D][U+6587]"
        );
        assert_eq!(unshowable_chars("\u{0416}\u{4E2D}"), vec!['\u{4E2D}']);
        assert!(unshowable_chars(cyrillic).is_empty());
        assert_eq!(printable(&printable(cyrillic)), printable(cyrillic));
    }

    #[test]
    fn the_report_s_own_symbols_and_control_characters_stay_in_the_built_in_font() {
        assert!(!needs_embedded("p \u{2264} R, \u{03B3}_W = 1.4"));
        assert!(!needs_embedded("Name\u{1b}[31m"));
        assert_eq!(printable("Name\u{1b}[31m\u{7}"), "Name\\u{1b}[31m\\u{7}");
        assert_eq!(printable("two\nlines"), "two lines");
    }

    #[test]
    fn embedded_text_is_measured_with_the_embedded_advances() {
        // DejaVu Sans 2.37: U+0416 is glyph 939, advance 2206 of 2048 units per em (read from the font's
        // cmap and hmtx tables with a separate script, not through this code).
        assert_relative_eq!(
            width_mm("\u{0416}", Font::Regular, PT_PER_MM),
            2206.0 / 2048.0,
            max_relative = 1e-9
        );
    }

    #[test]
    fn wrap_keeps_every_line_within_the_width() {
        let text = "Verify against the governing local building code and the nail manufacturer's specification.";
        let lines = wrap(text, Font::Regular, 7.0, 40.0);
        assert!(lines.len() > 1);
        for line in &lines {
            assert!(width_mm(line, Font::Regular, 7.0) <= 40.0, "{line}");
        }
        assert_eq!(lines.join(" "), text);
    }

    #[test]
    fn wrap_breaks_a_word_longer_than_the_line() {
        let lines = wrap("abcdefghijklmnopqrstuvwxyz", Font::Bold, 10.0, 20.0);
        assert!(lines.len() > 1);
        assert_eq!(lines.concat(), "abcdefghijklmnopqrstuvwxyz");
    }

    #[test]
    fn a_number_keeps_its_unit_on_its_line() {
        let text = "Sample ring-shank nail 3.3 x 63 mm";
        let width = width_mm("Sample ring-shank nail 3.3 x 63", Font::Bold, 18.0) + 0.5;
        let lines = wrap(text, Font::Bold, 18.0, width);
        assert_eq!(lines.last().map(String::as_str), Some("63 mm"));
    }

    #[test]
    fn fit_cuts_with_an_ellipsis() {
        let cut = fit(
            "A very long project name that does not fit",
            Font::Bold,
            10.0,
            30.0,
        );
        assert!(cut.ends_with('\u{2026}'));
        assert!(width_mm(&cut, Font::Bold, 10.0) <= 30.0);
        assert_eq!(fit("short", Font::Bold, 10.0, 30.0), "short");
    }
}
