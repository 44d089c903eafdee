//! plankwise — preliminary selection of precast prestressed floor and roof
//! members (hollow-core planks and double tees) to ACI 318-19.
//!
//! The library is the engine; it does no terminal I/O. Modules:
//! - [`units`]: quantities with units, parsing and conversion;
//! - [`material`]: concrete mixes and prestressing strand;
//! - [`section`]: section geometry of the three families and exact properties;
//! - [`catalog`]: the TOML catalog, raw mirror and validated model;
//! - [`report`]: printers for section tables.
//!
//! A preliminary selection only: the supplier's engineer and the engineer of
//! record make the final design; local codes and licensed practice govern.

#![forbid(unsafe_code)]

pub mod aging;
pub mod bay;
pub mod beam;
pub mod camber;
pub mod case;
pub mod catalog;
pub mod checks;
pub mod criteria;
pub mod files;
pub mod fire;
pub mod handling;
pub mod input;
pub mod items;
pub mod job;
pub mod loads;
pub mod material;
pub mod member;
pub mod prestress;
pub mod report;
pub mod schema;
pub mod section;
pub mod select;
pub mod strength;
pub mod tui;
pub mod units;
