//! Golden files: compare an output with its stored copy, or rewrite the copy in update mode.
//!
//! Normal mode: a difference fails the test and prints the first differing lines side by side (expected on
//! the left, actual on the right). Update mode (`DECKHOLD_UPDATE_GOLDEN=1`): every differing or missing file
//! is rewritten, and the test still FAILS, printing a line diff of what changed, so an update is never silent.
//! Run it again without the variable to see it pass, then review `git diff tests/golden` before committing.
//! Golden values are our own earlier output (regression values), never outside checks.

use std::fmt::Write as _;
use std::path::{Path, PathBuf};

/// The environment variable that switches on update mode.
pub const UPDATE_VARIABLE: &str = "DECKHOLD_UPDATE_GOLDEN";

/// Lines of diff shown per file before the rest is summarised.
const MAX_DIFF_LINES: usize = 60;
/// Differing lines shown side by side per file in normal mode.
const MAX_SIDE_BY_SIDE: usize = 12;
/// Width of each column in the side-by-side view.
const COLUMN_WIDTH: usize = 72;

/// True when the update variable is set (to anything but an empty string or `0`).
pub fn update_mode() -> bool {
    std::env::var(UPDATE_VARIABLE).is_ok_and(|value| !value.is_empty() && value != "0")
}

/// Path of a file under `tests/golden/`.
pub fn golden_path(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("tests/golden")
        .join(name)
}

/// Collects the differences of many golden files, so one run reports (or rewrites) all of them.
#[derive(Debug, Default)]
pub struct Goldens {
    problems: Vec<String>,
    compared: usize,
}

impl Goldens {
    pub fn new() -> Self {
        Self::default()
    }

    /// Compares `actual` with `tests/golden/<name>`; in update mode, rewrites the file when it differs.
    pub fn check(&mut self, name: &str, actual: &str) {
        self.compared += 1;
        let path = golden_path(name);
        let expected = std::fs::read_to_string(&path).ok();
        if expected.as_deref() == Some(actual) {
            return;
        }
        if update_mode() {
            self.problems
                .push(write_and_describe(&path, expected.as_deref(), actual));
        } else {
            self.problems.push(match expected {
                None => format!(
                    "{}: missing; create it with {UPDATE_VARIABLE}=1 (see tests/golden/README.md)",
                    path.display()
                ),
                Some(expected) => format!(
                    "{} differs from the output (left: golden file, right: this run):\n{}",
                    path.display(),
                    side_by_side(&expected, actual)
                ),
            });
        }
    }

    /// Panics with every problem found; passes only when every file matched.
    pub fn finish(self) {
        if self.problems.is_empty() {
            return;
        }
        let mut message = self.problems.join("\n\n");
        if update_mode() {
            let _ = write!(
                message,
                "\n\n{} of {} golden files rewritten. This run fails on purpose: review the diff above \
                 (and `git diff tests/golden`), rerun without {UPDATE_VARIABLE}, and say in the commit \
                 message what change explains it.",
                self.problems.len(),
                self.compared
            );
        } else {
            let _ = write!(
                message,
                "\n\n{} of {} golden files differ. If the change is intended, rerun with {UPDATE_VARIABLE}=1 \
                 (see tests/golden/README.md).",
                self.problems.len(),
                self.compared
            );
        }
        panic!("{message}");
    }
}

fn write_and_describe(path: &Path, expected: Option<&str>, actual: &str) -> String {
    if let Some(folder) = path.parent() {
        std::fs::create_dir_all(folder)
            .unwrap_or_else(|error| panic!("cannot create {}: {error}", folder.display()));
    }
    std::fs::write(path, actual)
        .unwrap_or_else(|error| panic!("cannot write {}: {error}", path.display()));
    match expected {
        None => format!(
            "{}: created ({} lines)",
            path.display(),
            actual.lines().count()
        ),
        Some(expected) => format!(
            "{}: rewritten; diff (- old, + new):\n{}",
            path.display(),
            line_diff(expected, actual)
        ),
    }
}

/// One step of a line edit script.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Edit {
    Same(usize, usize),
    Removed(usize),
    Added(usize),
}

/// An edit script from `old` to `new` (longest common subsequence of lines; the common head and tail are
/// matched first so long files with a few changes stay cheap).
fn edits(old: &[&str], new: &[&str]) -> Vec<Edit> {
    let head = old.iter().zip(new).take_while(|(a, b)| a == b).count();
    let tail = old[head..]
        .iter()
        .rev()
        .zip(new[head..].iter().rev())
        .take_while(|(a, b)| a == b)
        .count();
    let (a, b) = (&old[head..old.len() - tail], &new[head..new.len() - tail]);
    let mut script: Vec<Edit> = (0..head).map(|i| Edit::Same(i, i)).collect();
    if a.len().saturating_mul(b.len()) > 4_000_000 {
        // Too large for the table: show it as a block replaced.
        script.extend((0..a.len()).map(|i| Edit::Removed(head + i)));
        script.extend((0..b.len()).map(|j| Edit::Added(head + j)));
    } else {
        // lcs[i][j]: length of the common subsequence of a[i..] and b[j..].
        let width = b.len() + 1;
        let mut lcs = vec![0u32; (a.len() + 1) * width];
        for i in (0..a.len()).rev() {
            for j in (0..b.len()).rev() {
                lcs[i * width + j] = if a[i] == b[j] {
                    lcs[(i + 1) * width + j + 1] + 1
                } else {
                    lcs[(i + 1) * width + j].max(lcs[i * width + j + 1])
                };
            }
        }
        let (mut i, mut j) = (0, 0);
        while i < a.len() || j < b.len() {
            if i < a.len() && j < b.len() && a[i] == b[j] {
                script.push(Edit::Same(head + i, head + j));
                i += 1;
                j += 1;
            } else if i < a.len()
                && (j == b.len() || lcs[(i + 1) * width + j] >= lcs[i * width + j + 1])
            {
                script.push(Edit::Removed(head + i));
                i += 1;
            } else {
                script.push(Edit::Added(head + j));
                j += 1;
            }
        }
    }
    let (old_end, new_end) = (old.len() - tail, new.len() - tail);
    script.extend((0..tail).map(|k| Edit::Same(old_end + k, new_end + k)));
    script
}

/// A readable line diff: changed lines with two lines of context, `@@ line N @@` before each hunk.
pub fn line_diff(old: &str, new: &str) -> String {
    let (old_lines, new_lines): (Vec<&str>, Vec<&str>) =
        (old.lines().collect(), new.lines().collect());
    let script = edits(&old_lines, &new_lines);
    let near_change = |index: usize| {
        let from = index.saturating_sub(2);
        let to = (index + 3).min(script.len());
        script[from..to]
            .iter()
            .any(|edit| !matches!(edit, Edit::Same(..)))
    };
    let mut out = String::new();
    let mut shown = 0;
    let mut last_shown: Option<usize> = None;
    let changed = script
        .iter()
        .filter(|e| !matches!(e, Edit::Same(..)))
        .count();
    for (index, edit) in script.iter().enumerate() {
        if !near_change(index) {
            continue;
        }
        if shown == MAX_DIFF_LINES {
            let _ = writeln!(out, "  ... ({changed} changed lines in all)");
            break;
        }
        if last_shown.is_none_or(|last| last + 1 != index) {
            let line = match *edit {
                Edit::Same(i, _) | Edit::Removed(i) => i + 1,
                Edit::Added(j) => j + 1,
            };
            let _ = writeln!(out, "  @@ line {line} @@");
        }
        let _ = match *edit {
            Edit::Same(i, _) => writeln!(out, "   {}", old_lines[i]),
            Edit::Removed(i) => writeln!(out, "  -{}", old_lines[i]),
            Edit::Added(j) => writeln!(out, "  +{}", new_lines[j]),
        };
        shown += 1;
        last_shown = Some(index);
    }
    if out.is_empty() {
        out.push_str("  (only the final line ending differs)\n");
    }
    out
}

fn clip(text: &str) -> String {
    let mut clipped: String = text.chars().take(COLUMN_WIDTH).collect();
    if text.chars().count() > COLUMN_WIDTH {
        clipped.pop();
        clipped.push('~');
    }
    format!("{clipped:<COLUMN_WIDTH$}")
}

/// The first differing lines, golden file on the left and this run on the right, with line numbers.
pub fn side_by_side(expected: &str, actual: &str) -> String {
    let (old_lines, new_lines): (Vec<&str>, Vec<&str>) =
        (expected.lines().collect(), actual.lines().collect());
    let script = edits(&old_lines, &new_lines);
    let mut out = String::new();
    let mut rows = 0;
    let mut index = 0;
    while index < script.len() && rows < MAX_SIDE_BY_SIDE {
        if matches!(script[index], Edit::Same(..)) {
            index += 1;
            continue;
        }
        // A run of changes: pair the removed lines with the added ones.
        let start = index;
        while index < script.len() && !matches!(script[index], Edit::Same(..)) {
            index += 1;
        }
        let removed: Vec<usize> = script[start..index]
            .iter()
            .filter_map(|e| {
                if let Edit::Removed(i) = e {
                    Some(*i)
                } else {
                    None
                }
            })
            .collect();
        let added: Vec<usize> = script[start..index]
            .iter()
            .filter_map(|e| {
                if let Edit::Added(j) = e {
                    Some(*j)
                } else {
                    None
                }
            })
            .collect();
        for k in 0..removed.len().max(added.len()) {
            if rows == MAX_SIDE_BY_SIDE {
                break;
            }
            let left = removed
                .get(k)
                .map(|&i| format!("{:>5} {}", i + 1, clip(old_lines[i])))
                .unwrap_or_else(|| format!("{:>5} {}", "", clip("")));
            let right = added
                .get(k)
                .map(|&j| format!("{:>5} {}", j + 1, new_lines[j]))
                .unwrap_or_default();
            let _ = writeln!(out, "  {left} | {right}");
            rows += 1;
        }
    }
    let changed = script
        .iter()
        .filter(|e| !matches!(e, Edit::Same(..)))
        .count();
    if rows == 0 {
        out.push_str("  (only the final line ending differs)\n");
    } else {
        let _ = writeln!(
            out,
            "  ({changed} lines differ in all; {} lines in the golden file, {} in this run)",
            old_lines.len(),
            new_lines.len()
        );
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_diff_marks_exactly_the_changed_line() {
        let diff = line_diff("a\nb\nc\nd\n", "a\nb\nX\nd\n");
        assert_eq!(diff, "  @@ line 1 @@\n   a\n   b\n  -c\n  +X\n   d\n");
    }

    #[test]
    fn an_inserted_line_is_an_insertion_not_a_rewrite_of_the_rest() {
        let diff = line_diff("a\nb\nc\n", "a\nnew\nb\nc\n");
        assert_eq!(diff, "  @@ line 1 @@\n   a\n  +new\n   b\n   c\n");
    }

    #[test]
    fn side_by_side_pairs_the_golden_line_with_the_new_one() {
        let text = side_by_side("x\nold\ny\n", "x\nnew\ny\n");
        let first = text.lines().next().expect("a row");
        assert!(first.starts_with("      2 old"), "{text}");
        assert!(first.ends_with("|     2 new"), "{text}");
        assert!(text.contains("(2 lines differ in all; 3 lines"), "{text}");
    }
}
