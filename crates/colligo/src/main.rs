//! Colligo: a desktop formulation workbench for water activity, freezing
//! and vapour pressure of aqueous formulations, with headless subcommands
//! on the same binary.

use std::process::ExitCode;

use colligo::{app, cli};

fn main() -> ExitCode {
    let command = match cli::parse(std::env::args_os()) {
        Ok(cli::Launch::Run(command)) => command,
        Ok(cli::Launch::Window(project)) => {
            return match app::run(project) {
                Ok(()) => ExitCode::SUCCESS,
                Err(e) => {
                    eprintln!("colligo: cannot open the window: {e}");
                    ExitCode::from(1)
                }
            };
        }
        // Usage errors exit 2; --help and --version print and exit 0.
        Err(e) => {
            let _ = e.print();
            return ExitCode::from(u8::try_from(e.exit_code()).unwrap_or(2));
        }
    };
    let stdout = std::io::stdout();
    let mut lock = stdout.lock();
    match cli::run(&command, &mut lock) {
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
            eprintln!("colligo {}: {e:#}", command.name());
            ExitCode::from(1)
        }
    }
}
