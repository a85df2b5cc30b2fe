//! Shared helpers for the cross-crate tests (see the test files beside this folder).
