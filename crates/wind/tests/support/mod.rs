//! The sites and the building the wind crate's integration tests share.

use deckhold_wind::{
    AsceWind, Building, Enclosure, Exposure, Footprint, Importance, NbcWind, RidgeAlong, Roof,
    RoofShape, SiteWind, StrengthMethod, Terrain, WindInput,
};

pub fn nbc() -> SiteWind {
    SiteWind::Nbc2020(NbcWind {
        q50_kpa: 0.45,
        terrain: Terrain::Open,
        topographic_factor: 1.0,
        importance: Importance::Normal,
        internal_category: 2,
    })
}

pub fn asce() -> SiteWind {
    SiteWind::Asce722(AsceWind {
        speed_mph: 120.0,
        exposure: Exposure::C,
        kzt: 1.0,
        ground_elevation_ft: 0.0,
        enclosure: Enclosure::Enclosed,
        method: StrengthMethod::Asd,
    })
}

/// A 14 x 9 m building, no overhangs.
pub fn input(shape: RoofShape, slope_deg: f64, eave_height_m: f64, site: SiteWind) -> WindInput {
    WindInput {
        building: Building {
            footprint: Footprint::Rectangle {
                length_m: 14.0,
                width_m: 9.0,
            },
            eave_height_m,
        },
        roof: Roof {
            shape,
            slope_deg,
            ridge_along: RidgeAlong::Length,
            eave_overhang_mm: 0.0,
            rake_overhang_mm: 0.0,
            dead_load_kpa: 0.4,
            gable_walls: Vec::new(),
        },
        site,
        overrides: Vec::new(),
        table: None,
    }
}
