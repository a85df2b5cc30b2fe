//! Retrofit: the pattern in place plus added fasteners of another kind. Per zone and support role, the
//! existing row is checked alone (with the `credit` for its condition); where it does not carry the
//! demand, the sparsest practical added row is found that, together with the existing one, does.
//!
//! Placement: added fasteners go between existing ones, either as their own row at a practical spacing
//! set off from the existing nails (`offset`), or as `k` more between each pair of existing nails on the
//! grid they share (`between`). Every fastener keeps the larger of the two minimum spacings to each
//! neighbour, whatever its type: for two rows at `s_e` and `s_a` set off as far as possible the closest
//! pair is half of their greatest common divisor apart.

use crate::error::JobError;
use crate::job::{deck_layout, net_uplift_kpa, penetration_for, resistance_input};
use crate::project::{ExistingPattern, Project};
use crate::rules::spacing_rules;
use deckhold_core::ZoneKind;
use deckhold_deck::layout::SupportRole;
use deckhold_deck::spacing::{check_on_layout, DeckPlan, NailOption, Segment, SpacingRules};
use deckhold_fasten::{Nail, Resistance};
use deckhold_wind::WindAnalysis;

/// How existing and added resistances combine, printed with every retrofit.
pub const COMBINATION_RULE: &str = "existing and added fasteners share the row's uplift in proportion \
    to their resistance: per unit length, credit x R_existing / s_existing + R_added / s_added must carry \
    p x w (common practice, no source). NDS 2018 11.1.4 (from memory) leaves connections with mixed \
    fastener types to tests or analysis, so the reviewer must accept this combination";

/// How the added fasteners sit in the row.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Placement {
    /// Their own row at `spacing_mm`, set off `offset_mm` from the nearest existing nail.
    Offset { spacing_mm: f64, offset_mm: f64 },
    /// `per_gap` evenly between each pair of existing nails, every fastener then at `combined_mm`.
    Between { per_gap: u32, combined_mm: f64 },
}

impl Placement {
    /// Added fasteners per mm of row.
    fn density_per_mm(self, existing_mm: f64) -> f64 {
        match self {
            Placement::Offset { spacing_mm, .. } => 1.0 / spacing_mm,
            Placement::Between { per_gap, .. } => f64::from(per_gap) / existing_mm,
        }
    }

    /// Average spacing of the added fasteners alone, mm.
    pub fn added_spacing_mm(self, existing_mm: f64) -> f64 {
        1.0 / self.density_per_mm(existing_mm)
    }

    /// What the crew does, in words.
    pub fn describe(self, spacing: impl Fn(f64) -> String) -> String {
        match self {
            Placement::Offset {
                spacing_mm,
                offset_mm,
            } => format!(
                "add at {} o.c., set {} from the existing nails",
                spacing(spacing_mm),
                spacing(offset_mm)
            ),
            Placement::Between {
                per_gap,
                combined_mm,
            } => format!(
                "add {per_gap} between each pair of existing nails (all at {} o.c.)",
                spacing(combined_mm)
            ),
        }
    }
}

/// One zone and support role of a retrofit.
#[derive(Debug, Clone, PartialEq)]
pub struct RetrofitRow {
    pub label: ZoneKind,
    pub code_zone: String,
    pub support_role: SupportRole,
    pub existing_spacing_mm: f64,
    /// None: the existing pattern carries the demand alone, nothing is added.
    pub placement: Option<Placement>,
    /// Average spacing of the added fasteners, mm (None where none are needed).
    pub added_spacing_mm: Option<f64>,
    /// Demand over combined capacity at the worst stretch (existing alone where nothing is added; at the
    /// closest added row tried where nothing works).
    pub utilization: f64,
    pub governing_line: u32,
    pub passes: bool,
    pub notes: Vec<String>,
}

/// The whole retrofit.
#[derive(Debug, Clone)]
pub struct Retrofit {
    pub existing: Nail,
    pub added: Nail,
    pub credit: f64,
    pub existing_resistance: Resistance,
    pub added_resistance: Resistance,
    /// The deck checked at the existing pattern (segments, reaction widths, lines).
    pub plan: DeckPlan,
    pub rows: Vec<RetrofitRow>,
    /// Closest distance any two fasteners may have, mm (the larger of the two minimum spacings).
    pub min_neighbour_mm: f64,
}

impl Retrofit {
    pub fn passes(&self) -> bool {
        self.rows.iter().all(|row| row.passes)
    }
}

/// What one row must satisfy: resistances, spacing rules and the wind.
struct RowContext<'a> {
    wind: &'a WindAnalysis,
    existing_n: f64,
    added_n: f64,
    rules: &'a SpacingRules,
    min_neighbour_mm: f64,
}

impl RowContext<'_> {
    /// Worst demand / capacity over the stretches, with its line, for an added density (0: none).
    fn utilization(
        &self,
        stretches: &[(u32, &Segment)],
        existing_mm: f64,
        added_per_mm: f64,
    ) -> Result<(f64, u32), JobError> {
        let per_mm = 1.0 / existing_mm + added_per_mm;
        let capacity_n_per_mm = self.existing_n / existing_mm + self.added_n * added_per_mm;
        let mut worst = (0.0_f64, stretches.first().map_or(0, |(line, _)| *line));
        for (line, segment) in stretches {
            let width_mm = segment.reaction_width_mm;
            if width_mm <= 0.0 {
                continue;
            }
            // The area one fastener of the combined row holds: the smaller, more severe, area.
            let area_m2 = (width_mm / per_mm / 1e6)
                .max(self.rules.min_effective_area_m2)
                .max(1e-4);
            let uplift_kpa = net_uplift_kpa(self.wind, segment.zone_index, area_m2)
                .map_err(|message| {
                    JobError::Project(crate::ProjectError::Invalid {
                        path: "wind".to_string(),
                        message,
                    })
                })?
                .max(0.0);
            // kPa x mm = 1e-3 N/mm.
            let demand_n_per_mm = uplift_kpa * width_mm / 1000.0;
            let utilization = if capacity_n_per_mm > 0.0 {
                demand_n_per_mm / capacity_n_per_mm
            } else if demand_n_per_mm > 0.0 {
                f64::INFINITY
            } else {
                0.0
            };
            if utilization > worst.0 {
                worst = (utilization, *line);
            }
        }
        Ok(worst)
    }

    /// Every placement the rules allow next to an existing row at `existing_mm`, sparsest first.
    fn placements(&self, existing_mm: f64, role: SupportRole) -> Vec<Placement> {
        let max_mm = match role {
            SupportRole::PanelEdge => self.rules.max_panel_edge_mm,
            SupportRole::Intermediate => self.rules.max_intermediate_mm,
        };
        let mut found = Vec::new();
        for &spacing_mm in &self.rules.increments_mm {
            if spacing_mm > max_mm + 1e-6 || spacing_mm < self.rules.min_mm - 1e-6 {
                continue;
            }
            let offset_mm = gcd_mm(existing_mm, spacing_mm) / 2.0;
            if offset_mm >= self.min_neighbour_mm - 1e-6 {
                found.push(Placement::Offset {
                    spacing_mm,
                    offset_mm,
                });
            }
            let ratio = existing_mm / spacing_mm;
            let per_gap = ratio.round();
            if per_gap >= 2.0
                && (ratio - per_gap).abs() < 1e-6
                && spacing_mm >= self.min_neighbour_mm - 1e-6
            {
                found.push(Placement::Between {
                    per_gap: per_gap as u32 - 1,
                    combined_mm: spacing_mm,
                });
            }
        }
        // Sparsest first; at equal density the widest combined spacing (the offset row) first.
        found.sort_by(|a, b| {
            a.density_per_mm(existing_mm)
                .total_cmp(&b.density_per_mm(existing_mm))
                .then(
                    matches!(a, Placement::Between { .. })
                        .cmp(&matches!(b, Placement::Between { .. })),
                )
        });
        found
    }
}

/// Greatest common divisor of two spacings on a 0.1 mm grid, mm.
fn gcd_mm(a_mm: f64, b_mm: f64) -> f64 {
    let (mut a, mut b) = ((a_mm * 10.0).round() as u64, (b_mm * 10.0).round() as u64);
    while b != 0 {
        (a, b) = (b, a % b);
    }
    a as f64 / 10.0
}

/// Sizes what to add of `added_id` to the project's `existing` pattern.
pub fn plan_retrofit(
    project: &Project,
    wind: &WindAnalysis,
    pattern: &ExistingPattern,
    added_id: &str,
) -> Result<Retrofit, JobError> {
    let existing = project.fastener(&pattern.nail_id)?.clone();
    let added = project.fastener(added_id)?.clone();
    let existing_resistance = deckhold_fasten::nail_resistance(&resistance_input(
        project,
        &existing,
        penetration_for(project, &existing),
    )?)?;
    let added_resistance = deckhold_fasten::nail_resistance(&resistance_input(
        project,
        &added,
        penetration_for(project, &added),
    )?)?;
    let existing_rules = spacing_rules(project.basis, existing.shank_diameter_mm);
    let rules = spacing_rules(project.basis, added.shank_diameter_mm);
    let min_neighbour_mm = rules.min_mm.max(existing_rules.min_mm);

    let layout = deck_layout(project, wind)?;
    let given = crate::check::given_spacings(wind, pattern);
    // The layout pass only needs a positive resistance: utilizations are recomputed below.
    let option = NailOption {
        id: existing.id.clone(),
        resistance_n: existing_resistance.governing_n,
        mass_g: existing.mass_g,
    };
    let uplift = |zone_index: usize, area_m2: f64| net_uplift_kpa(wind, zone_index, area_m2);
    let plan = check_on_layout(&layout, &uplift, &option, &existing_rules, &given)?;
    let context = RowContext {
        wind,
        existing_n: existing_resistance.governing_n * pattern.credit,
        added_n: added_resistance.governing_n,
        rules: &rules,
        min_neighbour_mm,
    };

    let mut rows = Vec::with_capacity(plan.zone_roles.len());
    for role in &plan.zone_roles {
        let (Some(zone), Some(existing_mm)) = (
            wind.zones.get(role.zone_index),
            given(role.zone_index, role.support_role),
        ) else {
            continue;
        };
        let stretches: Vec<(u32, &Segment)> = plan
            .lines
            .iter()
            .flat_map(|line| line.segments.iter().map(move |s| (line.number, s)))
            .filter(|(_, s)| s.zone_index == role.zone_index && s.support_role == role.support_role)
            .collect();
        let max_mm = match role.support_role {
            SupportRole::PanelEdge => rules.max_panel_edge_mm,
            SupportRole::Intermediate => rules.max_intermediate_mm,
        };
        let (alone, alone_line) = context.utilization(&stretches, existing_mm, 0.0)?;
        let mut notes = Vec::new();
        // (placement, utilization, line, passes): nothing added where the existing row works alone.
        let outcome = if alone <= 1.0 + 1e-9 && existing_mm <= max_mm + 1e-6 {
            (None, alone, alone_line, true)
        } else {
            let mut outcome = (None, alone, alone_line, false);
            for placement in context.placements(existing_mm, role.support_role) {
                let (utilization, line) = context.utilization(
                    &stretches,
                    existing_mm,
                    placement.density_per_mm(existing_mm),
                )?;
                let holds = utilization <= 1.0 + 1e-9;
                outcome = (holds.then_some(placement), utilization, line, holds);
                if holds {
                    break;
                }
            }
            if !outcome.3 {
                notes.push(format!(
                    "no added row of `{}` that keeps {min_neighbour_mm:.0} mm from every neighbour \
                     carries the demand (utilization {:.2} at the densest one): use a stronger \
                     fastener or replace the deck",
                    added.id, outcome.1
                ));
            }
            outcome
        };
        let (placement, utilization, governing_line, passes) = outcome;
        let row = RetrofitRow {
            label: zone.label,
            code_zone: zone.code_zone.clone(),
            support_role: role.support_role,
            existing_spacing_mm: existing_mm,
            placement,
            added_spacing_mm: placement.map(|p| p.added_spacing_mm(existing_mm)),
            utilization,
            governing_line,
            passes,
            notes,
        };
        rows.push(row);
    }
    rows.sort_by_key(|row| {
        (
            row.label.sheet_rank(),
            row.support_role != SupportRole::PanelEdge,
        )
    });
    Ok(Retrofit {
        existing,
        added,
        credit: pattern.credit,
        existing_resistance,
        added_resistance,
        plan,
        rows,
        min_neighbour_mm,
    })
}
