//! Every coefficient of the per-nail methods, in one place, each with its clause and edition and
//! whether it was checked against a source we looked at or is from memory.
//!
//! The equations that use them live in `o86.rs`, `nds.rs` and `pull_through.rs`; docs/sources.md lists
//! the sources and docs/withdrawal-method.md explains the choices.

use crate::catalog::Confidence;

/// One coefficient with its provenance.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Coefficient {
    pub symbol: &'static str,
    pub value: f64,
    /// Unit of the value, "" when dimensionless.
    pub unit: &'static str,
    pub source: &'static str,
    pub confidence: Confidence,
}

impl Coefficient {
    /// `source (confidence)`, as the report prints it.
    pub fn provenance(&self) -> String {
        self.confidence.provenance(self.source)
    }
}

const fn from_memory(
    symbol: &'static str,
    value: f64,
    unit: &'static str,
    source: &'static str,
) -> Coefficient {
    Coefficient {
        symbol,
        value,
        unit,
        source,
        confidence: Confidence::FromMemory,
    }
}

const fn checked(
    symbol: &'static str,
    value: f64,
    unit: &'static str,
    source: &'static str,
) -> Coefficient {
    Coefficient {
        symbol,
        value,
        unit,
        source,
        confidence: Confidence::Checked,
    }
}

// ---------------------------------------------------------------------------------------------
// CSA O86:19, clause 12.9.5 (nails and spikes, withdrawal), limit states.
// ---------------------------------------------------------------------------------------------

/// Resistance factor for nails in withdrawal.
pub const O86_PHI: Coefficient = from_memory(
    "phi",
    0.6,
    "",
    "CSA O86:19 12.9.5.2, phi for nails in withdrawal",
);

/// y_w = O86_YW_COEFFICIENT · d_F^O86_YW_DIAMETER_EXPONENT · G^O86_YW_DENSITY_EXPONENT, N/mm with d_F in
/// mm and G the mean oven-dry relative density.
pub const O86_YW_COEFFICIENT: Coefficient = from_memory(
    "y_w coefficient",
    16.4,
    "N/mm",
    "CSA O86:19 12.9.5.2, basic withdrawal resistance y_w = 16.4 d_F^0.82 G^2.2",
);
pub const O86_YW_DIAMETER_EXPONENT: f64 = 0.82;
pub const O86_YW_DENSITY_EXPONENT: f64 = 2.2;

/// Service condition factor for nails in withdrawal, dry and wet service.
pub const O86_KSF_DRY: Coefficient = from_memory(
    "K_SF",
    1.0,
    "",
    "CSA O86:19 Table 12.2.2, K_SF for fastenings, dry service",
);
pub const O86_KSF_WET: Coefficient = from_memory(
    "K_SF",
    0.67,
    "",
    "CSA O86:19 Table 12.2.2, K_SF for fastenings, wet service",
);

/// Treatment factor: untreated, or preservative treatment without incising.
pub const O86_KT: Coefficient = from_memory(
    "K_T",
    1.0,
    "",
    "CSA O86:19 12.2.1 / 5.4.3, K_T for fastenings in untreated or preservative-treated (not incised) wood; \
     fire-retardant treatment needs test data and is outside this method",
);

/// Toe-nailing factor.
pub const O86_JA_TOE_NAILED: Coefficient = from_memory(
    "J_A",
    0.67,
    "",
    "CSA O86:19 12.9.5.2, toe-nailing factor J_A",
);
pub const O86_JA_STRAIGHT: Coefficient = from_memory(
    "J_A",
    1.0,
    "",
    "CSA O86:19 12.9.5.2, J_A for nails driven straight",
);

/// Clinching factor. Clinching raises the lateral resistance of nails that pass through both members;
/// a sheathing nail ends inside the rafter and is not clinched, so the factor is 1.0.
pub const O86_JB: Coefficient = from_memory(
    "J_B",
    1.0,
    "",
    "CSA O86:19 12.9.4 / 12.9.5, nail clinching factor J_B = 1.0 (not clinched)",
);

/// Factor for nails in the face of cross-laminated timber.
pub const O86_JX_CLT: Coefficient = from_memory(
    "J_x",
    0.9,
    "",
    "CSA O86:19 clause 12 (fastenings in CLT), J_x = 0.9; clause number not verified",
);
pub const O86_JX_SAWN: Coefficient =
    from_memory("J_x", 1.0, "", "CSA O86:19, J_x = 1.0 for sawn lumber");

/// Minimum penetration into the point-side member, in shank diameters.
pub const O86_MIN_PENETRATION_DIAMETERS: Coefficient = from_memory(
    "L_p,min / d_F",
    5.0,
    "",
    "CSA O86:19 12.9.4.2, minimum penetration 5 d_F into the main member (written for lateral \
     resistance; applied to withdrawal too)",
);
pub const O86_MIN_PENETRATION_RULE: &str =
    "5 d_F, CSA O86:19 12.9.4.2 (from memory), applied to withdrawal";

/// Nails may be relied on in withdrawal only for short-term loads.
pub const O86_SHORT_TERM_RULE: &str = "CSA O86:19 12.9.5.1 (from memory): nails and spikes may be \
    designed to resist withdrawal only under short-term loads such as wind or earthquake";
/// Wood screws under CSA O86: the standard has a wood-screw clause (12.11 in O86:19, from memory), but
/// its withdrawal equation could not be sourced for this tool, so screws are refused on this basis.
pub const O86_WOOD_SCREW_RULE: &str =
    "CSA O86:19 has a wood-screw clause (12.11, from memory) whose \
    withdrawal equation deckhold does not carry because it could not be checked against a source; \
    wood screws are refused on the Canadian basis: use a nail, or the US basis";
pub const O86_END_GRAIN_RULE: &str = "CSA O86:19 12.9.5.1 (from memory)";
pub const O86_STAINLESS_RULE: &str = "CSA O86:19 12.9.5 (from memory) gives one withdrawal equation, \
    derived for carbon-steel wire nails to CSA B111; it has no provision for stainless-steel nails, \
    whose withdrawal resistance is lower (AWC FAQ on NDS 2018 stainless nails)";

// ---------------------------------------------------------------------------------------------
// AWC NDS 2018, clause 12.2 (withdrawal) and Chapter 11 / Appendix N (adjustment factors).
// ---------------------------------------------------------------------------------------------

/// Smooth carbon-steel nails: W = 1380 G^(5/2) D, lb/in, D in inches.
pub const NDS_W_SMOOTH_CARBON: Coefficient = checked(
    "W coefficient",
    1380.0,
    "lb/in",
    "NDS 2018 12.2.3.1 Eq. 12.2-3, W = 1380 G^(5/2) D (equation checked against the \
     ultimate withdrawal equation of USDA FPL Research Note FPL-093 divided by 5, see the resistance tests)",
);
pub const NDS_W_SMOOTH_CARBON_EXPONENT: f64 = 2.5;

/// Smooth stainless-steel nails: W = 465 G^(3/2) D, lb/in.
pub const NDS_W_SMOOTH_STAINLESS: Coefficient = from_memory(
    "W coefficient",
    465.0,
    "lb/in",
    "NDS 2018 12.2.3.1 Eq. 12.2-4, W = 465 G^(3/2) D for smooth stainless-steel nails (coefficient from \
     memory; its 5 % to 40 % reduction from Eq. 12.2-3 over the usual G range agrees with the AWC FAQ)",
);
pub const NDS_W_SMOOTH_STAINLESS_EXPONENT: f64 = 1.5;

/// Roof sheathing ring shank (and post-frame ring shank) nails: W = 1800 G^2 D, lb/in of ring length.
pub const NDS_W_RING_SHANK: Coefficient = from_memory(
    "W coefficient",
    1800.0,
    "lb/in",
    "NDS 2018 12.2.3.1 Eq. 12.2-5, W = 1800 G^2 D for roof sheathing ring shank and post-frame ring \
     shank nails, per inch of ring-shank penetration",
);
pub const NDS_W_RING_SHANK_EXPONENT: f64 = 2.0;

/// Wood screws: W = 2850 G^2 D, lb per inch of thread penetration into the main member (D the shank
/// diameter). Equation and clause from memory: the only confirmation found was a reference website,
/// which is not a source; NDS 2018 Table 12.2B (tabulated W for wood screws) is the check to make.
pub const NDS_W_WOOD_SCREW: Coefficient = from_memory(
    "W coefficient",
    2850.0,
    "lb/in",
    "NDS 2018 12.2.2 Eq. 12.2-2, W = 2850 G^2 D for wood screws, per inch of thread penetration \
     (from memory; check against NDS 2018 Table 12.2B)",
);
pub const NDS_W_WOOD_SCREW_EXPONENT: f64 = 2.0;

/// Head pull-through of round-head fasteners: W_H = 690 π D_H G² t_ns, lb, with D_H and t_ns in inches.
pub const NDS_WH_COEFFICIENT: Coefficient = from_memory(
    "W_H coefficient",
    690.0,
    "lb/in^2",
    "NDS 2018 12.2.5 Eq. 12.2-6, head pull-through W_H = 690 pi D_H G^2 t_ns",
);

/// Load duration factors for ASD.
pub const NDS_CD_WIND: Coefficient = from_memory(
    "C_D",
    1.6,
    "",
    "NDS 2018 Table 2.3.2, C_D = 1.6 for wind and earthquake",
);
pub const NDS_CD_TEN_YEARS: Coefficient = from_memory(
    "C_D",
    1.0,
    "",
    "NDS 2018 Table 2.3.2, C_D = 1.0 for ten years (occupancy live load)",
);
pub const NDS_CD_PERMANENT: Coefficient = from_memory(
    "C_D",
    0.9,
    "",
    "NDS 2018 Table 2.3.2, C_D = 0.9 for permanent load",
);

/// Wet service factor for nails in withdrawal: dry service, and wet in service after fabrication dry.
pub const NDS_CM_DRY: Coefficient = from_memory(
    "C_M",
    1.0,
    "",
    "NDS 2018 Table 11.3.3, nails in withdrawal, dry in service",
);
pub const NDS_CM_WET: Coefficient = from_memory(
    "C_M",
    0.25,
    "",
    "NDS 2018 Table 11.3.3, nails in withdrawal, fabricated dry and wet in service (unverified: a mailing-list \
     note points to it, no published copy was checked)",
);
/// Toe-nails in withdrawal: the wet service factor does not apply.
pub const NDS_CM_TOE_NAILED: Coefficient = checked(
    "C_M",
    1.0,
    "",
    "NDS 2018 12.5.4.1, C_M does not apply to toe-nails in withdrawal (checked: Missouri S&T course \
     notes 'Nail Withdrawal Connections', 'CM = 1.0 for toenail')",
);

/// Temperature factor, sustained temperature up to 100 °F.
pub const NDS_CT: Coefficient = from_memory(
    "C_t",
    1.0,
    "",
    "NDS 2018 Table 11.3.4, C_t = 1.0 for T <= 100 F",
);

/// Toe-nail factor.
pub const NDS_CTN_TOE_NAILED: Coefficient = from_memory(
    "C_tn",
    0.67,
    "",
    "NDS 2018 12.5.4.1, toe-nail factor C_tn = 0.67",
);
pub const NDS_CTN_STRAIGHT: Coefficient = from_memory(
    "C_tn",
    1.0,
    "",
    "NDS 2018 12.5.4.1, C_tn = 1.0 for nails driven straight",
);

/// LRFD format conversion factor for connections, K_F = 2.16/φ_z.
pub const NDS_KF_CONNECTIONS: Coefficient = from_memory(
    "K_F",
    2.16 / 0.65,
    "",
    "NDS 2018 Table N1, K_F = 2.16/phi for connections",
);
/// LRFD resistance factor for connections.
pub const NDS_PHI_CONNECTIONS: Coefficient = from_memory(
    "phi_z",
    0.65,
    "",
    "NDS 2018 Table N2, phi_z = 0.65 for connections",
);
/// LRFD time effect factors.
pub const NDS_LAMBDA_WIND: Coefficient = from_memory(
    "lambda",
    1.0,
    "",
    "NDS 2018 Table N3, lambda = 1.0 for combinations with wind or earthquake",
);
pub const NDS_LAMBDA_OCCUPANCY: Coefficient = from_memory(
    "lambda",
    0.8,
    "",
    "NDS 2018 Table N3, lambda = 0.8 for 1.2D + 1.6L (occupancy live)",
);
pub const NDS_LAMBDA_PERMANENT: Coefficient = from_memory(
    "lambda",
    0.6,
    "",
    "NDS 2018 Table N3, lambda = 0.6 for 1.4D",
);

/// Minimum penetration into the main member, in shank diameters.
pub const NDS_MIN_PENETRATION_DIAMETERS: Coefficient = from_memory(
    "p_min / D",
    6.0,
    "",
    "NDS 2018 12.1.6.4, minimum nail penetration 6D into the main member (written for connections \
     in general and applied to withdrawal)",
);
pub const NDS_MIN_PENETRATION_RULE: &str = "6D, NDS 2018 12.1.6.4 (from memory)";
pub const NDS_END_GRAIN_RULE: &str =
    "NDS 2018 12.2.3 (from memory): nails and spikes shall not be \
    loaded in withdrawal from end grain of wood";

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn lrfd_factors_for_connections_are_the_tabulated_values() {
        // NDS 2018 Table N2 (from memory): phi_z = 0.65 for connections; Table N1: K_F = 2.16/phi_z, which for
        // 0.65 is 2.16 / 0.65 = 3.3231 (worked by hand; printed in the table as 3.32).
        assert_relative_eq!(NDS_PHI_CONNECTIONS.value, 0.65);
        assert_relative_eq!(NDS_KF_CONNECTIONS.value, 3.3231, max_relative = 1e-4);
    }

    #[test]
    fn every_coefficient_names_a_clause() {
        for coefficient in [
            O86_PHI,
            O86_YW_COEFFICIENT,
            O86_KSF_DRY,
            O86_KSF_WET,
            O86_KT,
            O86_JA_TOE_NAILED,
            O86_JA_STRAIGHT,
            O86_JB,
            O86_JX_CLT,
            O86_JX_SAWN,
            O86_MIN_PENETRATION_DIAMETERS,
            NDS_W_SMOOTH_CARBON,
            NDS_W_SMOOTH_STAINLESS,
            NDS_W_RING_SHANK,
            NDS_W_WOOD_SCREW,
            NDS_WH_COEFFICIENT,
            NDS_CD_WIND,
            NDS_CD_TEN_YEARS,
            NDS_CD_PERMANENT,
            NDS_CM_DRY,
            NDS_CM_WET,
            NDS_CM_TOE_NAILED,
            NDS_CT,
            NDS_CTN_TOE_NAILED,
            NDS_CTN_STRAIGHT,
            NDS_KF_CONNECTIONS,
            NDS_PHI_CONNECTIONS,
            NDS_LAMBDA_WIND,
            NDS_LAMBDA_OCCUPANCY,
            NDS_LAMBDA_PERMANENT,
            NDS_MIN_PENETRATION_DIAMETERS,
        ] {
            assert!(
                coefficient.source.contains("O86") || coefficient.source.contains("NDS"),
                "{}",
                coefficient.symbol
            );
            assert!(coefficient.value.is_finite() && coefficient.value > 0.0);
        }
    }
}
