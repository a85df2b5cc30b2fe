//! `deckhold batch`: many roofs from one base project, one summary line each, in input order.
//!
//! Exit status: 0 every roof works; 1 some roof fails (no practical spacing with any candidate nail);
//! 2 some row was refused, or the batch itself was (bad header, bad base project, unreadable file).

use anyhow::{Context, Result};
use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use rayon::prelude::*;
use serde_json::{json, Value};
use std::fs::File;
use std::io::{BufReader, IsTerminal};
use std::time::{Duration, Instant};

use crate::args::BatchArgs;
use crate::batch::rows::{RowReader, CHUNK_ROWS};
use crate::batch::sink::SummarySink;
use crate::batch::work::{work_row, BatchContext, Counts, RowResult, STAGES};
use crate::Outcome;
use deckhold_schedule::summary_header_csv;

pub fn run(args: &BatchArgs, table: Option<&std::path::Path>) -> Result<Outcome> {
    if let Some(table) = table {
        anyhow::bail!(
            "--coefficients {}: batch does not read coefficient tables; run the roofs one by one with run --coefficients",
            table.display()
        );
    }
    let started = Instant::now();
    let base = read_base(&args.base)?;
    let file = File::open(&args.roofs)
        .with_context(|| format!("cannot read the batch file {}", args.roofs.display()))?;
    let file_bytes = file.metadata().map(|meta| meta.len()).unwrap_or(0);
    let mut reader = RowReader::new(BufReader::new(file), CHUNK_ROWS)
        .with_context(|| format!("in {}", args.roofs.display()))?;
    let threads = args.jobs.map_or_else(
        || std::thread::available_parallelism().map_or(1, usize::from),
        usize::from,
    );
    let pool = rayon::ThreadPoolBuilder::new()
        .num_threads(threads)
        .build()
        .context("cannot start the worker threads")?;
    let mut sink = SummarySink::open(args.out.as_deref())?;
    sink.write(&summary_header_csv()?)?;
    let context = BatchContext {
        base: &base,
        columns: &reader.columns.clone(),
        roof_files: if args.pdf { args.out.as_deref() } else { None },
    };
    let progress = progress_bar(file_bytes);

    let mut counts = Counts::default();
    let mut stage_time = [Duration::ZERO; STAGES.len()];
    let mut wall = [Duration::ZERO; 3];
    loop {
        let clock = Instant::now();
        let chunk = reader
            .next_chunk()
            .with_context(|| format!("in {}", args.roofs.display()))?;
        wall[0] += clock.elapsed();
        if chunk.is_empty() {
            break;
        }
        let clock = Instant::now();
        let results: Vec<Result<RowResult>> = pool.install(|| {
            chunk
                .par_iter()
                .map(|row| work_row(&context, row))
                .collect()
        });
        wall[1] += clock.elapsed();
        let clock = Instant::now();
        for result in results {
            let result = result?;
            counts.add(result.status);
            for (total, time) in stage_time.iter_mut().zip(result.stage_time) {
                *total += time;
            }
            sink.write(&result.line)?;
        }
        wall[2] += clock.elapsed();
        progress.set_position(reader.byte_offset());
        progress.set_message(format!("{} roofs", counts.total()));
    }
    progress.finish_and_clear();
    let clock = Instant::now();
    let summary_path = sink.finish()?;
    wall[2] += clock.elapsed();

    let closing = format!(
        "batch: {} roofs: {} ok, {} fail, {} refused",
        counts.total(),
        counts.ok,
        counts.fails,
        counts.refused
    );
    match &summary_path {
        Some(path) => errln!("{closing}; wrote {}", path.display()),
        None => errln!("{closing}"),
    }
    if args.json {
        let report = json!({
            "roofs": counts.total(),
            "ok": counts.ok,
            "fails": counts.fails,
            "refused": counts.refused,
            "summary": summary_path.as_ref().map(|path| path.display().to_string()),
        });
        outln!("{}", serde_json::to_string_pretty(&report)?);
    }
    if args.timings {
        print_timings(
            &stage_time,
            &wall,
            started.elapsed(),
            counts.total(),
            threads,
        )?;
    }
    Ok(if counts.refused > 0 {
        Outcome::PartlyRefused
    } else if counts.fails > 0 {
        Outcome::DoesNotWork
    } else {
        Outcome::Works
    })
}

/// The base project as a JSON value tree, checked as a whole first: a base that is refused refuses the
/// batch, rather than every row with the same message.
fn read_base(path: &std::path::Path) -> Result<Value> {
    let text = std::fs::read_to_string(path)
        .with_context(|| format!("cannot read the base project {}", path.display()))?;
    let base: Value = serde_json::from_str(&text)
        .map_err(|error| deckhold_project::ProjectError::Json(error.to_string()))
        .with_context(|| format!("in the base project {}", path.display()))?;
    deckhold_project::project_from_value(&base)
        .with_context(|| format!("in the base project {}", path.display()))?;
    Ok(base)
}

/// A bar over the bytes of the batch file, drawn on stderr only when stderr is a terminal.
fn progress_bar(file_bytes: u64) -> ProgressBar {
    if !std::io::stderr().is_terminal() {
        return ProgressBar::hidden();
    }
    let bar = ProgressBar::with_draw_target(Some(file_bytes), ProgressDrawTarget::stderr());
    if let Ok(style) = ProgressStyle::with_template("{bar:40} {percent:>3}% {msg} ({elapsed})") {
        bar.set_style(style);
    }
    bar
}

fn print_timings(
    stage_time: &[Duration],
    wall: &[Duration; 3],
    total: Duration,
    roofs: u64,
    threads: usize,
) -> Result<()> {
    let ms = |duration: Duration| duration.as_secs_f64() * 1000.0;
    errln!("timing: summed over {roofs} roofs, on {threads} threads:");
    for (name, time) in STAGES.iter().zip(stage_time) {
        errln!("timing:   {name:<28} {:10.2} ms", ms(*time));
    }
    errln!("timing: wall clock:");
    for (name, time) in ["read rows", "work roofs", "write summary"]
        .iter()
        .zip(wall)
    {
        errln!("timing:   {name:<28} {:10.2} ms", ms(*time));
    }
    errln!("timing:   {:<28} {:10.2} ms", "total", ms(total));
    if roofs > 0 && total > Duration::ZERO {
        errln!(
            "timing:   {:<28} {:10.0}",
            "roofs per second",
            roofs as f64 / total.as_secs_f64()
        );
    }
    Ok(())
}
