//! Nails, wood and per-nail withdrawal resistance (CSA O86, NDS).
//!
//! The per-nail part: catalogs of nails, species groups and deck panels (data with provenance under
//! `data/`), and [`nail_resistance`], which gives the factored or allowable resistance of one nail in
//! withdrawal and head pull-through with every factor and its source. Pure functions, N and mm inside.

pub mod catalog;
pub mod error;
pub mod nail;
pub mod panel;
pub mod penetration;
pub mod resistance;
pub mod species;
pub mod stated;

pub use catalog::{
    nail, nails, panel, panels, species, species_groups, CatalogBasis, Confidence, SourcedValue,
};
pub use error::FastenError;
pub use nail::{MassBasis, Material, Nail, NdsNailType, ShankKind};
pub use panel::{DeckLayer, Panel};
pub use penetration::{minimum_penetration, penetration_mm, MinimumPenetration};
pub use resistance::{
    nail_resistance, Factor, Grain, LoadDuration, Method, Mode, Resistance, ResistanceInput,
    ResistanceKind, Service,
};
pub use species::{MemberKind, Species};
pub use stated::{stated_fastener, StatedFastener, StatedKind, StatedShank};
