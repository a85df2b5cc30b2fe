//! Wood species groups of the framing: the density each standard's withdrawal equation needs.
//!
//! CSA O86 uses the mean oven-dry relative density of the species combination; NDS 2018 uses the
//! assigned specific gravity G of Table 12.3.3A. The two are close but not the same number (Hem-Fir:
//! 0.46 in O86, 0.43 in the NDS), so each group carries both, or only the one its standard assigns.

use crate::catalog::{CatalogBasis, SourcedValue};
use crate::error::FastenError;
use serde::{Deserialize, Serialize};

/// The kind of point-side member the nail goes into.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum MemberKind {
    /// Sawn lumber: rafter, joist, truss chord.
    Sawn,
    /// Cross-laminated timber, nailed into its face.
    Clt,
}

impl MemberKind {
    pub fn as_str(self) -> &'static str {
        match self {
            MemberKind::Sawn => "sawn",
            MemberKind::Clt => "clt",
        }
    }
}

/// One species group.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Species {
    pub id: String,
    pub name: String,
    pub basis: CatalogBasis,
    /// Mean oven-dry relative density for CSA O86 (None: O86 assigns none).
    pub o86_relative_density: Option<SourcedValue>,
    /// Assigned specific gravity G for NDS 2018 (None: the NDS assigns none).
    pub nds_specific_gravity: Option<SourcedValue>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct SpeciesFile {
    #[serde(rename = "_about")]
    _about: Option<String>,
    species: Vec<Species>,
}

/// Parses and checks a species catalog.
pub fn parse_species(json: &str, file: &'static str) -> Result<Vec<Species>, FastenError> {
    let parsed: SpeciesFile = serde_json::from_str(json).map_err(|error| FastenError::Catalog {
        file,
        message: error.to_string(),
    })?;
    for (index, group) in parsed.species.iter().enumerate() {
        let bad = |message: String| FastenError::Catalog {
            file,
            message: format!("species `{}`: {message}", group.id),
        };
        if parsed.species[..index]
            .iter()
            .any(|other| other.id == group.id)
        {
            return Err(bad("id appears twice".to_string()));
        }
        if group.o86_relative_density.is_none() && group.nds_specific_gravity.is_none() {
            return Err(bad(
                "needs o86_relative_density or nds_specific_gravity".to_string()
            ));
        }
        for (name, value) in [
            ("o86_relative_density", &group.o86_relative_density),
            ("nds_specific_gravity", &group.nds_specific_gravity),
        ] {
            if let Some(value) = value {
                if !(value.value.is_finite() && value.value > 0.0 && value.value < 1.0) {
                    return Err(bad(format!(
                        "{name} = {} is outside 0 < G < 1",
                        value.value
                    )));
                }
            }
        }
    }
    Ok(parsed.species)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_group_without_any_density_is_refused() {
        let json = r#"{"species": [{"id": "x", "name": "X", "basis": "ca",
            "o86_relative_density": null, "nds_specific_gravity": null}]}"#;
        assert!(parse_species(json, "test.json").is_err());
    }

    #[test]
    fn a_density_of_one_or_more_is_refused() {
        let json = r#"{"species": [{"id": "x", "name": "X", "basis": "ca",
            "o86_relative_density": {"value": 1.2, "source": "s", "confidence": "checked"},
            "nds_specific_gravity": null}]}"#;
        assert!(parse_species(json, "test.json").is_err());
    }

    #[test]
    fn a_valid_group_parses() {
        let json = r#"{"species": [{"id": "x", "name": "X", "basis": "us",
            "o86_relative_density": null,
            "nds_specific_gravity": {"value": 0.42, "source": "s", "confidence": "checked"}}]}"#;
        let groups = parse_species(json, "test.json").expect("valid");
        assert_eq!(groups[0].id, "x");
    }
}
