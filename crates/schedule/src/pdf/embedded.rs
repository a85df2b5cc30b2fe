//! The embedded face for text the built-in fonts cannot show (Cyrillic, Greek, most of Latin Extended).
//!
//! The report's own words fit the built-in Helvetica (WinAnsi), which costs nothing to embed. A user's
//! name or address in another script needs a real font: DejaVu Sans (Bitstream Vera licence, public-domain
//! DejaVu changes; `crates/schedule/fonts/LICENSE-DejaVu.txt`), shipped in the repository from Debian's
//! `fonts-dejavu-core` 2.37. It is parsed only when a text needs it, and only the glyphs a document uses
//! are embedded (a subset with its own cmap), so an ordinary schedule is as small and fast as before.
//! Characters DejaVu lacks (CJK, for instance) print as their code points (`[U+4E2D]`), never as `?`.

use std::collections::BTreeSet;
use std::sync::OnceLock;

use allsorts::binary::read::ReadScope;
use allsorts::font_data::FontData;
use allsorts::subset::{subset, CmapTarget, SubsetProfile};
use printpdf::{FontId, ParsedFont, PdfDocument, PdfFont};

use super::text::Font;
use crate::ScheduleError;

const DEJAVU_SANS: &[u8] = include_bytes!("../../fonts/DejaVuSans.ttf");
const DEJAVU_SANS_BOLD: &[u8] = include_bytes!("../../fonts/DejaVuSans-Bold.ttf");

impl Font {
    /// The PDF resource name of this face's embedded twin; fixed, so the same text gives the same bytes.
    pub(crate) fn embedded_id(self) -> FontId {
        FontId(
            match self {
                Font::Regular => "DejaVuSans",
                Font::Bold => "DejaVuSans-Bold",
            }
            .to_string(),
        )
    }

    fn embedded_bytes(self) -> &'static [u8] {
        match self {
            Font::Regular => DEJAVU_SANS,
            Font::Bold => DEJAVU_SANS_BOLD,
        }
    }

    /// The whole face, parsed on first use (character map and advances).
    fn embedded_face(self) -> Option<&'static ParsedFont> {
        static REGULAR: OnceLock<Option<ParsedFont>> = OnceLock::new();
        static BOLD: OnceLock<Option<ParsedFont>> = OnceLock::new();
        let cell = match self {
            Font::Regular => &REGULAR,
            Font::Bold => &BOLD,
        };
        cell.get_or_init(|| ParsedFont::from_bytes(self.embedded_bytes(), 0, &mut Vec::new()))
            .as_ref()
    }
}

/// Whether the embedded faces have a glyph for `c` (both faces cover the same characters we use).
pub(crate) fn has_glyph(c: char) -> bool {
    Font::Regular
        .embedded_face()
        .and_then(|face| face.lookup_glyph_index(c as u32))
        .is_some_and(|glyph| glyph != 0)
}

/// Advance width of `text` in the embedded twin of `font`, in the face's units (a whole number, so the
/// advances of two pieces add up to that of both); a character without a glyph counts as the face's
/// missing-glyph box (callers replace those by code points first).
pub(crate) fn advance_units(text: &str, font: Font) -> u64 {
    let Some(face) = font.embedded_face() else {
        return 0;
    };
    text.chars()
        .map(|c| {
            let glyph = face.lookup_glyph_index(c as u32).unwrap_or(0);
            u64::from(face.get_glyph_width(glyph).unwrap_or(0))
        })
        .sum()
}

/// `units` of the embedded twin of `font` ([`advance_units`]) in em.
pub(crate) fn units_to_em(units: u64, font: Font) -> f64 {
    font.embedded_face().map_or(0.0, |face| {
        units as f64 / f64::from(face.units_per_em.max(1))
    })
}

/// The characters each face shows in the embedded twin, gathered while pages are drawn.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub(crate) struct EmbeddedChars {
    pub regular: BTreeSet<char>,
    pub bold: BTreeSet<char>,
}

impl EmbeddedChars {
    pub(crate) fn record(&mut self, font: Font, text: &str) {
        let set = match font {
            Font::Regular => &mut self.regular,
            Font::Bold => &mut self.bold,
        };
        set.extend(text.chars());
    }

    pub(crate) fn merge(&mut self, other: &EmbeddedChars) {
        self.regular.extend(other.regular.iter().copied());
        self.bold.extend(other.bold.iter().copied());
    }
}

/// Adds to `document` a subset of each embedded face holding just the characters in `chars`; a face
/// with no characters is not added at all.
pub(crate) fn add_subsets(
    document: &mut PdfDocument,
    chars: &EmbeddedChars,
) -> Result<(), ScheduleError> {
    for (font, used) in [(Font::Regular, &chars.regular), (Font::Bold, &chars.bold)] {
        if used.is_empty() {
            continue;
        }
        let bytes = subset_bytes(font, used)?;
        let parsed = ParsedFont::from_bytes(&bytes, 0, &mut Vec::new()).ok_or_else(|| {
            ScheduleError::Pdf(format!("the {:?} font subset does not parse", font))
        })?;
        document
            .resources
            .fonts
            .map
            .insert(font.embedded_id(), PdfFont::new(parsed));
    }
    Ok(())
}

/// The face cut down to the glyphs of `used` (glyph 0, the missing-glyph box, always kept first).
fn subset_bytes(font: Font, used: &BTreeSet<char>) -> Result<Vec<u8>, ScheduleError> {
    let face = font
        .embedded_face()
        .ok_or_else(|| ScheduleError::Pdf(format!("the embedded {font:?} font does not parse")))?;
    let mut glyphs: BTreeSet<u16> = used
        .iter()
        .filter_map(|c| face.lookup_glyph_index(*c as u32))
        .collect();
    glyphs.remove(&0);
    let glyph_ids: Vec<u16> = std::iter::once(0).chain(glyphs).collect();
    let fail = |error: &dyn std::fmt::Display| {
        ScheduleError::Pdf(format!("subsetting the embedded {font:?} font: {error}"))
    };
    let data = ReadScope::new(font.embedded_bytes())
        .read::<FontData<'_>>()
        .map_err(|e| fail(&e))?;
    let provider = data.table_provider(0).map_err(|e| fail(&e))?;
    subset(&provider, &glyph_ids, &profile(), CmapTarget::Unicode).map_err(|e| fail(&e))
}

/// The tables a PDF needs of an embedded TrueType face (ISO 32000-1, 9.9: head, hhea, loca, maxp, cvt,
/// prep, glyf, hmtx, fpgm; glyf and loca come with the outlines), plus the cmap that maps text to
/// glyphs and the name table that carries the font's copyright and licence notice. The glyph-name
/// table (`post`, 62 kB in DejaVu Sans) is left out: nothing reads it in a PDF.
fn profile() -> SubsetProfile {
    use allsorts::tag;
    SubsetProfile::Custom(vec![
        tag::CMAP,
        tag::HEAD,
        tag::HHEA,
        tag::HMTX,
        tag::MAXP,
        tag::NAME,
        tag::CVT,
        tag::FPGM,
        tag::PREP,
    ])
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn dejavu_covers_latin_greek_and_cyrillic_but_not_cjk() {
        for c in ['A', '\u{0416}', '\u{03A3}', '\u{0142}', '\u{00E9}'] {
            assert!(has_glyph(c), "{c} should be covered");
        }
        assert!(!has_glyph('\u{4E2D}'), "CJK is outside DejaVu Sans");
    }

    #[test]
    fn a_subset_is_a_small_fraction_of_the_face() {
        let used: BTreeSet<char> =
            "\u{0416}\u{0438}\u{043B}\u{043E}\u{0439} \u{0434}\u{043E}\u{043C}"
                .chars()
                .collect();
        let bytes = subset_bytes(Font::Regular, &used).expect("subset");
        assert!(
            bytes.len() < DEJAVU_SANS.len() / 20,
            "subset {} bytes of {}",
            bytes.len(),
            DEJAVU_SANS.len()
        );
        let parsed = ParsedFont::from_bytes(&bytes, 0, &mut Vec::new()).expect("parses");
        assert!(parsed.lookup_glyph_index('\u{0416}' as u32).is_some());
    }
}
