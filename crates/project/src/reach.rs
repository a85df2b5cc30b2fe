//! For choosing a nail: the site wind up to which its schedule stays at the prescriptive spacings (every
//! zone and support role nailed at the basis's prescriptive maximum, strength governing nowhere).
//!
//! The wind input the user gives is varied (ASCE 7-22: the basic wind speed V in mph; NBC 2020: the
//! reference velocity pressure q50 in kPa) with everything else of the project held, and the boundary is
//! found by bisection. More wind never allows wider nailing (checked in `tests/properties_reach.rs`), so the
//! set of winds where the schedule is all-prescriptive is an interval from the lowest accepted value up to
//! the boundary, and bisection finds it. The value reported is the low end of the last bracket: a wind at
//! which the schedule was seen to stay prescriptive, never one past the boundary.

use deckhold_core::limits;
use deckhold_deck::layout::DeckLayout;
use deckhold_deck::spacing::SpacingLimit;
use deckhold_fasten::Nail;
use deckhold_wind::{SiteWind, WindAnalysis, WindInput};

use crate::job::{deck_layout, plan_with_resistance, rank_zones};
use crate::rules::spacing_rules;
use crate::{JobError, Project};

/// Which wind input is varied: the one the basis takes from the user.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum WindMeasure {
    /// ASCE 7-22 basic wind speed V, mph (`wind.speed_mph`).
    SpeedMph,
    /// NBC 2020 reference velocity pressure q50, kPa (`wind.q50_kpa`).
    Q50Kpa,
}

impl WindMeasure {
    /// The project-file key of the input, as the user writes it.
    pub fn key(self) -> &'static str {
        match self {
            WindMeasure::SpeedMph => "wind.speed_mph",
            WindMeasure::Q50Kpa => "wind.q50_kpa",
        }
    }

    /// The input's unit, as the standard gives it.
    pub fn unit(self) -> &'static str {
        match self {
            WindMeasure::SpeedMph => "mph",
            WindMeasure::Q50Kpa => "kPa",
        }
    }

    /// How close the bisection brackets the boundary (half a mph; 0.005 kPa, about the last figure
    /// NBC Table C-2 prints).
    pub fn tolerance(self) -> f64 {
        match self {
            WindMeasure::SpeedMph => 0.5,
            WindMeasure::Q50Kpa => 0.005,
        }
    }

    /// The range the method accepts for the input (the project file's limits).
    fn range(self) -> (f64, f64) {
        let limit = match self {
            WindMeasure::SpeedMph => limits::SPEED_MPH,
            WindMeasure::Q50Kpa => limits::Q50_KPA,
        };
        (limit.min, limit.max)
    }

    /// The input's decimals in reports: whole mph, two decimals of kPa.
    pub fn decimals(self) -> usize {
        match self {
            WindMeasure::SpeedMph => 0,
            WindMeasure::Q50Kpa => 2,
        }
    }
}

/// Where a nail's all-prescriptive schedule ends.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Reach {
    /// Even at the lowest wind the method accepts, strength governs somewhere.
    BelowRange { lowest: f64 },
    /// Prescriptive up to this wind (within the tolerance, never past the boundary).
    UpTo(f64),
    /// Still prescriptive at the highest wind the method accepts.
    BeyondRange { highest: f64 },
}

/// The answer for one nail.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PrescriptiveReach {
    pub measure: WindMeasure,
    /// The project's own value of the input.
    pub given: f64,
    pub reach: Reach,
    /// Bisection steps taken (each one a whole wind analysis and deck plan).
    pub steps: u32,
}

impl PrescriptiveReach {
    /// "126 mph", "< 60 mph", ">= 300 mph" (the input's own unit). A reach is rounded down, never up, to
    /// the printed figure: the printed wind is one at which the schedule was seen to stay prescriptive.
    pub fn label(&self) -> String {
        let unit = self.measure.unit();
        let decimals = self.measure.decimals();
        match self.reach {
            Reach::BelowRange { lowest } => format!("< {lowest:.decimals$} {unit}"),
            Reach::UpTo(value) => {
                format!("{:.decimals$} {unit}", rounded_down(value, decimals))
            }
            Reach::BeyondRange { highest } => format!(">= {highest:.decimals$} {unit}"),
        }
    }

    /// The value to tabulate, rounded down to `decimals` (the bound of the range where the reach lies
    /// outside it).
    pub fn value(&self, decimals: usize) -> f64 {
        match self.reach {
            Reach::BelowRange { lowest } => lowest,
            Reach::UpTo(value) => rounded_down(value, decimals),
            Reach::BeyondRange { highest } => highest,
        }
    }

    /// `below-range`, `up-to` or `beyond-range`, for CSV and JSON.
    pub fn status(&self) -> &'static str {
        match self.reach {
            Reach::BelowRange { .. } => "below-range",
            Reach::UpTo(_) => "up-to",
            Reach::BeyondRange { .. } => "beyond-range",
        }
    }
}

/// `value` rounded down to `decimals` places (a tiny allowance keeps 0.30 from printing as 0.29 when
/// binary arithmetic gives 0.29999...).
fn rounded_down(value: f64, decimals: usize) -> f64 {
    let scale = 10f64.powi(decimals as i32);
    ((value * scale) + 1e-9).floor() / scale
}

/// The wind input the project's basis takes, and its value.
fn measure_of(wind: &WindInput) -> (WindMeasure, f64) {
    match &wind.site {
        SiteWind::Asce722(site) => (WindMeasure::SpeedMph, site.speed_mph),
        SiteWind::Nbc2020(site) => (WindMeasure::Q50Kpa, site.q50_kpa),
    }
}

fn with_measure(wind: &WindInput, value: f64) -> WindInput {
    let mut wind = wind.clone();
    match &mut wind.site {
        SiteWind::Asce722(site) => site.speed_mph = value,
        SiteWind::Nbc2020(site) => site.q50_kpa = value,
    }
    wind
}

/// The project's own wind analysis and deck layout, reused wherever another wind ranks the zones alike.
#[derive(Debug, Clone, Copy)]
pub struct ReachBase<'a> {
    pub project: &'a Project,
    pub wind: &'a WindAnalysis,
    pub layout: &'a DeckLayout,
}

/// Whether the nail's schedule is all-prescriptive at this value of the wind input. The deck layout
/// depends on the wind only through the zones' ranking; where the ranking differs from the project's
/// own, the framing and deck are laid out again.
fn stays_prescriptive(
    base: &ReachBase,
    nail: &Nail,
    resistance_n: f64,
    value: f64,
) -> Result<bool, JobError> {
    let project = base.project;
    let wind_input = with_measure(&project.wind, value);
    let wind = deckhold_wind::analyze(&wind_input)?;
    let own_layout;
    let layout = if rank_zones(&wind)? == rank_zones(base.wind)? {
        base.layout
    } else {
        own_layout = deck_layout(project, &wind)?;
        &own_layout
    };
    let rules = spacing_rules(project.basis, nail.shank_diameter_mm);
    let plan = plan_with_resistance(&wind, layout, nail, resistance_n, &rules)?;
    Ok(plan
        .zone_roles
        .iter()
        .all(|role| role.limited_by == SpacingLimit::PrescriptiveMaximum))
}

/// The wind up to which the nail (of governing resistance `resistance_n` in this project) keeps every zone
/// and role at the prescriptive spacing, by bisection on the basis's wind input.
pub fn prescriptive_reach(
    base: &ReachBase,
    nail: &Nail,
    resistance_n: f64,
) -> Result<PrescriptiveReach, JobError> {
    let (measure, given) = measure_of(&base.project.wind);
    let (lowest, highest) = measure.range();
    let mut steps = 2;
    let reach = if !stays_prescriptive(base, nail, resistance_n, lowest)? {
        Reach::BelowRange { lowest }
    } else if stays_prescriptive(base, nail, resistance_n, highest)? {
        Reach::BeyondRange { highest }
    } else {
        // Invariant: prescriptive at `low`, not at `high`.
        let (mut low, mut high) = (lowest, highest);
        while high - low > measure.tolerance() {
            let middle = 0.5 * (low + high);
            steps += 1;
            if stays_prescriptive(base, nail, resistance_n, middle)? {
                low = middle;
            } else {
                high = middle;
            }
        }
        Reach::UpTo(low)
    };
    Ok(PrescriptiveReach {
        measure,
        given,
        reach,
        steps,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn reach(measure: WindMeasure, reach: Reach) -> PrescriptiveReach {
        PrescriptiveReach {
            measure,
            given: 0.0,
            reach,
            steps: 0,
        }
    }

    #[test]
    fn labels_name_the_unit_and_the_side_of_the_range() {
        assert_eq!(
            reach(WindMeasure::SpeedMph, Reach::UpTo(126.4)).label(),
            "126 mph"
        );
        assert_eq!(
            reach(WindMeasure::Q50Kpa, Reach::UpTo(0.4321)).label(),
            "0.43 kPa"
        );
        // Rounded down, never up past the wind that was seen to work.
        assert_eq!(
            reach(WindMeasure::SpeedMph, Reach::UpTo(126.9)).label(),
            "126 mph"
        );
        assert_eq!(
            reach(WindMeasure::Q50Kpa, Reach::UpTo(0.4399)).label(),
            "0.43 kPa"
        );
        assert_eq!(
            reach(WindMeasure::Q50Kpa, Reach::UpTo(0.4399)).value(3),
            0.439
        );
        assert_eq!(
            reach(WindMeasure::SpeedMph, Reach::BelowRange { lowest: 60.0 }).label(),
            "< 60 mph"
        );
        assert_eq!(
            reach(WindMeasure::Q50Kpa, Reach::BeyondRange { highest: 3.0 }).label(),
            ">= 3.00 kPa"
        );
    }

    /// The largest utilization over the zones and roles of the nail's schedule at this wind.
    fn worst_utilization(base: &ReachBase, nail: &Nail, resistance_n: f64, value: f64) -> f64 {
        let wind = deckhold_wind::analyze(&with_measure(&base.project.wind, value)).expect("wind");
        let layout = deck_layout(base.project, &wind).expect("layout");
        let rules = spacing_rules(base.project.basis, nail.shank_diameter_mm);
        plan_with_resistance(&wind, &layout, nail, resistance_n, &rules)
            .expect("plan")
            .zone_roles
            .iter()
            .map(|role| role.utilization)
            .fold(0.0, f64::max)
    }

    /// At the reach every zone is still at the prescriptive spacing and one tolerance step more wind is
    /// not; and at the boundary the worst zone's nail is close to fully used at the prescriptive spacing
    /// (utilization just under 1), which is what "strength starts to govern" means. Hand-reasoned from the
    /// spacing rule (demand at the prescriptive spacing over the nail's resistance), not a regression value.
    #[test]
    fn the_reach_is_where_strength_starts_to_govern() {
        for text in [
            crate::DEMO_PROJECT_JSON,
            include_str!("../../../fixtures/us-hip.json"),
        ] {
            let project = crate::parse_project(text).expect("the demo parses");
            let job = crate::run_job(&project).expect("the job runs");
            let base = ReachBase {
                project: &project,
                wind: &job.wind,
                layout: &job.layout,
            };
            let chosen = job.chosen();
            let resistance_n = chosen.resistance.as_ref().expect("works").governing_n;
            let found = prescriptive_reach(&base, &chosen.nail, resistance_n).expect("reach");
            let Reach::UpTo(value) = found.reach else {
                panic!("the demo's nail has a reach inside the range: {found:?}");
            };
            let step = found.measure.tolerance();
            assert!(stays_prescriptive(&base, &chosen.nail, resistance_n, value).expect("plan"));
            assert!(
                !stays_prescriptive(&base, &chosen.nail, resistance_n, value + step).expect("plan")
            );
            let utilization = worst_utilization(&base, &chosen.nail, resistance_n, value);
            assert!(
                (0.9..=1.0).contains(&utilization),
                "{}: utilization {utilization} at the reach {value}",
                found.measure.key()
            );
            assert!(found.steps <= 16, "bisection took {} steps", found.steps);
        }
    }

    #[test]
    fn the_tolerance_is_finer_than_the_printed_figure() {
        for measure in [WindMeasure::SpeedMph, WindMeasure::Q50Kpa] {
            let printed_step = 10f64.powi(-(measure.decimals() as i32));
            assert!(measure.tolerance() <= printed_step, "{measure:?}");
        }
    }
}
