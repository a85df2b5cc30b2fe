//! How far a nail reaches into the framing, and the least it must reach.

use crate::nail::Nail;
use crate::resistance::coefficients::{
    NDS_MIN_PENETRATION_DIAMETERS, NDS_MIN_PENETRATION_RULE, O86_MIN_PENETRATION_DIAMETERS,
    O86_MIN_PENETRATION_RULE,
};
use crate::resistance::Method;

/// Penetration into the point-side member, mm: nail length less the deck and anything between deck
/// and framing (old boards, insulation). Never negative; the point (tip) is part of the penetration,
/// as in the NDS withdrawal values per inch of penetration.
pub fn penetration_mm(nail: &Nail, deck_thickness_mm: f64, between_mm: f64) -> f64 {
    (nail.length_mm - deck_thickness_mm - between_mm).max(0.0)
}

/// The least penetration a method accepts for a nail, with the rule that sets it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MinimumPenetration {
    pub min_mm: f64,
    pub rule: &'static str,
}

/// Minimum penetration into the point-side member for `nail` under `method`.
pub fn minimum_penetration(method: Method, nail: &Nail) -> MinimumPenetration {
    match method {
        Method::O86LimitStates => MinimumPenetration {
            min_mm: O86_MIN_PENETRATION_DIAMETERS.value * nail.shank_diameter_mm,
            rule: O86_MIN_PENETRATION_RULE,
        },
        Method::NdsAsd | Method::NdsLrfd => MinimumPenetration {
            min_mm: NDS_MIN_PENETRATION_DIAMETERS.value * nail.shank_diameter_mm,
            rule: NDS_MIN_PENETRATION_RULE,
        },
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::catalog::nail;
    use approx::assert_relative_eq;

    #[test]
    fn penetration_is_length_less_deck_and_between() {
        let nail = nail("8d-common").expect("8d");
        // 63.5 - 11.1 - 0 = 52.4 mm
        assert_relative_eq!(penetration_mm(nail, 11.1, 0.0), 52.4, max_relative = 1e-12);
        assert_relative_eq!(penetration_mm(nail, 11.1, 19.0), 33.4, max_relative = 1e-12);
    }

    #[test]
    fn penetration_is_never_negative() {
        let nail = nail("6d-common").expect("6d");
        assert_eq!(penetration_mm(nail, 40.0, 30.0), 0.0);
        assert_eq!(penetration_mm(nail, f64::NAN, 0.0), 0.0);
    }

    #[test]
    fn nds_minimum_is_six_diameters() {
        // NDS 2018 12.1.6.4: p_min = 6D (from memory, NDS 2018). 8d common: 6 x 3.327 = 20.0 mm.
        let nail = nail("8d-common").expect("8d");
        let minimum = minimum_penetration(Method::NdsAsd, nail);
        assert_relative_eq!(minimum.min_mm, 6.0 * 0.131 * 25.4, max_relative = 1e-4);
    }

    #[test]
    fn o86_minimum_is_five_diameters() {
        // CSA O86:19 12.9.4.2: 5 d_F (from memory, O86:19). 3.25 mm nail: 16.25 mm.
        let nail = nail("common-63x3.25").expect("63 mm");
        let minimum = minimum_penetration(Method::O86LimitStates, nail);
        assert_relative_eq!(minimum.min_mm, 16.25, max_relative = 1e-12);
    }
}
