//! The report model: what a computed schedule says (zones, lines, plan, basis, inputs as given), all in SI,
//! and how its numbers are formatted for people (SI or US customary, fixed places, never `-0`).
//!
//! The project crate fills it; the writers (`deckhold-schedule`) and the binary read it. It sits between
//! them so that the computation never depends on a writer: no I/O here, nothing computed.

pub mod format;
mod message_lengths;
mod schedule;
mod summary;

/// The whole model under one name (`deckhold_model::model::*`).
pub mod model {
    pub use crate::schedule::*;
    pub use crate::summary::*;
}

pub use model::*;
