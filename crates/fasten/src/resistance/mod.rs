//! Resistance of one nail to wind uplift: withdrawal from the framing and, where a deck is given,
//! head pull-through of the panel; the smaller governs.
//!
//! Pure functions: [`nail_resistance`] takes a typed input and returns every factor it used with its
//! source. Inside, forces are N and lengths mm; the NDS equations convert at their edge (see `units`).

pub mod coefficients;
mod nds;
mod o86;
mod pull_through;

pub use nds::{reference_withdrawal_lbf_per_in, NdsWithdrawalEquation};
pub use o86::{basic_withdrawal_n_per_mm, O86Withdrawal};
pub use pull_through::reference_head_pull_through_lbf;

use crate::error::FastenError;
use crate::nail::Nail;
use crate::panel::DeckLayer;
use crate::penetration::minimum_penetration;
use crate::species::{MemberKind, Species};
use coefficients::Coefficient;
use serde::Serialize;

/// The design method, chosen by the basis.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum Method {
    /// CSA O86:19 limit states design: factored resistance.
    O86LimitStates,
    /// NDS 2018 allowable stress design: adjusted (allowable) design value.
    NdsAsd,
    /// NDS 2018 load and resistance factor design: factored resistance.
    NdsLrfd,
}

impl Method {
    pub fn as_str(self) -> &'static str {
        match self {
            Method::O86LimitStates => "CSA O86:19 limit states",
            Method::NdsAsd => "NDS 2018 ASD",
            Method::NdsLrfd => "NDS 2018 LRFD",
        }
    }

    pub fn resistance_kind(self) -> ResistanceKind {
        match self {
            Method::NdsAsd => ResistanceKind::Allowable,
            Method::O86LimitStates | Method::NdsLrfd => ResistanceKind::Factored,
        }
    }
}

/// Whether the resistance is compared with factored loads or with ASD load combinations.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum ResistanceKind {
    Factored,
    Allowable,
}

impl ResistanceKind {
    pub fn as_str(self) -> &'static str {
        match self {
            ResistanceKind::Factored => "factored",
            ResistanceKind::Allowable => "allowable",
        }
    }
}

/// Grain direction the nail is driven into. Only side grain may carry withdrawal.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum Grain {
    Side,
    End,
}

/// Duration of the load the nail carries in withdrawal.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum LoadDuration {
    /// Wind or earthquake.
    Short,
    /// Ten-year (occupancy) loads.
    Standard,
    /// Permanent loads.
    Permanent,
}

impl LoadDuration {
    pub fn as_str(self) -> &'static str {
        match self {
            LoadDuration::Short => "short",
            LoadDuration::Standard => "standard",
            LoadDuration::Permanent => "permanent",
        }
    }
}

/// Service condition of the framing.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum Service {
    /// Moisture content stays at or below 19 %.
    Dry,
    /// Moisture content above 19 % in service.
    Wet,
}

/// The failure mode that governs.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum Mode {
    Withdrawal,
    PullThrough,
}

impl Mode {
    pub fn as_str(self) -> &'static str {
        match self {
            Mode::Withdrawal => "withdrawal",
            Mode::PullThrough => "head-pull-through",
        }
    }
}

/// Everything the resistance of one nail depends on.
#[derive(Debug, Clone, Copy)]
pub struct ResistanceInput<'a> {
    pub method: Method,
    pub nail: &'a Nail,
    pub species: &'a Species,
    pub member: MemberKind,
    /// The deck the nail passes through (None: no deck, no pull-through check).
    pub deck: Option<DeckLayer<'a>>,
    /// Penetration into the point-side member (rafter, truss chord), mm.
    pub penetration_mm: f64,
    pub toe_nail: bool,
    pub service: Service,
    pub grain: Grain,
    pub load: LoadDuration,
    pub treated: bool,
    /// Depth of the member in the nail's direction, mm; when given, penetration beyond it is not
    /// credited and a warning says the nail exits the member.
    pub member_depth_mm: Option<f64>,
}

/// One factor or intermediate value of the calculation, for the report.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Factor {
    pub name: String,
    pub value: f64,
    /// Unit of the value, "" when dimensionless.
    pub unit: String,
    /// Clause, table or equation with edition, and `checked` or `from memory`.
    pub source: String,
}

impl Factor {
    pub fn new(name: impl Into<String>, value: f64, unit: &str, source: impl Into<String>) -> Self {
        Factor {
            name: name.into(),
            value,
            unit: unit.to_string(),
            source: source.into(),
        }
    }

    fn from_coefficient(coefficient: &Coefficient) -> Self {
        Factor::new(
            coefficient.symbol,
            coefficient.value,
            coefficient.unit,
            coefficient.provenance(),
        )
    }

    fn prefixed(prefix: &str, coefficient: &Coefficient) -> Self {
        Factor::new(
            [prefix, coefficient.symbol].concat(),
            coefficient.value,
            coefficient.unit,
            coefficient.provenance(),
        )
    }
}

/// The resistance of one nail.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Resistance {
    pub method: Method,
    pub kind: ResistanceKind,
    /// Withdrawal resistance, N (factored or allowable per `kind`).
    pub withdrawal_n: f64,
    /// Withdrawal resistance per mm of credited length, N/mm.
    pub withdrawal_per_mm_n: f64,
    /// Length of shank credited in withdrawal, mm (penetration, capped by member depth and, for ring
    /// shank nails, by the ring length).
    pub credited_length_mm: f64,
    /// Head pull-through resistance, N (None without a deck).
    pub pull_through_n: Option<f64>,
    /// True when the pull-through value is a reference check outside the design standard (CSA O86 has
    /// no pull-through clause).
    pub pull_through_is_advisory: bool,
    pub governing_n: f64,
    pub governing_mode: Mode,
    pub factors: Vec<Factor>,
    pub warnings: Vec<String>,
}

impl Resistance {
    /// `withdrawal_n` in pound-force, for US reports.
    pub fn withdrawal_lbf(&self) -> f64 {
        deckhold_core::units::lbf_from_n(self.withdrawal_n)
    }

    /// `pull_through_n` in pound-force.
    pub fn pull_through_lbf(&self) -> Option<f64> {
        self.pull_through_n.map(deckhold_core::units::lbf_from_n)
    }

    /// `governing_n` in pound-force.
    pub fn governing_lbf(&self) -> f64 {
        deckhold_core::units::lbf_from_n(self.governing_n)
    }
}

/// A mode's value with the factors and warnings that produced it.
#[derive(Debug, Clone, PartialEq)]
struct ModeResult {
    value_n: f64,
    per_mm_n: f64,
    credited_length_mm: f64,
    factors: Vec<Factor>,
    warnings: Vec<String>,
}

/// Resistance of one nail; refuses inputs outside the method with a typed error.
pub fn nail_resistance(input: &ResistanceInput) -> Result<Resistance, FastenError> {
    if input.grain == Grain::End {
        let rule = match input.method {
            Method::O86LimitStates => coefficients::O86_END_GRAIN_RULE,
            Method::NdsAsd | Method::NdsLrfd => coefficients::NDS_END_GRAIN_RULE,
        };
        return Err(FastenError::EndGrainWithdrawal { rule });
    }
    let (penetration_mm, mut warnings) = credited_penetration(input)?;
    let withdrawal = match input.method {
        Method::O86LimitStates => o86::withdrawal(input, penetration_mm)?,
        Method::NdsAsd | Method::NdsLrfd => nds::withdrawal(input, penetration_mm)?,
    };
    let pull_through = match (input.deck, input.method) {
        (None, _) => None,
        (Some(deck), Method::O86LimitStates) => Some(pull_through::o86_advisory(input, &deck)),
        (Some(deck), Method::NdsAsd | Method::NdsLrfd) => Some(pull_through::nds(input, &deck)),
    };

    let mut factors = Vec::with_capacity(
        1 + withdrawal.factors.len()
            + pull_through
                .as_ref()
                .map_or(0, |result| result.factors.len()),
    );
    factors.push(Factor::new(
        "L_p",
        penetration_mm,
        "mm",
        "penetration into the point-side member (input)",
    ));
    factors.extend(withdrawal.factors);
    warnings.extend(withdrawal.warnings);
    let pull_through_n = pull_through.as_ref().map(|result| result.value_n);
    if let Some(result) = pull_through {
        factors.extend(result.factors);
        warnings.extend(result.warnings);
    }
    let (governing_n, governing_mode) = match pull_through_n {
        Some(pull_n) if pull_n < withdrawal.value_n => (pull_n, Mode::PullThrough),
        _ => (withdrawal.value_n, Mode::Withdrawal),
    };
    let resistance = Resistance {
        method: input.method,
        kind: input.method.resistance_kind(),
        withdrawal_n: withdrawal.value_n,
        withdrawal_per_mm_n: withdrawal.per_mm_n,
        credited_length_mm: withdrawal.credited_length_mm,
        pull_through_n,
        pull_through_is_advisory: pull_through_n.is_some()
            && input.method == Method::O86LimitStates,
        governing_n,
        governing_mode,
        factors,
        warnings,
    };
    all_finite(&resistance)?;
    Ok(resistance)
}

/// Checks the geometry and returns the penetration that may be credited, with warnings.
fn credited_penetration(input: &ResistanceInput) -> Result<(f64, Vec<String>), FastenError> {
    let nail = input.nail;
    let mut warnings = Vec::new();
    if !(input.penetration_mm.is_finite() && input.penetration_mm > 0.0) {
        return Err(FastenError::OutOfRange {
            field: "penetration_mm",
            value: input.penetration_mm,
            unit: "mm",
            range: "0 < penetration_mm".to_string(),
        });
    }
    let deck_mm = match input.deck {
        Some(deck) => {
            if !(deck.thickness_mm.is_finite() && deck.thickness_mm > 0.0) {
                return Err(FastenError::OutOfRange {
                    field: "deck.thickness_mm",
                    value: deck.thickness_mm,
                    unit: "mm",
                    range: "0 < thickness_mm".to_string(),
                });
            }
            deck.thickness_mm
        }
        None => 0.0,
    };
    let reach_mm = nail.length_mm - deck_mm;
    // A small tolerance for rounding in callers that compute the penetration themselves.
    if input.penetration_mm > reach_mm + 1.0e-6 {
        return Err(FastenError::OutOfRange {
            field: "penetration_mm",
            value: input.penetration_mm,
            unit: "mm",
            range: format!(
                "0..{reach_mm:.1} (nail `{}` is {:.1} mm long, deck {deck_mm:.1} mm)",
                nail.id, nail.length_mm
            ),
        });
    }
    let mut penetration_mm = input.penetration_mm;
    if let Some(depth_mm) = input.member_depth_mm {
        if !(depth_mm.is_finite() && depth_mm > 0.0) {
            return Err(FastenError::OutOfRange {
                field: "member_depth_mm",
                value: depth_mm,
                unit: "mm",
                range: "0 < member_depth_mm".to_string(),
            });
        }
        if penetration_mm > depth_mm {
            warnings.push(format!(
                "nail `{}` exits the member: penetration {penetration_mm:.1} mm exceeds the member depth \
                 {depth_mm:.1} mm; only {depth_mm:.1} mm is credited and the point protrudes",
                nail.id
            ));
            penetration_mm = depth_mm;
        }
    }
    let minimum = minimum_penetration(input.method, nail);
    if penetration_mm < minimum.min_mm {
        return Err(FastenError::PenetrationBelowMinimum {
            nail: nail.id.clone(),
            penetration_mm,
            min_mm: minimum.min_mm,
            rule: minimum.rule,
        });
    }
    Ok((penetration_mm, warnings))
}

/// No NaN or infinity leaves this crate.
fn all_finite(resistance: &Resistance) -> Result<(), FastenError> {
    let mut values = vec![
        ("withdrawal_n", resistance.withdrawal_n),
        ("governing_n", resistance.governing_n),
        ("withdrawal_per_mm_n", resistance.withdrawal_per_mm_n),
    ];
    if let Some(pull_n) = resistance.pull_through_n {
        values.push(("pull_through_n", pull_n));
    }
    values.extend(
        resistance
            .factors
            .iter()
            .map(|factor| ("factor", factor.value)),
    );
    match values.into_iter().find(|(_, value)| !value.is_finite()) {
        Some((field, value)) => Err(FastenError::OutOfRange {
            field,
            value,
            unit: "",
            range: "finite numbers".to_string(),
        }),
        None => Ok(()),
    }
}

#[cfg(test)]
mod tests;
