//! Every limit of the one table (`deckhold_core::limits::ALL`) is enforced at its boundary: a project with
//! the value at the limit is not refused for that key, and a value just beyond is refused with a message
//! naming the key the user wrote. The test walks the table itself: a limit added to the table without a
//! probe here (or a stated reason it is checked elsewhere) fails the test, so no limit goes untested.
//! A bounded proptest then draws values inside and outside each range.

use deckhold_core::limits::{Limit, ALL};
use deckhold_project::{project_from_value, run_job};
use proptest::prelude::*;
use serde_json::{json, Value};

const DEMO: &str = include_str!("../../../fixtures/demo-ca-gable.json");
const US: &str = include_str!("../../../fixtures/us-retrofit-1970s.json");

/// Limits not probed through the project reader, and the test that holds each at its boundary.
const CHECKED_ELSEWHERE: &[(&str, &str)] = &[
    (
        "project file",
        "crates/cli/tests/limit_boundaries.rs (bytes read by the binary)",
    ),
    (
        "batch file rows",
        "Limit::check_count unit tests: a million roofs cannot run in a test",
    ),
    (
        "batch file columns",
        "crates/cli/tests/limit_boundaries.rs (the batch reader)",
    ),
    (
        "batch file field",
        "crates/cli/tests/limit_boundaries.rs (the batch reader)",
    ),
    (
        "batch file id",
        "crates/cli/tests/limit_boundaries.rs (the batch reader)",
    ),
];

/// How a value is written into a project: a number at a key, a string of N characters, a list of N
/// entries.
#[derive(Clone, Copy)]
enum Kind {
    Number,
    /// A whole number at a key (a category).
    Whole,
    Chars,
    Entries,
}

#[derive(Clone, Copy)]
/// One limit's way into a project; `job` when the check is made by the method (wind) rather than the
/// reader.
struct Probe {
    /// The key the messages must name.
    key: &'static str,
    kind: Kind,
    job: bool,
    /// Based on the US fixture (ASCE 7 keys, user fasteners) rather than the demo.
    us: bool,
    set: fn(&mut Value, f64),
}

fn base(us: bool) -> Value {
    serde_json::from_str(if us { US } else { DEMO }).expect("fixture parses")
}

/// Sets the value at `path` (object keys, or list indices written as numbers), creating the last key.
fn put(value: &mut Value, path: &[&str], new: Value) {
    let (last, parents) = path.split_last().expect("a path");
    let pointer: String = parents.iter().map(|key| format!("/{key}")).collect();
    match value.pointer_mut(&pointer) {
        Some(Value::Object(map)) => {
            map.insert((*last).to_string(), new);
        }
        Some(Value::Array(items)) => {
            let index: usize = last.parse().expect("a list index");
            items[index] = new;
        }
        _ => panic!("no {pointer} in the base project"),
    }
}

fn chars(count: f64) -> Value {
    Value::from("x".repeat(count as usize))
}

/// A rectilinear staircase outline with `corners` points (at least 4; an odd count puts one on an edge).
fn staircase(corners: usize) -> Value {
    let steps = corners / 2 - 1;
    let mut points = vec![json!([0.0, 0.0])];
    for step in 0..steps {
        let x = 10.0 + step as f64 * 0.4;
        let y = step as f64 * 0.4;
        points.push(json!([x, y]));
        points.push(json!([x, y + 0.4]));
    }
    points.push(json!([0.0, steps as f64 * 0.4]));
    if corners % 2 == 1 {
        // An odd count: one more point, on the first edge.
        points.insert(1, json!([5.0, 0.0]));
    }
    Value::Array(points)
}

fn override_item(points: usize, source: Value) -> Value {
    let curve: Vec<Value> = (0..points)
        .map(|i| json!({"area_m2": 1.0 + i as f64, "coefficient": -2.5}))
        .collect();
    json!({"code_zone": "r", "points": curve, "source": source})
}

fn probes() -> Vec<(&'static str, Probe)> {
    use Kind::*;
    let number = |key, set| Probe {
        key,
        kind: Number,
        job: false,
        us: false,
        set,
    };
    let us_number = |key, set| Probe {
        key,
        kind: Number,
        job: false,
        us: true,
        set,
    };
    vec![
        (
            "project.name, .site, .owner, .prepared_by",
            Probe {
                key: "project.name",
                kind: Chars,
                job: false,
                us: false,
                set: |p, v| put(p, &["project", "name"], chars(v)),
            },
        ),
        (
            "project.notes",
            Probe {
                key: "project.notes",
                kind: Chars,
                job: false,
                us: false,
                set: |p, v| put(p, &["project", "notes"], chars(v)),
            },
        ),
        (
            "ids (basis, nails, species, panel, code_zone)",
            Probe {
                key: "fasteners[0].id",
                kind: Chars,
                job: false,
                us: true,
                set: |p, v| {
                    let id = "s".repeat(v as usize);
                    put(p, &["fasteners", "0", "id"], Value::from(id.clone()));
                    put(p, &["nails"], json!(["8d-common", id]));
                },
            },
        ),
        (
            "coefficient_overrides[].source",
            Probe {
                key: "coefficient_overrides[0].source",
                kind: Chars,
                job: false,
                us: false,
                set: |p, v| {
                    put(
                        p,
                        &["coefficient_overrides"],
                        json!([override_item(2, chars(v))]),
                    )
                },
            },
        ),
        (
            "nails",
            Probe {
                key: "nails",
                kind: Entries,
                job: false,
                us: false,
                set: |p, v| {
                    put(
                        p,
                        &["nails"],
                        Value::Array(vec![Value::from("common-63x3.25"); v as usize]),
                    )
                },
            },
        ),
        (
            "coefficient_overrides",
            Probe {
                key: "coefficient_overrides",
                kind: Entries,
                job: false,
                us: false,
                set: |p, v| {
                    put(
                        p,
                        &["coefficient_overrides"],
                        Value::Array(vec![override_item(2, Value::from("table")); v as usize]),
                    )
                },
            },
        ),
        (
            "coefficient_overrides[].points",
            Probe {
                key: "coefficient_overrides[0].points",
                kind: Entries,
                job: false,
                us: false,
                set: |p, v| {
                    put(
                        p,
                        &["coefficient_overrides"],
                        json!([override_item(v as usize, Value::from("table"))]),
                    )
                },
            },
        ),
        (
            "building.footprint.polygon_m",
            Probe {
                key: "building.footprint.polygon_m",
                kind: Entries,
                job: false,
                us: false,
                set: |p, v| {
                    put(
                        p,
                        &["building", "footprint"],
                        json!({"polygon_m": staircase(v as usize)}),
                    )
                },
            },
        ),
        (
            "building.footprint.rectangle.length_m, .width_m",
            number("building.footprint.rectangle.length_m", |p, v| {
                put(
                    p,
                    &["building", "footprint", "rectangle", "length_m"],
                    json!(v),
                )
            }),
        ),
        (
            "building.footprint.polygon_m[][]",
            number("building.footprint.polygon_m", |p, v| {
                let (a, b) = if v > 0.0 {
                    (v - 14.0, v)
                } else {
                    (v, v + 14.0)
                };
                put(
                    p,
                    &["building", "footprint"],
                    json!({"polygon_m": [[a, 0.0], [b, 0.0], [b, 8.0], [a, 8.0]]}),
                );
            }),
        ),
        (
            "building.eave_height_m",
            number("building.eave_height_m", |p, v| {
                put(p, &["building", "eave_height_m"], json!(v))
            }),
        ),
        (
            "roof.slope_deg",
            number("roof.slope", |p, v| {
                remove(p, &["roof"], "slope");
                put(p, &["roof", "slope_deg"], json!(v));
            }),
        ),
        (
            "roof.slope_deg (flat roof)",
            Probe {
                key: "roof.slope",
                kind: Number,
                job: true,
                us: false,
                set: |p, v| {
                    remove(p, &["roof"], "slope");
                    put(p, &["roof", "shape"], json!("flat"));
                    remove(p, &["roof"], "ridge_along");
                    put(p, &["roof", "slope_deg"], json!(v));
                },
            },
        ),
        (
            "roof.slope_deg (monoslope roof)",
            Probe {
                key: "roof.slope",
                kind: Number,
                job: true,
                us: false,
                set: |p, v| {
                    remove(p, &["roof"], "slope");
                    put(p, &["roof", "shape"], json!("monoslope"));
                    put(p, &["roof", "slope_deg"], json!(v));
                },
            },
        ),
        (
            "roof.overhang_mm, .eave_overhang_mm, .rake_overhang_mm",
            number("roof.eave_overhang_mm", |p, v| {
                put(p, &["roof", "eave_overhang_mm"], json!(v))
            }),
        ),
        (
            "roof.dead_load_kpa",
            number("roof.dead_load_kpa", |p, v| {
                put(p, &["roof", "dead_load_kpa"], json!(v))
            }),
        ),
        (
            "wind.q50_kpa",
            number("wind.q50_kpa", |p, v| {
                put(p, &["wind", "q50_kpa"], json!(v))
            }),
        ),
        (
            "wind.topographic_factor",
            number("wind.topographic_factor", |p, v| {
                put(p, &["wind", "topographic_factor"], json!(v))
            }),
        ),
        (
            "wind.internal_category",
            Probe {
                key: "wind.internal_category",
                kind: Whole,
                job: false,
                us: false,
                set: |p, v| put(p, &["wind", "internal_category"], json!(v)),
            },
        ),
        (
            "wind.speed_mph",
            us_number("wind.speed_mph", |p, v| {
                put(p, &["wind", "speed_mph"], json!(v));
            }),
        ),
        (
            "wind.kzt",
            us_number("wind.kzt", |p, v| {
                put(p, &["wind", "kzt"], json!(v));
            }),
        ),
        (
            "wind.ground_elevation_m",
            us_number("wind.ground_elevation_m", |p, v| {
                remove(p, &["wind"], "ground_elevation_ft");
                put(p, &["wind", "ground_elevation_m"], json!(v));
            }),
        ),
        (
            "coefficient_overrides[].points[].area_m2",
            number("coefficient_overrides[0].points[0].area", |p, v| {
                put(
                    p,
                    &["coefficient_overrides"],
                    json!([{"code_zone": "r", "points": [{"area_m2": v, "coefficient": -2.5}], "source": "table"}]),
                )
            }),
        ),
        (
            "coefficient_overrides[].points[].coefficient",
            number("coefficient_overrides[0].points[0].coefficient", |p, v| {
                put(
                    p,
                    &["coefficient_overrides"],
                    json!([{"code_zone": "r", "points": [{"area_m2": 1.0, "coefficient": v}], "source": "table"}]),
                )
            }),
        ),
        (
            "framing.spacing_mm",
            number("framing.spacing_mm", |p, v| {
                put(p, &["framing", "spacing_mm"], json!(v))
            }),
        ),
        (
            "framing.member_width_mm",
            number("framing.member_width_mm", |p, v| {
                put(p, &["framing", "member_width_mm"], json!(v))
            }),
        ),
        (
            "framing.member_depth_mm",
            number("framing.member_depth_mm", |p, v| {
                put(p, &["framing", "member_depth_mm"], json!(v))
            }),
        ),
        (
            "deck.thickness_mm",
            number("deck.thickness_mm", |p, v| {
                put(p, &["deck", "thickness_mm"], json!(v))
            }),
        ),
        (
            "deck.panel_length_mm",
            number("deck.panel_length_mm", |p, v| {
                put(p, &["deck", "panel_length_mm"], json!(v))
            }),
        ),
        (
            "deck.panel_width_mm",
            number("deck.panel_width_mm", |p, v| {
                put(p, &["deck", "panel_width_mm"], json!(v))
            }),
        ),
        (
            "deck.between_mm",
            number("deck.between_mm", |p, v| {
                put(p, &["deck", "between_mm"], json!(v))
            }),
        ),
        (
            "existing.edge_spacing_mm, .intermediate_spacing_mm",
            number("existing.edge_spacing_mm", |p, v| {
                put(
                    p,
                    &["existing"],
                    json!({"nail": "common-51x2.84", "edge_spacing_mm": v, "intermediate_spacing_mm": 300}),
                )
            }),
        ),
        (
            "existing.credit",
            number("existing.credit", |p, v| {
                put(
                    p,
                    &["existing"],
                    json!({"nail": "common-51x2.84", "edge_spacing_mm": 150, "intermediate_spacing_mm": 300, "credit": v}),
                )
            }),
        ),
        (
            "fasteners[].diameter_mm",
            us_number("fasteners[0].diameter_mm", |p, v| {
                si_fastener(p, "diameter_mm", v)
            }),
        ),
        (
            "fasteners[].length_mm",
            us_number("fasteners[0].length_mm", |p, v| {
                si_fastener(p, "length_mm", v)
            }),
        ),
        (
            "fasteners[].head_diameter_mm",
            us_number("fasteners[0].head_diameter_mm", |p, v| {
                si_fastener(p, "head_diameter_mm", v)
            }),
        ),
        (
            "fasteners[].thread_length_mm",
            us_number("fasteners[0].thread_length_mm", |p, v| {
                si_fastener(p, "thread_length_mm", v)
            }),
        ),
        (
            "fasteners[].withdrawal_n_per_mm",
            us_number("fasteners[0].withdrawal_n_per_mm", |p, v| {
                si_fastener(p, "withdrawal_n_per_mm", v)
            }),
        ),
    ]
}

fn remove(value: &mut Value, path: &[&str], key: &str) {
    let pointer: String = path.iter().map(|key| format!("/{key}")).collect();
    if let Some(Value::Object(map)) = value.pointer_mut(&pointer) {
        map.remove(key);
    }
}

/// The US fixture's screw written in SI keys, with `key` set to `v` (the others at mid-range values).
fn si_fastener(value: &mut Value, key: &str, v: f64) {
    let mut screw = json!({
        "id": "deck-screw-9x2.5", "kind": "screw", "diameter_mm": 4.5, "length_mm": 63.5,
        "head_diameter_mm": 8.6, "thread_length_mm": 41.3, "withdrawal_n_per_mm": 16.6,
        "source": "invented demo evaluation report"
    });
    if key == "head_diameter_mm" {
        // The head must exceed the shank: the thinnest shank lets the smallest head through.
        screw["diameter_mm"] = json!(1.5);
    }
    screw[key] = json!(v);
    value["fasteners"] = json!([screw]);
}

/// The project for `probe` at `v`, from its base fixture.
fn project_at(probe: &Probe, v: f64) -> Value {
    let mut project = base(probe.us);
    (probe.set)(&mut project, v);
    project
}

/// The refusal of `project`, if any: the reader's, then (for a method limit) the job's.
fn refusal(project: &Value, job: bool) -> Option<String> {
    match project_from_value(project) {
        Err(error) => Some(error.to_string()),
        Ok(parsed) if job => run_job(&parsed).err().map(|error| format!("{error:#}")),
        Ok(_) => None,
    }
}

/// Just beyond `edge` (outward by `sign`) in the probe's kind.
fn beyond(kind: Kind, edge: f64, sign: f64) -> f64 {
    match kind {
        Kind::Number => edge + sign * (edge.abs() * 1e-6).max(1e-6),
        Kind::Whole | Kind::Chars | Kind::Entries => edge + sign,
    }
}

fn probe_for(limit: &Limit) -> Option<Probe> {
    probes()
        .into_iter()
        .find(|(key, _)| *key == limit.key)
        .map(|(_, probe)| probe)
}

#[test]
fn every_limit_has_a_probe_or_a_stated_home() {
    let missing: Vec<&str> = ALL
        .iter()
        .filter(|limit| probe_for(limit).is_none())
        .filter(|limit| !CHECKED_ELSEWHERE.iter().any(|(key, _)| *key == limit.key))
        .map(|limit| limit.key)
        .collect();
    assert!(
        missing.is_empty(),
        "limits without a boundary probe: {missing:?}"
    );
}

#[test]
fn every_limit_holds_at_its_boundary() {
    let mut problems = Vec::new();
    let mut cases = 0;
    for limit in ALL {
        let Some(probe) = probe_for(limit) else {
            continue;
        };
        for (edge, sign) in [(limit.min, -1.0), (limit.max, 1.0)] {
            cases += 2;
            let inside = refusal(&project_at(&probe, edge), probe.job);
            if let Some(message) = inside.filter(|m| m.contains(probe.key)) {
                problems.push(format!("{} at {edge}: refused: {message}", limit.key));
            }
            let outside_value = beyond(probe.kind, edge, sign);
            if outside_value < 0.0 && !matches!(probe.kind, Kind::Number) {
                continue; // no count below zero
            }
            match refusal(&project_at(&probe, outside_value), probe.job) {
                Some(message) if message.contains(probe.key) => {}
                other => problems.push(format!(
                    "{} at {outside_value}: not refused naming {}: {other:?}",
                    limit.key, probe.key
                )),
            }
        }
    }
    assert!(cases >= 60, "only {cases} boundary cases");
    assert!(problems.is_empty(), "{}", problems.join("\n"));
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(48))]
    /// Any value inside a limit passes its check; any value outside is refused naming the key.
    #[test]
    fn values_inside_pass_and_outside_are_refused(index in 0..ALL.len(), fraction in 0.0..1.0f64, above in any::<bool>(), excess in 0.001..0.5f64) {
        let limit = &ALL[index];
        if let Some(probe) = probe_for(limit) {
            let span = limit.max - limit.min;
            let mut inside = limit.min + fraction * span;
            if !matches!(probe.kind, Kind::Number) {
                // Counts are whole; long strings and lists are capped so a case stays fast.
                inside = inside.round().min(limit.min.max(40.0));
            }
            let refused = refusal(&project_at(&probe, inside), probe.job);
            prop_assert!(!refused.as_deref().is_some_and(|m| m.contains(probe.key)), "{} at {inside}: {refused:?}", limit.key);
            let outside = if above { limit.max + excess * span.max(1.0) } else { limit.min - excess * span.max(1.0) };
            let outside = if matches!(probe.kind, Kind::Number) { outside } else { outside.round().max(limit.max + 1.0) };
            if outside >= 0.0 || matches!(probe.kind, Kind::Number) {
                let refused = refusal(&project_at(&probe, outside), probe.job);
                prop_assert!(refused.as_deref().is_some_and(|m| m.contains(probe.key)), "{} at {outside}: {refused:?}", limit.key);
            }
        }
    }
}
