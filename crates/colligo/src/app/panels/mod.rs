//! One struct per panel; each shows itself and emits commands.

pub mod charts;
pub mod compare;
pub mod conditions;
pub mod formula;
pub mod goal;
pub mod library;
pub mod results;
pub mod stability;
