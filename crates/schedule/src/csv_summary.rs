//! `summary.csv` of a batch: one row per roof, in the order of the input rows.
//!
//! A roof's row is formatted on its own ([`summary_record`]) so that roofs worked in parallel can be
//! formatted where they were worked and written in input order by the caller; the bytes do not depend on
//! which thread formatted them. Both unit systems are present for every spacing, as in `schedule.csv`.

use crate::csv_schedule::NO_SPACING;
use crate::format::{fixed, mm_to_in, places};
use crate::{ScheduleError, ZoneRow};
use deckhold_core::{SupportRole, ZoneKind};
use serde::Serialize;

/// The zones a schedule can carry, in the crew sheet's order (worst first).
pub const SUMMARY_ZONES: [ZoneKind; 6] = [
    ZoneKind::Corner,
    ZoneKind::Edge,
    ZoneKind::Interior,
    ZoneKind::OverhangCorner,
    ZoneKind::OverhangEdge,
    ZoneKind::OverhangInterior,
];

/// The support roles of a zone, in the crew sheet's order.
pub const SUMMARY_ROLES: [SupportRole; 2] = [SupportRole::PanelEdge, SupportRole::Intermediate];

/// How one roof of a batch ended.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum RoofStatus {
    /// Every zone has a working spacing.
    Ok,
    /// The roof was worked, but no practical spacing works in some zone with any candidate nail.
    Fails,
    /// The row was refused (bad value, outside the method): nothing was worked.
    Refused,
}

impl RoofStatus {
    pub fn as_str(self) -> &'static str {
        match self {
            RoofStatus::Ok => "ok",
            RoofStatus::Fails => "fails",
            RoofStatus::Refused => "refused",
        }
    }
}

/// One cell of the spacing grid: a zone and support role of one roof.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SpacingCell {
    /// None: no practical spacing works there.
    pub spacing_mm: Option<f64>,
}

/// One roof's line of the batch summary.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofSummary {
    pub id: String,
    pub status: RoofStatus,
    /// Why the roof was refused or fails (naming the row and column for a refusal); empty when ok.
    pub message: String,
    /// The nail the schedule uses (empty when refused).
    pub nail_id: String,
    /// `[zone][role]` in the order of [`SUMMARY_ZONES`] and [`SUMMARY_ROLES`]; None where the roof has
    /// no such zone.
    pub spacings: [[Option<SpacingCell>; 2]; 6],
    pub total_nail_count: u64,
    pub total_nail_mass_kg: f64,
    /// The largest utilization of any zone and role (None when refused).
    pub largest_utilization: Option<f64>,
}

impl RoofSummary {
    /// A refused row: only its id and the message.
    pub fn refused(id: &str, message: String) -> Self {
        RoofSummary {
            id: id.to_string(),
            status: RoofStatus::Refused,
            message,
            nail_id: String::new(),
            spacings: [[None; 2]; 6],
            total_nail_count: 0,
            total_nail_mass_kg: 0.0,
            largest_utilization: None,
        }
    }

    /// The spacing grid from a schedule's zone rows. Where several rows share a zone label and role (a
    /// standard with more than one edge zone), the closest spacing is kept, and "none works" wins over
    /// any spacing: the summary shows the most severe reading.
    pub fn spacing_grid(zones: &[ZoneRow]) -> [[Option<SpacingCell>; 2]; 6] {
        let mut grid = [[None; 2]; 6];
        for row in zones {
            let zone = SUMMARY_ZONES.iter().position(|label| *label == row.label);
            let role = SUMMARY_ROLES
                .iter()
                .position(|role| *role == row.support_role);
            let (Some(zone), Some(role)) = (zone, role) else {
                continue;
            };
            let cell: &mut Option<SpacingCell> = &mut grid[zone][role];
            let merged = match (*cell, row.spacing_mm) {
                (None, spacing_mm) => spacing_mm,
                (Some(SpacingCell { spacing_mm: None }), _) | (Some(_), None) => None,
                (
                    Some(SpacingCell {
                        spacing_mm: Some(held),
                    }),
                    Some(new),
                ) => Some(held.min(new)),
            };
            *cell = Some(SpacingCell { spacing_mm: merged });
        }
        grid
    }
}

/// Column names of `summary.csv`, units in the names.
pub fn summary_header() -> Vec<String> {
    let mut header: Vec<String> = ["id", "status", "message", "nail_id"]
        .iter()
        .map(|name| name.to_string())
        .collect();
    for zone in SUMMARY_ZONES {
        for role in SUMMARY_ROLES {
            let stem = format!("{}_{}", zone.as_str(), role.as_str()).replace('-', "_");
            header.push(format!("{stem}_mm"));
            header.push(format!("{stem}_in"));
        }
    }
    header.extend(
        [
            "total_nail_count",
            "total_nail_mass_kg",
            "largest_utilization",
        ]
        .iter()
        .map(|name| name.to_string()),
    );
    header
}

fn summary_writer() -> csv::Writer<Vec<u8>> {
    csv::WriterBuilder::new()
        .terminator(csv::Terminator::Any(b'\n'))
        .quote_style(csv::QuoteStyle::Necessary)
        .buffer_capacity(1024)
        .from_writer(Vec::with_capacity(512))
}

fn fail(error: impl std::fmt::Display) -> ScheduleError {
    ScheduleError::Csv {
        file: "summary.csv",
        message: error.to_string(),
    }
}

/// The header line of `summary.csv`, as bytes.
pub fn summary_header_csv() -> Result<Vec<u8>, ScheduleError> {
    let mut writer = summary_writer();
    writer.write_record(summary_header()).map_err(fail)?;
    writer.into_inner().map_err(fail)
}

/// One roof's line of `summary.csv`, as bytes. Spacing cells: empty where the roof has no such zone,
/// `none` where no practical spacing works.
pub fn summary_record(roof: &RoofSummary) -> Result<Vec<u8>, ScheduleError> {
    let mut record: Vec<String> = vec![
        roof.id.clone(),
        roof.status.as_str().to_string(),
        roof.message.clone(),
        roof.nail_id.clone(),
    ];
    for zone in &roof.spacings {
        for cell in zone {
            let (mm, inches) = match cell {
                None => (String::new(), String::new()),
                Some(SpacingCell { spacing_mm: None }) => {
                    (NO_SPACING.to_string(), NO_SPACING.to_string())
                }
                Some(SpacingCell {
                    spacing_mm: Some(mm),
                }) => {
                    let mm = crate::format::finite("spacing_mm", *mm)?;
                    (
                        fixed(mm, places::SPACING_MM),
                        fixed(mm_to_in(mm), places::SPACING_IN),
                    )
                }
            };
            record.push(mm);
            record.push(inches);
        }
    }
    let refused = roof.status == RoofStatus::Refused;
    record.push(if refused {
        String::new()
    } else {
        roof.total_nail_count.to_string()
    });
    record.push(if refused {
        String::new()
    } else {
        fixed(
            crate::format::finite("total_nail_mass_kg", roof.total_nail_mass_kg)?,
            places::MASS_KG,
        )
    });
    record.push(match roof.largest_utilization {
        None => String::new(),
        Some(utilization) => fixed(
            crate::format::finite("largest_utilization", utilization)?,
            places::UTILIZATION,
        ),
    });
    let mut writer = summary_writer();
    writer.write_record(&record).map_err(fail)?;
    writer.into_inner().map_err(fail)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn zone(label: ZoneKind, role: SupportRole, spacing_mm: Option<f64>) -> ZoneRow {
        ZoneRow {
            label,
            code_zone: String::new(),
            support_role: role,
            nail_id: "n".to_string(),
            nail_description: String::new(),
            spacing_mm,
            net_uplift_kpa: 1.0,
            demand_n: 1.0,
            resistance_n: 1.0,
            governing_mode: "withdrawal".to_string(),
            utilization: 0.5,
            nail_count: 1,
            governing_check: "strength".to_string(),
            governing_line: 1,
        }
    }

    #[test]
    fn the_grid_keeps_the_most_severe_reading_of_a_zone_and_role() {
        let grid = RoofSummary::spacing_grid(&[
            zone(ZoneKind::Edge, SupportRole::PanelEdge, Some(150.0)),
            zone(ZoneKind::Edge, SupportRole::PanelEdge, Some(100.0)),
            zone(ZoneKind::Edge, SupportRole::Intermediate, Some(150.0)),
            zone(ZoneKind::Edge, SupportRole::Intermediate, None),
            zone(ZoneKind::Edge, SupportRole::Intermediate, Some(300.0)),
        ]);
        assert_eq!(
            grid[1][0],
            Some(SpacingCell {
                spacing_mm: Some(100.0)
            })
        );
        assert_eq!(grid[1][1], Some(SpacingCell { spacing_mm: None }));
        assert_eq!(grid[0][0], None, "no corner zone given");
    }

    #[test]
    fn a_refused_row_quotes_its_message_and_leaves_the_numbers_empty() {
        let roof = RoofSummary::refused("h-1", "row 2, column roof.slope: bad, really".to_string());
        let text = String::from_utf8(summary_record(&roof).expect("record")).expect("utf8");
        assert!(text.starts_with("h-1,refused,\"row 2, column roof.slope: bad, really\","));
        assert!(text.ends_with(",,,\n"), "{text}");
        let columns = summary_header().len();
        let mut reader = csv::ReaderBuilder::new()
            .has_headers(false)
            .from_reader(text.as_bytes());
        let record = reader.records().next().expect("one").expect("parses");
        assert_eq!(record.len(), columns);
    }

    #[test]
    fn spacing_cells_carry_both_units_and_none() {
        let mut roof = RoofSummary::refused("a", String::new());
        roof.status = RoofStatus::Fails;
        roof.spacings[0][0] = Some(SpacingCell {
            spacing_mm: Some(152.4),
        });
        roof.spacings[0][1] = Some(SpacingCell { spacing_mm: None });
        roof.largest_utilization = Some(1.25);
        let text = String::from_utf8(summary_record(&roof).expect("record")).expect("utf8");
        assert!(text.starts_with("a,fails,,,152,6.00,none,none,"), "{text}");
        assert!(text.ends_with(",0,0.0,1.250\n"), "{text}");
    }
}
