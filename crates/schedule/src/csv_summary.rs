//! `summary.csv` of a batch: one row per roof, in the order of the input rows.
//!
//! A roof's row is formatted on its own ([`summary_record`]) so that roofs worked in parallel can be
//! formatted where they were worked and written in input order by the caller; the bytes do not depend on
//! which thread formatted them. Both unit systems are present for every spacing, as in `schedule.csv`.

use crate::csv_schedule::NO_SPACING;
use crate::format::{escape_controls, fixed, mm_to_in, places};
use crate::{RoofStatus, RoofSummary, ScheduleError, SpacingCell, SUMMARY_ROLES, SUMMARY_ZONES};

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
        escape_controls(&roof.id).into_owned(),
        roof.status.as_str().to_string(),
        escape_controls(&roof.message).into_owned(),
        escape_controls(&roof.nail_id).into_owned(),
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
