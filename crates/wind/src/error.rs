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

impl From<deckhold_core::OutOfRange> for WindError {
    fn from(error: deckhold_core::OutOfRange) -> Self {
        Self::OutOfRange {
            field: error.key,
            detail: format!("{} is outside {}", error.value, error.range),
        }
    }
}
