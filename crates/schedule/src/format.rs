//! Fixed-decimal number formatting and the unit twins printed beside SI values.
//!
//! The writers only format: every engineering value arrives in SI from [`crate::Schedule`]; the imperial
//! twins are exact re-expressions with the conversion constants below.

use crate::ScheduleError;

/// The conversions under the names the writers use (`deckhold_core::units` holds the one definition).
pub use deckhold_core::units::{
    ft_from_m as m_to_ft, in_from_mm as mm_to_in, lbf_from_n as n_to_lbf,
    psf_from_kpa as kpa_to_psf,
};
pub use deckhold_core::units::{KPA_PER_PSF, MM_PER_FT, MM_PER_IN, N_PER_LBF};

/// Decimal places of each printed quantity; the CSV files and docs/report-format.md use the same.
pub mod places {
    pub const SPACING_MM: usize = 0;
    pub const SPACING_IN: usize = 2;
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
/// Callers check finiteness first ([`finite`]); a non-finite value prints as `n/a` rather than panicking.
pub fn fixed(value: f64, decimals: usize) -> String {
    if !value.is_finite() {
        return "n/a".to_string();
    }
    let text = format!("{value:.decimals$}");
    match text.strip_prefix('-') {
        Some(magnitude) if magnitude.bytes().all(|b| b == b'0' || b == b'.') => {
            magnitude.to_string()
        }
        _ => text,
    }
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

/// `Ok(value)` when finite, else an error naming `field`.
pub fn finite(field: &str, value: f64) -> Result<f64, ScheduleError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(ScheduleError::NonFinite {
            field: field.to_string(),
            value,
        })
    }
}

/// A plan length the way a tape reads in the US: feet, inches and the nearest quarter inch (`39'-4 1/2"`).
pub fn feet_inches(m: f64) -> String {
    if !m.is_finite() {
        return "n/a".to_string();
    }
    let quarters_total = (m.abs() * 1000.0 / MM_PER_IN * 4.0).round() as u64;
    let feet = quarters_total / (12 * 4);
    let inches = (quarters_total % (12 * 4)) / 4;
    let fraction = match quarters_total % 4 {
        1 => " 1/4",
        2 => " 1/2",
        3 => " 3/4",
        _ => "",
    };
    let sign = if m < 0.0 && quarters_total > 0 {
        "-"
    } else {
        ""
    };
    format!("{sign}{feet}'-{inches}{fraction}\"")
}

/// A spacing for people: `150 mm`, or `6 in (152 mm)` when imperial leads; `none` when no spacing works.
pub fn spacing_label(spacing_mm: Option<f64>, imperial: bool) -> String {
    match spacing_mm {
        None => "none".to_string(),
        Some(mm) if imperial => format!(
            "{} in ({} mm)",
            trimmed(mm_to_in(mm), places::SPACING_IN),
            fixed(mm, places::SPACING_MM)
        ),
        Some(mm) => format!("{} mm", fixed(mm, places::SPACING_MM)),
    }
}

/// A pressure for people: `1.234 kPa`, or `25.77 psf (1.234 kPa)` when imperial leads.
pub fn pressure_label(kpa: f64, imperial: bool) -> String {
    if imperial {
        format!(
            "{} psf ({} kPa)",
            fixed(kpa_to_psf(kpa), places::PRESSURE_PSF),
            fixed(kpa, places::PRESSURE_KPA)
        )
    } else {
        format!("{} kPa", fixed(kpa, places::PRESSURE_KPA))
    }
}

/// A force for people: `512 N`, or `115.1 lbf (512 N)` when imperial leads.
pub fn force_label(n: f64, imperial: bool) -> String {
    if imperial {
        format!(
            "{} lbf ({} N)",
            fixed(n_to_lbf(n), places::FORCE_LBF),
            fixed(n, places::FORCE_N)
        )
    } else {
        format!("{} N", fixed(n, places::FORCE_N))
    }
}

/// A fastener dimension for people: `63.5 mm`, or `2.5 in (63.5 mm)` when imperial leads.
pub fn small_length_label(mm: f64, imperial: bool) -> String {
    if imperial {
        format!("{} in ({} mm)", trimmed(mm_to_in(mm), 3), trimmed(mm, 2))
    } else {
        format!("{} mm", trimmed(mm, 2))
    }
}

/// A plan length for people: `12.000 m`, or `39'-4 1/2" (12.000 m)` when imperial leads.
pub fn plan_length_label(m: f64, imperial: bool) -> String {
    if imperial {
        format!("{} ({} m)", feet_inches(m), fixed(m, places::LENGTH_M))
    } else {
        format!("{} m", fixed(m, places::LENGTH_M))
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

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

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
    }

    #[test]
    fn finite_names_the_field() {
        let error = finite("zones[0].demand_n", f64::INFINITY).expect_err("infinity is refused");
        assert_eq!(
            error.to_string(),
            "zones[0].demand_n: inf is not a finite number; the report prints finite values only"
        );
    }

    #[test]
    fn labels_lead_with_the_chosen_units() {
        assert_eq!(spacing_label(Some(150.0), false), "150 mm");
        assert_eq!(spacing_label(Some(152.4), true), "6 in (152 mm)");
        assert_eq!(spacing_label(None, true), "none");
        assert_eq!(force_label(444.8222, true), "100.0 lbf (445 N)");
        assert_eq!(pressure_label(1.0, false), "1.000 kPa");
    }
}
