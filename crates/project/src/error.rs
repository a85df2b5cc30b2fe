//! Errors of the project file and of the job it describes.

use thiserror::Error;

/// A problem with the project file, named by its key path (`roof.slope_deg`).
#[derive(Debug, Error, Clone, PartialEq)]
pub enum ProjectError {
    #[error("project file is not valid JSON: {0}")]
    Json(String),
    #[error("{path}: unknown key (allowed here: {allowed})")]
    UnknownKey { path: String, allowed: String },
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

/// Anything that stops the whole job: a bad file, or a method that refuses the input.
#[derive(Debug, Error)]
pub enum JobError {
    #[error(transparent)]
    Project(#[from] ProjectError),
    #[error("wind: {0}")]
    Wind(#[from] deckhold_wind::WindError),
    #[error("nail resistance: {0}")]
    Fasten(#[from] deckhold_fasten::FastenError),
    #[error("nail spacing: {0}")]
    Spacing(#[from] deckhold_fasten::spacing::SpacingError),
}
