//! Headless subcommands on the app's binary: `eval`, `freeze`, `sweep`,
//! `batch`, `solve`. Nothing here opens a window.
//!
//! The parser is clap's (derive): this module holds the top-level command
//! and the dispatch, [`options`] the options the subcommands share, one
//! module per subcommand its own options and run function, and [`output`]
//! what they print. The subcommand modules use `options` and `output` only,
//! never each other or this module.

pub mod batch;
pub mod eval;
pub mod freeze;
pub mod options;
pub mod output;
pub mod solve;
pub mod sweep;

use std::ffi::{OsStr, OsString};
use std::io::Write;
use std::path::{Path, PathBuf};

use anyhow::{Context, Result};
use clap::error::ErrorKind;
use clap::{CommandFactory, Parser, Subcommand};
use colligo_core::Library;

/// The command line.
#[derive(Debug, Parser)]
#[command(
    name = "colligo",
    version,
    about = "Colligo: water activity, freezing and vapour pressure of aqueous formulations.",
    override_usage = "colligo [PROJECT.ron]\n       colligo <COMMAND> [OPTIONS]",
    after_help = "Without a command, the workbench window opens: on PROJECT.ron when given, else on the \
last project (or a sample the first time).\n\nAmounts take g, kg, mg, oz, lb or % of the batch; \
temperatures C, F or K (a bare number is °C); pressures kPa, hPa, Pa, atm, bar, mmHg, psi or an \
altitude in m or ft. Ingredients are named by their ids. Errors go to stderr with exit code 1 \
(2 for a mistyped command line).",
    subcommand_required = true,
    arg_required_else_help = true
)]
pub struct Cli {
    /// The subcommand.
    #[command(subcommand)]
    pub command: Command,
}

/// A subcommand with its options.
#[derive(Debug, Subcommand)]
pub enum Command {
    /// Every property of one formula: a_w, ERH, vapour pressure, freezing and boiling points, ice
    /// fraction, osmolality
    Eval(eval::EvalArgs),
    /// The freezing curve: share of the water frozen and a_w, temperature by temperature
    Freeze(freeze::FreezeArgs),
    /// Every property while one ingredient's amount runs over a range
    Sweep(sweep::SweepArgs),
    /// Chosen properties of every formula in a CSV file
    Batch(batch::BatchArgs),
    /// The amount of one ingredient that brings a property to a target value
    Solve(solve::SolveArgs),
}

impl Command {
    /// The subcommand's name, as typed.
    pub fn name(&self) -> &'static str {
        match self {
            Command::Eval(_) => "eval",
            Command::Freeze(_) => "freeze",
            Command::Sweep(_) => "sweep",
            Command::Batch(_) => "batch",
            Command::Solve(_) => "solve",
        }
    }
}

/// What the program is asked to do.
#[derive(Debug)]
pub enum Launch {
    /// Open the window, on a project file or on the last project.
    Window(Option<PathBuf>),
    /// Run a subcommand.
    Run(Command),
}

/// Reads the command line (`args` includes the program name).
///
/// No argument, or a single one that names a project file (an existing
/// path, or one ending in `.ron`) and no subcommand, opens the window.
/// Anything else is parsed by clap, so a mistyped subcommand is an error
/// with a suggestion, not a window on a file that does not exist.
///
/// # Errors
/// clap's error (usage, or the help and version texts); print it with
/// [`clap::Error::print`] and exit with [`clap::Error::exit_code`].
pub fn parse<I, T>(args: I) -> Result<Launch, clap::Error>
where
    I: IntoIterator<Item = T>,
    T: Into<OsString>,
{
    let args: Vec<OsString> = args.into_iter().map(Into::into).collect();
    match args.get(1..) {
        None | Some([]) => return Ok(Launch::Window(None)),
        Some([one]) if names_a_project(one) => {
            return Ok(Launch::Window(Some(PathBuf::from(one))));
        }
        Some([first, rest @ ..]) if names_a_project(first) => {
            return Err(Cli::command().error(
                ErrorKind::UnknownArgument,
                format!(
                    "a project file opens the window and takes no more arguments (got {}); \
to compute without the window, put a subcommand first: colligo eval {} …",
                    rest.iter()
                        .map(|a| format!("'{}'", a.to_string_lossy()))
                        .collect::<Vec<_>>()
                        .join(" "),
                    first.to_string_lossy()
                ),
            ));
        }
        _ => {}
    }
    Cli::try_parse_from(args).map(|c| Launch::Run(c.command))
}

/// Whether a lone argument is a project to open rather than a subcommand
/// or an option.
fn names_a_project(arg: &OsStr) -> bool {
    let text = arg.to_string_lossy();
    let subcommand = Cli::command()
        .get_subcommands()
        .any(|c| c.get_name() == text)
        || text == "help";
    let path = Path::new(arg);
    !subcommand
        && !text.starts_with('-')
        && (path.exists()
            || path
                .extension()
                .is_some_and(|e| e.eq_ignore_ascii_case("ron")))
}

/// Runs a subcommand, writing its output to `out`. Errors are printed to
/// stderr by the caller, which exits non-zero.
///
/// # Errors
/// Any failure, with context.
pub fn run(command: &Command, out: &mut dyn Write) -> Result<()> {
    let lib = Library::builtin().context("loading the built-in library")?;
    match command {
        Command::Eval(a) => eval::run(a, &lib, out),
        Command::Freeze(a) => freeze::run(a, &lib, out),
        Command::Sweep(a) => sweep::run(a, &lib, out),
        Command::Batch(a) => batch::run(a, &lib, out),
        Command::Solve(a) => solve::run(a, &lib, out),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_command_line_is_consistent() {
        Cli::command().debug_assert();
    }

    #[test]
    fn windows_open_on_projects_and_subcommands_are_parsed() {
        assert!(matches!(parse(["colligo"]), Ok(Launch::Window(None))));
        assert!(matches!(
            parse(["colligo", "no/such/dir/spread.ron"]),
            Ok(Launch::Window(Some(_)))
        ));
        assert!(matches!(
            parse(["colligo", "eval", "--mix", "water=1g"]),
            Ok(Launch::Run(Command::Eval(_)))
        ));
        let e = parse(["colligo", "evl"]).err();
        assert_eq!(
            e.as_ref().map(clap::Error::kind),
            Some(clap::error::ErrorKind::InvalidSubcommand)
        );
        assert!(parse(["colligo", "frobnicate"]).is_err());
        let e = parse(["colligo", "a.ron", "--json"]).err();
        assert_eq!(
            e.as_ref().map(clap::Error::kind),
            Some(ErrorKind::UnknownArgument)
        );
        let text = e.map(|e| e.to_string()).unwrap_or_default();
        assert!(
            text.contains("'--json'") && text.contains("colligo eval a.ron"),
            "{text}"
        );
    }

    #[test]
    fn negative_and_unit_temperatures_parse() {
        let Ok(Launch::Run(Command::Freeze(f))) = parse([
            "colligo",
            "freeze",
            "--mix",
            "water=1g",
            "--from",
            "-1F",
            "--to",
            "-40",
            "--step",
            "0.5",
            "--storage",
            "-25C",
        ]) else {
            panic!("freeze options should parse");
        };
        assert!(
            (f.from - (-1.0 - 32.0) * 5.0 / 9.0).abs() < 1e-12,
            "{}",
            f.from
        );
        assert_eq!((f.to, f.step), (-40.0, 0.5));
        assert!(
            f.job
                .conditions
                .storage
                .is_some_and(|k| (k - 248.15).abs() < 1e-9)
        );
        let Ok(Launch::Run(Command::Freeze(d))) = parse(["colligo", "freeze", "x.ron"]) else {
            panic!("defaults should parse");
        };
        assert_eq!((d.from, d.to, d.step), (-1.0, -30.0, 1.0));
    }
}
