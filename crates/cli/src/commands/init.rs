//! `deckhold init`: write a complete example project file to start from (never over an existing file).

use anyhow::Result;
use std::path::PathBuf;

use crate::args::InitArgs;
use crate::output::write_new_file;
use crate::Outcome;

/// The Canadian template: the demo workshop with every key of the project file (NBC 2020 with CSA O86).
const CA_TEMPLATE_JSON: &str = include_str!("../../../../fixtures/template-ca.json");
/// The US template: an invented hip-roof duplex with every key, US units (ASCE 7-22 with NDS 2018, ASD).
const US_TEMPLATE_JSON: &str = include_str!("../../../../fixtures/template-us.json");
/// The example batch: eight invented roofs over the Canadian template, one failing and two refused, so
/// that every status shows.
const BATCH_EXAMPLE_CSV: &str = include_str!("../../../../fixtures/batch/roofs.csv");

pub fn run(args: &InitArgs) -> Result<Outcome> {
    if args.batch {
        let path = args
            .path
            .clone()
            .unwrap_or_else(|| PathBuf::from("roofs.csv"));
        write_new_file(&path, BATCH_EXAMPLE_CSV.as_bytes())?;
        errln!(
            "wrote {} (example batch over the Canadian template); with a base project from \
             `deckhold init`, run `deckhold batch {} --base project.json --out batch-out`",
            path.display(),
            path.display()
        );
        return Ok(Outcome::Works);
    }
    let path = args
        .path
        .clone()
        .unwrap_or_else(|| PathBuf::from("project.json"));
    let text = if args.us {
        US_TEMPLATE_JSON
    } else {
        CA_TEMPLATE_JSON
    };
    write_new_file(&path, text.as_bytes())?;
    errln!(
        "wrote {} ({} basis example); edit it, then run `deckhold run {}`",
        path.display(),
        if args.us { "US" } else { "Canadian" },
        path.display()
    );
    Ok(Outcome::Works)
}
