//! `deckhold catalog`: the built-in nails, species groups and panels, with their sources.

use anyhow::Result;
use deckhold_schedule::format::fixed;

use crate::args::{CatalogArgs, CatalogKind};
use crate::table::Table;
use crate::Outcome;

pub fn run(args: &CatalogArgs) -> Result<Outcome> {
    if args.template.is_some() && !matches!(args.kind, CatalogKind::Coefficients) {
        anyhow::bail!("--template: only `deckhold catalog coefficients` writes a template");
    }
    match args.kind {
        CatalogKind::Nails => {
            let nails = deckhold_fasten::nails();
            if args.json {
                outln!("{}", serde_json::to_string_pretty(nails)?);
                return Ok(Outcome::Works);
            }
            let mut table = Table::new(&[
                "id",
                "description",
                "length mm",
                "shank mm",
                "head mm",
                "shank",
                "material",
                "source",
            ]);
            for nail in nails {
                table.row(vec![
                    nail.id.clone(),
                    nail.description.clone(),
                    fixed(nail.length_mm, 1),
                    fixed(nail.shank_diameter_mm, 2),
                    fixed(nail.head_diameter_mm, 2),
                    nail.shank.as_str().to_string(),
                    nail.material.as_str().to_string(),
                    nail.provenance(),
                ]);
            }
            out!("{}", table.render());
        }
        CatalogKind::Species => {
            let groups = deckhold_fasten::species_groups();
            if args.json {
                outln!("{}", serde_json::to_string_pretty(groups)?);
                return Ok(Outcome::Works);
            }
            let mut table = Table::new(&["id", "name", "O86 rel. density", "NDS G", "sources"]);
            for group in groups {
                let value = |v: &Option<deckhold_fasten::SourcedValue>| {
                    v.as_ref().map_or("-".to_string(), |v| fixed(v.value, 2))
                };
                let sources: Vec<String> =
                    [&group.o86_relative_density, &group.nds_specific_gravity]
                        .iter()
                        .filter_map(|v| v.as_ref().map(|v| v.provenance()))
                        .collect();
                table.row(vec![
                    group.id.clone(),
                    group.name.clone(),
                    value(&group.o86_relative_density),
                    value(&group.nds_specific_gravity),
                    sources.join("; "),
                ]);
            }
            out!("{}", table.render());
        }
        CatalogKind::Panels => {
            let panels = deckhold_fasten::panels();
            if args.json {
                outln!("{}", serde_json::to_string_pretty(panels)?);
                return Ok(Outcome::Works);
            }
            let mut table = Table::new(&["id", "name", "NDS G", "source"]);
            for panel in panels {
                table.row(vec![
                    panel.id.clone(),
                    panel.name.clone(),
                    fixed(panel.nds_specific_gravity.value, 2),
                    panel.nds_specific_gravity.provenance(),
                ]);
            }
            out!("{}", table.render());
        }
        CatalogKind::Coefficients => match args.template {
            Some(edition) => {
                let template = deckhold_wind::coefficient_table_template(edition.edition())?;
                outln!("{}", serde_json::to_string_pretty(&template)?);
            }
            None => coefficients(args.json)?,
        },
    }
    Ok(Outcome::Works)
}

/// The built-in coefficient rows with their status; areas in m² (the data's unit).
fn coefficients(json: bool) -> Result<()> {
    let rows = deckhold_wind::coefficient_rows()?;
    if json {
        outln!("{}", serde_json::to_string_pretty(&rows)?);
        return Ok(());
    }
    let mut table = Table::new(&[
        "edition",
        "set",
        "zone",
        "curve (m² : coefficient)",
        "status",
        "figure",
    ]);
    for row in &rows {
        let curve: Vec<String> = row
            .points
            .iter()
            .map(|p| format!("{}: {}", fixed(p.area_m2, 3), fixed(p.coefficient, 2)))
            .collect();
        table.row(vec![
            row.edition.clone(),
            row.set.clone(),
            row.code_zone.clone(),
            curve.join(", "),
            row.status.to_string(),
            row.figure.clone(),
        ]);
    }
    out!("{}", table.render());
    Ok(())
}
