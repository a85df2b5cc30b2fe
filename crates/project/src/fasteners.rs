//! The project file's `fasteners` list: fasteners the user states (dimensions, and optionally a
//! withdrawal value from a maker's evaluation report with its source), used by id like catalog ones.

use crate::error::ProjectError;
use crate::reader::ObjectReader;
use crate::units::Quantity;
use deckhold_core::limits;
use deckhold_fasten::{stated_fastener, Nail, StatedFastener, StatedKind, StatedShank};
use serde_json::Value;

/// Reads `fasteners` (absent: none). Ids may not shadow catalog ids nor repeat.
pub fn read_fasteners(root: &ObjectReader) -> Result<Vec<Nail>, ProjectError> {
    let Some(value) = root.get("fasteners") else {
        return Ok(Vec::new());
    };
    let Value::Array(items) = value else {
        return Err(ProjectError::WrongType {
            path: "fasteners".to_string(),
            expected: "a list of { id, kind, diameter_mm, length_mm, head_diameter_mm, source }"
                .to_string(),
        });
    };
    let mut fasteners: Vec<Nail> = Vec::with_capacity(items.len());
    for (index, item) in items.iter().enumerate() {
        let path = format!("fasteners[{index}]");
        let block = ObjectReader::new(&path, item)?;
        let stated = read_one(&block)?;
        block.finish()?;
        if deckhold_fasten::nail(&stated.id).is_ok() {
            return Err(ProjectError::Invalid {
                path: format!("{path}.id"),
                message: format!(
                    "`{}` is a catalog id; a stated fastener needs an id of its own",
                    stated.id
                ),
            });
        }
        if fasteners.iter().any(|other| other.id == stated.id) {
            return Err(ProjectError::Invalid {
                path: format!("{path}.id"),
                message: format!("`{}` is stated twice", stated.id),
            });
        }
        let nail = stated_fastener(&stated).map_err(|error| ProjectError::Invalid {
            path: path.clone(),
            message: error.to_string(),
        })?;
        fasteners.push(nail);
    }
    Ok(fasteners)
}

fn read_one(block: &ObjectReader) -> Result<StatedFastener, ProjectError> {
    let id = block
        .string("id")?
        .ok_or_else(|| ProjectError::Missing {
            path: block.key_path("id"),
        })?
        .to_string();
    block.check_count("id", &limits::ID_CHARS, id.chars().count())?;
    if id.trim().is_empty() || id.contains(char::is_whitespace) || id.contains(',') {
        return Err(ProjectError::Invalid {
            path: block.key_path("id"),
            message: format!("'{id}' must be one word without spaces or commas"),
        });
    }
    let kind = block
        .choice(
            "kind",
            &[("nail", StatedKind::Nail), ("screw", StatedKind::Screw)],
        )?
        .ok_or_else(|| ProjectError::Missing {
            path: block.key_path("kind"),
        })?;
    let shank = block.choice(
        "shank",
        &[
            ("smooth", StatedShank::Smooth),
            ("ring", StatedShank::Ring),
            ("spiral", StatedShank::Spiral),
        ],
    )?;
    match (kind, shank) {
        (StatedKind::Nail, None) => {
            return Err(ProjectError::Missing {
                path: block.key_path("shank (smooth, ring or spiral)"),
            })
        }
        (StatedKind::Screw, Some(_)) => {
            return Err(ProjectError::Invalid {
                path: block.key_path("shank"),
                message: "a screw has a thread, not a nail shank: leave shank out and give \
                          thread_length_mm"
                    .to_string(),
            })
        }
        _ => {}
    }
    let diameter_mm = block.require_quantity(
        "diameter",
        Quantity::LengthMm,
        &limits::FASTENER_DIAMETER_MM,
    )?;
    let length_mm =
        block.require_quantity("length", Quantity::LengthMm, &limits::FASTENER_LENGTH_MM)?;
    let head_diameter_mm = block.require_quantity(
        "head_diameter",
        Quantity::LengthMm,
        &limits::FASTENER_HEAD_MM,
    )?;
    let thread_length_mm = match kind {
        StatedKind::Screw => Some(block.require_quantity(
            "thread_length",
            Quantity::LengthMm,
            &limits::FASTENER_THREAD_MM,
        )?),
        StatedKind::Nail => {
            if block.has("thread_length_mm") || block.has("thread_length_in") {
                return Err(ProjectError::Invalid {
                    path: block.key_path("thread_length_mm"),
                    message: "only a screw takes a thread length".to_string(),
                });
            }
            None
        }
    };
    if head_diameter_mm <= diameter_mm {
        return Err(ProjectError::Invalid {
            path: block.key_path("head_diameter_mm"),
            message: format!(
                "{head_diameter_mm:.2} mm must exceed the shank diameter {diameter_mm:.2} mm"
            ),
        });
    }
    let withdrawal_n_per_mm = block.quantity(
        "withdrawal",
        Quantity::ForceNPerMm,
        &limits::FASTENER_WITHDRAWAL_N_PER_MM,
    )?;
    let source = block
        .string("source")?
        .filter(|text| !text.trim().is_empty())
        .ok_or_else(|| ProjectError::Missing {
            path: block
                .key_path("source (where the dimensions and any withdrawal value come from)"),
        })?
        .to_string();
    Ok(StatedFastener {
        id,
        kind,
        shank,
        diameter_mm,
        length_mm,
        head_diameter_mm,
        thread_length_mm,
        withdrawal_n_per_mm,
        source,
    })
}

#[cfg(test)]
mod tests {
    use crate::parse_project;
    use crate::units::{MM_PER_IN, N_PER_LBF};
    use approx::assert_relative_eq;
    use deckhold_fasten::Confidence;

    const RETROFIT: &str = include_str!("../../../fixtures/us-retrofit-1970s.json");

    #[test]
    fn a_stated_screw_is_read_in_inches_and_used_by_id() {
        let project = parse_project(RETROFIT).expect("valid");
        let screw = project.fastener("deck-screw-9x2.5").expect("stated");
        assert!(screw.is_wood_screw());
        assert_relative_eq!(screw.shank_diameter_mm, 0.177 * MM_PER_IN);
        assert_relative_eq!(screw.threaded_length_mm.unwrap_or(0.0), 1.625 * MM_PER_IN);
        let stated = screw.stated_withdrawal_n_per_mm.as_ref().expect("W");
        // 95 lb/in = 95 · 4.448 / 25.4 N/mm (unit conversion).
        assert_relative_eq!(
            stated.value,
            95.0 * N_PER_LBF / MM_PER_IN,
            max_relative = 1e-9
        );
        assert_eq!(stated.confidence, Confidence::StatedByUser);
        assert!(stated.source.contains("DEMO-ER-0417"));
    }

    #[test]
    fn a_stated_id_may_not_shadow_a_catalog_id() {
        let text = RETROFIT.replace("deck-screw-9x2.5", "8d-common");
        let message = parse_project(&text).expect_err("refused").to_string();
        assert!(message.contains("fasteners[0].id"), "{message}");
        assert!(message.contains("`8d-common` is a catalog id"), "{message}");
    }

    #[test]
    fn a_screw_with_a_shank_is_refused_naming_the_key() {
        let text = RETROFIT.replace(
            r#""kind": "screw","#,
            r#""kind": "screw", "shank": "ring","#,
        );
        let message = parse_project(&text).expect_err("refused").to_string();
        assert!(message.contains("fasteners[0].shank"), "{message}");
    }

    #[test]
    fn both_unit_variants_are_refused() {
        let text = RETROFIT.replace(
            r#""withdrawal_lb_per_in": 95,"#,
            r#""withdrawal_lb_per_in": 95, "withdrawal_n_per_mm": 16,"#,
        );
        let message = parse_project(&text).expect_err("refused").to_string();
        assert!(message.contains("withdrawal_n_per_mm"), "{message}");
    }

    #[test]
    fn an_unknown_id_in_nails_lists_stated_ids_too() {
        let text = RETROFIT.replace(
            r#""deck-screw-9x2.5"
  ]"#,
            r#""deck-screw-9x25"
  ]"#,
        );
        let message = parse_project(&text).expect_err("refused").to_string();
        assert!(message.contains("nails[2]"), "{message}");
        assert!(
            message.contains("stated in `fasteners`: deck-screw-9x2.5"),
            "{message}"
        );
    }
}
