//! One roof of a batch: its row made into a project, the job's answer boiled down to one summary line.

use super::columns::{check_id, Columns};
use super::overrides::apply_row;
use crate::job::Job;
use crate::project::Project;
use crate::report::zone_rows_of;
use deckhold_model::{RoofStatus, RoofSummary};
use serde_json::Value;

/// A row of the batch file as read: its number as a spreadsheet shows it (the header is row 1) and its
/// fields.
#[derive(Debug, Clone, Copy)]
pub struct Row<'a> {
    pub number: u64,
    pub cells: &'a [&'a str],
}

impl Row<'_> {
    /// The row's id cell, trimmed (empty when the row is too short to have one).
    pub fn id(&self, columns: &Columns) -> &str {
        self.cells
            .get(columns.id_index)
            .map_or("", |cell| cell.trim())
    }
}

/// A refused row's summary, its message naming the row and, where one can be told, the column.
pub fn refused(id: &str, row_number: u64, column: Option<&str>, message: &str) -> RoofSummary {
    let place = match column {
        Some(column) => format!("row {row_number}, column {column}"),
        None => format!("row {row_number}"),
    };
    // The reader's messages start with the key path; say it once when it is the column's own.
    let message = column
        .and_then(|column| message.strip_prefix(&format!("{column}: ")))
        .unwrap_or(message);
    RoofSummary::refused(id, format!("{place}: {message}"))
}

/// The row as a validated project: the base with the row's cells set, read by the normal reader.
/// Err: the refused row's summary.
pub fn row_project(
    base: &Value,
    columns: &Columns,
    row: &Row,
) -> Result<Project, Box<RoofSummary>> {
    let refuse = |column: Option<&str>, message: &str| {
        Box::new(refused(row.id(columns), row.number, column, message))
    };
    if row.cells.len() != columns.width {
        return Err(refuse(
            None,
            &format!(
                "{} fields where the header has {}",
                row.cells.len(),
                columns.width
            ),
        ));
    }
    if let Err(message) = check_id(row.id(columns)) {
        return Err(refuse(Some(super::ID_COLUMN), &message));
    }
    let tree = apply_row(base, &columns.overrides, row.cells)
        .map_err(|(column, message)| refuse(Some(&column), &message))?;
    crate::parse::project_from_tree(tree).map_err(|error| {
        let message = error.to_string();
        refuse(column_named_in(columns, &message), &message)
    })
}

/// The column whose key path the message names (the longest such name), if any.
pub fn column_named_in<'c>(columns: &'c Columns, message: &str) -> Option<&'c str> {
    columns
        .overrides
        .iter()
        .map(|column| column.name.as_str())
        .filter(|name| message.contains(name))
        .max_by_key(|name| name.len())
}

/// The summary line of a worked roof.
pub fn summarize(id: &str, job: &Job) -> RoofSummary {
    let chosen = job.chosen();
    let zones = zone_rows_of(job);
    let largest_utilization = zones.iter().map(|zone| zone.utilization).fold(
        None,
        |largest: Option<f64>, utilization| {
            Some(largest.map_or(utilization, |held| held.max(utilization)))
        },
    );
    let (total_nail_count, total_nail_mass_kg) = chosen.plan.as_ref().map_or((0, 0.0), |plan| {
        (plan.total_nail_count, plan.total_nail_mass_kg)
    });
    let feasible = job.feasible();
    RoofSummary {
        id: id.to_string(),
        status: if feasible {
            RoofStatus::Ok
        } else {
            RoofStatus::Fails
        },
        message: if feasible {
            String::new()
        } else {
            chosen.shortfall(&job.wind).unwrap_or_default()
        },
        nail_id: chosen.nail.id.clone(),
        spacings: RoofSummary::spacing_grid(&zones),
        total_nail_count,
        total_nail_mass_kg,
        largest_utilization,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::DEMO_PROJECT_JSON;

    fn base() -> Value {
        serde_json::from_str(DEMO_PROJECT_JSON).expect("the demo is JSON")
    }

    #[test]
    fn a_value_out_of_range_is_refused_naming_row_and_column() {
        let columns = Columns::from_header(["id", "roof.slope"]).expect("header");
        let cells = ["h1", "30:12"];
        let row = Row {
            number: 4,
            cells: &cells,
        };
        let refusal = row_project(&base(), &columns, &row).expect_err("too steep");
        assert_eq!(refusal.status, RoofStatus::Refused);
        assert_eq!(refusal.id, "h1");
        assert!(
            refusal.message.starts_with("row 4, column roof.slope: "),
            "{}",
            refusal.message
        );
        assert!(refusal.message.contains("outside"), "{}", refusal.message);
    }

    #[test]
    fn a_short_row_and_a_bad_id_are_refused() {
        let columns = Columns::from_header(["id", "roof.shape"]).expect("header");
        let short = ["h2"];
        let refusal = row_project(
            &base(),
            &columns,
            &Row {
                number: 3,
                cells: &short,
            },
        )
        .expect_err("short");
        assert!(refusal.message.contains("1 fields where the header has 2"));
        let bad_id = ["../x", "hip"];
        let refusal = row_project(
            &base(),
            &columns,
            &Row {
                number: 5,
                cells: &bad_id,
            },
        )
        .expect_err("bad id");
        assert!(
            refusal.message.starts_with("row 5, column id: "),
            "{}",
            refusal.message
        );
    }

    #[test]
    fn a_good_row_sets_the_base_value() {
        let columns = Columns::from_header(["id", "roof.shape", "nails"]).expect("header");
        let cells = ["h3", "hip", "common-63x3.25;spiral-63x3.25"];
        let project = row_project(
            &base(),
            &columns,
            &Row {
                number: 2,
                cells: &cells,
            },
        )
        .expect("works");
        assert_eq!(project.nails, ["common-63x3.25", "spiral-63x3.25"]);
        assert_eq!(project.wind.roof.shape, deckhold_wind::RoofShape::Hip);
        // Its inputs as given, spelt only when asked, are the row's value tree's.
        let tree = apply_row(&base(), &columns.overrides, &cells).expect("applies");
        let rows = project.as_written.rows();
        let spelt = |rows: &[deckhold_model::InputRow]| -> Vec<String> {
            rows.iter()
                .map(|row| format!("{} = {}", row.key, row.value))
                .collect()
        };
        assert_eq!(
            spelt(&rows),
            spelt(&crate::as_written::rows_from_value(&tree))
        );
        assert!(rows
            .iter()
            .any(|row| row.key == "roof.shape" && row.value == "hip"));
    }
}
