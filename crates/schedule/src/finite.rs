//! The writers' guard against NaN and infinity: each value a writer prints is checked first, and the error
//! names the field by its path in the [`Schedule`], so the bug upstream is easy to find.

use crate::{Schedule, ScheduleError};

/// `Ok(value)` when finite, else an error naming `field`.
pub fn finite(field: &str, value: f64) -> Result<f64, ScheduleError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(ScheduleError::NonFinite {
            field: field.to_string(),
            value,
        })
    }
}

/// Like [`finite`], with the field's path built only when the value is not finite: the checks run
/// over every segment of every line, and on a big roof naming each finite value took a tenth of a run.
fn finite_at(value: f64, field: impl FnOnce() -> String) -> Result<f64, ScheduleError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(ScheduleError::NonFinite {
            field: field(),
            value,
        })
    }
}

/// The values printed in `schedule.csv`.
pub(crate) fn check_zone_rows(schedule: &Schedule) -> Result<(), ScheduleError> {
    for (index, row) in schedule.zones.iter().enumerate() {
        let path = |name: &str| format!("zones[{index}].{name}");
        if let Some(spacing_mm) = row.spacing_mm {
            finite(&path("spacing_mm"), spacing_mm)?;
        }
        finite(&path("net_uplift_kpa"), row.net_uplift_kpa)?;
        finite(&path("demand_n"), row.demand_n)?;
        finite(&path("resistance_n"), row.resistance_n)?;
        finite(&path("utilization"), row.utilization)?;
    }
    Ok(())
}

/// The values printed in `rafter-lines.csv` and the line table.
pub(crate) fn check_lines(schedule: &Schedule) -> Result<(), ScheduleError> {
    for (line_index, line) in schedule.lines.iter().enumerate() {
        finite_at(line.position_m, || {
            format!("lines[{line_index}].position_m")
        })?;
        finite_at(line.length_m, || format!("lines[{line_index}].length_m"))?;
        for (index, segment) in line.segments.iter().enumerate() {
            let path = |name: &str| format!("lines[{line_index}].segments[{index}].{name}");
            finite_at(segment.from_m, || path("from_m"))?;
            finite_at(segment.to_m, || path("to_m"))?;
            if let Some(spacing_mm) = segment.spacing_mm {
                finite_at(spacing_mm, || path("spacing_mm"))?;
            }
            finite_at(segment.utilization, || path("utilization"))?;
        }
    }
    Ok(())
}

/// `path` names the list; it is called only to name a value that is not finite.
fn check_points(path: impl Fn() -> String, points: &[[f64; 2]]) -> Result<(), ScheduleError> {
    for (index, point) in points.iter().enumerate() {
        finite_at(point[0], || format!("{}[{index}].x", path()))?;
        finite_at(point[1], || format!("{}[{index}].y", path()))?;
    }
    Ok(())
}

fn check_segments(path: &str, segments: &[[[f64; 2]; 2]]) -> Result<(), ScheduleError> {
    for (index, segment) in segments.iter().enumerate() {
        check_points(|| format!("{path}[{index}]"), segment)?;
    }
    Ok(())
}

/// Everything the PDF prints or draws.
pub(crate) fn check_all(schedule: &Schedule) -> Result<(), ScheduleError> {
    check_zone_rows(schedule)?;
    check_lines(schedule)?;
    let plan = &schedule.plan;
    check_points(
        || "plan.building_outline_m".to_string(),
        &plan.building_outline_m,
    )?;
    check_points(|| "plan.roof_outline_m".to_string(), &plan.roof_outline_m)?;
    check_segments("plan.ridge_lines_m", &plan.ridge_lines_m)?;
    check_segments("plan.panel_joints_m", &plan.panel_joints_m)?;
    check_segments("plan.course_lines_m", &plan.course_lines_m)?;
    for (zone_index, zone) in plan.zones.iter().enumerate() {
        for (index, polygon) in zone.polygons_m.iter().enumerate() {
            check_points(
                || format!("plan.zones[{zone_index}].polygons_m[{index}]"),
                polygon,
            )?;
        }
    }
    for (index, line) in plan.rafter_lines.iter().enumerate() {
        check_points(
            || format!("plan.rafter_lines[{index}]"),
            &[line.start_m, line.end_m],
        )?;
    }
    for (index, start) in schedule.laying_starts.iter().enumerate() {
        check_points(
            || format!("laying_starts[{index}].corner_m"),
            &[start.corner_m],
        )?;
        finite(
            &format!("laying_starts[{index}].first_course_offset_m"),
            start.first_course_offset_m,
        )?;
    }
    finite("building_length_m", schedule.building_length_m)?;
    finite("building_width_m", schedule.building_width_m)?;
    finite("framing_spacing_mm", schedule.framing_spacing_mm)?;
    finite("edge_width_m", schedule.edge_width_m)?;
    finite("total_nail_mass_kg", schedule.total_nail_mass_kg)?;
    let nail = &schedule.nail;
    finite("nail.length_mm", nail.length_mm)?;
    finite("nail.shank_diameter_mm", nail.shank_diameter_mm)?;
    finite("nail.head_diameter_mm", nail.head_diameter_mm)?;
    let resistance = &schedule.resistance;
    finite("resistance.withdrawal_n", resistance.withdrawal_n)?;
    if let Some(pull_through_n) = resistance.pull_through_n {
        finite("resistance.pull_through_n", pull_through_n)?;
    }
    finite("resistance.governing_n", resistance.governing_n)?;
    finite("resistance.penetration_mm", resistance.penetration_mm)?;
    for (index, factor) in resistance.factors.iter().enumerate() {
        finite(&format!("resistance.factors[{index}].value"), factor.value)?;
    }
    for (index, factor) in schedule.wind_factors.iter().enumerate() {
        finite(&format!("wind_factors[{index}].value"), factor.value)?;
    }
    for (index, row) in schedule.zone_pressures.iter().enumerate() {
        let path = |name: &str| format!("zone_pressures[{index}].{name}");
        finite(&path("area_m2"), row.area_m2)?;
        finite(&path("effective_area_m2"), row.effective_area_m2)?;
        finite(&path("cp_ext"), row.cp_ext)?;
        finite(&path("cp_int"), row.cp_int)?;
        finite(&path("external_kpa"), row.external_kpa)?;
        finite(&path("internal_kpa"), row.internal_kpa)?;
        finite(&path("dead_counteracting_kpa"), row.dead_counteracting_kpa)?;
        finite(&path("net_uplift_kpa"), row.net_uplift_kpa)?;
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::sample::sample_schedule;

    #[test]
    fn finite_names_the_field() {
        let error = finite("zones[0].demand_n", f64::INFINITY).expect_err("infinity is refused");
        assert_eq!(
            error.to_string(),
            "zones[0].demand_n: inf is not a finite number; the report prints finite values only"
        );
    }

    #[test]
    fn the_sample_is_finite() {
        assert_eq!(check_all(&sample_schedule()), Ok(()));
    }

    #[test]
    fn a_nan_is_reported_by_its_path() {
        let mut schedule = sample_schedule();
        schedule.lines[2].segments[1].to_m = f64::NAN;
        let error = check_all(&schedule).expect_err("NaN is refused");
        assert!(
            error
                .to_string()
                .starts_with("lines[2].segments[1].to_m: NaN"),
            "{error}"
        );
    }

    #[test]
    fn a_bad_plan_point_is_reported_by_its_path() {
        let mut schedule = sample_schedule();
        schedule.plan.zones[1].polygons_m[0][2][1] = f64::NEG_INFINITY;
        let error = check_all(&schedule).expect_err("infinity is refused");
        assert!(
            error
                .to_string()
                .starts_with("plan.zones[1].polygons_m[0][2].y"),
            "{error}"
        );
    }
}
