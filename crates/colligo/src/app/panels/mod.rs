//! One struct per panel; each shows itself and emits commands.

pub mod charts;
pub mod conditions;
pub mod formula;
pub mod results;
