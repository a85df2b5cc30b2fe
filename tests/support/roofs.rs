//! Pitched roofs on random L, T, U and Z outlines (and rectangles), laid out the way a user's project
//! is: the shared roof of the polygon property tests (`tests/polygon_*_properties.rs`).

use crate::fixture_text;
use crate::outlines::rectilinear_outline;
use deckhold_deck::layout::DeckLayout;
use deckhold_project::job::deck_layout;
use deckhold_project::parse_project;
use deckhold_wind::WindAnalysis;
use proptest::prelude::*;
use serde_json::{json, Value};

/// A roof to frame: a random outline with a hip or gable roof, or a rectangle of any shape.
#[derive(Debug, Clone)]
pub struct Roof {
    pub footprint: Value,
    pub shape: &'static str,
    pub slope_deg: f64,
    pub spacing_mm: f64,
    pub eave_mm: f64,
    pub rake_mm: f64,
}

/// Slope from 2:12 to 12:12 for pitched roofs; flat and monoslope roofs within their own ranges.
pub fn slope_for(shape: &str, unit: f64) -> f64 {
    match shape {
        "flat" => 7.0 * unit,
        "monoslope" => 3.0 * unit,
        _ => (2.0 + 10.0 * unit).atan2(12.0).to_degrees(),
    }
}

/// Hip and gable roofs on random rectilinear outlines of 4 to 12 corners, framing 300-1220 mm,
/// overhangs 0-900 mm.
pub fn polygon_roofs() -> impl Strategy<Value = Roof> {
    (
        rectilinear_outline(),
        prop_oneof![Just("hip"), Just("gable")],
        0.0f64..1.0,
        300.0f64..1220.0,
        0.0f64..900.0,
        0.0f64..900.0,
    )
        .prop_map(
            |(outline, shape, unit, spacing_mm, eave_mm, rake_mm)| Roof {
                footprint: json!({ "polygon_m": outline }),
                shape,
                slope_deg: slope_for(shape, unit),
                spacing_mm,
                eave_mm,
                rake_mm,
            },
        )
}

/// A roof laid out.
#[derive(Debug)]
pub struct LaidOut {
    pub wind: WindAnalysis,
    pub layout: DeckLayout,
    /// The project's narrowest piece, mm.
    pub min_piece_mm: f64,
}

/// The roof on the L bungalow's wind, framing and deck; None when the reader or the wind method
/// refuses it (a gable running into another wing, a roof higher than the house is wide).
pub fn lay_out(roof: &Roof) -> Option<LaidOut> {
    let mut value: Value =
        serde_json::from_str(&fixture_text("ca-l-hip-bungalow.json")).expect("fixture JSON");
    value["building"]["footprint"] = roof.footprint.clone();
    value["roof"] = json!({
        "shape": roof.shape,
        "slope_deg": roof.slope_deg,
        "ridge_along": "length",
        "eave_overhang_mm": roof.eave_mm,
        "rake_overhang_mm": roof.rake_mm,
        "dead_load_kpa": 0.5
    });
    if matches!(roof.shape, "hip" | "flat") {
        let block = value["roof"].as_object_mut().expect("roof block");
        block.remove("rake_overhang_mm");
        block.remove("ridge_along");
    }
    value["framing"]["spacing_mm"] = json!(roof.spacing_mm);
    let project = parse_project(&value.to_string()).ok()?;
    let wind = deckhold_wind::analyze(&project.wind).ok()?;
    let layout = deck_layout(&project, &wind).expect("a roof the wind method takes is laid out");
    Some(LaidOut {
        wind,
        layout,
        min_piece_mm: project.deck.min_piece_mm,
    })
}
