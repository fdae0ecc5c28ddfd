//! Colligo: a desktop formulation workbench for water activity, freezing
//! and vapour pressure of aqueous formulations, with headless subcommands
//! on the same binary.

use std::process::ExitCode;

use colligo::{app, cli};
use colligo_core::error::elide_words;

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
            // clap's message repeats the value it refused: shorten a very
            // long one (the styled print is kept for everything else).
            let text = e.render().to_string();
            match elide_words(&text) {
                std::borrow::Cow::Owned(short) if e.use_stderr() => eprint!("{short}"),
                _ => {
                    let _ = e.print();
                }
            }
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
            // The last guard: a message from elsewhere (a parser's) may
            // still quote a very long text.
            eprintln!(
                "colligo {}: {}",
                command.name(),
                elide_words(&format!("{e:#}"))
            );
            ExitCode::from(1)
        }
    }
}
