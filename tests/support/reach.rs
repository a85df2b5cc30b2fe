//! Running a property and counting how many of its cases reached the computation (issue 18: a property
//! that only exercises the refusals proves nothing about the method).

use proptest::strategy::Strategy;
use proptest::test_runner::{Config, TestCaseError, TestRunner};
use std::cell::Cell;

/// What the count counts, in the printed line.
pub const REACHED: &str = "reached the job";

/// The case count: `PROPTEST_CASES` when set, else `default`.
pub fn cases(default: u32) -> u32 {
    std::env::var("PROPTEST_CASES")
        .ok()
        .and_then(|text| text.parse().ok())
        .unwrap_or(default)
}

/// Runs `cases` cases of `body`, which returns whether the case reached the job; prints the share and
/// fails below one half.
pub fn run_counted<S: Strategy>(
    name: &str,
    cases: u32,
    counted: &str,
    strategy: S,
    body: impl Fn(S::Value) -> Result<bool, TestCaseError>,
) {
    let (tried, reached) = (Cell::new(0u32), Cell::new(0u32));
    let mut runner = TestRunner::new(config(cases));
    let result = runner.run(&strategy, |case| {
        let got_there = body(case)?;
        tried.set(tried.get() + 1);
        reached.set(reached.get() + u32::from(got_there));
        Ok(())
    });
    if let Err(error) = result {
        panic!("{name}: {error}");
    }
    let (tried, reached) = (tried.get(), reached.get());
    println!(
        "{name}: {reached} of {tried} cases {counted} ({:.0} %)",
        100.0 * f64::from(reached) / f64::from(tried.max(1))
    );
    assert!(
        2 * reached >= tried,
        "{name}: only {reached} of {tried} cases {counted}; the mutations are refused too often"
    );
}

/// A runner of `cases` cases that keeps no regression file (the cases are printed on failure).
pub fn config(cases: u32) -> Config {
    Config {
        cases,
        failure_persistence: None,
        ..Config::default()
    }
}
