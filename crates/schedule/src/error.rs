//! The one error type of the writers.

use thiserror::Error;

/// Why a writer refused to produce a file.
///
/// Every message names the offending field (as a path into [`crate::Schedule`] or [`crate::PdfOptions`])
/// and what would have been accepted.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum ScheduleError {
    /// A number in the schedule is NaN or infinite; the report never prints such a value.
    #[error("{field}: {value} is not a finite number; the report prints finite values only")]
    NonFinite { field: String, value: f64 },
    /// The PDF creation date is not an ISO calendar date.
    #[error("pdf.creation_date: '{value}' is not a calendar date in YYYY-MM-DD form (years 1900..=9999)")]
    CreationDate { value: String },
    /// The PDF document id is empty, too long or not printable ASCII.
    #[error("pdf.document_id: '{value}' must be 1..=64 printable ASCII characters without spaces")]
    DocumentId { value: String },
    /// The CSV writer failed (it writes to memory, so this points at a bug).
    #[error("writing {file} failed: {message}")]
    Csv { file: &'static str, message: String },
    /// The PDF could not be assembled (points at a bug in this crate or in printpdf).
    #[error("assembling the PDF failed: {0}")]
    Pdf(String),
}
