//! The project file and the whole job.
//!
//! [`parse_project`] turns the project file's text into a validated [`Project`] (SI inside, every message
//! naming its key path); [`run_job`] runs wind zones, nail resistance and spacing into a
//! [`deckhold_model::Schedule`]. No file or terminal I/O here: the binary reads and writes files.

pub mod as_written;
pub mod basis;
pub mod batch;
pub mod demo;
pub mod duplicate_keys;
pub mod error;
pub mod fasteners;
pub mod inputs;
pub mod parse;
pub mod project;
pub mod reader;
pub mod units;

pub use basis::{Basis, BasisStandards};
pub use demo::DEMO_PROJECT_JSON;
pub use error::{JobError, ProjectError};
pub use parse::{parse_project, project_from_value};
pub use project::*;
pub mod adjustments;
pub mod check;
pub mod job;
pub mod reach;
pub mod report;
pub mod retrofit;
pub mod rules;

pub use check::{check_pattern, CheckRow, PatternCheck};
pub use job::{run_job, run_job_to_chosen, run_job_with_nails, Job, NailOutcome};
pub use report::schedule_for;
pub use retrofit::{plan_retrofit, Placement, Retrofit, RetrofitRow, COMBINATION_RULE};
