//! Number formatting and the units people read: SI (mm, m, kPa, N) or US customary (in, feet-inches,
//! psf, lb), one system per document.
//!
//! The writers only format: every engineering value arrives in SI from [`crate::Schedule`]; the imperial
//! US values are exact re-expressions with the conversion constants below.

pub use crate::message_lengths::{lengths_for_reader, message_for_reader};
/// The conversions under the names the writers use (`deckhold_core::units` holds the one definition).
pub use deckhold_core::units::{
    ft_from_m as m_to_ft, in_from_mm as mm_to_in, lbf_from_n as n_to_lbf,
    psf_from_kpa as kpa_to_psf,
};
pub use deckhold_core::units::{KG_PER_LB, KPA_PER_PSF, MM_PER_FT, MM_PER_IN, N_PER_LBF};

/// Decimal places of each printed quantity; the CSV files and docs/report-format.md use the same.
pub mod places {
    pub const SPACING_MM: usize = 0;
    pub const SPACING_IN: usize = 2;
    /// Inch spacings in the CSV files: to 0.001 in, trailing zeros dropped (`6`, `2.5`).
    pub const SPACING_IN_CSV: usize = 3;
    pub const PRESSURE_KPA: usize = 3;
    pub const PRESSURE_PSF: usize = 2;
    pub const FORCE_N: usize = 0;
    pub const FORCE_LBF: usize = 1;
    pub const UTILIZATION: usize = 3;
    pub const LENGTH_M: usize = 3;
    pub const LENGTH_FT: usize = 2;
    pub const AREA_M2: usize = 3;
    pub const COEFFICIENT: usize = 3;
    pub const MASS_KG: usize = 1;
}

/// `value` with exactly `decimals` places. Never prints `-0.000`: a value that rounds to zero is zero.
///
/// Writers check finiteness first (`deckhold_schedule::format::finite`); a non-finite value prints as `n/a` rather than panicking.
pub fn fixed(value: f64, decimals: usize) -> String {
    if !value.is_finite() {
        return "n/a".to_string();
    }
    if let Some(text) = fixed_by_integers(value, decimals) {
        return text;
    }
    let text = format!("{value:.decimals$}");
    match text.strip_prefix('-') {
        Some(magnitude) if magnitude.bytes().all(|b| b == b'0' || b == b'.') => {
            magnitude.to_string()
        }
        _ => text,
    }
}

/// [`fixed`] by integer arithmetic, where that is certainly what `format!("{value:.decimals$}")`
/// prints (the tables print thousands of numbers, and the general formatter was a tenth of a run):
/// the scaled value below 1e9, so its rounding error (under 1.2e-7) cannot cross a half, and not within
/// 1e-6 of a half, where the exact binary value decides. None otherwise.
fn fixed_by_integers(value: f64, decimals: usize) -> Option<String> {
    const POWERS: [f64; 7] = [1.0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6];
    let scale = *POWERS.get(decimals)?;
    let scaled = value.abs() * scale;
    if scaled >= 1e9 {
        return None;
    }
    let whole = scaled.floor();
    let fraction = scaled - whole;
    if (fraction - 0.5).abs() < 1e-6 {
        return None;
    }
    let rounded = whole as u64 + u64::from(fraction > 0.5);
    // Written from the last digit back, with the point `decimals` places in and at least one digit
    // before it.
    let mut bytes = [0u8; 24];
    let mut start = bytes.len();
    let mut rest = rounded;
    let mut written = 0;
    while rest > 0 || written <= decimals {
        if written == decimals && decimals > 0 {
            start -= 1;
            bytes[start] = b'.';
        }
        start -= 1;
        bytes[start] = b'0' + (rest % 10) as u8;
        rest /= 10;
        written += 1;
    }
    if value < 0.0 && rounded != 0 {
        start -= 1;
        bytes[start] = b'-';
    }
    std::str::from_utf8(&bytes[start..])
        .ok()
        .map(str::to_string)
}

/// Like [`fixed`], then without trailing zeros (`6.00` -> `6`, `3.50` -> `3.5`): for the crew sheet.
pub fn trimmed(value: f64, decimals: usize) -> String {
    let text = fixed(value, decimals);
    if text.contains('.') {
        text.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        text
    }
}

/// A plan length the way a tape reads in the US: feet, inches and the nearest eighth (`39'-4 1/2"`).
pub fn feet_inches(m: f64) -> String {
    if !m.is_finite() {
        return "n/a".to_string();
    }
    let eighths_total = (m.abs() * 1000.0 / MM_PER_IN * 8.0).round() as u64;
    let feet = eighths_total / (12 * 8);
    let inches = (eighths_total % (12 * 8)) / 8;
    let fraction = eighths_fraction(eighths_total % 8);
    let sign = if m < 0.0 && eighths_total > 0 {
        "-"
    } else {
        ""
    };
    let fraction = if fraction.is_empty() {
        String::new()
    } else {
        format!(" {fraction}")
    };
    format!("{sign}{feet}'-{inches}{fraction}\"")
}

/// `1/8`, `1/4`, ... `7/8` for a count of eighths below eight (reduced); empty for zero.
fn eighths_fraction(eighths: u64) -> &'static str {
    match eighths {
        1 => "1/8",
        2 => "1/4",
        3 => "3/8",
        4 => "1/2",
        5 => "5/8",
        6 => "3/4",
        7 => "7/8",
        _ => "",
    }
}

/// Inches to the nearest eighth as a tape reads them: `6`, `2 1/2`, `3/8`.
pub fn inches_fraction(inches: f64) -> String {
    if !inches.is_finite() {
        return "n/a".to_string();
    }
    let eighths_total = (inches.abs() * 8.0).round() as u64;
    let whole = eighths_total / 8;
    let fraction = eighths_fraction(eighths_total % 8);
    let sign = if inches < 0.0 && eighths_total > 0 {
        "-"
    } else {
        ""
    };
    match (whole, fraction) {
        (whole, "") => format!("{sign}{whole}"),
        (0, fraction) => format!("{sign}{fraction}"),
        (whole, fraction) => format!("{sign}{whole} {fraction}"),
    }
}

/// `value` to three significant figures, the precision the inputs justify (`199.0927` -> `199`,
/// `2.7291` -> `2.73`, `0.04567` -> `0.0457`); large values keep their whole digits (`3056`).
pub fn sig3(value: f64) -> String {
    if !value.is_finite() {
        return "n/a".to_string();
    }
    if value == 0.0 {
        return "0".to_string();
    }
    let magnitude = value.abs().log10().floor() as i32;
    let decimals = (2 - magnitude).max(0) as usize;
    let scale = 10f64.powi(magnitude - 2);
    let rounded = if magnitude >= 2 {
        (value / scale).round() * scale
    } else {
        value
    };
    fixed(rounded, decimals)
}

/// A spacing for people in the chosen units: `150 mm` or `6 in`; `none` when no spacing works.
pub fn spacing_label(spacing_mm: Option<f64>, imperial: bool) -> String {
    match spacing_mm {
        None => "none".to_string(),
        Some(mm) if imperial => format!("{} in", inches_fraction(mm_to_in(mm))),
        Some(mm) => format!("{} mm", fixed(mm, places::SPACING_MM)),
    }
}

/// A pressure's number in the chosen units (psf or kPa), three significant figures.
pub fn pressure_value(kpa: f64, imperial: bool) -> String {
    sig3(if imperial { kpa_to_psf(kpa) } else { kpa })
}

/// A pressure for people, three significant figures: `2.73 kPa` or `57.0 psf`.
pub fn pressure_label(kpa: f64, imperial: bool) -> String {
    let unit = if imperial { "psf" } else { "kPa" };
    format!("{} {unit}", pressure_value(kpa, imperial))
}

/// A force's number in the chosen units (lb or N), three significant figures.
pub fn force_value(n: f64, imperial: bool) -> String {
    sig3(if imperial { n_to_lbf(n) } else { n })
}

/// A force for people, three significant figures: `512 N` or `115 lb`.
pub fn force_label(n: f64, imperial: bool) -> String {
    let unit = if imperial { "lb" } else { "N" };
    format!("{} {unit}", force_value(n, imperial))
}

/// A fastener dimension for people: `63.5 mm`, or `2.5 in` (decimal inches, as nail sizes are listed).
pub fn small_length_label(mm: f64, imperial: bool) -> String {
    if imperial {
        format!("{} in", trimmed(mm_to_in(mm), 3))
    } else {
        format!("{} mm", trimmed(mm, 2))
    }
}

/// A panel thickness as the trade names it: `15/32 in`, `19/32 in`, `7/16 in` in US units (nearest
/// thirty-second, reduced), `15.1 mm` in SI.
pub fn thickness_label(mm: f64, imperial: bool) -> String {
    if !imperial {
        return format!("{} mm", trimmed(mm, 1));
    }
    let mut numerator = (mm_to_in(mm) * 32.0).round() as u64;
    let mut denominator = 32_u64;
    while numerator > 0 && numerator.is_multiple_of(2) && denominator > 1 {
        numerator /= 2;
        denominator /= 2;
    }
    match (numerator, denominator) {
        (0, _) => "0 in".to_string(),
        (n, 1) => format!("{n} in"),
        (n, d) if n > d => format!("{} {}/{} in", n / d, n % d, d),
        (n, d) => format!("{n}/{d} in"),
    }
}

/// A plan length for people: `12.00 m`, or `39'-4 1/2"`.
pub fn plan_length_label(m: f64, imperial: bool) -> String {
    if imperial {
        feet_inches(m)
    } else {
        format!("{} m", fixed(m, 2))
    }
}

/// A mass for people: `13.2 kg` or `29.1 lb`.
pub fn mass_label(kg: f64, imperial: bool) -> String {
    if imperial {
        format!("{} lb", fixed(kg / KG_PER_LB, places::MASS_KG))
    } else {
        format!("{} kg", fixed(kg, places::MASS_KG))
    }
}

/// "on center" in US output, "on centre" in Canadian: one spelling per document.
pub fn on_center(imperial: bool) -> &'static str {
    if imperial {
        "on center"
    } else {
        "on centre"
    }
}

/// "CENTER" or "CENTRE", for headings.
pub fn center_word(imperial: bool) -> &'static str {
    if imperial {
        "center"
    } else {
        "centre"
    }
}

/// The plural of a framing member's name: "trusses", "rafters", "joists".
pub fn plural(word: &str) -> String {
    if word.ends_with('s') {
        format!("{word}es")
    } else {
        format!("{word}s")
    }
}

/// User text as every output shows it: control characters (a terminal escape, a bell, a line break)
/// written as `\u{1b}`, so a name can neither drive a terminal nor forge a line. Borrowed when clean.
pub fn escape_controls(text: &str) -> std::borrow::Cow<'_, str> {
    if !text.chars().any(char::is_control) {
        return std::borrow::Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len() + 8);
    for c in text.chars() {
        if c.is_control() {
            out.extend(c.escape_unicode());
        } else {
            out.push(c);
        }
    }
    std::borrow::Cow::Owned(out)
}

#[cfg(test)]
mod tests {
    /// The standard formatter with `fixed`'s one change (no `-0`): what `fixed` printed before its
    /// integer path, and still prints where that path declines.
    fn fixed_by_formatter(value: f64, decimals: usize) -> String {
        let text = format!("{value:.decimals$}");
        match text.strip_prefix('-') {
            Some(magnitude) if magnitude.bytes().all(|b| b == b'0' || b == b'.') => {
                magnitude.to_string()
            }
            _ => text,
        }
    }

    #[test]
    fn the_integer_path_prints_what_the_standard_formatter_prints() {
        let mut state = 0x9E37_79B9_7F4A_7C15_u64;
        let mut next = || {
            state ^= state << 13;
            state ^= state >> 7;
            state ^= state << 17;
            state
        };
        let mut values = vec![
            0.0,
            -0.0,
            0.5,
            1.5,
            2.5,
            -2.5,
            0.125,
            0.0005,
            -0.0004,
            0.9995,
            1.0005,
            999_999.999_5,
            1e9,
            123.456_5,
            0.045,
            2.675,
            -1e-12,
        ];
        for _ in 0..20_000 {
            let bits = next();
            let magnitude = 10f64.powi((bits % 14) as i32 - 6);
            let unit = (next() >> 11) as f64 / (1u64 << 53) as f64;
            let sign = if bits & (1 << 40) == 0 { 1.0 } else { -1.0 };
            values.push(sign * unit * magnitude);
            // Values on and next to a half at some number of places.
            let places = (bits % 7) as i32;
            let half = ((next() % 100_000) as f64 + 0.5) / 10f64.powi(places);
            values.extend([half, f64::from_bits(half.to_bits() + 1), -half]);
            // Large values next to a half, where scaling by a power of ten is least exact.
            values.push(1e7 * (1.0 + (next() % 1000) as f64) + half / 1e3);
        }
        for value in values {
            for decimals in 0..=6 {
                assert_eq!(
                    fixed(value, decimals),
                    fixed_by_formatter(value, decimals),
                    "{value:e} to {decimals} places"
                );
            }
        }
    }

    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn control_characters_are_written_escaped() {
        assert_eq!(
            escape_controls("a\u{1b}[2Jb\u{7}\nc"),
            "a\\u{1b}[2Jb\\u{7}\\u{a}c"
        );
        assert!(matches!(
            escape_controls("\u{0414}\u{043E}\u{043C} 5"),
            std::borrow::Cow::Borrowed(_)
        ));
    }

    #[test]
    fn fixed_rounds_to_the_requested_places() {
        assert_eq!(fixed(150.0, 0), "150");
        assert_eq!(fixed(1.23456, 3), "1.235");
        assert_eq!(fixed(0.5, 3), "0.500");
    }

    #[test]
    fn fixed_never_prints_negative_zero() {
        assert_eq!(fixed(-0.0001, 3), "0.000");
        assert_eq!(fixed(-0.0, 0), "0");
        assert_eq!(fixed(-0.002, 3), "-0.002");
    }

    #[test]
    fn fixed_prints_non_finite_as_not_available() {
        assert_eq!(fixed(f64::NAN, 2), "n/a");
    }

    #[test]
    fn trimmed_drops_trailing_zeros_only() {
        assert_eq!(trimmed(6.0, 2), "6");
        assert_eq!(trimmed(3.5, 2), "3.5");
        assert_eq!(trimmed(150.0, 0), "150");
    }

    #[test]
    fn conversions_match_the_exact_definitions() {
        // 1 in = 25.4 mm exactly (international inch, 1959).
        assert_relative_eq!(mm_to_in(152.4), 6.0, max_relative = 1e-12);
        // 1 lbf = 4.4482216152605 N exactly (0.45359237 kg x 9.80665 m/s²).
        assert_relative_eq!(n_to_lbf(4.448_221_615_260_5), 1.0, max_relative = 1e-15);
        // 1 psf = 47.88026 Pa.
        assert_relative_eq!(kpa_to_psf(0.047_880_26), 1.0, max_relative = 1e-7);
        assert_relative_eq!(m_to_ft(0.3048), 1.0, max_relative = 1e-12);
    }

    #[test]
    fn feet_inches_reads_like_a_tape() {
        assert_eq!(feet_inches(12.0), "39'-4 1/2\"");
        assert_eq!(feet_inches(0.3048), "1'-0\"");
        assert_eq!(feet_inches(0.0), "0'-0\"");
        // 12 ft 4 3/8 in = 148.375 in = 3.768725 m.
        assert_eq!(feet_inches(3.768725), "12'-4 3/8\"");
        assert_eq!(feet_inches(0.3048 * 12.0 + 0.0254 * 11.87), "12'-11 7/8\"");
        // 11 15/16 in rounds up to the next foot.
        assert_eq!(feet_inches(0.0254 * 11.99), "1'-0\"");
    }

    #[test]
    fn inches_read_as_fractions() {
        assert_eq!(inches_fraction(6.0), "6");
        assert_eq!(inches_fraction(2.5), "2 1/2");
        assert_eq!(inches_fraction(0.375), "3/8");
    }

    #[test]
    fn three_significant_figures() {
        assert_eq!(sig3(199.0927), "199");
        assert_eq!(sig3(2.7291), "2.73");
        assert_eq!(sig3(0.045_67), "0.0457");
        assert_eq!(sig3(3056.4), "3060");
        assert_eq!(sig3(57.0), "57.0");
        assert_eq!(sig3(0.0), "0");
    }

    #[test]
    fn panel_thickness_reads_as_the_trade_names_it() {
        // 19/32 in = 15.08 mm, 15/32 in = 11.91 mm, 7/16 in = 11.11 mm.
        assert_eq!(thickness_label(15.08, true), "19/32 in");
        assert_eq!(thickness_label(11.9, true), "15/32 in");
        assert_eq!(thickness_label(11.1, true), "7/16 in");
        assert_eq!(thickness_label(25.4, true), "1 in");
        assert_eq!(thickness_label(15.1, false), "15.1 mm");
    }

    #[test]
    fn labels_lead_with_the_chosen_units() {
        assert_eq!(spacing_label(Some(150.0), false), "150 mm");
        assert_eq!(spacing_label(Some(152.4), true), "6 in");
        assert_eq!(spacing_label(None, true), "none");
        assert_eq!(force_label(444.8222, true), "100 lb");
        assert_eq!(pressure_label(1.0, false), "1.00 kPa");
        assert_eq!(plan_length_label(12.0, true), "39'-4 1/2\"");
    }
}
