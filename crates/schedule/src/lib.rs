//! The computed schedule as report data ([`model`]), and the writers that turn it into bytes:
//! `schedule.csv`, `rafter-lines.csv` and the PDF (crew sheet, design basis, rafter-line table).
//!
//! Writers only format: every engineering value comes from the [`Schedule`]; the writers convert units
//! for the imperial twins and round to the fixed places listed in `docs/report-format.md`. No file I/O,
//! no clock: the same schedule and options give the same bytes.

mod csv_lines;
mod csv_schedule;
mod csv_summary;
mod error;
mod finite;
pub mod format;
pub mod line_groups;
pub mod model;
mod pdf;
#[doc(hidden)]
pub mod sample;

pub use csv_lines::{rafter_lines_csv, LINES_HEADER, LINES_HEADER_US};
pub use csv_schedule::{schedule_csv, NO_SPACING, SCHEDULE_HEADER, SCHEDULE_HEADER_US};
pub use csv_summary::{
    summary_header, summary_header_csv, summary_record, RoofStatus, RoofSummary, SpacingCell,
    SUMMARY_ROLES, SUMMARY_ZONES,
};
pub use error::ScheduleError;
pub use model::*;
pub use pdf::{report_pdf, schedule_pdf, Block, Part, PdfOptions, Report};
