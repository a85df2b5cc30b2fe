//! Many roofs from one base project: each row of a batch file sets some of the base's keys.
//!
//! A row is applied to the base project's JSON value tree ([`overrides`]) and read by the normal reader,
//! so a row gets every check a project file gets; a row that cannot be read is refused with a message
//! naming its row and column ([`roof`]), and never stops the others. Reading the file, running rows in
//! parallel and writing the summary in input order is the binary's work: this module does no I/O.

pub mod columns;
pub mod overrides;
pub mod roof;

pub use columns::{check_id, Columns, OverrideColumn, ID_COLUMN};
pub use overrides::{apply_row, LIST_SEPARATOR};
pub use roof::{column_named_in, refused, row_project, summarize, Row};

use thiserror::Error;

/// What refuses a whole batch before any row is worked.
#[derive(Debug, Error, Clone, PartialEq, Eq)]
pub enum BatchError {
    #[error("batch file header: {0}")]
    Header(String),
}

/// A job that refused a row (the method does not cover it): the summary names the row, and the column
/// when the message names one.
pub fn job_refusal(
    columns: &Columns,
    row: &Row,
    error: &crate::JobError,
) -> deckhold_model::RoofSummary {
    let message = error.to_string();
    refused(
        row.id(columns),
        row.number,
        column_named_in(columns, &message),
        &message,
    )
}
