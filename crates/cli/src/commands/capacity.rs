//! `deckhold capacity`: the resistance of one nail, with every factor and its source.

use anyhow::{anyhow, Result};
use deckhold_schedule::format::fixed;
use serde_json::json;

use super::caution_lines;
use crate::args::{CapacityArgs, GrainArg, LoadArg};
use crate::table::Table;
use crate::Outcome;
use deckhold_fasten::{
    nail_resistance, DeckLayer, Grain, LoadDuration, MemberKind, ResistanceInput, Service,
};
use deckhold_project::units::MM_PER_IN;
use deckhold_project::{Basis, BasisStandards};
use deckhold_schedule::format::{force_label, small_length_label};
use deckhold_schedule::Units;

pub fn run(args: &CapacityArgs, units: Option<Units>) -> Result<Outcome> {
    let basis = Basis::parse(&args.basis).ok_or_else(|| {
        anyhow!(
            "--basis: '{}' is not one of {}",
            args.basis,
            Basis::words().join(", ")
        )
    })?;
    let nail = deckhold_fasten::nail(&args.nail)?;
    let species = deckhold_fasten::species(&args.species)?;
    let panel = deckhold_fasten::panel(&args.panel)?;
    let penetration_mm = match (args.penetration_mm, args.penetration_in) {
        (Some(mm), _) => mm,
        (None, Some(inch)) => inch * MM_PER_IN,
        (None, None) => return Err(anyhow!("--penetration-mm or --penetration-in is required")),
    };
    let deck_mm = args.deck_mm.or(args.deck_in.map(|inch| inch * MM_PER_IN));
    let input = ResistanceInput {
        method: basis.fastener_method(),
        nail,
        species,
        member: if args.clt {
            MemberKind::Clt
        } else {
            MemberKind::Sawn
        },
        deck: deck_mm.map(|thickness_mm| DeckLayer {
            panel,
            thickness_mm,
        }),
        penetration_mm,
        toe_nail: args.toe_nail,
        service: if args.wet { Service::Wet } else { Service::Dry },
        grain: match args.grain {
            GrainArg::Side => Grain::Side,
            GrainArg::End => Grain::End,
        },
        load: match args.load {
            LoadArg::Short => LoadDuration::Short,
            LoadArg::Standard => LoadDuration::Standard,
            LoadArg::Permanent => LoadDuration::Permanent,
        },
        treated: args.treated,
        member_depth_mm: None,
    };
    let resistance = nail_resistance(&input)?;
    let us = basis.is_us();
    if args.json {
        let factor_details: Vec<serde_json::Value> = resistance
            .factors
            .iter()
            .map(
                |f| json!({ "name": f.name, "value": f.value, "unit": f.unit, "source": f.source }),
            )
            .collect();
        let factors: serde_json::Map<String, serde_json::Value> = resistance
            .factors
            .iter()
            .map(|f| (f.name.clone(), json!(f.value)))
            .collect();
        let mut value = json!({
            "basis": basis.as_str(),
            "method": resistance.method.as_str(),
            "nail": nail.id,
            "species": species.id,
            "penetration_mm": penetration_mm,
            "withdrawal_n": resistance.withdrawal_n,
            "pull_through_n": resistance.pull_through_n,
            "pull_through_is_advisory": resistance.pull_through_is_advisory,
            "governing_n": resistance.governing_n,
            "governing_mode": resistance.governing_mode.as_str(),
            "factors": factors,
            "factor_details": factor_details,
            "warnings": resistance.warnings,
            "cautions": deckhold_schedule::standard_cautions(),
        });
        if us {
            value["withdrawal_lbf"] = json!(resistance.withdrawal_lbf());
            value["pull_through_lbf"] = json!(resistance.pull_through_lbf());
            value["governing_lbf"] = json!(resistance.governing_lbf());
            value["penetration_in"] = json!(penetration_mm / MM_PER_IN);
        }
        outln!("{}", serde_json::to_string_pretty(&value)?);
        return Ok(Outcome::Works);
    }
    let us_units = units.map_or(us, Units::is_us);
    let force = |n: f64| force_label(n, us_units);
    outln!(
        "{} — {} in {} ({}), penetration {}",
        resistance.method.as_str(),
        nail.id,
        species.id,
        species.name,
        small_length_label(penetration_mm, us_units)
    );
    outln!("  withdrawal:       {}", force(resistance.withdrawal_n));
    match resistance.pull_through_n {
        Some(pull_n) => outln!(
            "  head pull-through: {}{}",
            force(pull_n),
            if resistance.pull_through_is_advisory {
                " (advisory: no clause in this standard)"
            } else {
                ""
            }
        ),
        None => outln!("  head pull-through: not checked (give --deck-mm)"),
    }
    outln!(
        "  governing:        {} ({})\n",
        force(resistance.governing_n),
        resistance.governing_mode.as_str()
    );
    let mut table = Table::new(&["factor", "value", "unit", "source"]);
    for factor in &resistance.factors {
        table.row(vec![
            factor.name.clone(),
            fixed(factor.value, 4),
            factor.unit.clone(),
            factor.source.clone(),
        ]);
    }
    out!("{}", table.render());
    for warning in &resistance.warnings {
        outln!("Warning: {warning}");
    }
    out!("{}", caution_lines(true));
    Ok(Outcome::Works)
}
