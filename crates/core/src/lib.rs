//! deckhold's shared vocabulary, at the bottom of the crate tree: every other crate depends on it and it
//! depends on none of them. It does no I/O.
//!
//! - [`units`]: one constant per unit conversion, each with its source.
//! - [`limits`]: the one table of limits (sizes and physical ranges) that the reader and every crate use.
//! - [`kinds`]: the enums every crate names (zone kind, support role, roof shape, basis), one `Display` each.

pub mod kinds;
pub mod limits;
pub mod units;

pub use kinds::{Basis, EdgeKind, LineKind, RoofShape, SupportRole, ZoneKind};
pub use limits::{Limit, OutOfRange};
