//! `schedule.csv`: one row per zone and support role, in the order of [`Schedule::zones`].
//!
//! A pure table: the header, then the rows, nothing else (the cautions travel in the PDF and on the
//! terminal; see docs/report-format.md). The quantities are in the schedule's units, named in the headers.

use crate::format::{escape_controls, fixed, kpa_to_psf, mm_to_in, n_to_lbf, places, trimmed};
use crate::{finite, Schedule, ScheduleError, Units};

/// Column names of `schedule.csv` in SI, units in the names.
pub const SCHEDULE_HEADER: [&str; 16] = [
    "zone",
    "code_zone",
    "support_role",
    "nail_id",
    "nail_description",
    "spacing_mm",
    "net_uplift_kpa",
    "demand_n",
    "resistance_n",
    "governing_mode",
    "utilization",
    "nail_count",
    "governing_check",
    "governing_line",
    "coefficient_status",
    "coefficient_figure",
];

/// Column names of `schedule.csv` in US customary units.
pub const SCHEDULE_HEADER_US: [&str; 16] = [
    "zone",
    "code_zone",
    "support_role",
    "nail_id",
    "nail_description",
    "spacing_in",
    "net_uplift_psf",
    "demand_lb",
    "resistance_lb",
    "governing_mode",
    "utilization",
    "nail_count",
    "governing_check",
    "governing_line",
    "coefficient_status",
    "coefficient_figure",
];

/// What a spacing cell holds when no practical spacing works with the nail.
pub const NO_SPACING: &str = "none";

/// A spacing cell in the file's units: `150` (mm) or `6` (in, to 0.001); `none` when none works.
pub(crate) fn spacing_cell(spacing_mm: Option<f64>, units: Units) -> String {
    match spacing_mm {
        Some(mm) if units.is_us() => trimmed(mm_to_in(mm), places::SPACING_IN_CSV),
        Some(mm) => fixed(mm, places::SPACING_MM),
        None => NO_SPACING.to_string(),
    }
}

/// The bytes of `schedule.csv`.
pub fn schedule_csv(schedule: &Schedule) -> Result<Vec<u8>, ScheduleError> {
    const FILE: &str = "schedule.csv";
    finite::check_zone_rows(schedule)?;
    let units = schedule.basis.units;
    let mut writer = crate::csv_lines::writer();
    let fail = |error: csv::Error| ScheduleError::Csv {
        file: FILE,
        message: error.to_string(),
    };
    let header = if units.is_us() {
        SCHEDULE_HEADER_US
    } else {
        SCHEDULE_HEADER
    };
    writer.write_record(header).map_err(fail)?;
    let pressure = |kpa: f64| match units {
        Units::Imperial => fixed(kpa_to_psf(kpa), places::PRESSURE_PSF),
        Units::Si => fixed(kpa, places::PRESSURE_KPA),
    };
    let force = |n: f64| match units {
        Units::Imperial => fixed(n_to_lbf(n), places::FORCE_LBF),
        Units::Si => fixed(n, places::FORCE_N),
    };
    for row in &schedule.zones {
        // Where the zone's coefficient comes from: built-in figure and status, or the user's table.
        let coefficient = schedule
            .zone_pressures
            .iter()
            .find(|zone| zone.label == row.label && zone.code_zone == row.code_zone)
            .ok_or_else(|| ScheduleError::Csv {
                file: FILE,
                message: format!(
                    "zone {} ({}) has no coefficient row",
                    row.label, row.code_zone
                ),
            })?;
        writer
            .write_record([
                row.label.as_str(),
                &row.code_zone,
                row.support_role.as_str(),
                &escape_controls(&row.nail_id),
                &escape_controls(&row.nail_description),
                &spacing_cell(row.spacing_mm, units),
                &pressure(row.net_uplift_kpa),
                &force(row.demand_n),
                &force(row.resistance_n),
                &row.governing_mode,
                &fixed(row.utilization, places::UTILIZATION),
                &row.nail_count.to_string(),
                &row.governing_check,
                &row.governing_line.to_string(),
                &coefficient.coefficient_status,
                &escape_controls(&coefficient.figure),
            ])
            .map_err(fail)?;
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

    fn text(bytes: &[u8]) -> &str {
        std::str::from_utf8(bytes).expect("CSV is UTF-8")
    }

    #[test]
    fn header_names_carry_the_units() {
        let bytes = schedule_csv(&sample_schedule()).expect("sample writes");
        let header = text(&bytes).lines().next().expect("a header line");
        assert_eq!(
            header,
            "zone,code_zone,support_role,nail_id,nail_description,spacing_mm,net_uplift_kpa,demand_n,\
             resistance_n,governing_mode,utilization,nail_count,governing_check,governing_line,\
             coefficient_status,coefficient_figure"
        );
    }

    #[test]
    fn us_files_carry_us_units_only() {
        let schedule = crate::sample::sample_schedule_with_lines(8, Units::Imperial);
        let bytes = schedule_csv(&schedule).expect("sample writes");
        let header = text(&bytes).lines().next().expect("a header line");
        assert_eq!(
            header,
            "zone,code_zone,support_role,nail_id,nail_description,spacing_in,net_uplift_psf,demand_lb,\
             resistance_lb,governing_mode,utilization,nail_count,governing_check,governing_line,\
             coefficient_status,coefficient_figure"
        );
        // The sample's 150 mm interior edge spacing is rounded to 6 in (152.4 mm) on the US basis.
        let first = text(&bytes).lines().nth(1).expect("a row").to_string();
        assert_eq!(first.split(',').nth(5), Some("6"), "{first}");
    }

    #[test]
    fn rows_follow_the_zone_order_with_fixed_places() {
        let bytes = schedule_csv(&sample_schedule()).expect("sample writes");
        let lines: Vec<&str> = text(&bytes).lines().collect();
        assert_eq!(lines.len(), 1 + 10, "header plus one row per zone and role");
        // Sample interior panel edge (invented data): 1.10 kPa, 150 mm, demand 1.10 x 0.305 x 150 = 50.325 N,
        // utilization 50.325 / 400 = 0.126, nails (150 mod 7 + 3) x 40 = 240.
        assert_eq!(
            lines[1],
            "interior,r,panel-edge,sample-nail-a,Sample ring-shank nail 3.3 x 63 mm,150,1.100,50,400,\
             withdrawal,0.126,240,strength,1,from memory,\"sample figure, invented for tests\""
        );
        assert!(lines[2].starts_with("interior,r,intermediate,"));
        assert!(lines[10].starts_with("overhang-corner,oh-c,intermediate,sample-nail-a,"));
    }

    #[test]
    fn line_ends_are_newlines_and_the_file_ends_with_one() {
        let bytes = schedule_csv(&sample_schedule()).expect("sample writes");
        assert!(!bytes.contains(&b'\r'));
        assert_eq!(bytes.last(), Some(&b'\n'));
    }

    #[test]
    fn same_input_gives_the_same_bytes() {
        let schedule = sample_schedule();
        assert_eq!(
            schedule_csv(&schedule).expect("first"),
            schedule_csv(&schedule).expect("second")
        );
    }

    #[test]
    fn infeasible_spacing_prints_none() {
        let bytes = schedule_csv(&sample_infeasible_schedule()).expect("sample writes");
        let row = text(&bytes)
            .lines()
            .find(|line| line.starts_with("overhang-corner,oh-c,panel-edge,"))
            .expect("the infeasible row");
        let cells: Vec<&str> = row.split(',').collect();
        assert_eq!(cells[5], "none");
        assert_eq!(cells[10], "1.240");
    }

    #[test]
    fn a_comma_in_a_description_is_quoted() {
        let mut schedule = sample_schedule();
        schedule.zones[0].nail_description = "ring shank, 63 mm".to_string();
        let bytes = schedule_csv(&schedule).expect("writes");
        assert!(text(&bytes).contains(",\"ring shank, 63 mm\","));
    }

    #[test]
    fn a_nan_demand_is_refused_by_name() {
        let mut schedule = sample_schedule();
        schedule.zones[3].demand_n = f64::NAN;
        let error = schedule_csv(&schedule).expect_err("NaN is refused");
        assert!(
            error.to_string().starts_with("zones[3].demand_n: NaN"),
            "{error}"
        );
    }

    #[test]
    fn an_empty_schedule_is_just_the_header() {
        let mut schedule = sample_schedule();
        schedule.zones.clear();
        let bytes = schedule_csv(&schedule).expect("writes");
        assert_eq!(text(&bytes).lines().count(), 1);
    }
}
