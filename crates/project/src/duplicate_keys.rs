//! Duplicate keys in the project file. A JSON parser keeps the last of two equal keys in one object and
//! drops the first silently, so a project could say two things and mean one. This scan runs on text the
//! parser has already accepted, and names the key path and both positions (line:column, from 1).

use crate::error::ProjectError;
use std::collections::HashMap;

/// One open object or array while scanning.
enum Frame {
    Object {
        /// Each key seen in this object with the position of its opening quote.
        keys: HashMap<String, (usize, usize)>,
        expect_key: bool,
        current: Option<String>,
    },
    Array {
        index: usize,
    },
}

/// Refuses the first key written twice in one object. `text` must be valid JSON.
pub fn check_duplicate_keys(text: &str) -> Result<(), ProjectError> {
    let mut stack: Vec<Frame> = Vec::new();
    let (mut line, mut column) = (1, 0);
    let mut chars = text.chars().peekable();
    while let Some(c) = chars.next() {
        column += 1;
        match c {
            '\n' => {
                line += 1;
                column = 0;
            }
            '{' => stack.push(Frame::Object {
                keys: HashMap::new(),
                expect_key: true,
                current: None,
            }),
            '[' => stack.push(Frame::Array { index: 0 }),
            '}' | ']' => {
                stack.pop();
            }
            ',' => match stack.last_mut() {
                Some(Frame::Object { expect_key, .. }) => *expect_key = true,
                Some(Frame::Array { index }) => *index += 1,
                None => {}
            },
            ':' => {
                if let Some(Frame::Object { expect_key, .. }) = stack.last_mut() {
                    *expect_key = false;
                }
            }
            '"' => {
                let start = (line, column);
                let mut raw = String::from('"');
                while let Some(c) = chars.next() {
                    column += 1;
                    raw.push(c);
                    if c == '\\' {
                        if let Some(escaped) = chars.next() {
                            column += 1;
                            raw.push(escaped);
                        }
                    } else if c == '"' {
                        break;
                    }
                }
                let Some(Frame::Object {
                    keys,
                    expect_key: true,
                    ..
                }) = stack.last_mut()
                else {
                    continue;
                };
                let key: String = serde_json::from_str(&raw).unwrap_or(raw);
                if let Some(first) = keys.get(&key) {
                    let first = *first;
                    return Err(ProjectError::DuplicateKey {
                        path: path_of(&stack, &key),
                        first: format!("line {}, column {}", first.0, first.1),
                        second: format!("line {}, column {}", start.0, start.1),
                    });
                }
                keys.insert(key.clone(), start);
                if let Some(Frame::Object { current, .. }) = stack.last_mut() {
                    *current = Some(key);
                }
            }
            _ => {}
        }
    }
    Ok(())
}

/// The key path of `key` inside the innermost object, as messages write it (`roof.slope_deg`, `nails[2]`).
fn path_of(stack: &[Frame], key: &str) -> String {
    let mut path = String::new();
    for frame in &stack[..stack.len().saturating_sub(1)] {
        match frame {
            Frame::Object {
                current: Some(name),
                ..
            } => {
                if !path.is_empty() {
                    path.push('.');
                }
                path.push_str(name);
            }
            Frame::Object { current: None, .. } => {}
            Frame::Array { index } => path.push_str(&format!("[{index}]")),
        }
    }
    if !path.is_empty() {
        path.push('.');
    }
    path.push_str(&crate::reader::escape_text(key));
    path
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_repeated_key_is_named_with_its_path_and_both_positions() {
        let text = "{\n  \"roof\": {\"slope_deg\": 20,\n    \"slope_deg\": 30}\n}";
        let error = check_duplicate_keys(text).expect_err("duplicate");
        assert_eq!(
            error.to_string(),
            "roof.slope_deg: written twice (line 2, column 12 and line 3, column 5); give each key once"
        );
    }

    #[test]
    fn equal_keys_in_different_objects_and_strings_in_arrays_are_fine() {
        let text = r#"{"a": {"x": 1}, "b": {"x": 2}, "c": ["x", "x"], "d": [{"x": 1}, {"x": 2}]}"#;
        check_duplicate_keys(text).expect("no duplicate");
    }

    #[test]
    fn keys_inside_lists_of_objects_are_named_with_their_index() {
        let text =
            r#"{"coefficient_overrides": [{"source": "a"}, {"source": "b", "source": "c"}]}"#;
        let error = check_duplicate_keys(text).expect_err("duplicate");
        assert!(
            error
                .to_string()
                .starts_with("coefficient_overrides[1].source: written twice"),
            "{error}"
        );
    }

    #[test]
    fn an_escaped_spelling_of_the_same_key_is_the_same_key() {
        let text = r#"{"name": "a", "n\u0061me": "b"}"#;
        assert!(check_duplicate_keys(text).is_err());
    }
}
