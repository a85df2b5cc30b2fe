//! One batch row applied to the base project's JSON value tree. The result then goes through the normal
//! reader ([`crate::project_from_value`]), so every key, range and unit check applies to a row as to a file.

use super::columns::OverrideColumn;
use crate::units::{with_unit_key, Quantity};
use serde_json::{Map, Number, Value};

/// The unit variants a key may have, so that a column given in one unit replaces the base's value in the
/// other (`framing.spacing_in` over a base with `framing.spacing_mm`).
const QUANTITIES: [Quantity; 4] = [
    Quantity::LengthM,
    Quantity::LengthMm,
    Quantity::PressureKpa,
    Quantity::AreaM2,
];

/// Keys that give one value two ways without a unit suffix pair.
const ALTERNATE_KEYS: [(&str, &str); 1] = [("slope", "slope_deg")];

/// Separator of list items in one cell (`nails` as `a;b;c`).
pub const LIST_SEPARATOR: char = ';';

/// Sets every non-empty cell of the row in a copy of `base`. An empty cell keeps the base's value.
/// Err: (column name, message) for a cell that cannot be set.
pub fn apply_row(
    base: &Value,
    columns: &[OverrideColumn],
    cells: &[&str],
) -> Result<Value, (String, String)> {
    let mut tree = base.clone();
    for column in columns {
        let Some(cell) = cells.get(column.index).map(|cell| cell.trim()) else {
            continue;
        };
        if cell.is_empty() {
            continue;
        }
        set_path(&mut tree, &column.keys, cell)
            .map_err(|message| (column.name.clone(), message))?;
    }
    Ok(tree)
}

fn set_path(tree: &mut Value, keys: &[String], cell: &str) -> Result<(), String> {
    let Some((leaf, parents)) = keys.split_last() else {
        return Err("the column names no key".to_string());
    };
    // The keys walked before `depth`, spelt only for a message.
    let not_an_object = |depth: usize, key: &str| {
        format!(
            "{} is not a group of keys in the base project, so {key} cannot be set in it",
            if depth == 0 {
                "the root".to_string()
            } else {
                keys[..depth].join(".")
            }
        )
    };
    let mut node = tree;
    for (depth, key) in parents.iter().enumerate() {
        let Value::Object(map) = node else {
            return Err(not_an_object(depth, key));
        };
        if !map.contains_key(key.as_str()) {
            map.insert(key.clone(), Value::Object(Map::new()));
        }
        node = map
            .get_mut(key.as_str())
            .ok_or_else(|| not_an_object(depth, key))?;
    }
    let Value::Object(map) = node else {
        return Err(not_an_object(parents.len(), leaf));
    };
    let value = typed_value(map.get(leaf.as_str()), cell)?;
    remove_twins(map, leaf);
    match map.get_mut(leaf.as_str()) {
        Some(held) => *held = value,
        None => {
            map.insert(leaf.clone(), value);
        }
    }
    Ok(())
}

/// Removes the other spellings of `key`'s value: the other unit variant, or the alternate key.
fn remove_twins(map: &mut Map<String, Value>, key: &str) {
    for quantity in QUANTITIES {
        let (si, us) = (quantity.si_suffix(), quantity.us_suffix());
        if let Some(stem) = unit_stem(key, si) {
            with_unit_key(stem, us, |twin| map.remove(twin));
        }
        if let Some(stem) = unit_stem(key, us) {
            with_unit_key(stem, si, |twin| map.remove(twin));
        }
    }
    for (first, second) in ALTERNATE_KEYS {
        if key == first {
            map.remove(second);
        } else if key == second {
            map.remove(first);
        }
    }
}

/// The stem of `key` when it ends in `_suffix`.
fn unit_stem<'k>(key: &'k str, suffix: &str) -> Option<&'k str> {
    key.strip_suffix(suffix)?.strip_suffix('_')
}

/// The cell as a JSON value of the kind the base holds at that key; where the base has no value there,
/// a number if the cell reads as one, true/false, else text. The reader then checks the kind it needs.
fn typed_value(base: Option<&Value>, cell: &str) -> Result<Value, String> {
    match base {
        Some(Value::String(_)) => Ok(Value::String(cell.to_string())),
        Some(Value::Number(_)) => number(cell).ok_or_else(|| format!("'{cell}' is not a number")),
        Some(Value::Bool(_)) => {
            boolean(cell).ok_or_else(|| format!("'{cell}' is not true or false"))
        }
        Some(Value::Array(items)) => {
            let texts = items.first().is_none_or(Value::is_string);
            Ok(Value::Array(
                cell.split(LIST_SEPARATOR)
                    .map(str::trim)
                    .filter(|item| !item.is_empty())
                    .map(|item| {
                        if texts {
                            Value::String(item.to_string())
                        } else {
                            guessed(item)
                        }
                    })
                    .collect(),
            ))
        }
        Some(Value::Object(_)) => Err(
            "the base project holds a group of keys here; name one of its keys in the column"
                .to_string(),
        ),
        Some(Value::Null) | None => Ok(guessed(cell)),
    }
}

fn number(cell: &str) -> Option<Value> {
    let value: f64 = cell.parse().ok()?;
    if !value.is_finite() {
        return None;
    }
    // Whole numbers stay integers, so a value reads back as the user wrote it.
    if value.fract() == 0.0 && value.abs() < 9.0e15 && !cell.contains(['.', 'e', 'E']) {
        return Some(Value::Number(Number::from(value as i64)));
    }
    Number::from_f64(value).map(Value::Number)
}

fn boolean(cell: &str) -> Option<Value> {
    match cell {
        "true" => Some(Value::Bool(true)),
        "false" => Some(Value::Bool(false)),
        _ => None,
    }
}

fn guessed(cell: &str) -> Value {
    number(cell)
        .or_else(|| boolean(cell))
        .unwrap_or_else(|| Value::String(cell.to_string()))
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    fn column(index: usize, name: &str) -> OverrideColumn {
        OverrideColumn {
            index,
            name: name.to_string(),
            keys: name.split('.').map(str::to_string).collect(),
        }
    }

    #[test]
    fn cells_take_the_kind_of_the_base_value() {
        let base = json!({
            "project": {"name": "base"},
            "roof": {"slope": "5:12", "dead_load_kpa": 0.3},
            "deck": {"treated": false},
            "nails": ["a", "b"]
        });
        let columns = [
            column(0, "project.name"),
            column(1, "roof.dead_load_kpa"),
            column(2, "deck.treated"),
            column(3, "nails"),
            column(4, "roof.shape"),
        ];
        let tree =
            apply_row(&base, &columns, &["1234", "0.5", "true", "x; y;z", "hip"]).expect("applies");
        assert_eq!(tree["project"]["name"], json!("1234"));
        assert_eq!(tree["roof"]["dead_load_kpa"], json!(0.5));
        assert_eq!(tree["deck"]["treated"], json!(true));
        assert_eq!(tree["nails"], json!(["x", "y", "z"]));
        assert_eq!(tree["roof"]["shape"], json!("hip"));
        assert_eq!(tree["roof"]["slope"], json!("5:12"), "untouched");
    }

    #[test]
    fn an_empty_cell_keeps_the_base_value() {
        let base = json!({"roof": {"dead_load_kpa": 0.3}});
        let tree = apply_row(&base, &[column(0, "roof.dead_load_kpa")], &[" "]).expect("applies");
        assert_eq!(tree, base);
    }

    #[test]
    fn a_column_in_the_other_unit_replaces_the_base_value() {
        let base = json!({"framing": {"spacing_mm": 610}, "roof": {"slope": "5:12"}});
        let columns = [column(0, "framing.spacing_in"), column(1, "roof.slope_deg")];
        let tree = apply_row(&base, &columns, &["16", "30"]).expect("applies");
        assert_eq!(tree["framing"], json!({"spacing_in": 16}));
        assert_eq!(tree["roof"], json!({"slope_deg": 30}));
    }

    #[test]
    fn a_cell_that_cannot_be_set_names_its_column() {
        let base = json!({"roof": {"dead_load_kpa": 0.3, "shape": "gable"}});
        let (name, message) = apply_row(&base, &[column(0, "roof.dead_load_kpa")], &["heavy"])
            .expect_err("not a number");
        assert_eq!(name, "roof.dead_load_kpa");
        assert!(message.contains("'heavy' is not a number"), "{message}");
        let (name, message) =
            apply_row(&base, &[column(0, "roof.shape.kind")], &["x"]).expect_err("not an object");
        assert_eq!(name, "roof.shape.kind");
        assert!(message.contains("roof.shape"), "{message}");
        let (_, message) =
            apply_row(&base, &[column(0, "roof")], &["x"]).expect_err("a whole group");
        assert!(message.contains("group of keys"), "{message}");
    }
}
