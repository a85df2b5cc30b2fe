//! One row worked: project from the row, the job, the summary line, and with `--pdf` the roof's files.

use anyhow::{Context, Result};
use serde_json::Value;
use std::path::Path;
use std::time::{Duration, Instant};

use super::rows::OwnedRow;
use crate::output::{write_all_atomically, OutputSet};
use deckhold_project::batch::{job_refusal, refused, row_project, summarize, Columns, Row};
use deckhold_project::{run_job, run_job_to_chosen, schedule_for};
use deckhold_schedule::{
    rafter_lines_csv, schedule_csv, schedule_pdf, summary_record, PdfOptions, RoofStatus,
};

/// The stages of one roof, in the order they run.
pub const STAGES: [&str; 4] = [
    "row to project",
    "wind + resistance + spacing",
    "summary line",
    "roof files (CSV, PDF)",
];

/// What one row gave: its status, its summary line's bytes, the time each stage took.
#[derive(Debug)]
pub struct RowResult {
    pub status: RoofStatus,
    pub line: Vec<u8>,
    pub stage_time: [Duration; 4],
}

/// What every row shares.
#[derive(Debug)]
pub struct BatchContext<'a> {
    pub base: &'a Value,
    pub columns: &'a Columns,
    /// With `--pdf`: the folder that gets a folder per roof.
    pub roof_files: Option<&'a Path>,
}

/// Works one row. Refusals and failing roofs are results; only a file that cannot be written is an
/// error (it stops the batch: the disk, not the row, is at fault).
pub fn work_row(context: &BatchContext, owned: &OwnedRow) -> Result<RowResult> {
    let mut stage_time = [Duration::ZERO; 4];
    let mut clock = Instant::now();
    let mut lap = |stage: usize| {
        stage_time[stage] += clock.elapsed();
        clock = Instant::now();
    };
    let cells: Vec<&str> = owned.record.iter().collect();
    let row = Row {
        number: owned.number,
        cells: &cells,
    };
    let id = row.id(context.columns);
    let project = match &owned.problem {
        Some((column, message)) => Err(Box::new(refused(id, row.number, Some(column), message))),
        None => row_project(context.base, context.columns, &row),
    };
    lap(0);
    // The summary reads only the chosen nail; the roof's own files list every candidate.
    let job_of = |project: &deckhold_project::Project| {
        if context.roof_files.is_some() {
            run_job(project)
        } else {
            run_job_to_chosen(project)
        }
    };
    let summary = match project {
        Err(refusal) => *refusal,
        Ok(project) => match job_of(&project) {
            Err(error) => {
                lap(1);
                job_refusal(context.columns, &row, &error)
            }
            Ok(job) => {
                lap(1);
                let summary = summarize(id, &job);
                lap(2);
                if let Some(folder) = context.roof_files {
                    write_roof_files(&folder.join(id), &schedule_for(&project, &job))?;
                    lap(3);
                }
                summary
            }
        },
    };
    let line = summary_record(&summary)
        .with_context(|| format!("the summary line of row {}", row.number))?;
    lap(2);
    Ok(RowResult {
        status: summary.status,
        line,
        stage_time,
    })
}

fn write_roof_files(folder: &Path, schedule: &deckhold_schedule::Schedule) -> Result<()> {
    let options = PdfOptions {
        creation_date: schedule.project.date.clone(),
        document_id: format!("deckhold-{}", schedule.project.date),
        crew_pages: None,
    };
    let files = [
        ("schedule.csv", schedule_csv(schedule)?),
        ("rafter-lines.csv", rafter_lines_csv(schedule)?),
        ("schedule.pdf", schedule_pdf(schedule, &options)?),
    ];
    write_all_atomically(folder, OutputSet::Schedule, &files)?;
    Ok(())
}

/// Counts of each status, for the exit status and the closing line.
#[derive(Debug, Default, Clone, Copy, PartialEq, Eq)]
pub struct Counts {
    pub ok: u64,
    pub fails: u64,
    pub refused: u64,
}

impl Counts {
    pub fn add(&mut self, status: RoofStatus) {
        match status {
            RoofStatus::Ok => self.ok += 1,
            RoofStatus::Fails => self.fails += 1,
            RoofStatus::Refused => self.refused += 1,
        }
    }

    pub fn total(&self) -> u64 {
        self.ok + self.fails + self.refused
    }
}
