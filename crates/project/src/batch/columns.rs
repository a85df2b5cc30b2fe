//! The header of a batch file: an `id` column, and columns named by project-file key paths.

use super::BatchError;

/// Name of the column that names each roof.
pub const ID_COLUMN: &str = "id";

use deckhold_core::limits::{BATCH_COLUMNS, ROOF_ID_CHARS};

/// Names in the output folder that a roof's folder may not take.
pub const RESERVED_IDS: [&str; 1] = ["summary.csv"];

/// One override column: where it sits in a row and the key path it sets.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct OverrideColumn {
    /// Position in the row.
    pub index: usize,
    /// The key path as written in the header, e.g. `roof.slope`.
    pub name: String,
    /// The path split at the dots.
    pub keys: Vec<String>,
}

/// The batch file's header, checked once for the whole batch.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Columns {
    pub id_index: usize,
    pub overrides: Vec<OverrideColumn>,
    /// Number of fields every row must have.
    pub width: usize,
}

impl Columns {
    /// Reads the header row. Refuses the whole batch when there is no `id` column, a column is named
    /// twice, or a name is not a key path (empty, or with an empty part between dots).
    pub fn from_header<'h>(header: impl IntoIterator<Item = &'h str>) -> Result<Self, BatchError> {
        let names: Vec<&str> = header.into_iter().map(str::trim).collect();
        BATCH_COLUMNS
            .check_count("the header", names.len())
            .map_err(|error| BatchError::Header(error.to_string()))?;
        let mut id_index = None;
        let mut overrides = Vec::with_capacity(names.len());
        for (index, name) in names.iter().enumerate() {
            if names[..index].contains(name) {
                return Err(BatchError::Header(format!(
                    "column {name} is named twice (columns {} and {})",
                    names[..index]
                        .iter()
                        .position(|earlier| earlier == name)
                        .map_or(0, |earlier| earlier + 1),
                    index + 1
                )));
            }
            if *name == ID_COLUMN {
                id_index = Some(index);
                continue;
            }
            let keys: Vec<String> = name.split('.').map(str::to_string).collect();
            if name.is_empty() || keys.iter().any(|key| key.is_empty()) {
                return Err(BatchError::Header(format!(
                    "column {} is named '{name}', which is not a key path of the project file \
                     (e.g. roof.slope)",
                    index + 1
                )));
            }
            overrides.push(OverrideColumn {
                index,
                name: name.to_string(),
                keys,
            });
        }
        let id_index = id_index.ok_or_else(|| {
            BatchError::Header(format!(
                "no '{ID_COLUMN}' column (each row needs an id that names its roof)"
            ))
        })?;
        Ok(Columns {
            id_index,
            overrides,
            width: names.len(),
        })
    }
}

/// Checks a roof id: it names the roof's output folder, so only letters, digits, `.`, `_` and `-`, not
/// starting with `.`, at most [`ROOF_ID_CHARS`], none of [`RESERVED_IDS`].
pub fn check_id(id: &str) -> Result<(), String> {
    if id.is_empty() {
        return Err("the id is empty".to_string());
    }
    if let Err(error) = ROOF_ID_CHARS.check_count("the id", id.chars().count()) {
        return Err(error.to_string());
    }
    if RESERVED_IDS.contains(&id) {
        return Err(format!(
            "the id '{id}' is the name of the batch's own output file"
        ));
    }
    if id.starts_with('.') {
        return Err(format!("the id '{id}' starts with '.'"));
    }
    if let Some(bad) = id
        .chars()
        .find(|c| !(c.is_ascii_alphanumeric() || matches!(c, '.' | '_' | '-')))
    {
        return Err(format!(
            "the id '{id}' holds '{bad}'; use letters, digits, '.', '_' and '-' (it names a folder)"
        ));
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_header_needs_an_id_and_distinct_key_paths() {
        let columns = Columns::from_header(["roof.slope", " id ", "nails"]).expect("a good header");
        assert_eq!(columns.id_index, 1);
        assert_eq!(columns.width, 3);
        assert_eq!(columns.overrides[0].keys, ["roof", "slope"]);
        assert_eq!(columns.overrides[1].index, 2);

        let missing = Columns::from_header(["roof.slope"]).expect_err("no id");
        assert!(missing.to_string().contains("no 'id' column"), "{missing}");
        let twice = Columns::from_header(["id", "roof.slope", "roof.slope"]).expect_err("twice");
        assert!(twice.to_string().contains("columns 2 and 3"), "{twice}");
        let empty = Columns::from_header(["id", "roof..slope"]).expect_err("empty part");
        assert!(empty.to_string().contains("column 2"), "{empty}");
    }

    #[test]
    fn ids_must_make_safe_folder_names() {
        assert!(check_id("house-12_b.3").is_ok());
        for bad in [
            "",
            "..",
            ".hidden",
            "summary.csv",
            "a/b",
            "a b",
            "x\\y",
            &"z".repeat(65),
        ] {
            assert!(check_id(bad).is_err(), "{bad:?} accepted");
        }
    }
}
