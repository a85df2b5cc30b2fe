//! Plain-text tables for the terminal: columns padded to their widest cell, numbers right-aligned.

/// A table built row by row and printed with aligned columns.
#[derive(Debug, Default)]
pub struct Table {
    header: Vec<String>,
    rows: Vec<Vec<String>>,
}

impl Table {
    pub fn new(header: &[&str]) -> Self {
        Self {
            header: header.iter().map(|cell| cell.to_string()).collect(),
            rows: Vec::new(),
        }
    }

    pub fn row(&mut self, cells: Vec<String>) {
        self.rows.push(cells);
    }

    /// The table as text, one line per row, ending in a newline.
    pub fn render(&self) -> String {
        let columns = self.header.len();
        let mut widths: Vec<usize> = self
            .header
            .iter()
            .map(|cell| cell.chars().count())
            .collect();
        for row in &self.rows {
            for (index, cell) in row.iter().enumerate().take(columns) {
                widths[index] = widths[index].max(cell.chars().count());
            }
        }
        let mut text = String::new();
        let mut line = |cells: &[String]| {
            let parts: Vec<String> = cells
                .iter()
                .enumerate()
                .take(columns)
                .map(|(index, cell)| {
                    let numeric = cell.parse::<f64>().is_ok();
                    if numeric {
                        format!("{cell:>width$}", width = widths[index])
                    } else {
                        format!("{cell:<width$}", width = widths[index])
                    }
                })
                .collect();
            text.push_str(parts.join("  ").trim_end());
            text.push('\n');
        };
        line(&self.header);
        let rule: Vec<String> = widths.iter().map(|width| "-".repeat(*width)).collect();
        line(&rule);
        for row in &self.rows {
            line(row);
        }
        text
    }
}
