//! `rafter-lines.csv`: one row per segment of every rafter line, lines in the order of
//! [`Schedule::lines`], segments from the low end up. Each row names the member's kind (common,
//! end-wall, hip, valley, jack, blocking) beside its `position_m`, so a checker can tell the wall
//! member from the common rafter next to it. A pure table, like `schedule.csv`, in the
//! schedule's units: metres in SI, feet-inches to the nearest 1/8 in on the US basis.

use crate::csv_schedule::spacing_cell;
use crate::format::{feet_inches, fixed, places};
use crate::{finite, Schedule, ScheduleError};

/// Column names of `rafter-lines.csv` in SI, units in the names.
pub const LINES_HEADER: [&str; 10] = [
    "line",
    "plane",
    "kind",
    "position_m",
    "from_m",
    "to_m",
    "zone",
    "support_role",
    "spacing_mm",
    "utilization",
];

/// Column names of `rafter-lines.csv` in US customary units.
pub const LINES_HEADER_US: [&str; 10] = [
    "line",
    "plane",
    "kind",
    "position_ft_in",
    "from_ft_in",
    "to_ft_in",
    "zone",
    "support_role",
    "spacing_in",
    "utilization",
];

/// The CSV writer both files share: `\n` line ends, quotes only where needed.
pub(crate) fn writer() -> csv::Writer<Vec<u8>> {
    csv::WriterBuilder::new()
        .terminator(csv::Terminator::Any(b'\n'))
        .quote_style(csv::QuoteStyle::Necessary)
        .from_writer(Vec::new())
}

/// The bytes of `rafter-lines.csv`.
pub fn rafter_lines_csv(schedule: &Schedule) -> Result<Vec<u8>, ScheduleError> {
    const FILE: &str = "rafter-lines.csv";
    finite::check_lines(schedule)?;
    let units = schedule.basis.units;
    let fail = |error: csv::Error| ScheduleError::Csv {
        file: FILE,
        message: error.to_string(),
    };
    let length = |m: f64| {
        if units.is_us() {
            feet_inches(m)
        } else {
            fixed(m, places::LENGTH_M)
        }
    };
    let mut writer = writer();
    let header = if units.is_us() {
        LINES_HEADER_US
    } else {
        LINES_HEADER
    };
    writer.write_record(header).map_err(fail)?;
    for line in &schedule.lines {
        let number = line.number.to_string();
        let position = length(line.position_m);
        for segment in &line.segments {
            writer
                .write_record([
                    number.as_str(),
                    line.plane.as_str(),
                    line.kind.as_str(),
                    &position,
                    &length(segment.from_m),
                    &length(segment.to_m),
                    segment.zone_label.as_str(),
                    segment.support_role.as_str(),
                    &spacing_cell(segment.spacing_mm, units),
                    &fixed(segment.utilization, places::UTILIZATION),
                ])
                .map_err(fail)?;
        }
    }
    writer.into_inner().map_err(|error| ScheduleError::Csv {
        file: FILE,
        message: error.to_string(),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::sample::{sample_infeasible_schedule, sample_schedule};

    fn text(bytes: &[u8]) -> String {
        String::from_utf8(bytes.to_vec()).expect("CSV is UTF-8")
    }

    #[test]
    fn header_names_carry_the_units() {
        let csv = text(&rafter_lines_csv(&sample_schedule()).expect("writes"));
        assert_eq!(
            csv.lines().next(),
            Some("line,plane,kind,position_m,from_m,to_m,zone,support_role,spacing_mm,utilization")
        );
    }

    #[test]
    fn us_lengths_read_in_feet_and_inches() {
        let schedule = crate::sample::sample_schedule_with_lines(6, crate::Units::Imperial);
        let csv = text(&rafter_lines_csv(&schedule).expect("writes"));
        assert_eq!(
            csv.lines().next(),
            Some(
                "line,plane,kind,position_ft_in,from_ft_in,to_ft_in,zone,support_role,spacing_in,utilization"
            )
        );
        // Line 2 of the sample sits 0.610 m from line 1: 24.02 in, read as 2'-0".
        let row = csv
            .lines()
            .find(|row| row.starts_with("2,"))
            .expect("line 2");
        assert!(
            row.starts_with("2,P1,common,\"2'-0\"\"\",\"0'-0\"\"\","),
            "{row}"
        );
    }

    #[test]
    fn one_row_per_segment_in_line_order() {
        let schedule = sample_schedule();
        let csv = text(&rafter_lines_csv(&schedule).expect("writes"));
        let segment_count: usize = schedule.lines.iter().map(|line| line.segments.len()).sum();
        assert_eq!(csv.lines().count(), 1 + segment_count);
        let lines: Vec<&str> = csv.lines().collect();
        // Sample line 1 at x = 0 (invented data): overhang from 0 to 0.6 / 0.948683 = 0.632 m along the slope,
        // overhang-corner panel edge at 50 mm: 3.60 x 0.305 x 50 / 400 = 0.137.
        assert_eq!(
            lines[1],
            "1,P1,end-wall,0.000,0.000,0.632,overhang-corner,panel-edge,50,0.137"
        );
        assert!(lines[6].starts_with("2,P1,common,0.610,0.000,0.632,overhang-corner,intermediate,"));
        assert!(lines
            .last()
            .expect("rows")
            .starts_with("20,P1,end-wall,11.590,"));
    }

    #[test]
    fn same_input_gives_the_same_bytes_with_newline_ends() {
        let schedule = sample_schedule();
        let first = rafter_lines_csv(&schedule).expect("first");
        assert_eq!(first, rafter_lines_csv(&schedule).expect("second"));
        assert!(!first.contains(&b'\r'));
    }

    #[test]
    fn infeasible_segments_print_none() {
        let csv = text(&rafter_lines_csv(&sample_infeasible_schedule()).expect("writes"));
        assert!(csv
            .lines()
            .nth(1)
            .expect("first row")
            .contains(",overhang-corner,panel-edge,none,1.240"));
    }

    #[test]
    fn a_nan_position_is_refused_by_name() {
        let mut schedule = sample_schedule();
        schedule.lines[4].position_m = f64::INFINITY;
        let error = rafter_lines_csv(&schedule).expect_err("refused");
        assert!(
            error.to_string().starts_with("lines[4].position_m: inf"),
            "{error}"
        );
    }
}
