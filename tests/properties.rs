//! Invariants of the whole pipeline, with random inputs (proptest). No outside source: these are
//! properties the method must have (more wind never allows a wider spacing; a stronger nail never needs a
//! closer one; no input makes the parser or the job panic).

use deckhold_deck::layout::SupportRole;
use deckhold_project::job::{deck_layout, plan_with_resistance};
use deckhold_project::rules::spacing_rules;
use deckhold_project::{parse_project, run_job, DEMO_PROJECT_JSON};
use deckhold_wind::SiteWind;
use proptest::prelude::*;
use serde_json::Value;

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

/// Spacing per (zone label, role) of the chosen nail; 0 where none works.
fn spacings(project: &deckhold_project::Project) -> Vec<(String, SupportRole, f64)> {
    let job = run_job(project).expect("runs");
    let chosen = job.chosen();
    let plan = chosen.plan.as_ref().expect("planned");
    plan.zone_roles
        .iter()
        .map(|role| {
            (
                job.wind.zones[role.zone_index].label.as_str().to_string(),
                role.support_role,
                role.spacing_mm.unwrap_or(0.0),
            )
        })
        .collect()
}

/// Replaces the value at a random place in the JSON tree with `replacement`.
fn mutate(value: &mut Value, path: &[usize], replacement: Value) {
    let Some((first, rest)) = path.split_first() else {
        *value = replacement;
        return;
    };
    match value {
        Value::Object(map) if !map.is_empty() => {
            let key = map
                .keys()
                .nth(first % map.len())
                .cloned()
                .unwrap_or_default();
            if let Some(child) = map.get_mut(&key) {
                mutate(child, rest, replacement);
            }
        }
        Value::Array(items) if !items.is_empty() => {
            let index = first % items.len();
            mutate(&mut items[index], rest, replacement);
        }
        _ => *value = replacement,
    }
}

fn any_json() -> impl Strategy<Value = Value> {
    prop_oneof![
        Just(Value::Null),
        any::<bool>().prop_map(Value::Bool),
        (-1e6f64..1e6).prop_map(|x| serde_json::json!(x)),
        Just(serde_json::json!(0)),
        Just(serde_json::json!(-1)),
        Just(serde_json::json!(1e300)),
        "[a-z:0-9-]{0,12}".prop_map(Value::String),
        Just(serde_json::json!([])),
        Just(serde_json::json!({})),
    ]
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(cases(64)))]

    #[test]
    fn the_parser_never_panics_on_any_text(text in "\\PC{0,200}") {
        let _ = parse_project(&text);
    }

    #[test]
    fn a_mutated_demo_is_either_refused_or_runs_without_panicking(
        path in prop::collection::vec(0usize..20, 1..4),
        replacement in any_json(),
    ) {
        let mut value: Value = serde_json::from_str(DEMO_PROJECT_JSON).expect("demo JSON");
        mutate(&mut value, &path, replacement);
        if let Ok(project) = deckhold_project::project_from_value(&value) {
            if let Ok(job) = run_job(&project) {
                let schedule = deckhold_project::schedule_for(&project, &job);
                for zone in &schedule.zones {
                    prop_assert!(zone.utilization.is_finite());
                    prop_assert!(zone.net_uplift_kpa.is_finite());
                }
            }
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(cases(12)))]

    #[test]
    fn more_wind_never_allows_a_wider_spacing(factor in 1.0f64..2.5) {
        let base = demo();
        let mut windier = base.clone();
        if let SiteWind::Nbc2020(site) = &mut windier.wind.site {
            site.q50_kpa = (site.q50_kpa * factor).min(3.0);
        }
        let before = spacings(&base);
        let after = spacings(&windier);
        for (label, role, spacing) in &before {
            let other = after
                .iter()
                .find(|(l, r, _)| l == label && r == role)
                .map(|(_, _, s)| *s)
                .unwrap_or(0.0);
            prop_assert!(other <= *spacing, "{label} {role:?}: {spacing} -> {other}");
        }
    }

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
