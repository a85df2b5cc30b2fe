//! The deck: framing lines, panel courses, the panel strip continuous over its supports, and the
//! nail spacing along every line.
//!
//! Plain data in (roof planes and zone polygons in plan, framing and panel settings, per-nail
//! resistance), plain data out.
//! Modules form a tree: `error` <- `beam` <- `layout` <- `spacing`.

pub mod beam;
pub mod error;
mod fast_hash;
pub mod layout;
pub mod spacing;

pub use error::SpacingError;
