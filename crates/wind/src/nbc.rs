//! NBC 2020 Part 4, 4.1.7 for low buildings (4.1.7.6): p = I_w q C_e C_t C_g C_p, limit states.

use crate::basis::{edge_width_m, Factor, PressureBasis, StandardBasis};
use crate::coefficients::{table, Edition};
use crate::error::WindError;
use crate::types::{Importance, NbcWind, RoofShape, Terrain};
use crate::zone_maps::{figure, figure_for_slope};
use deckhold_core::limits;

/// Low-building height limit, m (NBC 2020 4.1.7.6.(1), checked against the clause text on codeindex.ca).
const LOW_BUILDING_MAX_M: f64 = 20.0;

/// Exposure factor C_e at a reference height (NBC 2020 4.1.7.3, from memory).
pub(crate) fn exposure_factor(terrain: Terrain, height_m: f64) -> f64 {
    match terrain {
        Terrain::Open => (height_m / 10.0).powf(0.2).max(0.9),
        Terrain::Rough => (0.7 * (height_m / 12.0).powf(0.3)).max(0.7),
    }
}

/// Monoslope roofs up to this slope use Figure 4.1.7.6.-C, steeper ones Figure 4.1.7.6.-G (4.1.7.6.(8),
/// checked against the clause text on codeindex.ca), deg.
const MONOSLOPE_FROM_DEG: f64 = 3.0;

/// The NBC part of an analysis.
pub(crate) fn basis(
    site: &NbcWind,
    mean_height_m: f64,
    least_dimension_m: f64,
    shape: RoofShape,
    slope_deg: f64,
    dead_load_kpa: f64,
) -> Result<StandardBasis, WindError> {
    limits::Q50_KPA.check("wind.q50_kpa", site.q50_kpa)?;
    limits::TOPOGRAPHIC_FACTOR.check("wind.topographic_factor", site.topographic_factor)?;
    if !(1..=3).contains(&site.internal_category) {
        return Err(WindError::range(
            "wind.internal_category",
            format!(
                "{} is outside 1..3 (NBC 2020 4.1.7.7)",
                site.internal_category
            ),
        ));
    }
    if mean_height_m > LOW_BUILDING_MAX_M {
        return Err(WindError::unsupported(
            "building.eave_height_m",
            format!(
                "mean roof height {mean_height_m:.2} m is over the low-building limit of 20 m (NBC 2020 4.1.7.6)"
            ),
        ));
    }
    if mean_height_m >= least_dimension_m {
        return Err(WindError::unsupported(
            "building.eave_height_m",
            format!(
                "mean roof height {mean_height_m:.2} m must be less than the least horizontal dimension {least_dimension_m:.2} m (NBC 2020 4.1.7.6)"
            ),
        ));
    }
    let data = table(Edition::Nbc2020)?;
    let importance_key = match site.importance {
        Importance::Low => "I_w.low",
        Importance::Normal => "I_w.normal",
        Importance::High => "I_w.high",
        Importance::PostDisaster => "I_w.post_disaster",
    };
    let (i_w, i_w_source) = data.constant(importance_key)?;
    let (min_height_m, min_height_source) = data.constant("C_e.reference_height_min_m")?;
    let reference_height_m = mean_height_m.max(min_height_m);
    let c_e = exposure_factor(site.terrain, reference_height_m);
    let c_t = site.topographic_factor;
    let (c_gi, c_gi_source) = data.constant("C_gi")?;
    let (c_pi, c_pi_source) =
        data.constant(&format!("C_pi.max.category_{}", site.internal_category))?;
    let (wind_factor, wind_source) = data.constant("wind_load_factor")?;
    let (dead_factor, dead_source) = data.constant("dead_load_factor")?;
    let q_kpa = site.q50_kpa * c_e * c_t;
    let reference_kpa = i_w * q_kpa;
    let sloped = slope_deg > 7.0 && matches!(shape, RoofShape::Gable | RoofShape::Hip);
    // The band's figure by the standard's boundary rule (4.1.7.6.(4) and (6); upper bound included).
    let monoslope = shape == RoofShape::Monoslope && slope_deg > MONOSLOPE_FROM_DEG;
    let slope_set = if monoslope {
        figure_for_slope(&data.figures, "mono-", slope_deg, &data.edition)?
            .set
            .clone()
    } else if sloped {
        figure_for_slope(&data.figures, "gable-hip-", slope_deg, &data.edition)?
            .set
            .clone()
    } else {
        "slope-0-7".to_string()
    };
    let edge = edge_width_m(least_dimension_m, mean_height_m, 1.0);
    let terrain_formula = match site.terrain {
        Terrain::Open => "(h/10)^0.2 >= 0.9",
        Terrain::Rough => "0.7 (h/12)^0.3 >= 0.7",
    };
    let factors = vec![
        Factor::new("q50_kpa", site.q50_kpa, "NBC 2020 Appendix C (site input)"),
        Factor::new("I_w", i_w, i_w_source),
        Factor::new("h_ref_m", reference_height_m, min_height_source),
        Factor::new("C_e", c_e, format!("NBC 2020 4.1.7.3, C_e = {terrain_formula} (from memory, NBC 2020)")),
        Factor::new("C_t", c_t, "NBC 2020 4.1.7.4 (site input)"),
        Factor::new("C_gi", c_gi, c_gi_source),
        Factor::new("C_pi", c_pi, c_pi_source),
        Factor::new("edge_width_m", edge, "NBC 2020 Figure 4.1.7.6.-C/-E notes: z = min(0.1 D, 0.4 H) >= max(0.04 D, 1 m) (from memory, NBC 2020)"),
        Factor::new("wind_load_factor", wind_factor, wind_source),
        Factor::new("dead_load_factor", dead_factor, dead_source),
    ];
    let mut data_warnings = vec![
        "NBC 2020 C_pC_g curves are from memory; check them against the printed Figures 4.1.7.6.-C and -E or override them".to_string(),
    ];
    let warnings = Vec::new();
    if monoslope {
        data_warnings.push("NBC 2020 monoslope roofs (Figure 4.1.7.6.-G): its values could not be recalled or confirmed; each zone takes the more severe of the Figure 4.1.7.6.-C row and the sloped-roof reading (a stand-in), on a zone map from memory with the high eave zoned apart; check against the printed figure or override them (--coefficients)".to_string());
    }
    if sloped {
        data_warnings.push("NBC 2020 Figure 4.1.7.6.-E (sloped roofs): two readings differ and neither is confirmed; the more severe is used (corner / edge / interior -5.0 / -3.6 / -2.5, held at all areas, against -3.8 / -2.5 / -1.3 from memory)".to_string());
    }
    // The figure of the band decides which strips the layout draws (zone_maps.rs).
    let band_figure = figure(&data.figures, &slope_set, &data.edition)?;
    let strips = band_figure.strips(shape, edge);
    let zone_map = band_figure.summary();
    Ok(StandardBasis {
        edition: Edition::Nbc2020,
        pressure: PressureBasis {
            external_reference_kpa: reference_kpa,
            internal_reference_kpa: reference_kpa,
            cp_int: c_pi * c_gi,
            wind_load_factor: wind_factor,
            dead_load_factor: dead_factor,
            minimum_kpa: None,
            dead_load_kpa,
            cos_slope: slope_deg.to_radians().cos(),
        },
        q_kpa,
        strips,
        zone_map,
        slope_set,
        slope_blend: None,
        factors,
        warnings,
        data_warnings,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn site() -> NbcWind {
        NbcWind {
            q50_kpa: 0.5,
            terrain: Terrain::Open,
            topographic_factor: 1.0,
            importance: Importance::Normal,
            internal_category: 2,
        }
    }

    #[test]
    fn exposure_factor_values() {
        // NBC 2020 4.1.7.3, from memory: open (h/10)^0.2 >= 0.9, rough 0.7 (h/12)^0.3 >= 0.7.
        assert_relative_eq!(exposure_factor(Terrain::Open, 10.0), 1.0);
        assert_relative_eq!(exposure_factor(Terrain::Open, 3.0), 0.9);
        assert_relative_eq!(
            exposure_factor(Terrain::Open, 20.0),
            2f64.powf(0.2),
            max_relative = 1e-12
        );
        assert_relative_eq!(exposure_factor(Terrain::Rough, 6.0), 0.7);
        assert_relative_eq!(
            exposure_factor(Terrain::Rough, 24.0),
            0.7 * 2f64.powf(0.3),
            max_relative = 1e-12
        );
    }

    #[test]
    fn too_tall_names_the_field() {
        let error = basis(&site(), 25.0, 40.0, RoofShape::Gable, 20.0, 0.5).expect_err("tall");
        let text = error.to_string();
        assert!(text.starts_with("building.eave_height_m"), "{text}");
        assert!(text.contains("20 m"), "{text}");
        let error = basis(&site(), 9.0, 8.0, RoofShape::Gable, 20.0, 0.5).expect_err("slender");
        assert!(error.to_string().starts_with("building.eave_height_m"));
    }

    #[test]
    fn internal_pressure_category_two() {
        // NBC 2020 4.1.7.7, from memory: category 2 C_pi up to +0.3, C_gi = 2.0.
        let result = basis(&site(), 5.0, 10.0, RoofShape::Gable, 20.0, 0.5).expect("basis");
        assert_relative_eq!(result.pressure.cp_int, 0.6);
        // q C_e with h_ref = 6 m (open terrain): 0.5 × 0.6^0.2.
        assert_relative_eq!(result.q_kpa, 0.5 * 0.6f64.powf(0.2), max_relative = 1e-12);
        assert_eq!(result.slope_set, "gable-hip-7-27");
        assert!(result
            .data_warnings
            .iter()
            .any(|w| w.contains("more severe")));
    }

    #[test]
    fn importance_factor_cites_table_4_1_7_3() {
        // NBC 2020 Table 4.1.7.3 (I_w for wind, ULS; from memory): normal 1.0, high 1.15.
        let result = basis(&site(), 5.0, 10.0, RoofShape::Gable, 20.0, 0.5).expect("basis");
        let i_w = result
            .factors
            .iter()
            .find(|f| f.name == "I_w")
            .expect("I_w");
        assert!(i_w.source.contains("Table 4.1.7.3"), "{}", i_w.source);
    }

    #[test]
    fn bad_category_is_refused() {
        let mut bad = site();
        bad.internal_category = 4;
        let error = basis(&bad, 5.0, 10.0, RoofShape::Flat, 0.0, 0.5).expect_err("category");
        assert!(error.to_string().starts_with("wind.internal_category"));
    }
}
