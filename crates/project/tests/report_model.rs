//! The report model (`schedule_for`): what the writers are given, checked against the job it came from.

use deckhold_project::{parse_project, run_job, schedule_for};
use std::path::PathBuf;

fn schedule_of(name: &str) -> (deckhold_project::Job, deckhold_model::Schedule) {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../../fixtures")
        .join(name);
    let text = std::fs::read_to_string(&path).expect("fixture");
    let project = parse_project(&text).expect("parses");
    let job = run_job(&project).expect("runs");
    let schedule = schedule_for(&project, &job);
    (job, schedule)
}

#[test]
fn the_rows_are_the_chosen_nails_plan_worst_zones_first() {
    for name in ["demo-ca-gable.json", "us-hip.json", "ca-l-shaped-flat.json"] {
        let (job, schedule) = schedule_of(name);
        let chosen = job.chosen();
        let plan = chosen.plan.as_ref().expect("planned");
        assert_eq!(schedule.nail.id, chosen.nail.id, "{name}");
        assert_eq!(schedule.zones.len(), plan.zone_roles.len(), "{name}");
        // Worst first: corner, edge, interior, then the overhangs; panel edges before intermediates.
        let order: Vec<(String, String)> = schedule
            .zones
            .iter()
            .map(|z| {
                (
                    z.label.as_str().to_string(),
                    z.support_role.as_str().to_string(),
                )
            })
            .collect();
        let rank = |label: &str| {
            [
                "corner",
                "edge",
                "interior",
                "overhang-corner",
                "overhang-edge",
                "overhang-interior",
            ]
            .iter()
            .position(|l| *l == label)
            .unwrap_or_else(|| panic!("{name}: unknown zone {label}"))
        };
        let keys: Vec<(usize, bool)> = order
            .iter()
            .map(|(label, role)| (rank(label), role != "panel-edge"))
            .collect();
        let mut sorted = keys.clone();
        sorted.sort();
        assert_eq!(keys, sorted, "{name}: {order:?}");
        for row in &schedule.zones {
            let role = plan
                .zone_roles
                .iter()
                .find(|r| {
                    job.wind.zones[r.zone_index].label == row.label
                        && r.support_role == row.support_role
                })
                .expect("the row comes from the plan");
            assert_eq!(row.spacing_mm, role.spacing_mm, "{name}");
            assert_eq!(row.nail_id, schedule.nail.id, "{name}");
            assert_eq!(row.governing_line, role.governing_line, "{name}");
            assert!((row.utilization - role.utilization).abs() < 1e-12, "{name}");
            // Utilization is demand over the governing resistance.
            assert!(
                (row.utilization - row.demand_n / schedule.resistance.governing_n).abs() < 1e-9,
                "{name}: {row:?}"
            );
        }
        let total: u64 = schedule.zones.iter().map(|z| z.nail_count).sum();
        assert_eq!(schedule.total_nail_count, total, "{name}");
        assert_eq!(
            schedule.feasible,
            schedule.zones.iter().all(|z| z.spacing_mm.is_some()),
            "{name}"
        );
        for caution in deckhold_model::standard_cautions() {
            assert!(schedule.cautions.contains(&caution), "{name}: {caution}");
        }
        assert_eq!(
            schedule.zone_pressures.len(),
            job.wind.zones.len(),
            "{name}"
        );
    }
}

#[test]
fn an_infeasible_project_names_nails_that_would_work() {
    let (job, schedule) = schedule_of("ca-no-feasible-nail.json");
    assert!(!schedule.feasible);
    assert!(!job.feasible());
    assert!(schedule.zones.iter().any(|z| z.spacing_mm.is_none()));
    assert!(!schedule.alternatives.is_empty());
    // None of the candidates works anywhere-complete: the report says so and what to try instead.
    assert!(
        schedule.alternatives[0].starts_with("No candidate nail works in every zone."),
        "{:?}",
        schedule.alternatives
    );
}
