//! "Values used": after the keys the user wrote with the values as written ([`crate::as_written`]), the
//! design basis shows the values the tool derived from them, in the report's units. A plan checker reads
//! the first against the drawings and the second against the method.

use crate::project::{EdgeBlocking, Project, StaggerChoice};
use deckhold_model::format::{
    fixed, plan_length_label, pressure_label, small_length_label, spacing_label, thickness_label,
};
use deckhold_model::InputRow;
use deckhold_wind::Footprint;

/// The values the tool used, derived from the inputs (defaults filled in, slopes in degrees), in the
/// report's units.
pub fn derived_rows(project: &Project) -> Vec<InputRow> {
    let us = project.units.is_us();
    let row = |key: &str, value: String| InputRow {
        key: key.to_string(),
        value,
    };
    let wind = &project.wind;
    let mut rows = Vec::new();
    match &wind.building.footprint {
        Footprint::Rectangle { length_m, width_m } => {
            rows.push(row("building length", plan_length_label(*length_m, us)));
            rows.push(row("building width", plan_length_label(*width_m, us)));
        }
        Footprint::Polygon { vertices_m } => {
            rows.push(row(
                "building outline",
                format!("{} corners", vertices_m.len()),
            ));
        }
    }
    rows.push(row(
        "eave height",
        plan_length_label(wind.building.eave_height_m, us),
    ));
    rows.push(row(
        "roof slope",
        format!("{} deg", fixed(wind.roof.slope_deg, 1)),
    ));
    rows.push(row(
        "eave overhang",
        plan_length_label(wind.roof.eave_overhang_mm / 1000.0, us),
    ));
    rows.push(row(
        "rake overhang",
        plan_length_label(wind.roof.rake_overhang_mm / 1000.0, us),
    ));
    rows.push(row(
        "roof dead load",
        pressure_label(wind.roof.dead_load_kpa, us),
    ));
    let framing = &project.framing;
    rows.push(row(
        "framing spacing",
        format!("{} o.c.", spacing_label(Some(framing.spacing_mm), us)),
    ));
    rows.push(row(
        "member face x depth",
        format!(
            "{} x {}",
            small_length_label(framing.member_width_mm, us),
            small_length_label(framing.member_depth_mm, us)
        ),
    ));
    rows.push(row("toe-nailed", framing.toe_nailed.to_string()));
    let deck = &project.deck;
    rows.push(row(
        "deck thickness",
        thickness_label(deck.thickness_mm, us),
    ));
    rows.push(row(
        "panel size",
        format!(
            "{} x {}",
            plan_length_label(deck.panel_width_mm / 1000.0, us),
            plan_length_label(deck.panel_length_mm / 1000.0, us)
        ),
    ));
    let stagger = match deck.stagger {
        StaggerChoice::Half => "half a panel".to_string(),
        StaggerChoice::None => "none".to_string(),
        StaggerChoice::OffsetMm(offset_mm) => plan_length_label(offset_mm / 1000.0, us),
    };
    rows.push(row("end-joint stagger", stagger));
    // Listed only when asked for, so projects without it read as before.
    if deck.blocking == EdgeBlocking::CourseJoints {
        rows.push(row("blocking", "under every course joint".to_string()));
    }
    rows.push(row(
        "layer between deck and framing",
        small_length_label(deck.between_mm, us),
    ));
    rows.push(row("wet service", deck.wet_service.to_string()));
    rows.push(row("treated framing", deck.treated.to_string()));
    rows.push(row("candidate nails", project.nails.join(", ")));
    rows
}
