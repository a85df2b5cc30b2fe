//! "Inputs as given": every key the user wrote, as a dotted path (`roof.slope`,
//! `building.footprint.rectangle.length_ft`), with its value exactly as the file writes it. A JSON parser
//! turns `1` and `1.0`, `0.50` and `0.5`, `1e3` and `1000.0` into the same number, and a plan checker
//! reading the design basis against the project file would see a value the user never wrote. So the rows
//! come from the file's text: numbers keep their own digits, strings are shown without their quotes, and
//! a list of plain values stays on one line (`[8d-common, 10d-common]`, `[0, 0]`). The `project` block
//! (names and date) is shown in its own table and left out here. One spelling is changed: a negative
//! zero (`-0`, `-0.0`) is shown without its sign, as every output shows zero.
//!
//! A project built from a JSON value rather than a file (a batch row) has no text: its rows come from
//! the value, with serde_json's spelling of the numbers.

use deckhold_model::InputRow;
use serde_json::Value;

/// A project's keys as written: spelt when read from a file's text, or kept as the JSON value they are
/// spelt from when a report asks (a batch row: its summary never shows them, and spelling them cost
/// more than reading the row).
#[derive(Debug, Clone)]
pub enum AsWritten {
    Rows(Vec<InputRow>),
    Tree(Value),
}

impl AsWritten {
    /// The rows of "Inputs as given".
    pub fn rows(&self) -> Vec<InputRow> {
        match self {
            AsWritten::Rows(rows) => rows.clone(),
            AsWritten::Tree(value) => rows_from_value(value),
        }
    }
}

/// The rows of a project file's text, in the order written. `text` must be JSON that parsed (the
/// reader has accepted it); anything the scan does not understand ends the list rather than panicking.
pub fn rows_from_text(text: &str) -> Vec<InputRow> {
    let mut scan = Scan {
        bytes: text.as_bytes(),
        text,
        at: 0,
    };
    let mut rows = Vec::new();
    scan.skip_space();
    if scan.peek() == Some(b'{') {
        scan.object("", &mut rows, true);
    }
    rows
}

/// The rows of a JSON value (keys in the value's order, numbers as serde_json writes them).
pub fn rows_from_value(value: &Value) -> Vec<InputRow> {
    let mut rows = Vec::new();
    if let Value::Object(map) = value {
        for (key, inner) in map {
            if key != "project" {
                flatten(key, inner, &mut rows);
            }
        }
    }
    rows
}

fn is_plain(value: &Value) -> bool {
    !value.is_object() && !value.is_array()
}

fn plain_text(value: &Value) -> String {
    match value {
        Value::String(text) => text.clone(),
        other => unsigned_zero(other.to_string()),
    }
}

/// `token` without the sign when it is a negative zero (`-0.0` -> `0.0`); other tokens unchanged.
fn unsigned_zero(token: String) -> String {
    match token.strip_prefix('-') {
        Some(magnitude) if magnitude.parse::<f64>().is_ok_and(|value| value == 0.0) => {
            magnitude.to_string()
        }
        _ => token,
    }
}

fn flatten(path: &str, value: &Value, rows: &mut Vec<InputRow>) {
    match value {
        Value::Object(map) => {
            for (key, inner) in map {
                flatten(&format!("{path}.{key}"), inner, rows);
            }
        }
        Value::Array(items) if !items.iter().all(is_plain) => {
            for (index, inner) in items.iter().enumerate() {
                flatten(&format!("{path}[{index}]"), inner, rows);
            }
        }
        Value::Array(items) => {
            rows.push(row(path, list_text(items.iter().map(plain_text).collect())))
        }
        other => rows.push(row(path, plain_text(other))),
    }
}

fn row(path: &str, value: String) -> InputRow {
    InputRow {
        key: path.to_string(),
        value,
    }
}

fn list_text(items: Vec<String>) -> String {
    format!("[{}]", items.join(", "))
}

/// A cursor over JSON text that has already parsed.
struct Scan<'a> {
    bytes: &'a [u8],
    text: &'a str,
    at: usize,
}

impl Scan<'_> {
    fn peek(&self) -> Option<u8> {
        self.bytes.get(self.at).copied()
    }

    fn skip_space(&mut self) {
        while self.peek().is_some_and(|b| b.is_ascii_whitespace()) {
            self.at += 1;
        }
    }

    /// Skips whitespace and one expected byte; false when it is not there.
    fn eat(&mut self, byte: u8) -> bool {
        self.skip_space();
        if self.peek() == Some(byte) {
            self.at += 1;
            true
        } else {
            false
        }
    }

    /// A string token at the cursor, decoded (escapes resolved).
    fn string(&mut self) -> Option<String> {
        self.skip_space();
        let start = self.at;
        if self.peek() != Some(b'"') {
            return None;
        }
        self.at += 1;
        while let Some(b) = self.peek() {
            self.at += 1;
            match b {
                b'\\' => self.at += 1,
                b'"' => break,
                _ => {}
            }
        }
        let raw = self.text.get(start..self.at)?;
        serde_json::from_str(raw).ok()
    }

    /// A number or `true`/`false`/`null` token, exactly as written.
    fn bare(&mut self) -> Option<String> {
        self.skip_space();
        let start = self.at;
        while self
            .peek()
            .is_some_and(|b| b.is_ascii_alphanumeric() || b"+-.".contains(&b))
        {
            self.at += 1;
        }
        (self.at > start)
            .then(|| self.text.get(start..self.at).map(str::to_string))
            .flatten()
            .map(unsigned_zero)
    }

    /// A plain value (string or bare token) as it is shown; None at an object or a list.
    fn plain(&mut self) -> Option<String> {
        self.skip_space();
        match self.peek()? {
            b'{' | b'[' => None,
            b'"' => self.string(),
            _ => self.bare(),
        }
    }

    /// The object at the cursor, its keys under `path`; `top` leaves out the `project` block.
    fn object(&mut self, path: &str, rows: &mut Vec<InputRow>, top: bool) -> Option<()> {
        if !self.eat(b'{') {
            return None;
        }
        if self.eat(b'}') {
            return Some(());
        }
        loop {
            let key = self.string()?;
            if !self.eat(b':') {
                return None;
            }
            let inner = if path.is_empty() {
                key.clone()
            } else {
                format!("{path}.{key}")
            };
            if top && key == "project" {
                self.value(&inner, &mut Vec::new())?;
            } else {
                self.value(&inner, rows)?;
            }
            if self.eat(b'}') {
                return Some(());
            }
            if !self.eat(b',') {
                return None;
            }
        }
    }

    /// The value at the cursor: a plain value or a list of plain values is one row, anything else is
    /// walked into.
    fn value(&mut self, path: &str, rows: &mut Vec<InputRow>) -> Option<()> {
        self.skip_space();
        match self.peek()? {
            b'{' => self.object(path, rows, false),
            b'[' => self.list(path, rows),
            _ => {
                let text = self.plain()?;
                rows.push(row(path, text));
                Some(())
            }
        }
    }

    fn list(&mut self, path: &str, rows: &mut Vec<InputRow>) -> Option<()> {
        let start = self.at;
        if let Some(items) = self.plain_list() {
            rows.push(row(path, list_text(items)));
            return Some(());
        }
        self.at = start;
        self.eat(b'[');
        if self.eat(b']') {
            return Some(());
        }
        let mut index = 0;
        loop {
            self.value(&format!("{path}[{index}]"), rows)?;
            index += 1;
            if self.eat(b']') {
                return Some(());
            }
            if !self.eat(b',') {
                return None;
            }
        }
    }

    /// The list at the cursor when every item is plain; None (cursor anywhere) otherwise.
    fn plain_list(&mut self) -> Option<Vec<String>> {
        if !self.eat(b'[') {
            return None;
        }
        let mut items = Vec::new();
        if self.eat(b']') {
            return Some(items);
        }
        loop {
            items.push(self.plain()?);
            if self.eat(b']') {
                return Some(items);
            }
            if !self.eat(b',') {
                return None;
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const FILE: &str = r#"{"project": {"name": "x", "date": "2026-01-02"},
        "roof": {"slope": "6:12", "overhang_in": 18, "dead_load_psf": 8.0},
        "wind": {"kzt": 1, "q50_kpa": 0.50, "speed_mph": 1.4e2, "note": "a \"b\", c"},
        "building": {"footprint": {"polygon_ft": [[0, 0], [40.5, 0]]}},
        "nails": ["8d-common", "10d-common"], "empty": [], "flag": true}"#;

    fn lines(rows: &[InputRow]) -> Vec<String> {
        rows.iter()
            .map(|row| format!("{} = {}", row.key, row.value))
            .collect()
    }

    #[test]
    fn values_keep_the_digits_the_user_wrote_in_the_order_written() {
        let rows = lines(&rows_from_text(FILE));
        assert_eq!(
            rows,
            [
                "roof.slope = 6:12",
                "roof.overhang_in = 18",
                "roof.dead_load_psf = 8.0",
                "wind.kzt = 1",
                "wind.q50_kpa = 0.50",
                "wind.speed_mph = 1.4e2",
                "wind.note = a \"b\", c",
                "building.footprint.polygon_ft[0] = [0, 0]",
                "building.footprint.polygon_ft[1] = [40.5, 0]",
                "nails = [8d-common, 10d-common]",
                "empty = []",
                "flag = true",
            ]
        );
    }

    #[test]
    fn a_value_gives_the_same_keys_with_the_parser_s_numbers() {
        let value: Value = serde_json::from_str(FILE).expect("JSON");
        let from_value = rows_from_value(&value);
        let from_text = rows_from_text(FILE);
        let keys = |rows: &[InputRow]| {
            let mut keys: Vec<String> = rows.iter().map(|row| row.key.clone()).collect();
            keys.sort();
            keys
        };
        assert_eq!(keys(&from_value), keys(&from_text));
        // The parser's spelling differs where the user's does: the reason for reading the text.
        assert!(lines(&from_value).contains(&"wind.q50_kpa = 0.5".to_string()));
        assert!(!lines(&from_value).iter().any(|l| l.starts_with("project")));
    }

    #[test]
    fn a_negative_zero_is_shown_without_its_sign() {
        let rows = lines(&rows_from_text(
            r#"{"roof": {"eave_overhang_mm": -0.0, "x": [-0, -2.5]}}"#,
        ));
        assert_eq!(
            rows,
            vec!["roof.eave_overhang_mm = 0.0", "roof.x = [0, -2.5]"]
        );
        let value: Value =
            serde_json::from_str(r#"{"roof": {"dead_load_kpa": -0.0}}"#).expect("json");
        assert_eq!(
            lines(&rows_from_value(&value)),
            vec!["roof.dead_load_kpa = 0.0"]
        );
    }

    #[test]
    fn text_that_is_not_an_object_gives_no_rows_and_no_panic() {
        assert!(rows_from_text("[1, 2]").is_empty());
        assert!(rows_from_text("").is_empty());
        assert_eq!(lines(&rows_from_text(r#"{"a": 1, "b": "#)), ["a = 1"]);
    }
}
