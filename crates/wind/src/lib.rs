//! Roof components-and-cladding wind zones and uplift pressures, NBC 2020 Part 4 (4.1.7.6, low
//! buildings) and ASCE 7-22 Chapter 30 Part 1. Pure functions: typed inputs, typed results, SI inside.
//!
//! [`analyze`] lays out the zones in plan and fixes the velocity pressure; [`WindAnalysis::uplift`]
//! evaluates the factored net uplift of a zone at an effective wind area.

mod analysis;
mod asce;
mod basis;
mod coefficients;
mod edges;
mod error;
mod geometry;
mod nbc;
mod outline;
mod pitched_zones;
mod rectangle_zones;
mod roof;
mod types;
mod uplift;
mod user_table;
mod zone_maps;
mod zones;

pub use analysis::{analyze, RoofPlane, WindAnalysis, Zone};
pub use basis::{Factor, PressureBasis};
pub use coefficients::{coefficient_rows, CoefficientRow, ZoneCurve};
pub use deckhold_core::{RoofShape, ZoneKind};
pub use edges::{EdgeKind, PlaneEdge};
pub use error::WindError;
pub use types::{
    AsceWind, Building, CoefficientTable, CurveOverride, CurvePoint, Enclosure, Exposure,
    Footprint, Importance, NbcWind, RidgeAlong, Roof, SiteWind, StrengthMethod, TableRow, Terrain,
    WindInput,
};
pub use uplift::Uplift;
pub use user_table::{coefficient_table_template, parse_coefficient_table};
pub use zone_maps::CoefficientStatus;
