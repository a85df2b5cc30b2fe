//! Net uplift on one zone at one effective wind area.

use serde::Serialize;

use crate::basis::PressureBasis;
use crate::coefficients::ZoneCurve;
use crate::error::WindError;

/// Pressures on the roof at one effective area, kPa; positive = away from the roof (uplift).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Uplift {
    /// External peak coefficient (NBC C_pC_g, ASCE GC_p); negative = suction.
    pub cp_ext: f64,
    /// Internal coefficient with the sign that worsens uplift (0 on overhangs: both faces are outside).
    pub cp_int: f64,
    pub external_kpa: f64,
    pub internal_kpa: f64,
    /// Load factor × (external + internal), after the standard's minimum pressure.
    pub wind_factored_kpa: f64,
    /// Dead-load factor × dead load × cos(slope).
    pub dead_counteracting_kpa: f64,
    /// wind_factored − dead_counteracting; not clamped (≤ 0 means no net uplift).
    pub net_uplift_kpa: f64,
    pub effective_area_m2: f64,
    pub source: String,
}

/// Evaluates one zone curve at an effective area, m².
pub(crate) fn evaluate(
    basis: &PressureBasis,
    curve: &ZoneCurve,
    overhang: bool,
    effective_area_m2: f64,
) -> Result<Uplift, WindError> {
    let mut uplift = evaluate_pressures(basis, curve, overhang, effective_area_m2)?;
    uplift.source = curve.source.clone();
    Ok(uplift)
}

/// [`evaluate`] without the curve's source text (left empty): the same pressures, for callers that ask
/// thousands of times per roof and read only the numbers.
pub(crate) fn evaluate_pressures(
    basis: &PressureBasis,
    curve: &ZoneCurve,
    overhang: bool,
    effective_area_m2: f64,
) -> Result<Uplift, WindError> {
    if !effective_area_m2.is_finite() || effective_area_m2 <= 0.0 {
        return Err(WindError::range(
            "effective_area_m2",
            format!("{effective_area_m2} m² must be a finite area over 0 m²"),
        ));
    }
    let cp_ext = curve.coefficient_at(effective_area_m2);
    let cp_int = if overhang { 0.0 } else { basis.cp_int };
    let external_kpa = -cp_ext * basis.external_reference_kpa;
    let internal_kpa = cp_int * basis.internal_reference_kpa;
    let mut unfactored_kpa = external_kpa + internal_kpa;
    if let Some(minimum_kpa) = basis.minimum_kpa {
        unfactored_kpa = unfactored_kpa.max(minimum_kpa);
    }
    let wind_factored_kpa = basis.wind_load_factor * unfactored_kpa;
    let dead_counteracting_kpa = basis.dead_load_factor * basis.dead_load_kpa * basis.cos_slope;
    Ok(Uplift {
        cp_ext,
        cp_int,
        external_kpa,
        internal_kpa,
        wind_factored_kpa,
        dead_counteracting_kpa,
        net_uplift_kpa: wind_factored_kpa - dead_counteracting_kpa,
        effective_area_m2,
        source: String::new(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::types::CurvePoint;
    use approx::assert_relative_eq;

    fn basis(minimum_kpa: Option<f64>) -> PressureBasis {
        PressureBasis {
            external_reference_kpa: 0.5,
            internal_reference_kpa: 0.5,
            cp_int: 0.6,
            wind_load_factor: 1.4,
            dead_load_factor: 0.9,
            minimum_kpa,
            dead_load_kpa: 0.5,
            cos_slope: 1.0,
        }
    }

    fn curve() -> ZoneCurve {
        ZoneCurve {
            points: vec![CurvePoint {
                area_m2: 1.0,
                coefficient: -2.0,
            }],
            soffit: None,
            source: "test curve".to_string(),
            figure: "test figure".to_string(),
            status: crate::zone_maps::CoefficientStatus::FromMemory,
        }
    }

    #[test]
    fn hand_calculation() {
        // 1.4 × 0.5 × (2.0 + 0.6) − 0.9 × 0.5 = 1.82 − 0.45 = 1.37 kPa (arithmetic of NBC 2020 4.1.7 and Table 4.1.3.2.-A).
        let result = evaluate(&basis(None), &curve(), false, 0.5).expect("uplift");
        assert_relative_eq!(result.wind_factored_kpa, 1.82, max_relative = 1e-12);
        assert_relative_eq!(result.net_uplift_kpa, 1.37, max_relative = 1e-12);
        let overhang = evaluate(&basis(None), &curve(), true, 0.5).expect("uplift");
        assert_relative_eq!(overhang.internal_kpa, 0.0);
    }

    #[test]
    fn the_pressures_alone_are_the_same_numbers_without_the_source() {
        // Regression check of the fast path the spacing search uses, against the full breakdown.
        for (minimum, overhang, area) in [
            (None, false, 0.5),
            (Some(2.0), false, 3.0),
            (None, true, 20.0),
        ] {
            let full = evaluate(&basis(minimum), &curve(), overhang, area).expect("uplift");
            let fast =
                evaluate_pressures(&basis(minimum), &curve(), overhang, area).expect("uplift");
            assert!(!full.source.is_empty());
            assert_eq!(
                Uplift {
                    source: full.source.clone(),
                    ..fast
                },
                full
            );
        }
    }

    #[test]
    fn minimum_pressure_applies_before_factor() {
        // ASCE 7-22 30.2.2, from memory: 16 psf minimum = 16 x 0.047880 = 0.7661 kPa. With a reference
        // pressure of 0.2 kPa the suction is 0.2 x (2.0 + 0.6) = 0.52 kPa < 0.7661, so the minimum binds:
        // factored 1.4 x 0.7661 = 1.0725 kPa.
        let minimum_kpa = 16.0 * 0.047_880_259;
        let low = PressureBasis {
            external_reference_kpa: 0.2,
            internal_reference_kpa: 0.2,
            ..basis(Some(minimum_kpa))
        };
        let result = evaluate(&low, &curve(), false, 0.5).expect("uplift");
        assert_relative_eq!(result.wind_factored_kpa, 1.0725, max_relative = 1e-4);
        // Above the minimum it does not bind: 1.4 x 0.5 x 2.6 = 1.82 kPa, as without one.
        let result = evaluate(&basis(Some(minimum_kpa)), &curve(), false, 0.5).expect("uplift");
        assert_relative_eq!(result.wind_factored_kpa, 1.82, max_relative = 1e-12);
    }

    #[test]
    fn bad_area_is_refused() {
        for area in [0.0, -1.0, f64::NAN, f64::INFINITY] {
            let error = evaluate(&basis(None), &curve(), false, area).expect_err("bad area");
            assert!(error.to_string().starts_with("effective_area_m2"));
        }
    }
}
