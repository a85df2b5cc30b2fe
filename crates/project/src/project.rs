//! The validated project: everything the job needs, typed and in SI units.

use crate::basis::Basis;
use deckhold_core::ZoneKind;
pub use deckhold_deck::layout::{EdgeBlocking, StartCorner};
use deckhold_fasten::{FastenError, Nail};
use deckhold_model::{ProjectInfo, Units};
use deckhold_wind::WindInput;

/// Which way the framing lines run in plan, when the user overrides the roof's natural direction.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LinesAlong {
    /// Parallel to the building length (plan x).
    Length,
    /// Parallel to the building width (plan y).
    Width,
}

/// The kind of member the sheathing is nailed to.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MemberRole {
    Rafter,
    Truss,
    Joist,
    Clt,
}

impl MemberRole {
    pub fn as_str(self) -> &'static str {
        match self {
            MemberRole::Rafter => "rafter",
            MemberRole::Truss => "truss",
            MemberRole::Joist => "joist",
            MemberRole::Clt => "clt",
        }
    }
}

/// The framing under the deck.
#[derive(Debug, Clone, PartialEq)]
pub struct Framing {
    pub spacing_mm: f64,
    pub species_id: String,
    pub member: MemberRole,
    /// Width of the face the nails go into (edge distance).
    pub member_width_mm: f64,
    /// Depth of the member along the nail (the nail must not exit it).
    pub member_depth_mm: f64,
    pub lines_along: Option<LinesAlong>,
    pub toe_nailed: bool,
}

/// How the panels of one course are offset from the course below.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum StaggerChoice {
    Half,
    None,
    OffsetMm(f64),
}

/// The roof deck (the side member the nails pass through).
#[derive(Debug, Clone, PartialEq)]
pub struct Deck {
    pub panel_id: String,
    pub thickness_mm: f64,
    pub panel_length_mm: f64,
    pub panel_width_mm: f64,
    pub stagger: StaggerChoice,
    /// Narrowest cut piece laid across the framing, mm (`deck.min_piece_mm`).
    pub min_piece_mm: f64,
    /// Blocking under the panel edges (`deck.blocking`).
    pub blocking: EdgeBlocking,
    /// The eave corner panel laying starts from (`deck.start_corner`).
    pub start_corner: StartCorner,
    /// Width of the first course, mm (`deck.first_course_width_mm`; the panel width unless ripped).
    pub first_course_width_mm: f64,
    /// Length of the first panel of each course that starts with a whole panel, mm
    /// (`deck.first_panel_length_mm`; the panel length unless cut).
    pub first_panel_length_mm: f64,
    pub wet_service: bool,
    pub treated: bool,
    /// Anything between deck and framing (e.g. an existing board deck in a re-roof), mm.
    pub between_mm: f64,
}

/// Spacings of an existing or proposed pattern, for one zone or for all.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PatternSpacing {
    pub edge_spacing_mm: f64,
    pub intermediate_spacing_mm: f64,
}

/// The pattern a plan check judges.
#[derive(Debug, Clone, PartialEq)]
pub struct ExistingPattern {
    pub nail_id: String,
    pub all_zones: PatternSpacing,
    /// Per-zone overrides by zone kind.
    pub by_zone: Vec<(ZoneKind, PatternSpacing)>,
    /// Share of the existing fasteners' resistance that may be counted, 0..1 (1 sound, 0 unknown or
    /// corroded).
    pub credit: f64,
}

impl ExistingPattern {
    /// The spacings that apply in a zone.
    pub fn for_zone(&self, kind: ZoneKind) -> PatternSpacing {
        self.by_zone
            .iter()
            .find(|(zone, _)| *zone == kind)
            .map(|(_, spacing)| *spacing)
            .unwrap_or(self.all_zones)
    }
}

/// One whole project, validated.
#[derive(Debug, Clone)]
pub struct Project {
    pub info: ProjectInfo,
    pub basis: Basis,
    pub wind: WindInput,
    pub framing: Framing,
    pub deck: Deck,
    /// Candidate nail ids, in order of preference.
    pub nails: Vec<String>,
    pub existing: Option<ExistingPattern>,
    /// Units of every output: the basis's customary units unless the user chose others (`--units`).
    pub units: Units,
    /// Every key the user wrote with its value as written (units and digits), for "Inputs as given".
    pub as_written: crate::as_written::AsWritten,
    /// Fasteners stated in the project file, used by id like catalog ones.
    pub fasteners: Vec<Nail>,
    /// `coefficients`: the user's coefficient table file as written (relative to the project file).
    /// The binary reads it into `wind.table`; a job refuses to run while it is unread.
    pub coefficients_file: Option<String>,
}

impl Project {
    /// The fastener with this id: one stated in the project, else the catalog's (the error lists close
    /// ids from both).
    pub fn fastener(&self, id: &str) -> Result<&Nail, FastenError> {
        if let Some(stated) = self.fasteners.iter().find(|nail| nail.id == id) {
            return Ok(stated);
        }
        deckhold_fasten::nail(id).map_err(|error| match error {
            FastenError::UnknownId { kind, id, close } if !self.fasteners.is_empty() => {
                let mut close = close;
                close.extend(deckhold_fasten::catalog::close_ids(
                    &id,
                    self.fasteners.iter().map(|nail| nail.id.as_str()),
                ));
                FastenError::UnknownId { kind, id, close }
            }
            other => other,
        })
    }
}
