//! The writers that turn the computed schedule (the report model of `deckhold-model`) into bytes:
//! `schedule.csv`, `rafter-lines.csv`, `summary.csv` and the PDF (crew sheet, design basis, rafter-line
//! table). The model is re-exported here so the binary names one crate for the report.
//!
//! Writers only format: every engineering value comes from the [`Schedule`]; the writers convert units
//! for the imperial twins and round to the fixed places listed in `docs/report-format.md`. No file I/O,
//! no clock: the same schedule and options give the same bytes.

mod csv_lines;
mod csv_schedule;
mod csv_summary;
mod error;
mod finite;
pub mod line_groups;
mod pdf;
#[doc(hidden)]
pub mod sample;

pub use csv_lines::{rafter_lines_csv, LINES_HEADER, LINES_HEADER_US};
pub use csv_schedule::{schedule_csv, NO_SPACING, SCHEDULE_HEADER, SCHEDULE_HEADER_US};
pub use csv_summary::{summary_header, summary_header_csv, summary_record};
pub use deckhold_model::model;
pub use deckhold_model::model::*;
pub use error::ScheduleError;

/// Number formatting (from `deckhold-model`), and the writers' finiteness guard.
pub mod format {
    pub use crate::finite::finite;
    pub use deckhold_model::format::*;
}
pub use pdf::{
    crew_sheet_pages, plan_label_boxes, report_pdf, schedule_pdf, unshowable_chars, BarChart,
    Block, ChartColumn, ChartPanel, ChartRow, Part, PdfOptions, PlanLabelBox, Report,
};
