//! What a standard contributes to an analysis: velocity pressure, internal pressure, load factors,
//! edge width and which coefficient set applies.

use serde::Serialize;

use crate::coefficients::Edition;
use crate::zones::Strips;

/// A factor used in the computation, with where it comes from.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Factor {
    pub name: String,
    pub value: f64,
    pub source: String,
}

impl Factor {
    pub(crate) fn new(name: &str, value: f64, source: impl Into<String>) -> Self {
        Self {
            name: name.to_string(),
            value,
            source: source.into(),
        }
    }
}

/// Everything needed to turn a coefficient into a factored net uplift, kPa.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct PressureBasis {
    /// External pressure per unit of suction coefficient, unfactored, kPa.
    pub external_reference_kpa: f64,
    /// Internal pressure per unit of internal coefficient, unfactored, kPa.
    pub internal_reference_kpa: f64,
    /// Internal coefficient with the sign that adds to uplift (outward on the roof).
    pub cp_int: f64,
    pub wind_load_factor: f64,
    pub dead_load_factor: f64,
    /// Smallest unfactored net pressure the standard allows, kPa (ASCE 7-22 30.2.2).
    pub minimum_kpa: Option<f64>,
    pub dead_load_kpa: f64,
    /// cos(roof slope): the part of the vertical dead load normal to the roof.
    pub cos_slope: f64,
}

/// Interpolation by roof slope between the curves of `slope_set` and those of `upper_set`.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct SlopeBlend {
    pub upper_set: String,
    /// 0 at the lower figure's slope, 1 at the upper figure's.
    pub fraction: f64,
    /// How the standard asks for the interpolation, for the report.
    pub rule: String,
}

/// A standard's contribution to one analysis.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct StandardBasis {
    pub edition: Edition,
    pub pressure: PressureBasis,
    pub q_kpa: f64,
    pub strips: Strips,
    pub slope_set: String,
    /// Set when the standard interpolates between two figures by slope.
    pub slope_blend: Option<SlopeBlend>,
    /// The figure, slope band and zone map used, for the report.
    pub zone_map: String,
    pub factors: Vec<Factor>,
    pub warnings: Vec<String>,
    /// Warnings about the built-in coefficient rows (from memory, severe-of-two): printed only when some
    /// zone uses a built-in row.
    pub data_warnings: Vec<String>,
}

/// Edge width rule shared by both standards (NBC 2020 4.1.7.6 figures, ASCE 7-22 Figure 30.3-2 notes,
/// from memory): 10 % of the least horizontal dimension or 40 % of the height, whichever is smaller,
/// but not less than 4 % of the least dimension or `floor_m`.
pub(crate) fn edge_width_m(least_dimension_m: f64, height_m: f64, floor_m: f64) -> f64 {
    (0.1 * least_dimension_m)
        .min(0.4 * height_m)
        .max(0.04 * least_dimension_m)
        .max(floor_m)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn edge_width_rule() {
        // NBC 2020 Figure 4.1.7.6.-C notes, from memory: z = min(0.1 D, 0.4 H) >= max(0.04 D, 1 m).
        assert_relative_eq!(edge_width_m(12.0, 5.0, 1.0), 1.2);
        assert_relative_eq!(edge_width_m(30.0, 4.0, 1.0), 1.6);
        assert_relative_eq!(edge_width_m(8.0, 3.0, 1.0), 1.0);
        assert_relative_eq!(edge_width_m(100.0, 3.0, 1.0), 4.0);
        // ASCE 7-22 Figure 30.3-2 notes, from memory: 3 ft floor.
        assert_relative_eq!(edge_width_m(6.0, 3.0, 0.9144), 0.9144);
    }
}
