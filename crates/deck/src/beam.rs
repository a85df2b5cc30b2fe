//! Support reactions of a deck strip continuous over its supports (stiffness method).
//!
//! A panel strip of unit width is a prismatic beam on simple supports (the rafter lines) under a
//! uniform load. The interior supports of a continuous strip take more than a simple tributary share
//! and the end supports less, so the reactions are solved, not assumed.
//!
//! Method: the unknowns are the rotations at the supports. Each span contributes the member stiffness
//! `EI/L · [[4, 2], [2, 4]]` and the fixed-end moments `±wL²/12`; a cantilever past an outer support
//! adds its moment `wa²/2` to that support. After solving `K θ = -M_fixed` (Cholesky), the end moments
//! of each span give its end shears `wL/2 ± (M_ab + M_ba)/L`, and each reaction is the sum of the
//! shears on its two sides. The stiffness `EI` is uniform along the strip, so it cancels from the
//! reactions and is taken as 1.
//!
//! Sign convention: end moments counter-clockwise positive, load and reactions in the same sense
//! (a positive load gives positive reactions at the supports of a strip without cantilevers).

use nalgebra::{DMatrix, DVector};

use crate::error::SpacingError;

/// Reactions of a beam continuous over `spans_m.len() + 1` simple supports under a uniform load.
///
/// `load_per_m` is the load per metre of beam in any force unit (e.g. kN/m, or a pressure in kPa
/// on a strip 1 m wide); the reactions come back in that force unit, one per support, in order.
/// With `load_per_m = 1.0` each reaction is the tributary width of that support, in metres.
pub fn support_reactions(spans_m: &[f64], load_per_m: f64) -> Result<Vec<f64>, SpacingError> {
    if spans_m.is_empty() {
        return Err(SpacingError::Invalid {
            field: "spans_m".to_string(),
            reason: "needs at least one span".to_string(),
        });
    }
    strip_reactions(spans_m, 0.0, 0.0, load_per_m)
}

/// Like [`support_reactions`], with a cantilever of `overhang_start_m` before the first support and
/// `overhang_end_m` after the last one (deck running past an outer support). With no spans, the
/// strip sits on one support that carries both cantilevers.
pub fn strip_reactions(
    spans_m: &[f64],
    overhang_start_m: f64,
    overhang_end_m: f64,
    load_per_m: f64,
) -> Result<Vec<f64>, SpacingError> {
    for (index, span_m) in spans_m.iter().enumerate() {
        crate::error::check_positive(|| format!("spans_m[{index}]"), *span_m)?;
    }
    for (field, overhang_m) in [
        ("overhang_start_m", overhang_start_m),
        ("overhang_end_m", overhang_end_m),
    ] {
        if !(overhang_m.is_finite() && overhang_m >= 0.0) {
            return Err(SpacingError::OutOfRange {
                field: field.to_string(),
                value: overhang_m,
                allowed: "finite values >= 0".to_string(),
            });
        }
    }
    if !load_per_m.is_finite() {
        return Err(SpacingError::OutOfRange {
            field: "load_per_m".to_string(),
            value: load_per_m,
            allowed: "finite values".to_string(),
        });
    }
    let w = load_per_m;
    if spans_m.is_empty() {
        return Ok(vec![w * (overhang_start_m + overhang_end_m)]);
    }

    let supports = spans_m.len() + 1;
    let mut stiffness = DMatrix::<f64>::zeros(supports, supports);
    let mut rhs = DVector::<f64>::zeros(supports);
    for (i, &span_m) in spans_m.iter().enumerate() {
        let k = 1.0 / span_m;
        stiffness[(i, i)] += 4.0 * k;
        stiffness[(i, i + 1)] += 2.0 * k;
        stiffness[(i + 1, i)] += 2.0 * k;
        stiffness[(i + 1, i + 1)] += 4.0 * k;
        let fixed_end_moment = w * span_m * span_m / 12.0;
        rhs[i] -= fixed_end_moment;
        rhs[i + 1] += fixed_end_moment;
    }
    // The cantilevers are statically determinate: each hands its moment to its outer support.
    rhs[0] += w * overhang_start_m * overhang_start_m / 2.0;
    rhs[supports - 1] -= w * overhang_end_m * overhang_end_m / 2.0;

    let rotations = stiffness
        .cholesky()
        .map(|factor| factor.solve(&rhs))
        .ok_or_else(|| SpacingError::SingularBeam {
            spans_m: spans_m.to_vec(),
        })?;

    let mut reactions = vec![0.0; supports];
    reactions[0] += w * overhang_start_m;
    reactions[supports - 1] += w * overhang_end_m;
    for (i, &span_m) in spans_m.iter().enumerate() {
        let k = 1.0 / span_m;
        let fixed_end_moment = w * span_m * span_m / 12.0;
        let moment_start = fixed_end_moment + k * (4.0 * rotations[i] + 2.0 * rotations[i + 1]);
        let moment_end = -fixed_end_moment + k * (2.0 * rotations[i] + 4.0 * rotations[i + 1]);
        let shear_start = w * span_m / 2.0 + (moment_start + moment_end) / span_m;
        reactions[i] += shear_start;
        reactions[i + 1] += w * span_m - shear_start;
    }
    if reactions.iter().all(|r| r.is_finite()) {
        Ok(reactions)
    } else {
        Err(SpacingError::SingularBeam {
            spans_m: spans_m.to_vec(),
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;
    use proptest::prelude::*;

    /// Reaction coefficients (times wL) of uniformly loaded continuous beams over equal spans.
    /// Source: T. G. Hicks, Civil Engineering Formulas (McGraw-Hill), Table 2.1 "Uniformly Loaded
    /// Continuous Beams over Equal Spans" (shears on each side of each support, summed here);
    /// checked against a public copy of the page (edition not shown on it). The same coefficients
    /// appear in the AISC Steel Construction Manual beam diagrams (from memory, 15th ed.).
    fn check_equal_spans(spans: usize, coefficients: &[f64]) {
        let span_m = 0.61;
        let w = 2.5;
        let reactions = support_reactions(&vec![span_m; spans], w).expect("valid spans");
        assert_eq!(reactions.len(), coefficients.len());
        for (reaction, coefficient) in reactions.iter().zip(coefficients) {
            assert_relative_eq!(*reaction, coefficient * w * span_m, max_relative = 1e-9);
        }
    }

    #[test]
    fn one_span_is_simply_supported() {
        // Statics of a simple beam: each support takes wL/2.
        check_equal_spans(1, &[0.5, 0.5]);
    }

    #[test]
    fn two_equal_spans_match_the_handbook() {
        // Hicks Table 2.1: 3/8, 5/8 + 5/8, 3/8.
        check_equal_spans(2, &[3.0 / 8.0, 10.0 / 8.0, 3.0 / 8.0]);
    }

    #[test]
    fn three_equal_spans_match_the_handbook() {
        // Hicks Table 2.1: 4/10, 6/10 + 5/10, ...
        check_equal_spans(3, &[0.4, 1.1, 1.1, 0.4]);
    }

    #[test]
    fn four_equal_spans_match_the_handbook() {
        // Hicks Table 2.1: 11/28, 17/28 + 15/28, 13/28 + 13/28, ... (0.393, 1.143, 0.929).
        check_equal_spans(
            4,
            &[
                11.0 / 28.0,
                32.0 / 28.0,
                26.0 / 28.0,
                32.0 / 28.0,
                11.0 / 28.0,
            ],
        );
    }

    #[test]
    fn six_equal_spans_match_the_handbook() {
        // Hicks Table 2.1, seven supports: 41/104, 63/104 + 55/104, 49/104 + 51/104, 53/104 + 53/104.
        let c = [41.0, 118.0, 100.0, 106.0, 100.0, 118.0, 41.0].map(|n| n / 104.0);
        check_equal_spans(6, &c);
    }

    #[test]
    fn a_cantilever_matches_statics() {
        // Free body of one span L with a cantilever a: moments about the first support give
        // R_end = w (L^2 - a^2) / (2 L); vertical equilibrium gives R_first = w (L + a) - R_end.
        let (l, a, w) = (0.61, 0.2, 3.0);
        let reactions = strip_reactions(&[l], a, 0.0, w).expect("valid strip");
        let end = w * (l * l - a * a) / (2.0 * l);
        assert_relative_eq!(reactions[1], end, max_relative = 1e-9);
        assert_relative_eq!(reactions[0], w * (l + a) - end, max_relative = 1e-9);
    }

    #[test]
    fn a_strip_on_one_support_carries_both_cantilevers() {
        let reactions = strip_reactions(&[], 0.3, 0.1, 2.0).expect("valid strip");
        assert_eq!(reactions.len(), 1);
        assert_relative_eq!(reactions[0], 0.8, max_relative = 1e-12);
    }

    #[test]
    fn bad_spans_are_refused_with_the_field_name() {
        let error = support_reactions(&[0.61, -0.1], 1.0).expect_err("negative span");
        assert!(error.to_string().starts_with("spans_m[1]: -0.1"), "{error}");
        assert!(support_reactions(&[f64::NAN], 1.0).is_err());
        assert!(support_reactions(&[], 1.0).is_err());
        assert!(support_reactions(&[0.61], f64::INFINITY).is_err());
        assert!(strip_reactions(&[0.61], -0.1, 0.0, 1.0).is_err());
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(64))]

        #[test]
        fn reactions_balance_the_load(
            spans in proptest::collection::vec(0.1f64..2.0, 1..9),
            a in 0.0f64..0.5,
            b in 0.0f64..0.5,
            w in -5.0f64..5.0,
        ) {
            let reactions = strip_reactions(&spans, a, b, w).expect("valid strip");
            let length: f64 = spans.iter().sum::<f64>() + a + b;
            let total: f64 = reactions.iter().sum();
            prop_assert!((total - w * length).abs() <= 1e-9 * (1.0 + (w * length).abs()));
            // Moments about the first support: sum R_i x_i = w * length * (centroid).
            let mut x = 0.0;
            let mut moment = 0.0;
            for (i, r) in reactions.iter().enumerate() {
                moment += r * x;
                if i < spans.len() { x += spans[i]; }
            }
            let centroid = (x + b) / 2.0 - a / 2.0;
            prop_assert!((moment - w * length * centroid).abs() <= 1e-8 * (1.0 + (w * length).abs()));
        }

        #[test]
        fn mirrored_spans_give_mirrored_reactions(spans in proptest::collection::vec(0.1f64..2.0, 1..9)) {
            let forward = support_reactions(&spans, 1.0).expect("valid spans");
            let reversed_spans: Vec<f64> = spans.iter().rev().copied().collect();
            let mut backward = support_reactions(&reversed_spans, 1.0).expect("valid spans");
            backward.reverse();
            for (f, b) in forward.iter().zip(&backward) {
                prop_assert!((f - b).abs() <= 1e-9 * (1.0 + f.abs()));
            }
        }

        #[test]
        fn symmetric_spans_give_symmetric_reactions(half in proptest::collection::vec(0.1f64..2.0, 1..5)) {
            let mut spans = half.clone();
            spans.extend(half.iter().rev());
            let reactions = support_reactions(&spans, 1.0).expect("valid spans");
            let n = reactions.len();
            for i in 0..n / 2 {
                prop_assert!((reactions[i] - reactions[n - 1 - i]).abs() <= 1e-9 * (1.0 + reactions[i].abs()));
            }
        }
    }
}
