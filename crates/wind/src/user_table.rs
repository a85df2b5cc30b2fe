//! A user's own coefficient table (`--coefficients FILE`, or `coefficients` in the project file): rows
//! in the form of the built-in data (`set`, `region`, `code_zone`, `figure`, `points`), read from the
//! user's copy of the standard, with one stated source for the file. Each row replaces the built-in row
//! of the same set and region; every other row stays built-in.
//!
//! The binary reads the file; this module only parses its text, and refuses a malformed table naming
//! the row and the column (`curves[2].points[1].area_m2: ...`).

use serde_json::Value;

use crate::coefficients::{check_points, table, Edition, Table};
use crate::error::WindError;
use crate::types::{CoefficientTable, CurvePoint, TableRow};
use crate::zones::Region;

/// Keys of the table and of each row (anything else is refused: a misspelt key would be ignored).
const TABLE_KEYS: [&str; 4] = ["edition", "source", "note", "curves"];
const ROW_KEYS: [&str; 7] = [
    "set",
    "region",
    "code_zone",
    "figure",
    "points",
    "confidence",
    "status",
];

fn refuse(file: &str, at: &str, detail: impl std::fmt::Display) -> WindError {
    WindError::range(format!("coefficients {file}: {at}"), detail.to_string())
}

fn edition_of(name: &str) -> Option<Edition> {
    [Edition::Nbc2020, Edition::Asce722]
        .into_iter()
        .find(|edition| table(*edition).is_ok_and(|data| data.edition == name))
}

fn text<'a>(
    file: &str,
    object: &'a serde_json::Map<String, Value>,
    at: &str,
    key: &str,
) -> Result<&'a str, WindError> {
    match object.get(key) {
        Some(Value::String(value)) if !value.trim().is_empty() => Ok(value),
        Some(Value::String(_)) => Err(refuse(file, &format!("{at}{key}"), "is empty")),
        Some(_) => Err(refuse(file, &format!("{at}{key}"), "must be text")),
        None => Err(refuse(file, &format!("{at}{key}"), "is missing")),
    }
}

fn unknown_keys(
    file: &str,
    object: &serde_json::Map<String, Value>,
    at: &str,
    allowed: &[&str],
) -> Result<(), WindError> {
    match object.keys().find(|key| !allowed.contains(&key.as_str())) {
        Some(key) => Err(refuse(
            file,
            &format!("{at}{key}"),
            format!(
                "is not a key of a coefficient table (keys: {})",
                allowed.join(", ")
            ),
        )),
        None => Ok(()),
    }
}

fn points(file: &str, value: Option<&Value>, at: &str) -> Result<Vec<CurvePoint>, WindError> {
    let Some(Value::Array(items)) = value else {
        return Err(refuse(
            file,
            &format!("{at}points"),
            "must be a list of { area_m2, coefficient }",
        ));
    };
    let mut result = Vec::with_capacity(items.len());
    for (index, item) in items.iter().enumerate() {
        let here = format!("{at}points[{index}]");
        let Value::Object(point) = item else {
            return Err(refuse(file, &here, "must be { area_m2, coefficient }"));
        };
        unknown_keys(
            file,
            point,
            &format!("{here}."),
            &["area_m2", "coefficient"],
        )?;
        let number = |key: &str| match point.get(key).and_then(Value::as_f64) {
            Some(value) if value.is_finite() => Ok(value),
            _ => Err(refuse(
                file,
                &format!("{here}.{key}"),
                "must be a finite number",
            )),
        };
        result.push(CurvePoint {
            area_m2: number("area_m2")?,
            coefficient: number("coefficient")?,
        });
    }
    check_points(&result).map_err(|detail| refuse(file, &format!("{at}points"), detail))?;
    Ok(result)
}

/// Parses a user's table from its text; `file` names it in messages and reports.
pub fn parse_coefficient_table(file: &str, text_in: &str) -> Result<CoefficientTable, WindError> {
    let value: Value =
        serde_json::from_str(text_in).map_err(|error| refuse(file, "JSON", error))?;
    let Value::Object(root) = &value else {
        return Err(refuse(
            file,
            "top level",
            "must be an object { edition, source, curves }",
        ));
    };
    unknown_keys(file, root, "", &TABLE_KEYS)?;
    let edition = text(file, root, "", "edition")?;
    let data = edition_of(edition).map(table).transpose()?.ok_or_else(|| {
        refuse(
            file,
            "edition",
            format!("'{edition}' is not an edition with built-in data (NBC 2020, ASCE 7-22)"),
        )
    })?;
    let source = text(file, root, "", "source").map_err(|_| {
        refuse(
            file,
            "source",
            "must say where the values come from (the standard, edition, figure and who read it)",
        )
    })?;
    let Some(Value::Array(curves)) = root.get("curves") else {
        return Err(refuse(file, "curves", "must be a list of rows"));
    };
    let mut rows: Vec<TableRow> = Vec::new();
    for (index, item) in curves.iter().enumerate() {
        let at = format!("curves[{index}].");
        let Value::Object(row) = item else {
            return Err(refuse(
                file,
                &format!("curves[{index}]"),
                "must be an object",
            ));
        };
        unknown_keys(file, row, &at, &ROW_KEYS)?;
        if let Some(status) = row.get("status") {
            if status.as_str() != Some("user-supplied") {
                return Err(refuse(
                    file,
                    &format!("{at}status"),
                    format!("{status}: the rows of a user's table are user-supplied; delete the key or write \"user-supplied\""),
                ));
            }
        }
        let set = text(file, row, &at, "set")?;
        let region = text(file, row, &at, "region")?;
        let code_zone = text(file, row, &at, "code_zone")?;
        let figure = text(file, row, &at, "figure")?;
        let built_in = built_in_row(data, set, region)
            .map_err(|detail| refuse(file, &format!("{at}set"), detail))?;
        if built_in.code_zone != code_zone {
            return Err(refuse(
                file,
                &format!("{at}code_zone"),
                format!(
                    "'{code_zone}': set {set} region {region} is zone '{}' of {}",
                    built_in.code_zone, built_in.figure
                ),
            ));
        }
        if let Some(first) = rows.iter().position(|r| r.set == set && r.region == region) {
            return Err(refuse(
                file,
                &format!("curves[{index}]"),
                format!("set {set} region {region} is already given in curves[{first}]"),
            ));
        }
        rows.push(TableRow {
            set: set.to_string(),
            region: region.to_string(),
            code_zone: code_zone.to_string(),
            figure: figure.to_string(),
            points: points(file, row.get("points"), &at)?,
        });
    }
    if rows.is_empty() {
        return Err(refuse(file, "curves", "has no rows"));
    }
    Ok(CoefficientTable {
        file: file.to_string(),
        edition: data.edition.clone(),
        source: source.to_string(),
        rows,
    })
}

/// The built-in row a user's row replaces, or why there is none (naming the sets and regions there are).
fn built_in_row<'a>(
    data: &'a Table,
    set: &str,
    region: &str,
) -> Result<&'a crate::coefficients::CurveData, String> {
    if !data.curves.iter().any(|c| c.set == set) {
        let mut sets: Vec<&str> = data.curves.iter().map(|c| c.set.as_str()).collect();
        sets.dedup();
        return Err(format!(
            "'{set}' is not a coefficient set of {} (sets: {})",
            data.edition,
            sets.join(", ")
        ));
    }
    data.curves
        .iter()
        .find(|c| c.set == set && c.region == region)
        .ok_or_else(|| {
            let regions: Vec<&str> = data
                .curves
                .iter()
                .filter(|c| c.set == set)
                .map(|c| c.region.as_str())
                .collect();
            format!(
                "set {set} has no region '{region}' (regions: {})",
                regions.join(", ")
            )
        })
}

impl CoefficientTable {
    /// The user's row for a set and region, if the table has one.
    pub(crate) fn row(&self, set: &str, region: Region) -> Option<&TableRow> {
        self.rows
            .iter()
            .find(|row| row.set == set && row.region == region.as_str())
    }
}

/// A template of a user's table for `edition`: every built-in row of that edition in the table's form,
/// with an empty source (a table is refused until its source is stated).
pub fn coefficient_table_template(edition: &str) -> Result<Value, WindError> {
    let data = edition_of(edition).map(table).transpose()?.ok_or_else(|| {
        WindError::range(
            "--template",
            format!("'{edition}' is not an edition with built-in data (NBC 2020, ASCE 7-22)"),
        )
    })?;
    // Each row names its figure as the zone map does (without the built-in row's notes such as
    // "low confidence", which would not describe the user's values).
    let mut curves: Vec<Value> = Vec::with_capacity(data.curves.len());
    for curve in &data.curves {
        let figure = &crate::zone_maps::figure(&data.figures, &curve.set, &data.edition)?.figure;
        let points: Vec<Value> = curve
            .points
            .iter()
            .map(|p| serde_json::json!({"area_m2": p.area_m2, "coefficient": p.coefficient}))
            .collect();
        curves.push(serde_json::json!({
            "set": curve.set,
            "region": curve.region,
            "code_zone": curve.code_zone,
            "figure": figure,
            "points": points,
        }));
    }
    Ok(serde_json::json!({
        "edition": data.edition,
        "source": "",
        "note": "Template written by `deckhold catalog coefficients --template`: the built-in rows, some from memory. Replace the values with those of your copy of the standard, state in `source` which document, edition and figure they come from and who read them, and delete the rows you do not replace (a deleted row stays built-in). Areas in m2.",
        "curves": curves,
    }))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn table_text(rows: &str) -> String {
        format!(
            r#"{{"edition": "ASCE 7-22", "source": "printed ASCE 7-22, Figure 30.3-2C, read by the engineer of record", "curves": [{rows}]}}"#
        )
    }

    const CORNER: &str = r#"{"set": "gable-20-27", "region": "corner", "code_zone": "3", "figure": "ASCE 7-22 Figure 30.3-2C", "points": [{"area_m2": 0.929, "coefficient": -3.3}, {"area_m2": 9.29, "coefficient": -2.2}]}"#;

    #[test]
    fn a_good_table_parses() {
        let parsed = parse_coefficient_table("mine.json", &table_text(CORNER)).expect("parses");
        assert_eq!(parsed.edition, "ASCE 7-22");
        assert_eq!(parsed.rows.len(), 1);
        assert!(parsed.row("gable-20-27", Region::Corner).is_some());
        assert!(parsed.row("gable-20-27", Region::Edge).is_none());
    }

    #[test]
    fn malformed_tables_name_the_row_and_column() {
        let cases = [
            (
                table_text(&CORNER.replace("0.929", "9.5")),
                "curves[0].points: point 1: areas must increase",
            ),
            (
                table_text(&CORNER.replace("\"3\"", "\"2\"")),
                "curves[0].code_zone",
            ),
            (
                table_text(&CORNER.replace("gable-20-27", "gable-20-28")),
                "curves[0].set: 'gable-20-28' is not a coefficient set",
            ),
            (
                table_text(&CORNER.replace("corner", "crner")),
                "curves[0].set: set gable-20-27 has no region 'crner'",
            ),
            (
                table_text(&CORNER.replace("-3.3", "\"x\"")),
                "curves[0].points[0].coefficient: must be a finite number",
            ),
            (
                table_text(&CORNER.replace("\"figure\"", "\"figur\"")),
                "curves[0].figur: is not a key",
            ),
            (
                table_text(&format!("{CORNER}, {CORNER}")),
                "curves[1]: set gable-20-27 region corner is already given in curves[0]",
            ),
            (
                table_text(
                    &CORNER.replace("\"points\"", "\"status\": \"from memory\", \"points\""),
                ),
                "curves[0].status",
            ),
            (
                table_text(CORNER).replace(
                    "printed ASCE 7-22, Figure 30.3-2C, read by the engineer of record",
                    " ",
                ),
                "source: must say",
            ),
            (
                table_text(CORNER).replace("ASCE 7-22\", \"source", "ASCE 7-16\", \"source"),
                "edition: 'ASCE 7-16'",
            ),
            ("[1, 2]".to_string(), "top level"),
        ];
        for (text, expected) in cases {
            let error = parse_coefficient_table("mine.json", &text)
                .expect_err(expected)
                .to_string();
            assert!(error.starts_with("coefficients mine.json: "), "{error}");
            assert!(error.contains(expected), "{expected} not in: {error}");
        }
    }

    #[test]
    fn the_template_parses_once_its_source_is_stated() {
        for edition in ["NBC 2020", "ASCE 7-22"] {
            let mut template = coefficient_table_template(edition).expect("template");
            let text = template.to_string();
            assert!(parse_coefficient_table("t.json", &text)
                .expect_err("no source")
                .to_string()
                .contains("source"));
            template["source"] = Value::String("my copy".to_string());
            let parsed = parse_coefficient_table("t.json", &template.to_string()).expect("parses");
            let built_in = table(edition_of(edition).expect("edition")).expect("data");
            assert_eq!(parsed.rows.len(), built_in.curves.len());
        }
    }
}
