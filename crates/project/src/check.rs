//! Plan check of a given nailing pattern: is each zone's edge and intermediate spacing strong enough,
//! within the prescriptive maximum and not below the splitting minimum? And, for a retrofit, how many
//! nails to add between the existing ones where it is not.

use crate::error::JobError;
use crate::job::{deck_layout, net_uplift_kpa, penetration_for, resistance_input};
use crate::project::{ExistingPattern, Project};
use crate::rules::spacing_rules;
use deckhold_core::ZoneKind;
use deckhold_deck::layout::SupportRole;
use deckhold_deck::spacing::{check_on_layout, DeckPlan, NailOption};
use deckhold_fasten::{Nail, Resistance};
use deckhold_wind::WindAnalysis;

/// One zone and support role of a checked pattern.
#[derive(Debug, Clone, PartialEq)]
pub struct CheckRow {
    pub label: ZoneKind,
    pub code_zone: String,
    pub support_role: SupportRole,
    pub given_spacing_mm: f64,
    /// The widest practical spacing the zone needs with this nail (None: none works).
    pub required_spacing_mm: Option<f64>,
    /// Load on the worst-loaded nail at the given spacing, N.
    pub demand_n: f64,
    pub utilization: f64,
    pub governing_line: u32,
    pub passes: bool,
    /// Why it fails, or what to look at, in words.
    pub notes: Vec<String>,
    /// Retrofit: nails to add in each gap between existing nails so the spacing meets the requirement.
    pub added_nails_per_gap: Option<u32>,
}

/// The whole plan check.
#[derive(Debug, Clone)]
pub struct PatternCheck {
    pub nail: Nail,
    pub penetration_mm: f64,
    pub resistance: Resistance,
    pub plan: DeckPlan,
    pub rows: Vec<CheckRow>,
}

impl PatternCheck {
    pub fn passes(&self) -> bool {
        self.rows.iter().all(|row| row.passes)
    }
}

/// The pattern's spacing for a zone index and support role. One spacing per zone of the analysis, looked
/// up once: a zone the layout names is always one of these (the layout is built from the same zones), so
/// no zone falls back to another's pattern.
pub(crate) fn given_spacings(
    wind: &WindAnalysis,
    pattern: &ExistingPattern,
) -> impl Fn(usize, SupportRole) -> Option<f64> {
    let by_zone: Vec<_> = wind
        .zones
        .iter()
        .map(|zone| pattern.for_zone(zone.label))
        .collect();
    move |zone_index: usize, role: SupportRole| -> Option<f64> {
        let spacing = by_zone.get(zone_index)?;
        Some(match role {
            SupportRole::PanelEdge => spacing.edge_spacing_mm,
            SupportRole::Intermediate => spacing.intermediate_spacing_mm,
        })
    }
}

/// Checks `pattern` on the project's roof with the wind already analysed.
pub fn check_pattern(
    project: &Project,
    wind: &WindAnalysis,
    pattern: &ExistingPattern,
) -> Result<PatternCheck, JobError> {
    let nail = project.fastener(&pattern.nail_id)?.clone();
    let layout = deck_layout(project, wind)?;
    let penetration_mm = penetration_for(project, &nail);
    let resistance =
        deckhold_fasten::nail_resistance(&resistance_input(project, &nail, penetration_mm)?)?;
    let rules = spacing_rules(project.basis, nail.shank_diameter_mm);
    let uplift = |zone_index: usize, area_m2: f64| net_uplift_kpa(wind, zone_index, area_m2);
    let given = given_spacings(wind, pattern);
    if pattern.credit <= 0.0 {
        return Err(crate::ProjectError::Invalid {
            path: "existing.credit".to_string(),
            message:
                "0 counts nothing of the existing fasteners, so there is no pattern to check: \
                      give `check --add FASTENER` to size what to add"
                    .to_string(),
        }
        .into());
    }
    // The existing fasteners' condition: only `credit` of each one's resistance is counted.
    let option = NailOption {
        id: nail.id.clone(),
        resistance_n: resistance.governing_n * pattern.credit,
        mass_g: nail.mass_g,
    };
    let plan = check_on_layout(&layout, &uplift, &option, &rules, &given)?;

    let mut rows = Vec::with_capacity(plan.zone_roles.len());
    for role in &plan.zone_roles {
        let Some(zone) = wind.zones.get(role.zone_index) else {
            continue;
        };
        let Some(given_spacing_mm) = given(role.zone_index, role.support_role) else {
            continue;
        };
        let required_spacing_mm = plan
            .lines
            .iter()
            .flat_map(|line| &line.segments)
            .filter(|s| s.zone_index == role.zone_index && s.support_role == role.support_role)
            .map(|s| s.required_spacing_mm)
            .try_fold(f64::INFINITY, |least, required| {
                required.map(|r| least.min(r))
            })
            .filter(|least| least.is_finite());
        let maximum_mm = match role.support_role {
            SupportRole::PanelEdge => rules.max_panel_edge_mm,
            SupportRole::Intermediate => rules.max_intermediate_mm,
        };
        let mut notes = Vec::new();
        let strong_enough = role.utilization <= 1.0 + 1e-9;
        if !strong_enough {
            notes.push(format!(
                "overloaded: utilization {:.2} at line {}",
                role.utilization, role.governing_line
            ));
        }
        if given_spacing_mm > maximum_mm + 1e-6 {
            notes.push(format!(
                "wider than the prescriptive maximum of {maximum_mm:.0} mm for {} supports",
                role.support_role
            ));
        }
        if given_spacing_mm < rules.min_mm - 1e-6 {
            notes.push(format!(
                "closer than the splitting minimum of {:.0} mm: the member may split",
                rules.min_mm
            ));
        }
        let added_nails_per_gap = match required_spacing_mm {
            Some(required) if given_spacing_mm > required + 1e-6 => {
                Some(((given_spacing_mm / required) - 1e-9).ceil() as u32 - 1)
            }
            _ => None,
        };
        if required_spacing_mm.is_none() {
            notes.push("no practical spacing works with this nail: use another nail".to_string());
        }
        rows.push(CheckRow {
            label: zone.label,
            code_zone: zone.code_zone.clone(),
            support_role: role.support_role,
            given_spacing_mm,
            required_spacing_mm,
            demand_n: role.demand_n,
            utilization: role.utilization,
            governing_line: role.governing_line,
            passes: notes.is_empty(),
            notes,
            added_nails_per_gap,
        });
    }
    // Worst zones first, panel edges before intermediate supports, as on the schedule.
    rows.sort_by_key(|row| {
        (
            row.label.sheet_rank(),
            row.support_role != SupportRole::PanelEdge,
        )
    });
    Ok(PatternCheck {
        nail,
        penetration_mm,
        resistance,
        plan,
        rows,
    })
}
