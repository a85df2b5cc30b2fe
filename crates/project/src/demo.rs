//! The built-in demo project: an invented workshop on an invented site, for trying the tool.

/// The demo project file, as shipped in `fixtures/demo-ca-gable.json`.
pub const DEMO_PROJECT_JSON: &str = include_str!("../../../fixtures/demo-ca-gable.json");
