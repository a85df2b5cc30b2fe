//! The one error type of the wind crate: every message names the input field and what is allowed.

/// Why a wind analysis or an uplift evaluation was refused.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum WindError {
    /// An input value lies outside the range the method accepts.
    #[error("{field}: {detail}")]
    OutOfRange { field: String, detail: String },
    /// The input is valid in itself but the method implemented here does not cover it.
    #[error("{field}: {detail}")]
    Unsupported { field: String, detail: String },
    /// A built-in coefficient file failed to load (a defect of the crate, not of the input).
    #[error("coefficient data {file}: {detail}")]
    Data { file: String, detail: String },
}

impl WindError {
    pub(crate) fn range(field: impl Into<String>, detail: impl Into<String>) -> Self {
        Self::OutOfRange {
            field: field.into(),
            detail: detail.into(),
        }
    }

    pub(crate) fn unsupported(field: impl Into<String>, detail: impl Into<String>) -> Self {
        Self::Unsupported {
            field: field.into(),
            detail: detail.into(),
        }
    }
}

/// Refuses a value that is not finite or lies outside `min..=max`.
pub(crate) fn check_range(
    field: &str,
    value: f64,
    min: f64,
    max: f64,
    unit: &str,
) -> Result<(), WindError> {
    if value.is_finite() && value >= min && value <= max {
        Ok(())
    } else {
        Err(WindError::range(
            field,
            format!("{value} {unit} is outside {min}..{max} {unit}"),
        ))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn message_names_field_and_range() {
        let error = check_range("roof.slope_deg", 75.0, 0.0, 45.0, "deg").expect_err("75 is out");
        assert_eq!(
            error.to_string(),
            "roof.slope_deg: 75 deg is outside 0..45 deg"
        );
    }

    #[test]
    fn nan_is_refused() {
        assert!(check_range("x", f64::NAN, 0.0, 1.0, "m").is_err());
    }
}
