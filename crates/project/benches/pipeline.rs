//! `cargo bench -p deckhold-project`: one roof through the pipeline without the PDF (the demo project,
//! and a 10 m x 8 m hip house like a batch row), and the PDF writer on the demo's schedule.

use criterion::{criterion_group, criterion_main, Criterion};
use deckhold_project::{parse_project, run_job, schedule_for, DEMO_PROJECT_JSON};
use deckhold_schedule::{schedule_pdf, PdfOptions};
use std::hint::black_box;

fn small_hip_house() -> String {
    let mut project: serde_json::Value =
        serde_json::from_str(DEMO_PROJECT_JSON).expect("the demo is JSON");
    project["building"]["footprint"]["rectangle"] =
        serde_json::json!({ "length_m": 10.0, "width_m": 8.0 });
    project["roof"]["shape"] = serde_json::json!("hip");
    project.to_string()
}

fn pipeline(c: &mut Criterion) {
    let house = small_hip_house();
    c.bench_function(
        "demo: parse, zones, resistance, spacing, report data",
        |b| {
            b.iter(|| {
                let project = parse_project(black_box(DEMO_PROJECT_JSON)).expect("demo parses");
                let job = run_job(&project).expect("demo runs");
                black_box(schedule_for(&project, &job))
            })
        },
    );
    c.bench_function("10 m x 8 m hip: parse, zones, resistance, spacing", |b| {
        b.iter(|| {
            let project = parse_project(black_box(&house)).expect("house parses");
            black_box(run_job(&project).expect("house runs"))
        })
    });
    let project = parse_project(DEMO_PROJECT_JSON).expect("demo parses");
    let schedule = schedule_for(&project, &run_job(&project).expect("demo runs"));
    let options = PdfOptions::default();
    c.bench_function("demo: PDF writer", |b| {
        b.iter(|| black_box(schedule_pdf(black_box(&schedule), &options).expect("pdf")))
    });
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(20);
    targets = pipeline
}
criterion_main!(benches);
