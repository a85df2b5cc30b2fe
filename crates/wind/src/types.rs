//! The inputs of a wind analysis: building, roof, site wind and coefficient overrides (SI inside).

pub use deckhold_core::RoofShape;
use serde::{Deserialize, Serialize};

/// Plan shape of the wall line, metres. A rectangle has its length along plan x.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum Footprint {
    Rectangle {
        length_m: f64,
        width_m: f64,
    },
    /// A rectilinear (axis-aligned) simple polygon, either orientation.
    Polygon {
        vertices_m: Vec<[f64; 2]>,
    },
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Building {
    pub footprint: Footprint,
    pub eave_height_m: f64,
}

/// Direction of the ridge in plan. `Length` = ridge parallel to plan x (the rectangle's `length_m`).
/// For monoslope and flat roofs it names the direction of the level edges (the eaves).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum RidgeAlong {
    Length,
    Width,
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Roof {
    pub shape: RoofShape,
    pub slope_deg: f64,
    pub ridge_along: RidgeAlong,
    pub eave_overhang_mm: f64,
    pub rake_overhang_mm: f64,
    pub dead_load_kpa: f64,
    /// Gable roofs on a polygon footprint: the walls that are gable ends, numbered as the footprint's
    /// corners are written (wall i runs from corner i to corner i + 1). Empty: found from the
    /// outline (each wing's narrow end).
    pub gable_walls: Vec<usize>,
}

/// NBC 2020 4.1.7.3 terrain for the exposure factor C_e.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Terrain {
    Open,
    Rough,
}

/// NBC 2020 Table 4.1.2.1 importance category.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Importance {
    Low,
    Normal,
    High,
    PostDisaster,
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NbcWind {
    /// Reference velocity pressure, 1-in-50-year, kPa (NBC 2020 Appendix C).
    pub q50_kpa: f64,
    pub terrain: Terrain,
    /// C_t, NBC 2020 4.1.7.4; 1.0 on flat terrain.
    pub topographic_factor: f64,
    pub importance: Importance,
    /// NBC 2020 4.1.7.7 internal pressure category 1, 2 or 3.
    pub internal_category: u8,
}

/// ASCE 7-22 26.7 exposure category.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Exposure {
    B,
    C,
    D,
}

/// ASCE 7-22 26.12 enclosure classification.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Enclosure {
    Enclosed,
    PartiallyEnclosed,
    PartiallyOpen,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum StrengthMethod {
    Asd,
    Lrfd,
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct AsceWind {
    /// Basic wind speed V (strength level, 3-s gust at 33 ft), mph; imperial at the edge by the standard's own unit.
    pub speed_mph: f64,
    pub exposure: Exposure,
    pub kzt: f64,
    pub ground_elevation_ft: f64,
    pub enclosure: Enclosure,
    pub method: StrengthMethod,
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum SiteWind {
    Nbc2020(NbcWind),
    Asce722(AsceWind),
}

/// One point of an external-coefficient curve: effective wind area (m²) and coefficient.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CurvePoint {
    pub area_m2: f64,
    pub coefficient: f64,
}

/// A user's replacement for the built-in curve of one code zone, with where it comes from.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CurveOverride {
    pub code_zone: String,
    pub points: Vec<CurvePoint>,
    pub source: String,
}

/// One row of a user's coefficient table: replaces the built-in row of the same set and region.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct TableRow {
    pub set: String,
    pub region: String,
    pub code_zone: String,
    pub figure: String,
    pub points: Vec<CurvePoint>,
}

/// A user's coefficient table (`--coefficients FILE`), parsed by `parse_coefficient_table`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CoefficientTable {
    /// The file as the user named it, for the reports.
    pub file: String,
    /// The edition the rows belong to (`NBC 2020` or `ASCE 7-22`).
    pub edition: String,
    /// Where the values come from, as the user stated it.
    pub source: String,
    pub rows: Vec<TableRow>,
}

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct WindInput {
    pub building: Building,
    pub roof: Roof,
    pub site: SiteWind,
    pub overrides: Vec<CurveOverride>,
    /// The user's own coefficient table, if any: its rows replace the built-in rows they name.
    pub table: Option<CoefficientTable>,
}
