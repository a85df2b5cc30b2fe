//! A table of candidates with bars: one row per candidate, text columns first (the candidate and its
//! figures), then one panel of bars per measure (per-nail capacity, nails on the roof), each panel scaled
//! to its own largest value. Drawn in greys with the value at each bar's end, so it reads in black and
//! white; rows shrink (to a floor) as candidates are added so that a long list still fits one page.

use super::canvas::{Align, Area, Canvas, Stroke};
use super::text::{fit, Font};

/// A text column left of the bars.
#[derive(Debug, Clone, PartialEq)]
pub struct ChartColumn {
    pub title: String,
    pub width_mm: f64,
}

/// One measure drawn as a panel of bars.
#[derive(Debug, Clone, PartialEq)]
pub struct ChartPanel {
    /// What the bars measure, with its unit ("per nail, lb").
    pub title: String,
    /// Grey level of the bars (0 black, 1 white).
    pub level: f64,
}

/// One candidate: its text cells (one per column) and, per panel, the value with its printed label
/// (None: no bar, and `missing` in its place, e.g. "refused").
#[derive(Debug, Clone, PartialEq)]
pub struct ChartRow {
    pub cells: Vec<String>,
    pub values: Vec<Option<(f64, String)>>,
    pub missing: String,
}

/// The whole chart.
#[derive(Debug, Clone, PartialEq)]
pub struct BarChart {
    pub columns: Vec<ChartColumn>,
    pub panels: Vec<ChartPanel>,
    pub rows: Vec<ChartRow>,
}

const TITLE_PT: f64 = 7.5;
/// Room for the column and panel titles above the rows, mm.
const HEAD_MM: f64 = 6.0;
/// The rows share this height until they reach their floor, mm.
const ROWS_BUDGET_MM: f64 = 120.0;
const ROW_MAX_MM: f64 = 6.0;
const ROW_MIN_MM: f64 = 4.2;
/// Room kept right of the longest bar for its value, mm.
const VALUE_ROOM_MM: f64 = 13.0;
const PANEL_GAP_MM: f64 = 3.0;

impl BarChart {
    /// Height of one row, mm: shared out of a budget, between a floor and a ceiling.
    fn row_mm(&self) -> f64 {
        (ROWS_BUDGET_MM / self.rows.len().max(1) as f64).clamp(ROW_MIN_MM, ROW_MAX_MM)
    }

    fn label_pt(&self) -> f64 {
        if self.row_mm() < 5.0 {
            7.0
        } else {
            7.5
        }
    }

    /// The height the chart takes on the page, mm.
    pub(crate) fn height_mm(&self) -> f64 {
        HEAD_MM + self.row_mm() * self.rows.len() as f64 + 1.0
    }

    /// Draws the chart into `area` (as tall as [`BarChart::height_mm`]).
    pub(crate) fn draw(&self, canvas: &mut Canvas, area: Area) {
        let row_mm = self.row_mm();
        let label_pt = self.label_pt();
        let top = area.top();
        let rows_top = top - HEAD_MM;
        let rows_bottom = rows_top - row_mm * self.rows.len() as f64;
        for row_index in (1..self.rows.len()).step_by(2) {
            let y = rows_top - row_mm * (row_index as f64 + 1.0);
            canvas.fill_area(
                Area {
                    x: area.x,
                    y,
                    w: area.w,
                    h: row_mm,
                },
                0.93,
            );
        }
        let baseline = |row_index: usize| rows_top - row_mm * (row_index as f64 + 0.72);
        let mut x = area.x;
        for (column_index, column) in self.columns.iter().enumerate() {
            canvas.text(
                x + 0.8,
                rows_top + 1.6,
                &fit(&column.title, Font::Bold, TITLE_PT, column.width_mm - 1.0),
                Font::Bold,
                TITLE_PT,
                Align::Left,
            );
            for (row_index, row) in self.rows.iter().enumerate() {
                let cell = row.cells.get(column_index).map_or("", String::as_str);
                canvas.text(
                    x + 0.8,
                    baseline(row_index),
                    &fit(cell, Font::Regular, label_pt, column.width_mm - 1.5),
                    Font::Regular,
                    label_pt,
                    Align::Left,
                );
            }
            x += column.width_mm;
        }
        let panel_count = self.panels.len().max(1) as f64;
        let panel_w = (area.right() - x - PANEL_GAP_MM * panel_count) / panel_count;
        for (panel_index, panel) in self.panels.iter().enumerate() {
            let x0 = x + PANEL_GAP_MM + (panel_w + PANEL_GAP_MM) * panel_index as f64;
            canvas.text(
                x0,
                rows_top + 1.6,
                &fit(&panel.title, Font::Bold, TITLE_PT, panel_w),
                Font::Bold,
                TITLE_PT,
                Align::Left,
            );
            canvas.line([x0, rows_top], [x0, rows_bottom], 0.25, 0.0, Stroke::Solid);
            let largest = self
                .rows
                .iter()
                .filter_map(|row| row.values.get(panel_index).cloned().flatten())
                .map(|(value, _)| value)
                .fold(0.0_f64, f64::max);
            let bar_room = (panel_w - VALUE_ROOM_MM).max(panel_w * 0.5);
            for (row_index, row) in self.rows.iter().enumerate() {
                let row_top = rows_top - row_mm * row_index as f64;
                match row.values.get(panel_index).cloned().flatten() {
                    Some((value, text)) => {
                        let share = if largest > 0.0 { value / largest } else { 0.0 };
                        let bar = Area {
                            x: x0,
                            y: row_top - row_mm * 0.85,
                            w: (bar_room * share).max(0.3),
                            h: row_mm * 0.7,
                        };
                        canvas.fill_area(bar, panel.level);
                        canvas.stroke_area(bar, 0.15, 0.0);
                        canvas.text(
                            bar.right() + 1.0,
                            baseline(row_index),
                            &text,
                            Font::Regular,
                            label_pt,
                            Align::Left,
                        );
                    }
                    None => canvas.text(
                        x0 + 1.0,
                        baseline(row_index),
                        &fit(&row.missing, Font::Regular, label_pt, panel_w),
                        Font::Regular,
                        label_pt,
                        Align::Left,
                    ),
                }
            }
        }
        canvas.line(
            [area.x, rows_top],
            [area.right(), rows_top],
            0.3,
            0.0,
            Stroke::Solid,
        );
        canvas.line(
            [area.x, rows_bottom],
            [area.right(), rows_bottom],
            0.3,
            0.0,
            Stroke::Solid,
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn chart(rows: usize) -> BarChart {
        BarChart {
            columns: vec![ChartColumn {
                title: "nail".to_string(),
                width_mm: 30.0,
            }],
            panels: vec![ChartPanel {
                title: "per nail".to_string(),
                level: 0.45,
            }],
            rows: (0..rows)
                .map(|index| ChartRow {
                    cells: vec![format!("nail {index}")],
                    values: vec![Some((100.0, "100".to_string()))],
                    missing: "refused".to_string(),
                })
                .collect(),
        }
    }

    #[test]
    fn rows_shrink_to_their_floor_as_candidates_are_added() {
        assert!((chart(3).row_mm() - ROW_MAX_MM).abs() < 1e-9);
        assert!(chart(25).row_mm() < ROW_MAX_MM);
        assert!((chart(60).row_mm() - ROW_MIN_MM).abs() < 1e-9);
        // Up to the floor, the rows never take more than their budget.
        for rows in 1..=28 {
            assert!(chart(rows).height_mm() <= HEAD_MM + ROWS_BUDGET_MM + 1.0 + 1e-9);
        }
    }
}
