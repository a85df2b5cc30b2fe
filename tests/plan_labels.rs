//! The crew sheet's plan: no two labels on it overlap (line numbers, dimensions, the scale bar, plane
//! names, zone labels, the roof-line table, a monoslope's eave marks), every plane is named on it, a
//! monoslope zoned apart along its high eave marks which eave is high, and a roof with hips or
//! valleys carries their lengths. For every fixture, with the crew sheet on its own and on one page,
//! and for small and odd roofs where space is short. No outside source: a drawing rule.

use deckhold_project::{parse_project, run_job, schedule_for};
use deckhold_schedule::{plan_label_boxes, PdfOptions, PlanLabelBox, Schedule};
use deckhold_tests::{fixture_text, GOOD_FIXTURES};
use serde_json::{json, Value};

fn schedule_of(value: &Value) -> Schedule {
    let project = parse_project(&value.to_string()).expect("the roof parses");
    let job = run_job(&project).expect("the roof runs");
    schedule_for(&project, &job)
}

fn overlap(a: &PlanLabelBox, b: &PlanLabelBox) -> bool {
    a.x_mm < b.x_mm + b.w_mm
        && b.x_mm < a.x_mm + a.w_mm
        && a.y_mm < b.y_mm + b.h_mm
        && b.y_mm < a.y_mm + a.h_mm
}

/// The checks on one schedule, both crew-sheet layouts; returns the number of boxes seen.
fn check(name: &str, schedule: &Schedule) -> usize {
    let mut seen = 0;
    for crew_pages in [None, Some(1)] {
        let options = PdfOptions {
            crew_pages,
            ..PdfOptions::default()
        };
        let boxes = plan_label_boxes(schedule, &options);
        for (i, a) in boxes.iter().enumerate() {
            for b in &boxes[i + 1..] {
                assert!(
                    !overlap(a, b),
                    "{name} (crew pages {crew_pages:?}): '{}' overlaps '{}'\n{a:?}\n{b:?}",
                    a.text,
                    b.text
                );
            }
        }
        for plane in &schedule.plan.planes {
            assert!(
                boxes.iter().any(|b| b.text == plane.name),
                "{name} (crew pages {crew_pages:?}): plane {} is not named on the plan",
                plane.name
            );
        }
        let has_hips_or_valleys = schedule
            .plan
            .roof_lines
            .iter()
            .any(|l| matches!(l.kind.as_str(), "hip" | "valley"));
        if has_hips_or_valleys {
            assert!(
                boxes.iter().any(|b| b.text.starts_with("ROOF LINES")),
                "{name} (crew pages {crew_pages:?}): no table of hip and valley lengths"
            );
        }
        seen += boxes.len();
    }
    seen
}

/// A monoslope zoned apart along its high eave (ASCE 7-22 Figure 30.3-5A: zones 2' and 3' run along
/// the high eave only) marks its high eave and its low eave on the plan, the high mark up the slope
/// from the low one; no other roof carries either mark. Both crew-sheet layouts. Returns whether the
/// roof was marked.
fn check_eave_marks(name: &str, value: &Value, schedule: &Schedule) -> bool {
    let high_zones = schedule
        .plan
        .zones
        .iter()
        .any(|zone| zone.label.base() != zone.label);
    let monoslope = value["roof"]["shape"] == "monoslope" && high_zones;
    for crew_pages in [None, Some(1)] {
        let options = PdfOptions {
            crew_pages,
            ..PdfOptions::default()
        };
        let boxes = plan_label_boxes(schedule, &options);
        let centre = |text: &str| -> Vec<[f64; 2]> {
            boxes
                .iter()
                .filter(|b| b.text == text)
                .map(|b| [b.x_mm + b.w_mm / 2.0, b.y_mm + b.h_mm / 2.0])
                .collect()
        };
        let (high, low) = (centre("HIGH EAVE"), centre("low eave"));
        if !monoslope {
            assert!(
                high.is_empty() && low.is_empty(),
                "{name} (crew pages {crew_pages:?}): eave marks on a roof that is no monoslope"
            );
            continue;
        }
        assert_eq!(
            (high.len(), low.len()),
            (1, 1),
            "{name} (crew pages {crew_pages:?}): one high and one low eave mark"
        );
        // The page is the plan scaled and moved, not turned: down the slope on the page is the plane's.
        let down = schedule.plan.planes[0].downslope_m;
        let fall = (low[0][0] - high[0][0]) * down[0] + (low[0][1] - high[0][1]) * down[1];
        assert!(
            fall > 0.0,
            "{name} (crew pages {crew_pages:?}): the high eave mark is not up the slope from the low"
        );
    }
    monoslope
}

#[test]
fn no_two_labels_overlap_on_any_fixture_plan() {
    for name in GOOD_FIXTURES {
        let value: Value = serde_json::from_str(&fixture_text(name)).expect("fixture JSON");
        let schedule = schedule_of(&value);
        let seen = check(name, &schedule);
        assert!(seen > 10, "{name}: only {seen} labels");
        let marked = check_eave_marks(name, &value, &schedule);
        assert_eq!(
            marked,
            *name == "us-lean-to-addition.json",
            "{name}: eave marks"
        );
    }
    assert!(
        GOOD_FIXTURES.contains(&"us-lean-to-addition.json"),
        "the monoslope fixture is checked"
    );
}

#[test]
fn a_monoslope_with_its_eaves_up_and_down_the_page_marks_them_clear_of_other_labels() {
    let mut value: Value =
        serde_json::from_str(&fixture_text("us-lean-to-addition.json")).expect("fixture JSON");
    value["building"]["footprint"] = json!({ "rectangle": { "length_ft": 14, "width_ft": 26 } });
    value["roof"]["ridge_along"] = json!("width");
    let schedule = schedule_of(&value);
    check("small monoslope turned", &schedule);
    assert!(check_eave_marks(
        "small monoslope turned",
        &value,
        &schedule
    ));
}

/// The L bungalow's project with another outline and roof.
fn odd_roof(footprint: Value, roof: Value) -> Value {
    let mut value: Value =
        serde_json::from_str(&fixture_text("ca-l-hip-bungalow.json")).expect("fixture JSON");
    value["building"]["footprint"] = footprint;
    value["roof"] = roof;
    value["building"]["eave_height_m"] = json!(2.4);
    value
}

#[test]
fn no_two_labels_overlap_on_small_and_odd_roofs() {
    let hip = |slope: &str| json!({ "shape": "hip", "slope": slope, "overhang_mm": 300 });
    let gable = json!({ "shape": "gable", "slope": "8:12", "eave_overhang_mm": 300, "rake_overhang_mm": 150 });
    let roofs = [
        (
            "4 x 4 m hip",
            json!({ "rectangle": { "length_m": 4, "width_m": 4 } }),
            hip("4:12"),
        ),
        (
            "small L hip, 3 m wings",
            json!({ "polygon_m": [[0, 0], [7, 0], [7, 3], [3, 3], [3, 6], [0, 6]] }),
            hip("6:12"),
        ),
        (
            "small T cross gable",
            json!({ "polygon_m": [[0, 0], [10, 0], [10, 4], [7, 4], [7, 9], [3, 9], [3, 4], [0, 4]] }),
            gable.clone(),
        ),
        (
            "U hip",
            json!({ "polygon_m": [[0, 0], [16, 0], [16, 12], [11, 12], [11, 5], [5, 5], [5, 12], [0, 12]] }),
            hip("5:12"),
        ),
        (
            "long thin L gable",
            json!({ "polygon_m": [[0, 0], [30, 0], [30, 4], [4, 4], [4, 12], [0, 12]] }),
            gable,
        ),
        (
            "Z hip, 8 corners",
            json!({ "polygon_m": [[0, 0], [8, 0], [8, 4], [14, 4], [14, 10], [6, 10], [6, 6], [0, 6]] }),
            hip("12:12"),
        ),
        (
            "small monoslope, eaves up and down the page",
            json!({ "rectangle": { "length_m": 5, "width_m": 8 } }),
            json!({ "shape": "monoslope", "slope": "3:12", "ridge_along": "width", "overhang_mm": 300 }),
        ),
    ];
    for (name, footprint, roof) in roofs {
        let value = odd_roof(footprint, roof);
        let schedule = schedule_of(&value);
        check(name, &schedule);
        check_eave_marks(name, &value, &schedule);
    }
}
