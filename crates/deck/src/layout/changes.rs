//! How a course was shifted or trimmed, the way a framer would, and said in the output: the
//! minimum-piece rule, the sliver rule at hip and valley cuts, and where the two cannot both be met.

use serde::{Deserialize, Serialize};

use super::courses::SLIVER_M;

/// One change to one course's layout. Lengths in m; positions are plan coordinates across the
/// framing.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(tag = "kind", rename_all = "kebab-case")]
pub enum LayoutChange {
    /// The first end joint moved to the line at `to_m` so the first piece is at least the minimum.
    FirstJointMoved { to_m: f64 },
    /// The last end joint moved back to the line at `to_m` so the last piece is at least the minimum.
    LastJointMoved { to_m: f64 },
    /// A piece under the minimum that no framing line avoids (the two rules conflict with the
    /// framing, the start and the panel length): laid as it is.
    NarrowPiece {
        from_m: f64,
        to_m: f64,
        length_m: f64,
    },
    /// The top course is narrower than the minimum up the slope.
    NarrowTopCourse { width_m: f64 },
    /// A strip under [`SLIVER_M`] between a hip or valley cut and line `line`, carried by the line as
    /// a short cantilever rather than spanned to the hip or valley rafter.
    Sliver { line: u32, width_m: f64 },
}

/// How lengths are written: a plan position and a piece size, in the reader's units.
pub struct LengthWords<'a> {
    pub position: &'a dyn Fn(f64) -> String,
    pub size: &'a dyn Fn(f64) -> String,
    /// The unit suffix of the keys the reader writes (`mm` or `in`), for naming a setting.
    pub key_unit: &'a str,
}

impl std::fmt::Debug for LengthWords<'_> {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str("LengthWords")
    }
}

impl LayoutChange {
    /// The change in words, without the course number; `min_piece_m` is the minimum it was held to.
    pub fn words(&self, min_piece_m: f64, units: &LengthWords<'_>) -> String {
        let minimum = (units.size)(min_piece_m);
        match *self {
            LayoutChange::FirstJointMoved { to_m } => format!(
                "first end joint moved to the line at {} so the first piece is at least {minimum}",
                (units.position)(to_m)
            ),
            LayoutChange::LastJointMoved { to_m } => format!(
                "last end joint moved back to the line at {} so the last piece is at least {minimum}",
                (units.position)(to_m)
            ),
            LayoutChange::NarrowPiece {
                from_m,
                to_m,
                length_m,
            } => format!(
                "the piece from {} to {} is {}, under the {minimum} minimum: no framing line leaves \
                 it and its neighbours all at least the minimum (laid as it is)",
                (units.position)(from_m),
                (units.position)(to_m),
                (units.size)(length_m)
            ),
            LayoutChange::NarrowTopCourse { width_m } => format!(
                "the top course is {} wide up the slope, under the {minimum} minimum; rip the first \
                 course to widen it (deck.first_course_width_{})",
                (units.size)(width_m),
                units.key_unit
            ),
            LayoutChange::Sliver { line, width_m } => format!(
                "a {} sliver between a hip or valley cut and line {line} is carried by the line as a \
                 short cantilever (under {}: not spanned to the hip or valley rafter)",
                (units.size)(width_m),
                (units.size)(SLIVER_M)
            ),
        }
    }
}

/// SI words: positions in m to the millimetre, sizes in mm.
pub fn si_words(change: &LayoutChange, course_index: usize, min_piece_m: f64) -> String {
    let position = |m: f64| format!("{m:.3} m");
    let size = |m: f64| format!("{:.0} mm", m * 1000.0);
    let units = LengthWords {
        position: &position,
        size: &size,
        key_unit: "mm",
    };
    format!(
        "course {}: {}",
        course_index + 1,
        change.words(min_piece_m, &units)
    )
}
