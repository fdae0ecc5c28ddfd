//! The Colligo desktop app and its command line, over `colligo-core`.

pub mod app;
pub mod batch;
pub mod cli;
pub mod report;
pub mod solve_cli;
