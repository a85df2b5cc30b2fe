//! The spacing rules each basis imposes on roof sheathing nails: practical increments, prescriptive maxima
//! and the splitting minimum. Data with sources, in one place.

use crate::basis::Basis;
use crate::units::MM_PER_IN;
use deckhold_deck::spacing::SpacingRules;

/// Practical spacings for the SI basis, mm, widest first (common practice, no source).
pub const SI_INCREMENTS_MM: [f64; 8] = [300.0, 250.0, 200.0, 150.0, 125.0, 100.0, 75.0, 50.0];
/// Practical spacings for the US bases, in, widest first (common practice, no source).
pub const US_INCREMENTS_IN: [f64; 5] = [12.0, 6.0, 4.0, 3.0, 2.0];

/// NBC 2020 Part 9, Table 9.23.3.5.-A: roof sheathing nails at 150 mm along edges and 300 mm along
/// intermediate supports (from memory, NBC 2015/2020).
pub const NBC_MAX_EDGE_MM: f64 = 150.0;
pub const NBC_MAX_INTERMEDIATE_MM: f64 = 300.0;
/// IRC 2021 Table R602.3(1), roof sheathing: 6 in at edges, 12 in in the field (from memory, IRC 2018/2021).
pub const US_MAX_EDGE_IN: f64 = 6.0;
pub const US_MAX_INTERMEDIATE_IN: f64 = 12.0;

/// Splitting minimum spacing along the grain for the Canadian basis, in shank diameters:
/// CSA O86 12.9.2 spacing parallel to grain, 20 d_F (from memory, O86:19). Applied along the member.
pub const O86_MIN_SPACING_DIAMETERS: f64 = 20.0;
/// US: closer than 3 in o.c. needs 3x nominal framing at panel edges (AWC SDPWS 2021 4.2.7.1,
/// from memory); deckhold assumes 2x framing, so 3 in is the closest spacing it gives.
pub const US_MIN_SPACING_IN: f64 = 3.0;

/// Inches to mm rounded to 0.1 µm, so that 6 in prints as 152.4 mm and not 152.39999999999998.
fn mm_from_in(inch: f64) -> f64 {
    (inch * MM_PER_IN * 1e4).round() / 1e4
}

/// The rules for one basis and a nail of `shank_diameter_mm`.
pub fn spacing_rules(basis: Basis, shank_diameter_mm: f64) -> SpacingRules {
    if basis.is_us() {
        SpacingRules {
            increments_mm: US_INCREMENTS_IN
                .iter()
                .map(|inch| mm_from_in(*inch))
                .collect(),
            max_panel_edge_mm: mm_from_in(US_MAX_EDGE_IN),
            max_intermediate_mm: mm_from_in(US_MAX_INTERMEDIATE_IN),
            min_mm: US_MIN_SPACING_IN * MM_PER_IN,
            min_effective_area_m2: 0.0,
        }
    } else {
        SpacingRules {
            increments_mm: SI_INCREMENTS_MM.to_vec(),
            max_panel_edge_mm: NBC_MAX_EDGE_MM,
            max_intermediate_mm: NBC_MAX_INTERMEDIATE_MM,
            min_mm: O86_MIN_SPACING_DIAMETERS * shank_diameter_mm,
            min_effective_area_m2: 0.0,
        }
    }
}

/// Text for the report: where the limits come from.
pub fn spacing_rule_sources(basis: Basis) -> Vec<String> {
    if basis.is_us() {
        vec![
            "Maximum spacing 6 in at panel edges, 12 in at intermediate supports: IRC 2021 Table R602.3(1) (from memory)".to_string(),
            "Closest spacing 3 in o.c. for 2x framing: AWC SDPWS 2021 4.2.7.1 (from memory)".to_string(),
            "Spacing increments 12, 6, 4, 3, 2 in: common practice, no source".to_string(),
        ]
    } else {
        vec![
            "Maximum spacing 150 mm at panel edges, 300 mm at intermediate supports: NBC 2020 Table 9.23.3.5.-A (from memory)".to_string(),
            "Splitting minimum 20 d_F along the grain: CSA O86:19 12.9.2 (from memory)".to_string(),
            "Spacing increments 300, 250, 200, 150, 125, 100, 75, 50 mm: common practice, no source".to_string(),
        ]
    }
}

/// One row of a prescriptive roof-sheathing nail table: panels up to `max_thickness_mm` (and over the
/// previous row's) need a nail at least `min_length_mm` long.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MinimumNailRow {
    pub max_thickness_mm: f64,
    pub min_length_mm: f64,
    pub source: &'static str,
}

/// NBC 2020 Part 9 Table 9.23.3.5.-A, roof sheathing nails (from memory, NBC 2015/2020).
pub const NBC_MINIMUM_NAIL: [MinimumNailRow; 3] = [
    MinimumNailRow {
        max_thickness_mm: 10.0,
        min_length_mm: 45.0,
        source: "NBC 2020 Table 9.23.3.5.-A, 45 mm for panels up to 10 mm (from memory)",
    },
    MinimumNailRow {
        max_thickness_mm: 20.0,
        min_length_mm: 51.0,
        source: "NBC 2020 Table 9.23.3.5.-A, 51 mm for panels 10 to 20 mm (from memory)",
    },
    MinimumNailRow {
        max_thickness_mm: 25.0,
        min_length_mm: 57.0,
        source: "NBC 2020 Table 9.23.3.5.-A, 57 mm for panels 20 to 25 mm (from memory)",
    },
];

/// IRC 2021 Table R602.3(1), wood structural panel roof sheathing to framing (from memory, IRC
/// 2018/2021): 3/8 to 1/2 in asks an 8d common (2-1/2 in) on roofs (the 6d of that row is for subfloors
/// and walls); 19/32 to 1 in an 8d common; 1-1/8 to 1-1/4 in a 10d common (3 in) or an 8d deformed nail:
/// the rule does not know the shank, so the longer (10d) is asked. Each row's upper bound carries 0.5 mm
/// of rolling tolerance.
pub const US_MINIMUM_NAIL: [MinimumNailRow; 3] = [
    MinimumNailRow {
        max_thickness_mm: 0.5 * MM_PER_IN + 0.5,
        min_length_mm: 2.5 * MM_PER_IN,
        source: "IRC 2021 Table R602.3(1), 8d common (2-1/2 in) for 3/8 to 1/2 in roof sheathing (6d is for subfloor and wall sheathing) (from memory)",
    },
    MinimumNailRow {
        max_thickness_mm: 1.0 * MM_PER_IN + 0.5,
        min_length_mm: 2.5 * MM_PER_IN,
        source: "IRC 2021 Table R602.3(1), 8d common (2-1/2 in) for 19/32 to 1 in (from memory)",
    },
    MinimumNailRow {
        max_thickness_mm: 1.25 * MM_PER_IN + 0.5,
        min_length_mm: 3.0 * MM_PER_IN,
        source: "IRC 2021 Table R602.3(1), 10d common (3 in) for 1-1/8 to 1-1/4 in; an 8d deformed nail is also allowed but the rule does not know the shank (from memory)",
    },
];

/// The shortest nail the prescriptive rules allow for roof sheathing of `thickness_mm`, with its source.
/// Thicker decks than the table covers have no prescriptive nail: None.
pub fn prescriptive_minimum_length(basis: Basis, thickness_mm: f64) -> Option<(f64, &'static str)> {
    let table: &[MinimumNailRow] = if basis.is_us() {
        &US_MINIMUM_NAIL
    } else {
        &NBC_MINIMUM_NAIL
    };
    table
        .iter()
        .find(|row| thickness_mm <= row.max_thickness_mm)
        .map(|row| (row.min_length_mm, row.source))
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
    fn the_splitting_minimum_scales_with_the_shank() {
        // CSA O86:19 12.9.2 (from memory): 20 d_F along the grain.
        let rules = spacing_rules(Basis::Nbc2020O86, 3.25);
        assert!((rules.min_mm - 65.0).abs() < 1e-9);
        assert_eq!(rules.max_panel_edge_mm, 150.0);
        assert_eq!(rules.max_intermediate_mm, 300.0);
    }
}
