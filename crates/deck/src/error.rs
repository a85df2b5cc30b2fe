//! The one error type of the deck crate (beam, layout, spacing).
//!
//! At the root of the crate so that every module depends on it and none on another for it. Every message
//! names the input field and what is allowed.

use thiserror::Error;

/// Why a deck layout or a nail spacing could not be computed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum SpacingError {
    /// A number is outside the range the method accepts.
    #[error("{field}: {value} is outside {allowed}")]
    OutOfRange {
        field: String,
        value: f64,
        allowed: String,
    },
    /// An input has the wrong shape (too few points, empty list, unsorted list, ...).
    #[error("{field}: {reason}")]
    Invalid { field: String, reason: String },
    /// The continuous-beam stiffness matrix could not be factored (never expected for valid spans).
    #[error("beam: the stiffness matrix for spans {spans_m:?} m could not be factored")]
    SingularBeam { spans_m: Vec<f64> },
    /// A panel is too short to reach from one framing line to the next.
    #[error(
        "deck.panel_length_mm: a {length_mm} mm panel starting at {from_m:.3} m on plane {plane_index} \
         reaches no framing line (framing.spacing_mm {spacing_mm}); use longer panels or closer framing"
    )]
    PanelTooShort {
        plane_index: usize,
        length_mm: f64,
        spacing_mm: f64,
        from_m: f64,
    },
    /// A stretch of line in the layout has no panel strip on it (a layout fault, never a zero load).
    #[error("layout: framing line {line}, course {course}, has no panel bearing on it")]
    NoStrip { line: u32, course: usize },
    /// A checked pattern gives no spacing for a zone the layout has.
    #[error("pattern: no spacing given for zone {zone_index} ({role})")]
    NoPattern { zone_index: usize, role: String },
    /// No zone covers part of a rafter line: the zones do not tile the roof.
    #[error("zones: no zone covers rafter line {line} at plan position [{x_m:.3}, {y_m:.3}] m; the zones must tile every roof plane")]
    NoZone { line: u32, x_m: f64, y_m: f64 },
    /// The caller's uplift function refused or returned a number that is not finite.
    #[error("uplift for zone {zone_index} at effective area {effective_area_m2:.4} m2: {message}")]
    Uplift {
        zone_index: usize,
        effective_area_m2: f64,
        message: String,
    },
    /// No spacing increment lies between the splitting minimum and the prescriptive maximum.
    #[error(
        "rules.increments_mm: no increment lies in {min_mm}..{max_mm} mm (rules.min_mm .. the {role} maximum)"
    )]
    NoIncrement {
        role: String,
        min_mm: f64,
        max_mm: f64,
    },
}

impl From<deckhold_core::OutOfRange> for SpacingError {
    fn from(error: deckhold_core::OutOfRange) -> Self {
        SpacingError::Invalid {
            field: error.key,
            reason: format!("{} is outside {}", error.value, error.range),
        }
    }
}

/// Checks that `value` is finite and inside `lo..=hi`; `allowed` is the range as printed.
pub(crate) fn check_range(
    field: impl Fn() -> String,
    value: f64,
    lo: f64,
    hi: f64,
) -> Result<(), SpacingError> {
    if value.is_finite() && value >= lo && value <= hi {
        Ok(())
    } else {
        Err(SpacingError::OutOfRange {
            field: field(),
            value,
            allowed: format!("{lo}..{hi}"),
        })
    }
}

/// Checks that `value` is finite and strictly positive.
pub(crate) fn check_positive(field: impl Fn() -> String, value: f64) -> Result<(), SpacingError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(SpacingError::OutOfRange {
            field: field(),
            value,
            allowed: "finite values > 0".to_string(),
        })
    }
}
