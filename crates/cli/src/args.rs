//! Command-line arguments (clap derive). Everything after parsing sees plain values, not clap types.

use clap::{Args, Parser, Subcommand, ValueEnum};
use std::path::PathBuf;

/// Roof sheathing nailing schedules against wind uplift.
///
/// deckhold zones a roof for components-and-cladding wind uplift, finds the factored withdrawal resistance
/// of each nail, and sizes the nail spacing on every rafter line. Its output is a design aid for a
/// qualified person; check it against the governing code and have it reviewed where the law requires.
#[derive(Debug, Parser)]
#[command(
    name = "deckhold",
    version,
    about,
    long_about,
    after_help = "Exit status: 0 done, every zone works; 1 the design does not work (a plan check fails, or no \
                  practical spacing works in some zone); 2 the input was refused. For batch: 0 every roof ok, \
                  1 some roof fails, 2 some row refused.\n\
                  Without PROJECT, run, zones and compare use the built-in demo project (invented)."
)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Command,
    /// Units of everything printed and written: si (mm, m, kPa, N) or us (inches o.c., feet-inches,
    /// psf, lb). Default: the basis's customary units (us for ASCE 7 with NDS, si for NBC with O86).
    #[arg(long, global = true, value_enum)]
    pub units: Option<UnitsArg>,
    /// A coefficient table of your own (JSON, the form `deckhold catalog coefficients --template`
    /// writes): its rows replace the built-in rows they name, for run, zones, check and compare. Takes
    /// the place of the project file's `coefficients`.
    #[arg(long, global = true, value_name = "FILE")]
    pub coefficients: Option<PathBuf>,
}

/// The `--units` choice.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum UnitsArg {
    Si,
    Us,
}

impl UnitsArg {
    pub fn units(self) -> deckhold_schedule::Units {
        match self {
            UnitsArg::Si => deckhold_schedule::Units::Si,
            UnitsArg::Us => deckhold_schedule::Units::Imperial,
        }
    }
}

#[derive(Debug, Subcommand)]
pub enum Command {
    /// Run the whole job: zones, nail resistance, spacing; write the CSV and PDF schedule.
    Run(RunArgs),
    /// Run many roofs: each row of a CSV file sets keys of a base project; writes summary.csv.
    Batch(BatchArgs),
    /// Show the roof's wind zones and their net design uplift.
    Zones(ZonesArgs),
    /// Plan-check an existing or proposed nailing pattern (exit 1 when any zone fails).
    Check(CheckArgs),
    /// Compare nail types for one deck: capacity, spacing and nail count.
    Compare(CompareArgs),
    /// Factored resistance of one nail in withdrawal (and head pull-through).
    Capacity(CapacityArgs),
    /// List the built-in catalogs.
    Catalog(CatalogArgs),
    /// Write a complete example project file to start from.
    Init(InitArgs),
    /// Print the limits every input is held to, each with its reason or source.
    Limits,
}

#[derive(Debug, Args)]
pub struct RunArgs {
    /// Project file (JSON). Without it, the built-in demo project is used.
    pub project: Option<PathBuf>,
    /// Folder for schedule.csv, rafter-lines.csv and schedule.pdf (and schedule.json with --json).
    #[arg(long)]
    pub out: Option<PathBuf>,
    /// Print the schedule as JSON instead of a table.
    #[arg(long)]
    pub json: bool,
    /// Print how long each stage took, to stderr.
    #[arg(long)]
    pub timings: bool,
    /// Pages the PDF's crew sheet may take: 1 puts the nailing pattern (lines nailed alike grouped)
    /// under the plan on page 1. Without it the pattern gets its own page(s) after page 1. When the
    /// pattern does not fit, nothing is cut: a warning says how many pages it takes.
    #[arg(long, value_name = "N", value_parser = clap::value_parser!(u32).range(1..=99))]
    pub crew_pages: Option<u32>,
}

#[derive(Debug, Args)]
pub struct BatchArgs {
    /// The roofs (CSV): an `id` column, and columns named by project-file key paths (`roof.slope`,
    /// `framing.spacing_in`, `nails` as `a;b;c`, ...) whose cells replace the base project's value.
    pub roofs: PathBuf,
    /// The base project file (JSON) every row starts from.
    #[arg(long)]
    pub base: PathBuf,
    /// Folder for summary.csv (and, with --pdf, a folder per roof). Without it, summary.csv goes to
    /// standard output.
    #[arg(long)]
    pub out: Option<PathBuf>,
    /// Also write each worked roof's schedule.csv, rafter-lines.csv and schedule.pdf into OUT/ID/.
    #[arg(long, requires = "out")]
    pub pdf: bool,
    /// Roofs worked at once (default: the number of cores).
    #[arg(long, value_parser = clap::value_parser!(u16).range(1..=64))]
    pub jobs: Option<u16>,
    /// Print the counts (ok, fails, refused) as JSON on standard output.
    #[arg(long, requires = "out")]
    pub json: bool,
    /// Print how long each stage took, to stderr.
    #[arg(long)]
    pub timings: bool,
}

#[derive(Debug, Args)]
pub struct ZonesArgs {
    /// Project file (JSON). Without it, the built-in demo project is used.
    pub project: Option<PathBuf>,
    /// Effective wind area for the coefficients, m² (default 0.1 m², the area one nail holds).
    #[arg(long, conflicts_with = "area_ft2")]
    pub area_m2: Option<f64>,
    /// Effective wind area for the coefficients, ft².
    #[arg(long)]
    pub area_ft2: Option<f64>,
    #[arg(long)]
    pub json: bool,
}

#[derive(Debug, Args)]
pub struct CheckArgs {
    /// Project file (JSON); its `existing` block gives the pattern unless the options below do.
    pub project: PathBuf,
    /// Nail of the pattern (catalog id).
    #[arg(long)]
    pub nail: Option<String>,
    /// Spacing at panel edges, mm.
    #[arg(long, requires = "intermediate_mm", conflicts_with_all = ["edge_in", "intermediate_in"])]
    pub edge_mm: Option<f64>,
    /// Spacing at intermediate supports, mm.
    #[arg(long, requires = "edge_mm")]
    pub intermediate_mm: Option<f64>,
    /// Spacing at panel edges, in.
    #[arg(long, requires = "intermediate_in")]
    pub edge_in: Option<f64>,
    /// Spacing at intermediate supports, in.
    #[arg(long, requires = "edge_in")]
    pub intermediate_in: Option<f64>,
    /// Retrofit: size the fasteners of this id (catalog or the project's `fasteners`) to add between
    /// the existing ones, per zone and support role, so existing plus added carry the uplift.
    #[arg(long)]
    pub add: Option<String>,
    /// Folder for the plan-check report: check.csv and check.pdf (a sign-off page, then the detail).
    #[arg(long)]
    pub out: Option<PathBuf>,
    #[arg(long)]
    pub json: bool,
}

#[derive(Debug, Args)]
pub struct CompareArgs {
    /// Project file (JSON). Without it, the built-in demo project is used.
    pub project: Option<PathBuf>,
    /// Nails to compare, comma-separated ids (default: every catalog nail that fits the deck and member).
    #[arg(long, value_delimiter = ',')]
    pub nails: Vec<String>,
    /// Folder for the comparison on file: compare.csv and a one-page compare.pdf with a chart of
    /// capacity and nail count per candidate. Replaces only these two names in the folder.
    #[arg(long)]
    pub out: Option<PathBuf>,
    #[arg(long)]
    pub json: bool,
}

#[derive(Debug, Clone, Copy, ValueEnum)]
pub enum GrainArg {
    Side,
    End,
}

#[derive(Debug, Clone, Copy, ValueEnum)]
pub enum LoadArg {
    /// Wind or earthquake: the only duration withdrawal may carry.
    Short,
    Standard,
    Permanent,
}

#[derive(Debug, Args)]
pub struct CapacityArgs {
    /// Design basis: nbc2020-o86, asce7-22-nds2018-asd or asce7-22-nds2018-lrfd.
    #[arg(long)]
    pub basis: String,
    /// Nail id (see `deckhold catalog nails`).
    #[arg(long)]
    pub nail: String,
    /// Species group id of the framing (see `deckhold catalog species`).
    #[arg(long)]
    pub species: String,
    /// Penetration into the framing member, mm.
    #[arg(
        long,
        conflicts_with = "penetration_in",
        required_unless_present = "penetration_in"
    )]
    pub penetration_mm: Option<f64>,
    /// Penetration into the framing member, in.
    #[arg(long)]
    pub penetration_in: Option<f64>,
    /// Deck (side member) thickness, mm: enables the head pull-through check.
    #[arg(long, conflicts_with = "deck_in")]
    pub deck_mm: Option<f64>,
    /// Deck (side member) thickness, in.
    #[arg(long)]
    pub deck_in: Option<f64>,
    /// Deck panel id (plywood or osb) for head pull-through.
    #[arg(long, default_value = "osb")]
    pub panel: String,
    /// Framing is cross-laminated timber.
    #[arg(long)]
    pub clt: bool,
    /// The nail is toe-nailed.
    #[arg(long)]
    pub toe_nail: bool,
    /// Wet service conditions.
    #[arg(long)]
    pub wet: bool,
    /// Preservative- or fire-retardant-treated framing.
    #[arg(long)]
    pub treated: bool,
    /// Grain the nail points into.
    #[arg(long, value_enum, default_value = "side")]
    pub grain: GrainArg,
    /// Load duration.
    #[arg(long, value_enum, default_value = "short")]
    pub load: LoadArg,
    #[arg(long)]
    pub json: bool,
}

#[derive(Debug, Clone, Copy, ValueEnum)]
pub enum CatalogKind {
    Nails,
    Species,
    Panels,
    /// The built-in wind coefficient rows (figure, zone, curve, status).
    Coefficients,
}

#[derive(Debug, Args)]
pub struct CatalogArgs {
    /// Which catalog.
    #[arg(value_enum)]
    pub kind: CatalogKind,
    #[arg(long)]
    pub json: bool,
    /// With `coefficients`: print a template of a coefficient table for this edition (the built-in
    /// rows, an empty source to fill in) to pass to --coefficients once edited.
    #[arg(long, value_enum, value_name = "EDITION")]
    pub template: Option<EditionArg>,
}

/// An edition with built-in coefficient data.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum EditionArg {
    #[value(name = "nbc2020")]
    Nbc2020,
    #[value(name = "asce7-22")]
    Asce722,
}

impl EditionArg {
    /// The edition's name as the data writes it.
    pub fn edition(self) -> &'static str {
        match self {
            EditionArg::Nbc2020 => "NBC 2020",
            EditionArg::Asce722 => "ASCE 7-22",
        }
    }
}

#[derive(Debug, Args)]
pub struct InitArgs {
    /// Where to write the example (default: project.json, or roofs.csv with --batch). An existing file
    /// is not overwritten.
    pub path: Option<PathBuf>,
    /// Write the US-basis example (ASCE 7-22 with NDS) instead of the Canadian one.
    #[arg(long, conflicts_with = "batch")]
    pub us: bool,
    /// Write an example batch file (roofs.csv) for `deckhold batch` instead of a project.
    #[arg(long)]
    pub batch: bool,
}
