//! Colligo: a desktop formulation workbench for water activity, freezing
//! and vapour pressure of aqueous formulations, with headless subcommands
//! on the same binary.

mod batch;
mod cli;
mod report;
mod solve_cli;

use std::process::ExitCode;

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
    eprintln!("the window is not built yet");
    ExitCode::from(2)
}
