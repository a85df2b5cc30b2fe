//! ASCE 7-22 Chapter 30 Part 1 (low-rise, h <= 60 ft): q_h = 0.00256 K_z K_zt K_e V² psf,
//! p = q_h K_d [(GC_p) - (GC_pi)].

use crate::basis::{edge_width_m, Factor, PressureBasis, SlopeBlend, StandardBasis};
use crate::coefficients::{table, Edition, Table};
use crate::error::WindError;
use crate::types::{AsceWind, Enclosure, Exposure, RoofShape, StrengthMethod};
use crate::zone_maps::{figure, figure_for_slope};
use deckhold_core::limits;
use deckhold_core::units::{KPA_PER_PSF, M_PER_FT};

/// Chapter 30 Part 1 height limit, 60 ft in metres (ASCE 7-22 30.3, from memory).
const LOW_RISE_MAX_M: f64 = 60.0 * M_PER_FT;

fn exposure_key(exposure: Exposure) -> &'static str {
    match exposure {
        Exposure::B => "B",
        Exposure::C => "C",
        Exposure::D => "D",
    }
}

/// Velocity pressure exposure coefficient K_z at height z (ft), with the table's floor height.
pub(crate) fn kz(data: &Table, exposure: Exposure, z_ft: f64) -> Result<(f64, f64), WindError> {
    let key = exposure_key(exposure);
    let (alpha, _) = data.constant(&format!("alpha.{key}"))?;
    let (z_g_ft, _) = data.constant(&format!("z_g_ft.{key}"))?;
    let floor_name = if exposure == Exposure::B {
        "K_z.min_height_ft.B"
    } else {
        "K_z.min_height_ft"
    };
    let (floor_ft, _) = data.constant(floor_name)?;
    let z_used_ft = z_ft.max(floor_ft);
    Ok((2.41 * (z_used_ft / z_g_ft).powf(2.0 / alpha), z_used_ft))
}

/// Ground elevation factor K_e (ASCE 7-22 Table 26.9-1 note, from memory).
pub(crate) fn ke(ground_elevation_ft: f64) -> f64 {
    (-0.000_036_2 * ground_elevation_ft).exp()
}

/// Velocity pressure q_h, psf (ASCE 7-22 Eq. 26.10-1).
pub(crate) fn qh_psf(k_z: f64, k_zt: f64, k_e: f64, speed_mph: f64) -> f64 {
    0.00256 * k_z * k_zt * k_e * speed_mph * speed_mph
}

/// The ASCE part of an analysis.
pub(crate) fn basis(
    site: &AsceWind,
    mean_height_m: f64,
    least_dimension_m: f64,
    shape: RoofShape,
    slope_deg: f64,
    dead_load_kpa: f64,
) -> Result<StandardBasis, WindError> {
    limits::SPEED_MPH.check("wind.speed_mph", site.speed_mph)?;
    limits::KZT.check("wind.kzt", site.kzt)?;
    limits::GROUND_ELEVATION_M.check_scaled(
        "wind.ground_elevation_ft",
        site.ground_elevation_ft,
        M_PER_FT,
        "ft",
    )?;
    if mean_height_m > LOW_RISE_MAX_M + 1e-9 {
        return Err(WindError::unsupported(
            "building.eave_height_m",
            format!(
                "mean roof height {mean_height_m:.2} m is over the low-rise limit of 60 ft (18.29 m) (ASCE 7-22 30.3)"
            ),
        ));
    }
    if mean_height_m > least_dimension_m {
        return Err(WindError::unsupported(
            "building.eave_height_m",
            format!(
                "mean roof height {mean_height_m:.2} m is over the least horizontal dimension {least_dimension_m:.2} m (ASCE 7-22 26.2, low-rise building)"
            ),
        ));
    }
    let data = table(Edition::Asce722)?;
    let height_ft = mean_height_m / M_PER_FT;
    let (k_z, z_used_ft) = kz(data, site.exposure, height_ft)?;
    let k_e = ke(site.ground_elevation_ft);
    let q_h_psf = qh_psf(k_z, site.kzt, k_e, site.speed_mph);
    let q_h_kpa = q_h_psf * KPA_PER_PSF;
    let (k_d, k_d_source) = data.constant("K_d")?;
    let enclosure_key = match site.enclosure {
        Enclosure::Enclosed => "GC_pi.enclosed",
        Enclosure::PartiallyEnclosed => "GC_pi.partially_enclosed",
        Enclosure::PartiallyOpen => "GC_pi.partially_open",
    };
    let (gc_pi, gc_pi_source) = data.constant(enclosure_key)?;
    let method_key = match site.method {
        StrengthMethod::Asd => "asd",
        StrengthMethod::Lrfd => "lrfd",
    };
    let (wind_factor, wind_source) = data.constant(&format!("wind_load_factor.{method_key}"))?;
    let (dead_factor, dead_source) = data.constant(&format!("dead_load_factor.{method_key}"))?;
    let (minimum_kpa, minimum_source) = data.constant("minimum_pressure_kpa")?;
    let sloped = slope_deg > 7.0 && matches!(shape, RoofShape::Gable | RoofShape::Hip);
    let monoslope = shape == RoofShape::Monoslope && slope_deg > MONOSLOPE_FROM_DEG;
    let (slope_set, edge, edge_source) = if monoslope {
        // Figures 30.3-5A and 5B by the standard's band rule (upper bound included).
        let banded = figure_for_slope(&data.figures, "mono-", slope_deg, &data.edition)?;
        (
            banded.set.clone(),
            edge_width_m(least_dimension_m, mean_height_m, 3.0 * M_PER_FT),
            "ASCE 7-22 Figures 30.3-5A and 30.3-5B notes: a = min(0.1 D, 0.4 h) >= max(0.04 D, 3 ft) (from memory)",
        )
    } else if !sloped {
        (
            "slope-0-7".to_string(),
            0.6 * mean_height_m,
            "ASCE 7-22 Figure 30.3-2A: zone 2 strip 0.6 h; corner zone 3 taken as the 0.6 h square (from memory, conservative)",
        )
    } else {
        let prefix = if shape == RoofShape::Gable {
            "gable-"
        } else {
            "hip-"
        };
        // The band's figure by the standard's boundary rule (upper bound included); hip roofs over
        // 27 deg start from the 20-27 deg curves and blend into the 45 deg figure (`hip_blend`).
        let banded = figure_for_slope(&data.figures, prefix, slope_deg, &data.edition)?;
        let set = if banded.set == "hip-45" {
            "hip-20-27".to_string()
        } else {
            banded.set.clone()
        };
        (
            set,
            edge_width_m(least_dimension_m, mean_height_m, 3.0 * M_PER_FT),
            "ASCE 7-22 Figures 30.3-2B..G notes: a = min(0.1 D, 0.4 h) >= max(0.04 D, 3 ft) (from memory)",
        )
    };
    let key = exposure_key(site.exposure);
    let factors = vec![
        Factor::new("V_mph", site.speed_mph, "ASCE 7-22 26.5 (site input)"),
        Factor::new("z_ft", z_used_ft, "ASCE 7-22 Table 26.10-1: K_z at mean roof height, floor 15 ft (30 ft in Exposure B, conservative) (from memory)"),
        Factor::new("K_z", k_z, format!("ASCE 7-22 Table 26.10-1, K_z = 2.41 (z/z_g)^(2/alpha), Exposure {key}, constants Table 26.11-1 (from memory, ASCE 7-22)")),
        Factor::new("K_zt", site.kzt, "ASCE 7-22 26.8 (site input)"),
        Factor::new("K_e", k_e, "ASCE 7-22 Table 26.9-1, K_e = exp(-0.0000362 z_g) (from memory, ASCE 7-22)"),
        Factor::new("q_h_psf", q_h_psf, "ASCE 7-22 Eq. 26.10-1, q_h = 0.00256 K_z K_zt K_e V^2"),
        Factor::new("K_d", k_d, k_d_source),
        Factor::new("GC_pi", gc_pi, gc_pi_source),
        Factor::new("edge_width_m", edge, edge_source),
        Factor::new("minimum_pressure_kpa", minimum_kpa, minimum_source),
        Factor::new("wind_load_factor", wind_factor, wind_source),
        Factor::new("dead_load_factor", dead_factor, dead_source),
    ];
    let mut data_warnings = vec![
        "ASCE 7-22 GC_p curves are from memory or the more severe of two unconfirmed readings (severe-of-two: low-slope zone 2, gable 27-45 zone 3, hip 7-20 zones 1 and 2); check them against the printed Figure 30.3-2 series or override them".to_string(),
    ];
    let mut warnings = Vec::new();
    if sloped && shape == RoofShape::Hip {
        warnings.push("ASCE 7-22 hip roofs: zone 3 is taken along every eave, not only at the corners (the more severe of two unconfirmed readings of the 7-22 hip zone map)".to_string());
    }
    if monoslope {
        data_warnings.push("ASCE 7-22 monoslope roofs (Figures 30.3-5A and 30.3-5B): coefficients are the more severe of the figure as recalled and the rows that apply at the band's lower boundary; the zone map is from memory, with the high-eave corners taken at their larger recalled extent; check them against the printed figures or override them (--coefficients)".to_string());
    }
    if !sloped && !monoslope {
        warnings.push("ASCE 7-22 Figure 30.3-2A: zone 1' is taken as zone 1 and the corner zone 3 as the full 0.6 h square (conservative simplification)".to_string());
    }
    let reference_kpa = q_h_kpa * k_d;
    // The figure of the band decides which strips the layout draws (zone_maps.rs).
    let band_figure = figure(&data.figures, &slope_set, &data.edition)?;
    let strips = band_figure.strips(shape, edge);
    let zone_map = band_figure.summary();
    Ok(StandardBasis {
        edition: Edition::Asce722,
        pressure: PressureBasis {
            external_reference_kpa: reference_kpa,
            internal_reference_kpa: reference_kpa,
            cp_int: gc_pi,
            wind_load_factor: wind_factor,
            dead_load_factor: dead_factor,
            minimum_kpa: Some(minimum_kpa),
            dead_load_kpa,
            cos_slope: slope_deg.to_radians().cos(),
        },
        q_kpa: q_h_kpa,
        strips,
        zone_map,
        slope_set,
        slope_blend: hip_blend(shape, slope_deg),
        factors,
        warnings,
        data_warnings,
    })
}

/// Monoslope roofs up to this slope use the low-slope figure 30.3-2A; steeper ones the monoslope
/// figures (ASCE 7-22 Figure 30.3-5A note, from memory), deg.
const MONOSLOPE_FROM_DEG: f64 = 3.0;

/// Lowest and highest slope of the hip band that interpolates to the 45 deg figure, deg.
const HIP_BLEND_FROM_DEG: f64 = 27.0;
const HIP_BLEND_TO_DEG: f64 = 45.0;

/// ASCE 7-22 hip roofs over 27 deg (from memory, as read in the STRUCTURE article on the 7-22 C&C
/// changes): the 45 deg curves, interpolated linearly by slope from the 20-27 deg values at 27 deg.
fn hip_blend(shape: RoofShape, slope_deg: f64) -> Option<SlopeBlend> {
    (shape == RoofShape::Hip && slope_deg > HIP_BLEND_FROM_DEG).then(|| SlopeBlend {
        upper_set: "hip-45".to_string(),
        fraction: (slope_deg - HIP_BLEND_FROM_DEG) / (HIP_BLEND_TO_DEG - HIP_BLEND_FROM_DEG),
        rule: format!(
            "ASCE 7-22 hip roofs 27-45 deg: linear in slope between the 20-27 deg curves at 27 deg and the 45 deg curves ({slope_deg:.1} deg) (from memory)"
        ),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn data() -> &'static Table {
        table(Edition::Asce722).expect("table")
    }

    #[test]
    fn kz_matches_table_26_10_1() {
        // ASCE 7-22 Table 26.10-1, from memory: Exposure C 0.85 at 15 ft, 0.98 at 30 ft;
        // Exposure B 0.70 at 30 ft; Exposure D 1.03 at 15 ft.
        let (c15, _) = kz(data(), Exposure::C, 15.0).expect("kz");
        assert_relative_eq!(c15, 0.85, epsilon = 0.01);
        let (c30, _) = kz(data(), Exposure::C, 30.0).expect("kz");
        assert_relative_eq!(c30, 0.98, epsilon = 0.01);
        let (b30, _) = kz(data(), Exposure::B, 30.0).expect("kz");
        assert_relative_eq!(b30, 0.70, epsilon = 0.015);
        let (d15, _) = kz(data(), Exposure::D, 15.0).expect("kz");
        assert_relative_eq!(d15, 1.03, epsilon = 0.01);
        // Below the floor the floor height is used.
        let (c5, z_used) = kz(data(), Exposure::C, 5.0).expect("kz");
        assert_relative_eq!(c5, c15);
        assert_relative_eq!(z_used, 15.0);
    }

    #[test]
    fn ke_at_sea_level_is_one() {
        // ASCE 7-22 Table 26.9-1, from memory: K_e = 1.0 at 0 ft, about 0.96 at 1000 ft.
        assert_relative_eq!(ke(0.0), 1.0);
        assert_relative_eq!(ke(1000.0), 0.96, epsilon = 0.005);
    }

    #[test]
    fn qh_hand_calculation() {
        // Hand calculation, ASCE 7-22 Eq. 26.10-1: 0.00256 × 0.85 × 1 × 1 × 140² = 42.6 psf.
        assert_relative_eq!(qh_psf(0.85, 1.0, 1.0, 140.0), 42.65, epsilon = 0.01);
    }

    #[test]
    fn too_tall_is_refused() {
        let site = AsceWind {
            speed_mph: 140.0,
            exposure: Exposure::C,
            kzt: 1.0,
            ground_elevation_ft: 0.0,
            enclosure: Enclosure::Enclosed,
            method: StrengthMethod::Asd,
        };
        let error = basis(&site, 19.0, 40.0, RoofShape::Gable, 20.0, 0.5).expect_err("tall");
        assert!(error.to_string().starts_with("building.eave_height_m"));
        let ok = basis(&site, 6.0, 12.0, RoofShape::Gable, 20.0, 0.5).expect("fits");
        assert_eq!(ok.slope_set, "gable-7-20");
        // a = min(1.2, 2.4) = 1.2 m.
        assert_relative_eq!(ok.strips.edge_width_m, 1.2, max_relative = 1e-12);
    }
}
