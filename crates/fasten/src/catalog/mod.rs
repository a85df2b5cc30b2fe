//! The built-in catalogs (nails, species groups, panels): JSON data with provenance under
//! `crates/fasten/data/`, compiled in and parsed once.

mod close_ids;
mod provenance;

pub use close_ids::close_ids;
pub use provenance::{CatalogBasis, Confidence, SourcedValue};

use crate::error::FastenError;
use crate::nail::{parse_nails, Nail};
use crate::panel::{parse_panels, Panel};
use crate::species::{parse_species, Species};
use std::sync::OnceLock;

const NAILS_JSON: &str = include_str!("../../data/nails.json");
const SPECIES_JSON: &str = include_str!("../../data/species.json");
const PANELS_JSON: &str = include_str!("../../data/panels.json");

/// Parses compiled-in data. The data is part of the build, not user input, and the tests below parse
/// every file, so a failure here is a build defect that no user input can cause.
fn built_in<T>(parsed: Result<Vec<T>, FastenError>) -> Vec<T> {
    match parsed {
        Ok(items) => items,
        Err(error) => panic!("built-in catalog is invalid: {error}"),
    }
}

/// Every nail in the built-in catalog.
pub fn nails() -> &'static [Nail] {
    static NAILS: OnceLock<Vec<Nail>> = OnceLock::new();
    NAILS.get_or_init(|| built_in(parse_nails(NAILS_JSON, "data/nails.json")))
}

/// Every species group in the built-in catalog.
pub fn species_groups() -> &'static [Species] {
    static SPECIES: OnceLock<Vec<Species>> = OnceLock::new();
    SPECIES.get_or_init(|| built_in(parse_species(SPECIES_JSON, "data/species.json")))
}

/// Every panel kind in the built-in catalog.
pub fn panels() -> &'static [Panel] {
    static PANELS: OnceLock<Vec<Panel>> = OnceLock::new();
    PANELS.get_or_init(|| built_in(parse_panels(PANELS_JSON, "data/panels.json")))
}

/// The nail with this id; the error lists close ids.
pub fn nail(id: &str) -> Result<&'static Nail, FastenError> {
    let all = nails();
    all.iter()
        .find(|nail| nail.id == id)
        .ok_or_else(|| FastenError::UnknownId {
            kind: "nail",
            id: id.to_string(),
            close: close_ids(id, all.iter().map(|nail| nail.id.as_str())),
        })
}

/// The species group with this id; the error lists close ids.
pub fn species(id: &str) -> Result<&'static Species, FastenError> {
    let all = species_groups();
    all.iter()
        .find(|group| group.id == id)
        .ok_or_else(|| FastenError::UnknownId {
            kind: "species",
            id: id.to_string(),
            close: close_ids(id, all.iter().map(|group| group.id.as_str())),
        })
}

/// The panel kind with this id; the error lists close ids.
pub fn panel(id: &str) -> Result<&'static Panel, FastenError> {
    let all = panels();
    all.iter()
        .find(|panel| panel.id == id)
        .ok_or_else(|| FastenError::UnknownId {
            kind: "panel",
            id: id.to_string(),
            close: close_ids(id, all.iter().map(|panel| panel.id.as_str())),
        })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::nail::{NdsNailType, ShankKind};
    use approx::assert_relative_eq;

    use deckhold_core::units::MM_PER_IN;

    #[test]
    fn the_built_in_files_parse() {
        parse_nails(NAILS_JSON, "data/nails.json").expect("nails.json is valid");
        parse_species(SPECIES_JSON, "data/species.json").expect("species.json is valid");
        parse_panels(PANELS_JSON, "data/panels.json").expect("panels.json is valid");
    }

    #[test]
    fn the_catalog_holds_at_least_twenty_nails() {
        assert!(nails().len() >= 20, "{} nails", nails().len());
    }

    #[test]
    fn the_promised_ids_exist() {
        for id in [
            "common-51x2.84",
            "common-63x3.25",
            "common-76x3.66",
            "spiral-63x3.25",
            "6d-common",
            "8d-common",
            "10d-common",
            "8d-box",
            "rsrs-01",
            "rsrs-03",
            "rsrs-04",
        ] {
            nail(id).expect(id);
        }
        for id in ["dfl", "hem-fir", "spf", "northern", "southern-pine"] {
            species(id).expect(id);
        }
        for id in ["plywood", "osb"] {
            panel(id).expect(id);
        }
    }

    #[test]
    fn an_unknown_nail_lists_close_ids() {
        let error = nail("8d-comon").expect_err("unknown");
        match error {
            FastenError::UnknownId { kind, close, .. } => {
                assert_eq!(kind, "nail");
                assert_eq!(close.first().map(String::as_str), Some("8d-common"));
            }
            other => panic!("unexpected {other}"),
        }
    }

    #[test]
    fn unknown_species_and_panel_are_refused() {
        assert!(matches!(
            species("spruce"),
            Err(FastenError::UnknownId { .. })
        ));
        assert!(matches!(panel("mdf"), Err(FastenError::UnknownId { .. })));
    }

    fn inches(value_mm: f64) -> f64 {
        value_mm / MM_PER_IN
    }

    fn assert_dims(id: &str, length_in: f64, shank_in: f64, head_in: f64) {
        let nail = nail(id).expect(id);
        assert_relative_eq!(inches(nail.length_mm), length_in, max_relative = 1e-4);
        assert_relative_eq!(
            inches(nail.shank_diameter_mm),
            shank_in,
            max_relative = 1e-4
        );
        assert_relative_eq!(inches(nail.head_diameter_mm), head_in, max_relative = 1e-4);
    }

    #[test]
    fn us_common_nails_match_nds_table_l4() {
        // NDS 2018 Table L4 / ASTM F1667 common wire nails (from memory, NDS 2018); 8d 2-1/2 x 0.131
        // also in FEMA P-55 (2011) Example 9.1.
        assert_dims("6d-common", 2.0, 0.113, 0.266);
        assert_dims("8d-common", 2.5, 0.131, 0.281);
        assert_dims("10d-common", 3.0, 0.148, 0.312);
        // 16d 3-1/2 x 0.162: NDS 2018 Table L4 (from memory, NDS 2018).
        assert_dims("16d-common", 3.5, 0.162, 0.344);
    }

    #[test]
    fn us_box_and_sinker_nails_match_nds_table_l4() {
        // NDS 2018 Table L4 box and sinker nails (from memory, NDS 2018).
        assert_dims("8d-box", 2.5, 0.113, 0.297);
        assert_dims("10d-box", 3.0, 0.128, 0.312);
        assert_dims("8d-sinker", 2.375, 0.113, 0.266);
    }

    #[test]
    fn rsrs_nails_match_astm_f1667() {
        // Length x shank, from memory (ASTM F1667-17): RSRS-01 2-3/8 x 0.113, RSRS-03 2-1/2 x 0.131,
        // RSRS-04 3 x 0.120 in. Head 0.281 in: from memory, ASTM F1667-17. (A web article once cited here
        // for the sizes is neither a standard, a handbook nor a research report: not a source.)
        assert_dims("rsrs-01", 2.375, 0.113, 0.281);
        assert_dims("rsrs-03", 2.5, 0.131, 0.281);
        assert_dims("rsrs-04", 3.0, 0.120, 0.281);
        for id in ["rsrs-01", "rsrs-03", "rsrs-04"] {
            let nail = nail(id).expect(id);
            assert_eq!(nail.nds_type, NdsNailType::Rsrs);
            assert_eq!(nail.shank, ShankKind::Ring);
        }
    }

    #[test]
    fn canadian_ids_carry_their_dimensions() {
        // Catalog consistency, not an outside check: each Canadian id states length x shank diameter in mm,
        // so a number typed wrong in either the id or the entry shows here.
        for nail in nails().iter().filter(|nail| nail.basis == CatalogBasis::Ca) {
            let dims = nail
                .id
                .split_once('-')
                .map(|(_, dims)| dims)
                .expect("kind-LxD");
            let (length, diameter) = dims.split_once('x').expect("LxD");
            let length: f64 = length.parse().expect("length");
            let diameter: f64 = diameter.parse().expect("diameter");
            assert_relative_eq!(nail.length_mm, length);
            assert_relative_eq!(nail.shank_diameter_mm, diameter);
        }
    }

    #[test]
    fn every_entry_names_a_source() {
        for nail in nails() {
            assert!(!nail.source.trim().is_empty(), "{}", nail.id);
        }
        for group in species_groups() {
            for value in [&group.o86_relative_density, &group.nds_specific_gravity]
                .into_iter()
                .flatten()
            {
                assert!(!value.source.trim().is_empty(), "{}", group.id);
            }
        }
    }

    #[test]
    fn species_densities_match_their_tables() {
        // NDS 2018 Table 12.3.3A (from memory, NDS 2018): DF-L 0.50, Hem-Fir 0.43,
        // SPF 0.42, Northern 0.35, Southern Pine 0.55.
        let nds = |id: &str| {
            species(id)
                .expect(id)
                .nds_specific_gravity
                .as_ref()
                .map(|value| value.value)
        };
        assert_eq!(nds("dfl"), Some(0.50));
        assert_eq!(nds("hem-fir"), Some(0.43));
        assert_eq!(nds("spf"), Some(0.42));
        assert_eq!(nds("northern"), Some(0.35));
        assert_eq!(nds("southern-pine"), Some(0.55));
        // CSA O86:19 mean relative density (from memory, O86:19).
        let o86 = |id: &str| {
            species(id)
                .expect(id)
                .o86_relative_density
                .as_ref()
                .map(|value| value.value)
        };
        assert_eq!(o86("dfl"), Some(0.49));
        assert_eq!(o86("hem-fir"), Some(0.46));
        assert_eq!(o86("spf"), Some(0.42));
        assert_eq!(o86("northern"), Some(0.35));
        assert_eq!(o86("southern-pine"), None);
    }
}
