//! Head pull-through of the deck panel: NDS 2018 12.2.5, W_H = 690 π D_H G² t_ns (lb; D_H head
//! diameter and t_ns panel thickness in inches, G of the panel).
//!
//! Under NDS 2018 it is a design check of the standard. CSA O86 has no pull-through clause, so for the
//! Canadian basis the same equation is reported as an advisory reference check in LRFD format
//! (K_F φ_z λ = 2.16 for wind), and still enters the governing value: leaving a known weaker mode out
//! would be unsafe. docs/withdrawal-method.md explains the choice.

use super::coefficients::{NDS_CT, NDS_WH_COEFFICIENT};
use super::nds::format_factors;
use super::{Factor, LoadDuration, Method, ModeResult, ResistanceInput, Service};
use crate::panel::DeckLayer;
use deckhold_core::units::{in_from_mm, n_from_lbf};

/// Reference head pull-through design value W_H, lb (NDS 2018 Eq. 12.2-6, from memory).
pub fn reference_head_pull_through_lbf(
    head_diameter_in: f64,
    panel_specific_gravity: f64,
    panel_thickness_in: f64,
) -> f64 {
    NDS_WH_COEFFICIENT.value
        * std::f64::consts::PI
        * head_diameter_in
        * panel_specific_gravity.powi(2)
        * panel_thickness_in
}

const PREFIX: &str = "pull-through ";
const ADVISORY_PREFIX: &str = "pull-through (advisory, NDS 2018 12.2.5 as reference) ";

/// NDS 2018 ASD or LRFD head pull-through.
pub(super) fn nds(input: &ResistanceInput, deck: &DeckLayer) -> ModeResult {
    head_pull_through(input, deck, input.method, input.load, PREFIX)
}

/// Canadian basis: the NDS equation in LRFD format for a short-term load, as an advisory check.
pub(super) fn o86_advisory(input: &ResistanceInput, deck: &DeckLayer) -> ModeResult {
    let mut result = head_pull_through(
        input,
        deck,
        Method::NdsLrfd,
        LoadDuration::Short,
        ADVISORY_PREFIX,
    );
    result.warnings.push(
        "head pull-through: CSA O86 has no clause; the value is the NDS 2018 12.2.5 equation in LRFD \
         format (K_F phi_z lambda = 2.16), reported as advisory and included in the governing value"
            .to_string(),
    );
    result
}

fn head_pull_through(
    input: &ResistanceInput,
    deck: &DeckLayer,
    format: Method,
    load: LoadDuration,
    prefix: &str,
) -> ModeResult {
    let nail = input.nail;
    let gravity = &deck.panel.nds_specific_gravity;
    let w_h_lbf = reference_head_pull_through_lbf(
        in_from_mm(nail.head_diameter_mm),
        gravity.value,
        in_from_mm(deck.thickness_mm),
    );
    let w_h_n = n_from_lbf(w_h_lbf);
    let mut adjustments = vec![&NDS_CT];
    adjustments.extend(format_factors(format, load));
    let value_n = w_h_n * adjustments.iter().map(|c| c.value).product::<f64>();

    let mut warnings = Vec::new();
    if nail.is_wood_screw() {
        warnings.push(format!(
            "screw `{}`: head pull-through is taken with the nail-head equation of NDS 2018 12.2.5 and the \
             screw's head diameter, as for nails (from memory); a countersunk head set into the panel \
             holds less",
            nail.id
        ));
    }
    if input.service == Service::Wet {
        warnings.push(
            "head pull-through: no wet service factor is applied (NDS 2018 Table 11.3.3 lists none for \
             pull-through, from memory); a wet panel is weaker than this value"
                .to_string(),
        );
    }
    let mut factors = vec![
        Factor::new(
            [prefix, "G (panel)"].concat(),
            gravity.value,
            "",
            [
                deck.panel.name.as_str(),
                " `",
                &deck.panel.id,
                "`: ",
                &gravity.provenance(),
            ]
            .concat(),
        ),
        Factor::new(
            [prefix, "D_H"].concat(),
            nail.head_diameter_mm,
            "mm",
            ["nail `", &nail.id, "`: ", &nail.provenance()].concat(),
        ),
        Factor::new(
            [prefix, "t_ns"].concat(),
            deck.thickness_mm,
            "mm",
            "deck thickness (input)",
        ),
        Factor::new(
            [prefix, "W_H"].concat(),
            w_h_n,
            "N",
            format!("{} = {w_h_lbf:.1} lb", NDS_WH_COEFFICIENT.provenance()),
        ),
    ];
    factors.extend(adjustments.iter().map(|c| Factor::prefixed(prefix, c)));
    factors.push(Factor::new(
        [prefix, "W_H'"].concat(),
        value_n,
        "N",
        "W_H times the adjustment factors above, NDS 2018 Table 11.3.1 (from memory)",
    ));
    ModeResult {
        value_n,
        per_mm_n: 0.0,
        credited_length_mm: 0.0,
        factors,
        warnings,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn w_h_for_an_8d_head_through_7_16_osb() {
        // NDS 2018 Eq. 12.2-6 (from memory): 690 · π · 0.281 · 0.50² · 0.4375 = 66.6 lb (hand calculation).
        assert_relative_eq!(
            reference_head_pull_through_lbf(0.281, 0.50, 0.4375),
            66.63,
            max_relative = 1e-3
        );
    }
}
