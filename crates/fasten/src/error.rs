//! Why a catalog lookup or a resistance calculation was refused.
//!
//! Every message names the input (field or id) and what would have been accepted, so the caller can
//! show it to the user unchanged.

use thiserror::Error;

/// The errors of the per-nail part of `deckhold-fasten`.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum FastenError {
    /// A catalog id that does not exist; `close` holds the nearest ids.
    #[error("{kind} `{id}` is not in the catalog; close ids: {}", close_list(.close))]
    UnknownId {
        kind: &'static str,
        id: String,
        close: Vec<String>,
    },

    /// A number outside the range the method accepts.
    #[error("{field}: {value} {unit} is outside {range}")]
    OutOfRange {
        field: &'static str,
        value: f64,
        unit: &'static str,
        range: String,
    },

    /// The nail does not reach the minimum penetration into the point-side member.
    #[error(
        "penetration_mm: {penetration_mm:.1} mm is below the minimum {min_mm:.1} mm for nail `{nail}` ({rule})"
    )]
    PenetrationBelowMinimum {
        nail: String,
        penetration_mm: f64,
        min_mm: f64,
        rule: &'static str,
    },

    /// Withdrawal from end grain, which both standards forbid for nails.
    #[error("grain: nails shall not be loaded in withdrawal from end grain ({rule}); only `side` is accepted")]
    EndGrainWithdrawal { rule: &'static str },

    /// A load duration the method does not allow nails in withdrawal to carry.
    #[error("load: `{load}` is not accepted for {method}: {rule}; only `short` is accepted")]
    LoadDurationNotPermitted {
        method: &'static str,
        load: &'static str,
        rule: &'static str,
    },

    /// A species group without the property this method needs.
    #[error("species `{species}` has no {property} for {method}; groups that have one: {}", close_list(.choices))]
    MissingSpeciesProperty {
        species: String,
        property: &'static str,
        method: &'static str,
        choices: Vec<String>,
    },

    /// A nail the method does not cover (for example stainless steel under CSA O86).
    #[error("nail `{nail}`: {reason}")]
    NailNotCovered { nail: String, reason: String },

    /// Catalog data that does not parse or does not pass its checks.
    #[error("catalog {file}: {message}")]
    Catalog { file: &'static str, message: String },
}

fn close_list(ids: &[String]) -> String {
    if ids.is_empty() {
        "(none)".to_string()
    } else {
        ids.join(", ")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn unknown_id_lists_the_close_ids() {
        let error = FastenError::UnknownId {
            kind: "nail",
            id: "8d-comon".to_string(),
            close: vec!["8d-common".to_string(), "6d-common".to_string()],
        };
        assert_eq!(
            error.to_string(),
            "nail `8d-comon` is not in the catalog; close ids: 8d-common, 6d-common"
        );
    }

    #[test]
    fn out_of_range_names_field_and_range() {
        let error = FastenError::OutOfRange {
            field: "deck.thickness_mm",
            value: -2.0,
            unit: "mm",
            range: "0 < t".to_string(),
        };
        assert_eq!(
            error.to_string(),
            "deck.thickness_mm: -2 mm is outside 0 < t"
        );
    }
}
