//! `deckhold limits`: the one table of limits (`deckhold_core::limits`), as docs/project-format.md lists it.

use anyhow::Result;

use crate::Outcome;

pub fn run() -> Result<Outcome> {
    out!("{}", deckhold_core::limits::markdown_table());
    Ok(Outcome::Works)
}
