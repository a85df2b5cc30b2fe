//! CSA O86:19 factored withdrawal resistance of nails (clause 12.9.5), limit states design.
//!
//! P_rw = φ · Y_w · L_p · n_F · J_A · J_B, with Y_w = y_w · K_SF · K_T · J_x and
//! y_w = 16.4 d_F^0.82 G^2.2 N/mm (d_F in mm, G the mean oven-dry relative density).
//! No load-duration factor: O86 lets nails carry withdrawal only under short-term loads, so other
//! durations are refused. Deformed shanks (spiral, ring, screw) get no credit beyond the equation.

use super::coefficients::{
    Coefficient, O86_JA_STRAIGHT, O86_JA_TOE_NAILED, O86_JB, O86_JX_CLT, O86_JX_SAWN, O86_KSF_DRY,
    O86_KSF_WET, O86_KT, O86_PHI, O86_SHORT_TERM_RULE, O86_STAINLESS_RULE, O86_WOOD_SCREW_RULE,
    O86_YW_COEFFICIENT, O86_YW_DENSITY_EXPONENT, O86_YW_DIAMETER_EXPONENT,
};
use super::{Factor, LoadDuration, ModeResult, ResistanceInput, Service};
use crate::catalog::species_groups;
use crate::error::FastenError;
use crate::nail::Material;
use crate::species::MemberKind;

/// Basic withdrawal resistance y_w per mm of penetration, N/mm (CSA O86:19 12.9.5.2, from memory).
pub fn basic_withdrawal_n_per_mm(shank_diameter_mm: f64, relative_density: f64) -> f64 {
    O86_YW_COEFFICIENT.value
        * shank_diameter_mm.powf(O86_YW_DIAMETER_EXPONENT)
        * relative_density.powf(O86_YW_DENSITY_EXPONENT)
}

/// The terms of P_rw, so the product can be tested on its own.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct O86Withdrawal {
    pub phi: f64,
    pub y_w_n_per_mm: f64,
    pub k_sf: f64,
    pub k_t: f64,
    pub j_x: f64,
    pub l_p_mm: f64,
    pub n_f: u32,
    pub j_a: f64,
    pub j_b: f64,
}

impl O86Withdrawal {
    /// Y_w = y_w · K_SF · K_T · J_x, N/mm.
    pub fn specified_n_per_mm(&self) -> f64 {
        self.y_w_n_per_mm * self.k_sf * self.k_t * self.j_x
    }

    /// P_rw = φ · Y_w · L_p · n_F · J_A · J_B, N.
    pub fn factored_n(&self) -> f64 {
        self.phi
            * self.specified_n_per_mm()
            * self.l_p_mm
            * f64::from(self.n_f)
            * self.j_a
            * self.j_b
    }
}

pub(super) fn withdrawal(
    input: &ResistanceInput,
    penetration_mm: f64,
) -> Result<ModeResult, FastenError> {
    let nail = input.nail;
    if input.load != LoadDuration::Short {
        return Err(FastenError::LoadDurationNotPermitted {
            method: "CSA O86:19",
            load: input.load.as_str(),
            rule: O86_SHORT_TERM_RULE,
        });
    }
    if nail.is_wood_screw() {
        return Err(FastenError::NailNotCovered {
            nail: nail.id.clone(),
            reason: O86_WOOD_SCREW_RULE.to_string(),
        });
    }
    if nail.material == Material::Stainless {
        return Err(FastenError::NailNotCovered {
            nail: nail.id.clone(),
            reason: O86_STAINLESS_RULE.to_string(),
        });
    }
    let density = input.species.o86_relative_density.as_ref().ok_or_else(|| {
        FastenError::MissingSpeciesProperty {
            species: input.species.id.clone(),
            property: "mean relative density",
            method: "CSA O86",
            choices: species_groups()
                .iter()
                .filter(|group| group.o86_relative_density.is_some())
                .map(|group| group.id.clone())
                .collect(),
        }
    })?;

    let k_sf = pick(input.service == Service::Wet, &O86_KSF_WET, &O86_KSF_DRY);
    let j_x = pick(input.member == MemberKind::Clt, &O86_JX_CLT, &O86_JX_SAWN);
    let j_a = pick(input.toe_nail, &O86_JA_TOE_NAILED, &O86_JA_STRAIGHT);
    let (y_w, y_w_source) = match &nail.stated_withdrawal_n_per_mm {
        Some(stated) => (
            stated.value,
            format!(
                "stated for `{}` as the basic withdrawal resistance y_w: {}",
                nail.id,
                stated.provenance()
            ),
        ),
        None => (
            basic_withdrawal_n_per_mm(nail.shank_diameter_mm, density.value),
            O86_YW_COEFFICIENT.provenance(),
        ),
    };
    let terms = O86Withdrawal {
        phi: O86_PHI.value,
        y_w_n_per_mm: y_w,
        k_sf: k_sf.value,
        k_t: O86_KT.value,
        j_x: j_x.value,
        l_p_mm: penetration_mm,
        n_f: 1,
        j_a: j_a.value,
        j_b: O86_JB.value,
    };

    let mut warnings = Vec::new();
    if nail.shank.is_deformed() && nail.stated_withdrawal_n_per_mm.is_none() {
        warnings.push(format!(
            "nail `{}` has a {} shank: CSA O86:19 12.9.5 (from memory) gives deformed shanks no extra \
             withdrawal resistance, so it is credited as a smooth nail of the same diameter",
            nail.id,
            nail.shank.as_str()
        ));
    }
    if input.treated {
        warnings.push(
            "treated framing: K_T = 1.0 assumes preservative treatment without incising; \
             fire-retardant treated wood needs test-based values and is outside this method"
                .to_string(),
        );
    }

    let factors = vec![
        Factor::new("G", density.value, "", density.provenance()),
        Factor::new(
            "d_F",
            nail.shank_diameter_mm,
            "mm",
            ["nail `", &nail.id, "`: ", &nail.provenance()].concat(),
        ),
        Factor::new("y_w", y_w, "N/mm", y_w_source),
        Factor::from_coefficient(k_sf),
        Factor::from_coefficient(&O86_KT),
        Factor::from_coefficient(j_x),
        Factor::new(
            "Y_w",
            terms.specified_n_per_mm(),
            "N/mm",
            "Y_w = y_w K_SF K_T J_x, CSA O86:19 12.9.5.2 (from memory)",
        ),
        Factor::from_coefficient(&O86_PHI),
        Factor::new("n_F", 1.0, "", "one nail"),
        Factor::from_coefficient(j_a),
        Factor::from_coefficient(&O86_JB),
        Factor::new(
            "P_rw",
            terms.factored_n(),
            "N",
            "P_rw = phi Y_w L_p n_F J_A J_B, CSA O86:19 12.9.5.2 (from memory)",
        ),
    ];
    Ok(ModeResult {
        value_n: terms.factored_n(),
        per_mm_n: terms.factored_n() / penetration_mm,
        credited_length_mm: penetration_mm,
        factors,
        warnings,
    })
}

fn pick<'c>(
    condition: bool,
    if_true: &'c Coefficient,
    if_false: &'c Coefficient,
) -> &'c Coefficient {
    if condition {
        if_true
    } else {
        if_false
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;
    use proptest::prelude::*;

    fn terms(l_p_mm: f64, n_f: u32) -> O86Withdrawal {
        O86Withdrawal {
            phi: 0.6,
            y_w_n_per_mm: 6.0,
            k_sf: 1.0,
            k_t: 1.0,
            j_x: 1.0,
            l_p_mm,
            n_f,
            j_a: 1.0,
            j_b: 1.0,
        }
    }

    #[test]
    fn p_rw_applies_j_a_and_j_b() {
        // CSA O86:19 12.9.5.2 (from memory): both factors multiply: 0.6 x 6.0 x 40 x 1 x 0.9 x 0.8 = 103.68 N.
        let reduced = O86Withdrawal {
            j_a: 0.9,
            j_b: 0.8,
            ..terms(40.0, 1)
        };
        assert_relative_eq!(reduced.factored_n(), 103.68, max_relative = 1e-12);
    }

    #[test]
    fn p_rw_counts_every_nail() {
        // CSA O86:19 12.9.5.2 (from memory): P_rw = phi y_w L_p n_F (J factors 1): 0.6 x 6.0 x 40 x 3 = 432 N.
        assert_relative_eq!(terms(40.0, 3).factored_n(), 432.0, max_relative = 1e-12);
    }

    #[test]
    fn y_w_for_a_3_25_mm_nail_in_spf() {
        // y_w = 16.4 · 3.25^0.82 · 0.42^2.2 (CSA O86:19 12.9.5.2, from memory):
        // 3.25^0.82 = 2.6289, 0.42^2.2 = 0.14832, y_w = 6.395 N/mm (hand calculation).
        assert_relative_eq!(
            basic_withdrawal_n_per_mm(3.25, 0.42),
            6.395,
            max_relative = 1e-3
        );
    }

    #[test]
    fn y_w_at_unit_diameter_and_density_is_the_coefficient() {
        assert_relative_eq!(basic_withdrawal_n_per_mm(1.0, 1.0), 16.4);
    }

    #[test]
    fn p_rw_is_the_product_of_its_terms() {
        let mut t = terms(40.0, 1);
        t.k_sf = 0.67;
        t.j_x = 0.9;
        t.j_a = 0.67;
        // 0.6 · (6.0 · 0.67 · 1.0 · 0.9) · 40 · 1 · 0.67 · 1.0
        assert_relative_eq!(
            t.factored_n(),
            0.6 * 6.0 * 0.67 * 0.9 * 40.0 * 0.67,
            max_relative = 1e-12
        );
    }

    proptest! {
        #[test]
        fn y_w_grows_with_diameter_and_density(
            d in 2.0f64..6.0, g in 0.3f64..0.7, step in 0.01f64..0.5,
        ) {
            prop_assert!(basic_withdrawal_n_per_mm(d + step, g) > basic_withdrawal_n_per_mm(d, g));
            prop_assert!(basic_withdrawal_n_per_mm(d, g + step / 5.0) > basic_withdrawal_n_per_mm(d, g));
        }
    }
}
