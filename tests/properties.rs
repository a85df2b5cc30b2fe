//! Invariants of the whole pipeline, with random inputs (proptest). No outside source: these are
//! properties the method must have (a stronger nail never needs a closer one). The properties that mutate
//! project files and count the share of cases reaching the job are in `properties_reach.rs`.

use deckhold_deck::layout::SupportRole;
use deckhold_project::job::{deck_layout, plan_with_resistance};
use deckhold_project::rules::spacing_rules;
use deckhold_project::{parse_project, DEMO_PROJECT_JSON};
use proptest::prelude::*;

/// The case count: `PROPTEST_CASES` when set (for long fuzz runs, see docs/fuzzing.md), else `default`.
fn cases(default: u32) -> u32 {
    std::env::var("PROPTEST_CASES")
        .ok()
        .and_then(|text| text.parse().ok())
        .unwrap_or(default)
}

fn demo() -> deckhold_project::Project {
    parse_project(DEMO_PROJECT_JSON).expect("the demo parses")
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(cases(12)))]

    #[test]
    fn a_stronger_nail_never_needs_a_closer_spacing(resistance_n in 150.0f64..900.0, extra in 1.0f64..2.0) {
        let project = demo();
        let wind = deckhold_wind::analyze(&project.wind).expect("wind");
        let layout = deck_layout(&project, &wind).expect("layout");
        let nail = deckhold_fasten::nail("common-63x3.25").expect("nail");
        let rules = spacing_rules(project.basis, nail.shank_diameter_mm);
        let weak = plan_with_resistance(&wind, &layout, nail, resistance_n, &rules).expect("plan");
        let strong = plan_with_resistance(&wind, &layout, nail, resistance_n * extra, &rules).expect("plan");
        for role in &weak.zone_roles {
            let other = strong.zone_role(role.zone_index, role.support_role).expect("same roles");
            // None (no spacing works) is the closest of all.
            match (role.spacing_mm, other.spacing_mm) {
                (Some(weak_s), Some(strong_s)) => prop_assert!(strong_s >= weak_s),
                (Some(_), None) => prop_assert!(false, "a stronger nail lost its spacing"),
                (None, _) => {}
            }
            // Prescriptive maxima and the splitting minimum always hold (NBC 2020 Table 9.23.3.5.-A and
            // CSA O86:19 12.9.2, from memory).
            if let Some(spacing_mm) = role.spacing_mm {
                let maximum_mm = match role.support_role {
                    SupportRole::PanelEdge => rules.max_panel_edge_mm,
                    SupportRole::Intermediate => rules.max_intermediate_mm,
                };
                prop_assert!(spacing_mm <= maximum_mm && spacing_mm >= rules.min_mm);
                prop_assert!(role.utilization <= 1.0 + 1e-9);
            }
        }
    }
}
