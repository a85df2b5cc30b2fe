//! The spacing rules each basis imposes on roof sheathing nails: practical increments, prescriptive maxima
//! and the splitting minimum, and the shortest nail per panel thickness.
//!
//! The prescriptive tables (maximum spacing along panel edges and intermediate supports, shortest nail
//! per panel thickness) are data: `data/prescriptive.json`, embedded at build time, one table per basis
//! with its table number, edition and status. The practical increments and the splitting minimum stay
//! here as constants with their sources.

use std::sync::OnceLock;

use serde::Deserialize;

use crate::basis::Basis;
use crate::units::MM_PER_IN;
use deckhold_deck::spacing::SpacingRules;

/// Practical spacings for the SI basis, mm, widest first (common practice, no source).
pub const SI_INCREMENTS_MM: [f64; 8] = [300.0, 250.0, 200.0, 150.0, 125.0, 100.0, 75.0, 50.0];
/// Practical spacings for the US bases, in, widest first (common practice, no source).
pub const US_INCREMENTS_IN: [f64; 5] = [12.0, 6.0, 4.0, 3.0, 2.0];

/// Splitting minimum spacing along the grain for the Canadian basis, in shank diameters:
/// CSA O86 12.9.2 spacing parallel to grain, 20 d_F (from memory, O86:19). Applied along the member.
pub const O86_MIN_SPACING_DIAMETERS: f64 = 20.0;
/// US: closer than 3 in o.c. needs 3x nominal framing at panel edges (AWC SDPWS 2021 4.2.7.1,
/// from memory); deckhold assumes 2x framing, so 3 in is the closest spacing it gives.
pub const US_MIN_SPACING_IN: f64 = 3.0;

/// Rolling tolerance added to each US thickness row's upper bound, mm (a 15/32 in panel is
/// "1/2 in" in the table; common practice, no source).
const US_THICKNESS_TOLERANCE_MM: f64 = 0.5;

/// One row of a prescriptive roof-sheathing nail table: panels up to `max_thickness_mm` (and over the
/// previous row's) need a nail at least `min_length_mm` long.
#[derive(Debug, Clone, PartialEq)]
pub struct MinimumNailRow {
    pub max_thickness_mm: f64,
    pub min_length_mm: f64,
    pub source: String,
}

/// One basis's prescriptive table, in mm, with where it comes from.
#[derive(Debug, Clone, PartialEq)]
pub struct PrescriptiveTable {
    /// The table's number, e.g. `NBC 2020 Table 9.23.3.5.-A`.
    pub table: String,
    pub edition: String,
    /// `checked` or `from memory` (with `confidence` saying which edition).
    pub status: String,
    pub confidence: String,
    pub max_panel_edge_mm: f64,
    pub max_intermediate_mm: f64,
    /// The report line for the maxima.
    pub spacing_source: String,
    /// Thinnest first.
    pub minimum_nail: Vec<MinimumNailRow>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct NailRowData {
    max_thickness_mm: Option<f64>,
    max_thickness_in: Option<f64>,
    min_length_mm: Option<f64>,
    min_length_in: Option<f64>,
    source: String,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct TableData {
    basis: String,
    table: String,
    edition: String,
    status: String,
    confidence: String,
    max_panel_edge_mm: Option<f64>,
    max_panel_edge_in: Option<f64>,
    max_intermediate_mm: Option<f64>,
    max_intermediate_in: Option<f64>,
    spacing_source: String,
    minimum_nail: Vec<NailRowData>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct FileData {
    #[allow(dead_code)]
    note: String,
    tables: Vec<TableData>,
}

/// Inches to mm rounded to 0.1 µm, so that 6 in prints as 152.4 mm and not 152.39999999999998.
fn mm_from_in(inch: f64) -> f64 {
    (inch * MM_PER_IN * 1e4).round() / 1e4
}

/// A length given in mm or in inches (exactly one), in mm.
fn either(mm: Option<f64>, inch: Option<f64>, what: &str) -> Result<f64, String> {
    match (mm, inch) {
        (Some(mm), None) if mm.is_finite() && mm > 0.0 => Ok(mm),
        (None, Some(inch)) if inch.is_finite() && inch > 0.0 => Ok(mm_from_in(inch)),
        _ => Err(format!(
            "{what}: give one positive value, in mm or in inches"
        )),
    }
}

fn table_from(data: TableData) -> Result<PrescriptiveTable, String> {
    let tolerance_mm = if data.max_thickness_in_rows() {
        US_THICKNESS_TOLERANCE_MM
    } else {
        0.0
    };
    let mut minimum_nail = Vec::with_capacity(data.minimum_nail.len());
    for (index, row) in data.minimum_nail.iter().enumerate() {
        let at = format!("{} minimum_nail[{index}]", data.table);
        let max_thickness_mm =
            either(row.max_thickness_mm, row.max_thickness_in, &at)? + tolerance_mm;
        if minimum_nail
            .last()
            .is_some_and(|last: &MinimumNailRow| last.max_thickness_mm >= max_thickness_mm)
        {
            return Err(format!("{at}: thicknesses must increase"));
        }
        minimum_nail.push(MinimumNailRow {
            max_thickness_mm,
            min_length_mm: either(row.min_length_mm, row.min_length_in, &at)?,
            source: row.source.clone(),
        });
    }
    if !matches!(data.status.as_str(), "checked" | "from memory") {
        return Err(format!("{}: status '{}'", data.table, data.status));
    }
    Ok(PrescriptiveTable {
        max_panel_edge_mm: either(data.max_panel_edge_mm, data.max_panel_edge_in, &data.table)?,
        max_intermediate_mm: either(
            data.max_intermediate_mm,
            data.max_intermediate_in,
            &data.table,
        )?,
        table: data.table,
        edition: data.edition,
        status: data.status,
        confidence: data.confidence,
        spacing_source: data.spacing_source,
        minimum_nail,
    })
}

impl TableData {
    /// US tables give thicknesses in inches (trade sizes), which take the rolling tolerance.
    fn max_thickness_in_rows(&self) -> bool {
        self.minimum_nail
            .iter()
            .any(|row| row.max_thickness_in.is_some())
    }
}

/// Both bases' tables from the embedded file: (NBC, US).
fn parse(text: &str) -> Result<(PrescriptiveTable, PrescriptiveTable), String> {
    let file: FileData = serde_json::from_str(text).map_err(|error| error.to_string())?;
    let mut nbc = None;
    let mut us = None;
    for data in file.tables {
        let slot = match data.basis.as_str() {
            "nbc" => &mut nbc,
            "us" => &mut us,
            other => return Err(format!("basis '{other}'")),
        };
        *slot = Some(table_from(data)?);
    }
    match (nbc, us) {
        (Some(nbc), Some(us)) => Ok((nbc, us)),
        _ => Err("a table for each of nbc and us".to_string()),
    }
}

/// The prescriptive table of a basis (parsed once; the file is built in and checked by its test).
pub fn prescriptive_table(basis: Basis) -> &'static PrescriptiveTable {
    static TABLES: OnceLock<(PrescriptiveTable, PrescriptiveTable)> = OnceLock::new();
    let (nbc, us) = TABLES.get_or_init(|| {
        parse(include_str!("../data/prescriptive.json"))
            .unwrap_or_else(|error| panic!("built-in data/prescriptive.json: {error}"))
    });
    if basis.is_us() {
        us
    } else {
        nbc
    }
}

/// The rules for one basis and a nail of `shank_diameter_mm`.
pub fn spacing_rules(basis: Basis, shank_diameter_mm: f64) -> SpacingRules {
    let table = prescriptive_table(basis);
    if basis.is_us() {
        SpacingRules {
            increments_mm: US_INCREMENTS_IN
                .iter()
                .map(|inch| mm_from_in(*inch))
                .collect(),
            max_panel_edge_mm: table.max_panel_edge_mm,
            max_intermediate_mm: table.max_intermediate_mm,
            min_mm: US_MIN_SPACING_IN * MM_PER_IN,
            min_effective_area_m2: 0.0,
        }
    } else {
        SpacingRules {
            increments_mm: SI_INCREMENTS_MM.to_vec(),
            max_panel_edge_mm: table.max_panel_edge_mm,
            max_intermediate_mm: table.max_intermediate_mm,
            min_mm: O86_MIN_SPACING_DIAMETERS * shank_diameter_mm,
            min_effective_area_m2: 0.0,
        }
    }
}

/// Text for the report: where the limits come from.
pub fn spacing_rule_sources(basis: Basis) -> Vec<String> {
    let maxima = prescriptive_table(basis).spacing_source.clone();
    if basis.is_us() {
        vec![
            maxima,
            "Closest spacing 3 in o.c. for 2x framing: AWC SDPWS 2021 4.2.7.1 (from memory)"
                .to_string(),
            "Spacing increments 12, 6, 4, 3, 2 in: common practice, no source".to_string(),
        ]
    } else {
        vec![
            maxima,
            "Splitting minimum 20 d_F along the grain: CSA O86:19 12.9.2 (from memory)".to_string(),
            "Spacing increments 300, 250, 200, 150, 125, 100, 75, 50 mm: common practice, no source".to_string(),
        ]
    }
}

/// The shortest nail the prescriptive rules allow for roof sheathing of `thickness_mm`, with its source.
/// Thicker decks than the table covers have no prescriptive nail: None.
pub fn prescriptive_minimum_length(basis: Basis, thickness_mm: f64) -> Option<(f64, &'static str)> {
    prescriptive_table(basis)
        .minimum_nail
        .iter()
        .find(|row| thickness_mm <= row.max_thickness_mm)
        .map(|row| (row.min_length_mm, row.source.as_str()))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn prescriptive_minimum_nail_lengths_follow_the_tables() {
        // NBC 2020 Table 9.23.3.5.-A (from memory, NBC 2015/2020).
        assert_eq!(
            prescriptive_minimum_length(Basis::Nbc2020O86, 9.5).map(|r| r.0),
            Some(45.0)
        );
        assert_eq!(
            prescriptive_minimum_length(Basis::Nbc2020O86, 11.1).map(|r| r.0),
            Some(51.0)
        );
        assert_eq!(prescriptive_minimum_length(Basis::Nbc2020O86, 30.0), None);
        // IRC 2021 Table R602.3(1), roof sheathing (from memory): 3/8 and 15/32 in -> 8d (2-1/2 in, not the
        // 6d of walls and subfloors), 19/32 and 3/4 in -> 8d, 1-1/8 in -> 10d (3 in), 1-1/2 in -> none.
        for (thickness_mm, length_mm) in [
            (9.5, 63.5),
            (11.9, 63.5),
            (15.1, 63.5),
            (19.1, 63.5),
            (28.6, 76.2),
        ] {
            let found = prescriptive_minimum_length(Basis::Asce722Nds2018Asd, thickness_mm)
                .map_or(f64::NAN, |r| r.0);
            assert!(
                (found - length_mm).abs() < 1e-9,
                "{thickness_mm} mm: {found}"
            );
        }
        assert_eq!(
            prescriptive_minimum_length(Basis::Asce722Nds2018Asd, 38.1),
            None
        );
    }

    #[test]
    fn the_prescriptive_tables_are_data_with_their_table_numbers_and_status() {
        // NBC 2020 Table 9.23.3.5.-A and IRC 2021 Table R602.3(1) (both from memory: docs/sources.md):
        // 150 / 300 mm and 6 / 12 in maxima; each nail row names its table.
        let nbc = prescriptive_table(Basis::Nbc2020O86);
        assert_eq!(nbc.table, "NBC 2020 Table 9.23.3.5.-A");
        assert_eq!(nbc.status, "from memory");
        assert_eq!(
            (nbc.max_panel_edge_mm, nbc.max_intermediate_mm),
            (150.0, 300.0)
        );
        let us = prescriptive_table(Basis::Asce722Nds2018Lrfd);
        assert_eq!(us.table, "IRC 2021 Table R602.3(1)");
        assert_eq!(us.status, "from memory");
        assert_eq!(
            (us.max_panel_edge_mm, us.max_intermediate_mm),
            (152.4, 304.8)
        );
        for table in [nbc, us] {
            assert_eq!(table.minimum_nail.len(), 3);
            for row in &table.minimum_nail {
                assert!(row.source.starts_with(&table.table), "{}", row.source);
                assert!(row.source.contains("from memory"), "{}", row.source);
            }
        }
        // The US rows' upper bounds carry the 0.5 mm rolling tolerance: 1/2 in -> 13.2 mm.
        assert!((us.minimum_nail[0].max_thickness_mm - 13.2).abs() < 1e-9);
    }

    #[test]
    fn bad_prescriptive_data_is_refused() {
        let good = include_str!("../data/prescriptive.json");
        assert!(parse(good).is_ok());
        let unordered = good.replace("\"max_thickness_mm\": 20.0", "\"max_thickness_mm\": 5.0");
        assert!(parse(&unordered).expect_err("order").contains("increase"));
        let both_units = good.replace(
            "\"max_panel_edge_mm\": 150.0,",
            "\"max_panel_edge_mm\": 150.0, \"max_panel_edge_in\": 6.0,",
        );
        assert!(parse(&both_units).is_err());
        assert!(parse(&good.replace(
            "\"from memory\",\n   \"confidence\"",
            "\"guessed\",\n   \"confidence\""
        ))
        .is_err());
    }

    #[test]
    fn the_splitting_minimum_scales_with_the_shank() {
        // CSA O86:19 12.9.2 (from memory): 20 d_F along the grain.
        let rules = spacing_rules(Basis::Nbc2020O86, 3.25);
        assert!((rules.min_mm - 65.0).abs() < 1e-9);
        assert_eq!(rules.max_panel_edge_mm, 150.0);
        assert_eq!(rules.max_intermediate_mm, 300.0);
    }
}
