//! Project file (JSON) to a validated [`Project`]. Every message names the key path and the allowed range;
//! unknown keys are refused so that a misspelt key never falls back to a default silently.

use crate::as_written::AsWritten;
use crate::basis::{Basis, BasisStandards};
use crate::error::ProjectError;
use crate::project::{
    Deck, EdgeBlocking, ExistingPattern, Framing, LinesAlong, MemberRole, PatternSpacing, Project,
    StaggerChoice, StartCorner,
};
use crate::reader::{as_finite_number, ObjectReader};
use crate::units::Quantity;
use deckhold_core::limits::{self, Limit};
use deckhold_core::ZoneKind;
use deckhold_fasten::Nail;
use deckhold_model::ProjectInfo;
use deckhold_wind::{
    AsceWind, Building, CurveOverride, CurvePoint, Enclosure, Exposure, Footprint, Importance,
    NbcWind, RidgeAlong, Roof, RoofShape, SiteWind, Terrain, WindInput,
};
use serde_json::Value;

/// The date printed when the project gives none: fixed, so output stays reproducible.
pub const DEFAULT_DATE: &str = "2026-01-01";

/// Parses and validates a project file's text.
pub fn parse_project(text: &str) -> Result<Project, ProjectError> {
    let value: Value =
        serde_json::from_str(text).map_err(|error| ProjectError::Json(error.to_string()))?;
    crate::duplicate_keys::check_duplicate_keys(text)?;
    let mut project = project_from_value(&value)?;
    // The file's own digits, not the parser's: `1` stays `1`, `0.50` stays `0.50`.
    project.as_written = AsWritten::Rows(crate::as_written::rows_from_text(text));
    Ok(project)
}

/// Validates an already-parsed JSON value.
pub fn project_from_value(value: &Value) -> Result<Project, ProjectError> {
    let mut project = read_project(value)?;
    project.as_written = AsWritten::Rows(crate::as_written::rows_from_value(value));
    Ok(project)
}

/// Validates a JSON value the project keeps: its "inputs as given" are spelt from it only if a report
/// asks for them (a batch row's summary never does).
pub fn project_from_tree(tree: Value) -> Result<Project, ProjectError> {
    let mut project = read_project(&tree)?;
    project.as_written = AsWritten::Tree(tree);
    Ok(project)
}

/// The project `value` describes, with no "inputs as given" yet.
fn read_project(value: &Value) -> Result<Project, ProjectError> {
    let root = ObjectReader::new("", value)?;
    let info = read_info(&root)?;
    let basis_id = root.string("basis")?.ok_or_else(|| ProjectError::Missing {
        path: "basis".to_string(),
    })?;
    let basis = Basis::parse(basis_id).ok_or_else(|| ProjectError::Invalid {
        path: "basis".to_string(),
        message: format!("'{basis_id}' is not one of {}", Basis::words().join(", ")),
    })?;
    let building = read_building(&root.require_object("building")?)?;
    let roof = read_roof(&root.require_object("roof")?)?;
    let site = read_wind(&root.require_object("wind")?, basis)?;
    let overrides = read_overrides(&root)?;
    let coefficients_file = root.string("coefficients")?.map(str::to_string);
    let framing = read_framing(&root.require_object("framing")?, basis)?;
    let deck = read_deck(&root.require_object("deck")?, basis)?;
    let fasteners = crate::fasteners::read_fasteners(&root)?;
    let nails = read_nails(&root, &fasteners)?;
    let existing = match root.object("existing")? {
        Some(block) => Some(read_existing(&block, &fasteners)?),
        None => None,
    };
    root.finish()?;
    Ok(Project {
        info,
        basis,
        wind: WindInput {
            building,
            roof,
            site,
            overrides,
            table: None,
        },
        framing,
        deck,
        nails,
        existing,
        coefficients_file,
        units: basis.units(),
        as_written: AsWritten::Rows(Vec::new()),
        fasteners,
    })
}

fn read_info(root: &ObjectReader) -> Result<ProjectInfo, ProjectError> {
    let Some(block) = root.object("project")? else {
        return Ok(ProjectInfo {
            date: DEFAULT_DATE.to_string(),
            ..ProjectInfo::default()
        });
    };
    let text = |key: &'static str| -> Result<String, ProjectError> {
        let text = block.string(key)?.unwrap_or_default();
        let limit = if key == "notes" {
            limits::NOTES_CHARS
        } else {
            limits::TEXT_CHARS
        };
        block.check_count(key, &limit, text.chars().count())?;
        Ok(text.to_string())
    };
    let date = block.string("date")?.unwrap_or(DEFAULT_DATE).to_string();
    if !is_iso_date(&date) {
        return Err(ProjectError::Invalid {
            path: "project.date".to_string(),
            message: format!(
                "'{}' is not a calendar date in the form YYYY-MM-DD",
                crate::reader::escape_text(&date)
            ),
        });
    }
    let info = ProjectInfo {
        name: text("name")?,
        site: text("site")?,
        owner: text("owner")?,
        prepared_by: text("prepared_by")?,
        date,
        notes: text("notes")?,
    };
    block.finish()?;
    Ok(info)
}

fn is_iso_date(text: &str) -> bool {
    let parts: Vec<&str> = text.split('-').collect();
    if parts.len() != 3 || parts[0].len() != 4 || parts[1].len() != 2 || parts[2].len() != 2 {
        return false;
    }
    if !parts
        .iter()
        .all(|part| part.bytes().all(|b| b.is_ascii_digit()))
    {
        return false;
    }
    let numbers: Option<Vec<u32>> = parts.iter().map(|part| part.parse().ok()).collect();
    let Some([year, month, day]) = numbers.as_deref() else {
        return false;
    };
    // Gregorian calendar: days per month, February 29 in leap years only.
    let leap = (year % 4 == 0 && year % 100 != 0) || year % 400 == 0;
    let days = match month {
        1 | 3 | 5 | 7 | 8 | 10 | 12 => 31,
        4 | 6 | 9 | 11 => 30,
        2 if leap => 29,
        2 => 28,
        _ => return false,
    };
    (1..=days).contains(day)
}

fn read_building(block: &ObjectReader) -> Result<Building, ProjectError> {
    let footprint_block = block.require_object("footprint")?;
    let footprint = if let Some(rectangle) = footprint_block.object("rectangle")? {
        let length_m =
            rectangle.require_quantity("length", Quantity::LengthM, &limits::PLAN_SIZE_M)?;
        let width_m =
            rectangle.require_quantity("width", Quantity::LengthM, &limits::PLAN_SIZE_M)?;
        rectangle.finish()?;
        Footprint::Rectangle { length_m, width_m }
    } else if footprint_block.has("polygon_m") || footprint_block.has("polygon_ft") {
        Footprint::Polygon {
            vertices_m: read_polygon(&footprint_block)?,
        }
    } else {
        return Err(ProjectError::Missing {
            path: "building.footprint.rectangle (or building.footprint.polygon_m)".to_string(),
        });
    };
    footprint_block.finish()?;
    let eave_height_m =
        block.require_quantity("eave_height", Quantity::LengthM, &limits::EAVE_HEIGHT_M)?;
    Ok(Building {
        footprint,
        eave_height_m,
    })
}

fn read_polygon(block: &ObjectReader) -> Result<Vec<[f64; 2]>, ProjectError> {
    let (key, scale) = match (block.has("polygon_m"), block.has("polygon_ft")) {
        (true, true) => {
            return Err(ProjectError::BothUnits {
                first: block.key_path("polygon_m"),
                second: block.key_path("polygon_ft"),
            })
        }
        (true, false) => ("polygon_m", 1.0),
        _ => ("polygon_ft", Quantity::LengthM.to_si(1.0)),
    };
    let path = block.key_path(key);
    let Some(Value::Array(points)) = block.get(key) else {
        return Err(ProjectError::WrongType {
            path,
            expected: "a list of [x, y] points".to_string(),
        });
    };
    limits::OUTLINE_CORNERS.check_count(&path, points.len())?;
    points
        .iter()
        .enumerate()
        .map(|(index, point)| {
            let coordinates: Option<Vec<f64>> = point
                .as_array()
                .map(|pair| pair.iter().filter_map(as_finite_number).collect());
            match coordinates.as_deref() {
                Some([x, y]) if point.as_array().map(Vec::len) == Some(2) => {
                    let point_path = format!("{path}[{index}]");
                    limits::OUTLINE_COORDINATE_M.check(&point_path, *x * scale)?;
                    limits::OUTLINE_COORDINATE_M.check(&point_path, *y * scale)?;
                    Ok([*x * scale, *y * scale])
                }
                _ => Err(ProjectError::WrongType {
                    path: format!("{path}[{index}]"),
                    expected: "a point [x, y] of two numbers".to_string(),
                }),
            }
        })
        .collect()
}

fn read_roof(block: &ObjectReader) -> Result<Roof, ProjectError> {
    let shape = block
        .kind("shape", RoofShape::ALL, RoofShape::as_str)?
        .ok_or_else(|| ProjectError::Missing {
            path: "roof.shape".to_string(),
        })?;
    let slope_deg = match (block.has("slope"), block.has("slope_deg")) {
        (true, true) => {
            return Err(ProjectError::BothUnits {
                first: "roof.slope".to_string(),
                second: "roof.slope_deg".to_string(),
            })
        }
        (true, false) => parse_rise_run(block.string("slope")?.unwrap_or_default())?,
        (false, true) => block
            .number("slope_deg", &limits::SLOPE_DEG)?
            .unwrap_or_default(),
        (false, false) if shape == RoofShape::Flat => 0.0,
        (false, false) => {
            return Err(ProjectError::Missing {
                path: "roof.slope (or roof.slope_deg)".to_string(),
            })
        }
    };
    let ridge_along = block
        .choice(
            "ridge_along",
            &[("length", RidgeAlong::Length), ("width", RidgeAlong::Width)],
        )?
        .unwrap_or(RidgeAlong::Length);
    let overhang_mm = block
        .quantity("overhang", Quantity::LengthMm, &limits::OVERHANG_MM)?
        .unwrap_or(0.0);
    let eave_overhang_mm = block
        .quantity("eave_overhang", Quantity::LengthMm, &limits::OVERHANG_MM)?
        .unwrap_or(overhang_mm);
    let rake_overhang_mm = block
        .quantity("rake_overhang", Quantity::LengthMm, &limits::OVERHANG_MM)?
        .unwrap_or(overhang_mm);
    let dead_load_kpa = block
        .quantity("dead_load", Quantity::PressureKpa, &limits::DEAD_LOAD_KPA)?
        .unwrap_or(0.0);
    let gable_walls = read_gable_walls(block)?;
    block.finish()?;
    Ok(Roof {
        shape,
        slope_deg,
        ridge_along,
        eave_overhang_mm,
        rake_overhang_mm,
        dead_load_kpa,
        gable_walls,
    })
}

/// `roof.gable_walls`: wall numbers of a polygon footprint (wall i runs from corner i to i + 1).
fn read_gable_walls(block: &ObjectReader) -> Result<Vec<usize>, ProjectError> {
    let Some(value) = block.get("gable_walls") else {
        return Ok(Vec::new());
    };
    let path = block.key_path("gable_walls");
    let Some(items) = value.as_array() else {
        return Err(ProjectError::WrongType {
            path,
            expected: "a list of wall numbers (wall i runs from polygon corner i to corner i + 1)"
                .to_string(),
        });
    };
    items
        .iter()
        .enumerate()
        .map(|(index, item)| {
            item.as_u64()
                .filter(|n| *n < 200)
                .map(|n| n as usize)
                .ok_or_else(|| ProjectError::WrongType {
                    path: format!("{path}[{index}]"),
                    expected: "a wall number 0..199".to_string(),
                })
        })
        .collect()
}

/// "5:12" (rise:run, the framer's way) to degrees.
fn parse_rise_run(text: &str) -> Result<f64, ProjectError> {
    let invalid = || ProjectError::Invalid {
        path: "roof.slope".to_string(),
        message: format!("'{text}' is not a rise:run such as \"5:12\""),
    };
    let (rise, run) = text.split_once(':').ok_or_else(invalid)?;
    let rise: f64 = rise.trim().parse().map_err(|_| invalid())?;
    let run: f64 = run.trim().parse().map_err(|_| invalid())?;
    if !(rise.is_finite() && run.is_finite() && rise >= 0.0 && run > 0.0) {
        return Err(invalid());
    }
    let slope_deg = (rise / run).atan().to_degrees();
    limits::SLOPE_DEG.check("roof.slope", slope_deg)?;
    Ok(slope_deg)
}

fn read_wind(block: &ObjectReader, basis: Basis) -> Result<SiteWind, ProjectError> {
    let site = match basis.strength_method() {
        None => {
            let q50_kpa = block.number("q50_kpa", &limits::Q50_KPA)?.ok_or_else(|| {
                ProjectError::Missing {
                    path: "wind.q50_kpa".to_string(),
                }
            })?;
            let terrain = block
                .choice(
                    "terrain",
                    &[("open", Terrain::Open), ("rough", Terrain::Rough)],
                )?
                .ok_or_else(|| ProjectError::Missing {
                    path: "wind.terrain".to_string(),
                })?;
            let topographic_factor = block
                .number("topographic_factor", &limits::TOPOGRAPHIC_FACTOR)?
                .unwrap_or(1.0);
            let importance = block
                .choice(
                    "importance",
                    &[
                        ("low", Importance::Low),
                        ("normal", Importance::Normal),
                        ("high", Importance::High),
                        ("post-disaster", Importance::PostDisaster),
                    ],
                )?
                .unwrap_or(Importance::Normal);
            let internal_category = block
                .number("internal_category", &limits::INTERNAL_CATEGORY)?
                .ok_or_else(|| ProjectError::Missing {
                    path: "wind.internal_category".to_string(),
                })?;
            if internal_category.fract() != 0.0 {
                return Err(ProjectError::Invalid {
                    path: "wind.internal_category".to_string(),
                    message: format!("{internal_category} is not one of 1, 2, 3"),
                });
            }
            SiteWind::Nbc2020(NbcWind {
                q50_kpa,
                terrain,
                topographic_factor,
                importance,
                internal_category: internal_category as u8,
            })
        }
        Some(method) => {
            let speed_mph = block
                .number("speed_mph", &limits::SPEED_MPH)?
                .ok_or_else(|| ProjectError::Missing {
                    path: "wind.speed_mph".to_string(),
                })?;
            let exposure = block
                .choice(
                    "exposure",
                    &[("B", Exposure::B), ("C", Exposure::C), ("D", Exposure::D)],
                )?
                .ok_or_else(|| ProjectError::Missing {
                    path: "wind.exposure".to_string(),
                })?;
            let kzt = block.number("kzt", &limits::KZT)?.unwrap_or(1.0);
            let ground_elevation_ft = block
                .quantity(
                    "ground_elevation",
                    Quantity::LengthM,
                    &limits::GROUND_ELEVATION_M,
                )?
                .map(|elevation_m| Quantity::LengthM.from_si(elevation_m))
                .unwrap_or(0.0);
            let enclosure = block
                .choice(
                    "enclosure",
                    &[
                        ("enclosed", Enclosure::Enclosed),
                        ("partially-enclosed", Enclosure::PartiallyEnclosed),
                        ("partially-open", Enclosure::PartiallyOpen),
                    ],
                )?
                .ok_or_else(|| ProjectError::Missing {
                    path: "wind.enclosure".to_string(),
                })?;
            SiteWind::Asce722(AsceWind {
                speed_mph,
                exposure,
                kzt,
                ground_elevation_ft,
                enclosure,
                method,
            })
        }
    };
    block.finish()?;
    Ok(site)
}

fn read_overrides(root: &ObjectReader) -> Result<Vec<CurveOverride>, ProjectError> {
    let Some(value) = root.get("coefficient_overrides") else {
        return Ok(Vec::new());
    };
    let Value::Array(items) = value else {
        return Err(ProjectError::WrongType {
            path: "coefficient_overrides".to_string(),
            expected: "a list of { code_zone, points, source }".to_string(),
        });
    };
    limits::OVERRIDES_COUNT.check_count("coefficient_overrides", items.len())?;
    items
        .iter()
        .enumerate()
        .map(|(index, item)| {
            let path = format!("coefficient_overrides[{index}]");
            let block = ObjectReader::new(&path, item)?;
            let code_zone = block
                .string("code_zone")?
                .ok_or_else(|| ProjectError::Missing {
                    path: format!("{path}.code_zone"),
                })?
                .to_string();
            let source = block
                .string("source")?
                .ok_or_else(|| ProjectError::Missing {
                    path: format!("{path}.source (where the values come from)"),
                })?
                .to_string();
            limits::SOURCE_CHARS.check_count(&format!("{path}.source"), source.chars().count())?;
            let Some(Value::Array(raw_points)) = block.get("points") else {
                return Err(ProjectError::WrongType {
                    path: format!("{path}.points"),
                    expected: "a list of { area_m2, coefficient }".to_string(),
                });
            };
            limits::CURVE_POINTS.check_count(&format!("{path}.points"), raw_points.len())?;
            if raw_points.is_empty() {
                return Err(ProjectError::Missing {
                    path: format!("{path}.points[0]"),
                });
            }
            let points = raw_points
                .iter()
                .enumerate()
                .map(|(point_index, raw)| {
                    let point = ObjectReader::new(&format!("{path}.points[{point_index}]"), raw)?;
                    let area_m2 = point.require_quantity(
                        "area",
                        Quantity::AreaM2,
                        &limits::OVERRIDE_AREA_M2,
                    )?;
                    let coefficient = point
                        .number("coefficient", &limits::OVERRIDE_COEFFICIENT)?
                        .ok_or_else(|| ProjectError::Missing {
                            path: point.key_path("coefficient"),
                        })?;
                    point.finish()?;
                    Ok(CurvePoint {
                        area_m2,
                        coefficient,
                    })
                })
                .collect::<Result<Vec<_>, ProjectError>>()?;
            block.finish()?;
            Ok(CurveOverride {
                code_zone,
                points,
                source,
            })
        })
        .collect()
}

fn read_framing(block: &ObjectReader, basis: Basis) -> Result<Framing, ProjectError> {
    let spacing_mm =
        block.require_quantity("spacing", Quantity::LengthMm, &limits::FRAMING_SPACING_MM)?;
    let species_id = block
        .string("species")?
        .ok_or_else(|| ProjectError::Missing {
            path: "framing.species".to_string(),
        })?
        .to_string();
    deckhold_fasten::species(&species_id).map_err(|error| ProjectError::Invalid {
        path: "framing.species".to_string(),
        message: error.to_string(),
    })?;
    let member = block
        .choice(
            "member",
            &[
                ("rafter", MemberRole::Rafter),
                ("truss", MemberRole::Truss),
                ("joist", MemberRole::Joist),
                ("clt", MemberRole::Clt),
            ],
        )?
        .unwrap_or(MemberRole::Rafter);
    // A 2x nominal member: 38 mm (1-1/2 in) face, 89 mm (3-1/2 in) deep, the smallest common chord.
    let (default_width_mm, default_depth_mm) = if basis.is_us() {
        (38.1, 88.9)
    } else {
        (38.0, 89.0)
    };
    let member_width_mm = block
        .quantity("member_width", Quantity::LengthMm, &limits::MEMBER_WIDTH_MM)?
        .unwrap_or(default_width_mm);
    let member_depth_mm = block
        .quantity("member_depth", Quantity::LengthMm, &limits::MEMBER_DEPTH_MM)?
        .unwrap_or(default_depth_mm);
    let lines_along = block.choice(
        "runs_along",
        &[("length", LinesAlong::Length), ("width", LinesAlong::Width)],
    )?;
    let toe_nailed = block.bool("toe_nailed")?.unwrap_or(false);
    block.finish()?;
    Ok(Framing {
        spacing_mm,
        species_id,
        member,
        member_width_mm,
        member_depth_mm,
        lines_along,
        toe_nailed,
    })
}

fn read_deck(block: &ObjectReader, basis: Basis) -> Result<Deck, ProjectError> {
    let panel_id = block
        .string("panel")?
        .ok_or_else(|| ProjectError::Missing {
            path: "deck.panel".to_string(),
        })?
        .to_string();
    deckhold_fasten::panel(&panel_id).map_err(|error| ProjectError::Invalid {
        path: "deck.panel".to_string(),
        message: error.to_string(),
    })?;
    let thickness_mm =
        block.require_quantity("thickness", Quantity::LengthMm, &limits::DECK_THICKNESS_MM)?;
    // 1220 x 2440 mm in Canada, 48 x 96 in in the US.
    let (default_length_mm, default_width_mm) = if basis.is_us() {
        (2438.4, 1219.2)
    } else {
        (2440.0, 1220.0)
    };
    let panel_length_mm = block
        .quantity("panel_length", Quantity::LengthMm, &limits::PANEL_LENGTH_MM)?
        .unwrap_or(default_length_mm);
    let panel_width_mm = block
        .quantity("panel_width", Quantity::LengthMm, &limits::PANEL_WIDTH_MM)?
        .unwrap_or(default_width_mm);
    let stagger = match block.get("stagger") {
        None => StaggerChoice::Half,
        Some(Value::String(word)) if word == "half" => StaggerChoice::Half,
        Some(Value::String(word)) if word == "none" => StaggerChoice::None,
        Some(Value::Object(_)) => {
            let offset = block.require_object("stagger")?;
            let offset_mm = offset.require_quantity(
                "offset",
                Quantity::LengthMm,
                &stagger_limit(panel_length_mm),
            )?;
            offset.finish()?;
            StaggerChoice::OffsetMm(offset_mm)
        }
        Some(_) => {
            return Err(ProjectError::Invalid {
                path: "deck.stagger".to_string(),
                message: "expected \"half\", \"none\" or {\"offset_mm\": number}".to_string(),
            })
        }
    };
    // A cut piece no narrower than 24 in (610 mm) so that it reaches two supports at 16 in o.c.:
    // common practice, no source. 600 mm on a Canadian basis.
    let default_min_piece_mm = if basis.is_us() { 609.6 } else { 600.0 };
    let min_piece_mm = block
        .quantity(
            "min_piece",
            Quantity::LengthMm,
            &min_piece_limit(panel_length_mm),
        )?
        .unwrap_or(default_min_piece_mm);
    let blocking = block
        .choice(
            "blocking",
            &[
                ("none", EdgeBlocking::None),
                ("course-joints", EdgeBlocking::CourseJoints),
            ],
        )?
        .unwrap_or_default();
    let start_corner = block
        .choice(
            "start_corner",
            &[
                ("smaller-coordinate", StartCorner::SmallerCoordinate),
                ("larger-coordinate", StartCorner::LargerCoordinate),
            ],
        )?
        .unwrap_or_default();
    let first_course_width_mm = block
        .quantity(
            "first_course_width",
            Quantity::LengthMm,
            &first_cut_limit("deck.first_course_width_mm", panel_width_mm),
        )?
        .unwrap_or(panel_width_mm);
    let first_panel_length_mm = block
        .quantity(
            "first_panel_length",
            Quantity::LengthMm,
            &first_cut_limit("deck.first_panel_length_mm", panel_length_mm),
        )?
        .unwrap_or(panel_length_mm);
    let wet_service = block
        .choice("service", &[("dry", false), ("wet", true)])?
        .unwrap_or(false);
    let treated = block.bool("treated")?.unwrap_or(false);
    let between_mm = block
        .quantity("between", Quantity::LengthMm, &limits::BETWEEN_MM)?
        .unwrap_or(0.0);
    block.finish()?;
    Ok(Deck {
        panel_id,
        thickness_mm,
        panel_length_mm,
        panel_width_mm,
        stagger,
        min_piece_mm,
        blocking,
        start_corner,
        first_course_width_mm,
        first_panel_length_mm,
        wet_service,
        treated,
        between_mm,
    })
}

fn read_nails(root: &ObjectReader, stated: &[Nail]) -> Result<Vec<String>, ProjectError> {
    let Value::Array(items) = root.require("nails")? else {
        return Err(ProjectError::WrongType {
            path: "nails".to_string(),
            expected: "a list of nail ids".to_string(),
        });
    };
    if items.is_empty() {
        return Err(ProjectError::Missing {
            path: "nails[0]".to_string(),
        });
    }
    limits::NAILS_COUNT.check_count("nails", items.len())?;
    items
        .iter()
        .enumerate()
        .map(|(index, item)| {
            let path = || format!("nails[{index}]");
            let id = item.as_str().ok_or_else(|| ProjectError::WrongType {
                path: path(),
                expected: "a nail id (see `deckhold catalog nails`)".to_string(),
            })?;
            check_nail_id(path, id, stated)?;
            Ok(id.to_string())
        })
        .collect()
}

/// `path` spells the key's path, only when the id is refused.
fn check_nail_id(
    path: impl FnOnce() -> String,
    id: &str,
    stated: &[Nail],
) -> Result<(), ProjectError> {
    if stated.iter().any(|nail| nail.id == id) {
        return Ok(());
    }
    deckhold_fasten::nail(id).map(|_| ()).map_err(|error| {
        let mut message = error.to_string();
        if !stated.is_empty() {
            let ids: Vec<&str> = stated.iter().map(|nail| nail.id.as_str()).collect();
            message.push_str(&format!("; stated in `fasteners`: {}", ids.join(", ")));
        }
        ProjectError::Invalid {
            path: path(),
            message,
        }
    })
}

fn read_existing(block: &ObjectReader, stated: &[Nail]) -> Result<ExistingPattern, ProjectError> {
    let nail_id = block
        .string("nail")?
        .ok_or_else(|| ProjectError::Missing {
            path: "existing.nail".to_string(),
        })?
        .to_string();
    check_nail_id(|| "existing.nail".to_string(), &nail_id, stated)?;
    let credit = block
        .number("credit", &limits::EXISTING_CREDIT)?
        .unwrap_or(1.0);
    let all_zones = read_pattern_spacing(block)?;
    let mut by_zone = Vec::new();
    if let Some(zones) = block.object("zones")? {
        for kind in ZoneKind::ALL {
            if let Some(zone) = zones.object(kind.as_str())? {
                by_zone.push((*kind, read_pattern_spacing(&zone)?));
                zone.finish()?;
            }
        }
        zones.finish()?;
    }
    block.finish()?;
    Ok(ExistingPattern {
        nail_id,
        all_zones,
        by_zone,
        credit,
    })
}

fn read_pattern_spacing(block: &ObjectReader) -> Result<PatternSpacing, ProjectError> {
    Ok(PatternSpacing {
        edge_spacing_mm: block.require_quantity(
            "edge_spacing",
            Quantity::LengthMm,
            &limits::PATTERN_SPACING_MM,
        )?,
        intermediate_spacing_mm: block.require_quantity(
            "intermediate_spacing",
            Quantity::LengthMm,
            &limits::PATTERN_SPACING_MM,
        )?,
    })
}

/// The stagger offset's range depends on the panel: less than one panel length.
fn min_piece_limit(panel_length_mm: f64) -> Limit {
    Limit {
        key: "deck.min_piece_mm",
        min: 0.0,
        max: panel_length_mm,
        unit: "mm",
        reason: "a piece cannot be longer than the panel it is cut from",
    }
}

/// A first course or first panel cut from a panel: at least 50 mm (a narrower strip cannot be laid
/// and nailed; common practice, no source), at most the whole panel.
fn first_cut_limit(key: &'static str, panel_mm: f64) -> Limit {
    Limit {
        key,
        min: 50.0,
        max: panel_mm,
        unit: "mm",
        reason: "cut from one panel: at least 50 mm, at most the whole panel",
    }
}

fn stagger_limit(panel_length_mm: f64) -> Limit {
    Limit {
        key: "deck.stagger.offset_mm",
        min: 0.0,
        max: panel_length_mm,
        unit: "mm",
        reason: "an offset of a whole panel length is no offset",
    }
}
