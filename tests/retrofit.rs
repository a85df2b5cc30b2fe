//! Retrofit (`check --add`): existing fasteners plus added ones, through the library pipeline on the
//! invented 1973 ranch re-roof. Invariants of the method, not outside checks.

use deckhold_project::{parse_project, plan_retrofit, run_job_with_nails, Project};
use deckhold_tests::fixture_text;
use proptest::prelude::*;

fn ranch() -> Project {
    parse_project(&fixture_text("us-retrofit-1970s.json")).expect("fixture parses")
}

fn with_credit(credit: f64) -> Project {
    let mut project = ranch();
    if let Some(existing) = project.existing.as_mut() {
        existing.credit = credit;
    }
    project
}

fn added_per_mm(project: &Project, added: &str) -> Vec<f64> {
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let pattern = project.existing.clone().expect("existing");
    plan_retrofit(project, &wind, &pattern, added)
        .expect("retrofit")
        .rows
        .iter()
        .map(|row| row.added_spacing_mm.map_or(0.0, |mm| 1.0 / mm))
        .collect()
}

#[test]
fn existing_nails_that_already_pass_get_nothing_added() {
    let mut project = ranch();
    let existing = project.existing.as_mut().expect("existing");
    existing.nail_id = "rsrs-01".to_string();
    existing.credit = 1.0;
    existing.by_zone.clear();
    existing.all_zones.edge_spacing_mm = 76.2;
    existing.all_zones.intermediate_spacing_mm = 76.2;
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let pattern = project.existing.clone().expect("existing");
    let plain = deckhold_project::check_pattern(&project, &wind, &pattern).expect("check");
    assert!(plain.passes(), "the 3 in pattern of RSRS-01 passes alone");
    let retrofit = plan_retrofit(&project, &wind, &pattern, "deck-screw-9x2.5").expect("retrofit");
    for row in &retrofit.rows {
        assert_eq!(
            row.added_spacing_mm, None,
            "{} {}",
            row.label, row.support_role
        );
        assert!(row.passes);
    }
}

#[test]
fn zones_where_the_existing_pattern_works_get_nothing_and_the_others_pass_with_additions() {
    let project = ranch();
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    let pattern = project.existing.clone().expect("existing");
    let plain = deckhold_project::check_pattern(&project, &wind, &pattern).expect("check");
    let retrofit = plan_retrofit(&project, &wind, &pattern, "rsrs-01").expect("retrofit");
    assert!(retrofit.passes());
    for row in &retrofit.rows {
        let alone = plain
            .rows
            .iter()
            .find(|p| p.label == row.label && p.support_role == row.support_role)
            .expect("same zones");
        assert_eq!(
            alone.passes,
            row.added_spacing_mm.is_none(),
            "{} {}",
            row.label,
            row.support_role
        );
    }
}

#[test]
fn credit_zero_adds_what_a_new_deck_would_need() {
    // With no credit the added fasteners carry everything: their spacing is the new-deck schedule's,
    // wherever that spacing can sit between the existing nails (here every new-deck spacing is 6 or
    // 12 in and the existing rows 6 and 12 in, so the offset row always keeps 3 in from its neighbours).
    let project = with_credit(0.0);
    let job = run_job_with_nails(&project, &["rsrs-01".to_string()]).expect("new deck");
    let plan = job.chosen().plan.clone().expect("plan");
    let wind = &job.wind;
    let pattern = project.existing.clone().expect("existing");
    let retrofit = plan_retrofit(&project, wind, &pattern, "rsrs-01").expect("retrofit");
    let mut compared = 0;
    for row in &retrofit.rows {
        let new_deck = plan
            .zone_roles
            .iter()
            .find(|role| {
                wind.zones[role.zone_index].label == row.label
                    && role.support_role == row.support_role
            })
            .and_then(|role| role.spacing_mm)
            .expect("a new-deck spacing");
        let gcd_ok = [152.4, 304.8].contains(&new_deck);
        if gcd_ok {
            assert_eq!(
                row.added_spacing_mm,
                Some(new_deck),
                "{} {}",
                row.label,
                row.support_role
            );
            compared += 1;
        }
    }
    assert!(compared >= 4, "only {compared} rows compared");
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(12))]
    #[test]
    fn more_credit_never_needs_more_added_fasteners(low in 0.0f64..1.0, step in 0.0f64..1.0) {
        let high = (low + step).min(1.0);
        let fewer = added_per_mm(&with_credit(high), "rsrs-01");
        let more = added_per_mm(&with_credit(low), "rsrs-01");
        for (at_high, at_low) in fewer.iter().zip(&more) {
            prop_assert!(at_high <= at_low, "credit {high}: {at_high} per mm, credit {low}: {at_low}");
        }
    }
}
