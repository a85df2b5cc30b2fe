//! Errors of the project file and of the job it describes.

use thiserror::Error;

/// A problem with the project file, named by its key path (`roof.slope_deg`).
#[derive(Debug, Error, Clone, PartialEq)]
pub enum ProjectError {
    #[error("project file is not valid JSON: {0}")]
    Json(String),
    #[error("{path}: unknown key{suggestion} (allowed here: {allowed})")]
    UnknownKey {
        path: String,
        /// `; did you mean "length_m"?` when an allowed key is near, else empty.
        suggestion: String,
        allowed: String,
    },
    #[error("{path}: written twice ({first} and {second}); give each key once")]
    DuplicateKey {
        path: String,
        first: String,
        second: String,
    },
    #[error("{path}: missing (required)")]
    Missing { path: String },
    #[error("{path}: expected {expected}")]
    WrongType { path: String, expected: String },
    #[error("{path}: {value} is outside {range}")]
    OutOfRange {
        path: String,
        value: String,
        range: String,
    },
    #[error("{first} and {second}: give one unit variant of this quantity, not both")]
    BothUnits { first: String, second: String },
    #[error("{path}: {message}")]
    Invalid { path: String, message: String },
}

impl From<deckhold_core::OutOfRange> for ProjectError {
    fn from(error: deckhold_core::OutOfRange) -> Self {
        ProjectError::OutOfRange {
            path: error.key,
            value: error.value,
            range: error.range,
        }
    }
}

/// Anything that stops the whole job: a bad file, or a method that refuses the input.
#[derive(Debug, Error)]
pub enum JobError {
    #[error(transparent)]
    Project(#[from] ProjectError),
    // The inner message is printed in the variant's own text and not chained as a source, so that a
    // report of the error chain says it once.
    #[error("wind zones: {0}")]
    Wind(deckhold_wind::WindError),
    #[error("nail resistance: {0}")]
    Fasten(deckhold_fasten::FastenError),
    #[error("nail spacing: {0}")]
    Spacing(deckhold_deck::spacing::SpacingError),
}

impl From<deckhold_wind::WindError> for JobError {
    fn from(error: deckhold_wind::WindError) -> Self {
        JobError::Wind(error)
    }
}

impl From<deckhold_fasten::FastenError> for JobError {
    fn from(error: deckhold_fasten::FastenError) -> Self {
        JobError::Fasten(error)
    }
}

impl From<deckhold_deck::spacing::SpacingError> for JobError {
    fn from(error: deckhold_deck::spacing::SpacingError) -> Self {
        JobError::Spacing(error)
    }
}
