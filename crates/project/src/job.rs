//! The whole job for one project: wind zones, per-nail resistance, spacing for each candidate nail.
//!
//! Pure computation: a validated [`Project`] in, a [`Job`] out. The schedule for reports is built from the
//! job by [`crate::report::schedule_for`].

use crate::basis::BasisStandards;
use crate::error::JobError;
use crate::project::{LinesAlong, MemberRole, Project, StaggerChoice};
use crate::rules::spacing_rules;
use deckhold_deck::layout::{
    layout_deck_with, Axis, DeckLayout, FramingInput, LayoutDetail, PanelInput, PlaneGeometry,
    Stagger, ZoneRegion,
};
use deckhold_deck::spacing::{plan_on_layout, DeckPlan, NailOption, SpacingRules};
use deckhold_fasten::{
    DeckLayer, Grain, LoadDuration, MemberKind, Nail, Resistance, ResistanceInput, Service,
};
use deckhold_wind::WindAnalysis;

/// Effective wind area used to rank zones by severity, m²: a nail-sized area (common practice, no source).
const RANKING_AREA_M2: f64 = 0.1;

/// One candidate nail worked through the job.
#[derive(Debug, Clone)]
pub struct NailOutcome {
    pub nail: Nail,
    pub penetration_mm: f64,
    /// Err: the nail cannot be used at all (the message says why, e.g. too short to reach the minimum
    /// penetration).
    pub resistance: Result<Resistance, String>,
    pub plan: Option<DeckPlan>,
    /// Every zone and role has a working spacing.
    pub feasible: bool,
}

impl NailOutcome {
    /// Why this nail does not work, in one line naming the zones (None when it works).
    pub fn shortfall(&self, wind: &WindAnalysis) -> Option<String> {
        if self.feasible {
            return None;
        }
        match (&self.resistance, &self.plan) {
            (Err(reason), _) => Some(reason.clone()),
            (Ok(_), Some(plan)) => {
                let failing: Vec<String> = plan
                    .zone_roles
                    .iter()
                    .filter(|role| role.spacing_mm.is_none())
                    .map(|role| {
                        let label = wind
                            .zones
                            .get(role.zone_index)
                            .map_or("?", |zone| zone.label.as_str());
                        format!(
                            "{label} {} (utilization {:.2} at the closest spacing)",
                            role.support_role.as_str(),
                            role.utilization
                        )
                    })
                    .collect();
                Some(format!(
                    "no practical spacing works in {}",
                    failing.join(", ")
                ))
            }
            (Ok(_), None) => Some("not planned".to_string()),
        }
    }
}

/// The result of the whole job.
#[derive(Debug, Clone)]
pub struct Job {
    pub wind: WindAnalysis,
    /// The framing and panel layout, built once and shared by every candidate nail.
    pub layout: DeckLayout,
    /// One entry per candidate, in the project's order of preference.
    pub candidates: Vec<NailOutcome>,
    /// Index of the nail the schedule uses: the first feasible one, else the first candidate.
    pub chosen: usize,
}

impl Job {
    pub fn chosen(&self) -> &NailOutcome {
        &self.candidates[self.chosen]
    }

    pub fn feasible(&self) -> bool {
        self.chosen().feasible
    }
}

/// Runs the job for the project's own candidate list.
pub fn run_job(project: &Project) -> Result<Job, JobError> {
    run_job_with_nails(project, &project.nails)
}

/// Runs the job for the given candidate nails (ids checked against the catalog).
pub fn run_job_with_nails(project: &Project, nail_ids: &[String]) -> Result<Job, JobError> {
    job_for(project, nail_ids, Candidates::All)
}

/// Runs the job for the project's candidates up to the first that works in every zone, and no
/// further: the same chosen nail and plan as [`run_job`], for a caller that reads only the chosen
/// nail (a batch summary line). `candidates` then holds the nails tried, not every one listed, and
/// only the chosen one is planned: a nail that does not hold is found so without its plan.
pub fn run_job_to_chosen(project: &Project) -> Result<Job, JobError> {
    job_for(project, &project.nails, Candidates::UpToChosen)
}

/// How many candidates a job works through.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Candidates {
    All,
    UpToChosen,
}

fn job_for(project: &Project, nail_ids: &[String], which: Candidates) -> Result<Job, JobError> {
    if let (Some(file), None) = (&project.coefficients_file, &project.wind.table) {
        // Never a silent fallback to the built-in rows the user meant to replace.
        return Err(crate::ProjectError::Invalid {
            path: "coefficients".to_string(),
            message: format!("the table {file} was not read: only run, zones, check and compare read coefficient tables"),
        }
        .into());
    }
    let wind = deckhold_wind::analyze(&project.wind)?;
    // Only the chosen nail is read: the deck pieces and the adjustments in words are not.
    let detail = match which {
        Candidates::All => LayoutDetail::Full,
        Candidates::UpToChosen => LayoutDetail::ForSpacing,
    };
    let layout = deck_layout_with(project, &wind, detail)?;
    // Every id is looked up first, so an unknown nail refuses the job whichever nail is chosen.
    let nails = nail_ids
        .iter()
        .map(|id| project.fastener(id))
        .collect::<Result<Vec<_>, _>>()?;
    let plan = match which {
        Candidates::All => Planned::Always,
        Candidates::UpToChosen => Planned::WhenItHolds,
    };
    let mut candidates = Vec::with_capacity(nail_ids.len());
    for nail in &nails {
        let outcome = work_nail(project, &wind, &layout, (*nail).clone(), plan)?;
        let feasible = outcome.feasible;
        candidates.push(outcome);
        if feasible && which == Candidates::UpToChosen {
            break;
        }
    }
    let Some(first) = nails.first() else {
        return Err(crate::ProjectError::Missing {
            path: "nails[0]".to_string(),
        }
        .into());
    };
    let chosen = candidates
        .iter()
        .position(|candidate| candidate.feasible)
        .unwrap_or(0);
    if chosen == 0 && candidates[0].plan.is_none() && candidates[0].resistance.is_ok() {
        // None holds: the first candidate is the one reported, with its plan.
        candidates[0] = work_nail(project, &wind, &layout, (*first).clone(), Planned::Always)?;
    }
    Ok(Job {
        wind,
        layout,
        candidates,
        chosen,
    })
}

/// Lays out the project's framing and deck once (the layout does not depend on the nail).
pub fn deck_layout(project: &Project, wind: &WindAnalysis) -> Result<DeckLayout, JobError> {
    deck_layout_with(project, wind, LayoutDetail::Full)
}

/// [`deck_layout`] to the given detail.
fn deck_layout_with(
    project: &Project,
    wind: &WindAnalysis,
    detail: LayoutDetail,
) -> Result<DeckLayout, JobError> {
    let geometry = DeckGeometry::new(project, wind)?;
    let mut layout = layout_deck_with(
        &geometry.planes,
        &geometry.zones,
        &geometry.zone_rank,
        &geometry.framing,
        &geometry.panel,
        detail,
    )?;
    // The zone order of the nailing holds among the roof's zones and among the overhangs' apart: an
    // overhang carries its deck as a cantilever, and its own order is the overhang zones'.
    layout.zone_family = wind
        .zones
        .iter()
        .map(|zone| u32::from(zone.label.is_overhang()))
        .collect();
    Ok(layout)
}

/// The plan geometry and zone data in the form the layout takes.
#[derive(Debug, Clone)]
struct DeckGeometry {
    pub planes: Vec<PlaneGeometry>,
    pub zones: Vec<ZoneRegion>,
    pub zone_rank: Vec<u32>,
    pub framing: FramingInput,
    pub panel: PanelInput,
}

impl DeckGeometry {
    pub fn new(project: &Project, wind: &WindAnalysis) -> Result<Self, JobError> {
        let planes = wind
            .planes
            .iter()
            .map(|plane| PlaneGeometry {
                polygon_m: plane.polygon_m.clone(),
                slope_deg: plane.slope_deg,
                downslope_m: plane.downslope_m,
            })
            .collect();
        let zones = wind
            .zones
            .iter()
            .enumerate()
            .map(|(zone_index, zone)| ZoneRegion {
                zone_index,
                polygons_m: zone.polygons_m.clone(),
            })
            .collect();
        let zone_rank = rank_zones(wind)?;
        let lines_along = project.framing.lines_along.map(|along| match along {
            LinesAlong::Length => Axis::X,
            LinesAlong::Width => Axis::Y,
        });
        let framing = FramingInput {
            spacing_mm: project.framing.spacing_mm,
            lines_along,
            walls_m: wind.wall_lines_m.clone(),
        };
        let stagger = match project.deck.stagger {
            StaggerChoice::Half => Stagger::Half,
            StaggerChoice::None => Stagger::None,
            StaggerChoice::OffsetMm(offset_mm) => Stagger::OffsetMm(offset_mm),
        };
        let panel = PanelInput {
            length_mm: project.deck.panel_length_mm,
            width_mm: project.deck.panel_width_mm,
            stagger,
            min_piece_mm: project.deck.min_piece_mm,
            blocking: project.deck.blocking,
            start: project.deck.start_corner,
            first_course_width_mm: project.deck.first_course_width_mm,
            first_panel_length_mm: project.deck.first_panel_length_mm,
        };
        Ok(Self {
            planes,
            zones,
            zone_rank,
            framing,
            panel,
        })
    }
}

/// Zones ranked by net uplift at a nail-sized area: higher rank, worse zone. The layout depends on the
/// wind only through this ranking (it settles which zone a stretch of line belongs to where zones meet).
pub fn rank_zones(wind: &WindAnalysis) -> Result<Vec<u32>, JobError> {
    let mut uplift_by_zone = Vec::with_capacity(wind.zones.len());
    for zone_index in 0..wind.zones.len() {
        uplift_by_zone.push((
            zone_index,
            wind.uplift(zone_index, RANKING_AREA_M2)?.net_uplift_kpa,
        ));
    }
    let mut order = uplift_by_zone.clone();
    order.sort_by(|a, b| a.1.total_cmp(&b.1).then(a.0.cmp(&b.0)));
    let mut rank = vec![0; wind.zones.len()];
    for (position, (zone_index, _)) in order.iter().enumerate() {
        rank[*zone_index] = position as u32;
    }
    Ok(rank)
}

/// The resistance input for one nail in this project's deck and framing.
pub fn resistance_input<'a>(
    project: &Project,
    nail: &'a Nail,
    penetration_mm: f64,
) -> Result<ResistanceInput<'a>, JobError> {
    let species = deckhold_fasten::species(&project.framing.species_id)?;
    let panel = deckhold_fasten::panel(&project.deck.panel_id)?;
    Ok(ResistanceInput {
        method: project.basis.fastener_method(),
        nail,
        species,
        member: if project.framing.member == MemberRole::Clt {
            MemberKind::Clt
        } else {
            MemberKind::Sawn
        },
        deck: Some(DeckLayer {
            panel,
            thickness_mm: project.deck.thickness_mm,
        }),
        penetration_mm,
        toe_nail: project.framing.toe_nailed,
        service: if project.deck.wet_service {
            Service::Wet
        } else {
            Service::Dry
        },
        grain: Grain::Side,
        load: LoadDuration::Short,
        treated: project.deck.treated,
        member_depth_mm: Some(project.framing.member_depth_mm),
    })
}

/// Penetration of the point into the framing, mm. The resistance credits at most the member depth (a
/// nail that exits the member holds only along the part inside it) and says so in its warnings.
pub fn penetration_for(project: &Project, nail: &Nail) -> f64 {
    deckhold_fasten::penetration_mm(nail, project.deck.thickness_mm, project.deck.between_mm)
}

/// Which candidate nails get a plan.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Planned {
    Always,
    /// Only a nail that holds everywhere; one that does not is found so without its plan.
    WhenItHolds,
}

fn work_nail(
    project: &Project,
    wind: &WindAnalysis,
    layout: &DeckLayout,
    nail: Nail,
    planned: Planned,
) -> Result<NailOutcome, JobError> {
    let rules = &spacing_rules(project.basis, nail.shank_diameter_mm);
    let penetration_mm = penetration_for(project, &nail);
    let through_mm = project.deck.thickness_mm + project.deck.between_mm;
    if penetration_mm <= 0.0 {
        let reason = format!(
            "the {:.0} mm {} does not reach the framing through {through_mm:.1} mm of deck and layers",
            nail.length_mm,
            nail.kind_word()
        );
        return Ok(NailOutcome {
            nail,
            penetration_mm,
            resistance: Err(reason),
            plan: None,
            feasible: false,
        });
    }
    let resistance = match deckhold_fasten::nail_resistance(&resistance_input(
        project,
        &nail,
        penetration_mm,
    )?) {
        Ok(resistance) => resistance,
        Err(error) => {
            return Ok(NailOutcome {
                nail,
                penetration_mm,
                resistance: Err(error.to_string()),
                plan: None,
                feasible: false,
            })
        }
    };
    let plan = match planned {
        Planned::Always => {
            plan_with_resistance(wind, layout, &nail, resistance.governing_n, rules)?
        }
        Planned::WhenItHolds => {
            match plan_if_it_holds(wind, layout, &nail, resistance.governing_n, rules)? {
                Some(plan) => plan,
                None => {
                    return Ok(NailOutcome {
                        nail,
                        penetration_mm,
                        resistance: Ok(resistance),
                        plan: None,
                        feasible: false,
                    })
                }
            }
        }
    };
    let feasible = plan.zone_roles.iter().all(|role| role.spacing_mm.is_some());
    Ok(NailOutcome {
        nail,
        penetration_mm,
        resistance: Ok(resistance),
        plan: Some(plan),
        feasible,
    })
}

/// Net factored uplift of a zone at an effective area, in the form the spacing module asks for.
pub(crate) fn net_uplift_kpa(
    wind: &WindAnalysis,
    zone_index: usize,
    area_m2: f64,
) -> Result<f64, String> {
    wind.net_uplift_kpa(zone_index, area_m2)
        .map_err(|error| error.to_string())
}

/// The plan of one nail of known factored resistance when it holds everywhere on the project's
/// layout, None when it does not (found without building the plan).
fn plan_if_it_holds(
    wind: &WindAnalysis,
    layout: &DeckLayout,
    nail: &Nail,
    resistance_n: f64,
    rules: &SpacingRules,
) -> Result<Option<DeckPlan>, JobError> {
    let uplift = |zone_index: usize, area_m2: f64| net_uplift_kpa(wind, zone_index, area_m2);
    Ok(deckhold_deck::spacing::plan_if_it_holds(
        layout,
        &uplift,
        &nail_option(nail, resistance_n),
        rules,
    )?)
}

fn nail_option(nail: &Nail, resistance_n: f64) -> NailOption {
    NailOption {
        id: nail.id.to_string(),
        resistance_n,
        mass_g: nail.mass_g,
    }
}

/// Plans the deck for one nail of known factored resistance on the project's layout.
pub fn plan_with_resistance(
    wind: &WindAnalysis,
    layout: &DeckLayout,
    nail: &Nail,
    resistance_n: f64,
    rules: &SpacingRules,
) -> Result<DeckPlan, JobError> {
    let uplift = |zone_index: usize, area_m2: f64| net_uplift_kpa(wind, zone_index, area_m2);
    Ok(plan_on_layout(
        layout,
        &uplift,
        &nail_option(nail, resistance_n),
        rules,
    )?)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{parse_project, DEMO_PROJECT_JSON};

    #[test]
    fn stopping_at_the_chosen_nail_chooses_the_same_nail_and_plan() {
        // Regression check against the full job on the demo (its first candidate fails, the second works).
        let project = parse_project(DEMO_PROJECT_JSON).expect("demo parses");
        let full = run_job(&project).expect("runs");
        let short = run_job_to_chosen(&project).expect("runs");
        assert_eq!(short.chosen().nail.id, full.chosen().nail.id);
        assert_eq!(short.chosen().plan, full.chosen().plan);
        assert_eq!(short.candidates.len(), full.chosen + 1);
        assert!(short.candidates.len() < full.candidates.len());
    }

    #[test]
    fn an_unknown_nail_after_the_chosen_one_still_refuses_the_job() {
        let mut project = parse_project(DEMO_PROJECT_JSON).expect("demo parses");
        project.nails.push("no-such-nail".to_string());
        assert!(run_job_to_chosen(&project).is_err());
    }
}
