//! `deckhold`: the command-line tool. Reads project files, runs the job, writes the schedule files.
//!
//! Exit status: 0 done (and every zone works); 1 the design does not work (a plan check fails, or no
//! practical spacing works in some zone); 2 the input is refused (bad file, bad option, outside the method).

mod alloc;
mod args;
#[macro_use]
mod console;
mod batch;
mod commands;
mod output;
mod table;

use clap::Parser;
use std::process::ExitCode;

use args::{Cli, Command};

/// mimalloc in place of the system allocator, called the cheapest way each layout allows (see `alloc`).
#[global_allocator]
static ALLOCATOR: alloc::Allocator = alloc::Allocator;

/// What a command found, for the exit status.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Outcome {
    Works,
    DoesNotWork,
    /// Some of the input was refused, and the output says where (a batch row); exit 2 without an error.
    PartlyRefused,
}

fn main() -> ExitCode {
    let cli = Cli::parse();
    let units = cli.units.map(args::UnitsArg::units);
    let table = cli.coefficients.as_deref();
    let result = match cli.command {
        Command::Run(args) => commands::run::run(&args, units, table),
        Command::Batch(args) => commands::batch::run(&args, table),
        Command::Zones(args) => commands::zones::run(&args, units, table),
        Command::Check(args) => commands::check::run(&args, units, table),
        Command::Compare(args) => commands::compare::run(&args, units, table),
        Command::Capacity(args) => commands::capacity::run(&args, units),
        Command::Catalog(args) => commands::catalog::run(&args),
        Command::Init(args) => commands::init::run(&args),
        Command::Limits => commands::limits::run(),
    };
    let result = result.and_then(|outcome| console::flush_out().map(|()| outcome));
    match result {
        Ok(Outcome::Works) => ExitCode::SUCCESS,
        Ok(Outcome::DoesNotWork) => ExitCode::from(1),
        Ok(Outcome::PartlyRefused) => ExitCode::from(2),
        // The reader of our output went away (`deckhold zones | head -1`): stop quietly, as the shell's
        // own tools do, with the status a pipe-killed process would have (128 + SIGPIPE).
        Err(error) if console::is_broken_pipe(&error) => ExitCode::from(141),
        Err(error) => {
            // If even standard error cannot be written, the status still says the run failed.
            let _ = console::write_err(format_args!("deckhold: error: {error:#}\n"));
            ExitCode::from(2)
        }
    }
}
