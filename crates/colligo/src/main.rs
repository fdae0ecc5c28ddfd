//! Colligo: a desktop formulation workbench for water activity, freezing
//! and vapour pressure of aqueous formulations, with headless subcommands
//! on the same binary.

use std::process::ExitCode;

use colligo::{app, cli};

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().skip(1).collect();
    if let Some(first) = args.first()
        && (cli::SUBCOMMANDS.contains(&first.as_str()) || first == "--help" || first == "-h")
    {
        let sub = if first.starts_with('-') {
            "help"
        } else {
            first.as_str()
        };
        let stdout = std::io::stdout();
        let mut lock = stdout.lock();
        return match cli::run(sub, &args[1..], &mut lock) {
            Ok(()) => ExitCode::SUCCESS,
            // A reader that stops early (`| head`) is not an error.
            Err(e)
                if e.chain().any(|c| {
                    c.downcast_ref::<std::io::Error>()
                        .is_some_and(|io| io.kind() == std::io::ErrorKind::BrokenPipe)
                }) =>
            {
                ExitCode::SUCCESS
            }
            Err(e) => {
                eprintln!("colligo {sub}: {e:#}");
                ExitCode::from(1)
            }
        };
    }
    if args.len() > 1 || args.first().is_some_and(|a| a.starts_with('-')) {
        eprintln!("colligo: unexpected arguments {args:?}\n\n{}", cli::USAGE);
        return ExitCode::from(2);
    }
    match app::run(args.first().map(std::path::PathBuf::from)) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("colligo: cannot open the window: {e}");
            ExitCode::from(1)
        }
    }
}
