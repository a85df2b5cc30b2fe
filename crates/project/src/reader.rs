//! A strict reader over a JSON object that remembers the key path, so every message can name the key, and
//! that refuses keys nobody asked for (a misspelt key must not silently fall back to a default).
//!
//! Reading a good file builds no text: key paths and the list of allowed keys are spelt out only when a
//! message needs them (a batch reads one project per row, and the spelling cost more than the reading).

use crate::error::ProjectError;
use crate::units::{with_unit_key, Quantity};
use deckhold_core::limits::{self, Limit};
use serde_json::{Map, Value};
use std::cell::RefCell;
use std::collections::BTreeSet;
use std::fmt;

/// A key the parser asked for: a plain key (`suffix` empty), or a quantity's stem with one unit suffix
/// (`eave_height` + `m` is `eave_height_m`), kept in two parts so that asking needs no allocation.
#[derive(Debug, Clone, Copy)]
struct Asked {
    stem: &'static str,
    suffix: &'static str,
}

impl Asked {
    fn plain(key: &'static str) -> Self {
        Asked {
            stem: key,
            suffix: "",
        }
    }

    fn unit(stem: &'static str, suffix: &'static str) -> Self {
        Asked { stem, suffix }
    }

    /// True when `written` is this key.
    fn is(self, written: &str) -> bool {
        if self.suffix.is_empty() {
            return written == self.stem;
        }
        written
            .strip_prefix(self.stem)
            .and_then(|rest| rest.strip_prefix('_'))
            == Some(self.suffix)
    }

    /// The key's entry in `map`, looked up without allocating.
    fn find_in(self, map: &Map<String, Value>) -> Option<(&String, &Value)> {
        if self.suffix.is_empty() {
            return map.get_key_value(self.stem);
        }
        with_unit_key(self.stem, self.suffix, |key| map.get_key_value(key))
    }
}

impl fmt::Display for Asked {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.suffix.is_empty() {
            f.write_str(self.stem)
        } else {
            write!(f, "{}_{}", self.stem, self.suffix)
        }
    }
}

/// Room for the keys asked at one place before the list grows (the `deck` block asks 20).
const ASKED_CAPACITY: usize = 32;

/// One JSON object being read, with its path from the file's root.
#[derive(Debug)]
pub struct ObjectReader<'a> {
    path: String,
    map: &'a Map<String, Value>,
    /// The keys of `map` that were read.
    used: RefCell<Vec<&'a str>>,
    /// Every key the parser asked for here, present or not: the keys allowed at this place.
    asked: RefCell<Vec<Asked>>,
}

impl<'a> ObjectReader<'a> {
    /// Wraps `value`, which must be an object, found at `path` (empty for the root).
    pub fn new(path: &str, value: &'a Value) -> Result<Self, ProjectError> {
        Self::at(path.to_string(), value)
    }

    fn at(path: String, value: &'a Value) -> Result<Self, ProjectError> {
        match value {
            Value::Object(map) => Ok(Self {
                path,
                map,
                used: RefCell::new(Vec::with_capacity(map.len())),
                asked: RefCell::new(Vec::with_capacity(ASKED_CAPACITY)),
            }),
            _ => Err(ProjectError::WrongType {
                path: display_path(&path),
                expected: "an object".to_string(),
            }),
        }
    }

    /// The path of `key` below this object.
    pub fn key_path(&self, key: &str) -> String {
        if self.path.is_empty() {
            key.to_string()
        } else {
            [self.path.as_str(), ".", key].concat()
        }
    }

    fn asked_path(&self, key: Asked) -> String {
        self.key_path(&key.to_string())
    }

    /// The raw value of `key`, marking it as read.
    pub fn get(&self, key: &'static str) -> Option<&'a Value> {
        self.get_asked(Asked::plain(key))
    }

    fn get_asked(&self, key: Asked) -> Option<&'a Value> {
        let entry = self.look_up(key);
        self.mark_used(entry)
    }

    /// Records `key` as asked here and finds its entry, without marking it read.
    fn look_up(&self, key: Asked) -> Option<(&'a String, &'a Value)> {
        self.asked.borrow_mut().push(key);
        key.find_in(self.map)
    }

    /// Marks an entry found by [`Self::look_up`] as read and gives its value.
    fn mark_used(&self, entry: Option<(&'a String, &'a Value)>) -> Option<&'a Value> {
        let (stored_key, value) = entry?;
        self.used.borrow_mut().push(stored_key.as_str());
        Some(value)
    }

    pub fn has(&self, key: &'static str) -> bool {
        self.has_asked(Asked::plain(key))
    }

    fn has_asked(&self, key: Asked) -> bool {
        self.look_up(key).is_some()
    }

    pub fn require(&self, key: &'static str) -> Result<&'a Value, ProjectError> {
        self.get(key).ok_or_else(|| self.missing(key))
    }

    /// `key` is required and absent: if a key nobody asked for is near it, that key is a misspelling of
    /// it and is named (`roof.slop_deg: unknown key; did you mean "slope_deg"?`), else `key` is missing.
    pub fn missing(&self, key: &str) -> ProjectError {
        let asked = self.asked.borrow();
        let typo = self
            .map
            .keys()
            .filter(|written| !asked.iter().any(|allowed| allowed.is(written)))
            .find(|written| is_near(written, key));
        match typo {
            Some(written) => self.unknown_key(written),
            None => ProjectError::Missing {
                path: self.key_path(key),
            },
        }
    }

    fn unknown_key(&self, written: &str) -> ProjectError {
        let asked: BTreeSet<String> = self.asked.borrow().iter().map(Asked::to_string).collect();
        let nearest = asked
            .iter()
            .filter(|allowed| is_near(written, allowed))
            .max_by(|a, b| {
                strsim::jaro_winkler(written, a).total_cmp(&strsim::jaro_winkler(written, b))
            });
        ProjectError::UnknownKey {
            path: self.key_path(&escape_text(written)),
            suggestion: nearest.map_or(String::new(), |key| format!("; did you mean \"{key}\"?")),
            allowed: if asked.is_empty() {
                "none".to_string()
            } else {
                asked.iter().cloned().collect::<Vec<_>>().join(", ")
            },
        }
    }

    /// A nested object, if present.
    pub fn object(&self, key: &'static str) -> Result<Option<ObjectReader<'a>>, ProjectError> {
        match self.get(key) {
            None => Ok(None),
            Some(value) => ObjectReader::at(self.key_path(key), value).map(Some),
        }
    }

    pub fn require_object(&self, key: &'static str) -> Result<ObjectReader<'a>, ProjectError> {
        self.object(key)?.ok_or_else(|| self.missing(key))
    }

    pub fn string(&self, key: &'static str) -> Result<Option<&'a str>, ProjectError> {
        match self.get(key) {
            None => Ok(None),
            Some(Value::String(text)) => {
                self.check_count(key, &limits::NOTES_CHARS, text.chars().count())?;
                Ok(Some(text.as_str()))
            }
            Some(_) => Err(self.wrong_type(key, "a string")),
        }
    }

    /// Refuses a count of `key` (characters, entries) outside `limit`, naming `key`'s path.
    pub fn check_count(&self, key: &str, limit: &Limit, count: usize) -> Result<(), ProjectError> {
        Ok(limit.check_scaled_named(|| self.key_path(key), count as f64, 1.0, limit.unit)?)
    }

    /// Refuses a value of `key` written in `unit_written` outside `limit` (see [`Limit::check_scaled`]);
    /// the path is spelt only for the message.
    fn check_scaled(
        &self,
        key: Asked,
        limit: &Limit,
        value_written: f64,
        table_per_written: f64,
        unit_written: &str,
    ) -> Result<(), ProjectError> {
        Ok(limit.check_scaled_named(
            || self.asked_path(key),
            value_written,
            table_per_written,
            unit_written,
        )?)
    }

    pub fn bool(&self, key: &'static str) -> Result<Option<bool>, ProjectError> {
        match self.get(key) {
            None => Ok(None),
            Some(Value::Bool(flag)) => Ok(Some(*flag)),
            Some(_) => Err(self.wrong_type(key, "true or false")),
        }
    }

    /// A plain number (no unit variants), checked against its limit.
    pub fn number(&self, key: &'static str, limit: &Limit) -> Result<Option<f64>, ProjectError> {
        let Some(value) = self.get(key) else {
            return Ok(None);
        };
        let number = as_finite_number(value).ok_or_else(|| self.wrong_type(key, "a number"))?;
        self.check_scaled(Asked::plain(key), limit, number, 1.0, limit.unit)?;
        Ok(Some(number))
    }

    /// One of a fixed set of words.
    pub fn choice<T: Copy>(
        &self,
        key: &'static str,
        choices: &[(&str, T)],
    ) -> Result<Option<T>, ProjectError> {
        let Some(word) = self.string(key)? else {
            return Ok(None);
        };
        choices
            .iter()
            .find(|(name, _)| *name == word)
            .map(|(_, value)| Some(*value))
            .ok_or_else(|| {
                let nearest = choices
                    .iter()
                    .map(|(name, _)| *name)
                    .find(|name| is_near(word, name));
                ProjectError::Invalid {
                    path: self.key_path(key),
                    message: format!(
                        "'{}' is not one of {}{}",
                        escape_text(word),
                        choices
                            .iter()
                            .map(|(name, _)| *name)
                            .collect::<Vec<_>>()
                            .join(", "),
                        nearest.map_or(String::new(), |name| format!("; did you mean \"{name}\"?"))
                    ),
                }
            })
    }

    /// One of the kinds of the shared vocabulary, written as its word.
    pub fn kind<T: Copy>(
        &self,
        key: &'static str,
        all: &[T],
        word: fn(T) -> &'static str,
    ) -> Result<Option<T>, ProjectError> {
        let choices: Vec<(&str, T)> = all.iter().map(|kind| (word(*kind), *kind)).collect();
        self.choice(key, &choices)
    }

    /// A quantity that may be given in SI or US units (`eave_height_m` or `eave_height_ft`), never both.
    /// Returns the value converted to the SI unit, checked against its limit (in the unit the user wrote).
    pub fn quantity(
        &self,
        stem: &'static str,
        quantity: Quantity,
        limit: &Limit,
    ) -> Result<Option<f64>, ProjectError> {
        let si_key = Asked::unit(stem, quantity.si_suffix());
        let us_key = Asked::unit(stem, quantity.us_suffix());
        match (self.look_up(si_key), self.look_up(us_key)) {
            (Some(_), Some(_)) => Err(ProjectError::BothUnits {
                first: self.asked_path(si_key),
                second: self.asked_path(us_key),
            }),
            (None, None) => Ok(None),
            (si_entry @ Some(_), None) => {
                let value = self.raw_number(si_key, si_entry)?;
                self.check_scaled(si_key, limit, value, 1.0, quantity.si_unit())?;
                Ok(Some(value))
            }
            (None, us_entry @ Some(_)) => {
                let value = self.raw_number(us_key, us_entry)?;
                self.check_scaled(
                    us_key,
                    limit,
                    value,
                    quantity.to_si(1.0),
                    quantity.us_unit(),
                )?;
                Ok(Some(quantity.to_si(value)))
            }
        }
    }

    pub fn require_quantity(
        &self,
        stem: &'static str,
        quantity: Quantity,
        limit: &Limit,
    ) -> Result<f64, ProjectError> {
        self.quantity(stem, quantity, limit)?
            .ok_or_else(|| self.missing(&format!("{stem}_{}", quantity.si_suffix())))
    }

    /// The number at `key`'s entry (found by [`Self::look_up`]), marking it read.
    fn raw_number(
        &self,
        key: Asked,
        entry: Option<(&'a String, &'a Value)>,
    ) -> Result<f64, ProjectError> {
        let value = self
            .mark_used(entry)
            .ok_or_else(|| self.missing(&key.to_string()))?;
        as_finite_number(value).ok_or_else(|| ProjectError::WrongType {
            path: self.asked_path(key),
            expected: "a number".to_string(),
        })
    }

    fn wrong_type(&self, key: &str, expected: &str) -> ProjectError {
        ProjectError::WrongType {
            path: self.key_path(key),
            expected: expected.to_string(),
        }
    }

    /// Call when done: any key that was never read is an error (misspelt or unsupported), named with the
    /// nearest allowed key and every key allowed here.
    pub fn finish(&self) -> Result<(), ProjectError> {
        let used = self.used.borrow();
        match self.map.keys().find(|key| !used.contains(&key.as_str())) {
            Some(unknown) => Err(self.unknown_key(unknown)),
            None => Ok(()),
        }
    }
}

/// Near enough to be a misspelling: a couple of edits, or the same word with small differences.
pub fn is_near(written: &str, allowed: &str) -> bool {
    written != allowed
        && (strsim::levenshtein(written, allowed) <= 2
            || strsim::jaro_winkler(written, allowed) >= 0.9)
}

/// User text as it may be shown in a message: control characters (terminal escapes) written as `\u{1b}`.
pub fn escape_text(text: &str) -> String {
    deckhold_model::format::escape_controls(text).into_owned()
}

fn display_path(path: &str) -> String {
    if path.is_empty() {
        "(project file)".to_string()
    } else {
        path.to_string()
    }
}

/// A JSON number as a finite f64.
pub fn as_finite_number(value: &Value) -> Option<f64> {
    value.as_f64().filter(|number| number.is_finite())
}

#[cfg(test)]
mod tests {
    use super::*;
    use deckhold_core::limits;
    use serde_json::json;

    #[test]
    fn unknown_key_is_named_with_its_path() {
        let value = json!({"slope_deg": 20.0, "slop": 3});
        let reader = ObjectReader::new("roof", &value).expect("object");
        reader
            .number("slope_deg", &limits::SLOPE_DEG)
            .expect("in range");
        let error = reader.finish().expect_err("unknown key");
        assert!(
            error.to_string().starts_with("roof.slop: unknown key"),
            "{error}"
        );
    }

    #[test]
    fn both_unit_variants_are_refused() {
        let value = json!({"eave_height_m": 5.0, "eave_height_ft": 16.0});
        let reader = ObjectReader::new("building", &value).expect("object");
        let error = reader
            .quantity("eave_height", Quantity::LengthM, &limits::EAVE_HEIGHT_M)
            .expect_err("both");
        assert_eq!(
            error.to_string(),
            "building.eave_height_m and building.eave_height_ft: give one unit variant of this quantity, not both"
        );
    }

    #[test]
    fn us_variant_converts_and_reports_its_own_range() {
        let value = json!({"spacing_in": 24.0});
        let reader = ObjectReader::new("framing", &value).expect("object");
        let spacing_mm = reader
            .quantity("spacing", Quantity::LengthMm, &limits::FRAMING_SPACING_MM)
            .expect("ok")
            .expect("present");
        approx::assert_relative_eq!(spacing_mm, 609.6, epsilon = 1e-9);
        let value = json!({"spacing_in": 60.0});
        let reader = ObjectReader::new("framing", &value).expect("object");
        let error = reader
            .quantity("spacing", Quantity::LengthMm, &limits::FRAMING_SPACING_MM)
            .expect_err("too wide");
        assert_eq!(
            error.to_string(),
            "framing.spacing_in: 60 in is outside 7.874..48.031 in"
        );
    }

    #[test]
    fn quantity_keys_are_matched_and_listed_as_written() {
        for (written, is_it) in [
            ("eave_height_m", true),
            ("eave_height_ft", false),
            ("eave_heightm", false),
            ("eave_height_m2", false),
        ] {
            assert_eq!(
                Asked::unit("eave_height", "m").is(written),
                is_it,
                "{written}"
            );
        }
        assert!(Asked::plain("slope_deg").is("slope_deg"));
        assert!(!Asked::plain("slope").is("slope_deg"));
        // A key too long for the stack buffer is still found.
        let stem = "a_stem_long_enough_that_its_key_does_not_fit_in_the_buffer_on_the_stack";
        let value = json!({ format!("{stem}_mm"): 3.0 });
        let Value::Object(map) = &value else {
            unreachable!("an object")
        };
        assert!(Asked::unit(stem, "mm").find_in(map).is_some());
        assert!(Asked::unit(stem, "in").find_in(map).is_none());

        let value = json!({"eave_heigth_m": 5.0, "footprint": {}});
        let reader = ObjectReader::new("building", &value).expect("object");
        reader.get("footprint");
        let error = reader
            .require_quantity("eave_height", Quantity::LengthM, &limits::EAVE_HEIGHT_M)
            .expect_err("misspelt");
        assert_eq!(
            error.to_string(),
            "building.eave_heigth_m: unknown key; did you mean \"eave_height_m\"? \
             (allowed here: eave_height_ft, eave_height_m, footprint)"
        );
    }

    #[test]
    fn out_of_range_message_names_key_and_range() {
        let value = json!({"slope_deg": 75});
        let reader = ObjectReader::new("roof", &value).expect("object");
        let error = reader
            .number("slope_deg", &limits::SLOPE_DEG)
            .expect_err("range");
        assert_eq!(
            error.to_string(),
            "roof.slope_deg: 75 deg is outside 0..45 deg"
        );
    }
}
